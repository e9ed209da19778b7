#include "config.h"

#include <math.h>

#include "cw-render-private.h"

/* Colours of our own, built on the Okabe–Ito set (safe for the common colour-vision deficiencies);
 * meaning is also carried by line style, marker shape or text. Exports always use the light set. */
static const double light[CW_N_INKS][3] = {
  [CW_INK_BACKGROUND] = { 1.0, 1.0, 1.0 },
  [CW_INK_TEXT] = { 0.10, 0.10, 0.10 },
  [CW_INK_BOND] = { 0.0, 0.0, 0.0 },
  [CW_INK_MUTED] = { 0.36, 0.36, 0.36 },
  [CW_INK_GRID] = { 0.84, 0.84, 0.84 },
  [CW_INK_SERIES_1] = { 0.0, 0.447, 0.698 },    /* blue */
  [CW_INK_SERIES_2] = { 0.835, 0.369, 0.0 },    /* vermilion */
  [CW_INK_SERIES_3] = { 0.0, 0.620, 0.451 },    /* bluish green */
  [CW_INK_STRAIN] = { 0.835, 0.369, 0.0 },      /* vermilion */
  [CW_INK_GAUCHE] = { 0.0, 0.447, 0.698 },      /* blue */
  [CW_INK_HIGHLIGHT] = { 0.941, 0.894, 0.259 }, /* yellow, under text only */
  [CW_INK_PANEL] = { 0.945, 0.957, 0.973 },
};

static const double dark[CW_N_INKS][3] = {
  [CW_INK_BACKGROUND] = { 0.12, 0.12, 0.13 },
  [CW_INK_TEXT] = { 0.93, 0.93, 0.93 },
  [CW_INK_BOND] = { 0.96, 0.96, 0.96 },
  [CW_INK_MUTED] = { 0.68, 0.68, 0.68 },
  [CW_INK_GRID] = { 0.30, 0.30, 0.32 },
  [CW_INK_SERIES_1] = { 0.337, 0.706, 0.914 }, /* sky blue */
  [CW_INK_SERIES_2] = { 0.902, 0.624, 0.0 },   /* orange */
  [CW_INK_SERIES_3] = { 0.0, 0.75, 0.55 },
  [CW_INK_STRAIN] = { 0.902, 0.624, 0.0 },
  [CW_INK_GAUCHE] = { 0.337, 0.706, 0.914 },
  [CW_INK_HIGHLIGHT] = { 0.45, 0.40, 0.05 },
  [CW_INK_PANEL] = { 0.17, 0.18, 0.20 },
};

void
cw_palette_get (CwInk ink, gboolean is_dark, double rgb[3])
{
  const double *c = is_dark ? dark[ink] : light[ink];

  rgb[0] = c[0];
  rgb[1] = c[1];
  rgb[2] = c[2];
}

void
cw_palette_set_source (cairo_t *cr, CwInk ink, gboolean is_dark)
{
  double rgb[3];

  cw_palette_get (ink, is_dark, rgb);
  cairo_set_source_rgb (cr, rgb[0], rgb[1], rgb[2]);
}

static void
paint_wedge (cairo_t *cr, const CwPrim *p)
{
  double len = hypot (p->x1 - p->x0, p->y1 - p->y0);
  double nx, ny;

  if (len < 1e-6)
    return;
  nx = -(p->y1 - p->y0) / len;
  ny = (p->x1 - p->x0) / len;
  if (p->kind == CW_PRIM_WEDGE)
    {
      cairo_move_to (cr, p->x0 + nx * 0.4, p->y0 + ny * 0.4);
      cairo_line_to (cr, p->x1 + nx * p->wide / 2, p->y1 + ny * p->wide / 2);
      cairo_line_to (cr, p->x1 - nx * p->wide / 2, p->y1 - ny * p->wide / 2);
      cairo_line_to (cr, p->x0 - nx * 0.4, p->y0 - ny * 0.4);
      cairo_close_path (cr);
      cairo_fill (cr);
      return;
    }
  /* Hashes: rungs across the wedge, about 2.6 units apart, widening away from the ring. */
  int n = MAX (3, (int) floor (len / 2.6));
  cairo_set_line_width (cr, 1.0);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  for (int i = 0; i <= n; i++)
    {
      double t = (double) i / n;
      double half = 0.5 + (p->wide / 2 - 0.5) * t;
      double x = p->x0 + (p->x1 - p->x0) * t, y = p->y0 + (p->y1 - p->y0) * t;

      cairo_move_to (cr, x + nx * half, y + ny * half);
      cairo_line_to (cr, x - nx * half, y - ny * half);
    }
  cairo_stroke (cr);
}

static void
paint_marker (cairo_t *cr, const CwPrim *p)
{
  double r = p->wide / 2;

  switch (p->marker)
    {
    case CW_MARKER_CIRCLE:
      cairo_arc (cr, p->x0, p->y0, r, 0, 2 * G_PI);
      break;
    case CW_MARKER_SQUARE:
      cairo_rectangle (cr, p->x0 - r * 0.85, p->y0 - r * 0.85, 1.7 * r, 1.7 * r);
      break;
    case CW_MARKER_TRIANGLE:
      cairo_move_to (cr, p->x0, p->y0 - r * 1.1);
      cairo_line_to (cr, p->x0 + r, p->y0 + r * 0.8);
      cairo_line_to (cr, p->x0 - r, p->y0 + r * 0.8);
      cairo_close_path (cr);
      break;
    case CW_MARKER_DIAMOND:
      cairo_move_to (cr, p->x0, p->y0 - r * 1.2);
      cairo_line_to (cr, p->x0 + r, p->y0);
      cairo_line_to (cr, p->x0, p->y0 + r * 1.2);
      cairo_line_to (cr, p->x0 - r, p->y0);
      cairo_close_path (cr);
      break;
    default:
      break;
    }
  if (p->fill)
    cairo_fill (cr);
  else
    {
      cairo_set_line_width (cr, 1.2);
      cairo_stroke (cr);
    }
}

static void
paint_points (cairo_t *cr, const CwScene *scene, const CwPrim *p)
{
  for (guint i = 0; i < p->n_points; i++)
    {
      CwPoint q = g_array_index (scene->points, CwPoint, p->first_point + i);

      if (i == 0)
        cairo_move_to (cr, q.x, q.y);
      else
        cairo_line_to (cr, q.x, q.y);
    }
  if (p->kind == CW_PRIM_POLYGON)
    {
      cairo_close_path (cr);
      cairo_fill (cr);
    }
  else
    cairo_stroke (cr);
}

static void
paint_prim (cairo_t *cr, const CwScene *scene, const CwPrim *p, gboolean is_dark)
{
  double dashes[2];

  cw_palette_set_source (cr, p->ink, is_dark);
  cairo_set_line_width (cr, p->line_width);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  /* Dots (dash < 2) and dashes have square ends and are as long as round ends would make
   * them: Cairo builds each round end as a small polygon, and the dotted guide lines of a
   * plot have hundreds of them (they were a third of the energy profile's drawing time). */
  if (p->dash > 0)
    {
      double gap = p->dash < 2 ? p->dash + 2.0 : p->dash * 0.7;

      dashes[0] = p->dash + p->line_width;
      dashes[1] = MAX (gap - p->line_width, 0.1);
      cairo_set_dash (cr, dashes, 2, 0);
      cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
    }
  else
    cairo_set_dash (cr, NULL, 0, 0);
  switch (p->kind)
    {
    case CW_PRIM_LINE:
      if (p->halo)
        {
          /* Start the margin a little away from the line's own atom, which it must not erase. */
          double f = 0.22;
          cw_palette_set_source (cr, p->halo_ink, is_dark);
          cairo_set_line_width (cr, p->line_width + 4.0);
          cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
          cairo_move_to (cr, p->x0 + (p->x1 - p->x0) * f, p->y0 + (p->y1 - p->y0) * f);
          cairo_line_to (cr, p->x1, p->y1);
          cairo_stroke (cr);
          cw_palette_set_source (cr, p->ink, is_dark);
          cairo_set_line_width (cr, p->line_width);
          cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
        }
      cairo_move_to (cr, p->x0, p->y0);
      cairo_line_to (cr, p->x1, p->y1);
      cairo_stroke (cr);
      break;
    case CW_PRIM_WEDGE:
    case CW_PRIM_HASH:
      paint_wedge (cr, p);
      break;
    case CW_PRIM_POLYLINE:
    case CW_PRIM_POLYGON:
      paint_points (cr, scene, p);
      break;
    case CW_PRIM_MARKER:
      paint_marker (cr, p);
      break;
    case CW_PRIM_RECT:
      cairo_rectangle (cr, p->x0, p->y0, p->x1, p->y1);
      if (p->fill)
        cairo_fill (cr);
      else
        cairo_stroke (cr);
      break;
    case CW_PRIM_TEXT:
      {
        g_autoptr (PangoLayout) layout = cw_text_layout_get (p->markup, p->size, p->bold, p->wrap);

        cairo_move_to (cr, p->box.x, p->box.y);
        pango_cairo_show_layout (cr, layout);
        cairo_new_path (cr);
      }
      break;
    default:
      break;
    }
}

void
cw_scene_paint (const CwScene *scene, cairo_t *cr, gboolean is_dark)
{
  double cx0, cy0, cx1, cy1;
  CwBox  clip;

  /* Skip what falls outside the clip: a PNG is painted band by band. */
  cairo_clip_extents (cr, &cx0, &cy0, &cx1, &cy1);
  clip = (CwBox){ cx0 - 1, cy0 - 1, cx1 - cx0 + 2, cy1 - cy0 + 2 };
  for (guint i = 0; i < scene->prims->len; i++)
    {
      CwBox b = cw_prim_bounds (scene, &g_array_index (scene->prims, CwPrim, i));

      if (!cw_box_overlap (&b, &clip, 0))
        continue;
      cairo_save (cr);
      paint_prim (cr, scene, &g_array_index (scene->prims, CwPrim, i), is_dark);
      cairo_restore (cr);
    }
}
