#include "config.h"

#include <math.h>

#include "cw-figures.h"
#include "cw-render-private.h"

#define TICK_SIZE 9.0

double
cw_plot_x (const CwPlot *plot, double x)
{
  return plot->area.x + (x - plot->x0) / (plot->x1 - plot->x0) * plot->area.w;
}

double
cw_plot_y (const CwPlot *plot, double y)
{
  return plot->area.y + plot->area.h - (y - plot->y0) / (plot->y1 - plot->y0) * plot->area.h;
}

double
cw_nice_step (double range, int target)
{
  double raw = range / MAX (target, 1);
  double mag = pow (10, floor (log10 (raw)));
  double f = raw / mag;

  if (f <= 1)
    return mag;
  if (f <= 2)
    return 2 * mag;
  if (f <= 2.5)
    return 2.5 * mag;
  if (f <= 5)
    return 5 * mag;
  return 10 * mag;
}

static char *
tick_label (double v, double step)
{
  int              decimals = 0;
  g_autofree char *s = NULL;

  /* As many decimals as the step needs: 2.5 → one, 0.25 → two. */
  while (decimals < 4 && fabs (step * pow (10, decimals) - round (step * pow (10, decimals))) > 1e-6)
    decimals++;
  s = g_strdup_printf ("%.*f", decimals, fabs (v) < step * 1e-6 ? 0.0 : v);
  if (s[0] == '-')
    return g_strconcat ("−", s + 1, NULL);
  return g_steal_pointer (&s);
}

void
cw_plot_axes (CwScene *scene, const CwPlot *plot, double xstep, double ystep, double xoffset)
{
  const CwBox *a = &plot->area;

  for (double v = ceil (plot->y0 / ystep - 1e-9) * ystep; v <= plot->y1 + 1e-9; v += ystep)
    {
      double           y = cw_plot_y (plot, v);
      g_autofree char *lab = tick_label (v, ystep);

      cw_scene_line (scene, CW_ROLE_AXIS, CW_INK_GRID, a->x, y, a->x + a->w, y, 0.6);
      cw_scene_line (scene, CW_ROLE_AXIS, CW_INK_TEXT, a->x - 4, y, a->x, y, 0.9);
      cw_scene_text_at (scene, CW_ROLE_AXIS, CW_INK_TEXT, lab, TICK_SIZE, FALSE, a->x - 6, y, 1.0, 0.5);
    }
  if (xstep > 0)
    for (double d = ceil ((plot->x0 + xoffset) / xstep - 1e-9) * xstep; d - xoffset <= plot->x1 + 1e-9; d += xstep)
      {
        double           x = cw_plot_x (plot, d - xoffset);
        g_autofree char *lab = tick_label (d, xstep);

        cw_scene_line (scene, CW_ROLE_AXIS, CW_INK_GRID, x, a->y, x, a->y + a->h, 0.6);
        cw_scene_line (scene, CW_ROLE_AXIS, CW_INK_TEXT, x, a->y + a->h, x, a->y + a->h + 4, 0.9);
        cw_scene_text_at (scene, CW_ROLE_AXIS, CW_INK_TEXT, lab, TICK_SIZE, FALSE, x, a->y + a->h + 6, 0.5, 0);
      }
  cw_scene_line (scene, CW_ROLE_AXIS, CW_INK_TEXT, a->x, a->y, a->x, a->y + a->h, 1.0);
  cw_scene_line (scene, CW_ROLE_AXIS, CW_INK_TEXT, a->x, a->y + a->h, a->x + a->w, a->y + a->h, 1.0);
}
