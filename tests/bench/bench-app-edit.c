/* Benchmark: one edit → re-analysis, widget updates, and the next frame painted.
 * Measures the work, not the wait for the frame clock: the time inside the edit
 * plus the time from the start of the next frame (before-paint, ahead of every handler of
 * it) to the end of its paint phase (after-paint), which covers the window's round trip to
 * the X server, style, layout, snapshot and rendering.
 * Two series of 200 edits each: ring edits (a group placed, changed or removed) and
 * temperature changes as a drag of the slider makes them (the adjustment moved one
 * step at a time, with the temperature popover open). Every edit changes the analysis.
 * Targets, for each series: median <= 4 ms, maximum <= 16 ms. */
#define _GNU_SOURCE /* RUSAGE_THREAD */
#include "config.h"

#include "bench-common.h"

#include <gtk/gtk.h>
#include <stdio.h>
#include <stdlib.h>
#include <sys/resource.h>
#include <time.h>

#include "cw-app-data.h"
#include "cw-window-private.h"

#define N_EDITS 200

/* CHAIRWISE_BENCH_SLOW=MS: also print each edit slower than MS, to see which they are. */
static double   slow_ms;
static gint64   frame_start;
static gint64   paint_end;
static gboolean painted;

/* The frame starts before any before-paint handler runs, the window's own included (it may
 * wait for the X server there): an emission hook runs ahead of every handler. */
static gboolean
before_paint_hook (GSignalInvocationHint *hint,
                   guint                  n_values,
                   const GValue          *values,
                   gpointer               data)
{
  if (g_value_get_object (&values[0]) == data && frame_start == 0)
    frame_start = g_get_monotonic_time ();
  return TRUE;
}

static void
after_paint_cb (GdkFrameClock *clock, gpointer data)
{
  if (frame_start != 0)
    {
      paint_end = g_get_monotonic_time ();
      painted = TRUE;
    }
}

static gboolean
tick_cb (gpointer data)
{
  return G_SOURCE_CONTINUE;
}

static void
wait_frame (void)
{
  gint64 end = g_get_monotonic_time () + G_USEC_PER_SEC;

  while (!painted && g_get_monotonic_time () < end)
    g_main_context_iteration (NULL, TRUE);
}

/* What the process and its main thread have used so far: page faults (a first touch of new
 * memory shows here) and the main thread's involuntary context switches (times the system
 * took its core for something else). */
typedef struct
{
  double cpu_ms;         /* the process, all threads */
  double main_cpu_ms;    /* the main thread */
  long   faults;         /* the process, minor and major */
  long   main_preempted; /* the main thread's involuntary context switches */
} Usage;

static void
usage_now (Usage *u)
{
  struct rusage ru;

  u->cpu_ms = bench_cpu_ms ();
  u->main_cpu_ms = bench_thread_cpu_ms ();
  getrusage (RUSAGE_SELF, &ru);
  u->faults = ru.ru_minflt + ru.ru_majflt;
  getrusage (RUSAGE_THREAD, &ru);
  u->main_preempted = ru.ru_nivcsw;
}

static void
usage_since (Usage *u)
{
  Usage now;

  usage_now (&now);
  u->cpu_ms = now.cpu_ms - u->cpu_ms;
  u->main_cpu_ms = now.main_cpu_ms - u->main_cpu_ms;
  u->faults = now.faults - u->faults;
  u->main_preempted = now.main_preempted - u->main_preempted;
}

static void
print_edit (const char  *prefix,
            const char  *what,
            int          i,
            double       total,
            double       edit,
            const Usage *u)
{
  printf ("%s%s %d: %.2f ms (edit %.2f ms, frame %.2f ms; CPU: main thread %.2f ms, process %.2f ms; "
          "%ld page faults; main thread preempted %ld times)\n",
          prefix, what, i, total, edit, total - edit, u->main_cpu_ms, u->cpu_ms, u->faults, u->main_preempted);
}

static int
cmp_double (const void *a, const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

typedef enum
{
  SERIES_RING,
  SERIES_TEMPERATURE
} Series;

/* One edit of the series; returns after the edit, before its frame. */
static void
do_edit (CwWindow *win,
         Series    series,
         int       i)
{
  static const char *groups[] = { "methyl", "tert-butyl", "bromo", "phenyl", "hydroxy", "isopropyl" };

  if (series == SERIES_RING)
    {
      int pos = (int[]){ 3, 5, 6 }[(i / 3) % 3];

      /* One typical edit: a group placed on, changed on, or removed from carbon 3, 5 or 6. */
      if (i % 3 == 2)
        gtk_widget_activate_action (GTK_WIDGET (win), "win.remove-group", "(is)", pos, "up");
      else
        gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", pos, "up",
                                    groups[i % G_N_ELEMENTS (groups)]);
    }
  else
    {
      /* What the slider does while it is dragged: its adjustment moves by one step (one
       * degree), here up and down across 40 degrees. */
      GtkAdjustment *adj = win->temperature_adjustment;
      int            k = i % 80;
      double         step = gtk_adjustment_get_step_increment (adj);

      gtk_adjustment_set_value (adj, gtk_adjustment_get_value (adj) + (k < 40 ? step : -step));
    }
}

/* Runs one series; returns TRUE when it meets the targets. */
static gboolean
run_series (CwWindow   *win,
            Series      series,
            const char *prefix)
{
  double times[N_EDITS], edit_only[N_EDITS], cpu[N_EDITS];
  Usage  usage, slowest_usage = { 0 };
  double slowest = -1.0, slowest_edit = 0.0;
  int    slowest_i = 0;
  guint  serial = 0;

  for (int i = 0; i < N_EDITS; i++)
    {
      const CwAnalysis *an;
      double            before;
      gint64            t0, t1;

      an = cw_window_get_analysis (win);
      before = an != NULL ? an->K : 0.0;
      serial = win->serial;
      frame_start = 0;
      painted = FALSE;
      usage_now (&usage);
      t0 = g_get_monotonic_time ();
      do_edit (win, series, i);
      t1 = g_get_monotonic_time ();
      wait_frame ();
      usage_since (&usage);
      cpu[i] = usage.cpu_ms;
      edit_only[i] = (t1 - t0) / 1000.0;
      times[i] = edit_only[i] + (painted ? (paint_end - frame_start) / 1000.0 : 1000.0);
      if (slow_ms > 0 && times[i] > slow_ms)
        print_edit (prefix, "slow edit", i, times[i], edit_only[i], &usage);
      if (times[i] > slowest)
        {
          slowest = times[i];
          slowest_edit = edit_only[i];
          slowest_i = i;
          slowest_usage = usage;
        }
      /* Each edit is a real change of the document, and the temperature ones change K. */
      an = cw_window_get_analysis (win);
      if (win->serial == serial || (series == SERIES_TEMPERATURE && (an == NULL || an->K == before)))
        {
          printf ("%sedit %d changed nothing\n", prefix, i);
          return FALSE;
        }
    }
  qsort (times, N_EDITS, sizeof (double), cmp_double);
  qsort (edit_only, N_EDITS, sizeof (double), cmp_double);
  qsort (cpu, N_EDITS, sizeof (double), cmp_double);
  printf ("%sedits: %d\n", prefix, N_EDITS);
  /* CPU time of this process over the edit and the wait for its frame: the wall-clock
   * figures below also include the X server's share and any other load on the machine. */
  printf ("%sprocess CPU per edit (incl. the frame) median: %.2f ms, max %.2f ms\n", prefix, cpu[N_EDITS / 2],
          cpu[N_EDITS - 1]);
  printf ("%sedit+frame median: %.2f ms\n", prefix, times[N_EDITS / 2]);
  printf ("%sedit+frame p90: %.2f ms\n", prefix, times[N_EDITS * 9 / 10]);
  printf ("%sedit+frame max: %.2f ms\n", prefix, times[N_EDITS - 1]);
  /* Where the slowest edit's time went: work of the main thread, or waiting (for the worker,
   * the X server, or a core the system gave to other load). */
  print_edit (prefix, "slowest: edit", slowest_i, slowest, slowest_edit, &slowest_usage);
  printf ("%sedit only (analysis + widgets) median: %.2f ms, max %.2f ms\n", prefix, edit_only[N_EDITS / 2],
          edit_only[N_EDITS - 1]);
  if (times[N_EDITS / 2] > 4.0 || times[N_EDITS - 1] > 16.0)
    {
      printf ("%sFAIL: target is median <= 4 ms and max <= 16 ms\n", prefix);
      return FALSE;
    }
  return TRUE;
}

/* The temperature slider inside the popover. */
static GtkWidget *
find_scale (GtkWidget *widget)
{
  if (GTK_IS_SCALE (widget))
    return widget;
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL; child = gtk_widget_get_next_sibling (child))
    {
      GtkWidget *found = find_scale (child);

      if (found != NULL)
        return found;
    }
  return NULL;
}

int
main (int argc, char *argv[])
{
  GdkFrameClock *clock;
  CwWindow      *win;
  GtkWidget     *scale;
  guint          tick;
  gboolean       ok;

  if (g_getenv ("CHAIRWISE_BENCH_SLOW") != NULL)
    slow_ms = g_ascii_strtod (g_getenv ("CHAIRWISE_BENCH_SLOW"), NULL);
  /* Autosave files of this run go to a private directory. */
  {
    g_autofree char *state = g_dir_make_tmp ("cw-bench-XXXXXX", NULL);

    g_setenv ("XDG_STATE_HOME", state, TRUE);
  }
  /* As the program does at start (src/app/main.c): memory kept in the heap, Cairo
   * renderer, no GL context. */
  cw_app_tune_memory ();
  if (g_getenv ("GDK_DEBUG") == NULL && g_strcmp0 (g_getenv ("GSK_RENDERER"), "cairo") == 0)
    g_setenv ("GDK_DEBUG", "gl-disable", TRUE);
  if (!gtk_init_check ())
    {
      printf ("no display: benchmark skipped\n");
      return 77;
    }
  win = g_object_new (CW_TYPE_WINDOW, NULL);
  gtk_window_set_default_size (GTK_WINDOW (win), 1180, 780);
  gtk_window_present (GTK_WINDOW (win));
  tick = g_timeout_add (5, tick_cb, NULL);
  while (!gtk_widget_get_mapped (GTK_WIDGET (win)))
    g_main_context_iteration (NULL, TRUE);
  for (int i = 0; i < 20; i++)
    g_main_context_iteration (NULL, FALSE);
  clock = gtk_widget_get_frame_clock (GTK_WIDGET (win));
  g_signal_add_emission_hook (g_signal_lookup ("before-paint", GDK_TYPE_FRAME_CLOCK), 0, before_paint_hook, clock,
                              NULL);
  g_signal_connect (clock, "after-paint", G_CALLBACK (after_paint_cb), NULL);
  /* Start from the demo document (three groups), like a real study. */
  {
    g_autofree char *demo = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
    g_autoptr (GFile) file = g_file_new_for_path (demo);

    if (!cw_window_open_file (win, file, NULL))
      {
        printf ("cannot open %s\n", demo);
        return 1;
      }
  }
  frame_start = 0;
  painted = FALSE;
  wait_frame ();

  ok = run_series (win, SERIES_RING, "");

  /* The temperature popover open, as while the slider is dragged. */
  gtk_menu_button_popup (win->temperature_button);
  {
    GtkWidget *popover = GTK_WIDGET (gtk_menu_button_get_popover (win->temperature_button));
    gint64     end = g_get_monotonic_time () + G_USEC_PER_SEC;

    while (!gtk_widget_get_mapped (popover) && g_get_monotonic_time () < end)
      g_main_context_iteration (NULL, TRUE);
    if (!gtk_widget_get_mapped (popover))
      {
        printf ("the temperature popover did not open\n");
        return 1;
      }
    /* A drag starts with a click on the slider, which takes the focus. */
    scale = find_scale (popover);
    if (scale == NULL || !gtk_widget_grab_focus (scale))
      {
        printf ("the temperature slider cannot take the focus\n");
        return 1;
      }
  }
  for (int i = 0; i < 20; i++)
    g_main_context_iteration (NULL, FALSE);
  frame_start = 0;
  painted = FALSE;
  wait_frame ();
  ok = run_series (win, SERIES_TEMPERATURE, "temperature slider: ") && ok;
  gtk_menu_button_popdown (win->temperature_button);

  g_source_remove (tick);
  win->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (win));
  return ok ? 0 : 1;
}
