#include "config.h"

#include <string.h>

#include "test-helpers.h"

static CwData *data;

/* Relative configuration by the usual cis/trans and r/c/t conventions (IUPAC recommendations
 * for relative configuration, common practice). */
static void
test_configuration (void)
{
  const struct { const char *spec; const char *config; } cases[] = {
    { "1u=methyl", "" },
    { "1u=methyl 2u=methyl", "cis" },
    { "1u=methyl 4d=methyl", "trans" },
    { "1u=methyl 3u=methyl 4d=chloro", "r-1, c-3, t-4" },
    { "2d=methyl 5d=methyl 1u=isopropyl", "r-1, t-2, t-5" },
    { "1u=methyl 1d=methyl", "" },
    { "1u=methyl 1d=methyl 4u=tert-butyl", "" },            /* C1 is not stereogenic */
    { "1u=hydroxy 1d=methyl 4u=tert-butyl", "cis" },        /* OH outranks Me (O > C) */
    { "1d=hydroxy 1u=methyl 4u=tert-butyl", "trans" },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (CwMolecule) mol = test_ring (data, cases[i].spec);
      g_autofree char *c = cw_molecule_dup_configuration (mol);
      g_assert_cmpstr (c, ==, cases[i].config);
    }
}

static void
test_spec_round_trip (void)
{
  g_autoptr (CwMolecule) mol = test_ring (data, "3u=Cl, 1d=methyl 1u=Ph");
  g_autofree char *spec = cw_molecule_dup_spec (mol);

  g_assert_cmpstr (spec, ==, "1u=phenyl 1d=methyl 3u=chloro");
}

static void
test_spec_errors (void)
{
  const struct { const char *spec; const char *expect; } bad[] = {
    { "", "names no groups" },
    { "7u=methyl", "7u" },
    { "1x=methyl", "1x" },
    { "1u=unobtainium", "unobtainium" },
    { "1u=methyl 1u=ethyl", "already" },
    { "1u", "1u" },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec (bad[i].spec, data->groups, &error);
      g_assert_null (mol);
      g_assert_nonnull (error);
      g_assert_nonnull (strstr (error->message, bad[i].expect));
    }
}

static void
test_edit (void)
{
  g_autoptr (CwMolecule) mol = cw_molecule_new ();
  g_autoptr (GError) error = NULL;
  const CwGroup *me = cw_group_table_lookup (data->groups, "methyl");
  const CwGroup *custom;
  g_autoptr (CwMolecule) copy = NULL;

  g_assert_true (cw_molecule_set (mol, 4, CW_FACE_DOWN, me, NULL));
  g_assert_true (cw_molecule_set (mol, 1, CW_FACE_UP, me, NULL));
  g_assert_cmpint (mol->subs[0].position, ==, 1); /* kept sorted */
  g_assert_false (cw_molecule_set (mol, 0, CW_FACE_UP, me, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
  custom = cw_molecule_add_custom_group (mol, cw_group_new_custom ("nhac", "NHAc", 1.6, 0.3, "my note"));
  g_assert_true (cw_molecule_set (mol, 2, CW_FACE_UP, custom, NULL));
  copy = cw_molecule_copy (mol);
  /* the copy owns its own custom group and points at it */
  g_assert_true (copy->subs[1].group != custom);
  g_assert_cmpstr (copy->subs[1].group->id, ==, "nhac");
  g_assert_true (cw_molecule_remove (mol, 4, CW_FACE_DOWN));
  g_assert_false (cw_molecule_remove (mol, 4, CW_FACE_DOWN));
  g_assert_cmpint (mol->n_subs, ==, 2);
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/molecule/configuration", test_configuration);
  g_test_add_func ("/core/molecule/spec-round-trip", test_spec_round_trip);
  g_test_add_func ("/core/molecule/spec-errors", test_spec_errors);
  g_test_add_func ("/core/molecule/edit", test_edit);
  ret = g_test_run ();
  cw_data_free (data);
  return ret;
}
