#include "config.h"

#include <math.h>

#include "cw-figures.h"
#include "cw-label.h"
#include "cw-render-private.h"

static void
grow (CwBox *b, gboolean *any, double x, double y)
{
  if (!*any)
    {
      *b = (CwBox){ x, y, 0, 0 };
      *any = TRUE;
      return;
    }
  CwBox p = { x, y, 0, 0 };
  *b = cw_box_union (b, &p);
}

CwBox
cw_prim_bounds (const CwScene *scene, const CwPrim *p)
{
  CwBox    b = { 0, 0, 0, 0 };
  gboolean any = FALSE;
  double   r = 0.5 * MAX (p->line_width, p->wide) + (p->halo ? 2.0 : 0.0);

  switch (p->kind)
    {
    case CW_PRIM_TEXT:
      grow (&b, &any, p->box.x, p->box.y);
      grow (&b, &any, p->box.x + p->box.w, p->box.y + p->box.h);
      break;
    case CW_PRIM_RECT:
      grow (&b, &any, p->x0, p->y0);
      grow (&b, &any, p->x0 + p->x1, p->y0 + p->y1);
      break;
    case CW_PRIM_MARKER:
      grow (&b, &any, p->x0 - r, p->y0 - r);
      grow (&b, &any, p->x0 + r, p->y0 + r);
      break;
    case CW_PRIM_POLYLINE:
    case CW_PRIM_POLYGON:
      for (guint k = 0; k < p->n_points; k++)
        {
          CwPoint q = g_array_index (scene->points, CwPoint, p->first_point + k);
          grow (&b, &any, q.x - r, q.y - r);
          grow (&b, &any, q.x + r, q.y + r);
        }
      break;
    case CW_PRIM_LINE:
    case CW_PRIM_WEDGE:
    case CW_PRIM_HASH:
    default:
      grow (&b, &any, p->x0 - r, p->y0 - r);
      grow (&b, &any, p->x1 + r, p->y1 + r);
      grow (&b, &any, p->x0 + r, p->y0 + r);
      grow (&b, &any, p->x1 - r, p->y1 - r);
      break;
    }
  return b;
}

CwBox
cw_scene_bounds (const CwScene *scene)
{
  CwBox b = { 0, 0, 0, 0 };

  for (guint i = 0; i < scene->prims->len; i++)
    {
      CwBox pb = cw_prim_bounds (scene, &g_array_index (scene->prims, CwPrim, i));

      b = i == 0 ? pb : cw_box_union (&b, &pb);
    }
  return b;
}

void
cw_scene_fit (CwScene *scene, double margin)
{
  CwBox  b = cw_scene_bounds (scene);
  double w = b.w + 2 * margin, h = b.h + 2 * margin;
  double cx = b.x + 0.5 * b.w, cy = b.y + 0.5 * b.h;

  /* Keep the design box where it is big enough: grow it only when the content spills over. */
  if (b.x - margin >= 0 && b.y - margin >= 0 && b.x + b.w + margin <= scene->width &&
      b.y + b.h + margin <= scene->height)
    return;
  w = MAX (w, scene->width);
  h = MAX (h, scene->height);
  scene->origin_x = cx - 0.5 * w;
  scene->origin_y = cy - 0.5 * h;
  scene->width = w;
  scene->height = h;
}

void
cw_scene_fit_tight (CwScene *scene, double margin)
{
  CwBox b = cw_scene_bounds (scene);

  scene->origin_x = b.x - margin;
  scene->origin_y = b.y - margin;
  scene->width = b.w + 2 * margin;
  scene->height = b.h + 2 * margin;
}

void
cw_scene_highlight (CwScene *scene, const CwBox *box)
{
  CwPrim *p = cw_scene_add (scene, CW_PRIM_RECT, CW_ROLE_NONE, CW_INK_HIGHLIGHT);

  p->x0 = box->x - 3;
  p->y0 = box->y - 2;
  p->x1 = box->w + 6;
  p->y1 = box->h + 4;
  p->fill = TRUE;
}

void
cw_scene_message (CwScene *scene, const char *text)
{
  g_autofree char *esc = g_markup_escape_text (text, -1);

  cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_MUTED, esc, 12, FALSE,
                    scene->width / 2, scene->height / 2, 0.5, 0.5);
}

static int
text_hits (const CwScene *scene, const CwBox *box)
{
  int hits = 0;

  for (guint i = 0; i < scene->prims->len; i++)
    {
      const CwPrim *p = &g_array_index (scene->prims, CwPrim, i);

      /* Text on text is far worse than text across a line. */
      if (p->kind == CW_PRIM_TEXT)
        hits += 100 * cw_box_overlap (box, &p->box, 1.0);
      else if ((p->kind == CW_PRIM_LINE || p->kind == CW_PRIM_WEDGE || p->kind == CW_PRIM_HASH) &&
               (p->role == CW_ROLE_RING_BOND || p->role == CW_ROLE_SUB_BOND || p->role == CW_ROLE_HYDROGEN))
        hits += cw_segment_hits_box (p->x0, p->y0, p->x1, p->y1, box);
      else if (p->kind == CW_PRIM_POLYLINE && p->role == CW_ROLE_INTERACTION)
        for (guint k = 0; k + 1 < p->n_points; k++)
          {
            CwPoint a = g_array_index (scene->points, CwPoint, p->first_point + k);
            CwPoint b = g_array_index (scene->points, CwPoint, p->first_point + k + 1);
            hits += cw_segment_hits_box (a.x, a.y, b.x, b.y, box);
          }
    }
  return hits;
}

CwPrim *
cw_scene_text_free (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, const CwPoint *cands, guint n_cands, double ax, double ay)
{
  CwTextMetrics m;
  guint         pick = 0;
  CwPrim       *p;

  int best = G_MAXINT;

  cw_text_measure (markup, size, FALSE, 0, 0, 0, &m);
  for (guint i = 0; i < n_cands && best > 0; i++)
    {
      CwBox box = { cands[i].x - ax * m.w, cands[i].y - ay * m.h, m.w, m.h };
      int   hits = text_hits (scene, &box);

      if (hits < best)
        {
          best = hits;
          pick = i;
        }
    }
  p = cw_scene_add (scene, CW_PRIM_TEXT, role, ink);
  p->markup = g_strdup (markup);
  p->size = size;
  p->box = (CwBox){ cands[pick].x - ax * m.w, cands[pick].y - ay * m.h, m.w, m.h };
  return p;
}

void
cw_placer_init (CwPlacer *pl)
{
  pl->segments = g_array_new (FALSE, FALSE, sizeof (CwBox));
  pl->labels = g_array_new (FALSE, FALSE, sizeof (CwBox));
}

void
cw_placer_clear (CwPlacer *pl)
{
  g_clear_pointer (&pl->segments, g_array_unref);
  g_clear_pointer (&pl->labels, g_array_unref);
}

void
cw_placer_add_segment (CwPlacer *pl, double x0, double y0, double x1, double y1)
{
  CwBox s = { x0, y0, x1 - x0, y1 - y0 };

  g_array_append_val (pl->segments, s);
}

void
cw_placer_add_box (CwPlacer *pl, const CwBox *box)
{
  g_array_append_val (pl->labels, *box);
}

int
cw_placer_count_hits (const CwPlacer *pl, const CwBox *box, double x0, double y0, double x1, double y1)
{
  CwBox grown = { box->x - 1.5, box->y - 1.5, box->w + 3, box->h + 3 };
  int   hits = 0;

  for (guint i = 0; i < pl->labels->len; i++)
    {
      const CwBox *o = &g_array_index (pl->labels, CwBox, i);

      hits += cw_box_overlap (box, o, 2.0);
      hits += cw_segment_hits_box (x0, y0, x1, y1, o);
    }
  for (guint i = 0; i < pl->segments->len; i++)
    {
      const CwBox *s = &g_array_index (pl->segments, CwBox, i);

      hits += cw_segment_hits_box (s->x, s->y, s->x + s->w, s->y + s->h, &grown);
    }
  return hits;
}

gboolean
cw_placer_collides (const CwPlacer *pl, const CwBox *box, double x0, double y0, double x1, double y1)
{
  return cw_placer_count_hits (pl, box, x0, y0, x1, y1) > 0;
}

int
cw_placer_place_label (const CwPlacer *pl, const char *markup, double size, double px, double py, double dx, double dy, double base, CwLabelPlace *place, CwLabelText *lt)
{
  int          best = G_MAXINT;
  CwLabelPlace cand;

  /* Longer bonds first (up to about twice as long), then shorter ones; the first clear spot wins,
   * else the one that hits least. The label text depends on the direction only. */
  for (int t = 0; t < 31 && best > 0; t++)
    {
      double len = t < 26 ? base + 4.0 * t : base * (0.85 - 0.1 * (t - 26));
      int    hits;

      cw_label_text_clear (lt);
      cw_label_place (markup, size, px, py, dx, dy, len, &cand, lt);
      hits = cw_placer_count_hits (pl, &cand.box, px, py, cand.ex, cand.ey);
      if (hits < best)
        {
          best = hits;
          *place = cand;
        }
    }
  return best;
}
