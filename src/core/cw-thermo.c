#include "config.h"

#include "cw-thermo.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cw-core-error.h"

void
cw_populations (double dg_kcal, double t_kelvin, double *x1, double *x2)
{
  /* Logistic form: x2 = 1 / (1 + exp(u)), u = dg/RT. Picking the branch by the sign of u keeps
   * exp() at or below 1, so nothing overflows and x1 + x2 = 1 to rounding. */
  double u = dg_kcal / (CW_R_KCAL * t_kelvin);
  double e = exp (-fabs (u));
  double both[2] = { e / (1.0 + e), 1.0 / (1.0 + e) }; /* small, large */
  int    up = u >= 0;

  /* picked by index, not by a branch: the sign of u is anyone's guess in a batch */
  *x1 = both[up];
  *x2 = both[!up];
}

double
cw_equilibrium_constant (double dg_kcal, double t_kelvin)
{
  return exp (-dg_kcal / (CW_R_KCAL * t_kelvin));
}

double
cw_eyring_rate (double dg_act_kcal, double t_kelvin)
{
  return CW_KB * t_kelvin / CW_H_PLANCK * exp (-dg_act_kcal / (CW_R_KCAL * t_kelvin));
}

double
cw_energy_from_kcal (double kcal, CwEnergyUnit unit)
{
  return unit == CW_UNIT_KJ ? kcal * CW_J_PER_CAL : kcal;
}

double
cw_energy_to_kcal (double value, CwEnergyUnit unit)
{
  return unit == CW_UNIT_KJ ? value / CW_J_PER_CAL : value;
}

const char *
cw_energy_unit_symbol (CwEnergyUnit unit)
{
  return unit == CW_UNIT_KJ ? "kJ/mol" : "kcal/mol";
}

gboolean
cw_energy_unit_from_string (const char *s, CwEnergyUnit *unit)
{
  if (s == NULL)
    return FALSE;
  if (g_ascii_strcasecmp (s, "kcal") == 0 || g_ascii_strcasecmp (s, "kcal/mol") == 0)
    *unit = CW_UNIT_KCAL;
  else if (g_ascii_strcasecmp (s, "kJ") == 0 || g_ascii_strcasecmp (s, "kJ/mol") == 0)
    *unit = CW_UNIT_KJ;
  else
    return FALSE;
  return TRUE;
}

gboolean
cw_check_temperature (double kelvin, GError **error)
{
  if (isnan (kelvin))
    {
      g_set_error_literal (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                           _("Temperature is not a number"));
      return FALSE;
    }
  if (kelvin <= 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Temperature %.6g K is at or below absolute zero"), kelvin);
      return FALSE;
    }
  if (kelvin < CW_T_MIN)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Temperature %.10g K is below %.0f K, outside what the model covers"),
                   kelvin, CW_T_MIN);
      return FALSE;
    }
  if (kelvin > CW_T_MAX)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Temperature %.10g K is above %.0f K, outside what the model covers"),
                   kelvin, CW_T_MAX);
      return FALSE;
    }
  return TRUE;
}

static const char *
skip_space (const char *p)
{
  while (*p == ' ' || *p == '\t')
    p++;
  return p;
}

gboolean
cw_parse_temperature (const char *text, double *kelvin, CwTemperatureUnit *unit_out, GError **error)
{
  const char *p;
  char *end = NULL;
  double value;
  CwTemperatureUnit unit = CW_TUNIT_KELVIN;

  if (text == NULL || *(p = skip_space (text)) == '\0')
    {
      g_set_error_literal (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE, _("Temperature is empty"));
      return FALSE;
    }
  /* The minus sign U+2212 is accepted as well as ASCII '-'. */
  if (g_str_has_prefix (p, "\xe2\x88\x92"))
    {
      g_autofree char *ascii = g_strconcat ("-", p + 3, NULL);
      return cw_parse_temperature (ascii, kelvin, unit_out, error);
    }
  value = g_ascii_strtod (p, &end);
  if (end == p || (!isfinite (value)))
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s” is not a temperature; write e.g. 25C, -78 °C or 298.15K"), text);
      return FALSE;
    }
  p = skip_space (end);
  if (g_str_has_prefix (p, "\xc2\xb0")) /* degree sign */
    p = skip_space (p + 2);
  if (*p == 'C' || *p == 'c')
    {
      unit = CW_TUNIT_CELSIUS;
      p++;
    }
  else if (*p == 'K' || *p == 'k')
    p++;
  else if (*p != '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s”: unknown temperature unit “%s”; use C or K"), text, p);
      return FALSE;
    }
  p = skip_space (p);
  if (*p != '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_PARSE,
                   _("“%s”: unexpected “%s” after the unit"), text, p);
      return FALSE;
    }
  if (unit == CW_TUNIT_CELSIUS)
    value += CW_ZERO_C;
  if (!cw_check_temperature (value, error))
    {
      g_prefix_error (error, "“%s”: ", text);
      return FALSE;
    }
  *kelvin = value;
  if (unit_out)
    *unit_out = unit;
  return TRUE;
}

char *
cw_format_temperature (double kelvin, CwTemperatureUnit unit)
{
  if (unit == CW_TUNIT_CELSIUS)
    return g_strdup_printf ("%.1f °C", kelvin - CW_ZERO_C);
  return g_strdup_printf ("%.2f K", kelvin);
}

gboolean
cw_check_populations (const double pop[2], GError **error)
{
  if (!isfinite (pop[0]) || !isfinite (pop[1]) || pop[0] < 0 || pop[1] < 0 ||
      fabs (pop[0] + pop[1] - 1.0) > 1e-6)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("Chair populations %g and %g do not add up to 1"), pop[0], pop[1]);
      return FALSE;
    }
  return TRUE;
}
