#include "config.h"

#include "cw-result-sheet.h"

#include <glib/gi18n.h>
#include <string.h>

#include "cw-copy-menu.h"

#define N_COLS CW_SHEET_COLUMNS
#define SOURCE_COL (N_COLS - 1)
#define COL_SPACING 18
#define ROW_SPACING 4
#define SOURCE_MAX_CHARS 48 /* the source column asks for no more than this */
#define SOURCE_MIN_CHARS 6
#define DIM_OPACITY 0.55 /* as the theme's dimmed labels */
#define FLAG_PAD_X 8
#define FLAG_PAD_Y 6
#define FLAG_RADIUS 6
#define FLAG_GAP 4 /* between flags */
#define FLAG_MIN_CHARS 12
#define ICON_SIZE 16
#define ICON_GAP 8
#define SECTION_GAP 8  /* between the flags, the title and the table */
#define TITLE_MARGIN 6 /* more room above the title */
#define TITLE_SCALE 1.1
#define SHRINK_DELAY_MS 500

/* A text laid out once and drawn once, shared by every cell that shows it: when a term
 * comes or goes, the rows below it shift, and their texts are found again in the sheet's
 * pools instead of being laid out and drawn anew. */
typedef struct
{
  int            ref;
  char          *text;
  PangoLayout   *layout;
  int            width; /* logical size in pixels, on one line, before any shortening */
  int            height;
  int            layout_width;   /* width set on the layout (Pango units), -1 for none */
  int            limited_height; /* height at that width */
  GskRenderNode *node;           /* the layout drawn in node_color; NULL until drawn */
  GdkRGBA        node_color;
} Text;

/* Texts of each column, plain and heading, and of the flags. */
#define N_POOLS (2 * N_COLS + 1)
#define FLAG_POOL (2 * N_COLS)
#define POOL_KEEP 256 /* texts kept unused before the unused ones are dropped */

typedef struct
{
  Text    *cells[N_COLS];
  gboolean heading;
  int      height;
} Row;

typedef struct
{
  Text    *text;
  gboolean info;
} Flag;

struct _CwResultSheet
{
  GtkWidget parent_instance;

  GArray      *rows; /* Row, n_rows of them */
  guint        n_rows;
  GArray      *flags; /* Flag, n_flags of them */
  guint        n_flags;
  GHashTable  *pools[N_POOLS]; /* text → Text */
  char        *title;
  PangoLayout *title_layout;
  int          title_width;
  int          title_height;
  int          col_width[N_COLS]; /* only grow; the source column's is its natural width */
  int          table_height;
  int          min_width; /* as asked for; only grow */
  int          nat_width;
  int          char_width; /* pixels */
  int          source_max; /* pixels */
  int          source_min;
  guint        context_serial;
  int          room_width; /* the width the room below was laid out for, -1 for none */
  int          room;       /* the height the sheet holds at that width */
  guint        shrink_id;
  char        *text;
  GtkWidget   *menu;
};

enum
{
  PROP_0,
  PROP_TITLE,
  N_PROPS
};

static GParamSpec *props[N_PROPS];

G_DEFINE_FINAL_TYPE (CwResultSheet, cw_result_sheet, GTK_TYPE_WIDGET)

static gboolean
is_numeric (guint col)
{
  return col == 1 || col == 2;
}

static void
text_unref (Text *text)
{
  if (text == NULL || --text->ref > 0)
    return;
  g_free (text->text);
  g_clear_object (&text->layout);
  g_clear_pointer (&text->node, gsk_render_node_unref);
  g_free (text);
}

static void
text_measure (Text *text)
{
  pango_layout_set_width (text->layout, -1);
  text->layout_width = -1;
  pango_layout_get_pixel_size (text->layout, &text->width, &text->height);
  text->limited_height = text->height;
  g_clear_pointer (&text->node, gsk_render_node_unref);
}

/* Lays the text out width wide (Pango units, -1 for no limit), unless it already is. */
static void
text_set_width (Text *text,
                int   width)
{
  if (width == text->layout_width)
    return;
  pango_layout_set_width (text->layout, width);
  text->layout_width = width;
  pango_layout_get_pixel_size (text->layout, NULL, &text->limited_height);
  g_clear_pointer (&text->node, gsk_render_node_unref);
}

static void
text_set_alignment (Text          *text,
                    PangoAlignment alignment)
{
  if (pango_layout_get_alignment (text->layout) == alignment)
    return;
  pango_layout_set_alignment (text->layout, alignment);
  g_clear_pointer (&text->node, gsk_render_node_unref);
}

/* The text from the pool (a new reference), laid out when it is not there yet. */
static Text *
text_get (CwResultSheet *self,
          guint          pool,
          const char    *string)
{
  Text          *text = g_hash_table_lookup (self->pools[pool], string);
  PangoAttrList *attrs;

  if (text != NULL)
    {
      text->ref++;
      return text;
    }
  if (g_hash_table_size (self->pools[pool]) >= POOL_KEEP)
    {
      GHashTableIter iter;
      gpointer       value;

      g_hash_table_iter_init (&iter, self->pools[pool]);
      while (g_hash_table_iter_next (&iter, NULL, &value))
        if (((Text *) value)->ref == 1)
          g_hash_table_iter_remove (&iter);
    }
  text = g_new0 (Text, 1);
  text->ref = 2; /* the pool's and the caller's */
  text->text = g_strdup (string);
  text->layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), string);
  attrs = pango_attr_list_new ();
  if (pool == FLAG_POOL)
    pango_layout_set_wrap (text->layout, PANGO_WRAP_WORD_CHAR);
  else
    {
      guint col = pool % N_COLS;

      if (pool >= N_COLS)
        pango_attr_list_insert (attrs, pango_attr_weight_new (PANGO_WEIGHT_BOLD));
      if (is_numeric (col))
        pango_attr_list_insert (attrs, pango_attr_font_features_new ("tnum"));
      if (col == SOURCE_COL)
        pango_layout_set_ellipsize (text->layout, PANGO_ELLIPSIZE_END);
    }
  pango_layout_set_attributes (text->layout, attrs);
  pango_attr_list_unref (attrs);
  text_measure (text);
  g_hash_table_insert (self->pools[pool], text->text, text);
  return text;
}

/* Appends the text, drawn once and kept. */
static void
text_snapshot (Text          *text,
               GtkSnapshot   *snapshot,
               int            x,
               int            y,
               const GdkRGBA *color)
{
  if (text->node == NULL || !gdk_rgba_equal (&text->node_color, color))
    {
      GtkSnapshot *s = gtk_snapshot_new ();

      g_clear_pointer (&text->node, gsk_render_node_unref);
      gtk_snapshot_append_layout (s, text->layout, color);
      text->node = gtk_snapshot_free_to_node (s);
      text->node_color = *color;
    }
  if (text->node == NULL)
    return;
  gtk_snapshot_save (snapshot);
  gtk_snapshot_translate (snapshot, &GRAPHENE_POINT_INIT (x, y));
  gtk_snapshot_append_node (snapshot, text->node);
  gtk_snapshot_restore (snapshot);
}

static void
title_measure (CwResultSheet *self)
{
  pango_layout_get_pixel_size (self->title_layout, &self->title_width, &self->title_height);
}

/* Column widths and the table's height from the cells. Widths only grow. */
static void
update_table_metrics (CwResultSheet *self)
{
  int height = 0;

  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      row->height = 0;
      for (guint c = 0; c < N_COLS; c++)
        {
          int width = c == SOURCE_COL ? MIN (row->cells[c]->width, self->source_max) : row->cells[c]->width;

          self->col_width[c] = MAX (self->col_width[c], width);
          row->height = MAX (row->height, row->cells[c]->height);
        }
      height += row->height + (r > 0 ? ROW_SPACING : 0);
    }
  self->table_height = height;
}

/* Left edges of the columns (left to right); the source column gets what is left. */
static void
column_starts (CwResultSheet *self,
               int            x[N_COLS])
{
  x[0] = 0;
  for (guint c = 1; c < N_COLS; c++)
    x[c] = x[c - 1] + self->col_width[c - 1] + COL_SPACING;
}

/* The widths asked for; they only grow. Returns TRUE when they changed. */
static gboolean
update_widths (CwResultSheet *self)
{
  int      x[N_COLS];
  int      flag_min = 2 * FLAG_PAD_X + ICON_SIZE + ICON_GAP + FLAG_MIN_CHARS * self->char_width;
  int      min = MAX (flag_min, self->title_width), nat = min;
  gboolean changed;

  column_starts (self, x);
  if (self->n_rows > 0)
    {
      min = MAX (min, x[SOURCE_COL] + MIN (self->source_min, self->col_width[SOURCE_COL]));
      nat = MAX (nat, x[SOURCE_COL] + self->col_width[SOURCE_COL]);
    }
  for (guint i = 0; i < self->n_flags; i++)
    nat = MAX (nat, 2 * FLAG_PAD_X + ICON_SIZE + ICON_GAP + g_array_index (self->flags, Flag, i).text->width);
  nat = MAX (nat, min);
  changed = min > self->min_width || nat > self->nat_width;
  self->min_width = MAX (self->min_width, min);
  self->nat_width = MAX (self->nat_width, nat);
  return changed;
}

/* The font may have changed (theme, text scale): lay everything out again. */
static void
check_context (CwResultSheet *self)
{
  PangoContext     *context = gtk_widget_get_pango_context (GTK_WIDGET (self));
  guint             serial = pango_context_get_serial (context);
  PangoFontMetrics *metrics;
  int               char_width;

  if (serial == self->context_serial && self->source_max > 0)
    return;
  self->context_serial = serial;
  metrics = pango_context_get_metrics (context, NULL, NULL);
  char_width = pango_font_metrics_get_approximate_char_width (metrics);
  pango_font_metrics_unref (metrics);
  self->char_width = PANGO_PIXELS (char_width);
  self->source_max = PANGO_PIXELS (char_width * SOURCE_MAX_CHARS);
  self->source_min = PANGO_PIXELS (char_width * SOURCE_MIN_CHARS);
  for (guint i = 0; i < N_POOLS; i++)
    {
      GHashTableIter iter;
      gpointer       value;

      g_hash_table_iter_init (&iter, self->pools[i]);
      while (g_hash_table_iter_next (&iter, NULL, &value))
        {
          pango_layout_context_changed (((Text *) value)->layout);
          text_measure (value);
        }
    }
  pango_layout_context_changed (self->title_layout);
  title_measure (self);
  memset (self->col_width, 0, sizeof self->col_width);
  self->min_width = self->nat_width = 0;
  self->room_width = -1;
  update_table_metrics (self);
  update_widths (self);
}

static int
flag_text_width (int width)
{
  return MAX (width - 2 * FLAG_PAD_X - ICON_SIZE - ICON_GAP, 1);
}

/* A flag's height at the sheet's width; leaves its text laid out for that width. */
static int
flag_height (Flag *flag,
             int   width)
{
  int avail = flag_text_width (width);

  text_set_width (flag->text, flag->text->width > avail ? avail * PANGO_SCALE : -1);
  return 2 * FLAG_PAD_Y + MAX (ICON_SIZE, flag->text->limited_height);
}

/* Height of everything above the table, at a width. */
static int
table_top (CwResultSheet *self,
           int            width)
{
  int y = 0;

  for (guint i = 0; i < self->n_flags; i++)
    y += flag_height (&g_array_index (self->flags, Flag, i), width) + (i > 0 ? FLAG_GAP : 0);
  if (self->n_flags > 0)
    y += SECTION_GAP;
  return y + TITLE_MARGIN + self->title_height + SECTION_GAP;
}

static int
content_height (CwResultSheet *self,
                int            width)
{
  return table_top (self, width) + (self->n_rows > 0 ? self->table_height : -SECTION_GAP);
}

static void
update_text (CwResultSheet *self)
{
  GString *text = g_string_new (NULL);

  for (guint i = 0; i < self->n_flags; i++)
    {
      Flag *flag = &g_array_index (self->flags, Flag, i);

      /* TRANSLATORS: a flag as copied text: "Note: …" or "Warning: …" */
      g_string_append_printf (text, flag->info ? _("Note: %s") : _("Warning: %s"), flag->text->text);
      g_string_append_c (text, '\n');
    }
  if (self->title != NULL && *self->title != '\0')
    g_string_append_printf (text, "%s\n", self->title);
  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      for (guint c = 0; c < N_COLS; c++)
        {
          g_string_append (text, row->cells[c]->text);
          g_string_append_c (text, c + 1 < N_COLS ? '\t' : '\n');
        }
    }
  g_free (self->text);
  self->text = g_string_free (text, FALSE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, self->text, -1);
}

static gboolean
set_flags (CwResultSheet     *self,
           const CwSheetFlag *flags,
           guint              n_flags)
{
  gboolean changed = n_flags != self->n_flags;

  for (guint i = n_flags; i < self->n_flags; i++)
    g_clear_pointer (&g_array_index (self->flags, Flag, i).text, text_unref);
  g_array_set_size (self->flags, n_flags);
  for (guint i = 0; i < n_flags; i++)
    {
      Flag       *flag = &g_array_index (self->flags, Flag, i);
      const char *text = flags[i].text != NULL ? flags[i].text : "";

      if (flag->text != NULL && strcmp (flag->text->text, text) == 0 && flag->info == (flags[i].info != FALSE))
        continue;
      flag->info = flags[i].info != FALSE;
      text_unref (flag->text);
      flag->text = text_get (self, FLAG_POOL, text);
      changed = TRUE;
    }
  self->n_flags = n_flags;
  return changed;
}

static gboolean
set_rows (CwResultSheet    *self,
          const CwSheetRow *rows,
          guint             n_rows)
{
  gboolean changed = n_rows != self->n_rows;

  for (guint r = n_rows; r < self->n_rows; r++)
    for (guint c = 0; c < N_COLS; c++)
      g_clear_pointer (&g_array_index (self->rows, Row, r).cells[c], text_unref);
  g_array_set_size (self->rows, n_rows);
  for (guint r = 0; r < n_rows; r++)
    {
      Row     *row = &g_array_index (self->rows, Row, r);
      gboolean heading = rows[r].heading != FALSE;

      for (guint c = 0; c < N_COLS; c++)
        {
          const char *text = rows[r].cells[c] != NULL ? rows[r].cells[c] : "";

          if (row->cells[c] != NULL && heading == row->heading && strcmp (row->cells[c]->text, text) == 0)
            continue;
          text_unref (row->cells[c]);
          row->cells[c] = text_get (self, heading ? N_COLS + c : c, text);
          changed = TRUE;
        }
      row->heading = heading;
    }
  self->n_rows = n_rows;
  return changed;
}

static gboolean
shrink_cb (gpointer data)
{
  CwResultSheet *self = data;

  self->shrink_id = 0;
  cw_result_sheet_shrink (self);
  return G_SOURCE_REMOVE;
}

void
cw_result_sheet_shrink (CwResultSheet *self)
{
  int width;

  g_return_if_fail (CW_IS_RESULT_SHEET (self));
  g_clear_handle_id (&self->shrink_id, g_source_remove);
  width = gtk_widget_get_width (GTK_WIDGET (self));
  if (width > 0 && width == self->room_width)
    {
      int need = content_height (self, width);

      if (need < self->room)
        {
          self->room = need;
          gtk_widget_queue_resize (GTK_WIDGET (self));
        }
    }
}

CwSheetChange
cw_result_sheet_set_content (CwResultSheet     *self,
                             const CwSheetFlag *flags,
                             guint              n_flags,
                             const CwSheetRow  *rows,
                             guint              n_rows)
{
  gboolean changed;
  int      width, need;

  g_return_val_if_fail (CW_IS_RESULT_SHEET (self), CW_SHEET_UNCHANGED);
  check_context (self);
  changed = set_flags (self, flags, n_flags);
  changed = set_rows (self, rows, n_rows) || changed;
  if (!changed)
    return CW_SHEET_UNCHANGED;
  update_text (self);
  update_table_metrics (self);
  changed = update_widths (self);
  width = gtk_widget_get_width (GTK_WIDGET (self));
  need = content_height (self, width > 0 ? width : self->nat_width);
  if (!changed && width > 0 && width == self->room_width && need <= self->room)
    {
      /* It fits: redraw now, give room back once the edits pause. */
      if (need < self->room)
        {
          g_clear_handle_id (&self->shrink_id, g_source_remove);
          self->shrink_id = g_timeout_add (SHRINK_DELAY_MS, shrink_cb, self);
        }
      gtk_widget_queue_draw (GTK_WIDGET (self));
      return CW_SHEET_REDRAWN;
    }
  g_clear_handle_id (&self->shrink_id, g_source_remove);
  self->room = need;
  self->room_width = width > 0 ? width : -1;
  gtk_widget_queue_resize (GTK_WIDGET (self));
  return CW_SHEET_RESIZED;
}

guint
cw_result_sheet_get_n_rows (CwResultSheet *self)
{
  g_return_val_if_fail (CW_IS_RESULT_SHEET (self), 0);
  return self->n_rows;
}

guint
cw_result_sheet_get_n_flags (CwResultSheet *self)
{
  g_return_val_if_fail (CW_IS_RESULT_SHEET (self), 0);
  return self->n_flags;
}

const char *
cw_result_sheet_get_cell (CwResultSheet *self,
                          guint          row,
                          guint          column)
{
  g_return_val_if_fail (CW_IS_RESULT_SHEET (self), NULL);
  if (row >= self->n_rows || column >= N_COLS)
    return NULL;
  return g_array_index (self->rows, Row, row).cells[column]->text;
}

const char *
cw_result_sheet_get_flag (CwResultSheet *self,
                          guint          index,
                          gboolean      *info)
{
  Flag *flag;

  g_return_val_if_fail (CW_IS_RESULT_SHEET (self), NULL);
  if (index >= self->n_flags)
    return NULL;
  flag = &g_array_index (self->flags, Flag, index);
  if (info != NULL)
    *info = flag->info;
  return flag->text->text;
}

const char *
cw_result_sheet_get_text (CwResultSheet *self)
{
  g_return_val_if_fail (CW_IS_RESULT_SHEET (self), NULL);
  return self->text != NULL ? self->text : "";
}

/* ---- layout and drawing ------------------------------------------------------------- */

static GtkSizeRequestMode
cw_result_sheet_get_request_mode (GtkWidget *widget)
{
  return GTK_SIZE_REQUEST_HEIGHT_FOR_WIDTH;
}

static void
cw_result_sheet_measure (GtkWidget     *widget,
                         GtkOrientation orientation,
                         int            for_size,
                         int           *minimum,
                         int           *natural,
                         int           *minimum_baseline,
                         int           *natural_baseline)
{
  CwResultSheet *self = CW_RESULT_SHEET (widget);

  check_context (self);
  if (orientation == GTK_ORIENTATION_HORIZONTAL)
    {
      *minimum = self->min_width;
      *natural = self->nat_width;
    }
  else
    {
      int width = for_size >= 0 ? for_size : self->nat_width;
      int height = content_height (self, width);

      if (width == self->room_width)
        height = MAX (height, self->room);
      *minimum = *natural = height;
    }
}

static void
cw_result_sheet_size_allocate (GtkWidget *widget,
                               int        width,
                               int        height,
                               int        baseline)
{
  CwResultSheet *self = CW_RESULT_SHEET (widget);

  if (width != self->room_width)
    {
      self->room_width = width;
      self->room = content_height (self, width);
    }
  if (self->menu != NULL)
    gtk_popover_present (GTK_POPOVER (self->menu));
}

static void
lookup_color (GtkStyleContext *context,
              const char      *name,
              const GdkRGBA   *fallback,
              double           alpha,
              GdkRGBA         *color)
{
  if (!gtk_style_context_lookup_color (context, name, color))
    *color = *fallback;
  color->alpha *= alpha;
}

static void
snapshot_flag (CwResultSheet *self,
               GtkSnapshot   *snapshot,
               Flag          *flag,
               int            y,
               int            height,
               const GdkRGBA *fg,
               const GdkRGBA  symbolic[4],
               const GdkRGBA *tint)
{
  GtkWidget        *widget = GTK_WIDGET (self);
  int               width = gtk_widget_get_width (widget);
  gboolean          rtl = gtk_widget_get_direction (widget) == GTK_TEXT_DIR_RTL;
  GskRoundedRect    box;
  GtkIconPaintable *icon;
  int               icon_x = rtl ? width - FLAG_PAD_X - ICON_SIZE : FLAG_PAD_X;
  int               text_x = rtl ? FLAG_PAD_X : FLAG_PAD_X + ICON_SIZE + ICON_GAP;

  gsk_rounded_rect_init_from_rect (&box, &GRAPHENE_RECT_INIT (0, y, width, height), FLAG_RADIUS);
  gtk_snapshot_push_rounded_clip (snapshot, &box);
  gtk_snapshot_append_color (snapshot, tint, &box.bounds);
  gtk_snapshot_pop (snapshot);

  icon = gtk_icon_theme_lookup_icon (gtk_icon_theme_get_for_display (gtk_widget_get_display (widget)),
                                     flag->info ? "dialog-information-symbolic" : "dialog-warning-symbolic", NULL,
                                     ICON_SIZE, gtk_widget_get_scale_factor (widget), gtk_widget_get_direction (widget), 0);
  gtk_snapshot_save (snapshot);
  gtk_snapshot_translate (snapshot, &GRAPHENE_POINT_INIT (icon_x, y + FLAG_PAD_Y));
  gtk_symbolic_paintable_snapshot_symbolic (GTK_SYMBOLIC_PAINTABLE (icon), snapshot, ICON_SIZE, ICON_SIZE, symbolic, 4);
  gtk_snapshot_restore (snapshot);
  g_object_unref (icon);

  text_set_alignment (flag->text, rtl ? PANGO_ALIGN_RIGHT : PANGO_ALIGN_LEFT);
  text_snapshot (flag->text, snapshot, text_x, y + FLAG_PAD_Y, fg);
}

static void
cw_result_sheet_snapshot (GtkWidget   *widget,
                          GtkSnapshot *snapshot)
{
  CwResultSheet   *self = CW_RESULT_SHEET (widget);
  GtkStyleContext *style = gtk_widget_get_style_context (widget);
  int              width = gtk_widget_get_width (widget);
  gboolean         rtl = gtk_widget_get_direction (widget) == GTK_TEXT_DIR_RTL;
  GdkRGBA          color, dim, symbolic[4], warning_tint, info_tint;
  int              x[N_COLS], y = 0;

  check_context (self);
  gtk_style_context_get_color (style, &color);
  dim = color;
  dim.alpha *= DIM_OPACITY;
  symbolic[0] = color;
  lookup_color (style, "error_color", &color, 1.0, &symbolic[1]);
  lookup_color (style, "warning_color", &color, 1.0, &symbolic[2]);
  lookup_color (style, "success_color", &color, 1.0, &symbolic[3]);
  lookup_color (style, "warning_color", &color, 0.14, &warning_tint);
  lookup_color (style, "theme_selected_bg_color", &color, 0.12, &info_tint);

  for (guint i = 0; i < self->n_flags; i++)
    {
      Flag *flag = &g_array_index (self->flags, Flag, i);
      int   height = flag_height (flag, width);

      snapshot_flag (self, snapshot, flag, y, height, &color, symbolic, flag->info ? &info_tint : &warning_tint);
      y += height + FLAG_GAP;
    }
  if (self->n_flags > 0)
    y += SECTION_GAP - FLAG_GAP;

  y += TITLE_MARGIN;
  gtk_snapshot_save (snapshot);
  gtk_snapshot_translate (snapshot, &GRAPHENE_POINT_INIT (rtl ? width - self->title_width : 0, y));
  gtk_snapshot_append_layout (snapshot, self->title_layout, &color);
  gtk_snapshot_restore (snapshot);
  y += self->title_height + SECTION_GAP;

  column_starts (self, x);
  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      for (guint c = 0; c < N_COLS; c++)
        {
          Text *cell = row->cells[c];
          int   cx = x[c], cw = cell->width;

          if (*cell->text == '\0')
            continue;
          if (c == SOURCE_COL)
            {
              int avail = MAX (width - x[c], 0);

              text_set_width (cell, cell->width > avail ? avail * PANGO_SCALE : -1);
              cw = MIN (cell->width, avail);
            }
          else if (is_numeric (c))
            cx += self->col_width[c] - cell->width;
          if (rtl)
            cx = width - cx - cw;
          text_snapshot (cell, snapshot, cx, y, c == SOURCE_COL && !row->heading ? &dim : &color);
        }
      y += row->height + ROW_SPACING;
    }
}

/* The whole source of the table row under the pointer, which the cell may show shortened. */
static gboolean
cw_result_sheet_query_tooltip (GtkWidget  *widget,
                               int         px,
                               int         py,
                               gboolean    keyboard,
                               GtkTooltip *tooltip)
{
  CwResultSheet *self = CW_RESULT_SHEET (widget);
  int            y = table_top (self, gtk_widget_get_width (widget));

  if (keyboard)
    return FALSE;
  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      if (py >= y && py < y + row->height + ROW_SPACING)
        {
          const char *source = row->cells[SOURCE_COL]->text;

          if (row->heading || *source == '\0')
            return FALSE;
          gtk_tooltip_set_text (tooltip, source);
          return TRUE;
        }
      y += row->height + ROW_SPACING;
    }
  return FALSE;
}

/* ---- copying ------------------------------------------------------------------------ */

static void
copy_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *parameter)
{
  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), cw_result_sheet_get_text (CW_RESULT_SHEET (widget)));
}

static void
menu_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *parameter)
{
  graphene_point_t at;

  cw_copy_menu_popup (&CW_RESULT_SHEET (widget)->menu, widget, "sheet.copy", cw_copy_menu_point (parameter, &at));
}

/* ---- object ------------------------------------------------------------------------- */

static void
set_title (CwResultSheet *self,
           const char    *title)
{
  g_free (self->title);
  self->title = g_strdup (title);
  pango_layout_set_text (self->title_layout, title != NULL ? title : "", -1);
  title_measure (self);
  update_text (self);
  update_widths (self);
  gtk_widget_queue_resize (GTK_WIDGET (self));
}

static void
cw_result_sheet_get_property (GObject    *object,
                              guint       prop_id,
                              GValue     *value,
                              GParamSpec *pspec)
{
  switch (prop_id)
    {
    case PROP_TITLE:
      g_value_set_string (value, CW_RESULT_SHEET (object)->title);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_result_sheet_set_property (GObject      *object,
                              guint         prop_id,
                              const GValue *value,
                              GParamSpec   *pspec)
{
  switch (prop_id)
    {
    case PROP_TITLE:
      set_title (CW_RESULT_SHEET (object), g_value_get_string (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_result_sheet_dispose (GObject *object)
{
  CwResultSheet *self = CW_RESULT_SHEET (object);

  g_clear_handle_id (&self->shrink_id, g_source_remove);
  g_clear_pointer (&self->menu, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_result_sheet_parent_class)->dispose (object);
}

static void
cw_result_sheet_finalize (GObject *object)
{
  CwResultSheet *self = CW_RESULT_SHEET (object);

  for (guint r = 0; r < self->rows->len; r++)
    for (guint c = 0; c < N_COLS; c++)
      text_unref (g_array_index (self->rows, Row, r).cells[c]);
  for (guint i = 0; i < self->flags->len; i++)
    text_unref (g_array_index (self->flags, Flag, i).text);
  g_array_unref (self->rows);
  g_array_unref (self->flags);
  for (guint i = 0; i < N_POOLS; i++)
    g_hash_table_unref (self->pools[i]);
  g_clear_object (&self->title_layout);
  g_free (self->title);
  g_free (self->text);
  G_OBJECT_CLASS (cw_result_sheet_parent_class)->finalize (object);
}

static void
cw_result_sheet_class_init (CwResultSheetClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->get_property = cw_result_sheet_get_property;
  object_class->set_property = cw_result_sheet_set_property;
  object_class->dispose = cw_result_sheet_dispose;
  object_class->finalize = cw_result_sheet_finalize;
  widget_class->get_request_mode = cw_result_sheet_get_request_mode;
  widget_class->measure = cw_result_sheet_measure;
  widget_class->size_allocate = cw_result_sheet_size_allocate;
  widget_class->snapshot = cw_result_sheet_snapshot;
  widget_class->query_tooltip = cw_result_sheet_query_tooltip;

  props[PROP_TITLE] = g_param_spec_string ("title", NULL, NULL, NULL, G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, props);

  cw_copy_menu_install (widget_class, "sheet", copy_action, menu_action);
  gtk_widget_class_set_css_name (widget_class, "resultsheet");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_GROUP);
}

static void
cw_result_sheet_init (CwResultSheet *self)
{
  PangoAttrList *attrs = pango_attr_list_new ();

  self->rows = g_array_new (FALSE, TRUE, sizeof (Row));
  self->flags = g_array_new (FALSE, TRUE, sizeof (Flag));
  for (guint i = 0; i < N_POOLS; i++)
    self->pools[i] = g_hash_table_new_full (g_str_hash, g_str_equal, NULL, (GDestroyNotify) text_unref);
  self->room_width = -1;
  self->title_layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);
  pango_attr_list_insert (attrs, pango_attr_weight_new (PANGO_WEIGHT_BOLD));
  pango_attr_list_insert (attrs, pango_attr_scale_new (TITLE_SCALE));
  pango_layout_set_attributes (self->title_layout, attrs);
  pango_attr_list_unref (attrs);
  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_widget_set_has_tooltip (GTK_WIDGET (self), TRUE);
  cw_copy_menu_add_click (GTK_WIDGET (self), "sheet.menu");
}

GtkWidget *
cw_result_sheet_new (void)
{
  return g_object_new (CW_TYPE_RESULT_SHEET, NULL);
}
