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

/* The token of a marked carbon with n_groups groups and neighbour order w. */
static int
marked_token_of (int n_groups, const int w[4])
{
  gboolean clockwise = even_permutation (w);

  if (n_groups == 1)
    return clockwise ? 1 : 2;
  return clockwise ? 3 : 4;
}

/* Where a ring carbon stands in the written pattern, which fixes its neighbour order. */
enum
{
  AT_C1_AFTER_GROUP, /* C1 written after its first group */
  AT_C1_FIRST,       /* C1 written first (its group cannot be written towards the ring) */
  AT_MIDDLE,         /* C2…C5 */
  AT_C6,             /* C6, closing ring bond 1 */
  N_PLACES
};

/* The neighbour order (previous ring carbon, next, up group, down group, in writing order) of a
 * marked carbon with n groups, f the face of a single group; h the other face (its H). */
static void
neighbour_order (int place, int n, int f, int w[4])
{
  int h = f == UP ? DOWN : UP;

  switch (place)
    {
    case AT_C1_AFTER_GROUP:
      memcpy (w, n == 2 ? (int[4]){ UP, PREV, DOWN, NEXT } : (int[4]){ f, h, PREV, NEXT }, sizeof (int[4]));
      break;
    case AT_C1_FIRST:
      memcpy (w, n == 2 ? (int[4]){ PREV, UP, DOWN, NEXT } : (int[4]){ h, PREV, f, NEXT }, sizeof (int[4]));
      break;
    case AT_MIDDLE:
      memcpy (w, n == 2 ? (int[4]){ PREV, UP, DOWN, NEXT } : (int[4]){ PREV, h, f, NEXT }, sizeof (int[4]));
      break;
    default:
      memcpy (w, n == 2 ? (int[4]){ PREV, NEXT, UP, DOWN } : (int[4]){ PREV, h, NEXT, f }, sizeof (int[4]));
      break;
    }
}

/* The token of a marked carbon, by place, number of groups (1 or 2) and single group's face
 * (0 up, 1 down): worked out once from neighbour_order. */
static guint8 marked_token[N_PLACES][3][2];

static void
init_marked_tokens (void)
{
  static gsize done = 0;

  if (g_once_init_enter (&done))
    {
      for (int place = 0; place < N_PLACES; place++)
        for (int n = 1; n <= 2; n++)
          for (int face = 0; face < 2; face++)
            {
              int w[4];
              neighbour_order (place, n, face == 0 ? UP : DOWN, w);
              marked_token[place][n][face] = marked_token_of (n, w);
            }
      g_once_init_leave (&done, 1);
    }
}

static inline int
carbon_token (gboolean marked, int place, int n, int face)
{
  return marked_token[place][n][face] & -(int) (marked != 0); /* row n = 0 is all zero */
}

/* The text of one group: written from its attachment atom (fwd) and towards it (rev, or NULL). */
typedef struct
{
  const char *fwd, *rev;
  gsize       fwd_len, rev_len;
  char       *owned_fwd, *owned_rev;
} GroupText;

static const char      empty_pad[CW_SM_TEXT_PAD] = { 0 };
static const GroupText empty_text = { empty_pad, NULL, 0, 0, NULL, NULL };

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

/* A group's text, CW_SM_TEXT_PAD bytes a step: the texts are padded (cw_sm_pad_text) and the
 * output has room for the overrun, so short texts cost one fixed-size copy. */
static inline void
copy_text (char *dst, const char *s, gsize n)
{
  memcpy (dst, s, CW_SM_TEXT_PAD);
  for (gsize k = CW_SM_TEXT_PAD; k < n; k += CW_SM_TEXT_PAD)
    memcpy (dst + k, s + k, CW_SM_TEXT_PAD);
}

static inline void
put (Ctx *c, const char *s, gsize n)
{
  copy_text (c->p, s, n);
  c->p += n;
}

/* "(text)", or nothing for an empty slot (length 0): written either way, kept only when the
 * slot holds a group, so the common case takes no branch. */
static inline void
put_branch_if (Ctx *c, const GroupText *t)
{
  c->p[0] = '(';
  copy_text (c->p + 1, t->fwd, t->fwd_len);
  c->p[1 + t->fwd_len] = ')';
  c->p += t->fwd_len ? t->fwd_len + 2 : 0;
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

/* C1: its first group written towards the ring when it can be, then the ring carbon and ring
 * bond 1; otherwise the ring carbon first, its implicit H (if any) first in its neighbour
 * order, then ring bond 1, then the groups. */
static void
write_c1 (Ctx *c, const GroupText *slot[2], gboolean marked)
{
  int              n = (slot[0] != NULL) + (slot[1] != NULL);
  int              face = slot[0] != NULL ? 0 : 1; /* of a single group: 0 up, 1 down */
  const GroupText *first = slot[0] != NULL ? slot[0] : slot[1];

  if (first != NULL && first->rev != NULL)
    {
      put (c, first->rev, first->rev_len);
      put_token (c, carbon_token (marked, AT_C1_AFTER_GROUP, n, face));
      put_c (c, '1');
      put_branch_if (c, n == 2 ? slot[1] : &empty_text);
      return;
    }
  put_token (c, carbon_token (marked, AT_C1_FIRST, n, face));
  put_c (c, '1');
  put_branch_if (c, slot[0] ? slot[0] : &empty_text);
  put_branch_if (c, slot[1] ? slot[1] : &empty_text);
}

/* C2…C5: the carbon, then its groups as branches. */
static inline void
write_middle (Ctx *c, const GroupText *slot[2], gboolean marked)
{
  int n = (slot[0] != NULL) + (slot[1] != NULL);
  int face = slot[0] != NULL ? 0 : 1;

  put_token (c, carbon_token (marked, AT_MIDDLE, n, face));
  put_branch_if (c, slot[0] ? slot[0] : &empty_text);
  put_branch_if (c, slot[1] ? slot[1] : &empty_text);
}

/* C6: the carbon, ring bond 1, a second group as a branch, the last one written plainly. */
static inline void
write_c6 (Ctx *c, const GroupText *slot[2], gboolean marked)
{
  int              n = (slot[0] != NULL) + (slot[1] != NULL);
  int              face = slot[0] != NULL ? 0 : 1;
  const GroupText *last = slot[1] ? slot[1] : slot[0] ? slot[0] : &empty_text;

  put_token (c, carbon_token (marked, AT_C6, n, face));
  put_c (c, '1');
  put_branch_if (c, n == 2 ? slot[0] : &empty_text);
  put (c, last->fwd, last->fwd_len);
}

static void
write_numbered (const CwMolecule *m, const CwSmIndex *index, const gboolean *relevant, gboolean marks, GString *out)
{
  GroupText        text[CW_MAX_SUBS];
  const GroupText *slot[CW_RING_SIZE + 1][2] = { { NULL } };
  /* tokens are copied 8 bytes at a time, texts CW_SM_TEXT_PAD bytes at a time */
  gsize            start = out->len, bound = 6 * (8 + 2 * (2 + CW_SM_TEXT_PAD)) + 12;
  Ctx              c;
  gboolean         owned = FALSE; /* texts made here, to be freed */

  init_marked_tokens ();
  for (int i = 0; i < m->n_subs; i++)
    {
      group_text (m->subs[i].group, index, &text[i]);
      owned |= text[i].owned_fwd != NULL || text[i].owned_rev != NULL;
      bound += text[i].fwd_len + text[i].rev_len + 2 + 2 * CW_SM_TEXT_PAD;
      slot[m->subs[i].position][m->subs[i].face == CW_FACE_UP ? 0 : 1] = &text[i];
    }
  if (out->allocated_len <= start + bound)
    g_string_set_size (out, start + bound);
  c.p = out->str + start;
  write_c1 (&c, slot[1], marks && relevant[1]);
  for (int p = 2; p < CW_RING_SIZE; p++)
    write_middle (&c, slot[p], marks && relevant[p]);
  write_c6 (&c, slot[CW_RING_SIZE], marks && relevant[CW_RING_SIZE]);
  out->len = c.p - out->str;
  out->str[out->len] = '\0';
  for (int i = 0; i < m->n_subs && owned; i++)
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
