#include "config.h"

#include "cw-application.h"

#include <glib/gi18n.h>
#include <stdio.h>
#include <time.h>

#include "cw-autosave.h"
#include "cw-window-private.h"

struct _CwApplication
{
  GtkApplication parent_instance;

  GSettings *desktop; /* org.gnome.desktop.interface, when installed */

  char          *screenshot_path; /* --screenshot FILE */
  gboolean       demo;            /* --demo */
  gint64         start_time;
  int            status; /* exit status of a --screenshot run */
  gulong         after_paint_id;
  GdkFrameClock *clock;
};

G_DEFINE_FINAL_TYPE (CwApplication, cw_application, GTK_TYPE_APPLICATION)

static const GOptionEntry option_entries[] = {
  { "screenshot", 0, 0, G_OPTION_ARG_FILENAME, NULL,
    N_("Save a PNG of the window after its first frame, print the result and quit"), N_("FILE") },
    { "demo", 0, 0, G_OPTION_ARG_NONE, NULL, N_("Open the demo document"), NULL },
      { "version", 0, 0, G_OPTION_ARG_NONE, NULL, N_("Show the version and quit"), NULL },
        { NULL } };

/* ---- screenshot mode ---------------------------------------------------------------- */

static long
resident_kib (void)
{
  g_autofree char *status = NULL;
  const char      *p;

  if (!g_file_get_contents ("/proc/self/status", &status, NULL, NULL))
    return -1;
  p = strstr (status, "VmRSS:");
  return p ? strtol (p + 6, NULL, 10) : -1;
}

static double
process_cpu_ms (void)
{
  struct timespec ts;

  if (clock_gettime (CLOCK_PROCESS_CPUTIME_ID, &ts) != 0)
    return -1;
  return ts.tv_sec * 1000.0 + ts.tv_nsec / 1e6;
}

static gboolean
take_screenshot_cb (gpointer user_data)
{
  CwApplication *self = CW_APPLICATION (user_data);
  GtkWindow     *win = gtk_application_get_active_window (GTK_APPLICATION (self));
  g_autoptr (GError) error = NULL;

  if (win == NULL || !cw_window_save_screenshot (CW_WINDOW (win), self->screenshot_path, &error))
    {
      g_printerr ("%s: %s\n", _("No screenshot"), error ? error->message : _("no window"));
      self->status = 1;
      g_application_quit (G_APPLICATION (self));
      return G_SOURCE_REMOVE;
    }
  g_print (_("Screenshot saved to %s\n"), self->screenshot_path);
  g_print ("%s\n%s\n%s\n", cw_steady_label_get_text (CW_WINDOW (win)->summary_label),
           cw_steady_label_get_text (CW_WINDOW (win)->pop1_label), cw_steady_label_get_text (CW_WINDOW (win)->pop2_label));
  g_print ("%s\n", cw_caution_text ());
  /* The window quits without asking: a screenshot never changes the document. */
  CW_WINDOW (win)->close_confirmed = TRUE;
  g_application_quit (G_APPLICATION (self));
  return G_SOURCE_REMOVE;
}

static void
after_paint_cb (GdkFrameClock *clock,
                CwApplication *self)
{
  double ms = (g_get_monotonic_time () - self->start_time) / 1000.0;

  g_signal_handler_disconnect (clock, self->after_paint_id);
  self->after_paint_id = 0;
  /* Machine-readable lines for the start-up benchmark. */
  g_print ("first-frame-ms: %.1f\n", ms);
  g_print ("resident-kib: %ld\n", resident_kib ());
  /* CPU time of the process so far (user + system): steadier than wall time on a busy machine. */
  g_print ("first-frame-cpu-ms: %.1f\n", process_cpu_ms ());
  fflush (stdout);
  g_idle_add_full (G_PRIORITY_LOW, take_screenshot_cb, g_object_ref (self), g_object_unref);
}

static void
window_mapped_cb (GtkWidget     *widget,
                  CwApplication *self)
{
  self->clock = gtk_widget_get_frame_clock (widget);
  self->after_paint_id = g_signal_connect (self->clock, "after-paint", G_CALLBACK (after_paint_cb), self);
}

/* ---- autosave restore --------------------------------------------------------------- */

static void
restore_response_cb (GtkDialog *dialog,
                     int        response,
                     CwWindow  *win)
{
  g_autoptr (GPtrArray) files = g_object_steal_data (G_OBJECT (dialog), "files");
  GtkApplication *app = gtk_window_get_application (GTK_WINDOW (win));

  gtk_window_destroy (GTK_WINDOW (dialog));
  for (guint i = 0; files && i < files->len; i++)
    {
      const char *path = g_ptr_array_index (files, i);
      g_autoptr (GError) error = NULL;
      CwWindow *target = win;

      if (response != GTK_RESPONSE_ACCEPT)
        {
          cw_autosave_remove (path);
          continue;
        }
      if (!cw_window_is_pristine (win))
        target = cw_window_new (app);
      if (!cw_window_restore_autosave (target, path, &error))
        cw_window_show_error (win, _("Unsaved work could not be restored"), error);
      gtk_window_present (GTK_WINDOW (target));
    }
}

static void
offer_restore (CwWindow *win)
{
  GPtrArray *files = cw_autosave_list ();
  GtkWidget *dialog;

  if (files->len == 0)
    {
      g_ptr_array_unref (files);
      return;
    }
  dialog = gtk_message_dialog_new (GTK_WINDOW (win), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE, "%s",
                                   _("Restore unsaved work?"));
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog),
                                            g_dngettext (GETTEXT_PACKAGE,
                                                         "Chairwise did not close properly last time. "
                                                         "One document had unsaved changes.",
                                                         "Chairwise did not close properly last time. "
                                                         "%u documents had unsaved changes.",
                                                         files->len),
                                            files->len);
  gtk_dialog_add_buttons (GTK_DIALOG (dialog), _("_Discard"), GTK_RESPONSE_REJECT, _("_Restore"), GTK_RESPONSE_ACCEPT, NULL);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  g_object_set_data_full (G_OBJECT (dialog), "files", files, (GDestroyNotify) g_ptr_array_unref);
  g_signal_connect (dialog, "response", G_CALLBACK (restore_response_cb), win);
  gtk_window_present (GTK_WINDOW (dialog));
}

/* ---- dark style ------------------------------------------------------------------- */

/* GTK 4.8 without libadwaita does not read the desktop's colour scheme itself: follow
 * org.gnome.desktop.interface color-scheme where that schema exists. */
void
cw_application_apply_color_scheme (const char *scheme)
{
  GtkSettings *settings = gtk_settings_get_default ();
  gboolean     dark = g_strcmp0 (scheme, "prefer-dark") == 0, was = FALSE;

  /* Setting it, even to the value it has, makes GTK load the theme again: 10-15 ms of
   * start-up. */
  g_object_get (settings, "gtk-application-prefer-dark-theme", &was, NULL);
  if (dark != was)
    g_object_set (settings, "gtk-application-prefer-dark-theme", dark, NULL);
}

static void
color_scheme_changed_cb (GSettings  *desktop,
                         const char *key,
                         gpointer    user_data)
{
  g_autofree char *scheme = g_settings_get_string (desktop, "color-scheme");

  cw_application_apply_color_scheme (scheme);
}

static void
follow_color_scheme (CwApplication *self)
{
  GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
  g_autoptr (GSettingsSchema) schema = NULL;

  if (source == NULL || g_getenv ("GTK_THEME") != NULL)
    return;
  schema = g_settings_schema_source_lookup (source, "org.gnome.desktop.interface", TRUE);
  if (schema == NULL || !g_settings_schema_has_key (schema, "color-scheme"))
    return;
  self->desktop = g_settings_new_full (schema, NULL, NULL);
  g_signal_connect (self->desktop, "changed::color-scheme", G_CALLBACK (color_scheme_changed_cb), NULL);
  color_scheme_changed_cb (self->desktop, "color-scheme", NULL);
}

/* ---- app actions -------------------------------------------------------------------- */

static void
quit_activated (GSimpleAction *action,
                GVariant      *param,
                gpointer       user_data)
{
  GList *windows = g_list_copy (gtk_application_get_windows (GTK_APPLICATION (user_data)));

  /* Close each window through its close request, so unsaved work is asked about. */
  for (GList *l = windows; l != NULL; l = l->next)
    gtk_window_close (GTK_WINDOW (l->data));
  g_list_free (windows);
}

static void
about_activated (GSimpleAction *action,
                 GVariant      *param,
                 gpointer       user_data)
{
  static const char *authors[] = { "The Chairwise developers", NULL };
  GtkWindow         *win = gtk_application_get_active_window (GTK_APPLICATION (user_data));

  gtk_show_about_dialog (win,
                         "program-name", _("Chairwise"), "logo-icon-name", CW_APP_ID, "version", PACKAGE_VERSION, "comments", _("Which chair a substituted cyclohexane prefers, by how much, "
                                       "and at what temperature. The results are estimates from an "
                                       "additive model, to be confirmed by experiment."),
                                                                                                                                  "license-type", GTK_LICENSE_GPL_3_0, "authors", authors, "translator-credits", _("translator-credits"), "website", "https://chairwise.org", NULL);
}

static const GActionEntry app_entries[] = {
  { "quit", quit_activated },
  { "about", about_activated },
};

/* ---- GApplication vfuncs ------------------------------------------------------------ */

static int
cw_application_handle_local_options (GApplication *app,
                                     GVariantDict *options)
{
  CwApplication *self = CW_APPLICATION (app);

  if (g_variant_dict_contains (options, "version"))
    {
      g_print ("chairwise %s\n", PACKAGE_VERSION);
      return 0;
    }
  if (g_variant_dict_lookup (options, "screenshot", "^ay", &self->screenshot_path))
    /* A screenshot run is self-contained: never hand off to a running instance. */
    g_application_set_flags (app, g_application_get_flags (app) | G_APPLICATION_NON_UNIQUE);
  self->demo = g_variant_dict_contains (options, "demo");
  return -1;
}

static void
cw_application_startup (GApplication *app)
{
  static const char *quit_accels[] = { "<Primary>q", NULL };
  static const char *new_accels[] = { "<Primary>n", NULL };
  static const char *open_accels[] = { "<Primary>o", NULL };
  static const char *save_accels[] = { "<Primary>s", NULL };
  static const char *save_as_accels[] = { "<Primary><Shift>s", NULL };
  static const char *undo_accels[] = { "<Primary>z", NULL };
  static const char *redo_accels[] = { "<Primary><Shift>z", "<Primary>y", NULL };
  static const char *close_accels[] = { "<Primary>w", NULL };
  static const char *custom_accels[] = { "<Primary>g", NULL };
  static const char *copy_accels[] = { "<Primary><Shift>c", NULL };
  static const char *help_accels[] = { "<Primary>question", NULL };
  GtkApplication    *gapp = GTK_APPLICATION (app);
  g_autoptr (GtkCssProvider) css = gtk_css_provider_new ();

  G_APPLICATION_CLASS (cw_application_parent_class)->startup (app);

  g_action_map_add_action_entries (G_ACTION_MAP (app), app_entries, G_N_ELEMENTS (app_entries), app);
  gtk_application_set_accels_for_action (gapp, "app.quit", quit_accels);
  gtk_application_set_accels_for_action (gapp, "win.new", new_accels);
  gtk_application_set_accels_for_action (gapp, "win.open", open_accels);
  gtk_application_set_accels_for_action (gapp, "win.save", save_accels);
  gtk_application_set_accels_for_action (gapp, "win.save-as", save_as_accels);
  gtk_application_set_accels_for_action (gapp, "win.undo", undo_accels);
  gtk_application_set_accels_for_action (gapp, "win.redo", redo_accels);
  gtk_application_set_accels_for_action (gapp, "window.close", close_accels);
  gtk_application_set_accels_for_action (gapp, "win.custom-group", custom_accels);
  gtk_application_set_accels_for_action (gapp, "win.copy-figure::chairs", copy_accels);
  gtk_application_set_accels_for_action (gapp, "win.show-help-overlay", help_accels);

  gtk_css_provider_load_from_resource (css, "/org/chairwise/Chairwise/style.css");
  gtk_style_context_add_provider_for_display (gdk_display_get_default (), GTK_STYLE_PROVIDER (css),
                                              GTK_STYLE_PROVIDER_PRIORITY_APPLICATION);
  /* The default window icon is set by the first main window once it has drawn its first
   * frame (see cw-window.c). */
  follow_color_scheme (CW_APPLICATION (app));
}

static CwWindow *
new_window (CwApplication *self)
{
  CwWindow *win = cw_window_new (GTK_APPLICATION (self));

  if (self->screenshot_path != NULL)
    g_signal_connect (win, "map", G_CALLBACK (window_mapped_cb), self);
  return win;
}

static void
open_demo (CwWindow *win)
{
  g_autofree char *path = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GError) error = NULL;

  if (!cw_window_open_file (win, file, &error))
    cw_window_show_error (win, _("The demo document could not be opened"), error);
}

static void
cw_application_activate (GApplication *app)
{
  CwApplication *self = CW_APPLICATION (app);
  GtkWindow     *active = gtk_application_get_active_window (GTK_APPLICATION (app));
  CwWindow      *win;

  if (active != NULL && !self->demo)
    {
      gtk_window_present (active);
      return;
    }
  win = new_window (self);
  if (self->demo)
    open_demo (win);
  gtk_window_present (GTK_WINDOW (win));
  if (self->screenshot_path == NULL && active == NULL)
    offer_restore (win);
}

static void
cw_application_open (GApplication *app,
                     GFile       **files,
                     int           n_files,
                     const char   *hint)
{
  CwApplication *self = CW_APPLICATION (app);

  for (int i = 0; i < n_files; i++)
    {
      CwWindow *win = new_window (self);
      g_autoptr (GError) error = NULL;

      if (!cw_window_open_file (win, files[i], &error))
        {
          g_autofree char *name = g_file_get_parse_name (files[i]);
          g_autofree char *primary = g_strdup_printf (_("Could not open “%s”"), name);

          if (self->screenshot_path != NULL)
            {
              g_printerr ("%s: %s\n", primary, error->message);
              self->status = 1;
            }
          cw_window_show_error (win, primary, error);
        }
      gtk_window_present (GTK_WINDOW (win));
    }
}

static void
cw_application_finalize (GObject *object)
{
  CwApplication *self = CW_APPLICATION (object);

  g_clear_pointer (&self->screenshot_path, g_free);
  g_clear_object (&self->desktop);

  G_OBJECT_CLASS (cw_application_parent_class)->finalize (object);
}

static void
cw_application_class_init (CwApplicationClass *klass)
{
  GObjectClass      *object_class = G_OBJECT_CLASS (klass);
  GApplicationClass *app_class = G_APPLICATION_CLASS (klass);

  object_class->finalize = cw_application_finalize;
  app_class->handle_local_options = cw_application_handle_local_options;
  app_class->startup = cw_application_startup;
  app_class->activate = cw_application_activate;
  app_class->open = cw_application_open;
}

static void
cw_application_init (CwApplication *self)
{
  self->start_time = g_get_monotonic_time ();
  g_application_add_main_option_entries (G_APPLICATION (self), option_entries);
  g_application_set_option_context_parameter_string (G_APPLICATION (self), _("[DOCUMENT…]"));
  g_application_set_option_context_summary (G_APPLICATION (self),
                                            _("Estimate which chair a substituted cyclohexane prefers."));
}

int
cw_application_get_status (CwApplication *self)
{
  g_return_val_if_fail (CW_IS_APPLICATION (self), 1);
  return self->status;
}

CwApplication *
cw_application_new (void)
{
  return g_object_new (CW_TYPE_APPLICATION,
                       "application-id", CW_APP_ID,
                       "flags", G_APPLICATION_HANDLES_OPEN,
                       "resource-base-path", "/org/chairwise/Chairwise",
                       NULL);
}
