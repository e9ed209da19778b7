#pragma once

#include <gtk/gtk.h>

#include "cw-core.h"

G_BEGIN_DECLS

#define CW_TYPE_CUSTOM_GROUP_DIALOG (cw_custom_group_dialog_get_type ())

G_DECLARE_FINAL_TYPE (CwCustomGroupDialog, cw_custom_group_dialog, CW, CUSTOM_GROUP_DIALOG, GtkWindow)

/* Asks for a name, an A-value ± uncertainty (in the window's energy unit), a source and
 * a face. Emits "defined" (name, a_kcal, sigma_kcal, source, face) → gboolean; the
 * dialog closes when a handler returns TRUE and stays open (showing the error) otherwise. */
CwCustomGroupDialog *cw_custom_group_dialog_new (GtkWindow   *parent,
                                                 CwEnergyUnit unit,
                                                 int          position);
void                 cw_custom_group_dialog_show_error (CwCustomGroupDialog *self,
                                                        const char          *message);

G_END_DECLS
