/* The report's couplings, reaction-geometry and notes sections, read back from the PDF with
 * pdftotext; the page count with pdfinfo. */
#include "config.h"

#include <glib/gstdio.h>

#include "cw-report-private.h"
#include "render-test-util.h"

static CwData         *data;
static CwGeometryData *gd;
static char           *tmpdir;

static char *
run (const char *const *argv)
{
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr (GError) error = NULL;
  int status;

  if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &out, &err, &status, &error))
    g_error ("cannot run %s: %s", argv[0], error->message);
  if (!g_spawn_check_wait_status (status, NULL))
    g_error ("%s failed: %s", argv[0], err);
  return g_steal_pointer (&out);
}

/* Collapses white space, so text wrapped onto several lines still matches. */
static char *
squash (const char *s)
{
  g_autoptr (GRegex) re = g_regex_new ("\\s+", 0, 0, NULL);

  return g_regex_replace_literal (re, s, -1, 0, " ", 0, NULL);
}

static CwDocument *
ring_document (const char *spec)
{
  g_autoptr (CwMolecule) mol = rt_ring (data, spec);
  CwDocument *doc = cw_document_new ();

  cw_document_set_molecule (doc, mol);
  cw_document_set_temperature (doc, 298.15);
  cw_document_set_temperature_unit (doc, CW_TUNIT_CELSIUS);
  cw_document_set_energy_unit (doc, CW_UNIT_KCAL);
  return doc;
}

static CwDocument *
demo_document (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  CwDocument      *doc = cw_document_new_from_file (path, data->groups, &error);

  g_assert_no_error (error);
  return doc;
}

/* Writes the report on both papers; checks each is one page; returns the A4 text, squashed. */
static char *
report_text (const CwDocument *doc, const char *name)
{
  static const char *const papers[] = { "a4", "letter" };
  g_autofree char         *a4 = NULL;

  for (int p = 0; p < 2; p++)
    {
      g_autoptr (GError) error = NULL;
      g_autofree char *path = g_strdup_printf ("%s/%s-%s.pdf", tmpdir, name, papers[p]);
      const char      *info_argv[] = { "pdfinfo", path, NULL };
      const char      *text_argv[] = { "pdftotext", "-raw", path, "-", NULL };
      g_autofree char *info = NULL, *raw = NULL;

      g_assert_true (cw_render_export_report_with_geometry (data, gd, doc, papers[p], path, &error));
      g_assert_no_error (error);
      info = run (info_argv);
      if (strstr (info, "Pages:           1\n") == NULL)
        g_error ("%s (%s) is not one page:\n%s", name, papers[p], info);
      raw = run (text_argv);
      if (p == 0)
        a4 = squash (raw);
      g_unlink (path);
    }
  return g_steal_pointer (&a4);
}

static void
assert_has (const char *text, const char *want, const char *what)
{
  if (strstr (text, want) == NULL)
    g_error ("%s: no “%s” in the report text:\n%s", what, want, text);
}

static void
assert_lacks (const char *text, const char *unwanted, const char *what)
{
  if (strstr (text, unwanted) != NULL)
    g_error ("%s: “%s” should not be in the report text:\n%s", what, unwanted, text);
}

static CwCouplings *
couplings_of (const CwDocument *doc)
{
  g_autoptr (GError) error = NULL;
  CwCouplings *c = g_new0 (CwCouplings, 1);
  CwAnalysis   an;

  g_assert_true (cw_render_analyze_document (data, doc, &an, &error));
  g_assert_true (cw_couplings_compute (gd, cw_document_peek_molecule (doc), an.pop, an.temperature, NULL, c, &error));
  g_assert_no_error (error);
  return c;
}

/* Every ring proton's row: its label and its multiplets in each chair and averaged, as the core
 * names them. */
static void
assert_couplings_rows (const char *text, const CwCouplings *c, const char *what)
{
  assert_has (text, "Predicted vicinal couplings", what);
  for (int i = 0; i < c->n_protons; i++)
    {
      g_autofree char *label = cw_ring_proton_dup_label (&c->protons[i]);

      assert_has (text, label, what);
      for (int col = 0; col < 3; col++)
        {
          g_autofree char *m = cw_multiplet_dup_text (&c->protons[i].multiplet[col]);
          g_autofree char *row = col == 2 ? g_strdup_printf ("%s Σ %.1f", m, c->protons[i].width_avg)
                                          : g_strdup_printf ("%s %s Σ %.1f", c->protons[i].axial[col] ? "ax" : "eq", m,
                                                             c->protons[i].width[col]);

          assert_has (text, row, what);
        }
    }
}

/* The demo document: the notes, the couplings of every ring proton and the bromide's geometry. */
static void
test_demo (void)
{
  g_autoptr (CwDocument) doc = demo_document ();
  g_autofree CwCouplings *c = couplings_of (doc);
  g_autofree char        *text = report_text (doc, "demo");

  assert_has (text, "Notes. A made-up scenario for trying Chairwise", "demo");
  assert_couplings_rows (text, c, "demo");
  assert_has (text, "Reaction geometry", "demo");
  assert_has (text, "Br on C2", "demo");
  assert_has (text, "in a reactive chair at", "demo");
  assert_has (text, "Curtin–Hammett", "demo");
}

/* Menthyl chloride (Cl, iPr and Me all equatorial in the major chair): the CHCl proton is axial
 * with two axial neighbours, a triplet of doublets with the large coupling of J(ax,ax) 10–13 Hz
 * (common practice). Only the chair with Cl axial can eliminate, and there only the
 * CH2 side has an axial β-H, so the only E2 alkene is the less substituted C2=C3 (2-menthene),
 * as found for menthyl chloride with ethoxide (Hughes, Ingold et al., J. Chem. Soc. 1948; from
 * memory of the textbook accounts, unverified). */
static void
test_menthyl (void)
{
  g_autoptr (CwDocument) doc = ring_document ("1u=isopropyl 2d=chloro 4d=methyl");
  g_autofree CwCouplings *c = couplings_of (doc);
  g_autofree char        *text = report_text (doc, "menthyl");
  int                     h2 = cw_couplings_find_proton (c, 2, CW_FACE_UP);
  const CwMultiplet      *m;
  g_autofree char        *avg = NULL;

  g_assert_cmpint (h2, >=, 0);
  m = &c->protons[h2].multiplet[2];
  g_assert_cmpstr (m->pattern, ==, "td");
  g_assert_cmpfloat (m->j[0], >=, 10.0);
  g_assert_cmpfloat (m->j[0], <=, 13.0);
  avg = cw_multiplet_dup_text (m);
  assert_has (text, avg, "menthyl");
  assert_couplings_rows (text, c, "menthyl");
  assert_has (text, "Cl on C2 · chair 1: axial, anti-periplanar β-H: H-3 up · chair 2: equatorial, no anti-periplanar β-H",
              "menthyl");
  assert_has (text, "in a reactive chair at 25.0 °C: <0.1 %", "menthyl");
  assert_has (text, "E2 alkene: C2=C3 (disubstituted), from chair 1", "menthyl");
  assert_lacks (text, "C1=C2", "menthyl");
  assert_has (text, "⚠ Cl(2) is anti-periplanar to a β-hydrogen only in the minor chair", "menthyl");
  /* The chairs figure carries the marks, with their legend. */
  assert_has (text, "β-H anti-periplanar to it (E2)", "menthyl");
}

/* Neomenthyl chloride (Cl axial in the major chair): both β carbons offer an axial H, and the more
 * substituted C1=C2 (3-menthene) is open, the major product found (same source as above). The
 * CHCl proton is equatorial there: only small couplings, J(ax,eq) and J(eq,eq) 2–5 Hz (common
 * practice). */
static void
test_neomenthyl (void)
{
  g_autoptr (CwDocument) doc = ring_document ("1u=isopropyl 2u=chloro 4d=methyl");
  g_autofree CwCouplings *c = couplings_of (doc);
  g_autofree char        *text = report_text (doc, "neomenthyl");
  int                     h2 = cw_couplings_find_proton (c, 2, CW_FACE_DOWN);

  g_assert_cmpint (h2, >=, 0);
  g_assert_false (c->protons[h2].axial[1]);
  g_assert_cmpfloat (c->protons[h2].multiplet[1].j[0], <=, 5.5);
  assert_couplings_rows (text, c, "neomenthyl");
  assert_has (text, "anti-periplanar β-H: H-1 down, H-3 down", "neomenthyl");
  assert_has (text, "C1=C2 (trisubstituted), the more substituted, from chair 2", "neomenthyl");
  assert_has (text, "C2=C3 (disubstituted), from chair 2", "neomenthyl");
}

/* No anti-periplanar β-H in either chair: both neighbours' axial slots on the other face carry
 * methyls (trans-diaxial geometry, common practice). */
static void
test_no_anti (void)
{
  g_autoptr (CwDocument) doc = ring_document ("1u=chloro 2d=methyl 6d=methyl");
  g_autofree char *text = report_text (doc, "no-anti");

  assert_has (text, "no anti-periplanar β-H · chair 2: equatorial, no anti-periplanar β-H", "no-anti");
  assert_has (text, "⚠ Cl(1) has no anti-periplanar β-hydrogen in either chair", "no-anti");
  assert_has (text, "no E2 alkene by the anti pathway", "no-anti");
}

/* A deuterium anti to the chloride (held axial by the tert-butyl group) is named as D; both
 * alkenes are disubstituted, so neither is called the more substituted. */
static void
test_deuterium (void)
{
  g_autoptr (CwDocument) doc = ring_document ("1u=chloro 2d=deuterio 4u=tert-butyl");
  g_autofree char *text = report_text (doc, "deuterium");

  assert_has (text, "anti-periplanar β-H: H-6 down, D-2 down", "deuterium");
  assert_has (text, "C1=C6 (disubstituted), from chair 1", "deuterium");
  assert_has (text, "C1=C2 (disubstituted), from chair 1", "deuterium");
  assert_lacks (text, "the more substituted", "deuterium");
}

/* A trans-vicinal bromide and methoxy group: anti-periplanar (diaxial) only in the chair with
 * both axial, the one the equatorial tert-butyl group holds (A-values, data/groups.json). */
static void
test_pairs (void)
{
  g_autoptr (CwDocument) doc = ring_document ("1u=bromo 2d=methoxy 4u=tert-butyl");
  g_autofree char *text = report_text (doc, "pairs");

  assert_has (text, "(neighbouring-group participation): anti-periplanar in chair 1", "pairs");
}

/* Nothing to eliminate: the section says so; a dozen groups still fit one page. */
static void
test_no_leaving_group (void)
{
  g_autoptr (CwDocument) doc = ring_document ("1u=methyl");
  g_autoptr (CwDocument) full = ring_document ("1u=methyl 1d=ethyl 2u=chloro 2d=fluoro 3u=methyl 3d=hydroxy "
                                               "4u=methoxy 4d=bromo 5u=cyano 5d=methyl 6u=iodo 6d=vinyl");
  g_autofree char *text = report_text (doc, "methyl");
  g_autofree char *text_full = report_text (full, "full");
  g_autofree char *caution = squash (cw_caution_text ());

  assert_has (text, "No group in the molecule is marked as a leaving group.", "methyl");
  assert_lacks (text, "Notes.", "methyl");
  assert_lacks (text, "β-H anti-periplanar to it (E2)", "methyl");
  assert_has (text_full, "No ring protons", "full");
  assert_has (text_full, caution, "full");
}

/* A geometry table without a C–Cl bond length: the couplings and reaction sections say they are
 * not available and why; the rest of the report stands. */
static void
test_no_geometry (void)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwDocument) doc = ring_document ("1u=isopropyl 2d=chloro 4d=methyl");
  g_autofree char *path = g_build_filename (cw_data_find_dir (), "geometry.json", NULL);
  g_autofree char *json = NULL, *edited = NULL, *pdf = g_strdup_printf ("%s/no-cl.pdf", tmpdir);
  g_autofree char *raw = NULL, *text = NULL;
  g_autoptr (GRegex) re = g_regex_new ("\\{ *\"element\": *\"Cl\", *\"length\"[^}]*\\}, *", 0, 0, NULL);
  g_autoptr (CwGeometryData) no_cl = NULL;
  const char *argv[] = { "pdftotext", "-raw", pdf, "-", NULL };

  g_assert_true (g_file_get_contents (path, &json, NULL, &error));
  edited = g_regex_replace_literal (re, json, -1, 0, "", 0, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (strlen (edited), <, strlen (json));
  no_cl = cw_geometry_data_new_from_data (edited, strlen (edited), "no-cl.json", &error);
  g_assert_no_error (error);
  g_assert_true (cw_render_export_report_with_geometry (data, no_cl, doc, "a4", pdf, &error));
  g_assert_no_error (error);
  raw = run (argv);
  text = squash (raw);
  g_unlink (pdf);
  assert_has (text, "Predicted vicinal couplings", "no-cl");
  assert_has (text, "Reaction geometry", "no-cl");
  g_assert_nonnull (strstr (strstr (text, "Predicted vicinal couplings"), "Not available:"));
  g_assert_nonnull (strstr (strstr (text, "Reaction geometry"), "Not available:"));
  assert_has (text, "ΔG° = ", "no-cl");
  assert_has (text, "Caution.", "no-cl");
}

/* Notes: short ones whole, long ones cut at a word with "…", never more than two lines; markup in
 * them is text. */
static void
test_truncate (void)
{
  GString         *longer = g_string_new (NULL);
  g_autofree char *s = NULL, *l = NULL, *plain = NULL;
  CwTextMetrics    one, two;

  s = cw_report_dup_truncated ("<b>Notes.</b> ", "Keep <this> & that\n\n  short.", 8, 400, 2);
  g_assert_cmpstr (s, ==, "<b>Notes.</b> Keep &lt;this&gt; &amp; that short.");
  for (int i = 0; i < 200; i++)
    g_string_append_printf (longer, "word%d ", i);
  l = cw_report_dup_truncated ("<b>Notes.</b> ", longer->str, 8, 400, 2);
  g_assert_true (g_str_has_suffix (l, "…"));
  plain = cw_markup_dup_plain (l);
  /* Cut between words: the text before the ellipsis ends in a whole "wordN". */
  g_assert_true (g_regex_match_simple ("word[0-9]+…$", plain, 0, 0));
  cw_text_measure ("<b>Notes.</b> Ag", 8, FALSE, 400, 0, 0, &one);
  cw_text_measure (l, 8, FALSE, 400, 0, 0, &two);
  g_assert_cmpfloat (two.h, <=, 2.5 * one.h);
  g_assert_cmpfloat (two.h, >, 1.5 * one.h); /* and it uses the room it has */
  g_string_free (longer, TRUE);
}

int
main (int argc, char **argv)
{
  g_autoptr (GError) error = NULL;
  int ret;

  g_test_init (&argc, &argv, NULL);
  data = rt_load_data ();
  gd = test_load_geometry ();
  tmpdir = g_dir_make_tmp ("cw-report-XXXXXX", &error);
  g_assert_no_error (error);
  g_test_add_func ("/render/report-sections/demo", test_demo);
  g_test_add_func ("/render/report-sections/menthyl", test_menthyl);
  g_test_add_func ("/render/report-sections/neomenthyl", test_neomenthyl);
  g_test_add_func ("/render/report-sections/no-anti", test_no_anti);
  g_test_add_func ("/render/report-sections/deuterium", test_deuterium);
  g_test_add_func ("/render/report-sections/pairs", test_pairs);
  g_test_add_func ("/render/report-sections/no-leaving-group", test_no_leaving_group);
  g_test_add_func ("/render/report-sections/no-geometry", test_no_geometry);
  g_test_add_func ("/render/report-sections/truncate", test_truncate);
  ret = g_test_run ();
  g_rmdir (tmpdir);
  g_free (tmpdir);
  cw_geometry_data_free (gd);
  cw_data_free (data);
  return ret;
}
