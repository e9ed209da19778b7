#pragma once

#include "cw-groups.h"

G_BEGIN_DECLS

#define CW_FRAGMENT_MAX_NEIGHBOURS 4

/* What the couplings and reactivity analyses need to know about a substituent's first atom
 * (the atom bonded to the ring carbon), read from the group's SMILES fragment. */
typedef struct
{
  CwElement first_atom;
  /* Heavy atoms bonded to the first atom, other than the ring carbon (the β-substituents of the
   * Karplus equation). An atom joined by a double or triple bond is listed once. */
  CwElement neighbours[CW_FRAGMENT_MAX_NEIGHBOURS];
  int       n_neighbours;
  int       n_hydrogens; /* hydrogens on the first atom (implicit or in brackets) */
  gboolean  from_smiles; /* FALSE: no usable fragment; first_atom from the group, nothing else known */
} CwFragmentInfo;

/* Reads group->smiles (written from the attachment atom, e.g. "C(=O)OC", "[Si](C)(C)C", "c1ccccc1").
 * Never fails: a group without a fragment, or one this reader does not follow, gives
 * from_smiles = FALSE with first_atom = group->first_atom. */
void cw_fragment_info (const CwGroup *group, CwFragmentInfo *out);

/* Lower-level: parses a fragment string; FALSE (with error naming the position) when it cannot. */
gboolean cw_fragment_parse (const char *smiles, CwFragmentInfo *out, GError **error);

G_END_DECLS
