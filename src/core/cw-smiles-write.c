/* cw-smiles-write.c: canonical isomeric SMILES of a ring and its groups.
 *
 * The molecule is renumbered canonically (cw-smiles-canon.c) and written in one fixed pattern:
 * the first group on C1 written towards the ring, then C1…C6 with ring bond 1 from C1 to C6 and
 * the other groups as branches, e.g. "C[C@@H]1CC[C@H](C)CC1". @/@@ are written on the carbons
 * that carry one group or two different groups when there are at least two such carbons (a
 * relative configuration); a lone stereocentre is written without them, since its absolute
 * configuration does not change the conformational analysis. */
#include "config.h"

#include "cw-smiles-private.h"

enum
{
  PREV,
  NEXT,
  UP,
  DOWN
};

/* Parity of a permutation of {PREV, NEXT, UP, DOWN}: TRUE when even. */
static gboolean
even_permutation (const int w[4])
{
  int inversions = 0;

  for (int i = 0; i < 4; i++)
    for (int j = i + 1; j < 4; j++)
      inversions += w[i] > w[j];
  return inversions % 2 == 0;
}

/* Seen from the up face with positions running clockwise (as every drawing shows them), the
 * order (previous ring carbon, next ring carbon, up group, down group) is anticlockwise, i.e. @. */
static const char *
ring_token (gboolean marked, int n_groups, const int w[4])
{
  gboolean clockwise = even_permutation (w);

  if (!marked)
    return "C";
  if (n_groups == 1)
    return clockwise ? "[C@H]" : "[C@@H]";
  return clockwise ? "[C@]" : "[C@@]";
}

typedef struct
{
  const CwSmIndex *index;
  GString         *out;
} Ctx;

/* Appends the group written from (or, reverse, towards) its attachment atom; FALSE when it has
 * no string written towards it (nothing appended). */
static gboolean
append_group (Ctx *c, const CwGroup *g, gboolean reverse)
{
  char       *fwd, *rev;
  gboolean    owned;
  const char *text;

  cw_sm_group_strings (g, c->index, &fwd, &rev, &owned);
  text = reverse ? rev : fwd;
  if (text)
    g_string_append (c->out, text);
  if (owned)
    {
      g_free (fwd);
      g_free (rev);
    }
  return text != NULL;
}

static void
write_position (Ctx *c, int p, const CwGroup *slot[2], gboolean marked)
{
  int            n = (slot[0] != NULL) + (slot[1] != NULL);
  int            f = slot[0] != NULL ? UP : DOWN; /* face of the single group */
  int            h = f == UP ? DOWN : UP;
  const CwGroup *first = slot[0] != NULL ? slot[0] : slot[1];

  if (p == 1 && append_group (c, first, TRUE))
    {
      int w1[4] = { f, h, PREV, NEXT }, w2[4] = { UP, PREV, DOWN, NEXT };
      g_string_append (c->out, ring_token (marked, n, n == 2 ? w2 : w1));
      g_string_append_c (c->out, '1');
      if (n == 2)
        {
          g_string_append_c (c->out, '(');
          append_group (c, slot[1], FALSE);
          g_string_append_c (c->out, ')');
        }
      return;
    }
  if (p == 1)
    {
      /* the group cannot be written towards the ring: the ring carbon comes first, its implicit
       * H (if any) first in its neighbour order, then ring bond 1, then the groups */
      int w1[4] = { h, PREV, f, NEXT }, w2[4] = { PREV, UP, DOWN, NEXT };
      g_string_append (c->out, ring_token (marked, n, n == 2 ? w2 : w1));
      g_string_append_c (c->out, '1');
      for (int k = 0; k < 2; k++)
        if (slot[k] != NULL)
          {
            g_string_append_c (c->out, '(');
            append_group (c, slot[k], FALSE);
            g_string_append_c (c->out, ')');
          }
      return;
    }
  if (p < CW_RING_SIZE)
    {
      int w1[4] = { PREV, h, f, NEXT }, w2[4] = { PREV, UP, DOWN, NEXT };
      g_string_append (c->out, n ? ring_token (marked, n, n == 2 ? w2 : w1) : "C");
      for (int k = 0; k < 2; k++)
        if (slot[k] != NULL)
          {
            g_string_append_c (c->out, '(');
            append_group (c, slot[k], FALSE);
            g_string_append_c (c->out, ')');
          }
      return;
    }
  {
    int w1[4] = { PREV, h, NEXT, f }, w2[4] = { PREV, NEXT, UP, DOWN };
    int written = 0;
    g_string_append (c->out, n ? ring_token (marked, n, n == 2 ? w2 : w1) : "C");
    g_string_append_c (c->out, '1');
    for (int k = 0; k < 2; k++)
      if (slot[k] != NULL)
        {
          gboolean branch = ++written < n;
          if (branch)
            g_string_append_c (c->out, '(');
          append_group (c, slot[k], FALSE);
          if (branch)
            g_string_append_c (c->out, ')');
        }
  }
}

static void
write_numbered (const CwMolecule *m, const CwSmIndex *index, const gboolean *relevant, gboolean marks, GString *out)
{
  const CwGroup *slot[CW_RING_SIZE + 1][2] = { { NULL } };
  Ctx            c = { index, out };

  for (int i = 0; i < m->n_subs; i++)
    slot[m->subs[i].position][m->subs[i].face == CW_FACE_UP ? 0 : 1] = m->subs[i].group;
  for (int p = 1; p <= CW_RING_SIZE; p++)
    write_position (&c, p, slot[p], marks && relevant[p]);
}

void
cw_sm_write_molecule (const CwMolecule *mol, const CwSmIndex *index, GString *out)
{
  CwMolecule      m;
  CwRingTransform t;
  gboolean        relevant[CW_RING_SIZE + 1];
  gboolean        marks;

  if (mol->n_subs == 0)
    {
      g_string_append (out, "C1CCCCC1");
      return;
    }
  marks = cw_sm_relevant_carbons (mol, relevant) >= 2;
  cw_sm_canonical_transform (mol, !marks, &t);
  m.custom_groups = NULL;
  cw_sm_apply_transform (mol, &t, &m);
  cw_sm_relevant_carbons (&m, relevant);
  write_numbered (&m, index, relevant, marks, out);
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
