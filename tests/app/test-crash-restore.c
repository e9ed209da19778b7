/* kill -9 with unsaved work. A child process opens a window, makes edits, waits for the autosave
 * (the real timer, nothing forced) and is killed with SIGKILL. The parent then finds exactly one
 * autosave file, reads it as a complete document holding the edits, and restores it into a new
 * window as unsaved work. Only the window's public API and cw-autosave.h are used. */
#include "config.h"

#include <signal.h>
#include <unistd.h>

#include "app-test-helpers.h"
#include "cw-autosave.h"
#include "cw-window.h"

static const char *state_dir;

static void
edit_and_get_killed (void)
{
  CwWindow *win = g_object_new (CW_TYPE_WINDOW, NULL);
  gint64    deadline;

  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 1, "up", "isopropyl");
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 3, "down", "chloro");
  g_assert_true (cw_window_get_modified (win));
  /* The autosave runs a few seconds after an edit; wait for its file, then die at once. */
  deadline = g_get_monotonic_time () + 30 * G_USEC_PER_SEC;
  while (g_get_monotonic_time () < deadline)
    {
      g_autoptr (GPtrArray) files = NULL;

      app_test_pump (100, NULL);
      files = cw_autosave_list ();
      if (files->len > 0)
        kill (getpid (), SIGKILL);
    }
  g_error ("no autosave file appeared within 30 s");
}

static void
test_kill9_restore (void)
{
  g_autoptr (GPtrArray) files = NULL;
  g_autoptr (GPtrArray) after = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (CwData) data = NULL;
  g_autoptr (CwDocument) doc = NULL;
  const CwMolecule *mol;
  CwWindow         *win;

  if (g_test_subprocess ())
    {
      edit_and_get_killed ();
      return;
    }
  g_test_trap_subprocess (NULL, 90 * G_USEC_PER_SEC, G_TEST_SUBPROCESS_INHERIT_STDERR);
  g_assert_false (g_test_trap_reached_timeout ());
  g_assert_false (g_test_trap_has_passed ()); /* it was killed, not finished */

  /* What a restart finds: one autosave file, a whole document with both edits. */
  files = cw_autosave_list ();
  g_assert_cmpuint (files->len, ==, 1);
  g_test_message ("autosave in %s: %s", state_dir, (char *) files->pdata[0]);
  data = cw_data_new_from_dir (NULL, &error);
  g_assert_no_error (error);
  doc = cw_document_new_from_file (files->pdata[0], data->groups, &error);
  g_assert_no_error (error);
  mol = cw_document_peek_molecule (doc);
  g_assert_cmpint (mol->n_subs, ==, 2);
  g_assert_cmpstr (cw_molecule_get (mol, 1, CW_FACE_UP)->group->id, ==, "isopropyl");
  g_assert_cmpstr (cw_molecule_get (mol, 3, CW_FACE_DOWN)->group->id, ==, "chloro");

  /* Restored into a fresh window: the same molecule, still marked unsaved. */
  win = g_object_new (CW_TYPE_WINDOW, NULL);
  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));
  g_assert_true (cw_window_restore_autosave (win, files->pdata[0], &error));
  g_assert_no_error (error);
  g_assert_true (cw_window_get_modified (win));
  {
    g_autofree char *want = cw_molecule_dup_spec (mol);
    g_autofree char *got = cw_molecule_dup_spec (cw_document_peek_molecule (cw_window_get_document (win)));

    g_assert_cmpstr (got, ==, want);
  }
  /* The killed process's file is gone; this window's own autosave holds the work now. */
  g_assert_false (g_file_test (files->pdata[0], G_FILE_TEST_EXISTS));
  after = cw_autosave_list ();
  g_assert_cmpuint (after->len, ==, 1);
  gtk_window_destroy (GTK_WINDOW (win));
  app_test_pump (20, NULL);
}

int
main (int argc, char **argv)
{
  /* The child must see the parent's state directory, so choose it here, before anything
   * reads XDG_STATE_HOME, and pass it down. */
  state_dir = g_getenv ("CW_TEST_CRASH_STATE");
  if (state_dir == NULL)
    {
      state_dir = g_dir_make_tmp ("cw-crash-XXXXXX", NULL);
      g_setenv ("CW_TEST_CRASH_STATE", state_dir, TRUE);
    }
  g_setenv ("XDG_STATE_HOME", state_dir, TRUE);
  g_test_init (&argc, &argv, NULL);
  if (!gtk_init_check ())
    {
      if (g_strcmp0 (g_getenv ("CHAIRWISE_REQUIRE_DISPLAY"), "1") == 0)
        {
          printf ("Bail out! no display, and CHAIRWISE_REQUIRE_DISPLAY=1\n");
          return 1;
        }
      printf ("1..0 # SKIP no display\n");
      return 0;
    }
  g_test_add_func ("/app/crash-restore/kill9", test_kill9_restore);
  return g_test_run ();
}
