#pragma once

#include "cw-chair-geometry.h"
#include "cw-label.h"
#include "cw-render.h"
#include "cw-scene.h"

G_BEGIN_DECLS

/* Scene builders, one per figure; width × height is the design box in points. */
CwScene *cw_structure_build (const CwMolecule *mol, const CwRenderOptions *opt, double width, double height);
CwScene *cw_chairs_build (const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height);
CwScene *cw_profile_build (const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height);
CwScene *cw_scan_build (const CwData *data, const CwMolecule *mol, const CwAnalysis *an, const CwRenderOptions *opt, double width, double height);

/* Shared by the builders. */
void cw_scene_fit (CwScene *scene, double margin);
/* Crops the scene to its content plus margin. */
void  cw_scene_fit_tight (CwScene *scene, double margin);
CwBox cw_scene_bounds (const CwScene *scene);
void  cw_scene_message (CwScene *scene, const char *text);
/* A filled patch behind a label, for the substituent the window has selected. */
void cw_scene_highlight (CwScene *scene, const CwBox *box);
/* Places text at the first candidate point (ax, ay anchor 0..1) where it overlaps no other text
 * and no listed segment; falls back to the first candidate. */
CwPrim *cw_scene_text_free (CwScene *scene, CwRole role, CwInk ink, const char *markup, double size, const CwPoint *cands, guint n_cands, double ax, double ay);

/* Populations of chair 1, chair 2 and the twist-boat at temperature t from the analysis' energies. */
typedef struct
{
  double t;
  double pop[3];
} CwScanPoint;

/* Fills points over [t0, t1]; returns FALSE when an analysis fails (points then hold what was done). */
gboolean cw_scan_compute (const CwData *data, const CwMolecule *mol, CwSolvent solvent, gboolean with_twist_boat, double t0, double t1, guint n, CwScanPoint *points);
/* TRUE when the twist-boat competes enough to be drawn on the scan. */
gboolean cw_scan_wants_twist_boat (const CwAnalysis *an);
/* The twist-boat's share when it is included in a three-state Boltzmann sum. */
void cw_scan_three_state (const CwAnalysis *an, double pop[3]);

/* Keeps the labels and bonds placed so far, so the next label can avoid them. */
typedef struct
{
  GArray *segments; /* CwBox read as segment (x, y) → (x + w, y + h) */
  GArray *labels;   /* CwBox */
} CwPlacer;

void     cw_placer_init (CwPlacer *pl);
void     cw_placer_clear (CwPlacer *pl);
void     cw_placer_add_segment (CwPlacer *pl, double x0, double y0, double x1, double y1);
void     cw_placer_add_box (CwPlacer *pl, const CwBox *box);
gboolean cw_placer_collides (const CwPlacer *pl, const CwBox *box, double x0, double y0, double x1, double y1);
int      cw_placer_count_hits (const CwPlacer *pl, const CwBox *box, double x0, double y0, double x1, double y1);
/* Places a label at the end of a bond from (px, py) along (dx, dy), trying bond lengths around
 * base; returns how many labels and bonds the chosen spot still hits (0: clear). */
int cw_placer_place_label (const CwPlacer *pl, const char *markup, double size, double px, double py, double dx, double dy, double base, CwLabelPlace *place, CwLabelText *lt);

/* Plot helpers shared by the profile and the scan. */
typedef struct
{
  CwBox  area;           /* plot area on the page */
  double x0, x1, y0, y1; /* data range */
} CwPlot;

double cw_plot_x (const CwPlot *plot, double x);
double cw_plot_y (const CwPlot *plot, double y);
double cw_nice_step (double range, int target);
/* Axis lines, grid and labelled ticks every step (y always; x when xstep > 0, labelled with
 * x + xoffset, ticks at round values of that). */
void cw_plot_axes (CwScene *scene, const CwPlot *plot, double xstep, double ystep, double xoffset);

G_END_DECLS
