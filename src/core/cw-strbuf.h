#pragma once

#include <glib.h>
#include <string.h>

G_BEGIN_DECLS

/* Appending to a GString without a library call when it has room: the batch formats millions
 * of rows, and GLib 2.74's g_string_append is not inline. */
static inline void
cw_str_put (GString *s, const char *text, gsize n)
{
  if (s->len + n < s->allocated_len)
    {
      memcpy (s->str + s->len, text, n);
      s->len += n;
      s->str[s->len] = '\0';
    }
  else
    g_string_append_len (s, text, n);
}

static inline void
cw_str_puts (GString *s, const char *text)
{
  cw_str_put (s, text, strlen (text));
}

static inline void
cw_str_putc (GString *s, char c)
{
  if (s->len + 1 < s->allocated_len)
    {
      s->str[s->len++] = c;
      s->str[s->len] = '\0';
    }
  else
    g_string_append_c (s, c);
}

G_END_DECLS
