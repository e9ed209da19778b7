#include "config.h"

#include <glib/gi18n.h>
#include <string.h>

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

/* The figures the window shows, each in its own drawing area. */
static const CwFigure window_figures[] = { CW_FIGURE_CHAIRS, CW_FIGURE_PROFILE, CW_FIGURE_SCAN };

static guint
figure_slot (CwFigure fig)
{
  switch (fig)
    {
    case CW_FIGURE_CHAIRS:
      return 0;
    case CW_FIGURE_PROFILE:
      return 1;
    case CW_FIGURE_SCAN:
    case CW_FIGURE_STRUCTURE:
    default:
      return 2;
    }
}

/* The figure as it would be drawn now into the area's box with the options opt (see
 * cw_window_render_options); NULL when nothing is drawn. */
static CwScene *
figure_scene (CwWindow              *self,
              CwFigure               fig,
              int                    width,
              int                    height,
              const CwRenderOptions *opt)
{
  if (!self->an_valid && fig != CW_FIGURE_STRUCTURE)
    return NULL;
  return cw_render_figure_scene (fig, self->data, cw_document_peek_molecule (self->doc),
                                 self->an_valid ? &self->an : NULL, opt, width, height);
}

/* A molecule whose figures use every kind of text the window's figures show: plain, italic,
 * subscript and superscript group labels. */
#define WARM_UP_RING "1u=tert-butyl 2d=hydroxy 4u=trifluoromethyl 5d=carboxylate"

static CwMolecule *
warm_up_molecule (CwWindow     *self,
                  CwConditions *cond)
{
  g_autoptr (CwDocument) doc = cw_document_new ();

  cw_document_get_conditions (doc, cond);
  return cw_molecule_new_from_spec (WARM_UP_RING, self->data->groups, NULL);
}

/* A window's first figures are laid out and painted on the worker, whose fonts were loaded
 * while the window was being built (cw_window_start_figures). The window's own fonts for the
 * figures, which it needs to lay out each change, are loaded once they are on screen: for the
 * figures as shown, and for every kind of group label. */
static gboolean
warm_up_cb (gpointer data)
{
  CwWindow *self = data;
  g_autoptr (CwMolecule) mol = NULL;
  CwConditions cond;

  self->warm_up_id = 0;
  for (guint i = 0; i < G_N_ELEMENTS (window_figures); i++)
    {
      GtkDrawingArea *area = figure_area (self, window_figures[i]);
      guint           slot = figure_slot (window_figures[i]);
      int             width = self->figure_drawn_width[slot], height = self->figure_drawn_height[slot];
      CwRenderOptions opt;

      if (!self->figure_drawn_valid[slot] || width <= 0 || height <= 0)
        continue;
      cw_window_render_options (self, GTK_WIDGET (area), &opt);
      cw_scene_free (figure_scene (self, window_figures[i], width, height, &opt));
    }
  mol = warm_up_molecule (self, &cond);
  if (mol != NULL)
    cw_render_warm_up (self->data, mol, &cond, 0);
  self->fonts_loaded = TRUE;
  return G_SOURCE_REMOVE;
}

void
cw_window_start_figures (CwWindow *self)
{
  CwConditions cond;
  g_autoptr (CwMolecule) mol = warm_up_molecule (self, &cond);

  if (mol != NULL)
    self->warm_up_job = cw_paint_job_warm_up_figures (self->data, mol, &cond, 1);
}

/* Waits for job, copies its image into cr (or paints its scene here if Cairo failed on the
 * worker), frees it and returns its scene. */
static CwScene *
finish_job (CwWindow   *self,
            CwPaintJob *job,
            cairo_t    *cr,
            gboolean    dark,
            int         width,
            int         height)
{
  cairo_surface_t *image = cw_paint_job_wait (job);
  CwScene         *scene = cw_paint_job_steal_scene (job);

  if (image != NULL)
    {
      cairo_set_source_surface (cr, image, 0, 0);
      cairo_paint (cr);
      self->n_worker_figures++;
    }
  else
    cw_render_figure_paint (cr, scene, dark, width, height);
  cw_paint_job_free (job);
  return scene;
}

static void
draw_figure (CwWindow       *self,
             GtkDrawingArea *area,
             CwFigure        fig,
             cairo_t        *cr,
             int             width,
             int             height)
{
  guint           slot = figure_slot (fig);
  int             scale = gtk_widget_get_scale_factor (GTK_WIDGET (area));
  CwRenderOptions opt;
  CwScene        *scene;

  cw_window_render_options (self, GTK_WIDGET (area), &opt);
  /* The scene laid out when the redraw was queued, if nothing has changed since: painted
   * by then, or nearly, on the worker thread. */
  if (self->figure_pending[slot] != NULL && self->figure_pending_stamp[slot] == self->figure_stamp &&
      self->figure_pending_width[slot] == width && self->figure_pending_height[slot] == height &&
      self->figure_pending_scale[slot] == scale && memcmp (&self->figure_pending_opt[slot], &opt, sizeof opt) == 0)
    scene = finish_job (self, g_steal_pointer (&self->figure_pending[slot]), cr, opt.dark, width, height);
  else if (!self->fonts_loaded && self->an_valid && width > 0 && height > 0)
    {
      /* The first figures: on the worker, whose fonts are loaded, while this thread waits. */
      CwPaintJob *job;

      g_clear_pointer (&self->figure_pending[slot], cw_paint_job_free);
      job = cw_paint_job_start_figure (fig, self->data, cw_document_peek_molecule (self->doc), &self->an, &opt, width,
                                       height, scale);
      scene = finish_job (self, job, cr, opt.dark, width, height);
      if (!self->warm_up_done && scene != NULL)
        {
          /* After this frame. */
          self->warm_up_done = TRUE;
          self->warm_up_id = g_idle_add (warm_up_cb, self);
        }
    }
  else
    {
      g_clear_pointer (&self->figure_pending[slot], cw_paint_job_free);
      scene = figure_scene (self, fig, width, height, &opt);
      cw_render_figure_paint (cr, scene, opt.dark, width, height);
    }
  /* Kept to tell, at the next change, whether this figure needs drawing again. */
  g_free (self->figure_spec[slot]);
  self->figure_spec[slot] = cw_molecule_dup_spec (cw_document_peek_molecule (self->doc));
  g_clear_pointer (&self->figure_drawn[slot], cw_scene_free);
  self->figure_drawn[slot] = scene;
  self->figure_drawn_valid[slot] = TRUE;
  self->figure_drawn_dark[slot] = opt.dark;
  self->figure_drawn_width[slot] = width;
  self->figure_drawn_height[slot] = height;
}

/* Cairo places every point on a grid of 1/256 device pixel: a figure whose every point
 * moved by less than that (a temperature step shifts the energy levels by a few thousandths
 * of a point) is drawn as it already is. Returns that step in the scene's units. */
static double
figure_tolerance (GtkDrawingArea *area,
                  const CwScene  *scene,
                  int             width,
                  int             height)
{
  double s;

  if (scene == NULL || scene->width <= 0 || scene->height <= 0)
    return 0.0;
  s = MIN (width / scene->width, height / scene->height) * gtk_widget_get_scale_factor (GTK_WIDGET (area));
  return s > 0 ? 1.0 / (256.0 * s) : 0.0;
}

/* Keeps job, started for the figure in slot, to be drawn at the next frame. */
static void
keep_pending (CwWindow              *self,
              guint                  slot,
              CwPaintJob            *job,
              const CwRenderOptions *opt,
              int                    width,
              int                    height,
              int                    scale)
{
  self->figure_pending[slot] = job;
  self->figure_pending_opt[slot] = *opt;
  self->figure_pending_width[slot] = width;
  self->figure_pending_height[slot] = height;
  self->figure_pending_scale[slot] = scale;
  self->figure_pending_stamp[slot] = self->figure_stamp;
}

/* After a change: redraw the figures that now look different, and only those. A figure
 * that is not shown, or not drawn yet, is simply queued. */
void
cw_window_queue_figures (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  g_autofree char  *spec = cw_molecule_dup_spec (mol);

  for (guint i = 0; i < G_N_ELEMENTS (window_figures); i++)
    {
      GtkDrawingArea *area = figure_area (self, window_figures[i]);
      guint           slot = figure_slot (window_figures[i]);
      int             width = gtk_widget_get_width (GTK_WIDGET (area));
      int             height = gtk_widget_get_height (GTK_WIDGET (area));
      int             scale = gtk_widget_get_scale_factor (GTK_WIDGET (area));
      gboolean        new_molecule = g_strcmp0 (spec, self->figure_spec[slot]) != 0;
      CwRenderOptions opt;
      CwScene        *scene;

      g_clear_pointer (&self->figure_pending[slot], cw_paint_job_free);
      if (!self->figure_drawn_valid[slot] || !gtk_widget_get_mapped (GTK_WIDGET (area)) ||
          width != self->figure_drawn_width[slot] || height != self->figure_drawn_height[slot])
        {
          gtk_widget_queue_draw (GTK_WIDGET (area));
          continue;
        }
      cw_window_render_options (self, GTK_WIDGET (area), &opt);
      if (new_molecule && self->an_valid && width > 0 && height > 0)
        {
          /* Other groups on the ring: the figure will almost always look different, so there
           * is no point in laying it out here to compare. The worker lays it out and paints
           * it while this thread brings the other widgets up to date. */
          keep_pending (self, slot,
                        cw_paint_job_start_figure (window_figures[i], self->data, mol, &self->an, &opt, width, height,
                                                   scale),
                        &opt, width, height, scale);
          self->n_worker_layouts++;
          gtk_widget_queue_draw (GTK_WIDGET (area));
          continue;
        }
      scene = figure_scene (self, window_figures[i], width, height, &opt);
      if (opt.dark == self->figure_drawn_dark[slot] &&
          cw_scene_equal_within (scene, self->figure_drawn[slot], figure_tolerance (area, scene, width, height)))
        {
          cw_scene_free (scene);
          continue;
        }
      if (scene == NULL || width <= 0 || height <= 0)
        {
          /* Nothing to draw (no analysis): the area is cleared at once. */
          cw_scene_free (scene);
          gtk_widget_queue_draw (GTK_WIDGET (area));
          continue;
        }
      /* Painted on the worker thread while the other widgets are brought up to date. */
      keep_pending (self, slot, cw_paint_job_start (scene, opt.dark, width, height, scale), &opt, width, height, scale);
      gtk_widget_queue_draw (GTK_WIDGET (area));
    }
}

/* Before the window goes away. */
void
cw_window_stop_figures (CwWindow *self)
{
  g_clear_handle_id (&self->warm_up_id, g_source_remove);
  g_clear_pointer (&self->warm_up_job, cw_paint_job_free);
}

/* Forgets the figures as drawn: the next change redraws all three. */
void
cw_window_clear_figures (CwWindow *self)
{
  for (guint i = 0; i < G_N_ELEMENTS (self->figure_drawn); i++)
    {
      g_clear_pointer (&self->figure_drawn[i], cw_scene_free);
      g_clear_pointer (&self->figure_pending[i], cw_paint_job_free);
      g_clear_pointer (&self->figure_spec[i], g_free);
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

/* The window as last painted, or NULL while a redraw is pending: GTK hands out a widget's
 * last painted frame, and forgets it as soon as anything in the window asks to be drawn
 * again (a blinking cursor, a figure back from the worker). The paintable covers the
 * window's shadow too, and scales what it draws to the size asked for: it is snapshot at
 * its own size. */
static GskRenderNode *
painted_node (GtkWidget *widget)
{
  g_autoptr (GdkPaintable) paintable = gtk_widget_paintable_new (widget);
  GtkSnapshot *snapshot = gtk_snapshot_new ();

  gdk_paintable_snapshot (paintable, snapshot, gdk_paintable_get_intrinsic_width (paintable),
                          gdk_paintable_get_intrinsic_height (paintable));
  return gtk_snapshot_free_to_node (snapshot);
}

typedef struct
{
  GtkWidget     *widget;
  GskRenderNode *node;
  gboolean       painted;
} FrameGrab;

static void
grab_after_paint_cb (GdkFrameClock *clock,
                     gpointer       data)
{
  FrameGrab *grab = data;

  if (grab->painted)
    return;
  grab->painted = TRUE;
  grab->node = painted_node (grab->widget);
}

/* Paints a frame now and returns it (NULL if none came within two seconds): taken right
 * after the paint, before anything else can ask for a redraw. */
static GskRenderNode *
next_painted_node (GtkWidget *widget)
{
  GdkFrameClock *clock = gtk_widget_get_frame_clock (widget);
  FrameGrab      grab = { widget, NULL, FALSE };
  gint64         end = g_get_monotonic_time () + 2 * G_USEC_PER_SEC;
  gulong         handler;

  if (clock == NULL)
    return NULL;
  handler = g_signal_connect (clock, "after-paint", G_CALLBACK (grab_after_paint_cb), &grab);
  gtk_widget_queue_draw (widget);
  while (!grab.painted && g_get_monotonic_time () < end)
    if (!g_main_context_iteration (NULL, FALSE))
      g_usleep (1000);
  g_signal_handler_disconnect (clock, handler);
  return grab.node;
}

gboolean
cw_window_save_screenshot (CwWindow   *self,
                           const char *path,
                           GError    **error)
{
  GtkWidget *widget = GTK_WIDGET (self);
  int        w = gtk_widget_get_width (widget), h = gtk_widget_get_height (widget);
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  graphene_rect_t bounds;

  if (w <= 0 || h <= 0 || gtk_native_get_renderer (GTK_NATIVE (self)) == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("The window is not shown yet"));
      return FALSE;
    }
  /* The window's box, unscaled, out of what the paintable covers. */
  if (!gtk_widget_compute_bounds (widget, widget, &bounds))
    bounds = GRAPHENE_RECT_INIT (0, 0, w, h);
  node = painted_node (widget);
  if (node == NULL)
    node = next_painted_node (widget);
  if (node == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("The window drew nothing"));
      return FALSE;
    }
  texture = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (self)), node,
                                         &GRAPHENE_RECT_INIT (-bounds.origin.x, -bounds.origin.y, w, h));
  if (!gdk_texture_save_to_png (texture, path))
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, _("Could not write “%s”"), path);
      return FALSE;
    }
  return TRUE;
}
