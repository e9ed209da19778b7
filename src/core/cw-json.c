#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-core-error.h"
#include "cw-core-private.h"

cJSON *
cw_json_parse (const char *data, gsize len, const char *name, GError **error)
{
  const char *end = NULL;
  cJSON *root;

  if (len > 0 && !g_utf8_validate (data, len, &end))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("%s: not valid UTF-8 text (at byte %ld)"), name, (long) (end - data));
      return NULL;
    }
  root = cJSON_ParseWithLengthOpts (data, len, &end, FALSE);
  if (root == NULL)
    {
      const char *where = cJSON_GetErrorPtr ();
      gsize offset = (where && where >= data && where <= data + len) ? (gsize) (where - data) : 0;
      int line = 1;
      g_autofree char *snippet = NULL;

      for (gsize i = 0; i < offset; i++)
        if (data[i] == '\n')
          line++;
      snippet = g_utf8_make_valid (data + offset, (gssize) MIN ((gsize) 20, len - offset));
      g_strdelimit (snippet, "\n\r\t", ' ');
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("%s: invalid JSON at line %d (byte %lu) near “%s”"),
                   name, line, (unsigned long) offset, snippet);
      return NULL;
    }
  if (!cJSON_IsObject (root))
    {
      cJSON_Delete (root);
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: the top level must be a JSON object"), name);
      return NULL;
    }
  return root;
}

gboolean
cw_json_check_format (const cJSON *root, const char *format, int max_version, const char *name,
                      GError **error)
{
  const cJSON *f = cJSON_GetObjectItemCaseSensitive (root, "format");
  const cJSON *v = cJSON_GetObjectItemCaseSensitive (root, "version");

  if (!cJSON_IsString (f) || g_strcmp0 (f->valuestring, format) != 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “format” must be “%s”"), name, format);
      return FALSE;
    }
  if (!cJSON_IsNumber (v) || v->valuedouble != floor (v->valuedouble) || v->valuedouble < 1)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “version” must be a whole number of 1 or more"), name);
      return FALSE;
    }
  if (v->valuedouble > max_version)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_VERSION,
                   _("%s: format version %d is newer than this program reads (%d); "
                     "please update Chairwise"),
                   name, (int) MIN (v->valuedouble, 1e6), max_version);
      return FALSE;
    }
  return TRUE;
}

gboolean
cw_json_get_number (const cJSON *obj, const char *field, gboolean required, double *out,
                    const char *where, GError **error)
{
  const cJSON *item = cJSON_GetObjectItemCaseSensitive (obj, field);

  if (item == NULL || cJSON_IsNull (item))
    {
      if (!required)
        return TRUE;
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” is missing"), where, field);
      return FALSE;
    }
  if (!cJSON_IsNumber (item) || !isfinite (item->valuedouble))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” must be a finite number"), where, field);
      return FALSE;
    }
  *out = item->valuedouble;
  return TRUE;
}

gboolean
cw_json_get_string (const cJSON *obj, const char *field, gboolean required, const char **out,
                    const char *where, GError **error)
{
  const cJSON *item = cJSON_GetObjectItemCaseSensitive (obj, field);

  if (item == NULL || cJSON_IsNull (item))
    {
      if (!required)
        return TRUE;
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” is missing"), where, field);
      return FALSE;
    }
  if (!cJSON_IsString (item))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” must be a string"), where, field);
      return FALSE;
    }
  *out = item->valuestring;
  return TRUE;
}

gboolean
cw_json_get_bool (const cJSON *obj, const char *field, gboolean required, gboolean *out,
                  const char *where, GError **error)
{
  const cJSON *item = cJSON_GetObjectItemCaseSensitive (obj, field);

  if (item == NULL)
    {
      if (!required)
        return TRUE;
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” is missing"), where, field);
      return FALSE;
    }
  if (!cJSON_IsBool (item))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("%s: field “%s” must be true or false"), where, field);
      return FALSE;
    }
  *out = cJSON_IsTrue (item);
  return TRUE;
}
