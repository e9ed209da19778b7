#include "config.h"

#include <math.h>
#include <string.h>

#include "cw-reactivity.h"
#include "test-helpers.h"

static CwData         *data;
static CwGeometryData *gd;

static void
compute (const char *spec, double kelvin, CwReactivity *r, CwAnalysis *an)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = test_ring (data, spec);

  test_analyze (data, spec, kelvin, an);
  g_assert_true (cw_reactivity_compute (gd, mol, an->pop, kelvin, r, &error));
  g_assert_no_error (error);
}

static gboolean
has_warning (const CwReactivity *r, CwReactWarningCode code)
{
  for (int i = 0; i < r->n_warnings; i++)
    if (r->warnings[i].code == code)
      return TRUE;
  return FALSE;
}

static const CwAlkene *
find_alkene (const CwLeavingGroup *lg, int a, int b)
{
  for (int i = 0; i < lg->n_alkenes; i++)
    if (MIN (lg->alkenes[i].position_a, lg->alkenes[i].position_b) == MIN (a, b) &&
        MAX (lg->alkenes[i].position_a, lg->alkenes[i].position_b) == MAX (a, b))
      return &lg->alkenes[i];
  return NULL;
}

/* Menthyl and neomenthyl chloride (2-isopropyl-5-methylcyclohexyl chlorides) with ethoxide:
 * menthyl chloride (Cl, iPr and Me all equatorial in the major chair; Cl axial only in the
 * minor, all-axial chair) eliminates slowly and gives only 2-menthene (the C1=C6 alkene, away
 * from the isopropyl); neomenthyl chloride (Cl axial in the major chair) eliminates some 200
 * times faster and gives mainly 3-menthene (the more substituted C1=C2 alkene) with some
 * 2-menthene. Hughes, Ingold and co-workers, J. Chem. Soc. 1948; from memory, unverified.
 * We check which alkenes are possible from each isomer and which isomer reacts faster. */
static void
test_menthyl_chlorides (void)
{
  CwReactivity          men, neo;
  CwAnalysis            an_men, an_neo;
  const CwLeavingGroup *lm, *ln;
  const CwAlkene       *a12, *a16;

  /* chair 1: C1 and C5 axial up, C2 axial down; so 1d, 2u, 5d are all equatorial in chair 1 */
  compute ("1d=chloro 2u=isopropyl 5d=methyl", 298.15, &men, &an_men);
  compute ("1u=chloro 2u=isopropyl 5d=methyl", 298.15, &neo, &an_neo);
  g_assert_cmpint (men.n_groups, ==, 1);
  g_assert_cmpint (neo.n_groups, ==, 1);
  lm = &men.groups[0];
  ln = &neo.groups[0];

  /* menthyl: Cl axial only in the minor chair; there only H-6 (axial) is anti to it */
  g_assert_cmpint (an_men.major, ==, 0);
  g_assert_false (lm->axial[0]);
  g_assert_true (lm->axial[1]);
  g_assert_cmpint (lm->n_anti[0], ==, 0);
  g_assert_cmpint (lm->n_anti[1], ==, 1);
  g_assert_cmpint (lm->anti[1][0].position, ==, 6);
  g_assert_cmpint (lm->n_alkenes, ==, 1);
  a16 = find_alkene (lm, 1, 6);
  g_assert_nonnull (a16);
  g_assert_cmpint (a16->substitution, ==, 2);
  g_assert_null (find_alkene (lm, 1, 2));
  g_assert_cmpfloat (lm->reactive_fraction, <, 0.05);
  g_assert_true (has_warning (&men, CW_REACT_MINOR_CHAIR));

  /* neomenthyl: Cl axial in the major chair, anti to H-2 and H-6: both alkenes possible */
  g_assert_true (ln->axial[an_neo.major]);
  g_assert_cmpint (ln->n_anti[an_neo.major], ==, 2);
  a12 = find_alkene (ln, 1, 2);
  a16 = find_alkene (ln, 1, 6);
  g_assert_nonnull (a12);
  g_assert_nonnull (a16);
  g_assert_cmpint (a12->substitution, ==, 3);
  g_assert_true (a12->most_substituted);
  g_assert_false (a16->most_substituted);
  g_assert_cmpfloat (ln->reactive_fraction, >, 0.5);
  g_assert_false (has_warning (&neo, CW_REACT_MINOR_CHAIR));

  /* Curtin–Hammett: neomenthyl is the faster by far (observed about 200-fold) */
  g_test_message ("reactive fractions: neomenthyl %.4f, menthyl %.3g (ratio %.0f)",
                  ln->reactive_fraction, lm->reactive_fraction, ln->reactive_fraction / lm->reactive_fraction);
  g_assert_cmpfloat (ln->reactive_fraction, >, 10.0 * lm->reactive_fraction);
}

/* β-1,2,3,4,5,6-Hexachlorocyclohexane (all trans): no chlorine can be anti-periplanar to a
 * β-hydrogen in either chair, and it dehydrochlorinates thousands of times slower than its
 * isomers (Cristol, J. Am. Chem. Soc. 1947; from memory, unverified). */
static void
test_beta_hexachloro (void)
{
  CwReactivity r;
  CwAnalysis   an;

  compute ("1u=chloro 2d=chloro 3u=chloro 4d=chloro 5u=chloro 6d=chloro", 298.15, &r, &an);
  g_assert_cmpint (r.n_groups, ==, 6);
  for (int i = 0; i < r.n_groups; i++)
    {
      g_assert_true (r.groups[i].no_anti_h);
      g_assert_cmpint (r.groups[i].n_alkenes, ==, 0);
      g_assert_cmpfloat (r.groups[i].reactive_fraction, ==, 0.0);
    }
  g_assert_true (has_warning (&r, CW_REACT_NO_ANTI_H));
  /* the γ isomer (lindane), axial on C1–C3 and equatorial on C4–C6 in one chair, has chlorides
   * anti-periplanar to β-hydrogens and eliminates readily (Cristol 1947; from memory, unverified) */
  compute ("1u=chloro 2d=chloro 3u=chloro 4u=chloro 5d=chloro 6u=chloro", 298.15, &r, &an);
  {
    int with_anti = 0;
    for (int i = 0; i < r.n_groups; i++)
      with_anti += !r.groups[i].no_anti_h;
    g_assert_cmpint (with_anti, >, 0);
  }
}

/* Neighbouring groups: trans-2-acetoxycyclohexyl tosylate can put OAc anti-periplanar to OTs
 * (diaxial chair) and reacts with participation; the cis isomer cannot (Winstein and co-workers,
 * J. Am. Chem. Soc. 1948; from memory, unverified). trans-1,2-Dibromide: anti elimination of Br2
 * needs the diaxial chair (common practice). */
static void
test_neighbouring (void)
{
  CwReactivity      r;
  CwAnalysis        an;
  const CwAntiPair *p;

  compute ("1u=tosyloxy 2d=acetoxy", 298.15, &r, &an);
  g_assert_cmpint (r.n_pairs, ==, 1);
  p = &r.pairs[0];
  g_assert_cmpint (p->role, ==, CW_ANTI_PARTICIPATION);
  g_assert_true (p->anti[0]);
  g_assert_false (p->anti[1]);
  g_assert_cmpfloat_with_epsilon (p->fraction, an.pop[0], 1e-12);
  g_assert_false (has_warning (&r, CW_REACT_CIS_NEIGHBOUR));

  compute ("1u=tosyloxy 2u=acetoxy", 298.15, &r, &an);
  g_assert_cmpint (r.n_pairs, ==, 1);
  g_assert_false (r.pairs[0].anti[0] || r.pairs[0].anti[1]);
  g_assert_true (has_warning (&r, CW_REACT_CIS_NEIGHBOUR));

  compute ("1u=bromo 2d=bromo", 298.15, &r, &an);
  g_assert_cmpint (r.n_pairs, ==, 1);
  g_assert_cmpint (r.pairs[0].role, ==, CW_ANTI_ELIMINATION_XY);
  g_assert_true (r.pairs[0].anti[0]);
}

/* A tertiary chloride with a geminal methyl: the methyl's H can always turn anti (exocyclic
 * alkene possible in both chairs); flagged as a tertiary centre. No leaving group: a warning. */
static void
test_exocyclic_and_none (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = test_ring (data, "1u=chloro 1d=methyl");
  g_autofree char *label = NULL;
  CwReactivity     r;
  CwAnalysis       an;
  gboolean         exo = FALSE;

  compute ("1u=chloro 1d=methyl", 298.15, &r, &an);
  for (int i = 0; i < r.groups[0].n_alkenes; i++)
    if (r.groups[0].alkenes[i].position_b == 0)
      {
        exo = TRUE;
        g_assert_true (r.groups[0].alkenes[i].chair_ok[0] && r.groups[0].alkenes[i].chair_ok[1]);
        label = cw_alkene_dup_label (&r.groups[0].alkenes[i], mol);
        g_assert_nonnull (strstr (label, "exocyclic"));
      }
  g_assert_true (exo);
  g_assert_cmpfloat_with_epsilon (r.groups[0].reactive_fraction, 1.0, 1e-12);
  g_assert_true (has_warning (&r, CW_REACT_GEMINAL_LEAVING));
  /* the ring alkenes are trisubstituted: C1 keeps its methyl */
  g_assert_cmpint (find_alkene (&r.groups[0], 1, 2)->substitution, ==, 3);

  /* a deuterio group anti to the chloride counts as a β-hydrogen isotope (the alkene loses D) */
  compute ("1u=chloro 2d=deuterio", 298.15, &r, &an);
  g_assert_cmpint (r.groups[0].n_anti[0], ==, 2);
  g_assert_true (r.groups[0].anti[0][0].deuterium != r.groups[0].anti[0][1].deuterium);
  g_assert_nonnull (find_alkene (&r.groups[0], 1, 2));

  /* a geminal vinyl or formyl C–H is sp2: losing it would make an allene or a ketene, not an
   * E2 alkene (common practice, no source) */
  compute ("1u=iodo 1d=vinyl", 298.15, &r, &an);
  for (int i = 0; i < r.groups[0].n_alkenes; i++)
    g_assert_cmpint (r.groups[0].alkenes[i].position_b, !=, 0);
  compute ("1u=bromo 1d=formyl", 298.15, &r, &an);
  for (int i = 0; i < r.groups[0].n_alkenes; i++)
    g_assert_cmpint (r.groups[0].alkenes[i].position_b, !=, 0);

  compute ("1u=methyl", 298.15, &r, &an);
  g_assert_cmpint (r.n_groups, ==, 0);
  g_assert_true (has_warning (&r, CW_REACT_NO_LEAVING_GROUP));
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  gd = test_load_geometry ();
  g_test_add_func ("/core/reactivity/menthyl-chlorides", test_menthyl_chlorides);
  g_test_add_func ("/core/reactivity/beta-hexachloro", test_beta_hexachloro);
  g_test_add_func ("/core/reactivity/neighbouring", test_neighbouring);
  g_test_add_func ("/core/reactivity/exocyclic", test_exocyclic_and_none);
  ret = g_test_run ();
  cw_geometry_data_free (gd);
  cw_data_free (data);
  return ret;
}
