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
 *
 * Paging in the top of the pool once, after a frame has set it up, removes those faults.
 * The window does it in steps at idle time, between frames (cw-window.c). On a thread of its
 * own it competed with the window's first edits for the cores and for the process's memory
 * map (which paging in holds for reading), and made them slower when the machine was busy.
 * It costs that memory: up to 8 MB more resident (7.9 MB with the demo at the default
 * window size, whose first frames had used 0.3 MB of the pool). MADV_POPULATE_WRITE pages
 * memory in as a write would, without writing, so frames the X server may be reading are
 * left as they are. */

static gsize prefaulted;

#if defined(__linux__) && defined(MADV_POPULATE_WRITE)
typedef struct
{
  guintptr start;
  gsize    length;
  gsize    done;
} Range;

static GArray *ranges;      /* of Range, once found */
static gsize   found_total; /* bytes set aside, once found */
#endif

gsize
cw_frame_memory_find (gsize max_bytes)
{
#if defined(__linux__) && defined(MADV_POPULATE_WRITE)
  g_autofree char *maps = NULL;
  gsize            total = 0;
  char            *line, *next;

  if (found_total > 0)
    return found_total;
  if (max_bytes == 0 || !g_file_get_contents ("/proc/self/maps", &maps, NULL, NULL))
    return 0;
  if (ranges == NULL)
    ranges = g_array_new (FALSE, FALSE, sizeof (Range));
  for (line = maps; line != NULL && *line != '\0'; line = next)
    {
      unsigned long start, end;
      char          perms[5] = "";
      Range         r = { 0 };

      next = strchr (line, '\n');
      if (next != NULL)
        *next++ = '\0';
      /* "start-end perms offset dev inode path": shared, writable System V segments. */
      if (sscanf (line, "%lx-%lx %4s", &start, &end, perms) != 3 || end <= start || strcmp (perms, "rw-s") != 0 ||
          strstr (line, " /SYSV") == NULL)
        continue;
      r.length = MIN ((gsize) (end - start), max_bytes - total);
      r.start = (guintptr) end - r.length;
      if (r.length > 0)
        g_array_append_val (ranges, r);
      total += r.length;
    }
  found_total = total;
  return total;
#else
  return 0;
#endif
}

gboolean
cw_frame_memory_step (gsize bytes)
{
#if defined(__linux__) && defined(MADV_POPULATE_WRITE)
  if (ranges == NULL)
    return FALSE;
  for (guint i = 0; i < ranges->len && bytes > 0; i++)
    {
      Range *r = &g_array_index (ranges, Range, i);
      gsize  n = MIN (bytes, r->length - r->done);

      if (n == 0)
        continue;
      /* The pool may be gone by now (an error: the rest of it is dropped) or its pages
       * already in (no work). */
      if (madvise ((void *) (r->start + r->done), n, MADV_POPULATE_WRITE) != 0)
        {
          r->done = r->length;
          continue;
        }
      r->done += n;
      bytes -= n;
      prefaulted += n;
    }
  for (guint i = 0; i < ranges->len; i++)
    if (g_array_index (ranges, Range, i).done < g_array_index (ranges, Range, i).length)
      return TRUE;
  return FALSE;
#else
  return FALSE;
#endif
}

gsize
cw_frame_memory_get_prefaulted (void)
{
  return prefaulted;
}

gboolean
cw_frame_memory_get_range (guint     i,
                           gpointer *start,
                           gsize    *length)
{
#if defined(__linux__) && defined(MADV_POPULATE_WRITE)
  if (ranges == NULL || i >= ranges->len)
    return FALSE;
  *start = (gpointer) g_array_index (ranges, Range, i).start;
  *length = g_array_index (ranges, Range, i).length;
  return TRUE;
#else
  return FALSE;
#endif
}
