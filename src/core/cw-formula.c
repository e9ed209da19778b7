#include "config.h"

#include "cw-formula.h"

#include <string.h>

/* IUPAC/CIAAW abridged standard atomic weights (2021 table); D is the nuclide mass of 2H. */
static const double element_mass[CW_N_ELEMENTS] = {
  [CW_EL_C] = 12.011,  [CW_EL_H] = 1.008,   [CW_EL_D] = 2.01410177812,
  [CW_EL_BR] = 79.904, [CW_EL_CL] = 35.45,  [CW_EL_F] = 18.998,
  [CW_EL_HG] = 200.59, [CW_EL_I] = 126.90,  [CW_EL_N] = 14.007,
  [CW_EL_O] = 15.999,  [CW_EL_S] = 32.06,   [CW_EL_SI] = 28.085,
  [CW_EL_SN] = 118.71,
};

/* Hill order: C, H, then the rest alphabetically by symbol. */
static const CwElement hill_order[CW_N_ELEMENTS] = {
  CW_EL_C, CW_EL_H, CW_EL_BR, CW_EL_CL, CW_EL_D, CW_EL_F, CW_EL_HG,
  CW_EL_I, CW_EL_N, CW_EL_O, CW_EL_S, CW_EL_SI, CW_EL_SN,
};

double
cw_element_mass (CwElement el)
{
  g_return_val_if_fail (el < CW_N_ELEMENTS, 0);
  return element_mass[el];
}

double
cw_formula_unsaturation (int c, int h, int n, int halogens)
{
  return (2.0 * c + 2.0 + n - h - halogens) / 2.0;
}

void
cw_formula_compute (const CwMolecule *mol, CwFormula *out)
{
  int *el = out->elements;
  int tetravalent, hydrogens, halogens;

  memset (out, 0, sizeof *out);
  el[CW_EL_C] = 6;
  el[CW_EL_H] = 12;
  for (int i = 0; i < mol->n_subs; i++)
    {
      const CwGroup *g = mol->subs[i].group;
      el[CW_EL_H]--; /* the group replaces a ring hydrogen */
      for (int k = 0; k < CW_N_ELEMENTS; k++)
        out->elements[k] += g->elements[k];
      out->charge += g->charge;
    }
  for (int k = 0; k < CW_N_ELEMENTS; k++)
    out->molar_mass += el[k] * element_mass[k];
  tetravalent = el[CW_EL_C] + el[CW_EL_SI] + el[CW_EL_SN];
  /* A charge counts as a proton gained or lost, so ions give the parent's value. */
  hydrogens = el[CW_EL_H] + el[CW_EL_D] - out->charge;
  /* Divalent atoms (O, S, Hg) do not enter the count. */
  halogens = el[CW_EL_F] + el[CW_EL_CL] + el[CW_EL_BR] + el[CW_EL_I];
  out->unsaturation = cw_formula_unsaturation (tetravalent, hydrogens, el[CW_EL_N], halogens);
}

static char *
formula_string (const CwFormula *f, gboolean markup)
{
  GString *s = g_string_new (NULL);

  for (int k = 0; k < CW_N_ELEMENTS; k++)
    {
      CwElement e = hill_order[k];
      int n = f->elements[e];
      if (n <= 0)
        continue;
      g_string_append (s, cw_element_symbol (e));
      if (n > 1)
        g_string_append_printf (s, markup ? "<sub>%d</sub>" : "%d", n);
    }
  if (f->charge != 0)
    {
      const char *sign = f->charge > 0 ? "+" : "−";
      int n = ABS (f->charge);
      g_autofree char *count = n > 1 ? g_strdup_printf ("%d", n) : g_strdup ("");

      g_string_append_printf (s, markup ? "<sup>%s%s</sup>" : "%s%s", count, sign);
    }
  return g_string_free (s, FALSE);
}

char *
cw_formula_dup_string (const CwFormula *f)
{
  return formula_string (f, FALSE);
}

char *
cw_formula_dup_markup (const CwFormula *f)
{
  return formula_string (f, TRUE);
}
