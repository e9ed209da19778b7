/* libFuzzer harness: the geometry/Karplus table loader and the SMILES-fragment reader. An
 * accepted table is put to work on a few shipped rings: both chairs, every coupling, the inverse
 * and the reaction geometry must give finite, sane numbers. The same bytes are also read as a
 * group's SMILES fragment. */
#include "cw-couplings.h"
#include "cw-fragment.h"
#include "cw-reactivity.h"
#include "fuzz-common.h"

static const char *specs[] = {
  "1u=hydroxy 4d=tert-butyl",
  "1u=chloro 2u=isopropyl 5d=methyl",
  "1u=tosyloxy 2d=acetoxy 1d=methyl",
};

static void
exercise (const CwGeometryData *gd)
{
  CwData       *data = fuzz_data ();
  CwCouplings  *c = g_new0 (CwCouplings, 1);
  CwReactivity *r = g_new0 (CwReactivity, 1);

  for (gsize k = 0; k < G_N_ELEMENTS (specs); k++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec (specs[k], data->groups, &error);
      double          pop[2] = { 0.3, 0.7 };
      CwInverseResult inv;

      FUZZ_CHECK (mol != NULL, "shipped spec %s", specs[k]);
      if (!cw_couplings_compute (gd, mol, pop, 298.15, NULL, c, &error))
        {
          fuzz_check_error (error, TRUE);
          continue;
        }
      for (int i = 0; i < c->n_vicinal; i++)
        for (int ch = 0; ch < 2; ch++)
          FUZZ_CHECK (isfinite (c->vicinal[i].j[ch]) && fabs (c->vicinal[i].j[ch]) < 1e4, "J %g",
                      c->vicinal[i].j[ch]);
      for (int i = 0; i < c->n_protons; i++)
        {
          g_autofree char *text = cw_multiplet_dup_text (&c->protons[i].multiplet[2]);
          FUZZ_CHECK (text != NULL && text[0] != '\0', "empty multiplet");
        }
      if (c->n_protons > 0 &&
          cw_couplings_solve (gd, c, 0, -1, CLAMP (c->protons[0].width_avg, 0, 100), &inv, &error))
        FUZZ_CHECK (inv.status != CW_INVERSE_OK || (inv.pop[0] >= 0 && inv.pop[0] <= 1), "pop %g", inv.pop[0]);
      g_clear_error (&error);
      if (cw_reactivity_compute (gd, mol, pop, 298.15, r, &error))
        for (int i = 0; i < r->n_groups; i++)
          FUZZ_CHECK (r->groups[i].reactive_fraction >= 0 && r->groups[i].reactive_fraction <= 1 + 1e-12,
                      "fraction %g", r->groups[i].reactive_fraction);
      else
        fuzz_check_error (error, TRUE);
    }
  g_free (c);
  g_free (r);
}

int
LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwGeometryData) gd = NULL;
  g_autofree char *text = NULL;
  gboolean         utf8 = g_utf8_validate ((const char *) bytes, size, NULL);
  CwFragmentInfo   info;

  gd = cw_geometry_data_new_from_data ((const char *) bytes, size, "fuzz.json", &error);
  if (gd == NULL)
    fuzz_check_error (error, utf8);
  else
    exercise (gd);
  g_clear_error (&error);

  text = g_strndup ((const char *) bytes, size);
  if (cw_fragment_parse (text, &info, &error))
    FUZZ_CHECK (info.n_neighbours >= 0 && info.n_neighbours <= CW_FRAGMENT_MAX_NEIGHBOURS &&
                  info.n_hydrogens >= 0 && info.n_hydrogens <= 80,
                "fragment %d neighbours, %d H", info.n_neighbours, info.n_hydrogens);
  else
    fuzz_check_error (error, utf8 && strlen (text) == size);
  return 0;
}
