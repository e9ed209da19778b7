#pragma once

/* Shared set-up for the window tests: isolated state directory, display check, and
 * a main-loop pump that waits for a window to be mapped and drawn. */

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <stdio.h>
#include <stdlib.h>

static inline gboolean
app_test_init (int    *argc,
               char ***argv)
{
  g_autofree char *state = g_dir_make_tmp ("cw-app-test-XXXXXX", NULL);

  /* Autosave files go to a private directory, never the user's. */
  g_setenv ("XDG_STATE_HOME", state, TRUE);
  g_test_init (argc, argv, NULL);
  if (gtk_init_check ())
    return TRUE;
  if (g_strcmp0 (g_getenv ("CHAIRWISE_REQUIRE_DISPLAY"), "1") == 0)
    {
      printf ("Bail out! no display, and CHAIRWISE_REQUIRE_DISPLAY=1\n");
      exit (1);
    }
  printf ("1..0 # SKIP no display\n");
  return FALSE;
}

static gboolean
app_test_tick_cb (gpointer data)
{
  return G_SOURCE_CONTINUE;
}

/* Runs the main loop for about ms milliseconds, or until *done when done is set. */
static inline void
app_test_pump (guint     ms,
               gboolean *done)
{
  gint64 end = g_get_monotonic_time () + (gint64) ms * 1000;
  guint  id = g_timeout_add (5, app_test_tick_cb, NULL);

  while (g_get_monotonic_time () < end && (done == NULL || !*done))
    g_main_context_iteration (NULL, TRUE);
  g_source_remove (id);
}

static inline void
app_test_wait_mapped (GtkWidget *widget)
{
  gint64 end = g_get_monotonic_time () + 5 * G_USEC_PER_SEC;
  guint  id = g_timeout_add (5, app_test_tick_cb, NULL);

  while (g_get_monotonic_time () < end &&
         !(gtk_widget_get_mapped (widget) && gtk_widget_get_width (widget) > 0))
    g_main_context_iteration (NULL, TRUE);
  g_source_remove (id);
  g_assert_true (gtk_widget_get_mapped (widget));
  /* Let the first frames be laid out and drawn. */
  app_test_pump (150, NULL);
}

static inline char *
app_test_tmp_path (const char *name)
{
  static char *dir;

  if (dir == NULL)
    dir = g_dir_make_tmp ("cw-app-files-XXXXXX", NULL);
  return g_build_filename (dir, name, NULL);
}
