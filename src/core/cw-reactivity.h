#pragma once

#include "cw-geometry.h"

G_BEGIN_DECLS

/* Reaction geometry in the two chairs: which β-hydrogens are anti-periplanar to each leaving
 * group (an E2 needs them trans-diaxial in a cyclohexane), the fraction of molecules in a chair
 * that can react (Curtin–Hammett / Winstein–Holness: with fast ring inversion the rate is
 * Σ x(chair)·k(chair); taking k equal for every chair that has the anti-periplanar arrangement and
 * zero otherwise, the rate goes with the reactive fraction), which alkenes can form, and which
 * vicinal pairs of groups can become anti-periplanar (trans-diaxial participation, anti
 * elimination of X–Y). Geometry from cw-geometry.h; torsions |φ| ≥ the table's threshold count as
 * anti-periplanar. Epoxides and other fused rings cannot be drawn in this model. */

#define CW_MAX_LEAVING 6
#define CW_MAX_ALKENES 4
#define CW_MAX_ANTI_PAIRS 12
#define CW_MAX_REACT_WARNINGS 16

typedef struct
{
  int      position;  /* β ring carbon */
  CwFace   face;      /* face of the β-hydrogen */
  int      atom;      /* its atom index in the chair geometry */
  double   torsion;   /* LG–Cα–Cβ–H, degrees */
  gboolean deuterium; /* the slot carries the deuterio group: an anti E2 would lose D */
} CwAntiHydrogen;

typedef struct
{
  int      position_a;       /* Cα (the leaving group's carbon) */
  int      position_b;       /* Cβ ring carbon; 0 for an exocyclic alkene */
  int      exo_sub;          /* for an exocyclic alkene: the geminal substituent that loses H; else -1 */
  int      substitution;     /* non-H substituents on the two alkene carbons: 2 di, 3 tri, 4 tetra */
  gboolean chair_ok[2];      /* an anti-periplanar β-H for this alkene exists in chair 1 / 2 */
  double   fraction;         /* population fraction in chairs that can give it */
  gboolean most_substituted; /* the most substituted of the possible alkenes (Zaitsev) */
} CwAlkene;

typedef struct
{
  int            sub; /* molecule substituent index */
  int            position;
  gboolean       axial[2];
  CwAntiHydrogen anti[2][2]; /* per chair, up to two anti-periplanar β-H (ring) */
  int            n_anti[2];
  gboolean       exo_anti;                /* a geminal alkyl group's H can always turn anti */
  gboolean       reactive[2];             /* chair has the leaving group anti to a β-H */
  double         reactive_fraction;       /* Σ pop over reactive chairs */
  CwAlkene       alkenes[CW_MAX_ALKENES]; /* the possible E2 alkenes */
  int            n_alkenes;
  gboolean       no_anti_h; /* neither chair has an anti-periplanar β-H */
} CwLeavingGroup;

typedef enum
{
  CW_ANTI_PARTICIPATION,  /* a leaving group with a lone-pair neighbour trans on the next carbon */
  CW_ANTI_ELIMINATION_XY, /* two leaving groups trans-vicinal: anti elimination of X–Y */
  CW_ANTI_PAIR            /* any other trans-vicinal heteroatom pair that can be anti-periplanar */
} CwAntiPairRole;

typedef struct
{
  int            sub_a; /* the leaving group (for participation), or the lower position */
  int            sub_b;
  CwAntiPairRole role;
  gboolean       anti[2];    /* diaxial (anti-periplanar) in chair 1 / chair 2 */
  double         torsion[2]; /* X–C–C–Y, degrees */
  double         fraction;   /* population fraction with the pair anti-periplanar */
} CwAntiPair;

typedef enum
{
  CW_REACT_NO_LEAVING_GROUP, /* nothing in the molecule is marked as a leaving group */
  CW_REACT_NO_ANTI_H,        /* sub: no anti-periplanar β-H in either chair */
  CW_REACT_MINOR_CHAIR,      /* sub: reacts only through a chair of population < 50% */
  CW_REACT_CIS_NEIGHBOUR,    /* sub_a, sub_b: a cis neighbouring group cannot become anti */
  CW_REACT_GEMINAL_LEAVING,  /* sub: a tertiary centre (geminal partner): E1/SN1 may compete */
  CW_N_REACT_WARNINGS
} CwReactWarningCode;

typedef struct
{
  CwReactWarningCode code;
  int                sub_a;
  int                sub_b; /* -1 when none */
  double             value; /* e.g. the reactive fraction */
} CwReactWarning;

/* A plain value filled by cw_reactivity_compute (no allocation, nothing to free). Substituent
 * indexes refer to the molecule passed in; atom indexes to geometry[chair] (use them to highlight
 * the anti-periplanar hydrogens on a chair drawing). */
typedef struct
{
  double          temperature;
  double          pop[2];
  double          anti_min; /* degrees, from the table */
  CwChairGeometry geometry[2];
  CwLeavingGroup  groups[CW_MAX_LEAVING];
  int             n_groups;
  CwAntiPair      pairs[CW_MAX_ANTI_PAIRS];
  int             n_pairs;
  CwReactWarning  warnings[CW_MAX_REACT_WARNINGS];
  int             n_warnings;
} CwReactivity;

/* clang-format off */
/* pop: chair populations at temperature (from cw_analyze). */
gboolean    cw_reactivity_compute (const CwGeometryData *gd,
                                   const CwMolecule     *mol,
                                   const double          pop[2],
                                   double                temperature,
                                   CwReactivity         *out,
                                   GError              **error);
/* "C1=C2 (trisubstituted)" or "exocyclic C1=C (from Me)". Newly allocated. */
char       *cw_alkene_dup_label (const CwAlkene *alkene, const CwMolecule *mol);
const char *cw_react_warning_code_to_string (CwReactWarningCode code); /* stable, e.g. "no-anti-h" */
char       *cw_react_warning_dup_message (const CwReactWarning *w, const CwMolecule *mol);
const char *cw_anti_pair_role_to_string (CwAntiPairRole role);        /* stable, e.g. "participation" */
/* clang-format on */

G_END_DECLS
