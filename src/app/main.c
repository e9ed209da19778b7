#include "config.h"

#include <glib/gi18n.h>
#include <locale.h>

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

int
main (int   argc,
      char *argv[])
{
  g_autoptr (CwApplication) app = NULL;

  choose_renderer ();
  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  app = cw_application_new ();
  return g_application_run (G_APPLICATION (app), argc, argv);
}
