/* cw-smiles-write.c: canonical isomeric SMILES of a ring and its groups.
 *
 * The molecule is renumbered canonically (cw-smiles-canon.c) and written in one fixed pattern:
 * the first group on C1 written towards the ring, then C1…C6 with ring bond 1 from C1 to C6 and
 * the other groups as branches, e.g. "C[C@@H]1CC[C@H](C)CC1". @/@@ are written on the carbons
 * that carry one group or two different groups when there are at least two such carbons (a
 * relative configuration); a lone stereocentre is written without them, since its absolute
 * configuration does not change the conformational analysis. */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"

enum
{
  PREV,
  NEXT,
  UP,
  DOWN
};

/* Parity of a permutation of {PREV, NEXT, UP, DOWN}: TRUE when even. */
static inline gboolean
even_permutation (const int w[4])
{
  return cw_sm_permutation_parity[w[0] | w[1] << 2 | w[2] << 4 | w[3] << 6] == 2;
}

/* Seen from the up face with positions running clockwise (as every drawing shows them), the
 * order (previous ring carbon, next ring carbon, up group, down group) is anticlockwise, i.e. @. */
/* The ring carbon's token: an index into tokens[]. */
static const char tokens[5][8] = { "C", "[C@H]", "[C@@H]", "[C@]", "[C@@]" };
static const guint8 token_len[5] = { 1, 5, 6, 4, 5 };

static inline int
ring_token (gboolean marked, int n_groups, const int w[4])
{
  gboolean clockwise;

  if (!marked)
    return 0;
  clockwise = even_permutation (w);
  if (n_groups == 1)
    return clockwise ? 1 : 2;
  return clockwise ? 3 : 4;
}

/* The text of one group: written from its attachment atom (fwd) and towards it (rev, or NULL). */
typedef struct
{
  const char *fwd, *rev;
  gsize       fwd_len, rev_len;
  char       *owned_fwd, *owned_rev;
} GroupText;

static void
group_text (const CwGroup *g, const CwSmIndex *index, GroupText *t)
{
  char    *fwd, *rev;
  gboolean owned;

  if (index && g->index >= 0 && (guint) g->index < index->n_groups && index->groups[g->index] == g &&
      index->fwd_len[g->index] > 0)
    {
      t->fwd = index->fwd[g->index];
      t->fwd_len = index->fwd_len[g->index];
      t->rev = index->rev[g->index];
      t->rev_len = t->rev ? index->rev_len[g->index] : 0;
      if (t->rev && t->rev_len == 0)
        t->rev_len = strlen (t->rev);
      t->owned_fwd = t->owned_rev = NULL;
      return;
    }
  cw_sm_group_strings (g, index, &fwd, &rev, &owned);
  t->fwd = fwd;
  t->rev = rev;
  t->fwd_len = fwd ? strlen (fwd) : 0;
  t->rev_len = rev ? strlen (rev) : 0;
  t->owned_fwd = owned ? fwd : NULL;
  t->owned_rev = owned ? rev : NULL;
}

/* The output is written straight into the string's buffer, sized beforehand. */
typedef struct
{
  char *p;
} Ctx;

static inline void
put (Ctx *c, const char *s, gsize n)
{
  memcpy (c->p, s, n);
  c->p += n;
}

static inline void
put_c (Ctx *c, char ch)
{
  *c->p++ = ch;
}

/* Copies all eight bytes (the buffer has room for them) and moves on by the token's length. */
static inline void
put_token (Ctx *c, int token)
{
  memcpy (c->p, tokens[token], 8);
  c->p += token_len[token];
}

static inline void
put_branch (Ctx *c, const GroupText *t)
{
  put_c (c, '(');
  put (c, t->fwd, t->fwd_len);
  put_c (c, ')');
}

static void
write_position (Ctx *c, int p, const GroupText *slot[2], gboolean marked)
{
  int              n = (slot[0] != NULL) + (slot[1] != NULL);
  int              f = slot[0] != NULL ? UP : DOWN; /* face of the single group */
  int              h = f == UP ? DOWN : UP;
  const GroupText *first = slot[0] != NULL ? slot[0] : slot[1];

  if (p == 1 && first->rev != NULL)
    {
      int w1[4] = { f, h, PREV, NEXT }, w2[4] = { UP, PREV, DOWN, NEXT };
      put (c, first->rev, first->rev_len);
      put_token (c, ring_token (marked, n, n == 2 ? w2 : w1));
      put_c (c, '1');
      if (n == 2)
        put_branch (c, slot[1]);
      return;
    }
  if (p == 1)
    {
      /* the group cannot be written towards the ring: the ring carbon comes first, its implicit
       * H (if any) first in its neighbour order, then ring bond 1, then the groups */
      int w1[4] = { h, PREV, f, NEXT }, w2[4] = { PREV, UP, DOWN, NEXT };
      put_token (c, ring_token (marked, n, n == 2 ? w2 : w1));
      put_c (c, '1');
      for (int k = 0; k < 2; k++)
        if (slot[k] != NULL)
          put_branch (c, slot[k]);
      return;
    }
  if (p < CW_RING_SIZE)
    {
      int w1[4] = { PREV, h, f, NEXT }, w2[4] = { PREV, UP, DOWN, NEXT };
      put_token (c, n ? ring_token (marked, n, n == 2 ? w2 : w1) : 0);
      for (int k = 0; k < 2; k++)
        if (slot[k] != NULL)
          put_branch (c, slot[k]);
      return;
    }
  {
    int w1[4] = { PREV, h, NEXT, f }, w2[4] = { PREV, NEXT, UP, DOWN };
    int written = 0;
    put_token (c, n ? ring_token (marked, n, n == 2 ? w2 : w1) : 0);
    put_c (c, '1');
    for (int k = 0; k < 2; k++)
      if (slot[k] != NULL)
        {
          if (++written < n)
            put_branch (c, slot[k]);
          else
            put (c, slot[k]->fwd, slot[k]->fwd_len);
        }
  }
}

static void
write_numbered (const CwMolecule *m, const CwSmIndex *index, const gboolean *relevant, gboolean marks, GString *out)
{
  GroupText        text[CW_MAX_SUBS];
  const GroupText *slot[CW_RING_SIZE + 1][2] = { { NULL } };
  gsize            start = out->len, bound = 6 * 8 + 12; /* tokens are copied 8 bytes at a time */
  Ctx              c;

  for (int i = 0; i < m->n_subs; i++)
    {
      group_text (m->subs[i].group, index, &text[i]);
      bound += text[i].fwd_len + text[i].rev_len + 2;
      slot[m->subs[i].position][m->subs[i].face == CW_FACE_UP ? 0 : 1] = &text[i];
    }
  g_string_set_size (out, start + bound);
  c.p = out->str + start;
  for (int p = 1; p <= CW_RING_SIZE; p++)
    write_position (&c, p, slot[p], marks && relevant[p]);
  g_string_truncate (out, c.p - out->str);
  for (int i = 0; i < m->n_subs; i++)
    {
      g_free (text[i].owned_fwd);
      g_free (text[i].owned_rev);
    }
}

void
cw_sm_write_molecule (const CwMolecule *mol, const CwSmIndex *index, GString *out)
{
  CwMolecule m;
  gboolean   relevant[CW_RING_SIZE + 1];

  /* a lone stereocentre is written without @/@@, so mirror images number alike */
  m.n_subs = mol->n_subs;
  m.custom_groups = NULL;
  memcpy (m.subs, mol->subs, sizeof (CwSubstituent) * mol->n_subs);
  cw_sm_canonicalize (&m, cw_sm_relevant_carbons (mol, relevant) < 2);
  cw_sm_write_canonical (&m, index, out);
}

void
cw_sm_write_canonical (const CwMolecule *mol, const CwSmIndex *index, GString *out)
{
  gboolean relevant[CW_RING_SIZE + 1];
  gboolean marks;

  if (mol->n_subs == 0)
    {
      g_string_append (out, "C1CCCCC1");
      return;
    }
  marks = cw_sm_relevant_carbons (mol, relevant) >= 2;
  write_numbered (mol, index, relevant, marks, out);
}
