#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>

#include "cw-cli.h"
#if __has_include ("cw-smiles.h")
#include "cw-smiles.h"
#define CW_HAVE_SMILES 1
#endif

void
cw_cli_input_add_options (GOptionContext *context, CwCliInput *input, CwCliOptionSet set)
{
  GOptionEntry source_entries[] = {
    { "smiles", 0, 0, G_OPTION_ARG_STRING, &input->smiles, N_("Read the molecule from SMILES"), "SMILES" },
    { "ring", 0, 0, G_OPTION_ARG_STRING, &input->ring,
      N_("Inline ring: slots POSITION+FACE=GROUP, e.g. \"1u=methyl 3u=methyl\" (u up, d down)"), "SPEC" },
    { "data-dir", 0, 0, G_OPTION_ARG_FILENAME, &input->data_dir, N_("Read groups.json and interactions.json from DIR"), "DIR" },
    { NULL }
  };
  GOptionEntry condition_entries[] = {
    { "temperature", 't', 0, G_OPTION_ARG_STRING, &input->temperature,
      N_("Temperature with unit: 25C, -78 °C, 298.15K"), "T" },
    { "units", 'u', 0, G_OPTION_ARG_STRING, &input->units, N_("Energy unit: kcal or kJ"), "UNIT" },
    { "solvent", 's', 0, G_OPTION_ARG_STRING, &input->solvent, N_("Solvent class: aprotic or protic"), "CLASS" },
    { NULL }
  };
  GOptionEntry format_entries[] = {
    { "json", 0, 0, G_OPTION_ARG_NONE, &input->json, N_("Write JSON"), NULL },
    { "csv", 0, 0, G_OPTION_ARG_NONE, &input->csv, N_("Write CSV"), NULL },
    { NULL }
  };

  g_option_context_add_main_entries (context, source_entries, GETTEXT_PACKAGE);
  if (set & CW_CLI_OPTIONS_CONDITIONS)
    g_option_context_add_main_entries (context, condition_entries, GETTEXT_PACKAGE);
  if (set & CW_CLI_OPTIONS_FORMATS)
    g_option_context_add_main_entries (context, format_entries, GETTEXT_PACKAGE);
}

void
cw_cli_input_clear (CwCliInput *input)
{
  g_clear_pointer (&input->smiles, g_free);
  g_clear_pointer (&input->ring, g_free);
  g_clear_pointer (&input->temperature, g_free);
  g_clear_pointer (&input->units, g_free);
  g_clear_pointer (&input->solvent, g_free);
  g_clear_pointer (&input->data_dir, g_free);
}

int
cw_cli_error (const char *command, int code, const char *format, ...)
{
  va_list args;
  g_autofree char *msg = NULL;

  va_start (args, format);
  msg = g_strdup_vprintf (format, args);
  va_end (args);
  fprintf (stderr, "chairwise-calc %s: %s\n", command, msg);
  return code;
}

int
cw_cli_usage_error (GOptionContext *context, const char *command, const char *message)
{
  fprintf (stderr, "chairwise-calc %s: %s\n", command, message);
  fprintf (stderr, _("Try “chairwise-calc %s --help”.\n"), command);
  return CW_EXIT_USAGE;
}

static CwDocument *
document_from_molecule (const CwMolecule *mol)
{
  CwDocument *doc = cw_document_new ();

  cw_document_set_molecule (doc, mol);
  return doc;
}

static GPtrArray *
one_document (CwDocument *doc)
{
  GPtrArray *docs = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_document_free);

  if (doc != NULL)
    g_ptr_array_add (docs, doc);
  return docs;
}

static GPtrArray *
load_source (CwCliInput *input, const char *path, CwData *data, const char *cmd, int *exit_code)
{
  g_autoptr (GError) error = NULL;
  int n = (path != NULL) + (input->smiles != NULL) + (input->ring != NULL);

  if (n != 1)
    {
      *exit_code = cw_cli_error (cmd, CW_EXIT_USAGE,
                                 _("give exactly one of: a document path, --smiles or --ring"));
      return NULL;
    }
  if (input->ring != NULL)
    {
      g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec (input->ring, data->groups, &error);
      if (mol == NULL)
        {
          *exit_code = cw_cli_error (cmd, CW_EXIT_USAGE, "--ring: %s", error->message);
          return NULL;
        }
      return one_document (document_from_molecule (mol));
    }
#ifdef CW_HAVE_SMILES
  if (input->smiles != NULL)
    {
      g_autoptr (GString) notes = g_string_new (NULL);
      g_autoptr (GPtrArray) mols = cw_smiles_read (input->smiles, data->groups, notes, &error);
      if (mols == NULL)
        {
          *exit_code = cw_cli_error (cmd, CW_EXIT_ANALYSIS, "--smiles: %s", error->message);
          return NULL;
        }
      GPtrArray *docs = one_document (NULL);
      if (notes->len > 0)
        fprintf (stderr, "chairwise-calc %s: %s\n", cmd, notes->str);
      for (guint i = 0; i < mols->len; i++)
        {
          CwDocument *doc = document_from_molecule (g_ptr_array_index (mols, i));
          g_autofree char *smiles = cw_smiles_write (g_ptr_array_index (mols, i));
          cw_document_set_title (doc, smiles);
          g_ptr_array_add (docs, doc);
        }
      return docs;
    }
#endif
  {
    CwDocument *doc = cw_document_new_from_file (path, data->groups, &error);
    if (doc == NULL)
      {
        *exit_code = cw_cli_error (cmd, CW_EXIT_ANALYSIS, "%s", error->message);
        return NULL;
      }
    return one_document (doc);
  }
}

static gboolean
apply_conditions (CwCliInput *input, CwDocument *doc, const char *cmd, int *exit_code)
{
  g_autoptr (GError) error = NULL;

  if (input->temperature != NULL)
    {
      double t;
      CwTemperatureUnit unit;
      if (!cw_parse_temperature (input->temperature, &t, &unit, &error))
        {
          *exit_code = cw_cli_error (cmd, CW_EXIT_USAGE, "--temperature: %s", error->message);
          return FALSE;
        }
      cw_document_set_temperature (doc, t);
      cw_document_set_temperature_unit (doc, unit);
    }
  if (input->units != NULL)
    {
      CwEnergyUnit unit;
      if (!cw_energy_unit_from_string (input->units, &unit))
        {
          *exit_code = cw_cli_error (cmd, CW_EXIT_USAGE, _("--units: “%s” is not kcal or kJ"), input->units);
          return FALSE;
        }
      cw_document_set_energy_unit (doc, unit);
    }
  if (input->solvent != NULL)
    {
      CwSolvent solvent;
      if (!cw_solvent_from_string (input->solvent, &solvent))
        {
          *exit_code = cw_cli_error (cmd, CW_EXIT_USAGE, _("--solvent: “%s” is not aprotic or protic"),
                                     input->solvent);
          return FALSE;
        }
      cw_document_set_solvent (doc, solvent);
    }
  return TRUE;
}

GPtrArray *
cw_cli_input_load_all (CwCliInput *input, const char *path, CwData **data_out, int *exit_code)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (GPtrArray) docs = NULL;
  const char *cmd = g_get_prgname () ? g_get_prgname () : "";

  data = cw_data_new_from_dir (input->data_dir, &error);
  if (data == NULL)
    {
      *exit_code = cw_cli_error (cmd, CW_EXIT_ANALYSIS, _("cannot load the data tables: %s"),
                                 error->message);
      return NULL;
    }
  docs = load_source (input, path, data, cmd, exit_code);
  if (docs == NULL)
    return NULL;
  for (guint i = 0; i < docs->len; i++)
    if (!apply_conditions (input, g_ptr_array_index (docs, i), cmd, exit_code))
      return NULL;
  *data_out = g_steal_pointer (&data);
  return g_steal_pointer (&docs);
}

CwDocument *
cw_cli_input_load (CwCliInput *input, const char *path, CwData **data_out, int *exit_code)
{
  g_autoptr (GPtrArray) docs = cw_cli_input_load_all (input, path, data_out, exit_code);
  const char *cmd = g_get_prgname () ? g_get_prgname () : "";

  if (docs == NULL)
    return NULL;
  if (docs->len > 1)
    fprintf (stderr, _("chairwise-calc %s: the SMILES leaves %u cis/trans isomers open; using "
                       "the first, %s (see “chairwise-calc isomers” for all)\n"),
             cmd, docs->len, cw_document_get_title (g_ptr_array_index (docs, 0)));
  return g_ptr_array_steal_index (docs, 0);
}

char *
cw_cli_format_percent (double x)
{
  double p = 100 * x;

  if (p >= 0.1 && p <= 99.9)
    return g_strdup_printf ("%.1f", p);
  if (p < 0.1)
    return g_strdup_printf ("%.2g", p); /* a minor chair still shows two figures */
  if (100 - p < 1e-9)
    return g_strdup ("100");
  /* enough decimals to show how far from 100 % it is */
  return g_strdup_printf ("%.*f", MIN (10, 1 - (int) floor (log10 (100 - p)) + 1), p);
}
