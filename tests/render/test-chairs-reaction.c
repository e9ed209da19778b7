/* Reaction geometry on the chairs figure (CwRenderOptions.highlight_reactivity), checked on the
 * drawing model against the core's own list of anti-periplanar β-hydrogens. */
#include "config.h"

#include "render-test-util.h"

static CwData         *data;
static CwGeometryData *gd;

/* Ring specs and the anti-periplanar β-hydrogens expected from trans-diaxial geometry (an E2 in a
 * cyclohexane needs the leaving group and the β-H both axial on opposite faces; Barton's rule,
 * common practice). Menthyl chloride is 1u=isopropyl 2d=chloro 4d=methyl (all equatorial in one
 * chair), neomenthyl chloride the 2u epimer (checked with `chairwise-calc reactivity --ring`). */
typedef struct
{
  const char *spec;
  int         n_anti[2]; /* per chair, over every leaving group */
} Case;

static const Case cases[] = {
  /* Menthyl: Cl axial (chair 1, down at C2) has only H-3 up anti; H-1 is equatorial there. */
  { "1u=isopropyl 2d=chloro 4d=methyl", { 1, 0 } },
  /* Neomenthyl: Cl axial in chair 2 with both neighbours' axial H anti (H-1 down, H-3 down). */
  { "1u=isopropyl 2u=chloro 4d=methyl", { 0, 2 } },
  /* trans-1,2-Dibromide: each Br axial in one chair has one ring β-H anti (the other β carbon
   * carries the other Br). */
  { "1u=bromo 2d=bromo", { 2, 0 } },
  /* Both neighbours' axial slots carry methyls: no anti-periplanar β-H anywhere. */
  { "1u=chloro 2d=methyl 6d=methyl", { 0, 0 } },
  /* A deuterium in the anti slot is marked like a hydrogen (an anti E2 would lose D); the
   * tert-butyl group holds Cl axial. */
  { "1u=chloro 2d=deuterio 4u=tert-butyl", { 2, 0 } },
  /* No leaving group at all. */
  { "1u=methyl 3u=methyl", { 0, 0 } },
};

static void
compute (const char *spec, CwMolecule **mol, CwAnalysis *an, CwReactivity *re)
{
  g_autoptr (GError) error = NULL;

  *mol = rt_ring (data, spec);
  rt_analyze (data, *mol, 298.15, an);
  g_assert_true (cw_reactivity_compute (gd, *mol, an->pop, an->temperature, re, &error));
  g_assert_no_error (error);
}

/* The (chair, position, axial) of every ring mark in the scene, as bits: chair*14 + position*2 + axial. */
static guint64
marked (const CwScene *scene, int *n_labels)
{
  guint64 bits = 0;

  *n_labels = 0;
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim *p = cw_scene_get (scene, i);

      if (p->role != CW_ROLE_REACTION_MARK)
        continue;
      g_assert_cmpint (p->chair, >=, 0);
      g_assert_cmpint (p->position, >=, 1);
      if (p->kind == CW_PRIM_MARKER)
        {
          guint64 bit = G_GUINT64_CONSTANT (1) << (p->chair * 14 + p->position * 2 + p->axial);

          g_assert_false (bits & bit); /* each hydrogen ringed once */
          bits |= bit;
        }
      else if (p->kind == CW_PRIM_TEXT)
        {
          g_assert_cmpstr (p->markup, ==, "ap");
          (*n_labels)++;
        }
    }
  return bits;
}

/* The same set from the core: atom indexes into its chair geometry, read back as slots. */
static guint64
expected (const CwReactivity *re, int only_sub, int n_anti[2])
{
  guint64 bits = 0;

  n_anti[0] = n_anti[1] = 0;
  for (int g = 0; g < re->n_groups; g++)
    {
      if (only_sub >= 0 && re->groups[g].sub != only_sub)
        continue;
      for (int ch = 0; ch < 2; ch++)
        for (int j = 0; j < re->groups[g].n_anti[ch]; j++)
          {
            const CwAtom3D *a = &re->geometry[ch].atoms[re->groups[g].anti[ch][j].atom];
            guint64         bit = G_GUINT64_CONSTANT (1) << (ch * 14 + a->position * 2 + a->axial);

            g_assert_cmpint (a->kind, ==, re->groups[g].anti[ch][j].deuterium ? CW_ATOM_SUBSTITUENT : CW_ATOM_HYDROGEN);
            g_assert_cmpint (a->position, ==, re->groups[g].anti[ch][j].position);
            /* Anti-periplanar in a chair means axial (trans-diaxial). */
            g_assert_true (a->axial);
            if (!(bits & bit))
              n_anti[ch]++;
            bits |= bit;
          }
    }
  return bits;
}

/* Heavier bonds for the anti hydrogens and the leaving groups (`only`: that one, -1 every one)
 * than for any other hydrogen, substituent or ring bond: not colour alone. */
static void
check_widths (const CwScene *scene, const CwReactivity *re, int only, guint64 bits)
{
  double h_plain = 0, h_anti = G_MAXDOUBLE, bond_plain = 0, lg_min = G_MAXDOUBLE;

  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim *p = cw_scene_get (scene, i);
      gboolean      lg = FALSE;

      if (p->kind != CW_PRIM_LINE || p->chair < 0)
        continue;
      for (int g = 0; g < re->n_groups; g++)
        lg |= p->sub == re->groups[g].sub && (only < 0 || only == p->sub);
      if (p->role == CW_ROLE_HYDROGEN)
        {
          if ((bits >> (p->chair * 14 + p->position * 2 + p->axial)) & 1)
            h_anti = MIN (h_anti, p->line_width);
          else
            h_plain = MAX (h_plain, p->line_width);
        }
      else if (p->role == CW_ROLE_SUB_BOND && lg)
        lg_min = MIN (lg_min, p->line_width);
      else if (p->role == CW_ROLE_SUB_BOND || p->role == CW_ROLE_RING_BOND)
        bond_plain = MAX (bond_plain, p->line_width);
    }
  g_assert_cmpfloat (h_anti, >, h_plain + 0.5);
  g_assert_cmpfloat (lg_min, >, bond_plain + 0.5);
}

static int
count_role (const CwScene *scene, CwRole role)
{
  int n = 0;

  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    n += cw_scene_get (scene, i)->role == role;
  return n;
}

/* The highlighted hydrogens are exactly the core's anti-periplanar ones, in each chair; the
 * option draws the ring hydrogens; with the option off nothing is marked. */
static void
test_marks (void)
{
  for (guint c = 0; c < G_N_ELEMENTS (cases); c++)
    {
      g_autoptr (CwMolecule) mol = NULL;
      g_autoptr (CwScene) plain = NULL;
      g_autoptr (CwScene) lit = NULL;
      g_autoptr (CwScene) own = NULL;
      g_autofree CwReactivity *re = g_new0 (CwReactivity, 1);
      CwAnalysis               an;
      CwRenderOptions          opt;
      guint64                  want, got;
      int                      n_labels, n_anti[2];

      compute (cases[c].spec, &mol, &an, re);
      cw_render_options_init (&opt);
      g_assert_false (opt.highlight_reactivity);
      g_assert_cmpint (opt.reactivity_sub, ==, -1);
      plain = cw_chairs_build (mol, &an, &opt, 640, 330);
      g_assert_cmpint (count_role (plain, CW_ROLE_REACTION_MARK), ==, 0);
      g_assert_cmpint (count_role (plain, CW_ROLE_HYDROGEN), ==, 0);

      opt.highlight_reactivity = TRUE;
      opt.reactivity = re;
      lit = cw_chairs_build (mol, &an, &opt, 640, 330);
      want = expected (re, -1, n_anti);
      g_assert_cmpint (n_anti[0], ==, cases[c].n_anti[0]);
      g_assert_cmpint (n_anti[1], ==, cases[c].n_anti[1]);
      got = marked (lit, &n_labels);
      if (got != want)
        g_error ("%s: marked %" G_GINT64_MODIFIER "x, core says %" G_GINT64_MODIFIER "x", cases[c].spec, got, want);
      g_assert_cmpint (n_labels, ==, n_anti[0] + n_anti[1]);
      check_widths (lit, re, -1, want);
      /* Every free ring slot gets its hydrogen bond in both chairs (a D is a group). */
      {
        int h_bonds = 0;

        for (guint i = 0; i < cw_scene_get_n (lit); i++)
          h_bonds += cw_scene_get (lit, i)->role == CW_ROLE_HYDROGEN && cw_scene_get (lit, i)->kind == CW_PRIM_LINE;
        g_assert_cmpint (h_bonds, ==, 2 * (12 - mol->n_subs));
      }
      rt_assert_no_text_overlap (lit, cases[c].spec);

      /* Without a reactivity of its own, the figure computes the same from the default table. */
      opt.reactivity = NULL;
      own = cw_chairs_build (mol, &an, &opt, 640, 330);
      g_assert_true (marked (own, &n_labels) == want);
    }
}

/* reactivity_sub narrows the marks to one leaving group. */
static void
test_one_group (void)
{
  g_autoptr (CwMolecule) mol = NULL;
  g_autoptr (CwScene) scene = NULL;
  g_autofree CwReactivity *re = g_new0 (CwReactivity, 1);
  CwAnalysis               an;
  CwRenderOptions          opt;
  int                      n_labels, n_anti[2];
  guint64                  all;

  /* cis-1,3-Dibromide: each Br is axial in one chair, where both its neighbours' axial H are
   * anti; the two bromides' sets differ (C2 is shared). */
  compute ("1u=bromo 3u=bromo", &mol, &an, re);
  g_assert_cmpint (re->n_groups, ==, 2);
  cw_render_options_init (&opt);
  opt.highlight_reactivity = TRUE;
  opt.reactivity = re;
  all = expected (re, -1, n_anti);
  for (int g = 0; g < 2; g++)
    {
      guint64 want;

      opt.reactivity_sub = re->groups[g].sub;
      g_clear_pointer (&scene, cw_scene_free);
      scene = cw_chairs_build (mol, &an, &opt, 640, 330);
      want = expected (re, re->groups[g].sub, n_anti);
      g_assert_true (marked (scene, &n_labels) == want);
      g_assert_true (want != 0 && want != all);
      check_widths (scene, re, re->groups[g].sub, want);
    }
}

/* A reactivity of another molecule (substituent indexes out of range) draws no wrong marks. */
static void
test_stale (void)
{
  g_autoptr (CwMolecule) mol = NULL;
  g_autoptr (CwMolecule) other = NULL;
  g_autoptr (CwScene) scene = NULL;
  g_autofree CwReactivity *re = g_new0 (CwReactivity, 1);
  CwAnalysis               an, an2;
  CwRenderOptions          opt;
  int                      n_labels;

  compute ("1u=methyl 2u=methyl 3d=methyl 4u=chloro", &mol, &an, re);
  g_assert_cmpint (re->n_groups, ==, 1);
  g_assert_cmpint (re->groups[0].sub, ==, 3);
  other = rt_ring (data, "1u=methyl");
  rt_analyze (data, other, 298.15, &an2);
  cw_render_options_init (&opt);
  opt.highlight_reactivity = TRUE;
  opt.reactivity = re;
  scene = cw_chairs_build (other, &an2, &opt, 640, 330);
  g_assert_true (marked (scene, &n_labels) == 0);
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = rt_load_data ();
  gd = test_load_geometry ();
  g_test_add_func ("/render/chairs-reaction/marks", test_marks);
  g_test_add_func ("/render/chairs-reaction/one-group", test_one_group);
  g_test_add_func ("/render/chairs-reaction/stale", test_stale);
  ret = g_test_run ();
  cw_geometry_data_free (gd);
  cw_data_free (data);
  return ret;
}
