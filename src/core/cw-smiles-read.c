/* cw-smiles-read.c: from the parsed graph to ring, substituents, groups and faces.
 *
 * Steps: keep the largest disconnected part; find the rings (each ring bond of the text closes
 * one cycle of the parse tree); perceive Kekulé benzene rings as aromatic; pick the one
 * saturated all-carbon six-membered ring that shares no atom with another ring; cut each
 * substituent off at its ring carbon and look its rooted fragment up in the index; read each
 * face from @/@@; enumerate the cis/trans isomers of ring stereocentres left open. */
#include "config.h"

#include <glib/gi18n-lib.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-smiles-private.h"
#include "cw-smiles-reading.h"
#include "cw-smiles.h"

#define MAX_ISOMER_TRIES 64


/* ---- parts ---- */

static int
choose_component (Reading *r, GString *notes, CwSmilesInfo *info)
{
  CwSmGraph *g = r->g;
  int        queue[CW_SM_MAX_ATOMS], n_comp = 0, best = 0, best_heavy = -1, heavy[CW_SM_MAX_ATOMS];

  if (g->n_dots == 0)
    {
      /* one part: the parser refuses ring bonds across a '.' */
      for (int i = 0; i < g->n_atoms; i++)
        r->comp[i] = 0;
      r->keep = 0;
      info->n_dropped = 0;
      return 0;
    }
  for (int i = 0; i < g->n_atoms; i++)
    r->comp[i] = -1;
  for (int i = 0; i < g->n_atoms; i++)
    {
      int head = 0, tail = 0;
      if (r->comp[i] >= 0)
        continue;
      heavy[n_comp] = 0;
      r->comp[i] = n_comp;
      queue[tail++] = i;
      while (head < tail)
        {
          const CwSmAtom *a = &g->atoms[queue[head++]];
          heavy[n_comp] += a->element != 1;
          for (int k = 0; k < a->degree; k++)
            if (r->comp[a->nb[k]] < 0)
              {
                r->comp[a->nb[k]] = n_comp;
                queue[tail++] = a->nb[k];
              }
        }
      if (heavy[n_comp] > best_heavy)
        best = n_comp, best_heavy = heavy[n_comp];
      n_comp++;
    }
  r->keep = best;
  info->n_dropped = n_comp - 1;
  if (n_comp > 1 && notes)
    {
      g_string_append_printf (notes, _("The SMILES has %d disconnected parts; kept the largest (%d heavy atoms) and left out:"),
                                        n_comp, best_heavy);
      for (int c = 0; c < n_comp; c++)
        {
          int from = G_MAXINT, to = 0;
          if (c == best)
            continue;
          for (int i = 0; i < g->n_atoms; i++)
            if (r->comp[i] == c)
              {
                from = MIN (from, g->atoms[i].pos);
                to = MAX (to, g->atoms[i].pos + g->atoms[i].len);
              }
          g_autofree char *part = cw_sm_valid_text (g->text, from, to);
          g_string_append_printf (notes, " %s", part);
        }
      g_string_append (notes, ".\n");
    }
  return best;
}

static int
bond_order (const CwSmGraph *g, int a, int b)
{
  const CwSmAtom *x = &g->atoms[a];
  for (int k = 0; k < x->degree; k++)
    if (x->nb[k] == b)
      return x->bond[k];
  return 0;
}

static void
set_bond (CwSmGraph *g, int a, int b, int order)
{
  CwSmAtom *x = &g->atoms[a], *y = &g->atoms[b];
  for (int k = 0; k < x->degree; k++)
    if (x->nb[k] == b)
      x->bond[k] = order;
  for (int k = 0; k < y->degree; k++)
    if (y->nb[k] == a)
      y->bond[k] = order;
}

static void
find_cycles (Reading *r)
{
  CwSmGraph *g = r->g;

  for (int i = 0; i < g->n_atoms; i++)
    {
      r->depth[i] = g->atoms[i].parent < 0 ? 0 : r->depth[g->atoms[i].parent] + 1;
      r->member[i] = 0;
    }
  r->n_cycles = 0;
  for (int c = 0; c < g->n_closures; c++)
    {
      int  a = g->closures[c].a, b = g->closures[c].b, up[CW_SM_MAX_ATOMS], n_up = 0, down[CW_SM_MAX_ATOMS], n_down = 0;
      int *cy = r->cycle[r->n_cycles], n = 0;
      if (r->comp[a] != r->keep)
        continue;
      while (r->depth[a] > r->depth[b])
        up[n_up++] = a, a = g->atoms[a].parent;
      while (r->depth[b] > r->depth[a])
        down[n_down++] = b, b = g->atoms[b].parent;
      while (a != b)
        {
          up[n_up++] = a, a = g->atoms[a].parent;
          down[n_down++] = b, b = g->atoms[b].parent;
        }
      for (int i = 0; i < n_up; i++)
        cy[n++] = up[i];
      cy[n++] = a;
      for (int i = n_down - 1; i >= 0; i--)
        cy[n++] = down[i];
      r->cycle_len[r->n_cycles] = n;
      for (int i = 0; i < n; i++)
        r->member[cy[i]] |= 1u << r->n_cycles;
      r->n_cycles++;
    }
}

/* Kekulé benzene rings (alternating single and double bonds, C and N) become aromatic, so that
 * "C1=CC=CC=C1" and "c1ccccc1" give the same fragment. */
static void
perceive_aromatic (Reading *r)
{
  CwSmGraph *g = r->g;

  for (int c = 0; c < r->n_cycles; c++)
    {
      int     *cy = r->cycle[c], first;
      gboolean ok = r->cycle_len[c] == 6;
      for (int i = 0; ok && i < 6; i++)
        {
          const CwSmAtom *a = &g->atoms[cy[i]];
          ok = (a->element == 6 || a->element == 7) && !a->aromatic && a->charge == 0;
        }
      if (!ok)
        continue;
      first = bond_order (g, cy[0], cy[1]);
      for (int i = 0; ok && i < 6; i++)
        {
          int b = bond_order (g, cy[i], cy[(i + 1) % 6]);
          ok = (b == CW_SM_BOND_SINGLE || b == CW_SM_BOND_DOUBLE) && ((b == first) == (i % 2 == 0));
        }
      if (!ok)
        continue;
      for (int i = 0; i < 6; i++)
        {
          g->atoms[cy[i]].aromatic = TRUE;
          set_bond (g, cy[i], cy[(i + 1) % 6], CW_SM_BOND_AROMATIC);
        }
    }
}

static gboolean
saturated_carbon (const CwSmGraph *g, int atom)
{
  const CwSmAtom *a = &g->atoms[atom];

  if (a->element != 6 || a->aromatic || a->charge != 0 || a->isotope != 0)
    return FALSE;
  for (int k = 0; k < a->degree; k++)
    if (a->bond[k] != CW_SM_BOND_SINGLE)
      return FALSE;
  return a->degree + a->hcount == 4;
}

static int
shared_atoms (const Reading *r, int c, int d)
{
  int n = 0;
  for (int i = 0; i < r->cycle_len[c]; i++)
    n += (r->member[r->cycle[c][i]] >> d) & 1;
  return n;
}

static int
ring_substituents (const Reading *r, int c)
{
  int n = 0;
  for (int i = 0; i < r->cycle_len[c]; i++)
    {
      const CwSmAtom *a = &r->g->atoms[r->cycle[c][i]];
      for (int k = 0; k < a->degree; k++)
        n += !((r->member[a->nb[k]] >> c) & 1) && !cw_sm_is_hydrogen (r->g, a->nb[k]);
    }
  return n;
}

static void
describe_cycle (const Reading *r, int c, GString *s)
{
  g_string_append_printf (s, _("%d-membered ring at characters "), r->cycle_len[c]);
  for (int i = 0; i < r->cycle_len[c]; i++)
    g_string_append_printf (s, i ? ",%d" : "%d", r->g->atoms[r->cycle[c][i]].pos + 1);
}

/* Why a six-membered ring is not a plain cyclohexane: the first atom that disqualifies it. */
static void
describe_not_saturated (const Reading *r, int c, GString *s)
{
  for (int i = 0; i < 6; i++)
    {
      const CwSmAtom *a = &r->g->atoms[r->cycle[c][i]];
      const char     *why = NULL;
      if (a->element != 6)
        why = _("not carbon");
      else if (a->aromatic)
        why = _("aromatic");
      else if (a->charge != 0)
        why = _("charged");
      else if (a->isotope != 0)
        why = _("isotope-labelled");
      else if (!saturated_carbon (r->g, r->cycle[c][i]))
        why = _("not saturated");
      if (why)
        {
          g_string_append_printf (s, _(" (%s at character %d)"), why, a->pos + 1);
          return;
        }
    }
}

static gboolean
no_ring_error (Reading *r, GError **error)
{
  g_autoptr (GString) s = g_string_new (NULL);
  int spiro = -1, fused = -1;

  for (int c = 0; c < r->n_cycles; c++)
    {
      gboolean sat = r->cycle_len[c] == 6;
      for (int i = 0; sat && i < 6; i++)
        sat = saturated_carbon (r->g, r->cycle[c][i]);
      for (int d = 0; d < r->n_cycles; d++)
        if (d != c)
          {
            int n = shared_atoms (r, c, d);
            if (n >= 2 && (sat || fused < 0))
              fused = c;
            else if (n == 1 && sat)
              spiro = c;
          }
    }
  if (fused >= 0)
    {
      describe_cycle (r, fused, s);
      cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, r->g, r->g->atoms[r->cycle[fused][0]].pos,
                       _("a fused or bridged ring system (the %s shares a bond with another ring); only an isolated cyclohexane ring is analysed"),
                          s->str);
      return FALSE;
    }
  if (spiro >= 0)
    {
      describe_cycle (r, spiro, s);
      cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, r->g, r->g->atoms[r->cycle[spiro][0]].pos,
                       _("a spiro ring system (the cyclohexane %s shares an atom with another ring)"), s->str);
      return FALSE;
    }
  for (int c = 0; c < r->n_cycles; c++)
    {
      g_string_append (s, c ? "; " : _(" Rings found: "));
      describe_cycle (r, c, s);
      if (r->cycle_len[c] == 6)
        describe_not_saturated (r, c, s);
    }
  cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, r->g, -1,
                   _("No cyclohexane ring (a saturated all-carbon six-membered ring) in the SMILES.%s"),
                      r->n_cycles ? s->str : _(" It has no ring at all."));
  return FALSE;
}

static gboolean
choose_ring (Reading *r, GString *notes, GError **error)
{
  int cand[CW_SM_MAX_CYCLES], n_cand = 0, chosen = -1, n_busy = 0;

  for (int c = 0; c < r->n_cycles; c++)
    {
      gboolean ok = r->cycle_len[c] == 6;
      for (int i = 0; ok && i < 6; i++)
        ok = saturated_carbon (r->g, r->cycle[c][i]);
      for (int d = 0; ok && d < r->n_cycles; d++)
        ok = d == c || shared_atoms (r, c, d) == 0;
      if (ok)
        cand[n_cand++] = c;
    }
  if (n_cand == 0)
    return no_ring_error (r, error);
  /* a second ring that is only a cyclohexyl substituent does not compete */
  for (int k = 0; k < n_cand; k++)
    if (ring_substituents (r, cand[k]) != 1)
      {
        if (chosen < 0)
          chosen = cand[k];
        n_busy++;
      }
  if (n_busy > 1)
    {
      g_autoptr (GString) s = g_string_new (NULL);
      for (int k = 0; k < n_cand; k++)
        {
          g_string_append (s, k ? "; " : "");
          describe_cycle (r, cand[k], s);
        }
      cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, r->g, -1,
                       _("More than one substituted cyclohexane ring (%s); analyse one ring at a time"), s->str);
      return FALSE;
    }
  if (chosen < 0)
    {
      chosen = cand[0];
      if (notes && n_cand > 1)
        g_string_append (notes, _("Two equivalent cyclohexane rings: the first one is the ring analysed, the other its cyclohexyl group.\n"));
    }
  memcpy (r->ring, r->cycle[chosen], sizeof r->ring);
  return TRUE;
}

/* The stretch of text [*lo, *hi) that holds exactly the fragment's atoms and all of its ring
 * bonds, or FALSE. Ring-bond digits after the last atom belong to it and are included. */
static gboolean
fragment_span (const Reading *r, guint8 mark, const int *atoms, int n, int *lo, int *hi)
{
  const CwSmGraph *g = r->g;
  int              a = G_MAXINT, b = 0;

  int lo_atom = G_MAXINT, hi_atom = -1;

  for (int k = 0; k < n; k++)
    {
      const CwSmAtom *x = &g->atoms[atoms[k]];
      a = MIN (a, x->pos);
      b = MAX (b, x->pos + x->len);
      lo_atom = MIN (lo_atom, atoms[k]);
      hi_atom = MAX (hi_atom, atoms[k]);
    }
  /* atoms are numbered in text order: the stretch holds no other atom exactly when the
   * fragment's atoms are consecutive */
  if (hi_atom - lo_atom + 1 != n)
    return FALSE;
  while (b < g->text_len)
    {
      char c = g->text[b];
      if (g_ascii_isdigit (c))
        b++;
      else if (c == '%' && b + 2 < g->text_len && g_ascii_isdigit (g->text[b + 1]) && g_ascii_isdigit (g->text[b + 2]))
        b += 3;
      else if ((c == '-' || c == '=' || c == '#' || c == '$' || c == ':' || c == '/' || c == '\\') &&
               b + 1 < g->text_len && (g_ascii_isdigit (g->text[b + 1]) || g->text[b + 1] == '%'))
        b++;
      else
        break;
    }
  if (b - a > CW_SM_FRAG_TEXT)
    return FALSE;
  for (int c = 0; c < g->n_closures; c++)
    {
      gboolean in_a = r->mask[g->closures[c].a] == mark, in_b = r->mask[g->closures[c].b] == mark;
      gboolean here = g->closures[c].pos >= a && g->closures[c].pos < b;
      if ((in_a || in_b || here) && !(in_a && in_b && here))
        return FALSE;
    }
  *lo = a;
  *hi = b;
  return TRUE;
}

static const CwGroup *
lookup_fragment (Reading *r, int root, guint8 mark, const int *atoms, int n)
{
  CwSmGraph          *g = r->g;
  CwSmFragCacheEntry *e = NULL;
  const CwGroup      *group;
  int                 lo, hi;

  if (g->frag_cache && fragment_span (r, mark, atoms, n, &lo, &hi))
    {
      int     root_off = g->atoms[root].pos - lo;
      guint64 key = cw_sm_frag_key (g->text, lo, hi, root_off);
      if ((e = cw_sm_frag_find (g->frag_cache, key, g->text, lo, hi, root_off)) != NULL)
        return e->group;
      e = cw_sm_frag_insert (g->frag_cache, key);
      e->key = key;
      e->len = hi - lo;
      e->root_off = g->atoms[root].pos - lo;
      memcpy (e->text, g->text + lo, hi - lo);
      e->group = NULL;
    }
  group = cw_sm_index_lookup (r->index, cw_sm_fragment_hash (g, root, r->mask, mark));
  if (e)
    e->group = group; /* unknown fragments are remembered as unknown */
  return group;
}

static gboolean
cut_substituents (Reading *r, GError **error)
{
  CwSmGraph *g = r->g;
  int        queue[CW_SM_MAX_ATOMS];
  g_autoptr (GString) unknown = NULL;
  int first_unknown = -1;

  memset (r->mask, 0, g->n_atoms);
  for (int i = 0; i < CW_RING_SIZE; i++)
    r->mask[r->ring[i]] = 255;
  r->n_subs = 0;
  r->inner_stereo = FALSE;
  for (int i = 0; i < CW_RING_SIZE; i++)
    {
      const CwSmAtom *a = &g->atoms[r->ring[i]];
      for (int k = 0; k < a->degree; k++)
        {
          int root = a->nb[k], head = 0, tail = 0, s = r->n_subs;
          if (r->mask[root] == 255 || cw_sm_is_hydrogen (g, root))
            continue;
          g_assert (s < CW_MAX_SUBS);
          r->sub_ring[s] = i;
          r->sub_atom[s] = root;
          r->mask[root] = s + 1;
          queue[tail++] = root;
          while (head < tail)
            {
              const CwSmAtom *b = &g->atoms[queue[head++]];
              r->inner_stereo |= b->chirality != CW_SM_CHIRAL_NONE;
              for (int j = 0; j < b->degree; j++)
                if (r->mask[b->nb[j]] == 0)
                  {
                    r->mask[b->nb[j]] = s + 1;
                    queue[tail++] = b->nb[j];
                  }
            }
          r->sub_group[s] = lookup_fragment (r, root, s + 1, queue, tail);
          r->n_subs++;
          if (r->sub_group[s] == NULL)
            {
              if (unknown == NULL)
                unknown = g_string_new (NULL), first_unknown = root;
              else
                g_string_append (unknown, ", ");
              g_string_append (unknown, "‘");
              cw_sm_fragment_write (g, root, r->mask, s + 1, FALSE, 1, unknown);
              g_string_append_printf (unknown, _("’ (character %d)"), g->atoms[root].pos + 1);
            }
        }
    }
  if (unknown)
    {
      cw_sm_set_error (error, CW_CORE_ERROR_UNKNOWN_GROUP, g, g->atoms[first_unknown].pos,
                       _("no group in the table matches the substituent %s; define a custom group with its A-value for it"),
                          unknown->str);
      return FALSE;
    }
  return TRUE;
}

/* Face of each substituent from the @/@@ of its ring carbon, or -1. */
static void
read_faces (Reading *r)
{
  CwSmGraph *g = r->g;

  for (int i = 0; i < CW_RING_SIZE; i++)
    {
      const CwSmAtom *a = &g->atoms[r->ring[i]];
      int             subs[2], n = 0, w[CW_SM_MAX_NB + 1], nw = 0, inversions = 0;
      guint           seen = 0;
      gboolean        clockwise;

      for (int s = 0; s < r->n_subs; s++)
        if (r->sub_ring[s] == i)
          subs[n++] = s;
      for (int s = 0; s < n; s++)
        r->sub_face[subs[s]] = -1;
      if (n == 0 || a->chirality == CW_SM_CHIRAL_NONE)
        continue;
      /* symbols: 0 previous ring carbon, 1 next, 2 first group, 3 second group or H */
      for (int k = 0; k < a->degree; k++)
        {
          if (k == a->h_slot)
            w[nw++] = 3;
          if (a->nb[k] == r->ring[(i + 5) % 6])
            w[nw++] = 0;
          else if (a->nb[k] == r->ring[(i + 1) % 6])
            w[nw++] = 1;
          else if (a->nb[k] == r->sub_atom[subs[0]])
            w[nw++] = 2;
          else
            w[nw++] = 3; /* the second group or an [H] atom */
        }
      if (a->h_slot == a->degree)
        w[nw++] = 3;
      if (nw != 4)
        continue;
      for (int x = 0; x < 4; x++)
        seen |= 1u << w[x];
      if (seen != 0xf)
        continue;
      for (int x = 0; x < 4; x++)
        for (int y = x + 1; y < 4; y++)
          inversions += w[x] > w[y];
      clockwise = (a->chirality == CW_SM_CHIRAL_CLOCKWISE) == (inversions % 2 == 0);
      /* positions run clockwise seen from the up face, so (previous, next, up, down) is
       * anticlockwise: the first group is up when the order is anticlockwise */
      r->sub_face[subs[0]] = clockwise ? CW_FACE_DOWN : CW_FACE_UP;
      if (n == 2)
        r->sub_face[subs[1]] = clockwise ? CW_FACE_UP : CW_FACE_DOWN;
    }
}

/* ---- molecules ---- */

static void
fill_molecule (const Reading *r, guint open_bits, const int *open_ring, int n_open, CwMolecule *m)
{
  int   first[CW_RING_SIZE] = { 0 }, second[CW_RING_SIZE] = { 0 }, count[CW_RING_SIZE] = { 0 }, n = 0;
  guint flips = 0; /* bit i: the open carbon at ring index i takes its faces the other way */

  m->custom_groups = NULL;
  if (r->n_subs == 0)
    {
      m->n_subs = 0;
      return;
    }
  for (int k = 0; k < n_open; k++)
    flips |= ((open_bits >> k) & 1u) << open_ring[k];
  /* each carbon's groups in the order read (a ring carbon has at most two) */
  for (int s = 0; s < r->n_subs; s++)
    {
      int i = r->sub_ring[s];
      first[i] = count[i] ? first[i] : s;
      second[i] = count[i] ? s : second[i];
      count[i]++;
    }
  /* written without branching on the data: both slots of every carbon are stored (the up
   * face first) and only those that hold a group move the count on. An unwritten face is up
   * for the first group and down for the second, the other way round where the open carbon is
   * flipped. */
  for (int i = 0; i < CW_RING_SIZE; i++)
    {
      int up0 = (int) ((flips >> i) & 1u) ? CW_FACE_DOWN : CW_FACE_UP, up1 = up0 == CW_FACE_UP ? CW_FACE_DOWN : CW_FACE_UP;
      int f0 = r->sub_face[first[i]], f1 = r->sub_face[second[i]];
      int s0 = first[i], s1 = second[i], swap;
      f0 = f0 >= 0 ? f0 : up0;
      f1 = f1 >= 0 ? f1 : up1;
      swap = (count[i] == 2) & (f0 > f1);
      for (int k = 0; k < 2; k++)
        {
          int slot = MIN (n, CW_MAX_SUBS - 1), which = k ^ swap;
          m->subs[slot].group = r->sub_group[which ? s1 : s0];
          m->subs[slot].position = i + 1;
          m->subs[slot].face = which ? f1 : f0;
          n += k < count[i];
        }
    }
  m->n_subs = n;
}

int
cw_sm_make_molecules (Reading *r, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes, GError **error)
{
  CwMolecule base;
  gboolean   relevant[CW_RING_SIZE + 1];
  int        open_ring[CW_RING_SIZE], n_open = 0, n_rel, n_out = 0;
  gint64     keys[MAX_ISOMER_TRIES][CW_SM_KEY_LEN];
  gboolean   all_open;

  fill_molecule (r, 0, NULL, 0, &base);
  n_rel = cw_sm_relevant_carbons (&base, relevant);
  info->n_open = 0;
  if (n_rel >= 2)
    {
      /* the open stereocentres: relevant carbons with a group whose face was not written, in
       * ring order */
      guint open_mask = 0;
      for (int s = 0; s < r->n_subs; s++)
        open_mask |= (guint) (relevant[r->sub_ring[s] + 1] && r->sub_face[s] < 0) << r->sub_ring[s];
      for (; open_mask != 0; open_mask &= open_mask - 1)
        {
          int i = __builtin_ctz (open_mask);
          info->open_pos[n_open] = r->g->atoms[r->ring[i]].pos;
          open_ring[n_open++] = i;
        }
    }
  info->n_open = n_open;
  all_open = n_open == n_rel;
  for (guint bits = 0; bits < (1u << n_open); bits++)
    {
      CwMolecule      m;
      CwRingTransform t;
      gboolean        dup = FALSE;

      if (all_open && n_open > 0 && (bits & 1))
        continue; /* the first open carbon fixes the frame */
      if (n_open == 0)
        m = base;
      else
        fill_molecule (r, bits, open_ring, n_open, &m);
      if (n_open > 0)
        {
          /* isomers that differ only by mirror image or numbering are one relative configuration */
          cw_sm_canonical_transform (&m, TRUE, &t);
          cw_sm_molecule_key (&m, &t, keys[n_out]);
          for (int k = 0; k < n_out && !dup; k++)
            dup = memcmp (keys[k], keys[n_out], sizeof keys[k]) == 0;
          if (dup)
            continue;
        }
      if (n_out >= max_out)
        {
          cw_sm_set_error (error, CW_CORE_ERROR_UNSUPPORTED, r->g, -1,
                           _("more cis/trans isomers than fit (%d)"), max_out);
          return -1;
        }
      cw_sm_canonicalize (&m, n_rel < 2); /* open faces do not change which carbons are relevant */
      out[n_out].n_subs = m.n_subs;
      out[n_out].custom_groups = NULL;
      memcpy (out[n_out].subs, m.subs, sizeof (CwSubstituent) * m.n_subs);
      n_out++;
    }
  if (n_open > 0 && notes)
    {
      g_string_append (notes, n_open == 1 ? _("The ring stereocentre at character") : _("The ring stereocentres at characters"));
      for (int k = 0; k < n_open; k++)
        g_string_append_printf (notes, k == 0 ? " %d" : k == n_open - 1 ? _(" and %d") : ", %d", info->open_pos[k] + 1);
      g_string_append_printf (notes, ngettext (" has no @/@@: it is left open and the %d cis/trans isomer is analysed.\n", " have no @/@@: they are left open and each of the %d cis/trans isomers is analysed.\n", n_out),
                              n_out);
    }
  if (r->inner_stereo && notes)
    g_string_append (notes, _("@/@@ inside a substituent are not used: only the ring's faces matter here.\n"));
  return n_out;
}

int
cw_sm_read (const CwSmIndex *index, CwSmGraph *g, guint8 *mask, const char *text, int len, CwMolecule *out, int max_out, CwSmilesInfo *info, GString *notes, GError **error)
{
  Reading *r = g_alloca (sizeof (Reading));

  r->g = g;
  r->mask = mask;
  r->index = index;
  info->n_molecules = 0;
  info->n_open = 0;
  info->n_dropped = 0;
  info->error_pos = -1;
  g->error_pos = -1;
  if (g->frag_cache && !g->general_only)
    {
      int n = cw_sm_read_fast (index, g, text, len, out, max_out, info, notes);
      if (n > 0)
        {
          g->n_fast++;
          return n;
        }
    }
  if (!cw_sm_parse (g, text, len, FALSE, error))
    goto fail;
  choose_component (r, notes, info);
  find_cycles (r);
  perceive_aromatic (r);
  if (!choose_ring (r, notes, error) || !cut_substituents (r, error))
    goto fail;
  read_faces (r);
  info->n_molecules = cw_sm_make_molecules (r, out, max_out, info, notes, error);
  if (info->n_molecules < 0)
    goto fail;
  return info->n_molecules;

fail:
  info->n_molecules = 0;
  info->error_pos = g->error_pos;
  return -1;
}

void
cw_sm_perceive_aromatic_rings (CwSmGraph *g)
{
  Reading *r = g_new (Reading, 1);

  r->g = g;
  r->keep = 0;
  for (int i = 0; i < g->n_atoms; i++)
    r->comp[i] = 0;
  find_cycles (r);
  perceive_aromatic (r);
  g_free (r);
}

int
cw_sm_read_detail (const CwSmIndex *index, CwSmGraph *g, guint8 *mask, const char *text, int len, CwSmDetail *detail, GError **error)
{
  Reading     *r = g_new (Reading, 1);
  CwSmilesInfo info;
  int          n = -1;

  r->g = g;
  r->mask = mask;
  r->index = index;
  g->error_pos = -1;
  if (cw_sm_parse (g, text, len, FALSE, error))
    {
      choose_component (r, NULL, &info);
      find_cycles (r);
      perceive_aromatic (r);
      if (choose_ring (r, NULL, error) && cut_substituents (r, error))
        {
          read_faces (r);
          n = r->n_subs;
          memcpy (detail->ring_atom, r->ring, sizeof r->ring);
          for (int s = 0; s < n; s++)
            {
              detail->root_atom[s] = r->sub_atom[s];
              detail->ring_index[s] = r->sub_ring[s];
              detail->face[s] = r->sub_face[s];
              detail->group[s] = r->sub_group[s];
            }
        }
    }
  g_free (r);
  return n;
}
