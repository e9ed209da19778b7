#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_RESULT_SHEET (cw_result_sheet_get_type ())

G_DECLARE_FINAL_TYPE (CwResultSheet, cw_result_sheet, CW, RESULT_SHEET, GtkWidget)

#define CW_SHEET_COLUMNS 4

/* The part of the results whose length changes with the molecule, drawn as one widget:
 * - the flags, each a tinted box with an icon (warning or note) and its wrapped text;
 * - a title ("title" property);
 * - the itemised terms of the two chairs: a term, its energy in chair 1 and in chair 2
 *   (right-aligned, tabular figures) and its source (dimmed, shortened with "…" when
 *   narrow; the whole source is its tooltip). Heading rows are bold.
 *
 * One widget with its own text layouts instead of labels in boxes and grids, so that an
 * edit does not make GTK lay out the whole window again:
 * - new content that fits the space the sheet has is only redrawn;
 * - the sheet grows at once when the content needs more room, and gives room back
 *   half a second after the last change (so a run of edits never waits for a layout);
 * - column widths only grow.
 * Ctrl+C and the context menu copy the flags and the table (tab-separated) as text; screen
 * readers get the same text as the sheet's description. */
typedef struct
{
  const char *cells[CW_SHEET_COLUMNS]; /* NULL reads as "" */
  gboolean    heading;
} CwSheetRow;

typedef struct
{
  const char *text;
  gboolean    info; /* a note rather than a warning */
} CwSheetFlag;

/* What a change of content did to the widget. */
typedef enum
{
  CW_SHEET_UNCHANGED, /* same content: nothing to do */
  CW_SHEET_REDRAWN,   /* new content in the space it has: only redrawn */
  CW_SHEET_RESIZED    /* the content needed more room (or none was laid out yet) */
} CwSheetChange;

GtkWidget    *cw_result_sheet_new (void);
CwSheetChange cw_result_sheet_set_content (CwResultSheet     *self,
                                           const CwSheetFlag *flags,
                                           guint              n_flags,
                                           const CwSheetRow  *rows,
                                           guint              n_rows);
guint         cw_result_sheet_get_n_rows (CwResultSheet *self);
guint         cw_result_sheet_get_n_flags (CwResultSheet *self);
/* The text of a cell ("" for an empty one), or NULL outside the table. */
const char *cw_result_sheet_get_cell (CwResultSheet *self,
                                      guint          row,
                                      guint          column);
/* The text of a flag, or NULL. */
const char *cw_result_sheet_get_flag (CwResultSheet *self,
                                      guint          index,
                                      gboolean      *info);
/* The sheet as text: one line per flag, the title, then the table with cells separated by
 * tabs; every line ends with a newline. */
const char *cw_result_sheet_get_text (CwResultSheet *self);
/* Gives back room the content no longer needs now rather than after the pause. */
void cw_result_sheet_shrink (CwResultSheet *self);

G_END_DECLS
