#include "config.h"

#include <glib/gi18n.h>

#include "cw-smiles.h"
#include "cw-window-private.h"

static void
show_note (CwWindow   *self,
           const char *text,
           gboolean    is_error)
{
  gboolean any = text != NULL && *text != '\0';

  gtk_label_set_text (self->smiles_note_label, any ? text : "");
  gtk_widget_set_visible (GTK_WIDGET (self->smiles_note_label), any);
  if (is_error)
    gtk_widget_add_css_class (GTK_WIDGET (self->smiles_note_label), "cw-error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->smiles_note_label), "cw-error");
}

/* Keeps the entry showing the current molecule, unless the user is typing in it. */
void
cw_window_update_smiles (CwWindow *self)
{
  g_autofree char *smiles = NULL;

  if (gtk_widget_has_focus (GTK_WIDGET (self->smiles_entry)) ||
      gtk_widget_is_focus (GTK_WIDGET (self->smiles_entry)) ||
      gtk_widget_get_focus_child (GTK_WIDGET (self->smiles_entry)) != NULL)
    return;
  smiles = cw_smiles_write (cw_document_peek_molecule (self->doc));
  if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->smiles_entry)), smiles) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->smiles_entry), smiles);
}

gboolean
cw_window_set_smiles (CwWindow   *self,
                      const char *smiles,
                      GError    **error)
{
  g_autoptr (GString) notes = g_string_new (NULL);
  g_autoptr (GPtrArray) mols = NULL;
  g_autoptr (CwMolecule) mol = NULL;
  const CwMolecule *old = cw_document_peek_molecule (self->doc);

  mols = cw_smiles_read (smiles, self->data->groups, notes, error);
  if (mols == NULL)
    return FALSE;
  if (mols->len == 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE, _("“%s” describes no cyclohexane"), smiles);
      return FALSE;
    }
  mol = cw_molecule_copy (g_ptr_array_index (mols, 0));
  /* Custom groups are not part of SMILES; keep them, so an undo-free switch back is possible. */
  for (guint i = 0; old->custom_groups && i < old->custom_groups->len; i++)
    cw_molecule_add_custom_group (mol, cw_group_copy (g_ptr_array_index (old->custom_groups, i)));
  if (mols->len > 1 && notes->len > 0)
    g_string_append_c (notes, ' ');
  if (mols->len > 1)
    /* TRANSLATORS: the SMILES left ring stereocentres open */
    g_string_append_printf (notes, g_dngettext (GETTEXT_PACKAGE, "%u isomer fits; the first is shown.", "%u isomers fit; the first is shown (see Isomers).", mols->len),
                            mols->len);
  cw_window_begin_edit (self, NULL);
  cw_document_set_molecule (self->doc, mol);
  self->n_custom_shown = G_MAXUINT;
  cw_window_end_edit (self);
  show_note (self, notes->str, FALSE);
  return TRUE;
}

static void
smiles_activate_cb (CwWindow *self)
{
  g_autoptr (GError) error = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->smiles_entry));

  if (!cw_window_set_smiles (self, text, &error))
    {
      show_note (self, error->message, TRUE);
      return;
    }
  gtk_widget_grab_focus (GTK_WIDGET (self->ring_canvas));
  cw_window_update_smiles (self);
}

static void
paste_done_cb (GObject      *source,
               GAsyncResult *result,
               gpointer      user_data)
{
  g_autoptr (CwWindow) self = user_data;
  g_autoptr (GError) error = NULL;
  g_autofree char *text = gdk_clipboard_read_text_finish (GDK_CLIPBOARD (source), result, &error);

  if (text == NULL)
    {
      show_note (self, error ? error->message : _("The clipboard holds no text"), TRUE);
      return;
    }
  g_strstrip (text);
  gtk_editable_set_text (GTK_EDITABLE (self->smiles_entry), text);
  if (!cw_window_set_smiles (self, text, &error))
    show_note (self, error->message, TRUE);
  else
    cw_window_update_smiles (self);
}

static void
smiles_icon_release_cb (CwWindow *self)
{
  gtk_widget_activate_action (GTK_WIDGET (self), "win.paste-smiles", NULL);
}

static void
paste_smiles_action (GtkWidget  *widget,
                     const char *action_name,
                     GVariant   *param)
{
  gdk_clipboard_read_text_async (gtk_widget_get_clipboard (widget), NULL, paste_done_cb, g_object_ref (widget));
}

static void
copy_smiles_action (GtkWidget  *widget,
                    const char *action_name,
                    GVariant   *param)
{
  CwWindow        *self = CW_WINDOW (widget);
  g_autofree char *smiles = cw_smiles_write (cw_document_peek_molecule (self->doc));

  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), smiles);
}

static void
set_smiles_action (GtkWidget  *widget,
                   const char *action_name,
                   GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr (GError) error = NULL;

  if (!cw_window_set_smiles (self, g_variant_get_string (param, NULL), &error))
    show_note (self, error->message, TRUE);
  else
    cw_window_update_smiles (self);
}

void
cw_window_class_add_smiles_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.copy-smiles", NULL, copy_smiles_action);
  gtk_widget_class_install_action (widget_class, "win.paste-smiles", NULL, paste_smiles_action);
  gtk_widget_class_install_action (widget_class, "win.set-smiles", "s", set_smiles_action);
  gtk_widget_class_bind_template_callback (widget_class, smiles_activate_cb);
  gtk_widget_class_bind_template_callback (widget_class, smiles_icon_release_cb);
}
