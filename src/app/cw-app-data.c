#include "config.h"

#include <stdlib.h> /* defines __GLIBC__ with glibc */
#ifdef __GLIBC__
#include <malloc.h>
#endif

#include "cw-app-data.h"

#define G_SETTINGS_ENABLE_BACKEND
#include <gio/gio.h>
#include <gio/gsettingsbackend.h>

#define DATA_PATH "/org/chairwise/Chairwise/data/"

static CwData *
load_from_resources (GError **error)
{
  g_autoptr (GBytes) gb = NULL;
  g_autoptr (GBytes) ib = NULL;
  g_autoptr (CwGroupTable) groups = NULL;
  g_autoptr (CwInteractionTable) inter = NULL;
  gsize       len;
  const char *p;

  gb = g_resources_lookup_data (DATA_PATH "groups.json", G_RESOURCE_LOOKUP_FLAGS_NONE, error);
  if (gb == NULL)
    return NULL;
  ib = g_resources_lookup_data (DATA_PATH "interactions.json", G_RESOURCE_LOOKUP_FLAGS_NONE, error);
  if (ib == NULL)
    return NULL;
  p = g_bytes_get_data (gb, &len);
  groups = cw_group_table_new_from_data (p, len, "groups.json", error);
  if (groups == NULL)
    return NULL;
  p = g_bytes_get_data (ib, &len);
  inter = cw_interaction_table_new_from_data (p, len, "interactions.json", error);
  if (inter == NULL)
    return NULL;
  return cw_data_new (g_steal_pointer (&groups), g_steal_pointer (&inter));
}

const CwData *
cw_app_get_data (GError **error)
{
  static CwData *data;
  const char    *dir;

  if (data != NULL)
    return data;
  dir = g_getenv ("CHAIRWISE_DATADIR");
  if (dir != NULL && *dir != '\0')
    {
      g_autoptr (GError) local = NULL;

      data = cw_data_new_from_dir (dir, &local);
      if (data != NULL)
        return data;
      /* Bad tables in CHAIRWISE_DATADIR must not stop the program: say so, use the built-in ones. */
      g_printerr ("chairwise: CHAIRWISE_DATADIR=%s: %s; using the built-in tables\n", dir, local->message);
    }
  data = load_from_resources (error);
  return data;
}

const CwGeometryData *
cw_app_get_geometry (GError **error)
{
  static CwGeometryData *gd;
  const char            *dir;

  if (gd != NULL)
    return gd;
  dir = g_getenv ("CHAIRWISE_DATADIR");
  if (dir != NULL && *dir != '\0')
    gd = cw_geometry_data_new_from_dir (dir, error);
  else
    {
      g_autoptr (GBytes) bytes = g_resources_lookup_data (DATA_PATH "geometry.json", G_RESOURCE_LOOKUP_FLAGS_NONE, error);
      gsize       len;
      const char *p;

      if (bytes == NULL)
        return NULL;
      p = g_bytes_get_data (bytes, &len);
      gd = cw_geometry_data_new_from_data (p, len, "geometry.json", error);
    }
  return gd;
}

GSettings *
cw_app_settings_new (void)
{
  static GSettingsSchema  *schema;
  static GSettingsBackend *backend;
  GSettingsSchemaSource   *source = g_settings_schema_source_get_default ();

  if (schema == NULL && source != NULL)
    schema = g_settings_schema_source_lookup (source, CW_APP_ID, TRUE);
#ifdef CW_BUILD_SCHEMADIR
  if (schema == NULL)
    {
      g_autoptr (GSettingsSchemaSource) build =
        g_settings_schema_source_new_from_directory (CW_BUILD_SCHEMADIR, source, FALSE, NULL);

      if (build != NULL)
        schema = g_settings_schema_source_lookup (build, CW_APP_ID, FALSE);
      /* Uninstalled: keep preferences for this run only, not in the user's dconf. */
      if (schema != NULL && backend == NULL)
        backend = g_memory_settings_backend_new ();
    }
#endif
  if (schema == NULL)
    g_error ("The settings schema %s is missing; install Chairwise or set GSETTINGS_SCHEMA_DIR", CW_APP_ID);
  return g_settings_new_full (schema, backend, NULL);
}

void
cw_app_tune_memory (void)
{
#ifdef __GLIBC__
  /* Each frame GDK paints into a new image of the changed region, up to the whole window
   * (1180 x 780 pixels, 3.7 MB). glibc hands such a block back to the system when it is
   * freed, or when the top of the heap is over its trim threshold, and the next one is
   * then paged in again, a page fault per 4 kB: measured under Xvfb, about 700 faults and
   * 5 ms in such a frame. Blocks up to 16 MB stay in the heap instead. */
  mallopt (M_MMAP_THRESHOLD, 16 << 20);
  mallopt (M_TRIM_THRESHOLD, 16 << 20);
#endif
}
