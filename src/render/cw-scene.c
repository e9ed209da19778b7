#include "config.h"

#include "cw-scene.h"

#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

#include "cw-render-private.h"

static void
prim_clear (gpointer p)
{
  CwPrim *prim = p;

  g_clear_pointer (&prim->markup, g_free);
}

CwScene *
cw_scene_new (double width, double height)
{
  CwScene *scene = g_new0 (CwScene, 1);

  scene->prims = g_array_sized_new (FALSE, TRUE, sizeof (CwPrim), 128);
  g_array_set_clear_func (scene->prims, prim_clear);
  scene->points = g_array_new (FALSE, TRUE, sizeof (CwPoint));
  scene->width = width;
  scene->height = height;
  return scene;
}

void
cw_scene_free (CwScene *scene)
{
  if (scene == NULL)
    return;
  g_array_unref (scene->prims);
  g_array_unref (scene->points);
  g_free (scene);
}

static gboolean
near (double a, double b, double tolerance)
{
  return a == b || fabs (a - b) < tolerance;
}

static gboolean
prim_equal (const CwPrim *a, const CwPrim *b, double tol)
{
  return a->kind == b->kind && a->role == b->role && a->ink == b->ink && a->chair == b->chair &&
         a->sub == b->sub && a->position == b->position && a->axial == b->axial && near (a->x0, b->x0, tol) &&
         near (a->y0, b->y0, tol) && near (a->x1, b->x1, tol) && near (a->y1, b->y1, tol) &&
         a->line_width == b->line_width && near (a->wide, b->wide, tol) && a->dash == b->dash &&
         a->fill == b->fill && a->halo == b->halo && a->halo_ink == b->halo_ink && a->marker == b->marker &&
         a->first_point == b->first_point && a->n_points == b->n_points && g_strcmp0 (a->markup, b->markup) == 0 &&
         a->size == b->size && a->bold == b->bold && a->wrap == b->wrap && near (a->box.x, b->box.x, tol) &&
         near (a->box.y, b->box.y, tol) && near (a->box.w, b->box.w, tol) && near (a->box.h, b->box.h, tol);
}

gboolean
cw_scene_equal_within (const CwScene *a, const CwScene *b, double tolerance)
{
  if (a == b)
    return TRUE;
  if (a == NULL || b == NULL)
    return FALSE;
  if (a->width != b->width || a->height != b->height || !near (a->origin_x, b->origin_x, tolerance) ||
      !near (a->origin_y, b->origin_y, tolerance) || a->prims->len != b->prims->len ||
      a->points->len != b->points->len)
    return FALSE;
  for (guint i = 0; i < a->points->len; i++)
    {
      const CwPoint *p = &g_array_index (a->points, CwPoint, i), *q = &g_array_index (b->points, CwPoint, i);

      if (!near (p->x, q->x, tolerance) || !near (p->y, q->y, tolerance))
        return FALSE;
    }
  for (guint i = 0; i < a->prims->len; i++)
    if (!prim_equal (&g_array_index (a->prims, CwPrim, i), &g_array_index (b->prims, CwPrim, i), tolerance))
      return FALSE;
  return TRUE;
}

gboolean
cw_scene_equal (const CwScene *a, const CwScene *b)
{
  return cw_scene_equal_within (a, b, 0.0);
}

CwPrim *
cw_scene_add (CwScene *scene, CwPrimKind kind, CwRole role, CwInk ink)
{
  CwPrim prim = { 0 };

  prim.kind = kind;
  prim.role = role;
  prim.ink = ink;
  prim.chair = -1;
  prim.sub = -1;
  prim.line_width = 1.0;
  g_array_append_val (scene->prims, prim);
  return &g_array_index (scene->prims, CwPrim, scene->prims->len - 1);
}

CwPrim *
cw_scene_get (const CwScene *scene, guint i)
{
  g_return_val_if_fail (i < scene->prims->len, NULL);
  return &g_array_index (scene->prims, CwPrim, i);
}

void
cw_scene_append (CwScene *scene, const CwScene *src, double dx, double dy)
{
  for (guint i = 0; i < src->prims->len; i++)
    {
      CwPrim p = g_array_index (src->prims, CwPrim, i);

      p.markup = g_strdup (p.markup);
      p.x0 += dx;
      p.y0 += dy;
      p.box.x += dx;
      p.box.y += dy;
      if (p.kind != CW_PRIM_RECT) /* x1, y1 of a rectangle are its size */
        {
          p.x1 += dx;
          p.y1 += dy;
        }
      if (p.n_points > 0)
        {
          guint first = p.first_point;

          p.first_point = scene->points->len;
          for (guint k = 0; k < p.n_points; k++)
            {
              CwPoint q = g_array_index (src->points, CwPoint, first + k);

              q.x += dx;
              q.y += dy;
              g_array_append_val (scene->points, q);
            }
        }
      g_array_append_val (scene->prims, p);
    }
}

guint
cw_scene_get_n (const CwScene *scene)
{
  return scene->prims->len;
}

CwPrim *
cw_scene_line (CwScene *scene, CwRole role, CwInk ink, double x0, double y0, double x1, double y1, double width)
{
  CwPrim *p = cw_scene_add (scene, CW_PRIM_LINE, role, ink);

  p->x0 = x0;
  p->y0 = y0;
  p->x1 = x1;
  p->y1 = y1;
  p->line_width = width;
  return p;
}

static CwPrim *
add_points (CwScene *scene, CwPrimKind kind, CwRole role, CwInk ink, const CwPoint *pts, guint n)
{
  CwPrim *p = cw_scene_add (scene, kind, role, ink);

  p->first_point = scene->points->len;
  p->n_points = n;
  g_array_append_vals (scene->points, pts, n);
  return p;
}

CwPrim *
cw_scene_polyline (CwScene *scene, CwRole role, CwInk ink, const CwPoint *pts, guint n, double width)
{
  CwPrim *p = add_points (scene, CW_PRIM_POLYLINE, role, ink, pts, n);

  p->line_width = width;
  return p;
}

CwPrim *
cw_scene_polygon (CwScene *scene, CwRole role, CwInk ink, const CwPoint *pts, guint n)
{
  CwPrim *p = add_points (scene, CW_PRIM_POLYGON, role, ink, pts, n);

  p->fill = TRUE;
  return p;
}

static void
arrow_head (CwScene *scene, CwRole role, CwInk ink, double x0, double y0, double x1, double y1, double width)
{
  double  len = hypot (x1 - x0, y1 - y0);
  double  ux, uy, hl = 4.0 + 2.5 * width, hw = 1.5 + 1.2 * width;
  CwPoint pts[3];

  if (len < 1e-9)
    return;
  ux = (x1 - x0) / len;
  uy = (y1 - y0) / len;
  pts[0] = (CwPoint){ x1, y1 };
  pts[1] = (CwPoint){ x1 - hl * ux - hw * uy, y1 - hl * uy + hw * ux };
  pts[2] = (CwPoint){ x1 - hl * ux + hw * uy, y1 - hl * uy - hw * ux };
  cw_scene_polygon (scene, role, ink, pts, 3);
}

void
cw_scene_arrow (CwScene *scene, CwRole role, CwInk ink, double x0, double y0, double x1, double y1, double width, gboolean both)
{
  double len = hypot (x1 - x0, y1 - y0);
  double hl = 4.0 + 2.5 * width;
  double ux, uy;

  if (len < 1e-9)
    return;
  ux = (x1 - x0) / len;
  uy = (y1 - y0) / len;
  /* Stop the shaft inside the head so the tip stays sharp. */
  cw_scene_line (scene, role, ink, both ? x0 + ux * hl * 0.6 : x0, both ? y0 + uy * hl * 0.6 : y0,
                 x1 - ux * hl * 0.6, y1 - uy * hl * 0.6, width);
  arrow_head (scene, role, ink, x0, y0, x1, y1, width);
  if (both)
    arrow_head (scene, role, ink, x1, y1, x0, y0, width);
}

CwPrim *
cw_scene_text (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, gboolean bold, double x, double y)
{
  return cw_scene_text_at (scene, role, ink, markup, size, bold, x, y, 0.0, 0.0);
}

CwPrim *
cw_scene_text_at (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, gboolean bold, double x, double y, double ax, double ay)
{
  CwTextMetrics m;
  CwPrim       *p;

  cw_text_measure (markup, size, bold, 0, 0, 0, &m);
  p = cw_scene_add (scene, CW_PRIM_TEXT, role, ink);
  p->markup = g_strdup (markup);
  p->size = size;
  p->bold = bold;
  p->box = (CwBox){ x - ax * m.w, y - ay * m.h, m.w, m.h };
  return p;
}

CwPrim *
cw_scene_paragraph (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, double x, double y, double wrap)
{
  CwTextMetrics m;
  CwPrim       *p;

  cw_text_measure (markup, size, FALSE, wrap, 0, 0, &m);
  p = cw_scene_add (scene, CW_PRIM_TEXT, role, ink);
  p->markup = g_strdup (markup);
  p->size = size;
  p->wrap = wrap;
  p->box = (CwBox){ x, y, wrap, m.h };
  return p;
}

gboolean
cw_box_overlap (const CwBox *a, const CwBox *b, double pad)
{
  return a->x - pad < b->x + b->w && b->x - pad < a->x + a->w &&
         a->y - pad < b->y + b->h && b->y - pad < a->y + a->h;
}

CwBox
cw_box_union (const CwBox *a, const CwBox *b)
{
  double x0 = MIN (a->x, b->x), y0 = MIN (a->y, b->y);
  double x1 = MAX (a->x + a->w, b->x + b->w), y1 = MAX (a->y + a->h, b->y + b->h);

  return (CwBox){ x0, y0, x1 - x0, y1 - y0 };
}

/* Liang–Barsky clip of the segment against the box. */
gboolean
cw_segment_hits_box (double x0, double y0, double x1, double y1, const CwBox *box)
{
  double dx = x1 - x0, dy = y1 - y0;
  double p[4] = { -dx, dx, -dy, dy };
  double q[4] = { x0 - box->x, box->x + box->w - x0, y0 - box->y, box->y + box->h - y0 };
  double t0 = 0.0, t1 = 1.0;

  for (int i = 0; i < 4; i++)
    {
      if (fabs (p[i]) < 1e-12)
        {
          if (q[i] < 0)
            return FALSE;
          continue;
        }
      double t = q[i] / p[i];
      if (p[i] < 0)
        t0 = MAX (t0, t);
      else
        t1 = MIN (t1, t);
      if (t0 > t1)
        return FALSE;
    }
  return TRUE;
}

gboolean
cw_scene_box_hits_text (const CwScene *scene, const CwBox *box, double pad, int skip)
{
  for (guint i = 0; i < scene->prims->len; i++)
    {
      const CwPrim *p = &g_array_index (scene->prims, CwPrim, i);

      if ((int) i != skip && p->kind == CW_PRIM_TEXT && cw_box_overlap (box, &p->box, pad))
        return TRUE;
    }
  return FALSE;
}

/* One measuring context per thread: Pango font maps are per thread. */
static PangoContext *
measure_context (void)
{
  static GPrivate key = G_PRIVATE_INIT (g_object_unref);
  PangoContext   *ctx = g_private_get (&key);

  if (ctx == NULL)
    {
      PangoFontMap         *map = pango_cairo_font_map_get_default ();
      cairo_font_options_t *fo = cairo_font_options_create ();

      ctx = pango_font_map_create_context (map);
      pango_cairo_context_set_resolution (ctx, 72.0);
      cairo_font_options_set_hint_metrics (fo, CAIRO_HINT_METRICS_OFF);
      cairo_font_options_set_hint_style (fo, CAIRO_HINT_STYLE_NONE);
      pango_cairo_context_set_font_options (ctx, fo);
      cairo_font_options_destroy (fo);
      pango_context_set_round_glyph_positions (ctx, FALSE);
      g_private_set (&key, ctx);
    }
  return ctx;
}

PangoLayout *
cw_text_layout_new (const char *markup, double size, gboolean bold, double wrap)
{
  PangoLayout          *layout = pango_layout_new (measure_context ());
  PangoFontDescription *desc = pango_font_description_from_string (CW_FONT_FAMILY);

  pango_font_description_set_absolute_size (desc, size * PANGO_SCALE);
  if (bold)
    pango_font_description_set_weight (desc, PANGO_WEIGHT_BOLD);
  pango_layout_set_font_description (layout, desc);
  pango_font_description_free (desc);
  if (wrap > 0)
    {
      pango_layout_set_width (layout, (int) (wrap * PANGO_SCALE));
      pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
    }
  pango_layout_set_markup (layout, markup, -1);
  return layout;
}

/* Laid-out texts, per thread, so painting the same label again (every frame of the
 * window, every band of a PNG) does not shape it again. Two generations: a text used
 * since the last turnover stays; the older generation is dropped at each turnover. */
#define LAYOUT_GENERATION 256

typedef struct
{
  GHashTable *current;
  GHashTable *previous;
} LayoutCache;

static void
layout_cache_free (gpointer data)
{
  LayoutCache *c = data;

  g_hash_table_unref (c->current);
  g_hash_table_unref (c->previous);
  g_free (c);
}

static GHashTable *
layout_table_new (void)
{
  return g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_object_unref);
}

PangoLayout *
cw_text_layout_get (const char *markup, double size, gboolean bold, double wrap)
{
  static GPrivate  key = G_PRIVATE_INIT (layout_cache_free);
  LayoutCache     *c = g_private_get (&key);
  g_autofree char *k = g_strdup_printf ("%g|%d|%g|%s", size, bold, wrap, markup);
  PangoLayout     *layout;

  if (c == NULL)
    {
      c = g_new0 (LayoutCache, 1);
      c->current = layout_table_new ();
      c->previous = layout_table_new ();
      g_private_set (&key, c);
    }
  layout = g_hash_table_lookup (c->current, k);
  if (layout != NULL)
    return g_object_ref (layout);
  layout = g_hash_table_lookup (c->previous, k);
  if (layout != NULL)
    g_object_ref (layout);
  else
    layout = cw_text_layout_new (markup, size, bold, wrap);
  if (g_hash_table_size (c->current) >= LAYOUT_GENERATION)
    {
      g_hash_table_unref (c->previous);
      c->previous = c->current;
      c->current = layout_table_new ();
    }
  g_hash_table_insert (c->current, g_steal_pointer (&k), g_object_ref (layout));
  return layout;
}

/* Measurements repeat a lot (every try of every label): keep them, per thread. */
static GHashTable *
measure_cache (void)
{
  static GPrivate key = G_PRIVATE_INIT ((GDestroyNotify) g_hash_table_unref);
  GHashTable     *cache = g_private_get (&key);

  if (cache == NULL || g_hash_table_size (cache) > 8192)
    {
      cache = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
      g_private_replace (&key, cache);
    }
  return cache;
}

void
cw_text_measure (const char *markup, double size, gboolean bold, double wrap, int range_start, int range_end, CwTextMetrics *out)
{
  GHashTable      *cache = measure_cache ();
  g_autofree char *k = g_strdup_printf ("%g|%d|%g|%d|%d|%s", size, bold, wrap, range_start, range_end, markup);
  CwTextMetrics   *hit = g_hash_table_lookup (cache, k);

  if (hit != NULL)
    {
      *out = *hit;
      return;
    }
  g_autoptr (PangoLayout) layout = cw_text_layout_get (markup, size, bold, wrap);
  PangoRectangle logical;

  pango_layout_get_extents (layout, NULL, &logical);
  out->w = (double) logical.width / PANGO_SCALE;
  out->h = (double) logical.height / PANGO_SCALE;
  out->baseline = (double) pango_layout_get_baseline (layout) / PANGO_SCALE;
  out->atom_x0 = 0;
  out->atom_x1 = out->w;
  if (range_end > range_start)
    {
      PangoRectangle a, b;

      const char *text = pango_layout_get_text (layout);
      const char *last = g_utf8_find_prev_char (text, text + range_end);

      pango_layout_index_to_pos (layout, range_start, &a);
      pango_layout_index_to_pos (layout, last ? (int) (last - text) : range_start, &b);
      out->atom_x0 = (double) MIN (a.x, b.x) / PANGO_SCALE;
      out->atom_x1 = (double) MAX (a.x + a.width, b.x + b.width) / PANGO_SCALE;
    }
  g_hash_table_insert (cache, g_steal_pointer (&k), g_memdup2 (out, sizeof *out));
}

char *
cw_markup_dup_plain (const char *markup)
{
  char *text = NULL;

  if (!pango_parse_markup (markup, -1, 0, NULL, &text, NULL, NULL))
    return g_strdup (markup);
  return text;
}
