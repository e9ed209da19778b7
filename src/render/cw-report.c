#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-figures.h"
#include "cw-report-private.h"

/* The one-page report: everything measured first as a page scene, figures drawn into the room
 * left over, so it always fits one page. When the text leaves the figures too little room, the
 * text gets smaller first (down to a floor), then the figures. */

#define MARGIN 36.0
#define FOOTER 12.0
#define BODY 8.0          /* body text at its largest */
#define BODY_MIN 6.5      /* ... and smallest */
#define SMALL 6.5         /* the source list */
#define FIGURE_ROOM 300.0 /* the two figure rows want this much together */
#define FIGURE_MIN 150.0  /* below this even at BODY_MIN, the whole page is scaled down */

typedef CwReport Report;

int
cw_report_source_ref (CwReport *r, const char *source)
{
  if (source == NULL || *source == '\0')
    return 0;
  for (guint i = 0; i < r->sources->len; i++)
    if (strcmp (g_ptr_array_index (r->sources, i), source) == 0)
      return (int) i + 1;
  g_ptr_array_add (r->sources, (gpointer) source);
  return (int) r->sources->len;
}

static int
source_ref (Report *r, const char *source)
{
  return cw_report_source_ref (r, source);
}

static double
text (Report *r, const char *markup, double size, gboolean bold, double x, double y)
{
  return cw_scene_text (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, markup, size, bold, x, y)->box.h;
}

double
cw_report_para (CwReport *r, const char *markup, double size, CwInk ink, double y)
{
  return cw_scene_paragraph (r->page, CW_ROLE_CAPTION, ink, markup, size, r->x, y, r->w)->box.h;
}

static double
para (Report *r, const char *markup, double size, CwInk ink, double y)
{
  return cw_report_para (r, markup, size, ink, y);
}

double
cw_report_heading (CwReport *r, const char *markup)
{
  g_autofree char *b = g_strdup_printf ("<b>%s</b>", markup);

  return cw_scene_paragraph (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, b, r->body + 1, r->x, r->y, r->w)->box.h + 1;
}

/* Everything the page shows, computed once for all layout passes. */
typedef struct
{
  const CwData       *data;
  const CwDocument   *doc;
  const CwMolecule   *mol;
  const CwAnalysis   *an;
  CwEnergyUnit        unit;
  const CwCouplings  *couplings;
  const char         *couplings_error;
  const CwReactivity *reactivity;
  const char         *reactivity_error;
} Sections;

static double
header (Report *r, const CwDocument *doc, const CwAnalysis *an)
{
  const CwMolecule *mol = cw_document_peek_molecule (doc);
  g_autofree char  *summary = cw_molecule_dup_summary (mol);
  g_autofree char  *config = cw_molecule_dup_configuration (mol);
  const char       *title = cw_document_get_title (doc);
  g_autofree char  *t = g_markup_escape_text (title && *title ? title : summary, -1);
  g_autofree char  *tb = g_strdup_printf ("<b>%s</b>", t);
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

  d = cw_scene_text_at (r->page, CW_ROLE_CAPTION, CW_INK_MUTED, date, 8.5, FALSE, r->x + r->w, r->y + 3, 1, 0);
  /* The title wraps short of the date rather than run into it. */
  y += cw_scene_paragraph (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, tb, 15, r->x, y, d->box.x - 10 - r->x)->box.h;
  y += 1;
  y += text (r, sub, 8.5, FALSE, r->x, y) + 1;
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y + 1.5, r->x + r->w, y + 1.5, 0.8);
  return y + 4 - r->y;
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
  h = para (r, line, r->body + 0.5, CW_INK_TEXT, r->y);
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
  return cw_scene_text_at (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, markup, r->body, bold, x, y, ax, 0)->box.h;
}

/* Term | chair 1 | chair 2 | source, fitted to the current column: labels wrap, numbers do not. */
static double
term_table (Report *r, const CwMolecule *mol, const CwAnalysis *an, CwEnergyUnit unit)
{
  g_autoptr (GArray) rows = g_array_new (FALSE, FALSE, sizeof (Row));
  double           cs = r->x + r->w - 20, c2 = cs - 6, c1 = c2 - 36, wrap = c1 - 40 - r->x, y = r->y, lh;
  g_autofree char *h0 = g_strdup_printf (_("Term (energies in %s)"), cw_energy_unit_symbol (unit));
  gboolean         any_t = FALSE;

  collect_rows (an, rows);
  lh = cell (r, h0, r->x, y, 0, TRUE);
  cell (r, _("chair 1"), c1, y, 1, TRUE);
  cell (r, _("chair 2"), c2, y, 1, TRUE);
  cell (r, _("Src."), cs, y, 0, TRUE);
  y += lh + 0.5;
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y, r->x + r->w, y, 0.6);
  y += 1.5;
  if (rows->len == 0)
    y += cell (r, _("no terms: both chairs are unstrained"), r->x, y, 0, FALSE) + 1;
  for (guint i = 0; i < rows->len; i++)
    {
      Row             *row = &g_array_index (rows, Row, i);
      const CwTerm    *t = row->t[0] ? row->t[0] : row->t[1];
      g_autofree char *label = cw_term_dup_label (t, mol);
      g_autofree char *esc = g_markup_printf_escaped ("%s%s", label, t->estimated ? _(" (estimate)") : "");
      g_autofree char *src = g_strdup_printf ("[%d]%s", source_ref (r, t->source), t->temperature_dependent ? "*" : "");

      any_t |= t->temperature_dependent;
      lh = cw_scene_paragraph (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, esc, r->body, r->x, y, wrap)->box.h;
      for (int c = 0; c < 2; c++)
        {
          g_autofree char *v = row->t[c] ? cw_render_format_energy (row->t[c]->energy, unit) : g_strdup ("–");
          cell (r, v, c == 0 ? c1 : c2, y, 1, FALSE);
        }
      cell (r, src, cs, y, 0, FALSE);
      y += lh + 0.5;
    }
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y, r->x + r->w, y, 0.6);
  y += 1.5;
  for (int c = 0; c < 2; c++)
    {
      g_autofree char *v = cw_render_format_energy (an->chair[c].energy, unit);
      g_autofree char *b = g_strdup_printf ("<b>%s</b>", v);
      cell (r, b, c == 0 ? c1 : c2, y, 1, FALSE);
    }
  y += cw_scene_paragraph (r->page, CW_ROLE_CAPTION, CW_INK_TEXT, _("<b>total</b> (chair energy above an unstrained chair)"), r->body, r->x, y, wrap)->box.h;
  if (any_t)
    y += 1 + para (r, _("* from ΔH° and ΔS° at the report's temperature"), r->small, CW_INK_MUTED, y + 1);
  return y - r->y;
}

static double
flags (Report *r, const CwMolecule *mol, const CwAnalysis *an, CwEnergyUnit unit)
{
  double y = r->y;

  for (int i = 0; i < an->n_flags; i++)
    {
      g_autofree char *msg = cw_flag_dup_message (&an->flags[i], mol, unit);
      g_autofree char *m = g_markup_printf_escaped ("⚠ %s", msg ? msg : "");

      y += para (r, m, r->body, CW_INK_TEXT, y) + 1;
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
sources (Report *r)
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
  h = para (r, s->str, r->small, CW_INK_TEXT, r->y);
  g_string_free (s, TRUE);
  return h;
}

static void
draw_figure_at (cairo_t *cr, CwFigure fig, const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double x, double y, double w, double h)
{
  if (w < 1 || h < 1)
    return;
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

/* Terms on the left, reaction geometry on the right, side by side. */
static double
two_columns (Report *r, const Sections *sec)
{
  double x = r->x, w = r->w, split = 0.52 * w, h1, h2;

  r->w = split - 8;
  h1 = term_table (r, sec->mol, sec->an, sec->unit);
  r->x = x + split + 8;
  r->w = w - split - 8;
  h2 = cw_report_reactivity (r, sec->mol, sec->reactivity, sec->reactivity_error);
  cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, x + split, r->y, x + split, r->y + MAX (h1, h2), 0.6);
  r->x = x;
  r->w = w;
  return MAX (h1, h2);
}

static double
caution (Report *r)
{
  g_autofree char *caution = g_markup_escape_text (cw_caution_text (), -1);
  g_autofree char *caution_m = g_strdup_printf ("<b>%s</b> %s", _("Caution."), caution);
  CwPrim          *box = cw_scene_add (r->page, CW_PRIM_RECT, CW_ROLE_NONE, CW_INK_TEXT);
  double           h = para (r, caution_m, r->body + 0.5, CW_INK_TEXT, r->y + 3);

  box->x0 = r->x - 4;
  box->y0 = r->y;
  box->x1 = r->w + 8;
  box->y1 = h + 6;
  box->line_width = 0.8;
  return h + 6;
}

/* Lays out the text of the page around two figure rows of the given heights; returns the
 * height used. */
static double
build_page (Report *r, const Sections *sec, Rows *rows)
{
  double top = r->y, h;

  r->y += header (r, sec->doc, sec->an);
  h = cw_report_notes (r, cw_document_get_notes (sec->doc));
  r->y += h > 0 ? h + 3 : 0;
  rows->row1_y = r->y;
  r->y += rows->row1 > 0 ? rows->row1 + 3 : 0;
  r->y += results (r, sec->an, sec->unit) + 5;
  r->y += two_columns (r, sec) + 5;
  h = flags (r, sec->mol, sec->an, sec->unit);
  r->y += h > 0 ? h + 4 : 0;
  r->y += cw_report_couplings (r, sec->couplings, sec->couplings_error) + 4;
  rows->row2_y = r->y;
  r->y += rows->row2 > 0 ? rows->row2 + 3 : 0;
  ring_sources (r, sec->data);
  r->y += sources (r) + 5;
  r->y += caution (r);
  return r->y - top;
}

static void
report_begin (Report *r, double width, double height, double body, CwTemperatureUnit tunit)
{
  *r = (Report){ cw_scene_new (width, height), MARGIN, MARGIN, width - 2 * MARGIN, g_ptr_array_new (),
                 body, MIN (SMALL, body - 1), tunit };
}

static void
report_end (Report *r)
{
  cw_scene_free (r->page);
  g_ptr_array_unref (r->sources);
}

/* Text sizes and figure rows that fit the page: the text is measured alone first; while it leaves
 * the figures less than FIGURE_ROOM it is set smaller, down to BODY_MIN, and then the figures
 * take what is left (the profile and scan row goes first when even that is too little). */
static double
fit_page (const Sections *sec, double width, double height, double body, CwTemperatureUnit tunit, Rows *rows, double *room_out)
{
  double room = 0;

  for (;; body -= 0.25)
    {
      Report r;
      Rows   none = { 0 };

      report_begin (&r, width, height, body, tunit);
      room = height - 2 * MARGIN - FOOTER - build_page (&r, sec, &none) - 6;
      report_end (&r);
      if (room >= FIGURE_ROOM || body <= BODY_MIN)
        break;
    }
  rows->row1 = MIN (210, MAX (0, room) * 0.55);
  rows->row2 = MIN (185, MAX (0, room) - rows->row1);
  if (rows->row2 < 60)
    {
      rows->row2 = 0;
      rows->row1 = MIN (210, MAX (0, room));
    }
  *room_out = room;
  return body;
}

static void
compute_sections (Sections *sec, const CwGeometryData *gd, CwCouplings *c, CwReactivity *re, GError **ce, GError **rerr)
{
  const CwGeometryData *g = gd;
  GError               *error = NULL;

  if (g == NULL)
    g = cw_render_default_geometry (&error);
  if (g == NULL)
    {
      *rerr = g_error_copy (error);
      *ce = error;
      return;
    }
  if (cw_couplings_compute (g, sec->mol, sec->an->pop, sec->an->temperature, NULL, c, ce))
    sec->couplings = c;
  if (cw_reactivity_compute (g, sec->mol, sec->an->pop, sec->an->temperature, re, rerr))
    sec->reactivity = re;
}

void
cw_render_report_with_geometry (cairo_t *cr, const CwData *data, const CwGeometryData *gd, const CwDocument *doc, const CwAnalysis *an, double width, double height)
{
  Sections                 sec = { data, doc, cw_document_peek_molecule (doc), an, cw_document_get_energy_unit (doc) };
  g_autofree CwCouplings  *c = g_new0 (CwCouplings, 1); /* about 11 kB */
  g_autofree CwReactivity *re = g_new0 (CwReactivity, 1);
  g_autoptr (GError) ce = NULL;
  g_autoptr (GError) rerr = NULL;
  g_autoptr (GDateTime) now = g_date_time_new_now_local ();
  g_autofree char  *date = g_date_time_format (now, "%Y-%m-%d %H:%M");
  g_autofree char  *footer = g_strdup_printf ("Chairwise %s · %s", PACKAGE_VERSION, date);
  CwTemperatureUnit tunit = cw_document_get_temperature_unit (doc);
  CwRenderOptions   opt;
  Rows              rows = { 0 };
  Report            r;
  double            body, room, f = 1.0, sw;

  g_return_if_fail (cr != NULL && data != NULL && doc != NULL && an != NULL);
  compute_sections (&sec, gd, c, re, &ce, &rerr);
  sec.couplings_error = ce ? ce->message : NULL;
  sec.reactivity_error = rerr ? rerr->message : NULL;
  body = fit_page (&sec, width, height, BODY, tunit, &rows, &room);
  /* A molecule with very many terms and warnings: lay the page out larger and scale it down, so
   * it still fits one page. */
  while (room < FIGURE_MIN && f > 0.5)
    {
      f -= 0.05;
      body = fit_page (&sec, width / f, height / f, BODY_MIN, tunit, &rows, &room);
    }
  report_begin (&r, width / f, height / f, body, tunit);
  build_page (&r, &sec, &rows);
  cw_scene_text_at (r.page, CW_ROLE_CAPTION, CW_INK_MUTED, footer, 6.5, FALSE, width / f / 2, height / f - MARGIN + 4,
                    0.5, 0);

  cw_render_options_init (&opt);
  opt.unit = sec.unit;
  opt.temperature_unit = tunit;
  cairo_save (cr);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  cairo_scale (cr, f, f);
  cw_scene_paint (r.page, cr, FALSE);
  /* The flat structure needs less room than the chairs beside it. */
  sw = 0.8 * rows.row1;
  draw_figure_at (cr, CW_FIGURE_STRUCTURE, data, sec.mol, an, &opt, r.x, rows.row1_y, sw, rows.row1);
  /* The chairs carry the reaction geometry the text describes. */
  opt.highlight_reactivity = sec.reactivity != NULL && sec.reactivity->n_groups > 0;
  opt.reactivity = sec.reactivity;
  draw_figure_at (cr, CW_FIGURE_CHAIRS, data, sec.mol, an, &opt, r.x + sw + 6, rows.row1_y, r.w - sw - 6, rows.row1);
  opt.highlight_reactivity = FALSE;
  opt.reactivity = NULL;
  draw_figure_at (cr, CW_FIGURE_PROFILE, data, sec.mol, an, &opt, r.x, rows.row2_y, r.w / 2 - 4, rows.row2);
  draw_figure_at (cr, CW_FIGURE_SCAN, data, sec.mol, an, &opt, r.x + r.w / 2 + 4, rows.row2_y, r.w / 2 - 4,
                  rows.row2);
  cairo_restore (cr);
  report_end (&r);
}

void
cw_render_report (cairo_t *cr, const CwData *data, const CwDocument *doc, const CwAnalysis *an, double width, double height)
{
  cw_render_report_with_geometry (cr, data, NULL, doc, an, width, height);
}
