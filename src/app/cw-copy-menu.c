#include "config.h"

#include "cw-copy-menu.h"

#include <glib/gi18n.h>

void
cw_copy_menu_install (GtkWidgetClass             *widget_class,
                      const char                 *prefix,
                      GtkWidgetActionActivateFunc copy,
                      GtkWidgetActionActivateFunc menu)
{
  g_autofree char *copy_name = g_strconcat (prefix, ".copy", NULL);
  g_autofree char *menu_name = g_strconcat (prefix, ".menu", NULL);

  gtk_widget_class_install_action (widget_class, copy_name, NULL, copy);
  gtk_widget_class_install_action (widget_class, menu_name, "(dd)", menu);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_c, GDK_CONTROL_MASK, copy_name, NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_F10, GDK_SHIFT_MASK, menu_name, "(dd)", -1.0, -1.0);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Menu, 0, menu_name, "(dd)", -1.0, -1.0);
}

void
cw_copy_menu_popup (GtkWidget             **menu,
                    GtkWidget              *widget,
                    const char             *action,
                    const graphene_point_t *at)
{
  if (*menu == NULL)
    {
      g_autoptr (GMenu) model = g_menu_new ();

      g_menu_append (model, _("_Copy"), action);
      *menu = gtk_popover_menu_new_from_model (G_MENU_MODEL (model));
      gtk_widget_set_parent (*menu, widget);
      gtk_popover_set_has_arrow (GTK_POPOVER (*menu), FALSE);
    }
  if (at != NULL)
    gtk_popover_set_pointing_to (GTK_POPOVER (*menu), &(GdkRectangle){ (int) at->x, (int) at->y, 1, 1 });
  else
    gtk_popover_set_pointing_to (GTK_POPOVER (*menu), NULL);
  gtk_popover_popup (GTK_POPOVER (*menu));
}

static void
pressed_cb (GtkGestureClick *gesture,
            int              n_press,
            double           x,
            double           y,
            const char      *menu_action)
{
  GtkWidget *widget = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (gesture));

  gtk_widget_grab_focus (widget);
  gtk_widget_activate_action (widget, menu_action, "(dd)", x, y);
  gtk_gesture_set_state (GTK_GESTURE (gesture), GTK_EVENT_SEQUENCE_CLAIMED);
}

void
cw_copy_menu_add_click (GtkWidget  *widget,
                        const char *menu_action)
{
  GtkGesture *click = gtk_gesture_click_new ();

  gtk_gesture_single_set_button (GTK_GESTURE_SINGLE (click), GDK_BUTTON_SECONDARY);
  g_signal_connect (click, "pressed", G_CALLBACK (pressed_cb), (gpointer) g_intern_string (menu_action));
  gtk_widget_add_controller (widget, GTK_EVENT_CONTROLLER (click));
}

const graphene_point_t *
cw_copy_menu_point (GVariant         *parameter,
                    graphene_point_t *point)
{
  double x = -1.0, y = -1.0;

  if (parameter != NULL)
    g_variant_get (parameter, "(dd)", &x, &y);
  if (x < 0.0 || y < 0.0)
    return NULL;
  *point = GRAPHENE_POINT_INIT (x, y);
  return point;
}
