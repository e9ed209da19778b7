#pragma once

#include <glib.h>

#include "cw-core.h"

G_BEGIN_DECLS

/* The group and interaction tables, loaded once per process: from CHAIRWISE_DATADIR
 * when set, otherwise from the copy compiled into the program's resources. */
const CwData *cw_app_get_data (GError **error);

G_END_DECLS
