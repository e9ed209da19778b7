#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cw-core-error.h"
#include "cw-couplings.h"

/* Multiplet names and the averaged-coupling method (the inverse of cw_couplings_compute). */

static int
compare_desc (const void *a, const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x < y) - (x > y);
}

static const char *
letters_for (int count)
{
  static const char *names[] = { "", "d", "t", "q", "quint", "sext", "sept" };

  return (count >= 1 && count <= 6) ? names[count] : NULL;
}

void
cw_multiplet_build (const double *j, int n, double tolerance, double min_resolved, CwMultiplet *out)
{
  double   v[CW_MULTIPLET_MAX];
  int      counts[CW_MULTIPLET_MAX];
  int      m = 0, groups = 0;
  GString *pattern = g_string_new (NULL);
  gboolean simple = TRUE;

  g_return_if_fail (out != NULL && (j != NULL || n == 0));
  memset (out, 0, sizeof *out);
  for (int i = 0; i < n && m < CW_MULTIPLET_MAX; i++)
    if (fabs (j[i]) >= min_resolved)
      v[m++] = fabs (j[i]);
  qsort (v, m, sizeof (double), compare_desc);
  /* Greedy groups: a coupling joins the current group when within tolerance of its largest. */
  for (int i = 0; i < m;)
    {
      double sum = 0;
      int    k = i;
      while (k < m && v[i] - v[k] <= tolerance)
        sum += v[k++];
      counts[groups] = k - i;
      out->j[groups++] = sum / (k - i);
      i = k;
    }
  out->n_j = groups;
  for (int g = 0; g < groups; g++)
    {
      if (counts[g] > 3)
        simple = FALSE;
      g_string_append (pattern, letters_for (counts[g]) ? letters_for (counts[g]) : "m");
    }
  if (groups == 0)
    g_strlcpy (out->pattern, "s", sizeof out->pattern);
  else if ((!simple && groups > 1) || groups > 4)
    g_strlcpy (out->pattern, "m", sizeof out->pattern);
  else
    g_strlcpy (out->pattern, pattern->str, sizeof out->pattern);
  g_string_free (pattern, TRUE);
}

char *
cw_multiplet_dup_text (const CwMultiplet *m)
{
  GString *s;

  g_return_val_if_fail (m != NULL, NULL);
  s = g_string_new (m->pattern);
  for (int i = 0; i < m->n_j; i++)
    g_string_append_printf (s, ", %.1f", m->j[i]);
  if (m->n_j > 0)
    g_string_append (s, " Hz");
  return g_string_free (s, FALSE);
}

const char *
cw_inverse_status_to_string (CwInverseStatus status)
{
  switch (status)
    {
    case CW_INVERSE_OK:
      return "ok";
    case CW_INVERSE_ONE_CHAIR:
      return "one-chair";
    case CW_INVERSE_OUTSIDE:
      return "outside";
    case CW_INVERSE_INSENSITIVE:
      return "insensitive";
    default:
      return "unknown";
    }
}

static gboolean
chair_values (const CwCouplings *c, int proton, int partner, double value[2], GError **error)
{
  const CwRingProton *p;

  if (proton < 0 || proton >= c->n_protons || partner >= c->n_protons || partner < -1)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("No such ring proton"));
      return FALSE;
    }
  p = &c->protons[proton];
  if (partner < 0)
    {
      value[0] = p->width[0];
      value[1] = p->width[1];
      return TRUE;
    }
  else
    {
      int              v = cw_couplings_find_vicinal (c, proton, partner);
      g_autofree char *a = cw_ring_proton_dup_label (p);
      g_autofree char *b = cw_ring_proton_dup_label (&c->protons[partner]);

      if (v < 0)
        {
          g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                       _("%s and %s are not vicinal (H–C–C–H) protons"), a, b);
          return FALSE;
        }
      value[0] = c->vicinal[v].j[0];
      value[1] = c->vicinal[v].j[1];
      return TRUE;
    }
}

gboolean
cw_couplings_solve (const CwGeometryData *gd,
                    const CwCouplings    *c,
                    int                   proton,
                    int                   partner,
                    double                observed,
                    CwInverseResult      *out,
                    GError              **error)
{
  double tol, x1;

  g_return_val_if_fail (gd != NULL && c != NULL && out != NULL, FALSE);
  memset (out, 0, sizeof *out);
  if (!isfinite (observed) || observed < 0 || observed > 100)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("A measured coupling or width must be a number of hertz from 0 to 100, not %g"), observed);
      return FALSE;
    }
  if (!chair_values (c, proton, partner, out->chair_value, error))
    return FALSE;
  tol = gd->inverse_tolerance.value;
  out->observed = observed;
  out->tolerance = tol;
  out->low = MIN (out->chair_value[0], out->chair_value[1]);
  out->high = MAX (out->chair_value[0], out->chair_value[1]);
  out->pop[0] = out->pop[1] = out->delta_g = NAN;
  if (out->high - out->low < gd->inverse_min_spread.value)
    {
      out->status = CW_INVERSE_INSENSITIVE;
      return TRUE;
    }
  if (observed < out->low - tol || observed > out->high + tol)
    {
      out->status = CW_INVERSE_OUTSIDE;
      return TRUE;
    }
  /* observed = x1·J1 + (1 − x1)·J2 */
  x1 = (observed - out->chair_value[1]) / (out->chair_value[0] - out->chair_value[1]);
  if (x1 <= 0.0 || x1 >= 1.0)
    {
      out->status = CW_INVERSE_ONE_CHAIR;
      x1 = CLAMP (x1, 0.0, 1.0);
      out->pop[0] = x1;
      out->pop[1] = 1.0 - x1;
      return TRUE;
    }
  out->status = CW_INVERSE_OK;
  out->pop[0] = x1;
  out->pop[1] = 1.0 - x1;
  /* K = x2/x1 = exp(−ΔG°/RT) */
  out->delta_g = -CW_R_KCAL * c->temperature * log (out->pop[1] / out->pop[0]);
  return TRUE;
}

char *
cw_inverse_dup_message (const CwInverseResult *r, CwEnergyUnit unit)
{
  g_return_val_if_fail (r != NULL, NULL);
  switch (r->status)
    {
    case CW_INVERSE_OK:
      return g_strdup_printf (_("%.1f Hz lies between chair 1 (%.1f Hz) and chair 2 (%.1f Hz): "
                                "chair 1 %.0f%%, chair 2 %.0f%%, ΔG° = %.2f %s (chair 2 − chair 1)."),
                                 r->observed, r->chair_value[0], r->chair_value[1], 100 * r->pop[0],
                                 100 * r->pop[1], cw_energy_from_kcal (r->delta_g, unit),
                                 cw_energy_unit_symbol (unit));
    case CW_INVERSE_ONE_CHAIR:
      return g_strdup_printf (_("%.1f Hz is at the value of chair %d alone (chair 1 %.1f Hz, chair 2 %.1f Hz, "
                                "within %.1f Hz): that chair dominates; ΔG° cannot be given, only its sign."),
                                 r->observed, r->pop[0] >= 0.5 ? 1 : 2, r->chair_value[0], r->chair_value[1],
                                 r->tolerance);
    case CW_INVERSE_OUTSIDE:
      return g_strdup_printf (_("%.1f Hz is outside what the two chairs can produce (%.1f to %.1f Hz): "
                                "check the assignment, or the ring is not a pair of chairs (twist-boat, "
                                "distortion) or the coupling model does not fit this proton."),
                                 r->observed, r->low, r->high);
    case CW_INVERSE_INSENSITIVE:
      return g_strdup_printf (_("The two chairs give nearly the same value (%.1f and %.1f Hz): this "
                                "measurement cannot tell their populations apart; use another proton."),
                                 r->chair_value[0], r->chair_value[1]);
    default:
      return g_strdup ("");
    }
}
