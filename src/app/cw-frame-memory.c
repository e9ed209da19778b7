#include "config.h"

#include "cw-frame-memory.h"

#include <stdio.h>
#include <string.h>
#ifdef __linux__
#include <sys/mman.h>
#endif

/* With the Cairo renderer on X11, Cairo's X11 backend hands each frame's pixels to the X
 * server through a pool of memory it shares with it (a System V segment of 32 MB here,
 * attached as "/SYSV..." in /proc/self/maps). The pool hands out blocks from its top, and a
 * block's pages are only backed by memory when first written: a frame that lands on a fresh
 * part of it takes a page fault per 4 kB. The window's frames stay in the top 4 MB; while
 * the temperature popover is open its frames take a piece of that block first and the
 * window's move to the next 4 MB, so the first step of a slider drag took about 300 faults:
 * 5 ms against a median of 1.6 ms here, 11-14 ms with both cores busy with other work.
 * Paging in the top of the pool once, on a thread, after a frame has set it up removes those
 * faults. It costs that memory: up to 8 MB more resident (7.9 MB with the demo at the
 * default window size, whose first frames had used 0.3 MB of the pool). MADV_POPULATE_WRITE
 * pages memory in as a write would, without writing, so frames the X server may be reading
 * are left as they are. */

static gsize prefaulted; /* atomic */

#if defined(__linux__) && defined(MADV_POPULATE_WRITE)
typedef struct
{
  guintptr start;
  gsize    length;
} Range;

static gpointer
prefault_thread (gpointer data)
{
  GArray *ranges = data;

  for (guint i = 0; i < ranges->len; i++)
    {
      Range *r = &g_array_index (ranges, Range, i);

      /* The pool may be gone by now (an error then) or its pages already in (no work). */
      if (madvise ((void *) r->start, r->length, MADV_POPULATE_WRITE) == 0)
        g_atomic_pointer_add (&prefaulted, r->length);
    }
  g_array_unref (ranges);
  return NULL;
}
#endif

gsize
cw_frame_memory_prefault (gsize max_bytes)
{
#if defined(__linux__) && defined(MADV_POPULATE_WRITE)
  g_autofree char *maps = NULL;
  GArray          *ranges;
  gsize            total = 0;
  char            *line, *next;

  if (max_bytes == 0 || !g_file_get_contents ("/proc/self/maps", &maps, NULL, NULL))
    return 0;
  ranges = g_array_new (FALSE, FALSE, sizeof (Range));
  for (line = maps; line != NULL && *line != '\0'; line = next)
    {
      unsigned long start, end;
      char          perms[5] = "";
      Range         r;

      next = strchr (line, '\n');
      if (next != NULL)
        *next++ = '\0';
      /* "start-end perms offset dev inode path": shared, writable System V segments. */
      if (sscanf (line, "%lx-%lx %4s", &start, &end, perms) != 3 || end <= start || strcmp (perms, "rw-s") != 0 ||
          strstr (line, " /SYSV") == NULL)
        continue;
      r.length = MIN ((gsize) (end - start), max_bytes);
      r.start = (guintptr) end - r.length;
      g_array_append_val (ranges, r);
      total += r.length;
    }
  if (ranges->len == 0)
    {
      g_array_unref (ranges);
      return 0;
    }
  g_thread_unref (g_thread_new ("cw-frame-memory", prefault_thread, ranges));
  return total;
#else
  return 0;
#endif
}

gsize
cw_frame_memory_get_prefaulted (void)
{
  return (gsize) g_atomic_pointer_get (&prefaulted);
}
