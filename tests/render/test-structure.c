/* The flat structure's drawing model and the label rules behind every figure. */
#include "config.h"

#include "cw-label.h"
#include "render-test-util.h"

/* Condensed formulas read from the bond side: a group drawn to the left of its bond is written
 * backwards so the attachment atom meets the bond ("MeO₂C–", "Me₂N–", "HO–"; common practice in
 * structure drawings, no source). A two-atom label that would name another group keeps its
 * meaning with an explicit bond (cyano "N≡C–", not the isocyanide "NC–"). */
static void
test_reverse (void)
{
  static const char *const cases[][2] = {
    { "CO<sub>2</sub>Me", "MeO<sub>2</sub>C" },
    { "NMe<sub>2</sub>", "Me<sub>2</sub>N" },
    { "CF<sub>3</sub>", "F<sub>3</sub>C" },
    { "OH", "HO" },
    { "CH<sub>2</sub>OH", "HOH<sub>2</sub>C" },
    { "C≡CH", "HC≡C" },
    { "NO<sub>2</sub>", "O<sub>2</sub>N" },
    { "SiMe<sub>3</sub>", "Me<sub>3</sub>Si" },
    { "NH<sub>3</sub><sup>+</sup>", "H<sub>3</sub>N<sup>+</sup>" },
    { "CO<sub>2</sub><sup>−</sup>", "<sup>−</sup>O<sub>2</sub>C" },
    { "CN", "N≡C" },
    { "Cl", "Cl" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *r = cw_label_reverse_markup (cases[i][0]);
      g_assert_cmpstr (r, ==, cases[i][1]);
    }
  /* Not a formula: placed as one block. */
  g_assert_null (cw_label_reverse_markup ("<i>t</i>Bu"));
}

/* The bond meets the attachment atom: the atom's centre lies on the bond's line, just past its
 * end, whichever side the label is on. */
static void
test_anchor (void)
{
  static const char *const markups[] = { "CO<sub>2</sub>Me", "Me", "NMe<sub>2</sub>", "<i>t</i>Bu", "OH" };

  for (guint m = 0; m < G_N_ELEMENTS (markups); m++)
    for (int a = 0; a < 12; a++)
      {
        double        th = a * G_PI / 6 + 0.1, dx = cos (th), dy = sin (th);
        CwLabelPlace  place;
        CwLabelText   lt = { 0 };
        CwTextMetrics tm;
        double        cx, cy, along, across;

        cw_label_place (markups[m], 12, 100, 100, dx, dy, 30, &place, &lt);
        cw_text_measure (lt.markup, 12, FALSE, 0, lt.atom_start, lt.atom_end, &tm);
        cx = place.box.x + 0.5 * (tm.atom_x0 + tm.atom_x1);
        g_assert_cmpfloat_with_epsilon (cx, place.ax, 1e-9);
        cy = place.ay;
        along = (cx - place.ex) * dx + (cy - place.ey) * dy;
        across = -(cx - 100) * dy + (cy - 100) * dx;
        g_assert_cmpfloat (fabs (across), <, 1e-9);
        g_assert_cmpfloat (along, >, 0);
        /* ...and the bond stops on the edge of the atom's own box, a 0.18 em gap around its
         * letters (cap height 0.73 em), not inside the text and not short of it. */
        {
          double hw = 0.5 * (tm.atom_x1 - tm.atom_x0) + 0.18 * 12, hh = 0.5 * 0.73 * 12 + 0.18 * 12;
          double r = MAX (fabs (place.ex - cx) / hw, fabs (place.ey - cy) / hh);

          g_assert_cmpfloat_with_epsilon (r, 1.0, 1e-9);
        }
        /* The attachment atom sits inside the label's box. */
        g_assert_cmpfloat (cx, >, place.box.x);
        g_assert_cmpfloat (cx, <, place.box.x + place.box.w);
        g_assert_cmpfloat (cy, >, place.box.y);
        g_assert_cmpfloat (cy, <, place.box.y + place.box.h);
        cw_label_text_clear (&lt);
      }
}

/* Up-face groups on solid wedges, down-face groups on hashed wedges, narrow end at the ring. */
static void
test_wedges (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, "1u=methyl 1d=phenyl 2d=chloro 4u=hydroxy");
  g_autoptr (CwScene) scene = NULL;
  CwRenderOptions opt;
  int             n = 0;

  cw_render_options_init (&opt);
  opt.highlight_sub = 2;
  scene = cw_structure_build (mol, &opt, 300, 300);
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim *p = cw_scene_get (scene, i);
      const CwPrim *ring = NULL;

      /* The selected group's label is bold on a highlight patch drawn before it; no other is. */
      if (p->role == CW_ROLE_SUB_LABEL)
        {
          gboolean patch = FALSE;

          for (guint j = 0; j < i; j++)
            {
              const CwPrim *r = cw_scene_get (scene, j);

              patch |= r->kind == CW_PRIM_RECT && r->ink == CW_INK_HIGHLIGHT && r->x0 <= p->box.x &&
                       r->x0 + r->x1 >= p->box.x + p->box.w && r->y0 <= p->box.y &&
                       r->y0 + r->y1 >= p->box.y + p->box.h;
            }
          g_assert_true (p->bold == (p->sub == 2));
          g_assert_true (patch == (p->sub == 2));
        }

      if (p->role != CW_ROLE_SUB_BOND)
        continue;
      n++;
      g_assert_cmpint (p->kind, ==, mol->subs[p->sub].face == CW_FACE_UP ? CW_PRIM_WEDGE : CW_PRIM_HASH);
      for (guint j = 0; j < cw_scene_get_n (scene); j++)
        if (cw_scene_get (scene, j)->role == CW_ROLE_RING_BOND &&
            cw_scene_get (scene, j)->position == mol->subs[p->sub].position)
          ring = cw_scene_get (scene, j);
      g_assert_nonnull (ring);
      /* Ring bond "position" starts at that carbon. */
      g_assert_cmpfloat (hypot (ring->x0 - p->x0, ring->y0 - p->y0), <, 1e-9);
    }
  g_assert_cmpint (n, ==, mol->n_subs);
}

/* Position 1 at the top, then 2…6 clockwise on the page, seen from the up face (the reader's
 * side, where solid wedges point): the same sense as the chairs (test-chair-geometry). */
static void
test_numbering (void)
{
  g_autoptr (CwMolecule) mol = cw_molecule_new ();
  g_autoptr (CwScene) scene = NULL;
  CwRenderOptions opt;
  CwPoint         at[6];
  double          area = 0;

  cw_render_options_init (&opt);
  scene = cw_structure_build (mol, &opt, 300, 300);
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      const CwPrim *p = cw_scene_get (scene, i);

      if (p->role == CW_ROLE_RING_BOND)
        at[p->position - 1] = (CwPoint){ p->x0, p->y0 };
    }
  for (int k = 1; k < 6; k++)
    g_assert_cmpfloat (at[0].y, <, at[k].y);
  for (int k = 0; k < 6; k++)
    area += at[k].x * at[(k + 1) % 6].y - at[(k + 1) % 6].x * at[k].y;
  g_assert_cmpfloat (area, >, 0); /* clockwise on a page whose y grows downwards */
}

/* Every pattern of up to twelve groups (none, up, down or both on each carbon), with long labels:
 * no two labels overlap, and no label sits on a bond. */
static void
test_no_overlaps (void)
{
  static const char *const groups[] = { "trimethylsilyloxy", "methoxycarbonyl", "tert-butyl", "methyl",
                                        "dimethylamino", "trifluoromethyl", "chloro", "hydroxymethyl" };
  g_autoptr (CwData) data = rt_load_data ();
  CwRenderOptions opt;
  int             g = 0;

  cw_render_options_init (&opt);
  for (int pattern = 0; pattern < 4096; pattern++)
    {
      g_autoptr (CwMolecule) mol = cw_molecule_new ();
      g_autoptr (CwScene) scene = NULL;
      g_autofree char *what = NULL;

      for (int k = 0; k < 6; k++)
        {
          int slot = (pattern >> (2 * k)) & 3;

          for (int f = 0; f < 2; f++)
            if (slot & (1 << f))
              {
                const CwGroup *grp = cw_group_table_lookup (data->groups, groups[g++ % G_N_ELEMENTS (groups)]);
                g_assert_nonnull (grp);
                g_assert_true (cw_molecule_set (mol, k + 1, f == 0 ? CW_FACE_UP : CW_FACE_DOWN, grp, NULL));
              }
        }
      scene = cw_structure_build (mol, &opt, 300, 300);
      what = cw_molecule_dup_spec (mol);
      rt_assert_no_text_overlap (scene, what);
      for (guint i = 0; i < cw_scene_get_n (scene); i++)
        {
          const CwPrim *t = cw_scene_get (scene, i);

          if (t->kind != CW_PRIM_TEXT || t->role == CW_ROLE_CAPTION)
            continue;
          for (guint j = 0; j < cw_scene_get_n (scene); j++)
            {
              const CwPrim *b = cw_scene_get (scene, j);

              if ((b->role == CW_ROLE_RING_BOND || b->role == CW_ROLE_SUB_BOND) && !(b->sub >= 0 && b->sub == t->sub) &&
                  cw_segment_hits_box (b->x0, b->y0, b->x1, b->y1, &t->box))
                g_error ("%s: label “%s” lies on a bond", what, t->markup);
            }
        }
    }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/render/structure/reverse", test_reverse);
  g_test_add_func ("/render/structure/anchor", test_anchor);
  g_test_add_func ("/render/structure/wedges", test_wedges);
  g_test_add_func ("/render/structure/numbering", test_numbering);
  g_test_add_func ("/render/structure/no-overlaps", test_no_overlaps);
  return g_test_run ();
}
