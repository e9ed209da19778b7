#pragma once

#include <glib.h>
#include <gmodule.h>

#include "cw-core.h"

G_BEGIN_DECLS

/* Exit codes of chairwise-calc. */
#define CW_EXIT_OK 0
#define CW_EXIT_ANALYSIS 1 /* the input was understood but could not be analysed, or I/O failed */
#define CW_EXIT_USAGE 2    /* bad options or arguments */

/* One subcommand: argv[0] is the subcommand name. Returns an exit code. Prints errors on stderr
 * as "chairwise-calc NAME: message". */
typedef int (*CwCliRun) (int argc, char **argv);

typedef struct
{
  const char *name;
  const char *summary; /* one line for the top-level --help */
  CwCliRun run;
} CwCliCommand;

/* Where a subcommand's molecule comes from: a document path, --smiles or --ring. Options to add to
 * a GOptionContext with cw_cli_input_add_options; cw_cli_input_load resolves them after parsing. */
typedef struct
{
  char *smiles;
  char *ring;      /* inline spec, see cw_molecule_new_from_spec */
  char *temperature;
  char *units;
  char *solvent;
  char *data_dir;
  gboolean json;
  gboolean csv;
} CwCliInput;

/* Which option groups a command takes besides --smiles/--ring/--data-dir. */
typedef enum
{
  CW_CLI_OPTIONS_SOURCE = 0,
  CW_CLI_OPTIONS_CONDITIONS = 1 << 0, /* --temperature, --units, --solvent */
  CW_CLI_OPTIONS_FORMATS = 1 << 1     /* --json, --csv */
} CwCliOptionSet;

void        cw_cli_input_add_options (GOptionContext *context, CwCliInput *input, CwCliOptionSet set);
void        cw_cli_input_clear (CwCliInput *input);
G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (CwCliInput, cw_cli_input_clear)
/* Loads the tables and the document (from the positional path, --smiles or --ring), applies
 * --temperature/--units/--solvent. On failure prints the message and sets *exit_code. */
CwDocument *cw_cli_input_load (CwCliInput *input, const char *path, CwData **data_out, int *exit_code);
/* The same, keeping every cis/trans isomer when a SMILES leaves ring stereocentres open
 * (element-type CwDocument*, owned); each isomer's title is its canonical SMILES. */
GPtrArray  *cw_cli_input_load_all (CwCliInput *input, const char *path, CwData **data_out, int *exit_code);
int         cw_cli_error (const char *command, int code, const char *format, ...) G_GNUC_PRINTF (3, 4);
/* A fraction as a percentage with as many figures as it needs: "68.3", "0.031", "99.9704". */
char       *cw_cli_format_percent (double fraction);
int         cw_cli_usage_error (GOptionContext *context, const char *command, const char *message);

/* Subcommands; each lives in its own cw-cli-*.c file. */
int cw_cli_analyze (int argc, char **argv);
int cw_cli_scan (int argc, char **argv);
int cw_cli_groups (int argc, char **argv);
/* cw-cli-draw.c, built as the chairwise-calc-render module (exported for g_module_symbol) */
G_MODULE_EXPORT int cw_cli_draw (int argc, char **argv);
G_MODULE_EXPORT int cw_cli_report (int argc, char **argv);
int cw_cli_geometry (int argc, char **argv);   /* cw-cli-nmr.c */
int cw_cli_couplings (int argc, char **argv);  /* cw-cli-nmr.c */
int cw_cli_reactivity (int argc, char **argv); /* cw-cli-reactivity.c */
int cw_cli_isomers (int argc, char **argv);    /* cw-cli-smiles.c */
int cw_cli_batch (int argc, char **argv);      /* cw-cli-smiles.c */

G_END_DECLS
