#include "config.h"

#include "cw-figure-reaction.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-render-private.h"

/* Reaction geometry on the chairs: which β-hydrogens an E2 can take from each leaving group.
 * The marks do not rely on colour: the leaving group's bond is heavy, each anti-periplanar
 * hydrogen's bond is heavier than the other hydrogens', and its H is ringed and labelled "ap". */

#define LG_WIDTH 3.4 /* leaving group's bond; substituent bonds 1.3, major ring bonds 2.6 */
#define AP_WIDTH 1.8 /* anti-periplanar hydrogen's bond; other hydrogens 0.8 */
#define AP_SIZE 8.5  /* the "ap" label */

const CwReactivity *
cw_chairs_reaction_prepare (const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, CwReactivity **owned)
{
  const CwGeometryData *gd;

  *owned = NULL;
  if (!opt->highlight_reactivity)
    return NULL;
  if (opt->reactivity != NULL)
    return opt->reactivity;
  gd = cw_render_default_geometry (NULL);
  if (gd == NULL)
    return NULL;
  *owned = g_new0 (CwReactivity, 1);
  if (!cw_reactivity_compute (gd, mol, an->pop, an->temperature, *owned, NULL))
    g_clear_pointer (owned, g_free);
  return *owned;
}

gboolean
cw_chairs_reaction_wants (const CwReactivity *r, int g, const CwMolecule *mol, const CwRenderOptions *opt)
{
  int sub = r->groups[g].sub;

  if (sub < 0 || sub >= mol->n_subs)
    return FALSE; /* a reactivity of another molecule: draw nothing rather than the wrong atoms */
  return opt->reactivity_sub < 0 || opt->reactivity_sub == sub;
}

static int
sub_at (const CwMolecule *mol, int position, CwFace face)
{
  for (int i = 0; i < mol->n_subs; i++)
    if (mol->subs[i].position == position && mol->subs[i].face == face)
      return i;
  return -1;
}

/* The ring and the label for one anti-periplanar hydrogen (or deuterium) whose drawn end is the
 * prim at index `bond` (a bond line) and, when shown, `label` (its letter). */
static void
ring_and_label (CwScene *scene, CwPlacer *placer, guint bond, int label, int which, int position, gboolean axial)
{
  CwPrim       *b = cw_scene_get (scene, bond);
  CwPoint       c = { b->x1, b->y1 };
  double        r = 4.5, dx = b->x1 - b->x0, dy = b->y1 - b->y0, n = MAX (hypot (dx, dy), 1e-6);
  CwTextMetrics m;
  CwPoint       cands[16];
  CwPrim       *p;

  if (label >= 0)
    {
      const CwBox *box = &cw_scene_get (scene, label)->box;

      c = (CwPoint){ box->x + box->w / 2, box->y + box->h / 2 };
      r = 0.5 * MAX (box->w, 0.8 * box->h) + 2.0;
    }
  p = cw_scene_add (scene, CW_PRIM_MARKER, CW_ROLE_REACTION_MARK, CW_INK_SERIES_3);
  p->marker = CW_MARKER_CIRCLE;
  p->x0 = c.x;
  p->y0 = c.y;
  p->wide = 2 * r;
  p->fill = FALSE;
  p->chair = which;
  p->sub = -1;
  p->position = position;
  p->axial = axial;
  /* "ap" just outside the ring: along the bond first, then turning away from it both ways. */
  cw_text_measure ("ap", AP_SIZE, FALSE, 0, 0, 0, &m);
  dx /= n;
  dy /= n;
  for (int i = 0; i < 16; i++)
    {
      double turn = ((i + 1) / 2) * (G_PI / 8) * (i % 2 ? 1 : -1);
      double ux = dx * cos (turn) - dy * sin (turn), uy = dx * sin (turn) + dy * cos (turn);
      double d = r + 1.5 + 0.5 * fabs (ux) * m.w + 0.5 * fabs (uy) * m.h;

      cands[i] = (CwPoint){ c.x + ux * d, c.y + uy * d };
    }
  p = cw_scene_text_free (scene, CW_ROLE_REACTION_MARK, CW_INK_SERIES_3, "ap", AP_SIZE, cands, 16, 0.5, 0.5);
  p->chair = which;
  p->sub = -1;
  p->position = position;
  p->axial = axial;
  cw_placer_add_box (placer, &p->box);
}

/* Emphasises the bond (and letter) of the hydrogen or deuterium on (position, face). */
static void
mark_anti (CwScene *scene, CwPlacer *placer, const CwMolecule *mol, int which, int position, CwFace face)
{
  gboolean axial = cw_chair_is_axial (which, position, face);
  int      d_sub = sub_at (mol, position, face);
  CwRole   bond_role = d_sub >= 0 ? CW_ROLE_SUB_BOND : CW_ROLE_HYDROGEN;
  CwRole   label_role = d_sub >= 0 ? CW_ROLE_SUB_LABEL : CW_ROLE_HYDROGEN;
  int      bond = -1, label = -1;

  for (guint i = 0; i < cw_scene_get_n (scene); i++)
    {
      CwPrim *p = cw_scene_get (scene, i);

      if (p->chair != which || p->position != position || p->axial != axial || p->sub != d_sub)
        continue;
      if (p->role == bond_role && p->kind == CW_PRIM_LINE)
        {
          p->line_width = AP_WIDTH;
          p->ink = CW_INK_SERIES_3;
          bond = (int) i;
        }
      else if (p->role == label_role && p->kind == CW_PRIM_TEXT)
        {
          p->ink = CW_INK_SERIES_3;
          label = (int) i;
        }
    }
  if (bond >= 0)
    ring_and_label (scene, placer, (guint) bond, label, which, position, axial);
}

void
cw_chairs_reaction_mark (CwScene *scene, CwPlacer *placer, const CwMolecule *mol, const CwReactivity *r, const CwRenderOptions *opt, int which)
{
  gboolean done[CW_RING_SIZE + 1][2] = { { FALSE } };

  for (int g = 0; g < r->n_groups; g++)
    {
      const CwLeavingGroup *lg = &r->groups[g];

      if (!cw_chairs_reaction_wants (r, g, mol, opt))
        continue;
      for (guint i = 0; i < cw_scene_get_n (scene); i++)
        {
          CwPrim *p = cw_scene_get (scene, i);

          if (p->role == CW_ROLE_SUB_BOND && p->chair == which && p->sub == lg->sub)
            {
              p->line_width = LG_WIDTH;
              p->ink = CW_INK_SERIES_3;
            }
        }
      for (int j = 0; j < lg->n_anti[which] && j < 2; j++)
        {
          const CwAntiHydrogen *h = &lg->anti[which][j];

          /* A hydrogen anti to two leaving groups is marked once. */
          if (h->position < 1 || h->position > CW_RING_SIZE || done[h->position][h->face])
            continue;
          done[h->position][h->face] = TRUE;
          mark_anti (scene, placer, mol, which, h->position, h->face);
        }
    }
}

double
cw_chairs_reaction_legend (CwScene *scene, double x, double y)
{
  CwPrim *p;
  double  x0 = x;

  p = cw_scene_line (scene, CW_ROLE_LEGEND, CW_INK_SERIES_3, x, y, x + 22, y, LG_WIDTH);
  p = cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_TEXT, _("leaving group"), 9, FALSE, x + 27, y, 0, 0.5);
  x = p->box.x + p->box.w + 14;
  p = cw_scene_add (scene, CW_PRIM_MARKER, CW_ROLE_LEGEND, CW_INK_SERIES_3);
  p->marker = CW_MARKER_CIRCLE;
  p->x0 = x + 6;
  p->y0 = y;
  p->wide = 11;
  cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_SERIES_3, "H", 9, FALSE, x + 6, y, 0.5, 0.5);
  p = cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_SERIES_3, "ap", 9, FALSE, x + 16, y, 0, 0.5);
  p = cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_TEXT, _(": β-H anti-periplanar to it (E2)"), 9, FALSE, p->box.x + p->box.w, y, 0, 0.5);
  return p->box.x + p->box.w - x0;
}
