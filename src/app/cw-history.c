#include "config.h"

#include "cw-history.h"

typedef struct
{
  CwDocument *doc;
  guint       serial;
} State;

struct _CwHistory
{
  GArray *undo; /* State, oldest first */
  GArray *redo;
  guint   limit;
  char   *last_key;
  gint64  last_time;
};

static void
state_clear (gpointer p)
{
  State *s = p;

  g_clear_pointer (&s->doc, cw_document_free);
}

CwHistory *
cw_history_new (guint limit)
{
  CwHistory *h = g_new0 (CwHistory, 1);

  h->undo = g_array_new (FALSE, TRUE, sizeof (State));
  h->redo = g_array_new (FALSE, TRUE, sizeof (State));
  g_array_set_clear_func (h->undo, state_clear);
  g_array_set_clear_func (h->redo, state_clear);
  h->limit = MAX (limit, 1);
  return h;
}

void
cw_history_free (CwHistory *history)
{
  if (history == NULL)
    return;
  g_array_unref (history->undo);
  g_array_unref (history->redo);
  g_free (history->last_key);
  g_free (history);
}

void
cw_history_clear (CwHistory *history)
{
  g_array_set_size (history->undo, 0);
  g_array_set_size (history->redo, 0);
  g_clear_pointer (&history->last_key, g_free);
}

void
cw_history_push (CwHistory        *history,
                 const CwDocument *doc,
                 guint             serial,
                 const char       *merge_key)
{
  gint64 now = g_get_monotonic_time ();
  State  s;

  g_return_if_fail (history != NULL && doc != NULL);

  g_array_set_size (history->redo, 0);
  if (merge_key != NULL && history->undo->len > 0 &&
      g_strcmp0 (merge_key, history->last_key) == 0 &&
      now - history->last_time < G_USEC_PER_SEC)
    {
      history->last_time = now;
      return;
    }
  g_free (history->last_key);
  history->last_key = g_strdup (merge_key);
  history->last_time = now;

  if (history->undo->len >= history->limit)
    g_array_remove_index (history->undo, 0);
  s.doc = cw_document_copy (doc);
  s.serial = serial;
  g_array_append_val (history->undo, s);
}

gboolean
cw_history_can_undo (CwHistory *history)
{
  return history->undo->len > 0;
}

gboolean
cw_history_can_redo (CwHistory *history)
{
  return history->redo->len > 0;
}

static CwDocument *
swap (GArray           *from,
      GArray           *to,
      const CwDocument *current,
      guint             current_serial,
      guint            *serial_out)
{
  State      *top, cur;
  CwDocument *doc;

  if (from->len == 0)
    return NULL;
  top = &g_array_index (from, State, from->len - 1);
  doc = g_steal_pointer (&top->doc);
  *serial_out = top->serial;
  g_array_set_size (from, from->len - 1);

  cur.doc = cw_document_copy (current);
  cur.serial = current_serial;
  g_array_append_val (to, cur);
  return doc;
}

CwDocument *
cw_history_undo (CwHistory        *history,
                 const CwDocument *current,
                 guint             current_serial,
                 guint            *serial_out)
{
  g_clear_pointer (&history->last_key, g_free);
  return swap (history->undo, history->redo, current, current_serial, serial_out);
}

CwDocument *
cw_history_redo (CwHistory        *history,
                 const CwDocument *current,
                 guint             current_serial,
                 guint            *serial_out)
{
  g_clear_pointer (&history->last_key, g_free);
  return swap (history->redo, history->undo, current, current_serial, serial_out);
}
