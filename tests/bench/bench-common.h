#pragma once

/* Shared by the benchmarks: this process's CPU time (user + system, all threads) in ms. The
 * machine may be shared, so benchmarks compare CPU time where they can. */
#include <time.h>

static inline double
bench_cpu_ms (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_PROCESS_CPUTIME_ID, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

/* CPU time of the calling thread only, in ms: set beside the wall clock, it tells work from
 * waiting (for another thread, the X server, or a core taken by other load). */
static inline double
bench_thread_cpu_ms (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}
