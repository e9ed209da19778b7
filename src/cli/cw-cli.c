#include "config.h"

#include <gmodule.h>
#include <glib/gi18n.h>
#include <errno.h>
#include <locale.h>
#include <stdio.h>
#include <string.h>

#include "cw-cli.h"

/* draw and report run from the chairwise-calc-render module, found beside the program (a build
 * tree), in CHAIRWISE_MODULEDIR, or where it is installed. */
static int
run_from_module (const char *symbol, int argc, char **argv)
{
  g_autofree char *self = g_file_read_link ("/proc/self/exe", NULL);
  g_autofree char *here = self ? g_path_get_dirname (self) : g_strdup (".");
  const char *dirs[] = { g_getenv ("CHAIRWISE_MODULEDIR"), here, CW_CLI_MODULEDIR };
  g_autofree char *last_error = NULL;
  CwCliRun run = NULL;

  for (gsize i = 0; i < G_N_ELEMENTS (dirs); i++)
    {
      g_autofree char *path = NULL;
      GModule *module;

      if (dirs[i] == NULL || *dirs[i] == '\0')
        continue;
      path = g_module_build_path (dirs[i], "chairwise-calc-render");
      if (!g_file_test (path, G_FILE_TEST_EXISTS))
        continue;
      module = g_module_open (path, G_MODULE_BIND_LOCAL);
      if (module == NULL)
        {
          g_free (last_error);
          last_error = g_strdup (g_module_error ());
          continue;
        }
      if (g_module_symbol (module, symbol, (gpointer *) &run) && run != NULL)
        return run (argc, argv); /* the module stays loaded until exit */
      g_module_close (module);
    }
  return cw_cli_error (argv[0], CW_EXIT_ANALYSIS, _("the drawing module is missing or broken (%s)"),
                       last_error ? last_error : "libchairwise-calc-render.so not found");
}

static int
run_draw (int argc, char **argv)
{
  return run_from_module ("cw_cli_draw", argc, argv);
}

static int
run_report (int argc, char **argv)
{
  return run_from_module ("cw_cli_report", argc, argv);
}

static const CwCliCommand commands[] = {
  { "analyze", N_("Both chairs, every term, ΔG°, K and populations"), cw_cli_analyze },
  { "scan", N_("Chair populations against temperature (CSV)"), cw_cli_scan },
  { "groups", N_("The substituent table with A-values and sources"), cw_cli_groups },
  { "isomers", N_("Every cis/trans isomer with its free energy and equilibrium share"), cw_cli_isomers },
  { "batch", N_("Analyse a file of SMILES (one compound a line) to CSV or JSON"), cw_cli_batch },
  { "draw", N_("Draw a figure to PNG, SVG or PDF"), run_draw },
  { "report", N_("The one-page PDF report"), run_report },
  { "geometry", N_("3D coordinates of a chair as XYZ"), cw_cli_geometry },
  { "couplings", N_("Predicted vicinal couplings, and populations from a measured one"), cw_cli_couplings },
  { "reactivity", N_("Anti-periplanar checks for E2 and trans-diaxial reactions"), cw_cli_reactivity },
};

static void
print_help (FILE *out)
{
  fprintf (out, _("Usage: chairwise-calc COMMAND [OPTIONS] [DOCUMENT.json]\n\n"
                  "Which chair a substituted cyclohexane prefers, by how much, at what temperature.\n\n"
                  "Commands:\n"));
  for (gsize i = 0; i < G_N_ELEMENTS (commands); i++)
    fprintf (out, "  %-12s %s\n", commands[i].name, _(commands[i].summary));
  fprintf (out, _("\nEach command takes --help. A molecule comes from a document, --smiles or --ring "
                  "(e.g. --ring \"1u=methyl 3u=methyl\").\n"
                  "Exit codes: 0 ok, 1 analysis or file error, 2 usage error.\n"));
}

/* A text option whose value is not valid UTF-8 (in a UTF-8 locale GLib would only say "Invalid
 * byte sequence in conversion input"): name the option. File names may be any bytes, so
 * positional arguments and the file options are left to the command. */
static gboolean
check_text_options (const char *command, int argc, char **argv)
{
  static const char *const file_options[] = { "-o", "--output", "--data-dir", NULL };

  for (int i = 1; i < argc; i++)
    {
      g_autofree char *name = NULL;
      const char      *eq, *value = argv[i];
      if (g_utf8_validate (argv[i], -1, NULL))
        continue;
      if (g_str_has_prefix (argv[i], "--") && (eq = strchr (argv[i], '=')) != NULL)
        name = g_strndup (argv[i], eq - argv[i]), value = eq + 1;
      else if (i > 1 && argv[i - 1][0] == '-' && argv[i - 1][1] != '\0' && !strchr (argv[i - 1], '='))
        name = g_strdup (argv[i - 1]);
      if (name == NULL || !g_utf8_validate (name, -1, NULL) || g_strv_contains (file_options, name))
        continue;
      {
        g_autofree char *shown = g_utf8_make_valid (value, -1);
        fprintf (stderr, _("chairwise-calc %s: the value of %s is not valid UTF-8 text: “%s”\n"), command, name, shown);
        return FALSE;
      }
    }
  return TRUE;
}

int
main (int argc, char **argv)
{
  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  if (argc < 2)
    {
      print_help (stderr);
      return CW_EXIT_USAGE;
    }
  if (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0 || strcmp (argv[1], "help") == 0)
    {
      print_help (stdout);
      return CW_EXIT_OK;
    }
  if (strcmp (argv[1], "--version") == 0)
    {
      printf ("chairwise-calc %s\n", PACKAGE_VERSION);
      return CW_EXIT_OK;
    }
  for (gsize i = 0; i < G_N_ELEMENTS (commands); i++)
    if (strcmp (argv[1], commands[i].name) == 0)
      {
        int code;

        g_set_prgname (commands[i].name);
        if (!check_text_options (commands[i].name, argc - 1, argv + 1))
          return CW_EXIT_USAGE;
        code = commands[i].run (argc - 1, argv + 1);
        /* a full disk or a closed pipe must not pass for success */
        if (fflush (stdout) != 0 || ferror (stdout))
          {
            fprintf (stderr, _("chairwise-calc %s: cannot write the output: %s\n"), commands[i].name,
                     g_strerror (errno));
            return code == CW_EXIT_OK ? CW_EXIT_ANALYSIS : code;
          }
        return code;
      }
  fprintf (stderr, _("chairwise-calc: unknown command “%s”\n\n"), argv[1]);
  print_help (stderr);
  return CW_EXIT_USAGE;
}
