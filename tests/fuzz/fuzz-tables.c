/* libFuzzer harness: the data-table loaders (groups and interactions). An accepted table is put
 * to work with the shipped other half: every group alone and next to its neighbour, and every
 * pair term, must give a sound analysis. */
#include "fuzz-common.h"

static void
analyze_spec (const CwData *data, const CwGroup *x, const CwGroup *y, int py, CwFace fy)
{
  g_autoptr (CwMolecule) mol = cw_molecule_new ();
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
  CwAnalysis an;
  g_autoptr (GError) error = NULL;

  if (!cw_molecule_set (mol, 1, CW_FACE_UP, x, &error) ||
      (y != NULL && !cw_molecule_set (mol, py, fy, y, &error)))
    return;
  for (int solvent = 0; solvent < 2; solvent++)
    {
      cond.solvent = (CwSolvent) solvent;
      g_clear_error (&error);
      if (cw_analyze (data, mol, &cond, &an, &error))
        fuzz_check_analysis (&an);
      else
        fuzz_check_error (error, TRUE);
    }
}

static void
exercise (CwGroupTable *groups, CwInteractionTable *inter)
{
  g_autoptr (CwData) data = cw_data_new (groups, inter);
  guint n = MIN (cw_group_table_get_n_groups (data->groups), 8u);

  for (guint i = 0; i < n; i++)
    {
      const CwGroup *g = cw_group_table_get (data->groups, i);
      const CwGroup *h = cw_group_table_get (data->groups, (i + 1) % n);

      FUZZ_CHECK (cw_group_table_lookup (data->groups, g->id) != NULL, "id %s not found", g->id);
      analyze_spec (data, g, NULL, 0, CW_FACE_UP);
      analyze_spec (data, g, h, 2, CW_FACE_DOWN); /* trans-1,2: gauche in one chair */
      analyze_spec (data, g, h, 3, CW_FACE_UP);   /* cis-1,3: syn-axial in one chair */
      analyze_spec (data, g, h, 1, CW_FACE_DOWN); /* geminal */
    }
}

/* The shipped file NAME, read once. */
static const char *
shipped (const char *name, gsize *len)
{
  static char *contents[2];
  static gsize lens[2];
  int k = strcmp (name, "groups.json") == 0 ? 0 : 1;

  if (contents[k] == NULL)
    {
      g_autofree char *path = g_build_filename (cw_data_find_dir (), name, NULL);
      g_autoptr (GError) error = NULL;

      FUZZ_CHECK (g_file_get_contents (path, &contents[k], &lens[k], &error), "%s", error->message);
    }
  *len = lens[k];
  return contents[k];
}

int
LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size)
{
  g_autoptr (GError) error = NULL;
  CwGroupTable *groups;
  CwInteractionTable *inter;
  const char *other;
  gsize other_len;

  groups = cw_group_table_new_from_data ((const char *) bytes, size, "fuzz.json", &error);
  if (groups == NULL)
    fuzz_check_error (error, TRUE);
  g_clear_error (&error);
  inter = cw_interaction_table_new_from_data ((const char *) bytes, size, "fuzz.json", &error);
  if (inter == NULL)
    fuzz_check_error (error, TRUE);

  /* cw_data_new takes ownership, so each half is paired with a fresh copy of the shipped other. */
  if (groups != NULL)
    {
      other = shipped ("interactions.json", &other_len);
      exercise (groups, cw_interaction_table_new_from_data (other, other_len, "interactions.json", NULL));
    }
  if (inter != NULL)
    {
      other = shipped ("groups.json", &other_len);
      exercise (cw_group_table_new_from_data (other, other_len, "groups.json", NULL), inter);
    }
  return 0;
}
