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
clear_children (GtkWidget *parent)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (parent)) != NULL)
    gtk_widget_unparent (child);
}

static void
update_flags (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  CwEnergyUnit unit = cw_window_get_energy_unit (self);

  clear_children (GTK_WIDGET (self->flags_box));
  for (int i = 0; self->an_valid && i < self->an.n_flags; i++)
    {
      gboolean info = flag_is_info (self->an.flags[i].code);
      g_autofree char *msg = cw_flag_dup_message (&self->an.flags[i], mol, unit);
      GtkWidget *row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
      GtkWidget *icon = gtk_image_new_from_icon_name (info ? "dialog-information-symbolic" : "dialog-warning-symbolic");
      GtkWidget *label = gtk_label_new (msg);

      gtk_widget_add_css_class (row, "cw-flag");
      if (info)
        gtk_widget_add_css_class (row, "cw-info");
      gtk_widget_set_valign (icon, GTK_ALIGN_START);
      gtk_accessible_update_property (GTK_ACCESSIBLE (icon), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                      info ? _("Note") : _("Warning"), -1);
      gtk_label_set_wrap (GTK_LABEL (label), TRUE);
      gtk_label_set_xalign (GTK_LABEL (label), 0.0f);
      gtk_label_set_selectable (GTK_LABEL (label), TRUE);
      gtk_widget_set_hexpand (label, TRUE);
      gtk_box_append (GTK_BOX (row), icon);
      gtk_box_append (GTK_BOX (row), label);
      gtk_box_append (self->flags_box, row);
    }
  gtk_widget_set_visible (GTK_WIDGET (self->flags_box), gtk_widget_get_first_child (GTK_WIDGET (self->flags_box)) != NULL);
}

static GtkWidget *
cell (const char *text,
      const char *css,
      float       xalign)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), xalign);
  if (css != NULL)
    gtk_widget_add_css_class (label, css);
  return label;
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
add_term_row (CwWindow     *self,
              int           row,
              const CwTerm *t1,
              const CwTerm *t2)
{
  const CwTerm *t = t1 ? t1 : t2;
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  CwEnergyUnit unit = cw_window_get_energy_unit (self);
  g_autofree char *label = cw_term_dup_label (t, mol);
  g_autofree char *e1 = t1 ? g_strdup_printf ("%.2f", cw_energy_from_kcal (t1->energy, unit)) : g_strdup ("–");
  g_autofree char *e2 = t2 ? g_strdup_printf ("%.2f", cw_energy_from_kcal (t2->energy, unit)) : g_strdup ("–");
  g_autofree char *source = t->estimated ? g_strdup_printf (_("estimate: %s"), t->source ? t->source : "")
                                         : g_strdup (t->source ? t->source : "");
  GtkWidget *src = cell (source, "dim-label", 0.0f);

  gtk_label_set_ellipsize (GTK_LABEL (src), PANGO_ELLIPSIZE_END);
  gtk_label_set_max_width_chars (GTK_LABEL (src), 48);
  gtk_widget_set_hexpand (src, TRUE);
  gtk_widget_set_tooltip_text (src, source);
  gtk_grid_attach (self->terms_grid, cell (label, NULL, 0.0f), 0, row, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (e1, "cw-terms-value", 1.0f), 1, row, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (e2, "cw-terms-value", 1.0f), 2, row, 1, 1);
  gtk_grid_attach (self->terms_grid, src, 3, row, 1, 1);
}

static void
update_terms (CwWindow *self)
{
  CwEnergyUnit unit = cw_window_get_energy_unit (self);
  g_autofree char *h1 = NULL, *h2 = NULL, *tot1 = NULL, *tot2 = NULL;
  int row = 1;

  clear_children (GTK_WIDGET (self->terms_grid));
  if (!self->an_valid)
    return;
  /* TRANSLATORS: column header: energy of a term in chair 1, with the unit */
  h1 = g_strdup_printf (_("Chair 1 (%s)"), cw_energy_unit_symbol (unit));
  h2 = g_strdup_printf (_("Chair 2 (%s)"), cw_energy_unit_symbol (unit));
  gtk_grid_attach (self->terms_grid, cell (_("Term"), "cw-terms-header", 0.0f), 0, 0, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (h1, "cw-terms-header", 1.0f), 1, 0, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (h2, "cw-terms-header", 1.0f), 2, 0, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (_("Source"), "cw-terms-header", 0.0f), 3, 0, 1, 1);

  for (int i = 0; i < self->an.chair[0].n_terms; i++)
    {
      const CwTerm *t = &self->an.chair[0].terms[i];
      add_term_row (self, row++, t, find_term (&self->an.chair[1], t));
    }
  for (int i = 0; i < self->an.chair[1].n_terms; i++)
    {
      const CwTerm *t = &self->an.chair[1].terms[i];
      if (find_term (&self->an.chair[0], t) == NULL)
        add_term_row (self, row++, NULL, t);
    }
  if (row == 1)
    {
      gtk_grid_attach (self->terms_grid, cell (_("No terms: neither chair carries an axial group."), "dim-label", 0.0f),
                       0, row++, 4, 1);
    }
  tot1 = g_strdup_printf ("%.2f", cw_energy_from_kcal (self->an.chair[0].energy, unit));
  tot2 = g_strdup_printf ("%.2f", cw_energy_from_kcal (self->an.chair[1].energy, unit));
  gtk_grid_attach (self->terms_grid, cell (_("Total"), "cw-terms-header", 0.0f), 0, row, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (tot1, "cw-terms-value", 1.0f), 1, row, 1, 1);
  gtk_grid_attach (self->terms_grid, cell (tot2, "cw-terms-value", 1.0f), 2, row, 1, 1);
}

static char *
format_population (int     chair,
                   double  pop,
                   double  low,
                   double  high)
{
  double lo = MIN (low, high) * 100.0, hi = MAX (low, high) * 100.0;

  /* TRANSLATORS: "Chair 1: 95.0 % (93.1–96.4 %)"; the interval is for ΔG° ± 2σ */
  return g_strdup_printf (_("Chair %d: %.1f %% (%.1f–%.1f %%)"), chair, pop * 100.0, lo, hi);
}

static void
update_summary (CwWindow *self)
{
  CwEnergyUnit unit = cw_window_get_energy_unit (self);
  g_autofree char *p1 = NULL, *p2 = NULL, *t = NULL, *text = NULL, *kstr = NULL;
  const CwAnalysis *an = &self->an;

  if (!self->an_valid)
    {
      g_autofree char *msg = g_strdup_printf (_("No result: %s"), self->analysis_error ? self->analysis_error : "");

      gtk_label_set_text (self->summary_label, msg);
      gtk_widget_add_css_class (GTK_WIDGET (self->summary_label), "cw-error");
      gtk_label_set_text (self->pop1_label, "");
      gtk_label_set_text (self->pop2_label, "");
      return;
    }
  gtk_widget_remove_css_class (GTK_WIDGET (self->summary_label), "cw-error");
  p1 = format_population (1, an->pop[0], an->pop_low[0], an->pop_high[0]);
  p2 = format_population (2, an->pop[1], an->pop_low[1], an->pop_high[1]);
  gtk_label_set_text (self->pop1_label, p1);
  gtk_label_set_text (self->pop2_label, p2);
  if (an->pop[0] > an->pop[1] + 1e-9)
    {
      gtk_widget_add_css_class (GTK_WIDGET (self->pop1_label), "cw-major");
      gtk_widget_remove_css_class (GTK_WIDGET (self->pop2_label), "cw-major");
    }
  else if (an->pop[1] > an->pop[0] + 1e-9)
    {
      gtk_widget_add_css_class (GTK_WIDGET (self->pop2_label), "cw-major");
      gtk_widget_remove_css_class (GTK_WIDGET (self->pop1_label), "cw-major");
    }
  else
    {
      gtk_widget_remove_css_class (GTK_WIDGET (self->pop1_label), "cw-major");
      gtk_widget_remove_css_class (GTK_WIDGET (self->pop2_label), "cw-major");
    }

  t = cw_format_temperature (an->temperature, cw_window_get_temperature_unit (self));
  kstr = (an->K >= 1e4 || an->K < 1e-3) ? g_strdup_printf ("%.2e", an->K) : g_strdup_printf ("%.3g", an->K);
  /* TRANSLATORS: the result line: ΔG°, its uncertainty, unit, temperature, equilibrium constant */
  text = g_strdup_printf (_("ΔG° = G(chair 2) − G(chair 1) = %+.2f ± %.2f %s at %s;  K = %s"),
                          cw_energy_from_kcal (an->delta_g, unit), cw_energy_from_kcal (an->sigma, unit),
                          cw_energy_unit_symbol (unit), t, kstr);
  gtk_label_set_text (self->summary_label, text);
}

void
cw_window_update_results (CwWindow *self)
{
  update_summary (self);
  update_terms (self);
  update_flags (self);
}
