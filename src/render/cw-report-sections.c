#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-render-nmr.h"
#include "cw-report-private.h"

/* The report's sections beyond the conformational analysis: the document's notes, predicted
 * vicinal couplings and reaction geometry. All text goes into the page scene, measured. */

#define COL_GAP 12.0

/* ---- notes ---- */

static char *
collapse_space (const char *text)
{
  g_autoptr (GRegex) re = g_regex_new ("\\s+", 0, 0, NULL);
  g_autofree char *s = g_regex_replace_literal (re, text, -1, 0, " ", 0, NULL);

  return g_strdup (g_strstrip (s));
}

static gboolean
fits (const char *markup, double size, double width, double max_h)
{
  CwTextMetrics m;

  cw_text_measure (markup, size, FALSE, width, 0, 0, &m);
  return m.h <= max_h;
}

static char *
cut_markup (const char *prefix, const char *plain, glong n_chars, gboolean ellipsis)
{
  const char      *end = g_utf8_offset_to_pointer (plain, n_chars);
  g_autofree char *head = g_strndup (plain, end - plain);
  g_autofree char *esc = NULL;

  if (ellipsis)
    {
      /* Back to the last word boundary, so no word is cut in half. */
      char *space = strrchr (head, ' ');

      if (space != NULL && space != head)
        *space = '\0';
      g_strchomp (head);
    }
  esc = g_markup_escape_text (head, -1);
  return g_strconcat (prefix, esc, ellipsis ? "…" : "", NULL);
}

char *
cw_report_dup_truncated (const char *prefix, const char *text, double size, double width, int max_lines)
{
  g_autofree char *plain = collapse_space (text ? text : "");
  glong            n = g_utf8_strlen (plain, -1), lo = 0, hi = n;
  CwTextMetrics    line;
  double           max_h;
  char            *full = cut_markup (prefix, plain, n, FALSE);

  cw_text_measure (prefix[0] ? prefix : "Ag", size, FALSE, 0, 0, 0, &line);
  max_h = (max_lines + 0.5) * line.h;
  if (fits (full, size, width, max_h))
    return full;
  g_free (full);
  /* The longest head that still fits with its ellipsis. */
  while (lo < hi)
    {
      glong            mid = (lo + hi + 1) / 2;
      g_autofree char *m = cut_markup (prefix, plain, mid, TRUE);

      if (fits (m, size, width, max_h))
        lo = mid;
      else
        hi = mid - 1;
    }
  return cut_markup (prefix, plain, lo, TRUE);
}

double
cw_report_notes (CwReport *r, const char *notes)
{
  g_autofree char *prefix = NULL, *markup = NULL;

  if (notes == NULL || *notes == '\0' || strspn (notes, " \t\r\n") == strlen (notes))
    return 0;
  prefix = g_strdup_printf ("<b>%s</b> ", _("Notes."));
  markup = cw_report_dup_truncated (prefix, notes, r->body, r->w, 2);
  return cw_report_para (r, markup, r->body, CW_INK_TEXT, r->y);
}

/* ---- couplings ---- */

static char *
header_cell (const CwCouplings *c, int column, CwTemperatureUnit tunit)
{
  g_autofree char *p = NULL;
  g_autofree char *t = NULL;

  switch (column)
    {
    case 0:
      return g_strdup (_("Proton"));
    case 1:
    case 2:
      p = cw_render_format_percent (c->pop[column - 1]);
      return g_strdup_printf (_("Chair %d (%s %%)"), column, p);
    default:
      t = cw_format_temperature (c->temperature, tunit);
      return g_strdup_printf (_("Averaged at %s"), t);
    }
}

static char *
body_cell (const CwCouplings *c, int proton, int column)
{
  const CwRingProton *p = &c->protons[proton];
  g_autofree char    *label = NULL;

  if (column > 0)
    return cw_render_couplings_dup_cell (p, column - 1);
  label = cw_ring_proton_dup_label (p);
  return g_markup_escape_text (label, -1);
}

static char *
cell_at (const CwCouplings *c, int row, int column, CwTemperatureUnit tunit)
{
  return row == 0 ? header_cell (c, column, tunit) : body_cell (c, row - 1, column);
}

static char *
karplus_refs (CwReport *r, const CwCouplings *c)
{
  GString *s = g_string_new (NULL);
  int      seen[CW_KARPLUS_MAX_SETS + 1] = { 0 };
  int      n = 0;

  for (int i = 0; i < c->n_vicinal; i++)
    {
      int      ref = c->vicinal[i].set ? cw_report_source_ref (r, c->vicinal[i].set->source) : 0;
      gboolean dup = FALSE;

      for (int k = 0; k < n; k++)
        dup |= seen[k] == ref;
      if (ref > 0 && !dup && n < CW_KARPLUS_MAX_SETS)
        {
          g_string_append_printf (s, "%s%d", n ? ", " : "", ref);
          seen[n++] = ref;
        }
    }
  return g_string_free (s, FALSE);
}

static double
couplings_legend (CwReport *r, const CwCouplings *c, double y, double size)
{
  int              ref = cw_report_source_ref (r, c->geminal_source);
  g_autofree char *refs = ref > 0 ? g_strdup_printf (" [%d]", ref) : g_strdup ("");
  g_autofree char *text = g_strdup_printf (_("Hz. ax/eq: the proton's bond in that chair; Σ: the width, the sum of "
                                             "its vicinal couplings. First-order multiplets, with ²J = %s%.0f Hz%s "
                                             "for CH₂ protons; averages weighted by the chair populations."),
                                              c->geminal < 0 ? "−" : "", fabs (c->geminal), refs);

  return cw_report_para (r, text, size, CW_INK_MUTED, y);
}

double
cw_report_couplings (CwReport *r, const CwCouplings *c, const char *error)
{
  double           y = r->y, size = r->body, colw[4] = { 0 }, total = 0, x, row_h;
  g_autofree char *refs = c ? karplus_refs (r, c) : NULL;
  g_autofree char *title = g_strdup_printf (_("Predicted vicinal couplings ³<i>J</i>(H,H)%s%s%s"),
                                               refs && *refs ? " [" : "", refs ? refs : "", refs && *refs ? "]" : "");

  y += cw_report_heading (r, title);
  if (c == NULL)
    {
      g_autofree char *msg = g_markup_printf_escaped (_("Not available: %s"), error ? error : "");
      return y + cw_report_para (r, msg, size, CW_INK_TEXT, y) - r->y;
    }
  if (c->n_protons == 0)
    return y + cw_report_para (r, _("No ring protons: every ring position carries a group."), size, CW_INK_TEXT, y) - r->y;
  for (int row = 0; row <= c->n_protons; row++)
    for (int col = 0; col < 4; col++)
      {
        g_autofree char *m = cell_at (c, row, col, r->tunit);
        CwTextMetrics    tm;

        cw_text_measure (m, size, row == 0, 0, 0, 0, &tm);
        colw[col] = MAX (colw[col], tm.w);
      }
  for (int col = 0; col < 4; col++)
    total += colw[col] + (col ? COL_GAP : 0);
  if (total > r->w)
    {
      /* Text width goes with the size: shrink the table to the column rather than wrap cells. */
      double s = r->w / total;

      size *= s;
      for (int col = 0; col < 4; col++)
        colw[col] *= s;
    }
  for (int row = 0; row <= c->n_protons; row++)
    {
      x = r->x;
      row_h = 0;
      for (int col = 0; col < 4; col++)
        {
          g_autofree char *m = cell_at (c, row, col, r->tunit);
          CwInk            ink = row == 0 && col == 1 ? CW_INK_SERIES_1 : row == 0 && col == 2 ? CW_INK_SERIES_2
                                                                                               : CW_INK_TEXT;
          CwPrim          *p = cw_scene_text (r->page, CW_ROLE_CAPTION, ink, m, size, row == 0, x, y);

          row_h = MAX (row_h, p->box.h);
          x += colw[col] + COL_GAP;
        }
      y += row_h;
      if (row == 0)
        {
          cw_scene_line (r->page, CW_ROLE_NONE, CW_INK_GRID, r->x, y + 0.5, r->x + r->w, y + 0.5, 0.6);
          y += 1.5;
        }
    }
  y += 1;
  y += couplings_legend (r, c, y, MAX (r->small, size - 1));
  return y - r->y;
}

/* ---- reaction geometry ---- */

static char *
sub_markup (const CwMolecule *mol, int sub)
{
  if (sub < 0 || sub >= mol->n_subs)
    return g_strdup ("?");
  return g_strdup_printf (_("%s on C%d"), mol->subs[sub].group->markup, mol->subs[sub].position);
}

/* "both chairs", "chair 1" or "chair 2" for a per-chair flag pair with at least one set. */
static const char *
chairs_word (const gboolean ok[2])
{
  if (ok[0] && ok[1])
    return _("both chairs");
  return ok[0] ? _("chair 1") : _("chair 2");
}

static void
append_chair (GString *s, const CwLeavingGroup *lg, int ch)
{
  g_string_append_printf (s, _("chair %d: %s, "), ch + 1, lg->axial[ch] ? _("axial") : _("equatorial"));
  if (lg->n_anti[ch] == 0)
    g_string_append (s, _("no anti-periplanar β-H"));
  for (int i = 0; i < lg->n_anti[ch] && i < 2; i++)
    {
      const CwAntiHydrogen *h = &lg->anti[ch][i];
      const char           *face = h->face == CW_FACE_UP ? _("up") : _("down");

      g_string_append (s, i == 0 ? _("anti-periplanar β-H: ") : ", ");
      g_string_append_printf (s, "%s-%d %s", h->deuterium ? "D" : "H", h->position, face);
    }
}

static void
append_alkenes (GString *s, const CwLeavingGroup *lg, const CwMolecule *mol)
{
  int least = G_MAXINT;

  if (lg->n_alkenes == 0)
    {
      g_string_append (s, _(" · no E2 alkene by the anti pathway"));
      return;
    }
  for (int k = 0; k < lg->n_alkenes; k++)
    least = MIN (least, lg->alkenes[k].substitution);
  g_string_append (s, lg->n_alkenes > 1 ? _(" · E2 alkenes: ") : _(" · E2 alkene: "));
  for (int k = 0; k < lg->n_alkenes; k++)
    {
      const CwAlkene  *al = &lg->alkenes[k];
      g_autofree char *label = cw_alkene_dup_label (al, mol);
      g_autofree char *esc = g_markup_escape_text (label, -1);
      /* "the more substituted" only where some other alkene is less so (not for a tie). */
      gboolean more = al->most_substituted && al->substitution > least;

      g_string_append_printf (s, "%s%s%s%s, %s %s", k ? "; " : "", more ? "<b>" : "", esc,
                              more ? _(", the more substituted</b>") : "", _("from"), chairs_word (al->chair_ok));
    }
}

static double
leaving_group (CwReport *r, const CwMolecule *mol, const CwReactivity *re, const CwLeavingGroup *lg, double y)
{
  g_autofree char *name = sub_markup (mol, lg->sub);
  g_autofree char *frac = cw_render_format_percent (lg->reactive_fraction);
  g_autofree char *t = cw_format_temperature (re->temperature, r->tunit);
  GString         *s = g_string_new (NULL);
  double           h;

  g_string_append_printf (s, "<b>%s</b> · ", name);
  append_chair (s, lg, 0);
  g_string_append (s, " · ");
  append_chair (s, lg, 1);
  g_string_append_printf (s, _(" · in a reactive chair at %s: <b>%s %%</b>"), t, frac);
  append_alkenes (s, lg, mol);
  h = cw_report_para (r, s->str, r->body, CW_INK_TEXT, y);
  g_string_free (s, TRUE);
  return h;
}

static const char *
pair_role (CwAntiPairRole role)
{
  switch (role)
    {
    case CW_ANTI_PARTICIPATION:
      return _("neighbouring-group participation");
    case CW_ANTI_ELIMINATION_XY:
      return _("anti elimination of both groups");
    case CW_ANTI_PAIR:
    default:
      return _("vicinal heteroatom pair");
    }
}

static double
anti_pair (CwReport *r, const CwMolecule *mol, const CwAntiPair *p, double y)
{
  g_autofree char *a = sub_markup (mol, p->sub_a);
  g_autofree char *b = sub_markup (mol, p->sub_b);
  g_autofree char *frac = cw_render_format_percent (p->fraction);
  g_autofree char *where = NULL, *m = NULL;

  if (p->anti[0] || p->anti[1])
    where = g_strdup_printf (_("anti-periplanar in %s (%s %% of molecules)"), chairs_word (p->anti), frac);
  else
    where = g_strdup (_("anti-periplanar in neither chair"));
  m = g_strdup_printf ("<b>%s / %s</b> (%s): %s", a, b, pair_role (p->role), where);
  return cw_report_para (r, m, r->body, CW_INK_TEXT, y);
}

double
cw_report_reactivity (CwReport *r, const CwMolecule *mol, const CwReactivity *re, const char *error)
{
  double y = r->y;

  y += cw_report_heading (r, _("Reaction geometry (anti-periplanar E2)"));
  if (re == NULL)
    {
      g_autofree char *msg = g_markup_printf_escaped (_("Not available: %s"), error ? error : "");
      return y + cw_report_para (r, msg, r->body, CW_INK_TEXT, y) - r->y;
    }
  for (int g = 0; g < re->n_groups; g++)
    y += leaving_group (r, mol, re, &re->groups[g], y) + 1.5;
  for (int i = 0; i < re->n_pairs; i++)
    y += anti_pair (r, mol, &re->pairs[i], y) + 1.5;
  for (int i = 0; i < re->n_warnings; i++)
    {
      g_autofree char *msg = cw_react_warning_dup_message (&re->warnings[i], mol);
      g_autofree char *m = g_markup_printf_escaped ("⚠ %s", msg ? msg : "");

      y += cw_report_para (r, m, r->body, CW_INK_TEXT, y) + 1.5;
    }
  if (re->n_groups > 0)
    y += cw_report_para (r, _("Reactive chair: one with a β-H anti-periplanar to the leaving group. With fast ring "
                              "inversion (Curtin–Hammett) the E2 rate goes with the fraction of molecules in such "
                              "chairs, taking equal rate constants for them."),
                               MAX (r->small, r->body - 1), CW_INK_MUTED, y);
  return y - r->y;
}
