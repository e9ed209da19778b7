/* libFuzzer harness: the inline ring spec (“1u=methyl 3d=Cl”, cw_molecule_new_from_spec).
 * An accepted spec must print back to a spec that reads as the same molecule, and analyse
 * soundly at a cold and a hot temperature. */
#include "fuzz-common.h"

int
LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size)
{
  CwData *data = fuzz_data ();
  g_autofree char *text = fuzz_strndup (bytes, size);
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = NULL;
  g_autoptr (CwMolecule) back = NULL;
  g_autofree char *spec = NULL, *spec_back = NULL, *config = NULL, *summary = NULL;
  const double temps[] = { 1.0, 195.15, 1000.0 };

  mol = cw_molecule_new_from_spec (text, data->groups, &error);
  if (mol == NULL)
    {
      fuzz_check_error (error, g_utf8_validate (text, -1, NULL));
      return 0;
    }
  spec = cw_molecule_dup_spec (mol);
  back = cw_molecule_new_from_spec (spec, data->groups, &error);
  FUZZ_CHECK (back != NULL, "“%s” printed as “%s”, which does not read: %s", text, spec,
              error->message);
  spec_back = cw_molecule_dup_spec (back);
  FUZZ_CHECK (strcmp (spec, spec_back) == 0, "%s → %s", spec, spec_back);
  config = cw_molecule_dup_configuration (mol);
  summary = cw_molecule_dup_summary (mol);
  FUZZ_CHECK (g_utf8_validate (summary, -1, NULL) && g_utf8_validate (config, -1, NULL), "%s", spec);
  for (gsize i = 0; i < G_N_ELEMENTS (temps); i++)
    {
      CwConditions cond = { temps[i], (CwSolvent) (i % 2) };
      CwAnalysis an;

      if (cw_analyze (data, mol, &cond, &an, &error))
        fuzz_check_analysis (&an);
      else
        fuzz_check_error (error, TRUE);
      g_clear_error (&error);
    }
  return 0;
}
