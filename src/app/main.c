#include "config.h"

#include <glib/gi18n.h>
#include <locale.h>

#include "cw-app-data.h"
#include "cw-application.h"

/* Everything Chairwise shows is drawn with Cairo, so GL brings nothing but cost: on
 * Mesa's software path it adds about 60 MB of resident memory and a few hundred ms to
 * start-up. Use the Cairo renderer and keep GDK from opening GL, unless the user chose
 * a renderer, set GDK_DEBUG, or asked for GL with CHAIRWISE_GL=1. */
static void
choose_renderer (void)
{
  if (g_strcmp0 (g_getenv ("CHAIRWISE_GL"), "1") == 0)
    return;
  if (g_getenv ("GSK_RENDERER") == NULL)
    g_setenv ("GSK_RENDERER", "cairo", TRUE);
  if (g_getenv ("GDK_DEBUG") == NULL && g_strcmp0 (g_getenv ("GSK_RENDERER"), "cairo") == 0)
    g_setenv ("GDK_DEBUG", "gl-disable", TRUE);
}

/* GTK 4.8 reaches the accessibility bus through the session bus; where there is none
 * (a bare X server, a CI box) it can only warn, so do not try. */
static void
choose_accessibility (void)
{
  g_autofree char *socket = g_build_filename (g_get_user_runtime_dir (), "bus", NULL);

  if (g_getenv ("GTK_A11Y") == NULL && g_getenv ("DBUS_SESSION_BUS_ADDRESS") == NULL &&
      !g_file_test (socket, G_FILE_TEST_EXISTS))
    g_setenv ("GTK_A11Y", "none", TRUE);
}

/* With no session bus and no dbus-launch to start one, GLib's autolaunch can only fail, after
 * trying to run dbus-launch from every PATH directory (measured: about 24 failed spawns before
 * the window). Say at once that there is no session bus; the program then runs as a plain,
 * non-unique application, which is what it would have ended up as anyway. */
static void
choose_session_bus (void)
{
  g_autofree char *socket = g_build_filename (g_get_user_runtime_dir (), "bus", NULL);
  g_autofree char *launcher = NULL;

  if (g_getenv ("DBUS_SESSION_BUS_ADDRESS") != NULL || g_file_test (socket, G_FILE_TEST_EXISTS))
    return;
  launcher = g_find_program_in_path ("dbus-launch");
  if (launcher == NULL)
    g_setenv ("DBUS_SESSION_BUS_ADDRESS", "disabled:", TRUE);
}

int
main (int   argc,
      char *argv[])
{
  g_autoptr (CwApplication) app = NULL;

  cw_app_tune_memory ();
  choose_renderer ();
  choose_accessibility ();
  choose_session_bus ();
  setlocale (LC_ALL, "");
  /* CHAIRWISE_LOCALEDIR lets an uninstalled build use its compiled catalogues (build/po). */
  bindtextdomain (GETTEXT_PACKAGE, g_getenv ("CHAIRWISE_LOCALEDIR") ? g_getenv ("CHAIRWISE_LOCALEDIR") : LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  int status;

  app = cw_application_new ();
  status = g_application_run (G_APPLICATION (app), argc, argv);
  return status != 0 ? status : cw_application_get_status (app);
}
