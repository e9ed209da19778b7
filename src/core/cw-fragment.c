#include "config.h"

#include "cw-fragment.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"

/* A reader for the small SMILES fragments of the group table: enough of the grammar (organic
 * subset, bracket atoms, bonds, branches, ring closures) to find the first atom's neighbours and
 * hydrogens. Fragments are short; fixed-size arrays keep it allocation-free. */

#define MAX_ATOMS 64
#define MAX_BONDS 80

typedef struct
{
  CwElement el;
  gboolean  aromatic;
  gboolean  bracket;
  int       bracket_h;
} Atom;

typedef struct
{
  int    a, b;
  double order;
} Bond;

typedef struct
{
  Atom atoms[MAX_ATOMS];
  int  n_atoms;
  Bond bonds[MAX_BONDS];
  int  n_bonds;
} Graph;

static gboolean
symbol_to_element (const char *s, gsize len, CwElement *el)
{
  char buf[4] = { 0 };

  if (len == 0 || len > 2)
    return FALSE;
  memcpy (buf, s, len);
  buf[0] = g_ascii_toupper (buf[0]);
  for (int i = 0; i < CW_N_ELEMENTS; i++)
    if (strcmp (cw_element_symbol ((CwElement) i), buf) == 0)
      {
        *el = (CwElement) i;
        return TRUE;
      }
  return FALSE;
}

static gboolean
fail (GError **error, const char *smiles, const char *p, const char *what)
{
  g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
               _("SMILES fragment “%s”: %s at character %d"), smiles, what, (int) (p - smiles) + 1);
  return FALSE;
}

/* Reads one atom at *pp into a; advances *pp. */
static gboolean
read_atom (const char *smiles, const char **pp, Atom *a, GError **error)
{
  const char *p = *pp;

  memset (a, 0, sizeof *a);
  if (*p == '[')
    {
      const char *start;
      int         isotope = 0;

      p++;
      while (g_ascii_isdigit (*p))
        {
          if (isotope < 1000) /* mass numbers are at most three digits; never overflow */
            isotope = isotope * 10 + (*p - '0');
          p++;
        }
      start = p;
      if (g_ascii_islower (*p))
        a->aromatic = TRUE, p++;
      else if (g_ascii_isupper (*p))
        {
          p++;
          if (g_ascii_islower (*p) && *p != 'h')
            p++;
        }
      if (!symbol_to_element (start, p - start, &a->el))
        return fail (error, smiles, start, _("an element this reader does not cover"));
      if (a->el == CW_EL_H && isotope == 2)
        a->el = CW_EL_D;
      while (*p == '@')
        p++;
      if (*p == 'H')
        {
          p++;
          a->bracket_h = 1;
          if (g_ascii_isdigit (*p))
            a->bracket_h = *p++ - '0';
        }
      while (*p && *p != ']')
        p++; /* charge and atom class do not matter here */
      if (*p != ']')
        return fail (error, smiles, p, _("an unclosed bracket atom"));
      a->bracket = TRUE;
      *pp = p + 1;
      return TRUE;
    }
  if ((p[0] == 'C' && p[1] == 'l') || (p[0] == 'B' && p[1] == 'r'))
    {
      symbol_to_element (p, 2, &a->el);
      *pp = p + 2;
      return TRUE;
    }
  if (strchr ("CNOSFI", *p) != NULL || strchr ("cnos", *p) != NULL)
    {
      a->aromatic = g_ascii_islower (*p);
      symbol_to_element (p, 1, &a->el);
      *pp = p + 1;
      return TRUE;
    }
  return fail (error, smiles, p, _("an atom this reader does not cover"));
}

static gboolean
add_bond (Graph *g, int a, int b, double order, int pending)
{
  if (g->n_bonds >= MAX_BONDS)
    return FALSE;
  if (pending > 0)
    order = pending;
  else if (g->atoms[a].aromatic && g->atoms[b].aromatic)
    order = 1.5;
  g->bonds[g->n_bonds++] = (Bond){ a, b, order };
  return TRUE;
}

static gboolean
parse_graph (const char *smiles, Graph *g, GError **error)
{
  int         stack[MAX_ATOMS], depth = 0, prev = -1, pending = 0;
  int         ring_open[100], ring_pending[100];
  const char *p = smiles;

  for (int i = 0; i < 100; i++)
    ring_open[i] = -1;
  while (*p)
    {
      if (*p == '(' || *p == ')')
        {
          if (*p == '(' && (prev < 0 || depth >= MAX_ATOMS))
            return fail (error, smiles, p, _("a misplaced branch"));
          if (*p == ')' && depth == 0)
            return fail (error, smiles, p, _("an unmatched “)”"));
          if (*p == '(')
            stack[depth++] = prev;
          else
            prev = stack[--depth];
          p++;
        }
      else if (strchr ("-=#:/\\", *p) != NULL)
        pending = (*p == '=') ? 2 : (*p == '#') ? 3
                                                : 1,
        p++;
      else if (g_ascii_isdigit (*p) || *p == '%')
        {
          int label = *p - '0';
          if (*p == '%')
            {
              if (!g_ascii_isdigit (p[1]) || !g_ascii_isdigit (p[2]))
                return fail (error, smiles, p, _("a bad ring-closure number"));
              label = (p[1] - '0') * 10 + (p[2] - '0');
              p += 2;
            }
          p++;
          if (prev < 0)
            return fail (error, smiles, p - 1, _("a ring closure before any atom"));
          if (ring_open[label] >= 0)
            {
              if (!add_bond (g, ring_open[label], prev, 1.0, pending ? pending : ring_pending[label]))
                return fail (error, smiles, p, _("too many bonds"));
              ring_open[label] = -1;
            }
          else
            ring_open[label] = prev, ring_pending[label] = pending;
          pending = 0;
        }
      else
        {
          if (g->n_atoms >= MAX_ATOMS)
            return fail (error, smiles, p, _("too many atoms"));
          if (!read_atom (smiles, &p, &g->atoms[g->n_atoms], error))
            return FALSE;
          if (prev >= 0 && !add_bond (g, prev, g->n_atoms, 1.0, pending))
            return fail (error, smiles, p, _("too many bonds"));
          prev = g->n_atoms++;
          pending = 0;
        }
    }
  if (g->n_atoms == 0)
    return fail (error, smiles, p, _("no atom"));
  if (depth != 0)
    return fail (error, smiles, p, _("an unclosed branch"));
  for (int i = 0; i < 100; i++)
    if (ring_open[i] >= 0)
      return fail (error, smiles, p, _("an unclosed ring"));
  return TRUE;
}

static int
implicit_hydrogens (CwElement el, double bond_sum)
{
  static const int carbon[] = { 4 }, nitrogen[] = { 3, 5 }, oxygen[] = { 2 },
                   sulfur[] = { 2, 4, 6 }, halogen[] = { 1 };
  const int *v;
  int        n, s = (int) floor (bond_sum + 0.01);

  switch (el)
    {
    case CW_EL_C:
      v = carbon, n = 1;
      break;
    case CW_EL_N:
      v = nitrogen, n = 2;
      break;
    case CW_EL_O:
      v = oxygen, n = 1;
      break;
    case CW_EL_S:
      v = sulfur, n = 3;
      break;
    case CW_EL_F:
    case CW_EL_CL:
    case CW_EL_BR:
    case CW_EL_I:
      v = halogen, n = 1;
      break;
    case CW_EL_H:
    case CW_EL_D:
    case CW_EL_HG:
    case CW_EL_SI:
    case CW_EL_SN:
    case CW_N_ELEMENTS:
    default:
      return 0;
    }
  for (int i = 0; i < n; i++)
    if (v[i] >= s)
      return v[i] - s;
  return 0;
}

gboolean
cw_fragment_parse (const char *smiles, CwFragmentInfo *out, GError **error)
{
  Graph  g;
  double sum = 1.0; /* the bond to the ring carbon */
  int    explicit_h = 0;

  g_return_val_if_fail (smiles != NULL && out != NULL, FALSE);
  memset (&g, 0, sizeof g);
  memset (out, 0, sizeof *out);
  if (!parse_graph (smiles, &g, error))
    return FALSE;
  out->first_atom = g.atoms[0].el;
  for (int i = 0; i < g.n_bonds; i++)
    {
      const Bond *b = &g.bonds[i];
      int         other = (b->a == 0) ? b->b : (b->b == 0) ? b->a
                                                           : -1;
      CwElement   el;

      if (other < 0)
        continue;
      sum += b->order;
      el = g.atoms[other].el;
      if (el == CW_EL_H || el == CW_EL_D)
        explicit_h++;
      else if (out->n_neighbours < CW_FRAGMENT_MAX_NEIGHBOURS)
        out->neighbours[out->n_neighbours++] = el;
    }
  if (g.atoms[0].bracket)
    out->n_hydrogens = g.atoms[0].bracket_h + explicit_h;
  else
    out->n_hydrogens = implicit_hydrogens (out->first_atom, sum) + explicit_h;
  out->from_smiles = TRUE;
  return TRUE;
}

void
cw_fragment_info (const CwGroup *group, CwFragmentInfo *out)
{
  g_return_if_fail (group != NULL && out != NULL);
  /* The table may write deuterium's first atom as H: H and D are the same atom here. */
  if (group->smiles != NULL && *group->smiles != '\0' && cw_fragment_parse (group->smiles, out, NULL) &&
      (out->first_atom == group->first_atom ||
       ((out->first_atom == CW_EL_D || out->first_atom == CW_EL_H) &&
        (group->first_atom == CW_EL_D || group->first_atom == CW_EL_H))))
    return;
  memset (out, 0, sizeof *out);
  out->first_atom = group->first_atom;
}
