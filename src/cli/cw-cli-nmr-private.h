#pragma once

#include <cjson/cJSON.h>

#include "cw-cli.h"
#include "cw-geometry-data.h"

G_BEGIN_DECLS

/* Shared by the geometry, couplings and reactivity subcommands: the document, the tables and
 * the analysis at the document's conditions. */
typedef struct
{
  CwDocument       *doc;
  CwData           *data;
  CwGeometryData   *gd;
  const CwMolecule *mol; /* borrowed from doc */
  CwAnalysis        an;
} CwCliNmrContext;

/* On failure prints the message and sets *code. */
gboolean cw_cli_nmr_setup (CwCliNmrContext *ctx, CwCliInput *input, const char *path, const char *cmd, int *code);
void     cw_cli_nmr_clear (CwCliNmrContext *ctx);
char    *cw_cli_nmr_percent (double fraction); /* "99.7", "0.03" */
void     cw_cli_nmr_print_header (const CwCliNmrContext *ctx);
void     cw_cli_nmr_add_header_json (cJSON *o, const CwCliNmrContext *ctx, const char *format);
/* Adds the caution and prints. */
void cw_cli_nmr_print_json (cJSON *o);

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (CwCliNmrContext, cw_cli_nmr_clear)

G_END_DECLS
