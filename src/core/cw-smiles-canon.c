/* cw-smiles-canon.c: canonical ring numbering of a CwMolecule.
 *
 * Convention (shared with the SMILES reader and writer): seen from the up face, positions 1→6 run
 * anticlockwise. Renumbering in the other direction therefore swaps up and down (the ring is
 * turned over: the same molecule); swapping the faces alone gives the mirror image. */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"

#define EMPTY G_GINT64_CONSTANT (1) << 40

gint64
cw_sm_group_rank (const CwGroup *g)
{
  if (g == NULL)
    return EMPTY;
  if (g->index >= 0 && !g->custom)
    return g->index;
  return 100000 + (g->id ? g_str_hash (g->id) % 1000000 : 0);
}

static int
source_position (const CwRingTransform *t, int p)
{
  return ((t->start - 1 + t->dir * (p - 1)) % 6 + 12) % 6 + 1;
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

void
cw_sm_molecule_key (const CwMolecule *mol, const CwRingTransform *t, gint64 key[CW_SM_KEY_LEN])
{
  const CwGroup *slot[CW_RING_SIZE + 1][2] = { { NULL } };
  gint64 occupancy = 0;
  gboolean swap = swaps_faces (t);

  for (int i = 0; i < mol->n_subs; i++)
    {
      const CwSubstituent *s = &mol->subs[i];
      slot[s->position][s->face == CW_FACE_UP ? 0 : 1] = s->group;
    }
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      int q = source_position (t, p);
      const CwGroup *up = slot[q][swap ? 1 : 0], *down = slot[q][swap ? 0 : 1];
      int count = (up != NULL) + (down != NULL);
      occupancy = occupancy * 3 + (2 - count);
      key[2 * p - 1] = cw_sm_group_rank (up);
      key[2 * p] = cw_sm_group_rank (down);
    }
  key[0] = occupancy;
}

static int
compare_keys (const gint64 *a, const gint64 *b)
{
  for (int i = 0; i < CW_SM_KEY_LEN; i++)
    if (a[i] != b[i])
      return a[i] < b[i] ? -1 : 1;
  return 0;
}

void
cw_sm_canonical_transform (const CwMolecule *mol, gboolean mirror, CwRingTransform *out)
{
  gint64 best[CW_SM_KEY_LEN], key[CW_SM_KEY_LEN];
  gboolean have = FALSE;

  for (int f = 0; f < (mirror ? 2 : 1); f++)
    for (int d = 0; d < 2; d++)
      for (int s = 1; s <= CW_RING_SIZE; s++)
        {
          CwRingTransform t = { s, d ? -1 : 1, f };
          cw_sm_molecule_key (mol, &t, key);
          if (!have || compare_keys (key, best) < 0)
            {
              memcpy (best, key, sizeof best);
              *out = t;
              have = TRUE;
            }
        }
}

void
cw_sm_apply_transform (const CwMolecule *in, const CwRingTransform *t, CwMolecule *out)
{
  const CwSubstituent *slot[CW_RING_SIZE + 1][2] = { { NULL } };
  gboolean swap = swaps_faces (t);
  int n = 0;

  for (int i = 0; i < in->n_subs; i++)
    slot[in->subs[i].position][in->subs[i].face == CW_FACE_UP ? 0 : 1] = &in->subs[i];
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      int q = source_position (t, p);
      for (int f = 0; f < 2; f++)
        {
          const CwSubstituent *s = slot[q][swap ? 1 - f : f];
          if (s == NULL)
            continue;
          out->subs[n].group = s->group;
          out->subs[n].position = p;
          out->subs[n].face = f == 0 ? CW_FACE_UP : CW_FACE_DOWN;
          n++;
        }
    }
  out->n_subs = n;
}

int
cw_sm_relevant_carbons (const CwMolecule *mol, gboolean relevant[CW_RING_SIZE + 1])
{
  const CwGroup *slot[CW_RING_SIZE + 1][2] = { { NULL } };
  int n = 0;

  for (int i = 0; i < mol->n_subs; i++)
    slot[mol->subs[i].position][mol->subs[i].face == CW_FACE_UP ? 0 : 1] = mol->subs[i].group;
  for (int p = 0; p <= CW_RING_SIZE; p++)
    {
      const CwGroup *a = slot[p][0], *b = slot[p][1];
      relevant[p] = p > 0 && (a != NULL || b != NULL) && cw_sm_group_rank (a) != cw_sm_group_rank (b);
      n += relevant[p];
    }
  return n;
}
