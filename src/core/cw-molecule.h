#pragma once

#include "cw-groups.h"

G_BEGIN_DECLS

#define CW_RING_SIZE 6
#define CW_MAX_SUBS 12

typedef enum
{
  CW_FACE_UP,   /* solid wedge in the flat drawing */
  CW_FACE_DOWN  /* hashed wedge */
} CwFace;

typedef struct
{
  const CwGroup *group; /* borrowed from the data table or the molecule's custom groups */
  int position;         /* ring carbon, 1..6 */
  CwFace face;
} CwSubstituent;

/* A substituted cyclohexane: up to two groups on each ring carbon, each on a face.
 * Substituents are kept sorted by (position, face). */
typedef struct
{
  CwSubstituent subs[CW_MAX_SUBS];
  int n_subs;
  GPtrArray *custom_groups; /* owned CwGroup*, may be NULL */
} CwMolecule;

CwMolecule *cw_molecule_new   (void);
CwMolecule *cw_molecule_copy  (const CwMolecule *mol);
void        cw_molecule_free  (CwMolecule *mol);
void        cw_molecule_clear (CwMolecule *mol);
/* Adds or replaces the group on (position, face). Fails when the slot is out of range. */
gboolean    cw_molecule_set   (CwMolecule *mol, int position, CwFace face, const CwGroup *group, GError **error);
gboolean    cw_molecule_remove (CwMolecule *mol, int position, CwFace face);
const CwSubstituent *cw_molecule_get (const CwMolecule *mol, int position, CwFace face);
/* Takes ownership of group; returns the stored pointer. Replaces a custom group of the same id. */
const CwGroup *cw_molecule_add_custom_group (CwMolecule *mol, CwGroup *group);
const CwGroup *cw_molecule_find_custom_group (const CwMolecule *mol, const char *id);

/* Relative configuration: "cis", "trans", or r/c/t descriptors "r-1, c-3, t-4"; "" when fewer than
 * two carbons are stereogenic. On a carbon with two different groups the higher-ranking one (first
 * atom's atomic number, then size) gives the face. Newly allocated. */
char       *cw_molecule_dup_configuration (const CwMolecule *mol);
void        cw_molecule_append_configuration (const CwMolecule *mol, GString *out);
/* Inline ring spec of our own: "1u=methyl 3d=Cl", see cw-molecule.c. */
CwMolecule *cw_molecule_new_from_spec (const char *spec, const CwGroupTable *table, GError **error);
char       *cw_molecule_dup_spec (const CwMolecule *mol);
/* A readable name such as "cis-1,3-di(Me)cyclohexane"-style summary: "1-Me, 3-Me (cis)". */
char       *cw_molecule_dup_summary (const CwMolecule *mol);

const char *cw_face_to_string (CwFace face);
gboolean    cw_face_from_string (const char *s, CwFace *face);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwMolecule, cw_molecule_free)

G_END_DECLS
