#include "config.h"

#include "cw-interactions.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-core-private.h"

#define CW_INTERACTIONS_FORMAT "chairwise-interactions"
#define CW_INTERACTIONS_VERSION 1

struct _CwInteractionTable
{
  GArray *entries; /* CwPairEntry */
  CwRingEnergetics ring;
  CwFallbackRules fallback;
};

static const char *kind_names[CW_N_PAIR_KINDS] = { "syn-axial", "gauche", "geminal" };

const char *
cw_pair_kind_to_string (CwPairKind kind)
{
  g_return_val_if_fail (kind < CW_N_PAIR_KINDS, "?");
  return kind_names[kind];
}

static void
clear_entry (CwPairEntry *e)
{
  g_free (e->a);
  g_free (e->b);
  g_free (e->source);
  g_free (e->note);
}

void
cw_interaction_table_free (CwInteractionTable *table)
{
  if (table == NULL)
    return;
  g_clear_pointer (&table->entries, g_array_unref);
  g_free (table->ring.half_chair.source);
  g_free (table->ring.twist_boat.source);
  g_free (table->ring.boat.source);
  g_free (table->ring.twist_boat_margin_source);
  g_free (table->fallback.rule);
  g_free (table);
}

static gboolean
parse_pair (const cJSON *obj, int index, const char *name, CwPairEntry *e, GError **error)
{
  g_autofree char *where = g_strdup_printf ("%s: pair %d", name, index + 1);
  const char *kind = NULL, *a = NULL, *b = NULL, *src = NULL, *note = NULL;
  int k;

  if (!cJSON_IsObject (obj))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: must be an object"), where);
      return FALSE;
    }
  if (!cw_json_get_string (obj, "kind", TRUE, &kind, where, error) ||
      !cw_json_get_string (obj, "a", TRUE, &a, where, error) ||
      !cw_json_get_string (obj, "b", TRUE, &b, where, error) ||
      !cw_json_get_number (obj, "kcal_mol", TRUE, &e->value, where, error) ||
      !cw_json_get_number (obj, "sigma", TRUE, &e->sigma, where, error) ||
      !cw_json_get_string (obj, "source", TRUE, &src, where, error) ||
      !cw_json_get_string (obj, "note", FALSE, &note, where, error))
    return FALSE;
  for (k = 0; k < CW_N_PAIR_KINDS; k++)
    if (strcmp (kind, kind_names[k]) == 0)
      break;
  if (k == CW_N_PAIR_KINDS)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “kind” is “%s”; expected syn-axial, gauche or geminal"), where, kind);
      return FALSE;
    }
  if (fabs (e->value) > 20 || e->sigma > 10)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “kcal_mol” must lie within ±20 and “sigma” at most 10"), where);
      return FALSE;
    }
  if (e->sigma < 0 || *src == '\0' || *a == '\0' || *b == '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “a”, “b” and “source” must not be empty and “sigma” not negative"), where);
      return FALSE;
    }
  e->kind = (CwPairKind) k;
  e->a = g_strdup (a);
  e->b = g_strdup (b);
  e->source = g_strdup (src);
  e->note = g_strdup (note);
  return TRUE;
}

static gboolean
parse_level (const cJSON *ring, const char *field, CwRingLevel *level, const char *name, GError **error)
{
  const cJSON *obj = cJSON_GetObjectItemCaseSensitive (ring, field);
  g_autofree char *where = g_strdup_printf ("%s: ring, “%s”", name, field);
  const char *src = NULL;

  if (!cJSON_IsObject (obj))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: ring level “%s” is missing"), name, field);
      return FALSE;
    }
  if (!cw_json_get_number (obj, "kcal_mol", TRUE, &level->g, where, error) ||
      !cw_json_get_number (obj, "sigma", TRUE, &level->sigma, where, error) ||
      !cw_json_get_string (obj, "source", TRUE, &src, where, error))
    return FALSE;
  if (level->g < 0 || level->g > 30 || level->sigma < 0 || level->sigma > 10)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “kcal_mol” must lie within 0–30 and “sigma” within 0–10"), where);
      return FALSE;
    }
  level->source = g_strdup (src);
  return TRUE;
}

static gboolean
parse_ring (const cJSON *root, CwInteractionTable *t, const char *name, GError **error)
{
  const cJSON *ring = cJSON_GetObjectItemCaseSensitive (root, "ring");
  CwRingLevel margin = { 0 };

  if (!cJSON_IsObject (ring))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “ring” must be an object"), name);
      return FALSE;
    }
  if (!parse_level (ring, "half_chair", &t->ring.half_chair, name, error) ||
      !parse_level (ring, "twist_boat", &t->ring.twist_boat, name, error) ||
      !parse_level (ring, "boat", &t->ring.boat, name, error) ||
      !parse_level (ring, "twist_boat_margin", &margin, name, error))
    return FALSE;
  t->ring.twist_boat_margin = margin.g;
  t->ring.twist_boat_margin_source = margin.source;
  return TRUE;
}

static gboolean
parse_fallback (const cJSON *root, CwInteractionTable *t, const char *name, GError **error)
{
  const cJSON *obj = cJSON_GetObjectItemCaseSensitive (root, "fallback");
  g_autofree char *where = g_strdup_printf ("%s: fallback", name);
  const char *rule = NULL;

  if (!cJSON_IsObject (obj))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “fallback” must be an object"), name);
      return FALSE;
    }
  if (!cw_json_get_number (obj, "syn_axial_scale", TRUE, &t->fallback.syn_axial_scale, where, error) ||
      !cw_json_get_number (obj, "gauche_scale", TRUE, &t->fallback.gauche_scale, where, error) ||
      !cw_json_get_number (obj, "relative_sigma", TRUE, &t->fallback.relative_sigma, where, error) ||
      !cw_json_get_number (obj, "min_sigma", TRUE, &t->fallback.min_sigma, where, error) ||
      !cw_json_get_string (obj, "rule", TRUE, &rule, where, error))
    return FALSE;
  if (t->fallback.syn_axial_scale < 0 || t->fallback.syn_axial_scale > 10 ||
      t->fallback.gauche_scale < 0 || t->fallback.gauche_scale > 10 ||
      t->fallback.relative_sigma < 0 || t->fallback.relative_sigma > 10 ||
      t->fallback.min_sigma < 0 || t->fallback.min_sigma > 10)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: the scales and sigmas must lie within 0–10"), where);
      return FALSE;
    }
  t->fallback.rule = g_strdup (rule);
  return TRUE;
}

CwInteractionTable *
cw_interaction_table_new_from_data (const char *data, gsize len, const char *name, GError **error)
{
  g_autoptr (cJSON) root = cw_json_parse (data, len, name, error);
  g_autoptr (CwInteractionTable) t = NULL;
  const cJSON *pairs, *item;
  int i = 0;

  if (root == NULL ||
      !cw_json_check_format (root, CW_INTERACTIONS_FORMAT, CW_INTERACTIONS_VERSION, name, error))
    return NULL;
  t = g_new0 (CwInteractionTable, 1);
  t->entries = g_array_new (FALSE, TRUE, sizeof (CwPairEntry));
  g_array_set_clear_func (t->entries, (GDestroyNotify) clear_entry);
  pairs = cJSON_GetObjectItemCaseSensitive (root, "pairs");
  if (!cJSON_IsArray (pairs))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “pairs” must be an array"), name);
      return NULL;
    }
  cJSON_ArrayForEach (item, pairs)
    {
      CwPairEntry e = { 0 };

      if (!parse_pair (item, i++, name, &e, error))
        {
          clear_entry (&e);
          return NULL;
        }
      g_array_append_val (t->entries, e);
    }
  if (!parse_ring (root, t, name, error) || !parse_fallback (root, t, name, error))
    return NULL;
  return g_steal_pointer (&t);
}

CwInteractionTable *
cw_interaction_table_new_from_file (const char *path, GError **error)
{
  g_autofree char *contents = NULL;
  gsize len = 0;

  if (!g_file_get_contents (path, &contents, &len, error))
    return NULL;
  return cw_interaction_table_new_from_data (contents, len, path, error);
}

guint
cw_interaction_table_get_n_entries (const CwInteractionTable *table)
{
  return table->entries->len;
}

const CwPairEntry *
cw_interaction_table_get_entry (const CwInteractionTable *table, guint i)
{
  g_return_val_if_fail (i < table->entries->len, NULL);
  return &g_array_index (table->entries, CwPairEntry, i);
}

const CwRingEnergetics *
cw_interaction_table_get_ring (const CwInteractionTable *table)
{
  return &table->ring;
}

const CwFallbackRules *
cw_interaction_table_get_fallback (const CwInteractionTable *table)
{
  return &table->fallback;
}

/* 2 for an id match, 1 for a class match, 0 for none. */
static int
match_score (const char *key, const CwGroup *g)
{
  if (g_str_has_prefix (key, "class:"))
    return strcmp (key + 6, cw_group_class_to_string (g->klass)) == 0 ? 1 : 0;
  return strcmp (key, g->id) == 0 ? 2 : 0;
}

const CwPairEntry *
cw_interaction_table_find (const CwInteractionTable *table,
                           CwPairKind kind,
                           const CwGroup *x,
                           const CwGroup *y,
                           gboolean *swapped)
{
  const CwPairEntry *best = NULL;
  int best_score = 0;
  gboolean best_swapped = FALSE;

  for (guint i = 0; i < table->entries->len; i++)
    {
      const CwPairEntry *e = &g_array_index (table->entries, CwPairEntry, i);
      int ab, ba;

      if (e->kind != kind)
        continue;
      ab = MIN (match_score (e->a, x), match_score (e->b, y));
      ab = ab ? match_score (e->a, x) + match_score (e->b, y) : 0;
      ba = MIN (match_score (e->a, y), match_score (e->b, x));
      ba = ba ? match_score (e->a, y) + match_score (e->b, x) : 0;
      if (ab > best_score)
        {
          best = e;
          best_score = ab;
          best_swapped = FALSE;
        }
      if (ba > best_score)
        {
          best = e;
          best_score = ba;
          best_swapped = TRUE;
        }
    }
  if (swapped)
    *swapped = best_swapped;
  return best;
}
