#pragma once

#include "cw-analysis.h"

G_BEGIN_DECLS

/* The cis/trans (relative-configuration) isomers of one constitution and their balance.
 *
 * Each isomer's conformer-averaged free energy is G = −RT ln Σᵢ exp(−Gᵢ/RT), the sum running over
 * its distinct chair species. Reference: Gᵢ are the chair energies of cw_analyze, kcal/mol above
 * an unstrained chair of the same constitution with every group equatorial and no pair terms, so
 * G values of isomers of one constitution can be compared directly.
 * Counting: a chair species is a chair of one absolute configuration, up to rotation. A chiral
 * isomer stands for both enantiomers (a racemate), so it has up to four species; the two chairs
 * of an achiral isomer are two species when they differ or are mirror images of each other, one
 * when they are superimposable. Rotational symmetry numbers and vibrational terms are not
 * included. Equilibrium fractions (for isomers that interconvert, e.g. by epimerisation) are
 * xⱼ = exp(−Gⱼ/RT) / Σₖ exp(−Gₖ/RT). */

typedef struct
{
  CwMolecule *molecule;          /* owned; numbered so that the first group is on C1, up */
  char       *smiles;            /* canonical isomeric SMILES */
  char       *configuration;     /* "cis", "trans", "r-1,c-3,t-4" or "" */
  CwAnalysis  analysis;          /* at the set's temperature */
  gboolean    chiral;            /* the isomer is not superimposable on its mirror image */
  int         n_species;         /* distinct chair species counted, 1–4 */
  double      species_energy[4]; /* their energies, kcal/mol */
  double      g;                 /* conformer-averaged free energy, kcal/mol */
  double      h_mean;            /* population-weighted mean chair energy (enthalpy-like), kcal/mol */
  double      g_rel;             /* g − the lowest g of the set */
  double      h_rel;             /* h_mean − the lowest h_mean of the set */
  double      fraction;          /* equilibrium fraction among the isomers */
} CwIsomer;

typedef struct
{
  double     temperature;
  CwSolvent  solvent;
  GPtrArray *isomers;          /* CwIsomer*, owned, sorted by g */
  int        n_stereo_carbons; /* carbons with one group or two different groups */
} CwIsomerSet;

/* Faces of constitution are ignored; every relative configuration is listed once. */
CwIsomerSet *cw_isomers_enumerate (const CwData *data, const CwMolecule *constitution, const CwConditions *cond, GError **error);
void         cw_isomer_set_free (CwIsomerSet *set);
/* Index of the isomer with the relative configuration of mol (either enantiomer), or -1. Compare
 * configurations with this, not with SMILES: a chiral isomer is listed by one enantiomer. */
int cw_isomer_set_find (const CwIsomerSet *set, const CwMolecule *mol);
/* The reference and the counting rules above, in plain words, for output. */
const char *cw_isomers_method_text (void);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwIsomerSet, cw_isomer_set_free)

G_END_DECLS
