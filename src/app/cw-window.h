#pragma once

#include <gtk/gtk.h>

#include "cw-core.h"

G_BEGIN_DECLS

#define CW_TYPE_WINDOW (cw_window_get_type ())

G_DECLARE_FINAL_TYPE (CwWindow, cw_window, CW, WINDOW, GtkApplicationWindow)

/* One document per window: ring editor, both chairs, terms, result, flags and the
 * profile / temperature pages, all recomputed after every edit. */
CwWindow *cw_window_new (GtkApplication *app);
gboolean  cw_window_open_file (CwWindow *self,
                               GFile    *file,
                               GError  **error);
/* Takes doc. file may be NULL (untitled). */
void              cw_window_set_document (CwWindow   *self,
                                          CwDocument *doc,
                                          GFile      *file,
                                          gboolean    modified);
gboolean          cw_window_restore_autosave (CwWindow   *self,
                                              const char *autosave_path,
                                              GError    **error);
const CwDocument *cw_window_get_document (CwWindow *self);
/* NULL when the current document could not be analysed. */
const CwAnalysis *cw_window_get_analysis (CwWindow *self);
GFile            *cw_window_get_file (CwWindow *self);
gboolean          cw_window_get_modified (CwWindow *self);
/* Untitled, unmodified and empty: a fresh window an Open may reuse. */
gboolean cw_window_is_pristine (CwWindow *self);
/* Renders the whole window, as on screen, to a PNG file. */
gboolean cw_window_save_screenshot (CwWindow   *self,
                                    const char *path,
                                    GError    **error);

G_END_DECLS
