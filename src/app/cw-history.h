#pragma once

#include <glib.h>

#include "cw-core.h"

G_BEGIN_DECLS

/* Undo/redo as whole-document snapshots: a document is a few hundred bytes, so a copy
 * per edit is cheaper and far simpler than inverse commands. Each state carries a
 * serial so the window can tell whether the current state is the saved one. */
typedef struct _CwHistory CwHistory;

CwHistory *cw_history_new (guint limit);
void       cw_history_free (CwHistory *history);
void       cw_history_clear (CwHistory *history);
/* Records doc (copied) as the state before an edit. A non-NULL merge_key equal to the
 * previous push's key, within a second, merges with it (e.g. dragging a slider). */
void     cw_history_push (CwHistory        *history,
                          const CwDocument *doc,
                          guint             serial,
                          const char       *merge_key);
gboolean cw_history_can_undo (CwHistory *history);
gboolean cw_history_can_redo (CwHistory *history);
/* Swap: current goes onto the other stack, the returned document (owned) becomes current. */
CwDocument *cw_history_undo (CwHistory        *history,
                             const CwDocument *current,
                             guint             current_serial,
                             guint            *serial_out);
CwDocument *cw_history_redo (CwHistory        *history,
                             const CwDocument *current,
                             guint             current_serial,
                             guint            *serial_out);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwHistory, cw_history_free)

G_END_DECLS
