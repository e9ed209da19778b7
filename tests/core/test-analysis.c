#include "config.h"

#include <math.h>
#include <string.h>

#include "test-helpers.h"

static CwData *data;

/* Temperatures: 298.15 K is the standard temperature (25 °C) of thermochemical tables
 * (IUPAC standard state convention, common practice). */

/* Methylcyclohexane is about 95 % equatorial at 25 °C (A(Me) 1.74 kcal/mol: Booth & Everett,
 * J. Chem. Soc., Perkin Trans. 2 1980, 255; the 95 % figure is common practice, no source). */
static void
test_methyl (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=methyl", 298.15, &an);
  g_assert_cmpint (an.major, ==, 1);           /* chair 2: C1 up is equatorial there */
  g_assert_false (an.chair[1].axial[0]);
  g_assert_cmpfloat (an.pop[1], >, 0.94);
  g_assert_cmpfloat (an.pop[1], <, 0.96);
  g_assert_cmpfloat_with_epsilon (an.delta_g, -1.74, 0.02);
  /* σ(A(Me)) = half the 1.70–1.80 range (Eliel, Wilen & Mander 1994, Table 11.7; from memory) */
  g_assert_cmpfloat_with_epsilon (an.sigma, 0.05, 1e-9);
  g_assert_cmpfloat (an.pop_low[1], <, an.pop[1]);
  g_assert_cmpfloat (an.pop_high[1], >, an.pop[1]);
}

/* tert-Butylcyclohexane: more than 99.9 % equatorial (A ≈ 4.7–5.4, Eliel, Wilen & Mander 1994,
 * Table 11.7; from memory, unverified); its better chair is unstrained: no twist-boat flag. */
static void
test_tert_butyl (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=tert-butyl", 298.15, &an);
  g_assert_cmpfloat (an.pop[an.major], >, 0.999);
  g_assert_false (cw_analysis_has_flag (&an, CW_FLAG_TWIST_BOAT));
}

/* cis-1,3-Dimethylcyclohexane: diaxial − diequatorial ≈ 5.4–5.5 kcal/mol (Allinger & Miller,
 * J. Am. Chem. Soc. 1961, 83, 2145; from memory, unverified). */
static void
test_cis_1_3_dimethyl (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=methyl 3u=methyl", 298.15, &an);
  g_assert_true (an.chair[0].axial[0] && an.chair[0].axial[1]);
  g_assert_cmpfloat (-an.delta_g, >=, 5.35);
  g_assert_cmpfloat (-an.delta_g, <=, 5.55);
}

/* trans-1,2-Dimethylcyclohexane: diequatorial favoured by about 2.6–2.7 kcal/mol
 * (2 × A(Me) − one butane gauche; SCIENCE notes, common practice). */
static void
test_trans_1_2_dimethyl (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=methyl 2d=methyl", 298.15, &an);
  g_assert_cmpfloat (-an.delta_g, >=, 2.55);
  g_assert_cmpfloat (-an.delta_g, <=, 2.75);
  g_assert_false (an.chair[1].axial[0] || an.chair[1].axial[1]);
}

/* cis-1,2- and cis-1,4-dimethylcyclohexane: both chairs equal by symmetry, K = 1 exactly
 * (textbook conformational analysis, common practice). cis-1,2: enantiomeric chairs. */
static void
test_symmetric (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=methyl 2u=methyl", 298.15, &an);
  g_assert_cmpfloat (an.K, ==, 1.0);
  g_assert_cmpfloat (an.sigma, ==, 0.0);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_MIRROR_CHAIRS));
  test_analyze (data, "1u=methyl 4u=methyl", 298.15, &an);
  g_assert_cmpfloat (an.K, ==, 1.0);
  g_assert_cmpfloat (an.pop[0], ==, 0.5);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_IDENTICAL_CHAIRS));
  test_analyze (data, "1u=methyl 1d=methyl", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_IDENTICAL_CHAIRS));
  /* trans-1,4 is not symmetric between its chairs */
  test_analyze (data, "1u=methyl 4d=methyl", 298.15, &an);
  g_assert_false (cw_analysis_has_flag (&an, CW_FLAG_IDENTICAL_CHAIRS) ||
                  cw_analysis_has_flag (&an, CW_FLAG_MIRROR_CHAIRS));
  g_assert_cmpfloat_with_epsilon (fabs (an.delta_g), 2 * 1.74, 0.02);
}

/* 1-Methyl-1-phenylcyclohexane prefers the axial-phenyl chair by about 0.32 kcal/mol although
 * A(Ph) > A(Me) (Carey & Sundberg, Advanced Organic Chemistry A, 5th ed., ch. 2; primary
 * source believed Eliel & Manoharan, J. Org. Chem. 1981; from memory, unverified). */
static void
test_geminal_methyl_phenyl (void)
{
  CwAnalysis an;
  int ph_axial_chair;

  test_analyze (data, "1u=phenyl 1d=methyl", 298.15, &an);
  ph_axial_chair = an.chair[0].axial[0] ? 0 : 1; /* subs sorted: phenyl (up) first */
  g_assert_cmpint (an.major, ==, ph_axial_chair);
  g_assert_cmpfloat_with_epsilon (fabs (an.delta_g), 0.32, 0.02);
}

/* Isopropyl: ΔH° = −1.52 kcal/mol, ΔS° = +2.31 cal/(mol K) (Booth & Everett 1980, published,
 * read): A(300 K) = 1.52 + 0.300 × 2.31 = 2.213, A(200 K) = 1.982. */
static void
test_temperature_dependence (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=isopropyl", 300, &an);
  g_assert_cmpfloat_with_epsilon (-an.delta_g, 2.213, 1e-3);
  g_assert_true (an.chair[0].terms[0].temperature_dependent);
  test_analyze (data, "1u=isopropyl", 200, &an);
  g_assert_cmpfloat_with_epsilon (-an.delta_g, 1.982, 1e-3);
  /* tert-butyl has no ΔH°/ΔS° in the table: held constant, and said so */
  test_analyze (data, "1u=tert-butyl", 200, &an);
  g_assert_cmpfloat_with_epsilon (-an.delta_g, 4.9, 1e-9);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_CONSTANT_A));
}

/* OH: 0.52–0.60 aprotic, 0.87–1.0 protic (Eliel, Wilen & Mander 1994, Table 11.7; from memory). */
static void
test_solvent (void)
{
  g_autoptr (CwMolecule) mol = test_ring (data, "1u=hydroxy");
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
  CwAnalysis an;

  g_assert_true (cw_analyze (data, mol, &cond, &an, NULL));
  g_assert_cmpfloat_with_epsilon (-an.delta_g, 0.6, 1e-9);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_SOLVENT_SENSITIVE));
  cond.solvent = CW_SOLVENT_PROTIC;
  g_assert_true (cw_analyze (data, mol, &cond, &an, NULL));
  g_assert_cmpfloat_with_epsilon (-an.delta_g, 0.9, 1e-9);
}

/* Known failures of additivity are flagged (SCIENCE notes §2; trans-1,2-dihalides: diaxial chair
 * heavily populated in nonpolar media, common practice). */
static void
test_additivity_flags (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=chloro 2d=chloro", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_POLAR_VICINAL));
  test_analyze (data, "1u=bromo 4d=bromo", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_DIHALIDE_1_4));
  test_analyze (data, "1u=hydroxy 3u=methoxy", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_HBOND_1_3));
  test_analyze (data, "1u=isopropyl 1d=methyl", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_GEMINAL_NONADDITIVE));
  /* a geminal pair with an aryl group but a tabulated correction (methyl/phenyl in
   * data/interactions.json) is additive by the model: no flag, in either order of the groups */
  test_analyze (data, "1u=phenyl 1d=methyl", 298.15, &an);
  g_assert_false (cw_analysis_has_flag (&an, CW_FLAG_GEMINAL_NONADDITIVE));
  {
    /* with both kinds of geminal pair, only the untabulated one (on C4) is flagged */
    g_autoptr (CwMolecule) mol = test_ring (data, "1u=methyl 1d=phenyl 4u=isopropyl 4d=methyl");
    CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
    int          n = 0;

    g_assert_true (cw_analyze (data, mol, &cond, &an, NULL));
    for (int k = 0; k < an.n_flags; k++)
      if (an.flags[k].code == CW_FLAG_GEMINAL_NONADDITIVE)
        {
          g_assert_cmpint (mol->subs[an.flags[k].sub_a].position, ==, 4);
          g_assert_cmpint (mol->subs[an.flags[k].sub_b].position, ==, 4);
          n++;
        }
    g_assert_cmpint (n, ==, 1);
  }
  test_analyze (data, "1u=chloro 3u=bromo", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_ESTIMATED_TERM));
  /* the message counts the estimated pairs: data/interactions.json has no term for at least two
   * of this molecule's pairs (nitro/azido among them), so the fall-back rule is used twice */
  {
    g_autoptr (CwMolecule) mol = test_ring (data, "1u=nitro 2d=azido 3d=cyano");
    CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
    g_assert_true (cw_analyze (data, mol, &cond, &an, NULL));
    for (int k = 0; k < an.n_flags; k++)
      if (an.flags[k].code == CW_FLAG_ESTIMATED_TERM)
        {
          g_autofree char *msg = cw_flag_dup_message (&an.flags[k], mol, CW_UNIT_KCAL);
          g_assert_cmpfloat (an.flags[k].value, >=, 2);
          g_assert_nonnull (strstr (msg, "other pair"));
        }
  }
  /* methylcyclohexane raises none of these */
  test_analyze (data, "1u=methyl", 298.15, &an);
  g_assert_false (cw_analysis_has_flag (&an, CW_FLAG_POLAR_VICINAL) ||
                  cw_analysis_has_flag (&an, CW_FLAG_ESTIMATED_TERM) ||
                  cw_analysis_has_flag (&an, CW_FLAG_TWIST_BOAT));
}

/* trans-1,3-Di-tert-butylcyclohexane must put one tBu axial in either chair: known to prefer
 * twist-boat forms (Eliel, Wilen & Mander 1994, ch. 11; from memory, unverified). */
static void
test_twist_boat_flag (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=tert-butyl 3d=tert-butyl", 298.15, &an);
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_TWIST_BOAT));
  test_analyze (data, "1u=tert-butyl 4u=tert-butyl", 298.15, &an); /* cis-1,4 likewise */
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_TWIST_BOAT));
  test_analyze (data, "1u=tert-butyl 3u=tert-butyl", 298.15, &an); /* cis-1,3: diequatorial, fine */
  g_assert_false (cw_analysis_has_flag (&an, CW_FLAG_TWIST_BOAT));
}

/* Every term carries a source, and the chair energy is the sum of its terms. */
static void
test_terms_sum (void)
{
  CwAnalysis an;

  test_analyze (data, "1u=methyl 2d=ethyl 3u=chloro 4d=phenyl 5u=hydroxy 6d=cyano", 298.15, &an);
  for (int c = 0; c < 2; c++)
    {
      double sum = 0;
      for (int k = 0; k < an.chair[c].n_terms; k++)
        {
          g_assert_nonnull (an.chair[c].terms[k].source);
          g_assert_cmpuint (strlen (an.chair[c].terms[k].source), >, 0);
          sum += an.chair[c].terms[k].energy;
        }
      g_assert_cmpfloat_with_epsilon (sum, an.chair[c].energy, 1e-12);
    }
  g_assert_cmpfloat (an.sigma, >, 0);
  g_assert_cmpfloat_with_epsilon (an.pop[0] + an.pop[1], 1.0, 1e-12);
}

/* Rates never exceed the Eyring prefactor kB·T/h (CODATA 2018), however strained a chair is. */
static void
test_rate_ceiling (void)
{
  const double temps[] = { 1, 77, 298.15, 1000 };
  CwAnalysis an;

  for (gsize i = 0; i < G_N_ELEMENTS (temps); i++)
    {
      double ceiling = CW_KB * temps[i] / CW_H_PLANCK;
      test_analyze (data, "1u=tert-butyl 3u=tert-butyl 5u=tert-butyl", temps[i], &an);
      g_assert_cmpfloat (an.k_forward, <=, ceiling * (1 + 1e-12));
      g_assert_cmpfloat (an.k_reverse, <=, ceiling * (1 + 1e-12));
      g_assert_cmpfloat (an.barrier, >=, fabs (an.delta_g));
    }
}

static void
test_bad_input (void)
{
  g_autoptr (CwMolecule) mol = test_ring (data, "1u=methyl");
  CwConditions cond = { 0, CW_SOLVENT_APROTIC };
  g_autoptr (GError) error = NULL;
  CwAnalysis an;

  g_assert_false (cw_analyze (data, mol, &cond, &an, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
  g_clear_error (&error);
  cond.temperature = NAN;
  g_assert_false (cw_analyze (data, mol, &cond, &an, &error));
  g_clear_error (&error);
  cond.temperature = 298.15;
  /* three groups on one carbon cannot be built through the API; forge one */
  mol->subs[1] = mol->subs[0];
  mol->subs[1].face = CW_FACE_DOWN;
  mol->subs[2] = mol->subs[0];
  mol->n_subs = 3;
  g_assert_false (cw_analyze (data, mol, &cond, &an, &error));
  g_assert_nonnull (strstr (error->message, "more than two"));
}

/* The batch's variant without rate constants gives the same equilibrium, bit for bit
 * (methylcyclohexane 95 % equatorial at 25 °C, as test_methyl checks against its source). */
static void
test_equilibrium_only (void)
{
  static const char *const specs[] = { "1u=methyl", "1u=methyl 3u=methyl", "1u=tert-butyl 4d=hydroxy",
                                       "1u=methyl 1d=phenyl", "1u=chloro 2d=bromo", "1u=methyl 2u=methyl 4u=ethyl" };
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };

  for (guint i = 0; i < G_N_ELEMENTS (specs); i++)
    {
      g_autoptr (CwMolecule) mol = test_ring (data, specs[i]);
      CwAnalysis full, eq;
      g_assert_true (cw_analyze (data, mol, &cond, &full, NULL));
      g_assert_true (cw_analyze_equilibrium (data, mol, &cond, &eq, NULL));
      g_assert_cmpfloat (full.delta_g, ==, eq.delta_g);
      g_assert_cmpfloat (full.sigma, ==, eq.sigma);
      g_assert_cmpfloat (full.K, ==, eq.K);
      g_assert_cmpfloat (full.pop[0], ==, eq.pop[0]);
      g_assert_cmpfloat (full.pop_low[1], ==, eq.pop_low[1]);
      g_assert_cmpint (full.major, ==, eq.major);
      g_assert_cmpint (full.n_flags, ==, eq.n_flags);
      for (int k = 0; k < full.n_flags; k++)
        g_assert_cmpint (full.flags[k].code, ==, eq.flags[k].code);
      g_assert_true (isnan (eq.k_forward) && isnan (eq.k_reverse));
      g_assert_cmpfloat (full.chair[0].energy, ==, eq.chair[0].energy);
      g_assert_cmpfloat (full.chair[1].energy, ==, eq.chair[1].energy);
      g_assert_cmpint (eq.chair[0].n_terms + eq.chair[1].n_terms, ==, 0);
      g_assert_cmpfloat (full.k_forward, >, 0);
    }
  {
    g_autoptr (CwMolecule) mol = test_ring (data, "1u=methyl");
    CwAnalysis eq;
    g_assert_true (cw_analyze_equilibrium (data, mol, &cond, &eq, NULL));
    /* about 95 % equatorial at 25 °C: the figure and sources of test_methyl above */
    g_assert_cmpfloat_with_epsilon (MAX (eq.pop[0], eq.pop[1]), 0.95, 0.01);
  }
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/analysis/methyl", test_methyl);
  g_test_add_func ("/core/analysis/equilibrium-only", test_equilibrium_only);
  g_test_add_func ("/core/analysis/tert-butyl", test_tert_butyl);
  g_test_add_func ("/core/analysis/cis-1,3-dimethyl", test_cis_1_3_dimethyl);
  g_test_add_func ("/core/analysis/trans-1,2-dimethyl", test_trans_1_2_dimethyl);
  g_test_add_func ("/core/analysis/symmetric", test_symmetric);
  g_test_add_func ("/core/analysis/geminal-methyl-phenyl", test_geminal_methyl_phenyl);
  g_test_add_func ("/core/analysis/temperature", test_temperature_dependence);
  g_test_add_func ("/core/analysis/solvent", test_solvent);
  g_test_add_func ("/core/analysis/additivity-flags", test_additivity_flags);
  g_test_add_func ("/core/analysis/twist-boat", test_twist_boat_flag);
  g_test_add_func ("/core/analysis/terms-sum", test_terms_sum);
  g_test_add_func ("/core/analysis/rate-ceiling", test_rate_ceiling);
  g_test_add_func ("/core/analysis/bad-input", test_bad_input);
  ret = g_test_run ();
  cw_data_free (data);
  return ret;
}
