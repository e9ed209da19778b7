#include "config.h"

#include <math.h>

#include "cw-geometry-data.h"
#include "cw-render-nmr.h"
#include "cw-render.h"
#include "../core/test-helpers.h"

static CwData         *data;
static CwGeometryData *gd;

static void
couplings_of (const char *spec, CwCouplings *c)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec (spec, data->groups, &error);
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
  CwAnalysis   an;

  g_assert_no_error (error);
  g_assert_true (cw_analyze (data, mol, &cond, &an, &error));
  g_assert_true (cw_couplings_compute (gd, mol, an.pop, 298.15, NULL, c, &error));
  g_assert_no_error (error);
}

/* counts pixels in a rectangle matching a predicate on (r, g, b) in 0..255 */
static int
count (cairo_surface_t *s, int x0, int y0, int x1, int y1, gboolean (*match) (int, int, int))
{
  unsigned char *px = cairo_image_surface_get_data (s);
  int            stride = cairo_image_surface_get_stride (s), n = 0;

  cairo_surface_flush (s);
  for (int y = y0; y < y1; y++)
    for (int x = x0; x < x1; x++)
      {
        guint32 v = *(guint32 *) (px + y * stride + 4 * x);
        if (match ((v >> 16) & 0xff, (v >> 8) & 0xff, v & 0xff))
          n++;
      }
  return n;
}

static gboolean
is_dark (int r, int g, int b)
{
  return r + g + b < 200;
}

static gboolean
is_yellow (int r, int g, int b)
{
  return r > 200 && g > 190 && b < 120;
}

static gboolean
is_white (int r, int g, int b)
{
  return r == 255 && g == 255 && b == 255;
}

/* The table paints text in every row, highlights the chosen proton's row, fills its background
 * and leaves the cairo state as found (render rules of the house style). */
static void
test_table (void)
{
  CwCouplings      c;
  double           w, h, row_y;
  cairo_surface_t *s;
  cairo_t         *cr;
  cairo_matrix_t   before, after;

  couplings_of ("1u=hydroxy 4d=tert-butyl", &c);
  cw_render_couplings_table_size (&c, &w, &h);
  g_assert_cmpfloat (w, >, 100);
  g_assert_cmpfloat (h, >, 10 * c.n_protons);
  s = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) ceil (w), (int) ceil (h));
  cr = cairo_create (s);
  cairo_set_source_rgb (cr, 1, 0, 0);
  cairo_paint (cr);
  cairo_get_matrix (cr, &before);
  cw_render_couplings_table (cr, &c, 0, FALSE, w, h);
  cairo_get_matrix (cr, &after);
  g_assert_cmpmem (&before, sizeof before, &after, sizeof after);
  g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
  /* the red under-paint is gone: background painted */
  g_assert_cmpint (count (s, 0, 0, 4, 4, is_white), ==, 16);
  /* every row carries dark text */
  for (int i = 0; i <= c.n_protons; i++)
    {
      int y = (int) (8 + 15 * i + (i > 0 ? 4 : 0));
      g_assert_cmpint (count (s, 8, y, (int) w - 8, y + 12, is_dark), >, 20);
    }
  /* row 0 (the first proton) is highlighted, row 1 is not */
  row_y = 8 + 15 + 4;
  g_assert_cmpint (count (s, 0, (int) row_y, (int) w, (int) row_y + 12, is_yellow), >, 500);
  g_assert_cmpint (count (s, 0, (int) (row_y + 15), (int) w, (int) (row_y + 27), is_yellow), ==, 0);
  cairo_destroy (cr);
  cairo_surface_destroy (s);
}

int
main (int argc, char **argv)
{
  g_autoptr (GError) error = NULL;
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = cw_data_new_from_dir (NULL, &error);
  g_assert_no_error (error);
  gd = test_load_geometry ();
  g_test_add_func ("/render/nmr/table", test_table);
  ret = g_test_run ();
  cw_geometry_data_free (gd);
  cw_data_free (data);
  return ret;
}
