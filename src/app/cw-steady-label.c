#include "config.h"

#include "cw-steady-label.h"

#include <glib/gi18n.h>

#include "cw-copy-menu.h"

#define STEP_CHARS 4      /* widths asked for are whole steps of this many characters */
#define MIN_SHORT_STEPS 3 /* a wrapping or shortened label can be this narrow */

struct _CwSteadyLabel
{
  GtkWidget parent_instance;

  char        *text;
  PangoLayout *layout;
  gboolean     wrap;
  gboolean     ellipsize;
  gboolean     bold;
  float        xalign;
  gboolean     copyable;
  guint        context_serial;
  int          step;       /* pixels; 0 until the font is known */
  int          line_width; /* the text's width on one line, pixels */
  int          line_height;
  int          min_width; /* as asked for */
  int          nat_width;
  int          layout_width; /* width set on the layout (Pango units), -1 for none */
  GtkWidget   *menu;
};

G_DEFINE_FINAL_TYPE (CwSteadyLabel, cw_steady_label, GTK_TYPE_WIDGET)

enum
{
  PROP_0,
  PROP_TEXT,
  PROP_WRAP,
  PROP_ELLIPSIZE,
  PROP_XALIGN,
  PROP_COPYABLE,
  N_PROPS
};

static GParamSpec *props[N_PROPS];

/* Tabular figures, so that a number that changes keeps its width; bold when set. */
static void
set_attributes (CwSteadyLabel *self)
{
  PangoAttrList *attrs = pango_attr_list_new ();

  pango_attr_list_insert (attrs, pango_attr_font_features_new ("tnum"));
  if (self->bold)
    pango_attr_list_insert (attrs, pango_attr_weight_new (PANGO_WEIGHT_BOLD));
  pango_layout_set_attributes (self->layout, attrs);
  pango_attr_list_unref (attrs);
}

static void
set_layout_width (CwSteadyLabel *self,
                  int            width)
{
  if (width != self->layout_width)
    {
      pango_layout_set_width (self->layout, width);
      self->layout_width = width;
    }
}

static int
round_up (int width,
          int step)
{
  return step > 0 ? (width + step - 1) / step * step : width;
}

/* The widths to ask for, from the text on one line. They only grow: a label that once
 * held a longer result keeps the room for it (until the font changes). */
static void
compute_widths (CwSteadyLabel *self)
{
  int nat;

  set_layout_width (self, -1);
  pango_layout_get_pixel_size (self->layout, &self->line_width, &self->line_height);
  nat = self->line_width > 0 ? round_up (self->line_width, self->step) : 0;
  self->nat_width = MAX (self->nat_width, nat);
  self->min_width = self->wrap || self->ellipsize ? MIN (self->nat_width, MIN_SHORT_STEPS * self->step) : self->nat_width;
}

/* The font may have changed (style class, theme, text scale). */
static void
check_context (CwSteadyLabel *self)
{
  PangoContext     *context = gtk_widget_get_pango_context (GTK_WIDGET (self));
  guint             serial = pango_context_get_serial (context);
  PangoFontMetrics *metrics;

  if (serial == self->context_serial && self->step > 0)
    return;
  self->context_serial = serial;
  metrics = pango_context_get_metrics (context, NULL, NULL);
  self->step = MAX (1, PANGO_PIXELS (pango_font_metrics_get_approximate_char_width (metrics) * STEP_CHARS));
  pango_font_metrics_unref (metrics);
  pango_layout_context_changed (self->layout);
  self->nat_width = 0;
  compute_widths (self);
}

static int
height_for_width (CwSteadyLabel *self,
                  int            width)
{
  int height;

  if (!self->wrap || width < 0 || width >= self->line_width)
    return self->line_height;
  set_layout_width (self, width * PANGO_SCALE);
  pango_layout_get_pixel_size (self->layout, NULL, &height);
  return height;
}

/* After a change of text or weight: asks for a new size when the widths it asks for
 * changed or the text no longer has the height it was given, else only redraws. Returns
 * TRUE when it asked for a new size. */
static gboolean
queue_change (CwSteadyLabel *self,
              int            old_min,
              int            old_nat,
              int            old_height)
{
  int      width = gtk_widget_get_width (GTK_WIDGET (self));
  gboolean resize;

  check_context (self);
  compute_widths (self);
  resize = self->min_width != old_min || self->nat_width != old_nat ||
           (width > 0 ? height_for_width (self, width) != gtk_widget_get_height (GTK_WIDGET (self))
                      : self->line_height != old_height);
  if (resize)
    gtk_widget_queue_resize (GTK_WIDGET (self));
  else
    gtk_widget_queue_draw (GTK_WIDGET (self));
  return resize;
}

gboolean
cw_steady_label_set_text (CwSteadyLabel *self,
                          const char    *text)
{
  int      old_min, old_nat, old_height;
  gboolean resize;

  g_return_val_if_fail (CW_IS_STEADY_LABEL (self), FALSE);
  if (text == NULL)
    text = "";
  if (g_strcmp0 (self->text, text) == 0)
    return FALSE;
  old_min = self->min_width;
  old_nat = self->nat_width;
  old_height = self->line_height;
  g_free (self->text);
  self->text = g_strdup (text);
  pango_layout_set_text (self->layout, text, -1);
  resize = queue_change (self, old_min, old_nat, old_height);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, text, -1);
  g_object_notify_by_pspec (G_OBJECT (self), props[PROP_TEXT]);
  return resize;
}

/* Bold through the text's own attributes, not a style class: changing a style class
 * makes GTK restyle and lay out the window. */
gboolean
cw_steady_label_set_bold (CwSteadyLabel *self,
                          gboolean       bold)
{
  int old_min, old_nat, old_height;

  g_return_val_if_fail (CW_IS_STEADY_LABEL (self), FALSE);
  bold = bold != FALSE;
  if (bold == self->bold)
    return FALSE;
  self->bold = bold;
  old_min = self->min_width;
  old_nat = self->nat_width;
  old_height = self->line_height;
  set_attributes (self);
  return queue_change (self, old_min, old_nat, old_height);
}

gboolean
cw_steady_label_get_bold (CwSteadyLabel *self)
{
  g_return_val_if_fail (CW_IS_STEADY_LABEL (self), FALSE);
  return self->bold;
}

const char *
cw_steady_label_get_text (CwSteadyLabel *self)
{
  g_return_val_if_fail (CW_IS_STEADY_LABEL (self), NULL);
  return self->text;
}

/* ---- layout and drawing ------------------------------------------------------------- */

static GtkSizeRequestMode
cw_steady_label_get_request_mode (GtkWidget *widget)
{
  return CW_STEADY_LABEL (widget)->wrap ? GTK_SIZE_REQUEST_HEIGHT_FOR_WIDTH : GTK_SIZE_REQUEST_CONSTANT_SIZE;
}

static void
cw_steady_label_measure (GtkWidget     *widget,
                         GtkOrientation orientation,
                         int            for_size,
                         int           *minimum,
                         int           *natural,
                         int           *minimum_baseline,
                         int           *natural_baseline)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (widget);

  check_context (self);
  if (orientation == GTK_ORIENTATION_HORIZONTAL)
    {
      *minimum = self->min_width;
      *natural = self->nat_width;
    }
  else
    *minimum = *natural = height_for_width (self, for_size);
}

static void
cw_steady_label_snapshot (GtkWidget   *widget,
                          GtkSnapshot *snapshot)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (widget);
  int            width = gtk_widget_get_width (widget);
  int            height = gtk_widget_get_height (widget);
  float          xalign = gtk_widget_get_direction (widget) == GTK_TEXT_DIR_RTL ? 1.0f - self->xalign : self->xalign;
  PangoRectangle logical;
  GdkRGBA        color;
  float          x, y;

  if (self->text == NULL || *self->text == '\0')
    return;
  check_context (self);
  set_layout_width (self, (self->wrap || self->ellipsize) && width < self->line_width ? width * PANGO_SCALE : -1);
  pango_layout_set_alignment (self->layout, xalign > 0.75f ? PANGO_ALIGN_RIGHT : xalign > 0.25f ? PANGO_ALIGN_CENTER
                                                                                                : PANGO_ALIGN_LEFT);
  pango_layout_get_pixel_extents (self->layout, NULL, &logical);
  x = self->layout_width == -1 ? xalign * (width - logical.width) - logical.x : 0.0f;
  y = MAX (0, (height - logical.height) / 2);
  gtk_style_context_get_color (gtk_widget_get_style_context (widget), &color);
  gtk_snapshot_save (snapshot);
  gtk_snapshot_translate (snapshot, &GRAPHENE_POINT_INIT (x, y));
  gtk_snapshot_append_layout (snapshot, self->layout, &color);
  gtk_snapshot_restore (snapshot);
}

/* ---- copying ------------------------------------------------------------------------ */

static void
copy_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *parameter)
{
  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), CW_STEADY_LABEL (widget)->text ? CW_STEADY_LABEL (widget)->text : "");
}

static void
menu_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *parameter)
{
  graphene_point_t at;

  cw_copy_menu_popup (&CW_STEADY_LABEL (widget)->menu, widget, "line.copy", cw_copy_menu_point (parameter, &at));
}

static void
set_copyable (CwSteadyLabel *self,
              gboolean       copyable)
{
  self->copyable = copyable;
  gtk_widget_set_focusable (GTK_WIDGET (self), copyable);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "line.copy", copyable);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "line.menu", copyable);
}

/* ---- object ------------------------------------------------------------------------- */

static void
cw_steady_label_size_allocate (GtkWidget *widget,
                               int        width,
                               int        height,
                               int        baseline)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (widget);

  if (self->menu != NULL)
    gtk_popover_present (GTK_POPOVER (self->menu));
}

static void
cw_steady_label_get_property (GObject    *object,
                              guint       prop_id,
                              GValue     *value,
                              GParamSpec *pspec)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (object);

  switch (prop_id)
    {
    case PROP_TEXT:
      g_value_set_string (value, self->text);
      break;
    case PROP_WRAP:
      g_value_set_boolean (value, self->wrap);
      break;
    case PROP_ELLIPSIZE:
      g_value_set_boolean (value, self->ellipsize);
      break;
    case PROP_XALIGN:
      g_value_set_float (value, self->xalign);
      break;
    case PROP_COPYABLE:
      g_value_set_boolean (value, self->copyable);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_steady_label_set_property (GObject      *object,
                              guint         prop_id,
                              const GValue *value,
                              GParamSpec   *pspec)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (object);

  switch (prop_id)
    {
    case PROP_TEXT:
      cw_steady_label_set_text (self, g_value_get_string (value));
      break;
    case PROP_WRAP:
      self->wrap = g_value_get_boolean (value);
      compute_widths (self);
      gtk_widget_queue_resize (GTK_WIDGET (self));
      break;
    case PROP_ELLIPSIZE:
      self->ellipsize = g_value_get_boolean (value);
      pango_layout_set_ellipsize (self->layout, self->ellipsize ? PANGO_ELLIPSIZE_END : PANGO_ELLIPSIZE_NONE);
      compute_widths (self);
      gtk_widget_queue_resize (GTK_WIDGET (self));
      break;
    case PROP_XALIGN:
      self->xalign = g_value_get_float (value);
      gtk_widget_queue_draw (GTK_WIDGET (self));
      break;
    case PROP_COPYABLE:
      set_copyable (self, g_value_get_boolean (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_steady_label_dispose (GObject *object)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (object);

  g_clear_pointer (&self->menu, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_steady_label_parent_class)->dispose (object);
}

static void
cw_steady_label_finalize (GObject *object)
{
  CwSteadyLabel *self = CW_STEADY_LABEL (object);

  g_free (self->text);
  g_clear_object (&self->layout);
  G_OBJECT_CLASS (cw_steady_label_parent_class)->finalize (object);
}

static void
cw_steady_label_class_init (CwSteadyLabelClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->get_property = cw_steady_label_get_property;
  object_class->set_property = cw_steady_label_set_property;
  object_class->dispose = cw_steady_label_dispose;
  object_class->finalize = cw_steady_label_finalize;
  widget_class->get_request_mode = cw_steady_label_get_request_mode;
  widget_class->measure = cw_steady_label_measure;
  widget_class->size_allocate = cw_steady_label_size_allocate;
  widget_class->snapshot = cw_steady_label_snapshot;

  props[PROP_TEXT] = g_param_spec_string ("text", NULL, NULL, NULL, G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  props[PROP_WRAP] = g_param_spec_boolean ("wrap", NULL, NULL, FALSE, G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  props[PROP_ELLIPSIZE] = g_param_spec_boolean ("ellipsize", NULL, NULL, FALSE, G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  props[PROP_XALIGN] = g_param_spec_float ("xalign", NULL, NULL, 0.0f, 1.0f, 0.5f, G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  props[PROP_COPYABLE] = g_param_spec_boolean ("copyable", NULL, NULL, FALSE, G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, props);

  cw_copy_menu_install (widget_class, "line", copy_action, menu_action);
  gtk_widget_class_set_css_name (widget_class, "label");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_LABEL);
}

static void
cw_steady_label_init (CwSteadyLabel *self)
{
  self->xalign = 0.5f;
  self->layout_width = -1;
  self->layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);
  pango_layout_set_wrap (self->layout, PANGO_WRAP_WORD_CHAR);
  set_attributes (self);
  set_copyable (self, FALSE);
  cw_copy_menu_add_click (GTK_WIDGET (self), "line.menu");
}

GtkWidget *
cw_steady_label_new (void)
{
  return g_object_new (CW_TYPE_STEADY_LABEL, NULL);
}
