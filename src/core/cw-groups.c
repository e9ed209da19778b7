#include "config.h"

#include "cw-groups.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-core-private.h"

#define CW_GROUPS_FORMAT "chairwise-groups"
#define CW_GROUPS_VERSION 1

struct _CwGroupTable
{
  GPtrArray *groups;     /* CwGroup*, owned */
  GHashTable *by_key;    /* id and label -> CwGroup*, borrowed */
};

static const char *element_symbols[CW_N_ELEMENTS] = {
  "C", "H", "D", "Br", "Cl", "F", "Hg", "I", "N", "O", "S", "Si", "Sn",
};

static const char *class_names[CW_N_CLASSES] = {
  "alkyl", "branched-alkyl", "aryl", "unsaturated", "halogen", "oxygen",
  "nitrogen", "sulfur", "element", "isotope", "other",
};

const char *
cw_element_symbol (CwElement el)
{
  g_return_val_if_fail (el < CW_N_ELEMENTS, "?");
  return element_symbols[el];
}

const char *
cw_group_class_to_string (CwGroupClass klass)
{
  g_return_val_if_fail (klass < CW_N_CLASSES, "other");
  return class_names[klass];
}

static gboolean
element_from_symbol (const char *s, gsize len, CwElement *el)
{
  for (int i = 0; i < CW_N_ELEMENTS; i++)
    if (strlen (element_symbols[i]) == len && strncmp (element_symbols[i], s, len) == 0)
      {
        *el = (CwElement) i;
        return TRUE;
      }
  return FALSE;
}

gboolean
cw_group_parse_formula (const char *formula, int elements[CW_N_ELEMENTS], int *charge, GError **error)
{
  const char *p = formula;

  memset (elements, 0, sizeof (int) * CW_N_ELEMENTS);
  if (charge)
    *charge = 0;
  while (*p)
    {
      const char *start = p;
      CwElement el;
      long count = 1;

      if (*p == '+' || *p == '-')
        {
          if (charge)
            *charge += (*p == '+') ? 1 : -1;
          p++;
          continue;
        }
      if (!g_ascii_isupper (*p))
        goto bad;
      p++;
      while (g_ascii_islower (*p))
        p++;
      if (!element_from_symbol (start, p - start, &el))
        goto bad;
      if (g_ascii_isdigit (*p))
        {
          char *end;
          count = strtol (p, &end, 10);
          if (count <= 0 || count > 999)
            goto bad;
          p = end;
        }
      elements[el] += (int) count;
      continue;
    bad:
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("formula “%s”: cannot read “%s”"), formula, start);
      return FALSE;
    }
  return TRUE;
}

void
cw_group_free (CwGroup *group)
{
  if (group == NULL)
    return;
  g_free (group->id);
  g_free (group->label);
  g_free (group->markup);
  g_free (group->smiles);
  g_free (group->formula);
  g_free (group->source);
  g_free (group->protic_source);
  g_free (group->thermo_source);
  g_free (group);
}

CwGroup *
cw_group_copy (const CwGroup *group)
{
  CwGroup *copy = g_memdup2 (group, sizeof *group);

  copy->id = g_strdup (group->id);
  copy->label = g_strdup (group->label);
  copy->markup = g_strdup (group->markup);
  copy->smiles = g_strdup (group->smiles);
  copy->formula = g_strdup (group->formula);
  copy->source = g_strdup (group->source);
  copy->protic_source = g_strdup (group->protic_source);
  copy->thermo_source = g_strdup (group->thermo_source);
  return copy;
}

CwGroup *
cw_group_new_custom (const char *id, const char *label, double a, double a_sigma, const char *source)
{
  CwGroup *g = g_new0 (CwGroup, 1);

  g->id = g_strdup (id);
  g->label = g_strdup (label ? label : id);
  g->markup = g_markup_escape_text (g->label, -1);
  g->smiles = g_strdup ("");
  g->formula = g_strdup ("");
  g->first_atom = CW_EL_C;
  g->klass = CW_CLASS_OTHER;
  g->a = a;
  g->a_sigma = a_sigma;
  g->a_min = a - a_sigma;
  g->a_max = a + a_sigma;
  g->source = g_strdup (source && *source ? source : _("user-defined value, no source given"));
  g->custom = TRUE;
  g->index = -1;
  return g;
}

static gboolean
parse_class (const char *s, CwGroupClass *klass)
{
  for (int i = 0; i < CW_N_CLASSES; i++)
    if (g_strcmp0 (s, class_names[i]) == 0)
      {
        *klass = (CwGroupClass) i;
        return TRUE;
      }
  return FALSE;
}

static gboolean
parse_value_block (const cJSON *obj, const char *field, double *value, double *sigma,
                   const char **source, const char *where, GError **error)
{
  const cJSON *block = cJSON_GetObjectItemCaseSensitive (obj, field);
  g_autofree char *inner = g_strdup_printf ("%s, “%s”", where, field);

  if (!cJSON_IsObject (block))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” must be an object"), where, field);
      return FALSE;
    }
  if (!cw_json_get_number (block, "kcal_mol", TRUE, value, inner, error) ||
      !cw_json_get_number (block, "sigma", TRUE, sigma, inner, error) ||
      !cw_json_get_string (block, "source", TRUE, source, inner, error))
    return FALSE;
  if (fabs (*value) > 20 || *sigma > 10)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “kcal_mol” must lie within ±20 and “sigma” at most 10"), inner);
      return FALSE;
    }
  if (*sigma < 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “sigma” must not be negative"), inner);
      return FALSE;
    }
  if (**source == '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “source” must not be empty"), inner);
      return FALSE;
    }
  return TRUE;
}

static gboolean
parse_range (const cJSON *obj, CwGroup *g, const char *where, GError **error)
{
  const cJSON *block = cJSON_GetObjectItemCaseSensitive (obj, "a_value");
  const cJSON *range = cJSON_GetObjectItemCaseSensitive (block, "range");

  g->a_min = g->a_max = g->a;
  if (range == NULL)
    return TRUE;
  if (!cJSON_IsArray (range) || cJSON_GetArraySize (range) != 2 ||
      !cJSON_IsNumber (cJSON_GetArrayItem (range, 0)) ||
      !cJSON_IsNumber (cJSON_GetArrayItem (range, 1)) ||
      cJSON_GetArrayItem (range, 0)->valuedouble > cJSON_GetArrayItem (range, 1)->valuedouble)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s, “a_value”: field “range” must be [low, high] with low ≤ high"), where);
      return FALSE;
    }
  g->a_min = cJSON_GetArrayItem (range, 0)->valuedouble;
  g->a_max = cJSON_GetArrayItem (range, 1)->valuedouble;
  return TRUE;
}

static gboolean
parse_thermo (const cJSON *obj, CwGroup *g, const char *where, GError **error)
{
  const cJSON *block = cJSON_GetObjectItemCaseSensitive (obj, "thermo");
  g_autofree char *inner = g_strdup_printf ("%s, “thermo”", where);
  const char *src = NULL;

  if (block == NULL)
    return TRUE;
  if (!cJSON_IsObject (block))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “thermo” must be an object"), where);
      return FALSE;
    }
  if (!cw_json_get_number (block, "dh_kcal_mol", TRUE, &g->dh, inner, error) ||
      !cw_json_get_number (block, "ds_cal_mol_k", TRUE, &g->ds, inner, error) ||
      !cw_json_get_string (block, "source", TRUE, &src, inner, error))
    return FALSE;
  if (fabs (g->dh) > 20 || fabs (g->ds) > 50)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: ΔH° must lie within ±20 kcal/mol and ΔS° within ±50 cal/(mol·K)"), inner);
      return FALSE;
    }
  g->has_thermo = TRUE;
  g->thermo_source = g_strdup (src);
  return TRUE;
}

static gboolean
parse_flags (const cJSON *obj, CwGroup *g, const char *where, GError **error)
{
  return cw_json_get_bool (obj, "polar", FALSE, &g->polar, where, error) &&
         cw_json_get_bool (obj, "hbond_donor", FALSE, &g->hbond_donor, where, error) &&
         cw_json_get_bool (obj, "hbond_acceptor", FALSE, &g->hbond_acceptor, where, error) &&
         cw_json_get_bool (obj, "leaving", FALSE, &g->leaving, where, error);
}

static gboolean
markup_ok (const char *markup)
{
  static const GMarkupParser parser = { 0 };
  g_autofree char *wrapped = g_strconcat ("<m>", markup, "</m>", NULL);
  g_autoptr (GMarkupParseContext) ctx = g_markup_parse_context_new (&parser, 0, NULL, NULL);

  return g_markup_parse_context_parse (ctx, wrapped, -1, NULL) &&
         g_markup_parse_context_end_parse (ctx, NULL);
}

static gboolean
parse_identity (const cJSON *obj, CwGroup *g, const char *where, GError **error)
{
  const char *id, *label, *markup, *smiles, *formula, *first, *klass;
  double unsat = 0, charge = 0;

  if (!cw_json_get_string (obj, "id", TRUE, &id, where, error) ||
      !cw_json_get_string (obj, "label", TRUE, &label, where, error) ||
      !cw_json_get_string (obj, "markup", TRUE, &markup, where, error) ||
      !cw_json_get_string (obj, "smiles", TRUE, &smiles, where, error) ||
      !cw_json_get_string (obj, "formula", TRUE, &formula, where, error) ||
      !cw_json_get_string (obj, "first_atom", TRUE, &first, where, error) ||
      !cw_json_get_string (obj, "class", TRUE, &klass, where, error) ||
      !cw_json_get_number (obj, "unsaturation", FALSE, &unsat, where, error) ||
      !cw_json_get_number (obj, "charge", FALSE, &charge, where, error))
    return FALSE;
  if (*id == '\0' || *label == '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “id” and “label” must not be empty"), where);
      return FALSE;
    }
  g->id = g_strdup (id);
  g->label = g_strdup (label);
  g->markup = g_strdup (markup);
  g->smiles = g_strdup (smiles);
  g->formula = g_strdup (formula);
  if (unsat != floor (unsat) || unsat < 0 || unsat > 50 || charge != floor (charge) || fabs (charge) > 4)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “unsaturation” must be a whole number 0–50 and “charge” −4…4"), where);
      return FALSE;
    }
  g->unsaturation = (int) unsat;
  if (!markup_ok (markup) ||
      !cw_group_parse_formula (formula, g->elements, &g->charge, error) ||
      !element_from_symbol (first, strlen (first), &g->first_atom) || !parse_class (klass, &g->klass))
    {
      g_clear_error (error);
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: bad “markup”, “formula”, “first_atom” or “class”"), where);
      return FALSE;
    }
  g->charge += (int) charge;
  return TRUE;
}

static CwGroup *
parse_group (const cJSON *obj, int index, const char *name, GError **error)
{
  g_autoptr (CwGroup) g = g_new0 (CwGroup, 1);
  g_autofree char *where = NULL;
  const cJSON *id = cJSON_GetObjectItemCaseSensitive (obj, "id");
  const char *src = NULL;

  if (cJSON_IsString (id))
    where = g_strdup_printf ("%s: group %d (“%s”)", name, index + 1, id->valuestring);
  else
    where = g_strdup_printf ("%s: group %d", name, index + 1);
  if (!cJSON_IsObject (obj))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: must be an object"), where);
      return NULL;
    }
  g->index = index;
  if (!parse_identity (obj, g, where, error) ||
      !parse_value_block (obj, "a_value", &g->a, &g->a_sigma, &src, where, error) ||
      !parse_range (obj, g, where, error) || !parse_thermo (obj, g, where, error) ||
      !parse_flags (obj, g, where, error))
    return NULL;
  g->source = g_strdup (src);
  if (cJSON_GetObjectItemCaseSensitive (obj, "protic") != NULL)
    {
      if (!parse_value_block (obj, "protic", &g->a_protic, &g->a_protic_sigma, &src, where, error))
        return NULL;
      g->has_protic = TRUE;
      g->protic_source = g_strdup (src);
    }
  if (fabs (g->a) > 10)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: A-value %.3g kcal/mol is outside −10…10"), where, g->a);
      return NULL;
    }
  return g_steal_pointer (&g);
}

CwGroupTable *
cw_group_table_new_from_data (const char *data, gsize len, const char *name, GError **error)
{
  g_autoptr (cJSON) root = cw_json_parse (data, len, name, error);
  g_autoptr (CwGroupTable) table = NULL;
  const cJSON *groups, *item;
  int i = 0;

  if (root == NULL || !cw_json_check_format (root, CW_GROUPS_FORMAT, CW_GROUPS_VERSION, name, error))
    return NULL;
  groups = cJSON_GetObjectItemCaseSensitive (root, "groups");
  if (!cJSON_IsArray (groups) || cJSON_GetArraySize (groups) == 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “groups” must be a non-empty array"), name);
      return NULL;
    }
  table = g_new0 (CwGroupTable, 1);
  table->groups = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_group_free);
  table->by_key = g_hash_table_new (g_str_hash, g_str_equal);
  cJSON_ArrayForEach (item, groups)
    {
      CwGroup *g = parse_group (item, i++, name, error);

      if (g == NULL)
        return NULL;
      g_ptr_array_add (table->groups, g);
      if (g_hash_table_contains (table->by_key, g->id))
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("%s: group %d: id or label “%s” is used twice"), name, i, g->id);
          return NULL;
        }
      g_hash_table_insert (table->by_key, g->id, g);
    }
  /* Labels are a second key, where they do not clash with an id. */
  for (guint k = 0; k < table->groups->len; k++)
    {
      CwGroup *g = g_ptr_array_index (table->groups, k);
      if (!g_hash_table_contains (table->by_key, g->label))
        g_hash_table_insert (table->by_key, g->label, g);
    }
  return g_steal_pointer (&table);
}

CwGroupTable *
cw_group_table_new_from_file (const char *path, GError **error)
{
  g_autofree char *contents = NULL;
  gsize len = 0;

  if (!g_file_get_contents (path, &contents, &len, error))
    return NULL;
  return cw_group_table_new_from_data (contents, len, path, error);
}

void
cw_group_table_free (CwGroupTable *table)
{
  if (table == NULL)
    return;
  g_clear_pointer (&table->by_key, g_hash_table_unref);
  g_clear_pointer (&table->groups, g_ptr_array_unref);
  g_free (table);
}

guint
cw_group_table_get_n_groups (const CwGroupTable *table)
{
  return table->groups->len;
}

const CwGroup *
cw_group_table_get (const CwGroupTable *table, guint i)
{
  g_return_val_if_fail (i < table->groups->len, NULL);
  return g_ptr_array_index (table->groups, i);
}

const CwGroup *
cw_group_table_lookup (const CwGroupTable *table, const char *key)
{
  const CwGroup *g;

  if (key == NULL)
    return NULL;
  g = g_hash_table_lookup (table->by_key, key);
  if (g != NULL)
    return g;
  for (guint i = 0; i < table->groups->len; i++)
    {
      g = g_ptr_array_index (table->groups, i);
      if (g_ascii_strcasecmp (g->id, key) == 0)
        return g;
    }
  return NULL;
}
