#pragma once

#include <cairo.h>
#include <pango/pangocairo.h>

#include "cw-render.h"
#include "cw-scene.h"

G_BEGIN_DECLS

G_DEFINE_AUTOPTR_CLEANUP_FUNC (cairo_t, cairo_destroy)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (cairo_surface_t, cairo_surface_destroy)

#define CW_FONT_FAMILY "DejaVu Sans, Sans"

/* A layout from the shared measuring context, so painted text has the measured size. */
PangoLayout *cw_text_layout_new (const char *markup, double size, gboolean bold, double wrap);
/* The same layout from a per-thread cache of recently used texts (a new reference): callers
 * must not change it. */
PangoLayout *cw_text_layout_get (const char *markup, double size, gboolean bold, double wrap);

/* Palette: colours for an ink in the light (print) or dark (screen) theme. */
void cw_palette_get (CwInk ink, gboolean dark, double rgb[3]);
void cw_palette_set_source (cairo_t *cr, CwInk ink, gboolean dark);

/* Paints a scene into (0,0,width,height) of cr, scaled uniformly from the scene's own size. */
void cw_scene_paint (const CwScene *scene, cairo_t *cr, gboolean dark);

/* Formatting in the current unit: "1.74" with the unit's precision; newly allocated. */
char *cw_render_format_energy (double kcal, CwEnergyUnit unit);
char *cw_render_format_value (double value, CwEnergyUnit unit); /* already in unit */
char *cw_render_format_percent (double fraction);
char *cw_render_format_k (double K);

/* Background, then the scene scaled uniformly and centred in (0, 0, width, height). */
void cw_render_paint_scene (cairo_t *cr, const CwScene *scene, gboolean dark, double width, double height);

/* Natural (design) size of a figure in points. */
void cw_render_figure_size (CwFigure fig, double *width, double *height);

/* Prepares a figure's scene for a box of this many user units. */
CwScene *cw_render_build_figure (CwFigure               fig,
                                 const CwData          *data,
                                 const CwMolecule      *mol,
                                 const CwAnalysis      *an,
                                 const CwRenderOptions *opt,
                                 double                 width,
                                 double                 height);

/* Atomic file output: write to a temporary file beside path, rename on success. */
typedef gboolean (*CwWriteFunc) (const char *tmp_path, gpointer user_data, GError **error);
gboolean cw_render_write_atomic (const char *path, CwWriteFunc write, gpointer user_data, GError **error);

/* Paints the scene on white into a PNG of width × height points at dpi (cw-png.c). */
gboolean cw_render_write_png_scene (const CwScene *scene, double width, double height, double dpi, const char *path, GError **error);

/* Analysis of a document at its own conditions. */
gboolean cw_render_analyze_document (const CwData *data, const CwDocument *doc, CwAnalysis *an, GError **error);

G_END_DECLS
