/* cw-smiles-canon.c: canonical ring numbering of a CwMolecule.
 *
 * Convention (shared with the SMILES reader and writer): seen from the up face, positions 1→6 run
 * clockwise (as the flat drawing shows them). Renumbering in the other direction therefore swaps up and down (the ring is
 * turned over: the same molecule); swapping the faces alone gives the mirror image. */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"

#define EMPTY G_GINT64_CONSTANT (1) << 40

/* source position of result position p under start s (1..6) and direction d (0: +1, 1: -1) */
/* clang-format off */
static const guint8 source_table[2][CW_RING_SIZE + 1][CW_RING_SIZE + 1] = {
  { { 0 }, { 0, 1, 2, 3, 4, 5, 6 }, { 0, 2, 3, 4, 5, 6, 1 }, { 0, 3, 4, 5, 6, 1, 2 },
    { 0, 4, 5, 6, 1, 2, 3 }, { 0, 5, 6, 1, 2, 3, 4 }, { 0, 6, 1, 2, 3, 4, 5 } },
  { { 0 }, { 0, 1, 6, 5, 4, 3, 2 }, { 0, 2, 1, 6, 5, 4, 3 }, { 0, 3, 2, 1, 6, 5, 4 },
    { 0, 4, 3, 2, 1, 6, 5 }, { 0, 5, 4, 3, 2, 1, 6 }, { 0, 6, 5, 4, 3, 2, 1 } },
};
/* clang-format on */

static inline int
source_position (const CwRingTransform *t, int p)
{
  return source_table[t->dir < 0][t->start][p];
}

static gboolean
swaps_faces (const CwRingTransform *t)
{
  return (t->dir < 0) != (t->flip != FALSE);
}

int
cw_sm_transform_source (const CwRingTransform *t, int p)
{
  return source_position (t, p);
}

gboolean
cw_sm_transform_swaps (const CwRingTransform *t)
{
  return swaps_faces (t);
}

typedef struct
{
  gint64 rank[CW_RING_SIZE + 1][2]; /* [position][0 up, 1 down] */
  int    count[CW_RING_SIZE + 1];
} Slots;

static void
fill_slots (const CwMolecule *mol, Slots *s)
{
  for (int p = 0; p <= CW_RING_SIZE; p++)
    {
      s->rank[p][0] = s->rank[p][1] = EMPTY;
      s->count[p] = 0;
    }
  for (int i = 0; i < mol->n_subs; i++)
    {
      const CwSubstituent *x = &mol->subs[i];
      s->rank[x->position][x->face == CW_FACE_UP ? 0 : 1] = cw_sm_group_rank (x->group);
      s->count[x->position]++;
    }
}

static void
key_from_slots (const Slots *s, const CwRingTransform *t, gint64 key[CW_SM_KEY_LEN])
{
  int    swap = swaps_faces (t) ? 1 : 0;
  gint64 occupancy = 0;

  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      int q = source_position (t, p);
      occupancy = occupancy * 3 + (2 - s->count[q]);
      key[2 * p - 1] = s->rank[q][swap];
      key[2 * p] = s->rank[q][1 - swap];
    }
  key[0] = occupancy;
}

void
cw_sm_molecule_key (const CwMolecule *mol, const CwRingTransform *t, gint64 key[CW_SM_KEY_LEN])
{
  Slots s;

  fill_slots (mol, &s);
  key_from_slots (&s, t, key);
}

/* A group rank in 21 bits, order kept: table ranks and custom ones stay below 2^21 - 1, and an
 * empty slot (rank 2^40) becomes 2^21 - 1. */
static inline guint64
rank21 (gint64 rank)
{
  return rank >= (1 << 21) - 1 ? (1 << 21) - 1 : (guint64) rank;
}

/* The same order as comparing the keys of key_from_slots, on packed numbers: the occupancy,
 * then per result position one number holding (first face's rank, second face's rank). */
void
cw_sm_canonical_transform (const CwMolecule *mol, gboolean mirror, CwRingTransform *out)
{
  guint64 packed[2][CW_RING_SIZE + 1], best[CW_RING_SIZE + 1], rank[CW_RING_SIZE + 1][2];
  int     count[CW_RING_SIZE + 1] = { 0 }, max_count = 0;
  guint   best_occupancy = 0x1000, fwd = 0, bwd = 0; /* above every 12-bit occupancy: the first candidate wins */
  int     starts[CW_RING_SIZE], n_starts = 0;

  for (int p = 1; p <= CW_RING_SIZE; p++)
    rank[p][0] = rank[p][1] = (1 << 21) - 1;
  for (int i = 0; i < mol->n_subs; i++)
    {
      const CwSubstituent *x = &mol->subs[i];
      rank[x->position][x->face == CW_FACE_UP ? 0 : 1] = rank21 (cw_sm_group_rank (x->group));
      count[x->position]++;
    }
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      max_count = MAX (max_count, count[p]);
      packed[0][p] = rank[p][0] << 21 | rank[p][1];
      packed[1][p] = rank[p][1] << 21 | rank[p][0];
    }
  /* occupancy digits (2 - count) two bits each, the first position in the highest bits: a
   * numbering's digits are a rotation of the forward or the backward sequence, and comparing
   * the 12-bit numbers compares the sequences as the base-3 occupancy of the keys does */
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      fwd = fwd << 2 | (guint) (2 - count[p]);
      bwd = bwd << 2 | (guint) (2 - count[source_table[1][1][p]]);
      starts[n_starts] = p; /* kept when p has the most groups */
      n_starts += count[p] == max_count;
    }
  /* only numberings that start on a carbon with the most groups can win; of those the ones
   * with the lowest locants, then the lowest ranks; the first of equals is kept */
  for (int f = 0; f < (mirror ? 2 : 1); f++)
    for (int d = 0; d < 2; d++)
      for (int k = 0; k < n_starts; k++)
        {
          int            st = starts[k], sh;
          const guint8  *src = source_table[d][st];
          const guint64 *pk = packed[d != f];
          guint          occupancy;
          int            p;
          /* forward from st: fwd turned by st - 1 digits; backward from st (st, st-1, …): bwd
           * (1, 6, 5, …) turned by 6 - (st - 1) digits */
          static const guint8 turn[2][CW_RING_SIZE + 1] = { { 0, 0, 2, 4, 6, 8, 10 }, { 0, 0, 10, 8, 6, 4, 2 } };
          guint               seq = d ? bwd : fwd;
          sh = turn[d][st];
          occupancy = ((seq << sh) | (seq >> (12 - sh))) & 0xfff;
          if (occupancy > best_occupancy)
            continue;
          if (occupancy == best_occupancy)
            {
              for (p = 1; p <= CW_RING_SIZE && pk[src[p]] == best[p]; p++)
                ;
              if (p > CW_RING_SIZE || pk[src[p]] > best[p])
                continue;
            }
          for (p = 1; p <= CW_RING_SIZE; p++)
            best[p] = pk[src[p]];
          best_occupancy = occupancy;
          out->start = st;
          out->dir = d ? -1 : 1;
          out->flip = f;
        }
}

void
cw_sm_apply_transform (const CwMolecule *in, const CwRingTransform *t, CwMolecule *out)
{
  static const CwSubstituent none = { NULL }; /* an empty slot: no group */
  const CwSubstituent       *slot[CW_RING_SIZE + 1][2];
  gboolean                   swap = swaps_faces (t);
  int                        n = 0;

  for (int p = 0; p <= CW_RING_SIZE; p++)
    slot[p][0] = slot[p][1] = &none;
  for (int i = 0; i < in->n_subs; i++)
    slot[in->subs[i].position][in->subs[i].face == CW_FACE_UP ? 0 : 1] = &in->subs[i];
  /* written without branches on the data: every slot is stored, and only a filled one moves
   * the count on (out->subs has room for the extra store: at most CW_MAX_SUBS - 1 are kept
   * before the last carbon's two stores) */
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      int q = source_position (t, p);
      for (int f = 0; f < 2; f++)
        {
          const CwSubstituent *s = slot[q][swap ? 1 - f : f];
          int                  k = MIN (n, CW_MAX_SUBS - 1);
          out->subs[k].group = s->group;
          out->subs[k].position = p;
          out->subs[k].face = f == 0 ? CW_FACE_UP : CW_FACE_DOWN;
          n += s != &none;
        }
    }
  out->n_subs = n;
}

void
cw_sm_canonicalize (CwMolecule *mol, gboolean mirror)
{
  CwRingTransform t;
  CwMolecule      tmp;

  cw_sm_canonical_transform (mol, mirror, &t);
  cw_sm_apply_transform (mol, &t, &tmp);
  memcpy (mol->subs, tmp.subs, sizeof mol->subs); /* all of it: a fixed size, copied inline */
  mol->n_subs = tmp.n_subs;
}

int
cw_sm_relevant_carbons (const CwMolecule *mol, gboolean relevant[CW_RING_SIZE + 1])
{
  gint64 rank[CW_RING_SIZE + 1][2];
  int    n = 0;

  /* ranks, an empty slot ranking as cw_sm_group_rank (NULL) does: two empty slots are equal */
  for (int p = 0; p <= CW_RING_SIZE; p++)
    rank[p][0] = rank[p][1] = cw_sm_group_rank (NULL);
  for (int i = 0; i < mol->n_subs; i++)
    rank[mol->subs[i].position][mol->subs[i].face == CW_FACE_UP ? 0 : 1] = cw_sm_group_rank (mol->subs[i].group);
  relevant[0] = FALSE;
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      relevant[p] = rank[p][0] != rank[p][1];
      n += relevant[p];
    }
  return n;
}

void
cw_sm_append_configuration (const CwMolecule *mol, GString *out)
{
  cw_molecule_append_configuration (mol, out);
}
