#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-figures.h"
#include "cw-render-private.h"

/* Populations against temperature, recomputed with cw_analyze at each point. */

#define N_SCAN 81

gboolean
cw_scan_wants_twist_boat (const CwAnalysis *an)
{
  double x[3];

  if (cw_analysis_has_flag (an, CW_FLAG_TWIST_BOAT))
    return TRUE;
  cw_scan_three_state (an, x);
  return x[2] > 0.005;
}

void
cw_scan_three_state (const CwAnalysis *an, double pop[3])
{
  double g[3] = { an->chair[0].energy, an->chair[1].energy, an->twist_boat };
  double gmin = MIN (g[0], MIN (g[1], g[2]));
  double rt = CW_R_KCAL * an->temperature, sum = 0;

  for (int i = 0; i < 3; i++)
    sum += pop[i] = exp (-(g[i] - gmin) / rt);
  for (int i = 0; i < 3; i++)
    pop[i] /= sum;
}

gboolean
cw_scan_compute (const CwData *data, const CwMolecule *mol, CwSolvent solvent, gboolean with_twist_boat, double t0, double t1, guint n, CwScanPoint *points)
{
  CwAnalysis an;

  for (guint i = 0; i < n; i++)
    {
      CwConditions cond = { t0 + (t1 - t0) * i / (n > 1 ? n - 1 : 1), solvent };

      if (!cw_analyze (data, mol, &cond, &an, NULL))
        return FALSE;
      points[i].t = cond.temperature;
      if (with_twist_boat)
        cw_scan_three_state (&an, points[i].pop);
      else
        {
          points[i].pop[0] = an.pop[0];
          points[i].pop[1] = an.pop[1];
          points[i].pop[2] = 0;
        }
    }
  return TRUE;
}

typedef struct
{
  CwInk         ink;
  double        dash;
  CwMarkerShape marker;
  const char   *name;
} Series;

static const Series series[3] = {
  { CW_INK_SERIES_1, 0, CW_MARKER_CIRCLE, N_("chair 1") },
    { CW_INK_SERIES_2, 5.0, CW_MARKER_SQUARE, N_("chair 2") },
      { CW_INK_SERIES_3, 1.2, CW_MARKER_TRIANGLE, N_("twist-boat") },
    };

static CwPrim *
marker (CwScene *scene, int s, double x, double y, CwRole role)
{
  CwPrim *p = cw_scene_add (scene, CW_PRIM_MARKER, role, series[s].ink);

  p->x0 = x;
  p->y0 = y;
  p->wide = 6.5;
  p->marker = series[s].marker;
  p->fill = TRUE;
  return p;
}

static void
legend (CwScene *scene, int n_series, double x, double y)
{
  for (int s = 0; s < n_series; s++)
    {
      CwPrim *p = cw_scene_line (scene, CW_ROLE_LEGEND, series[s].ink, x, y, x + 26, y, 2.0);

      p->dash = series[s].dash;
      marker (scene, s, x + 13, y, CW_ROLE_LEGEND);
      p = cw_scene_text_at (scene, CW_ROLE_LEGEND, CW_INK_TEXT, _(series[s].name), 9.5, FALSE, x + 31, y, 0, 0.5);
      x = p->box.x + p->box.w + 16;
    }
}

static void
draw_series (CwScene *scene, const CwPlot *plot, const CwScanPoint *pts, guint n, int s)
{
  CwPoint line[N_SCAN];
  CwPrim *p;

  for (guint i = 0; i < n; i++)
    line[i] = (CwPoint){ cw_plot_x (plot, pts[i].t), cw_plot_y (plot, 100 * pts[i].pop[s]) };
  p = cw_scene_polyline (scene, CW_ROLE_CURVE, series[s].ink, line, n, 2.0);
  p->dash = series[s].dash;
  /* Markers along the curve, offset per series so they do not sit on each other. */
  for (guint i = 4 + 3 * s; i < n; i += 10)
    marker (scene, s, line[i].x, line[i].y, CW_ROLE_CURVE);
}

static void
chosen_temperature (CwScene *scene, const CwPlot *plot, const CwAnalysis *an, const double pop[3], int n_series, const CwRenderOptions *opt)
{
  double           x = cw_plot_x (plot, an->temperature);
  g_autofree char *t = cw_format_temperature (an->temperature, opt->temperature_unit);
  g_autofree char *esc = g_markup_escape_text (t, -1);
  CwPrim          *p = cw_scene_line (scene, CW_ROLE_MARKER, CW_INK_MUTED, x, plot->area.y, x, plot->area.y + plot->area.h, 1.0);
  double           last_y = -G_MAXDOUBLE;
  int              order[3] = { 0, 1, 2 };

  p->dash = 3.0;
  cw_scene_text_at (scene, CW_ROLE_MARKER, CW_INK_TEXT, esc, 9.5, TRUE, x, plot->area.y - 3, 0.5, 1);
  /* Value labels beside the markers, top to bottom, nudged apart when they crowd. */
  for (int a = 0; a < n_series; a++)
    for (int b = a + 1; b < n_series; b++)
      if (pop[order[b]] > pop[order[a]])
        {
          int tmp = order[a];
          order[a] = order[b];
          order[b] = tmp;
        }
  for (int i = 0; i < n_series; i++)
    {
      int              s = order[i];
      double           y = cw_plot_y (plot, 100 * pop[s]);
      g_autofree char *v = cw_render_format_percent (pop[s]);
      g_autofree char *lab = g_strdup_printf ("%s %%", v);
      gboolean         right = x < plot->area.x + plot->area.w - 60;
      double           ly = MAX (y, last_y + 12);

      p = marker (scene, s, x, y, CW_ROLE_MARKER);
      p->wide = 8;
      p = cw_scene_text_at (scene, CW_ROLE_MARKER, series[s].ink, lab, 9.5, TRUE, right ? x + 8 : x - 8, ly,
                            right ? 0 : 1, 0.5);
      /* A background patch under the value, so the curves do not run through it. */
      CwPrim patch = { 0 };
      patch.kind = CW_PRIM_RECT;
      patch.ink = CW_INK_BACKGROUND;
      patch.fill = TRUE;
      patch.chair = patch.sub = -1;
      patch.x0 = p->box.x - 2;
      patch.y0 = p->box.y;
      patch.x1 = p->box.w + 4;
      patch.y1 = p->box.h;
      g_array_insert_val (scene->prims, scene->prims->len - 1, patch);
      last_y = ly;
    }
}

CwScene *
cw_scan_build (const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height)
{
  CwScene         *scene = cw_scene_new (width, height);
  gboolean         tb = cw_scan_wants_twist_boat (an);
  int              n_series = tb ? 3 : 2;
  double           t = an->temperature;
  double           t0 = MAX (100.0, MIN (180.0, t - 60)), t1 = MIN (CW_T_MAX, MAX (420.0, t + 60));
  double           xoff = opt->temperature_unit == CW_TUNIT_CELSIUS ? -CW_ZERO_C : 0;
  CwScanPoint      pts[N_SCAN];
  double           pop[3];
  CwPlot           plot;
  const char      *tunit = opt->temperature_unit == CW_TUNIT_CELSIUS ? "°C" : "K";
  g_autofree char *xtitle = g_strdup_printf (_("temperature, %s"), tunit);

  if (data == NULL || !cw_scan_compute (data, mol, an->solvent, tb, t0, t1, N_SCAN, pts))
    {
      cw_scene_message (scene, _("The temperature scan could not be computed"));
      return scene;
    }
  plot.area = (CwBox){ 52, 26, width - 52 - 22, height - 26 - 70 };
  plot.x0 = t0;
  plot.x1 = t1;
  plot.y0 = 0;
  plot.y1 = 100;
  cw_plot_axes (scene, &plot, cw_nice_step (t1 - t0, 6), 20, xoff);
  cw_scene_text (scene, CW_ROLE_AXIS, CW_INK_TEXT, _("population, %"), 10, FALSE, plot.area.x - 40, 6);
  cw_scene_text_at (scene, CW_ROLE_AXIS, CW_INK_TEXT, xtitle, 10, FALSE,
                    plot.area.x + plot.area.w / 2, plot.area.y + plot.area.h + 20, 0.5, 0);
  for (int s = 0; s < n_series; s++)
    draw_series (scene, &plot, pts, N_SCAN, s);
  if (tb)
    cw_scan_three_state (an, pop);
  else
    pop[0] = an->pop[0], pop[1] = an->pop[1], pop[2] = 0;
  chosen_temperature (scene, &plot, an, pop, n_series, opt);
  legend (scene, n_series, plot.area.x, height - 12);
  cw_scene_fit (scene, 4);
  return scene;
}
