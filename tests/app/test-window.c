#include "config.h"

#include <math.h>
#include <stdio.h>
#include <string.h>
#ifdef __linux__
#include <sys/mman.h>
#include <unistd.h>
#endif

#include "app-test-helpers.h"
#include "cw-application.h"
#include "cw-custom-group-dialog.h"
#include "app-test-window.h"
#include "cw-frame-memory.h"
#ifdef GDK_WINDOWING_X11
#include <gdk/x11/gdkx.h>
#endif

/* Reference values, independent of the core:
 * - A(Me) from Booth & Everett, J. Chem. Soc., Perkin Trans. 2 1980, 255: axial -> equatorial
 *   dH = -1.75 kcal/mol, dS = -0.03 cal/(mol K), so A(T) = 1.75 - T * 0.03e-3 kcal/mol.
 * - R = 8.314462618 J/(mol K) (CODATA 2018), 1 cal = 4.184 J (thermochemical calorie). */
#define R_KCAL (8.314462618 / 4184.0)

static double
methyl_a (double t)
{
  return 1.75 - t * 0.03e-3;
}

/* Fraction of the chair with methyl equatorial, from the Boltzmann ratio. */
static double
equatorial_fraction (double a, double t)
{
  return 1.0 / (1.0 + exp (-a / (R_KCAL * t)));
}


static void
set_group (CwWindow *win, int pos, const char *face, const char *id)
{
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", pos, face, id);
}

static char *
expected_pop (int chair, double frac)
{
  return g_strdup_printf ("Chair %d: %.1f %%", chair, frac * 100.0);
}

static void
test_edit_updates_results (void)
{
  CwWindow         *win = new_window ();
  double            t = 298.15;
  double            x_eq = equatorial_fraction (methyl_a (t), t);
  g_autofree char  *pop2 = expected_pop (2, x_eq);
  g_autofree char  *pop1 = expected_pop (1, 1.0 - x_eq);
  const CwAnalysis *an;

  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", t);
  g_assert_cmpstr (cw_steady_label_get_text (win->pop1_label), ==, "Chair 1: 50.0 % (50.0–50.0 %)");

  /* Methyl on the up face of C1: axial in chair 1 (DEVELOPERS.md, the model), equatorial in chair 2. */
  set_group (win, 1, "up", "methyl");
  an = cw_window_get_analysis (win);
  g_assert_nonnull (an);
  g_assert_cmpfloat_with_epsilon (an->delta_g, -methyl_a (t), 0.01);
  g_assert_true (g_str_has_prefix (cw_steady_label_get_text (win->pop2_label), pop2));
  g_assert_true (g_str_has_prefix (cw_steady_label_get_text (win->pop1_label), pop1));
  g_assert_true (cw_steady_label_get_bold (win->pop2_label));
  g_assert_false (cw_steady_label_get_bold (win->pop1_label));
  g_assert_nonnull (strstr (cw_steady_label_get_text (win->summary_label), "kcal/mol"));
  g_assert_true (cw_window_get_modified (win));
  /* The terms table lists the axial methyl: heading, the term with A(T) in chair 1 and
   * none in chair 2, its source, and the totals. */
  g_assert_cmpuint (cw_result_sheet_get_n_rows (win->result_sheet), ==, 3);
  {
    g_autofree char *a = g_strdup_printf ("%.2f", methyl_a (t));

    g_assert_cmpstr (cw_result_sheet_get_cell (win->result_sheet, 1, 1), ==, a);
    g_assert_cmpstr (cw_result_sheet_get_cell (win->result_sheet, 1, 2), ==, "–");
    g_assert_cmpstr (cw_result_sheet_get_cell (win->result_sheet, 2, 0), ==, "Total");
    g_assert_cmpstr (cw_result_sheet_get_cell (win->result_sheet, 2, 1), ==, a);
  }
  g_assert_nonnull (strstr (cw_result_sheet_get_cell (win->result_sheet, 1, 3), "Booth"));

  /* kJ/mol: the same ΔG° times 4.184 shows in the result line. */
  g_settings_set_string (win->settings, "energy-unit", "kj");
  {
    g_autofree char *kj = g_strdup_printf ("%+.2f", -methyl_a (t) * 4.184);
    g_assert_nonnull (strstr (cw_steady_label_get_text (win->summary_label), kj));
    g_assert_nonnull (strstr (cw_steady_label_get_text (win->summary_label), "kJ/mol"));
    g_assert_cmpstr (cw_result_sheet_get_cell (win->result_sheet, 0, 1), ==, "Chair 1 (kJ/mol)");
    g_free (kj);
    kj = g_strdup_printf ("%.2f", methyl_a (t) * 4.184);
    g_assert_cmpstr (cw_result_sheet_get_cell (win->result_sheet, 1, 1), ==, kj);
  }
  g_settings_set_string (win->settings, "energy-unit", "kcal");

  /* At -78 °C the equatorial chair gains. */
  t = 195.15;
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", t);
  {
    g_autofree char *cold = expected_pop (2, equatorial_fraction (methyl_a (t), t));
    g_assert_true (g_str_has_prefix (cw_steady_label_get_text (win->pop2_label), cold));
  }
  destroy_window (win);
}

/* The temperature slider moves the document's temperature, and the header's temperature
 * button follows it while the slider is dragged (not only when the temperature is set
 * elsewhere). 310.15 K = 37.0 °C: 0 °C is 273.15 K by the definition of the Celsius scale
 * (BIPM, The International System of Units, 9th edition, 2019). */
static void
test_temperature_slider (void)
{
  CwWindow *win = new_window ();

  g_settings_set_string (win->settings, "temperature-unit", "celsius");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", 310.15);
  g_assert_cmpfloat_with_epsilon (gtk_adjustment_get_value (win->temperature_adjustment), 37.0, 1e-9);
  g_assert_nonnull (strstr (cw_steady_label_get_text (win->temperature_label), "37.0"));

  /* What a drag does: the adjustment moves a step at a time. */
  for (int i = 1; i <= 3; i++)
    {
      g_autofree char *expected = g_strdup_printf ("%.1f", 37.0 + i);

      gtk_adjustment_set_value (win->temperature_adjustment, 37.0 + i);
      g_assert_cmpfloat_with_epsilon (cw_document_get_temperature (cw_window_get_document (win)), 310.15 + i, 1e-9);
      g_assert_nonnull (strstr (cw_steady_label_get_text (win->temperature_label), expected));
    }
  /* Undo takes back the drag (temperature changes less than a second apart are one step),
   * and the slider and the button follow the document. */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  {
    double           c = cw_document_get_temperature (cw_window_get_document (win)) - 273.15;
    g_autofree char *expected = g_strdup_printf ("%.1f", c);

    g_assert_cmpfloat (c, <, 38.0);
    g_assert_cmpfloat_with_epsilon (gtk_adjustment_get_value (win->temperature_adjustment), c, 1e-9);
    g_assert_nonnull (strstr (cw_steady_label_get_text (win->temperature_label), expected));
  }
  destroy_window (win);
}

static void
test_undo_redo (void)
{
  CwWindow        *win = new_window ();
  g_autofree char *spec = NULL;

  set_group (win, 1, "up", "methyl");
  set_group (win, 3, "up", "methyl");
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 2);
  /* cis-1,3-dimethyl: diaxial chair 1 carries the syn-axial Me/Me pair, so chair 2 wins strongly. */
  g_assert_cmpfloat (cw_window_get_analysis (win)->pop[1], >, 0.999);

  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 1);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 0);
  g_assert_false (cw_window_get_modified (win));
  g_assert_true (g_str_has_prefix (cw_steady_label_get_text (win->pop1_label), "Chair 1: 50.0 %"));
  gtk_widget_activate_action (GTK_WIDGET (win), "win.redo", NULL);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.redo", NULL);
  spec = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (win)));
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 2);
  g_assert_true (cw_window_get_modified (win));

  /* Removing and clearing are edits too. */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.clear-carbon", "i", 3);
  g_assert_cmpint (cw_document_peek_molecule (cw_window_get_document (win))->n_subs, ==, 1);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.undo", NULL);
  {
    g_autofree char *again = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (win)));
    g_assert_cmpstr (again, ==, spec);
  }
  destroy_window (win);
}

static void
test_geminal_and_custom (void)
{
  CwWindow         *win = new_window ();
  const CwMolecule *mol;

  set_group (win, 2, "up", "methyl");
  set_group (win, 2, "down", "phenyl");
  mol = cw_document_peek_molecule (cw_window_get_document (win));
  g_assert_nonnull (cw_molecule_get (mol, 2, CW_FACE_UP));
  g_assert_nonnull (cw_molecule_get (mol, 2, CW_FACE_DOWN));

  gtk_widget_activate_action (GTK_WIDGET (win), "win.place-custom-group", "(sddsis)", "CH2OTBS", 1.5, 0.3,
                              "my own estimate", 4, "down");
  mol = cw_document_peek_molecule (cw_window_get_document (win));
  g_assert_nonnull (cw_molecule_get (mol, 4, CW_FACE_DOWN));
  g_assert_true (cw_molecule_get (mol, 4, CW_FACE_DOWN)->group->custom);
  g_assert_cmpfloat_with_epsilon (cw_molecule_get (mol, 4, CW_FACE_DOWN)->group->a, 1.5, 1e-9);
  g_assert_true (cw_analysis_has_flag (cw_window_get_analysis (win), CW_FLAG_CUSTOM_GROUP));
  destroy_window (win);
}

static void
test_custom_group_dialog (void)
{
  CwWindow            *win = new_window ();
  GtkWidget           *dialog = NULL;
  GListModel          *toplevels = gtk_window_get_toplevels (); /* borrowed */
  const CwSubstituent *s;

  gtk_widget_activate_action (GTK_WIDGET (win), "win.select-carbon", "i", 2);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.custom-group", NULL);
  for (guint i = 0; i < g_list_model_get_n_items (toplevels); i++)
    {
      g_autoptr (GObject) w = g_list_model_get_item (toplevels, i);

      if (CW_IS_CUSTOM_GROUP_DIALOG (w))
        dialog = GTK_WIDGET (w);
    }
  g_assert_nonnull (dialog);
#define CHILD(name) gtk_widget_get_template_child (dialog, CW_TYPE_CUSTOM_GROUP_DIALOG, name)
  /* An empty name is refused, with the reason shown in the dialog. */
  g_signal_emit_by_name (CHILD ("add_button"), "clicked");
  g_assert_true (gtk_widget_get_visible (GTK_WIDGET (CHILD ("error_label"))));
  gtk_editable_set_text (GTK_EDITABLE (CHILD ("name_entry")), "CH2OTBS");
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (CHILD ("a_spin")), 1.6);
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (CHILD ("sigma_spin")), 0.3);
  gtk_editable_set_text (GTK_EDITABLE (CHILD ("source_entry")), "lab estimate");
  gtk_drop_down_set_selected (GTK_DROP_DOWN (CHILD ("face_dropdown")), 1);
  g_signal_emit_by_name (CHILD ("add_button"), "clicked");
#undef CHILD
  app_test_pump (50, NULL);
  s = cw_molecule_get (cw_document_peek_molecule (cw_window_get_document (win)), 2, CW_FACE_DOWN);
  g_assert_nonnull (s);
  g_assert_true (s->group->custom);
  g_assert_cmpstr (s->group->label, ==, "CH2OTBS");
  g_assert_cmpfloat_with_epsilon (s->group->a, 1.6, 1e-9);
  g_assert_cmpfloat_with_epsilon (s->group->a_sigma, 0.3, 1e-9);
  g_assert_cmpstr (s->group->source, ==, "lab estimate");
  destroy_window (win);
}

static void
test_save_open_round_trip (void)
{
  CwWindow        *win = new_window ();
  CwWindow        *other;
  g_autofree char *path = app_test_tmp_path ("round-trip.json");
  g_autofree char *spec1 = NULL, *spec2 = NULL;
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GError) error = NULL;

  set_group (win, 1, "up", "tert-butyl");
  set_group (win, 3, "down", "chloro");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.place-custom-group", "(sddsis)", "Xq", 0.8, 0.1, "test value",
                              5, "up");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", 223.15);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.save-to", "s", path);
  g_assert_false (cw_window_get_modified (win));
  g_assert_true (g_file_test (path, G_FILE_TEST_EXISTS));
  spec1 = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (win)));

  other = new_window ();
  g_assert_true (cw_window_open_file (other, file, &error));
  g_assert_no_error (error);
  spec2 = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (other)));
  g_assert_cmpstr (spec1, ==, spec2);
  g_assert_cmpfloat_with_epsilon (cw_document_get_temperature (cw_window_get_document (other)), 223.15, 1e-9);
  g_assert_cmpfloat_with_epsilon (cw_window_get_analysis (other)->delta_g, cw_window_get_analysis (win)->delta_g,
                                  1e-9);
  g_assert_false (cw_window_get_modified (other));
  /* The opened file went into the recent list. */
  {
    g_auto (GStrv) recent = g_settings_get_strv (other->settings, "recent-files");
    g_assert_cmpstr (recent[0], ==, path);
    /* … and into the Open Recent menu. */
    g_assert_cmpint (g_menu_model_get_n_items (G_MENU_MODEL (other->recent_section)), >=, 1);
  }
  destroy_window (other);
  destroy_window (win);
}

static void
test_drop_document (void)
{
  CwWindow        *win = new_window ();
  CwWindow        *target;
  g_autofree char *path = app_test_tmp_path ("dropped.json");
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GListModel) controllers = NULL;
  GSList  *list = g_slist_prepend (NULL, file);
  GValue   value = G_VALUE_INIT;
  gboolean handled = FALSE;

  /* Write a document, then drop it on a fresh window: the window opens it. */
  set_group (win, 2, "down", "phenyl");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.save-to", "s", path);
  destroy_window (win);

  target = new_window ();
  controllers = gtk_widget_observe_controllers (GTK_WIDGET (target));
  g_value_init (&value, GDK_TYPE_FILE_LIST);
  g_value_take_boxed (&value, gdk_file_list_new_from_list (list));
  g_slist_free (list);
  for (guint i = 0; i < g_list_model_get_n_items (controllers); i++)
    {
      g_autoptr (GObject) c = g_list_model_get_item (controllers, i);

      if (GTK_IS_DROP_TARGET (c))
        g_signal_emit_by_name (c, "drop", &value, 10.0, 10.0, &handled);
    }
  g_value_unset (&value);
  g_assert_true (handled);
  g_assert_nonnull (cw_window_get_file (target));
  g_assert_true (g_file_equal (cw_window_get_file (target), file));
  g_assert_nonnull (cw_molecule_get (cw_document_peek_molecule (cw_window_get_document (target)), 2, CW_FACE_DOWN));
  destroy_window (target);
}

static void
test_open_bad_file (void)
{
  CwWindow        *win = new_window ();
  g_autofree char *path = app_test_tmp_path ("bad.json");
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GError) error = NULL;

  g_assert_true (g_file_set_contents (path, "{ \"format\": \"chairwise-document\", ", -1, NULL));
  g_assert_false (cw_window_open_file (win, file, &error));
  g_assert_nonnull (error);
  /* The window keeps its (empty) document. */
  g_assert_true (cw_window_is_pristine (win));
  destroy_window (win);
}

static gboolean
has_magic (const char *path, const char *magic, gsize len)
{
  g_autofree char *contents = NULL;
  gsize            n = 0;

  if (!g_file_get_contents (path, &contents, &n, NULL))
    return FALSE;
  return n > len && memcmp (contents, magic, len) == 0;
}

static void
test_export (void)
{
  CwWindow        *win = new_window ();
  g_autofree char *png = app_test_tmp_path ("chairs.png");
  g_autofree char *svg = app_test_tmp_path ("profile.svg");
  g_autofree char *pdf = app_test_tmp_path ("scan.pdf");
  g_autofree char *report = app_test_tmp_path ("report.pdf");
  g_autoptr (GdkTexture) texture = NULL;

  set_group (win, 1, "up", "methyl");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "chairs.png", png);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "profile.svg", svg);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "scan.pdf", pdf);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "report-a4.pdf", report);
  /* File signatures from the PNG (RFC 2083), PDF (ISO 32000) and XML specifications. */
  g_assert_true (has_magic (png, "\x89PNG\r\n\x1a\n", 8));
  g_assert_true (has_magic (svg, "<?xml", 5));
  g_assert_true (has_magic (pdf, "%PDF-", 5));
  g_assert_true (has_magic (report, "%PDF-", 5));
  texture = gdk_texture_new_from_filename (png, NULL);
  g_assert_nonnull (texture);
  g_assert_cmpint (gdk_texture_get_width (texture), >, 100);
  destroy_window (win);
}

/* Reads an XYZ file (count line, comment line, "El x y z" lines) into elements and
 * coordinates; fails the test if the format is wrong. */
static int
read_xyz (const char *path, char elements[][3], double xyz[][3], int max_atoms)
{
  g_autofree char *contents = NULL;
  g_auto (GStrv) lines = NULL;
  guint n_lines;
  int   n;
  char *end;

  g_assert_true (g_file_get_contents (path, &contents, NULL, NULL));
  lines = g_strsplit (contents, "\n", -1);
  n_lines = g_strv_length (lines);
  n = (int) strtol (lines[0], &end, 10);
  g_assert_true (end != lines[0] && *end == '\0');
  g_assert_cmpint (n, >, 0);
  g_assert_cmpint (n, <=, max_atoms);
  /* count + comment + n atom lines, and the final newline's empty piece */
  g_assert_cmpuint (n_lines, ==, (guint) n + 3);
  g_assert_cmpstr (lines[n + 2], ==, "");
  for (int i = 0; i < n; i++)
    {
      char el[8];

      g_assert_cmpint (sscanf (lines[i + 2], "%7s %lf %lf %lf", el, &xyz[i][0], &xyz[i][1], &xyz[i][2]), ==, 4);
      g_assert_cmpuint (strlen (el), <=, 2);
      g_strlcpy (elements[i], el, 3);
    }
  return n;
}

static double
dist (const double a[3], const double b[3])
{
  return sqrt ((a[0] - b[0]) * (a[0] - b[0]) + (a[1] - b[1]) * (a[1] - b[1]) + (a[2] - b[2]) * (a[2] - b[2]));
}

/* Methylcyclohexane, methyl up on C1: axial in chair 1, equatorial in chair 2 (the axial bonds
 * run along the ring's threefold axis, z in the file). Returns |cos| of the Me–C1 bond to z. */
static double
methyl_axis_cos (const char *path)
{
  char   el[32][3];
  double xyz[32][3];
  int    n = read_xyz (path, el, xyz, 32);
  int    n_c = 0, methyl = -1, c1 = -1;

  for (int i = 0; i < n; i++)
    {
      int bonded_c = 0, last = -1;

      g_assert_true (g_strcmp0 (el[i], "C") == 0 || g_strcmp0 (el[i], "H") == 0);
      if (g_strcmp0 (el[i], "C") != 0)
        continue;
      n_c++;
      for (int j = 0; j < n; j++)
        if (j != i && g_strcmp0 (el[j], "C") == 0 && dist (xyz[i], xyz[j]) < 1.65)
          {
            bonded_c++;
            last = j;
            /* C–C single bond 1.53 ± 0.02 Å (Allen et al., J. Chem. Soc. Perkin Trans. 2 1987, S1). */
            g_assert_cmpfloat_with_epsilon (dist (xyz[i], xyz[j]), 1.53, 0.02);
          }
      if (bonded_c == 1)
        {
          methyl = i;
          c1 = last;
        }
    }
  g_assert_cmpint (n_c, ==, 7);
  g_assert_cmpint (methyl, >=, 0);
  return fabs (xyz[methyl][2] - xyz[c1][2]) / dist (xyz[methyl], xyz[c1]);
}

static void
test_export_xyz (void)
{
  CwWindow        *win = new_window ();
  g_autofree char *xyz1 = app_test_tmp_path ("chair1.xyz");
  g_autofree char *xyz2 = app_test_tmp_path ("chair2.xyz");
  g_autoptr (GError) error = NULL;

  set_group (win, 1, "up", "methyl");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "chair1.xyz", xyz1);
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "chair2.xyz", xyz2);
  /* Axial: along the axis (cos 1); equatorial: at 109.5° − 90° ≈ 19.5° below the ring's mean
   * plane at most, so |cos| < 0.5 (ideal tetrahedral geometry, common practice (no source)). */
  g_assert_cmpfloat (methyl_axis_cos (xyz1), >, 0.95);
  g_assert_cmpfloat (methyl_axis_cos (xyz2), <, 0.5);
  /* Exporting again replaces the file whole. */
  set_group (win, 1, "up", "hydroxy");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.export-to", "(ss)", "chair1.xyz", xyz1);
  {
    char   el[32][3];
    double xyz[32][3];
    int    n = read_xyz (xyz1, el, xyz, 32), n_o = 0;

    for (int i = 0; i < n; i++)
      n_o += g_strcmp0 (el[i], "O") == 0;
    g_assert_cmpint (n_o, ==, 1);
  }
  g_assert_false (cw_window_export_to (win, "chair1.xyz", "/nonexistent-dir/x.xyz", &error));
  g_assert_nonnull (error);
  destroy_window (win);
}

static void
test_copy_figure (void)
{
  CwWindow          *win = new_window ();
  GdkClipboard      *clipboard = gtk_widget_get_clipboard (GTK_WIDGET (win));
  GdkContentFormats *formats;

  set_group (win, 1, "up", "methyl");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.copy-figure", "s", "chairs");
  formats = gdk_clipboard_get_formats (clipboard);
  g_assert_true (gdk_clipboard_is_local (clipboard));
  g_assert_true (gdk_content_formats_contain_mime_type (formats, "image/png"));
  g_assert_true (gdk_content_formats_contain_mime_type (formats, "image/svg+xml"));
  destroy_window (win);
}

static void
test_unsaved_changes (void)
{
  CwWindow        *win = new_window ();
  g_autofree char *path = app_test_tmp_path ("unsaved.json");
  g_autoptr (GFile) file = g_file_new_for_path (path);
  gpointer weak = win;

  g_object_add_weak_pointer (G_OBJECT (win), &weak);
  set_group (win, 1, "up", "methyl");

  /* Close with changes: the window stays and asks. Cancel keeps it. */
  gtk_window_close (GTK_WINDOW (win));
  app_test_pump (50, NULL);
  g_assert_nonnull (weak);
  g_assert_nonnull (win->pending_dialog);
  gtk_dialog_response (GTK_DIALOG (win->pending_dialog), GTK_RESPONSE_CANCEL);
  app_test_pump (50, NULL);
  g_assert_nonnull (weak);
  g_assert_null (win->pending_dialog);

  /* Save: with a file already set, the document is written and the window closes. */
  g_set_object (&win->file, file);
  gtk_window_close (GTK_WINDOW (win));
  app_test_pump (50, NULL);
  g_assert_nonnull (win->pending_dialog);
  gtk_dialog_response (GTK_DIALOG (win->pending_dialog), GTK_RESPONSE_ACCEPT);
  app_test_pump (100, NULL);
  g_assert_null (weak);
  g_assert_true (g_file_test (path, G_FILE_TEST_EXISTS));

  /* Discard: the window closes and the changes are not written. */
  win = new_window ();
  weak = win;
  g_object_add_weak_pointer (G_OBJECT (win), &weak);
  set_group (win, 2, "down", "bromo");
  gtk_window_close (GTK_WINDOW (win));
  app_test_pump (50, NULL);
  g_assert_nonnull (win->pending_dialog);
  gtk_dialog_response (GTK_DIALOG (win->pending_dialog), GTK_RESPONSE_REJECT);
  app_test_pump (100, NULL);
  g_assert_null (weak);
}

static void
test_autosave_restore (void)
{
  CwWindow        *win = new_window ();
  CwWindow        *other;
  g_autofree char *saved_path = NULL;
  g_autofree char *spec = NULL;
  g_autoptr (GError) error = NULL;

  set_group (win, 1, "up", "isopropyl");
  /* The autosave timer runs after a few seconds; run it now. */
  g_assert_cmpuint (win->autosave_id, !=, 0);
  g_source_remove (win->autosave_id);
  win->autosave_id = 0;
  cw_window_schedule_autosave (win);
  {
    GSource *src = g_main_context_find_source_by_id (NULL, win->autosave_id);
    g_source_set_ready_time (src, 0);
  }
  app_test_pump (50, NULL);
  g_assert_nonnull (win->autosave_path);
  g_assert_true (g_file_test (win->autosave_path, G_FILE_TEST_EXISTS));
  saved_path = g_strdup (win->autosave_path);
  spec = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (win)));

  /* As after a crash: another window restores the file, marked as modified. */
  other = new_window ();
  g_assert_true (cw_window_restore_autosave (other, saved_path, &error));
  g_assert_no_error (error);
  g_assert_true (cw_window_get_modified (other));
  {
    g_autofree char *again = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (other)));
    g_assert_cmpstr (again, ==, spec);
  }
  g_assert_false (g_file_test (saved_path, G_FILE_TEST_EXISTS));
  destroy_window (other);
  destroy_window (win);
}

static void
count_notify (GObject *object, GParamSpec *pspec, int *n)
{
  (*n)++;
}

/* The desktop's colour scheme: "prefer-dark" turns on GTK's dark style, anything else turns
 * it off, and a value that changes nothing does not touch GtkSettings (which would make GTK
 * load the theme again). */
static void
test_dark_style (void)
{
  GtkSettings *settings = gtk_settings_get_default ();
  CwWindow    *win = new_window ();
  gboolean     dark = TRUE;
  int          n = 0;
  gulong       id;

  g_object_set (settings, "gtk-application-prefer-dark-theme", FALSE, NULL);
  id = g_signal_connect (settings, "notify::gtk-application-prefer-dark-theme", G_CALLBACK (count_notify), &n);
  cw_application_apply_color_scheme ("default");
  g_assert_cmpint (n, ==, 0);
  cw_application_apply_color_scheme ("prefer-dark");
  g_object_get (settings, "gtk-application-prefer-dark-theme", &dark, NULL);
  g_assert_true (dark);
  g_assert_cmpint (n, ==, 1);
  app_test_pump (5, NULL);
  cw_application_apply_color_scheme ("prefer-dark");
  g_assert_cmpint (n, ==, 1);
  cw_application_apply_color_scheme ("prefer-light");
  g_object_get (settings, "gtk-application-prefer-dark-theme", &dark, NULL);
  g_assert_false (dark);
  g_assert_cmpint (n, ==, 2);
  g_signal_handler_disconnect (settings, id);
  destroy_window (win);
}

/* The result sheet (flags, title, terms table) redraws new content that fits the room it
 * has, grows at once when the content needs more, and gives room back when asked (or
 * after a pause); its text (copied with Ctrl+C) has the flags, the title and the table
 * with tab-separated cells. */
static void
test_result_sheet (void)
{
  /* The texts below test the widget's layout only: their digits are made up and mean
   * nothing chemically (no source needed; no result is checked here). */
  GtkWidget        *window = gtk_window_new ();
  GtkWidget        *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 0);
  CwResultSheet    *sheet = CW_RESULT_SHEET (g_object_new (CW_TYPE_RESULT_SHEET, "title", "Terms", NULL));
  const CwSheetRow  two[] = { { { "Term", "Chair 1", "Chair 2", "Source" }, TRUE },
                              { { "1,3-diaxial", "0.87", "–", "a table" }, FALSE } };
  const CwSheetRow  other[] = { two[0], { { "1,3-diaxial", "0.12", "–", "a table" }, FALSE } };
  const CwSheetRow  three[] = { two[0], two[1], { { "Total", "0.87", NULL, NULL }, TRUE } };
  const CwSheetFlag flag[] = { { "A warning that is long enough to wrap onto a second line in a window this narrow", FALSE },
                               { "A note", TRUE } };
  GdkContentProvider *content;
  GValue              value = G_VALUE_INIT;
  gboolean            info = FALSE;
  int                 h2, h3;

  gtk_box_append (GTK_BOX (box), GTK_WIDGET (sheet));
  gtk_window_set_child (GTK_WINDOW (window), box);
  gtk_window_set_default_size (GTK_WINDOW (window), 360, -1);
  gtk_window_present (GTK_WINDOW (window));
  app_test_wait_mapped (window);
  g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, two, 2), ==, CW_SHEET_RESIZED);
  app_test_pump (100, NULL);
  h2 = gtk_widget_get_height (GTK_WIDGET (sheet));
  g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, two, 2), ==, CW_SHEET_UNCHANGED);
  /* Tabular figures: another number of the same length keeps every column's width. */
  g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, other, 2), ==, CW_SHEET_REDRAWN);
  g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, three, 3), ==, CW_SHEET_RESIZED);
  app_test_pump (100, NULL);
  h3 = gtk_widget_get_height (GTK_WIDGET (sheet));
  g_assert_cmpint (h3, >, h2);
  /* Fewer rows fit the room it has: redrawn, and the room is kept until given back. */
  g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, two, 2), ==, CW_SHEET_REDRAWN);
  app_test_pump (100, NULL);
  g_assert_cmpint (gtk_widget_get_height (GTK_WIDGET (sheet)), ==, h3);
  cw_result_sheet_shrink (sheet);
  app_test_pump (100, NULL);
  g_assert_cmpint (gtk_widget_get_height (GTK_WIDGET (sheet)), ==, h2);

  /* Flags above the title: more room, then a changed text of the same length is redrawn. */
  g_assert_cmpint (cw_result_sheet_set_content (sheet, flag, 2, three, 3), ==, CW_SHEET_RESIZED);
  app_test_pump (100, NULL);
  g_assert_cmpint (gtk_widget_get_height (GTK_WIDGET (sheet)), >, h3);
  g_assert_cmpuint (cw_result_sheet_get_n_flags (sheet), ==, 2);
  g_assert_cmpstr (cw_result_sheet_get_flag (sheet, 1, &info), ==, "A note");
  g_assert_true (info);
  g_assert_null (cw_result_sheet_get_flag (sheet, 2, NULL));
  g_assert_cmpstr (cw_result_sheet_get_cell (sheet, 2, 2), ==, "");
  g_assert_null (cw_result_sheet_get_cell (sheet, 3, 0));
  g_assert_cmpstr (cw_result_sheet_get_text (sheet), ==,
                   "Warning: A warning that is long enough to wrap onto a second line in a window this narrow\n"
                   "Note: A note\n"
                   "Terms\n"
                   "Term\tChair 1\tChair 2\tSource\n1,3-diaxial\t0.87\t–\ta table\nTotal\t0.87\t\t\n");

  gtk_widget_activate_action (GTK_WIDGET (sheet), "sheet.copy", NULL);
  content = gdk_clipboard_get_content (gtk_widget_get_clipboard (GTK_WIDGET (sheet)));
  g_assert_nonnull (content);
  g_value_init (&value, G_TYPE_STRING);
  g_assert_true (gdk_content_provider_get_value (content, &value, NULL));
  g_assert_cmpstr (g_value_get_string (&value), ==, cw_result_sheet_get_text (sheet));
  g_value_unset (&value);

  /* Rows that shift down when one is put in above them, and more different texts than
   * the sheet keeps laid out for later: every cell still shows its own text. */
  for (int i = 0; i < 600; i++)
    {
      g_autofree char *number = g_strdup_printf ("%d.%02d", i / 100, i % 100);
      const CwSheetRow rows[] = { two[0], { { "Term", number, "–", "a table" }, FALSE }, two[1] };
      guint            first = i % 2 == 0 ? 1 : 0;

      g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, rows + first, 3 - first), !=, CW_SHEET_UNCHANGED);
      /* The heading's "Term" is bold, the row's is not: the same text, two cells. */
      g_assert_cmpstr (cw_result_sheet_get_cell (sheet, 0, 0), ==, "Term");
      g_assert_cmpstr (cw_result_sheet_get_cell (sheet, 0, 1), ==, first == 1 ? number : "Chair 1");
      g_assert_cmpstr (cw_result_sheet_get_cell (sheet, 1 - first, 1), ==, number);
      g_assert_cmpstr (cw_result_sheet_get_cell (sheet, 2 - first, 1), ==, "0.87");
      if (i % 50 == 0)
        app_test_pump (5, NULL);
    }
  app_test_pump (20, NULL);

  g_assert_cmpint (cw_result_sheet_set_content (sheet, NULL, 0, NULL, 0), ==, CW_SHEET_REDRAWN);
  g_assert_cmpstr (cw_result_sheet_get_text (sheet), ==, "Terms\n");
  gtk_window_destroy (GTK_WINDOW (window));
  app_test_pump (5, NULL);
}

/* A steady label is only redrawn when a new text fits the size it has (widths in steps of
 * four characters, tabular figures), and asks for a new size when it does not. */
static void
test_steady_label (void)
{
  /* Layout test only: the digits in these texts are made up, not results. */
  GtkWidget     *window = gtk_window_new ();
  GtkWidget     *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 0);
  CwSteadyLabel *label = CW_STEADY_LABEL (cw_steady_label_new ());
  CwSteadyLabel *wrapped = CW_STEADY_LABEL (g_object_new (CW_TYPE_STEADY_LABEL, "wrap", TRUE, "copyable", TRUE, NULL));
  GdkContentProvider *content;
  GValue              value = G_VALUE_INIT;

  gtk_box_append (GTK_BOX (box), GTK_WIDGET (label));
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (wrapped));
  gtk_window_set_child (GTK_WINDOW (window), box);
  gtk_window_set_default_size (GTK_WINDOW (window), 300, -1);
  g_assert_true (cw_steady_label_set_text (label, "Chair 1: 68.3 % (35.0–89.7 %)"));
  g_assert_true (cw_steady_label_set_text (wrapped, "ΔG° = +0.38 kcal/mol"));
  gtk_window_present (GTK_WINDOW (window));
  app_test_wait_mapped (window);
  app_test_pump (100, NULL);
  g_assert_false (cw_steady_label_set_text (label, "Chair 1: 68.3 % (35.0–89.7 %)"));
  g_assert_false (cw_steady_label_set_text (label, "Chair 1: 95.0 % (93.1–96.4 %)"));
  g_assert_cmpstr (cw_steady_label_get_text (label), ==, "Chair 1: 95.0 % (93.1–96.4 %)");
  g_assert_true (cw_steady_label_set_text (label, "Chair 1: 95.0 % (93.1–96.4 %) and a good deal more text"));
  g_assert_false (cw_steady_label_set_text (wrapped, "ΔG° = −1.74 kcal/mol"));
  /* Too long for one line at this width: the wrapped label grows. */
  g_assert_true (cw_steady_label_set_text (wrapped, "ΔG° = G(chair 2) − G(chair 1) = −1.74 ± 0.02 kcal/mol at 25.0 °C;  K = 18.9"));
  app_test_pump (100, NULL);
  g_assert_cmpint (gtk_widget_get_height (GTK_WIDGET (wrapped)), >, gtk_widget_get_height (GTK_WIDGET (label)));

  /* The copyable one copies its text; the other has no copy action. */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (wrapped), "line.copy", NULL));
  content = gdk_clipboard_get_content (gtk_widget_get_clipboard (GTK_WIDGET (wrapped)));
  g_value_init (&value, G_TYPE_STRING);
  g_assert_true (gdk_content_provider_get_value (content, &value, NULL));
  g_assert_cmpstr (g_value_get_string (&value), ==, cw_steady_label_get_text (wrapped));
  g_value_unset (&value);
  gtk_widget_activate_action (GTK_WIDGET (label), "line.copy", NULL);
  content = gdk_clipboard_get_content (gtk_widget_get_clipboard (GTK_WIDGET (label)));
  g_value_init (&value, G_TYPE_STRING);
  g_assert_true (gdk_content_provider_get_value (content, &value, NULL));
  g_assert_cmpstr (g_value_get_string (&value), ==, cw_steady_label_get_text (wrapped));
  g_value_unset (&value);
  gtk_window_destroy (GTK_WINDOW (window));
  app_test_pump (5, NULL);
}

/* X11: frame sync follows the window manager's offer of it; under a bare X server (as in
 * these tests) it is off, so that no frame asks the X server about it again. */
static void
test_frame_sync (void)
{
#ifdef GDK_WINDOWING_X11
  CwWindow   *win = new_window ();
  GdkDisplay *display = gtk_widget_get_display (GTK_WIDGET (win));

  if (!GDK_IS_X11_DISPLAY (display))
    {
      destroy_window (win);
      g_test_skip ("not an X11 display");
      return;
    }
  g_assert_cmpint (win->frame_sync, ==,
                   gdk_x11_screen_supports_net_wm_hint (gdk_x11_display_get_screen (display),
                                                        g_intern_static_string ("_NET_WM_FRAME_DRAWN")));
  /* And, while it is off, a round trip to the X server before each frame. */
  g_assert_cmpuint (win->sync_id, !=, 0);
  destroy_window (win);
#else
  g_test_skip ("built without X11");
#endif
}

/* The memory Cairo shares with the X server for frames is paged in ahead of use: once a
 * window has drawn the demo, the top of that pool (8 MB, or all of it when smaller) is
 * resident, so the first frames that land there take no page faults. */
static void
test_frame_memory (void)
{
#if defined(GDK_WINDOWING_X11) && defined(__linux__)
  CwWindow        *win = new_window ();
  g_autofree char *demo = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (demo);
  gint64           end = g_get_monotonic_time () + 5 * G_USEC_PER_SEC;
  gsize            checked = 0;

  if (!GDK_IS_X11_DISPLAY (gtk_widget_get_display (GTK_WIDGET (win))) ||
      !GSK_IS_CAIRO_RENDERER (gtk_native_get_renderer (GTK_NATIVE (win))))
    {
      destroy_window (win);
      g_test_skip ("not the Cairo renderer on X11");
      return;
    }
  g_assert_true (cw_window_open_file (win, file, NULL));
  /* Found after a frame, then paged in a step at a time between frames. */
  while ((cw_frame_memory_find (8 << 20) == 0 || cw_frame_memory_get_prefaulted () < cw_frame_memory_find (8 << 20)) &&
         g_get_monotonic_time () < end)
    app_test_pump (20, NULL);
  g_assert_cmpuint (cw_frame_memory_find (8 << 20), >, 0);
  g_assert_cmpuint (cw_frame_memory_get_prefaulted (), ==, cw_frame_memory_find (8 << 20));

  /* Every page of what was set aside is resident now. */
  {
    gpointer start;
    gsize    length, page = (gsize) sysconf (_SC_PAGESIZE);

    for (guint r = 0; cw_frame_memory_get_range (r, &start, &length); r++)
      {
        g_autofree unsigned char *resident = g_malloc (length / page);

        g_assert_cmpint (mincore (start, length, resident), ==, 0);
        for (gsize i = 0; i < length / page; i++)
          g_assert_cmpuint (resident[i] & 1, ==, 1);
        checked += length;
      }
  }
  g_assert_cmpuint (checked, ==, cw_frame_memory_get_prefaulted ());
  destroy_window (win);
#else
  g_test_skip ("needs X11 on Linux");
#endif
}

/* The main and export menus are built when they first open; they then hold the template's
 * menus, and open again as they are. */
static void
test_menus (void)
{
  CwWindow      *win = new_window ();
  GtkMenuButton *buttons[] = { win->primary_menu_button, win->export_menu_button };
  GMenuModel    *menus[] = { win->primary_menu, win->export_menu };

  for (guint i = 0; i < G_N_ELEMENTS (buttons); i++)
    {
      GtkWidget *popover;

      g_assert_null (gtk_menu_button_get_popover (buttons[i]));
      g_assert_true (gtk_widget_get_sensitive (GTK_WIDGET (buttons[i])));
      gtk_menu_button_popup (buttons[i]);
      app_test_pump (50, NULL);
      popover = GTK_WIDGET (gtk_menu_button_get_popover (buttons[i]));
      g_assert_nonnull (popover);
      g_assert_true (gtk_menu_button_get_menu_model (buttons[i]) == menus[i]);
      g_assert_cmpint (g_menu_model_get_n_items (menus[i]), >, 0);
      g_assert_true (gtk_widget_get_visible (popover));
      gtk_menu_button_popdown (buttons[i]);
      app_test_pump (50, NULL);
      gtk_menu_button_popup (buttons[i]);
      app_test_pump (50, NULL);
      g_assert_true (GTK_WIDGET (gtk_menu_button_get_popover (buttons[i])) == popover);
      g_assert_true (gtk_widget_get_visible (popover));
      gtk_menu_button_popdown (buttons[i]);
    }
  destroy_window (win);
}

int
main (int argc, char *argv[])
{
  if (!app_test_init (&argc, &argv))
    return 0;
  g_test_add_func ("/app/window/edit-updates-results", test_edit_updates_results);
  g_test_add_func ("/app/window/dark-style", test_dark_style);
  g_test_add_func ("/app/window/frame-sync", test_frame_sync);
  g_test_add_func ("/app/window/frame-memory", test_frame_memory);
  g_test_add_func ("/app/window/menus", test_menus);
  g_test_add_func ("/app/window/result-sheet", test_result_sheet);
  g_test_add_func ("/app/window/steady-label", test_steady_label);
  g_test_add_func ("/app/window/undo-redo", test_undo_redo);
  g_test_add_func ("/app/window/temperature-slider", test_temperature_slider);
  g_test_add_func ("/app/window/geminal-and-custom", test_geminal_and_custom);
  g_test_add_func ("/app/window/custom-group-dialog", test_custom_group_dialog);
  g_test_add_func ("/app/window/save-open-round-trip", test_save_open_round_trip);
  g_test_add_func ("/app/window/open-bad-file", test_open_bad_file);
  g_test_add_func ("/app/window/drop-document", test_drop_document);
  g_test_add_func ("/app/window/export", test_export);
  g_test_add_func ("/app/window/export-xyz", test_export_xyz);
  g_test_add_func ("/app/window/copy-figure", test_copy_figure);
  g_test_add_func ("/app/window/unsaved-changes", test_unsaved_changes);
  g_test_add_func ("/app/window/autosave-restore", test_autosave_restore);
  return g_test_run ();
}
