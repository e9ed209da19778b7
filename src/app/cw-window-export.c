#include "config.h"

#include <cairo-svg.h>
#include <glib/gi18n.h>

#include "cw-app-data.h"
#include "cw-geometry.h"
#include "cw-window-private.h"

#define EXPORT_DPI 300.0

/* Clipboard sizes, in pixels for PNG and points for SVG. */
static const struct
{
  const char *name;
  CwFigure    fig;
  int         width, height;
} figures[] = {
  { "structure", CW_FIGURE_STRUCTURE, 420, 420 },
  { "chairs", CW_FIGURE_CHAIRS, 900, 420 },
  { "profile", CW_FIGURE_PROFILE, 800, 420 },
  { "scan", CW_FIGURE_SCAN, 800, 420 },
};

static gboolean
lookup_figure (const char *name,
               guint      *index)
{
  for (guint i = 0; i < G_N_ELEMENTS (figures); i++)
    if (g_strcmp0 (figures[i].name, name) == 0)
      {
        *index = i;
        return TRUE;
      }
  return FALSE;
}

/* The idealised 3D chair (chair 0 or 1) as XYZ, written atomically. */
static gboolean
export_chair_xyz (CwWindow   *self,
                  int         chair,
                  const char *path,
                  GError    **error)
{
  const CwMolecule     *mol = cw_document_peek_molecule (self->doc);
  const CwGeometryData *gd = cw_app_get_geometry (error);
  g_autofree char      *spec = NULL;
  g_autofree char      *comment = NULL;
  g_autofree char      *text = NULL;
  CwChairGeometry       g;

  if (gd == NULL || !cw_chair_geometry_build (gd, mol, chair, &g, error))
    return FALSE;
  spec = cw_molecule_dup_spec (mol);
  if (self->an_valid)
    comment = g_strdup_printf ("Chairwise chair %d of %s (%.1f %% at %.1f K); idealised geometry, an estimate",
                               chair + 1, spec, 100 * self->an.pop[chair], self->an.temperature);
  else
    comment = g_strdup_printf ("Chairwise chair %d of %s; idealised geometry, an estimate", chair + 1, spec);
  text = cw_chair_geometry_to_xyz (&g, comment);
  /* Temporary file, then rename: an existing file is never left half written. */
  return g_file_set_contents_full (path, text, -1, G_FILE_SET_CONTENTS_CONSISTENT, 0666, error);
}

/* target is "FIGURE.EXT" (e.g. "chairs.svg"), "report-a4.pdf" / "report-letter.pdf", or
 * "chair1.xyz" / "chair2.xyz" (the 3D chairs).
 * Exports always use the light style (the render layer ignores dark for files). */
gboolean
cw_window_export_to (CwWindow   *self,
                     const char *target,
                     const char *path,
                     GError    **error)
{
  g_autofree char *fig_name = g_strdup (target);
  char            *dot = strrchr (fig_name, '.');
  CwRenderOptions  opt;
  guint            i;

  if (dot != NULL)
    *dot = '\0';
  if (g_strcmp0 (target, "chair1.xyz") == 0 || g_strcmp0 (target, "chair2.xyz") == 0)
    return export_chair_xyz (self, target[5] - '1', path, error);
  if (g_strcmp0 (fig_name, "report-a4") == 0 || g_strcmp0 (fig_name, "report-letter") == 0)
    {
      /* The window's own geometry table, so the report's couplings and reactions match the pages. */
      const CwGeometryData *gd = cw_app_get_geometry (error);

      if (gd == NULL)
        return FALSE;
      return cw_render_export_report_with_geometry (self->data, gd, self->doc, fig_name + strlen ("report-"),
                                                    path, error);
    }
  if (!lookup_figure (fig_name, &i))
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_ARGUMENT, _("Unknown figure “%s”"), target);
      return FALSE;
    }
  cw_window_render_options (self, NULL, &opt);
  opt.dark = FALSE;
  opt.highlight_sub = -1;
  return cw_render_export_figure (figures[i].fig, self->data, self->doc, &opt, path, EXPORT_DPI, error);
}

static cairo_status_t
write_to_array_cb (void                *closure,
                   const unsigned char *data,
                   unsigned int         length)
{
  g_byte_array_append (closure, data, length);
  return CAIRO_STATUS_SUCCESS;
}

static void
draw_for_copy (CwWindow *self,
               guint     i,
               cairo_t  *cr)
{
  CwRenderOptions opt;

  cw_window_render_options (self, NULL, &opt);
  opt.dark = FALSE;
  opt.highlight_sub = -1;
  cw_render_figure (cr, figures[i].fig, self->data, cw_document_peek_molecule (self->doc),
                    self->an_valid ? &self->an : NULL, &opt, figures[i].width, figures[i].height);
}

gboolean
cw_window_copy_figure (CwWindow   *self,
                       const char *figure,
                       GError    **error)
{
  GByteArray *png = g_byte_array_new ();
  GByteArray *svg = g_byte_array_new ();
  g_autoptr (GBytes) png_bytes = NULL;
  g_autoptr (GBytes) svg_bytes = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  GdkContentProvider *providers[2];
  GdkContentProvider *union_provider;
  cairo_surface_t    *surface;
  cairo_status_t      status;
  cairo_t            *cr;
  guint               i;

  if (!lookup_figure (figure, &i) || (!self->an_valid && figures[i].fig != CW_FIGURE_STRUCTURE))
    {
      g_byte_array_unref (png);
      g_byte_array_unref (svg);
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_ARGUMENT, _("There is no figure “%s” to copy"), figure);
      return FALSE;
    }
  /* PNG at twice the nominal size, so it stays sharp when pasted into a report. */
  surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, figures[i].width * 2, figures[i].height * 2);
  cr = cairo_create (surface);
  cairo_scale (cr, 2.0, 2.0);
  draw_for_copy (self, i, cr);
  cairo_destroy (cr);
  status = cairo_surface_write_to_png_stream (surface, write_to_array_cb, png);
  cairo_surface_destroy (surface);

  surface = cairo_svg_surface_create_for_stream (write_to_array_cb, svg, figures[i].width, figures[i].height);
  cr = cairo_create (surface);
  draw_for_copy (self, i, cr);
  cairo_destroy (cr);
  cairo_surface_finish (surface);
  if (status == CAIRO_STATUS_SUCCESS)
    status = cairo_surface_status (surface);
  cairo_surface_destroy (surface);

  png_bytes = g_byte_array_free_to_bytes (png);
  svg_bytes = g_byte_array_free_to_bytes (svg);
  if (status != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("The figure could not be drawn: %s"), cairo_status_to_string (status));
      return FALSE;
    }
  texture = gdk_texture_new_from_bytes (png_bytes, error);
  if (texture == NULL)
    return FALSE;
  providers[0] = gdk_content_provider_new_typed (GDK_TYPE_TEXTURE, texture);
  providers[1] = gdk_content_provider_new_for_bytes ("image/svg+xml", svg_bytes);
  union_provider = gdk_content_provider_new_union (providers, 2);
  gdk_clipboard_set_content (gtk_widget_get_clipboard (GTK_WIDGET (self)), union_provider);
  g_object_unref (union_provider);
  return TRUE;
}

/* ---- actions ---------------------------------------------------------------------------- */

typedef struct
{
  CwWindow *self;
  char     *target;
} ExportRequest;

static void
export_response_cb (GtkNativeDialog *native,
                    int              response,
                    ExportRequest   *req)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (native));
      g_autofree char *path = g_file_get_path (file);
      g_autoptr (GError) error = NULL;

      if (path == NULL || !cw_window_export_to (req->self, req->target, path, &error))
        cw_window_show_error (req->self, _("The export failed"), error);
    }
  g_object_unref (req->self);
  g_free (req->target);
  g_free (req);
  g_object_unref (native);
}

static void
export_action (GtkWidget  *widget,
               const char *action_name,
               GVariant   *param)
{
  CwWindow             *self = CW_WINDOW (widget);
  const char           *target = g_variant_get_string (param, NULL);
  const char           *title = cw_document_get_title (self->doc);
  GtkFileChooserNative *native;
  ExportRequest        *req;
  g_autofree char      *name = NULL;

  native = gtk_file_chooser_native_new (_("Export"), GTK_WINDOW (self), GTK_FILE_CHOOSER_ACTION_SAVE,
                                           _("_Export"), _("_Cancel"));
  /* e.g. "Demo-chairs.svg" */
  name = g_strdup_printf ("%s-%s", title && *title ? title : _("Untitled"), target);
  g_strdelimit (name, "/", '-');
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (native), name);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (native), TRUE);
  req = g_new0 (ExportRequest, 1);
  req->self = g_object_ref (self);
  req->target = g_strdup (target);
  g_signal_connect (native, "response", G_CALLBACK (export_response_cb), req);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (native));
}

static void
export_to_action (GtkWidget  *widget,
                  const char *action_name,
                  GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr (GError) error = NULL;
  const char *target, *path;

  g_variant_get (param, "(&s&s)", &target, &path);
  if (!cw_window_export_to (self, target, path, &error))
    cw_window_show_error (self, _("The export failed"), error);
}

static void
copy_figure_action (GtkWidget  *widget,
                    const char *action_name,
                    GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr (GError) error = NULL;

  if (!cw_window_copy_figure (self, g_variant_get_string (param, NULL), &error))
    cw_window_show_error (self, _("Nothing was copied"), error);
}

void
cw_window_class_add_export_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.export", "s", export_action);
  gtk_widget_class_install_action (widget_class, "win.export-to", "(ss)", export_to_action);
  gtk_widget_class_install_action (widget_class, "win.copy-figure", "s", copy_figure_action);
}
