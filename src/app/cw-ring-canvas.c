#include "config.h"

#include "cw-ring-canvas.h"

#include <glib/gi18n.h>
#include <math.h>

struct _CwRingCanvas
{
  GtkWidget parent_instance;

  /* owned: a copy, so the canvas never points into a document that changed */
  CwMolecule *mol;
  GHashTable *layouts; /* markup → PangoLayout: shaping the text is most of a redraw */
  int         selected;
  /* Drawings kept from one frame to the next: the ring with its numbers and the selection,
   * and each carbon's groups, each with what it was drawn from. GTK repaints only where a
   * drawing is new, so an edit on one carbon repaints that carbon's groups alone. */
  GskRenderNode *base_node;
  char          *base_key;
  GskRenderNode *carbon_node[CW_RING_SIZE];
  char          *carbon_key[CW_RING_SIZE];
  guint          n_drawn; /* drawings made (for tests) */
};

G_DEFINE_FINAL_TYPE (CwRingCanvas, cw_ring_canvas, GTK_TYPE_WIDGET)

enum
{
  PROP_0,
  PROP_SELECTED,
  N_PROPS
};

enum
{
  CLEAR_REQUESTED,
  CHOOSE_REQUESTED,
  SEARCH_REQUESTED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint       signals[N_SIGNALS];

typedef struct
{
  double cx, cy, r;
} Geometry;

static void
get_geometry (CwRingCanvas *self,
              Geometry     *g)
{
  double w = gtk_widget_get_width (GTK_WIDGET (self));
  double h = gtk_widget_get_height (GTK_WIDGET (self));

  g->cx = w / 2.0;
  g->cy = h / 2.0;
  g->r = MIN (w, h) * 0.27;
}

/* Carbon 1 at the top, numbering clockwise. */
static void
carbon_point (const Geometry *g,
              int             position,
              double         *x,
              double         *y)
{
  double a = -G_PI / 2.0 + (position - 1) * G_PI / 3.0;

  *x = g->cx + g->r * cos (a);
  *y = g->cy + g->r * sin (a);
}

static void
get_colors (GtkWidget *widget,
            GdkRGBA   *fg,
            GdkRGBA   *accent)
{
  GtkStyleContext *ctx = gtk_widget_get_style_context (widget);

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (ctx, fg);
  if (!gtk_style_context_lookup_color (ctx, "accent_bg_color", accent) &&
      !gtk_style_context_lookup_color (ctx, "theme_selected_bg_color", accent))
    gdk_rgba_parse (accent, "#3584e4");
  G_GNUC_END_IGNORE_DEPRECATIONS
}

static void
draw_wedge (cairo_t *cr,
            double   x0,
            double   y0,
            double   x1,
            double   y1,
            gboolean hashed)
{
  double dx = x1 - x0, dy = y1 - y0;
  double len = hypot (dx, dy);
  double nx = -dy / len, ny = dx / len;
  double half = 5.0;

  if (!hashed)
    {
      cairo_move_to (cr, x0, y0);
      cairo_line_to (cr, x1 + nx * half, y1 + ny * half);
      cairo_line_to (cr, x1 - nx * half, y1 - ny * half);
      cairo_close_path (cr);
      cairo_fill (cr);
      return;
    }
  cairo_set_line_width (cr, 1.5);
  for (int i = 1; i <= 7; i++)
    {
      double t = i / 7.0;
      double px = x0 + dx * t, py = y0 + dy * t;

      cairo_move_to (cr, px + nx * half * t, py + ny * half * t);
      cairo_line_to (cr, px - nx * half * t, py - ny * half * t);
    }
  cairo_stroke (cr);
}

static PangoLayout *
get_layout (CwRingCanvas *self,
            const char   *markup,
            gboolean      bold)
{
  g_autofree char *key = bold ? g_strdup_printf ("<b>%s</b>", markup) : g_strdup (markup);
  PangoLayout     *layout = g_hash_table_lookup (self->layouts, key);

  if (layout == NULL)
    {
      layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);
      pango_layout_set_markup (layout, key, -1);
      g_hash_table_insert (self->layouts, g_steal_pointer (&key), layout);
    }
  return layout;
}

static void
draw_label (CwRingCanvas *self,
            cairo_t      *cr,
            const char   *markup,
            double        x,
            double        y,
            gboolean      bold)
{
  PangoLayout *layout = get_layout (self, markup, bold);
  int          w, h;

  pango_layout_get_pixel_size (layout, &w, &h);
  cairo_move_to (cr, x - w / 2.0, y - h / 2.0);
  pango_cairo_show_layout (cr, layout);
}

/* Where a group's bond ends and its label sits, for face f (0 up, 1 down) of position. */
static void
group_points (const Geometry      *g,
              int                  position,
              const CwSubstituent *up,
              const CwSubstituent *down,
              int                  f,
              double              *x1,
              double              *y1,
              double              *lx,
              double              *ly)
{
  double a = -G_PI / 2.0 + (position - 1) * G_PI / 3.0, x0, y0;

  carbon_point (g, position, &x0, &y0);
  /* A geminal pair splits its two bonds either side of the radial direction. */
  if (up != NULL && down != NULL)
    a += f == 0 ? -0.38 : 0.38;
  *x1 = x0 + g->r * 0.42 * cos (a);
  *y1 = y0 + g->r * 0.42 * sin (a);
  *lx = x0 + g->r * 0.70 * cos (a);
  *ly = y0 + g->r * 0.70 * sin (a);
}

static const char *
group_markup (const CwSubstituent *s)
{
  return s->group->markup ? s->group->markup : s->group->label;
}

/* A drawing of its own, in the widget's coordinates, clipped to bounds. */
static GskRenderNode *
new_drawing (const graphene_rect_t *bounds,
             cairo_t              **cr)
{
  GskRenderNode *node = gsk_cairo_node_new (bounds);

  *cr = gsk_cairo_node_get_draw_context (node);
  return node;
}

/* The groups up and down (either may be NULL) on one carbon: their wedges and labels, in
 * a box just large enough. NULL when the carbon has none. */
static GskRenderNode *
draw_carbon (CwRingCanvas        *self,
             const Geometry      *g,
             const GdkRGBA       *fg,
             int                  position,
             const CwSubstituent *up,
             const CwSubstituent *down)
{
  double         x0, y0, left, top, right, bottom;
  GskRenderNode *node;
  cairo_t       *cr;

  if (up == NULL && down == NULL)
    return NULL;
  carbon_point (g, position, &x0, &y0);
  left = right = x0;
  top = bottom = y0;
  for (int f = 0; f < 2; f++)
    {
      const CwSubstituent *s = f == 0 ? up : down;
      double               x1, y1, lx, ly;
      int                  w, h;

      if (s == NULL)
        continue;
      group_points (g, position, up, down, f, &x1, &y1, &lx, &ly);
      pango_layout_get_pixel_size (get_layout (self, group_markup (s), FALSE), &w, &h);
      left = MIN (MIN (left, x1), lx - w / 2.0);
      right = MAX (MAX (right, x1), lx + w / 2.0);
      top = MIN (MIN (top, y1), ly - h / 2.0);
      bottom = MAX (MAX (bottom, y1), ly + h / 2.0);
    }
  /* Room for the wedge's width and the antialiased edges. */
  left = floor (left) - 8;
  top = floor (top) - 8;
  node = new_drawing (&GRAPHENE_RECT_INIT (left, top, ceil (right) + 8 - left, ceil (bottom) + 8 - top), &cr);
  gdk_cairo_set_source_rgba (cr, fg);
  for (int f = 0; f < 2; f++)
    {
      const CwSubstituent *s = f == 0 ? up : down;
      double               x1, y1, lx, ly;

      if (s == NULL)
        continue;
      group_points (g, position, up, down, f, &x1, &y1, &lx, &ly);
      draw_wedge (cr, x0, y0, x1, y1, s->face == CW_FACE_DOWN);
      draw_label (self, cr, group_markup (s), lx, ly, FALSE);
    }
  cairo_destroy (cr);
  self->n_drawn++;
  return node;
}

/* The ring, its position numbers and the selected carbon's mark. */
static GskRenderNode *
draw_base (CwRingCanvas   *self,
           const Geometry *g,
           const GdkRGBA  *fg,
           const GdkRGBA  *accent,
           int             w,
           int             h)
{
  cairo_t       *cr;
  GskRenderNode *node = new_drawing (&GRAPHENE_RECT_INIT (0, 0, w, h), &cr);

  if (self->selected >= 1)
    {
      double sx, sy;

      carbon_point (g, self->selected, &sx, &sy);
      cairo_set_source_rgba (cr, accent->red, accent->green, accent->blue, 0.28);
      cairo_arc (cr, sx, sy, MAX (14.0, g->r * 0.2), 0, 2 * G_PI);
      cairo_fill (cr);
    }

  gdk_cairo_set_source_rgba (cr, fg);
  cairo_set_line_width (cr, 2.0);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      double x, y;

      carbon_point (g, p, &x, &y);
      if (p == 1)
        cairo_move_to (cr, x, y);
      else
        cairo_line_to (cr, x, y);
    }
  cairo_close_path (cr);
  cairo_stroke (cr);

  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      double x, y, a = -G_PI / 2.0 + (p - 1) * G_PI / 3.0;
      char   num[4];

      carbon_point (g, p, &x, &y);
      g_snprintf (num, sizeof num, "%d", p);
      /* Position numbers sit just inside the ring. */
      cairo_set_source_rgba (cr, fg->red, fg->green, fg->blue, p == self->selected ? 1.0 : 0.6);
      draw_label (self, cr, num, x - 0.2 * g->r * cos (a), y - 0.2 * g->r * sin (a), p == self->selected);
    }
  cairo_destroy (cr);
  self->n_drawn++;
  return node;
}

/* Replaces *node with a new drawing unless key is what it was drawn from. */
static gboolean
keep_drawing (GskRenderNode **node,
              char          **old_key,
              char           *key)
{
  if (g_strcmp0 (*old_key, key) == 0)
    {
      g_free (key);
      return TRUE;
    }
  g_clear_pointer (node, gsk_render_node_unref);
  g_free (*old_key);
  *old_key = key;
  return FALSE;
}

static void
forget_drawings (CwRingCanvas *self)
{
  g_clear_pointer (&self->base_node, gsk_render_node_unref);
  g_clear_pointer (&self->base_key, g_free);
  for (int i = 0; i < CW_RING_SIZE; i++)
    {
      g_clear_pointer (&self->carbon_node[i], gsk_render_node_unref);
      g_clear_pointer (&self->carbon_key[i], g_free);
    }
}

static char *
color_key (const GdkRGBA *c)
{
  return g_strdup_printf ("%.4f,%.4f,%.4f,%.4f", c->red, c->green, c->blue, c->alpha);
}

static void
cw_ring_canvas_snapshot (GtkWidget   *widget,
                         GtkSnapshot *snapshot)
{
  CwRingCanvas    *self = CW_RING_CANVAS (widget);
  int              w = gtk_widget_get_width (widget), h = gtk_widget_get_height (widget);
  GdkRGBA          fg, accent;
  Geometry         g;
  g_autofree char *fg_key = NULL, *accent_key = NULL;

  if (w <= 0 || h <= 0)
    return;
  get_geometry (self, &g);
  get_colors (widget, &fg, &accent);
  fg_key = color_key (&fg);
  accent_key = color_key (&accent);

  if (!keep_drawing (&self->base_node, &self->base_key,
                     g_strdup_printf ("%dx%d %s %s %d", w, h, fg_key, accent_key, self->selected)))
    self->base_node = draw_base (self, &g, &fg, &accent, w, h);
  gtk_snapshot_append_node (snapshot, self->base_node);

  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      const CwSubstituent *up = self->mol ? cw_molecule_get (self->mol, p, CW_FACE_UP) : NULL;
      const CwSubstituent *down = self->mol ? cw_molecule_get (self->mol, p, CW_FACE_DOWN) : NULL;

      if (!keep_drawing (&self->carbon_node[p - 1], &self->carbon_key[p - 1],
                         g_strdup_printf ("%dx%d %s %s|%s", w, h, fg_key, up ? group_markup (up) : "",
                                          down ? group_markup (down) : "")))
        self->carbon_node[p - 1] = draw_carbon (self, &g, &fg, p, up, down);
      if (self->carbon_node[p - 1] != NULL)
        gtk_snapshot_append_node (snapshot, self->carbon_node[p - 1]);
    }
}

guint
cw_ring_canvas_get_n_drawn (CwRingCanvas *self)
{
  g_return_val_if_fail (CW_IS_RING_CANVAS (self), 0);
  return self->n_drawn;
}

static void
update_accessible (CwRingCanvas *self)
{
  const CwSubstituent *up, *down;
  g_autofree char     *text = NULL;

  if (self->mol == NULL || self->selected < 1)
    return;
  up = cw_molecule_get (self->mol, self->selected, CW_FACE_UP);
  down = cw_molecule_get (self->mol, self->selected, CW_FACE_DOWN);
  /* TRANSLATORS: screen-reader text for the ring canvas: carbon number, up group, down group */
  text = g_strdup_printf (_("Carbon %d selected; up face: %s; down face: %s"), self->selected,
                             up ? up->group->label : _("none"), down ? down->group->label : _("none"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_VALUE_TEXT, text, -1);
}

static void
click_pressed_cb (GtkGestureClick *gesture,
                  int              n_press,
                  double           x,
                  double           y,
                  CwRingCanvas    *self)
{
  int p = cw_ring_canvas_hit_test (self, x, y);

  gtk_widget_grab_focus (GTK_WIDGET (self));
  if (p > 0)
    cw_ring_canvas_set_selected (self, p);
  if (p > 0 && n_press == 2)
    g_signal_emit (self, signals[CHOOSE_REQUESTED], 0, (int) CW_FACE_UP);
}

static gboolean
key_pressed_cb (GtkEventControllerKey *controller,
                guint                  keyval,
                guint                  keycode,
                GdkModifierType        state,
                CwRingCanvas          *self)
{
  gunichar ch = gdk_keyval_to_unicode (keyval);
  int      sel = MAX (self->selected, 1);

  if (state & (GDK_CONTROL_MASK | GDK_ALT_MASK | GDK_SUPER_MASK))
    return FALSE;
  if (keyval >= GDK_KEY_1 && keyval <= GDK_KEY_6)
    cw_ring_canvas_set_selected (self, keyval - GDK_KEY_0);
  else if (keyval >= GDK_KEY_KP_1 && keyval <= GDK_KEY_KP_6)
    cw_ring_canvas_set_selected (self, keyval - GDK_KEY_KP_0);
  else if (keyval == GDK_KEY_Right || keyval == GDK_KEY_Down)
    cw_ring_canvas_set_selected (self, sel % CW_RING_SIZE + 1);
  else if (keyval == GDK_KEY_Left || keyval == GDK_KEY_Up)
    cw_ring_canvas_set_selected (self, (sel + CW_RING_SIZE - 2) % CW_RING_SIZE + 1);
  else if (keyval == GDK_KEY_Delete || keyval == GDK_KEY_BackSpace || keyval == GDK_KEY_KP_Delete)
    g_signal_emit (self, signals[CLEAR_REQUESTED], 0);
  else if (keyval == GDK_KEY_Return || keyval == GDK_KEY_KP_Enter || keyval == GDK_KEY_space)
    g_signal_emit (self, signals[CHOOSE_REQUESTED], 0,
                   (int) ((state & GDK_SHIFT_MASK) ? CW_FACE_DOWN : CW_FACE_UP));
  else if (ch != 0 && g_unichar_isgraph (ch))
    {
      char buf[8] = { 0 };

      g_unichar_to_utf8 (ch, buf);
      g_signal_emit (self, signals[SEARCH_REQUESTED], 0, buf);
    }
  else
    return FALSE;
  return TRUE;
}

static void
cw_ring_canvas_finalize (GObject *object)
{
  CwRingCanvas *self = CW_RING_CANVAS (object);

  g_clear_pointer (&self->mol, cw_molecule_free);
  g_clear_pointer (&self->layouts, g_hash_table_unref);
  forget_drawings (self);

  G_OBJECT_CLASS (cw_ring_canvas_parent_class)->finalize (object);
}

static void
cw_ring_canvas_get_property (GObject    *object,
                             guint       prop_id,
                             GValue     *value,
                             GParamSpec *pspec)
{
  CwRingCanvas *self = CW_RING_CANVAS (object);

  switch (prop_id)
    {
    case PROP_SELECTED:
      g_value_set_int (value, self->selected);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_ring_canvas_set_property (GObject      *object,
                             guint         prop_id,
                             const GValue *value,
                             GParamSpec   *pspec)
{
  CwRingCanvas *self = CW_RING_CANVAS (object);

  switch (prop_id)
    {
    case PROP_SELECTED:
      cw_ring_canvas_set_selected (self, g_value_get_int (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_ring_canvas_css_changed (GtkWidget         *widget,
                            GtkCssStyleChange *change)
{
  CwRingCanvas *self = CW_RING_CANVAS (widget);

  GTK_WIDGET_CLASS (cw_ring_canvas_parent_class)->css_changed (widget, change);
  /* A new font or scale: lay the labels out again. */
  g_hash_table_remove_all (self->layouts);
  forget_drawings (self);
  gtk_widget_queue_draw (widget);
}

static void
cw_ring_canvas_measure (GtkWidget     *widget,
                        GtkOrientation orientation,
                        int            for_size,
                        int           *minimum,
                        int           *natural,
                        int           *minimum_baseline,
                        int           *natural_baseline)
{
  *minimum = 220;
  *natural = 320;
}

static void
cw_ring_canvas_class_init (CwRingCanvasClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->finalize = cw_ring_canvas_finalize;
  object_class->get_property = cw_ring_canvas_get_property;
  object_class->set_property = cw_ring_canvas_set_property;
  widget_class->snapshot = cw_ring_canvas_snapshot;
  widget_class->measure = cw_ring_canvas_measure;
  widget_class->css_changed = cw_ring_canvas_css_changed;

  properties[PROP_SELECTED] =
    g_param_spec_int ("selected", NULL, NULL, 1, CW_RING_SIZE, 1,
                      G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  signals[CLEAR_REQUESTED] =
    g_signal_new ("clear-requested", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 0);
  signals[CHOOSE_REQUESTED] =
    g_signal_new ("choose-requested", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 1, G_TYPE_INT);
  signals[SEARCH_REQUESTED] =
    g_signal_new ("search-requested", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 1, G_TYPE_STRING);

  /* Copy and paste the molecule as SMILES while the ring has the focus. */
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_c, GDK_CONTROL_MASK, "win.copy-smiles", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_v, GDK_CONTROL_MASK, "win.paste-smiles", NULL);

  gtk_widget_class_set_css_name (widget_class, "ringcanvas");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_GROUP);
}

static void
cw_ring_canvas_init (CwRingCanvas *self)
{
  GtkGesture         *click = gtk_gesture_click_new ();
  GtkEventController *keys = gtk_event_controller_key_new ();

  self->selected = 1;
  self->layouts = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_object_unref);
  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_widget_set_focus_on_click (GTK_WIDGET (self), TRUE);
  gtk_widget_add_css_class (GTK_WIDGET (self), "cw-ring-canvas");

  g_signal_connect (click, "pressed", G_CALLBACK (click_pressed_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (click));
  g_signal_connect (keys, "key-pressed", G_CALLBACK (key_pressed_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self), keys);
}

GtkWidget *
cw_ring_canvas_new (void)
{
  return g_object_new (CW_TYPE_RING_CANVAS, NULL);
}

/* Whether the canvas would draw b just as it draws a (same groups, by label, on the same slots). */
static gboolean
same_ring (const CwMolecule *a,
           const CwMolecule *b)
{
  if (a == NULL || b == NULL)
    return a == b;
  if (a->n_subs != b->n_subs)
    return FALSE;
  for (int i = 0; i < a->n_subs; i++)
    {
      const CwSubstituent *x = &a->subs[i], *y = &b->subs[i];

      if (x->position != y->position || x->face != y->face ||
          g_strcmp0 (x->group->label, y->group->label) != 0 ||
          g_strcmp0 (x->group->markup, y->group->markup) != 0 || x->group->custom != y->group->custom)
        return FALSE;
    }
  return TRUE;
}

void
cw_ring_canvas_set_molecule (CwRingCanvas     *self,
                             const CwMolecule *mol)
{
  g_return_if_fail (CW_IS_RING_CANVAS (self));

  /* A temperature or unit change leaves the ring as it is: nothing to redraw. */
  if (same_ring (self->mol, mol))
    return;
  g_clear_pointer (&self->mol, cw_molecule_free);
  if (mol != NULL)
    self->mol = cw_molecule_copy (mol);
  update_accessible (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

int
cw_ring_canvas_get_selected (CwRingCanvas *self)
{
  g_return_val_if_fail (CW_IS_RING_CANVAS (self), 0);
  return self->selected;
}

void
cw_ring_canvas_set_selected (CwRingCanvas *self,
                             int           position)
{
  g_return_if_fail (CW_IS_RING_CANVAS (self));

  position = CLAMP (position, 1, CW_RING_SIZE);
  if (position == self->selected)
    return;
  self->selected = position;
  update_accessible (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SELECTED]);
}

int
cw_ring_canvas_hit_test (CwRingCanvas *self,
                         double        x,
                         double        y)
{
  Geometry g;
  int      best = 0;
  double   best_d = G_MAXDOUBLE;

  g_return_val_if_fail (CW_IS_RING_CANVAS (self), 0);

  get_geometry (self, &g);
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      double px, py, d;

      carbon_point (&g, p, &px, &py);
      d = hypot (x - px, y - py);
      if (d < best_d)
        {
          best_d = d;
          best = p;
        }
    }
  /* Generous target: anywhere within the carbon's own segment out to its labels. */
  return best_d <= g.r * 0.9 ? best : 0;
}
