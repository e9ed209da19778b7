#pragma once

#include "cw-data.h"
#include "cw-molecule.h"
#include "cw-thermo.h"

G_BEGIN_DECLS

#define CW_MAX_TERMS 64
#define CW_MAX_FLAGS 32

typedef enum
{
  CW_SOLVENT_APROTIC,
  CW_SOLVENT_PROTIC
} CwSolvent;

typedef struct
{
  double temperature; /* K */
  CwSolvent solvent;
} CwConditions;

typedef enum
{
  CW_TERM_AXIAL,     /* A(X) of an axial group */
  CW_TERM_SYN_AXIAL, /* U(X,Y) − A(X)/2 − A(Y)/2 for a syn-1,3-diaxial pair */
  CW_TERM_GAUCHE,    /* g(X,Y) for a vicinal gauche pair */
  CW_TERM_GEMINAL    /* tabulated correction for two groups on one carbon */
} CwTermKind;

typedef struct
{
  CwTermKind kind;
  int sub_a;          /* index into the molecule's subs */
  int sub_b;          /* -1 for CW_TERM_AXIAL */
  double energy;      /* kcal/mol at the analysis temperature, in this chair */
  double sigma;       /* kcal/mol */
  const char *source; /* borrowed from the tables */
  gboolean estimated; /* from the fall-back rule: no published value */
  gboolean temperature_dependent; /* from dH and dS */
} CwTerm;

typedef struct
{
  gboolean axial[CW_MAX_SUBS]; /* per molecule substituent */
  CwTerm terms[CW_MAX_TERMS];
  int n_terms;
  double energy;               /* kcal/mol above an unstrained chair */
} CwChair;

typedef enum
{
  CW_FLAG_IDENTICAL_CHAIRS,   /* the two chairs are superimposable: K = 1 */
  CW_FLAG_MIRROR_CHAIRS,      /* the two chairs are mirror images: K = 1 */
  CW_FLAG_TWIST_BOAT,         /* the better chair comes near the twist-boat */
  CW_FLAG_POLAR_VICINAL,      /* vicinal polar pair: additivity fails */
  CW_FLAG_DIHALIDE_1_4,       /* 1,4-dihalide: additivity fails */
  CW_FLAG_GEMINAL_NONADDITIVE,/* geminal pair with aryl or branched group, no tabulated correction */
  CW_FLAG_HBOND_1_3,          /* syn-1,3-diaxial donor/acceptor pair may hydrogen-bond */
  CW_FLAG_ESTIMATED_TERM,     /* a pair term came from the fall-back rule */
  CW_FLAG_CONSTANT_A,         /* some A-values are held constant with temperature */
  CW_FLAG_SOLVENT_SENSITIVE,  /* a group whose A-value depends on solvent */
  CW_FLAG_CUSTOM_GROUP,       /* a user-defined value is in play */
  CW_FLAG_NO_SUBSTITUENTS,
  CW_N_FLAGS
} CwFlagCode;

typedef struct
{
  CwFlagCode code;
  int sub_a;    /* -1 when none */
  int sub_b;
  double value; /* e.g. the twist-boat estimate (kcal/mol), the number of estimated pairs */
} CwFlag;

typedef struct
{
  double temperature;
  CwSolvent solvent;
  CwChair chair[2];
  double delta_g;        /* G(chair 2) − G(chair 1), kcal/mol */
  double sigma;          /* of delta_g, root-sum-square over the distinct parameters */
  double K;              /* [chair 2]/[chair 1] */
  double pop[2];         /* fractions */
  double pop_low[2];     /* fraction interval for delta_g ± 2 sigma */
  double pop_high[2];
  int major;             /* 0 or 1; 0 when equal */
  double twist_boat;     /* estimate for the twist-boat, kcal/mol above an unstrained chair */
  double barrier;        /* half-chair estimate above the lower chair, kcal/mol */
  double k_forward;      /* chair 1 -> chair 2, 1/s */
  double k_reverse;
  CwFlag flags[CW_MAX_FLAGS];
  int n_flags;
} CwAnalysis;

/* Fills *out; never allocates. Returns FALSE (with error) only for a molecule the model
 * cannot hold (e.g. a carbon with three groups) or an out-of-range temperature. */
gboolean    cw_analyze (const CwData *data,
                        const CwMolecule *mol,
                        const CwConditions *cond,
                        CwAnalysis *out,
                        GError **error);
/* The same without the ring-inversion rate constants (k_forward and k_reverse are NAN) and
 * without the itemised terms (each chair's n_terms is 0; its energy is set): what a batch of
 * compounds needs. */
gboolean    cw_analyze_equilibrium (const CwData *data,
                                    const CwMolecule *mol,
                                    const CwConditions *cond,
                                    CwAnalysis *out,
                                    GError **error);
/* A(X) at T in the given solvent, with its sigma; *from_thermo tells whether dH/dS were used. */
double      cw_group_a_value (const CwGroup *group, double t_kelvin, CwSolvent solvent, double *sigma, gboolean *from_thermo);
gboolean    cw_analysis_has_flag (const CwAnalysis *an, CwFlagCode code);
const char *cw_flag_code_to_string (CwFlagCode code);  /* stable, e.g. "twist-boat-competes" */
char       *cw_flag_dup_message (const CwFlag *flag, const CwMolecule *mol, CwEnergyUnit unit);
const char *cw_term_kind_to_string (CwTermKind kind);  /* stable, e.g. "syn-1,3-diaxial" */
char       *cw_term_dup_label (const CwTerm *term, const CwMolecule *mol); /* "Me(1) axial" */
const char *cw_solvent_to_string (CwSolvent solvent);
gboolean    cw_solvent_from_string (const char *s, CwSolvent *solvent);

/* Caution that goes with every result. */
const char *cw_caution_text (void);

G_END_DECLS
