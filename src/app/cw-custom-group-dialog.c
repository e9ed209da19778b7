#include "config.h"

#include "cw-custom-group-dialog.h"

#include <glib/gi18n.h>

struct _CwCustomGroupDialog
{
  GtkWindow parent_instance;

  /* template children */
  GtkButton     *add_button;
  GtkEntry      *name_entry;
  GtkSpinButton *a_spin;
  GtkSpinButton *sigma_spin;
  GtkLabel      *a_unit_label;
  GtkLabel      *sigma_unit_label;
  GtkEntry      *source_entry;
  GtkDropDown   *face_dropdown;
  GtkLabel      *position_label;
  GtkLabel      *error_label;

  CwEnergyUnit unit;
};

G_DEFINE_FINAL_TYPE (CwCustomGroupDialog, cw_custom_group_dialog, GTK_TYPE_WINDOW)

enum
{
  DEFINED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

static void
cancel_clicked_cb (CwCustomGroupDialog *self)
{
  gtk_window_destroy (GTK_WINDOW (self));
}

static void
add_clicked_cb (CwCustomGroupDialog *self)
{
  const char *name = gtk_editable_get_text (GTK_EDITABLE (self->name_entry));
  const char *source = gtk_editable_get_text (GTK_EDITABLE (self->source_entry));
  double      a, sigma;
  int         face = gtk_drop_down_get_selected (self->face_dropdown) == 1 ? CW_FACE_DOWN : CW_FACE_UP;
  gboolean    done = FALSE;

  gtk_spin_button_update (self->a_spin);
  gtk_spin_button_update (self->sigma_spin);
  a = cw_energy_to_kcal (gtk_spin_button_get_value (self->a_spin), self->unit);
  sigma = cw_energy_to_kcal (gtk_spin_button_get_value (self->sigma_spin), self->unit);
  g_signal_emit (self, signals[DEFINED], 0, name, a, sigma, source, face, &done);
  if (done)
    gtk_window_destroy (GTK_WINDOW (self));
}

static void
cw_custom_group_dialog_dispose (GObject *object)
{
  gtk_widget_dispose_template (GTK_WIDGET (object), CW_TYPE_CUSTOM_GROUP_DIALOG);

  G_OBJECT_CLASS (cw_custom_group_dialog_parent_class)->dispose (object);
}

static void
cw_custom_group_dialog_class_init (CwCustomGroupDialogClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_custom_group_dialog_dispose;

  signals[DEFINED] =
    g_signal_new ("defined", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, g_signal_accumulator_true_handled,
                  NULL, NULL, G_TYPE_BOOLEAN, 5, G_TYPE_STRING, G_TYPE_DOUBLE, G_TYPE_DOUBLE, G_TYPE_STRING,
                  G_TYPE_INT);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/chairwise/Chairwise/ui/cw-custom-group-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, add_button);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, name_entry);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, a_spin);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, sigma_spin);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, a_unit_label);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, sigma_unit_label);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, source_entry);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, face_dropdown);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, position_label);
  gtk_widget_class_bind_template_child (widget_class, CwCustomGroupDialog, error_label);
  gtk_widget_class_bind_template_callback (widget_class, cancel_clicked_cb);
  gtk_widget_class_bind_template_callback (widget_class, add_clicked_cb);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
cw_custom_group_dialog_init (CwCustomGroupDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

CwCustomGroupDialog *
cw_custom_group_dialog_new (GtkWindow   *parent,
                            CwEnergyUnit unit,
                            int          position)
{
  CwCustomGroupDialog *self = g_object_new (CW_TYPE_CUSTOM_GROUP_DIALOG, "transient-for", parent,
                                            "destroy-with-parent", TRUE, NULL);
  g_autofree char     *where = NULL;

  self->unit = unit;
  gtk_label_set_text (self->a_unit_label, cw_energy_unit_symbol (unit));
  gtk_label_set_text (self->sigma_unit_label, cw_energy_unit_symbol (unit));
  /* TRANSLATORS: where the new group goes; %d is the ring carbon */
  where = g_strdup_printf (_("The group is placed on carbon %d and saved with the document."), position);
  gtk_label_set_text (self->position_label, where);
  return self;
}

void
cw_custom_group_dialog_show_error (CwCustomGroupDialog *self,
                                   const char          *message)
{
  g_return_if_fail (CW_IS_CUSTOM_GROUP_DIALOG (self));

  gtk_label_set_text (self->error_label, message);
  gtk_widget_set_visible (GTK_WIDGET (self->error_label), TRUE);
}
