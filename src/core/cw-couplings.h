#pragma once

#include "cw-geometry.h"
#include "cw-thermo.h"

G_BEGIN_DECLS

/* Vicinal ³J(H,H) couplings of the ring protons in each chair, from the torsion angles of the
 * idealised chairs (cw-geometry.h) and the generalised Karplus equation of Haasnoot, de Leeuw &
 * Altona (Tetrahedron 1980, 36, 2783) with its electronegativity corrections; population-weighted
 * averages; first-order multiplets; and the inverse (populations from a measured coupling).
 *
 * Sign convention of ξ (the substituent orientation): for a substituent S on carbon Ca of the
 * fragment Ha–Ca–Cb–Hb, ξ = sign(((Ha − Ca) × (S − Ca)) · (Cb − Ca)), i.e. +1 when S lies at +120°
 * from Ha by a right-handed turn about Ca→Cb. With P5 < 0 this gives the largest lowering of a
 * gauche coupling when S is anti-periplanar to Hb (the Booth effect), which reproduces
 * J(ax,eq) > J(eq,eq) in cyclohexane. Torsions follow the IUPAC sign convention. */

#define CW_MAX_RING_PROTONS (CW_RING_SIZE * 2)
#define CW_MAX_VICINAL (CW_RING_SIZE * 4)
#define CW_MAX_ALPHA_SUBS 4
#define CW_MULTIPLET_MAX 8
#define CW_KARPLUS_BY_COUNT "by-substituents" /* pick the set fitted to the fragment's substituent count */

/* One non-H α-substituent of an H–C–C–H fragment and its Karplus correction. */
typedef struct
{
  int       position;    /* ring carbon it is bonded to */
  int       sub;         /* molecule substituent index, or -1 when it is a ring carbon */
  int       ring_carbon; /* when sub == -1: the ring carbon's number, else 0 */
  CwElement element;
  double    delta_chi;  /* Δχ(α) − P7 Σ Δχ(β) */
  int       xi[2];      /* ±1 in chair 1 and chair 2 */
  gboolean  beta_known; /* FALSE when the group's fragment could not be read (β terms left out) */
} CwKarplusSubstituent;

typedef struct
{
  int                  proton_a; /* indexes into CwCouplings.protons; a is on the lower-numbered carbon of the bond */
  int                  proton_b;
  double               torsion[2]; /* H–C–C–H, degrees, in chair 1 and chair 2 */
  double               j[2];       /* Hz */
  double               j_avg;      /* population-weighted */
  CwKarplusSubstituent subs[CW_MAX_ALPHA_SUBS];
  int                  n_subs;
  const CwKarplusSet  *set;
} CwVicinalCoupling;

/* A first-order multiplet: the pattern ("s", "d", "t", "dd", "tt", "td", "ddd", "m", ...) and its
 * distinct couplings, largest first, in Hz (magnitudes). */
typedef struct
{
  char   pattern[16];
  double j[CW_MULTIPLET_MAX];
  int    n_j;
} CwMultiplet;

typedef struct
{
  int         position; /* ring carbon 1..6 */
  CwFace      face;
  gboolean    axial[2];   /* in chair 1, chair 2 */
  int         vicinal[4]; /* indexes into CwCouplings.vicinal */
  int         n_vicinal;
  int         geminal;  /* the other proton on the same carbon, or -1 */
  double      width[2]; /* sum of the vicinal couplings, Hz, per chair */
  double      width_avg;
  CwMultiplet multiplet[3]; /* chair 1, chair 2, averaged; the geminal 2J is included */
} CwRingProton;

/* A plain value filled by cw_couplings_compute (no allocation, nothing to free; about 11 kB, so
 * heap-allocate it in UI code). Its strings and set pointers borrow from the CwGeometryData,
 * which must outlive it. */
typedef struct
{
  double            temperature; /* K, as given */
  double            pop[2];      /* as given */
  CwChairGeometry   geometry[2];
  CwRingProton      protons[CW_MAX_RING_PROTONS];
  int               n_protons;
  CwVicinalCoupling vicinal[CW_MAX_VICINAL];
  int               n_vicinal;
  double            geminal; /* 2J used for ring CH2 protons, Hz */
  const char       *geminal_source;
  const char       *set_request;      /* the set id used (the table's default when none was asked), or CW_KARPLUS_BY_COUNT */
  gboolean          fragment_unknown; /* some substituent's β-atoms are unknown (its corrections are rougher) */
} CwCouplings;

typedef enum
{
  CW_INVERSE_OK,         /* populations found strictly between 0 and 1 */
  CW_INVERSE_ONE_CHAIR,  /* at or just beyond one chair's value, within the tolerance */
  CW_INVERSE_OUTSIDE,    /* beyond what the two chairs can produce */
  CW_INVERSE_INSENSITIVE /* the chairs give nearly the same value: the measurement cannot decide */
} CwInverseStatus;

typedef struct
{
  CwInverseStatus status;
  double          observed;       /* Hz */
  double          chair_value[2]; /* the coupling (or width) in the pure chairs, Hz */
  double          pop[2];         /* solved populations; NaN when OUTSIDE or INSENSITIVE */
  double          delta_g;        /* G(chair 2) − G(chair 1), kcal/mol; NaN unless OK */
  double          low, high;      /* the range the chairs span, Hz */
  double          tolerance;      /* Hz, from the table */
} CwInverseResult;

/* clang-format off */
/* One coupling from the equation: phi in degrees; delta_chi[i] and xi[i] for n substituents. */
double   cw_karplus_coupling (const CwKarplusSet *set, double phi, const double *delta_chi, const int *xi, int n);

/* Builds both chairs and every ring-proton coupling. pop are the chair populations at
 * temperature (from cw_analyze); set_id is a set id of the table, CW_KARPLUS_BY_COUNT, or NULL for
 * the table's default. Fails for an unknown set id or a molecule the geometry cannot hold. */
gboolean cw_couplings_compute (const CwGeometryData *gd,
                               const CwMolecule     *mol,
                               const double          pop[2],
                               double                temperature,
                               const char           *set_id,
                               CwCouplings          *out,
                               GError              **error);
/* Index of the proton on (position, face), or -1 when that slot carries a substituent. */
int      cw_couplings_find_proton  (const CwCouplings *c, int position, CwFace face);
/* Index of the vicinal coupling between two protons, or -1 when they are not vicinal. */
int      cw_couplings_find_vicinal (const CwCouplings *c, int proton_a, int proton_b);
/* "H-1 up" style label. Newly allocated. */
char    *cw_ring_proton_dup_label  (const CwRingProton *p);
/* Parses "1u", "1d", "1" (the only proton of carbon 1), "H1u", "1up", "1 down" into an index. */
int      cw_couplings_parse_proton (const CwCouplings *c, const char *text, GError **error);

/* Names a first-order multiplet: couplings below min_resolved are dropped, and couplings within
 * tolerance of the largest in their group are read as equal. */
void     cw_multiplet_build    (const double *j, int n, double tolerance, double min_resolved, CwMultiplet *out);
/* "tt, 11.6, 4.1 Hz"; "s" when nothing is resolved. Newly allocated. */
char    *cw_multiplet_dup_text (const CwMultiplet *m);

/* The averaged-coupling method: observed = x1·J(chair 1) + x2·J(chair 2). partner is a proton
 * index for a vicinal coupling, or -1 to use the proton's width (sum of vicinal couplings).
 * Fails only for bad arguments (not vicinal, not finite, negative); an impossible value gives
 * status CW_INVERSE_OUTSIDE. */
gboolean cw_couplings_solve (const CwGeometryData *gd,
                             const CwCouplings    *c,
                             int                   proton,
                             int                   partner,
                             double                observed,
                             CwInverseResult      *out,
                             GError              **error);
const char *cw_inverse_status_to_string (CwInverseStatus status); /* stable: "ok", "one-chair", "outside", "insensitive" */
/* A plain-language sentence about the result (Hz, populations, ΔG° in the unit). Newly allocated. */
char    *cw_inverse_dup_message (const CwInverseResult *r, CwEnergyUnit unit);
/* clang-format on */

G_END_DECLS
