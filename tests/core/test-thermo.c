#include "config.h"

#include <math.h>
#include <string.h>

#include "cw-core.h"

/* CODATA 2018 exact values: R = NA·kB = 8.314462618... J/(mol K). */
static void
test_codata (void)
{
  g_assert_cmpfloat_with_epsilon (CW_R_J, CW_NA * CW_KB, 1e-9);
  /* R in cal: 1.98720425864 cal/(mol K) (CODATA 2018 with the thermochemical calorie) */
  g_assert_cmpfloat_with_epsilon (CW_R_KCAL * 1000.0, 1.98720425864, 1e-10);
  /* Eyring prefactor kB·T/h at 298.15 K = 6.2124e12 1/s (CODATA 2018 kB and h) */
  g_assert_cmpfloat_with_epsilon (cw_eyring_rate (0, 298.15) / 6.21241e12, 1.0, 1e-5);
}

/* Cyclohexane: ΔG‡ ≈ 10.2–10.3 kcal/mol gives about 1e5 inversions per second at 25 °C
 * (Anet & Bourn, J. Am. Chem. Soc. 1967, 89, 760; from memory, unverified). */
static void
test_inversion_rate (void)
{
  double k = cw_eyring_rate (10.25, 298.15);

  g_assert_cmpfloat (k, >, 5e4);
  g_assert_cmpfloat (k, <, 5e5);
}

/* Populations: sums to 1 and never overflows (|ΔG| to 100 kcal/mol, T 1–1000 K). */
static void
test_populations_extreme (void)
{
  const double dgs[] = { -100, -30, -1e-9, 0, 1e-9, 0.5, 30, 100 };
  const double ts[] = { 1, 10, 77, 298.15, 1000 };

  for (gsize i = 0; i < G_N_ELEMENTS (dgs); i++)
    for (gsize j = 0; j < G_N_ELEMENTS (ts); j++)
      {
        double x1, x2;
        cw_populations (dgs[i], ts[j], &x1, &x2);
        g_assert_true (isfinite (x1) && isfinite (x2));
        g_assert_cmpfloat (x1, >=, 0);
        g_assert_cmpfloat (x2, >=, 0);
        g_assert_cmpfloat_with_epsilon (x1 + x2, 1.0, 1e-12);
        g_assert_true ((dgs[i] > 0) ? x1 >= x2 : (dgs[i] < 0 ? x2 >= x1 : x1 == x2));
      }
}

/* 1.74 kcal/mol at 298.15 K: RT = 0.5924850 kcal/mol (CODATA 2018 R, 4.184 J/cal), so
 * K = exp(−2.936784) = 0.0530360 (computed by hand from those constants). */
static void
test_boltzmann (void)
{
  double x1, x2;

  g_assert_cmpfloat_with_epsilon (cw_equilibrium_constant (1.74, 298.15), 0.0530360, 1e-7);
  cw_populations (1.74, 298.15, &x1, &x2);
  g_assert_cmpfloat_with_epsilon (x2, 0.0530360 / 1.0530360, 1e-7);
}

static void
test_parse_temperature (void)
{
  const struct { const char *text; double kelvin; } good[] = {
    { "25C", 298.15 }, { "298.15K", 298.15 }, { "-78 °C", 195.15 }, { "−78 °C", 195.15 },
    { "300", 300 }, { " 0 C ", 273.15 }, { "1000K", 1000 },
  };
  const char *bad[] = { "", "abc", "-274C", "0K", "0", "nan", "inf", "1e9K", "25F", "25 C x", "1001K", "0.5K", "4.9e-324K" };

  for (gsize i = 0; i < G_N_ELEMENTS (good); i++)
    {
      g_autoptr (GError) error = NULL;
      double t = 0;
      g_assert_true (cw_parse_temperature (good[i].text, &t, NULL, &error));
      g_assert_no_error (error);
      g_assert_cmpfloat_with_epsilon (t, good[i].kelvin, 1e-9);
    }
  for (gsize i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      g_autoptr (GError) error = NULL;
      double t = 0;
      g_assert_false (cw_parse_temperature (bad[i], &t, NULL, &error));
      g_assert_nonnull (error);
      g_assert_nonnull (strstr (error->message, bad[i]));
    }
}

/* 1 kcal = 4.184 kJ exactly (thermochemical calorie). */
static void
test_units (void)
{
  g_assert_cmpfloat_with_epsilon (cw_energy_from_kcal (1.0, CW_UNIT_KJ), 4.184, 1e-15);
  g_assert_cmpfloat_with_epsilon (cw_energy_to_kcal (4.184, CW_UNIT_KJ), 1.0, 1e-15);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/thermo/codata", test_codata);
  g_test_add_func ("/core/thermo/inversion-rate", test_inversion_rate);
  g_test_add_func ("/core/thermo/populations-extreme", test_populations_extreme);
  g_test_add_func ("/core/thermo/boltzmann", test_boltzmann);
  g_test_add_func ("/core/thermo/parse-temperature", test_parse_temperature);
  g_test_add_func ("/core/thermo/units", test_units);
  return g_test_run ();
}
