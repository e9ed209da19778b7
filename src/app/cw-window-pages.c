#include "config.h"

#include <glib/gi18n.h>

#include "cw-app-data.h"
#include "cw-isomers.h"
#include "cw-smiles.h"
#include "cw-window-private.h"

/* Fills grid with n_rows × n_columns texts (row 0 is the header), reusing the labels
 * already in it and hiding the rest. */
void
cw_window_grid_set_rows (GtkGrid     *grid,
                         guint        n_columns,
                         const char **cells,
                         guint        n_rows)
{
  GPtrArray *pool = g_object_get_data (G_OBJECT (grid), "cw-cells");

  if (pool == NULL)
    {
      pool = g_ptr_array_new ();
      g_object_set_data_full (G_OBJECT (grid), "cw-cells", pool, (GDestroyNotify) g_ptr_array_unref);
    }
  while (pool->len < n_rows * n_columns)
    {
      guint      i = pool->len;
      GtkWidget *label = gtk_label_new (NULL);

      gtk_label_set_xalign (GTK_LABEL (label), 0.0f);
      gtk_label_set_wrap (GTK_LABEL (label), i % n_columns == n_columns - 1);
      gtk_grid_attach (grid, label, i % n_columns, i / n_columns, 1, 1);
      g_ptr_array_add (pool, label);
    }
  for (guint i = 0; i < pool->len; i++)
    {
      GtkWidget *label = g_ptr_array_index (pool, i);

      if (i < n_rows * n_columns)
        {
          gtk_label_set_text (GTK_LABEL (label), cells[i] ? cells[i] : "");
          if (i < n_columns)
            gtk_widget_add_css_class (label, "cw-terms-header");
        }
      gtk_widget_set_visible (label, i < n_rows * n_columns);
    }
}

static char *
chair_cell (const CwRingProton *p,
            int                 chair)
{
  g_autofree char *m = cw_multiplet_dup_text (&p->multiplet[chair]);

  /* TRANSLATORS: a proton in one chair: "ax · tt, 11.6, 4.1 Hz" */
  return g_strdup_printf ("%s · %s", p->axial[chair] ? _("ax") : _("eq"), m);
}

static void
update_couplings (CwWindow             *self,
                  const CwGeometryData *gd)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  g_autoptr (GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  g_autofree char *note = NULL;
  CwCouplings     *c;

  if (self->couplings == NULL)
    self->couplings = g_new0 (CwCouplings, 1);
  c = self->couplings;
  if (!cw_couplings_compute (gd, mol, self->an.pop, self->an.temperature, NULL, c, &error))
    {
      cw_window_grid_set_rows (self->couplings_grid, 4, NULL, 0);
      gtk_label_set_text (self->couplings_note, error->message);
      return;
    }
  g_ptr_array_add (cells, g_strdup (_("Proton")));
  g_ptr_array_add (cells, g_strdup (_("Chair 1")));
  g_ptr_array_add (cells, g_strdup (_("Chair 2")));
  g_ptr_array_add (cells, g_strdup (_("Population average")));
  for (int i = 0; i < c->n_protons; i++)
    {
      const CwRingProton *p = &c->protons[i];
      g_autofree char    *avg = cw_multiplet_dup_text (&p->multiplet[2]);

      g_ptr_array_add (cells, cw_ring_proton_dup_label (p));
      g_ptr_array_add (cells, chair_cell (p, 0));
      g_ptr_array_add (cells, chair_cell (p, 1));
      /* TRANSLATORS: averaged multiplet and the width (sum of vicinal couplings) */
      g_ptr_array_add (cells, g_strdup_printf (_("%s; width %.1f Hz"), avg, p->width_avg));
    }
  cw_window_grid_set_rows (self->couplings_grid, 4, (const char **) cells->pdata, cells->len / 4);
  note = g_strdup_printf (_("Vicinal ³J(H,H) from the generalised Karplus equation on ideal chairs (%s); "
                            "geminal ²J %.1f Hz (%s). First-order patterns, averaged by the chair populations."),
                             c->n_vicinal > 0 && c->vicinal[0].set ? c->vicinal[0].set->source : "",
                             c->geminal, c->geminal_source ? c->geminal_source : "");
  gtk_label_set_text (self->couplings_note, note);
}

static char *
alkenes_text (const CwLeavingGroup *lg,
              const CwMolecule     *mol)
{
  GString *s = g_string_new (NULL);

  for (int k = 0; k < lg->n_alkenes; k++)
    {
      g_autofree char *label = cw_alkene_dup_label (&lg->alkenes[k], mol);

      if (s->len > 0)
        g_string_append (s, "; ");
      g_string_append_printf (s, "%s %.0f %%", label, lg->alkenes[k].fraction * 100.0);
    }
  if (s->len == 0)
    g_string_append (s, _("none"));
  return g_string_free (s, FALSE);
}

static void
update_reactions (CwWindow             *self,
                  const CwGeometryData *gd)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  g_autoptr (GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GString) note = g_string_new (NULL);
  g_autoptr (GError) error = NULL;
  CwReactivity *r;

  if (self->reactivity == NULL)
    self->reactivity = g_new0 (CwReactivity, 1);
  r = self->reactivity;
  if (!cw_reactivity_compute (gd, mol, self->an.pop, self->an.temperature, r, &error))
    {
      cw_window_grid_set_rows (self->reactions_grid, 5, NULL, 0);
      gtk_label_set_text (self->reactions_note, error->message);
      return;
    }
  g_ptr_array_add (cells, g_strdup (_("Leaving group")));
  g_ptr_array_add (cells, g_strdup (_("Chair 1")));
  g_ptr_array_add (cells, g_strdup (_("Chair 2")));
  g_ptr_array_add (cells, g_strdup (_("Can react (E2)")));
  g_ptr_array_add (cells, g_strdup (_("Alkenes")));
  for (int i = 0; i < r->n_groups; i++)
    {
      const CwLeavingGroup *lg = &r->groups[i];
      const CwSubstituent  *s = &mol->subs[lg->sub];

      g_ptr_array_add (cells, g_strdup_printf ("%s (C%d)", s->group->label, lg->position));
      for (int ch = 0; ch < 2; ch++)
        g_ptr_array_add (cells, g_strdup_printf ("%s, %s", lg->axial[ch] ? _("axial") : _("equatorial"), lg->reactive[ch] ? _("anti β-H") : _("no anti β-H")));
      g_ptr_array_add (cells, g_strdup_printf ("%.1f %%", lg->reactive_fraction * 100.0));
      g_ptr_array_add (cells, alkenes_text (lg, mol));
    }
  cw_window_grid_set_rows (self->reactions_grid, 5, (const char **) cells->pdata,
                           r->n_groups > 0 ? cells->len / 5 : 0);
  for (int i = 0; i < r->n_warnings; i++)
    {
      g_autofree char *msg = cw_react_warning_dup_message (&r->warnings[i], mol);

      g_string_append_printf (note, "%s%s", note->len ? "\n" : "", msg);
    }
  g_string_append_printf (note, "%s%s", note->len ? "\n" : "",
                          _("An E2 needs the leaving group anti-periplanar (trans-diaxial) to a β-hydrogen; "
                            "with fast ring inversion the rate follows the population of the chairs that have it."));
  gtk_label_set_text (self->reactions_note, note->str);
}

static void
update_isomers (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  CwEnergyUnit      unit = cw_window_get_energy_unit (self);
  g_autoptr (GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (CwIsomerSet) set = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *current = cw_smiles_write (mol);
  CwConditions     cond;

  cw_document_get_conditions (self->doc, &cond);
  set = cw_isomers_enumerate (self->data, mol, &cond, &error);
  if (set == NULL)
    {
      cw_window_grid_set_rows (self->isomers_grid, 5, NULL, 0);
      gtk_label_set_text (self->isomers_note, error->message);
      return;
    }
  g_ptr_array_add (cells, g_strdup (_("Isomer")));
  g_ptr_array_add (cells, g_strdup_printf (_("G rel. (%s)"), cw_energy_unit_symbol (unit)));
  g_ptr_array_add (cells, g_strdup (_("At equilibrium")));
  g_ptr_array_add (cells, g_strdup (_("Major chair")));
  g_ptr_array_add (cells, g_strdup (_("SMILES")));
  for (guint i = 0; i < set->isomers->len; i++)
    {
      const CwIsomer   *iso = g_ptr_array_index (set->isomers, i);
      const CwAnalysis *an = &iso->analysis;
      const char       *config = iso->configuration && *iso->configuration ? iso->configuration : "–";
      gboolean          this_one = g_strcmp0 (iso->smiles, current) == 0;

      g_ptr_array_add (cells, this_one ? g_strdup_printf (_("%s (this document)"), config) : g_strdup (config));
      g_ptr_array_add (cells, g_strdup_printf ("%.2f", cw_energy_from_kcal (iso->g_rel, unit)));
      g_ptr_array_add (cells, g_strdup_printf ("%.1f %%", iso->fraction * 100.0));
      g_ptr_array_add (cells, g_strdup_printf ("%.0f %%", MAX (an->pop[0], an->pop[1]) * 100.0));
      g_ptr_array_add (cells, g_strdup (iso->smiles));
    }
  cw_window_grid_set_rows (self->isomers_grid, 5, (const char **) cells->pdata, cells->len / 5);
  gtk_label_set_text (self->isomers_note, cw_isomers_method_text ());
}

void
cw_window_update_pages (CwWindow *self)
{
  const char *page = gtk_stack_get_visible_child_name (self->lower_stack);
  g_autoptr (GError) error = NULL;
  const CwGeometryData *gd;

  /* Only the page on screen is computed; the others when they are shown. */
  if (page == NULL || !self->an_valid)
    return;
  if (g_strcmp0 (page, "isomers") == 0)
    update_isomers (self);
  else if (g_strcmp0 (page, "couplings") == 0 || g_strcmp0 (page, "reactions") == 0)
    {
      gd = cw_app_get_geometry (&error);
      if (gd == NULL)
        {
          gtk_label_set_text (g_strcmp0 (page, "couplings") == 0 ? self->couplings_note : self->reactions_note,
                              error->message);
          return;
        }
      if (g_strcmp0 (page, "couplings") == 0)
        update_couplings (self, gd);
      else
        update_reactions (self, gd);
    }
}
