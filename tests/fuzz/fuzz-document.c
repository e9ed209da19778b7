/* libFuzzer harness: the document loader (cw_document_new_from_data), then save → load → save
 * must give the same bytes, and the analysis of any accepted document must be sound. */
#include "fuzz-common.h"

static void
check_round_trip (const CwDocument *doc, const CwGroupTable *groups)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) back = NULL;
  g_autoptr (CwDocument) copy = cw_document_copy (doc);
  g_autofree char *first = NULL, *second = NULL, *third = NULL;
  gsize len = 0, len2 = 0;

  first = cw_document_to_data (doc, &len);
  back = cw_document_new_from_data (first, len, groups, &error);
  FUZZ_CHECK (back != NULL, "saved document does not load: %s\n%s", error->message, first);
  second = cw_document_to_data (back, &len2);
  FUZZ_CHECK (len == len2 && memcmp (first, second, len) == 0, "round trip changed\n%s\n%s",
              first, second);
  third = cw_document_to_data (copy, NULL);
  FUZZ_CHECK (strcmp (first, third) == 0, "copy differs");
}

int
LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size)
{
  CwData *data = fuzz_data ();
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = NULL;
  CwConditions cond;
  CwAnalysis an;

  doc = cw_document_new_from_data ((const char *) bytes, size, data->groups, &error);
  if (doc == NULL)
    {
      fuzz_check_error (error, TRUE); /* the loader itself refuses text that is not UTF-8 */
      return 0;
    }
  check_round_trip (doc, data->groups);
  cw_document_get_conditions (doc, &cond);
  if (cw_analyze (data, cw_document_peek_molecule (doc), &cond, &an, &error))
    fuzz_check_analysis (&an);
  else
    fuzz_check_error (error, TRUE);
  return 0;
}
