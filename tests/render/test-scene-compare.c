/* What the window relies on to redraw a figure only when it changed: comparing two laid-out
 * figures; and texts painted from the layout cache looking as texts laid out afresh. */
#include "config.h"

#include "render-test-util.h"

static const char *const spec = "1u=methoxycarbonyl 2d=bromo 4u=ethyl";

static CwScene *
build (const CwData *data, const CwMolecule *mol, CwFigure fig, double kelvin)
{
  CwAnalysis      an;
  CwRenderOptions opt;

  rt_analyze (data, mol, kelvin, &an);
  cw_render_options_init (&opt);
  return cw_render_figure_scene (fig, data, mol, &an, &opt, 765, 230);
}

static CwPrim *
first_of_kind (CwScene *scene, CwPrimKind kind)
{
  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    if (cw_scene_get (scene, i)->kind == kind)
      return cw_scene_get (scene, i);
  g_assert_not_reached ();
  return NULL;
}

static void
test_equal (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, spec);
  g_autoptr (CwScene) a = build (data, mol, CW_FIGURE_CHAIRS, 298.15);
  g_autoptr (CwScene) b = build (data, mol, CW_FIGURE_CHAIRS, 298.15);
  g_autoptr (CwScene) warmer = build (data, mol, CW_FIGURE_CHAIRS, 348.15);
  CwPrim *line, *text;

  /* The same inputs lay out the same figure. */
  g_assert_true (cw_scene_equal (a, b));
  g_assert_true (cw_scene_equal_within (a, b, 0.0));
  /* 50 K warmer the populations printed under the chairs change: no tolerance hides text. */
  g_assert_false (cw_scene_equal (a, warmer));
  g_assert_false (cw_scene_equal_within (a, warmer, 1e6));

  /* A line moved by less than the tolerance is the same figure, by more it is not. */
  line = first_of_kind (b, CW_PRIM_LINE);
  line->x0 += 1e-4;
  g_assert_false (cw_scene_equal (a, b));
  g_assert_true (cw_scene_equal_within (a, b, 1e-3));
  line->x0 += 1e-2;
  g_assert_false (cw_scene_equal_within (a, b, 1e-3));
  line->x0 = first_of_kind (a, CW_PRIM_LINE)->x0;
  g_assert_true (cw_scene_equal (a, b));

  /* A changed style or text is a different figure whatever the tolerance. */
  line->ink = line->ink == CW_INK_MUTED ? CW_INK_TEXT : CW_INK_MUTED;
  g_assert_false (cw_scene_equal_within (a, b, 1e6));
  line->ink = first_of_kind (a, CW_PRIM_LINE)->ink;
  text = first_of_kind (b, CW_PRIM_TEXT);
  g_free (text->markup);
  text->markup = g_strdup ("changed");
  g_assert_false (cw_scene_equal_within (a, b, 1e6));
  g_assert_false (cw_scene_equal (a, NULL));
  g_assert_true (cw_scene_equal (NULL, NULL));
}

static GBytes *
paint (const CwScene *scene)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 765, 230);
  cairo_t         *cr = cairo_create (surface);
  GBytes          *pixels;

  cw_render_figure_paint (cr, scene, FALSE, 765, 230);
  cairo_destroy (cr);
  cairo_surface_flush (surface);
  pixels = g_bytes_new (cairo_image_surface_get_data (surface),
                        (gsize) cairo_image_surface_get_stride (surface) * 230);
  cairo_surface_destroy (surface);
  return pixels;
}

static void
test_paint_again (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, spec);
  static const CwFigure figs[] = { CW_FIGURE_CHAIRS, CW_FIGURE_PROFILE, CW_FIGURE_SCAN };

  for (guint i = 0; i < G_N_ELEMENTS (figs); i++)
    {
      g_autoptr (CwScene) scene = build (data, mol, figs[i], 248.15);
      g_autoptr (GBytes) first = paint (scene);
      g_autoptr (GBytes) again = NULL;

      /* Other texts push the figure's out of the layout cache: painted again, its texts are
       * laid out afresh. */
      for (int k = 0; k < 1000; k++)
        {
          g_autofree char *other = g_strdup_printf ("%d", k);
          CwTextMetrics    m;

          cw_text_measure (other, 9.5, FALSE, -1, 0, 0, &m);
        }
      again = paint (scene);
      const guchar *p = g_bytes_get_data (first, NULL);
      gsize         n = g_bytes_get_size (first), inked = 0;

      /* Something was drawn besides the background, */
      for (gsize k = 4; k < n; k += 4)
        inked += memcmp (p + k, p, 4) != 0;
      g_assert_cmpuint (inked, >, 1000);
      /* and drawn the same the second time. */
      g_assert_true (g_bytes_equal (first, again));
    }
}

int
main (int argc, char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/render/scene-compare/equal", test_equal);
  g_test_add_func ("/render/scene-compare/paint-again", test_paint_again);
  return g_test_run ();
}
