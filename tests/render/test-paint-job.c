/* Figures painted on the worker thread (what the window shows after an edit) look exactly
 * as figures painted where they are asked for, and jobs can be dropped at any point. */
#include "config.h"

#include "cw-paint-job.h"
#include "render-test-util.h"

static const char *const spec = "1u=methoxycarbonyl 2d=bromo 4u=ethyl";

/* A figure, the box it is painted into, at scale pixels per unit, light or dark. */
typedef struct
{
  CwFigure fig;
  int      width, height, scale;
  gboolean dark;
} Case;

static CwScene *
build (const CwData *data, const CwMolecule *mol, CwFigure fig, int width, int height)
{
  CwAnalysis      an;
  CwRenderOptions opt;

  /* 298.15 K: the standard temperature of thermochemical tables (common practice, no
   * source needed); no result is checked here, only how the figure is painted. */
  rt_analyze (data, mol, 298.15, &an);
  cw_render_options_init (&opt);
  return cw_render_figure_scene (fig, data, mol, &an, &opt, width, height);
}

/* Number of pixels that differ. */
static guint
n_different (cairo_surface_t *a, cairo_surface_t *b)
{
  int     w = cairo_image_surface_get_width (a), h = cairo_image_surface_get_height (a);
  int     sa = cairo_image_surface_get_stride (a), sb = cairo_image_surface_get_stride (b);
  guint   n = 0;
  guchar *pa = cairo_image_surface_get_data (a), *pb = cairo_image_surface_get_data (b);

  g_assert_cmpint (w, ==, cairo_image_surface_get_width (b));
  g_assert_cmpint (h, ==, cairo_image_surface_get_height (b));
  for (int y = 0; y < h; y++)
    for (int x = 0; x < w; x++)
      {
        guint32 u = ((guint32 *) (pa + y * sa))[x] & 0xffffff, v = ((guint32 *) (pb + y * sb))[x] & 0xffffff;

        n += u != v;
      }
  return n;
}

/* Fraction of pixels that are not the figure's background (the top-left pixel). */
static double
busy (cairo_surface_t *image)
{
  int     w = cairo_image_surface_get_width (image), h = cairo_image_surface_get_height (image);
  int     stride = cairo_image_surface_get_stride (image);
  guchar *p = cairo_image_surface_get_data (image);
  guint32 bg = ((guint32 *) p)[0] & 0xffffff;
  guint   n = 0;

  for (int y = 0; y < h; y++)
    for (int x = 0; x < w; x++)
      n += (((guint32 *) (p + y * stride))[x] & 0xffffff) != bg;
  return (double) n / (w * h);
}

/* The job's image is a real drawing of the size asked for, pixel for pixel what scene painted
 * here gives: the worker's own fonts and text caches draw what this thread's would. Its scene
 * comes back equal to scene. */
static void
check_job (CwPaintJob *job, const CwScene *scene, const Case *c)
{
  cairo_surface_t *image = cw_paint_job_wait (job);
  cairo_surface_t *here;
  g_autoptr (CwScene) back = NULL;

  g_assert_nonnull (image);
  g_assert_cmpint (cairo_image_surface_get_width (image), ==, c->width * c->scale);
  g_assert_cmpint (cairo_image_surface_get_height (image), ==, c->height * c->scale);
  g_assert_cmpfloat (busy (image), >, 0.01);
  here = cw_render_figure_image (scene, c->dark, c->width, c->height, c->scale);
  g_assert_cmpuint (n_different (image, here), ==, 0);
  cairo_surface_destroy (here);
  back = cw_paint_job_steal_scene (job);
  g_assert_true (cw_scene_equal (back, scene));
}

static void
test_same_pixels (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, spec);
  static const Case cases[] = {
    { CW_FIGURE_CHAIRS, 765, 230, 1, FALSE },
    { CW_FIGURE_PROFILE, 765, 120, 1, FALSE },
    { CW_FIGURE_SCAN, 500, 200, 1, TRUE },
    { CW_FIGURE_CHAIRS, 400, 150, 2, TRUE },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      CwScene *scene = build (data, mol, cases[i].fig, cases[i].width, cases[i].height);
      g_autoptr (CwScene) again = build (data, mol, cases[i].fig, cases[i].width, cases[i].height);
      g_autoptr (CwPaintJob) job = cw_paint_job_start (scene, cases[i].dark, cases[i].width, cases[i].height, cases[i].scale);

      check_job (job, again, &cases[i]);
    }
}

/* A figure laid out on the worker as well: the same scene and pixels as laid out and painted
 * here. */
static void
test_figure_job (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, spec);
  g_autoptr (CwMolecule) bare = cw_molecule_new ();
  g_autofree CwAnalysis *an = g_new0 (CwAnalysis, 1);
  static const Case      cases[] = {
         { CW_FIGURE_CHAIRS, 640, 260, 1, FALSE },
         { CW_FIGURE_PROFILE, 700, 140, 2, TRUE },
         { CW_FIGURE_SCAN, 420, 180, 1, FALSE },
  };

  /* 298.15 K: as in build() above. */
  rt_analyze (data, mol, 298.15, an);
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      CwRenderOptions opt;
      g_autoptr (CwScene) here = NULL;
      g_autoptr (CwPaintJob) job = NULL;

      cw_render_options_init (&opt);
      opt.dark = cases[i].dark;
      job = cw_paint_job_start_figure (cases[i].fig, data, mol, an, &opt, cases[i].width, cases[i].height, cases[i].scale);
      here = cw_render_figure_scene (cases[i].fig, data, mol, an, &opt, cases[i].width, cases[i].height);
      check_job (job, here, &cases[i]);
    }

  /* A box too small to draw in: no scene and no image, and no failure. */
  {
    CwRenderOptions opt;
    g_autoptr (CwPaintJob) job = NULL;

    cw_render_options_init (&opt);
    job = cw_paint_job_start_figure (CW_FIGURE_CHAIRS, data, bare, an, &opt, 1, 1, 1);
    g_assert_null (cw_paint_job_wait (job));
    g_assert_null (cw_paint_job_steal_scene (job));
  }
}

/* A figure job works on copies of the molecule, the analysis and the reaction geometry: the
 * caller may change or free its own as soon as the job is started (a window does, at its
 * next edit). The worker is kept busy first, so that the job runs only after the caller's
 * copies have been wiped; it still lays out the figure of the inputs as they were. */
static void
test_figure_job_copies (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) kept_mol = rt_ring (data, spec);
  CwMolecule              *mol = rt_ring (data, spec);
  CwAnalysis              *an = g_new0 (CwAnalysis, 1);
  CwReactivity            *react = g_new0 (CwReactivity, 1);
  g_autofree CwAnalysis   *kept_an = NULL;
  g_autofree CwReactivity *kept_react = NULL;
  const CwGeometryData    *gd = cw_render_default_geometry (NULL);
  /* As in build() above. */
  CwConditions    cond = { 298.15, CW_SOLVENT_APROTIC };
  CwRenderOptions opt;
  CwPaintJob     *busy_job, *job;
  g_autoptr (CwScene) here = NULL;
  static const Case c = { CW_FIGURE_CHAIRS, 640, 260, 1, FALSE };

  g_assert_nonnull (gd);
  rt_analyze (data, mol, 298.15, an);
  g_assert_true (cw_reactivity_compute (gd, mol, an->pop, an->temperature, react, NULL));
  kept_an = g_memdup2 (an, sizeof *an);
  kept_react = g_memdup2 (react, sizeof *react);
  cw_render_options_init (&opt);
  opt.highlight_reactivity = TRUE;
  opt.reactivity_sub = -1;
  opt.reactivity = react;

  busy_job = cw_paint_job_warm_up_figures (data, mol, &cond, 2);
  job = cw_paint_job_start_figure (c.fig, data, mol, an, &opt, c.width, c.height, c.scale);
  memset (an, 0xff, sizeof *an);
  memset (react, 0, sizeof *react);
  g_free (an);
  g_free (react);
  cw_molecule_free (mol);

  opt.reactivity = kept_react;
  here = cw_render_figure_scene (c.fig, data, kept_mol, kept_an, &opt, c.width, c.height);
  g_assert_nonnull (here);
  check_job (job, here, &c);
  cw_paint_job_free (job);
  cw_paint_job_free (busy_job);
}

/* Jobs dropped before, while and after they run; the ones kept still finish. */
static void
test_drop (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  g_autoptr (CwMolecule) mol = rt_ring (data, spec);
  CwPaintJob *kept[4];
  /* As in build() above. */
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };

  for (int round = 0; round < 20; round++)
    {
      for (int k = 0; k < 4; k++)
        {
          CwPaintJob *dropped = cw_paint_job_start (build (data, mol, CW_FIGURE_PROFILE, 300, 100), FALSE, 300, 100, 1);

          kept[k] = cw_paint_job_start (build (data, mol, CW_FIGURE_CHAIRS, 300, 120), FALSE, 300, 120, 1);
          if (k % 2 == 0)
            g_usleep (200);
          cw_paint_job_free (dropped);
        }
      cw_paint_job_free (cw_paint_job_warm_up_figures (data, mol, &cond, 1));
      for (int k = 0; k < 4; k++)
        {
          g_assert_nonnull (cw_paint_job_wait (kept[k]));
          cw_paint_job_free (kept[k]);
        }
    }
  cw_paint_job_free (NULL);
}

/* Jobs are not left running on the tables they borrow: once such a job is freed, the tables
 * can go (AddressSanitizer and valgrind would see the worker read freed memory). Each job is
 * freed a little later than the one before, so that some are freed while they run. */
static void
test_drop_borrowed (void)
{
  g_autoptr (CwData) data = rt_load_data ();
  /* As in build() above. */
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };

  for (int round = 0; round < 40; round++)
    {
      CwData         *tables = rt_load_data ();
      CwMolecule     *mol = rt_ring (tables, spec);
      CwAnalysis     *an = g_new0 (CwAnalysis, 1);
      CwRenderOptions opt;
      CwPaintJob     *job;

      rt_analyze (tables, mol, 298.15, an);
      cw_render_options_init (&opt);
      job = cw_paint_job_start_figure (CW_FIGURE_CHAIRS, tables, mol, an, &opt, 500, 200, 1);
      /* The job has its own molecule and analysis. */
      cw_molecule_free (mol);
      g_free (an);
      g_usleep (round * 50);
      cw_paint_job_free (job);
      cw_data_free (tables);
    }
  for (int round = 0; round < 10; round++)
    {
      CwMolecule *mol = rt_ring (data, spec);
      CwPaintJob *job = cw_paint_job_warm_up_figures (data, mol, &cond, 1);

      /* The warm-up copies its molecule. */
      cw_molecule_free (mol);
      g_usleep (round * 1000);
      cw_paint_job_free (job);
    }
}

int
main (int argc, char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/render/paint-job/same-pixels", test_same_pixels);
  g_test_add_func ("/render/paint-job/figure", test_figure_job);
  g_test_add_func ("/render/paint-job/figure-copies", test_figure_job_copies);
  g_test_add_func ("/render/paint-job/drop", test_drop);
  g_test_add_func ("/render/paint-job/drop-borrowed", test_drop_borrowed);
  return g_test_run ();
}
