#pragma once

#include "cw-groups.h"

G_BEGIN_DECLS

typedef enum
{
  CW_PAIR_SYN_AXIAL, /* total X/Y contact across a syn-1,3-diaxial pair, U(X,Y) */
  CW_PAIR_GAUCHE,    /* vicinal gauche X/Y term, g(X,Y) */
  CW_PAIR_GEMINAL,   /* correction added to the chair in which group b is axial */
  CW_N_PAIR_KINDS
} CwPairKind;

/* One tabulated pair term. a and b are group ids or "class:NAME". */
typedef struct
{
  CwPairKind kind;
  char *a;
  char *b;
  double value;   /* kcal/mol */
  double sigma;
  char *source;
  char *note;     /* optional, e.g. "aqueous scheme" */
} CwPairEntry;

/* A level on the ring-inversion profile, relative to the unstrained chair. */
typedef struct
{
  double g;       /* kcal/mol */
  double sigma;
  char *source;
} CwRingLevel;

typedef struct
{
  CwRingLevel half_chair;   /* chair -> chair barrier, dG‡ */
  CwRingLevel twist_boat;
  CwRingLevel boat;
  double twist_boat_margin; /* flag when the better chair comes this close, kcal/mol */
  char *twist_boat_margin_source;
} CwRingEnergetics;

/* The documented fall-back rules for pairs no table entry covers (a model choice, no source). */
typedef struct
{
  double syn_axial_scale;   /* U(X,Y) ≈ scale · sqrt(A(X)·A(Y)) */
  double gauche_scale;      /* g(X,Y) ≈ scale · sqrt(A(X)·A(Y)) */
  double relative_sigma;    /* σ as a fraction of the estimate */
  double min_sigma;         /* kcal/mol */
  char *rule;               /* the rule in words, shown as the term's source */
} CwFallbackRules;

typedef struct _CwInteractionTable CwInteractionTable;

CwInteractionTable *cw_interaction_table_new_from_file (const char *path, GError **error);
CwInteractionTable *cw_interaction_table_new_from_data (const char *data, gsize len, const char *name, GError **error);
void                cw_interaction_table_free          (CwInteractionTable *table);
guint               cw_interaction_table_get_n_entries (const CwInteractionTable *table);
const CwPairEntry  *cw_interaction_table_get_entry     (const CwInteractionTable *table, guint i);
const CwRingEnergetics *cw_interaction_table_get_ring  (const CwInteractionTable *table);
const CwFallbackRules  *cw_interaction_table_get_fallback (const CwInteractionTable *table);
/* The most specific entry for the pair (id/id, then id/class, then class/class), or NULL.
 * For CW_PAIR_GEMINAL the order matters: *swapped is set when the entry names (y, x). */
const CwPairEntry  *cw_interaction_table_find (const CwInteractionTable *table,
                                               CwPairKind kind,
                                               const CwGroup *x,
                                               const CwGroup *y,
                                               gboolean *swapped);
const char         *cw_pair_kind_to_string (CwPairKind kind);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwInteractionTable, cw_interaction_table_free)

G_END_DECLS
