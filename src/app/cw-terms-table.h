#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_TERMS_TABLE (cw_terms_table_get_type ())

G_DECLARE_FINAL_TYPE (CwTermsTable, cw_terms_table, CW, TERMS_TABLE, GtkWidget)

#define CW_TERMS_TABLE_COLUMNS 4

/* The itemised terms of the two chairs as one drawn table: a term, its energy in chair 1
 * and in chair 2 (right-aligned, tabular figures) and its source (dimmed, shortened with
 * "…" when narrow; the whole source is its tooltip). Heading rows are bold.
 *
 * One widget with its own text layouts instead of a grid of labels: a change of the
 * numbers that keeps the table's size only redraws it, where every changed label would
 * make GTK lay out the whole window again. Ctrl+C and the context menu copy the table as
 * tab-separated text; screen readers get the same text as the table's description. */
typedef struct
{
  const char *cells[CW_TERMS_TABLE_COLUMNS]; /* NULL reads as "" */
  gboolean    heading;
} CwTermsTableRow;

/* What a change of content did to the widget. */
typedef enum
{
  CW_TERMS_TABLE_UNCHANGED, /* same content: nothing to do */
  CW_TERMS_TABLE_REDRAWN,   /* new content at the same size: only redrawn */
  CW_TERMS_TABLE_RESIZED    /* the size it asks for changed: laid out again */
} CwTermsTableChange;

GtkWidget         *cw_terms_table_new (void);
CwTermsTableChange cw_terms_table_set_rows (CwTermsTable          *self,
                                            const CwTermsTableRow *rows,
                                            guint                  n_rows);
guint              cw_terms_table_get_n_rows (CwTermsTable *self);
/* The text of a cell ("" for an empty one), or NULL outside the table. */
const char *cw_terms_table_get_cell (CwTermsTable *self,
                                     guint         row,
                                     guint         column);
/* The table as text: cells separated by tabs, rows ended by newlines. */
const char *cw_terms_table_get_text (CwTermsTable *self);

G_END_DECLS
