#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Memory that Cairo's X11 backend shares with the X server for the window's frames, paged
 * in ahead of use (see cw-frame-memory.c). Starts a thread that pages in the top
 * `max_bytes` of each such block of this process and returns how many bytes it was given,
 * 0 when there is none or the system cannot do it. */
gsize cw_frame_memory_prefault (gsize max_bytes);
/* Bytes paged in so far by those threads. */
gsize cw_frame_memory_get_prefaulted (void);

G_END_DECLS
