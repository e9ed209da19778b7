#include "config.h"

#include "cw-render.h"

/* The geometry table (data/geometry.json) for the drawings and the report when the caller has
 * none of its own: loaded on first use and kept for the life of the process, as the tables are
 * read-only. A failed load is retried on the next call, so each caller gets its own error. */

static GMutex          geometry_lock;
static CwGeometryData *geometry;

const CwGeometryData *
cw_render_default_geometry (GError **error)
{
  CwGeometryData *gd;

  g_mutex_lock (&geometry_lock);
  if (geometry == NULL)
    geometry = cw_geometry_data_new_from_dir (NULL, error);
  gd = geometry;
  g_mutex_unlock (&geometry_lock);
  return gd;
}
