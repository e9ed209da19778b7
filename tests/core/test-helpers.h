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
