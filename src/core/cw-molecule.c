#include "config.h"

#include "cw-molecule.h"
#include "cw-strbuf.h"

#include <glib/gi18n-lib.h>
#include <string.h>

#include "cw-core-error.h"

CwMolecule *
cw_molecule_new (void)
{
  return g_new0 (CwMolecule, 1);
}

void
cw_molecule_clear (CwMolecule *mol)
{
  mol->n_subs = 0;
  g_clear_pointer (&mol->custom_groups, g_ptr_array_unref);
}

void
cw_molecule_free (CwMolecule *mol)
{
  if (mol == NULL)
    return;
  cw_molecule_clear (mol);
  g_free (mol);
}

CwMolecule *
cw_molecule_copy (const CwMolecule *mol)
{
  CwMolecule *copy = cw_molecule_new ();

  *copy = *mol;
  copy->custom_groups = NULL;
  /* Custom groups are owned, so the copy gets its own and its substituents point at them. */
  if (mol->custom_groups != NULL)
    for (guint i = 0; i < mol->custom_groups->len; i++)
      {
        const CwGroup *old = g_ptr_array_index (mol->custom_groups, i);
        const CwGroup *new = cw_molecule_add_custom_group (copy, cw_group_copy (old));

        for (int s = 0; s < copy->n_subs; s++)
          if (copy->subs[s].group == old)
            copy->subs[s].group = new;
      }
  return copy;
}

static int
slot_key (int position, CwFace face)
{
  return position * 2 + (face == CW_FACE_DOWN ? 1 : 0);
}

const CwSubstituent *
cw_molecule_get (const CwMolecule *mol, int position, CwFace face)
{
  for (int i = 0; i < mol->n_subs; i++)
    if (mol->subs[i].position == position && mol->subs[i].face == face)
      return &mol->subs[i];
  return NULL;
}

gboolean
cw_molecule_set (CwMolecule *mol, int position, CwFace face, const CwGroup *group, GError **error)
{
  int i;

  g_return_val_if_fail (group != NULL, FALSE);
  if (position < 1 || position > CW_RING_SIZE)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Ring position %d does not exist; positions run from 1 to 6"), position);
      return FALSE;
    }
  if (face != CW_FACE_UP && face != CW_FACE_DOWN)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("Face must be up or down"));
      return FALSE;
    }
  for (i = 0; i < mol->n_subs; i++)
    if (mol->subs[i].position == position && mol->subs[i].face == face)
      {
        mol->subs[i].group = group;
        return TRUE;
      }
  /* Twelve slots (six carbons, two faces) and each is unique, so this cannot overflow. */
  g_assert (mol->n_subs < CW_MAX_SUBS);
  for (i = mol->n_subs; i > 0 && slot_key (mol->subs[i - 1].position, mol->subs[i - 1].face) >
                                   slot_key (position, face);
       i--)
    mol->subs[i] = mol->subs[i - 1];
  mol->subs[i].group = group;
  mol->subs[i].position = position;
  mol->subs[i].face = face;
  mol->n_subs++;
  return TRUE;
}

gboolean
cw_molecule_remove (CwMolecule *mol, int position, CwFace face)
{
  for (int i = 0; i < mol->n_subs; i++)
    if (mol->subs[i].position == position && mol->subs[i].face == face)
      {
        memmove (&mol->subs[i], &mol->subs[i + 1], sizeof (CwSubstituent) * (mol->n_subs - i - 1));
        mol->n_subs--;
        return TRUE;
      }
  return FALSE;
}

const CwGroup *
cw_molecule_find_custom_group (const CwMolecule *mol, const char *id)
{
  if (mol->custom_groups == NULL)
    return NULL;
  for (guint i = 0; i < mol->custom_groups->len; i++)
    {
      const CwGroup *g = g_ptr_array_index (mol->custom_groups, i);
      if (g_strcmp0 (g->id, id) == 0)
        return g;
    }
  return NULL;
}

const CwGroup *
cw_molecule_add_custom_group (CwMolecule *mol, CwGroup *group)
{
  const CwGroup *old;

  group->custom = TRUE;
  group->index = -1;
  if (mol->custom_groups == NULL)
    mol->custom_groups = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_group_free);
  old = cw_molecule_find_custom_group (mol, group->id);
  if (old != NULL)
    {
      for (int s = 0; s < mol->n_subs; s++)
        if (mol->subs[s].group == old)
          mol->subs[s].group = group;
      g_ptr_array_remove (mol->custom_groups, (gpointer) old);
    }
  g_ptr_array_add (mol->custom_groups, group);
  return group;
}

const char *
cw_face_to_string (CwFace face)
{
  return face == CW_FACE_DOWN ? "down" : "up";
}

gboolean
cw_face_from_string (const char *s, CwFace *face)
{
  if (g_strcmp0 (s, "up") == 0 || g_strcmp0 (s, "u") == 0)
    *face = CW_FACE_UP;
  else if (g_strcmp0 (s, "down") == 0 || g_strcmp0 (s, "d") == 0)
    *face = CW_FACE_DOWN;
  else
    return FALSE;
  return TRUE;
}

static int
atomic_number (CwElement el)
{
  static const int z[CW_N_ELEMENTS] = {
    [CW_EL_C] = 6, [CW_EL_H] = 1, [CW_EL_D] = 1, [CW_EL_BR] = 35, [CW_EL_CL] = 17,
    [CW_EL_F] = 9, [CW_EL_HG] = 80, [CW_EL_I] = 53, [CW_EL_N] = 7, [CW_EL_O] = 8,
    [CW_EL_S] = 16, [CW_EL_SI] = 14, [CW_EL_SN] = 50,
  };
  return el < CW_N_ELEMENTS ? z[el] : 0;
}

static double
group_mass (const CwGroup *g)
{
  /* rough CIP tie-break: heavier group first (atomic numbers stand in for masses) */
  double m = 0;

  for (int k = 0; k < CW_N_ELEMENTS; k++)
    m += g->elements[k] * atomic_number ((CwElement) k);
  return m;
}

/* The face that defines a carbon's configuration: its single group's, or for two different
 * groups the face of the one that ranks higher (first atom's atomic number, then the group's
 * size: an approximation of CIP priority). -1 when the carbon has no group or two alike. */
static int
single_face (const CwSubstituent *const found[2], int n)
{
  if (n == 1)
    return found[0]->face;
  if (n == 2 && found[0]->group != found[1]->group)
    {
      const CwGroup *a = found[0]->group, *b = found[1]->group;
      int za = atomic_number (a->first_atom), zb = atomic_number (b->first_atom);
      gboolean a_first = za != zb ? za > zb : group_mass (a) >= group_mass (b);
      return a_first ? found[0]->face : found[1]->face;
    }
  return -1;
}

void
cw_molecule_append_configuration (const CwMolecule *mol, GString *out)
{
  static const CwSubstituent none = { 0 }; /* read for a carbon without groups, not used */
  const CwSubstituent       *found[CW_RING_SIZE + 1][2];
  int                        count[CW_RING_SIZE + 1] = { 0 }, faces[CW_RING_SIZE + 1];
  guint                      stereo = 0; /* bit p: carbon p has a face of its own */
  int                        ref, n;
  char                       buf[8 + 5 * CW_RING_SIZE], *q = buf;

  for (int p = 0; p <= CW_RING_SIZE; p++)
    found[p][0] = found[p][1] = &none;
  /* the groups of each carbon in one pass (a third one on a carbon is not looked at) */
  for (int i = 0; i < mol->n_subs; i++)
    {
      int p = mol->subs[i].position;
      if (p >= 1 && p <= CW_RING_SIZE && count[p] < 2)
        found[p][count[p]++] = &mol->subs[i];
    }
  for (int p = 1; p <= CW_RING_SIZE; p++)
    {
      /* loaded for every carbon (an empty one reads "none"), so choosing takes no branch */
      int f = found[p][0]->face;
      faces[p] = count[p] == 2 ? single_face (found[p], 2) : count[p] == 1 ? f : -1;
      stereo |= (guint) (faces[p] >= 0) << p;
    }
  n = __builtin_popcount (stereo);
  if (n < 2)
    return;
  ref = __builtin_ctz (stereo);
  if (n == 2)
    {
      cw_str_puts (out, faces[__builtin_ctz (stereo & (stereo - 1))] == faces[ref] ? "cis" : "trans");
      return;
    }
  /* no printf: batch runs call this once a compound; every carbon after the reference is
   * written, and kept only when it has a face */
  memcpy (q, "r-", 2);
  q[2] = (char) ('0' + ref);
  q += 3;
  for (int p = ref + 1; p <= CW_RING_SIZE; p++)
    {
      memcpy (q, faces[p] == faces[ref] ? ", c-" : ", t-", 4);
      q[4] = (char) ('0' + p);
      q += faces[p] >= 0 ? 5 : 0;
    }
  cw_str_put (out, buf, q - buf);
}

char *
cw_molecule_dup_configuration (const CwMolecule *mol)
{
  GString *s = g_string_new (NULL);

  cw_molecule_append_configuration (mol, s);
  return g_string_free (s, FALSE);
}

char *
cw_molecule_dup_summary (const CwMolecule *mol)
{
  GString *s = g_string_new (NULL);

  if (mol->n_subs == 0)
    return g_string_free (s, FALSE);
  for (int i = 0; i < mol->n_subs; i++)
    g_string_append_printf (s, "%s%d-%s (%s)", i ? ", " : "", mol->subs[i].position,
                            mol->subs[i].group->label, cw_face_to_string (mol->subs[i].face));
  return g_string_free (s, FALSE);
}

char *
cw_molecule_dup_spec (const CwMolecule *mol)
{
  GString *s = g_string_new (NULL);

  for (int i = 0; i < mol->n_subs; i++)
    g_string_append_printf (s, "%s%d%c=%s", i ? " " : "", mol->subs[i].position,
                            mol->subs[i].face == CW_FACE_UP ? 'u' : 'd', mol->subs[i].group->id);
  return g_string_free (s, FALSE);
}

static gboolean
parse_spec_token (CwMolecule *mol, const char *tok, const CwGroupTable *table, GError **error)
{
  const char *eq = strchr (tok, '=');
  g_autofree char *slot = NULL;
  const CwGroup *group;
  CwFace face;
  int position;

  if (eq == NULL || eq == tok || eq[1] == '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s”: expected POSITION FACE = GROUP, e.g. 1u=methyl or 4d=Cl"), tok);
      return FALSE;
    }
  slot = g_strndup (tok, eq - tok);
  if (!g_ascii_isdigit (slot[0]) || !cw_face_from_string (slot + 1, &face))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s”: the slot “%s” must be a ring position 1–6 and u (up) or d (down)"),
                   tok, slot);
      return FALSE;
    }
  position = slot[0] - '0';
  group = cw_group_table_lookup (table, eq + 1);
  if (group == NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_UNKNOWN_GROUP,
                   _("“%s”: unknown group “%s” (list them with: chairwise-calc groups)"), tok, eq + 1);
      return FALSE;
    }
  if (cw_molecule_get (mol, position, face) != NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("“%s”: position %d already has a group on the %s face"), tok, position,
                   cw_face_to_string (face));
      return FALSE;
    }
  if (!cw_molecule_set (mol, position, face, group, error))
    {
      g_prefix_error (error, "“%s”: ", tok);
      return FALSE;
    }
  return TRUE;
}

CwMolecule *
cw_molecule_new_from_spec (const char *spec, const CwGroupTable *table, GError **error)
{
  g_autoptr (CwMolecule) mol = cw_molecule_new ();
  g_auto (GStrv) tokens = g_strsplit_set (spec, " \t,;", -1);

  for (int i = 0; tokens[i] != NULL; i++)
    {
      if (tokens[i][0] == '\0')
        continue;
      if (!parse_spec_token (mol, tokens[i], table, error))
        return NULL;
    }
  if (mol->n_subs == 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("ring spec “%s” names no groups; write e.g. “1u=methyl 3u=methyl”"), spec);
      return NULL;
    }
  return g_steal_pointer (&mol);
}
