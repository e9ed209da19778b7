#pragma once

/* Shared pieces of the libFuzzer harnesses: the project's tables, loaded once, and checks that
 * turn a broken promise (an error without a message, a NaN population, a lost round trip) into a
 * crash the fuzzer reports. */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cw-core.h"

int LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size);

#define FUZZ_CHECK(cond, ...)                                           \
  do                                                                    \
    {                                                                   \
      if (!(cond))                                                      \
        {                                                               \
          fprintf (stderr, "fuzz check failed: %s: ", #cond);           \
          fprintf (stderr, __VA_ARGS__);                                \
          fputc ('\n', stderr);                                         \
          abort ();                                                     \
        }                                                               \
    }                                                                   \
  while (0)

/* The shipped tables (CHAIRWISE_DATADIR or the source tree), kept for the whole run. */
static inline CwData *
fuzz_data (void)
{
  static CwData *data = NULL;

  if (data == NULL)
    {
      GError *error = NULL;

      data = cw_data_new_from_dir (NULL, &error);
      FUZZ_CHECK (data != NULL, "cannot load the data tables: %s", error ? error->message : "?");
    }
  return data;
}

/* A refusal must say what was wrong: a core error with a non-empty message, in UTF-8 whenever
 * the input was (the window shows it in a label). CHAIRWISE_FUZZ_SKIP_UTF8=1 turns the UTF-8
 * check off, for exploring past a known, reported problem locally; CI never sets it. */
static inline void
fuzz_check_error (const GError *error, gboolean input_utf8)
{
  static int skip_utf8 = -1;

  if (skip_utf8 < 0)
    skip_utf8 = g_strcmp0 (g_getenv ("CHAIRWISE_FUZZ_SKIP_UTF8"), "1") == 0;
  FUZZ_CHECK (error != NULL, "failed without an error");
  FUZZ_CHECK (error->domain == CW_CORE_ERROR, "error from domain %s: %s",
              g_quark_to_string (error->domain), error->message);
  FUZZ_CHECK (error->message != NULL && error->message[0] != '\0', "empty message");
  if (input_utf8 && !skip_utf8)
    FUZZ_CHECK (g_utf8_validate (error->message, -1, NULL), "message is not UTF-8: %s",
                error->message);
}

/* What every analysis must give: finite energies, populations in [0, 1] summing to 1, and an
 * interval that contains the estimate. */
static inline void
fuzz_check_analysis (const CwAnalysis *an)
{
  FUZZ_CHECK (isfinite (an->delta_g) && isfinite (an->sigma) && an->sigma >= 0,
              "delta_g %g sigma %g", an->delta_g, an->sigma);
  for (int c = 0; c < 2; c++)
    {
      FUZZ_CHECK (isfinite (an->chair[c].energy), "chair %d energy %g", c + 1, an->chair[c].energy);
      FUZZ_CHECK (an->pop[c] >= 0 && an->pop[c] <= 1, "population %g", an->pop[c]);
      FUZZ_CHECK (an->pop_low[c] <= an->pop[c] + 1e-12 && an->pop[c] <= an->pop_high[c] + 1e-12,
                  "interval %g..%g around %g", an->pop_low[c], an->pop_high[c], an->pop[c]);
    }
  FUZZ_CHECK (fabs (an->pop[0] + an->pop[1] - 1.0) <= 1e-12, "sum %.17g", an->pop[0] + an->pop[1]);
}

/* The input as a C string (stops at the first NUL, like any C caller would). */
static inline char *
fuzz_strndup (const uint8_t *bytes, size_t size)
{
  return g_strndup ((const char *) bytes, size);
}
