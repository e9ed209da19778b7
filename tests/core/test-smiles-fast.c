/* The SMILES reader's fast path (src/core/cw-smiles-fast.c) against the general reader.
 *
 * The fast path reads simply written rings without building the molecular graph; for every text
 * it accepts it must give exactly what the general reader gives (molecules, open stereocentres,
 * notes), and everything else must go to the general reader unchanged (errors and their
 * positions). The general reader itself is checked against RDKit in tests/reference and against
 * the OpenSMILES rules in test-smiles.c; here the two paths are compared on generated texts:
 * every table group in its table spelling and written towards the ring, Kekulé and aromatic
 * rings, ring-bond numbers 1-9 and %nn (also reused inside groups), groups before the ring,
 * after it and as branches, @/@@ present, missing or contradictory, explicit H counts, salts,
 * bonds written next to the ring, and random damage to the text. */
#include "config.h"

#include <string.h>

#include "cw-smiles-private.h"
#include "cw-smiles.h"
#include "test-helpers.h"

#define MAX_OUT 64

static CwData *data;

typedef struct
{
  int          n;
  CwMolecule   mols[MAX_OUT];
  CwSmilesInfo info;
  GString     *notes;
  char        *error;
} Result;

/* with_notes FALSE reads as the batch does, without notes (the fast path then also takes a
 * lone cyclohexyl group) */
static void
read_into (CwSmilesReader *reader, const char *text, gboolean with_notes, Result *r)
{
  g_autoptr (GError) error = NULL;

  g_string_truncate (r->notes, 0);
  g_clear_pointer (&r->error, g_free);
  memset (&r->info, 0, sizeof r->info);
  r->n = cw_smiles_reader_read (reader, text, -1, r->mols, MAX_OUT, &r->info, with_notes ? r->notes : NULL, &error);
  if (r->n < 0)
    {
      g_assert_nonnull (error);
      r->error = g_strdup (error->message);
    }
}

static void
assert_same (const char *text, const Result *a, const Result *b)
{
  if (a->n != b->n)
    g_error ("%s: %d molecules by one path, %d by the other (%s / %s)", text, a->n, b->n,
             a->error ? a->error : "-", b->error ? b->error : "-");
  if (a->n < 0)
    {
      g_assert_cmpstr (a->error, ==, b->error);
      g_assert_cmpint (a->info.error_pos, ==, b->info.error_pos);
      return;
    }
  g_assert_cmpint (a->info.n_molecules, ==, b->info.n_molecules);
  g_assert_cmpint (a->info.n_open, ==, b->info.n_open);
  g_assert_cmpint (a->info.n_dropped, ==, b->info.n_dropped);
  for (int k = 0; k < a->info.n_open; k++)
    g_assert_cmpint (a->info.open_pos[k], ==, b->info.open_pos[k]);
  if (strcmp (a->notes->str, b->notes->str) != 0)
    g_error ("%s: notes differ:\n%s\n--\n%s", text, a->notes->str, b->notes->str);
  for (int m = 0; m < a->n; m++)
    {
      const CwMolecule *x = &a->mols[m], *y = &b->mols[m];
      if (x->n_subs != y->n_subs)
        g_error ("%s: molecule %d has %d groups by one path, %d by the other", text, m, x->n_subs, y->n_subs);
      for (int s = 0; s < x->n_subs; s++)
        if (x->subs[s].group != y->subs[s].group || x->subs[s].position != y->subs[s].position ||
            x->subs[s].face != y->subs[s].face)
          g_error ("%s: molecule %d group %d differs (%s %d%c / %s %d%c)", text, m, s, x->subs[s].group->id,
                   x->subs[s].position, x->subs[s].face == CW_FACE_UP ? 'u' : 'd', y->subs[s].group->id,
                   y->subs[s].position, y->subs[s].face == CW_FACE_UP ? 'u' : 'd');
    }
}

/* ---- generated texts ---- */

static const char *
pick (GRand *rand, const char *const *list, int n)
{
  return list[g_rand_int_range (rand, 0, n)];
}

static void
append_ring_digit (GString *s, int digit)
{
  if (digit < 10)
    g_string_append_c (s, '0' + digit);
  else
    g_string_append_printf (s, "%%%02d", digit);
}

/* One group written from its attachment atom (towards = FALSE) or ending at it. */
static void
append_group (GRand *rand, const CwGroup *group, gboolean towards, GString *s)
{
  char    *fwd, *rev;
  gboolean owned;

  if (strcmp (group->id, "phenyl") == 0 && g_rand_int_range (rand, 0, 3) == 0)
    {
      g_string_append (s, g_rand_boolean (rand) ? "C1=CC=CC=C1" : "c2ccccc2");
      return;
    }
  if (strcmp (group->id, "methyl") == 0 && g_rand_int_range (rand, 0, 4) == 0)
    {
      g_string_append (s, g_rand_boolean (rand) ? "[CH3]" : "C([H])([H])[H]");
      return;
    }
  cw_sm_group_strings (group, NULL, &fwd, &rev, &owned);
  if (towards && rev)
    g_string_append (s, rev);
  else if (!towards && g_rand_int_range (rand, 0, 3) == 0)
    g_string_append (s, group->smiles);
  else
    g_string_append (s, fwd ? fwd : group->smiles);
  if (owned)
    {
      g_free (fwd);
      g_free (rev);
    }
}

static void
damage (GRand *rand, GString *s)
{
  static const char *const bits[] = { "C", "c", "N", "(", ")", "[", "]", "@", "H", "1", "2", "9", "=", ".", "%", "-", "[H]", "%1", "Cl" };
  int                      at = s->len ? g_rand_int_range (rand, 0, s->len) : 0;

  switch (g_rand_int_range (rand, 0, 3))
    {
    case 0:
      if (s->len)
        g_string_erase (s, at, 1);
      break;
    case 1:
      g_string_insert (s, at, pick (rand, bits, G_N_ELEMENTS (bits)));
      break;
    default:
      if (s->len)
        {
          g_string_erase (s, at, 1);
          g_string_insert (s, at, pick (rand, bits, G_N_ELEMENTS (bits)));
        }
      break;
    }
}

static void
generate (GRand *rand, const CwGroupTable *table, GString *s)
{
  static const int         digits[] = { 1, 1, 1, 2, 3, 9, 10, 23 };
  static const char *const one_h[] = { "[C@H]", "[C@@H]", "[C@H]", "[C@@H]", "[CH]", "C", "[C@H1]", "[C@@H2]" };
  static const char *const no_h[] = { "[C@]", "[C@@]", "[C@]", "[C@@]", "[C]", "C", "[13C@]", "[C@TH1]" };
  static const char *const two_h[] = { "C", "C", "[CH2]", "[C@H2]", "[CH]" };
  const CwGroup           *slot[6][2] = { { NULL } };
  int                      n_sub = g_rand_int_range (rand, 0, 7), start = g_rand_int_range (rand, 0, 6);
  int                      dir = g_rand_boolean (rand) ? 1 : -1, digit = digits[g_rand_int_range (rand, 0, G_N_ELEMENTS (digits))];
  gboolean                 prefix = g_rand_int_range (rand, 0, 3) == 0, tail = g_rand_int_range (rand, 0, 3) == 0;

  test_random_slots (rand, table, n_sub, slot);
  if (g_rand_int_range (rand, 0, 20) == 0)
    g_string_append (s, "[Na+].");
  for (int i = 0; i < 6; i++)
    {
      int p = ((start + dir * i) % 6 + 6) % 6, n = (slot[p][0] != NULL) + (slot[p][1] != NULL), first_branch = 0;
      if (i == 0 && n > 0 && prefix)
        {
          append_group (rand, slot[p][0], TRUE, s);
          if (g_rand_int_range (rand, 0, 15) == 0)
            g_string_append_c (s, '-');
          first_branch = 1;
        }
      else if (i > 0 && g_rand_int_range (rand, 0, 40) == 0)
        g_string_append_c (s, '-');
      /* mostly well-formed ring carbons, now and then an odd one */
      int odd = g_rand_int_range (rand, 0, 12) == 0 ? 8 : 4;
      g_string_append (s, n == 2 ? no_h[g_rand_int_range (rand, 0, odd)] : n == 1 ? one_h[g_rand_int_range (rand, 0, odd)]
                                                                                  : two_h[g_rand_int_range (rand, 0, odd == 8 ? 5 : 2)]);
      if (i == 0 || i == 5)
        append_ring_digit (s, digit);
      for (int k = first_branch; k < n; k++)
        {
          if (i == 5 && k == n - 1 && tail)
            {
              append_group (rand, slot[p][k], FALSE, s);
              break;
            }
          g_string_append_c (s, '(');
          if (g_rand_int_range (rand, 0, 40) == 0)
            g_string_append (s, "[H]");
          else
            append_group (rand, slot[p][k], FALSE, s);
          g_string_append_c (s, ')');
        }
    }
  if (g_rand_int_range (rand, 0, 20) == 0)
    g_string_append (s, ".Cl");
  if (g_rand_int_range (rand, 0, 8) == 0)
    damage (rand, s);
}

static void
compare_on (const char *const *texts, int n_texts, GRand *rand, int n_generated, guint64 *n_fast_out, int *n_ok_out)
{
  g_autoptr (CwSmilesReader) fast = cw_smiles_reader_new (data->groups);
  g_autoptr (CwSmilesReader) general = cw_smiles_reader_new (data->groups);
  g_autoptr (GString) s = g_string_new (NULL);
  Result a = { .notes = g_string_new (NULL) }, b = { .notes = g_string_new (NULL) }, c = { .notes = g_string_new (NULL) };
  int    n_ok = 0;

  cw_sm_reader_set_general_only (general, TRUE);
  for (int i = 0; i < n_texts + n_generated; i++)
    {
      const char *text;
      if (i < n_texts)
        text = texts[i];
      else
        {
          g_string_truncate (s, 0);
          generate (rand, data->groups, s);
          text = s->str;
        }
      /* twice: the first reading of a spelling fills the fragment cache */
      gboolean with_notes = i % 2 == 0;
      read_into (fast, text, with_notes, &a);
      read_into (general, text, with_notes, &b);
      assert_same (text, &a, &b);
      read_into (fast, text, with_notes, &c);
      assert_same (text, &c, &b);
      n_ok += b.n > 0;
    }
  *n_fast_out = cw_sm_reader_get_n_fast (fast);
  *n_ok_out = n_ok;
  g_assert_cmpuint (cw_sm_reader_get_n_fast (general), ==, 0);
  g_string_free (a.notes, TRUE), g_string_free (b.notes, TRUE), g_string_free (c.notes, TRUE);
  g_free (a.error), g_free (b.error), g_free (c.error);
}

/* Hand-written cases at the edges of what the fast path takes. */
static void
test_edges (void)
{
  static const char *const texts[] = {
    "CC1CCCCC1", "C1CCCCC1C", "C[C@H]1CC[C@@H](C)CC1", "C[C@@H]1CC[C@@H](C)CC1", "[H][C@]1(C)CCCCC1",
    "[C@H]1(C)CCCCC1", "C1CC[C@H](C)CC1", "C[C@]1(O)CCCCC1", "O[C@@]1(C)CCCCC1", "C1(C)(O)CCCCC1",
    "C[C@H]1CCCC[C@@H]1C", "CC1CCCCC1C", "C[C@H]1CCCC[C@H]1C", "C[C@H]1C[C@@H](C)C[C@H](C)C1",
    "C1CCCCC1C1CCCCC1", "C1CCCCC1c1ccccc1", "c1ccccc1C1CCCCC1", "C1=CC=CC=C1[C@H]1CC[C@@H](C)CC1",
    "C%10CCCCC%10C", "C9CCCCC9(C)C", "C1CCCC2C1CCCC2", "C12CCCCC1CCCC2", "C1CCCCC1.Cl", "C1C(C)CC(C)CC1",
    "C1CC(CC1)C", "C-1CCCCC1C", "C=C1CCCCC1", "C1CCC=CC1C", "CC(C)(C)[C@H]1CC[C@H](O)CC1",
    "OC(=O)[C@H]1CC[C@@H](C(=O)OC)CC1", "C[C@H]1CC[C@@H](CC1)C", "CC1CCC(C)CC1", "C1CCCCC1", "C1CCCC1C",
    "C1CCCCCC1C", "C1CC1C1CCCCC1", "C2CC2[C@H]1CC[C@@H](C)CC1", "[2H][C@H]1CC[C@@H](C)CC1",
    "C([H])([H])([H])[C@H]1CC[C@@H](C)CC1", "C1CCCCC1(C)C(C)C", "Cl[C@H]1CCCC[C@@H]1Br", "CC1CC(C)C(C)C(C)C1",
    "C[C@H]1[C@@H](C)[C@H](C)[C@@H](C)[C@H](C)[C@@H]1C", "N#C[C@H]1CC[C@H](C#N)CC1", "[CH3][C@H]1CCCCC1",
    "C[C@H]1CC[C@@H](C)CC1C1CCCCC1", "C1CCCCC1(", "C1CCCCC1)", "C1CCCCC", "C1CCCCC1[", "(C)C1CCCCC1",
    "C9CCCCC9(C1CCCCC1)", "C9CCCCC9(C1CCCCC1)", "C9CC[C@H](C1CCCCC1)CC9", "C9CC[C@H](C1CCCCC1)CC9",
    "C9C[C@H](C1CCCCC1)C[C@@H](C1CCCCC1)C9", "C9C[C@H](C1CCCCC1)C[C@@H](C1CCCCC1)C9",
    "C9CC[C@H](C1CCC(C)CC1)CC9", "C9CC[C@H](C1CCC(C)CC1)CC9", "C9CC[C@@H](C1CCCC1)CC9", "C9CC[C@@H](C1CCCC1)CC9",
    "c1ccccc1[C@H]2CC[C@@H](C)CC2", "c1ccccc1[C@H]2CC[C@@H](C)CC2", "C1=CC=CC=C1[C@H]2CC[C@@H](C)CC2",
    "C1=CC=CC=C1[C@H]2CC[C@@H](C)CC2", "C-1CCCCC1[C@H]2CC[C@@H](C)CC2", "C-1CCCCC1[C@H]2CC[C@@H](C)CC2",
    "C-1CCCCC1C2CCCCC2", "C-1CCCCC1C2CCCCC2", "C1CCCCC1C2CCCCC2", "C1CCCCC1C2CCCCC2",
    "[C@H]1(c2ccccc2)CC[C@@H](C)CC1", "[C@H]1(c2ccccc2)CC[C@@H](C)CC1", "C[C@H]1CC[C@@H](CC1)c1ccccc1",
    /* '@' inside a group (not a stereocentre there): read, and named in the notes */
    "C[C@@H](C)[C@H]1CC[C@@H](C)CC1", "C[C@@H](C)[C@H]1CC[C@@H](C)CC1", "C[C@H]1CC[C@@H]([C@H](C)C)CC1",
    "C[C@H]1CC[C@@H]([C@H](C)C)CC1", "C[C@H]1CC[C@@H](CC1)[C@H](C)C", "C[C@H]1CC[C@@H](CC1)[C@H](C)C",
  };
  guint64 n_fast;
  int     n_ok;

  compare_on (texts, G_N_ELEMENTS (texts), NULL, 0, &n_fast, &n_ok);
  g_test_message ("%d texts read, %" G_GUINT64_FORMAT " of the readings by the fast path", n_ok, n_fast);
  /* the ring-first and ring-last spellings above are of the simple kind */
  g_assert_cmpuint (n_fast, >=, 10);
}

static void
test_generated (void)
{
  /* a fixed seed by default; thorough runs (-m thorough) take GTest's seed, shown as
   * "random seed" and repeatable with --seed */
  g_autoptr (GRand) rand = g_rand_new_with_seed (g_test_thorough () ? g_test_rand_int () : 20261202);
  guint64 n_fast;
  int     n_ok, n = g_test_thorough () ? 200000 : 20000;

  compare_on (NULL, 0, rand, n, &n_fast, &n_ok);
  g_test_message ("%d generated texts, %d read, %" G_GUINT64_FORMAT " fast-path readings of %d", n, n_ok, n_fast, 2 * n);
  /* most texts are of the simple kind, so the comparison above covers the fast path well */
  g_assert_cmpuint (n_fast, >, (guint64) n / 2);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/smiles-fast/edges", test_edges);
  g_test_add_func ("/smiles-fast/generated", test_generated);
  return g_test_run ();
}
