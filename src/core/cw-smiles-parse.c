/* cw-smiles-parse.c: OpenSMILES text to the internal graph (cw-smiles-private.h).
 *
 * Reads the organic subset and bracket atoms (isotope, element, @/@@ and @TH1/@TH2, H count,
 * charge, atom class), bonds - = # $ : / \ (the last two as single bonds), branches, ring bonds
 * 0-9 and %nn, and '.' between disconnected parts. Every error names the character position.
 * The parser allocates nothing: the graph lives in the caller's CwSmGraph. */
#include "config.h"

#include <glib/gi18n-lib.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-smiles-private.h"

/* clang-format off */
static const char *const element_symbols[] = {
  "*", "H", "He", "Li", "Be", "B", "C", "N", "O", "F", "Ne", "Na", "Mg", "Al", "Si", "P", "S",
  "Cl", "Ar", "K", "Ca", "Sc", "Ti", "V", "Cr", "Mn", "Fe", "Co", "Ni", "Cu", "Zn", "Ga", "Ge",
  "As", "Se", "Br", "Kr", "Rb", "Sr", "Y", "Zr", "Nb", "Mo", "Tc", "Ru", "Rh", "Pd", "Ag", "Cd",
  "In", "Sn", "Sb", "Te", "I", "Xe", "Cs", "Ba", "La", "Ce", "Pr", "Nd", "Pm", "Sm", "Eu", "Gd",
  "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu", "Hf", "Ta", "W", "Re", "Os", "Ir", "Pt", "Au", "Hg",
  "Tl", "Pb", "Bi", "Po", "At", "Rn", "Fr", "Ra", "Ac", "Th", "Pa", "U", "Np", "Pu", "Am", "Cm",
  "Bk", "Cf", "Es", "Fm", "Md", "No", "Lr", "Rf", "Db", "Sg", "Bh", "Hs", "Mt", "Ds", "Rg", "Cn",
  "Nh", "Fl", "Mc", "Lv", "Ts", "Og",
};
/* clang-format on */

#define N_ELEMENTS ((int) G_N_ELEMENTS (element_symbols))

typedef struct
{
  gint16  atom; /* -1 when the ring number is free */
  gint8   slot; /* the neighbour slot reserved on atom */
  guint8  bond; /* bond written with the opening digit, 0 for none */
  guint16 pos;
} RingOpen;

typedef struct
{
  CwSmGraph  *g;
  const char *s;
  int         len;
  int         i;
  int         prev;
  int         bond; /* pending bond order, 0 for none */
  int         bond_pos;
  int         stack[CW_SM_MAX_ATOMS];
  int         stack_pos[CW_SM_MAX_ATOMS];
  int         depth;
  RingOpen    ring[100];
  int         n_open;
  int         part_start; /* first atom after the last ‘.’ */
} Parser;

const char *
cw_sm_element_symbol (int z)
{
  return z >= 0 && z < N_ELEMENTS ? element_symbols[z] : "?";
}

/* text[from, to) as valid UTF-8: control bytes become '?', invalid sequences U+FFFD. */
char *
cw_sm_valid_text (const char *text, int from, int to)
{
  g_autofree char *copy = g_strndup (text + from, to - from);

  for (char *c = copy; *c; c++)
    if ((guchar) *c < 0x20 || *c == 0x7f)
      *c = '?';
  return g_utf8_make_valid (copy, -1);
}

char *
cw_sm_describe_char (const char *text, int len, int i)
{
  guchar c = text[i];
  int    n = c < 0x80 ? 1 : c >= 0xf0 ? 4
                          : c >= 0xe0 ? 3
                          : c >= 0xc0 ? 2
                                      : 0;

  if (c >= 0x20 && c < 0x7f)
    return g_strdup_printf ("‘%c’", c);
  if (n > 1 && i + n <= len && g_utf8_validate (text + i, n, NULL))
    return g_strdup_printf ("‘%.*s’", n, text + i);
  return g_strdup_printf ("byte 0x%02X", c);
}

void
cw_sm_set_error (GError         **error,
                 int              code,
                 const CwSmGraph *g,
                 int              pos,
                 const char      *format,
                 ...)
{
  va_list          ap;
  g_autofree char *what = NULL;
  g_autofree char *excerpt = NULL;
  g_autofree char *before = NULL;
  g_autofree char *prefix = NULL;
  int              from, to;

  if (g != NULL)
    ((CwSmGraph *) g)->error_pos = pos;
  if (error == NULL)
    return;
  va_start (ap, format);
  what = g_strdup_vprintf (format, ap);
  va_end (ap);
  if (g == NULL || g->text == NULL || pos < 0)
    {
      g_set_error_literal (error, CW_CORE_ERROR, code, what);
      return;
    }
  /* Show up to 30 bytes either side (whole UTF-8 characters), with a caret under the position;
   * positions are counted in characters. */
  pos = MIN (pos, g->text_len);
  from = MAX (0, pos - 30);
  to = MIN (g->text_len, pos + 30);
  while (from > 0 && ((guchar) g->text[from] & 0xc0) == 0x80)
    from--;
  while (to < g->text_len && ((guchar) g->text[to] & 0xc0) == 0x80)
    to++;
  excerpt = cw_sm_valid_text (g->text, from, to);
  before = cw_sm_valid_text (g->text, from, pos);
  prefix = cw_sm_valid_text (g->text, 0, pos);
  g_set_error (error, CW_CORE_ERROR, code, _("SMILES, character %ld: %s\n  %s%s\n  %*s^"), g_utf8_strlen (prefix, -1) + 1, what, from > 0 ? "…" : "", excerpt, (int) (g_utf8_strlen (before, -1) + (from > 0 ? 1 : 0)), "");
}

static inline int
add_neighbour (Parser *p, int atom, int other, int bond, GError **error)
{
  CwSmAtom *a = &p->g->atoms[atom];

  if (a->degree >= CW_SM_MAX_NB)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, a->pos,
                       _("too many bonds on one atom (at most %d)"), CW_SM_MAX_NB);
      return -1;
    }
  a->nb[a->degree] = other;
  a->bond[a->degree] = bond;
  return a->degree++;
}

static int
default_bond (Parser *p, int a, int b)
{
  return p->g->atoms[a].aromatic && p->g->atoms[b].aromatic ? CW_SM_BOND_AROMATIC : CW_SM_BOND_SINGLE;
}

/* Element by symbol: one table entry per upper-case letter and following lower-case letter (or
 * none), filled once from element_symbols. */
static gint8 symbol_table[26][27];

static void
fill_symbol_table (void)
{
  static gsize done = 0;

  if (!g_once_init_enter (&done))
    return;
  memset (symbol_table, -1, sizeof symbol_table);
  for (int z = 1; z < N_ELEMENTS; z++)
    {
      const char *sym = element_symbols[z];
      symbol_table[sym[0] - 'A'][sym[1] ? sym[1] - 'a' + 1 : 0] = z;
    }
  g_once_init_leave (&done, 1);
}

static int
lookup_symbol (const char *s, int n)
{
  if (s[0] < 'A' || s[0] > 'Z' || (n == 2 && (s[1] < 'a' || s[1] > 'z')))
    return -1;
  fill_symbol_table ();
  return symbol_table[s[0] - 'A'][n == 2 ? s[1] - 'a' + 1 : 0];
}

/* Parses "[...]" at p->i into atom a. */
static gboolean
parse_bracket (Parser *p, CwSmAtom *a, GError **error)
{
  const char *s = p->s;
  int         start = p->i, i = p->i + 1, z = -1, close;

  for (close = i; close < p->len && s[close] != ']'; close++)
    if (s[close] == '[' || s[close] == '.' || s[close] == '(')
      break;
  if (close >= p->len || s[close] != ']')
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, start, _("bracket atom without its closing ‘]’"));
      return FALSE;
    }
  a->bracket = TRUE;
  a->hcount = 0;
  while (i < close && g_ascii_isdigit (s[i]))
    {
      a->isotope = a->isotope * 10 + (s[i] - '0');
      if (a->isotope > 999)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, i, _("isotope mass number too large"));
          return FALSE;
        }
      i++;
    }
  if (i < close && s[i] == '*')
    z = 0, i++;
  else if (i < close && g_ascii_islower (s[i]))
    {
      static const char *const arom[] = { "se", "as", "b", "c", "n", "o", "p", "s" };
      for (guint k = 0; k < G_N_ELEMENTS (arom) && z < 0; k++)
        {
          int n = strlen (arom[k]);
          if (i + n <= close && strncmp (s + i, arom[k], n) == 0)
            {
              char up[3] = { g_ascii_toupper (arom[k][0]), n > 1 ? arom[k][1] : 0, 0 };
              z = lookup_symbol (up, n);
              a->aromatic = TRUE;
              i += n;
            }
        }
    }
  else if (i < close && g_ascii_isupper (s[i]))
    {
      if (i + 1 < close && g_ascii_islower (s[i + 1]) && (z = lookup_symbol (s + i, 2)) >= 0)
        i += 2;
      else if ((z = lookup_symbol (s + i, 1)) >= 0)
        i += 1;
    }
  if (z < 0)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, i,
                       _("not an element symbol in a bracket atom"));
      return FALSE;
    }
  a->element = z;
  if (i < close && s[i] == '@')
    {
      int at = i;
      i++;
      a->chirality = CW_SM_CHIRAL_ANTICLOCKWISE;
      if (i < close && s[i] == '@')
        a->chirality = CW_SM_CHIRAL_CLOCKWISE, i++;
      else if (i + 2 < close && s[i] == 'T' && s[i + 1] == 'H' && (s[i + 2] == '1' || s[i + 2] == '2'))
        a->chirality = s[i + 2] == '1' ? CW_SM_CHIRAL_ANTICLOCKWISE : CW_SM_CHIRAL_CLOCKWISE, i += 3;
      else if (i + 1 < close && g_ascii_isupper (s[i]) && g_ascii_isupper (s[i + 1]))
        {
          cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, p->g, at,
                           _("only tetrahedral @ and @@ centres are read"));
          return FALSE;
        }
    }
  if (i < close && s[i] == 'H')
    {
      i++;
      a->hcount = 1;
      if (i < close && g_ascii_isdigit (s[i]))
        a->hcount = s[i++] - '0';
    }
  if (i < close && (s[i] == '+' || s[i] == '-'))
    {
      int  sign = s[i] == '+' ? 1 : -1, n = 1;
      char c = s[i++];
      if (i < close && g_ascii_isdigit (s[i]))
        {
          n = 0;
          while (i < close && g_ascii_isdigit (s[i]) && n < 100)
            n = n * 10 + (s[i++] - '0');
        }
      else
        while (i < close && s[i] == c)
          n++, i++;
      if (n > 15)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, i - 1, _("charge out of range"));
          return FALSE;
        }
      a->charge = sign * n;
    }
  if (i < close && s[i] == ':')
    {
      i++;
      while (i < close && g_ascii_isdigit (s[i]))
        i++;
    }
  if (i != close)
    {
      g_autofree char *bad = cw_sm_describe_char (s, p->len, i);
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, i,
                       _("unexpected %s in a bracket atom"), bad);
      return FALSE;
    }
  p->i = close + 1;
  return TRUE;
}

static gboolean
parse_organic (Parser *p, CwSmAtom *a, GError **error)
{
  const char *s = p->s;
  char        c = s[p->i], d = p->i + 1 < p->len ? s[p->i + 1] : 0;

  a->hcount = -1;
  switch (c)
    {
    case 'C':
      if (d == 'l')
        a->element = 17, p->i++;
      else
        a->element = 6;
      break;
    case 'B':
      if (d == 'r')
        a->element = 35, p->i++;
      else
        a->element = 5;
      break;
    case 'N':
      a->element = 7;
      break;
    case 'O':
      a->element = 8;
      break;
    case 'P':
      a->element = 15;
      break;
    case 'S':
      a->element = 16;
      break;
    case 'F':
      a->element = 9;
      break;
    case 'I':
      a->element = 53;
      break;
    case 'b':
      a->element = 5, a->aromatic = TRUE;
      break;
    case 'c':
      a->element = 6, a->aromatic = TRUE;
      break;
    case 'n':
      a->element = 7, a->aromatic = TRUE;
      break;
    case 'o':
      a->element = 8, a->aromatic = TRUE;
      break;
    case 'p':
      a->element = 15, a->aromatic = TRUE;
      break;
    case 's':
      a->element = 16, a->aromatic = TRUE;
      break;
    case '*':
      a->element = 0;
      break;
    default:
      if (g_ascii_isalpha (c))
        cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i,
                         _("‘%c’ is not an atom of the organic subset; write it in brackets, e.g. [%c]"), c, c);
      else
        {
          g_autofree char *bad = cw_sm_describe_char (s, p->len, p->i);
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i, _("unexpected character %s"), bad);
        }
      return FALSE;
    }
  p->i++;
  return TRUE;
}

static gboolean
parse_atom (Parser *p, GError **error)
{
  CwSmGraph *g = p->g;
  CwSmAtom  *a;
  int        idx = g->n_atoms, start = p->i;

  if (idx >= CW_SM_MAX_ATOMS)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, g, start,
                       _("more than %d atoms"), CW_SM_MAX_ATOMS);
      return FALSE;
    }
  a = &g->atoms[idx];
  memset (a, 0, sizeof *a);
  a->h_slot = -1;
  a->parent = -1;
  a->pos = start;
  if (!(p->s[p->i] == '[' ? parse_bracket (p, a, error) : parse_organic (p, a, error)))
    return FALSE;
  a->len = p->i - start;
  g->n_atoms++;
  if (p->prev >= 0)
    {
      int bond = p->bond ? p->bond : default_bond (p, p->prev, idx);
      a->parent = p->prev;
      /* a new atom cannot already be bonded: no duplicate check (ring bonds have theirs) */
      if (add_neighbour (p, p->prev, idx, bond, error) < 0 || add_neighbour (p, idx, p->prev, bond, error) < 0)
        return FALSE;
    }
  else if (p->bond)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, g, p->bond_pos, _("a bond with no atom before it"));
      return FALSE;
    }
  if (a->bracket && a->hcount > 0)
    a->h_slot = a->degree;
  p->prev = idx;
  p->bond = 0;
  return TRUE;
}

static gboolean
parse_ring_bond (Parser *p, GError **error)
{
  const char *s = p->s;
  int         pos = p->i, num;
  RingOpen   *r;

  if (p->prev < 0)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, pos, _("a ring bond number with no atom before it"));
      return FALSE;
    }
  if (s[p->i] == '%')
    {
      if (p->i + 2 >= p->len + 0 || !g_ascii_isdigit (s[p->i + 1]) || !g_ascii_isdigit (s[p->i + 2]))
        {
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, pos, _("‘%%’ must be followed by two digits"));
          return FALSE;
        }
      num = (s[p->i + 1] - '0') * 10 + (s[p->i + 2] - '0');
      p->i += 3;
    }
  else
    num = s[p->i++] - '0';
  r = &p->ring[num];
  if (r->atom < 0)
    {
      int slot = add_neighbour (p, p->prev, -1, 0, error);
      if (slot < 0)
        return FALSE;
      r->atom = p->prev;
      r->slot = slot;
      r->bond = p->bond;
      r->pos = pos;
      p->n_open++;
    }
  else
    {
      CwSmAtom *o = &p->g->atoms[r->atom];
      int       bond;

      if (p->part_start > r->atom)
        {
          /* legal OpenSMILES, but it hides one molecule behind a '.': not read here */
          cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, p->g, pos,
                           _("ring bond %d joins parts separated by ‘.’; write them as one part"), num);
          return FALSE;
        }
      if (r->atom == p->prev)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, pos, _("ring bond %d joins an atom to itself"), num);
          return FALSE;
        }
      if (r->bond && p->bond && r->bond != p->bond)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, pos,
                           _("the two ends of ring bond %d give different bond orders"), num);
          return FALSE;
        }
      for (int k = 0; k < o->degree; k++)
        if (o->nb[k] == p->prev)
          {
            cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, pos,
                             _("ring bond %d joins two atoms that are already bonded"), num);
            return FALSE;
          }
      bond = r->bond ? r->bond : p->bond ? p->bond
                                         : default_bond (p, r->atom, p->prev);
      o->nb[r->slot] = p->prev;
      o->bond[r->slot] = bond;
      if (add_neighbour (p, p->prev, r->atom, bond, error) < 0)
        return FALSE;
      if (p->g->n_closures >= CW_SM_MAX_CYCLES)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, p->g, pos, _("too many rings"));
          return FALSE;
        }
      p->g->closures[p->g->n_closures++] = (CwSmClosure){ r->atom, p->prev, pos };
      r->atom = -1;
      p->n_open--;
    }
  p->bond = 0;
  return TRUE;
}

static int
bond_from_char (char c)
{
  switch (c)
    {
    case '-':
    case '/':
    case '\\':
      return CW_SM_BOND_SINGLE;
    case '=':
      return CW_SM_BOND_DOUBLE;
    case '#':
      return CW_SM_BOND_TRIPLE;
    case '$':
      return CW_SM_BOND_QUAD;
    case ':':
      return CW_SM_BOND_AROMATIC;
    default:
      return 0;
    }
}

static gboolean
parse_loop (Parser *p, GError **error)
{
  while (p->i < p->len)
    {
      char c = p->s[p->i];
      int  b;

      if (c == '(')
        {
          if (p->prev < 0 || p->bond)
            {
              cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i, _("a branch must follow an atom"));
              return FALSE;
            }
          if (p->i + 1 < p->len && (p->s[p->i + 1] == ')' || p->s[p->i + 1] == '('))
            {
              cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i + 1,
                               p->s[p->i + 1] == ')' ? _("empty branch") : _("a branch must start with an atom or a bond"));
              return FALSE;
            }
          /* each open branch follows its own atom, so depth < number of atoms <= the stack */
          g_assert (p->depth < CW_SM_MAX_ATOMS);
          p->stack_pos[p->depth] = p->i;
          p->stack[p->depth++] = p->prev;
          p->i++;
        }
      else if (c == ')')
        {
          if (p->depth == 0 || p->bond)
            {
              cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i,
                               p->bond ? _("a bond with no atom after it") : _("‘)’ without a matching ‘(’"));
              return FALSE;
            }
          p->prev = p->stack[--p->depth];
          p->i++;
        }
      else if ((b = bond_from_char (c)) != 0)
        {
          if (p->bond)
            {
              cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i, _("two bond symbols in a row"));
              return FALSE;
            }
          p->bond = b;
          p->bond_pos = p->i++;
        }
      else if (g_ascii_isdigit (c) || c == '%')
        {
          if (!parse_ring_bond (p, error))
            return FALSE;
        }
      else if (c == '.')
        {
          if (p->prev < 0 || p->bond || p->depth > 0)
            {
              cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->i,
                               p->depth > 0 ? _("‘.’ inside a branch") : _("‘.’ must separate two parts"));
              return FALSE;
            }
          p->prev = -1;
          p->g->n_dots++;
          p->part_start = p->g->n_atoms;
          p->i++;
        }
      else if (!parse_atom (p, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
check_end (Parser *p, GError **error)
{
  if (p->bond)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->bond_pos, _("a bond with no atom after it"));
      return FALSE;
    }
  if (p->depth > 0)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->stack_pos[p->depth - 1], _("branch ‘(’ is never closed"));
      return FALSE;
    }
  if (p->n_open > 0)
    for (int k = 0; k < 100; k++)
      if (p->ring[k].atom >= 0)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->ring[k].pos, _("ring bond %d is never closed"), k);
          return FALSE;
        }
  if (p->g->n_atoms == 0 || p->prev < 0)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_PARSE, p->g, p->len, p->g->n_atoms == 0 ? _("no atoms") : _("ends with ‘.’"));
      return FALSE;
    }
  return TRUE;
}

int
cw_sm_atom_valence (const CwSmGraph *g, int atom)
{
  const CwSmAtom *a = &g->atoms[atom];
  int             v = 0;

  for (int k = 0; k < a->degree; k++)
    v += a->bond[k] == CW_SM_BOND_AROMATIC ? 1 : a->bond[k];
  return v;
}

/* Implicit hydrogens of an organic-subset atom, from its normal valences. */
static void
compute_hcount (CwSmGraph *g, int atom)
{
  CwSmAtom        *a = &g->atoms[atom];
  static const int v_b[] = { 3, 0 }, v_c[] = { 4, 0 }, v_n[] = { 3, 5, 0 }, v_o[] = { 2, 0 },
                   v_p[] = { 3, 5, 0 }, v_s[] = { 2, 4, 6, 0 }, v_x[] = { 1, 0 };
  const int *vals;
  int        v = cw_sm_atom_valence (g, atom);

  if (g->fragment && atom == 0)
    v++;
  if (a->aromatic)
    v++;
  switch (a->element)
    {
    case 5:
      vals = v_b;
      break;
    case 6:
      vals = v_c;
      break;
    case 7:
      vals = v_n;
      break;
    case 8:
      vals = v_o;
      break;
    case 15:
      vals = v_p;
      break;
    case 16:
      vals = v_s;
      break;
    case 9:
    case 17:
    case 35:
    case 53:
      vals = v_x;
      break;
    default:
      a->hcount = 0;
      return;
    }
  a->hcount = 0;
  for (; *vals; vals++)
    if (*vals >= v)
      {
        a->hcount = *vals - v;
        break;
      }
}

gboolean
cw_sm_is_hydrogen (const CwSmGraph *g, int atom)
{
  const CwSmAtom *a = &g->atoms[atom];
  return a->element == 1 && a->isotope == 0 && a->charge == 0 && a->degree == 1;
}

int
cw_sm_total_h (const CwSmGraph *g, int atom)
{
  const CwSmAtom *a = &g->atoms[atom];
  int             h = a->hcount;

  for (int k = 0; k < a->degree; k++)
    if (cw_sm_is_hydrogen (g, a->nb[k]))
      h++;
  return h;
}

gboolean
cw_sm_parse (CwSmGraph *g, const char *text, int len, gboolean fragment, GError **error)
{
  Parser p;

  g->n_atoms = 0;
  g->n_closures = 0;
  g->n_dots = 0;
  g->text = text;
  g->text_len = len;
  g->fragment = fragment;
  p.g = g;
  p.s = text;
  p.len = len;
  p.i = 0;
  p.prev = -1;
  p.bond = 0;
  p.depth = 0;
  p.n_open = 0;
  p.part_start = 0;
  memset (p.ring, 0xff, sizeof p.ring); /* every atom field -1: free */
  if (!parse_loop (&p, error) || !check_end (&p, error))
    return FALSE;
  for (int k = 0; k < g->n_atoms; k++)
    if (!g->atoms[k].bracket)
      compute_hcount (g, k);
  return TRUE;
}
