#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-figure-reaction.h"
#include "cw-figures.h"
#include "cw-label.h"
#include "cw-render-private.h"

/* Both chairs side by side, projected from the ideal 3D chair (cw-chair-geometry.c). */

#define LABEL_SIZE 12.0
#define H_SIZE 9.0
#define MARK_SIZE 9.0
#define CAPTION_SIZE 11.0

typedef struct
{
  CwPoint  atom; /* page position of the ring carbon */
  CwPoint  end;  /* where the bond stops */
  CwPoint  dir;  /* page direction, unit */
  double   length;
  gboolean placed;
} SubPlace;

typedef struct
{
  CwScene               *scene;
  const CwMolecule      *mol;
  const CwAnalysis      *an;
  const CwRenderOptions *opt;
  double                 bond; /* ring bond length on the page */
  CwPlacer               placer;
  CwChair3D              chair3d;
  CwPoint                atom[6];
  SubPlace               sub[CW_MAX_SUBS];
  int                    which;
  double                 azimuth;
  gboolean               major;    /* drawn on the major chair's panel */
  const int             *order;    /* substituents in placing order */
  int                    failures; /* labels that found no clear spot */
  const CwReactivity    *react;    /* reaction geometry to mark, or NULL */
} ChairLayout;

static CwPoint
project_dir (const ChairLayout *cl, const CwVec3 *v)
{
  double x, y, n;

  cw_chair_project (v, cl->azimuth, CW_CHAIR_TILT, &x, &y);
  n = hypot (x, y);
  return (CwPoint){ x / n, y / n };
}

static void
draw_ring (ChairLayout *cl, double cx, double cy, gboolean major)
{
  double minx = G_MAXDOUBLE, maxx = -G_MAXDOUBLE, miny = G_MAXDOUBLE, maxy = -G_MAXDOUBLE;

  cw_chair3d_build (&cl->chair3d, cl->which);
  cl->azimuth = cw_chair_azimuth (cl->which);
  for (int k = 0; k < 6; k++)
    {
      double x, y;

      cw_chair_project (&cl->chair3d.atom[k], cl->azimuth, CW_CHAIR_TILT, &x, &y);
      cl->atom[k] = (CwPoint){ x * cl->bond, y * cl->bond };
      minx = MIN (minx, cl->atom[k].x);
      maxx = MAX (maxx, cl->atom[k].x);
      miny = MIN (miny, cl->atom[k].y);
      maxy = MAX (maxy, cl->atom[k].y);
    }
  for (int k = 0; k < 6; k++)
    {
      cl->atom[k].x += cx - 0.5 * (minx + maxx);
      cl->atom[k].y += cy - 0.5 * (miny + maxy);
    }
  for (int k = 0; k < 6; k++)
    {
      CwPoint p = cl->atom[k], q = cl->atom[(k + 1) % 6];
      CwPrim *b = cw_scene_line (cl->scene, CW_ROLE_RING_BOND, CW_INK_BOND, p.x, p.y, q.x, q.y, major ? 2.6 : 1.5);

      b->chair = cl->which;
      b->position = k + 1;
      cw_placer_add_segment (&cl->placer, p.x, p.y, q.x, q.y);
    }
}

/* One bond and its label, the bond lengthened until the label is clear. */
static void
place_group (ChairLayout *cl, int k, CwPoint dir, const char *markup, double size, double base, CwRole role, int sub, gboolean axial, SubPlace *out)
{
  CwPoint      a = cl->atom[k];
  CwLabelPlace place = { 0 };
  CwLabelText  lt = { 0 };
  gboolean     h = role == CW_ROLE_HYDROGEN;
  CwPrim      *p;

  gboolean show_label = TRUE;

  if (cw_placer_place_label (&cl->placer, markup, size, a.x, a.y, dir.x, dir.y, base, &place, &lt) > 0)
    {
      if (!h)
        cl->failures++;
      else
        {
          /* No clear spot for this hydrogen's letter: keep a short bond alone rather than
           * write over a group. */
          show_label = FALSE;
          place.ex = a.x + dir.x * 0.3 * cl->bond;
          place.ey = a.y + dir.y * 0.3 * cl->bond;
        }
    }
  if (!h && cl->opt->highlight_sub == sub)
    cw_scene_highlight (cl->scene, &place.box);
  p = cw_scene_line (cl->scene, h ? CW_ROLE_HYDROGEN : CW_ROLE_SUB_BOND, h ? CW_INK_MUTED : CW_INK_BOND,
                     a.x, a.y, place.ex, place.ey, h ? 0.8 : 1.3);
  p->halo = TRUE;
  p->halo_ink = cl->major ? CW_INK_PANEL : CW_INK_BACKGROUND;
  p->chair = cl->which;
  p->sub = sub;
  p->position = k + 1;
  p->axial = axial;
  if (show_label)
    {
      p = cw_label_add (cl->scene, &lt, &place, size, role, h ? CW_INK_MUTED : CW_INK_TEXT,
                        !h && cl->opt->highlight_sub == sub);
      p->chair = cl->which;
      p->sub = sub;
      p->position = k + 1;
      p->axial = axial;
      cw_placer_add_box (&cl->placer, &place.box);
    }
  cw_placer_add_segment (&cl->placer, a.x, a.y, place.ex, place.ey);
  if (out != NULL)
    *out = (SubPlace){ a, { place.ex, place.ey }, dir, hypot (place.ex - a.x, place.ey - a.y), TRUE };
  cw_label_text_clear (&lt);
}

static void
draw_substituents (ChairLayout *cl)
{
  const CwChair *ch = &cl->an->chair[cl->which];
  gboolean       taken[6][2] = { { FALSE } }; /* [carbon][axial] */

  for (int n = 0; n < cl->mol->n_subs; n++)
    {
      int                  i = cl->order[n];
      const CwSubstituent *s = &cl->mol->subs[i];
      int                  k = s->position - 1;
      gboolean             axial = ch->axial[i];
      CwPoint              dir = project_dir (cl, axial ? &cl->chair3d.axial[k] : &cl->chair3d.equatorial[k]);

      taken[k][axial] = TRUE;
      place_group (cl, k, dir, s->group->markup, LABEL_SIZE, 0.8 * cl->bond, CW_ROLE_SUB_LABEL, i, axial,
                   &cl->sub[i]);
    }
  if (!cl->opt->show_hydrogens && cl->react == NULL)
    return;
  for (int k = 0; k < 6; k++)
    for (int ax = 1; ax >= 0; ax--)
      if (!taken[k][ax])
        place_group (cl, k, project_dir (cl, ax ? &cl->chair3d.axial[k] : &cl->chair3d.equatorial[k]), "H",
                     H_SIZE, 0.5 * cl->bond, CW_ROLE_HYDROGEN, -1, ax, NULL);
}

static CwPoint
along (const SubPlace *sp, double f)
{
  return (CwPoint){ sp->atom.x + sp->dir.x * sp->length * f, sp->atom.y + sp->dir.y * sp->length * f };
}

static void
mark_term (ChairLayout *cl, const CwTerm *term, CwPoint centre)
{
  const SubPlace  *a = &cl->sub[term->sub_a], *b = &cl->sub[term->sub_b];
  gboolean         syn = term->kind == CW_TERM_SYN_AXIAL;
  CwPoint          p = along (a, syn ? 0.75 : 0.6), q = along (b, syn ? 0.75 : 0.6);
  CwPoint          mid = { 0.5 * (p.x + q.x), 0.5 * (p.y + q.y) };
  double           ox = mid.x - centre.x, oy = mid.y - centre.y, on = hypot (ox, oy);
  CwPoint          pts[17];
  g_autofree char *val = cw_render_format_energy (term->energy, cl->opt->unit);
  g_autofree char *markup = g_strdup_printf ("%s%s", term->energy > 0 ? "+" : "", val);
  CwPoint          cands[48];
  CwPrim          *prim;
  double           bulge = syn ? -0.22 * hypot (q.x - p.x, q.y - p.y) : 0;

  if (on < 1e-6)
    ox = 0, oy = -1, on = 1;
  ox /= on;
  oy /= on;
  /* A gentle curve, bowed towards the ring for syn-axial pairs (it stays clear of the labels). */
  for (int i = 0; i <= 16; i++)
    {
      double t = i / 16.0, s = 4 * t * (1 - t);
      pts[i] = (CwPoint){ p.x + (q.x - p.x) * t + ox * bulge * s, p.y + (q.y - p.y) * t + oy * bulge * s };
    }
  prim = cw_scene_polyline (cl->scene, CW_ROLE_INTERACTION, syn ? CW_INK_STRAIN : CW_INK_GAUCHE, pts, 17,
                            1.3);
  prim->dash = syn ? 4.0 : 1.2;
  prim->chair = cl->which;
  prim->sub = term->sub_a;
  /* Beside the middle of the mark, away from the ring first, then further out, then along it. */
  for (int i = 0; i < 48; i++)
    {
      double d = 7 + 6 * ((i % 24) / 2);
      double side = (i % 2) ? -1 : 1;
      double along_t = i < 24 ? 0 : (i % 4 < 2 ? 12 : -12);
      double lx = q.x - p.x, ly = q.y - p.y, ln = MAX (hypot (lx, ly), 1e-6);

      cands[i] = (CwPoint){ pts[8].x + side * ox * d + along_t * lx / ln, pts[8].y + side * oy * d + along_t * ly / ln };
    }
  prim = cw_scene_text_free (cl->scene, CW_ROLE_INTERACTION_LABEL, syn ? CW_INK_STRAIN : CW_INK_GAUCHE,
                             markup, MARK_SIZE, cands, 48, 0.5, 0.5);
  prim->chair = cl->which;
  prim->sub = term->sub_a;
  cw_placer_add_box (&cl->placer, &prim->box);
}

static void
draw_chair_once (ChairLayout *cl, gboolean major)
{
  const CwChair *ch = &cl->an->chair[cl->which];
  CwPoint        centre = { 0, 0 };

  cl->major = major;
  cw_placer_init (&cl->placer);
  memset (cl->sub, 0, sizeof cl->sub);
  cl->failures = 0;
  draw_ring (cl, 0, 0, major);
  draw_substituents (cl);
  for (int t = 0; t < ch->n_terms; t++)
    {
      const CwTerm *term = &ch->terms[t];

      if ((term->kind == CW_TERM_SYN_AXIAL || term->kind == CW_TERM_GAUCHE) && term->sub_a >= 0 &&
          term->sub_b >= 0 && term->sub_a < cl->mol->n_subs && term->sub_b < cl->mol->n_subs &&
          cl->sub[term->sub_a].placed && cl->sub[term->sub_b].placed)
        mark_term (cl, term, centre);
    }
  if (cl->react != NULL)
    cw_chairs_reaction_mark (cl->scene, &cl->placer, cl->mol, cl->react, cl->opt, cl->which);
  cw_placer_clear (&cl->placer);
}

/* Lays the chair out, centred on (0, 0), into a new scene. Labels are placed one after another,
 * each clear of those before; when some label finds no clear spot, other orders are tried (the
 * axial groups first, then in reverse, then each group first) and the best kept. */
static CwScene *
draw_chair (ChairLayout *cl, gboolean major, double width, double height)
{
  int      n = cl->mol->n_subs, order[CW_MAX_SUBS], best_failures = G_MAXINT;
  CwScene *best = NULL;

  for (int attempt = 0; attempt < n + 2 && best_failures > 0; attempt++)
    {
      int m = 0;

      if (attempt == 0)
        {
          for (int pass = 0; pass < 2; pass++)
            for (int i = 0; i < n; i++)
              if (cl->an->chair[cl->which].axial[i] == (pass == 0))
                order[m++] = i;
        }
      else if (attempt == 1)
        for (int i = n - 1; i >= 0; i--)
          order[m++] = i;
      else
        {
          order[m++] = attempt - 2;
          for (int i = 0; i < n; i++)
            if (i != attempt - 2)
              order[m++] = i;
        }
      cl->order = order;
      cl->scene = cw_scene_new (width, height);
      draw_chair_once (cl, major);
      if (cl->failures < best_failures)
        {
          cw_scene_free (best);
          best = cl->scene;
          best_failures = cl->failures;
        }
      else
        cw_scene_free (cl->scene);
      cl->scene = NULL;
    }
  return best;
}

static void
equilibrium_arrows (CwScene *scene, double x0, double x1, double y)
{
  CwPoint top[3] = { { x1, y - 3 }, { x1 - 8, y - 8 }, { x1 - 8, y - 3 } };
  CwPoint bot[3] = { { x0, y + 3 }, { x0 + 8, y + 8 }, { x0 + 8, y + 3 } };

  cw_scene_line (scene, CW_ROLE_ARROW, CW_INK_TEXT, x0, y - 3, x1 - 4, y - 3, 1.3);
  cw_scene_polygon (scene, CW_ROLE_ARROW, CW_INK_TEXT, top, 3);
  cw_scene_line (scene, CW_ROLE_ARROW, CW_INK_TEXT, x0 + 4, y + 3, x1, y + 3, 1.3);
  cw_scene_polygon (scene, CW_ROLE_ARROW, CW_INK_TEXT, bot, 3);
}

static void
captions (CwScene *scene, const CwAnalysis *an, const CwRenderOptions *opt, int c, double cx, double y, gboolean major)
{
  g_autofree char *pop = cw_render_format_percent (an->pop[c]);
  g_autofree char *lo = cw_render_format_percent (an->pop_low[c]);
  g_autofree char *hi = cw_render_format_percent (an->pop_high[c]);
  g_autofree char *g = cw_render_format_energy (an->chair[c].energy, opt->unit);
  g_autofree char *title = NULL, *line2 = NULL, *line3 = NULL;
  CwPrim          *p;

  title = g_strdup_printf (major ? _("Chair %d (major)") : _("Chair %d"), c + 1);
  p = cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_TEXT, title, CAPTION_SIZE + 1, major, cx, y, 0.5, 0);
  p->chair = c;
  y += p->box.h + 1;
  {
    gboolean    swap = an->pop_low[c] > an->pop_high[c];
    const char *a = swap ? hi : lo, *b = swap ? lo : hi;

    /* The interval for ΔG° ± 2σ; one value when both ends print alike ("<0.1"). */
    if (g_strcmp0 (a, b) == 0)
      line2 = g_strdup_printf ("%s %%  <span size=\"smaller\">(%s %%)</span>", pop, a);
    else
      line2 = g_strdup_printf ("%s %%  <span size=\"smaller\">(%s–%s %%)</span>", pop, a, b);
  }
  p = cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_TEXT, line2, CAPTION_SIZE, major, cx, y, 0.5, 0);
  p->chair = c;
  y += p->box.h + 1;
  line3 = g_strdup_printf (_("strain %s %s"), g, cw_energy_unit_symbol (opt->unit));
  p = cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_MUTED, line3, CAPTION_SIZE - 1, FALSE, cx, y, 0.5, 0);
  p->chair = c;
}

static void
legend (CwScene *scene, const CwRenderOptions *opt, double y)
{
  double           x = scene->width / 2 - 190;
  CwPrim          *p;
  g_autofree char *units = g_strdup_printf (_("energies in %s"), cw_energy_unit_symbol (opt->unit));

  p = cw_scene_line (scene, CW_ROLE_LEGEND, CW_INK_STRAIN, x, y, x + 22, y, 1.3);
  p->dash = 4.0;
  p = cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_TEXT, _("syn-1,3-diaxial pair"), 9, FALSE, x + 27, y, 0, 0.5);
  x = p->box.x + p->box.w + 14;
  p = cw_scene_line (scene, CW_ROLE_LEGEND, CW_INK_GAUCHE, x, y, x + 22, y, 1.3);
  p->dash = 1.2;
  p = cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_TEXT, _("gauche pair"), 9, FALSE, x + 27, y, 0, 0.5);
  x = p->box.x + p->box.w + 14;
  cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_MUTED, units, 9, FALSE, x, y, 0, 0.5);
}

CwScene *
cw_chairs_build (const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height)
{
  CwScene         *scene = cw_scene_new (width, height);
  double           span = MIN (width, 2 * height);
  double           bond = 0.105 * span;
  double           mid = 0.5 * width, gap, cy;
  CwTextMetrics    km, gm;
  double           cx[2];
  gboolean         decided = fabs (an->pop[0] - an->pop[1]) > 1e-6;
  g_autofree char *k = cw_render_format_k (an->K);
  g_autofree char *dg = cw_render_format_energy (an->delta_g, opt->unit);
  g_autofree char *sg = cw_render_format_energy (an->sigma, opt->unit);
  g_autofree char *kline = g_strdup_printf ("<i>K</i> = %s", k);
  g_autofree char *gline = g_strdup_printf ("Δ<i>G</i>° = %s ± %s", dg, sg);
  CwBox            bounds, cb[2];
  CwScene         *part[2];
  double           cap_y, top = G_MAXDOUBLE, bottom = -G_MAXDOUBLE;

  g_autofree CwReactivity *react_owned = NULL;
  const CwReactivity      *react = cw_chairs_reaction_prepare (mol, an, opt, &react_owned);

  cw_text_measure (kline, CAPTION_SIZE, FALSE, 0, 0, 0, &km);
  cw_text_measure (gline, CAPTION_SIZE - 1, FALSE, 0, 0, 0, &gm);
  gap = MAX (30, 0.5 * MAX (km.w, gm.w)) + 10;
  /* Each chair is laid out on its own, then set beside the arrows with its bounds clear of them. */
  for (int c = 0; c < 2; c++)
    {
      ChairLayout cl = { NULL, mol, an, opt, bond };

      cl.which = c;
      cl.react = react;
      part[c] = draw_chair (&cl, decided && an->major == c, width, height);
      cb[c] = cw_scene_bounds (part[c]);
      top = MIN (top, cb[c].y);
      bottom = MAX (bottom, cb[c].y + cb[c].h);
    }
  cy = 14 - top;
  for (int c = 0; c < 2; c++)
    {
      double dx = c == 0 ? MIN (mid - gap - (cb[0].x + cb[0].w), mid - 0.27 * span)
                         : MAX (mid + gap - cb[1].x, mid + 0.27 * span);
      cx[c] = dx;
      cw_scene_append (scene, part[c], dx, cy);
      cw_scene_free (part[c]);
    }
  equilibrium_arrows (scene, mid - 24, mid + 24, cy);
  cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_TEXT, kline, CAPTION_SIZE, FALSE, mid, cy - 10, 0.5, 1);
  cw_scene_text_at (scene, CW_ROLE_CAPTION, CW_INK_TEXT, gline, CAPTION_SIZE - 1, FALSE, mid, cy + 10, 0.5, 0);
  cap_y = cy + bottom + 10;
  for (int c = 0; c < 2; c++)
    captions (scene, an, opt, c, cx[c], cap_y, decided && an->major == c);
  bounds = cw_scene_bounds (scene);
  legend (scene, opt, bounds.y + bounds.h + 16);
  if (react != NULL)
    cw_chairs_reaction_legend (scene, scene->width / 2 - 190, bounds.y + bounds.h + 32);
  if (decided)
    {
      /* A faint panel behind the major chair, painted first; the caption says "major" too. */
      CwPrim       panel = { 0 };
      const CwBox *b = &cb[an->major];

      panel.kind = CW_PRIM_RECT;
      panel.ink = CW_INK_PANEL;
      panel.chair = an->major;
      panel.sub = -1;
      panel.x0 = MIN (cx[an->major] + b->x, cx[an->major] - 0.2 * span) - 8;
      panel.x1 = MAX (cx[an->major] + b->x + b->w, cx[an->major] + 0.2 * span) + 8 - panel.x0;
      panel.y0 = 4;
      panel.y1 = bounds.y + bounds.h + 4 - panel.y0;
      panel.fill = TRUE;
      g_array_prepend_val (scene->prims, panel);
    }
  cw_scene_fit_tight (scene, 6);
  return scene;
}
