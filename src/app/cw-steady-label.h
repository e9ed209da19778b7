#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_STEADY_LABEL (cw_steady_label_get_type ())

G_DECLARE_FINAL_TYPE (CwSteadyLabel, cw_steady_label, CW, STEADY_LABEL, GtkWidget)

/* A short text for results that change with every edit; when the width is short it is
 * wrapped ("wrap") or ends in "…" ("ellipsize"). It asks for a new size only when its
 * text no longer fits the size it has: the widths it asks for are rounded up to steps of
 * four average characters and never shrink, so a result that changes digit by digit is
 * only redrawn, where a GtkLabel makes GTK lay out the whole window again. With "copyable" set it takes the focus, and
 * Ctrl+C or its context menu copy the text. Styled as a label ("label" in CSS). */
GtkWidget *cw_steady_label_new (void);
/* Returns TRUE when the label asked for a new size, FALSE when it is only redrawn (or the
 * text is the same). */
gboolean    cw_steady_label_set_text (CwSteadyLabel *self,
                                      const char    *text);
const char *cw_steady_label_get_text (CwSteadyLabel *self);
/* Bold text (returns TRUE when that asked for a new size). */
gboolean cw_steady_label_set_bold (CwSteadyLabel *self,
                                   gboolean       bold);
gboolean cw_steady_label_get_bold (CwSteadyLabel *self);

G_END_DECLS
