/* cw-cli-smiles.c: the `isomers` and `batch` subcommands. */
#include "config.h"

#include <cjson/cJSON.h>
#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <stdio.h>
#include <string.h>

#include "cw-batch.h"
#include "cw-cli.h"
#include "cw-isomers.h"
#include "cw-smiles.h"

/* ---- isomers ---- */

static void
print_isomers_text (const CwIsomerSet *set, CwEnergyUnit unit, const CwMolecule *constitution)
{
  const char      *u = cw_energy_unit_symbol (unit);
  g_autofree char *t = cw_format_temperature (set->temperature, CW_TUNIT_KELVIN);

  printf (_("cis/trans isomers: %u (%d ring carbons with one group or two different groups)\n"),
             set->isomers->len, set->n_stereo_carbons);
  printf (_("temperature %s, solvent %s, energies in %s\n\n"), t, cw_solvent_to_string (set->solvent), u);
  printf ("%-3s %-22s %-44s %9s %9s %9s %8s %6s %9s %7s\n", "#", _("configuration"), "SMILES", "G", _("G rel"), _("<E> rel"), _("species"), _("major"), _("dG ring"), _("x eq"));
  for (guint i = 0; i < set->isomers->len; i++)
    {
      const CwIsomer *iso = set->isomers->pdata[i];
      printf ("%-3u %-22s %-44s %9.3f %9.3f %9.3f %8d %6d %9.3f %6.1f%%\n", i + 1,
              iso->configuration[0] ? iso->configuration : "-", iso->smiles,
              cw_energy_from_kcal (iso->g, unit), cw_energy_from_kcal (iso->g_rel, unit),
              cw_energy_from_kcal (iso->h_rel, unit), iso->n_species, iso->analysis.major + 1,
              cw_energy_from_kcal (iso->analysis.delta_g, unit), 100.0 * iso->fraction);
    }
  printf (_("\nG: conformer-averaged free energy; <E>: population-weighted mean chair energy; "
            "species: chair species counted; major: the lower chair; dG ring: G(chair 2) − G(chair 1); "
            "x eq: fraction at equilibrium if the isomers interconvert.\n"));
  printf (_("Method: %s\n"), cw_isomers_method_text ());
  printf (_("Caution: %s\n"), cw_caution_text ());
  (void) constitution;
}

static void
print_isomers_json (const CwIsomerSet *set, CwEnergyUnit unit)
{
  cJSON *root = cJSON_CreateObject ();
  cJSON *list = cJSON_AddArrayToObject (root, "isomers");
  char  *text;

  cJSON_AddStringToObject (root, "format", "chairwise-isomers");
  cJSON_AddNumberToObject (root, "version", 1);
  cJSON_AddNumberToObject (root, "temperature_K", set->temperature);
  cJSON_AddStringToObject (root, "solvent", cw_solvent_to_string (set->solvent));
  cJSON_AddStringToObject (root, "energy_unit", cw_energy_unit_symbol (unit));
  cJSON_AddStringToObject (root, "method", cw_isomers_method_text ());
  cJSON_AddStringToObject (root, "caution", cw_caution_text ());
  for (guint i = 0; i < set->isomers->len; i++)
    {
      const CwIsomer  *iso = set->isomers->pdata[i];
      cJSON           *o = cJSON_CreateObject ();
      cJSON           *species = cJSON_AddArrayToObject (o, "species_energies");
      cJSON           *pop = cJSON_AddArrayToObject (o, "chair_populations");
      cJSON           *flags = cJSON_AddArrayToObject (o, "flags");
      g_autofree char *spec = cw_molecule_dup_spec (iso->molecule);

      cJSON_AddStringToObject (o, "configuration", iso->configuration);
      cJSON_AddStringToObject (o, "smiles", iso->smiles);
      cJSON_AddStringToObject (o, "ring", spec);
      cJSON_AddBoolToObject (o, "chiral", iso->chiral);
      for (int k = 0; k < iso->n_species; k++)
        cJSON_AddItemToArray (species, cJSON_CreateNumber (cw_energy_from_kcal (iso->species_energy[k], unit)));
      cJSON_AddNumberToObject (o, "G", cw_energy_from_kcal (iso->g, unit));
      cJSON_AddNumberToObject (o, "G_rel", cw_energy_from_kcal (iso->g_rel, unit));
      cJSON_AddNumberToObject (o, "mean_energy_rel", cw_energy_from_kcal (iso->h_rel, unit));
      cJSON_AddNumberToObject (o, "fraction", iso->fraction);
      cJSON_AddNumberToObject (o, "delta_g_ring_inversion", cw_energy_from_kcal (iso->analysis.delta_g, unit));
      cJSON_AddNumberToObject (o, "K", iso->analysis.K);
      cJSON_AddItemToArray (pop, cJSON_CreateNumber (iso->analysis.pop[0]));
      cJSON_AddItemToArray (pop, cJSON_CreateNumber (iso->analysis.pop[1]));
      cJSON_AddNumberToObject (o, "major_chair", iso->analysis.major + 1);
      for (int k = 0; k < iso->analysis.n_flags; k++)
        cJSON_AddItemToArray (flags, cJSON_CreateString (cw_flag_code_to_string (iso->analysis.flags[k].code)));
      cJSON_AddItemToArray (list, o);
    }
  text = cJSON_Print (root);
  printf ("%s\n", text);
  cJSON_free (text);
  cJSON_Delete (root);
}

static void
print_isomers_csv (const CwIsomerSet *set, CwEnergyUnit unit)
{
  printf ("configuration,smiles,chiral,species,G,G_rel,mean_energy_rel,fraction,delta_g_ring,major_chair,unit\n");
  for (guint i = 0; i < set->isomers->len; i++)
    {
      const CwIsomer *iso = set->isomers->pdata[i];
      printf ("\"%s\",%s,%s,%d,%.4f,%.4f,%.4f,%.6f,%.4f,%d,%s\n", iso->configuration, iso->smiles,
              iso->chiral ? "yes" : "no", iso->n_species, cw_energy_from_kcal (iso->g, unit),
              cw_energy_from_kcal (iso->g_rel, unit), cw_energy_from_kcal (iso->h_rel, unit),
              iso->fraction, cw_energy_from_kcal (iso->analysis.delta_g, unit), iso->analysis.major + 1,
              cw_energy_unit_symbol (unit));
    }
}

int
cw_cli_isomers (int argc, char **argv)
{
  g_auto (CwCliInput) input = { 0 };
  g_autoptr (GOptionContext) context = g_option_context_new (_("[DOCUMENT.json] — every cis/trans isomer of the constitution, with conformer-averaged free energies"));
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (GPtrArray) docs = NULL;
  g_autoptr (CwIsomerSet) set = NULL;
  CwConditions      cond;
  const CwDocument *doc;
  CwEnergyUnit      unit;
  int               code = CW_EXIT_OK;

  cw_cli_input_add_options (context, &input, CW_CLI_OPTIONS_CONDITIONS | CW_CLI_OPTIONS_FORMATS);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "isomers", error->message);
  if (argc > 2)
    return cw_cli_usage_error (context, "isomers", _("too many arguments"));
  if (input.json && input.csv)
    return cw_cli_usage_error (context, "isomers", _("give --json or --csv, not both"));
  docs = cw_cli_input_load_all (&input, argc > 1 ? argv[1] : NULL, &data, &code);
  if (docs == NULL)
    return code;
  /* every isomer of the SMILES shares the constitution; the first will do */
  doc = g_ptr_array_index (docs, 0);
  cw_document_get_conditions (doc, &cond);
  unit = cw_document_get_energy_unit (doc);
  set = cw_isomers_enumerate (data, cw_document_peek_molecule (doc), &cond, &error);
  if (set == NULL)
    return cw_cli_error ("isomers", CW_EXIT_ANALYSIS, "%s", error->message);
  if (input.json)
    print_isomers_json (set, unit);
  else if (input.csv)
    print_isomers_csv (set, unit);
  else
    print_isomers_text (set, unit, cw_document_peek_molecule (doc));
  return CW_EXIT_OK;
}

/* ---- batch ---- */

static gboolean
has_suffix_ci (const char *s, const char *suffix)
{
  gsize n = strlen (s), m = strlen (suffix);
  return n >= m && g_ascii_strcasecmp (s + n - m, suffix) == 0;
}

int
cw_cli_batch (int argc, char **argv)
{
  g_autofree char *output = NULL, *temperature = NULL, *solvent = NULL, *format = NULL, *data_dir = NULL;
  gboolean         json = FALSE, quiet = FALSE;
  GOptionEntry     entries[] = {
        { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, N_("Write results to OUT.csv or OUT.json (default: CSV on standard output)"), "OUT" },
          { "temperature", 't', 0, G_OPTION_ARG_STRING, &temperature, N_("Temperature with unit: 25C, -78 °C, 298.15K (default 25 °C)"), "T" },
            { "solvent", 's', 0, G_OPTION_ARG_STRING, &solvent, N_("Solvent class: aprotic or protic"), "CLASS" },
              { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Write JSON whatever the output name"), NULL },
                { "input-format", 0, 0, G_OPTION_ARG_STRING, &format, N_("smi or csv (default: from the name, else from the first line)"), "FORMAT" },
                  { "data-dir", 0, 0, G_OPTION_ARG_FILENAME, &data_dir, N_("Read groups.json and interactions.json from DIR"), "DIR" },
                    { "quiet", 'q', 0, G_OPTION_ARG_NONE, &quiet, N_("No progress line and no summary"), NULL },
                      { NULL } };
  g_autoptr (GOptionContext) context = g_option_context_new (_("IN.smi|IN.csv|- — analyse one compound per line"));
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autofree char *part = NULL, *summary_text = NULL;
  CwBatchOptions   opt;
  CwBatchSummary   summary;
  FILE            *in = stdin, *out = stdout;
  gboolean         ok;

  g_option_context_set_description (context,
                                    _("Input: SMILES lines with an optional name or id after the SMILES, or CSV with a header naming "
      "a “smiles” column and optionally “id” or “name”. Output columns: line, id, canonical SMILES, "
      "relative configuration, major chair, ΔG° and its σ (kcal/mol), K, chair populations, the "
      "interval of the major population for ΔG° ± 2σ, flags, and the error for a bad line. A SMILES "
      "with open ring stereocentres gives one row per cis/trans isomer (flag open-stereo). Bad lines "
      "are reported on standard error with their line number and the batch goes on. The exit status "
      "is 0 when every line was read, 1 when any line had an error or reading/writing failed."));
  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return cw_cli_usage_error (context, "batch", error->message);
  if (argc != 2)
    return cw_cli_usage_error (context, "batch", argc < 2 ? _("give an input file (or - for standard input)") : _("too many arguments"));
  cw_batch_options_init (&opt);
  opt.progress = !quiet;
  if (temperature && !cw_parse_temperature (temperature, &opt.temperature, NULL, &error))
    return cw_cli_usage_error (context, "batch", error->message);
  if (solvent && !cw_solvent_from_string (solvent, &opt.solvent))
    return cw_cli_usage_error (context, "batch", _("--solvent must be aprotic or protic"));
  if (format && g_ascii_strcasecmp (format, "csv") == 0)
    opt.input = CW_BATCH_INPUT_CSV;
  else if (format && g_ascii_strcasecmp (format, "smi") == 0)
    opt.input = CW_BATCH_INPUT_SMI;
  else if (format)
    return cw_cli_usage_error (context, "batch", _("--input-format must be smi or csv"));
  else if (has_suffix_ci (argv[1], ".csv"))
    opt.input = CW_BATCH_INPUT_CSV;
  else if (has_suffix_ci (argv[1], ".smi") || has_suffix_ci (argv[1], ".smiles"))
    opt.input = CW_BATCH_INPUT_SMI;
  opt.json = json || (output && has_suffix_ci (output, ".json"));
  data = cw_data_new_from_dir (data_dir, &error);
  if (data == NULL)
    return cw_cli_error ("batch", CW_EXIT_ANALYSIS, _("cannot load the data tables: %s"), error->message);
  if (strcmp (argv[1], "-") != 0 && (in = g_fopen (argv[1], "rb")) == NULL)
    return cw_cli_error ("batch", CW_EXIT_ANALYSIS, _("cannot open %s: %s"), argv[1], g_strerror (errno));
  if (output && strcmp (output, "-") != 0)
    {
      /* write beside the target and rename at the end: an earlier OUT survives a failed run */
      part = g_strconcat (output, ".part", NULL);
      if ((out = g_fopen (part, "wb")) == NULL)
        {
          if (in != stdin)
            fclose (in);
          return cw_cli_error ("batch", CW_EXIT_ANALYSIS, _("cannot write %s: %s"), part, g_strerror (errno));
        }
    }
  ok = cw_batch_run (data, in, out, stderr, &opt, &summary, &error);
  if (in != stdin)
    fclose (in);
  if (part)
    {
      ok = (fclose (out) == 0) && ok;
      if (ok && g_rename (part, output) != 0)
        {
          g_set_error (&error, CW_CORE_ERROR, CW_CORE_ERROR_IO, _("cannot rename %s to %s: %s"), part, output, g_strerror (errno));
          ok = FALSE;
        }
      if (!ok)
        g_unlink (part);
    }
  if (!ok)
    return cw_cli_error ("batch", CW_EXIT_ANALYSIS, "%s", error ? error->message : _("failed"));
  if (!quiet)
    {
      summary_text = cw_batch_summary_dup_text (&summary);
      fprintf (stderr, "chairwise-calc batch: %s\n", summary_text);
      fprintf (stderr, _("chairwise-calc batch: caution: %s\n"), cw_caution_text ());
    }
  return summary.errors ? CW_EXIT_ANALYSIS : CW_EXIT_OK;
}
