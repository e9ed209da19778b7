#include "config.h"

#include <math.h>
#include <stdlib.h>

#include "app-test-helpers.h"
#include "app-test-window.h"

/* Reference: A(Me) = 1.74 kcal/mol (Booth & Everett, J. Chem. Soc., Perkin Trans. 2 1980, 255,
 * as tabulated at 298 K); textbook conformational analysis (Eliel, Wilen & Mander 1994, ch. 11):
 * cis-1,4-dimethylcyclohexane has two equal chairs (one Me axial in each), trans-1,4 has a
 * diequatorial chair favoured by about 2·A(Me). */


static const char *
cell_text (GtkGrid *grid, int col, int row)
{
  GtkWidget *w = gtk_grid_get_child_at (grid, col, row);

  g_assert_nonnull (w);
  g_assert_true (gtk_widget_get_visible (w));
  return gtk_label_get_text (GTK_LABEL (w));
}

static void
test_smiles_cis_trans (void)
{
  CwWindow          *win = new_window ();
  static const char *smiles[] = { "C[C@H]1CC[C@@H](C)CC1", "C[C@H]1CC[C@H](C)CC1" };
  int                n_cis = 0, n_trans = 0;

  for (guint i = 0; i < G_N_ELEMENTS (smiles); i++)
    {
      const CwAnalysis *an;
      g_autofree char  *config = NULL;

      gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", 298.15);
      gtk_widget_activate_action (GTK_WIDGET (win), "win.set-smiles", "s", smiles[i]);
      g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 2);
      an = cw_window_get_analysis (win);
      config = cw_molecule_dup_configuration (cw_document_peek_molecule (cw_window_get_document (win)));
      if (g_strcmp0 (config, "cis") == 0)
        {
          n_cis++;
          g_assert_cmpfloat_with_epsilon (an->delta_g, 0.0, 1e-9);
        }
      else
        {
          g_assert_cmpstr (config, ==, "trans");
          n_trans++;
          g_assert_cmpfloat_with_epsilon (fabs (an->delta_g), 2 * 1.74, 0.1);
        }
    }
  g_assert_cmpint (n_cis, ==, 1);
  g_assert_cmpint (n_trans, ==, 1);

  /* Undo brings back the first molecule; bad SMILES leaves the document alone and says why. */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  {
    g_autofree char *config = cw_molecule_dup_configuration (cw_document_peek_molecule (cw_window_get_document (win)));
    g_assert_true (g_strcmp0 (config, "cis") == 0 || g_strcmp0 (config, "trans") == 0);
  }
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-smiles", "s", "C1CC(");
  g_assert_true (gtk_widget_get_visible (GTK_WIDGET (win->smiles_note_label)));
  g_assert_true (gtk_widget_has_css_class (GTK_WIDGET (win->smiles_note_label), "cw-error"));
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 2);

  /* Copy as SMILES puts text on the clipboard. */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.copy-smiles", NULL);
  g_assert_true (gdk_content_formats_contain_mime_type (
    gdk_clipboard_get_formats (gtk_widget_get_clipboard (GTK_WIDGET (win))), "text/plain;charset=utf-8"));
  destroy_window (win);
}

static gboolean
press (GtkWidget *widget, guint keyval)
{
  g_autoptr (GListModel) controllers = gtk_widget_observe_controllers (widget);
  gboolean handled = FALSE;

  for (guint i = 0; i < g_list_model_get_n_items (controllers) && !handled; i++)
    {
      g_autoptr (GObject) c = g_list_model_get_item (controllers, i);

      if (GTK_IS_EVENT_CONTROLLER_KEY (c))
        g_signal_emit_by_name (c, "key-pressed", keyval, 0, (GdkModifierType) 0, &handled);
    }
  return handled;
}

static void
test_keyboard_editing (void)
{
  CwWindow         *win = new_window ();
  GtkWidget        *canvas = GTK_WIDGET (win->ring_canvas);
  GtkEditable      *search;
  const CwMolecule *mol;

  g_assert_true (press (canvas, GDK_KEY_3));
  g_assert_cmpint (cw_ring_canvas_get_selected (win->ring_canvas), ==, 3);
  g_assert_true (press (canvas, GDK_KEY_Right));
  g_assert_cmpint (cw_ring_canvas_get_selected (win->ring_canvas), ==, 4);
  g_assert_true (press (canvas, GDK_KEY_Left));

  /* Typing opens the up-face chooser with the text; Enter picks the first match. */
  g_assert_true (press (canvas, GDK_KEY_i));
  search = GTK_EDITABLE (gtk_widget_get_template_child (GTK_WIDGET (win->up_chooser), CW_TYPE_GROUP_CHOOSER,
                                                        "search_entry"));
  g_assert_cmpstr (gtk_editable_get_text (search), ==, "i");
  gtk_editable_set_text (search, "isopropyl");
  g_signal_emit_by_name (search, "activate");
  app_test_pump (50, NULL);
  mol = cw_document_peek_molecule (cw_window_get_document (win));
  g_assert_nonnull (cw_molecule_get (mol, 3, CW_FACE_UP));
  g_assert_cmpstr (cw_molecule_get (mol, 3, CW_FACE_UP)->group->id, ==, "isopropyl");

  g_assert_true (press (canvas, GDK_KEY_Delete));
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 0);
  destroy_window (win);
}

static void
test_couplings_page (void)
{
  CwWindow *win = new_window ();
  GtkGrid  *grid = win->couplings_grid;
  gboolean  found = FALSE;

  /* tert-Butyl up on C1 is equatorial only in chair 2, which then holds nearly all molecules;
   * H-1 (down) is axial there: a triplet of triplets with J(ax,ax) of 10–13 Hz
   * (common practice; docs/couplings-and-reactions.md). */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 1, "up", "tert-butyl");
  gtk_stack_set_visible_child_name (win->lower_stack, "couplings");
  app_test_pump (50, NULL);
  for (int row = 1; gtk_grid_get_child_at (grid, 0, row) && gtk_widget_get_visible (gtk_grid_get_child_at (grid, 0, row)); row++)
    if (g_str_has_prefix (cell_text (grid, 0, row), "H-1"))
      {
        const char *avg = cell_text (grid, 3, row);
        double      j1;

        g_test_message ("H-1 averaged: %s", avg);
        g_assert_true (g_str_has_prefix (avg, "tt"));
        j1 = g_ascii_strtod (avg + 4, NULL);
        g_assert_cmpfloat (j1, >=, 10.0);
        g_assert_cmpfloat (j1, <=, 13.0);
        found = TRUE;
      }
  g_assert_true (found);
  destroy_window (win);
}

static double
reactive_percent (CwWindow *win, const char *tbu_face)
{
  gtk_widget_activate_action (GTK_WIDGET (win), "win.clear-carbon", "i", 4);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 1, "up", "bromo");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 4, tbu_face, "tert-butyl");
  app_test_pump (20, NULL);
  g_assert_true (g_str_has_prefix (cell_text (win->reactions_grid, 0, 1), "Br"));
  return g_ascii_strtod (cell_text (win->reactions_grid, 3, 1), NULL);
}

static void
test_reactions_page (void)
{
  CwWindow *win = new_window ();

  /* 4-tert-butylcyclohexyl bromide, the textbook E2 case (Eliel, Wilen & Mander 1994, ch. 11):
   * cis has Br axial (anti to two β-H) in the one populated chair, trans has Br equatorial. */
  gtk_stack_set_visible_child_name (win->lower_stack, "reactions");
  g_assert_cmpfloat (reactive_percent (win, "up"), >, 99.0);
  g_assert_cmpfloat (reactive_percent (win, "down"), <, 1.0);
  destroy_window (win);
}

/* The chairs figure as drawn on screen, as a texture. */
static GBytes *
chairs_pixels (CwWindow *win)
{
  GtkWidget *area = GTK_WIDGET (win->chairs_area);
  int        w = gtk_widget_get_width (area), h = gtk_widget_get_height (area);
  g_autoptr (GdkPaintable) paintable = gtk_widget_paintable_new (area);
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  GtkSnapshot *snapshot = gtk_snapshot_new ();
  guchar      *data;

  g_assert_cmpint (w, >, 0);
  gdk_paintable_snapshot (paintable, snapshot, w, h);
  node = gtk_snapshot_free_to_node (snapshot);
  g_assert_nonnull (node);
  texture = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (win)), node,
                                         &GRAPHENE_RECT_INIT (0, 0, w, h));
  data = g_malloc ((gsize) w * h * 4);
  gdk_texture_download (texture, data, (gsize) w * 4);
  return g_bytes_new_take (data, (gsize) w * h * 4);
}

static void
test_reactivity_marks (void)
{
  CwWindow       *win = new_window ();
  CwRenderOptions opt;
  g_autoptr (GBytes) plain = NULL;
  g_autoptr (GBytes) marked = NULL;
  g_autoptr (GBytes) again = NULL;
  const CwLeavingGroup *lg;
  int                   major;

  /* cis-4-tert-butylcyclohexyl bromide: Br axial in the populated chair, anti-periplanar to
   * the two axial β-hydrogens on C2 and C6 (Eliel, Wilen & Mander 1994, ch. 11). The marks
   * work from any lower page. */
  gtk_stack_set_visible_child_name (win->lower_stack, "profile");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 1, "up", "bromo");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 4, "up", "tert-butyl");
  app_test_pump (50, NULL);
  cw_window_render_options (win, NULL, &opt);
  g_assert_false (opt.highlight_reactivity);
  plain = chairs_pixels (win);

  gtk_check_button_set_active (win->reactivity_check, TRUE);
  app_test_pump (50, NULL);
  cw_window_render_options (win, NULL, &opt);
  g_assert_true (opt.highlight_reactivity);
  g_assert_true (opt.reactivity == win->reactivity);
  g_assert_cmpint (opt.reactivity_sub, ==, -1);
  g_assert_cmpint (win->reactivity->n_groups, ==, 1);
  lg = &win->reactivity->groups[0];
  major = cw_window_get_analysis (win)->pop[0] > 0.5 ? 0 : 1;
  g_assert_true (lg->axial[major]);
  g_assert_cmpint (lg->n_anti[major], ==, 2);
  marked = chairs_pixels (win);
  g_assert_false (g_bytes_equal (plain, marked));

  /* An edit while marked keeps the marks current: trans has Br equatorial, no anti β-H. */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.clear-carbon", "i", 4);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 4, "down", "tert-butyl");
  app_test_pump (50, NULL);
  lg = &win->reactivity->groups[0];
  major = cw_window_get_analysis (win)->pop[0] > 0.5 ? 0 : 1;
  g_assert_false (lg->axial[major]);
  g_assert_cmpint (lg->n_anti[major], ==, 0);

  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  gtk_check_button_set_active (win->reactivity_check, FALSE);
  app_test_pump (50, NULL);
  cw_window_render_options (win, NULL, &opt);
  g_assert_false (opt.highlight_reactivity);
  again = chairs_pixels (win);
  g_assert_true (g_bytes_equal (plain, again));
  destroy_window (win);
}

static CwWindow *
find_other_window (CwWindow *win)
{
  GListModel *toplevels = gtk_window_get_toplevels (); /* borrowed */
  CwWindow   *other = NULL;

  for (guint i = 0; i < g_list_model_get_n_items (toplevels); i++)
    {
      g_autoptr (GObject) w = g_list_model_get_item (toplevels, i);

      if (CW_IS_WINDOW (w) && CW_WINDOW (w) != win)
        other = CW_WINDOW (w);
    }
  return other;
}

/* The isomers page opens the cis isomer (row 1, with its "Open" button) in a new window;
 * the trans document stays as it was. */
static void
check_open_isomer (CwWindow *win)
{
  GtkWidget       *button = gtk_grid_get_child_at (win->isomers_grid, 5, 1);
  GtkWidget       *current_button = gtk_grid_get_child_at (win->isomers_grid, 5, 2);
  CwWindow        *other;
  g_autofree char *config = NULL;
  g_autofree char *old_config = NULL;

  g_assert_true (GTK_IS_BUTTON (button));
  g_assert_true (gtk_widget_get_visible (button));
  /* The row of this document has nothing to open. */
  g_assert_false (gtk_widget_get_visible (current_button));
  g_assert_null (find_other_window (win));
  g_signal_emit_by_name (button, "clicked");
  app_test_pump (50, NULL);
  other = find_other_window (win);
  g_assert_nonnull (other);
  config = cw_molecule_dup_configuration (cw_document_peek_molecule (cw_window_get_document (other)));
  g_assert_cmpstr (config, ==, "cis");
  g_assert_cmpfloat_with_epsilon (cw_document_get_temperature (cw_window_get_document (other)), 298.15, 1e-9);
  g_assert_true (cw_window_get_modified (other));
  g_assert_null (cw_window_get_file (other));
  /* cis-1,3: the diequatorial chair wins by more than 2 A(Me) (Eliel, Wilen & Mander 1994). */
  g_assert_cmpfloat (fabs (cw_window_get_analysis (other)->delta_g), >, 2 * 1.74);
  old_config = cw_molecule_dup_configuration (cw_document_peek_molecule (cw_window_get_document (win)));
  g_assert_cmpstr (old_config, ==, "trans");
  destroy_window (other);

  /* A bad index says so and opens nothing. */
  {
    g_autoptr (GError) error = NULL;

    g_assert_null (cw_window_open_isomer (win, 7, &error));
    g_assert_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_ARGUMENT);
  }
}

static void
test_isomers_page (void)
{
  CwWindow *win = new_window ();

  /* 1,3-dimethylcyclohexane: cis (diequatorial chair available) is the more stable isomer,
   * by about A(Me) (Eliel, Wilen & Mander 1994, ch. 11). */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", 298.15);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 1, "up", "methyl");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 3, "down", "methyl");
  gtk_stack_set_visible_child_name (win->lower_stack, "isomers");
  app_test_pump (50, NULL);
  g_assert_true (g_str_has_prefix (cell_text (win->isomers_grid, 0, 1), "cis"));
  g_assert_true (g_str_has_prefix (cell_text (win->isomers_grid, 0, 2), "trans"));
  g_assert_nonnull (strstr (cell_text (win->isomers_grid, 0, 2), "(this document)"));
  /* trans is chiral: a racemate, whose two enantiomers add R ln 2 of mixing entropy, so
   * G(trans) − G(cis) = A(Me) − RT ln 2 (R from CODATA 2018). */
  g_assert_cmpfloat_with_epsilon (g_ascii_strtod (cell_text (win->isomers_grid, 1, 2), NULL),
                                  1.74 - 8.314462618 / 4184.0 * 298.15 * log (2.0), 0.02);
  check_open_isomer (win);
  destroy_window (win);
}

static void
test_shortcuts_window (void)
{
  CwWindow   *win = new_window ();
  GListModel *toplevels = gtk_window_get_toplevels (); /* borrowed */
  GtkWidget  *shortcuts = NULL;

  /* Built on first use; it must come up without a warning (fatal in tests). */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.show-help-overlay", NULL);
  app_test_pump (200, NULL);
  for (guint i = 0; i < g_list_model_get_n_items (toplevels); i++)
    {
      g_autoptr (GObject) w = g_list_model_get_item (toplevels, i);

      if (GTK_IS_SHORTCUTS_WINDOW (w))
        shortcuts = GTK_WIDGET (w);
    }
  g_assert_nonnull (shortcuts);
  g_assert_true (gtk_widget_get_visible (shortcuts));
  gtk_window_destroy (GTK_WINDOW (shortcuts));
  destroy_window (win);
}

int
main (int argc, char *argv[])
{
  if (!app_test_init (&argc, &argv))
    return 0;
  g_test_add_func ("/app/pages/smiles-cis-trans", test_smiles_cis_trans);
  g_test_add_func ("/app/pages/keyboard-editing", test_keyboard_editing);
  g_test_add_func ("/app/pages/couplings", test_couplings_page);
  g_test_add_func ("/app/pages/reactions", test_reactions_page);
  g_test_add_func ("/app/pages/isomers", test_isomers_page);
  g_test_add_func ("/app/pages/reactivity-marks", test_reactivity_marks);
  g_test_add_func ("/app/pages/shortcuts-window", test_shortcuts_window);
  return g_test_run ();
}
