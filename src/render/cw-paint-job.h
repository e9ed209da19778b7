#pragma once

#include <cairo.h>

#include "cw-render.h"
#include "cw-scene.h"

G_BEGIN_DECLS

/* A figure painted into an image on a worker thread, so that a window can paint a changed
 * figure while it goes on updating its other widgets; the image is then copied onto the
 * screen in one step. Jobs run one after the other on one thread, in the order they were
 * started. The render layer's text caches are per thread, so the worker keeps its own. */
typedef struct _CwPaintJob CwPaintJob;

/* clang-format off */
/* Starts painting scene (taken) into an opaque image of width x height user units at scale
 * device pixels per unit, as cw_render_figure_paint would paint it. */
CwPaintJob      *cw_paint_job_start (CwScene *scene, gboolean dark, int width, int height, int scale);
/* Lays fig out for mol and an on the worker, as cw_render_figure_scene would, then paints it
 * as cw_paint_job_start does. mol, an and opt's reactivity are copied; data is borrowed: it
 * must stay until the job has been waited for or freed (freeing a running job waits for it).
 * Its scene is known once cw_paint_job_wait has returned; there is no image when there is
 * no scene. */
CwPaintJob      *cw_paint_job_start_figure (CwFigure fig, const CwData *data, const CwMolecule *mol,
                                            const CwAnalysis *an, const CwRenderOptions *opt,
                                            int width, int height, int scale);
/* Loads the worker's fonts before a window's first figures: lays out each figure a window
 * shows for mol (copied) in the conditions cond, at its design size, paints it at scale
 * and throws it away. data is borrowed until the job is freed. The job has no image. */
CwPaintJob      *cw_paint_job_warm_up_figures (const CwData *data, const CwMolecule *mol,
                                               const CwConditions *cond, int scale);
/* Waits until the image is painted and returns it (owned by the job; NULL when Cairo failed). */
cairo_surface_t *cw_paint_job_wait (CwPaintJob *job);
/* Takes the scene back from a finished job (after cw_paint_job_wait). */
CwScene         *cw_paint_job_steal_scene (CwPaintJob *job);
/* Drops the job; a job not started yet is not run. Only a running figure or warm-up job,
 * which reads the borrowed data, is waited for. */
void             cw_paint_job_free (CwPaintJob *job);
/* clang-format on */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwPaintJob, cw_paint_job_free)

G_END_DECLS
