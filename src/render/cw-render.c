#include "config.h"

#include "cw-render.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-figures.h"
#include "cw-render-private.h"

GQuark
cw_render_error_quark (void)
{
  return g_quark_from_static_string ("cw-render-error-quark");
}

void
cw_render_options_init (CwRenderOptions *opt)
{
  memset (opt, 0, sizeof *opt);
  opt->unit = CW_UNIT_KCAL;
  opt->show_hydrogens = FALSE;
  opt->dark = FALSE;
  opt->highlight_sub = -1;
  opt->highlight_reactivity = FALSE;
  opt->reactivity_sub = -1;
  opt->reactivity = NULL;
  opt->temperature_unit = CW_TUNIT_KELVIN;
}

static const char *const figure_names[] = { "structure", "chairs", "profile", "scan" };

gboolean
cw_render_figure_from_string (const char *s, CwFigure *fig)
{
  if (s == NULL)
    return FALSE;
  for (guint i = 0; i < G_N_ELEMENTS (figure_names); i++)
    if (g_ascii_strcasecmp (s, figure_names[i]) == 0)
      {
        *fig = (CwFigure) i;
        return TRUE;
      }
  return FALSE;
}

const char *
cw_render_figure_to_string (CwFigure fig)
{
  g_return_val_if_fail ((guint) fig < G_N_ELEMENTS (figure_names), NULL);
  return figure_names[fig];
}

void
cw_render_figure_size (CwFigure fig, double *width, double *height)
{
  switch (fig)
    {
    case CW_FIGURE_STRUCTURE:
      *width = 300;
      *height = 300;
      break;
    case CW_FIGURE_CHAIRS:
      *width = 640;
      *height = 330;
      break;
    case CW_FIGURE_PROFILE:
    case CW_FIGURE_SCAN:
    default:
      *width = 480;
      *height = 300;
      break;
    }
}

char *
cw_render_format_energy (double kcal, CwEnergyUnit unit)
{
  return cw_render_format_value (cw_energy_from_kcal (kcal, unit), unit);
}

char *
cw_render_format_value (double v, CwEnergyUnit unit)
{
  g_autofree char *s = g_strdup_printf (unit == CW_UNIT_KJ ? "%.1f" : "%.2f", v);

  /* A real minus sign, and no "-0.00". */
  if (s[0] == '-')
    {
      gboolean zero = strspn (s + 1, "0.") == strlen (s + 1);
      return zero ? g_strdup (s + 1) : g_strconcat ("−", s + 1, NULL);
    }
  return g_steal_pointer (&s);
}

char *
cw_render_format_percent (double fraction)
{
  double pct = 100.0 * fraction;

  if (pct > 0 && pct < 0.1)
    return g_strdup ("&lt;0.1");
  if (pct < 100 && pct > 99.9)
    return g_strdup ("&gt;99.9");
  return g_strdup_printf ("%.1f", pct);
}

char *
cw_render_format_k (double K)
{
  if (!isfinite (K))
    return g_strdup ("∞");
  if (K != 0 && (K < 0.01 || K >= 1000))
    {
      int    e = (int) floor (log10 (K));
      double m = K / pow (10, e);
      return g_strdup_printf ("%.2f × 10<sup>%s%d</sup>", m, e < 0 ? "−" : "", abs (e));
    }
  return g_strdup_printf (K < 10 ? "%.3g" : "%.1f", K);
}

CwScene *
cw_render_build_figure (CwFigure               fig,
                        const CwData          *data,
                        const CwMolecule      *mol,
                        const CwAnalysis      *an,
                        const CwRenderOptions *opt,
                        double                 width,
                        double                 height)
{
  CwScene *scene;

  if (fig != CW_FIGURE_STRUCTURE && an == NULL)
    {
      scene = cw_scene_new (width, height);
      cw_scene_message (scene, _("No analysis"));
      return scene;
    }
  switch (fig)
    {
    case CW_FIGURE_STRUCTURE:
      return cw_structure_build (mol, opt, width, height);
    case CW_FIGURE_CHAIRS:
      return cw_chairs_build (mol, an, opt, width, height);
    case CW_FIGURE_PROFILE:
      return cw_profile_build (data, mol, an, opt, width, height);
    case CW_FIGURE_SCAN:
    default:
      return cw_scan_build (data, mol, an, opt, width, height);
    }
}

CwScene *
cw_render_figure_scene (CwFigure fig, const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height)
{
  double w0, h0, s;

  g_return_val_if_fail (mol != NULL && opt != NULL, NULL);
  if (width <= 1 || height <= 1)
    return NULL;
  /* Lay out at the design size or larger, then scale uniformly into the box, so text keeps its
   * proportions and the extra room goes to the figure. */
  cw_render_figure_size (fig, &w0, &h0);
  s = MIN (width / w0, height / h0);
  /* a wide, low box (the window's lower area): lay the plot out lower rather than shrinking
   * its text below three quarters of the design size */
  if (fig != CW_FIGURE_CHAIRS && fig != CW_FIGURE_STRUCTURE && s < 0.75 && width / w0 >= 0.75)
    s = 0.75;
  return cw_render_build_figure (fig, data, mol, an, opt, width / s, height / s);
}

void
cw_render_warm_up (const CwData *data, const CwMolecule *mol, const CwConditions *cond, int scale)
{
  static const CwFigure  figures[] = { CW_FIGURE_CHAIRS, CW_FIGURE_PROFILE, CW_FIGURE_SCAN };
  g_autofree CwAnalysis *an = g_new0 (CwAnalysis, 1);
  CwRenderOptions        opt;

  g_return_if_fail (data != NULL && mol != NULL && cond != NULL);
  if (!cw_analyze (data, mol, cond, an, NULL))
    return;
  cw_render_options_init (&opt);
  for (guint i = 0; i < G_N_ELEMENTS (figures); i++)
    {
      double   w, h;
      CwScene *scene;

      cw_render_figure_size (figures[i], &w, &h);
      scene = cw_render_figure_scene (figures[i], data, mol, an, &opt, w, h);
      if (scene != NULL && scale > 0)
        {
          cairo_surface_t *image = cw_render_figure_image (scene, FALSE, (int) w, (int) h, scale);

          if (image != NULL)
            cairo_surface_destroy (image);
        }
      cw_scene_free (scene);
    }
}

void
cw_render_figure_paint (cairo_t *cr, const CwScene *scene, gboolean dark, double width, double height)
{
  g_return_if_fail (cr != NULL);
  if (scene == NULL || width <= 1 || height <= 1)
    return;
  cw_render_paint_scene (cr, scene, dark, width, height);
}

cairo_surface_t *
cw_render_figure_image (const CwScene *scene, gboolean dark, int width, int height, int scale)
{
  cairo_rectangle_t box = { 0, 0, width, height };
  cairo_surface_t  *recording, *image;
  cairo_t          *cr;

  g_return_val_if_fail (width > 0 && height > 0 && scale > 0, NULL);
  /* Recorded first, then played into the image, as GTK plays a window's drawing onto the
   * screen. Drawn straight into the image, the figure came out different at a scale of 2
   * (3,250 pixels of the demo's window, in the text); recorded first, it is the same pixel
   * for pixel at scales 1 and 2, light and dark. */
  recording = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, &box);
  cr = cairo_create (recording);
  cw_render_figure_paint (cr, scene, dark, width, height);
  cairo_destroy (cr);
  /* Opaque: the figure paints its own background over the whole box, and an image without
   * alpha is copied onto the screen without blending. */
  image = cairo_image_surface_create (CAIRO_FORMAT_RGB24, width * scale, height * scale);
  cairo_surface_set_device_scale (image, scale, scale);
  cr = cairo_create (image);
  cairo_set_source_surface (cr, recording, 0, 0);
  cairo_paint (cr);
  cairo_destroy (cr);
  cairo_surface_destroy (recording);
  cairo_surface_flush (image);
  if (cairo_surface_status (image) != CAIRO_STATUS_SUCCESS)
    g_clear_pointer (&image, cairo_surface_destroy);
  return image;
}

void
cw_render_figure (cairo_t *cr, CwFigure fig, const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height)
{
  g_autoptr (CwScene) scene = NULL;

  g_return_if_fail (cr != NULL && mol != NULL && opt != NULL);
  scene = cw_render_figure_scene (fig, data, mol, an, opt, width, height);
  cw_render_figure_paint (cr, scene, opt->dark, width, height);
}

void
cw_render_paint_scene (cairo_t *cr, const CwScene *scene, gboolean dark, double width, double height)
{
  double bg[3], s;

  cairo_save (cr);
  cw_palette_get (CW_INK_BACKGROUND, dark, bg);
  cairo_set_source_rgb (cr, bg[0], bg[1], bg[2]);
  cairo_rectangle (cr, 0, 0, width, height);
  cairo_fill (cr);
  s = MIN (width / scene->width, height / scene->height);
  cairo_translate (cr, 0.5 * (width - s * scene->width), 0.5 * (height - s * scene->height));
  cairo_scale (cr, s, s);
  cairo_translate (cr, -scene->origin_x, -scene->origin_y);
  cw_scene_paint (scene, cr, dark);
  cairo_restore (cr);
}

const char *
cw_render_version (void)
{
  return PACKAGE_VERSION;
}
