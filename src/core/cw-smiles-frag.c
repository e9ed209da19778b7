/* cw-smiles-frag.c: rooted substituent fragments of the internal graph.
 *
 * A fragment is the set of atoms with mask[atom] == mark; its root is the atom bonded to the
 * ring carbon. cw_sm_fragment_hash gives the same 64-bit value for the same rooted structure
 * however it was written (iterated neighbourhood hashing, one round more than the root's
 * eccentricity, which is exact for trees up to hash collisions). Plain [H] atoms count as
 * hydrogens on their neighbour, not as atoms. */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"

#define MAX_FRAG CW_SM_MAX_ATOMS

typedef struct
{
  int     n;
  int     atom[MAX_FRAG]; /* local -> graph index, BFS order from the root */
  int     dist[MAX_FRAG];
  guint64 h[MAX_FRAG];
  gint16  local[CW_SM_MAX_ATOMS]; /* graph -> local index, -1 outside */
} Frag;

static inline guint64
mix64 (guint64 x)
{
  x ^= x >> 30;
  x *= G_GUINT64_CONSTANT (0xbf58476d1ce4e5b9);
  x ^= x >> 27;
  x *= G_GUINT64_CONSTANT (0x94d049bb133111eb);
  x ^= x >> 31;
  return x;
}

static gboolean
in_frag (const CwSmGraph *g, const guint8 *mask, guint8 mark, int atom)
{
  return mask[atom] == mark && !cw_sm_is_hydrogen (g, atom);
}

static void
collect (const CwSmGraph *g, int root, const guint8 *mask, guint8 mark, Frag *f)
{
  int head = 0;

  for (int k = 0; k < g->n_atoms; k++)
    f->local[k] = -1;
  f->n = 1;
  f->atom[0] = root;
  f->dist[0] = 0;
  f->local[root] = 0;
  while (head < f->n)
    {
      int             v = f->atom[head];
      const CwSmAtom *a = &g->atoms[v];
      for (int k = 0; k < a->degree; k++)
        {
          int u = a->nb[k];
          if (f->local[u] >= 0 || !in_frag (g, mask, mark, u))
            continue;
          f->local[u] = f->n;
          f->dist[f->n] = f->dist[head] + 1;
          f->atom[f->n++] = u;
        }
      head++;
    }
}

static void
hash_frag (const CwSmGraph *g, Frag *f)
{
  guint64 next[MAX_FRAG];
  int     rounds = f->dist[f->n - 1] + 1;

  for (int i = 0; i < f->n; i++)
    {
      const CwSmAtom *a = &g->atoms[f->atom[i]];
      guint64         x = a->element | (guint64) a->aromatic << 8 | (guint64) (a->charge + 16) << 9 |
                  (guint64) a->isotope << 16 | (guint64) cw_sm_total_h (g, f->atom[i]) << 28 |
                  (guint64) (i == 0) << 34;
      f->h[i] = mix64 (x + 0x9e3779b97f4a7c15ull);
    }
  for (int r = 0; r < rounds; r++)
    {
      for (int i = 0; i < f->n; i++)
        {
          const CwSmAtom *a = &g->atoms[f->atom[i]];
          guint64         sum = 0;
          for (int k = 0; k < a->degree; k++)
            {
              int j = f->local[a->nb[k]];
              if (j >= 0)
                sum += mix64 (f->h[j] ^ ((guint64) a->bond[k] * 0x51afd7ed558ccd1dull));
            }
          next[i] = mix64 (f->h[i] * 31 + sum);
        }
      memcpy (f->h, next, sizeof (guint64) * f->n);
    }
}

guint64
cw_sm_fragment_hash (const CwSmGraph *g, int root, const guint8 *mask, guint8 mark)
{
  Frag f;

  collect (g, root, mask, mark, &f);
  hash_frag (g, &f);
  return mix64 (f.h[0] ^ (guint64) f.n << 48);
}

/* ---- writing ---- */

typedef struct
{
  const CwSmGraph *g;
  Frag            *f;
  int              root; /* local index 0 */
  gboolean         reverse;
  int              toward[MAX_FRAG]; /* local next hop toward the root (reverse mode) */
  gboolean         visited[MAX_FRAG];
  int              order[MAX_FRAG]; /* local atoms in DFS order */
  int              n_order;
  int              tree_parent[MAX_FRAG];
  /* ring closures: pairs of local atoms */
  int      cl_a[CW_SM_MAX_CYCLES], cl_b[CW_SM_MAX_CYCLES], n_cl;
  int      cl_digit[CW_SM_MAX_CYCLES];
  gboolean written[MAX_FRAG];
  gboolean digit_used[100];
  int      first_digit;
  GString *out;
} Writer;

static gboolean
organic_ok (const CwSmGraph *g, const Frag *f, int atom, gboolean is_root)
{
  const CwSmAtom     *a = &g->atoms[atom];
  static const guint8 organic[] = { 5, 6, 7, 8, 9, 15, 16, 17, 35, 53 };
  gboolean            found = FALSE;
  int                 v, h, expect = -1;
  static const int    norm[][4] = { { 5, 3, 0, 0 }, { 6, 4, 0, 0 }, { 7, 3, 5, 0 }, { 8, 2, 0, 0 }, { 9, 1, 0, 0 }, { 15, 3, 5, 0 }, { 16, 2, 4, 6 }, { 17, 1, 0, 0 }, { 35, 1, 0, 0 }, { 53, 1, 0, 0 } };

  for (guint k = 0; k < G_N_ELEMENTS (organic); k++)
    found |= organic[k] == a->element;
  if (!found || a->charge != 0 || a->isotope != 0)
    return FALSE;
  if (a->aromatic && a->element != 5 && a->element != 6 && a->element != 7 && a->element != 8 &&
      a->element != 15 && a->element != 16)
    return FALSE;
  v = 0;
  for (int k = 0; k < a->degree; k++)
    if (f->local[a->nb[k]] >= 0)
      v += a->bond[k] == CW_SM_BOND_AROMATIC ? 1 : a->bond[k];
  v += is_root ? 1 : 0;
  v += a->aromatic ? 1 : 0;
  h = cw_sm_total_h (g, atom);
  for (guint k = 0; k < G_N_ELEMENTS (norm); k++)
    if (norm[k][0] == a->element)
      for (int j = 1; j < 4 && norm[k][j]; j++)
        if (norm[k][j] >= v)
          {
            expect = norm[k][j] - v;
            break;
          }
  if (expect < 0)
    expect = 0;
  return expect == h;
}

static void
write_atom_token (Writer *w, int local)
{
  const CwSmGraph *g = w->g;
  int              atom = w->f->atom[local];
  const CwSmAtom  *a = &g->atoms[atom];
  const char      *sym = cw_sm_element_symbol (a->element);
  int              h;

  if (organic_ok (g, w->f, atom, local == 0))
    {
      if (a->aromatic)
        {
          g_string_append_c (w->out, g_ascii_tolower (sym[0]));
          g_string_append (w->out, sym + 1);
        }
      else
        g_string_append (w->out, sym);
      return;
    }
  g_string_append_c (w->out, '[');
  if (a->isotope)
    g_string_append_printf (w->out, "%d", a->isotope);
  if (a->aromatic)
    {
      g_string_append_c (w->out, g_ascii_tolower (sym[0]));
      g_string_append (w->out, sym + 1);
    }
  else
    g_string_append (w->out, sym);
  h = cw_sm_total_h (g, atom);
  if (h == 1)
    g_string_append_c (w->out, 'H');
  else if (h > 1)
    g_string_append_printf (w->out, "H%d", h);
  if (a->charge == 1 || a->charge == -1)
    g_string_append_c (w->out, a->charge > 0 ? '+' : '-');
  else if (a->charge)
    g_string_append_printf (w->out, "%+d", a->charge);
  g_string_append_c (w->out, ']');
}

static void
write_bond (Writer *w, int bond, int la, int lb)
{
  const CwSmAtom *a = &w->g->atoms[w->f->atom[la]], *b = &w->g->atoms[w->f->atom[lb]];

  switch (bond)
    {
    case CW_SM_BOND_DOUBLE:
      g_string_append_c (w->out, '=');
      break;
    case CW_SM_BOND_TRIPLE:
      g_string_append_c (w->out, '#');
      break;
    case CW_SM_BOND_QUAD:
      g_string_append_c (w->out, '$');
      break;
    case CW_SM_BOND_SINGLE:
      if (a->aromatic && b->aromatic)
        g_string_append_c (w->out, '-');
      break;
    case CW_SM_BOND_AROMATIC:
      if (!(a->aromatic && b->aromatic))
        g_string_append_c (w->out, ':');
      break;
    default:
      break;
    }
}

static int
bond_between (const Writer *w, int la, int lb)
{
  const CwSmAtom *a = &w->g->atoms[w->f->atom[la]];
  for (int k = 0; k < a->degree; k++)
    if (a->nb[k] == w->f->atom[lb])
      return a->bond[k];
  return CW_SM_BOND_SINGLE;
}

/* Unvisited-or-not local neighbours of v in hash order, the toward-root hop last. */
static int
sorted_neighbours (const Writer *w, int v, int *out)
{
  const CwSmAtom *a = &w->g->atoms[w->f->atom[v]];
  int             n = 0;

  for (int k = 0; k < a->degree; k++)
    {
      int j = w->f->local[a->nb[k]];
      if (j >= 0)
        out[n++] = j;
    }
  for (int i = 1; i < n; i++)
    for (int k = i; k > 0; k--)
      {
        int      x = out[k - 1], y = out[k];
        gboolean x_last = w->reverse && w->toward[v] == x;
        gboolean y_last = w->reverse && w->toward[v] == y;
        gboolean swap = x_last ? TRUE : y_last ? FALSE
                                               : w->f->h[y] < w->f->h[x];
        if (!swap)
          break;
        out[k - 1] = y;
        out[k] = x;
      }
  return n;
}

static void
dfs (Writer *w, int v, int parent)
{
  int nb[CW_SM_MAX_NB], n;

  w->visited[v] = TRUE;
  w->tree_parent[v] = parent;
  w->order[w->n_order++] = v;
  n = sorted_neighbours (w, v, nb);
  for (int k = 0; k < n; k++)
    {
      int u = nb[k];
      if (u == parent)
        continue;
      if (w->reverse && u == 0 && w->toward[v] != 0)
        {
          /* an edge to the reserved root that is not the main path: a ring bond */
          w->cl_a[w->n_cl] = v, w->cl_b[w->n_cl++] = u;
          continue;
        }
      if (w->visited[u])
        {
          gboolean seen = FALSE;
          for (int c = 0; c < w->n_cl; c++)
            seen |= (w->cl_a[c] == u && w->cl_b[c] == v) || (w->cl_a[c] == v && w->cl_b[c] == u);
          if (!seen && w->n_cl < CW_SM_MAX_CYCLES)
            w->cl_a[w->n_cl] = u, w->cl_b[w->n_cl++] = v;
          continue;
        }
      dfs (w, u, v);
    }
}

static void
emit (Writer *w, int v)
{
  int nb[CW_SM_MAX_NB], n, children[CW_SM_MAX_NB], nc = 0;

  write_atom_token (w, v);
  w->written[v] = TRUE;
  for (int c = 0; c < w->n_cl; c++)
    {
      int other;
      if (w->cl_a[c] == v)
        other = w->cl_b[c];
      else if (w->cl_b[c] == v)
        other = w->cl_a[c];
      else
        continue;
      if (w->written[other])
        {
          g_string_append_printf (w->out, w->cl_digit[c] > 9 ? "%%%02d" : "%d", w->cl_digit[c]);
          w->digit_used[w->cl_digit[c]] = FALSE;
        }
      else
        {
          int d = w->first_digit;
          while (d < 99 && w->digit_used[d])
            d++;
          w->digit_used[d] = TRUE;
          w->cl_digit[c] = d;
          write_bond (w, bond_between (w, v, other), v, other);
          g_string_append_printf (w->out, d > 9 ? "%%%02d" : "%d", d);
        }
    }
  n = sorted_neighbours (w, v, nb);
  for (int k = 0; k < n; k++)
    if (w->tree_parent[nb[k]] == v && !w->written[nb[k]])
      children[nc++] = nb[k];
  for (int k = 0; k < nc; k++)
    {
      /* in reverse mode the root is reached last and every child of the root is a branch */
      gboolean branch = k < nc - 1 || (w->reverse && v == 0);
      if (branch)
        g_string_append_c (w->out, '(');
      write_bond (w, bond_between (w, v, children[k]), v, children[k]);
      emit (w, children[k]);
      if (branch)
        g_string_append_c (w->out, ')');
    }
}

void
cw_sm_fragment_write (const CwSmGraph *g, int root, const guint8 *mask, guint8 mark, gboolean reverse, int first_digit, GString *out)
{
  Frag    f;
  Writer *w = g_new0 (Writer, 1);
  int     start = 0;

  collect (g, root, mask, mark, &f);
  hash_frag (g, &f);
  w->g = g;
  w->f = &f;
  w->reverse = reverse && f.n > 1;
  w->first_digit = first_digit;
  w->out = out;
  if (w->reverse)
    {
      /* start at the atom farthest from the root (lowest hash among ties); the path back to
       * the root is the main chain, so the root is written last and the ring follows it */
      for (int i = 0; i < f.n; i++)
        {
          int             best = -1;
          const CwSmAtom *a = &g->atoms[f.atom[i]];
          w->toward[i] = -1;
          for (int k = 0; k < a->degree; k++)
            {
              int j = f.local[a->nb[k]];
              if (j >= 0 && f.dist[j] == f.dist[i] - 1 && (best < 0 || f.h[j] < f.h[best]))
                best = j;
            }
          w->toward[i] = best;
          if (f.dist[i] > f.dist[start] || (f.dist[i] == f.dist[start] && f.h[i] < f.h[start]))
            start = i;
        }
      w->visited[0] = TRUE; /* reserved: entered only from the end of the main path */
      {
        /* walk: dfs from start; when the main path reaches the root's neighbour, the root
         * follows as its last child */
        int path_end = start;
        while (w->toward[path_end] != 0)
          path_end = w->toward[path_end];
        dfs (w, start, -1);
        w->visited[0] = FALSE;
        /* attach the root below path_end and let it take its remaining neighbours */
        for (int c = 0; c < w->n_cl; c++)
          if ((w->cl_a[c] == path_end && w->cl_b[c] == 0) || (w->cl_b[c] == path_end && w->cl_a[c] == 0))
            {
              w->cl_a[c] = w->cl_a[--w->n_cl];
              w->cl_b[c] = w->cl_b[w->n_cl];
              break;
            }
        w->reverse = FALSE; /* the root's own branches are written in hash order */
        {
          int save_n_cl = w->n_cl;
          dfs (w, 0, path_end);
          (void) save_n_cl;
        }
        w->reverse = TRUE;
      }
    }
  else
    dfs (w, 0, -1);
  emit (w, w->reverse ? start : 0);
  g_free (w);
}
