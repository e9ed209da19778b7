#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define CW_CORE_ERROR (cw_core_error_quark ())

typedef enum
{
  CW_CORE_ERROR_PARSE,      /* malformed text: JSON, SMILES, a number, a unit */
  CW_CORE_ERROR_INVALID,    /* well-formed but wrong: a missing field, a bad value */
  CW_CORE_ERROR_UNKNOWN_GROUP,
  CW_CORE_ERROR_VERSION,    /* a format version we cannot read */
  CW_CORE_ERROR_IO,
  CW_CORE_ERROR_UNSUPPORTED /* a valid structure outside what the model covers */
} CwCoreError;

GQuark cw_core_error_quark (void);

G_END_DECLS
