#include "config.h"

#include "cw-render-nmr.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-render-private.h"

#define TEXT_SIZE 9.0
#define ROW 15.0
#define PAD 8.0
#define COL_PROTON 62.0
#define COL_CELL 178.0

static void
show (cairo_t *cr, const char *markup, double x, double y, gboolean bold, CwInk ink, gboolean dark)
{
  g_autoptr (PangoLayout) layout = cw_text_layout_new (markup, TEXT_SIZE, bold, -1);

  cw_palette_set_source (cr, ink, dark);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
  cairo_new_path (cr);
}

void
cw_render_couplings_table_size (const CwCouplings *c, double *width, double *height)
{
  g_return_if_fail (c != NULL);
  *width = 2 * PAD + COL_PROTON + 3 * COL_CELL;
  *height = 2 * PAD + ROW * (c->n_protons + 2) + 8;
}

char *
cw_render_couplings_dup_cell (const CwRingProton *p, int column)
{
  g_autofree char *m = cw_multiplet_dup_text (&p->multiplet[column]);
  g_autofree char *escaped = g_markup_escape_text (m, -1);
  double           width = column < 2 ? p->width[column] : p->width_avg;

  if (column == 2)
    return g_strdup_printf ("%s  <span alpha=\"70%%\">Σ %.1f</span>", escaped, width);
  return g_strdup_printf ("<b>%s</b>  %s  <span alpha=\"70%%\">Σ %.1f</span>",
                          p->axial[column] ? _("ax") : _("eq"), escaped, width);
}

static void
draw_header (cairo_t *cr, const CwCouplings *c, gboolean dark)
{
  g_autofree char *p1 = cw_render_format_percent (c->pop[0]);
  g_autofree char *p2 = cw_render_format_percent (c->pop[1]);
  g_autofree char *h1 = g_strdup_printf (_("Chair 1 (%s %%)"), p1);
  g_autofree char *h2 = g_strdup_printf (_("Chair 2 (%s %%)"), p2);
  g_autofree char *ha = g_strdup_printf (_("Averaged, %.0f K"), c->temperature);
  double           x = PAD;

  show (cr, _("Proton"), x, PAD, TRUE, CW_INK_TEXT, dark);
  show (cr, h1, x + COL_PROTON, PAD, TRUE, CW_INK_SERIES_1, dark);
  show (cr, h2, x + COL_PROTON + COL_CELL, PAD, TRUE, CW_INK_SERIES_2, dark);
  show (cr, ha, x + COL_PROTON + 2 * COL_CELL, PAD, TRUE, CW_INK_TEXT, dark);
  cw_palette_set_source (cr, CW_INK_GRID, dark);
  cairo_set_line_width (cr, 0.75);
  cairo_move_to (cr, PAD, PAD + ROW + 1);
  cairo_line_to (cr, PAD + COL_PROTON + 3 * COL_CELL, PAD + ROW + 1);
  cairo_stroke (cr);
}

static void
draw_row (cairo_t *cr, const CwCouplings *c, int i, gboolean highlight, gboolean dark)
{
  const CwRingProton *p = &c->protons[i];
  g_autofree char    *label = cw_ring_proton_dup_label (p);
  g_autofree char    *escaped = g_markup_escape_text (label, -1);
  double              y = PAD + ROW * (i + 1) + 4;

  if (highlight)
    {
      cw_palette_set_source (cr, CW_INK_HIGHLIGHT, dark);
      cairo_rectangle (cr, PAD - 2, y - 1, COL_PROTON + 3 * COL_CELL + 4, ROW);
      cairo_fill (cr);
    }
  show (cr, escaped, PAD, y, FALSE, CW_INK_TEXT, dark);
  for (int col = 0; col < 3; col++)
    {
      g_autofree char *cell = cw_render_couplings_dup_cell (p, col);
      show (cr, cell, PAD + COL_PROTON + col * COL_CELL, y, FALSE, CW_INK_TEXT, dark);
    }
}

static void
draw_legend (cairo_t *cr, const CwCouplings *c, gboolean dark)
{
  g_autofree char *text = g_strdup_printf (_("Hz. Σ: sum of the vicinal couplings (the width). Multiplets are "
                                             "first order and include ²J = %s%.0f Hz for CH₂ protons."),
                                              c->geminal < 0 ? "−" : "", fabs (c->geminal));
  g_autofree char *escaped = g_markup_escape_text (text, -1);

  show (cr, escaped, PAD, PAD + ROW * (c->n_protons + 1) + 8, FALSE, CW_INK_MUTED, dark);
}

void
cw_render_couplings_table (cairo_t *cr, const CwCouplings *c, int highlight_proton, gboolean dark, double width, double height)
{
  double nw, nh, s;

  g_return_if_fail (cr != NULL && c != NULL);
  cairo_save (cr);
  cw_palette_set_source (cr, CW_INK_BACKGROUND, dark);
  cairo_rectangle (cr, 0, 0, width, height);
  cairo_fill (cr);
  cw_render_couplings_table_size (c, &nw, &nh);
  s = MIN (width / nw, height / nh);
  if (s > 0 && isfinite (s))
    {
      cairo_translate (cr, (width - s * nw) / 2, (height - s * nh) / 2);
      cairo_scale (cr, s, s);
      draw_header (cr, c, dark);
      for (int i = 0; i < c->n_protons; i++)
        draw_row (cr, c, i, i == highlight_proton, dark);
      draw_legend (cr, c, dark);
    }
  cairo_restore (cr);
}
