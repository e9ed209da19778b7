#include "config.h"

#include <glib/gi18n.h>
#include <errno.h>
#include <locale.h>
#include <stdio.h>
#include <string.h>

#include "cw-cli.h"

static const CwCliCommand commands[] = {
  { "analyze", N_("Both chairs, every term, ΔG°, K and populations"), cw_cli_analyze },
  { "scan", N_("Chair populations against temperature (CSV)"), cw_cli_scan },
  { "groups", N_("The substituent table with A-values and sources"), cw_cli_groups },
  { "isomers", N_("Every cis/trans isomer with its free energy and equilibrium share"), cw_cli_isomers },
  { "batch", N_("Analyse a file of SMILES (one compound a line) to CSV or JSON"), cw_cli_batch },
  { "draw", N_("Draw a figure to PNG, SVG or PDF"), cw_cli_draw },
  { "report", N_("The one-page PDF report"), cw_cli_report },
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
