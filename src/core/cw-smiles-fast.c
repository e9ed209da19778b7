/* cw-smiles-fast.c: a fast path of the SMILES reader for simply written rings.
 *
 * Most SMILES of substituted cyclohexanes are written one way: the six ring carbons in one chain
 * at the top level ("C1…C1", ring bond between the first and the sixth), each substituent either
 * a branch of its ring carbon, the chain written before the ring or the chain after it. For those
 * the ring, the substituents and the faces follow from one pass over the text, without building
 * the molecular graph, as long as every substituent is a stretch of text the fragment cache
 * already maps to a table group (the general reader, cw-smiles-read.c, fills that cache: the
 * first compound with a given spelling of a group is read the general way).
 *
 * Anything else — a '.', bonds written next to the ring, ring carbons in branches, ring bonds
 * joining two substituents or fusing rings, unknown or uncached fragments, groups that hold a
 * non-aromatic ring (a second candidate ring), bracket ring carbons with isotopes or charges —
 * returns 0 and the general reader reads the text from the start, with all its messages. The
 * fast path never reports an error, and for what it accepts it gives exactly the general reader's
 * molecules and notes (tests/core/test-smiles-fast.c compares the two). */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"
#include "cw-smiles-reading.h"

#define MAX_CHAIN 64
#define MAX_BRANCH 64
#define MAX_DIGITS 64

enum
{
  RING_NOT_OK = 0, /* cannot be a ring carbon of the fast path */
  RING_ORGANIC,    /* C */
  RING_BRACKET     /* [C], [CH], [C@H], [C@@], … */
};

typedef struct
{
  guint16 pos, len;
  guint8  kind;
  guint8  chirality; /* CwSmChirality */
  gint8   hcount;    /* bracket atoms */
  guint8  bond_before;
  guint8  has_at; /* '@' in its bracket */
  guint8  n_branch, n_digit;
  guint8  first_branch;
} ChainAtom;

typedef struct
{
  ChainAtom chain[MAX_CHAIN];
  int       n_chain;
  guint16   br_lo[MAX_BRANCH], br_hi[MAX_BRANCH]; /* text inside the parentheses */
  guint8    br_owner[MAX_BRANCH], br_has_at[MAX_BRANCH];
  int       n_branch;
  guint8    dg_num[MAX_DIGITS];
  gint16    dg_seg[MAX_DIGITS]; /* chain atom (>= 0) or -(branch + 1) */
  guint8    dg_bond[MAX_DIGITS];
  gint8     dg_pair[MAX_DIGITS];
  int       n_digit;
  int       n_at; /* bracket atoms holding '@', chain and branches */
} Scan;

/* Character classes inside a branch: what the scan must look at. */
enum
{
  CL_PLAIN = 0,
  CL_BRACKET,
  CL_OPEN,
  CL_CLOSE,
  CL_DIGIT,
  CL_PERCENT,
  CL_DOT
};

static const guint8 char_class[256] = {
  ['['] = CL_BRACKET, ['('] = CL_OPEN, [')'] = CL_CLOSE, ['%'] = CL_PERCENT, ['.'] = CL_DOT,
  ['0'] = CL_DIGIT, ['1'] = CL_DIGIT, ['2'] = CL_DIGIT, ['3'] = CL_DIGIT, ['4'] = CL_DIGIT,
  ['5'] = CL_DIGIT, ['6'] = CL_DIGIT, ['7'] = CL_DIGIT, ['8'] = CL_DIGIT, ['9'] = CL_DIGIT,
};

static inline gboolean
is_bond_char (char c)
{
  return c == '-' || c == '=' || c == '#' || c == '$' || c == ':' || c == '/' || c == '\\';
}

/* Characters that begin an atom: '[', '*' and letters. */
#define LETTERS(base) \
  [base + 0] = 1, [base + 1] = 1, [base + 2] = 1, [base + 3] = 1, [base + 4] = 1, [base + 5] = 1, \
  [base + 6] = 1, [base + 7] = 1, [base + 8] = 1, [base + 9] = 1, [base + 10] = 1, [base + 11] = 1, \
  [base + 12] = 1, [base + 13] = 1, [base + 14] = 1, [base + 15] = 1, [base + 16] = 1, [base + 17] = 1, \
  [base + 18] = 1, [base + 19] = 1, [base + 20] = 1, [base + 21] = 1, [base + 22] = 1, [base + 23] = 1, \
  [base + 24] = 1, [base + 25] = 1
static const guint8 atom_start[256] = { ['['] = 1, ['*'] = 1, LETTERS ('A'), LETTERS ('a') };
#undef LETTERS

static inline gboolean
is_atom_start (char c)
{
  return atom_start[(guchar) c];
}

/* The ']' closing the bracket atom opened at i, or -1; *at tells whether it holds '@'. */
static inline int
bracket_end (const char *s, int len, int i, gboolean *at)
{
  for (int j = i + 1; j < len; j++)
    {
      char c = s[j];
      if (c == ']')
        return j;
      if (c == '@')
        *at = TRUE;
      else if (c == '[' || c == '(' || c == '.')
        return -1;
    }
  return -1;
}

/* A bracket ring carbon: [C], optional @ or @@, optional H with one digit, nothing else. */
static void
read_ring_bracket (const char *s, int lo, int hi, ChainAtom *a)
{
  int i = lo + 1;

  a->kind = RING_NOT_OK;
  if (i >= hi || s[i] != 'C' || (i + 1 < hi && s[i + 1] == 'l'))
    return;
  i++;
  a->chirality = CW_SM_CHIRAL_NONE;
  if (i < hi && s[i] == '@')
    {
      a->chirality = CW_SM_CHIRAL_ANTICLOCKWISE, i++;
      if (i < hi && s[i] == '@')
        a->chirality = CW_SM_CHIRAL_CLOCKWISE, i++;
    }
  a->hcount = 0;
  if (i < hi && s[i] == 'H')
    {
      i++;
      a->hcount = 1;
      if (i < hi && s[i] >= '0' && s[i] <= '9')
        a->hcount = s[i++] - '0';
    }
  if (i == hi)
    a->kind = RING_BRACKET;
}

static inline gboolean
add_digit (Scan *sc, int num, int seg, gboolean bond)
{
  if (sc->n_digit >= MAX_DIGITS)
    return FALSE;
  sc->dg_num[sc->n_digit] = num;
  sc->dg_seg[sc->n_digit] = seg;
  sc->dg_bond[sc->n_digit] = bond;
  sc->n_digit++;
  return TRUE;
}

/* Top-level pass: chain atoms, their ring-bond digits and branches (scanned only for their
 * extent, digits and '@'). FALSE when the text is not of the simple kind. */
static gboolean
scan (Scan *sc, const char *s, int len)
{
  gboolean bond = FALSE;
  int      i = 0;

  sc->n_chain = sc->n_branch = sc->n_digit = sc->n_at = 0;
  while (i < len)
    {
      char c = s[i];
      if (c == '(')
        {
          int      depth = 1, j = i + 1, b = sc->n_branch;
          gboolean at = FALSE;
          if (sc->n_chain == 0 || bond || b >= MAX_BRANCH)
            return FALSE;
          while (j < len)
            {
              char d = s[j];
              if (G_LIKELY (char_class[(guchar) d] == CL_PLAIN))
                {
                  j++;
                  continue;
                }
              /* tested in order of frequency: conditional branches, which the processor
               * predicts better here than a jump table */
              {
                int cl = char_class[(guchar) d];
                if (cl == CL_CLOSE)
                  depth--;
                else if (cl == CL_BRACKET)
                  {
                    j = bracket_end (s, len, j, &at);
                    if (j < 0)
                      return FALSE;
                  }
                else if (cl == CL_OPEN)
                  depth++;
                else if (cl == CL_DIGIT)
                  {
                    if (!add_digit (sc, d - '0', -(b + 1), FALSE))
                      return FALSE;
                  }
                else if (cl == CL_PERCENT)
                  {
                    if (j + 2 >= len || s[j + 1] < '0' || s[j + 1] > '9' || s[j + 2] < '0' || s[j + 2] > '9' ||
                        !add_digit (sc, (s[j + 1] - '0') * 10 + (s[j + 2] - '0'), -(b + 1), FALSE))
                      return FALSE;
                    j += 2;
                  }
                else /* '.' */
                  return FALSE;
              }
              if (depth == 0)
                break;
              j++;
            }
          if (j >= len)
            return FALSE;
          sc->br_lo[b] = i + 1;
          sc->br_hi[b] = j;
          sc->br_owner[b] = sc->n_chain - 1;
          sc->br_has_at[b] = at;
          sc->n_at += at;
          if (sc->chain[sc->n_chain - 1].n_branch++ == 0)
            sc->chain[sc->n_chain - 1].first_branch = b;
          sc->n_branch++;
          i = j + 1;
        }
      else if (c >= '0' && c <= '9')
        {
          if (sc->n_chain == 0 || !add_digit (sc, c - '0', sc->n_chain - 1, bond))
            return FALSE;
          sc->chain[sc->n_chain - 1].n_digit++;
          bond = FALSE;
          i++;
        }
      else if (c == '%')
        {
          if (sc->n_chain == 0 || i + 2 >= len || s[i + 1] < '0' || s[i + 1] > '9' || s[i + 2] < '0' || s[i + 2] > '9' ||
              !add_digit (sc, (s[i + 1] - '0') * 10 + (s[i + 2] - '0'), sc->n_chain - 1, bond))
            return FALSE;
          sc->chain[sc->n_chain - 1].n_digit++;
          bond = FALSE;
          i += 3;
        }
      else if (is_bond_char (c))
        {
          if (bond)
            return FALSE;
          bond = TRUE;
          i++;
        }
      else if (is_atom_start (c))
        {
          ChainAtom *a;
          if (sc->n_chain >= MAX_CHAIN)
            return FALSE;
          a = &sc->chain[sc->n_chain++];
          a->pos = i;
          a->bond_before = bond;
          a->n_branch = a->n_digit = a->first_branch = 0;
          a->has_at = FALSE;
          a->chirality = CW_SM_CHIRAL_NONE;
          a->hcount = -1;
          bond = FALSE;
          if (c == '[')
            {
              gboolean at = FALSE;
              int      j = bracket_end (s, len, i, &at);
              if (j < 0)
                return FALSE;
              a->has_at = at;
              sc->n_at += at;
              read_ring_bracket (s, i, j, a);
              i = j + 1;
            }
          else
            {
              /* organic subset: two-letter Cl and Br, else one letter */
              a->kind = c == 'C' && !(i + 1 < len && s[i + 1] == 'l') ? RING_ORGANIC : RING_NOT_OK;
              i += (c == 'C' && i + 1 < len && s[i + 1] == 'l') || (c == 'B' && i + 1 < len && s[i + 1] == 'r') ? 2 : 1;
            }
          a->len = i - a->pos;
        }
      else
        return FALSE;
    }
  if (bond || sc->n_chain == 0 || sc->chain[0].bond_before)
    return FALSE;
  /* pair the ring-bond digits in text order, as the parser does */
  {
    gint8 open[100];
    memset (open, -1, sizeof open);
    for (int k = 0; k < sc->n_digit; k++)
      {
        int num = sc->dg_num[k];
        if (open[num] < 0)
          open[num] = k, sc->dg_pair[k] = -1;
        else
          {
            sc->dg_pair[k] = open[num];
            sc->dg_pair[open[num]] = k;
            open[num] = -1;
          }
      }
    for (int k = 0; k < sc->n_digit; k++)
      if (sc->dg_pair[k] < 0)
        return FALSE;
  }
  return TRUE;
}

/* Which part of the molecule a digit lies in, once the ring is chain[first..first+5]:
 * -1 prefix, -2 tail, -3 a ring carbon, or the branch (>= 0) of a ring carbon. */
static int
segment_of (const Scan *sc, int seg, int first)
{
  int owner = seg >= 0 ? seg : sc->br_owner[-seg - 1];

  if (owner < first)
    return -1;
  if (owner > first + 5)
    return -2;
  return seg >= 0 ? -3 : -seg - 1;
}

/* The group of text[lo, hi) rooted at root_off, from the cache, or NULL. */
static const CwGroup *
cached_group (const CwSmIndex *index, CwSmGraph *g, const char *s, int lo, int hi, int root_off, gboolean *cyclohexyl)
{
  const CwGroup      *group;
  CwSmFragCacheEntry *e;
  guint64             key;

  while (hi > lo && s[hi - 1] == ')')
    hi--; /* the stretch the general reader caches ends with the last atom or its ring bonds */
  if (hi - lo > CW_SM_FRAG_TEXT || hi <= lo || !is_atom_start (s[lo]))
    return NULL;
  key = cw_sm_frag_key (s, lo, hi, root_off);
  e = cw_sm_frag_find (g->frag_cache, key, s, lo, hi, root_off);
  if (e == NULL || (group = e->group) == NULL || group->index < 0 || (guint) group->index >= index->n_groups ||
      index->groups[group->index] != group)
    return NULL;
  /* a group with a non-aromatic ring of its own may hold a second candidate ring: only a
   * plain cyclohexyl is known not to compete (see cw_sm_read_fast) */
  if (index->ring_inside[group->index])
    {
      if (index->ring_inside[group->index] != CW_SM_RING_CYCLOHEXYL)
        return NULL;
      *cyclohexyl = TRUE;
    }
  return group;
}

/* The neighbour order @/@@ refers to on a marked ring carbon (previous ring carbon 0, next 1,
 * first group 2, second group or H 3), two bits a neighbour in the order the bonds are
 * written: the bond to the atom before, the H, the ring bond, the branches, the atom after. By
 * place (0 the first ring carbon, 1 the middle ones, 2 the last), whether the chain before the
 * ring (first carbon) or after it (last carbon) attaches there, an H in its brackets and its
 * number of branches. */
typedef struct
{
  guint8 code, n;
} StereoOrder;

static StereoOrder stereo_orders[3][2][2][3];

static StereoOrder
stereo_order (int place, gboolean attached, gboolean h, int n_branch)
{
  gboolean    first = place == 0, last = place == 2;
  gboolean    prefix = first && attached, tail = last && attached;
  StereoOrder o = { 0, 0 };
#define PUT(sym) (o.n < 4 ? (o.code |= (guint8) ((sym) << (2 * o.n))) : 0, o.n++)
  if (!first)
    PUT (0);
  else if (prefix)
    PUT (2);
  if (h)
    PUT (3);
  if (first)
    PUT (0);
  else if (last)
    PUT (1);
  for (int b = 0; b < n_branch; b++)
    PUT (prefix || b > 0 ? 3 : 2);
  if (!last)
    PUT (1);
  else if (tail)
    PUT (n_branch > 0 ? 3 : 2);
#undef PUT
  return o;
}

static void
init_stereo_orders (void)
{
  static gsize done = 0;

  if (g_once_init_enter (&done))
    {
      for (int place = 0; place < 3; place++)
        for (int attached = 0; attached < 2; attached++)
          for (int h = 0; h < 2; h++)
            for (int nb = 0; nb < 3; nb++)
              stereo_orders[place][attached][h][nb] = stereo_order (place, attached, h, nb);
      g_once_init_leave (&done, 1);
    }
}

/* The molecule when no ring stereocentre is left open, as cw_sm_make_molecules makes it: the
 * groups in (position, face) order, an unwritten face up for the first group of a carbon and
 * down for the second, then the canonical numbering (mirror images counted as one when fewer
 * than two carbons are stereocentres). FALSE when a stereocentre is open. */
static gboolean
one_molecule (const Reading *r, CwMolecule *m)
{
  int      n_rel = 0;
  gboolean open = FALSE;

  m->custom_groups = NULL;
  m->n_subs = r->n_subs;
  for (int s = 0; s < r->n_subs; s++)
    {
      gboolean second = s > 0 && r->sub_ring[s - 1] == r->sub_ring[s];
      gboolean first_of_two = s + 1 < r->n_subs && r->sub_ring[s + 1] == r->sub_ring[s];
      int      f = r->sub_face[s];
      m->subs[s].group = r->sub_group[s];
      m->subs[s].position = r->sub_ring[s] + 1;
      m->subs[s].face = f >= 0 ? f : second ? CW_FACE_DOWN : CW_FACE_UP;
      if (second)
        {
          if (m->subs[s - 1].face > m->subs[s].face)
            {
              CwSubstituent t = m->subs[s - 1];
              m->subs[s - 1] = m->subs[s];
              m->subs[s] = t;
            }
          continue;
        }
      /* a stereocentre: one group (and an H), or two different groups */
      if (!first_of_two || cw_sm_group_rank (r->sub_group[s]) != cw_sm_group_rank (r->sub_group[s + 1]))
        {
          n_rel++;
          open |= f < 0;
        }
    }
  if (n_rel >= 2 && open)
    return FALSE;
  cw_sm_canonicalize (m, n_rel < 2);
  return TRUE;
}

int
cw_sm_read_fast (const CwSmIndex *index, CwSmGraph *g, const char *text, int len, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes)
{
  Scan     sc;
  Reading *r;
  int      first = -1, n;
  gboolean tail, prefix, cyclohexyl = FALSE;

  if (len > G_MAXUINT16 || !scan (&sc, text, len))
    return 0;
  /* the ring: a ring bond joining two top-level atoms five apart, all six plain carbons with no
   * bond symbol or other ring bond among them; exactly one such. Another ring of the text then
   * lies inside a group, which the cache check below vets (a plain cyclohexyl, or aromatic). */
  for (int k = 0; k < sc.n_digit; k++)
    {
      int      p = sc.dg_pair[k], start = sc.dg_seg[k];
      gboolean ok;
      if (p < k || start < 0 || sc.dg_seg[p] != start + 5)
        continue;
      ok = !sc.dg_bond[k] && !sc.dg_bond[p];
      for (int j = 0; j < 6 && ok; j++)
        {
          const ChainAtom *a = &sc.chain[start + j];
          ok = (a->kind != RING_NOT_OK) & (a->n_digit == (j == 0 || j == 5)) & !(a->bond_before & ((j > 0) | (start > 0)));
        }
      if (!ok)
        continue;
      if (first >= 0)
        return 0;
      first = start;
    }
  if (first < 0)
    return 0;
  /* every other ring bond stays inside one substituent */
  for (int k = 0; k < sc.n_digit; k++)
    {
      int here = segment_of (&sc, sc.dg_seg[k], first);
      if (here == -3)
        continue; /* the ring's own bond (ring carbons carry no other) */
      if (here != segment_of (&sc, sc.dg_seg[sc.dg_pair[k]], first))
        return 0;
    }
  prefix = first > 0;
  tail = first + 6 < sc.n_chain;
  if (tail && sc.chain[first + 6].bond_before)
    return 0;

  r = g_alloca (sizeof (Reading));
  r->g = g;
  r->index = index;
  r->n_subs = 0;
  r->inner_stereo = FALSE;
  g->text = text;
  g->text_len = len;
  g->n_atoms = CW_RING_SIZE;
  g->n_closures = 0;
  g->n_dots = 0;
  /* '@' inside a group: in any bracket atom but the ring carbons' own */
  {
    int n_at = sc.n_at;
    for (int k = 0; k < CW_RING_SIZE; k++)
      n_at -= sc.chain[first + k].has_at;
    r->inner_stereo = n_at > 0;
  }

  /* the groups in the order their bonds were written: the chain before the ring (on C1), the
   * ring carbons' branches (branches of chain atoms outside the ring lie inside the chains'
   * texts), the chain after the ring (on C6) */
  {
    gboolean missing = FALSE;
    if (prefix)
      {
        const ChainAtom *root = &sc.chain[first - 1];
        r->sub_group[r->n_subs] = cached_group (index, g, text, sc.chain[0].pos, sc.chain[first].pos, root->pos - sc.chain[0].pos, &cyclohexyl);
        r->sub_ring[r->n_subs++] = 0;
      }
    for (int b = 0; b < sc.n_branch; b++)
      {
        guint k = (guint) (sc.br_owner[b] - first);
        if (k >= CW_RING_SIZE)
          continue;
        /* more groups than a ring holds: the general reader says what is wrong */
        if (r->n_subs + tail >= CW_MAX_SUBS)
          return 0;
        r->sub_group[r->n_subs] = cached_group (index, g, text, sc.br_lo[b], sc.br_hi[b], 0, &cyclohexyl);
        r->sub_ring[r->n_subs++] = k;
      }
    if (tail)
      {
        r->sub_group[r->n_subs] = cached_group (index, g, text, sc.chain[first + 6].pos, len, 0, &cyclohexyl);
        r->sub_ring[r->n_subs++] = CW_RING_SIZE - 1;
      }
    for (int s = 0; s < r->n_subs; s++)
      {
        r->sub_face[s] = -1;
        missing |= r->sub_group[s] == NULL;
      }
    if (missing)
      return 0;
  }
  {
    int      s0 = 0;
    gboolean bad = FALSE;
    init_stereo_orders ();
    for (int k = 0; k < CW_RING_SIZE; k++)
      {
        const ChainAtom *a = &sc.chain[first + k];
        int              attached = (k == 0 && prefix) || (k == CW_RING_SIZE - 1 && tail);
        int              degree = 2 + a->n_branch + attached, n_here = a->n_branch + attached;
        int              place = k == 0 ? 0 : k == CW_RING_SIZE - 1 ? 2 : 1;
        guint            parity;
        gboolean         clockwise;
        StereoOrder      o;

        bad |= (degree > 4) | ((a->kind == RING_BRACKET) & (degree + a->hcount != 4));
        r->ring[k] = k;
        g->atoms[k].pos = a->pos;
        g->atoms[k].len = a->len;
        s0 += n_here;
        if (n_here == 0 || a->chirality == CW_SM_CHIRAL_NONE || degree > 4)
          continue;
        /* the neighbour order @/@@ refers to, from the table (see stereo_order) */
        o = stereo_orders[place][attached][a->hcount > 0][a->n_branch];
        if (o.n != 4 || (parity = cw_sm_permutation_parity[o.code]) == 0)
          continue;
        clockwise = (a->chirality == CW_SM_CHIRAL_CLOCKWISE) == (parity == 2);
        r->sub_face[s0 - n_here] = clockwise ? CW_FACE_DOWN : CW_FACE_UP;
        if (n_here == 2)
          r->sub_face[s0 - n_here + 1] = clockwise ? CW_FACE_UP : CW_FACE_DOWN;
      }
    if (bad)
      return 0;
  }
  /* a cyclohexyl group's ring is a second candidate ring with one substituent: ours is the
   * one analysed when it has more than one; with one, the general reader takes the first of the
   * two equal rings (the same molecule either way) and says so in the notes */
  if (cyclohexyl && r->n_subs == 1 && notes)
    return 0;
  info->n_dropped = 0;
  if (max_out >= 1 && !(r->inner_stereo && notes) && one_molecule (r, &out[0]))
    {
      info->n_open = 0;
      info->n_molecules = 1;
      return 1;
    }
  n = cw_sm_make_molecules (r, out, max_out, info, notes, NULL);
  if (n <= 0)
    {
      info->n_open = 0;
      return 0;
    }
  info->n_molecules = n;
  return n;
}
