#pragma once

#include "cw-groups.h"
#include "cw-molecule.h"

G_BEGIN_DECLS

/* SMILES in and out (OpenSMILES, our own reader and writer).
 *
 * Reading finds the one saturated all-carbon six-membered ring, cuts each substituent off at its
 * ring carbon and maps it to a table group by comparing canonical rooted fragments, so "OC(C)=O",
 * "O(C(=O)C)" and an acetoxy written towards the ring ("CC(=O)O[C@H]1…") all give OAc. Faces come
 * from @/@@: seen from the up face, positions 1→6 run clockwise, as drawn (the same convention in the
 * writer, so absolute configuration survives SMILES → molecule → SMILES). Molecules come back
 * canonically numbered (lowest locants, then the group table order, then up before down). */

/* clang-format off */

/* One or more molecules: more than one when ring stereocentres are open (each a cis/trans isomer);
 * notes (may be NULL) gets plain-language remarks (largest fragment chosen, open centres). Groups
 * are borrowed from table; unknown fragments -> error CW_CORE_ERROR_UNKNOWN_GROUP naming the
 * fragment SMILES and its position. Errors name the character position (1-based). */
GPtrArray *cw_smiles_read  (const char *smiles, const CwGroupTable *table, GString *notes, GError **error); /* element-type CwMolecule*, owned (free func set) */
/* Canonical isomeric SMILES. Groups without a fragment are written as "*". */
char      *cw_smiles_write (const CwMolecule *mol);

/* A reusable reader: builds the fragment index of the table once and keeps its buffers, so that
 * reading allocates nothing (for batch work). The table must outlive the reader. */
typedef struct _CwSmilesReader CwSmilesReader;
typedef struct _CwSmilesInfo CwSmilesInfo;

struct _CwSmilesInfo
{
  int n_molecules;       /* filled into out[0..n-1] */
  int n_open;            /* ring stereocentres without @/@@ (when cis/trans isomers exist) */
  int open_pos[CW_RING_SIZE]; /* character offsets (0-based) of those ring carbons */
  int n_dropped;         /* disconnected parts left out (salts, solvents) */
  int error_pos;         /* character offset (0-based) of a reading error, -1 when none */
};

CwSmilesReader *cw_smiles_reader_new   (const CwGroupTable *table);
void            cw_smiles_reader_free  (CwSmilesReader *reader);
/* Reads len bytes (-1: up to the NUL). Fills at most max_out molecules into out (their
 * custom_groups is left NULL); more isomers than max_out is an error. notes may be NULL. */
int             cw_smiles_reader_read  (CwSmilesReader *reader, const char *smiles, gssize len,
                                        CwMolecule *out, int max_out, CwSmilesInfo *info,
                                        GString *notes, GError **error);
/* Appends the canonical SMILES of mol, using the reader's prepared fragments when it can. */
void            cw_smiles_reader_write (CwSmilesReader *reader, const CwMolecule *mol, GString *out);
/* Problems met while indexing the table (a group whose fragment cannot be read), or "" */
const char     *cw_smiles_reader_get_problems (CwSmilesReader *reader);
/* The table group whose fragment matches smiles (written from the attachment atom), or NULL. */
const CwGroup  *cw_smiles_reader_match_fragment (CwSmilesReader *reader, const char *fragment, GError **error);
/* Canonical SMILES of a group's fragment as the reader writes it, newly allocated. */
char           *cw_smiles_dup_group_fragment (const CwGroup *group);

/* clang-format on */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwSmilesReader, cw_smiles_reader_free)

G_END_DECLS
