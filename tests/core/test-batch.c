/* Batch analysis: rows, error lines, CSV and JSON, and agreement with one-at-a-time analysis. */
#define _GNU_SOURCE /* fopencookie */
#include "config.h"

#include <cjson/cJSON.h>
#include <stdio.h>
#include <string.h>
#include <sys/resource.h>

#include "cw-batch.h"
#include "cw-smiles.h"
#include "test-helpers.h"

#if defined(__SANITIZE_ADDRESS__)
#define SANITIZER_SLACK_KB 8192
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#define SANITIZER_SLACK_KB 8192
#endif
#endif
#ifndef SANITIZER_SLACK_KB
#define SANITIZER_SLACK_KB 0
#endif

static CwData *data;

static char *
run (const char *input, gboolean json, CwBatchInput format, CwBatchSummary *sum, char **err_text)
{
  g_autoptr (GError) error = NULL;
  CwBatchOptions opt;
  char          *out_buf = NULL, *err_buf = NULL;
  size_t         out_len = 0, err_len = 0;
  FILE          *in = fmemopen ((void *) input, strlen (input), "r");
  FILE          *out = open_memstream (&out_buf, &out_len);
  FILE          *err = open_memstream (&err_buf, &err_len);

  cw_batch_options_init (&opt);
  opt.json = json;
  opt.input = format;
  g_assert_true (cw_batch_run (data, in, out, err, &opt, sum, &error));
  g_assert_no_error (error);
  fclose (in);
  fclose (out);
  fclose (err);
  if (err_text)
    *err_text = err_buf;
  else
    free (err_buf);
  return out_buf;
}

static const char *input =
  "CC1CCCCC1 methylcyclohexane\n"
  "C[C@H]1CC[C@H](C(C)(C)C)CC1 trans-4-tert-butyl-1-methyl\n"
  "CC1CCC(C)CC1 open\n"
  "C1CCCCC1C(C)(C)CC unknown group\n"
  "\n"
  "# a comment\n"
  "C1CC(CCCC1 bad\n"
  "[Na+].[O-]C(=O)C1CCCCC1 salt\n";

static void
test_csv (void)
{
  CwBatchSummary   sum;
  g_autofree char *err = NULL;
  g_autofree char *out = run (input, FALSE, CW_BATCH_INPUT_AUTO, &sum, &err);
  g_auto (GStrv) lines = g_strsplit (out, "\n", -1);

  g_assert_cmpuint (sum.lines, ==, 8);
  g_assert_cmpuint (sum.compounds, ==, 6);
  g_assert_cmpuint (sum.analysed, ==, 4);
  g_assert_cmpuint (sum.errors, ==, 2);
  g_assert_cmpuint (sum.rows, ==, 5);
  g_assert_cmpuint (sum.expanded, ==, 1);
  g_assert_cmpuint (sum.salts, ==, 1);
  g_assert_true (g_str_has_prefix (lines[0], "line,id,smiles,configuration,major_chair,delta_g_kcal"));
  /* every row has the header's 14 columns */
  for (int i = 0; lines[i] && lines[i][0]; i++)
    {
      int      commas = 0;
      gboolean quoted = FALSE;
      for (const char *c = lines[i]; *c; c++)
        {
          quoted ^= *c == '"';
          commas += *c == ',' && !quoted;
        }
      g_assert_cmpint (commas, ==, 13);
    }
  g_assert_true (g_str_has_prefix (lines[1], "1,methylcyclohexane,CC1CCCCC1,,2,-"));
  g_assert_true (g_str_has_prefix (lines[3], "3,open,") && strstr (lines[3], "open-stereo"));
  g_assert_true (g_str_has_prefix (lines[4], "3,open,") && strstr (lines[4], "open-stereo"));
  g_assert_true (g_str_has_prefix (lines[5], "4,unknown group,,") && strstr (lines[5], "C(CC)(C)C"));
  g_assert_true (g_str_has_prefix (lines[6], "7,bad,,"));
  g_assert_true (strstr (lines[7], "largest-part") != NULL);
  g_assert_nonnull (strstr (err, "line 4:"));
  g_assert_nonnull (strstr (err, "line 7:"));
}

/* A row says what analysing the molecule alone says. */
static void
test_agrees_with_analysis (void)
{
  CwBatchSummary   sum;
  g_autofree char *out = run ("C[C@H]1CC[C@H](C(C)(C)C)CC1\n", FALSE, CW_BATCH_INPUT_SMI, &sum, NULL);
  g_autoptr (GPtrArray) mols = cw_smiles_read ("C[C@H]1CC[C@H](C(C)(C)C)CC1", data->groups, NULL, NULL);
  g_auto (GStrv) lines = g_strsplit (out, "\n", -1);
  g_auto (GStrv) f = g_strsplit (lines[1], ",", -1);
  g_autofree char *smiles = cw_smiles_write (mols->pdata[0]);
  CwConditions     cond = { 298.15, CW_SOLVENT_APROTIC };
  CwAnalysis       an;

  g_assert_true (cw_analyze (data, mols->pdata[0], &cond, &an, NULL));
  g_assert_cmpstr (f[2], ==, smiles);
  g_assert_cmpint (atoi (f[4]), ==, an.major + 1);
  g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[5], NULL), an.delta_g, 0.0005);
  g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[6], NULL), an.sigma, 0.0005);
  g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[7], NULL) / an.K, 1.0, 0.001);
  g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[8], NULL), an.pop[0], 0.00005);
  g_assert_cmpfloat_with_epsilon (g_ascii_strtod (f[9], NULL), an.pop[1], 0.00005);
}

static void
test_csv_input (void)
{
  CwBatchSummary   sum;
  g_autofree char *out = run ("name,other,SMILES\n\"a, b\",1,OC1CCCCC1\nc,2,ClC1CCCCC1\nd,3,\n,,\n", FALSE,
                              CW_BATCH_INPUT_AUTO, &sum, NULL);
  g_auto (GStrv) lines = g_strsplit (out, "\n", -1);

  g_assert_cmpuint (sum.analysed, ==, 2);
  g_assert_cmpuint (sum.errors, ==, 1); /* row d has no SMILES; the empty row is skipped */
  g_assert_true (g_str_has_prefix (lines[3], "4,d,,"));
  g_assert_true (g_str_has_prefix (lines[1], "2,\"a, b\",OC1CCCCC1,"));
  g_assert_true (g_str_has_prefix (lines[2], "3,c,ClC1CCCCC1,"));
}

static void
test_json (void)
{
  CwBatchSummary   sum;
  g_autofree char *out = run (input, TRUE, CW_BATCH_INPUT_SMI, &sum, NULL);
  cJSON           *root = cJSON_Parse (out);
  cJSON           *results, *summary;

  g_assert_nonnull (root);
  results = cJSON_GetObjectItem (root, "results");
  summary = cJSON_GetObjectItem (root, "summary");
  g_assert_cmpint (cJSON_GetArraySize (results), ==, 7);
  g_assert_cmpint (cJSON_GetObjectItem (summary, "errors")->valueint, ==, 2);
  g_assert_nonnull (cJSON_GetObjectItem (cJSON_GetArrayItem (results, 4), "error"));
  g_assert_nonnull (cJSON_GetObjectItem (root, "caution"));
  cJSON_Delete (root);
}

/* Many lines, a long line, no final newline: every compound is counted once. */
static void
test_stream (void)
{
  CwBatchSummary sum;
  g_autoptr (GString) in = g_string_new (NULL);
  g_autofree char *out = NULL;

  for (int i = 0; i < 30000; i++)
    g_string_append_printf (in, "%s id%d\n", i % 3 ? "OC1CCC(Cl)CC1" : "C[C@@H]1CC[C@H](C#N)CC1", i);
  g_string_append_c (in, 'C');
  for (int i = 0; i < 2000; i++)
    g_string_append (in, "(C)");
  g_string_append (in, "\nCC1CCCCC1");
  out = run (in->str, FALSE, CW_BATCH_INPUT_SMI, &sum, NULL);
  g_assert_cmpuint (sum.compounds, ==, 30002);
  g_assert_cmpuint (sum.errors, ==, 1);
  g_assert_cmpuint (sum.rows, ==, 10000 + 20000 * 2 + 1);
  g_assert_true (g_str_has_suffix (out, "\n"));
}

typedef struct
{
  long line, n_lines;
  char pending[64];
  int  len, off;
} LineSource;

static ssize_t
source_read (void *cookie, char *buf, size_t size)
{
  LineSource *src = cookie;
  size_t      done = 0;

  while (done < size)
    {
      if (src->off == src->len)
        {
          if (src->line == src->n_lines)
            break;
          src->len = g_snprintf (src->pending, sizeof src->pending, "%s c%ld\n",
                                 src->line % 2 ? "OC1CCC(Cl)CC1" : "C[C@@H]1CC[C@H](C#N)C(C)C1", src->line);
          src->off = 0;
          src->line++;
        }
      buf[done++] = src->pending[src->off++];
    }
  return done;
}

static long
max_rss_kb (void)
{
  struct rusage ru;

  getrusage (RUSAGE_SELF, &ru);
  return ru.ru_maxrss;
}

/* Streaming: ten times the input does not raise the high-water mark of memory. */
static void G_GNUC_UNUSED
test_memory_flat (void)
{
  cookie_io_functions_t io = { source_read, NULL, NULL, NULL };
  long                  sizes[2] = { 20000, 200000 }, rss[2];

  for (int k = 0; k < 2; k++)
    {
      LineSource     src = { 0, sizes[k], "", 0, 0 };
      FILE          *in = fopencookie (&src, "r", io);
      FILE          *out = fopen ("/dev/null", "w");
      CwBatchOptions opt;
      CwBatchSummary sum;

      cw_batch_options_init (&opt);
      opt.input = CW_BATCH_INPUT_SMI;
      g_assert_true (cw_batch_run (data, in, out, NULL, &opt, &sum, NULL));
      g_assert_cmpuint (sum.compounds, ==, sizes[k]);
      fclose (in);
      fclose (out);
      rss[k] = max_rss_kb ();
    }
  g_test_message ("max RSS after 20000 lines %ld kB, after 200000 more %ld kB", rss[0], rss[1]);
  /* Under AddressSanitizer freed blocks stay in quarantine, so the second run's fixed buffers
   * (about 3.5 MB) come on top: allow for them, still far below 200000 lines of growth. */
  g_assert_cmpint (rss[1] - rss[0], <, SANITIZER_SLACK_KB + 1024);
}

int
main (int argc, char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/batch/csv", test_csv);
  g_test_add_func ("/core/batch/agrees-with-analysis", test_agrees_with_analysis);
  g_test_add_func ("/core/batch/csv-input", test_csv_input);
  g_test_add_func ("/core/batch/json", test_json);
  g_test_add_func ("/core/batch/stream", test_stream);
  /* AddressSanitizer keeps freed memory in quarantine, so resident size grows by design there;
   * the check runs in every other build */
#if !defined(__SANITIZE_ADDRESS__)
  g_test_add_func ("/core/batch/memory-flat", test_memory_flat);
#endif
  status = g_test_run ();
  cw_data_free (data);
  return status;
}
