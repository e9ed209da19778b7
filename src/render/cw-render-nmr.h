#pragma once

#include <cairo.h>

#include "cw-couplings.h"

G_BEGIN_DECLS

/* The ring-proton couplings as a table: one row per ring proton, columns chair 1, chair 2 and the
 * population-weighted average, each cell "ax  tt, 11.6, 4.1 Hz  Σ 30.6". */

/* clang-format off */
/* Natural size in points (at 9-point text). */
void cw_render_couplings_table_size (const CwCouplings *c, double *width, double *height);
/* Draws into the box (0,0,width,height) in user units, background included, scaled uniformly
 * from the natural size and centred; highlight_proton (an index into c->protons, or -1) is drawn on
 * the highlight ink. dark selects the screen palette. The cairo state is left as found. */
void cw_render_couplings_table (cairo_t *cr, const CwCouplings *c, int highlight_proton, gboolean dark,
                                double width, double height);
/* One cell's markup: column 0 or 1 (chair 1, 2) "<b>ax</b>  tt, 11.6, 4.1 Hz  Σ 30.6" (the Σ part
 * faint), column 2 (averaged) the same without ax/eq. Newly allocated; shared with the report. */
char *cw_render_couplings_dup_cell (const CwRingProton *p, int column);
/* clang-format on */

G_END_DECLS
