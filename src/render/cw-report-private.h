#pragma once

#include "cw-render-private.h"

G_BEGIN_DECLS

/* The one-page report is laid out as a page scene (cw-report.c); its sections on couplings,
 * reaction geometry and notes are in cw-report-sections.c. */

typedef struct
{
  CwScene          *page;
  double            x, y, w; /* the current text column */
  GPtrArray        *sources; /* distinct source strings, borrowed; the index + 1 is the reference number */
  double            body;    /* body text size, points */
  double            small;   /* the source list's size */
  CwTemperatureUnit tunit;
} CwReport;

/* clang-format off */
/* Reference number of a source (added on first use); 0 for none. */
int    cw_report_source_ref   (CwReport *r, const char *source);
/* A wrapped paragraph across the column at y; returns its height. */
double cw_report_para         (CwReport *r, const char *markup, double size, CwInk ink, double y);
/* A section heading at r->y; returns its height. */
double cw_report_heading      (CwReport *r, const char *markup);

/* The document's notes, at most two lines, cut with an ellipsis; 0 when there are none. */
double cw_report_notes        (CwReport *r, const char *notes);
/* The couplings table, or `error` in its place when c is NULL. */
double cw_report_couplings    (CwReport *r, const CwCouplings *c, const char *error);
/* Reaction geometry: leaving groups, reactive fractions, alkenes, warnings and anti pairs. */
double cw_report_reactivity   (CwReport *r, const CwMolecule *mol, const CwReactivity *re, const char *error);
/* prefix (markup) followed by text (plain, white space collapsed), cut to at most max_lines lines
 * when wrapped at width and then ending in "…". Newly allocated markup. */
char  *cw_report_dup_truncated (const char *prefix, const char *text, double size, double width, int max_lines);
/* clang-format on */

G_END_DECLS
