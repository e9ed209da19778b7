#pragma once

#include "cw-smiles-private.h"
#include "cw-smiles.h"

G_BEGIN_DECLS

/* One reading in progress, shared by the general reader (cw-smiles-read.c) and its fast path
 * for simply written rings (cw-smiles-fast.c). */
typedef struct
{
  CwSmGraph       *g;
  guint8          *mask;
  const CwSmIndex *index;
  gint16           comp[CW_SM_MAX_ATOMS];
  gint16           depth[CW_SM_MAX_ATOMS];
  guint32          member[CW_SM_MAX_ATOMS]; /* bit c: atom lies on cycle c */
  int              cycle[CW_SM_MAX_CYCLES][CW_SM_MAX_ATOMS];
  int              cycle_len[CW_SM_MAX_CYCLES];
  int              n_cycles;
  int              keep;               /* component kept */
  int              ring[CW_RING_SIZE]; /* graph atoms, cyclic order */
  int              n_subs;
  int              sub_ring[CW_MAX_SUBS]; /* 0..5 */
  int              sub_atom[CW_MAX_SUBS];
  const CwGroup   *sub_group[CW_MAX_SUBS];
  int              sub_face[CW_MAX_SUBS]; /* CwFace, or -1 when not written */
  gboolean         inner_stereo;
} Reading;

/* The molecules of a finished reading: open ring stereocentres enumerated, each numbered
 * canonically. Uses r->ring, r->sub_* and the ring atoms' text positions. */
int cw_sm_make_molecules (Reading *r, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes, GError **error);

/* cw-smiles-fast.c: the molecules of a SMILES written in the simple pattern (one ring, its
 * carbons in one chain, every substituent a self-contained stretch of text whose fragment the
 * cache already knows), or 0 when the general reader must read it. Never sets an error. */
int cw_sm_read_fast (const CwSmIndex *index, CwSmGraph *g, const char *text, int len, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes);

G_END_DECLS
