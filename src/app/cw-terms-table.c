#include "config.h"

#include "cw-terms-table.h"

#include <glib/gi18n.h>

#include "cw-copy-menu.h"

#define N_COLS CW_TERMS_TABLE_COLUMNS
#define SOURCE_COL (N_COLS - 1)
#define COL_SPACING 18
#define ROW_SPACING 4
#define SOURCE_MAX_CHARS 48 /* the source column asks for no more than this */
#define SOURCE_MIN_CHARS 6
#define DIM_OPACITY 0.55 /* as the theme's dimmed labels */

typedef struct
{
  char        *text;
  PangoLayout *layout;
  int          width; /* logical size in pixels, before any shortening */
  int          height;
  int          layout_width; /* width set on the layout (Pango units), -1 for none */
} Cell;

typedef struct
{
  Cell     cells[N_COLS];
  gboolean heading;
  int      height;
} Row;

struct _CwTermsTable
{
  GtkWidget parent_instance;

  GArray    *rows; /* Row; the first n_rows are shown, the others keep their layouts */
  guint      n_rows;
  int        col_width[N_COLS]; /* the source column's is its natural width */
  int        height;
  int        source_max; /* pixels */
  int        source_min;
  guint      context_serial;
  char      *text;
  GtkWidget *menu;
};

G_DEFINE_FINAL_TYPE (CwTermsTable, cw_terms_table, GTK_TYPE_WIDGET)

static gboolean
is_numeric (guint col)
{
  return col == 1 || col == 2;
}

static void
cell_set_attributes (Cell    *cell,
                     guint    col,
                     gboolean heading)
{
  PangoAttrList *attrs = pango_attr_list_new ();

  if (heading)
    pango_attr_list_insert (attrs, pango_attr_weight_new (PANGO_WEIGHT_BOLD));
  if (is_numeric (col))
    pango_attr_list_insert (attrs, pango_attr_font_features_new ("tnum"));
  pango_layout_set_attributes (cell->layout, attrs);
  pango_attr_list_unref (attrs);
}

static void
cell_measure (Cell *cell)
{
  if (cell->layout_width != -1)
    {
      pango_layout_set_width (cell->layout, -1);
      cell->layout_width = -1;
    }
  pango_layout_get_pixel_size (cell->layout, &cell->width, &cell->height);
}

/* The font may have changed (theme, text scale): lay every cell out again. */
static void
check_context (CwTermsTable *self)
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
  self->source_max = PANGO_PIXELS (char_width * SOURCE_MAX_CHARS);
  self->source_min = PANGO_PIXELS (char_width * SOURCE_MIN_CHARS);
  for (guint r = 0; r < self->rows->len; r++)
    for (guint c = 0; c < N_COLS; c++)
      {
        Cell *cell = &g_array_index (self->rows, Row, r).cells[c];

        if (cell->layout != NULL)
          {
            pango_layout_context_changed (cell->layout);
            cell_measure (cell);
          }
      }
}

/* Column widths and height from the cells; returns TRUE when the size asked for changed. */
static gboolean
update_metrics (CwTermsTable *self)
{
  int      width[N_COLS] = { 0 };
  int      height = 0;
  gboolean changed;

  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      row->height = 0;
      for (guint c = 0; c < N_COLS; c++)
        {
          width[c] = MAX (width[c], row->cells[c].width);
          row->height = MAX (row->height, row->cells[c].height);
        }
      height += row->height + (r > 0 ? ROW_SPACING : 0);
    }
  width[SOURCE_COL] = MIN (width[SOURCE_COL], self->source_max);
  changed = height != self->height || memcmp (width, self->col_width, sizeof width) != 0;
  memcpy (self->col_width, width, sizeof width);
  self->height = height;
  return changed;
}

static void
update_text (CwTermsTable *self)
{
  GString *text = g_string_new (NULL);

  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      for (guint c = 0; c < N_COLS; c++)
        {
          g_string_append (text, row->cells[c].text);
          g_string_append_c (text, c + 1 < N_COLS ? '\t' : '\n');
        }
    }
  g_free (self->text);
  self->text = g_string_free (text, FALSE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, self->text, -1);
}

CwTermsTableChange
cw_terms_table_set_rows (CwTermsTable          *self,
                         const CwTermsTableRow *rows,
                         guint                  n_rows)
{
  gboolean changed = n_rows != self->n_rows;

  g_return_val_if_fail (CW_IS_TERMS_TABLE (self), CW_TERMS_TABLE_UNCHANGED);
  check_context (self);
  if (self->rows->len < n_rows)
    g_array_set_size (self->rows, n_rows);
  for (guint r = 0; r < n_rows; r++)
    {
      Row     *row = &g_array_index (self->rows, Row, r);
      gboolean heading = rows[r].heading != FALSE;

      for (guint c = 0; c < N_COLS; c++)
        {
          Cell       *cell = &row->cells[c];
          const char *text = rows[r].cells[c] != NULL ? rows[r].cells[c] : "";

          if (cell->layout == NULL)
            {
              cell->layout = gtk_widget_create_pango_layout (GTK_WIDGET (self), NULL);
              cell->layout_width = -1;
              if (c == SOURCE_COL)
                pango_layout_set_ellipsize (cell->layout, PANGO_ELLIPSIZE_END);
              cell_set_attributes (cell, c, heading);
            }
          else if (heading == row->heading && g_strcmp0 (cell->text, text) == 0)
            continue;
          else if (heading != row->heading)
            cell_set_attributes (cell, c, heading);
          g_free (cell->text);
          cell->text = g_strdup (text);
          pango_layout_set_text (cell->layout, text, -1);
          cell_measure (cell);
          changed = TRUE;
        }
      row->heading = heading;
    }
  self->n_rows = n_rows;
  if (!changed)
    return CW_TERMS_TABLE_UNCHANGED;
  update_text (self);
  if (update_metrics (self))
    {
      gtk_widget_queue_resize (GTK_WIDGET (self));
      return CW_TERMS_TABLE_RESIZED;
    }
  gtk_widget_queue_draw (GTK_WIDGET (self));
  return CW_TERMS_TABLE_REDRAWN;
}

guint
cw_terms_table_get_n_rows (CwTermsTable *self)
{
  g_return_val_if_fail (CW_IS_TERMS_TABLE (self), 0);
  return self->n_rows;
}

const char *
cw_terms_table_get_cell (CwTermsTable *self,
                         guint         row,
                         guint         column)
{
  g_return_val_if_fail (CW_IS_TERMS_TABLE (self), NULL);
  if (row >= self->n_rows || column >= N_COLS)
    return NULL;
  return g_array_index (self->rows, Row, row).cells[column].text;
}

const char *
cw_terms_table_get_text (CwTermsTable *self)
{
  g_return_val_if_fail (CW_IS_TERMS_TABLE (self), NULL);
  return self->text != NULL ? self->text : "";
}

/* ---- layout and drawing ------------------------------------------------------------- */

/* Left edges of the columns (left to right); the source column gets what is left. */
static void
column_starts (CwTermsTable *self,
               int           x[N_COLS])
{
  x[0] = 0;
  for (guint c = 1; c < N_COLS; c++)
    x[c] = x[c - 1] + self->col_width[c - 1] + COL_SPACING;
}

static void
cw_terms_table_measure (GtkWidget     *widget,
                        GtkOrientation orientation,
                        int            for_size,
                        int           *minimum,
                        int           *natural,
                        int           *minimum_baseline,
                        int           *natural_baseline)
{
  CwTermsTable *self = CW_TERMS_TABLE (widget);
  int           x[N_COLS];

  check_context (self);
  update_metrics (self);
  if (self->n_rows == 0)
    {
      *minimum = *natural = 0;
      return;
    }
  if (orientation == GTK_ORIENTATION_VERTICAL)
    {
      *minimum = *natural = self->height;
      return;
    }
  column_starts (self, x);
  *minimum = x[SOURCE_COL] + MIN (self->source_min, self->col_width[SOURCE_COL]);
  *natural = x[SOURCE_COL] + self->col_width[SOURCE_COL];
}

static void
cw_terms_table_snapshot (GtkWidget   *widget,
                         GtkSnapshot *snapshot)
{
  CwTermsTable *self = CW_TERMS_TABLE (widget);
  int           width = gtk_widget_get_width (widget);
  gboolean      rtl = gtk_widget_get_direction (widget) == GTK_TEXT_DIR_RTL;
  GdkRGBA       color, dim;
  int           x[N_COLS], y = 0;

  check_context (self);
  column_starts (self, x);
  gtk_style_context_get_color (gtk_widget_get_style_context (widget), &color);
  dim = color;
  dim.alpha *= DIM_OPACITY;
  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      for (guint c = 0; c < N_COLS; c++)
        {
          Cell *cell = &row->cells[c];
          int   cx = x[c], cw = cell->width;

          if (cell->text == NULL || *cell->text == '\0')
            continue;
          if (c == SOURCE_COL)
            {
              int avail = MAX (width - x[c], 0);
              int want = cell->width > avail ? avail * PANGO_SCALE : -1;

              if (want != cell->layout_width)
                {
                  pango_layout_set_width (cell->layout, want);
                  cell->layout_width = want;
                }
              cw = MIN (cell->width, avail);
            }
          else if (is_numeric (c))
            cx += self->col_width[c] - cell->width;
          if (rtl)
            cx = width - cx - cw;
          gtk_snapshot_save (snapshot);
          gtk_snapshot_translate (snapshot, &GRAPHENE_POINT_INIT (cx, y));
          gtk_snapshot_append_layout (snapshot, cell->layout, c == SOURCE_COL && !row->heading ? &dim : &color);
          gtk_snapshot_restore (snapshot);
        }
      y += row->height + ROW_SPACING;
    }
}

/* The whole source of the row under the pointer, which the cell may show shortened. */
static gboolean
cw_terms_table_query_tooltip (GtkWidget  *widget,
                              int         px,
                              int         py,
                              gboolean    keyboard,
                              GtkTooltip *tooltip)
{
  CwTermsTable *self = CW_TERMS_TABLE (widget);
  int           y = 0;

  if (keyboard)
    return FALSE;
  for (guint r = 0; r < self->n_rows; r++)
    {
      Row *row = &g_array_index (self->rows, Row, r);

      if (py >= y && py < y + row->height + ROW_SPACING)
        {
          const char *source = row->cells[SOURCE_COL].text;

          if (row->heading || source == NULL || *source == '\0')
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
  gdk_clipboard_set_text (gtk_widget_get_clipboard (widget), cw_terms_table_get_text (CW_TERMS_TABLE (widget)));
}

static void
menu_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *parameter)
{
  graphene_point_t at;

  cw_copy_menu_popup (&CW_TERMS_TABLE (widget)->menu, widget, _("_Copy Table"), "terms.copy", cw_copy_menu_point (parameter, &at));
}

static void
cw_terms_table_size_allocate (GtkWidget *widget,
                              int        width,
                              int        height,
                              int        baseline)
{
  CwTermsTable *self = CW_TERMS_TABLE (widget);

  if (self->menu != NULL)
    gtk_popover_present (GTK_POPOVER (self->menu));
}

static void
cw_terms_table_dispose (GObject *object)
{
  CwTermsTable *self = CW_TERMS_TABLE (object);

  g_clear_pointer (&self->menu, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_terms_table_parent_class)->dispose (object);
}

static void
cw_terms_table_finalize (GObject *object)
{
  CwTermsTable *self = CW_TERMS_TABLE (object);

  for (guint r = 0; r < self->rows->len; r++)
    for (guint c = 0; c < N_COLS; c++)
      {
        Cell *cell = &g_array_index (self->rows, Row, r).cells[c];

        g_free (cell->text);
        g_clear_object (&cell->layout);
      }
  g_array_unref (self->rows);
  g_free (self->text);
  G_OBJECT_CLASS (cw_terms_table_parent_class)->finalize (object);
}

static void
cw_terms_table_class_init (CwTermsTableClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_terms_table_dispose;
  object_class->finalize = cw_terms_table_finalize;
  widget_class->measure = cw_terms_table_measure;
  widget_class->size_allocate = cw_terms_table_size_allocate;
  widget_class->snapshot = cw_terms_table_snapshot;
  widget_class->query_tooltip = cw_terms_table_query_tooltip;

  gtk_widget_class_install_action (widget_class, "terms.copy", NULL, copy_action);
  gtk_widget_class_install_action (widget_class, "terms.menu", "(dd)", menu_action);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_c, GDK_CONTROL_MASK, "terms.copy", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_F10, GDK_SHIFT_MASK, "terms.menu", "(dd)", -1.0, -1.0);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Menu, 0, "terms.menu", "(dd)", -1.0, -1.0);
  gtk_widget_class_set_css_name (widget_class, "termstable");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_GROUP);
}

static void
cw_terms_table_init (CwTermsTable *self)
{
  self->rows = g_array_new (FALSE, TRUE, sizeof (Row));
  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_widget_set_has_tooltip (GTK_WIDGET (self), TRUE);
  cw_copy_menu_add_click (GTK_WIDGET (self), "terms.menu");
}

GtkWidget *
cw_terms_table_new (void)
{
  return g_object_new (CW_TYPE_TERMS_TABLE, NULL);
}
