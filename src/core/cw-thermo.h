#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* CODATA 2018 (exact in the SI since 2019). */
#define CW_R_J           8.314462618        /* J/(mol K) */
#define CW_KB            1.380649e-23       /* J/K */
#define CW_H_PLANCK      6.62607015e-34     /* J s */
#define CW_NA            6.02214076e23      /* 1/mol */
#define CW_J_PER_CAL     4.184              /* thermochemical calorie, exact */
#define CW_R_KCAL        (CW_R_J / CW_J_PER_CAL / 1000.0) /* kcal/(mol K) */
#define CW_ZERO_C        273.15
#define CW_T_MIN         1.0                /* K; below this R·T underflows and nothing is meant */
#define CW_T_MAX         1000.0             /* the model is not meant above this */

typedef enum
{
  CW_UNIT_KCAL,
  CW_UNIT_KJ
} CwEnergyUnit;

typedef enum
{
  CW_TUNIT_KELVIN,
  CW_TUNIT_CELSIUS
} CwTemperatureUnit;

/* x1 = 1/(1+K), K = exp(-dg/RT), computed without overflow for any finite dg. */
void     cw_populations (double dg_kcal, double t_kelvin, double *x1, double *x2);
double   cw_equilibrium_constant (double dg_kcal, double t_kelvin);
/* Eyring, kappa = 1: k = kB T / h · exp(-dG‡/RT), 1/s. */
double   cw_eyring_rate (double dg_act_kcal, double t_kelvin);
double   cw_energy_from_kcal (double kcal, CwEnergyUnit unit);
double   cw_energy_to_kcal (double value, CwEnergyUnit unit);
const char *cw_energy_unit_symbol (CwEnergyUnit unit); /* "kcal/mol" or "kJ/mol" */
gboolean cw_energy_unit_from_string (const char *s, CwEnergyUnit *unit);
/* "25C", "25 °C", "298.15K", "-78 °C", "298" (kelvin when no unit). Rejects T < 1 K,
 * T > CW_T_MAX, NaN and junk with a message naming the text. unit_out may be NULL. */
gboolean cw_parse_temperature (const char *text, double *kelvin, CwTemperatureUnit *unit_out, GError **error);
gboolean cw_check_temperature (double kelvin, GError **error);
/* Two finite, non-negative fractions that add up to 1 (within 1e-6). */
gboolean cw_check_populations (const double pop[2], GError **error);
char    *cw_format_temperature (double kelvin, CwTemperatureUnit unit);

G_END_DECLS
