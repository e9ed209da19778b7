#pragma once

#include <cairo.h>

#include "cw-core.h"
#include "cw-couplings.h"
#include "cw-reactivity.h"
#include "cw-scene.h"

G_BEGIN_DECLS

#define CW_RENDER_ERROR (cw_render_error_quark ())

typedef enum
{
  CW_RENDER_ERROR_FORMAT,  /* unknown file extension or paper size */
  CW_RENDER_ERROR_IO,      /* the file could not be written */
  CW_RENDER_ERROR_DRAW,    /* Cairo reported an error */
  CW_RENDER_ERROR_ANALYSIS /* the document could not be analysed */
} CwRenderError;

GQuark cw_render_error_quark (void);

typedef struct
{
  CwEnergyUnit      unit;
  gboolean          show_hydrogens;
  gboolean          dark;             /* screen only; exports always light */
  int               highlight_sub;    /* -1 none */
  CwTemperatureUnit temperature_unit; /* axis of the scan figure */
  /* Reaction geometry on the chairs: when TRUE, the ring hydrogens are drawn, each leaving
   * group's bond is drawn heavy and the β-hydrogens anti-periplanar to it are ringed and
   * labelled "ap" in each chair (not by colour alone). reactivity_sub narrows it to one leaving
   * group (a substituent index; -1: every leaving group). reactivity is borrowed and may be NULL:
   * then it is computed from the default geometry table (cw_render_default_geometry). */
  gboolean            highlight_reactivity;
  int                 reactivity_sub;
  const CwReactivity *reactivity;
} CwRenderOptions;

typedef enum
{
  CW_FIGURE_STRUCTURE,
  CW_FIGURE_CHAIRS,
  CW_FIGURE_PROFILE,
  CW_FIGURE_SCAN
} CwFigure;

/* clang-format off */
void        cw_render_options_init (CwRenderOptions *opt);
/* Draws into the box (0,0,width,height) in user units, background included; cairo state left as
 * found. an may be NULL for the structure figure. */
void        cw_render_figure (cairo_t *cr, CwFigure fig, const CwData *data, const CwMolecule *mol,
                              const CwAnalysis *an, const CwRenderOptions *opt, double width, double height);
/* cw_render_figure in two steps, for a window that redraws a figure only when it changed:
 * the figure laid out for the box (NULL when the box is empty; free with cw_scene_free, compare
 * with cw_scene_equal), then painted into it. */
CwScene    *cw_render_figure_scene (CwFigure fig, const CwData *data, const CwMolecule *mol,
                                    const CwAnalysis *an, const CwRenderOptions *opt, double width, double height);
void        cw_render_figure_paint (cairo_t *cr, const CwScene *scene, gboolean dark, double width, double height);
/* The figure painted into a new opaque image of width x height units at scale pixels per unit,
 * looking as the same figure painted by a window on screen; NULL when Cairo fails. */
cairo_surface_t *cw_render_figure_image (const CwScene *scene, gboolean dark, int width, int height, int scale);
/* Loads the calling thread's fonts for the figures a window shows (Pango's fonts are per
 * thread, and the first figure a thread lays out loads them, which takes longer than the
 * figure): lays out each figure for mol in the conditions cond at its design size and,
 * when scale > 0, paints it into an image at scale; then throws it all away. */
void        cw_render_warm_up (const CwData *data, const CwMolecule *mol, const CwConditions *cond, int scale);
/* Format from the extension (.png, .svg, .pdf); atomic: temporary file, then rename. dpi is used
 * for PNG only. Always on white. */
gboolean    cw_render_export_figure (CwFigure fig, const CwData *data, const CwDocument *doc,
                                     const CwRenderOptions *opt, const char *path, double dpi, GError **error);
/* One-page PDF report; paper is "a4" or "letter". */
gboolean    cw_render_export_report (const CwData *data, const CwDocument *doc, const char *paper,
                                     const char *path, GError **error);
/* The same, with the couplings and reaction-geometry sections computed from gd (NULL: the
 * default geometry table, as cw_render_export_report does). */
gboolean    cw_render_export_report_with_geometry (const CwData *data, const CwGeometryData *gd,
                                                   const CwDocument *doc, const char *paper,
                                                   const char *path, GError **error);
/* The report drawn onto any cairo_t with a page of width × height points (used by export and
 * tests); gd may be NULL as above. */
void        cw_render_report (cairo_t *cr, const CwData *data, const CwDocument *doc,
                              const CwAnalysis *an, double width, double height);
void        cw_render_report_with_geometry (cairo_t *cr, const CwData *data, const CwGeometryData *gd,
                                            const CwDocument *doc, const CwAnalysis *an,
                                            double width, double height);
/* geometry.json of cw_data_find_dir (), loaded once and kept for the process; NULL (and error
 * set) when it cannot be read. */
const CwGeometryData *cw_render_default_geometry (GError **error);
gboolean    cw_render_figure_from_string (const char *s, CwFigure *fig);
const char *cw_render_figure_to_string (CwFigure fig);
const char *cw_render_version (void);
/* clang-format on */

G_END_DECLS
