/* Benchmark: couplings (both chairs, every ring proton) and reaction geometry per second, on one
 * core, for a trisubstituted ring. The window recomputes both on every edit, so each must stay far
 * below a frame (16 ms): target ≥ 20,000 per second (50 µs), defect line 2,000 per second
 * (0.5 ms). Prints a TAP line per figure; fails below the defect line. */
#include "config.h"

#include <stdio.h>

#include "cw-core.h"
#include "cw-couplings.h"
#include "cw-reactivity.h"

typedef gboolean (*Job) (const CwGeometryData *gd, const CwMolecule *mol, const double pop[2], double t, double *checksum);

static gboolean
couplings_job (const CwGeometryData *gd, const CwMolecule *mol, const double pop[2], double t, double *checksum)
{
  static CwCouplings c;

  if (!cw_couplings_compute (gd, mol, pop, t, NULL, &c, NULL))
    return FALSE;
  *checksum += c.protons[0].width_avg;
  return TRUE;
}

static gboolean
reactivity_job (const CwGeometryData *gd, const CwMolecule *mol, const double pop[2], double t, double *checksum)
{
  static CwReactivity r;

  if (!cw_reactivity_compute (gd, mol, pop, t, &r, NULL))
    return FALSE;
  *checksum += r.n_groups ? r.groups[0].reactive_fraction : 0;
  return TRUE;
}

static double
per_second (Job job, const CwGeometryData *gd, const CwMolecule *mol, double *checksum)
{
  gint64 start = g_get_monotonic_time (), now;
  long   n = 0;

  do
    {
      for (int i = 0; i < 100; i++)
        {
          double pop[2] = { 0.001 * (i % 1000), 1.0 - 0.001 * (i % 1000) };
          if (!job (gd, mol, pop, 200.0 + i, checksum))
            g_error ("computation failed");
        }
      n += 100;
      now = g_get_monotonic_time ();
    }
  while (now - start < 1e6);
  return n / ((now - start) / 1e6);
}

int
main (int argc, char **argv)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = cw_data_new_from_dir (NULL, &error);
  g_autoptr (CwGeometryData) gd = NULL;
  g_autoptr (CwMolecule) mol = NULL;
  struct
  {
    const char *name;
    Job         job;
  } jobs[] = { { "couplings", couplings_job }, { "reactivity", reactivity_job } };
  double checksum = 0;
  int    failed = 0;

  if (data == NULL)
    g_error ("%s", error->message);
  gd = cw_geometry_data_new_from_dir (NULL, &error);
  if (gd == NULL)
    g_error ("%s", error->message);
  mol = cw_molecule_new_from_spec ("1u=chloro 2u=isopropyl 5d=methyl", data->groups, &error);
  printf ("1..%d\n", (int) G_N_ELEMENTS (jobs));
  for (gsize i = 0; i < G_N_ELEMENTS (jobs); i++)
    {
      double   rate = per_second (jobs[i].job, gd, mol, &checksum);
      gboolean ok = rate >= 2000;

      printf ("%s %d - %.0f %s/s (%.1f µs each); target 20000\n", ok ? "ok" : "not ok", (int) i + 1, rate,
              jobs[i].name, 1e6 / rate);
      failed |= !ok;
    }
  printf ("# checksum %g\n", checksum);
  return failed;
}
