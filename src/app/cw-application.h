#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_APPLICATION (cw_application_get_type ())

G_DECLARE_FINAL_TYPE (CwApplication, cw_application, CW, APPLICATION, GtkApplication)

CwApplication *cw_application_new (void);
/* Non-zero after a --screenshot run that could not open its document or write the PNG. */
int cw_application_get_status (CwApplication *self);
/* Follows the desktop's org.gnome.desktop.interface color-scheme value ("prefer-dark",
 * "default", …): dark style for "prefer-dark" only. */
void cw_application_apply_color_scheme (const char *scheme);

G_END_DECLS
