#pragma once

#include "cw-analysis.h"

G_BEGIN_DECLS

#define CW_DOCUMENT_FORMAT "chairwise-document"
#define CW_DOCUMENT_VERSION 1
#define CW_DOCUMENT_MAX_SIZE (4 * 1000 * 1000) /* bytes; real documents are a few kB */

/* A saved study: the molecule (with any custom groups), conditions, units, title and notes.
 * Fields this version does not know are kept and written back on save. */
typedef struct _CwDocument CwDocument;

CwDocument *cw_document_new (void);
CwDocument *cw_document_copy (const CwDocument *doc);
void        cw_document_free (CwDocument *doc);
CwDocument *cw_document_new_from_data (const char *data, gsize len, const CwGroupTable *table, GError **error);
CwDocument *cw_document_new_from_file (const char *path, const CwGroupTable *table, GError **error);
char       *cw_document_to_data (const CwDocument *doc, gsize *len);
/* Atomic: temporary file, fsync, rename; keeps PATH.bak of the previous version when keep_backup. */
gboolean    cw_document_save (const CwDocument *doc, const char *path, gboolean keep_backup, GError **error);

CwMolecule *cw_document_get_molecule (CwDocument *doc);          /* borrowed, mutable */
const CwMolecule *cw_document_peek_molecule (const CwDocument *doc);
void        cw_document_set_molecule (CwDocument *doc, const CwMolecule *mol); /* copies */
const char *cw_document_get_title (const CwDocument *doc);
void        cw_document_set_title (CwDocument *doc, const char *title);
const char *cw_document_get_notes (const CwDocument *doc);
void        cw_document_set_notes (CwDocument *doc, const char *notes);
double      cw_document_get_temperature (const CwDocument *doc);      /* K */
void        cw_document_set_temperature (CwDocument *doc, double kelvin);
CwTemperatureUnit cw_document_get_temperature_unit (const CwDocument *doc);
void        cw_document_set_temperature_unit (CwDocument *doc, CwTemperatureUnit unit);
CwEnergyUnit cw_document_get_energy_unit (const CwDocument *doc);
void        cw_document_set_energy_unit (CwDocument *doc, CwEnergyUnit unit);
CwSolvent   cw_document_get_solvent (const CwDocument *doc);
void        cw_document_set_solvent (CwDocument *doc, CwSolvent solvent);
void        cw_document_get_conditions (const CwDocument *doc, CwConditions *cond);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwDocument, cw_document_free)

G_END_DECLS
