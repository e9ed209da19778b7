#pragma once

#include <cjson/cJSON.h>
#include <glib.h>

G_BEGIN_DECLS

G_DEFINE_AUTOPTR_CLEANUP_FUNC (cJSON, cJSON_Delete)

/* Helpers for validating table and document JSON; each names the file, the entry and the field. */
gboolean cw_json_get_number (const cJSON *obj, const char *field, gboolean required, double *out,
                             const char *where, GError **error);
gboolean cw_json_get_string (const cJSON *obj, const char *field, gboolean required, const char **out,
                             const char *where, GError **error);
gboolean cw_json_get_bool (const cJSON *obj, const char *field, gboolean required, gboolean *out,
                           const char *where, GError **error);
cJSON   *cw_json_parse (const char *data, gsize len, const char *name, GError **error);
gboolean cw_json_check_format (const cJSON *root, const char *format, int max_version, const char *name,
                               GError **error);

G_END_DECLS
