#include "config.h"

#include "cw-couplings.h"
#include "cw-thermo.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-fragment.h"

#define DEG (G_PI / 180.0)

double
cw_karplus_coupling (const CwKarplusSet *set, double phi, const double *delta_chi, const int *xi, int n)
{
  const double *p = set->p;
  double        c = cos (phi * DEG);
  double        j = p[0] * c * c + p[1] * c + p[2];

  for (int i = 0; i < n; i++)
    {
      double arg = (xi[i] * phi + p[5] * fabs (delta_chi[i])) * DEG;
      double ca = cos (arg);
      j += delta_chi[i] * (p[3] + p[4] * ca * ca);
    }
  return j;
}

/* Δχ of an atom at a chair slot (a ring carbon's exocyclic position) seen from its ring carbon. */
static double
slot_delta_chi (const CwGeometryData *gd, const CwMolecule *mol, int position, CwFace face, double p7, gboolean *beta_known, CwElement *el_out)
{
  const CwSubstituent *s = cw_molecule_get (mol, position, face);
  double               chi_h = cw_geometry_data_electronegativity (gd, CW_EL_H);
  CwFragmentInfo       info;
  double               beta = 0;

  *beta_known = TRUE;
  if (s == NULL)
    {
      *el_out = CW_EL_H;
      return 0.0;
    }
  cw_fragment_info (s->group, &info);
  *el_out = info.first_atom;
  *beta_known = info.from_smiles;
  for (int i = 0; i < info.n_neighbours; i++)
    beta += cw_geometry_data_electronegativity (gd, info.neighbours[i]) - chi_h;
  return cw_geometry_data_electronegativity (gd, info.first_atom) - chi_h - p7 * beta;
}

/* Δχ of ring carbon `carbon` seen from its neighbour `from`: its β-atoms are its other ring
 * neighbour and whatever sits on its two slots. */
static double
ring_carbon_delta_chi (const CwGeometryData *gd, const CwMolecule *mol, int carbon, int from, double p7, gboolean *beta_known)
{
  double chi_h = cw_geometry_data_electronegativity (gd, CW_EL_H);
  double chi_c = cw_geometry_data_electronegativity (gd, CW_EL_C);
  double beta = chi_c - chi_h; /* the ring carbon beyond */

  *beta_known = TRUE;
  for (int f = 0; f < 2; f++)
    {
      const CwSubstituent *s = cw_molecule_get (mol, carbon, (CwFace) f);
      CwFragmentInfo       info;
      if (s == NULL)
        continue;
      cw_fragment_info (s->group, &info);
      beta += cw_geometry_data_electronegativity (gd, info.first_atom) - chi_h;
    }
  (void) from;
  return chi_c - chi_h - p7 * beta;
}

static int
ring_neighbour (int position, int step)
{
  return ((position - 1 + step + CW_RING_SIZE) % CW_RING_SIZE) + 1;
}

static int
xi_sign (const CwChairGeometry *g, int h, int ca, int cb, int s)
{
  const double *H = g->atoms[h].xyz, *A = g->atoms[ca].xyz, *B = g->atoms[cb].xyz, *S = g->atoms[s].xyz;
  double        u[3], v[3], w[3];

  for (int i = 0; i < 3; i++)
    u[i] = H[i] - A[i], v[i] = S[i] - A[i], w[i] = B[i] - A[i];
  return ((u[1] * v[2] - u[2] * v[1]) * w[0] + (u[2] * v[0] - u[0] * v[2]) * w[1] +
          (u[0] * v[1] - u[1] * v[0]) * w[2]) >= 0
           ? 1
           : -1;
}

/* The α-substituents on carbon `pa` (bearing proton slot face_a), looking along pa→pb. */
static void
collect_alpha (const CwGeometryData *gd, const CwMolecule *mol, const CwCouplings *c, int pa, CwFace face_a, int pb, double p7, CwVicinalCoupling *v)
{
  int                   other_ring = (ring_neighbour (pa, 1) == pb) ? ring_neighbour (pa, -1) : ring_neighbour (pa, 1);
  CwFace                other_face = (face_a == CW_FACE_UP) ? CW_FACE_DOWN : CW_FACE_UP;
  CwKarplusSubstituent *k;
  gboolean              known;
  CwElement             el;
  double                dchi;

  /* The ring carbon beyond pa. */
  k = &v->subs[v->n_subs++];
  k->position = pa;
  k->sub = -1;
  k->ring_carbon = other_ring;
  k->element = CW_EL_C;
  k->delta_chi = ring_carbon_delta_chi (gd, mol, other_ring, pa, p7, &known);
  k->beta_known = known;
  for (int ch = 0; ch < 2; ch++)
    {
      const CwChairGeometry *g = &c->geometry[ch];
      k->xi[ch] = xi_sign (g, g->slot[pa - 1][face_a], g->ring[pa - 1], g->ring[pb - 1],
                           g->ring[other_ring - 1]);
    }
  /* The other exocyclic slot of pa, when it is not H. */
  dchi = slot_delta_chi (gd, mol, pa, other_face, p7, &known, &el);
  if (el == CW_EL_H || el == CW_EL_D)
    return;
  k = &v->subs[v->n_subs++];
  k->position = pa;
  k->sub = (int) (cw_molecule_get (mol, pa, other_face) - mol->subs);
  k->ring_carbon = 0;
  k->element = el;
  k->delta_chi = dchi;
  k->beta_known = known;
  for (int ch = 0; ch < 2; ch++)
    {
      const CwChairGeometry *g = &c->geometry[ch];
      k->xi[ch] = xi_sign (g, g->slot[pa - 1][face_a], g->ring[pa - 1], g->ring[pb - 1],
                           g->slot[pa - 1][other_face]);
    }
}

static const CwKarplusSet *
choose_set (const CwGeometryData *gd, const char *set_id, int n_subs)
{
  if (g_strcmp0 (set_id, CW_KARPLUS_BY_COUNT) == 0)
    {
      for (int i = 0; i < gd->n_sets; i++)
        if (gd->sets[i].substituents == n_subs)
          return &gd->sets[i];
      return cw_geometry_data_find_set (gd, NULL);
    }
  return cw_geometry_data_find_set (gd, set_id);
}

static void
compute_vicinal (const CwGeometryData *gd, const CwMolecule *mol, const char *set_id, CwCouplings *c, int ia, int ib)
{
  const CwRingProton *a = &c->protons[ia], *b = &c->protons[ib];
  CwVicinalCoupling  *v = &c->vicinal[c->n_vicinal];
  double              p7 = cw_geometry_data_find_set (gd, NULL)->p[6];
  double              dchi[CW_MAX_ALPHA_SUBS];

  memset (v, 0, sizeof *v);
  v->proton_a = ia;
  v->proton_b = ib;
  /* The substituent count decides the set before P7 is known; the count does not depend on P7. */
  collect_alpha (gd, mol, c, a->position, a->face, b->position, p7, v);
  collect_alpha (gd, mol, c, b->position, b->face, a->position, p7, v);
  v->set = choose_set (gd, set_id, v->n_subs);
  if (v->set->p[6] != p7)
    {
      v->n_subs = 0;
      collect_alpha (gd, mol, c, a->position, a->face, b->position, v->set->p[6], v);
      collect_alpha (gd, mol, c, b->position, b->face, a->position, v->set->p[6], v);
    }
  for (int i = 0; i < v->n_subs; i++)
    {
      dchi[i] = v->subs[i].delta_chi;
      if (!v->subs[i].beta_known)
        c->fragment_unknown = TRUE;
    }
  for (int ch = 0; ch < 2; ch++)
    {
      const CwChairGeometry *g = &c->geometry[ch];
      int                    xi[CW_MAX_ALPHA_SUBS];

      for (int i = 0; i < v->n_subs; i++)
        xi[i] = v->subs[i].xi[ch];
      v->torsion[ch] = cw_chair_geometry_torsion (g, g->slot[a->position - 1][a->face],
                                                  g->ring[a->position - 1], g->ring[b->position - 1],
                                                  g->slot[b->position - 1][b->face]);
      v->j[ch] = cw_karplus_coupling (v->set, v->torsion[ch], dchi, xi, v->n_subs);
    }
  v->j_avg = c->pop[0] * v->j[0] + c->pop[1] * v->j[1];
  c->n_vicinal++;
}

static void
summarise_proton (const CwGeometryData *gd, CwCouplings *c, CwRingProton *p)
{
  double tol = gd->multiplet_tolerance.value, min = gd->resolved_min.value;

  for (int ch = 0; ch < 3; ch++)
    {
      double j[5];
      int    n = 0;
      double width = 0;

      for (int i = 0; i < p->n_vicinal; i++)
        {
          const CwVicinalCoupling *v = &c->vicinal[p->vicinal[i]];
          double                   value = (ch < 2) ? v->j[ch] : v->j_avg;
          j[n++] = value;
          width += value;
        }
      if (p->geminal >= 0)
        j[n++] = fabs (c->geminal);
      if (ch < 2)
        p->width[ch] = width;
      else
        p->width_avg = width;
      cw_multiplet_build (j, n, tol, min, &p->multiplet[ch]);
    }
}

static void
list_protons (const CwMolecule *mol, CwCouplings *c)
{
  for (int pos = 1; pos <= CW_RING_SIZE; pos++)
    for (int f = 0; f < 2; f++)
      {
        CwRingProton *p;
        if (cw_molecule_get (mol, pos, (CwFace) f) != NULL)
          continue;
        p = &c->protons[c->n_protons++];
        p->position = pos;
        p->face = (CwFace) f;
        p->geminal = -1;
        for (int ch = 0; ch < 2; ch++)
          p->axial[ch] = cw_chair_is_axial (ch, pos, (CwFace) f);
      }
  for (int i = 0; i < c->n_protons; i++)
    for (int k = 0; k < c->n_protons; k++)
      if (k != i && c->protons[k].position == c->protons[i].position)
        c->protons[i].geminal = k;
}

gboolean
cw_couplings_compute (const CwGeometryData *gd,
                      const CwMolecule     *mol,
                      const double          pop[2],
                      double                temperature,
                      const char           *set_id,
                      CwCouplings          *out,
                      GError              **error)
{
  g_return_val_if_fail (gd != NULL && mol != NULL && pop != NULL && out != NULL, FALSE);
  if (set_id != NULL && g_strcmp0 (set_id, CW_KARPLUS_BY_COUNT) != 0 &&
      cw_geometry_data_find_set (gd, set_id) == NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Unknown Karplus parameter set “%s”"), set_id);
      return FALSE;
    }
  if (!cw_check_populations (pop, error))
    return FALSE;
  memset (out, 0, sizeof *out);
  out->temperature = temperature;
  out->pop[0] = pop[0];
  out->pop[1] = pop[1];
  out->geminal = gd->geminal.value;
  out->geminal_source = gd->geminal.source;
  /* Never keep the caller's string: point into the table or at the constant. */
  out->set_request = g_strcmp0 (set_id, CW_KARPLUS_BY_COUNT) == 0 ? CW_KARPLUS_BY_COUNT
                                                                  : cw_geometry_data_find_set (gd, set_id)->id;
  for (int ch = 0; ch < 2; ch++)
    if (!cw_chair_geometry_build (gd, mol, ch, &out->geometry[ch], error))
      return FALSE;
  list_protons (mol, out);
  /* Every ring bond (pos, pos + 1), every proton pair across it. */
  for (int pos = 1; pos <= CW_RING_SIZE; pos++)
    {
      int next = ring_neighbour (pos, 1);
      for (int i = 0; i < out->n_protons; i++)
        for (int k = 0; k < out->n_protons; k++)
          {
            int lo = MIN (pos, next), hi = MAX (pos, next);
            if (out->protons[i].position != lo || out->protons[k].position != hi)
              continue;
            out->protons[i].vicinal[out->protons[i].n_vicinal++] = out->n_vicinal;
            out->protons[k].vicinal[out->protons[k].n_vicinal++] = out->n_vicinal;
            compute_vicinal (gd, mol, set_id, out, i, k);
          }
    }
  for (int i = 0; i < out->n_protons; i++)
    summarise_proton (gd, out, &out->protons[i]);
  return TRUE;
}

int
cw_couplings_find_proton (const CwCouplings *c, int position, CwFace face)
{
  g_return_val_if_fail (c != NULL, -1);
  for (int i = 0; i < c->n_protons; i++)
    if (c->protons[i].position == position && c->protons[i].face == face)
      return i;
  return -1;
}

int
cw_couplings_find_vicinal (const CwCouplings *c, int proton_a, int proton_b)
{
  g_return_val_if_fail (c != NULL, -1);
  for (int i = 0; i < c->n_vicinal; i++)
    if ((c->vicinal[i].proton_a == proton_a && c->vicinal[i].proton_b == proton_b) ||
        (c->vicinal[i].proton_a == proton_b && c->vicinal[i].proton_b == proton_a))
      return i;
  return -1;
}

char *
cw_ring_proton_dup_label (const CwRingProton *p)
{
  g_return_val_if_fail (p != NULL, NULL);
  return g_strdup_printf ("H-%d %s", p->position, p->face == CW_FACE_UP ? _("up") : _("down"));
}

int
cw_couplings_parse_proton (const CwCouplings *c, const char *text, GError **error)
{
  const char      *p = text;
  int              position, idx = -1, n = 0;
  g_autofree char *rest = NULL;

  g_return_val_if_fail (c != NULL && text != NULL, -1);
  while (g_ascii_isspace (*p))
    p++;
  if (*p == 'H' || *p == 'h')
    p++;
  if (*p == '-')
    p++;
  if (*p < '1' || *p > '6' || g_ascii_isdigit (p[1]))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s” does not name a ring proton: give the carbon (1 to 6) and the face, e.g. “2u” or “2d”"),
                      text);
      return -1;
    }
  position = *p++ - '0';
  rest = g_strstrip (g_ascii_strdown (p, -1));
  if (*rest == '\0')
    {
      for (int i = 0; i < c->n_protons; i++)
        if (c->protons[i].position == position)
          idx = i, n++;
      if (n == 1)
        return idx;
      if (n == 0)
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                     _("Carbon %d carries no hydrogen"), position);
      else
        g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                     _("Carbon %d carries two hydrogens: add the face, e.g. “%du” or “%dd”"),
                        position, position, position);
      return -1;
    }
  if (g_strcmp0 (rest, "u") == 0 || g_strcmp0 (rest, "up") == 0)
    idx = cw_couplings_find_proton (c, position, CW_FACE_UP);
  else if (g_strcmp0 (rest, "d") == 0 || g_strcmp0 (rest, "down") == 0)
    idx = cw_couplings_find_proton (c, position, CW_FACE_DOWN);
  else
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s”: the face must be “u” (up) or “d” (down)"), text);
      return -1;
    }
  if (idx < 0)
    g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                 _("“%s”: that position carries a substituent, not a hydrogen"), text);
  return idx;
}
