/* Benchmark: analyses per second for a hexasubstituted ring with uncertainty, on one core.
 * Target ≥ 1,000,000 per second. Prints a TAP line per figure; fails below the defect line
 * (200,000 per second), so a regression shows without timing any unit test. */
#include "config.h"

#include <stdio.h>

#include "cw-core.h"

static double
analyses_per_second (const CwData *data, const CwMolecule *mol, double seconds, double *checksum)
{
  CwConditions cond = { 298.15, CW_SOLVENT_APROTIC };
  CwAnalysis an;
  gint64 start = g_get_monotonic_time (), now;
  long n = 0;

  do
    {
      for (int i = 0; i < 1000; i++)
        {
          cond.temperature = 200.0 + (i % 200); /* vary T so nothing is hoisted */
          if (!cw_analyze (data, mol, &cond, &an, NULL))
            g_error ("analysis failed");
          *checksum += an.pop[0] + an.sigma;
        }
      n += 1000;
      now = g_get_monotonic_time ();
    }
  while (now - start < seconds * 1e6);
  return n / ((now - start) / 1e6);
}

int
main (int argc, char **argv)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = cw_data_new_from_dir (NULL, &error);
  const char *specs[] = {
    "1u=methyl 2d=ethyl 3u=chloro 4d=phenyl 5u=hydroxy 6d=cyano",
    "1u=tert-butyl 2u=methyl 3d=bromo 4u=methoxycarbonyl 5d=isopropyl 6u=fluoro",
  };
  double checksum = 0;
  int failed = 0;

  if (data == NULL)
    g_error ("%s", error->message);
  printf ("1..%d\n", (int) G_N_ELEMENTS (specs));
  for (gsize i = 0; i < G_N_ELEMENTS (specs); i++)
    {
      g_autoptr (CwMolecule) mol = cw_molecule_new_from_spec (specs[i], data->groups, &error);
      double rate = analyses_per_second (data, mol, 1.0, &checksum);
      gboolean ok = rate >= 200000;

      printf ("%s %d - %.0f analyses/s (%.2f µs each) for %s; target 1000000\n", ok ? "ok" : "not ok",
              (int) i + 1, rate, 1e6 / rate, specs[i]);
      failed |= !ok;
    }
  printf ("# checksum %g\n", checksum);
  return failed;
}
