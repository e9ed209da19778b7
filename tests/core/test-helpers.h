#pragma once

/* Shared set-up for core tests: the project's own data tables. */
#include "cw-core.h"

static inline CwData *
test_load_data (void)
{
  g_autoptr (GError) error = NULL;
  CwData *data = cw_data_new_from_dir (NULL, &error);

  g_assert_no_error (error);
  g_assert_nonnull (data);
  return data;
}

static inline CwMolecule *
test_ring (const CwData *data, const char *spec)
{
  g_autoptr (GError) error = NULL;
  CwMolecule *mol = cw_molecule_new_from_spec (spec, data->groups, &error);

  g_assert_no_error (error);
  return mol;
}

static inline void
test_analyze (const CwData *data, const char *spec, double kelvin, CwAnalysis *an)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwMolecule) mol = test_ring (data, spec);
  CwConditions cond = { kelvin, CW_SOLVENT_APROTIC };

  g_assert_true (cw_analyze (data, mol, &cond, an, &error));
  g_assert_no_error (error);
}

static inline CwGeometryData *
test_load_geometry (void)
{
  g_autoptr (GError) error = NULL;
  CwGeometryData *gd = cw_geometry_data_new_from_dir (NULL, &error);

  g_assert_no_error (error);
  g_assert_nonnull (gd);
  return gd;
}

/* Generated compounds (tests and benchmarks): n_sub picks of a ring carbon (0..5) and a table
 * group; a carbon picked twice gets a second group one time in three. slot[carbon][0..1]. */
static inline void
test_random_slots (GRand *rand, const CwGroupTable *table, int n_sub, const CwGroup *slot[6][2])
{
  guint n_groups = cw_group_table_get_n_groups (table);

  for (int k = 0; k < n_sub; k++)
    {
      int            p = g_rand_int_range (rand, 0, 6);
      const CwGroup *g = cw_group_table_get (table, g_rand_int_range (rand, 0, n_groups));
      if (slot[p][0] == NULL)
        slot[p][0] = g;
      else if (slot[p][1] == NULL && g_rand_int_range (rand, 0, 3) == 0)
        slot[p][1] = g;
    }
}
