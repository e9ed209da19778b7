#pragma once

#include <gtk/gtk.h>

#include "cw-core.h"

G_BEGIN_DECLS

#define CW_TYPE_RING_CANVAS (cw_ring_canvas_get_type ())

G_DECLARE_FINAL_TYPE (CwRingCanvas, cw_ring_canvas, CW, RING_CANVAS, GtkWidget)

/* The flat ring editor: a hexagon with carbons 1-6, each carbon's groups drawn on
 * a solid (up) or hashed (down) wedge, and the selected carbon highlighted.
 * Clicking or keys 1-6 / arrows set "selected"; Delete emits "clear-requested";
 * Enter emits "choose-requested" (face); a printable key emits "search-requested". */
GtkWidget *cw_ring_canvas_new (void);
void       cw_ring_canvas_set_molecule (CwRingCanvas     *self,
                                        const CwMolecule *mol);
int        cw_ring_canvas_get_selected (CwRingCanvas *self);
void       cw_ring_canvas_set_selected (CwRingCanvas *self,
                                        int           position);
/* How many drawings of the ring or of a carbon's groups the canvas has made (for tests: an
 * edit on one carbon draws that carbon again, and nothing else). */
guint cw_ring_canvas_get_n_drawn (CwRingCanvas *self);
/* Position (1-6) of the carbon nearest to (x, y) in widget coordinates, or 0. */
int cw_ring_canvas_hit_test (CwRingCanvas *self,
                             double        x,
                             double        y);

G_END_DECLS
