/* cw-isomers.c: every cis/trans isomer of a constitution, its conformer-averaged free energy
 * and the equilibrium among the isomers (see cw-isomers.h for the counting rules). */
#include "config.h"

#include "cw-isomers.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-smiles-private.h"
#include "cw-smiles.h"

#define MAX_COMBOS 64

/* Key of a chair conformer under a proper renumbering: each slot holds group rank and whether
 * the group is axial. Axial status is a property of the conformer, unchanged by renumbering. */
static void
conformer_key (const CwMolecule *mol, int chair, const CwRingTransform *t, gint64 key[CW_SM_KEY_LEN])
{
  gint64   slot[CW_RING_SIZE + 1][2];
  gboolean swap = cw_sm_transform_swaps (t);

  for (int p = 0; p <= CW_RING_SIZE; p++)
    slot[p][0] = slot[p][1] = G_GINT64_CONSTANT (1) << 40;
  for (int i = 0; i < mol->n_subs; i++)
    {
      const CwSubstituent *s = &mol->subs[i];
      /* chair 1: odd carbons have their axial bond up (DEVELOPERS.md, the model) */
      gboolean axial_up = (s->position % 2 == 1) == (chair == 0);
      gboolean axial = (s->face == CW_FACE_UP) == axial_up;
      slot[s->position][s->face == CW_FACE_UP ? 0 : 1] = cw_sm_group_rank (s->group) * 2 + axial;
    }
  key[0] = 0;
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      int q = cw_sm_transform_source (t, p);
      key[2 * p - 1] = slot[q][swap ? 1 : 0];
      key[2 * p] = slot[q][swap ? 0 : 1];
    }
}

static void
min_key (const CwMolecule *mol, int chair, gint64 best[CW_SM_KEY_LEN])
{
  gint64 key[CW_SM_KEY_LEN];

  for (int d = 0; d < 2; d++)
    for (int s = 1; s <= CW_RING_SIZE; s++)
      {
        CwRingTransform t = { s, d ? -1 : 1, FALSE };
        if (chair < 0)
          {
            cw_sm_molecule_key (mol, &t, key);
            key[0] = 0;
          }
        else
          conformer_key (mol, chair, &t, key);
        if ((d == 0 && s == 1) || memcmp (key, best, sizeof key) < 0)
          {
            /* memcmp on gint64 is not a numeric order, but any fixed total order will do */
            memcpy (best, key, sizeof key);
          }
      }
}

static void
mirror_of (const CwMolecule *mol, CwMolecule *out)
{
  *out = *mol;
  out->custom_groups = NULL;
  for (int i = 0; i < out->n_subs; i++)
    out->subs[i].face = out->subs[i].face == CW_FACE_UP ? CW_FACE_DOWN : CW_FACE_UP;
}

static double
log_sum_exp (const double *e, int n, double rt, double *mean)
{
  double lo = e[0], z = 0, s = 0;

  for (int i = 1; i < n; i++)
    lo = MIN (lo, e[i]);
  for (int i = 0; i < n; i++)
    {
      double w = exp (-(e[i] - lo) / rt);
      z += w;
      s += w * e[i];
    }
  *mean = s / z;
  return lo - rt * log (z);
}

static void
cw_isomer_free (CwIsomer *iso)
{
  cw_molecule_free (iso->molecule);
  g_free (iso->smiles);
  g_free (iso->configuration);
  g_free (iso);
}

static CwIsomer *
make_isomer (const CwData *data, const CwMolecule *m, const CwConditions *cond, GError **error)
{
  g_autoptr (CwMolecule) mol = cw_molecule_new ();
  CwIsomer   *iso;
  CwMolecule  mirror;
  CwAnalysis *mirror_an;
  gint64      keys[4][CW_SM_KEY_LEN], km[CW_SM_KEY_LEN], kmm[CW_SM_KEY_LEN];
  double      energies[4], rt = CW_R_KCAL * cond->temperature;

  for (int i = 0; i < m->n_subs; i++)
    if (!cw_molecule_set (mol, m->subs[i].position, m->subs[i].face, m->subs[i].group, error))
      return NULL;
  iso = g_new0 (CwIsomer, 1);
  iso->molecule = g_steal_pointer (&mol);
  if (!cw_analyze (data, iso->molecule, cond, &iso->analysis, error))
    {
      cw_isomer_free (iso);
      return NULL;
    }
  mirror_of (iso->molecule, &mirror);
  mirror_an = g_new (CwAnalysis, 1);
  if (!cw_analyze (data, &mirror, cond, mirror_an, error))
    {
      g_free (mirror_an);
      cw_isomer_free (iso);
      return NULL;
    }
  min_key (iso->molecule, -1, km);
  min_key (&mirror, -1, kmm);
  iso->chiral = memcmp (km, kmm, sizeof km) != 0;
  for (int x = 0; x < 2; x++)
    for (int c = 0; c < 2; c++)
      {
        const CwMolecule *which = x == 0 ? iso->molecule : &mirror;
        const CwAnalysis *an = x == 0 ? &iso->analysis : mirror_an;
        gboolean          dup = FALSE;
        min_key (which, c, keys[iso->n_species]);
        for (int k = 0; k < iso->n_species && !dup; k++)
          dup = memcmp (keys[k], keys[iso->n_species], sizeof keys[k]) == 0;
        if (!dup)
          energies[iso->n_species++] = an->chair[c].energy;
      }
  g_free (mirror_an);
  memcpy (iso->species_energy, energies, sizeof energies);
  iso->g = log_sum_exp (energies, iso->n_species, rt, &iso->h_mean);
  iso->smiles = cw_smiles_write (iso->molecule);
  iso->configuration = cw_molecule_dup_configuration (iso->molecule);
  if (iso->configuration[0] == '\0')
    {
      g_free (iso->configuration);
      iso->configuration = cw_molecule_dup_spec (iso->molecule);
    }
  return iso;
}

static int
compare_isomers (gconstpointer a, gconstpointer b)
{
  const CwIsomer *x = *(CwIsomer *const *) a, *y = *(CwIsomer *const *) b;
  return x->g < y->g ? -1 : x->g > y->g ? 1
                                        : g_strcmp0 (x->smiles, y->smiles);
}

/* Face assignment number bits over the stereo carbons; the first carbon stays as it is. */
static void
assign_faces (const CwMolecule *base, const gboolean *relevant, guint bits, CwMolecule *out)
{
  const CwGroup *slot[CW_RING_SIZE + 1][2];
  int            bit = 0;

  memset (slot, 0, sizeof slot);
  out->n_subs = 0;
  out->custom_groups = NULL;
  for (int i = 0; i < base->n_subs; i++)
    {
      int p = base->subs[i].position;
      slot[p][slot[p][0] ? 1 : 0] = base->subs[i].group;
    }
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      gboolean       flip = FALSE;
      const CwGroup *a = slot[p][0], *b = slot[p][1];
      if (b && cw_sm_group_rank (b) < cw_sm_group_rank (a))
        a = slot[p][1], b = slot[p][0];
      if (relevant[p])
        flip = (bits >> bit++) & 1;
      if (a)
        out->subs[out->n_subs++] = (CwSubstituent){ a, p, flip ? CW_FACE_DOWN : CW_FACE_UP };
      if (b)
        out->subs[out->n_subs++] = (CwSubstituent){ b, p, flip ? CW_FACE_UP : CW_FACE_DOWN };
    }
}

CwIsomerSet *
cw_isomers_enumerate (const CwData *data, const CwMolecule *constitution, const CwConditions *cond, GError **error)
{
  g_autoptr (CwIsomerSet) set = g_new0 (CwIsomerSet, 1);
  gboolean relevant[CW_RING_SIZE + 1];
  gint64   seen[MAX_COMBOS][CW_SM_KEY_LEN];
  int      n_seen = 0, n_rel;
  double   g_min = G_MAXDOUBLE, h_min = G_MAXDOUBLE, z = 0, rt;

  g_return_val_if_fail (data != NULL && constitution != NULL && cond != NULL, NULL);
  if (!cw_check_temperature (cond->temperature, error))
    return NULL;
  rt = CW_R_KCAL * cond->temperature;
  set->temperature = cond->temperature;
  set->solvent = cond->solvent;
  set->isomers = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_isomer_free);
  {
    CwMolecule flat;
    assign_faces (constitution, (gboolean[CW_RING_SIZE + 1]){ 0 }, 0, &flat);
    n_rel = cw_sm_relevant_carbons (&flat, relevant);
  }
  set->n_stereo_carbons = n_rel;
  for (guint bits = 0; bits < (n_rel > 1 ? 1u << (n_rel - 1) : 1u); bits++)
    {
      CwMolecule      m, canon;
      CwRingTransform t;
      CwIsomer       *iso;
      gboolean        dup = FALSE;

      assign_faces (constitution, relevant, bits << 1, &m);
      cw_sm_canonical_transform (&m, TRUE, &t);
      cw_sm_molecule_key (&m, &t, seen[n_seen]);
      for (int k = 0; k < n_seen && !dup; k++)
        dup = memcmp (seen[k], seen[n_seen], sizeof seen[k]) == 0;
      if (dup)
        continue;
      n_seen++;
      canon.custom_groups = NULL;
      cw_sm_apply_transform (&m, &t, &canon);
      iso = make_isomer (data, &canon, cond, error);
      if (iso == NULL)
        return NULL;
      g_ptr_array_add (set->isomers, iso);
    }
  for (guint i = 0; i < set->isomers->len; i++)
    {
      CwIsomer *iso = set->isomers->pdata[i];
      g_min = MIN (g_min, iso->g);
      h_min = MIN (h_min, iso->h_mean);
    }
  for (guint i = 0; i < set->isomers->len; i++)
    {
      CwIsomer *iso = set->isomers->pdata[i];
      iso->g_rel = iso->g - g_min;
      iso->h_rel = iso->h_mean - h_min;
      iso->fraction = exp (-iso->g_rel / rt);
      z += iso->fraction;
    }
  for (guint i = 0; i < set->isomers->len; i++)
    ((CwIsomer *) set->isomers->pdata[i])->fraction /= z;
  g_ptr_array_sort (set->isomers, compare_isomers);
  return g_steal_pointer (&set);
}

void
cw_isomer_set_free (CwIsomerSet *set)
{
  if (set == NULL)
    return;
  if (set->isomers)
    g_ptr_array_unref (set->isomers);
  g_free (set);
}

static void
relative_key (const CwMolecule *mol, gint64 key[CW_SM_KEY_LEN])
{
  CwRingTransform t;

  cw_sm_canonical_transform (mol, TRUE, &t);
  cw_sm_molecule_key (mol, &t, key);
}

int
cw_isomer_set_find (const CwIsomerSet *set, const CwMolecule *mol)
{
  gint64 want[CW_SM_KEY_LEN], key[CW_SM_KEY_LEN];

  g_return_val_if_fail (set != NULL && mol != NULL, -1);
  relative_key (mol, want);
  for (guint i = 0; i < set->isomers->len; i++)
    {
      relative_key (((const CwIsomer *) set->isomers->pdata[i])->molecule, key);
      if (memcmp (key, want, sizeof key) == 0)
        return i;
    }
  return -1;
}

const char *
cw_isomers_method_text (void)
{
  return _("G = −RT ln Σ exp(−Gᵢ/RT) over each isomer's distinct chair species. Gᵢ are chair energies "
           "above an unstrained chair of the same constitution (every group equatorial, no pair terms). "
           "A chiral isomer stands for both enantiomers, so its chairs are counted for each; an achiral "
           "isomer's two chairs count twice when they differ or are mirror images, once when they are "
           "superimposable. Rotational symmetry numbers are not included. Fractions assume the isomers "
           "interconvert (e.g. by epimerisation): xⱼ ∝ exp(−Gⱼ/RT).");
}
