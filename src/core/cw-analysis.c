#include "config.h"

#include "cw-analysis.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"

/* One independent parameter of the model (an A-value, a tabulated pair term, or one fall-back
 * estimate) and how many times it enters each chair. Identical parameters in both chairs cancel,
 * and so does their uncertainty. */
typedef struct
{
  int tag;
  const void *p1;
  const void *p2;
  double sigma;
  double coef[2];
} CwParam;

#define CW_MAX_PARAMS 96
#define CW_PARAM_SLOTS 128 /* open-addressing table, a power of two above CW_MAX_PARAMS */
G_STATIC_ASSERT (CW_MAX_PARAMS < 255); /* slots hold index + 1 in a byte */

typedef struct
{
  const CwData *data;
  const CwMolecule *mol;
  const CwConditions *cond;
  CwAnalysis *out;
  double a[CW_MAX_SUBS];       /* A(X) at T for each substituent */
  double a_sigma[CW_MAX_SUBS];
  gboolean a_thermo[CW_MAX_SUBS];
  CwParam params[CW_MAX_PARAMS];
  int n_params;
  guint8 slots[CW_PARAM_SLOTS]; /* param index + 1, 0 for empty */
  gboolean any_estimate;
  int estimate_a, estimate_b;
  guint64 estimated_pairs[(CW_MAX_SUBS * CW_MAX_SUBS + 63) / 64]; /* bit a * CW_MAX_SUBS + b, a < b */
  int n_estimated_pairs;
  double energy[2]; /* each chair's terms summed as they are made, in their order */
  gboolean record_terms; /* FALSE: terms are summed only, each written over one scratch term */
  CwTerm scratch;
  int first_constant, first_solvent, first_custom; /* substituents for the flags, or -1 */
  CwFlag pair_flags[CW_MAX_SUBS * (CW_MAX_SUBS - 1) / 2]; /* one per pair at most: found with the pair terms, added in build_flags */
  int n_pair_flags;
} CwEngine;

enum { PARAM_A, PARAM_PAIR, PARAM_FALLBACK_SYN, PARAM_FALLBACK_GAUCHE };

static void
add_param (CwEngine *e, int chair, int tag, const void *p1, const void *p2, double sigma, double coef)
{
  guint h = (guint) (((guintptr) p1 >> 3) * 2654435761u ^ ((guintptr) p2 >> 3) * 40503u ^ (guint) tag);
  int i = -1;

  for (h &= CW_PARAM_SLOTS - 1; e->slots[h] != 0; h = (h + 1) & (CW_PARAM_SLOTS - 1))
    {
      CwParam *p = &e->params[e->slots[h] - 1];
      if (p->tag == tag && p->p1 == p1 && p->p2 == p2)
        {
          i = e->slots[h] - 1;
          break;
        }
    }
  if (i < 0)
    {
      i = e->n_params;
      e->slots[h] = (guint8) (i + 1);
      /* 12 A-values, 24 vicinal and 24 1,3 pairs and 6 geminal ones stay inside the table. */
      g_assert (e->n_params < CW_MAX_PARAMS);
      e->params[i] = (CwParam) { tag, p1, p2, sigma, { 0, 0 } };
      e->n_params++;
    }
  e->params[i].coef[chair] += coef;
}

static void
param_a (CwEngine *e, int chair, int sub, double coef)
{
  add_param (e, chair, PARAM_A, e->mol->subs[sub].group, NULL, e->a_sigma[sub], coef);
}

double
cw_group_a_value (const CwGroup *group, double t_kelvin, CwSolvent solvent, double *sigma,
                  gboolean *from_thermo)
{
  if (from_thermo)
    *from_thermo = FALSE;
  if (solvent == CW_SOLVENT_PROTIC && group->has_protic)
    {
      if (sigma)
        *sigma = group->a_protic_sigma;
      return group->a_protic;
    }
  if (sigma)
    *sigma = group->a_sigma;
  if (group->has_thermo)
    {
      if (from_thermo)
        *from_thermo = TRUE;
      /* A = G(ax) − G(eq) = −(ΔH° − TΔS°) of the axial → equatorial change; ΔS° in cal. */
      return -(group->dh - t_kelvin * group->ds / 1000.0);
    }
  return group->a;
}

static gboolean
is_axial (const CwSubstituent *s, int chair)
{
  /* Chair 1 (index 0): odd carbons have their axial bond up. */
  gboolean odd = (s->position % 2) == 1;
  CwFace axial_face = (odd == (chair == 0)) ? CW_FACE_UP : CW_FACE_DOWN;

  return s->face == axial_face;
}

static CwTerm *
new_term (CwEngine *e, int chair, CwTermKind kind, int a, int b)
{
  CwChair *c = &e->out->chair[chair];
  CwTerm *t;

  if (!e->record_terms)
    return &e->scratch;
  g_assert (c->n_terms < CW_MAX_TERMS);
  t = &c->terms[c->n_terms++];
  memset (t, 0, sizeof *t);
  t->kind = kind;
  t->sub_a = a;
  t->sub_b = b;
  return t;
}

static void
add_axial_term (CwEngine *e, int chair, int s)
{
  CwTerm *t = new_term (e, chair, CW_TERM_AXIAL, s, -1);
  const CwGroup *g = e->mol->subs[s].group;

  t->energy = e->a[s];
  e->energy[chair] += t->energy;
  t->sigma = e->a_sigma[s];
  t->temperature_dependent = e->a_thermo[s];
  if (e->cond->solvent == CW_SOLVENT_PROTIC && g->has_protic)
    t->source = g->protic_source;
  else
    t->source = e->a_thermo[s] ? g->thermo_source : g->source;
  param_a (e, chair, s, 1.0);
}

static double
fallback_value (const CwEngine *e, int a, int b, double scale, double *sigma)
{
  const CwFallbackRules *r = cw_interaction_table_get_fallback (e->data->interactions);
  double v = scale * sqrt (MAX (e->a[a], 0.0) * MAX (e->a[b], 0.0));

  *sigma = MAX (r->min_sigma, r->relative_sigma * v);
  return v;
}

static void
note_estimate (CwEngine *e, int a, int b)
{
  int bit = MIN (a, b) * CW_MAX_SUBS + MAX (a, b);

  if (!e->any_estimate)
    {
      e->estimate_a = a;
      e->estimate_b = b;
    }
  e->any_estimate = TRUE;
  /* count each pair once, whichever chairs it is estimated in */
  if (!(e->estimated_pairs[bit / 64] & (G_GUINT64_CONSTANT (1) << (bit % 64))))
    {
      e->estimated_pairs[bit / 64] |= G_GUINT64_CONSTANT (1) << (bit % 64);
      e->n_estimated_pairs++;
    }
}

static void
add_pair_term (CwEngine *e, int chair, CwTermKind kind, int a, int b)
{
  const CwGroup *ga = e->mol->subs[a].group, *gb = e->mol->subs[b].group;
  CwPairKind pk = kind == CW_TERM_SYN_AXIAL ? CW_PAIR_SYN_AXIAL : CW_PAIR_GAUCHE;
  const CwPairEntry *entry = cw_data_find_pair (e->data, pk, ga, gb, NULL);
  const CwFallbackRules *rules = cw_interaction_table_get_fallback (e->data->interactions);
  CwTerm *t = new_term (e, chair, kind, a, b);
  double value, sigma;
  const void *k1 = ga < gb ? ga : gb, *k2 = ga < gb ? gb : ga;

  if (entry != NULL)
    {
      value = entry->value;
      sigma = entry->sigma;
      t->source = entry->source;
      add_param (e, chair, PARAM_PAIR, entry, NULL, sigma, 1.0);
    }
  else
    {
      double scale = pk == CW_PAIR_SYN_AXIAL ? rules->syn_axial_scale : rules->gauche_scale;
      value = fallback_value (e, a, b, scale, &sigma);
      t->source = rules->rule;
      t->estimated = TRUE;
      add_param (e, chair, pk == CW_PAIR_SYN_AXIAL ? PARAM_FALLBACK_SYN : PARAM_FALLBACK_GAUCHE,
                 k1, k2, sigma, 1.0);
      note_estimate (e, a, b);
    }
  if (kind == CW_TERM_SYN_AXIAL)
    {
      /* Each axial group's A-value already counts about A/2 for each syn-axial X/H contact;
       * the X/Y contact replaces one such contact on each side. */
      value -= 0.5 * e->a[a] + 0.5 * e->a[b];
      sigma = sqrt (sigma * sigma + 0.25 * (e->a_sigma[a] * e->a_sigma[a] + e->a_sigma[b] * e->a_sigma[b]));
      param_a (e, chair, a, -0.5);
      param_a (e, chair, b, -0.5);
      t->temperature_dependent = e->a_thermo[a] || e->a_thermo[b];
    }
  t->energy = value;
  e->energy[chair] += value;
  t->sigma = sigma;
}

/* Returns the tabulated correction, or NULL. */
static const CwPairEntry *
add_geminal_term (CwEngine *e, int a, int b)
{
  const CwGroup *ga = e->mol->subs[a].group, *gb = e->mol->subs[b].group;
  gboolean swapped = FALSE;
  const CwPairEntry *entry = cw_data_find_pair (e->data, CW_PAIR_GEMINAL, ga, gb, &swapped);
  int target = swapped ? a : b; /* the substituent that plays the entry's "b" */

  if (entry == NULL)
    return NULL;
  for (int chair = 0; chair < 2; chair++)
    if (e->out->chair[chair].axial[target])
      {
        CwTerm *t = new_term (e, chair, CW_TERM_GEMINAL, a, b);
        t->energy = entry->value;
        e->energy[chair] += t->energy;
        t->sigma = entry->sigma;
        t->source = entry->source;
        add_param (e, chair, PARAM_PAIR, entry, NULL, entry->sigma, 1.0);
      }
  return entry;
}

static int
ring_distance (int p, int q)
{
  int d = abs (p - q);
  return MIN (d, CW_RING_SIZE - d);
}

static gboolean
is_branched_or_aryl (const CwGroup *g)
{
  return g->klass == CW_CLASS_ARYL || g->klass == CW_CLASS_BRANCHED_ALKYL;
}

/* The flag a pair raises, if any, kept for build_flags; returns its index there, or -1. The
 * conditions are combined without short cuts: they depend on the molecule, and one test is
 * cheaper than a chain of guesses. A geminal pair's flag is kept provisionally: it stands only
 * if no geminal correction is tabulated (build_terms withdraws it otherwise). */
static int
note_pair_flag (CwEngine *e, int i, int j, int d)
{
  const CwMolecule *mol = e->mol;
  const CwGroup    *gi = mol->subs[i].group, *gj = mol->subs[j].group;
  /* Diaxial in one chair and diequatorial in the other: the case where dipoles decide. */
  gboolean trans_like = e->out->chair[0].axial[i] == e->out->chair[0].axial[j];
  gboolean polar = (d == 1) & !!gi->polar & !!gj->polar & trans_like;
  gboolean dihalide = (d == 3) & (gi->klass == CW_CLASS_HALOGEN) & (gj->klass == CW_CLASS_HALOGEN) & trans_like;
  gboolean hbond = (d == 2) & (mol->subs[i].face == mol->subs[j].face) &
                   ((!!gi->hbond_donor & !!gj->hbond_acceptor) | (!!gj->hbond_donor & !!gi->hbond_acceptor));
  gboolean gem = (d == 0) & (is_branched_or_aryl (gi) | is_branched_or_aryl (gj));
  CwFlagCode code;

  if (!(polar | dihalide | hbond | gem))
    return -1;
  code = polar ? CW_FLAG_POLAR_VICINAL : dihalide ? CW_FLAG_DIHALIDE_1_4 : hbond ? CW_FLAG_HBOND_1_3 : CW_FLAG_GEMINAL_NONADDITIVE;
  e->pair_flags[e->n_pair_flags] = (CwFlag) { code, i, j, 0 };
  return e->n_pair_flags++;
}

/* Which pair term two groups d carbons apart make in a chair, by whether each is axial:
 * syn-1,3-diaxial for 1,3 both axial, gauche for vicinal unless both are axial (trans
 * diaxial), none otherwise (-1). */
static const gint8 pair_kind[4][2][2] = {
  { { -1, -1 }, { -1, -1 } },
  { { CW_TERM_GAUCHE, CW_TERM_GAUCHE }, { CW_TERM_GAUCHE, -1 } },
  { { -1, -1 }, { -1, CW_TERM_SYN_AXIAL } },
  { { -1, -1 }, { -1, -1 } },
};

/* One pair term to make: groups i < j, in chair 0 or 1 or (GEMINAL_STEP) the geminal
 * correction, and for that one the provisional flag to withdraw if a correction is found. */
#define GEMINAL_STEP 2
typedef struct
{
  guint8 i, j, what, kind;
  gint8  flag;
} PairStep;

static void
build_terms (CwEngine *e)
{
  const CwMolecule *mol = e->mol;
  const gboolean   *ax0 = e->out->chair[0].axial, *ax1 = e->out->chair[1].axial;
  guint             mask[2] = { 0, 0 };
  PairStep          steps[3 * CW_MAX_SUBS * (CW_MAX_SUBS - 1) / 2 + 3];
  int               n = 0;

  /* axial groups, each chair's in group order */
  for (int i = 0; i < mol->n_subs; i++)
    {
      mask[0] |= (guint) !!ax0[i] << i;
      mask[1] |= (guint) !!ax1[i] << i;
    }
  for (int chair = 0; chair < 2; chair++)
    for (guint m = mask[chair]; m != 0; m &= m - 1)
      add_axial_term (e, chair, __builtin_ctz (m)); /* the lowest set bit (GLib's g_bit_nth_lsf loops) */
  /* the pairs: first listed (each step written, kept only when it applies), then made in the
   * same order as ever, so every chair's terms and the parameters come in that order */
  for (int i = 0; i < mol->n_subs; i++)
    for (int j = i + 1; j < mol->n_subs; j++)
      {
        int d = ring_distance (mol->subs[i].position, mol->subs[j].position);
        int k0 = pair_kind[d][!!ax0[i]][!!ax0[j]], k1 = pair_kind[d][!!ax1[i]][!!ax1[j]];
        int flag = note_pair_flag (e, i, j, d);

        steps[n] = (PairStep) { i, j, 0, k0, -1 };
        n += k0 >= 0;
        steps[n] = (PairStep) { i, j, 1, k1, -1 };
        n += k1 >= 0;
        steps[n] = (PairStep) { i, j, GEMINAL_STEP, 0, flag };
        n += d == 0;
      }
  for (int k = 0; k < n; k++)
    {
      const PairStep *st = &steps[k];
      if (st->what != GEMINAL_STEP)
        add_pair_term (e, st->what, st->kind, st->i, st->j);
      else if (add_geminal_term (e, st->i, st->j) != NULL && st->flag >= 0)
        e->pair_flags[st->flag].code = CW_N_FLAGS; /* tabulated: the pair is additive after all */
    }
}

/* Per ring position, the (group, axial) labels of a chair in a canonical order. */
typedef struct
{
  const CwGroup *g[2];
  gboolean ax[2];
  int n;
} CwSite;

static void
chair_sites (const CwMolecule *mol, const CwChair *c, CwSite sites[CW_RING_SIZE])
{
  memset (sites, 0, sizeof (CwSite) * CW_RING_SIZE);
  for (int i = 0; i < mol->n_subs; i++)
    {
      CwSite *s = &sites[mol->subs[i].position - 1];
      s->g[s->n] = mol->subs[i].group;
      s->ax[s->n] = c->axial[i];
      s->n++;
    }
  for (int p = 0; p < CW_RING_SIZE; p++)
    if (sites[p].n == 2 && sites[p].ax[0])
      {
        /* axial first is not canonical: put the equatorial one first */
        const CwGroup *g = sites[p].g[0];
        sites[p].g[0] = sites[p].g[1];
        sites[p].g[1] = g;
        sites[p].ax[0] = FALSE;
        sites[p].ax[1] = TRUE;
      }
}

static gboolean
sites_equal (const CwSite *a, const CwSite *b)
{
  if (a->n != b->n)
    return FALSE;
  for (int k = 0; k < a->n; k++)
    if (a->g[k] != b->g[k] || a->ax[k] != b->ax[k])
      return FALSE;
  return TRUE;
}

/* Does c2[m] == c1[h(m)] for all m, with h(m) = sign * m + shift? */
static gboolean
sites_match (const CwSite *c1, const CwSite *c2, int sign, int shift)
{
  for (int m = 0; m < CW_RING_SIZE; m++)
    {
      int h = ((sign * m + shift) % CW_RING_SIZE + CW_RING_SIZE) % CW_RING_SIZE;
      if (!sites_equal (&c2[m], &c1[h]))
        return FALSE;
    }
  return TRUE;
}

/* Chair 2 drawn on chair 1's skeleton is chair 2 with its numbering reversed. Working that
 * through the chair's D3d symmetry: chair 2 is superimposable on chair 1 when c2[m] = c1[h(m)]
 * for an odd shift h(m) = m + odd or a reflection h(m) = even − m, and it is the mirror image
 * when h is an even shift or a reflection h(m) = odd − m. */
static CwFlagCode
chair_symmetry (const CwMolecule *mol, const CwAnalysis *an)
{
  CwSite c1[CW_RING_SIZE], c2[CW_RING_SIZE];

  chair_sites (mol, &an->chair[0], c1);
  chair_sites (mol, &an->chair[1], c2);
  for (int k = 0; k < CW_RING_SIZE; k++)
    if ((k % 2 == 1 && sites_match (c1, c2, 1, k)) || (k % 2 == 0 && sites_match (c1, c2, -1, k)))
      return CW_FLAG_IDENTICAL_CHAIRS;
  for (int k = 0; k < CW_RING_SIZE; k++)
    if ((k % 2 == 0 && sites_match (c1, c2, 1, k)) || (k % 2 == 1 && sites_match (c1, c2, -1, k)))
      return CW_FLAG_MIRROR_CHAIRS;
  return CW_N_FLAGS;
}

static void
add_flag (CwAnalysis *an, CwFlagCode code, int a, int b, double value)
{
  if (an->n_flags >= CW_MAX_FLAGS)
    return;
  an->flags[an->n_flags++] = (CwFlag) { code, a, b, value };
}

gboolean
cw_analysis_has_flag (const CwAnalysis *an, CwFlagCode code)
{
  for (int i = 0; i < an->n_flags; i++)
    if (an->flags[i].code == code)
      return TRUE;
  return FALSE;
}

static void
build_flags (CwEngine *e, CwFlagCode symmetry)
{
  CwAnalysis *an = e->out;
  const CwMolecule *mol = e->mol;
  const CwRingEnergetics *ring = cw_interaction_table_get_ring (e->data->interactions);
  double better = MIN (an->chair[0].energy, an->chair[1].energy);
  int constant = e->first_constant, solvent = e->first_solvent, custom = e->first_custom;

  if (mol->n_subs == 0)
    add_flag (an, CW_FLAG_NO_SUBSTITUENTS, -1, -1, 0);
  if (symmetry != CW_N_FLAGS)
    add_flag (an, symmetry, -1, -1, 0);
  if (better >= an->twist_boat - ring->twist_boat_margin)
    add_flag (an, CW_FLAG_TWIST_BOAT, -1, -1, an->twist_boat);
  for (int k = 0; k < e->n_pair_flags; k++)
    if (e->pair_flags[k].code != CW_N_FLAGS)
      add_flag (an, e->pair_flags[k].code, e->pair_flags[k].sub_a, e->pair_flags[k].sub_b, 0);
  if (e->any_estimate)
    add_flag (an, CW_FLAG_ESTIMATED_TERM, e->estimate_a, e->estimate_b, e->n_estimated_pairs);
  if (constant >= 0)
    add_flag (an, CW_FLAG_CONSTANT_A, constant, -1, 0);
  if (solvent >= 0)
    add_flag (an, CW_FLAG_SOLVENT_SENSITIVE, solvent, -1, 0);
  if (custom >= 0)
    add_flag (an, CW_FLAG_CUSTOM_GROUP, custom, -1, 0);
}

static void
finish_thermo (CwEngine *e, CwFlagCode symmetry, gboolean kinetics)
{
  CwAnalysis *an = e->out;
  const CwRingEnergetics *ring = cw_interaction_table_get_ring (e->data->interactions);
  double T = an->temperature, var = 0, mean, lo, hi, dummy;

  /* the chairs' energies were summed by analyze () */
  for (int k = 0; k < e->n_params; k++)
    {
      double d = (e->params[k].coef[1] - e->params[k].coef[0]) * e->params[k].sigma;
      var += d * d;
    }
  an->delta_g = an->chair[1].energy - an->chair[0].energy;
  an->sigma = sqrt (var);
  if (symmetry != CW_N_FLAGS)
    {
      /* Equal by symmetry, not by arithmetic: make it exact. */
      an->chair[1].energy = an->chair[0].energy;
      an->delta_g = 0;
      an->sigma = 0;
    }
  an->K = cw_equilibrium_constant (an->delta_g, T);
  cw_populations (an->delta_g, T, &an->pop[0], &an->pop[1]);
  cw_populations (an->delta_g + 2 * an->sigma, T, &hi, &dummy);
  cw_populations (an->delta_g - 2 * an->sigma, T, &lo, &dummy);
  an->pop_low[0] = lo;
  an->pop_high[0] = hi;
  an->pop_low[1] = 1.0 - hi;
  an->pop_high[1] = 1.0 - lo;
  an->major = an->delta_g < 0 ? 1 : 0;
  /* Model choice: the half-chair carries the mean of the two chairs' substituent strain. */
  mean = 0.5 * (an->chair[0].energy + an->chair[1].energy);
  an->barrier = ring->half_chair.g + mean - MIN (an->chair[0].energy, an->chair[1].energy);
  /* The transition state lies at least as high as the higher chair: a chair cannot leave faster
   * than kB·T/h. */
  an->barrier = MAX (an->barrier, fabs (an->delta_g));
  if (kinetics)
    {
      an->k_forward = cw_eyring_rate (MAX (ring->half_chair.g + mean - an->chair[0].energy,
                                           MAX (an->delta_g, 0.0)), T);
      an->k_reverse = cw_eyring_rate (MAX (ring->half_chair.g + mean - an->chair[1].energy,
                                           MAX (-an->delta_g, 0.0)), T);
    }
  else
    an->k_forward = an->k_reverse = NAN;
  an->twist_boat = ring->twist_boat.g;
}

static gboolean
check_molecule (const CwMolecule *mol, GError **error)
{
  int per_carbon[CW_RING_SIZE + 1] = { 0 };

  if (mol->n_subs < 0 || mol->n_subs > CW_MAX_SUBS)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("Too many substituents"));
      return FALSE;
    }
  for (int i = 0; i < mol->n_subs; i++)
    {
      int p = mol->subs[i].position;
      if (p < 1 || p > CW_RING_SIZE || mol->subs[i].group == NULL)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("Substituent %d is on ring position %d, which does not exist"), i + 1, p);
          return FALSE;
        }
      if (++per_carbon[p] > 2)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("Ring carbon %d carries more than two groups"), p);
          return FALSE;
        }
    }
  return TRUE;
}

static gboolean
analyze (const CwData *data, const CwMolecule *mol, const CwConditions *cond, gboolean kinetics, CwAnalysis *out,
         GError **error)
{
  CwEngine e;
  CwFlagCode symmetry;

  g_return_val_if_fail (data != NULL && mol != NULL && cond != NULL && out != NULL, FALSE);
  if (!cw_check_temperature (cond->temperature, error) || !check_molecule (mol, error))
    return FALSE;
  e.data = data;
  e.mol = mol;
  e.cond = cond;
  e.out = out;
  e.n_params = 0;
  memset (e.slots, 0, sizeof e.slots);
  e.any_estimate = FALSE;
  memset (e.estimated_pairs, 0, sizeof e.estimated_pairs);
  e.n_estimated_pairs = 0;
  e.energy[0] = e.energy[1] = 0;
  e.record_terms = kinetics;
  e.first_constant = e.first_solvent = e.first_custom = -1;
  e.n_pair_flags = 0;
  out->temperature = cond->temperature;
  out->solvent = cond->solvent;
  out->n_flags = 0;
  out->chair[0].n_terms = out->chair[1].n_terms = 0;
  /* one pass over the groups: axial in which chair, A at T, what the flags need */
  for (int i = mol->n_subs - 1; i >= 0; i--)
    {
      const CwGroup *g = mol->subs[i].group;
      out->chair[0].axial[i] = is_axial (&mol->subs[i], 0);
      out->chair[1].axial[i] = is_axial (&mol->subs[i], 1);
      e.a[i] = cw_group_a_value (g, cond->temperature, cond->solvent, &e.a_sigma[i], &e.a_thermo[i]);
      /* walked backwards, so each ends at the first such group */
      e.first_constant = !e.a_thermo[i] ? i : e.first_constant;
      e.first_solvent = g->has_protic ? i : e.first_solvent;
      e.first_custom = g->custom ? i : e.first_custom;
    }
  build_terms (&e);
  /* The energy model is invariant under the chair's symmetry operations, so chairs related by
   * symmetry always come out equal; only then is the (costlier) exact test needed. */
  symmetry = CW_N_FLAGS;
  for (int c = 0; c < 2; c++)
    out->chair[c].energy = e.energy[c];
  if (fabs (out->chair[0].energy - out->chair[1].energy) < 1e-9)
    symmetry = chair_symmetry (mol, out);
  finish_thermo (&e, symmetry, kinetics);
  build_flags (&e, symmetry);
  return TRUE;
}

gboolean
cw_analyze (const CwData *data, const CwMolecule *mol, const CwConditions *cond, CwAnalysis *out,
            GError **error)
{
  return analyze (data, mol, cond, TRUE, out, error);
}

gboolean
cw_analyze_equilibrium (const CwData *data, const CwMolecule *mol, const CwConditions *cond, CwAnalysis *out,
                        GError **error)
{
  return analyze (data, mol, cond, FALSE, out, error);
}

static const char *flag_codes[CW_N_FLAGS] = {
  "identical-chairs", "mirror-image-chairs", "twist-boat-competes", "polar-vicinal-pair",
  "dihalide-1-4", "geminal-nonadditive", "hydrogen-bond-1-3", "estimated-term",
  "a-value-held-constant", "solvent-sensitive", "custom-group", "no-substituents",
};

const char *
cw_flag_code_to_string (CwFlagCode code)
{
  g_return_val_if_fail (code < CW_N_FLAGS, "unknown");
  return flag_codes[code];
}

static char *
sub_name (const CwMolecule *mol, int i)
{
  if (i < 0 || i >= mol->n_subs)
    return g_strdup ("?");
  return g_strdup_printf ("%s (C%d)", mol->subs[i].group->label, mol->subs[i].position);
}

char *
cw_flag_dup_message (const CwFlag *flag, const CwMolecule *mol, CwEnergyUnit unit)
{
  g_autofree char *a = sub_name (mol, flag->sub_a);
  g_autofree char *b = sub_name (mol, flag->sub_b);

  switch (flag->code)
    {
    case CW_FLAG_IDENTICAL_CHAIRS:
      return g_strdup (_("The two chairs are identical (superimposable): K = 1 exactly, 50:50."));
    case CW_FLAG_MIRROR_CHAIRS:
      return g_strdup (_("The two chairs are mirror images of each other (enantiomeric "
                         "conformations): K = 1 exactly, 50:50, and fast ring inversion makes "
                         "the sample optically inactive."));
    case CW_FLAG_TWIST_BOAT:
      return g_strdup_printf (_("Even the better chair is strained to within reach of the twist-boat "
                                "(estimated %.1f %s above an unstrained chair): twist-boat forms "
                                "may compete, and the two-chair picture may not hold."),
                              cw_energy_from_kcal (flag->value, unit), cw_energy_unit_symbol (unit));
    case CW_FLAG_POLAR_VICINAL:
      return g_strdup_printf (_("%s and %s are a vicinal polar pair: dipole and hyperconjugative "
                                "effects make the diaxial chair more populated than additive "
                                "A-values predict, especially in nonpolar solvents."), a, b);
    case CW_FLAG_DIHALIDE_1_4:
      return g_strdup_printf (_("%s and %s are a 1,4-dihalide pair: the diaxial chair is known to be "
                                "more populated than additive A-values predict."), a, b);
    case CW_FLAG_GEMINAL_NONADDITIVE:
      return g_strdup_printf (_("%s and %s share a carbon, and one is aryl or branched: geminal pairs "
                                "like this are known to break additivity (the larger group may "
                                "prefer axial)."), a, b);
    case CW_FLAG_HBOND_1_3:
      return g_strdup_printf (_("%s and %s can meet syn-1,3-diaxial as hydrogen-bond donor and "
                                "acceptor: an intramolecular hydrogen bond may stabilise the diaxial "
                                "chair, most of all in nonpolar solvents."), a, b);
    case CW_FLAG_ESTIMATED_TERM:
      if (flag->value <= 1)
        return g_strdup_printf (_("No published pair term for %s/%s: estimated by the documented "
                                  "fall-back rule, with a wide uncertainty."), a, b);
      {
        int others = (int) flag->value - 1;
        return g_strdup_printf (ngettext ("No published pair term for %s/%s and %d other pair: estimated "
                                          "by the documented fall-back rule, with a wide uncertainty.",
                                          "No published pair term for %s/%s and %d other pairs: estimated "
                                          "by the documented fall-back rule, with a wide uncertainty.",
                                          others),
                                a, b, others);
      }
    case CW_FLAG_CONSTANT_A:
      return g_strdup_printf (_("Some A-values, e.g. that of %s, have no published ΔH°/ΔS° and are "
                                "held at their ~298 K value at every temperature."), a);
    case CW_FLAG_SOLVENT_SENSITIVE:
      return g_strdup_printf (_("The A-value of %s depends on the solvent; check that the solvent "
                                "class (aprotic or protic) matches your conditions."), a);
    case CW_FLAG_CUSTOM_GROUP:
      return g_strdup_printf (_("%s is a user-defined group: its value comes from the user's note, "
                                "not from the table."), a);
    case CW_FLAG_NO_SUBSTITUENTS:
      return g_strdup (_("The ring has no substituents: both chairs are cyclohexane itself."));
    case CW_N_FLAGS:
    default:
      break;
    }
  return g_strdup ("");
}

const char *
cw_term_kind_to_string (CwTermKind kind)
{
  switch (kind)
    {
    case CW_TERM_AXIAL:
      return "axial";
    case CW_TERM_SYN_AXIAL:
      return "syn-1,3-diaxial";
    case CW_TERM_GAUCHE:
      return "gauche";
    case CW_TERM_GEMINAL:
      return "geminal";
    default:
      return "?";
    }
}

char *
cw_term_dup_label (const CwTerm *term, const CwMolecule *mol)
{
  const CwSubstituent *a = &mol->subs[term->sub_a];
  const CwSubstituent *b = term->sub_b >= 0 ? &mol->subs[term->sub_b] : NULL;

  switch (term->kind)
    {
    case CW_TERM_AXIAL:
      return g_strdup_printf (_("%s on C%d axial"), a->group->label, a->position);
    case CW_TERM_SYN_AXIAL:
      return g_strdup_printf (_("%s (C%d) / %s (C%d) syn-1,3-diaxial"), a->group->label, a->position,
                              b->group->label, b->position);
    case CW_TERM_GAUCHE:
      return g_strdup_printf (_("%s (C%d) / %s (C%d) gauche"), a->group->label, a->position,
                              b->group->label, b->position);
    case CW_TERM_GEMINAL:
      return g_strdup_printf (_("%s / %s on C%d geminal correction"), a->group->label,
                              b->group->label, a->position);
    default:
      return g_strdup ("?");
    }
}

const char *
cw_solvent_to_string (CwSolvent solvent)
{
  return solvent == CW_SOLVENT_PROTIC ? "protic" : "aprotic";
}

gboolean
cw_solvent_from_string (const char *s, CwSolvent *solvent)
{
  if (g_strcmp0 (s, "aprotic") == 0)
    *solvent = CW_SOLVENT_APROTIC;
  else if (g_strcmp0 (s, "protic") == 0)
    *solvent = CW_SOLVENT_PROTIC;
  else
    return FALSE;
  return TRUE;
}

const char *
cw_caution_text (void)
{
  return _("Additive estimates from tabulated values: confirm by experiment (NMR, X-ray) "
           "before a route depends on them.");
}
