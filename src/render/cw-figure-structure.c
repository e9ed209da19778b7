#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-figures.h"
#include "cw-label.h"
#include "cw-render-private.h"

/* The flat structure: a hexagon with position 1 at the top, numbered clockwise as seen from the
 * up face (the reader's side), each group on a solid (up) or hashed (down) wedge. */

#define LABEL_SIZE 13.0
#define NUMBER_SIZE 9.0
#define SPLAY (G_PI / 6.4) /* half-angle between the two groups on one carbon */

typedef struct
{
  CwScene *scene;
  double   cx, cy, radius;
  CwPoint  atom[6];
  CwPlacer placer;
} Layout;

static void
place_sub (Layout *lay, const CwMolecule *mol, int i, double angle, const CwRenderOptions *opt)
{
  const CwSubstituent *sub = &mol->subs[i];
  CwPoint              a = lay->atom[sub->position - 1];
  double               dx = cos (angle), dy = -sin (angle);
  double               base = 0.62 * lay->radius;
  CwLabelPlace         place = { 0 };
  CwLabelText          lt = { 0 };
  CwPrim              *p;

  cw_placer_place_label (&lay->placer, sub->group->markup, LABEL_SIZE, a.x, a.y, dx, dy, base, &place, &lt);
  if (opt->highlight_sub == i)
    cw_scene_highlight (lay->scene, &place.box);
  p = cw_scene_add (lay->scene, sub->face == CW_FACE_UP ? CW_PRIM_WEDGE : CW_PRIM_HASH,
                    CW_ROLE_SUB_BOND, CW_INK_BOND);
  p->x0 = a.x;
  p->y0 = a.y;
  p->x1 = place.ex;
  p->y1 = place.ey;
  p->wide = 6.5;
  p->line_width = 1.1;
  p->sub = i;
  p->position = sub->position;
  p = cw_label_add (lay->scene, &lt, &place, LABEL_SIZE, CW_ROLE_SUB_LABEL, CW_INK_TEXT, opt->highlight_sub == i);
  p->sub = i;
  p->position = sub->position;
  cw_placer_add_box (&lay->placer, &place.box);
  cw_placer_add_segment (&lay->placer, a.x, a.y, place.ex, place.ey);
  cw_label_text_clear (&lt);
}

static void
draw_ring (Layout *lay)
{
  for (int k = 0; k < 6; k++)
    {
      double th = G_PI / 2 - k * G_PI / 3;
      lay->atom[k] = (CwPoint){ lay->cx + lay->radius * cos (th), lay->cy - lay->radius * sin (th) };
    }
  for (int k = 0; k < 6; k++)
    {
      CwPoint          p = lay->atom[k], q = lay->atom[(k + 1) % 6];
      CwPrim          *b = cw_scene_line (lay->scene, CW_ROLE_RING_BOND, CW_INK_BOND, p.x, p.y, q.x, q.y, 1.6);
      g_autofree char *num = g_strdup_printf ("%d", k + 1);
      double           nx = lay->cx + 0.74 * (p.x - lay->cx), ny = lay->cy + 0.74 * (p.y - lay->cy);
      CwPrim          *t;

      b->position = k + 1;
      cw_placer_add_segment (&lay->placer, p.x, p.y, q.x, q.y);
      t = cw_scene_text_at (lay->scene, CW_ROLE_POSITION_LABEL, CW_INK_MUTED, num, NUMBER_SIZE, FALSE,
                            nx, ny, 0.5, 0.5);
      t->position = k + 1;
      cw_placer_add_box (&lay->placer, &t->box);
    }
}

CwScene *
cw_structure_build (const CwMolecule *mol, const CwRenderOptions *opt, double width, double height)
{
  CwScene         *scene = cw_scene_new (width, height);
  Layout           lay = { scene, width / 2, height / 2 - 8, 0.23 * MIN (width, height - 20), { { 0 } }, { 0 } };
  g_autofree char *config = NULL;

  cw_placer_init (&lay.placer);
  draw_ring (&lay);
  for (int i = 0; i < mol->n_subs; i++)
    {
      const CwSubstituent *s = &mol->subs[i];
      double               radial = G_PI / 2 - (s->position - 1) * G_PI / 3;
      const CwSubstituent *other = cw_molecule_get (mol, s->position, s->face == CW_FACE_UP ? CW_FACE_DOWN : CW_FACE_UP);
      double               angle = radial;

      if (other != NULL)
        angle += s->face == CW_FACE_UP ? SPLAY : -SPLAY;
      place_sub (&lay, mol, i, angle, opt);
    }
  config = cw_molecule_dup_configuration (mol);
  if (config != NULL && *config)
    {
      g_autofree char *esc = g_markup_escape_text (config, -1);
      CwBox            b = cw_scene_bounds (scene);
      cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_MUTED, esc, 11, FALSE, lay.cx, b.y + b.h + 8, 0.5, 0);
    }
  cw_placer_clear (&lay.placer);
  cw_scene_fit_tight (scene, 8);
  return scene;
}
