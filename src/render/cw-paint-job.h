#pragma once

#include <cairo.h>

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
/* The scene being painted; it must not be changed while the job lives. */
const CwScene   *cw_paint_job_get_scene (CwPaintJob *job);
/* Waits until the image is painted and returns it (owned by the job; NULL when Cairo failed). */
cairo_surface_t *cw_paint_job_wait (CwPaintJob *job);
/* Takes the scene back from a finished job (after cw_paint_job_wait). */
CwScene         *cw_paint_job_steal_scene (CwPaintJob *job);
/* Drops the job without waiting; a job not started yet is not painted. */
void             cw_paint_job_free (CwPaintJob *job);
/* Paints scene (taken) on the worker and throws the image away: the worker's first
 * figure loads its fonts, which takes a while; a window does this once, when idle. */
void             cw_paint_job_warm_up (CwScene *scene, gboolean dark, int width, int height, int scale);
/* clang-format on */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwPaintJob, cw_paint_job_free)

G_END_DECLS
