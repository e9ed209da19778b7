/* libFuzzer harness: the SMILES reader (cw_smiles_reader_read on the raw bytes, with their length
 * and no terminating NUL, so an over-read shows). Every molecule read must analyse soundly and
 * survive write → read unchanged (canonical SMILES, canonical numbering). The reader is kept
 * between inputs, so its fast path is exercised too, and a second reader held to the general
 * path must give the same result for every input. */
#include "fuzz-common.h"

#include "cw-smiles-private.h"
#include "cw-smiles.h"

#define MAX_OUT 64

static void
check_round_trip (CwSmilesReader *reader, const CwMolecule *mol)
{
  static CwMolecule back[MAX_OUT];
  g_autoptr (GString) out = g_string_new (NULL);
  g_autoptr (GError) error = NULL;
  g_autofree char *spec = cw_molecule_dup_spec (mol);
  g_autofree char *spec_back = NULL;
  int n;

  cw_smiles_reader_write (reader, mol, out);
  n = cw_smiles_reader_read (reader, out->str, out->len, back, MAX_OUT, NULL, NULL, &error);
  FUZZ_CHECK (n == 1, "“%s” (from %s) reads back as %d molecules: %s", out->str, spec, n,
              error ? error->message : "");
  spec_back = cw_molecule_dup_spec (&back[0]);
  FUZZ_CHECK (strcmp (spec, spec_back) == 0, "%s → “%s” → %s", spec, out->str, spec_back);
}

int
LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size)
{
  static CwSmilesReader *reader = NULL;
  static CwMolecule mols[MAX_OUT];
  CwData *data = fuzz_data ();
  g_autoptr (GError) error = NULL;
  CwSmilesInfo info;
  int n;

  static CwSmilesReader *general = NULL;
  static CwMolecule       gmols[MAX_OUT];
  g_autoptr (GError) gerror = NULL;
  int gn;

  if (reader == NULL)
    {
      reader = cw_smiles_reader_new (data->groups);
      general = cw_smiles_reader_new (data->groups);
      cw_sm_reader_set_general_only (general, TRUE);
    }
  n = cw_smiles_reader_read (reader, (const char *) bytes, (gssize) size, mols, MAX_OUT, &info, NULL,
                             &error);
  gn = cw_smiles_reader_read (general, (const char *) bytes, (gssize) size, gmols, MAX_OUT, NULL, NULL, &gerror);
  FUZZ_CHECK (n == gn, "fast path %d molecules, general reader %d", n, gn);
  if (n < 0)
    FUZZ_CHECK (strcmp (error->message, gerror->message) == 0, "errors differ: %s / %s", error->message,
                gerror->message);
  for (int i = 0; i < n; i++)
    {
      g_autofree char *a = cw_molecule_dup_spec (&mols[i]);
      g_autofree char *b = cw_molecule_dup_spec (&gmols[i]);
      FUZZ_CHECK (strcmp (a, b) == 0, "molecule %d: %s by the fast path, %s by the general reader", i, a, b);
    }
  if (n < 0)
    {
      fuzz_check_error (error, g_utf8_validate ((const char *) bytes, (gssize) size, NULL));
      FUZZ_CHECK (info.error_pos >= -1 && info.error_pos <= (int) size, "error_pos %d of %zu",
                  info.error_pos, size);
      return 0;
    }
  FUZZ_CHECK (n <= MAX_OUT && info.n_molecules == n, "n %d, info %d", n, info.n_molecules);
  for (int i = 0; i < n; i++)
    {
      CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
      CwAnalysis an;

      FUZZ_CHECK (mols[i].n_subs >= 0 && mols[i].n_subs <= CW_MAX_SUBS, "n_subs %d", mols[i].n_subs);
      if (cw_analyze (data, &mols[i], &cond, &an, &error))
        fuzz_check_analysis (&an);
      else
        fuzz_check_error (error, TRUE);
      g_clear_error (&error);
      check_round_trip (reader, &mols[i]);
    }
  return 0;
}
