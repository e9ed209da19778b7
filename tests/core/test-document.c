#include "config.h"

#include <glib/gstdio.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

#include "test-helpers.h"

static CwData *data;

static char *
demo_path (void)
{
  return g_build_filename (cw_data_find_dir (), "demo.json", NULL);
}

/* load → save → load → save gives the same bytes; the demo opens. */
static void
test_round_trip (void)
{
  g_autofree char *path = demo_path ();
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = cw_document_new_from_file (path, data->groups, &error);
  g_autofree char *once = NULL, *twice = NULL;
  g_autoptr (CwDocument) again = NULL;

  g_assert_no_error (error);
  g_assert_cmpint (cw_document_peek_molecule (doc)->n_subs, ==, 3);
  once = cw_document_to_data (doc, NULL);
  again = cw_document_new_from_data (once, strlen (once), data->groups, &error);
  g_assert_no_error (error);
  twice = cw_document_to_data (again, NULL);
  g_assert_cmpstr (once, ==, twice);
}

/* Fields from a newer writer survive a save; custom groups are kept with their note. */
static void
test_unknown_fields_and_custom (void)
{
  const char *json =
    "{\"format\":\"chairwise-document\",\"version\":1,\"future_field\":{\"x\":[1,2]},"
    "\"custom_groups\":[{\"id\":\"nhac\",\"label\":\"NHAc\",\"a_kcal_mol\":1.6,"
    "\"sigma_kcal_mol\":0.4,\"source\":\"my own measurement, notebook 12\"}],"
    "\"substituents\":[{\"position\":1,\"face\":\"up\",\"group\":\"nhac\"},"
    "{\"position\":3,\"face\":\"up\",\"group\":\"methyl\"}]}";
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = cw_document_new_from_data (json, strlen (json), data->groups, &error);
  g_autofree char *out = NULL;
  g_autoptr (CwDocument) back = NULL;
  CwConditions cond;
  CwAnalysis an;

  g_assert_no_error (error);
  out = cw_document_to_data (doc, NULL);
  g_assert_nonnull (strstr (out, "future_field"));
  g_assert_nonnull (strstr (out, "notebook 12"));
  back = cw_document_new_from_data (out, strlen (out), data->groups, &error);
  g_assert_no_error (error);
  cw_document_get_conditions (back, &cond);
  g_assert_true (cw_analyze (data, cw_document_peek_molecule (back), &cond, &an, NULL));
  g_assert_true (cw_analysis_has_flag (&an, CW_FLAG_CUSTOM_GROUP));
}

static void
expect_bad (const char *json, gsize len, const char *needle)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = cw_document_new_from_data (json, len, data->groups, &error);

  g_assert_null (doc);
  g_assert_nonnull (error);
  if (strstr (error->message, needle) == NULL)
    g_error ("message “%s” lacks “%s”", error->message, needle);
}

#define HEAD "{\"format\":\"chairwise-document\",\"version\":1,"

static void
test_bad_documents (void)
{
  const struct { const char *json; const char *needle; } cases[] = {
    { "{\"format\":\"chairwise-document\",", "invalid JSON" },
    { "\"just a string\"", "object" },
    { "{\"version\":1,\"substituents\":[]}", "format" },
    { "{\"format\":\"chairwise-document\",\"version\":2,\"substituents\":[]}", "newer" },
    { "{\"format\":\"chairwise-document\",\"version\":\"1\",\"substituents\":[]}", "version" },
    { HEAD "\"substituents\":{}}", "substituents" },
    { HEAD "\"substituents\":[{\"position\":1,\"face\":\"up\"}]}", "substituent 1: field “group”" },
    { HEAD "\"substituents\":[{\"position\":1,\"face\":\"up\",\"group\":\"zz\"}]}", "unknown group “zz”" },
    { HEAD "\"substituents\":[{\"position\":7,\"face\":\"up\",\"group\":\"methyl\"}]}", "position" },
    { HEAD "\"substituents\":[{\"position\":1.5,\"face\":\"up\",\"group\":\"methyl\"}]}", "whole number" },
    { HEAD "\"substituents\":[{\"position\":1,\"face\":\"left\",\"group\":\"methyl\"}]}", "left" },
    { HEAD "\"substituents\":[{\"position\":1,\"face\":\"up\",\"group\":\"methyl\"},"
      "{\"position\":1,\"face\":\"up\",\"group\":\"ethyl\"}]}", "substituent 2: position 1 already" },
    { HEAD "\"temperature_k\":-5,\"substituents\":[]}", "temperature_k" },
    { HEAD "\"temperature_k\":1e6,\"substituents\":[]}", "temperature_k" },
    { HEAD "\"temperature_k\":\"hot\",\"substituents\":[]}", "temperature_k" },
    { HEAD "\"solvent\":\"water\",\"substituents\":[]}", "solvent" },
    { HEAD "\"custom_groups\":[{\"id\":\"methyl\",\"a_kcal_mol\":1,\"sigma_kcal_mol\":0}],"
      "\"substituents\":[]}", "already names" },
    { HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1e300,\"sigma_kcal_mol\":0}],"
      "\"substituents\":[]}", "custom group 1" },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (cases); i++)
    expect_bad (cases[i].json, strlen (cases[i].json), cases[i].needle);
  expect_bad ("{\"title\":\"\xff\xfe\"}", 14, "UTF-8");
}

/* Atomic save: the old version goes to .bak; a failed save leaves the file untouched. */
static void
test_save (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-doc-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "a.json", NULL);
  g_autofree char *bak = g_strconcat (path, ".bak", NULL);
  g_autoptr (CwDocument) doc = cw_document_new ();
  g_autoptr (GError) error = NULL;
  g_autofree char *first = NULL, *backup = NULL;

  cw_document_set_title (doc, "first");
  g_assert_true (cw_document_save (doc, path, TRUE, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (path, &first, NULL, NULL));
  cw_document_set_title (doc, "second");
  g_assert_true (cw_document_save (doc, path, TRUE, &error));
  g_assert_true (g_file_get_contents (bak, &backup, NULL, NULL));
  g_assert_cmpstr (backup, ==, first);
  if (getuid () != 0) /* root ignores directory permissions */
    {
      g_chmod (dir, 0500);
      g_assert_false (cw_document_save (doc, path, FALSE, &error));
      g_assert_nonnull (strstr (error->message, path));
      g_chmod (dir, 0700);
    }
  {
    /* a folder that cannot be written even by root */
    const char *nowhere = "/proc/chairwise-no-such-dir/a.json";
    g_clear_error (&error);
    g_assert_false (cw_document_save (doc, nowhere, TRUE, &error));
    g_assert_nonnull (strstr (error->message, nowhere));
  }
  g_remove (bak);
  g_remove (path);
  g_rmdir (dir);
}

/* A document far larger than any real one is refused before it is read in full. */
static void
test_huge (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-doc-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "big.json", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = NULL;
  FILE *f = fopen (path, "w");

  g_assert_nonnull (f);
  g_assert_cmpint (ftruncate (fileno (f), 50 * 1000 * 1000), ==, 0);
  fclose (f);
  doc = cw_document_new_from_file (path, data->groups, &error);
  g_assert_null (doc);
  g_assert_nonnull (strstr (error->message, "MB"));
  g_remove (path);
  g_rmdir (dir);
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/document/round-trip", test_round_trip);
  g_test_add_func ("/core/document/unknown-fields-custom", test_unknown_fields_and_custom);
  g_test_add_func ("/core/document/bad", test_bad_documents);
  g_test_add_func ("/core/document/save", test_save);
  g_test_add_func ("/core/document/huge", test_huge);
  ret = g_test_run ();
  cw_data_free (data);
  return ret;
}
