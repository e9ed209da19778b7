#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-window-private.h"

/* Flags that explain rather than warn. */
static gboolean
flag_is_info (CwFlagCode code)
{
  switch (code)
    {
    case CW_FLAG_IDENTICAL_CHAIRS:
    case CW_FLAG_MIRROR_CHAIRS:
    case CW_FLAG_CONSTANT_A:
    case CW_FLAG_CUSTOM_GROUP:
    case CW_FLAG_NO_SUBSTITUENTS:
      return TRUE;
    case CW_FLAG_TWIST_BOAT:
    case CW_FLAG_POLAR_VICINAL:
    case CW_FLAG_DIHALIDE_1_4:
    case CW_FLAG_GEMINAL_NONADDITIVE:
    case CW_FLAG_HBOND_1_3:
    case CW_FLAG_ESTIMATED_TERM:
    case CW_FLAG_SOLVENT_SENSITIVE:
    case CW_N_FLAGS:
    default:
      return FALSE;
    }
}

static void
set_css_class (GtkWidget  *widget,
               const char *css,
               gboolean    on)
{
  if (on)
    gtk_widget_add_css_class (widget, css);
  else
    gtk_widget_remove_css_class (widget, css);
}

/* ---- terms table -------------------------------------------------------------------- */

static const CwTerm *
find_term (const CwChair *chair,
           const CwTerm  *t)
{
  for (int i = 0; i < chair->n_terms; i++)
    {
      const CwTerm *u = &chair->terms[i];

      if (u->kind == t->kind && u->sub_a == t->sub_a && u->sub_b == t->sub_b)
        return u;
    }
  return NULL;
}

/* The rows' texts, kept until the table has taken them. */
typedef struct
{
  GArray    *rows;  /* CwSheetRow */
  GPtrArray *texts; /* char *, freed with the table */
} TermRows;

static void
add_row (TermRows   *t,
         gboolean    heading,
         const char *c0,
         const char *c1,
         const char *c2,
         const char *c3)
{
  CwSheetRow row = { { c0, c1, c2, c3 }, heading };

  g_array_append_val (t->rows, row);
}

static const char *
keep (TermRows *t,
      char     *text)
{
  g_ptr_array_add (t->texts, text);
  return text;
}

static void
term_row (CwWindow     *self,
          TermRows     *rows,
          const CwTerm *t1,
          const CwTerm *t2)
{
  const CwTerm *t = t1 ? t1 : t2;
  CwEnergyUnit  unit = cw_window_get_energy_unit (self);
  const char   *src = t->source ? t->source : "";
  const char   *label = keep (rows, cw_term_dup_label (t, cw_document_peek_molecule (self->doc)));
  const char   *e1 = t1 ? keep (rows, g_strdup_printf ("%.2f", cw_energy_from_kcal (t1->energy, unit))) : "–";
  const char   *e2 = t2 ? keep (rows, g_strdup_printf ("%.2f", cw_energy_from_kcal (t2->energy, unit))) : "–";
  /* Estimated terms say so; the table's own fall-back text may already begin with it. */
  const char *source = t->estimated && g_ascii_strncasecmp (src, "estimate", 8) != 0
    ? keep (rows, g_strdup_printf (_("estimate: %s"), src))
    : src;

  add_row (rows, FALSE, label, e1, e2, source);
}

/* The flags and the terms table, one sheet. */
static void
update_sheet (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  CwEnergyUnit      unit = cw_window_get_energy_unit (self);
  TermRows          rows = { g_array_new (FALSE, FALSE, sizeof (CwSheetRow)), g_ptr_array_new_with_free_func (g_free) };
  int               n_flags = self->an_valid ? self->an.n_flags : 0;
  CwSheetFlag       flags[CW_MAX_FLAGS];

  for (int i = 0; i < n_flags; i++)
    {
      flags[i].text = keep (&rows, cw_flag_dup_message (&self->an.flags[i], mol, unit));
      flags[i].info = flag_is_info (self->an.flags[i].code);
    }
  if (self->an_valid)
    {
      /* TRANSLATORS: column header: energy of a term in chair 1, with the unit */
      add_row (&rows, TRUE, _("Term"), keep (&rows, g_strdup_printf (_("Chair 1 (%s)"), cw_energy_unit_symbol (unit))),
               keep (&rows, g_strdup_printf (_("Chair 2 (%s)"), cw_energy_unit_symbol (unit))), _("Source"));
      for (int i = 0; i < self->an.chair[0].n_terms; i++)
        {
          const CwTerm *t = &self->an.chair[0].terms[i];
          term_row (self, &rows, t, find_term (&self->an.chair[1], t));
        }
      for (int i = 0; i < self->an.chair[1].n_terms; i++)
        {
          const CwTerm *t = &self->an.chair[1].terms[i];
          if (find_term (&self->an.chair[0], t) == NULL)
            term_row (self, &rows, NULL, t);
        }
      if (rows.rows->len == 1)
        add_row (&rows, FALSE, _("No axial groups"), "–", "–", "");
      add_row (&rows, TRUE, _("Total"),
               keep (&rows, g_strdup_printf ("%.2f", cw_energy_from_kcal (self->an.chair[0].energy, unit))),
               keep (&rows, g_strdup_printf ("%.2f", cw_energy_from_kcal (self->an.chair[1].energy, unit))), "");
    }
  cw_result_sheet_set_content (self->result_sheet, flags, n_flags, (const CwSheetRow *) (void *) rows.rows->data,
                               rows.rows->len);
  g_array_unref (rows.rows);
  g_ptr_array_unref (rows.texts);
}

/* ---- summary -------------------------------------------------------------------------- */

static char *
format_population (int    chair,
                   double pop,
                   double low,
                   double high)
{
  double lo = MIN (low, high) * 100.0, hi = MAX (low, high) * 100.0;

  /* TRANSLATORS: "Chair 1: 95.0 % (93.1–96.4 %)"; the interval is for ΔG° ± 2σ */
  return g_strdup_printf (_("Chair %d: %.1f %% (%.1f–%.1f %%)"), chair, pop * 100.0, lo, hi);
}

static void
update_summary (CwWindow *self)
{
  CwEnergyUnit      unit = cw_window_get_energy_unit (self);
  g_autofree char  *p1 = NULL, *p2 = NULL, *t = NULL, *text = NULL, *kstr = NULL;
  const CwAnalysis *an = &self->an;

  set_css_class (GTK_WIDGET (self->summary_label), "cw-error", !self->an_valid);
  if (!self->an_valid)
    {
      g_autofree char *msg = g_strdup_printf (_("No result: %s"), self->analysis_error ? self->analysis_error : "");

      cw_steady_label_set_text (self->summary_label, msg);
      cw_steady_label_set_text (self->pop1_label, "");
      cw_steady_label_set_text (self->pop2_label, "");
      return;
    }
  p1 = format_population (1, an->pop[0], an->pop_low[0], an->pop_high[0]);
  p2 = format_population (2, an->pop[1], an->pop_low[1], an->pop_high[1]);
  cw_steady_label_set_text (self->pop1_label, p1);
  cw_steady_label_set_text (self->pop2_label, p2);
  /* The major chair's population in bold. */
  cw_steady_label_set_bold (self->pop1_label, an->pop[0] > an->pop[1] + 1e-9);
  cw_steady_label_set_bold (self->pop2_label, an->pop[1] > an->pop[0] + 1e-9);

  t = cw_format_temperature (an->temperature, cw_window_get_temperature_unit (self));
  kstr = (an->K >= 1e4 || an->K < 1e-3) ? g_strdup_printf ("%.2e", an->K) : g_strdup_printf ("%.3g", an->K);
  /* TRANSLATORS: the result line: ΔG°, its uncertainty, unit, temperature, equilibrium constant */
  text = g_strdup_printf (_("ΔG° = G(chair 2) − G(chair 1) = %+.2f ± %.2f %s at %s;  K = %s"),
                             cw_energy_from_kcal (an->delta_g, unit), cw_energy_from_kcal (an->sigma, unit),
                             cw_energy_unit_symbol (unit), t, kstr);
  cw_steady_label_set_text (self->summary_label, text);
  /* Screen readers get the result with the drawing it belongs to. */
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->chairs_area), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, text, -1);
}

void
cw_window_update_results (CwWindow *self)
{
  update_summary (self);
  update_sheet (self);
}
