#include "config.h"

#include <glib/gi18n.h>

#include "cw-window-private.h"

/* Drawing the figures on screen, and the whole window into a PNG. */

/* The window follows the theme: light text on the background means a dark style. */
static gboolean
widget_is_dark (GtkWidget *widget)
{
  GdkRGBA fg;

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (widget), &fg);
  G_GNUC_END_IGNORE_DEPRECATIONS
  return 0.2126 * fg.red + 0.7152 * fg.green + 0.0722 * fg.blue > 0.5;
}

void
cw_window_render_options (CwWindow        *self,
                          GtkWidget       *widget,
                          CwRenderOptions *opt)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  int               sel = cw_ring_canvas_get_selected (self->ring_canvas);

  cw_render_options_init (opt);
  opt->unit = cw_window_get_energy_unit (self);
  opt->temperature_unit = cw_window_get_temperature_unit (self);
  opt->dark = widget != NULL && widget_is_dark (widget);
  opt->highlight_sub = -1;
  /* Reaction geometry on the chairs, from the same table as the Reactions page. */
  if (gtk_check_button_get_active (self->reactivity_check) && self->reactivity_valid)
    {
      opt->highlight_reactivity = TRUE;
      opt->reactivity_sub = -1;
      opt->reactivity = self->reactivity;
    }
  for (int i = 0; i < mol->n_subs; i++)
    if (mol->subs[i].position == sel)
      {
        opt->highlight_sub = i;
        break;
      }
}

static GtkDrawingArea *
figure_area (CwWindow *self,
             CwFigure  fig)
{
  switch (fig)
    {
    case CW_FIGURE_CHAIRS:
      return self->chairs_area;
    case CW_FIGURE_PROFILE:
      return self->profile_area;
    case CW_FIGURE_SCAN:
      return self->scan_area;
    case CW_FIGURE_STRUCTURE:
    default:
      g_return_val_if_reached (NULL);
    }
}

static guint
figure_slot (CwFigure fig)
{
  return fig == CW_FIGURE_CHAIRS ? 0 : fig == CW_FIGURE_PROFILE ? 1 : 2;
}

/* The figure as it would be drawn now into the area's box; NULL when nothing is drawn. */
static CwScene *
figure_scene (CwWindow       *self,
              GtkDrawingArea *area,
              CwFigure        fig,
              int             width,
              int             height,
              gboolean       *dark)
{
  CwRenderOptions opt;

  cw_window_render_options (self, GTK_WIDGET (area), &opt);
  *dark = opt.dark;
  if (!self->an_valid && fig != CW_FIGURE_STRUCTURE)
    return NULL;
  return cw_render_figure_scene (fig, self->data, cw_document_peek_molecule (self->doc),
                                 self->an_valid ? &self->an : NULL, &opt, width, height);
}

static void
draw_figure (CwWindow       *self,
             GtkDrawingArea *area,
             CwFigure        fig,
             cairo_t        *cr,
             int             width,
             int             height)
{
  guint    slot = figure_slot (fig);
  int      scale = gtk_widget_get_scale_factor (GTK_WIDGET (area));
  gboolean dark;
  CwScene *scene = figure_scene (self, area, fig, width, height, &dark);

  /* Painted into an image of the area's pixels, kept with the scene it shows: GTK's Cairo
   * renderer would otherwise replay the figure's drawing operations at every frame that
   * shows the area, through an intermediate surface as large as the figure. */
  if (g_getenv ("CW_NOIMG"))
    {
      cw_render_figure_paint (cr, scene, dark, width, height);
      g_clear_pointer (&self->figure_image[slot], cairo_surface_destroy);
    }
  else if (!(self->figure_drawn_valid[slot] && self->figure_image[slot] != NULL && dark == self->figure_drawn_dark[slot] &&
        width == self->figure_drawn_width[slot] && height == self->figure_drawn_height[slot] &&
        scale == self->figure_drawn_scale[slot] && cw_scene_equal (scene, self->figure_drawn[slot])))
    {
      g_clear_pointer (&self->figure_image[slot], cairo_surface_destroy);
      if (scene != NULL && width > 0 && height > 0)
        {
          cairo_surface_t *image = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, width * scale, height * scale);
          cairo_t         *icr;

          cairo_surface_set_device_scale (image, scale, scale);
          icr = cairo_create (image);
          cw_render_figure_paint (icr, scene, dark, width, height);
          cairo_destroy (icr);
          self->figure_image[slot] = image;
        }
    }
  if (self->figure_image[slot] != NULL)
    {
      cairo_set_source_surface (cr, self->figure_image[slot], 0, 0);
      cairo_paint (cr);
    }
  /* Kept to tell, at the next change, whether this figure needs drawing again. */
  g_clear_pointer (&self->figure_drawn[slot], cw_scene_free);
  self->figure_drawn[slot] = scene;
  self->figure_drawn_valid[slot] = TRUE;
  self->figure_drawn_dark[slot] = dark;
  self->figure_drawn_width[slot] = width;
  self->figure_drawn_height[slot] = height;
  self->figure_drawn_scale[slot] = scale;
}

/* After a change: redraw the figures that now look different, and only those. A figure
 * that is not shown, or not drawn yet, is simply queued. */
void
cw_window_queue_figures (CwWindow *self)
{
  static const CwFigure figs[] = { CW_FIGURE_CHAIRS, CW_FIGURE_PROFILE, CW_FIGURE_SCAN };

  for (guint i = 0; i < G_N_ELEMENTS (figs); i++)
    {
      GtkDrawingArea *area = figure_area (self, figs[i]);
      guint           slot = figure_slot (figs[i]);
      int             width = gtk_widget_get_width (GTK_WIDGET (area));
      int             height = gtk_widget_get_height (GTK_WIDGET (area));
      gboolean        same = FALSE;

      if (self->figure_drawn_valid[slot] && gtk_widget_get_mapped (GTK_WIDGET (area)) &&
          width == self->figure_drawn_width[slot] && height == self->figure_drawn_height[slot] &&
          gtk_widget_get_scale_factor (GTK_WIDGET (area)) == self->figure_drawn_scale[slot])
        {
          gboolean          dark;
          g_autoptr (CwScene) scene = figure_scene (self, area, figs[i], width, height, &dark);

          same = dark == self->figure_drawn_dark[slot] && cw_scene_equal (scene, self->figure_drawn[slot]);
        }
      if (!same)
        gtk_widget_queue_draw (GTK_WIDGET (area));
    }
}

/* Forgets the figures as drawn: the next change redraws all three. */
void
cw_window_clear_figures (CwWindow *self)
{
  for (guint i = 0; i < G_N_ELEMENTS (self->figure_drawn); i++)
    {
      g_clear_pointer (&self->figure_drawn[i], cw_scene_free);
      g_clear_pointer (&self->figure_image[i], cairo_surface_destroy);
      self->figure_drawn_valid[i] = FALSE;
    }
}

void
cw_window_draw_chairs_cb (GtkDrawingArea *area,
                          cairo_t        *cr,
                          int             width,
                          int             height,
                          gpointer        user_data)
{
  draw_figure (CW_WINDOW (user_data), area, CW_FIGURE_CHAIRS, cr, width, height);
}

void
cw_window_draw_profile_cb (GtkDrawingArea *area,
                           cairo_t        *cr,
                           int             width,
                           int             height,
                           gpointer        user_data)
{
  draw_figure (CW_WINDOW (user_data), area, CW_FIGURE_PROFILE, cr, width, height);
}

void
cw_window_draw_scan_cb (GtkDrawingArea *area,
                        cairo_t        *cr,
                        int             width,
                        int             height,
                        gpointer        user_data)
{
  draw_figure (CW_WINDOW (user_data), area, CW_FIGURE_SCAN, cr, width, height);
}

gboolean
cw_window_save_screenshot (CwWindow   *self,
                           const char *path,
                           GError    **error)
{
  GtkWidget *widget = GTK_WIDGET (self);
  int        w = gtk_widget_get_width (widget), h = gtk_widget_get_height (widget);
  g_autoptr (GdkPaintable) paintable = NULL;
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  GtkSnapshot *snapshot;

  if (w <= 0 || h <= 0 || gtk_native_get_renderer (GTK_NATIVE (self)) == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("The window is not shown yet"));
      return FALSE;
    }
  paintable = gtk_widget_paintable_new (widget);
  snapshot = gtk_snapshot_new ();
  gdk_paintable_snapshot (paintable, snapshot, w, h);
  node = gtk_snapshot_free_to_node (snapshot);
  if (node == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("The window drew nothing"));
      return FALSE;
    }
  texture = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (self)), node,
                                         &GRAPHENE_RECT_INIT (0, 0, w, h));
  if (!gdk_texture_save_to_png (texture, path))
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("Could not write “%s”"), path);
      return FALSE;
    }
  return TRUE;
}
