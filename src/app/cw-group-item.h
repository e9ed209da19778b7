#pragma once

#include <glib-object.h>

#include "cw-core.h"

G_BEGIN_DECLS

#define CW_TYPE_GROUP_ITEM (cw_group_item_get_type ())

G_DECLARE_FINAL_TYPE (CwGroupItem, cw_group_item, CW, GROUP_ITEM, GObject)

/* A row of the group chooser: a borrowed CwGroup (table or custom) shown by label,
 * A-value and source. The group must outlive the item. */
CwGroupItem   *cw_group_item_new (const CwGroup *group);
const CwGroup *cw_group_item_get_group (CwGroupItem *self);
const char    *cw_group_item_get_search_text (CwGroupItem *self);

G_END_DECLS
