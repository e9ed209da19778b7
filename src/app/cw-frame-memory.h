#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Memory that Cairo's X11 backend shares with the X server for the window's frames, paged
 * in ahead of use, a step at a time (see cw-frame-memory.c). One set per process. */

/* Looks for that memory and sets aside the top of each block of it to be paged in, up to
 * `max_bytes` in all. Returns the bytes set aside, 0 when there is none (yet) or the system cannot do it;
 * once found, later calls return the same without looking again. */
gsize cw_frame_memory_find (gsize max_bytes);
/* Pages in up to `bytes` more of what was set aside; returns TRUE while some is left. */
gboolean cw_frame_memory_step (gsize bytes);
/* Bytes paged in so far. */
gsize cw_frame_memory_get_prefaulted (void);
/* The i-th part set aside (its start and length), FALSE past the last. */
gboolean cw_frame_memory_get_range (guint     i,
                                    gpointer *start,
                                    gsize    *length);

G_END_DECLS
