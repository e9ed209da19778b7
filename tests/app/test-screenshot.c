#include "config.h"

#include <string.h>

#include "app-test-helpers.h"
#include "cw-window-private.h"

/* Pixels of rect (in window coordinates) that differ from the rect's most common colour. */
static double
busy_fraction (const guint32 *px,
               int            stride,
               int            x0,
               int            y0,
               int            w,
               int            h,
               guint         *n_colours)
{
  g_autoptr (GHashTable) counts = g_hash_table_new (NULL, NULL);
  guint          best = 0, total = 0;
  GHashTableIter it;
  gpointer       key, value;

  for (int y = y0; y < y0 + h; y++)
    for (int x = x0; x < x0 + w; x++)
      {
        guint32 c = px[y * stride + x];
        guint   n = GPOINTER_TO_UINT (g_hash_table_lookup (counts, GUINT_TO_POINTER (c))) + 1;

        g_hash_table_insert (counts, GUINT_TO_POINTER (c), GUINT_TO_POINTER (n));
        total++;
      }
  g_hash_table_iter_init (&it, counts);
  while (g_hash_table_iter_next (&it, &key, &value))
    best = MAX (best, GPOINTER_TO_UINT (value));
  *n_colours = g_hash_table_size (counts);
  return total ? 1.0 - (double) best / total : 0.0;
}

static void
test_screenshot_not_blank (void)
{
  CwWindow        *win = g_object_new (CW_TYPE_WINDOW, NULL);
  g_autofree char *demo = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  g_autofree char *path = app_test_tmp_path ("window.png");
  g_autoptr (GFile) file = g_file_new_for_path (demo);
  g_autoptr (GError) error = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  g_autofree guint32 *px = NULL;
  graphene_rect_t     bounds;
  guint               n_colours;
  int                 w, h;
  double              busy;
  gboolean            saved;

  g_assert_true (cw_window_open_file (win, file, &error));
  g_assert_no_error (error);
  gtk_window_set_default_size (GTK_WINDOW (win), 1100, 760);
  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));

  /* A redraw asked for just before, as a blinking cursor or a figure back from the worker
   * asks: GTK no longer hands out the last frame, and the screenshot takes the next. */
  gtk_widget_queue_draw (GTK_WIDGET (win->chairs_area));
  saved = cw_window_save_screenshot (win, path, &error);
  g_assert_no_error (error);
  g_assert_true (saved);
  texture = gdk_texture_new_from_filename (path, &error);
  g_assert_no_error (error);
  w = gdk_texture_get_width (texture);
  h = gdk_texture_get_height (texture);
  g_assert_cmpint (w, >=, 600);
  g_assert_cmpint (h, >=, 400);
  px = g_new (guint32, (gsize) w * h);
  gdk_texture_download (texture, (guchar *) px, (gsize) w * 4);

  /* The whole window: text, ring and figures make a busy, many-coloured image. */
  busy = busy_fraction (px, w, 0, 0, w, h, &n_colours);
  g_test_message ("window: %.1f %% non-background pixels, %u colours", busy * 100, n_colours);
  g_assert_cmpfloat (busy, >, 0.03);
  g_assert_cmpuint (n_colours, >, 30);

  /* The chairs figure itself was drawn. */
  g_assert_true (gtk_widget_compute_bounds (GTK_WIDGET (win->chairs_area), GTK_WIDGET (win), &bounds));
  busy = busy_fraction (px, w, (int) bounds.origin.x, (int) bounds.origin.y,
                        MIN ((int) bounds.size.width, w - (int) bounds.origin.x),
                        MIN ((int) bounds.size.height, h - (int) bounds.origin.y), &n_colours);
  g_test_message ("chairs: %.1f %% non-background pixels, %u colours", busy * 100, n_colours);
  g_assert_cmpfloat (busy, >, 0.01);

  /* So was the ring canvas. */
  g_assert_true (gtk_widget_compute_bounds (GTK_WIDGET (win->ring_canvas), GTK_WIDGET (win), &bounds));
  busy = busy_fraction (px, w, (int) bounds.origin.x, (int) bounds.origin.y,
                        MIN ((int) bounds.size.width, w - (int) bounds.origin.x),
                        MIN ((int) bounds.size.height, h - (int) bounds.origin.y), &n_colours);
  g_assert_cmpfloat (busy, >, 0.01);

  win->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (win));
}

static guint32 *
window_pixels (CwWindow *win,
               int      *w,
               int      *h)
{
  g_autofree char *path = app_test_tmp_path ("pixels.png");
  g_autoptr (GError) error = NULL;
  g_autoptr (GdkTexture) texture = NULL;
  guint32 *px;
  gboolean saved;

  saved = cw_window_save_screenshot (win, path, &error);
  g_assert_no_error (error);
  g_assert_true (saved);
  texture = gdk_texture_new_from_filename (path, &error);
  g_assert_no_error (error);
  *w = gdk_texture_get_width (texture);
  *h = gdk_texture_get_height (texture);
  px = g_new (guint32, (gsize) *w * *h);
  gdk_texture_download (texture, (guchar *) px, (gsize) *w * 4);
  return px;
}

/* After an edit the changed figures are painted on a worker thread and copied onto the
 * screen; the window looks exactly as when it paints them itself. */
static void
test_worker_figures_same_pixels (void)
{
  CwWindow        *win = g_object_new (CW_TYPE_WINDOW, NULL);
  g_autofree char *demo = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (demo);
  g_autoptr (GError) error = NULL;
  g_autofree guint32 *from_worker = NULL, *from_window = NULL;
  int                 w1, h1, w2, h2;
  guint               n, layouts, differ = 0;

  g_assert_true (cw_window_open_file (win, file, &error));
  g_assert_no_error (error);
  gtk_window_set_default_size (GTK_WINDOW (win), 1100, 760);
  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));
  app_test_pump (300, NULL);
  /* The first figures were laid out and painted on the worker, whose fonts were loaded while
   * the window was built. */
  g_assert_cmpuint (win->n_worker_figures, >=, 2);

  n = win->n_worker_figures;
  layouts = win->n_worker_layouts;
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-group", "(iss)", 3, "up", "bromo");
  /* Past the table's giving back room (half a second), so the figures stay where they are. */
  app_test_pump (800, NULL);
  /* The chairs and the energy profile changed, and came from the worker, which also laid
   * them out: the groups on the ring changed. */
  g_assert_cmpuint (win->n_worker_figures, >=, n + 2);
  g_assert_cmpuint (win->n_worker_layouts, ==, layouts + 2);
  from_worker = window_pixels (win, &w1, &h1);

  /* The same figures painted by the window itself. */
  n = win->n_worker_figures;
  cw_window_clear_figures (win);
  gtk_widget_queue_draw (GTK_WIDGET (win->chairs_area));
  gtk_widget_queue_draw (GTK_WIDGET (win->profile_area));
  app_test_pump (300, NULL);
  g_assert_cmpuint (win->n_worker_figures, ==, n);
  from_window = window_pixels (win, &w2, &h2);

  g_assert_cmpint (w1, ==, w2);
  g_assert_cmpint (h1, ==, h2);
  /* The two figures' boxes (the rest of the window may change meanwhile: a blinking cursor,
   * the table giving back room). */
  for (guint f = 0; f < 2; f++)
    {
      GtkWidget      *area = GTK_WIDGET (f == 0 ? win->chairs_area : win->profile_area);
      graphene_rect_t b;

      g_assert_true (gtk_widget_compute_bounds (area, GTK_WIDGET (win), &b));
      g_assert_cmpfloat (b.size.width * b.size.height, >, 10000);
      for (int y = (int) b.origin.y; y < (int) (b.origin.y + b.size.height) && y < h1; y++)
        for (int x = (int) b.origin.x; x < (int) (b.origin.x + b.size.width) && x < w1; x++)
          differ += from_worker[(gsize) y * w1 + x] != from_window[(gsize) y * w1 + x];
    }
  g_assert_cmpuint (differ, ==, 0);

  /* A change of temperature keeps the groups: the figures are laid out here and compared with
   * what is on screen, not laid out on the worker. 310.15 K: body temperature, 37 °C (common
   * practice, no source needed); any other temperature would do. */
  gtk_widget_activate_action (GTK_WIDGET (win), "win.set-temperature", "d", 310.15);
  app_test_pump (300, NULL);
  g_assert_cmpfloat_with_epsilon (cw_window_get_analysis (win)->temperature, 310.15, 1e-9);
  g_assert_cmpuint (win->n_worker_layouts, ==, layouts + 2);

  win->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (win));
}

/* A window on the demo, at a fixed size, shown and drawn. */
static CwWindow *
demo_window (void)
{
  CwWindow        *win = g_object_new (CW_TYPE_WINDOW, NULL);
  g_autofree char *demo = g_build_filename (cw_data_find_dir (), "demo.json", NULL);
  g_autoptr (GFile) file = g_file_new_for_path (demo);
  g_autoptr (GError) error = NULL;

  g_assert_true (cw_window_open_file (win, file, &error));
  g_assert_no_error (error);
  gtk_window_set_default_size (GTK_WINDOW (win), 1100, 760);
  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));
  return win;
}

/* Runs action on win and returns how many drawings the ring canvas made for it. */
static guint
ring_drawings (CwWindow   *win,
               const char *action,
               const char *format,
               ...)
{
  guint   before = cw_ring_canvas_get_n_drawn (win->ring_canvas);
  va_list args;
  g_autoptr (GVariant) param = NULL;

  va_start (args, format);
  /* Owned here: activating an action does not take a floating reference. */
  param = g_variant_ref_sink (g_variant_new_va (format, NULL, &args));
  va_end (args);
  gtk_widget_activate_action_variant (GTK_WIDGET (win), action, param);
  app_test_pump (200, NULL);
  return cw_ring_canvas_get_n_drawn (win->ring_canvas) - before;
}

/* The ring canvas keeps its drawings from frame to frame: an edit on one carbon draws that
 * carbon's groups again and nothing else, a new selection the ring alone. What it shows is
 * what a window drawing the same molecule afresh shows. */
static void
test_ring_drawings (void)
{
  CwWindow        *win = demo_window (), *fresh;
  g_autofree char *path = app_test_tmp_path ("ring-edits.json");
  g_autoptr (GFile) file = g_file_new_for_path (path);
  g_autoptr (GError) error = NULL;
  g_autofree guint32 *edited = NULL, *drawn = NULL;
  int                 w1, h1, w2, h2;
  guint               differ = 0;
  graphene_rect_t     b;

  g_assert_cmpuint (ring_drawings (win, "win.set-group", "(iss)", 3, "up", "bromo"), ==, 1);
  g_assert_cmpuint (ring_drawings (win, "win.set-group", "(iss)", 5, "down", "methyl"), ==, 1);
  /* A geminal pair on carbon 5: both of its groups are drawn again, split. */
  g_assert_cmpuint (ring_drawings (win, "win.set-group", "(iss)", 5, "up", "hydroxy"), ==, 1);
  g_assert_cmpuint (ring_drawings (win, "win.remove-group", "(is)", 3, "up"), ==, 0);
  g_assert_cmpuint (ring_drawings (win, "win.select-carbon", "i", 2), ==, 1);
  /* A change of temperature leaves the ring as it is. 310.15 K: body temperature, as in the
   * test above (common practice, no source needed). */
  g_assert_cmpuint (ring_drawings (win, "win.set-temperature", "d", 310.15), ==, 0);

  gtk_widget_activate_action (GTK_WIDGET (win), "win.save-to", "s", path);
  fresh = g_object_new (CW_TYPE_WINDOW, NULL);
  g_assert_true (cw_window_open_file (fresh, file, &error));
  g_assert_no_error (error);
  gtk_window_set_default_size (GTK_WINDOW (fresh), 1100, 760);
  gtk_window_present (GTK_WINDOW (fresh));
  app_test_wait_mapped (GTK_WIDGET (fresh));
  gtk_widget_activate_action (GTK_WIDGET (fresh), "win.select-carbon", "i", 2);
  app_test_pump (300, NULL);

  edited = window_pixels (win, &w1, &h1);
  drawn = window_pixels (fresh, &w2, &h2);
  g_assert_cmpint (w1, ==, w2);
  g_assert_cmpint (h1, ==, h2);
  g_assert_true (gtk_widget_compute_bounds (GTK_WIDGET (win->ring_canvas), GTK_WIDGET (win), &b));
  for (int y = (int) b.origin.y; y < (int) (b.origin.y + b.size.height) && y < h1; y++)
    for (int x = (int) b.origin.x; x < (int) (b.origin.x + b.size.width) && x < w1; x++)
      differ += edited[(gsize) y * w1 + x] != drawn[(gsize) y * w1 + x];
  g_assert_cmpuint (differ, ==, 0);

  win->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (win));
  fresh->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (fresh));
}

/* The window's icon comes from pictures drawn at fixed sizes (data/icons/hicolor/NxN), so
 * setting it loads no SVG renderer (8 MB resident, measured when it did). Nothing else in
 * this program loads one. */
static void
test_window_icon (void)
{
  CwWindow     *win = g_object_new (CW_TYPE_WINDOW, NULL);
  GtkIconTheme *theme;
  gint64        end = g_get_monotonic_time () + 5 * G_USEC_PER_SEC;
  const int     sizes[] = { 16, 32, 48, 64, 128 };

  theme = gtk_icon_theme_get_for_display (gtk_widget_get_display (GTK_WIDGET (win)));
  /* Where the program's GtkApplication finds them (its resource base path + "/icons"); this
   * test runs the window without one. */
  if (!gtk_icon_theme_has_icon (theme, CW_APP_ID))
    gtk_icon_theme_add_resource_path (theme, "/org/chairwise/Chairwise/icons");
  gtk_window_present (GTK_WINDOW (win));
  app_test_wait_mapped (GTK_WIDGET (win));
  while (gtk_window_get_icon_name (GTK_WINDOW (win)) == NULL && g_get_monotonic_time () < end)
    app_test_pump (20, NULL);
  g_assert_cmpstr (gtk_window_get_icon_name (GTK_WINDOW (win)), ==, CW_APP_ID);
  app_test_pump (100, NULL);

  for (guint i = 0; i < G_N_ELEMENTS (sizes); i++)
    {
      g_autoptr (GtkIconPaintable) icon =
        gtk_icon_theme_lookup_icon (theme, CW_APP_ID, NULL, sizes[i], 1, GTK_TEXT_DIR_LTR, 0);
      g_autoptr (GFile) file = gtk_icon_paintable_get_file (icon);
      g_autofree char *uri = file ? g_file_get_uri (file) : NULL;

      g_assert_nonnull (uri);
      g_assert_nonnull (strstr (uri, CW_APP_ID));
      g_assert_true (g_str_has_suffix (uri, ".png"));
      g_assert_cmpint (gdk_paintable_get_intrinsic_width (GDK_PAINTABLE (icon)), ==, sizes[i]);
    }
#ifdef __linux__
  {
    g_autofree char *maps = NULL;

    g_assert_true (g_file_get_contents ("/proc/self/maps", &maps, NULL, NULL));
    g_assert_null (strstr (maps, "librsvg"));
  }
#endif
  win->close_confirmed = TRUE;
  gtk_window_destroy (GTK_WINDOW (win));
}

int
main (int argc, char *argv[])
{
  if (!app_test_init (&argc, &argv))
    return 0;
  g_test_add_func ("/app/screenshot/not-blank", test_screenshot_not_blank);
  g_test_add_func ("/app/screenshot/worker-figures", test_worker_figures_same_pixels);
  g_test_add_func ("/app/screenshot/ring-drawings", test_ring_drawings);
  g_test_add_func ("/app/screenshot/window-icon", test_window_icon);
  return g_test_run ();
}
