#include "config.h"

#include "test-helpers.h"

static CwData *data;

static void
check (const char *spec, const char *formula, double mass, double dou)
{
  g_autoptr (CwMolecule) mol = test_ring (data, spec);
  g_autofree char *s = NULL;
  CwFormula f;

  cw_formula_compute (mol, &f);
  s = cw_formula_dup_string (&f);
  g_assert_cmpstr (s, ==, formula);
  g_assert_cmpfloat_with_epsilon (f.molar_mass, mass, 0.002);
  g_assert_cmpfloat_with_epsilon (f.unsaturation, dou, 1e-12);
}

/* Molar masses from the IUPAC/CIAAW abridged standard atomic weights (2021 table: C 12.011,
 * H 1.008, N 14.007, O 15.999, Cl 35.45, Br 79.904; from memory, unverified), summed by hand.
 * Degrees of unsaturation by (2C + 2 + N − H − X)/2 (common practice). */
static void
test_formulas (void)
{
  check ("1u=methyl", "C7H14", 98.189, 1);             /* 7×12.011 + 14×1.008 */
  check ("1u=chloro", "C6H11Cl", 118.604, 1);          /* 72.066 + 11.088 + 35.45 */
  check ("1u=hydroxy", "C6H12O", 100.161, 1);          /* 72.066 + 12.096 + 15.999 */
  check ("1u=phenyl", "C12H16", 160.260, 5);           /* 144.132 + 16.128 */
  check ("1u=cyano", "C7H11N", 109.172, 3);            /* 84.077 + 11.088 + 14.007 */
  check ("1u=methyl 2d=bromo 4u=methoxycarbonyl", "C9H15BrO2", 235.121, 2);
  /* 108.099 + 15.120 + 79.904 + 31.998 */
}

/* C6H12 → 1, C6H8 → 3 (standard formula, common practice). */
static void
test_unsaturation_formula (void)
{
  g_assert_cmpfloat (cw_formula_unsaturation (6, 12, 0, 0), ==, 1);
  g_assert_cmpfloat (cw_formula_unsaturation (6, 8, 0, 0), ==, 3);
  g_assert_cmpfloat (cw_formula_unsaturation (6, 6, 0, 0), ==, 4);
}

static void
test_ions (void)
{
  /* cyclohexylammonium C6H14N+ has the parent amine's single ring */
  check ("1u=ammonio", "C6H14N+", 100.185, 1);
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/formula/formulas", test_formulas);
  g_test_add_func ("/core/formula/unsaturation", test_unsaturation_formula);
  g_test_add_func ("/core/formula/ions", test_ions);
  ret = g_test_run ();
  cw_data_free (data);
  return ret;
}
