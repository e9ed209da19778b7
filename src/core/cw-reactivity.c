#include "config.h"

#include "cw-reactivity.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-fragment.h"
#include "cw-thermo.h"

static int
ring_neighbour (int position, int step)
{
  return ((position - 1 + step + CW_RING_SIZE) % CW_RING_SIZE) + 1;
}

static gboolean
is_hydrogen_like (CwElement el)
{
  return el == CW_EL_H || el == CW_EL_D;
}

static CwFace
other_face (CwFace f)
{
  return f == CW_FACE_UP ? CW_FACE_DOWN : CW_FACE_UP;
}

static void
add_warning (CwReactivity *r, CwReactWarningCode code, int a, int b, double value)
{
  if (r->n_warnings >= CW_MAX_REACT_WARNINGS)
    return;
  r->warnings[r->n_warnings++] = (CwReactWarning){ code, a, b, value };
}

/* Non-H groups on a ring carbon, not counting the slot `except` (-1 for none). */
static int
count_groups (const CwMolecule *mol, int position, int except_face)
{
  int n = 0;

  for (int f = 0; f < 2; f++)
    {
      const CwSubstituent *s = cw_molecule_get (mol, position, (CwFace) f);
      if (f != except_face && s != NULL && !is_hydrogen_like (s->group->first_atom))
        n++;
    }
  return n;
}

static void
find_anti_hydrogens (const CwMolecule *mol, CwReactivity *r, CwLeavingGroup *lg, const CwSubstituent *s)
{
  for (int ch = 0; ch < 2; ch++)
    {
      const CwChairGeometry *g = &r->geometry[ch];
      int                    x = g->slot[s->position - 1][s->face];

      for (int step = -1; step <= 1; step += 2)
        {
          int b = ring_neighbour (s->position, step);
          for (int f = 0; f < 2; f++)
            {
              int    h = g->slot[b - 1][f];
              double t;
              /* A deuterio group counts as a β-hydrogen isotope. */
              if (!is_hydrogen_like (g->atoms[h].element) || lg->n_anti[ch] >= 2)
                continue;
              t = cw_chair_geometry_torsion (g, x, g->ring[s->position - 1], g->ring[b - 1], h);
              if (fabs (t) >= r->anti_min)
                lg->anti[ch][lg->n_anti[ch]++] =
                  (CwAntiHydrogen){ b, (CwFace) f, h, t, g->atoms[h].kind == CW_ATOM_SUBSTITUENT };
            }
        }
    }
  (void) mol;
}

static void
add_ring_alkenes (const CwMolecule *mol, CwReactivity *r, CwLeavingGroup *lg, const CwSubstituent *s)
{
  for (int step = -1; step <= 1; step += 2)
    {
      int       b = ring_neighbour (s->position, step);
      CwAlkene *al = &lg->alkenes[lg->n_alkenes];

      memset (al, 0, sizeof *al);
      for (int ch = 0; ch < 2; ch++)
        for (int i = 0; i < lg->n_anti[ch]; i++)
          if (lg->anti[ch][i].position == b)
            al->chair_ok[ch] = TRUE;
      if (!al->chair_ok[0] && !al->chair_ok[1])
        continue;
      al->position_a = s->position;
      al->position_b = b;
      al->exo_sub = -1;
      /* Each alkene carbon keeps its other ring bond; add the groups left on it. */
      al->substitution = 2 + count_groups (mol, s->position, s->face) + count_groups (mol, b, -1);
      for (int ch = 0; ch < 2; ch++)
        if (al->chair_ok[ch])
          al->fraction += r->pop[ch];
      lg->n_alkenes++;
    }
}

static void
add_exo_alkene (const CwMolecule *mol, CwReactivity *r, CwLeavingGroup *lg, const CwSubstituent *s)
{
  const CwSubstituent *gem = cw_molecule_get (mol, s->position, other_face (s->face));
  CwFragmentInfo       info;
  CwAlkene            *al;

  if (gem == NULL || gem->group->first_atom != CW_EL_C)
    return;
  /* Only an sp3 first carbon gives an exocyclic alkene; a vinyl or formyl C–H would make an
   * allene or a ketene. */
  if (gem->group->klass == CW_CLASS_UNSATURATED || gem->group->klass == CW_CLASS_ARYL)
    return;
  cw_fragment_info (gem->group, &info);
  if (!info.from_smiles || info.n_hydrogens == 0 || lg->n_alkenes >= CW_MAX_ALKENES)
    return;
  /* A C–H of a freely turning geminal alkyl group can always stand anti to the leaving group. */
  lg->exo_anti = TRUE;
  al = &lg->alkenes[lg->n_alkenes++];
  memset (al, 0, sizeof *al);
  al->position_a = s->position;
  al->position_b = 0;
  al->exo_sub = (int) (gem - mol->subs);
  al->substitution = 2 + info.n_neighbours;
  al->chair_ok[0] = al->chair_ok[1] = TRUE;
  al->fraction = r->pop[0] + r->pop[1];
}

static void
analyse_leaving (const CwMolecule *mol, CwReactivity *r, const CwSubstituent *s)
{
  CwLeavingGroup *lg = &r->groups[r->n_groups++];
  int             best = 0;

  memset (lg, 0, sizeof *lg);
  lg->sub = (int) (s - mol->subs);
  lg->position = s->position;
  for (int ch = 0; ch < 2; ch++)
    lg->axial[ch] = cw_chair_is_axial (ch, s->position, s->face);
  find_anti_hydrogens (mol, r, lg, s);
  add_ring_alkenes (mol, r, lg, s);
  add_exo_alkene (mol, r, lg, s);
  for (int ch = 0; ch < 2; ch++)
    {
      lg->reactive[ch] = lg->n_anti[ch] > 0 || lg->exo_anti;
      if (lg->reactive[ch])
        lg->reactive_fraction += r->pop[ch];
    }
  for (int i = 0; i < lg->n_alkenes; i++)
    best = MAX (best, lg->alkenes[i].substitution);
  for (int i = 0; i < lg->n_alkenes; i++)
    lg->alkenes[i].most_substituted = lg->alkenes[i].substitution == best;
  lg->no_anti_h = lg->n_alkenes == 0;
  if (lg->no_anti_h)
    add_warning (r, CW_REACT_NO_ANTI_H, lg->sub, -1, 0);
  else if (lg->reactive_fraction < 0.5)
    add_warning (r, CW_REACT_MINOR_CHAIR, lg->sub, -1, lg->reactive_fraction);
  if (count_groups (mol, s->position, s->face) > 0)
    add_warning (r, CW_REACT_GEMINAL_LEAVING, lg->sub, -1, 0);
}

static gboolean
pair_role (const CwGeometryData *gd, const CwGroup *a, const CwGroup *b, CwAntiPairRole *role, gboolean *swap)
{
  *swap = FALSE;
  if (a->leaving && b->leaving)
    *role = CW_ANTI_ELIMINATION_XY;
  else if (a->leaving && gd->neighbouring[b->first_atom])
    *role = CW_ANTI_PARTICIPATION;
  else if (b->leaving && gd->neighbouring[a->first_atom])
    *role = CW_ANTI_PARTICIPATION, *swap = TRUE;
  else if (a->first_atom != CW_EL_C && b->first_atom != CW_EL_C && !is_hydrogen_like (a->first_atom) &&
           !is_hydrogen_like (b->first_atom))
    *role = CW_ANTI_PAIR;
  else
    return FALSE;
  return TRUE;
}

static void
analyse_pairs (const CwGeometryData *gd, const CwMolecule *mol, CwReactivity *r)
{
  for (int i = 0; i < mol->n_subs; i++)
    for (int k = i + 1; k < mol->n_subs; k++)
      {
        const CwSubstituent *a = &mol->subs[i], *b = &mol->subs[k];
        CwAntiPair          *p;
        gboolean             swap;
        CwAntiPairRole       role;

        if (ring_neighbour (a->position, 1) != b->position && ring_neighbour (a->position, -1) != b->position)
          continue;
        if (!pair_role (gd, a->group, b->group, &role, &swap) || r->n_pairs >= CW_MAX_ANTI_PAIRS)
          continue;
        if (swap)
          a = &mol->subs[k], b = &mol->subs[i];
        p = &r->pairs[r->n_pairs++];
        p->sub_a = (int) (a - mol->subs);
        p->sub_b = (int) (b - mol->subs);
        p->role = role;
        p->fraction = 0;
        for (int ch = 0; ch < 2; ch++)
          {
            const CwChairGeometry *g = &r->geometry[ch];
            p->torsion[ch] = cw_chair_geometry_torsion (g, g->slot[a->position - 1][a->face],
                                                        g->ring[a->position - 1], g->ring[b->position - 1],
                                                        g->slot[b->position - 1][b->face]);
            p->anti[ch] = fabs (p->torsion[ch]) >= r->anti_min;
            if (p->anti[ch])
              p->fraction += r->pop[ch];
          }
        if (a->face == b->face && role == CW_ANTI_PARTICIPATION)
          add_warning (r, CW_REACT_CIS_NEIGHBOUR, p->sub_a, p->sub_b, 0);
      }
}

gboolean
cw_reactivity_compute (const CwGeometryData *gd,
                       const CwMolecule     *mol,
                       const double          pop[2],
                       double                temperature,
                       CwReactivity         *out,
                       GError              **error)
{
  g_return_val_if_fail (gd != NULL && mol != NULL && pop != NULL && out != NULL, FALSE);
  if (!cw_check_populations (pop, error))
    return FALSE;
  memset (out, 0, sizeof *out);
  out->temperature = temperature;
  out->pop[0] = pop[0];
  out->pop[1] = pop[1];
  out->anti_min = gd->anti_periplanar_min.value;
  for (int ch = 0; ch < 2; ch++)
    if (!cw_chair_geometry_build (gd, mol, ch, &out->geometry[ch], error))
      return FALSE;
  for (int i = 0; i < mol->n_subs && out->n_groups < CW_MAX_LEAVING; i++)
    if (mol->subs[i].group->leaving)
      analyse_leaving (mol, out, &mol->subs[i]);
  if (out->n_groups == 0)
    add_warning (out, CW_REACT_NO_LEAVING_GROUP, -1, -1, 0);
  analyse_pairs (gd, mol, out);
  return TRUE;
}

static char *
sub_label (const CwMolecule *mol, int sub)
{
  if (sub < 0 || sub >= mol->n_subs)
    return g_strdup ("?");
  return g_strdup_printf ("%s(%d)", mol->subs[sub].group->label, mol->subs[sub].position);
}

char *
cw_alkene_dup_label (const CwAlkene *alkene, const CwMolecule *mol)
{
  static const char *degree[] = { "", N_("monosubstituted"), N_("disubstituted"), N_("trisubstituted"), N_("tetrasubstituted") };
  const char        *d = (alkene->substitution >= 1 && alkene->substitution <= 4) ? _(degree[alkene->substitution]) : "";

  if (alkene->position_b == 0)
    {
      g_autofree char *from = sub_label (mol, alkene->exo_sub);
      return g_strdup_printf (_("exocyclic C%d=C from %s (%s)"), alkene->position_a, from, d);
    }
  return g_strdup_printf ("C%d=C%d (%s)", MIN (alkene->position_a, alkene->position_b),
                          MAX (alkene->position_a, alkene->position_b), d);
}

const char *
cw_react_warning_code_to_string (CwReactWarningCode code)
{
  switch (code)
    {
    case CW_REACT_NO_LEAVING_GROUP:
      return "no-leaving-group";
    case CW_REACT_NO_ANTI_H:
      return "no-anti-h";
    case CW_REACT_MINOR_CHAIR:
      return "minor-chair";
    case CW_REACT_CIS_NEIGHBOUR:
      return "cis-neighbour";
    case CW_REACT_GEMINAL_LEAVING:
      return "tertiary-centre";
    case CW_N_REACT_WARNINGS:
    default:
      return "unknown";
    }
}

const char *
cw_anti_pair_role_to_string (CwAntiPairRole role)
{
  switch (role)
    {
    case CW_ANTI_PARTICIPATION:
      return "participation";
    case CW_ANTI_ELIMINATION_XY:
      return "anti-elimination";
    case CW_ANTI_PAIR:
      return "anti-pair";
    default:
      return "unknown";
    }
}

char *
cw_react_warning_dup_message (const CwReactWarning *w, const CwMolecule *mol)
{
  g_autofree char *a = sub_label (mol, w->sub_a);
  g_autofree char *b = sub_label (mol, w->sub_b);

  switch (w->code)
    {
    case CW_REACT_NO_LEAVING_GROUP:
      return g_strdup (_("No group in the molecule is marked as a leaving group."));
    case CW_REACT_NO_ANTI_H:
      return g_strdup_printf (_("%s has no anti-periplanar β-hydrogen in either chair: no E2 is possible "
                                "from it by the anti pathway; expect slow reaction, substitution or a syn/E1 route."),
                                 a);
    case CW_REACT_MINOR_CHAIR:
      return g_strdup_printf (_("%s is anti-periplanar to a β-hydrogen only in the minor chair (%.2g%% of "
                                "molecules): E2 goes through that chair and is slow."),
                                 a, 100.0 * w->value);
    case CW_REACT_CIS_NEIGHBOUR:
      return g_strdup_printf (_("%s and %s are cis: they can never be anti-periplanar, so no "
                                "neighbouring-group participation by the anti pathway."),
                                 a, b);
    case CW_REACT_GEMINAL_LEAVING:
      return g_strdup_printf (_("%s is on a carbon that carries another group: a tertiary centre, where "
                                "E1 and SN1 can compete with E2."),
                                 a);
    case CW_N_REACT_WARNINGS:
    default:
      return g_strdup ("");
    }
}
