#include "config.h"

#include "cw-paint-job.h"

#include "cw-render.h"

/* A job is shared by its owner and, until it has run, the worker: whoever lets go last
 * frees it. */
struct _CwPaintJob
{
  gatomicrefcount  ref;
  gint             dropped; /* atomic: the owner let go before the job ran */
  CwScene         *scene;
  gboolean         dark;
  int              width, height, scale;
  GMutex           lock;
  GCond            cond;
  gboolean         done; /* under lock */
  cairo_surface_t *image;
};

static void
job_unref (CwPaintJob *job)
{
  if (!g_atomic_ref_count_dec (&job->ref))
    return;
  g_clear_pointer (&job->image, cairo_surface_destroy);
  g_clear_pointer (&job->scene, cw_scene_free);
  g_mutex_clear (&job->lock);
  g_cond_clear (&job->cond);
  g_free (job);
}

static void
paint (gpointer data,
       gpointer user_data)
{
  CwPaintJob      *job = data;
  cairo_surface_t *image = NULL;

  if (!g_atomic_int_get (&job->dropped))
    image = cw_render_figure_image (job->scene, job->dark, job->width, job->height, job->scale);
  g_mutex_lock (&job->lock);
  job->image = image;
  job->done = TRUE;
  g_cond_signal (&job->cond);
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
      GThreadPool *p = g_thread_pool_new (paint, NULL, 1, TRUE, NULL);

      g_once_init_leave (&pool, p);
    }
  return pool;
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
  job = g_new0 (CwPaintJob, 1);
  g_atomic_ref_count_init (&job->ref);
  g_atomic_ref_count_inc (&job->ref); /* the worker's */
  job->scene = scene;
  job->dark = dark;
  job->width = width;
  job->height = height;
  job->scale = scale;
  g_mutex_init (&job->lock);
  g_cond_init (&job->cond);
  g_thread_pool_push (pool (), job, NULL);
  return job;
}

const CwScene *
cw_paint_job_get_scene (CwPaintJob *job)
{
  g_return_val_if_fail (job != NULL, NULL);
  return job->scene;
}

cairo_surface_t *
cw_paint_job_wait (CwPaintJob *job)
{
  cairo_surface_t *image;

  g_return_val_if_fail (job != NULL, NULL);
  g_mutex_lock (&job->lock);
  while (!job->done)
    g_cond_wait (&job->cond, &job->lock);
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
  g_atomic_int_set (&job->dropped, TRUE);
  job_unref (job);
}

void
cw_paint_job_warm_up (CwScene *scene,
                      gboolean dark,
                      int      width,
                      int      height,
                      int      scale)
{
  CwPaintJob *job = cw_paint_job_start (scene, dark, width, height, scale);

  /* The owner lets go without dropping the job: it is painted all the same. */
  if (job != NULL)
    job_unref (job);
}
