#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_APPLICATION (cw_application_get_type ())

G_DECLARE_FINAL_TYPE (CwApplication, cw_application, CW, APPLICATION, GtkApplication)

CwApplication *cw_application_new (void);
/* Non-zero after a --screenshot run that could not open its document or write the PNG. */
int cw_application_get_status (CwApplication *self);

G_END_DECLS
