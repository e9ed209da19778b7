#pragma once

#include "cw-molecule.h"

G_BEGIN_DECLS

typedef struct
{
  int elements[CW_N_ELEMENTS];
  int charge;
  double molar_mass;     /* g/mol, IUPAC standard atomic weights (abridged, 2021) */
  double unsaturation;   /* degrees of unsaturation (rings + pi bonds) */
} CwFormula;

void   cw_formula_compute (const CwMolecule *mol, CwFormula *out);
char  *cw_formula_dup_string (const CwFormula *f);        /* Hill order, "C8H16" */
char  *cw_formula_dup_markup (const CwFormula *f);        /* Pango, "C<sub>8</sub>H<sub>16</sub>" */
double cw_element_mass (CwElement el);
double cw_formula_unsaturation (int c, int h, int n, int halogens);

G_END_DECLS
