#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* The context menu of a drawn text widget: one item that copies its text. A right click
 * (cw_copy_menu_add_click) or a key bound to the widget's menu action opens it. */

/* Installs PREFIX.copy (Ctrl+C) and PREFIX.menu (Shift+F10, Menu; parameter "(dd)", the
 * position to point at, or (-1, -1)) on a widget class. */
void cw_copy_menu_install (GtkWidgetClass             *widget_class,
                           const char                 *prefix,
                           GtkWidgetActionActivateFunc copy,
                           GtkWidgetActionActivateFunc menu);
/* Opens the menu (made on first use and kept in *menu, which the widget unparents in its
 * dispose) with one item, "Copy" → action; at is where it points, NULL for the whole
 * widget. */
void cw_copy_menu_popup (GtkWidget             **menu,
                         GtkWidget              *widget,
                         const char             *action,
                         const graphene_point_t *at);
/* A right click on the widget takes the focus and activates menu_action, whose parameter
 * "(dd)" is the pointer position. Keys bound to it pass (-1, -1). */
void cw_copy_menu_add_click (GtkWidget  *widget,
                             const char *menu_action);
/* The position in a menu action's "(dd)" parameter, or NULL for none. */
const graphene_point_t *cw_copy_menu_point (GVariant         *parameter,
                                            graphene_point_t *point);

G_END_DECLS
