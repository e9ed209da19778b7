#pragma once

#include <gio/gio.h>

#include "cw-core.h"

G_BEGIN_DECLS

/* Unsaved work is written every few seconds to the user's state directory
 * ($XDG_STATE_HOME/chairwise/autosave), one file per window, and removed when the
 * window closes cleanly. Files left behind at start-up come from a crash. */
char *cw_autosave_dir (void);
char *cw_autosave_new_path (void);
/* Writes the document plus, in a sidecar key file, the path it was opened from. */
gboolean cw_autosave_write (const char       *path,
                            const CwDocument *doc,
                            const char       *origin,
                            GError          **error);
void     cw_autosave_remove (const char *path);
/* Autosave files present now, oldest first (owned strings). */
GPtrArray *cw_autosave_list (void);
/* The origin recorded beside an autosave file, or NULL. */
char *cw_autosave_dup_origin (const char *path);

G_END_DECLS
