#include "config.h"

#include "cw-geometry-data.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-core-private.h"
#include "cw-data.h"

static gboolean
element_lookup (const char *symbol, CwElement *el)
{
  for (int i = 0; i < CW_N_ELEMENTS; i++)
    if (g_strcmp0 (cw_element_symbol ((CwElement) i), symbol) == 0)
      {
        *el = (CwElement) i;
        return TRUE;
      }
  return FALSE;
}

/* {"value": x, "source": "..."} under parent[field]; the value must lie in [lo, hi]. */
static gboolean
read_sourced (const cJSON *parent, const char *field, double lo, double hi, CwSourcedValue *out, const char *name, GError **error)
{
  const cJSON     *obj = cJSON_GetObjectItemCaseSensitive (parent, field);
  g_autofree char *where = g_strdup_printf ("%s: “%s”", name, field);

  if (!cJSON_IsObject (obj))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s is missing or not an object"), where);
      return FALSE;
    }
  if (!cw_json_get_number (obj, "value", TRUE, &out->value, where, error) ||
      !cw_json_get_string (obj, "source", TRUE, &out->source, where, error))
    return FALSE;
  if (out->value < lo || out->value > hi)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: value %g is outside the plausible range %g to %g"), where, out->value, lo, hi);
      return FALSE;
    }
  return TRUE;
}

static const cJSON *
get_object (const cJSON *root, const char *field, const char *name, GError **error)
{
  const cJSON *obj = cJSON_GetObjectItemCaseSensitive (root, field);

  if (!cJSON_IsObject (obj))
    g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                 _("%s: “%s” is missing or not an object"), name, field);
  return cJSON_IsObject (obj) ? obj : NULL;
}

static gboolean
read_ring (CwGeometryData *gd, const cJSON *root, const char *name, GError **error)
{
  const cJSON *ring = get_object (root, "ring", name, error);
  double       theta, tau;

  if (ring == NULL ||
      !read_sourced (ring, "cc_bond", 1.3, 1.7, &gd->cc_bond, name, error) ||
      !read_sourced (ring, "ch_axial", 0.9, 1.3, &gd->ch_axial, name, error) ||
      !read_sourced (ring, "ch_equatorial", 0.9, 1.3, &gd->ch_equatorial, name, error) ||
      !read_sourced (ring, "ccc_angle", 100.0, 120.0, &gd->ccc_angle, name, error) ||
      !read_sourced (ring, "ring_torsion", 30.0, 70.0, &gd->ring_torsion, name, error) ||
      !read_sourced (ring, "exocyclic_angle", 100.0, 120.0, &gd->exocyclic_angle, name, error))
    return FALSE;
  /* The chair is built from the angle; the torsion must agree with it (D3d: cos τ = −cos θ/(1 + cos θ)). */
  theta = gd->ccc_angle.value * G_PI / 180.0;
  tau = acos (-cos (theta) / (1.0 + cos (theta))) * 180.0 / G_PI;
  if (fabs (tau - gd->ring_torsion.value) > 1.0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “ring_torsion” %.1f° disagrees with the %.1f° a chair with “ccc_angle” %.1f° has"),
                      name, gd->ring_torsion.value, tau, gd->ccc_angle.value);
      return FALSE;
    }
  return TRUE;
}

static gboolean
read_element_list (const cJSON *root, const char *field, const char *value_field, double lo, double hi, gboolean *has, CwSourcedValue *values, const char *name, GError **error)
{
  const cJSON *list = cJSON_GetObjectItemCaseSensitive (root, field);
  const cJSON *item;
  int          i = 0;

  if (!cJSON_IsArray (list))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “%s” must be an array"), name, field);
      return FALSE;
    }
  cJSON_ArrayForEach (item, list)
  {
    g_autofree char *where = g_strdup_printf ("%s: %s entry %d", name, field, ++i);
    const char      *symbol = NULL;
    CwElement        el;
    double           v = 0;

    if (!cJSON_IsObject (item) ||
        !cw_json_get_string (item, "element", TRUE, &symbol, where, error) ||
        !cw_json_get_number (item, value_field, TRUE, &v, where, error))
      {
        if (error && *error == NULL)
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: not an object"), where);
        return FALSE;
      }
    if (!element_lookup (symbol, &el))
      {
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                     _("%s: unknown element “%s”"), where, symbol);
        return FALSE;
      }
    if ((v < lo || v > hi) && !(v == 0 && (el == CW_EL_H || el == CW_EL_D)))
      {
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                     _("%s: %s %g is outside %g to %g"), where, value_field, v, lo, hi);
        return FALSE;
      }
    if (!cw_json_get_string (item, "source", TRUE, &values[el].source, where, error))
      return FALSE;
    values[el].value = v;
    has[el] = TRUE;
  }
  return TRUE;
}

static gboolean
read_set (CwKarplusSet *set, const cJSON *item, const char *where, GError **error)
{
  const cJSON *p = cJSON_GetObjectItemCaseSensitive (item, "p");
  double       n = 0;

  if (!cw_json_get_string (item, "id", TRUE, &set->id, where, error) ||
      !cw_json_get_string (item, "label", TRUE, &set->label, where, error) ||
      !cw_json_get_number (item, "substituents", TRUE, &n, where, error) ||
      !cw_json_get_string (item, "source", TRUE, &set->source, where, error))
    return FALSE;
  if (n < 0 || n > 4 || n != floor (n) || n == 1)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “substituents” must be 0 (any), 2, 3 or 4"), where);
      return FALSE;
    }
  set->substituents = (int) n;
  if (!cJSON_IsArray (p) || cJSON_GetArraySize (p) != CW_KARPLUS_N_PARAMS)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “p” must be an array of %d numbers (P1 to P7)"), where, CW_KARPLUS_N_PARAMS);
      return FALSE;
    }
  for (int k = 0; k < CW_KARPLUS_N_PARAMS; k++)
    {
      const cJSON *v = cJSON_GetArrayItem (p, k);
      if (!cJSON_IsNumber (v) || !isfinite (v->valuedouble) || fabs (v->valuedouble) > 100.0)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("%s: P%d must be a finite number of magnitude below 100"), where, k + 1);
          return FALSE;
        }
      set->p[k] = v->valuedouble;
    }
  if (set->p[0] <= 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: P1 must be positive"), where);
      return FALSE;
    }
  return TRUE;
}

static gboolean
read_karplus (CwGeometryData *gd, const cJSON *root, const char *name, GError **error)
{
  const cJSON *k = get_object (root, "karplus", name, error);
  const cJSON *sets, *item;
  const char  *def = NULL;

  if (k == NULL)
    return FALSE;
  sets = cJSON_GetObjectItemCaseSensitive (k, "sets");
  if (!cJSON_IsArray (sets) || cJSON_GetArraySize (sets) < 1 ||
      cJSON_GetArraySize (sets) > CW_KARPLUS_MAX_SETS)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “karplus”.“sets” must be an array of 1 to %d sets"), name, CW_KARPLUS_MAX_SETS);
      return FALSE;
    }
  cJSON_ArrayForEach (item, sets)
  {
    g_autofree char *where = g_strdup_printf ("%s: karplus set %d", name, gd->n_sets + 1);
    if (!cJSON_IsObject (item) || !read_set (&gd->sets[gd->n_sets], item, where, error))
      {
        if (error && *error == NULL)
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("%s: not an object"), where);
        return FALSE;
      }
    gd->n_sets++;
  }
  if (!cw_json_get_string (k, "default", TRUE, &def, name, error) ||
      !cw_json_get_string (k, "xi_convention", TRUE, &gd->xi_convention, name, error))
    return FALSE;
  gd->default_set = -1;
  for (int i = 0; i < gd->n_sets; i++)
    if (g_strcmp0 (gd->sets[i].id, def) == 0)
      gd->default_set = i;
  if (gd->default_set < 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: the default Karplus set “%s” is not among the sets"), name, def);
      return FALSE;
    }
  return TRUE;
}

static gboolean
read_misc (CwGeometryData *gd, const cJSON *root, const char *name, GError **error)
{
  const cJSON *th = get_object (root, "thresholds", name, error);
  const cJSON *nb, *values, *item;

  if (th == NULL ||
      !read_sourced (root, "geminal", -20.0, 0.0, &gd->geminal, name, error) ||
      !read_sourced (th, "anti_periplanar_min", 120.0, 180.0, &gd->anti_periplanar_min, name, error) ||
      !read_sourced (th, "multiplet_tolerance", 0.0, 5.0, &gd->multiplet_tolerance, name, error) ||
      !read_sourced (th, "resolved_min", 0.0, 5.0, &gd->resolved_min, name, error) ||
      !read_sourced (th, "inverse_tolerance", 0.0, 5.0, &gd->inverse_tolerance, name, error) ||
      !read_sourced (th, "inverse_min_spread", 0.0, 10.0, &gd->inverse_min_spread, name, error))
    return FALSE;
  nb = get_object (root, "neighbouring_elements", name, error);
  if (nb == NULL ||
      !cw_json_get_string (nb, "source", TRUE, &gd->neighbouring_source, name, error))
    return FALSE;
  values = cJSON_GetObjectItemCaseSensitive (nb, "values");
  if (!cJSON_IsArray (values))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: “neighbouring_elements”.“values” must be an array of element symbols"), name);
      return FALSE;
    }
  cJSON_ArrayForEach (item, values)
  {
    CwElement el;
    if (!cJSON_IsString (item) || !element_lookup (item->valuestring, &el))
      {
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                     _("%s: “neighbouring_elements” holds something that is not a known element"), name);
        return FALSE;
      }
    gd->neighbouring[el] = TRUE;
  }
  return TRUE;
}

CwGeometryData *
cw_geometry_data_new_from_data (const char *data, gsize len, const char *name, GError **error)
{
  g_autoptr (CwGeometryData) gd = g_new0 (CwGeometryData, 1);
  cJSON *root;

  g_return_val_if_fail (data != NULL || len == 0, NULL);
  if (name == NULL)
    name = "geometry.json";
  root = cw_json_parse (data, len, name, error);
  if (root == NULL)
    return NULL;
  gd->json = root; /* every borrowed string points into it */
  if (!cw_json_check_format (root, CW_GEOMETRY_FORMAT, CW_GEOMETRY_VERSION, name, error) ||
      !read_ring (gd, root, name, error) ||
      !read_element_list (root, "bonds", "length", 0.9, 3.0, gd->has_bond, gd->bond, name, error) ||
      !read_element_list (cJSON_GetObjectItemCaseSensitive (root, "electronegativity"), "values",
                          "value", 0.5, 4.5, gd->has_electronegativity, gd->electronegativity,
                          name, error) ||
      !read_karplus (gd, root, name, error) ||
      !read_misc (gd, root, name, error))
    return NULL;
  if (!gd->has_electronegativity[CW_EL_H] || !gd->has_electronegativity[CW_EL_C])
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: the electronegativity list must give H and C"), name);
      return NULL;
    }
  return g_steal_pointer (&gd);
}

CwGeometryData *
cw_geometry_data_new_from_file (const char *path, GError **error)
{
  g_autofree char *contents = NULL;
  gsize            len = 0;

  g_return_val_if_fail (path != NULL, NULL);
  if (!g_file_get_contents (path, &contents, &len, error))
    {
      if (error && *error && (*error)->domain == G_FILE_ERROR)
        {
          GError *e = *error;
          *error = g_error_new (CW_CORE_ERROR, CW_CORE_ERROR_IO, "%s", e->message);
          g_error_free (e);
        }
      return NULL;
    }
  return cw_geometry_data_new_from_data (contents, len, path, error);
}

CwGeometryData *
cw_geometry_data_new_from_dir (const char *dir, GError **error)
{
  g_autofree char *path = g_build_filename (dir ? dir : cw_data_find_dir (), "geometry.json", NULL);

  return cw_geometry_data_new_from_file (path, error);
}

void
cw_geometry_data_free (CwGeometryData *gd)
{
  if (gd == NULL)
    return;
  cJSON_Delete (gd->json);
  g_free (gd);
}

const CwKarplusSet *
cw_geometry_data_find_set (const CwGeometryData *gd, const char *id)
{
  g_return_val_if_fail (gd != NULL, NULL);
  if (id == NULL)
    return &gd->sets[gd->default_set];
  for (int i = 0; i < gd->n_sets; i++)
    if (g_strcmp0 (gd->sets[i].id, id) == 0)
      return &gd->sets[i];
  return NULL;
}

double
cw_geometry_data_electronegativity (const CwGeometryData *gd, CwElement el)
{
  g_return_val_if_fail (gd != NULL && el < CW_N_ELEMENTS, 2.6);
  if (gd->has_electronegativity[el])
    return gd->electronegativity[el].value;
  return gd->electronegativity[CW_EL_C].value;
}
