#include "config.h"

#include "cw-document.h"

#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/stat.h>

#include "cw-core-error.h"
#include "cw-core-private.h"

struct _CwDocument
{
  CwMolecule *mol;
  char *title;
  char *notes;
  double temperature;
  CwTemperatureUnit temperature_unit;
  CwEnergyUnit energy_unit;
  CwSolvent solvent;
  cJSON *extra; /* the document as read, so that unknown fields survive a save */
};

CwDocument *
cw_document_new (void)
{
  CwDocument *doc = g_new0 (CwDocument, 1);

  doc->mol = cw_molecule_new ();
  doc->title = g_strdup ("");
  doc->notes = g_strdup ("");
  doc->temperature = 298.15;
  doc->temperature_unit = CW_TUNIT_CELSIUS;
  doc->energy_unit = CW_UNIT_KCAL;
  doc->solvent = CW_SOLVENT_APROTIC;
  return doc;
}

void
cw_document_free (CwDocument *doc)
{
  if (doc == NULL)
    return;
  cw_molecule_free (doc->mol);
  g_free (doc->title);
  g_free (doc->notes);
  if (doc->extra)
    cJSON_Delete (doc->extra);
  g_free (doc);
}

CwDocument *
cw_document_copy (const CwDocument *doc)
{
  CwDocument *copy = g_new0 (CwDocument, 1);

  *copy = *doc;
  copy->mol = cw_molecule_copy (doc->mol);
  copy->title = g_strdup (doc->title);
  copy->notes = g_strdup (doc->notes);
  copy->extra = doc->extra ? cJSON_Duplicate (doc->extra, TRUE) : NULL;
  return copy;
}

static gboolean
parse_custom_groups (const cJSON *root, CwMolecule *mol, const CwGroupTable *table,
                     const char *name, GError **error)
{
  const cJSON *arr = cJSON_GetObjectItemCaseSensitive (root, "custom_groups");
  const cJSON *item;
  int i = 0;

  if (arr == NULL)
    return TRUE;
  if (!cJSON_IsArray (arr))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “custom_groups” must be an array"), name);
      return FALSE;
    }
  cJSON_ArrayForEach (item, arr)
    {
      g_autofree char *where = g_strdup_printf ("%s: custom group %d", name, ++i);
      const char *id = NULL, *label = NULL, *source = NULL;
      double a = 0, sigma = 0;

      if (!cJSON_IsObject (item))
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: must be an object"), where);
          return FALSE;
        }
      if (!cw_json_get_string (item, "id", TRUE, &id, where, error) ||
          !cw_json_get_string (item, "label", FALSE, &label, where, error) ||
          !cw_json_get_number (item, "a_kcal_mol", TRUE, &a, where, error) ||
          !cw_json_get_number (item, "sigma_kcal_mol", TRUE, &sigma, where, error) ||
          !cw_json_get_string (item, "source", FALSE, &source, where, error))
        return FALSE;
      if (*id == '\0' || cw_group_table_lookup (table, id) != NULL ||
          cw_molecule_find_custom_group (mol, id) != NULL)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("%s: id “%s” is empty or already names a group"), where, id);
          return FALSE;
        }
      if (fabs (a) > 10 || sigma < 0 || sigma > 10)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("%s: A-value must lie within −10…10 kcal/mol and sigma within 0…10"), where);
          return FALSE;
        }
      cw_molecule_add_custom_group (mol, cw_group_new_custom (id, label, a, sigma, source));
    }
  return TRUE;
}

static gboolean
parse_substituent (const cJSON *item, CwMolecule *mol, const CwGroupTable *table, const char *where,
                   GError **error)
{
  const char *face_s = NULL, *gid = NULL;
  double pos = 0;
  CwFace face;
  const CwGroup *g;

  if (!cJSON_IsObject (item))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: must be an object"), where);
      return FALSE;
    }
  if (!cw_json_get_number (item, "position", TRUE, &pos, where, error) ||
      !cw_json_get_string (item, "face", TRUE, &face_s, where, error) ||
      !cw_json_get_string (item, "group", TRUE, &gid, where, error))
    return FALSE;
  if (pos != floor (pos) || pos < 1 || pos > CW_RING_SIZE)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “position” must be a whole number from 1 to 6"), where);
      return FALSE;
    }
  if (!cw_face_from_string (face_s, &face))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “face” is “%s”; expected “up” or “down”"), where, face_s);
      return FALSE;
    }
  g = cw_molecule_find_custom_group (mol, gid);
  if (g == NULL)
    g = cw_group_table_lookup (table, gid);
  if (g == NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_UNKNOWN_GROUP,
                   _("%s: unknown group “%s”; define it under “custom_groups” with an A-value"),
                   where, gid);
      return FALSE;
    }
  if (cw_molecule_get (mol, (int) pos, face) != NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: position %d already has a group on the %s face"), where, (int) pos, face_s);
      return FALSE;
    }
  return cw_molecule_set (mol, (int) pos, face, g, error);
}

static gboolean
parse_substituents (const cJSON *root, CwMolecule *mol, const CwGroupTable *table, const char *name,
                    GError **error)
{
  const cJSON *arr = cJSON_GetObjectItemCaseSensitive (root, "substituents");
  const cJSON *item;
  int i = 0;

  if (!cJSON_IsArray (arr))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “substituents” must be an array"), name);
      return FALSE;
    }
  cJSON_ArrayForEach (item, arr)
    {
      g_autofree char *where = g_strdup_printf ("%s: substituent %d", name, ++i);
      if (i > CW_MAX_SUBS)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("%s: more than %d substituents (six carbons, two faces)"), where, CW_MAX_SUBS);
          return FALSE;
        }
      if (!parse_substituent (item, mol, table, where, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
parse_conditions (const cJSON *root, CwDocument *doc, const char *name, GError **error)
{
  const char *tunit = NULL, *eunit = NULL, *solvent = NULL, *title = NULL, *notes = NULL;

  if (!cw_json_get_number (root, "temperature_k", FALSE, &doc->temperature, name, error) ||
      !cw_json_get_string (root, "temperature_unit", FALSE, &tunit, name, error) ||
      !cw_json_get_string (root, "energy_unit", FALSE, &eunit, name, error) ||
      !cw_json_get_string (root, "solvent", FALSE, &solvent, name, error) ||
      !cw_json_get_string (root, "title", FALSE, &title, name, error) ||
      !cw_json_get_string (root, "notes", FALSE, &notes, name, error))
    return FALSE;
  if (!cw_check_temperature (doc->temperature, error))
    {
      g_prefix_error (error, _("%s: field “temperature_k”: "), name);
      return FALSE;
    }
  if (tunit != NULL && g_strcmp0 (tunit, "K") != 0 && g_strcmp0 (tunit, "C") != 0)
    goto bad_enum;
  doc->temperature_unit = g_strcmp0 (tunit, "K") == 0 ? CW_TUNIT_KELVIN : CW_TUNIT_CELSIUS;
  if ((eunit != NULL && !cw_energy_unit_from_string (eunit, &doc->energy_unit)) ||
      (solvent != NULL && !cw_solvent_from_string (solvent, &doc->solvent)))
    goto bad_enum;
  g_free (doc->title);
  doc->title = g_strdup (title ? title : "");
  g_free (doc->notes);
  doc->notes = g_strdup (notes ? notes : "");
  return TRUE;
bad_enum:
  g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
               _("%s: “temperature_unit” must be K or C, “energy_unit” kcal/mol or kJ/mol, "
                 "“solvent” aprotic or protic"), name);
  return FALSE;
}

static CwDocument *
document_parse (const char *data, gsize len, const CwGroupTable *table, const char *name,
                GError **error)
{
  g_autoptr (cJSON) root = NULL;
  g_autoptr (CwDocument) doc = cw_document_new ();

  root = cw_json_parse (data, len, name, error);
  if (root == NULL ||
      !cw_json_check_format (root, CW_DOCUMENT_FORMAT, CW_DOCUMENT_VERSION, name, error) ||
      !parse_conditions (root, doc, name, error) ||
      !parse_custom_groups (root, doc->mol, table, name, error) ||
      !parse_substituents (root, doc->mol, table, name, error))
    return NULL;
  doc->extra = g_steal_pointer (&root);
  return g_steal_pointer (&doc);
}

CwDocument *
cw_document_new_from_data (const char *data, gsize len, const CwGroupTable *table, GError **error)
{
  return document_parse (data, len, table, _("document"), error);
}

CwDocument *
cw_document_new_from_file (const char *path, const CwGroupTable *table, GError **error)
{
  g_autofree char *contents = NULL;
  gsize len = 0;
  GStatBuf st;

  if (g_stat (path, &st) == 0 && !S_ISREG (st.st_mode))
    {
      if (S_ISDIR (st.st_mode))
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_IO,
                     _("%s: is a directory, not a document"), path);
      else
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_IO,
                     _("%s: not a regular file (a device or a pipe), not a document"), path);
      return NULL;
    }
  if (g_stat (path, &st) == 0 && st.st_size > CW_DOCUMENT_MAX_SIZE)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: %.1f MB is far larger than any Chairwise document (limit %d MB)"), path,
                   st.st_size / 1e6, CW_DOCUMENT_MAX_SIZE / 1000000);
      return NULL;
    }
  if (!g_file_get_contents (path, &contents, &len, error))
    return NULL;
  return document_parse (contents, len, table, path, error);
}

static void
set_item (cJSON *root, const char *key, cJSON *item)
{
  if (cJSON_GetObjectItemCaseSensitive (root, key) != NULL)
    cJSON_ReplaceItemInObjectCaseSensitive (root, key, item);
  else
    cJSON_AddItemToObject (root, key, item);
}

static cJSON *
custom_groups_json (const CwMolecule *mol)
{
  cJSON *arr = cJSON_CreateArray ();

  for (guint i = 0; mol->custom_groups && i < mol->custom_groups->len; i++)
    {
      const CwGroup *g = g_ptr_array_index (mol->custom_groups, i);
      cJSON *o = cJSON_CreateObject ();

      cJSON_AddStringToObject (o, "id", g->id);
      cJSON_AddStringToObject (o, "label", g->label);
      cJSON_AddNumberToObject (o, "a_kcal_mol", g->a);
      cJSON_AddNumberToObject (o, "sigma_kcal_mol", g->a_sigma);
      cJSON_AddStringToObject (o, "source", g->source);
      cJSON_AddItemToArray (arr, o);
    }
  return arr;
}

static cJSON *
substituents_json (const CwMolecule *mol)
{
  cJSON *arr = cJSON_CreateArray ();

  for (int i = 0; i < mol->n_subs; i++)
    {
      cJSON *o = cJSON_CreateObject ();

      cJSON_AddNumberToObject (o, "position", mol->subs[i].position);
      cJSON_AddStringToObject (o, "face", cw_face_to_string (mol->subs[i].face));
      cJSON_AddStringToObject (o, "group", mol->subs[i].group->id);
      cJSON_AddItemToArray (arr, o);
    }
  return arr;
}

char *
cw_document_to_data (const CwDocument *doc, gsize *len)
{
  g_autoptr (cJSON) root = doc->extra ? cJSON_Duplicate (doc->extra, TRUE) : cJSON_CreateObject ();
  char *printed, *out;

  set_item (root, "format", cJSON_CreateString (CW_DOCUMENT_FORMAT));
  set_item (root, "version", cJSON_CreateNumber (CW_DOCUMENT_VERSION));
  set_item (root, "title", cJSON_CreateString (doc->title));
  set_item (root, "notes", cJSON_CreateString (doc->notes));
  set_item (root, "temperature_k", cJSON_CreateNumber (doc->temperature));
  set_item (root, "temperature_unit",
            cJSON_CreateString (doc->temperature_unit == CW_TUNIT_KELVIN ? "K" : "C"));
  set_item (root, "energy_unit", cJSON_CreateString (cw_energy_unit_symbol (doc->energy_unit)));
  set_item (root, "solvent", cJSON_CreateString (cw_solvent_to_string (doc->solvent)));
  set_item (root, "custom_groups", custom_groups_json (doc->mol));
  set_item (root, "substituents", substituents_json (doc->mol));
  printed = cJSON_Print (root);
  out = g_strconcat (printed, "\n", NULL);
  cJSON_free (printed);
  if (len)
    *len = strlen (out);
  return out;
}

gboolean
cw_document_save (const CwDocument *doc, const char *path, gboolean keep_backup, GError **error)
{
  gsize len = 0;
  g_autofree char *data = cw_document_to_data (doc, &len);
  g_autofree char *old = NULL;
  gsize old_len = 0;

  if (keep_backup && g_file_get_contents (path, &old, &old_len, NULL))
    {
      g_autofree char *bak = g_strconcat (path, ".bak", NULL);
      if (!g_file_set_contents_full (bak, old, old_len,
                                     G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE,
                                     0644, error))
        {
          g_prefix_error (error, _("Could not keep a backup of %s: "), path);
          return FALSE;
        }
    }
  /* Temporary file, fsync, rename: a failure leaves the previous version untouched. */
  if (!g_file_set_contents_full (path, data, len,
                                 G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE,
                                 0644, error))
    {
      g_prefix_error (error, _("Could not save %s: "), path);
      return FALSE;
    }
  return TRUE;
}

CwMolecule *
cw_document_get_molecule (CwDocument *doc)
{
  return doc->mol;
}

const CwMolecule *
cw_document_peek_molecule (const CwDocument *doc)
{
  return doc->mol;
}

void
cw_document_set_molecule (CwDocument *doc, const CwMolecule *mol)
{
  CwMolecule *copy = cw_molecule_copy (mol);

  cw_molecule_free (doc->mol);
  doc->mol = copy;
}

const char *
cw_document_get_title (const CwDocument *doc)
{
  return doc->title;
}

void
cw_document_set_title (CwDocument *doc, const char *title)
{
  char *copy = g_strdup (title ? title : "");

  g_free (doc->title);
  doc->title = copy;
}

const char *
cw_document_get_notes (const CwDocument *doc)
{
  return doc->notes;
}

void
cw_document_set_notes (CwDocument *doc, const char *notes)
{
  char *copy = g_strdup (notes ? notes : "");

  g_free (doc->notes);
  doc->notes = copy;
}

double
cw_document_get_temperature (const CwDocument *doc)
{
  return doc->temperature;
}

void
cw_document_set_temperature (CwDocument *doc, double kelvin)
{
  g_return_if_fail (kelvin > 0 && kelvin <= CW_T_MAX);
  doc->temperature = kelvin;
}

CwTemperatureUnit
cw_document_get_temperature_unit (const CwDocument *doc)
{
  return doc->temperature_unit;
}

void
cw_document_set_temperature_unit (CwDocument *doc, CwTemperatureUnit unit)
{
  doc->temperature_unit = unit;
}

CwEnergyUnit
cw_document_get_energy_unit (const CwDocument *doc)
{
  return doc->energy_unit;
}

void
cw_document_set_energy_unit (CwDocument *doc, CwEnergyUnit unit)
{
  doc->energy_unit = unit;
}

CwSolvent
cw_document_get_solvent (const CwDocument *doc)
{
  return doc->solvent;
}

void
cw_document_set_solvent (CwDocument *doc, CwSolvent solvent)
{
  doc->solvent = solvent;
}

void
cw_document_get_conditions (const CwDocument *doc, CwConditions *cond)
{
  cond->temperature = doc->temperature;
  cond->solvent = doc->solvent;
}
