#include "config.h"

#include "cw-app-data.h"

#include <gio/gio.h>

#define DATA_PATH "/org/chairwise/Chairwise/data/"

static CwData *
load_from_resources (GError **error)
{
  g_autoptr (GBytes) gb = NULL;
  g_autoptr (GBytes) ib = NULL;
  g_autoptr (CwGroupTable) groups = NULL;
  g_autoptr (CwInteractionTable) inter = NULL;
  gsize len;
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
  const char *dir;

  if (data != NULL)
    return data;
  dir = g_getenv ("CHAIRWISE_DATADIR");
  if (dir != NULL && *dir != '\0')
    data = cw_data_new_from_dir (dir, error);
  else
    data = load_from_resources (error);
  return data;
}
