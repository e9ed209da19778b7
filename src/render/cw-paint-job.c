#include "config.h"

#include "cw-paint-job.h"

#include "cw-render.h"

/* What a job does on the worker. */
typedef enum
{
  JOB_PAINT,  /* paint the scene given */
  JOB_FIGURE, /* lay the figure out from its own copies of the inputs, then paint it */
  JOB_WARM_UP /* lay out and paint every figure of a window for a molecule of its own */
} JobKind;

/* A job is shared by its owner and, until it has run, the worker: whoever lets go last
 * frees it. */
struct _CwPaintJob
{
  gatomicrefcount ref;
  JobKind         kind;
  CwScene        *scene;
  gboolean        dark;
  int             width, height, scale;
  /* data borrowed; JOB_FIGURE: mol, an and opt's reactivity copied; JOB_WARM_UP: mol and
   * cond copied */
  CwFigure          fig;
  const CwData     *data;
  CwMolecule       *own_mol;
  CwAnalysis       *own_an; /* NULL when the figure is laid out without an analysis */
  CwReactivity     *own_reactivity;
  CwRenderOptions   opt;
  CwConditions      cond;
  GMutex            lock;
  GCond             cond_done;
  /* under lock */
  gboolean         dropped; /* the owner let go before the job ran */
  gboolean         running;
  gboolean         done;
  cairo_surface_t *image;
};

static void
job_unref (CwPaintJob *job)
{
  if (!g_atomic_ref_count_dec (&job->ref))
    return;
  g_clear_pointer (&job->image, cairo_surface_destroy);
  g_clear_pointer (&job->scene, cw_scene_free);
  g_clear_pointer (&job->own_mol, cw_molecule_free);
  g_free (job->own_an);
  g_free (job->own_reactivity);
  g_mutex_clear (&job->lock);
  g_cond_clear (&job->cond_done);
  g_free (job);
}

static void
run (gpointer data,
     gpointer user_data)
{
  CwPaintJob      *job = data;
  cairo_surface_t *image = NULL;
  gboolean         skip;

  g_mutex_lock (&job->lock);
  skip = job->dropped;
  job->running = !skip;
  g_mutex_unlock (&job->lock);
  if (!skip)
    switch (job->kind)
      {
      case JOB_FIGURE:
        job->scene = cw_render_figure_scene (job->fig, job->data, job->own_mol, job->own_an, &job->opt, job->width, job->height);
        if (job->scene != NULL)
          image = cw_render_figure_image (job->scene, job->dark, job->width, job->height, job->scale);
        break;
      case JOB_WARM_UP:
        cw_render_warm_up (job->data, job->own_mol, &job->cond, job->scale);
        break;
      case JOB_PAINT:
      default:
        image = cw_render_figure_image (job->scene, job->dark, job->width, job->height, job->scale);
        break;
      }
  g_mutex_lock (&job->lock);
  job->image = image;
  job->done = TRUE;
  g_cond_signal (&job->cond_done);
  g_mutex_unlock (&job->lock);
  job_unref (job);
}

/* One worker, started on first use and kept, so its text caches stay warm. */
static GThreadPool *
pool (void)
{
  static GThreadPool *pool;

  if (g_once_init_enter (&pool))
    {
      GThreadPool *p = g_thread_pool_new (run, NULL, 1, TRUE, NULL);

      g_once_init_leave (&pool, p);
    }
  return pool;
}

static CwPaintJob *
job_new (JobKind kind,
         int     width,
         int     height,
         int     scale)
{
  CwPaintJob *job = g_new0 (CwPaintJob, 1);

  g_atomic_ref_count_init (&job->ref);
  g_atomic_ref_count_inc (&job->ref); /* the worker's */
  job->kind = kind;
  job->width = width;
  job->height = height;
  job->scale = scale;
  g_mutex_init (&job->lock);
  g_cond_init (&job->cond_done);
  return job;
}

CwPaintJob *
cw_paint_job_start (CwScene *scene,
                    gboolean dark,
                    int      width,
                    int      height,
                    int      scale)
{
  CwPaintJob *job;

  g_return_val_if_fail (scene != NULL && width > 0 && height > 0 && scale > 0, NULL);
  job = job_new (JOB_PAINT, width, height, scale);
  job->scene = scene;
  job->dark = dark;
  g_thread_pool_push (pool (), job, NULL);
  return job;
}

CwPaintJob *
cw_paint_job_start_figure (CwFigure               fig,
                           const CwData          *data,
                           const CwMolecule      *mol,
                           const CwAnalysis      *an,
                           const CwRenderOptions *opt,
                           int                    width,
                           int                    height,
                           int                    scale)
{
  CwPaintJob *job;

  g_return_val_if_fail (data != NULL && mol != NULL && opt != NULL, NULL);
  g_return_val_if_fail (width > 0 && height > 0 && scale > 0, NULL);
  job = job_new (JOB_FIGURE, width, height, scale);
  job->fig = fig;
  job->data = data;
  /* Copies, a few kilobytes: the window may change its own while the job runs. */
  job->own_mol = cw_molecule_copy (mol);
  job->own_an = an != NULL ? g_memdup2 (an, sizeof *an) : NULL;
  job->opt = *opt;
  if (opt->reactivity != NULL)
    {
      job->own_reactivity = g_memdup2 (opt->reactivity, sizeof *opt->reactivity);
      job->opt.reactivity = job->own_reactivity;
    }
  job->dark = opt->dark;
  g_thread_pool_push (pool (), job, NULL);
  return job;
}

CwPaintJob *
cw_paint_job_warm_up_figures (const CwData       *data,
                              const CwMolecule   *mol,
                              const CwConditions *cond,
                              int                 scale)
{
  CwPaintJob *job;

  g_return_val_if_fail (data != NULL && mol != NULL && cond != NULL && scale > 0, NULL);
  job = job_new (JOB_WARM_UP, 1, 1, scale);
  job->data = data;
  job->own_mol = cw_molecule_copy (mol);
  job->cond = *cond;
  g_thread_pool_push (pool (), job, NULL);
  return job;
}

cairo_surface_t *
cw_paint_job_wait (CwPaintJob *job)
{
  cairo_surface_t *image;

  g_return_val_if_fail (job != NULL, NULL);
  g_mutex_lock (&job->lock);
  while (!job->done)
    g_cond_wait (&job->cond_done, &job->lock);
  image = job->image;
  g_mutex_unlock (&job->lock);
  return image;
}

CwScene *
cw_paint_job_steal_scene (CwPaintJob *job)
{
  g_return_val_if_fail (job != NULL, NULL);
  cw_paint_job_wait (job);
  return g_steal_pointer (&job->scene);
}

void
cw_paint_job_free (CwPaintJob *job)
{
  if (job == NULL)
    return;
  g_mutex_lock (&job->lock);
  job->dropped = TRUE;
  /* A job that reads borrowed inputs is not left running on them. */
  if (job->kind != JOB_PAINT)
    while (job->running && !job->done)
      g_cond_wait (&job->cond_done, &job->lock);
  g_mutex_unlock (&job->lock);
  job_unref (job);
}
