/* libFuzzer harness: the temperature parser (cw_parse_temperature, “25C”, “-78 °C”, “298.15K”).
 * Whatever it accepts lies in (0, 1000] K and is finite; what it prints reads back within the
 * printed precision. */
#include "fuzz-common.h"

int
LLVMFuzzerTestOneInput (const uint8_t *bytes, size_t size)
{
  g_autofree char *text = fuzz_strndup (bytes, size);
  g_autoptr (GError) error = NULL;
  g_autofree char *shown = NULL;
  CwTemperatureUnit unit = CW_TUNIT_KELVIN;
  double kelvin = NAN, again = NAN;

  if (!cw_parse_temperature (text, &kelvin, &unit, &error))
    {
      fuzz_check_error (error, g_utf8_validate (text, -1, NULL));
      return 0;
    }
  FUZZ_CHECK (isfinite (kelvin) && kelvin > 0 && kelvin <= CW_T_MAX, "“%s” gave %g K", text, kelvin);
  FUZZ_CHECK (cw_check_temperature (kelvin, NULL), "“%s” gave %g K", text, kelvin);
  FUZZ_CHECK (unit == CW_TUNIT_KELVIN || unit == CW_TUNIT_CELSIUS, "unit %d", unit);
  shown = cw_format_temperature (kelvin, unit);
  /* Rounding to the printed digits may step just outside the range (0.001 K prints as 0.00 K). */
  g_clear_error (&error);
  if (cw_parse_temperature (shown, &again, NULL, &error))
    FUZZ_CHECK (fabs (again - kelvin) <= 0.051, "“%s” → %.17g K → “%s” → %.17g K", text, kelvin,
                shown, again);
  else
    FUZZ_CHECK (kelvin < 0.01 || kelvin > CW_T_MAX - 0.06, "“%s” printed as “%s”: %s", text, shown,
                error->message);
  return 0;
}
