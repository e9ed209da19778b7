#pragma once

#include <stdio.h>

#include "cw-analysis.h"

G_BEGIN_DECLS

/* Batch analysis: one compound per input line, one output row per analysed molecule (a line
 * whose ring stereocentres are open gives one row per cis/trans isomer). Streams: memory does
 * not grow with the input. A bad line becomes an error row and a message naming the line; the
 * batch goes on. */

typedef enum
{
  CW_BATCH_INPUT_AUTO, /* CSV when the first line has a "smiles" column, else SMILES lines */
  CW_BATCH_INPUT_SMI,  /* "SMILES [name or id]" per line; '#' starts a comment line */
  CW_BATCH_INPUT_CSV   /* comma-separated, header with a "smiles" column and optional id/name */
} CwBatchInput;

typedef struct
{
  double       temperature; /* K */
  CwSolvent    solvent;
  CwBatchInput input;
  gboolean     json;     /* JSON document instead of CSV */
  gboolean     progress; /* progress line on err (only when err is a terminal) */
  const char  *command;  /* prefix for messages, e.g. "chairwise-calc batch" */
} CwBatchOptions;

typedef struct
{
  guint64 lines;     /* lines read */
  guint64 compounds; /* lines that held a compound */
  guint64 analysed;  /* compounds analysed */
  guint64 rows;      /* result rows written */
  guint64 errors;    /* compounds that could not be analysed */
  guint64 expanded;  /* compounds with open ring stereocentres (more than one row) */
  guint64 salts;     /* compounds with parts left out */
  double  seconds;
} CwBatchSummary;

void cw_batch_options_init (CwBatchOptions *opt);
/* FALSE only when reading or writing fails (error set); bad lines do not fail the batch. */
gboolean cw_batch_run (const CwData *data, FILE *in, FILE *out, FILE *err, const CwBatchOptions *opt, CwBatchSummary *summary, GError **error);
/* "12 compounds in 12 lines: 11 analysed (13 rows), 1 error; 0.01 s" */
char *cw_batch_summary_dup_text (const CwBatchSummary *summary);

G_END_DECLS
