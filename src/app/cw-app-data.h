#pragma once

#include <gio/gio.h>

#include "cw-core.h"
#include "cw-geometry-data.h"

G_BEGIN_DECLS

/* The group and interaction tables, loaded once per process: from CHAIRWISE_DATADIR
 * when set, otherwise from the copy compiled into the program's resources. */
const CwData *cw_app_get_data (GError **error);
/* The 3D, coupling and reactivity table (geometry.json), loaded the same way, on first use. */
const CwGeometryData *cw_app_get_geometry (GError **error);

/* The app's settings. Uses the installed schema, or the one compiled in the build tree
 * when the program runs uninstalled; never aborts for a missing schema (falls back to
 * settings kept in memory). */
GSettings *cw_app_settings_new (void);

/* Keeps large freed blocks in the process's heap (glibc), where the next frame finds them
 * already paged in; see cw-app-data.c. Called once, at start, before any window. */
void cw_app_tune_memory (void);

G_END_DECLS
