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
  self->reactivity_valid = cw_reactivity_compute (gd, mol, self->an.pop, self->an.temperature, r, &error);
  if (!self->reactivity_valid)
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

/* One "Open" button per isomer row, in the column after the texts: opening an isomer
 * makes a new window, so the work in this one stays as it is. */
static void
set_isomer_buttons (CwWindow *self,
                    guint     n_isomers,
                    int       current)
{
  GPtrArray *pool = g_object_get_data (G_OBJECT (self->isomers_grid), "cw-open-buttons");

  if (pool == NULL)
    {
      pool = g_ptr_array_new ();
      g_object_set_data_full (G_OBJECT (self->isomers_grid), "cw-open-buttons", pool,
                              (GDestroyNotify) g_ptr_array_unref);
    }
  while (pool->len < n_isomers)
    {
      GtkWidget *button = gtk_button_new_with_mnemonic (_("_Open"));

      gtk_widget_set_valign (button, GTK_ALIGN_CENTER);
      gtk_actionable_set_action_name (GTK_ACTIONABLE (button), "win.open-isomer");
      gtk_actionable_set_action_target (GTK_ACTIONABLE (button), "i", (int) pool->len);
      gtk_widget_set_tooltip_text (button, _("Open this isomer in a new window"));
      gtk_grid_attach (self->isomers_grid, button, 5, pool->len + 1, 1, 1);
      g_ptr_array_add (pool, button);
    }
  for (guint i = 0; i < pool->len; i++)
    gtk_widget_set_visible (g_ptr_array_index (pool, i), i < n_isomers && (int) i != current);
}

static void
update_isomers (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  CwEnergyUnit      unit = cw_window_get_energy_unit (self);
  g_autoptr (GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  CwConditions cond;
  CwIsomerSet *set;
  int          current;

  cw_document_get_conditions (self->doc, &cond);
  g_clear_pointer (&self->isomers, cw_isomer_set_free);
  self->isomers = cw_isomers_enumerate (self->data, mol, &cond, &error);
  set = self->isomers;
  if (set == NULL)
    {
      cw_window_grid_set_rows (self->isomers_grid, 5, NULL, 0);
      set_isomer_buttons (self, 0, -1);
      gtk_label_set_text (self->isomers_note, error->message);
      return;
    }
  /* Compared by relative configuration: a chiral isomer is listed by one enantiomer. */
  current = cw_isomer_set_find (set, mol);
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

      g_ptr_array_add (cells, (int) i == current ? g_strdup_printf (_("%s (this document)"), config) : g_strdup (config));
      g_ptr_array_add (cells, g_strdup_printf ("%.2f", cw_energy_from_kcal (iso->g_rel, unit)));
      g_ptr_array_add (cells, g_strdup_printf ("%.1f %%", iso->fraction * 100.0));
      g_ptr_array_add (cells, g_strdup_printf ("%.0f %%", MAX (an->pop[0], an->pop[1]) * 100.0));
      g_ptr_array_add (cells, g_strdup (iso->smiles));
    }
  cw_window_grid_set_rows (self->isomers_grid, 5, (const char **) cells->pdata, cells->len / 5);
  set_isomer_buttons (self, set->isomers->len, current);
  gtk_label_set_text (self->isomers_note, cw_isomers_method_text ());
}

/* A copy of this document (temperature, solvent, custom groups, notes) holding isomer
 * index of the isomers page, in a new window. The new window starts modified: it is
 * unsaved work, and autosave keeps it. */
CwWindow *
cw_window_open_isomer (CwWindow *self,
                       int       index,
                       GError  **error)
{
  const CwIsomer *iso;
  CwDocument     *doc;
  CwWindow       *win;
  const char     *title = cw_document_get_title (self->doc);

  if (self->isomers == NULL || index < 0 || (guint) index >= self->isomers->isomers->len)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_ARGUMENT,
                   _("There is no isomer number %d in the list"), index + 1);
      return NULL;
    }
  iso = g_ptr_array_index (self->isomers->isomers, index);
  doc = cw_document_copy (self->doc);
  cw_document_set_molecule (doc, iso->molecule);
  if (title != NULL && *title != '\0' && iso->configuration != NULL && *iso->configuration != '\0')
    {
      /* TRANSLATORS: the title of a document opened from the isomers page: "Title (trans)" */
      g_autofree char *new_title = g_strdup_printf (_("%s (%s)"), title, iso->configuration);

      cw_document_set_title (doc, new_title);
    }
  win = cw_window_new (gtk_window_get_application (GTK_WINDOW (self)));
  cw_window_set_document (win, doc, NULL, TRUE);
  gtk_window_present (GTK_WINDOW (win));
  return win;
}

static void
open_isomer_action (GtkWidget  *widget,
                    const char *action_name,
                    GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr (GError) error = NULL;

  if (cw_window_open_isomer (self, g_variant_get_int32 (param), &error) == NULL)
    cw_window_show_error (self, _("The isomer could not be opened"), error);
}

void
cw_window_class_add_page_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.open-isomer", "i", open_isomer_action);
}

void
cw_window_update_pages (CwWindow *self)
{
  const char *page = gtk_stack_get_visible_child_name (self->lower_stack);
  gboolean    couplings = g_strcmp0 (page, "couplings") == 0;
  /* The reaction geometry is also needed while the chairs show it. */
  gboolean reactions = g_strcmp0 (page, "reactions") == 0 || gtk_check_button_get_active (self->reactivity_check);
  g_autoptr (GError) error = NULL;
  const CwGeometryData *gd;

  /* Only the page on screen is computed; the others when they are shown. The reaction
   * geometry may be drawn on the chairs: a figure laid out before is out of date. */
  self->figure_stamp++;
  self->reactivity_valid = FALSE;
  if (!self->an_valid)
    return;
  if (g_strcmp0 (page, "isomers") == 0)
    update_isomers (self);
  if (!couplings && !reactions)
    return;
  gd = cw_app_get_geometry (&error);
  if (gd == NULL)
    {
      gtk_label_set_text (couplings ? self->couplings_note : self->reactions_note, error->message);
      return;
    }
  if (couplings)
    update_couplings (self, gd);
  if (reactions)
    update_reactions (self, gd);
}
