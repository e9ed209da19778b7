#include "config.h"

#include "cw-core-error.h"

GQuark
cw_core_error_quark (void)
{
  return g_quark_from_static_string ("cw-core-error-quark");
}
