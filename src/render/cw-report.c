#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-figures.h"
#include "cw-render-private.h"

/* The one-page report: everything measured first as a page scene, figures drawn into the room
 * left over, so it always fits one page. */

#define MARGIN 40.0
#define BODY 8.5
#define SMALL 7.0

typedef struct
{
  CwScene   *page;
  double     x, y, w; /* text column */
  GPtrArray *sources; /* distinct source strings, borrowed; the index + 1 is the reference number */
} Report;

static int
source_ref (Report *r, const char *source)
{
  if (source == NULL || *source == '\0')
    return 0;
  for (guint i = 0; i < r->sources->len; i++)
    if (strcmp (g_ptr_array_index (r->sources, i), source) == 0)
      return (int) i + 1;
  g_ptr_array_add (r->sources, (gpointer) source);
  return (int) r->sources->len;
}

static double
text (Report *r, const char *markup, double size, gboolean bold, double x, double y)
{
  return cw_scene_text (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, markup, size, bold, x, y)->box.h;
}

static double
para (Report *r, const char *markup, double size, CwInk ink, double y)
{
  return cw_scene_paragraph (r->page, CW_ROLE_CAPTION, ink, markup, size, r->x, y, r->w)->box.h;
}

static double
header (Report *r, const CwDocument *doc, const CwAnalysis *an)
{
  const CwMolecule *mol = cw_document_peek_molecule (doc);
  g_autofree char  *summary = cw_molecule_dup_summary (mol);
  g_autofree char  *config = cw_molecule_dup_configuration (mol);
  const char       *title = cw_document_get_title (doc);
  g_autofree char  *t = g_markup_escape_text (title && *title ? title : summary, -1);
  g_autoptr (GDateTime) now = g_date_time_new_now_local ();
  g_autofree char *date = g_date_time_format (now, "%Y-%m-%d");
  g_autofree char *temp = cw_format_temperature (an->temperature, CW_TUNIT_KELVIN);
  g_autofree char *tc = cw_format_temperature (an->temperature, CW_TUNIT_CELSIUS);
  gboolean         titled = title && *title;
  g_autofree char *sub = g_markup_printf_escaped (_("%s%s%s%sT = %s (%s) · %s solvent class"),
                                                     titled ? summary : "", titled ? " · " : "",
                                                     config ? config : "", config && *config ? " · " : "",
                                                     temp, tc, cw_solvent_to_string (an->solvent));
  double           y = r->y;
  CwPrim          *d;

  y += text (r, t, 17, TRUE, r->x, y) + 2;
  y += text (r, sub, 9.5, FALSE, r->x, y) + 2;
  d = cw_scene_text_at (r->page, CW_ROLE_CAPTION, CW_INK_MUTED, date, 9, FALSE, r->x + r->w, r->y + 4, 1, 0);
  (void) d;
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y + 2, r->x + r->w, y + 2, 0.8);
  return y + 6 - r->y;
}

static double
results (Report *r, const CwAnalysis *an, CwEnergyUnit unit)
{
  g_autofree char *dg = cw_render_format_energy (an->delta_g, unit);
  g_autofree char *sg = cw_render_format_energy (an->sigma, unit);
  g_autofree char *k = cw_render_format_k (an->K);
  g_autofree char *bar = cw_render_format_energy (an->barrier, unit);
  g_autofree char *line = NULL;
  g_autofree char *rate = cw_render_format_k (an->major == 1 ? an->k_reverse : an->k_forward);
  char            *p[2][3];
  double           h;

  for (int c = 0; c < 2; c++)
    {
      double lo = MIN (an->pop_low[c], an->pop_high[c]), hi = MAX (an->pop_low[c], an->pop_high[c]);
      p[c][0] = cw_render_format_percent (an->pop[c]);
      p[c][1] = cw_render_format_percent (lo);
      p[c][2] = cw_render_format_percent (hi);
    }
  line = g_strdup_printf (_("<b>Δ<i>G</i>° = %s ± %s %s</b> (G(chair 2) − G(chair 1), ±1σ) · <b><i>K</i> = %s</b> · "
                            "chair 1: <b>%s %%</b> (%s–%s %%), chair 2: <b>%s %%</b> (%s–%s %%) for Δ<i>G</i>° ± 2σ · "
                            "ring inversion from the major chair: Δ<i>G</i><sup>‡</sup> ≈ %s %s, <i>k</i> ≈ %s s<sup>−1</sup>"),
                             dg, sg, cw_energy_unit_symbol (unit), k, p[0][0], p[0][1], p[0][2], p[1][0], p[1][1],
                             p[1][2], bar, cw_energy_unit_symbol (unit), rate);
  h = para (r, line, 9.5, CW_INK_TEXT, r->y);
  for (int c = 0; c < 2; c++)
    for (int j = 0; j < 3; j++)
      g_free (p[c][j]);
  return h;
}

typedef struct
{
  const CwTerm *t[2];
} Row;

static void
collect_rows (const CwAnalysis *an, GArray *rows)
{
  for (int c = 0; c < 2; c++)
    for (int i = 0; i < an->chair[c].n_terms; i++)
      {
        const CwTerm *t = &an->chair[c].terms[i];
        gboolean      merged = FALSE;

        for (guint j = 0; j < rows->len && !merged; j++)
          {
            Row          *row = &g_array_index (rows, Row, j);
            const CwTerm *o = row->t[0] ? row->t[0] : row->t[1];

            if (row->t[c] == NULL && o->kind == t->kind && o->sub_a == t->sub_a && o->sub_b == t->sub_b)
              row->t[c] = t, merged = TRUE;
          }
        if (!merged)
          {
            Row row = { { NULL, NULL } };
            row.t[c] = t;
            g_array_append_val (rows, row);
          }
      }
}

static double
cell (Report *r, const char *markup, double x, double y, double ax, gboolean bold)
{
  return cw_scene_text_at (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, markup, BODY, bold, x, y, ax, 0)->box.h;
}

static double
term_table (Report *r, const CwMolecule *mol, const CwAnalysis *an, CwEnergyUnit unit)
{
  g_autoptr (GArray) rows = g_array_new (FALSE, FALSE, sizeof (Row));
  double           c1 = r->x + 300, c2 = r->x + 360, cs = r->x + 385, y = r->y, lh;
  g_autofree char *h0 = g_strdup_printf (_("Term (energies in %s)"), cw_energy_unit_symbol (unit));

  collect_rows (an, rows);
  lh = cell (r, h0, r->x, y, 0, TRUE);
  cell (r, _("chair 1"), c1, y, 1, TRUE);
  cell (r, _("chair 2"), c2, y, 1, TRUE);
  cell (r, _("Source"), cs, y, 0, TRUE);
  y += lh + 1;
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y, r->x + r->w, y, 0.6);
  y += 2;
  if (rows->len == 0)
    y += cell (r, _("no terms: both chairs are unstrained"), r->x, y, 0, FALSE) + 1;
  for (guint i = 0; i < rows->len; i++)
    {
      Row             *row = &g_array_index (rows, Row, i);
      const CwTerm    *t = row->t[0] ? row->t[0] : row->t[1];
      g_autofree char *label = cw_term_dup_label (t, mol);
      g_autofree char *esc = g_markup_printf_escaped ("%s%s", label, t->estimated ? _(" (estimate)") : "");
      g_autofree char *src = g_strdup_printf ("[%d]%s", source_ref (r, t->source),
                                              t->temperature_dependent ? _(" from ΔH°, ΔS°") : "");

      lh = cell (r, esc, r->x, y, 0, FALSE);
      for (int c = 0; c < 2; c++)
        {
          g_autofree char *v = row->t[c] ? cw_render_format_energy (row->t[c]->energy, unit) : g_strdup ("–");
          cell (r, v, c == 0 ? c1 : c2, y, 1, FALSE);
        }
      cell (r, src, cs, y, 0, FALSE);
      y += lh + 1;
    }
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y, r->x + r->w, y, 0.6);
  y += 2;
  for (int c = 0; c < 2; c++)
    {
      g_autofree char *v = cw_render_format_energy (an->chair[c].energy, unit);
      g_autofree char *b = g_strdup_printf ("<b>%s</b>", v);
      lh = cell (r, b, c == 0 ? c1 : c2, y, 1, FALSE);
    }
  cell (r, _("<b>total (chair energy above an unstrained chair)</b>"), r->x, y, 0, FALSE);
  return y + lh - r->y;
}

static double
flags (Report *r, const CwMolecule *mol, const CwAnalysis *an, CwEnergyUnit unit)
{
  double y = r->y;

  for (int i = 0; i < an->n_flags; i++)
    {
      g_autofree char *msg = cw_flag_dup_message (&an->flags[i], mol, unit);
      g_autofree char *m = g_markup_printf_escaped ("⚠ %s", msg ? msg : "");

      y += para (r, m, BODY, CW_INK_TEXT, y) + 1;
    }
  return y - r->y;
}

static void
ring_sources (Report *r, const CwData *data)
{
  const CwRingEnergetics *ring = cw_interaction_table_get_ring (data->interactions);

  if (ring == NULL)
    return;
  source_ref (r, ring->half_chair.source);
  source_ref (r, ring->twist_boat.source);
  source_ref (r, ring->boat.source);
}

static double
sources (Report *r, double size)
{
  GString *s = g_string_new (NULL);
  double   h;

  g_string_append_printf (s, "<b>%s</b> ", _("Sources."));
  for (guint i = 0; i < r->sources->len; i++)
    {
      g_autofree char *esc = g_markup_escape_text (g_ptr_array_index (r->sources, i), -1);
      g_string_append_printf (s, "[%u] %s  ", i + 1, esc);
    }
  g_string_append_printf (s, "[%u] %s", r->sources->len + 1,
                          _("Gas constant R = 8.314462618 J/(mol·K), CODATA 2018; 1 kcal = 4.184 kJ."));
  h = para (r, s->str, size, CW_INK_TEXT, r->y);
  g_string_free (s, TRUE);
  return h;
}

static void
draw_figure_at (cairo_t *cr, CwFigure fig, const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double x, double y, double w, double h)
{
  cairo_save (cr);
  cairo_translate (cr, x, y);
  cw_render_figure (cr, fig, data, mol, an, opt, w, h);
  cairo_restore (cr);
}

typedef struct
{
  double row1, row2; /* figure row heights */
  double row1_y, row2_y;
} Rows;

/* Lays out the text of the page around two figure rows of the given heights; returns the
 * height used. */
static double
build_page (Report *r, const CwData *data, const CwDocument *doc, const CwAnalysis *an, Rows *rows, double sources_size)
{
  const CwMolecule *mol = cw_document_peek_molecule (doc);
  CwEnergyUnit      unit = cw_document_get_energy_unit (doc);
  double            top = r->y;
  g_autofree char  *caution = g_markup_escape_text (cw_caution_text (), -1);
  g_autofree char  *caution_m = g_strdup_printf ("<b>%s</b> %s", _("Caution."), caution);
  CwPrim           *box;
  double            h;

  r->y += header (r, doc, an);
  rows->row1_y = r->y;
  r->y += rows->row1 + 4;
  r->y += results (r, an, unit) + 6;
  r->y += term_table (r, mol, an, unit) + 8;
  rows->row2_y = r->y;
  r->y += rows->row2 + 4;
  r->y += flags (r, mol, an, unit) + 4;
  ring_sources (r, data);
  r->y += sources (r, sources_size) + 6;
  box = cw_scene_add (r->page, CW_PRIM_RECT, CW_ROLE_NONE, CW_INK_TEXT);
  r->y += 4;
  h = para (r, caution_m, BODY + 0.5, CW_INK_TEXT, r->y);
  box->x0 = r->x - 4;
  box->y0 = r->y - 4;
  box->x1 = r->w + 8;
  box->y1 = h + 8;
  box->line_width = 0.8;
  r->y += h + 6;
  return r->y - top;
}

void
cw_render_report (cairo_t *cr, const CwData *data, const CwDocument *doc, const CwAnalysis *an, double width, double height)
{
  Report          r = { NULL, MARGIN, MARGIN, width - 2 * MARGIN, NULL };
  Rows            rows = { 0 };
  CwRenderOptions opt;
  double          room, text_h, size = SMALL;
  g_autoptr (GDateTime) now = g_date_time_new_now_local ();
  g_autofree char  *date = g_date_time_format (now, "%Y-%m-%d %H:%M");
  g_autofree char  *footer = g_strdup_printf ("Chairwise %s · %s", PACKAGE_VERSION, date);
  const CwMolecule *mol = cw_document_peek_molecule (doc);

  cw_render_options_init (&opt);
  opt.unit = cw_document_get_energy_unit (doc);
  opt.temperature_unit = cw_document_get_temperature_unit (doc);
  /* Pass 1: text only, to learn how much room the figures get. */
  for (;;)
    {
      r.page = cw_scene_new (width, height);
      r.sources = g_ptr_array_new ();
      r.y = MARGIN;
      text_h = build_page (&r, data, doc, an, &rows, size);
      cw_scene_free (r.page);
      g_ptr_array_unref (r.sources);
      room = height - 2 * MARGIN - 14 - text_h;
      if (room >= 220 || size <= 5.0)
        break;
      size -= 0.5; /* a long source list: smaller print before smaller figures */
    }
  rows.row1 = MIN (200, MAX (60, room * 0.55));
  rows.row2 = MIN (175, MAX (50, room - rows.row1));
  r.page = cw_scene_new (width, height);
  r.sources = g_ptr_array_new ();
  r.y = MARGIN;
  build_page (&r, data, doc, an, &rows, size);
  cw_scene_text_at (r.page, CW_ROLE_CAPTION, CW_INK_MUTED, footer, SMALL, FALSE, width / 2, height - MARGIN + 10,
                    0.5, 0);

  cairo_save (cr);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  cw_scene_paint (r.page, cr, FALSE);
  draw_figure_at (cr, CW_FIGURE_STRUCTURE, data, mol, an, &opt, r.x, rows.row1_y, rows.row1, rows.row1);
  draw_figure_at (cr, CW_FIGURE_CHAIRS, data, mol, an, &opt, r.x + rows.row1 + 6, rows.row1_y,
                  r.w - rows.row1 - 6, rows.row1);
  draw_figure_at (cr, CW_FIGURE_PROFILE, data, mol, an, &opt, r.x, rows.row2_y, r.w / 2 - 4, rows.row2);
  draw_figure_at (cr, CW_FIGURE_SCAN, data, mol, an, &opt, r.x + r.w / 2 + 4, rows.row2_y, r.w / 2 - 4, rows.row2);
  cairo_restore (cr);
  cw_scene_free (r.page);
  g_ptr_array_unref (r.sources);
}
