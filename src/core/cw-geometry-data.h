#pragma once

#include "cw-groups.h"

G_BEGIN_DECLS

#define CW_GEOMETRY_FORMAT "chairwise-geometry"
#define CW_GEOMETRY_VERSION 1
#define CW_KARPLUS_N_PARAMS 7
#define CW_KARPLUS_MAX_SETS 8

/* A number from data/geometry.json with its provenance (borrowed from the table). */
typedef struct
{
  double      value;
  const char *source;
} CwSourcedValue;

/* One parameter set of the generalised Karplus equation of Haasnoot, de Leeuw & Altona (1980):
 * 3J = P1 cos²φ + P2 cos φ + P3 + Σ Δχi [P4 + P5 cos²(ξi φ + P6 |Δχi|)],
 * Δχi = Δχ(α) − P7 Σ Δχ(β). p[0..6] are P1..P7 (Hz, P6 in degrees). */
typedef struct
{
  const char *id; /* "general", "two", "three", "four" */
  const char *label;
  int         substituents; /* number of non-H substituents on the H–C–C–H fragment it was fitted to; 0 = any */
  double      p[CW_KARPLUS_N_PARAMS];
  const char *source;
} CwKarplusSet;

/* Everything the 3D, couplings and reactivity analyses read from the table. Loaded once;
 * all strings are owned by the table. */
typedef struct
{
  CwSourcedValue cc_bond;  /* ring C–C, Å */
  CwSourcedValue ch_axial; /* ring C–H, Å */
  CwSourcedValue ch_equatorial;
  CwSourcedValue ccc_angle;       /* degrees */
  CwSourcedValue ring_torsion;    /* degrees; checked against the D3d value from ccc_angle */
  CwSourcedValue exocyclic_angle; /* angle between the two exocyclic bonds of a ring carbon */
  gboolean       has_bond[CW_N_ELEMENTS];
  CwSourcedValue bond[CW_N_ELEMENTS]; /* ring C – first atom of a substituent, Å */
  gboolean       has_electronegativity[CW_N_ELEMENTS];
  CwSourcedValue electronegativity[CW_N_ELEMENTS]; /* Huggins scale where available */
  CwKarplusSet   sets[CW_KARPLUS_MAX_SETS];
  int            n_sets;
  int            default_set;
  const char    *xi_convention;
  CwSourcedValue geminal;                     /* 2J of a ring CH2, Hz */
  CwSourcedValue anti_periplanar_min;         /* degrees */
  CwSourcedValue multiplet_tolerance;         /* Hz */
  CwSourcedValue resolved_min;                /* Hz */
  CwSourcedValue inverse_tolerance;           /* Hz */
  CwSourcedValue inverse_min_spread;          /* Hz */
  gboolean       neighbouring[CW_N_ELEMENTS]; /* first atoms that can act as neighbouring groups */
  const char    *neighbouring_source;
  /* private */
  void *json;
} CwGeometryData;

/* clang-format off */
CwGeometryData *cw_geometry_data_new_from_data (const char *data, gsize len, const char *name, GError **error);
CwGeometryData *cw_geometry_data_new_from_file (const char *path, GError **error);
/* geometry.json from dir; NULL means cw_data_find_dir (). */
CwGeometryData *cw_geometry_data_new_from_dir  (const char *dir, GError **error);
void            cw_geometry_data_free          (CwGeometryData *gd);
/* By id; NULL id gives the default set. NULL when unknown. */
const CwKarplusSet *cw_geometry_data_find_set  (const CwGeometryData *gd, const char *id);
/* Electronegativity of an element; falls back to carbon's for an element without a value. */
double          cw_geometry_data_electronegativity (const CwGeometryData *gd, CwElement el);
/* clang-format on */

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwGeometryData, cw_geometry_data_free)

G_END_DECLS
