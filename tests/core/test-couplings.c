#include "config.h"

#include <math.h>
#include <string.h>

#include "cw-couplings.h"
#include "test-helpers.h"

static CwData         *data;
static CwGeometryData *gd;

/* Couplings of a ring at T, with the populations from the engine. */
static void
compute (const char *spec, double kelvin, const char *set, CwCouplings *c, CwAnalysis *an)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = *spec ? test_ring (data, spec) : cw_molecule_new ();
  CwAnalysis local;
  double     pop[2] = { 0.5, 0.5 };

  if (an == NULL)
    an = &local;
  if (*spec)
    {
      test_analyze (data, spec, kelvin, an);
      pop[0] = an->pop[0];
      pop[1] = an->pop[1];
    }
  g_assert_true (cw_couplings_compute (gd, mol, pop, kelvin, set, c, &error));
  g_assert_no_error (error);
}

static const CwVicinalCoupling *
vicinal (const CwCouplings *c, const char *a, const char *b)
{
  int pa = cw_couplings_parse_proton (c, a, NULL), pb = cw_couplings_parse_proton (c, b, NULL);
  int v = cw_couplings_find_vicinal (c, pa, pb);

  g_assert_cmpint (v, >=, 0);
  return &c->vicinal[v];
}

static void
log_proton (const CwCouplings *c, int i)
{
  const CwRingProton *p = &c->protons[i];
  g_autofree char    *label = cw_ring_proton_dup_label (p);

  for (int ch = 0; ch < 3; ch++)
    {
      g_autofree char *m = cw_multiplet_dup_text (&p->multiplet[ch]);
      g_test_message ("%s [%s]: %s, width %.2f Hz", label, ch == 2 ? "avg" : ch ? "chair 2"
                                                                                : "chair 1",
                      m, ch == 2 ? p->width_avg : p->width[ch]);
    }
}

/* The equation itself, worked by hand from its published form and the general parameter set
 * (Haasnoot, de Leeuw & Altona, Tetrahedron 1980, 36, 2783; P1..P7 = 13.70, −0.73, 0, 0.56, −2.47,
 * 16.9°, 0.14): with no substituent J(0°) = P1 + P2 = 12.97 Hz, J(90°) = P3 = 0 and
 * J(180°) = P1 − P2 = 14.43 Hz; one substituent of Δχ = 1.3 at ξ = +1 adds at 60°
 * 1.3·(0.56 − 2.47·cos²(81.97°)) = 1.3·(0.56 − 2.47·0.01951) = 0.6653 Hz (derived by hand).
 * The paper's own numerical examples are not in our hands. */
static void
test_equation (void)
{
  const CwKarplusSet *set = cw_geometry_data_find_set (gd, "general");
  double              dchi = 1.3;
  int                 xi = 1;
  double              base60 = 13.70 * 0.25 - 0.73 * 0.5;

  g_assert_nonnull (set);
  g_assert_cmpfloat_with_epsilon (cw_karplus_coupling (set, 0, NULL, NULL, 0), 12.97, 1e-9);
  g_assert_cmpfloat_with_epsilon (cw_karplus_coupling (set, 90, NULL, NULL, 0), 0.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (cw_karplus_coupling (set, 180, NULL, NULL, 0), 14.43, 1e-9);
  g_assert_cmpfloat_with_epsilon (cw_karplus_coupling (set, 60, &dchi, &xi, 1) - base60, 0.6653, 5e-4);
  xi = -1; /* cos²(−38.03°) = 0.6205, 1.3·(0.56 − 2.47·0.6205) = −1.2643 Hz (by hand) */
  g_assert_cmpfloat_with_epsilon (cw_karplus_coupling (set, 60, &dchi, &xi, 1) - base60, -1.2643, 5e-4);
}

/* Cyclohexane: J(ax,ax) 13.12, J(ax,eq) 3.65, J(eq,eq) 2.96 Hz (Garbisch & Griffith, J. Am. Chem.
 * Soc. 1968; from memory, unverified); the equation fits vicinal couplings to about 0.5–1 Hz
 * (Haasnoot et al. 1980), so we allow 1 Hz. Ranges in rigid cyclohexanes: ax,ax 8–14, ax,eq 2–6,
 * eq,eq 2–5 Hz (Pretsch, Bühlmann & Badertscher, Structure Determination of Organic Compounds,
 * Springer 2009, H,H coupling tables; from memory, unverified). J(ax,eq) > J(eq,eq) is the
 * Booth effect of the ring carbons anti to an equatorial proton: the check on our ξ sign. */
static void
test_cyclohexane (void)
{
  CwCouplings              c;
  const CwVicinalCoupling *aa, *ae, *ee;

  compute ("", 298.15, NULL, &c, NULL);
  g_assert_cmpint (c.n_protons, ==, 12);
  g_assert_cmpint (c.n_vicinal, ==, 24);
  /* chair 1: 1u axial, 2d axial */
  aa = vicinal (&c, "1u", "2d");
  ae = vicinal (&c, "1u", "2u");
  ee = vicinal (&c, "1d", "2u");
  g_test_message ("cyclohexane: J(aa) %.2f, J(ae) %.2f, J(ee) %.2f Hz; torsions %.1f %.1f %.1f",
                  aa->j[0], ae->j[0], ee->j[0], aa->torsion[0], ae->torsion[0], ee->torsion[0]);
  g_assert_cmpfloat_with_epsilon (aa->j[0], 13.12, 1.0);
  g_assert_cmpfloat_with_epsilon (ae->j[0], 3.65, 1.0);
  g_assert_cmpfloat_with_epsilon (ee->j[0], 2.96, 1.0);
  g_assert_cmpfloat (aa->j[0], >=, 8.0);
  g_assert_cmpfloat (aa->j[0], <=, 14.0);
  g_assert_cmpfloat (ae->j[0], >=, 2.0);
  g_assert_cmpfloat (ae->j[0], <=, 6.0);
  g_assert_cmpfloat (ee->j[0], >=, 2.0);
  g_assert_cmpfloat (ee->j[0], <=, 5.0);
  g_assert_cmpfloat (ae->j[0], >, ee->j[0]);
  /* ring inversion: the trans pair is ax,ax in chair 1 and eq,eq in chair 2; averaged at 50:50 */
  g_assert_cmpfloat_with_epsilon (aa->j[1], ee->j[0], 1e-9);
  g_assert_cmpfloat_with_epsilon (aa->j_avg, 0.5 * (aa->j[0] + ee->j[0]), 1e-9);
  /* the three other parameter sets give the same ordering */
  for (const char **id = (const char *[]){ "two", CW_KARPLUS_BY_COUNT, NULL }; *id; id++)
    {
      compute ("", 298.15, *id, &c, NULL);
      aa = vicinal (&c, "1u", "2d");
      ae = vicinal (&c, "1u", "2u");
      ee = vicinal (&c, "1d", "2u");
      g_test_message ("cyclohexane, set %s: J(aa) %.2f, J(ae) %.2f, J(ee) %.2f Hz", *id, aa->j[0],
                      ae->j[0], ee->j[0]);
      g_assert_cmpfloat_with_epsilon (aa->j[0], 13.12, 1.0);
      g_assert_cmpfloat (ae->j[0], >, ee->j[0]);
    }
}

/* trans-4-tert-Butylcyclohexanol (locked, OH equatorial): H-1 is axial, a triplet of triplets with
 * J(ax,ax) about 11 Hz and J(ax,eq) about 4 Hz; cis (OH axial): H-1 equatorial, a narrow multiplet
 * of small couplings, all 2–4 Hz (from memory of the widely reproduced spectra of the two isomers,
 * e.g. in Eliel, Wilen & Mander, Stereochemistry of Organic Compounds, Wiley 1994, ch. 11;
 * unverified). Tolerances: ±1.5 Hz on each, for our idealised geometry. */
static void
test_tert_butylcyclohexanol (void)
{
  CwCouplings         trans, cis;
  CwAnalysis          an;
  const CwRingProton *p;
  int                 h;

  compute ("1u=hydroxy 4d=tert-butyl", 298.15, NULL, &trans, &an);
  g_assert_cmpfloat (an.pop[1], >, 0.999); /* chair 2: both equatorial */
  h = cw_couplings_parse_proton (&trans, "1", NULL);
  g_assert_cmpint (h, >=, 0);
  log_proton (&trans, h);
  p = &trans.protons[h];
  g_assert_true (p->axial[1]);
  g_assert_cmpstr (p->multiplet[2].pattern, ==, "tt");
  g_assert_cmpfloat_with_epsilon (p->multiplet[2].j[0], 11.0, 1.5);
  g_assert_cmpfloat_with_epsilon (p->multiplet[2].j[1], 4.0, 1.5);

  compute ("1d=hydroxy 4d=tert-butyl", 298.15, NULL, &cis, &an);
  g_assert_cmpfloat (an.pop[1], >, 0.99);
  h = cw_couplings_parse_proton (&cis, "1", NULL);
  log_proton (&cis, h);
  p = &cis.protons[h];
  g_assert_false (p->axial[1]);
  for (int i = 0; i < p->multiplet[2].n_j; i++)
    {
      g_assert_cmpfloat (p->multiplet[2].j[i], >=, 2.0 - 1.5);
      g_assert_cmpfloat (p->multiplet[2].j[i], <=, 4.0 + 1.5);
    }
  /* the classical width criterion: an axial carbinol proton is far broader than an equatorial one */
  g_assert_cmpfloat (trans.protons[cw_couplings_parse_proton (&trans, "1", NULL)].width_avg, >,
                     2.0 * p->width_avg);
}

/* First-order multiplet names (common practice, no source): n equal couplings give n + 1 lines,
 * named d, t, q, quint; groups are listed from the largest coupling down, as in "tt, 11.6, 4.1 Hz". */
static void
test_multiplet (void)
{
  struct
  {
    double      j[5];
    int         n;
    const char *text;
  } cases[] = {
    { { 11.6, 4.1, 11.6, 4.1 }, 4, "tt, 11.6, 4.1 Hz" },
    { { 4.0, 12.0 }, 2, "dd, 12.0, 4.0 Hz" },
    { { 11.5, 11.0, 4.0 }, 3, "td, 11.2, 4.0 Hz" },
    { { 12.0, 5.0, 2.0 }, 3, "ddd, 12.0, 5.0, 2.0 Hz" },
    { { 3.0, 3.0, 3.0, 3.0 }, 4, "quint, 3.0 Hz" },
    { { 7.0, 7.0, 7.0 }, 3, "q, 7.0 Hz" },
    { { 0.5 }, 1, "s" },
    { { 0 }, 0, "s" },
    { { 13.0, 11.0, 9.0, 6.5, 4.0 }, 5, "m, 13.0, 11.0, 9.0, 6.5, 4.0 Hz" },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      CwMultiplet      m;
      g_autofree char *text = NULL;

      cw_multiplet_build (cases[i].j, cases[i].n, 1.0, 1.0, &m);
      text = cw_multiplet_dup_text (&m);
      g_assert_cmpstr (text, ==, cases[i].text);
    }
}

/* The averaged-coupling method (Eliel; docs/couplings-and-reactions.md): J_obs = x1·J1 + x2·J2. Fed the averaged
 * width of H-1 of cyclohexanol at the engine's populations, it must return the engine's ΔG°
 * (derived: the method inverts the forward average exactly). */
static void
test_inverse_round_trip (void)
{
  for (const char **spec = (const char *[]){ "1u=hydroxy", "1u=methyl", "1u=bromo", NULL }; *spec; spec++)
    {
      g_autoptr (GError) error = NULL;
      CwCouplings     c;
      CwAnalysis      an;
      CwInverseResult r;
      int             h;

      compute (*spec, 298.15, NULL, &c, &an);
      h = cw_couplings_parse_proton (&c, "1", &error);
      g_assert_no_error (error);
      g_assert_true (cw_couplings_solve (gd, &c, h, -1, c.protons[h].width_avg, &r, &error));
      g_assert_no_error (error);
      g_assert_cmpint (r.status, ==, CW_INVERSE_OK);
      g_assert_cmpfloat_with_epsilon (r.pop[0], an.pop[0], 1e-9);
      g_assert_cmpfloat_with_epsilon (r.delta_g, an.delta_g, 1e-6);
      /* the same through one vicinal coupling that changes between the chairs (H-1 / H-2 trans) */
      {
        int partner = cw_couplings_find_proton (&c, 2, c.protons[h].face == CW_FACE_UP ? CW_FACE_DOWN : CW_FACE_UP);
        int v = cw_couplings_find_vicinal (&c, h, partner);
        g_assert_true (cw_couplings_solve (gd, &c, h, partner, c.vicinal[v].j_avg, &r, &error));
        g_assert_cmpint (r.status, ==, CW_INVERSE_OK);
        g_assert_cmpfloat_with_epsilon (r.delta_g, an.delta_g, 1e-6);
      }
    }
}

/* Measurements the two chairs cannot produce, or cannot tell apart, are named as such. */
static void
test_inverse_limits (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *msg = NULL;
  CwCouplings      c;
  CwInverseResult  r;
  int              h, cis2, far;

  compute ("1u=hydroxy", 298.15, NULL, &c, NULL);
  h = cw_couplings_parse_proton (&c, "1", &error);
  g_assert_no_error (error);
  /* a width beyond four ax,ax couplings */
  g_assert_true (cw_couplings_solve (gd, &c, h, -1, 45.0, &r, &error));
  g_assert_cmpint (r.status, ==, CW_INVERSE_OUTSIDE);
  g_assert_true (isnan (r.delta_g));
  msg = cw_inverse_dup_message (&r, CW_UNIT_KCAL);
  g_assert_nonnull (strstr (msg, "outside"));
  /* just beyond the broader chair, within the tolerance: one chair */
  g_assert_true (cw_couplings_solve (gd, &c, h, -1, r.high + 0.3, &r, &error));
  g_assert_cmpint (r.status, ==, CW_INVERSE_ONE_CHAIR);
  /* H-1 / H-2 cis is axial/equatorial in both chairs, but the OH is anti to H-2 only in chair 1:
   * the Booth effect makes the two chairs differ by about 2 Hz */
  cis2 = cw_couplings_find_proton (&c, 2, c.protons[h].face);
  g_assert_true (cw_couplings_solve (gd, &c, h, cis2, 3.0, &r, &error));
  g_test_message ("cyclohexanol cis H-1/H-2: %.2f and %.2f Hz", r.chair_value[0], r.chair_value[1]);
  g_assert_cmpfloat (r.chair_value[1] - r.chair_value[0], >, 1.0);
  /* far from any substituent, a cis pair is ax,eq in one chair and eq,ax in the other: no information */
  compute ("1u=methyl", 298.15, NULL, &c, NULL);
  g_assert_true (cw_couplings_solve (gd, &c, cw_couplings_find_proton (&c, 3, CW_FACE_UP),
                                     cw_couplings_find_proton (&c, 4, CW_FACE_UP), 3.0, &r, &error));
  g_test_message ("methylcyclohexane cis H-3/H-4: %.2f and %.2f Hz", r.chair_value[0], r.chair_value[1]);
  g_assert_cmpint (r.status, ==, CW_INVERSE_INSENSITIVE);
  g_free (msg);
  msg = cw_inverse_dup_message (&r, CW_UNIT_KCAL);
  g_assert_nonnull (strstr (msg, "cannot"));
  h = cw_couplings_parse_proton (&c, "1", &error);
  /* not vicinal, not a number */
  far = cw_couplings_find_proton (&c, 3, CW_FACE_UP);
  g_assert_false (cw_couplings_solve (gd, &c, h, far, 3.0, &r, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_false (cw_couplings_solve (gd, &c, h, -1, NAN, &r, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_false (cw_couplings_solve (gd, &c, h, -1, -2.0, &r, &error));
  g_clear_error (&error);
}

/* Protons are named by carbon and face; bad names get a message. */
static void
test_proton_names (void)
{
  CwCouplings c;

  compute ("1u=hydroxy", 298.15, NULL, &c, NULL);
  g_assert_cmpint (c.n_protons, ==, 11);
  g_assert_cmpint (cw_couplings_parse_proton (&c, "1", NULL), ==, cw_couplings_find_proton (&c, 1, CW_FACE_DOWN));
  g_assert_cmpint (cw_couplings_parse_proton (&c, "H-2up", NULL), ==, cw_couplings_find_proton (&c, 2, CW_FACE_UP));
  g_assert_cmpint (cw_couplings_parse_proton (&c, "3 d", NULL), ==, cw_couplings_find_proton (&c, 3, CW_FACE_DOWN));
  for (const char **bad = (const char *[]){ "1u", "2", "7", "0d", "2x", "", "12", NULL }; *bad; bad++)
    {
      g_autoptr (GError) error = NULL;
      g_assert_cmpint (cw_couplings_parse_proton (&c, *bad, &error), ==, -1);
      g_assert_nonnull (error);
    }
}

/* Averages are population-weighted at the analysis temperature; a bad set id is refused. */
static void
test_averages (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = test_ring (data, "1u=methyl");
  CwCouplings c;
  double      pop[2] = { 0.25, 0.75 };

  g_assert_true (cw_couplings_compute (gd, mol, pop, 200.0, NULL, &c, &error));
  for (int i = 0; i < c.n_vicinal; i++)
    g_assert_cmpfloat_with_epsilon (c.vicinal[i].j_avg, 0.25 * c.vicinal[i].j[0] + 0.75 * c.vicinal[i].j[1], 1e-12);
  for (int i = 0; i < c.n_protons; i++)
    g_assert_cmpfloat_with_epsilon (c.protons[i].width_avg,
                                    0.25 * c.protons[i].width[0] + 0.75 * c.protons[i].width[1], 1e-9);
  g_assert_false (cw_couplings_compute (gd, mol, pop, 200.0, "nonsense", &c, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
  g_clear_error (&error);
  pop[1] = 0.9;
  g_assert_false (cw_couplings_compute (gd, mol, pop, 200.0, NULL, &c, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  gd = test_load_geometry ();
  g_test_add_func ("/core/couplings/equation", test_equation);
  g_test_add_func ("/core/couplings/cyclohexane", test_cyclohexane);
  g_test_add_func ("/core/couplings/tert-butylcyclohexanol", test_tert_butylcyclohexanol);
  g_test_add_func ("/core/couplings/multiplet", test_multiplet);
  g_test_add_func ("/core/couplings/inverse-round-trip", test_inverse_round_trip);
  g_test_add_func ("/core/couplings/inverse-limits", test_inverse_limits);
  g_test_add_func ("/core/couplings/proton-names", test_proton_names);
  g_test_add_func ("/core/couplings/averages", test_averages);
  ret = g_test_run ();
  cw_geometry_data_free (gd);
  cw_data_free (data);
  return ret;
}
