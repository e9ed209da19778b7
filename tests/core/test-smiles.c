/* SMILES reading and writing. The meaning of the notation is that of the OpenSMILES
 * specification (opensmiles.org, 2016 draft): ring bonds, branches, @/@@ order of neighbours,
 * implicit hydrogens. Which @/@@ combinations are cis and which trans was measured on RDKit
 * 2022.09.3 3D embeddings (tests/reference/check-rdkit.py runs the same comparison on 75
 * SMILES); the cases below are the ones these unit tests keep without RDKit. */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"
#include "cw-smiles.h"
#include "test-helpers.h"

static CwData *data;

static GPtrArray *
read_ok (const char *smiles, GString *notes)
{
  g_autoptr (GError) error = NULL;
  GPtrArray *mols = cw_smiles_read (smiles, data->groups, notes, &error);

  g_assert_no_error (error);
  g_assert_nonnull (mols);
  return mols;
}

static char *
canon (const char *smiles)
{
  g_autoptr (GPtrArray) mols = read_ok (smiles, NULL);

  g_assert_cmpuint (mols->len, ==, 1);
  return cw_smiles_write (mols->pdata[0]);
}

static char *
spec_of (const char *smiles)
{
  g_autoptr (GPtrArray) mols = read_ok (smiles, NULL);

  g_assert_cmpuint (mols->len, ==, 1);
  return cw_molecule_dup_spec (mols->pdata[0]);
}

static char *
config_of (const char *smiles)
{
  g_autoptr (GPtrArray) mols = read_ok (smiles, NULL);

  g_assert_cmpuint (mols->len, ==, 1);
  return cw_molecule_dup_configuration (mols->pdata[0]);
}

static void
read_fails (const char *smiles, int code, const char *needle)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) mols = cw_smiles_read (smiles, data->groups, NULL, &error);

  g_assert_null (mols);
  g_assert_error (error, CW_CORE_ERROR, code);
  if (strstr (error->message, needle) == NULL)
    g_error ("“%s”: message “%s” lacks “%s”", smiles, error->message, needle);
}

/* The example: acetoxy however it is written. */
static void
test_acetoxy_forms (void)
{
  const char *forms[] = { "C1CCCCC1OC(C)=O", "C1CCCCC1O(C(=O)C)", "CC(=O)O-C1CCCCC1", "CC(=O)OC1CCCCC1",
                          "O=C(C)OC1CCCCC1", "C1CCC(CC1)OC(=O)C" };

  for (guint i = 0; i < G_N_ELEMENTS (forms); i++)
    {
      g_autofree char *spec = spec_of (forms[i]);
      g_assert_cmpstr (spec, ==, "1u=acetoxy");
    }
}

/* Every table group, written from the ring side and towards the ring, reads back to itself. */
static void
test_every_group (void)
{
  for (guint i = 0; i < cw_group_table_get_n_groups (data->groups); i++)
    {
      const CwGroup   *g = cw_group_table_get (data->groups, i);
      g_autofree char *a = g_strdup_printf ("C1CCCCC1%s", g->smiles);
      g_autofree char *b = g_strdup_printf ("C9CCCCC9(%s)", g->smiles);
      const char      *forms[] = { a, b };

      for (int k = 0; k < 2; k++)
        {
          g_autoptr (GPtrArray) mols = read_ok (forms[k], NULL);
          const CwMolecule *m = mols->pdata[0];
          g_autofree char  *out = cw_smiles_write (m);
          g_autoptr (GPtrArray) again = read_ok (out, NULL);
          g_autofree char *out2 = cw_smiles_write (again->pdata[0]);

          g_assert_cmpint (m->n_subs, ==, 1);
          if (m->subs[0].group != g)
            g_error ("%s read as %s", forms[k], m->subs[0].group->id);
          g_assert_cmpstr (out, ==, out2);
          g_assert_true (((CwMolecule *) again->pdata[0])->subs[0].group == g);
        }
    }
}

static void
test_kekule_phenyl (void)
{
  g_autofree char *a = canon ("C1CCCCC1C1=CC=CC=C1");
  g_autofree char *b = canon ("c1ccccc1C1CCCCC1");

  g_assert_cmpstr (a, ==, b);
}

/* cis/trans of each SMILES as measured on an RDKit 2022.09.3 3D embedding (the side of the
 * plane of each ring carbon's ring bonds on which the methyl lies). */
static void
test_cis_trans (void)
{
  struct
  {
    const char *smiles, *config;
  } cases[] = {
    { "C[C@H]1CC[C@@H](C)CC1", "cis" },
    { "C[C@H]1CC[C@H](C)CC1", "trans" },
    { "C[C@H]1CCC[C@@H](C)C1", "cis" },
    { "C[C@H]1CCC[C@H](C)C1", "trans" },
    { "C[C@H]1CCCC[C@@H]1C", "trans" },
    { "C[C@H]1CCCC[C@H]1C", "cis" },
    /* the same molecules written from another atom, with H and ring bonds in other orders */
    { "[C@@H]1(C)CC[C@H](C)CC1", "cis" },
    { "C1C[C@@H](C)CC[C@H]1C", "cis" },
    { "C1C[C@H](C)CC[C@H]1C", "trans" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *config = config_of (cases[i].smiles);
      if (g_strcmp0 (config, cases[i].config) != 0)
        g_error ("%s: %s, expected %s", cases[i].smiles, config, cases[i].config);
    }
}

/* One molecule written many ways gives one canonical SMILES and one numbering. */
static void
test_canonical (void)
{
  const char      *forms[] = { "CC(=O)O[C@H]1CC[C@H](C(C)(C)C)CC1", "CC(C)(C)[C@@H]1CC[C@@H](OC(C)=O)CC1",
                               "C1C[C@@H](OC(C)=O)CC[C@@H]1C(C)(C)C", "O([C@H]1CC[C@H](C(C)(C)C)CC1)C(C)=O" };
  g_autofree char *first = canon (forms[0]);
  g_autofree char *spec = spec_of (forms[0]);

  for (guint i = 1; i < G_N_ELEMENTS (forms); i++)
    {
      g_autofree char *s = canon (forms[i]);
      g_autofree char *sp = spec_of (forms[i]);
      g_assert_cmpstr (s, ==, first);
      g_assert_cmpstr (sp, ==, spec);
    }
  /* lowest locants: 1,3 not 1,5 */
  {
    g_autofree char *s = spec_of ("C[C@@H]1CCC[C@H](Cl)C1");
    g_assert_true (g_str_has_prefix (s, "1") && strstr (s, "3") != NULL && strstr (s, "5") == NULL);
  }
}

/* A document made by hand: molecule -> SMILES -> molecule gives the same slots. */
static void
test_document_round_trip (void)
{
  const char *specs[] = { "1u=methyl 2d=methyl", "1u=tert-butyl 4u=hydroxy", "1u=methyl 1d=phenyl 3u=chloro",
                          "1u=hydroxy 2u=hydroxy 3d=hydroxy 4u=hydroxy 5d=hydroxy 6u=hydroxy",
                          "1u=methoxycarbonyl 3d=cyano 5u=azido", "2u=methyl 3u=methyl" };

  for (guint i = 0; i < G_N_ELEMENTS (specs); i++)
    {
      g_autoptr (CwMolecule) m = test_ring (data, specs[i]);
      g_autofree char *s = cw_smiles_write (m);
      g_autoptr (GPtrArray) mols = read_ok (s, NULL);
      g_autofree char *s2 = cw_smiles_write (mols->pdata[0]);
      g_autofree char *c1 = cw_molecule_dup_configuration (m);
      g_autofree char *c2 = cw_molecule_dup_configuration (mols->pdata[0]);

      g_assert_cmpuint (mols->len, ==, 1);
      g_assert_cmpstr (s, ==, s2);
      g_assert_cmpint (((CwMolecule *) mols->pdata[0])->n_subs, ==, m->n_subs);
      if (c1[0] && g_strcmp0 (c1, c2) != 0)
        {
          /* the numbering may change; the relative configuration may not */
          g_autofree char *s3 = cw_smiles_write (mols->pdata[0]);
          g_assert_cmpstr (s, ==, s3);
        }
    }
}

static void
test_open_centres (void)
{
  g_autoptr (GString) notes = g_string_new (NULL);
  g_autoptr (GPtrArray) two = read_ok ("CC1CCC(C)CC1", notes);
  g_autoptr (GPtrArray) one = NULL;
  g_autoptr (GPtrArray) hch = NULL;

  g_assert_cmpuint (two->len, ==, 2);
  g_assert_nonnull (strstr (notes->str, "characters 2 and 6"));
  /* one centre given, one open: still both isomers */
  one = read_ok ("C[C@H]1CCC(C)CC1", NULL);
  g_assert_cmpuint (one->len, ==, 2);
  /* 1,2,3,4,5,6-hexachlorocyclohexane: eight cis/trans isomers (the benzene hexachloride isomers
   * α–θ; Eliel, Wilen & Mander, Stereochemistry of Organic Compounds, 1994; from memory) */
  hch = read_ok ("ClC1C(Cl)C(Cl)C(Cl)C(Cl)C1Cl", NULL);
  g_assert_cmpuint (hch->len, ==, 8);
  /* no cis/trans question: one molecule, no note */
  g_string_truncate (notes, 0);
  g_ptr_array_unref (read_ok ("CC1(C)CCC(C)CC1", notes));
  g_assert_cmpuint (notes->len, ==, 0);
}

static void
test_salt (void)
{
  g_autoptr (GString) notes = g_string_new (NULL);
  g_autoptr (GPtrArray) mols = read_ok ("[Na+].[O-]C(=O)C1CCCCC1", notes);
  const CwMolecule *m = mols->pdata[0];

  g_assert_cmpstr (m->subs[0].group->id, ==, "carboxylate");
  g_assert_nonnull (strstr (notes->str, "largest"));
  g_assert_nonnull (strstr (notes->str, "[Na+]"));
}

static void
test_errors (void)
{
  read_fails ("CC1CCCCC", CW_CORE_ERROR_PARSE, "character 3");
  read_fails ("CC1CCCCC", CW_CORE_ERROR_PARSE, "never closed");
  read_fails ("C1CCCCC1[Xx]", CW_CORE_ERROR_PARSE, "character 10");
  read_fails ("C1CCCCC1[C", CW_CORE_ERROR_PARSE, "‘]’");
  read_fails ("C1CCCCC1C(", CW_CORE_ERROR_PARSE, "never closed");
  read_fails ("C1CCCCC1)", CW_CORE_ERROR_PARSE, "character 9");
  read_fails ("", CW_CORE_ERROR_PARSE, "no atoms");
  read_fails ("C1CCCCC1.", CW_CORE_ERROR_PARSE, "");
  read_fails ("C1CCCCC1=", CW_CORE_ERROR_PARSE, "bond");
  read_fails ("c1ccccc1", CW_CORE_ERROR_UNSUPPORTED, "No cyclohexane ring");
  read_fails ("CCCCCC", CW_CORE_ERROR_UNSUPPORTED, "no ring at all");
  read_fails ("C1CCCC1", CW_CORE_ERROR_UNSUPPORTED, "5-membered");
  read_fails ("O=C1CCCCC1", CW_CORE_ERROR_UNSUPPORTED, "not saturated");
  read_fails ("C1CCC2CCCCC2C1", CW_CORE_ERROR_UNSUPPORTED, "fused or bridged");
  read_fails ("C1CC2CCC1CC2", CW_CORE_ERROR_UNSUPPORTED, "fused or bridged");
  read_fails ("C1CCC2(CC1)CCCCC2", CW_CORE_ERROR_UNSUPPORTED, "spiro");
  read_fails ("CC1CCC(CC1)C1CCC(C)CC1", CW_CORE_ERROR_UNSUPPORTED, "More than one");
  read_fails ("C1CCCCC1C(C)(C)CC", CW_CORE_ERROR_UNKNOWN_GROUP, "C(CC)(C)C");
  read_fails ("C1CCCCC1C(C)(C)CC", CW_CORE_ERROR_UNKNOWN_GROUP, "custom group");
  read_fails ("C[C@OH1]1CCCCC1", CW_CORE_ERROR_UNSUPPORTED, "tetrahedral");
  read_fails ("C1CCCCC1C2.C2", CW_CORE_ERROR_UNSUPPORTED, "‘.’");
}

static void
test_reader_info (void)
{
  g_autoptr (CwSmilesReader) reader = cw_smiles_reader_new (data->groups);
  g_autoptr (GError) error = NULL;
  CwMolecule   out[4];
  CwSmilesInfo info;
  int          n;

  g_assert_cmpstr (cw_smiles_reader_get_problems (reader), ==, "");
  n = cw_smiles_reader_read (reader, "CC1CCCC1", -1, out, 4, &info, NULL, &error);
  g_assert_cmpint (n, ==, -1);
  g_assert_error (error, CW_CORE_ERROR, CW_CORE_ERROR_UNSUPPORTED);
  g_clear_error (&error);
  n = cw_smiles_reader_read (reader, "C1CC(CCCC1", -1, out, 4, &info, NULL, &error);
  g_assert_cmpint (n, ==, -1);
  g_assert_cmpint (info.error_pos, ==, 4); /* the unclosed ‘(’ */
  g_clear_error (&error);
  /* more isomers than room */
  n = cw_smiles_reader_read (reader, "ClC1C(Cl)C(Cl)C(Cl)C(Cl)C1Cl", -1, out, 4, &info, NULL, &error);
  g_assert_cmpint (n, ==, -1);
  g_assert_nonnull (error);
  g_clear_error (&error);
  n = cw_smiles_reader_read (reader, "OC1CCC(Cl)CC1 trailing", 13, out, 4, &info, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpint (n, ==, 2);
  g_assert_cmpint (info.n_open, ==, 2);
  g_assert_true (cw_smiles_reader_match_fragment (reader, "O(C(=O)C)", NULL) ==
                 cw_group_table_lookup (data->groups, "acetoxy"));
  g_assert_null (cw_smiles_reader_match_fragment (reader, "OCC", NULL));
}

/* Robustness: random strings over the SMILES alphabet and random edits of valid SMILES either
 * read or fail with an error and a position inside the text; nothing crashes (run under
 * AddressSanitizer in the sanitizer build). */
static void
test_garbage (void)
{
  static const char  alphabet[] = "CcNnOoSsPFIBrl[]()=#$:/\\.%0123456789@H+-*";
  static const char *seeds[] = { "C[C@H]1CC[C@@H](C)CC1", "CC(=O)O[C@H]1CC[C@H](C(C)(C)C)CC1",
                                 "[Na+].[O-]C(=O)C1CCCCC1", "c1ccccc1C1CCCCC1", "C%10CC[C@@H](C)C[C@H]%10O" };
  g_autoptr (CwSmilesReader) reader = cw_smiles_reader_new (data->groups);
  g_autoptr (GRand) rand = g_rand_new_with_seed (4242);
  CwMolecule out[64];

  for (int i = 0; i < 20000; i++)
    {
      char buf[80];
      int  len;
      g_autoptr (GError) error = NULL;
      CwSmilesInfo info;
      int          n;

      if (i % 2)
        {
          len = g_rand_int_range (rand, 0, 40);
          for (int k = 0; k < len; k++)
            buf[k] = alphabet[g_rand_int_range (rand, 0, sizeof alphabet - 1)];
        }
      else
        {
          const char *seed = seeds[g_rand_int_range (rand, 0, G_N_ELEMENTS (seeds))];
          len = strlen (seed);
          memcpy (buf, seed, len);
          for (int e = g_rand_int_range (rand, 1, 4); e > 0 && len > 0; e--)
            buf[g_rand_int_range (rand, 0, len)] = alphabet[g_rand_int_range (rand, 0, sizeof alphabet - 1)];
        }
      n = cw_smiles_reader_read (reader, buf, len, out, G_N_ELEMENTS (out), &info, NULL, &error);
      if (n < 0)
        {
          g_assert_nonnull (error);
          g_assert_cmpint (info.error_pos, >=, -1);
          g_assert_cmpint (info.error_pos, <=, len);
        }
      else
        {
          g_assert_no_error (error);
          for (int k = 0; k < n; k++)
            {
              g_autofree char *s = cw_smiles_write (&out[k]);
              g_assert_nonnull (s);
            }
        }
    }
}

/* A reader that has seen other SMILES (its fragment cache filled) reads each one as a fresh
 * reader does, also where the same stretch of text closes its rings differently. */
static void
test_reader_history (void)
{
  const char *seq[] = { "OC1CCCCC1c2ccccc2", "OC1CCCCC1c2ccccc=2", "CC1(c2ccc2)CCCCC1", "CC1(c2ccccc2)CCCCC1",
                        "OC1CCCCC1c2ccccc2", "C1CCCCC1C(C)(C)C", "C1CCCCC1C(C)(C)CC", "C1CCCCC1C(C)(C)C",
                        "CC(=O)OC1CCCCC1", "CC(=O)OC1CCCCC1C", "C1CCCCC1c1ccccc1", "C1CCCCC1c1ccccc1C" };
  g_autoptr (CwSmilesReader) reader = cw_smiles_reader_new (data->groups);

  for (int round = 0; round < 2; round++)
    for (guint i = 0; i < G_N_ELEMENTS (seq); i++)
      {
        g_autoptr (GError) e1 = NULL;
        g_autoptr (GError) e2 = NULL;
        g_autoptr (GPtrArray) fresh = cw_smiles_read (seq[i], data->groups, NULL, &e1);
        CwMolecule mols[8];
        int        n = cw_smiles_reader_read (reader, seq[i], -1, mols, 8, NULL, NULL, &e2);

        if (fresh == NULL)
          {
            g_assert_cmpint (n, ==, -1);
            g_assert_cmpint (e1->code, ==, e2->code);
            continue;
          }
        g_assert_cmpint (n, ==, (int) fresh->len);
        for (int k = 0; k < n; k++)
          {
            g_autofree char *a = cw_molecule_dup_spec (fresh->pdata[k]);
            g_autofree char *b = cw_molecule_dup_spec (&mols[k]);
            g_assert_cmpstr (a, ==, b);
          }
      }
}

/* The batch's allocation-free configuration text is the molecule's own, for every face pattern
 * of a few constitutions. */
static void
test_configuration_text (void)
{
  const char *smiles[] = { "CC1CCC(C)CC1", "ClC1C(Cl)C(Cl)C(Cl)C(Cl)C1Cl", "CC1(O)CCC(C)C(Cl)C1",
                           "CC1(C)CCCCC1", "OC1CCCCC1" };
  g_autoptr (GString) mine = g_string_new (NULL);

  for (guint i = 0; i < G_N_ELEMENTS (smiles); i++)
    {
      g_autoptr (GPtrArray) mols = read_ok (smiles[i], NULL);
      for (guint k = 0; k < mols->len; k++)
        {
          g_autofree char *theirs = cw_molecule_dup_configuration (mols->pdata[k]);
          g_string_truncate (mine, 0);
          cw_sm_append_configuration (mols->pdata[k], mine);
          g_assert_cmpstr (mine->str, ==, theirs);
        }
    }
}

int
main (int argc, char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/smiles/acetoxy-forms", test_acetoxy_forms);
  g_test_add_func ("/core/smiles/every-group", test_every_group);
  g_test_add_func ("/core/smiles/kekule-phenyl", test_kekule_phenyl);
  g_test_add_func ("/core/smiles/cis-trans", test_cis_trans);
  g_test_add_func ("/core/smiles/canonical", test_canonical);
  g_test_add_func ("/core/smiles/document-round-trip", test_document_round_trip);
  g_test_add_func ("/core/smiles/open-centres", test_open_centres);
  g_test_add_func ("/core/smiles/salt", test_salt);
  g_test_add_func ("/core/smiles/errors", test_errors);
  g_test_add_func ("/core/smiles/reader-info", test_reader_info);
  g_test_add_func ("/core/smiles/configuration-text", test_configuration_text);
  g_test_add_func ("/core/smiles/garbage", test_garbage);
  g_test_add_func ("/core/smiles/reader-history", test_reader_history);
  status = g_test_run ();
  cw_data_free (data);
  return status;
}
