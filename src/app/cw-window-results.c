#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-window-private.h"

#define N_COLUMNS 4

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

/* ---- flags ------------------------------------------------------------------------- */

static GtkWidget *
flag_row (CwWindow *self,
          guint     i)
{
  GtkWidget *row, *icon, *label;

  if (i < self->flag_rows->len)
    return g_ptr_array_index (self->flag_rows, i);
  /* A grid, not a horizontal box: a box asks its wrapping label for its width at the
   * row's height, which GtkLabel answers by laying the text out again and again (a
   * binary search over widths, 20 ms and more for one new flag); the grid asks for
   * widths first and heights for them after, as the label is laid out anyway. */
  row = gtk_grid_new ();
  icon = gtk_image_new ();
  label = gtk_label_new (NULL);
  gtk_grid_set_column_spacing (GTK_GRID (row), 8);
  gtk_widget_add_css_class (row, "cw-flag");
  gtk_widget_set_valign (icon, GTK_ALIGN_START);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_xalign (GTK_LABEL (label), 0.0f);
  gtk_widget_set_hexpand (label, TRUE);
  gtk_grid_attach (GTK_GRID (row), icon, 0, 0, 1, 1);
  gtk_grid_attach (GTK_GRID (row), label, 1, 0, 1, 1);
  gtk_box_append (self->flags_box, row);
  g_ptr_array_add (self->flag_rows, row);
  return row;
}

static void
update_flags (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  CwEnergyUnit      unit = cw_window_get_energy_unit (self);
  int               n = self->an_valid ? self->an.n_flags : 0;

  for (int i = 0; i < n; i++)
    {
      gboolean         info = flag_is_info (self->an.flags[i].code);
      g_autofree char *msg = cw_flag_dup_message (&self->an.flags[i], mol, unit);
      GtkWidget       *row = flag_row (self, i);
      GtkWidget       *icon = gtk_widget_get_first_child (row);
      GtkWidget       *label = gtk_widget_get_next_sibling (icon);
      const char      *icon_name = info ? "dialog-information-symbolic" : "dialog-warning-symbolic";

      set_css_class (row, "cw-info", info);
      /* Setting the same icon again would still make the image measure and draw anew. */
      if (g_strcmp0 (gtk_image_get_icon_name (GTK_IMAGE (icon)), icon_name) != 0)
        {
          gtk_image_set_from_icon_name (GTK_IMAGE (icon), icon_name);
          gtk_accessible_update_property (GTK_ACCESSIBLE (icon), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                          info ? _("Note") : _("Warning"), -1);
        }
      gtk_label_set_text (GTK_LABEL (label), msg);
      gtk_widget_set_visible (row, TRUE);
    }
  for (guint i = n; i < self->flag_rows->len; i++)
    gtk_widget_set_visible (g_ptr_array_index (self->flag_rows, i), FALSE);
  gtk_widget_set_visible (GTK_WIDGET (self->flags_box), n > 0);
}

/* ---- terms table -------------------------------------------------------------------- */

static gboolean
source_tooltip_cb (GtkWidget  *widget,
                   int         x,
                   int         y,
                   gboolean    keyboard,
                   GtkTooltip *tooltip,
                   gpointer    user_data)
{
  const char *text = gtk_label_get_text (GTK_LABEL (widget));

  if (text == NULL || *text == '\0')
    return FALSE;
  gtk_tooltip_set_text (tooltip, text);
  return TRUE;
}

static GtkLabel *
term_cell (CwWindow *self,
           guint     row,
           guint     col)
{
  while (self->term_cells->len < (row + 1) * N_COLUMNS)
    {
      guint      r = self->term_cells->len / N_COLUMNS, c = self->term_cells->len % N_COLUMNS;
      GtkWidget *label = gtk_label_new (NULL);

      gtk_label_set_xalign (GTK_LABEL (label), c == 1 || c == 2 ? 1.0f : 0.0f);
      if (c == 1 || c == 2)
        gtk_widget_add_css_class (label, "cw-terms-value");
      if (c == 3)
        {
          gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
          gtk_label_set_max_width_chars (GTK_LABEL (label), 48);
          gtk_widget_set_hexpand (label, TRUE);
          gtk_widget_add_css_class (label, "dim-label");
        }
      if (c == 3)
        g_signal_connect (label, "query-tooltip", G_CALLBACK (source_tooltip_cb), NULL);
      gtk_grid_attach (self->terms_grid, label, c, r, 1, 1);
      g_ptr_array_add (self->term_cells, label);
    }
  return g_ptr_array_index (self->term_cells, row * N_COLUMNS + col);
}

static void
set_row (CwWindow   *self,
         guint       row,
         const char *texts[N_COLUMNS],
         gboolean    heading)
{
  for (guint c = 0; c < N_COLUMNS; c++)
    {
      GtkLabel *label = term_cell (self, row, c);

      gtk_label_set_text (label, texts[c] ? texts[c] : "");
      set_css_class (GTK_WIDGET (label), "cw-terms-header", heading);
      if (c == 3)
        {
          /* The full source (the cell may be ellipsized), answered on demand in
           * source_tooltip_cb: setting tooltip texts costs an X round trip each. */
          set_css_class (GTK_WIDGET (label), "dim-label", !heading);
          gtk_widget_set_has_tooltip (GTK_WIDGET (label), !heading);
        }
      gtk_widget_set_visible (GTK_WIDGET (label), TRUE);
    }
}

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

static void
term_row (CwWindow     *self,
          guint         row,
          const CwTerm *t1,
          const CwTerm *t2)
{
  const CwTerm    *t = t1 ? t1 : t2;
  CwEnergyUnit     unit = cw_window_get_energy_unit (self);
  g_autofree char *label = cw_term_dup_label (t, cw_document_peek_molecule (self->doc));
  g_autofree char *e1 = t1 ? g_strdup_printf ("%.2f", cw_energy_from_kcal (t1->energy, unit)) : g_strdup ("–");
  g_autofree char *e2 = t2 ? g_strdup_printf ("%.2f", cw_energy_from_kcal (t2->energy, unit)) : g_strdup ("–");
  const char      *src = t->source ? t->source : "";
  /* Estimated terms say so; the table's own fall-back text may already begin with it. */
  g_autofree char *source = t->estimated && g_ascii_strncasecmp (src, "estimate", 8) != 0
    ? g_strdup_printf (_("estimate: %s"), src)
    : g_strdup (src);
  const char *texts[N_COLUMNS] = { label, e1, e2, source };

  set_row (self, row, texts, FALSE);
}

static void
update_terms (CwWindow *self)
{
  CwEnergyUnit     unit = cw_window_get_energy_unit (self);
  g_autofree char *h1 = NULL, *h2 = NULL, *tot1 = NULL, *tot2 = NULL;
  guint            row = 1;

  if (self->an_valid)
    {
      /* TRANSLATORS: column header: energy of a term in chair 1, with the unit */
      h1 = g_strdup_printf (_("Chair 1 (%s)"), cw_energy_unit_symbol (unit));
      h2 = g_strdup_printf (_("Chair 2 (%s)"), cw_energy_unit_symbol (unit));
      set_row (self, 0, (const char *[N_COLUMNS]){ _("Term"), h1, h2, _("Source") }, TRUE);

      for (int i = 0; i < self->an.chair[0].n_terms; i++)
        {
          const CwTerm *t = &self->an.chair[0].terms[i];
          term_row (self, row++, t, find_term (&self->an.chair[1], t));
        }
      for (int i = 0; i < self->an.chair[1].n_terms; i++)
        {
          const CwTerm *t = &self->an.chair[1].terms[i];
          if (find_term (&self->an.chair[0], t) == NULL)
            term_row (self, row++, NULL, t);
        }
      if (row == 1)
        set_row (self, row++, (const char *[N_COLUMNS]){ _("No axial groups"), "–", "–", "" }, FALSE);
      tot1 = g_strdup_printf ("%.2f", cw_energy_from_kcal (self->an.chair[0].energy, unit));
      tot2 = g_strdup_printf ("%.2f", cw_energy_from_kcal (self->an.chair[1].energy, unit));
      set_row (self, row++, (const char *[N_COLUMNS]){ _("Total"), tot1, tot2, "" }, TRUE);
    }
  else
    row = 0;
  for (guint i = row * N_COLUMNS; i < self->term_cells->len; i++)
    gtk_widget_set_visible (g_ptr_array_index (self->term_cells, i), FALSE);
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

      gtk_label_set_text (self->summary_label, msg);
      gtk_label_set_text (self->pop1_label, "");
      gtk_label_set_text (self->pop2_label, "");
      return;
    }
  p1 = format_population (1, an->pop[0], an->pop_low[0], an->pop_high[0]);
  p2 = format_population (2, an->pop[1], an->pop_low[1], an->pop_high[1]);
  gtk_label_set_text (self->pop1_label, p1);
  gtk_label_set_text (self->pop2_label, p2);
  set_css_class (GTK_WIDGET (self->pop1_label), "cw-major", an->pop[0] > an->pop[1] + 1e-9);
  set_css_class (GTK_WIDGET (self->pop2_label), "cw-major", an->pop[1] > an->pop[0] + 1e-9);

  t = cw_format_temperature (an->temperature, cw_window_get_temperature_unit (self));
  kstr = (an->K >= 1e4 || an->K < 1e-3) ? g_strdup_printf ("%.2e", an->K) : g_strdup_printf ("%.3g", an->K);
  /* TRANSLATORS: the result line: ΔG°, its uncertainty, unit, temperature, equilibrium constant */
  text = g_strdup_printf (_("ΔG° = G(chair 2) − G(chair 1) = %+.2f ± %.2f %s at %s;  K = %s"),
                             cw_energy_from_kcal (an->delta_g, unit), cw_energy_from_kcal (an->sigma, unit),
                             cw_energy_unit_symbol (unit), t, kstr);
  gtk_label_set_text (self->summary_label, text);
  /* Screen readers get the result with the drawing it belongs to. */
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->chairs_area), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, text, -1);
}

void
cw_window_update_results (CwWindow *self)
{
  update_summary (self);
  update_terms (self);
  update_flags (self);
}
