#include "config.h"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "cw-render-private.h"

typedef enum
{
  FORMAT_PNG,
  FORMAT_SVG,
  FORMAT_PDF
} Format;

static gboolean
format_from_path (const char *path, Format *format, GError **error)
{
  const char *dot = strrchr (path, '.');
  const char *slash = strrchr (path, G_DIR_SEPARATOR);

  if (dot != NULL && (slash == NULL || dot > slash))
    {
      if (g_ascii_strcasecmp (dot, ".png") == 0)
        *format = FORMAT_PNG;
      else if (g_ascii_strcasecmp (dot, ".svg") == 0)
        *format = FORMAT_SVG;
      else if (g_ascii_strcasecmp (dot, ".pdf") == 0)
        *format = FORMAT_PDF;
      else
        dot = NULL;
      if (dot != NULL)
        return TRUE;
    }
  g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT,
               _("Cannot tell the file type of “%s”: the name must end in .png, .svg or .pdf"), path);
  return FALSE;
}

gboolean
cw_render_write_atomic (const char *path, CwWriteFunc write, gpointer user_data, GError **error)
{
  g_autofree char *dir = g_path_get_dirname (path);
  g_autofree char *base = g_path_get_basename (path);
  g_autofree char *tmp = g_strdup_printf ("%s%c.%s.XXXXXX", dir, G_DIR_SEPARATOR, base);
  int              fd;

  if (g_file_test (path, G_FILE_TEST_IS_DIR))
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_IO, _("Cannot write “%s”: it is a folder"), path);
      return FALSE;
    }
  fd = g_mkstemp (tmp);
  if (fd < 0)
    {
      int saved = errno;
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_IO, _("Cannot write “%s”: %s"), path, g_strerror (saved));
      return FALSE;
    }
  /* mkstemp makes the file private; give it the permissions a new file would get. */
  mode_t mask = umask (0);
  umask (mask);
  fchmod (fd, 0666 & ~mask);
  close (fd);
  if (!write (tmp, user_data, error))
    {
      g_unlink (tmp);
      g_prefix_error (error, _("Cannot write “%s”: "), path);
      return FALSE;
    }
  if (g_rename (tmp, path) != 0)
    {
      int saved = errno;
      g_unlink (tmp);
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_IO, _("Cannot write “%s”: %s"), path, g_strerror (saved));
      return FALSE;
    }
  return TRUE;
}

gboolean
cw_render_analyze_document (const CwData *data, const CwDocument *doc, CwAnalysis *an, GError **error)
{
  CwConditions cond;

  cw_document_get_conditions (doc, &cond);
  if (!cw_analyze (data, cw_document_peek_molecule (doc), &cond, an, error))
    {
      g_prefix_error (error, _("Cannot analyse the document: "));
      if (error != NULL && *error != NULL && (*error)->domain != CW_RENDER_ERROR)
        {
          (*error)->domain = CW_RENDER_ERROR;
          (*error)->code = CW_RENDER_ERROR_ANALYSIS;
        }
      return FALSE;
    }
  return TRUE;
}

static gboolean
check_cairo (cairo_status_t status, GError **error)
{
  if (status == CAIRO_STATUS_SUCCESS)
    return TRUE;
  g_set_error (error, CW_RENDER_ERROR, status == CAIRO_STATUS_WRITE_ERROR ? CW_RENDER_ERROR_IO : CW_RENDER_ERROR_DRAW,
               "%s", cairo_status_to_string (status));
  return FALSE;
}

typedef struct
{
  Format format;
  double width, height; /* points */
  double dpi;
  void (*draw) (cairo_t *cr, gpointer user_data, double width, double height);
  gpointer       user_data;
  const CwScene *scene; /* for the text layer of an SVG, or NULL */
} Job;

/* Cairo writes SVG text as glyph outlines. Add every label once more as real, transparent
 * <text>, placed where it is drawn, so the file can be searched, selected and read aloud. */
static gboolean
svg_add_text_layer (const char *path, const CwScene *scene, double width, double height, GError **error)
{
  g_autofree char *svg = NULL;
  g_autoptr (GString) layer = g_string_new ("<g id=\"chairwise-text\" fill-opacity=\"0\" stroke=\"none\">\n");
  double s = MIN (width / scene->width, height / scene->height);
  double ox = 0.5 * (width - s * scene->width) - s * scene->origin_x;
  double oy = 0.5 * (height - s * scene->height) - s * scene->origin_y;
  char  *end;
  gsize  len;

  if (!g_file_get_contents (path, &svg, &len, error))
    return FALSE;
  end = g_strrstr (svg, "</svg>");
  if (end == NULL)
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_DRAW, _("the SVG surface wrote no closing tag"));
      return FALSE;
    }
  for (guint i = 0; i < scene->prims->len; i++)
    {
      const CwPrim    *p = &g_array_index (scene->prims, CwPrim, i);
      g_autofree char *plain = NULL, *esc = NULL;
      char             x[G_ASCII_DTOSTR_BUF_SIZE], y[G_ASCII_DTOSTR_BUF_SIZE], fs[G_ASCII_DTOSTR_BUF_SIZE];

      if (p->kind != CW_PRIM_TEXT)
        continue;
      plain = cw_markup_dup_plain (p->markup);
      esc = g_markup_escape_text (plain, -1);
      g_ascii_formatd (x, sizeof x, "%.2f", ox + s * p->box.x);
      g_ascii_formatd (y, sizeof y, "%.2f", oy + s * (p->box.y + 0.8 * p->box.h));
      g_ascii_formatd (fs, sizeof fs, "%.2f", s * p->size);
      g_string_append_printf (layer, "<text x=\"%s\" y=\"%s\" font-size=\"%s\">%s</text>\n", x, y, fs, esc);
    }
  g_string_append (layer, "</g>\n");
  {
    g_autoptr (GString) out = g_string_new_len (svg, end - svg);

    g_string_append (out, layer->str);
    g_string_append (out, end);
    return g_file_set_contents (path, out->str, out->len, error);
  }
}

static gboolean
write_job (const char *tmp, gpointer user_data, GError **error)
{
  Job *job = user_data;
  g_autoptr (cairo_surface_t) surface = NULL;
  g_autoptr (cairo_t) cr = NULL;
  cairo_status_t status;

  if (job->format == FORMAT_PNG)
    {
      g_assert (job->scene != NULL);
      return cw_render_write_png_scene (job->scene, job->width, job->height, job->dpi, tmp, error);
    }
  if (job->format == FORMAT_SVG)
    surface = cairo_svg_surface_create (tmp, job->width, job->height);
  else
    {
      surface = cairo_pdf_surface_create (tmp, job->width, job->height);
      cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATOR, "Chairwise " PACKAGE_VERSION);
    }
  if (!check_cairo (cairo_surface_status (surface), error))
    return FALSE;
  cr = cairo_create (surface);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  job->draw (cr, job->user_data, job->width, job->height);
  status = cairo_status (cr);
  g_clear_pointer (&cr, cairo_destroy);
  if (!check_cairo (status, error))
    return FALSE;
  cairo_surface_finish (surface);
  if (!check_cairo (cairo_surface_status (surface), error))
    return FALSE;
  if (job->format == FORMAT_SVG && job->scene != NULL)
    return svg_add_text_layer (tmp, job->scene, job->width, job->height, error);
  return TRUE;
}

static void
draw_scene (cairo_t *cr, gpointer user_data, double width, double height)
{
  cw_render_paint_scene (cr, user_data, FALSE, width, height);
}

gboolean
cw_render_export_figure (CwFigure fig, const CwData *data, const CwDocument *doc, const CwRenderOptions *opt, const char *path, double dpi, GError **error)
{
  CwAnalysis      an;
  CwRenderOptions light;
  g_autoptr (CwScene) scene = NULL;
  double w0, h0;
  Job    job = { 0 };

  g_return_val_if_fail (data != NULL && doc != NULL && opt != NULL && path != NULL, FALSE);
  if (!format_from_path (path, &job.format, error))
    return FALSE;
  if (!(dpi >= 10 && dpi <= 2400))
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT,
                   _("Resolution %g dpi is out of range (10 to 2400)"), dpi);
      return FALSE;
    }
  if (!cw_render_analyze_document (data, doc, &an, error))
    return FALSE;
  light = *opt;
  light.dark = FALSE; /* exports are always on white */
  light.highlight_sub = -1;
  /* The page is the figure's own size at the design scale, in points. */
  cw_render_figure_size (fig, &w0, &h0);
  scene = cw_render_build_figure (fig, data, cw_document_peek_molecule (doc), &an, &light, w0, h0);
  job.width = ceil (scene->width);
  job.height = ceil (scene->height);
  job.dpi = dpi;
  job.draw = draw_scene;
  job.user_data = scene;
  job.scene = scene;
  return cw_render_write_atomic (path, write_job, &job, error);
}

typedef struct
{
  const CwData         *data;
  const CwGeometryData *gd;
  const CwDocument     *doc;
  const CwAnalysis     *an;
} ReportJob;

static void
draw_report (cairo_t *cr, gpointer user_data, double width, double height)
{
  ReportJob *rj = user_data;

  cw_render_report_with_geometry (cr, rj->data, rj->gd, rj->doc, rj->an, width, height);
}

gboolean
cw_render_export_report (const CwData *data, const CwDocument *doc, const char *paper, const char *path, GError **error)
{
  return cw_render_export_report_with_geometry (data, NULL, doc, paper, path, error);
}

gboolean
cw_render_export_report_with_geometry (const CwData *data, const CwGeometryData *gd, const CwDocument *doc, const char *paper, const char *path, GError **error)
{
  CwAnalysis  an;
  ReportJob   rj = { data, gd, doc, &an };
  Job         job = { 0 };
  const char *dot;

  g_return_val_if_fail (data != NULL && doc != NULL && path != NULL, FALSE);
  if (paper == NULL || g_ascii_strcasecmp (paper, "a4") == 0)
    job.width = 595.276, job.height = 841.89; /* 210 × 297 mm */
  else if (g_ascii_strcasecmp (paper, "letter") == 0)
    job.width = 612, job.height = 792; /* 8.5 × 11 in */
  else
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT,
                   _("Unknown paper size “%s”: use a4 or letter"), paper);
      return FALSE;
    }
  dot = strrchr (path, '.');
  if (dot == NULL || g_ascii_strcasecmp (dot, ".pdf") != 0 || strchr (dot, G_DIR_SEPARATOR) != NULL)
    {
      g_set_error (error, CW_RENDER_ERROR, CW_RENDER_ERROR_FORMAT,
                   _("The report is a PDF: the name “%s” must end in .pdf"), path);
      return FALSE;
    }
  if (!cw_render_analyze_document (data, doc, &an, error))
    return FALSE;
  job.format = FORMAT_PDF;
  job.dpi = 72;
  job.draw = draw_report;
  job.user_data = &rj;
  return cw_render_write_atomic (path, write_job, &job, error);
}
