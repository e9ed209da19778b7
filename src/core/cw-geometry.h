#pragma once

#include "cw-geometry-data.h"
#include "cw-molecule.h"

G_BEGIN_DECLS

/* Idealised 3D chairs (DEVELOPERS.md, the model; docs/couplings-and-reactions.md).
 *
 * Frame: the ring's threefold axis is z; "up" (the up face of the flat drawing) is +z. Ring carbon
 * k (1..6) sits at azimuth 60°·(k − 1), counter-clockwise seen from +z, at radius r and height ±h
 * from the measured C–C bond and C–C–C angle (a D3d chair). In chair 1 the carbons 1, 3, 5 are
 * the upper ones, whose axial bond points up; chair 2 is the ring-inverted form (all heights
 * negated). The two exocyclic bonds of each carbon lie in the plane that bisects its C–C–C angle,
 * symmetric about that angle's bisector, at the tabulated exocyclic angle; the one nearer the
 * axis is axial. Each slot (carbon, face) holds either H (ring C–H length, axial or equatorial)
 * or the first atom of the substituent there (ring C – element bond length from the table). */

#define CW_CHAIR_MAX_ATOMS (CW_RING_SIZE * 3)

typedef enum
{
  CW_ATOM_RING,       /* ring carbon */
  CW_ATOM_HYDROGEN,   /* ring hydrogen */
  CW_ATOM_SUBSTITUENT /* first atom of a substituent */
} CwAtomKind;

typedef struct
{
  CwAtomKind kind;
  CwElement  element;
  double     xyz[3];   /* Å */
  int        position; /* ring carbon 1..6 it is (or is bonded to) */
  CwFace     face;     /* for H and substituents */
  gboolean   axial;    /* for H and substituents, in this chair */
  int        sub;      /* index into the molecule's subs, or -1 */
} CwAtom3D;

typedef struct
{
  int      chair; /* 0 = chair 1, 1 = chair 2 */
  CwAtom3D atoms[CW_CHAIR_MAX_ATOMS];
  int      n_atoms;               /* always CW_CHAIR_MAX_ATOMS once built */
  int      ring[CW_RING_SIZE];    /* atom index of carbon k + 1 */
  int      slot[CW_RING_SIZE][2]; /* atom index on carbon k + 1, [CW_FACE_UP / CW_FACE_DOWN] */
} CwChairGeometry;

/* clang-format off */
/* Face of the axial bond of a ring carbon (1..6) in chair 0 or 1. */
CwFace   cw_chair_axial_face (int chair, int position);
gboolean cw_chair_is_axial   (int chair, int position, CwFace face);

/* Fills *out. Fails only for an out-of-range chair or a substituent the table has no bond for
 * (then the message names it). */
gboolean cw_chair_geometry_build (const CwGeometryData *gd,
                                  const CwMolecule     *mol,
                                  int                   chair,
                                  CwChairGeometry      *out,
                                  GError              **error);
/* Atom index of the slot (position 1..6, face). */
int      cw_chair_geometry_slot  (const CwChairGeometry *g, int position, CwFace face);
/* Signed torsion angle a–b–c–d in degrees, (−180, 180], IUPAC sign convention. */
double   cw_chair_geometry_torsion (const CwChairGeometry *g, int a, int b, int c, int d);
double   cw_torsion_angle (const double a[3], const double b[3], const double c[3], const double d[3]);
double   cw_chair_geometry_distance (const CwChairGeometry *g, int a, int b);
double   cw_chair_geometry_angle (const CwChairGeometry *g, int a, int b, int c); /* degrees at b */

/* XYZ text (open format: count line, comment line, "El x y z" lines, Å). comment may be NULL;
 * newlines in it are replaced by spaces. Newly allocated. */
char    *cw_chair_geometry_to_xyz (const CwChairGeometry *g, const char *comment);
/* Writes the XYZ text atomically (temporary file, rename). */
gboolean cw_chair_geometry_save_xyz (const CwChairGeometry *g, const char *comment, const char *path, GError **error);
/* clang-format on */

G_END_DECLS
