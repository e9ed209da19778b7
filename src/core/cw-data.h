#pragma once

#include "cw-groups.h"
#include "cw-interactions.h"

G_BEGIN_DECLS

/* The two tables every analysis reads: groups and pair/ring terms. */
typedef struct
{
  CwGroupTable *groups;
  CwInteractionTable *interactions;
  /* Dense lookup built at load: entry index (or -1) per (kind, group i, group j). */
  int *pair_index;
  guint n_groups;
} CwData;

/* Loads groups.json and interactions.json from dir; NULL dir means the installed or
 * source-tree data directory (CHAIRWISE_DATADIR overrides both). */
CwData     *cw_data_new_from_dir (const char *dir, GError **error);
CwData     *cw_data_new (CwGroupTable *groups, CwInteractionTable *interactions);
void        cw_data_free (CwData *data);
const char *cw_data_find_dir (void);
/* Fast pair lookup used by the engine; handles custom groups through their class. */
const CwPairEntry *cw_data_find_pair (const CwData *data,
                                      CwPairKind kind,
                                      const CwGroup *x,
                                      const CwGroup *y,
                                      gboolean *swapped);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwData, cw_data_free)

G_END_DECLS
