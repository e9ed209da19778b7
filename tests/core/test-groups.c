#include "config.h"

#include <string.h>

#include "test-helpers.h"

/* The shipped tables load, hold at least 40 groups, and every value names its source. */
static void
test_tables_load (void)
{
  g_autoptr (CwData) data = test_load_data ();
  guint n = cw_group_table_get_n_groups (data->groups);

  g_assert_cmpuint (n, >=, 40);
  for (guint i = 0; i < n; i++)
    {
      const CwGroup *g = cw_group_table_get (data->groups, i);
      g_assert_cmpuint (strlen (g->source), >, 10);
      g_assert_cmpfloat (g->a_min, <=, g->a_max);
      g_assert_cmpfloat (g->a_sigma, >=, 0);
      g_assert_true (cw_group_table_lookup (data->groups, g->id) == g);
    }
  for (guint i = 0; i < cw_interaction_table_get_n_entries (data->interactions); i++)
    g_assert_cmpuint (strlen (cw_interaction_table_get_entry (data->interactions, i)->source), >, 10);
}

/* Table values against SCIENCE notes §3 (Eliel, Wilen & Mander 1994, Table 11.7, from memory;
 * Booth & Everett 1980 for the alkyls). */
static void
test_table_values (void)
{
  g_autoptr (CwData) data = test_load_data ();
  const struct { const char *id; double a; } expect[] = {
    { "methyl", 1.74 }, { "tert-butyl", 4.9 }, { "phenyl", 2.8 }, { "chloro", 0.5 },
    { "hydroxy", 0.6 }, { "cyano", 0.2 }, { "trimethylsilyl", 2.5 },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (expect); i++)
    {
      const CwGroup *g = cw_group_table_lookup (data->groups, expect[i].id);
      g_assert_nonnull (g);
      g_assert_cmpfloat_with_epsilon (g->a, expect[i].a, 1e-9);
    }
  g_assert_true (cw_group_table_lookup (data->groups, "Me") ==
                 cw_group_table_lookup (data->groups, "methyl"));
}

static void
expect_rejected (const char *json, const char *needle)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwGroupTable) t = cw_group_table_new_from_data (json, strlen (json), "groups.json", &error);

  g_assert_null (t);
  g_assert_nonnull (error);
  if (strstr (error->message, needle) == NULL)
    g_error ("message “%s” lacks “%s”", error->message, needle);
}

#define GROUP_OK "\"id\":\"x\",\"label\":\"X\",\"markup\":\"X\",\"smiles\":\"C\",\"formula\":\"CH3\"," \
                 "\"first_atom\":\"C\",\"class\":\"alkyl\""
#define AV_OK "\"a_value\":{\"kcal_mol\":1,\"sigma\":0.1,\"source\":\"test\"}"

/* A malformed table is rejected naming file, entry and field. */
static void
test_malformed (void)
{
  expect_rejected ("{", "groups.json");
  expect_rejected ("[]", "object");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":1}", "groups");
  expect_rejected ("{\"format\":\"other\",\"version\":1,\"groups\":[]}", "format");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":9,\"groups\":[]}", "newer");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":1,\"groups\":[{" GROUP_OK "}]}",
                   "group 1 (“x”): field “a_value”");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":1,\"groups\":[{" GROUP_OK ","
                   "\"a_value\":{\"kcal_mol\":\"big\",\"sigma\":0.1,\"source\":\"s\"}}]}", "kcal_mol");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":1,\"groups\":[{" GROUP_OK ","
                   "\"a_value\":{\"kcal_mol\":1,\"sigma\":0.1,\"source\":\"\"}}]}", "source");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":1,\"groups\":[{" GROUP_OK ","
                   AV_OK "},{" GROUP_OK "," AV_OK "}]}", "group 2");
  expect_rejected ("{\"format\":\"chairwise-groups\",\"version\":1,\"groups\":[{\"id\":\"y\","
                   "\"label\":\"Y\",\"markup\":\"<b>Y\",\"smiles\":\"C\",\"formula\":\"CH3\","
                   "\"first_atom\":\"C\",\"class\":\"alkyl\"," AV_OK "}]}", "markup");
}

static void
test_formula_parse (void)
{
  int el[CW_N_ELEMENTS], charge;

  g_assert_true (cw_group_parse_formula ("C3H9OSi", el, &charge, NULL));
  g_assert_cmpint (el[CW_EL_C], ==, 3);
  g_assert_cmpint (el[CW_EL_SI], ==, 1);
  g_assert_cmpint (el[CW_EL_O], ==, 1);
  g_assert_false (cw_group_parse_formula ("C3Xx", el, &charge, NULL));
  g_assert_false (cw_group_parse_formula ("c3", el, &charge, NULL));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/groups/tables-load", test_tables_load);
  g_test_add_func ("/core/groups/table-values", test_table_values);
  g_test_add_func ("/core/groups/malformed", test_malformed);
  g_test_add_func ("/core/groups/formula-parse", test_formula_parse);
  return g_test_run ();
}
