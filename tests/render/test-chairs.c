/* The chairs figure's drawing model, checked before it reaches Cairo. */
#include "config.h"

#include "render-test-util.h"

/* Molecules that cover the cases a chemist draws: mono-, cis/trans-di-, tri-, geminal, and
 * every slot filled. */
static const char *const molecules[] = {
  "1u=methyl",
  "1u=methyl 2u=methyl",
  "1u=methyl 2d=methyl",
  "1u=methyl 3u=methyl",
  "1u=methyl 3d=methyl",
  "1u=methyl 4d=methyl",
  "1u=tert-butyl 3u=methyl 4d=methoxycarbonyl",
  "1u=methyl 1d=phenyl",
  "1u=hydroxy 2d=chloro 4u=isopropyl",
  "1u=methyl 1d=ethyl 2u=chloro 2d=fluoro 3u=methyl 3d=hydroxy 4u=methoxy 4d=bromo 5u=cyano 5d=methyl 6u=iodo 6d=vinyl",
};

static const CwPrim *
ring_bond (const CwScene *scene, int chair, int position)
{
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim *p = cw_scene_get (scene, i);

      if (p->role == CW_ROLE_RING_BOND && p->chair == chair && p->position == position)
        return p;
    }
  g_assert_not_reached ();
  return NULL;
}

static double
sin_between (double ax, double ay, double bx, double by)
{
  return fabs (ax * by - ay * bx) / (hypot (ax, ay) * hypot (bx, by));
}

/* Every substituent bond: where the engine put it (axial or equatorial), on its own face,
 * axial bonds vertical, equatorial bonds parallel to the ring bonds one removed. */
static void
check_geometry (const CwScene *scene, const CwMolecule *mol, const CwAnalysis *an)
{
  int seen[2] = { 0, 0 };

  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim        *p = cw_scene_get (scene, i);
      const CwSubstituent *s;
      CwChair3D            c3;
      int                  k;
      double               dx, dy;

      if (p->role != CW_ROLE_SUB_BOND)
        continue;
      g_assert_cmpint (p->chair, >=, 0);
      g_assert_cmpint (p->sub, >=, 0);
      s = &mol->subs[p->sub];
      k = s->position - 1;
      seen[p->chair]++;
      g_assert_true (p->axial == an->chair[p->chair].axial[p->sub]);
      cw_chair3d_build (&c3, p->chair);
      /* The engine's assignment agrees with the chair: axial bonds point to the face of their
       * carbon's pucker, equatorial bonds to the other face (DEVELOPERS.md, the model). */
      if (p->axial)
        g_assert_true ((s->face == CW_FACE_UP) == c3.up[k]);
      else
        g_assert_true ((s->face == CW_FACE_UP) == !c3.up[k]);
      dx = p->x1 - p->x0;
      dy = p->y1 - p->y0;
      if (p->axial)
        {
          g_assert_cmpfloat (fabs (dx), <, 1e-9 * fabs (dy));
          g_assert_true ((dy < 0) == (s->face == CW_FACE_UP));
        }
      else
        {
          const CwPrim *b1 = ring_bond (scene, p->chair, (k + 1) % 6 + 1); /* C(k+2)–C(k+3) */
          const CwPrim *b2 = ring_bond (scene, p->chair, (k + 4) % 6 + 1); /* C(k+5)–C(k+6) */
          double        ex, ey;

          g_assert_cmpfloat (sin_between (dx, dy, b1->x1 - b1->x0, b1->y1 - b1->y0), <, 1e-9);
          g_assert_cmpfloat (sin_between (dx, dy, b2->x1 - b2->x0, b2->y1 - b2->y0), <, 1e-9);
          /* Same sense as the 3D equatorial bond, not its reverse. */
          cw_chair_project (&c3.equatorial[k], cw_chair_azimuth (p->chair), CW_CHAIR_TILT, &ex, &ey);
          g_assert_cmpfloat (ex * dx + ey * dy, >, 0);
        }
    }
  g_assert_cmpint (seen[0], ==, mol->n_subs);
  g_assert_cmpint (seen[1], ==, mol->n_subs);
}

/* Each syn-1,3-diaxial and gauche term has a mark and a label with its energy. */
static void
check_marks (const CwScene *scene, const CwMolecule *mol, const CwAnalysis *an, CwEnergyUnit unit)
{
  for (int c = 0; c < 2; c++)
    for (int t = 0; t < an->chair[c].n_terms; t++)
      {
        const CwTerm    *term = &an->chair[c].terms[t];
        g_autofree char *v = NULL;
        gboolean         mark = FALSE, label = FALSE;

        if (term->kind != CW_TERM_SYN_AXIAL && term->kind != CW_TERM_GAUCHE)
          continue;
        v = g_strdup_printf (unit == CW_UNIT_KJ ? "%.1f" : "%.2f", fabs (cw_energy_from_kcal (term->energy, unit)));
        for (guint i = 0; i < cw_scene_get_n (scene); i++)
          {
            const CwPrim *p = cw_scene_get (scene, i);

            if (p->chair != c || p->sub != term->sub_a)
              continue;
            mark |= p->role == CW_ROLE_INTERACTION && p->kind == CW_PRIM_POLYLINE;
            label |= p->role == CW_ROLE_INTERACTION_LABEL && strstr (p->markup, v) != NULL;
          }
        g_assert_true (mark);
        g_assert_true (label);
      }
}

static void
test_molecules (void)
{
  g_autoptr (CwData) data = rt_load_data ();

  for (guint m = 0; m < G_N_ELEMENTS (molecules); m++)
    for (int variant = 0; variant < 3; variant++)
      {
        g_autoptr (CwMolecule) mol = rt_ring (data, molecules[m]);
        g_autoptr (CwScene) scene = NULL;
        CwRenderOptions  opt;
        CwAnalysis       an;
        g_autofree char *what = g_strdup_printf ("%s, variant %d", molecules[m], variant);

        rt_analyze (data, mol, variant == 2 ? 195.0 : 298.15, &an);
        cw_render_options_init (&opt);
        opt.show_hydrogens = variant == 1;
        opt.unit = variant == 2 ? CW_UNIT_KJ : CW_UNIT_KCAL;
        scene = cw_chairs_build (mol, &an, &opt, 640, 330);
        check_geometry (scene, mol, &an);
        check_marks (scene, mol, &an, opt.unit);
        rt_assert_no_text_overlap (scene, what);
      }
}

/* cis-1,3-Dimethylcyclohexane: the diaxial chair carries U(Me,Me) − A(Me) = 3.7 − 1.74 =
 * 1.96 kcal/mol on its syn-axial mark (Allinger & Miller, J. Am. Chem. Soc. 1961, 83, 2145, from
 * memory, unverified; A(Me) from Booth & Everett 1980), in kJ/mol 8.2. */
static void
test_cis_13_mark (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, "1u=methyl 3u=methyl");
  CwRenderOptions opt;
  CwAnalysis      an;

  rt_analyze (data, mol, 298.15, &an);
  cw_render_options_init (&opt);
  for (int u = 0; u < 2; u++)
    {
      g_autoptr (CwScene) scene = NULL;
      const char *want = u == 0 ? "+1.96" : "+8.2";
      gboolean    found = FALSE;

      opt.unit = u == 0 ? CW_UNIT_KCAL : CW_UNIT_KJ;
      scene = cw_chairs_build (mol, &an, &opt, 640, 330);
      for (guint i = 0; i < cw_scene_get_n (scene); i++)
        {
          const CwPrim *p = cw_scene_get (scene, i);

          if (p->role == CW_ROLE_INTERACTION_LABEL && p->chair == 0 && g_strcmp0 (p->markup, want) == 0)
            found = TRUE;
          /* Chair 2 is diequatorial: no syn-axial mark there. */
          g_assert_false (p->role == CW_ROLE_INTERACTION && p->chair == 1);
        }
      g_assert_true (found);
    }
}

/* The major chair is marked in words and weight, not by colour alone. */
static void
test_major_emphasis (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, "1u=methyl");
  g_autoptr (CwScene) scene = NULL;
  CwRenderOptions opt;
  CwAnalysis      an;
  double          width[2] = { 0, 0 };
  gboolean        major_caption = FALSE;

  rt_analyze (data, mol, 298.15, &an);
  g_assert_cmpint (an.major, ==, 1); /* axial Me in chair 1: chair 2 is the major one */
  cw_render_options_init (&opt);
  scene = cw_chairs_build (mol, &an, &opt, 640, 330);
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim *p = cw_scene_get (scene, i);

      if (p->role == CW_ROLE_RING_BOND)
        width[p->chair] = p->line_width;
      if (p->role == CW_ROLE_CAPTION && p->chair == 1 && p->bold && strstr (p->markup, "major"))
        major_caption = TRUE;
    }
  g_assert_cmpfloat (width[1], >, width[0]);
  g_assert_true (major_caption);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/render/chairs/molecules", test_molecules);
  g_test_add_func ("/render/chairs/cis-1,3-mark", test_cis_13_mark);
  g_test_add_func ("/render/chairs/major-emphasis", test_major_emphasis);
  return g_test_run ();
}
