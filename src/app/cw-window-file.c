#include "config.h"

#include <glib/gi18n.h>

#include "cw-autosave.h"
#include "cw-window-private.h"

#define MAX_RECENT 8
#define AUTOSAVE_SECONDS 3

/* ---- recent documents ------------------------------------------------------------- */

static void
remember_recent (CwWindow *self,
                 GFile    *file)
{
  g_autofree char *path = g_file_get_path (file);
  g_auto (GStrv) old = g_settings_get_strv (self->settings, "recent-files");
  g_autoptr (GStrvBuilder) b = g_strv_builder_new ();
  g_auto (GStrv) list = NULL;
  guint n = 1;

  if (path == NULL)
    return;
  g_strv_builder_add (b, path);
  for (guint i = 0; old[i] != NULL && n < MAX_RECENT; i++)
    if (g_strcmp0 (old[i], path) != 0)
      {
        g_strv_builder_add (b, old[i]);
        n++;
      }
  list = g_strv_builder_end (b);
  g_settings_set_strv (self->settings, "recent-files", (const char *const *) list);
}

void
cw_window_update_recent_menu (CwWindow *self)
{
  g_auto (GStrv) list = g_settings_get_strv (self->settings, "recent-files");

  g_menu_remove_all (self->recent_section);
  for (guint i = 0; list[i] != NULL; i++)
    {
      g_autofree char *base = g_path_get_basename (list[i]);
      g_autoptr (GMenuItem) item = g_menu_item_new (base, NULL);

      g_menu_item_set_action_and_target_value (item, "win.open-file", g_variant_new_string (list[i]));
      g_menu_append_item (self->recent_section, item);
    }
  if (list[0] == NULL)
    {
      g_autoptr (GMenuItem) item = g_menu_item_new (_("No recent documents"), "win.none");

      g_menu_append_item (self->recent_section, item);
    }
}

/* ---- autosave --------------------------------------------------------------------- */

static gboolean
autosave_cb (gpointer user_data)
{
  CwWindow *self = CW_WINDOW (user_data);
  g_autoptr (GError) error = NULL;
  g_autofree char *origin = NULL;

  self->autosave_id = 0;
  if (!cw_window_get_modified (self))
    {
      cw_window_drop_autosave (self);
      return G_SOURCE_REMOVE;
    }
  if (self->autosave_path == NULL)
    self->autosave_path = cw_autosave_new_path ();
  origin = self->file ? g_file_get_path (self->file) : NULL;
  if (!cw_autosave_write (self->autosave_path, self->doc, origin, &error))
    g_message ("Autosave to %s failed: %s", self->autosave_path, error->message);
  return G_SOURCE_REMOVE;
}

void
cw_window_schedule_autosave (CwWindow *self)
{
  if (self->autosave_id == 0)
    self->autosave_id = g_timeout_add_seconds (AUTOSAVE_SECONDS, autosave_cb, self);
}

void
cw_window_drop_autosave (CwWindow *self)
{
  if (self->autosave_path == NULL)
    return;
  cw_autosave_remove (self->autosave_path);
  g_clear_pointer (&self->autosave_path, g_free);
}

gboolean
cw_window_restore_autosave (CwWindow   *self,
                            const char *autosave_path,
                            GError    **error)
{
  g_autofree char *origin = cw_autosave_dup_origin (autosave_path);
  g_autoptr (GFile) file = origin ? g_file_new_for_path (origin) : NULL;
  CwDocument *doc = cw_document_new_from_file (autosave_path, self->data->groups, error);

  if (doc == NULL)
    return FALSE;
  cw_window_set_document (self, doc, file, TRUE);
  /* This window now owns the work: its own autosave replaces the old file. */
  cw_autosave_remove (autosave_path);
  autosave_cb (self);
  return TRUE;
}

/* ---- open and save ------------------------------------------------------------------ */

gboolean
cw_window_open_file (CwWindow *self,
                     GFile    *file,
                     GError  **error)
{
  g_autofree char *path = g_file_get_path (file);
  CwDocument      *doc;

  if (path == NULL)
    {
      g_autofree char *uri = g_file_get_uri (file);

      g_set_error (error, G_IO_ERROR, G_IO_ERROR_NOT_SUPPORTED, _("%s: only local files can be opened"), uri);
      return FALSE;
    }
  doc = cw_document_new_from_file (path, self->data->groups, error);
  if (doc == NULL)
    return FALSE;
  cw_window_set_document (self, doc, file, FALSE);
  remember_recent (self, file);
  return TRUE;
}

gboolean
cw_window_save_to (CwWindow *self,
                   GFile    *file,
                   GError  **error)
{
  g_autofree char *path = g_file_get_path (file);

  if (path == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_NOT_SUPPORTED, _("Only local files can be written"));
      return FALSE;
    }
  if (!cw_document_save (self->doc, path, TRUE, error))
    return FALSE;
  g_set_object (&self->file, file);
  self->saved_serial = self->serial;
  cw_window_drop_autosave (self);
  remember_recent (self, file);
  cw_window_update_title (self);
  if (self->close_after_save)
    {
      self->close_confirmed = TRUE;
      gtk_window_close (GTK_WINDOW (self));
    }
  return TRUE;
}

/* Opens in this window when it holds nothing worth keeping, else in a new one. */
static void
open_in_some_window (CwWindow *self,
                     GFile    *file)
{
  GtkApplication *app = gtk_window_get_application (GTK_WINDOW (self));
  CwWindow       *target = self;
  g_autoptr (GError) error = NULL;

  if (!cw_window_is_pristine (self) && app != NULL)
    target = cw_window_new (app);
  if (!cw_window_open_file (target, file, &error))
    {
      g_autofree char *name = g_file_get_parse_name (file);
      g_autofree char *primary = g_strdup_printf (_("Could not open “%s”"), name);

      cw_window_show_error (self, primary, error);
      if (target != self)
        gtk_window_destroy (GTK_WINDOW (target));
      return;
    }
  gtk_window_present (GTK_WINDOW (target));
}

static GtkFileFilter *
json_filter (void)
{
  GtkFileFilter *filter = gtk_file_filter_new ();

  gtk_file_filter_set_name (filter, _("Chairwise documents (JSON)"));
  gtk_file_filter_add_pattern (filter, "*.json");
  gtk_file_filter_add_mime_type (filter, "application/json");
  return filter;
}

static void
open_response_cb (GtkNativeDialog *native,
                  int              response,
                  CwWindow        *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (native));

      open_in_some_window (self, file);
    }
  g_object_unref (native);
}

static void
open_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *param)
{
  GtkFileChooserNative *native = gtk_file_chooser_native_new (_("Open Document"), GTK_WINDOW (widget),
                                                                 GTK_FILE_CHOOSER_ACTION_OPEN, _("_Open"), _("_Cancel"));
  g_autoptr (GtkFileFilter) filter = json_filter ();

  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (native), filter);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (native), TRUE);
  g_signal_connect (native, "response", G_CALLBACK (open_response_cb), widget);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (native));
}

static void
open_file_action (GtkWidget  *widget,
                  const char *action_name,
                  GVariant   *param)
{
  g_autoptr (GFile) file = g_file_new_for_path (g_variant_get_string (param, NULL));

  open_in_some_window (CW_WINDOW (widget), file);
}

static void
new_action (GtkWidget  *widget,
            const char *action_name,
            GVariant   *param)
{
  GtkApplication *app = gtk_window_get_application (GTK_WINDOW (widget));

  if (app != NULL)
    gtk_window_present (GTK_WINDOW (cw_window_new (app)));
}

static void
save_or_report (CwWindow *self,
                GFile    *file)
{
  g_autoptr (GError) error = NULL;

  if (!cw_window_save_to (self, file, &error))
    {
      self->close_after_save = FALSE;
      cw_window_show_error (self, _("The document was not saved"), error);
    }
}

static void
save_as_response_cb (GtkNativeDialog *native,
                     int              response,
                     CwWindow        *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (native));

      save_or_report (self, file);
    }
  else
    self->close_after_save = FALSE;
  g_object_unref (native);
}

static void
save_as (CwWindow *self)
{
  GtkFileChooserNative *native = gtk_file_chooser_native_new (_("Save Document"), GTK_WINDOW (self),
                                                                 GTK_FILE_CHOOSER_ACTION_SAVE, _("_Save"), _("_Cancel"));
  g_autoptr (GtkFileFilter) filter = json_filter ();
  const char      *title = cw_document_get_title (self->doc);
  g_autofree char *name = g_strconcat (title && *title ? title : _("Untitled"), ".json", NULL);

  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (native), filter);
  if (self->file != NULL)
    gtk_file_chooser_set_file (GTK_FILE_CHOOSER (native), self->file, NULL);
  else
    gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (native), name);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (native), TRUE);
  g_signal_connect (native, "response", G_CALLBACK (save_as_response_cb), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (native));
}

static void
save_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  if (self->file != NULL)
    save_or_report (self, self->file);
  else
    save_as (self);
}

static void
save_as_action (GtkWidget  *widget,
                const char *action_name,
                GVariant   *param)
{
  save_as (CW_WINDOW (widget));
}

static void
save_to_action (GtkWidget  *widget,
                const char *action_name,
                GVariant   *param)
{
  g_autoptr (GFile) file = g_file_new_for_path (g_variant_get_string (param, NULL));

  save_or_report (CW_WINDOW (widget), file);
}

/* ---- closing with unsaved changes ----------------------------------------------------- */

typedef struct
{
  CwWindow *self;
  int       response;
} CloseAnswer;

/* Runs after the dialog has gone: closing the window inside the dialog's own
 * response emission would finalize the parent before the dialog lets go of it. */
static gboolean
apply_close_answer_cb (gpointer data)
{
  CloseAnswer *answer = data;
  CwWindow    *self = answer->self;

  switch (answer->response)
    {
    case GTK_RESPONSE_REJECT: /* discard */
      self->close_confirmed = TRUE;
      cw_window_drop_autosave (self);
      gtk_window_close (GTK_WINDOW (self));
      break;
    case GTK_RESPONSE_ACCEPT: /* save, then close */
      self->close_after_save = TRUE;
      gtk_widget_activate_action (GTK_WIDGET (self), "win.save", NULL);
      break;
    default:
      break;
    }
  g_object_unref (self);
  g_free (answer);
  return G_SOURCE_REMOVE;
}

static void
unsaved_response_cb (GtkDialog *dialog,
                     int        response,
                     CwWindow  *self)
{
  CloseAnswer *answer = g_new0 (CloseAnswer, 1);

  self->pending_dialog = NULL;
  gtk_window_destroy (GTK_WINDOW (dialog));
  answer->self = g_object_ref (self);
  answer->response = response;
  g_idle_add (apply_close_answer_cb, answer);
}

/* Returns TRUE when the close must wait for the user's answer. */
gboolean
cw_window_close_request (CwWindow *self)
{
  GtkWidget       *dialog;
  const char      *title;
  g_autofree char *primary = NULL;

  if (self->close_confirmed || !cw_window_get_modified (self))
    {
      cw_window_drop_autosave (self);
      return FALSE;
    }
  if (self->pending_dialog != NULL)
    {
      gtk_window_present (GTK_WINDOW (self->pending_dialog));
      return TRUE;
    }
  title = gtk_label_get_text (self->title_label);
  if (g_str_has_prefix (title, "• "))
    title += strlen ("• ");
  primary = g_strdup_printf (_("Save changes to “%s” before closing?"), title);
  dialog = gtk_message_dialog_new (GTK_WINDOW (self), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE, "%s", primary);
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s",
                                            _("If you close without saving, your changes are lost."));
  gtk_dialog_add_buttons (GTK_DIALOG (dialog), _("_Cancel"), GTK_RESPONSE_CANCEL, _("_Discard"), GTK_RESPONSE_REJECT, _("_Save"), GTK_RESPONSE_ACCEPT, NULL);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  g_signal_connect_object (dialog, "response", G_CALLBACK (unsaved_response_cb), self, 0);
  self->pending_dialog = dialog;
  gtk_window_present (GTK_WINDOW (dialog));
  return TRUE;
}

/* ---- drag and drop -------------------------------------------------------------------- */

static gboolean
drop_cb (GtkDropTarget *target,
         const GValue  *value,
         double         x,
         double         y,
         CwWindow      *self)
{
  GSList  *files;
  gboolean any;

  if (!G_VALUE_HOLDS (value, GDK_TYPE_FILE_LIST))
    return FALSE;
  files = gdk_file_list_get_files (g_value_get_boxed (value));
  any = files != NULL;
  for (GSList *l = files; l != NULL; l = l->next)
    open_in_some_window (self, G_FILE (l->data));
  g_slist_free (files);
  return any;
}

void
cw_window_file_init (CwWindow *self)
{
  GtkDropTarget *drop = gtk_drop_target_new (GDK_TYPE_FILE_LIST, GDK_ACTION_COPY);

  g_signal_connect (drop, "drop", G_CALLBACK (drop_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (drop));
  cw_window_update_recent_menu (self);
}

void
cw_window_class_add_file_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.new", NULL, new_action);
  gtk_widget_class_install_action (widget_class, "win.open", NULL, open_action);
  gtk_widget_class_install_action (widget_class, "win.open-file", "s", open_file_action);
  gtk_widget_class_install_action (widget_class, "win.save", NULL, save_action);
  gtk_widget_class_install_action (widget_class, "win.save-as", NULL, save_as_action);
  gtk_widget_class_install_action (widget_class, "win.save-to", "s", save_to_action);
}
