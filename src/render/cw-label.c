#include "config.h"

#include "cw-label.h"

#include <math.h>
#include <string.h>

#include "cw-render-private.h"

/* One unit of a formula-like label: a symbol with its subscript, or a bond sign. */
typedef struct
{
  GString *text;
} Unit;

static gboolean
starts_with (const char *p, const char *prefix)
{
  return strncmp (p, prefix, strlen (prefix)) == 0;
}

/* Reads "<tag>…</tag>" at p into *inner; returns the end or NULL. */
static const char *
read_tag (const char *p, const char *tag, GString *inner)
{
  g_autofree char *open = g_strdup_printf ("<%s>", tag);
  g_autofree char *close = g_strdup_printf ("</%s>", tag);
  const char      *end;

  if (!starts_with (p, open))
    return NULL;
  p += strlen (open);
  end = strstr (p, close);
  if (end == NULL)
    return NULL;
  g_string_append_len (inner, p, end - p);
  return end + strlen (close);
}

static gboolean
tokenize (const char *p, GPtrArray *units, GString *sup)
{
  while (*p)
    {
      if (g_ascii_isupper (*p))
        {
          GString *u = g_string_new (NULL);
          g_string_append_c (u, *p++);
          while (g_ascii_islower (*p))
            g_string_append_c (u, *p++);
          g_ptr_array_add (units, u);
        }
      else if (starts_with (p, "<sub>") && units->len > 0)
        {
          GString *u = g_ptr_array_index (units, units->len - 1);
          GString *inner = g_string_new (NULL);

          p = read_tag (p, "sub", inner);
          if (p != NULL)
            g_string_append_printf (u, "<sub>%s</sub>", inner->str);
          g_string_free (inner, TRUE);
          if (p == NULL)
            return FALSE;
        }
      else if (starts_with (p, "<sup>"))
        {
          GString *inner = g_string_new (NULL);

          p = read_tag (p, "sup", inner);
          g_string_append (sup, inner->str);
          g_string_free (inner, TRUE);
          if (p == NULL)
            return FALSE;
        }
      else if (*p == '=' || starts_with (p, "≡"))
        {
          int n = *p == '=' ? 1 : (int) strlen ("≡");
          g_ptr_array_add (units, g_string_new_len (p, n));
          p += n;
        }
      else
        return FALSE;
    }
  return units->len > 0;
}

static void
string_free (gpointer s)
{
  g_string_free (s, TRUE);
}

char *
cw_label_reverse_markup (const char *markup)
{
  g_autoptr (GPtrArray) units = g_ptr_array_new_with_free_func (string_free);
  g_autoptr (GString) sup = g_string_new (NULL);
  GString *out;

  if (!tokenize (markup, units, sup))
    return NULL;
  if (units->len == 1)
    return g_strdup (markup);
  /* A two-atom label read backwards names another group (CN → NC, the isocyanide):
   * spell out the triple bond instead. */
  if (units->len == 2 && sup->len == 0 &&
      (strcmp (markup, "CN") == 0 || strcmp (markup, "NC") == 0))
    return g_strdup (strcmp (markup, "CN") == 0 ? "N≡C" : "C≡N");
  /* A charge stays with its atom: on the attachment atom (H₃N⁺) it ends the reversed label,
   * on a far atom (⁻O₂C) it starts it. */
  GString *first = g_ptr_array_index (units, 0);
  gboolean charge_on_first = first->str[0] == 'N' && first->len == 1;
  out = g_string_new (NULL);
  if (sup->len > 0 && !charge_on_first)
    g_string_append_printf (out, "<sup>%s</sup>", sup->str);
  for (guint i = units->len; i > 0; i--)
    g_string_append (out, ((GString *) g_ptr_array_index (units, i - 1))->str);
  if (sup->len > 0 && charge_on_first)
    g_string_append_printf (out, "<sup>%s</sup>", sup->str);
  return g_string_free (out, FALSE);
}

/* Byte range of the first (or last) element symbol in plain text. */
static void
find_atom (const char *plain, gboolean last, int *start, int *end)
{
  int n = (int) strlen (plain);
  int s = -1;

  if (!last)
    {
      if (n > 0 && g_ascii_isupper (plain[0]))
        s = 0;
    }
  else
    {
      for (int i = n - 1; i >= 0; i--)
        if (g_ascii_isupper (plain[i]))
          {
            s = i;
            break;
          }
    }
  if (s < 0)
    {
      *start = 0;
      *end = n; /* not a formula: the whole label is the attachment point */
      return;
    }
  *start = s;
  *end = s + 1;
  while (*end < n && g_ascii_islower (plain[*end]))
    (*end)++;
}

void
cw_label_text_init (CwLabelText *lt, const char *markup, gboolean reversed)
{
  g_autofree char *rev = reversed ? cw_label_reverse_markup (markup) : NULL;
  g_autofree char *plain = NULL;

  lt->markup = g_strdup (rev ? rev : markup);
  plain = cw_markup_dup_plain (lt->markup);
  if (reversed && rev == NULL)
    {
      lt->atom_start = 0;
      lt->atom_end = (int) strlen (plain);
    }
  else
    find_atom (plain, rev != NULL, &lt->atom_start, &lt->atom_end);
}

void
cw_label_text_clear (CwLabelText *lt)
{
  g_clear_pointer (&lt->markup, g_free);
}

void
cw_label_place (const char *markup, double size, double px, double py, double dx, double dy, double length, CwLabelPlace *out, CwLabelText *text_out)
{
  CwTextMetrics m;
  double        hw, hh, t;
  /* Cap height of the font, about 0.73 em: the atom's centre is half of it above the baseline. */
  double cap = 0.73 * size;
  double pad = 0.18 * size;

  out->reversed = dx < -0.35;
  cw_label_text_init (text_out, markup, out->reversed);
  cw_text_measure (text_out->markup, size, FALSE, 0, text_out->atom_start, text_out->atom_end, &m);
  out->ax = px + dx * length;
  out->ay = py + dy * length;
  out->box.x = out->ax - 0.5 * (m.atom_x0 + m.atom_x1);
  out->box.y = out->ay - (m.baseline - 0.5 * cap);
  out->box.w = m.w;
  out->box.h = m.h;
  hw = 0.5 * (m.atom_x1 - m.atom_x0) + pad;
  hh = 0.5 * cap + pad;
  t = MIN (fabs (dx) > 1e-9 ? hw / fabs (dx) : G_MAXDOUBLE, fabs (dy) > 1e-9 ? hh / fabs (dy) : G_MAXDOUBLE);
  t = MIN (t, length * 0.8);
  out->ex = out->ax - dx * t;
  out->ey = out->ay - dy * t;
}

CwPrim *
cw_label_add (CwScene *scene, const CwLabelText *lt, const CwLabelPlace *place, double size, CwRole role, CwInk ink, gboolean bold)
{
  CwPrim *p = cw_scene_add (scene, CW_PRIM_TEXT, role, ink);

  p->markup = g_strdup (lt->markup);
  p->size = size;
  p->bold = bold;
  p->box = place->box;
  return p;
}
