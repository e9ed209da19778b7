/* cis/trans isomers, conformer-averaged free energies and the equilibrium among isomers. */
#include "config.h"

#include <math.h>
#include <string.h>

#include "cw-isomers.h"
#include "cw-smiles.h"
#include "test-helpers.h"

static CwData *data;

static CwIsomerSet *
isomers_of (const char *smiles, double kelvin)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (GPtrArray) mols = cw_smiles_read (smiles, data->groups, NULL, &error);
  CwConditions cond = { kelvin, CW_SOLVENT_APROTIC };
  CwIsomerSet *set;

  g_assert_no_error (error);
  set = cw_isomers_enumerate (data, mols->pdata[0], &cond, &error);
  g_assert_no_error (error);
  g_assert_nonnull (set);
  return set;
}

static const CwIsomer *
find (const CwIsomerSet *set, const char *configuration)
{
  for (guint i = 0; i < set->isomers->len; i++)
    {
      const CwIsomer *iso = set->isomers->pdata[i];
      if (g_strcmp0 (iso->configuration, configuration) == 0)
        return iso;
    }
  g_error ("no %s isomer", configuration);
  return NULL;
}

/* Enthalpy differences between the cis and trans dimethylcyclohexanes in the liquid, from heats
 * of combustion: ΔH(cis − trans) = +1.87 (1,2), −1.96 (1,3), +1.90 (1,4) kcal/mol.
 * Source: Beckett, Pitzer & Spitzer, J. Am. Chem. Soc. 1947, 69, 2488 (combustion data of
 * Prosen, Johnson & Rossini), as tabulated by Eliel, Wilen & Mander, Stereochemistry of Organic
 * Compounds (Wiley 1994), ch. 11; from memory, unverified.
 * Compared with the model's enthalpy-like population-weighted mean chair energy <E>, which
 * leaves out the RT ln 2 mixing terms that G carries. Agreement expected within the model's
 * own precision: 0.35 kcal/mol (the A-value of Me alone spans 1.70–1.80). The sign (which
 * isomer is the more stable) must be right. */
static void
test_dimethyl_published (void)
{
  struct
  {
    const char *smiles;
    double      dh_cis_minus_trans;
  } cases[] = {
    { "CC1CCCCC1C", 1.87 },
    { "CC1CCCC(C)C1", -1.96 },
    { "CC1CCC(C)CC1", 1.90 },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (CwIsomerSet) set = isomers_of (cases[i].smiles, 298.15);
      const CwIsomer *cis = find (set, "cis"), *trans = find (set, "trans");
      double          model = cis->h_mean - trans->h_mean;

      g_assert_cmpuint (set->isomers->len, ==, 2);
      g_test_message ("%s: model %.3f, published %.2f kcal/mol", cases[i].smiles, model,
                      cases[i].dh_cis_minus_trans);
      g_assert_true ((model > 0) == (cases[i].dh_cis_minus_trans > 0));
      g_assert_cmpfloat_with_epsilon (model, cases[i].dh_cis_minus_trans, 0.35);
    }
}

/* Counting: numbers of cis/trans isomers are facts of the constitution (standard stereochemistry:
 * two for each disubstituted pattern, 1,2,3-trimethyl three, 1,2,4-trimethyl four,
 * 1,3,5-trimethyl two, the 1,2,3,4,5,6-hexasubstituted ring eight, of which one is chiral:
 * the hexachlorocyclohexanes and the inositols; Eliel, Wilen & Mander 1994, from memory). */
static void
test_counts (void)
{
  struct
  {
    const char *smiles;
    guint       n;
    guint       n_chiral;
  } cases[] = {
    { "CC1CCCCC1C", 2, 1 },   /* trans-1,2 is chiral */
    { "CC1CCCC(C)C1", 2, 1 }, /* trans-1,3 is chiral */
    { "CC1CCC(C)CC1", 2, 0 },
    { "CC1C(C)C(C)CCC1", 3, 1 },
    { "CC1CC(C)C(C)CC1", 4, 4 },
    { "CC1CC(C)CC(C)C1", 2, 0 },
    { "OC1C(O)C(O)C(O)C(O)C1O", 8, 1 },
    { "CC1(C)CCCCC1", 1, 0 },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (CwIsomerSet) set = isomers_of (cases[i].smiles, 298.15);
      guint  chiral = 0;
      double sum = 0;

      for (guint k = 0; k < set->isomers->len; k++)
        {
          const CwIsomer *iso = set->isomers->pdata[k];
          chiral += iso->chiral;
          sum += iso->fraction;
        }
      if (set->isomers->len != cases[i].n || chiral != cases[i].n_chiral)
        g_error ("%s: %u isomers (%u chiral), expected %u (%u)", cases[i].smiles, set->isomers->len, chiral,
                 cases[i].n, cases[i].n_chiral);
      g_assert_cmpfloat_with_epsilon (sum, 1.0, 1e-12);
    }
}

/* G = −RT ln Σ exp(−Gᵢ/RT) over the species, checked against the chair energies themselves. */
static void
test_averaging (void)
{
  g_autoptr (CwIsomerSet) set = isomers_of ("CC1CCCCC1C", 298.15);
  const CwIsomer *cis = find (set, "cis"), *trans = find (set, "trans");
  double          rt = CW_R_KCAL * 298.15, e, z;

  /* cis-1,2: the two chairs are mirror images of each other, both counted */
  g_assert_cmpint (cis->n_species, ==, 2);
  e = cis->analysis.chair[0].energy;
  g_assert_cmpfloat_with_epsilon (cis->g, e - rt * log (2.0), 1e-9);
  /* trans-1,2: chiral, two chairs for each enantiomer */
  g_assert_cmpint (trans->n_species, ==, 4);
  z = 2 * exp (-trans->analysis.chair[0].energy / rt) + 2 * exp (-trans->analysis.chair[1].energy / rt);
  g_assert_cmpfloat_with_epsilon (trans->g, -rt * log (z), 1e-9);
  /* the equilibrium fractions follow from the G values */
  g_assert_cmpfloat_with_epsilon (cis->fraction / trans->fraction, exp (-(cis->g - trans->g) / rt), 1e-9);
  g_assert_true (set->isomers->pdata[0] == trans);
}

/* cis-1,4: superimposable chairs count once. */
static void
test_identical_chairs (void)
{
  g_autoptr (CwIsomerSet) set = isomers_of ("CC1CCC(C)CC1", 200);
  const CwIsomer *cis = find (set, "cis");

  g_assert_cmpint (cis->n_species, ==, 1);
  g_assert_cmpfloat_with_epsilon (cis->g, cis->analysis.chair[0].energy, 1e-9);
  g_assert_cmpfloat (set->temperature, ==, 200);
}

/* Finding a document's isomer: by relative configuration, whichever enantiomer it is. */
static void
test_find (void)
{
  g_autoptr (CwIsomerSet) set = isomers_of ("CC1CCCCC1C", 298.15);
  /* the two enantiomers of trans-1,2-dimethylcyclohexane, and the cis isomer */
  g_autoptr (GPtrArray) a = cw_smiles_read ("C[C@H]1CCCC[C@@H]1C", data->groups, NULL, NULL);
  g_autoptr (GPtrArray) b = cw_smiles_read ("C[C@@H]1CCCC[C@H]1C", data->groups, NULL, NULL);
  g_autoptr (GPtrArray) c = cw_smiles_read ("C[C@H]1CCCC[C@H]1C", data->groups, NULL, NULL);
  g_autoptr (GPtrArray) other = cw_smiles_read ("CC1CCC(C)CC1", data->groups, NULL, NULL);
  int ia = cw_isomer_set_find (set, a->pdata[0]), ib = cw_isomer_set_find (set, b->pdata[0]);
  int ic = cw_isomer_set_find (set, c->pdata[0]);

  g_autofree char *sa = cw_smiles_write (a->pdata[0]);
  g_autofree char *sb = cw_smiles_write (b->pdata[0]);

  /* a and b: one configuration, written differently; c is the other configuration */
  g_assert_cmpstr (sa, !=, sb);
  g_assert_cmpint (ia, >=, 0);
  g_assert_cmpint (ia, ==, ib);
  g_assert_cmpint (ic, >=, 0);
  g_assert_cmpint (ic, !=, ia);
  g_assert_cmpint (cw_isomer_set_find (set, other->pdata[0]), ==, -1);
}

int
main (int argc, char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  data = test_load_data ();
  g_test_add_func ("/core/isomers/dimethyl-published", test_dimethyl_published);
  g_test_add_func ("/core/isomers/counts", test_counts);
  g_test_add_func ("/core/isomers/averaging", test_averaging);
  g_test_add_func ("/core/isomers/identical-chairs", test_identical_chairs);
  g_test_add_func ("/core/isomers/find", test_find);
  status = g_test_run ();
  cw_data_free (data);
  return status;
}
