/* Files: PNG, SVG and PDF of every figure, the one-page report, and the failures around them. */
#include "config.h"

#include <glib/gstdio.h>

#include "cw-render-private.h"
#include "render-test-util.h"

typedef struct
{
  CwData     *data;
  CwDocument *doc;
  char       *dir;
} Fixture;

static void
fixture_set_up (Fixture *f, gconstpointer spec)
{
  g_autoptr (CwMolecule) mol = NULL;
  g_autoptr (GError) error = NULL;

  f->data = rt_load_data ();
  mol = rt_ring (f->data, spec ? spec : "1u=methyl");
  f->doc = cw_document_new ();
  cw_document_set_molecule (f->doc, mol);
  cw_document_set_temperature (f->doc, 298.15);
  cw_document_set_energy_unit (f->doc, CW_UNIT_KCAL);
  f->dir = g_dir_make_tmp ("cw-render-XXXXXX", &error);
  g_assert_no_error (error);
}

static void
fixture_tear_down (Fixture *f, gconstpointer spec)
{
  g_autoptr (GDir) d = g_dir_open (f->dir, 0, NULL);
  const char *name;

  while (d && (name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *p = g_build_filename (f->dir, name, NULL);
      g_unlink (p);
    }
  g_rmdir (f->dir);
  g_free (f->dir);
  cw_document_free (f->doc);
  cw_data_free (f->data);
}

static guint
count_files (const char *dir)
{
  g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
  guint n = 0;

  while (d && g_dir_read_name (d) != NULL)
    n++;
  return n;
}

static char *
run (const char *const *argv, int *status)
{
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr (GError) error = NULL;

  if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &out, &err, status, &error))
    g_error ("cannot run %s: %s", argv[0], error->message);
  return g_steal_pointer (&out);
}

/* PNG at the requested resolution: pixels = points × dpi / 72 (the PNG definition of dpi). */
static void
test_png_size (Fixture *f, gconstpointer spec)
{
  CwRenderOptions opt;
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (f->dir, "chairs.png", NULL);
  g_autoptr (CwScene) scene = NULL;
  CwAnalysis an;
  double     w0, h0;

  cw_render_options_init (&opt);
  g_assert_true (cw_render_analyze_document (f->data, f->doc, &an, &error));
  cw_render_figure_size (CW_FIGURE_CHAIRS, &w0, &h0);
  scene = cw_render_build_figure (CW_FIGURE_CHAIRS, f->data, cw_document_peek_molecule (f->doc), &an, &opt, w0, h0);
  for (int i = 0; i < 2; i++)
    {
      double           dpi = i == 0 ? 300 : 96;
      cairo_surface_t *png;

      g_assert_true (cw_render_export_figure (CW_FIGURE_CHAIRS, f->data, f->doc, &opt, path, dpi, &error));
      g_assert_no_error (error);
      png = cairo_image_surface_create_from_png (path);
      g_assert_cmpint (cairo_surface_status (png), ==, CAIRO_STATUS_SUCCESS);
      g_assert_cmpint (cairo_image_surface_get_width (png), ==, (int) lround (ceil (scene->width) * dpi / 72));
      g_assert_cmpint (cairo_image_surface_get_height (png), ==, (int) lround (ceil (scene->height) * dpi / 72));
      cairo_surface_destroy (png);
    }
}

/* Exports are on white even when the screen is dark. */
static void
test_png_white (Fixture *f, gconstpointer spec)
{
  CwRenderOptions opt;
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (f->dir, "scan.png", NULL);
  cairo_surface_t *png;
  guint32         *px;
  int              dark = 0, w, h, stride;

  cw_render_options_init (&opt);
  opt.dark = TRUE;
  g_assert_true (cw_render_export_figure (CW_FIGURE_SCAN, f->data, f->doc, &opt, path, 101, &error));
  png = cairo_image_surface_create_from_png (path);
  w = cairo_image_surface_get_width (png);
  h = cairo_image_surface_get_height (png);
  stride = cairo_image_surface_get_stride (png) / 4;
  px = (guint32 *) cairo_image_surface_get_data (png);
  g_assert_cmphex (px[0] & 0xffffff, ==, 0xffffff);
  /* The page's edges are white too, not shaded by partly covered pixels. */
  for (int y = 0; y < h; y++)
    g_assert_cmphex (px[y * stride + w - 1] & 0xffffff, ==, 0xffffff);
  for (int x = 0; x < w; x++)
    g_assert_cmphex (px[(h - 1) * stride + x] & 0xffffff, ==, 0xffffff);
  for (int y = 0; y < h; y++)
    for (int x = 0; x < w; x++)
      dark += (px[y * stride + x] & 0xff) < 0x80;
  /* Mostly white, with drawing on it. */
  g_assert_cmpint (dark, >, 200);
  g_assert_cmpint (dark, <, w * h / 4);
  cairo_surface_destroy (png);
}

/* SVG: well-formed XML (xmllint) with the labels as text. */
static void
test_svg (Fixture *f, gconstpointer spec)
{
  static const struct
  {
    CwFigure    fig;
    const char *want[3];
  } cases[] = {
    { CW_FIGURE_STRUCTURE, { "CO2Me", "Me", ">cis<" } },
    { CW_FIGURE_CHAIRS, { "Chair 1", "Chair 2", "K = " } },
    { CW_FIGURE_PROFILE, { "half-chair", "twist-boat", "boat" } },
    { CW_FIGURE_SCAN, { "population", "chair 1", "temperature" } },
  };
  CwRenderOptions opt;

  cw_render_options_init (&opt);
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autofree char *path = g_strdup_printf ("%s/%s.svg", f->dir, cw_render_figure_to_string (cases[i].fig));
      g_autofree char *svg = NULL, *out = NULL;
      const char      *argv[] = { "xmllint", "--noout", path, NULL };
      int              status;

      g_assert_true (cw_render_export_figure (cases[i].fig, f->data, f->doc, &opt, path, 72, &error));
      g_assert_no_error (error);
      out = run (argv, &status);
      g_assert_true (g_spawn_check_wait_status (status, NULL));
      g_assert_true (g_file_get_contents (path, &svg, NULL, NULL));
      g_assert_nonnull (strstr (svg, "<svg"));
      for (int k = 0; k < 3; k++)
        if (strstr (svg, cases[i].want[k]) == NULL)
          g_error ("%s: no “%s” in the SVG", path, cases[i].want[k]);
    }
}

static char *
pdf_text (const char *path)
{
  const char *argv[] = { "pdftotext", "-layout", path, "-", NULL };
  int         status;
  char       *text = run (argv, &status);

  g_assert_true (g_spawn_check_wait_status (status, NULL));
  return text;
}

/* Collapses runs of white space, so text wrapped onto several lines still matches. */
static char *
squash (const char *s)
{
  g_autoptr (GRegex) re = g_regex_new ("\\s+", 0, 0, NULL);

  return g_regex_replace_literal (re, s, -1, 0, " ", 0, NULL);
}

/* The report: one page of the requested paper, rasterises, and carries ΔG°, the populations,
 * the figures' words, the sources, the caution and the date. Methylcyclohexane: ΔG° = G(chair 2)
 * − G(chair 1) = −A(Me) = −1.74 kcal/mol (chair 1 has Me axial; A-value derived from Booth &
 * Everett, J. Chem. Soc., Perkin Trans. 2 1980, 255), K = exp(1.74/RT) ≈ 18.9
 * at 298.15 K (CODATA R), so 5.0 % / 95.0 %. */
static void
test_report (Fixture *f, gconstpointer spec)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GDateTime) now = g_date_time_new_now_local ();
  g_autofree char  *date = g_date_time_format (now, "%Y-%m-%d");
  const char *const papers[] = { "a4", "letter" };
  const char *const sizes[] = { "595.276 x 841.89 pts", "612 x 792 pts" };

  for (int p = 0; p < 2; p++)
    {
      g_autofree char *path = g_strdup_printf ("%s/report-%s.pdf", f->dir, papers[p]);
      g_autofree char *prefix = g_strdup_printf ("%s/page-%s", f->dir, papers[p]);
      g_autofree char *png = g_strdup_printf ("%s.png", prefix);
      g_autofree char *raw = NULL, *text = NULL, *info = NULL, *caution = squash (cw_caution_text ());
      const char      *info_argv[] = { "pdfinfo", path, NULL };
      const char      *ras_argv[] = { "pdftoppm", "-png", "-r", "30", "-singlefile", path, prefix, NULL };
      int              status;
      cairo_surface_t *img;

      g_assert_true (cw_render_export_report (f->data, f->doc, papers[p], path, &error));
      g_assert_no_error (error);
      info = run (info_argv, &status);
      g_assert_nonnull (strstr (info, "Pages:           1"));
      g_assert_nonnull (strstr (info, sizes[p]));
      g_free (run (ras_argv, &status));
      g_assert_true (g_spawn_check_wait_status (status, NULL));
      img = cairo_image_surface_create_from_png (png);
      g_assert_cmpint (cairo_surface_status (img), ==, CAIRO_STATUS_SUCCESS);
      g_assert_cmpint (cairo_image_surface_get_width (img), >, 200);
      cairo_surface_destroy (img);
      raw = pdf_text (path);
      text = squash (raw);
      for (const char *const *want = (const char *const[]){ "ΔG° = −1.74", "K = 18.9", "5.0 %", "95.0 %",
                                                            "Chair 2 (major)", "half-chair", "population",
                                                            "Booth & Everett", "Sources.", NULL };
           *want; want++)
        if (strstr (text, *want) == NULL)
          g_error ("report (%s): no “%s” in\n%s", papers[p], *want, text);
      g_assert_nonnull (strstr (text, caution));
      g_assert_nonnull (strstr (text, date));
    }
}

/* The format follows the extension; a wrong one or an unwritable place is an error that names
 * the file, and nothing is left behind. */
static void
test_errors (Fixture *f, gconstpointer spec)
{
  CwRenderOptions opt;
  g_autoptr (GError) e1 = NULL, e2 = NULL, e3 = NULL, e4 = NULL, e5 = NULL;
  g_autofree char *bad_ext = g_build_filename (f->dir, "figure.jpeg", NULL);
  g_autofree char *no_dir = g_build_filename (f->dir, "missing", "figure.png", NULL);
  g_autofree char *report_png = g_build_filename (f->dir, "report.png", NULL);
  g_autofree char *good = g_build_filename (f->dir, "good.pdf", NULL);
  g_autofree char *folder = g_build_filename (f->dir, "folder.png", NULL);

  cw_render_options_init (&opt);
  g_assert_false (cw_render_export_figure (CW_FIGURE_CHAIRS, f->data, f->doc, &opt, bad_ext, 300, &e1));
  g_assert_error (e1, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT);
  g_assert_nonnull (strstr (e1->message, "figure.jpeg"));
  g_assert_false (cw_render_export_figure (CW_FIGURE_CHAIRS, f->data, f->doc, &opt, no_dir, 300, &e2));
  g_assert_error (e2, CW_RENDER_ERROR, CW_RENDER_ERROR_IO);
  g_assert_nonnull (strstr (e2->message, "figure.png"));
  g_assert_false (cw_render_export_report (f->data, f->doc, "a4", report_png, &e3));
  g_assert_error (e3, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT);
  g_assert_false (cw_render_export_report (f->data, f->doc, "a5", good, &e4));
  g_assert_error (e4, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT);
  g_assert_cmpint (g_mkdir (folder, 0700), ==, 0);
  g_assert_false (cw_render_export_figure (CW_FIGURE_CHAIRS, f->data, f->doc, &opt, folder, 300, &e5));
  g_assert_error (e5, CW_RENDER_ERROR, CW_RENDER_ERROR_IO);
  g_assert_true (g_file_test (folder, G_FILE_TEST_IS_DIR));
  g_rmdir (folder);
  g_assert_cmpuint (count_files (f->dir), ==, 0);
  /* A good export leaves exactly the one file, no temporary. */
  g_assert_true (cw_render_export_report (f->data, f->doc, "a4", good, NULL));
  g_assert_cmpuint (count_files (f->dir), ==, 1);
}

/* cw_render_figure draws into any box, leaves the cairo state as found, and follows the theme. */
static void
test_figure_box (Fixture *f, gconstpointer spec)
{
  CwRenderOptions   opt;
  CwAnalysis        an;
  const CwMolecule *mol = cw_document_peek_molecule (f->doc);

  cw_render_options_init (&opt);
  g_assert_true (cw_render_analyze_document (f->data, f->doc, &an, NULL));
  for (int fig = CW_FIGURE_STRUCTURE; fig <= CW_FIGURE_SCAN; fig++)
    for (int dark = 0; dark < 2; dark++)
      {
        g_autoptr (cairo_surface_t) s = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 320, 200);
        g_autoptr (cairo_t) cr = cairo_create (s);
        cairo_matrix_t before, after;
        guint32       *px;
        double         bg[3];

        cairo_translate (cr, 10, 5);
        cairo_set_line_width (cr, 7.0);
        cairo_get_matrix (cr, &before);
        opt.dark = dark;
        cw_render_figure (cr, fig, f->data, mol, &an, &opt, 300, 190);
        cairo_get_matrix (cr, &after);
        g_assert_cmpmem (&before, sizeof before, &after, sizeof after);
        g_assert_cmpfloat (cairo_get_line_width (cr), ==, 7.0);
        g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
        cairo_surface_flush (s);
        px = (guint32 *) cairo_image_surface_get_data (s);
        cw_palette_get (CW_INK_BACKGROUND, dark, bg);
        /* The box's corner has the theme's background; outside the box is untouched (black). */
        g_assert_cmphex (px[(5 + 1) * (cairo_image_surface_get_stride (s) / 4) + 11] & 0xff, ==,
                         (guint) lround (bg[2] * 255));
        g_assert_cmphex (px[0] & 0xffffff, ==, 0);
      }
}

static void
test_figure_names (void)
{
  CwFigure fig;

  for (int i = CW_FIGURE_STRUCTURE; i <= CW_FIGURE_SCAN; i++)
    {
      g_assert_true (cw_render_figure_from_string (cw_render_figure_to_string (i), &fig));
      g_assert_cmpint (fig, ==, i);
    }
  g_assert_false (cw_render_figure_from_string ("chair", &fig));
  g_assert_false (cw_render_figure_from_string (NULL, &fig));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add ("/render/export/png-size", Fixture, NULL, fixture_set_up, test_png_size, fixture_tear_down);
  g_test_add ("/render/export/png-white", Fixture, NULL, fixture_set_up, test_png_white, fixture_tear_down);
  g_test_add ("/render/export/svg", Fixture, "1u=methoxycarbonyl 3u=methyl", fixture_set_up, test_svg,
              fixture_tear_down);
  g_test_add ("/render/export/report", Fixture, NULL, fixture_set_up, test_report, fixture_tear_down);
  g_test_add ("/render/export/errors", Fixture, NULL, fixture_set_up, test_errors, fixture_tear_down);
  g_test_add ("/render/export/figure-box", Fixture, NULL, fixture_set_up, test_figure_box, fixture_tear_down);
  g_test_add_func ("/render/export/figure-names", test_figure_names);
  return g_test_run ();
}
