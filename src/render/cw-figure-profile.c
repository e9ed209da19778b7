#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-figures.h"
#include "cw-render-private.h"

/* Ring inversion: chair → half-chair → twist-boat → boat → twist-boat → half-chair → chair on a
 * schematic coordinate, each station at its own level, relative to the more stable chair. */

#define N_STATIONS 7

static const char *const station_names[N_STATIONS] = {
  N_("chair 1"), N_("half-chair"), N_("twist-boat"), N_("boat"), N_("twist-boat"), N_("half-chair"), N_("chair 2") };

/* Levels in kcal/mol above the lower chair. */
static void
levels (const CwData *data, const CwAnalysis *an, double g[N_STATIONS])
{
  const CwRingEnergetics *ring = data ? cw_interaction_table_get_ring (data->interactions) : NULL;
  double                  gmin = MIN (an->chair[0].energy, an->chair[1].energy);
  double                  boat_above_tb = ring ? ring->boat.g - ring->twist_boat.g : 0.0;

  g[0] = an->chair[0].energy - gmin;
  g[6] = an->chair[1].energy - gmin;
  g[1] = g[5] = an->barrier;
  g[2] = g[4] = an->twist_boat - gmin;
  g[3] = g[2] + MAX (boat_above_tb, 0.0);
  /* The half-chair is the top of the path; keep it there even if the estimates cross. */
  g[1] = g[5] = MAX (g[1], MAX (g[3], MAX (g[0], g[6])) + 0.1);
}

static double
curve (const double g[N_STATIONS], double s)
{
  int    i = CLAMP ((int) floor (s), 0, N_STATIONS - 2);
  double t = s - i;
  /* Cosine easing: flat at every station, so minima and maxima sit on the stations. */
  double w = 0.5 * (1 - cos (G_PI * t));

  return g[i] + (g[i + 1] - g[i]) * w;
}

/* side: 0 centred on the bar, -1 standing out to the left of it, +1 to the right (the chairs
 * at the ends, so the curve leaving or reaching them does not run through the number). */
static void
level_label (CwScene *scene, const CwPlot *plot, double x, double g, const CwRenderOptions *opt, gboolean below, int side)
{
  g_autofree char *v = cw_render_format_value (g, opt->unit);
  double           px = cw_plot_x (plot, x), py = cw_plot_y (plot, g);
  double           lx = side < 0 ? px + 2 : side > 0 ? px - 2 : px, ax = side < 0 ? 1.0 : side > 0 ? 0.0 : 0.5;

  cw_scene_line (scene, CW_ROLE_LEVEL, CW_INK_TEXT, px - 14, py, px + 14, py, 2.0);
  cw_scene_text_at (scene, CW_ROLE_LEVEL, CW_INK_TEXT, v, 9, FALSE, lx, below ? py + 4 : py - 4, ax, below ? 0 : 1);
}

#define ARROW_TEXT 9.5

/* Where the label of an arrow between two levels goes: beside the arrow, half-way up; or, when
 * the levels are too close for that, above the upper one, clear of the dotted guides. Gives
 * the label's vertical anchor (as cw_scene_text_at takes it) in *ay. */
static double
arrow_label_y (const CwPlot *plot, double ga, double gb, double *ay)
{
  double ya = cw_plot_y (plot, ga), yb = cw_plot_y (plot, gb);

  if (fabs (ya - yb) >= 2.0 * ARROW_TEXT)
    {
      *ay = 0.5;
      return 0.5 * (ya + yb);
    }
  *ay = 1.0;
  return MIN (ya, yb) - 3;
}

/* A double arrow between two levels at x, with dotted guides from the stations it refers to.
 * Returns its label. */
static CwPrim *
vertical_arrow (CwScene *scene, const CwPlot *plot, double px, double ga, double gb, double sa, double sb, const char *markup)
{
  double  ya = cw_plot_y (plot, ga), yb = cw_plot_y (plot, gb), ay, ly = arrow_label_y (plot, ga, gb, &ay);
  CwPrim *p;

  p = cw_scene_line (scene, CW_ROLE_LEVEL, CW_INK_MUTED, cw_plot_x (plot, sa) + 15, ya, px + 3, ya, 0.7);
  p->dash = 1.0;
  p = cw_scene_line (scene, CW_ROLE_LEVEL, CW_INK_MUTED, cw_plot_x (plot, sb) + 15, yb, px + 3, yb, 0.7);
  p->dash = 1.0;
  if (fabs (ya - yb) > 9)
    cw_scene_arrow (scene, CW_ROLE_ARROW, CW_INK_TEXT, px, ya, px, yb, 1.0, TRUE);
  return cw_scene_text_at (scene, CW_ROLE_LEVEL, CW_INK_TEXT, markup, ARROW_TEXT, FALSE, px + 5, ly, 0.0, ay);
}

CwScene *
cw_profile_build (const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height)
{
  CwScene         *scene = cw_scene_new (width, height);
  double           g[N_STATIONS], top = 0, step;
  CwPlot           plot;
  CwPoint          pts[241];
  g_autofree char *title = g_strdup_printf (_("G relative to the more stable chair, %s"),
                                               cw_energy_unit_symbol (opt->unit));
  g_autofree char *dg = cw_render_format_energy (an->delta_g, opt->unit);
  g_autofree char *bar = cw_render_format_energy (an->barrier, opt->unit);
  g_autofree char *dg_markup = g_strdup_printf ("Δ<i>G</i>° = %s", dg);
  g_autofree char *bar_markup = g_strdup_printf ("Δ<i>G</i><sup>‡</sup> = %s", bar);
  int              low = an->chair[0].energy <= an->chair[1].energy ? 0 : 6;
  CwPrim          *bar_label;
  double           dg_y, dg_ay, dg_x;

  levels (data, an, g);
  for (int i = 0; i < N_STATIONS; i++)
    top = MAX (top, g[i]);
  /* The axis is in the display unit; the levels stay in kcal/mol and are converted on the way. */
  for (int i = 0; i < N_STATIONS; i++)
    g[i] = cw_energy_from_kcal (g[i], opt->unit);
  top = cw_energy_from_kcal (top, opt->unit);
  step = cw_nice_step (top * 1.15, 5);
  plot.area = (CwBox){ 56, 30, width - 56 - 16, height - 30 - 44 };
  plot.x0 = -0.5;
  plot.x1 = N_STATIONS + 1.3; /* room on the right for the two arrows */
  plot.y0 = 0;
  plot.y1 = ceil (top * 1.12 / step) * step;
  cw_plot_axes (scene, &plot, 0, step, 0);
  cw_scene_text (scene, CW_ROLE_AXIS, CW_INK_TEXT, title, 10, FALSE, plot.area.x - 40, 8);

  for (int i = 0; i < 241; i++)
    {
      double s = (N_STATIONS - 1) * i / 240.0;
      pts[i] = (CwPoint){ cw_plot_x (&plot, s), cw_plot_y (&plot, curve (g, s)) };
    }
  cw_scene_polyline (scene, CW_ROLE_CURVE, CW_INK_SERIES_1, pts, 241, 2.0);
  for (int i = 0; i < N_STATIONS; i++)
    {
      gboolean maximum = i == 1 || i == 3 || i == 5;
      double   px = cw_plot_x (&plot, i);

      level_label (scene, &plot, i, g[i], opt, !maximum && i != 0 && i != 6, i == 0 ? -1 : i == 6 ? 1 : 0);
      cw_scene_text_at (scene, CW_ROLE_AXIS, CW_INK_TEXT, _(station_names[i]), 9, i == 0 || i == 6, px, plot.area.y + plot.area.h + 6, 0.5, 0);
    }
  /* Beyond the last station: the barrier from the lower chair, then ΔG° between the chairs. */
  bar_label = vertical_arrow (scene, &plot, cw_plot_x (&plot, N_STATIONS - 0.5), g[low], g[5], low, 5, bar_markup);
  /* the ΔG° arrow stands clear of the barrier's label when its own label would be level with it */
  dg_y = arrow_label_y (&plot, g[0], g[6], &dg_ay) - dg_ay * 1.4 * ARROW_TEXT;
  dg_x = cw_plot_x (&plot, N_STATIONS + 0.2);
  if (dg_y < bar_label->box.y + bar_label->box.h + 2 && dg_y + 1.4 * ARROW_TEXT > bar_label->box.y - 2)
    dg_x = MAX (dg_x, bar_label->box.x + bar_label->box.w + 8);
  vertical_arrow (scene, &plot, dg_x, g[0], g[6], 0, 6, dg_markup);
  cw_scene_fit (scene, 4);
  return scene;
}
