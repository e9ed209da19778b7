#pragma once

#include <gtk/gtk.h>

#include "cw-core.h"

G_BEGIN_DECLS

#define CW_TYPE_GROUP_CHOOSER (cw_group_chooser_get_type ())

G_DECLARE_FINAL_TYPE (CwGroupChooser, cw_group_chooser, CW, GROUP_CHOOSER, GtkWidget)

/* A button showing the current group of one slot; its popover lists the groups
 * (label, A-value, source) with a search entry. Emits "group-chosen" (id). */
GtkWidget *cw_group_chooser_new (void);
void       cw_group_chooser_set_model (CwGroupChooser *self,
                                       GListModel     *groups);
void       cw_group_chooser_set_group (CwGroupChooser *self,
                                       const CwGroup  *group);
void       cw_group_chooser_set_energy_unit (CwGroupChooser *self,
                                             CwEnergyUnit    unit);
void       cw_group_chooser_popup (CwGroupChooser *self,
                                   const char     *search_text);
char      *cw_group_chooser_dup_value_text (const CwGroup *group,
                                            CwEnergyUnit   unit);

G_END_DECLS
