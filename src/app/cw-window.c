#include "config.h"

#include "cw-window.h"

#include <glib/gi18n.h>
#ifdef GDK_WINDOWING_X11
#include <gdk/x11/gdkx.h>
#endif

#include "cw-app-data.h"
#include "cw-frame-memory.h"
#include "cw-group-item.h"
#include "cw-window-private.h"

G_DEFINE_FINAL_TYPE (CwWindow, cw_window, GTK_TYPE_APPLICATION_WINDOW)

/* ---- units and options ------------------------------------------------------------ */

/* The units are read on every edit, many times: GSettings is asked once per change of the
 * key (read_units, connected before anything else that reacts to the settings). */
static void
read_units (CwWindow *self)
{
  self->energy_unit = g_settings_get_enum (self->settings, "energy-unit") == 1 ? CW_UNIT_KJ : CW_UNIT_KCAL;
  self->temperature_unit =
    g_settings_get_enum (self->settings, "temperature-unit") == 1 ? CW_TUNIT_CELSIUS : CW_TUNIT_KELVIN;
}

CwEnergyUnit
cw_window_get_energy_unit (CwWindow *self)
{
  return self->energy_unit;
}

CwTemperatureUnit
cw_window_get_temperature_unit (CwWindow *self)
{
  return self->temperature_unit;
}

/* ---- refresh after every change ----------------------------------------------------- */

static void
update_groups_store (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  guint             n_table = cw_group_table_get_n_groups (self->data->groups);
  guint             n_custom = mol->custom_groups ? mol->custom_groups->len : 0;
  g_autoptr (GPtrArray) items = g_ptr_array_new_with_free_func (g_object_unref);

  /* Custom groups first: they are what the user just made. The store keeps borrowed
   * pointers into the document, so rebuild it whenever the document is replaced. */
  for (guint i = 0; i < n_custom; i++)
    g_ptr_array_add (items, cw_group_item_new (g_ptr_array_index (mol->custom_groups, i)));
  for (guint i = 0; i < n_table; i++)
    g_ptr_array_add (items, cw_group_item_new (cw_group_table_get (self->data->groups, i)));
  g_list_store_splice (self->groups_store, 0, g_list_model_get_n_items (G_LIST_MODEL (self->groups_store)),
                       items->pdata, items->len);
  self->n_custom_shown = n_custom;
  /* The slot buttons may show a custom group that has just been replaced. */
  cw_group_chooser_set_energy_unit (self->up_chooser, cw_window_get_energy_unit (self));
  cw_group_chooser_set_energy_unit (self->down_chooser, cw_window_get_energy_unit (self));
}

static void
update_editor (CwWindow *self)
{
  const CwMolecule    *mol = cw_document_peek_molecule (self->doc);
  int                  sel = cw_ring_canvas_get_selected (self->ring_canvas);
  const CwSubstituent *up = cw_molecule_get (mol, sel, CW_FACE_UP);
  const CwSubstituent *down = cw_molecule_get (mol, sel, CW_FACE_DOWN);
  g_autofree char     *text = g_strdup_printf (_("Carbon %d"), sel);

  gtk_label_set_text (self->carbon_label, text);
  cw_group_chooser_set_group (self->up_chooser, up ? up->group : NULL);
  cw_group_chooser_set_group (self->down_chooser, down ? down->group : NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (self->up_clear), up != NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (self->down_clear), down != NULL);
}

static void
update_temperature_widgets (CwWindow *self)
{
  double            k = cw_document_get_temperature (self->doc);
  CwTemperatureUnit tu = cw_window_get_temperature_unit (self);
  double            offset = tu == CW_TUNIT_CELSIUS ? CW_ZERO_C : 0.0;
  g_autofree char  *label = cw_format_temperature (k, tu);

  /* The button shows the document's temperature however it was set; while the slider is
   * dragged the adjustment already holds it. */
  cw_steady_label_set_text (self->temperature_label, label);
  if (gtk_adjustment_get_value (self->temperature_adjustment) == k - offset &&
      gtk_adjustment_get_lower (self->temperature_adjustment) == 100.0 - offset)
    return;
  self->updating_temperature = TRUE;
  gtk_adjustment_configure (self->temperature_adjustment, k - offset, 100.0 - offset, 600.0 - offset,
                            1.0, 10.0, 0.0);
  self->updating_temperature = FALSE;
}

void
cw_window_update_title (CwWindow *self)
{
  const char      *title = cw_document_get_title (self->doc);
  g_autofree char *basename = NULL;
  g_autofree char *shown = NULL;
  g_autofree char *config = cw_molecule_dup_configuration (cw_document_peek_molecule (self->doc));
  gboolean         modified = cw_window_get_modified (self);

  if (title == NULL || *title == '\0')
    {
      if (self->file != NULL)
        basename = g_file_get_basename (self->file);
      title = basename ? basename : _("Untitled");
    }
  shown = modified ? g_strconcat ("• ", title, NULL) : g_strdup (title);
  gtk_label_set_text (self->title_label, shown);
  cw_steady_label_set_text (self->subtitle_label, config && *config ? config : _("Substituted cyclohexane"));
  gtk_widget_set_visible (GTK_WIDGET (self->subtitle_label), TRUE);
  {
    g_autofree char *win_title = g_strdup_printf ("%s – %s", shown, _("Chairwise"));

    if (g_strcmp0 (gtk_window_get_title (GTK_WINDOW (self)), win_title) != 0)
      gtk_window_set_title (GTK_WINDOW (self), win_title);
  }
}

void
cw_window_refresh (CwWindow *self)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  g_autoptr (GError) error = NULL;
  CwConditions cond;
  guint        n_custom = mol->custom_groups ? mol->custom_groups->len : 0;

  self->refreshed = TRUE;
  self->figure_stamp++;
  cw_document_get_conditions (self->doc, &cond);
  g_clear_pointer (&self->analysis_error, g_free);
  self->an_valid = cw_analyze (self->data, mol, &cond, &self->an, &error);
  if (!self->an_valid)
    self->analysis_error = g_strdup (error->message);

  if (n_custom != self->n_custom_shown)
    update_groups_store (self);
  cw_ring_canvas_set_molecule (self->ring_canvas, mol);
  /* The figures first: those the worker paints, or lays out too, are then in progress while
   * this thread brings the other widgets up to date. They may show the reaction geometry,
   * which the pages compute. */
  cw_window_update_pages (self);
  cw_window_queue_figures (self);
  update_editor (self);
  update_temperature_widgets (self);
  cw_window_update_results (self);
  cw_window_update_title (self);
  cw_window_update_edit_actions (self);
  cw_window_update_smiles (self);
}

void
cw_window_begin_edit (CwWindow   *self,
                      const char *merge_key)
{
  cw_history_push (self->history, self->doc, self->serial, merge_key);
}

void
cw_window_end_edit (CwWindow *self)
{
  self->serial = ++self->next_serial;
  cw_window_refresh (self);
  cw_window_schedule_autosave (self);
}

void
cw_window_show_error (CwWindow     *self,
                      const char   *primary,
                      const GError *error)
{
  GtkWidget *dialog;

  dialog = gtk_message_dialog_new (GTK_WINDOW (self), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_ERROR, GTK_BUTTONS_CLOSE, "%s", primary);
  if (error != NULL)
    gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s", error->message);
  g_signal_connect (dialog, "response", G_CALLBACK (gtk_window_destroy), NULL);
  gtk_window_present (GTK_WINDOW (dialog));
}

/* ---- template callbacks ------------------------------------------------------------- */

static void
ring_selected_cb (CwWindow *self)
{
  update_editor (self);
  gtk_widget_queue_draw (GTK_WIDGET (self->chairs_area));
}

static void
ring_clear_requested_cb (CwWindow *self)
{
  int sel = cw_ring_canvas_get_selected (self->ring_canvas);

  gtk_widget_activate_action (GTK_WIDGET (self), "win.clear-carbon", "i", sel);
}

static void
ring_search_requested_cb (CwWindow   *self,
                          const char *text)
{
  cw_group_chooser_popup (self->up_chooser, text);
}

static void
ring_choose_requested_cb (CwWindow *self,
                          int       face)
{
  cw_group_chooser_popup (face == CW_FACE_DOWN ? self->down_chooser : self->up_chooser, NULL);
}

static void
chosen (CwWindow   *self,
        CwFace      face,
        const char *id)
{
  int sel = cw_ring_canvas_get_selected (self->ring_canvas);

  gtk_widget_activate_action (GTK_WIDGET (self), "win.set-group", "(iss)", sel, cw_face_to_string (face), id);
  gtk_widget_grab_focus (GTK_WIDGET (self->ring_canvas));
}

static void
up_chosen_cb (CwWindow   *self,
              const char *id)
{
  chosen (self, CW_FACE_UP, id);
}

static void
down_chosen_cb (CwWindow   *self,
                const char *id)
{
  chosen (self, CW_FACE_DOWN, id);
}

static void
up_clear_cb (CwWindow *self)
{
  gtk_widget_activate_action (GTK_WIDGET (self), "win.remove-group", "(is)",
                              cw_ring_canvas_get_selected (self->ring_canvas), cw_face_to_string (CW_FACE_UP));
}

static void
down_clear_cb (CwWindow *self)
{
  gtk_widget_activate_action (GTK_WIDGET (self), "win.remove-group", "(is)",
                              cw_ring_canvas_get_selected (self->ring_canvas), cw_face_to_string (CW_FACE_DOWN));
}

static void
temperature_value_changed_cb (CwWindow *self)
{
  double v = gtk_adjustment_get_value (self->temperature_adjustment);

  if (self->updating_temperature)
    return;
  if (cw_window_get_temperature_unit (self) == CW_TUNIT_CELSIUS)
    v += CW_ZERO_C;
  gtk_widget_activate_action (GTK_WIDGET (self), "win.set-temperature", "d", v);
}

static void
lower_page_changed_cb (CwWindow *self)
{
  /* Pages other than the visible one are not kept up to date: compute it now. */
  if (self->doc != NULL)
    cw_window_update_pages (self);
}

static void
reactivity_toggled_cb (CwWindow *self)
{
  /* The marks need the reaction geometry even while another page is shown. */
  if (self->doc != NULL)
    cw_window_update_pages (self);
  gtk_widget_queue_draw (GTK_WIDGET (self->chairs_area));
}

static void
settings_changed_cb (CwWindow   *self,
                     const char *key)
{
  if (g_strcmp0 (key, "energy-unit") == 0)
    {
      cw_group_chooser_set_energy_unit (self->up_chooser, cw_window_get_energy_unit (self));
      cw_group_chooser_set_energy_unit (self->down_chooser, cw_window_get_energy_unit (self));
    }
  if (g_strcmp0 (key, "energy-unit") == 0 || g_strcmp0 (key, "temperature-unit") == 0)
    cw_window_refresh (self);
  else if (g_strcmp0 (key, "recent-files") == 0)
    cw_window_update_recent_menu (self);
}

static gboolean
enum_to_selected (GValue   *value,
                  GVariant *variant,
                  gpointer  user_data)
{
  g_value_set_uint (value, g_strcmp0 (g_variant_get_string (variant, NULL), "kj") == 0 ? 1 : 0);
  return TRUE;
}

static GVariant *
selected_to_enum (const GValue       *value,
                  const GVariantType *type,
                  gpointer            user_data)
{
  return g_variant_new_string (g_value_get_uint (value) == 1 ? "kj" : "kcal");
}

/* Built on first use: a shortcuts window costs more to build than the main window's
 * whole ring pane, and most sessions never open it. */
static void
show_help_overlay_action (GtkWidget  *widget,
                          const char *action_name,
                          GVariant   *param)
{
  g_autoptr (GtkBuilder) builder = gtk_builder_new_from_resource ("/org/chairwise/Chairwise/ui/cw-shortcuts-window.ui");
  GtkWindow *shortcuts = GTK_WINDOW (gtk_builder_get_object (builder, "shortcuts_window"));

  gtk_window_set_transient_for (shortcuts, GTK_WINDOW (widget));
  /* Shortcuts named by action show the accelerators the application set for them. */
  gtk_window_set_application (shortcuts, gtk_window_get_application (GTK_WINDOW (widget)));
  gtk_window_set_destroy_with_parent (shortcuts, TRUE);
  gtk_window_present (shortcuts);
}

/* ---- GObject ------------------------------------------------------------------------ */

static gboolean
cw_window_close_request_vfunc (GtkWindow *window)
{
  CwWindow *self = CW_WINDOW (window);

  if (cw_window_close_request (self))
    return TRUE;
  if (!gtk_window_is_maximized (window))
    {
      int w, h;

      gtk_window_get_default_size (window, &w, &h);
      g_settings_set_int (self->settings, "window-width", MAX (w, 360));
      g_settings_set_int (self->settings, "window-height", MAX (h, 360));
    }
  g_settings_set_boolean (self->settings, "window-maximized", gtk_window_is_maximized (window));
  return GTK_WINDOW_CLASS (cw_window_parent_class)->close_request (window);
}

static gboolean
set_icon_idle_cb (gpointer user_data)
{
  gtk_window_set_default_icon_name (CW_APP_ID);
  gtk_window_set_icon_name (GTK_WINDOW (user_data), CW_APP_ID);
  return G_SOURCE_REMOVE;
}

static void
first_frame_cb (GdkFrameClock *clock,
                CwWindow      *self)
{
  g_clear_signal_handler (&self->first_frame_id, clock);
  /* After other low-priority work queued by this frame (a --screenshot run takes its
   * picture then): the window controls rebuild themselves for the icon, which needs a
   * new layout. */
  g_idle_add_full (G_PRIORITY_LOW + 10, set_icon_idle_cb, g_object_ref (self), g_object_unref);
}

/* On X11, GDK asks the window manager at the end of every frame whether it supports
 * frame sync (_NET_WM_FRAME_DRAWN). With a window manager the answer is cached; with none
 * (a bare X server, a kiosk, Xvfb) GDK asks the X server again each time, two round trips
 * a frame, about a fifth of a millisecond each, for an answer that stays no. The window
 * turns frame sync off while no window manager offers it, which is what GDK does then
 * anyway, and turns it back on when a window manager that does appears. */
static void
update_frame_sync (CwWindow *self)
{
#ifdef GDK_WINDOWING_X11
  GdkDisplay *display = gtk_widget_get_display (GTK_WIDGET (self));
  GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (self));

  if (surface == NULL || !GDK_IS_X11_DISPLAY (display))
    return;
  self->frame_sync = gdk_x11_screen_supports_net_wm_hint (gdk_x11_display_get_screen (display),
                                                          g_intern_static_string ("_NET_WM_FRAME_DRAWN"));
  gdk_x11_surface_set_frame_sync_enabled (surface, self->frame_sync);
#endif
}

#ifdef GDK_WINDOWING_X11
/* With frame sync off the window may hear nothing from the X server between two frames.
 * Cairo's X11 backend then cannot tell that the server is done with the memory it shares
 * with it for the last frame (a block of 3.7 MB for this window), and takes a block never
 * written before for the next frame: about 900 page faults the first time, 10-20 ms on the
 * development machine, the slowest frame of the edit benchmark. A round trip before each
 * frame lets it use the same block again; it cost no time that could be measured in the
 * benchmark's median. With frame sync on, the window manager's message after each frame
 * does the same. */
static void
sync_before_frame_cb (GdkFrameClock *clock,
                      CwWindow      *self)
{
  if (!self->frame_sync)
    gdk_display_sync (gtk_widget_get_display (GTK_WIDGET (self)));
}

/* The memory Cairo shares with the X server for frames (cw-frame-memory.c) is paged in once
 * per process as soon as it exists (Cairo sets it up at the first frame that needs it, not
 * always the first one): looked for after each of the first 200 frames, then paged in 128 kB
 * at a time (0.1-0.3 ms) whenever the main loop is idle, so never inside a frame. The top
 * 8 MB: two blocks of the window's default size. */
static gboolean
prefault_idle_cb (gpointer data)
{
  CwWindow *self = data;

  if (!self->prefault_found)
    {
      self->prefault_found = cw_frame_memory_find (8 << 20) > 0;
      if (!self->prefault_found && ++self->prefault_tries < 200)
        {
          self->prefault_idle = 0;
          return G_SOURCE_REMOVE; /* again after the next frame */
        }
      g_clear_signal_handler (&self->prefault_id, gtk_widget_get_frame_clock (GTK_WIDGET (self)));
    }
  if (self->prefault_found && cw_frame_memory_step (128 << 10))
    return G_SOURCE_CONTINUE;
  self->prefault_idle = 0;
  return G_SOURCE_REMOVE;
}

static void
prefault_after_frame_cb (GdkFrameClock *clock,
                         CwWindow      *self)
{
  if (self->prefault_idle == 0)
    self->prefault_idle = g_idle_add_full (G_PRIORITY_LOW, prefault_idle_cb, self, NULL);
}
#endif

static void
cw_window_realize (GtkWidget *widget)
{
  CwWindow *self = CW_WINDOW (widget);

  if (!self->refreshed)
    cw_window_refresh (self);
  GTK_WIDGET_CLASS (cw_window_parent_class)->realize (widget);
  update_frame_sync (self);
#ifdef GDK_WINDOWING_X11
  if (GDK_IS_X11_DISPLAY (gtk_widget_get_display (widget)))
    {
      g_signal_connect_object (gdk_x11_display_get_screen (gtk_widget_get_display (widget)), "window-manager-changed",
                               G_CALLBACK (update_frame_sync), self, G_CONNECT_SWAPPED);
      self->sync_id = g_signal_connect (gtk_widget_get_frame_clock (widget), "before-paint",
                                        G_CALLBACK (sync_before_frame_cb), self);
      if (GSK_IS_CAIRO_RENDERER (gtk_native_get_renderer (GTK_NATIVE (self))) && !self->prefault_found &&
          self->prefault_tries < 200)
        self->prefault_id = g_signal_connect (gtk_widget_get_frame_clock (widget), "after-paint",
                                              G_CALLBACK (prefault_after_frame_cb), self);
    }
#endif
  /* The window's icon is set once its first frame is on screen: on X11 GTK then renders the
   * icon at every size it has for the window manager. The icon is drawn at fixed sizes
   * (data/icons/hicolor/NxN, PNG), so no SVG renderer is loaded for it: with only the
   * scalable icon that renderer (with its XML and Unicode libraries) took about a twentieth
   * of the time to the first frame, and 8 MB. */
  if (gtk_window_get_icon_name (GTK_WINDOW (self)) == NULL && self->first_frame_id == 0)
    self->first_frame_id = g_signal_connect (gtk_widget_get_frame_clock (widget), "after-paint",
                                             G_CALLBACK (first_frame_cb), self);
}

static void
cw_window_unrealize (GtkWidget *widget)
{
  CwWindow *self = CW_WINDOW (widget);

  if (self->first_frame_id != 0)
    g_clear_signal_handler (&self->first_frame_id, gtk_widget_get_frame_clock (widget));
  if (self->sync_id != 0)
    g_clear_signal_handler (&self->sync_id, gtk_widget_get_frame_clock (widget));
  if (self->prefault_id != 0)
    g_clear_signal_handler (&self->prefault_id, gtk_widget_get_frame_clock (widget));
  g_clear_handle_id (&self->prefault_idle, g_source_remove);
#ifdef GDK_WINDOWING_X11
  if (GDK_IS_X11_DISPLAY (gtk_widget_get_display (widget)))
    g_signal_handlers_disconnect_by_func (gdk_x11_display_get_screen (gtk_widget_get_display (widget)),
                                          update_frame_sync, self);
#endif
  GTK_WIDGET_CLASS (cw_window_parent_class)->unrealize (widget);
}

static void
cw_window_dispose (GObject *object)
{
  CwWindow *self = CW_WINDOW (object);

  g_clear_handle_id (&self->autosave_id, g_source_remove);
  cw_window_stop_figures (self);
  if (self->pending_dialog != NULL)
    gtk_window_destroy (GTK_WINDOW (g_steal_pointer (&self->pending_dialog)));
  gtk_widget_dispose_template (GTK_WIDGET (self), CW_TYPE_WINDOW);
  g_clear_object (&self->groups_store);
  g_clear_object (&self->settings);
  g_clear_object (&self->file);

  G_OBJECT_CLASS (cw_window_parent_class)->dispose (object);
}

static void
cw_window_finalize (GObject *object)
{
  CwWindow *self = CW_WINDOW (object);

  /* A window that goes away on purpose leaves no autosave behind. */
  cw_window_drop_autosave (self);
  g_clear_pointer (&self->doc, cw_document_free);
  g_clear_pointer (&self->history, cw_history_free);
  g_clear_pointer (&self->analysis_error, g_free);
  g_clear_pointer (&self->couplings, g_free);
  g_clear_pointer (&self->reactivity, g_free);
  g_clear_pointer (&self->isomers, cw_isomer_set_free);
  cw_window_clear_figures (self);

  G_OBJECT_CLASS (cw_window_parent_class)->finalize (object);
}

static void
cw_window_class_init (CwWindowClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);
  GtkWindowClass *window_class = GTK_WINDOW_CLASS (klass);

  object_class->dispose = cw_window_dispose;
  object_class->finalize = cw_window_finalize;
  window_class->close_request = cw_window_close_request_vfunc;
  widget_class->realize = cw_window_realize;
  widget_class->unrealize = cw_window_unrealize;

  g_type_ensure (CW_TYPE_RING_CANVAS);
  g_type_ensure (CW_TYPE_RESULT_SHEET);
  g_type_ensure (CW_TYPE_STEADY_LABEL);
  g_type_ensure (CW_TYPE_GROUP_CHOOSER);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/chairwise/Chairwise/ui/cw-window.ui");
  gtk_widget_class_bind_template_child (widget_class, CwWindow, title_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, subtitle_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, temperature_button);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, temperature_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, primary_menu_button);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, export_menu_button);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, primary_menu);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, export_menu);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, temperature_spin);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, temperature_adjustment);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, temperature_error_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, energy_unit_dropdown);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, ring_canvas);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, carbon_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, up_chooser);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, down_chooser);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, up_clear);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, down_clear);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, chairs_area);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, profile_area);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, scan_area);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, pop1_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, pop2_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, summary_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, result_sheet);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, lower_stack);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, caution_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, recent_section);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, smiles_entry);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, smiles_note_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, couplings_grid);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, couplings_note);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, reactions_grid);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, reactions_note);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, reactivity_check);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, isomers_grid);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, isomers_note);
  gtk_widget_class_bind_template_callback (widget_class, ring_selected_cb);
  gtk_widget_class_bind_template_callback (widget_class, ring_clear_requested_cb);
  gtk_widget_class_bind_template_callback (widget_class, ring_search_requested_cb);
  gtk_widget_class_bind_template_callback (widget_class, up_chosen_cb);
  gtk_widget_class_bind_template_callback (widget_class, down_chosen_cb);
  gtk_widget_class_bind_template_callback (widget_class, up_clear_cb);
  gtk_widget_class_bind_template_callback (widget_class, down_clear_cb);
  gtk_widget_class_bind_template_callback (widget_class, temperature_value_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, lower_page_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, reactivity_toggled_cb);

  gtk_widget_class_install_action (widget_class, "win.show-help-overlay", NULL, show_help_overlay_action);
  cw_window_class_add_edit_actions (widget_class);
  cw_window_class_add_file_actions (widget_class);
  cw_window_class_add_export_actions (widget_class);
  cw_window_class_add_smiles_actions (widget_class);
  cw_window_class_add_page_actions (widget_class);
}

/* A menu button's menu is built the first time it opens: building both menus' popovers took
 * about 6 ms of the window's start-up. */
static void
build_menu_cb (GtkMenuButton *button,
               gpointer       model)
{
  gtk_menu_button_set_menu_model (button, G_MENU_MODEL (model));
  gtk_menu_button_set_create_popup_func (button, NULL, NULL, NULL);
}

static void
menu_on_demand (GtkMenuButton *button,
                GMenuModel    *menu)
{
  gtk_menu_button_set_create_popup_func (button, build_menu_cb, g_object_ref (menu), g_object_unref);
}

static void
cw_window_init (CwWindow *self)
{
  g_autoptr (GSimpleActionGroup) prefs = g_simple_action_group_new ();
  g_autoptr (GAction) tunit = NULL;
  g_autoptr (GError) error = NULL;

  self->data = cw_app_get_data (&error);
  /* The tables are compiled into the program; failing here is a broken build. */
  if (self->data == NULL)
    g_error ("Cannot load the group tables: %s", error->message);
  /* The worker loads its fonts for the figures meanwhile. */
  cw_window_start_figures (self);
  gtk_widget_init_template (GTK_WIDGET (self));

  self->frame_sync = TRUE; /* GDK's default */

  self->settings = cw_app_settings_new ();
  read_units (self);
  g_signal_connect_object (self->settings, "changed::energy-unit", G_CALLBACK (read_units), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->settings, "changed::temperature-unit", G_CALLBACK (read_units), self,
                           G_CONNECT_SWAPPED);
  self->history = cw_history_new (200);
  self->doc = cw_document_new ();
  cw_document_set_temperature (self->doc, g_settings_get_double (self->settings, "default-temperature"));
  self->groups_store = g_list_store_new (CW_TYPE_GROUP_ITEM);
  self->n_custom_shown = G_MAXUINT;

  tunit = g_settings_create_action (self->settings, "temperature-unit");
  g_action_map_add_action (G_ACTION_MAP (prefs), tunit);
  gtk_widget_insert_action_group (GTK_WIDGET (self), "prefs", G_ACTION_GROUP (prefs));
  g_settings_bind_with_mapping (self->settings, "energy-unit", self->energy_unit_dropdown, "selected",
                                G_SETTINGS_BIND_DEFAULT, enum_to_selected, selected_to_enum, NULL, NULL);
  g_settings_bind (self->settings, "lower-page", self->lower_stack, "visible-child-name", G_SETTINGS_BIND_DEFAULT);
  g_signal_connect_object (self->settings, "changed", G_CALLBACK (settings_changed_cb), self, G_CONNECT_SWAPPED);
  gtk_window_set_default_size (GTK_WINDOW (self), g_settings_get_int (self->settings, "window-width"),
                               g_settings_get_int (self->settings, "window-height"));
  if (g_settings_get_boolean (self->settings, "window-maximized"))
    gtk_window_maximize (GTK_WINDOW (self));

  /* The chooser's button is what takes the focus: give it the slot's name. */
  gtk_accessible_update_property (GTK_ACCESSIBLE (gtk_widget_get_template_child (GTK_WIDGET (self->up_chooser),
                                                                                 CW_TYPE_GROUP_CHOOSER, "button")),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Group on the up face"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (gtk_widget_get_template_child (GTK_WIDGET (self->down_chooser),
                                                                                 CW_TYPE_GROUP_CHOOSER, "button")),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Group on the down face"), -1);
  cw_group_chooser_set_model (self->up_chooser, G_LIST_MODEL (self->groups_store));
  cw_group_chooser_set_model (self->down_chooser, G_LIST_MODEL (self->groups_store));
  cw_group_chooser_set_energy_unit (self->up_chooser, cw_window_get_energy_unit (self));
  cw_group_chooser_set_energy_unit (self->down_chooser, cw_window_get_energy_unit (self));
  g_signal_connect_object (self->ring_canvas, "choose-requested", G_CALLBACK (ring_choose_requested_cb), self,
                           G_CONNECT_SWAPPED);

  gtk_drawing_area_set_draw_func (self->chairs_area, cw_window_draw_chairs_cb, self, NULL);
  gtk_drawing_area_set_draw_func (self->profile_area, cw_window_draw_profile_cb, self, NULL);
  gtk_drawing_area_set_draw_func (self->scan_area, cw_window_draw_scan_cb, self, NULL);
  gtk_label_set_text (self->caution_label, cw_caution_text ());
  menu_on_demand (self->primary_menu_button, self->primary_menu);
  menu_on_demand (self->export_menu_button, self->export_menu);

  cw_window_file_init (self);
  /* The first refresh waits for realize: a window opened with a document (the usual
   * start) would otherwise analyse and fill everything twice before its first frame. */
  /* Start on the ring, so keys 1-6 and typing work at once. */
  gtk_window_set_focus (GTK_WINDOW (self), GTK_WIDGET (self->ring_canvas));
}

/* ---- public API ----------------------------------------------------------------------- */

CwWindow *
cw_window_new (GtkApplication *app)
{
  return g_object_new (CW_TYPE_WINDOW, "application", app, NULL);
}

void
cw_window_set_document (CwWindow   *self,
                        CwDocument *doc,
                        GFile      *file,
                        gboolean    modified)
{
  g_return_if_fail (CW_IS_WINDOW (self));
  g_return_if_fail (doc != NULL);

  g_clear_pointer (&self->doc, cw_document_free);
  self->doc = doc;
  g_set_object (&self->file, file);
  cw_history_clear (self->history);
  self->serial = ++self->next_serial;
  self->saved_serial = modified ? 0 : self->serial;
  /* The chooser rows point into the old document's custom groups: rebuild them. */
  self->n_custom_shown = G_MAXUINT;
  cw_window_refresh (self);
  if (modified)
    cw_window_schedule_autosave (self);
  else
    cw_window_drop_autosave (self);
}

const CwDocument *
cw_window_get_document (CwWindow *self)
{
  g_return_val_if_fail (CW_IS_WINDOW (self), NULL);
  return self->doc;
}

const CwAnalysis *
cw_window_get_analysis (CwWindow *self)
{
  g_return_val_if_fail (CW_IS_WINDOW (self), NULL);
  if (!self->refreshed)
    cw_window_refresh (self);
  return self->an_valid ? &self->an : NULL;
}

GFile *
cw_window_get_file (CwWindow *self)
{
  g_return_val_if_fail (CW_IS_WINDOW (self), NULL);
  return self->file;
}

gboolean
cw_window_get_modified (CwWindow *self)
{
  g_return_val_if_fail (CW_IS_WINDOW (self), FALSE);
  return self->serial != self->saved_serial;
}

gboolean
cw_window_is_pristine (CwWindow *self)
{
  g_return_val_if_fail (CW_IS_WINDOW (self), FALSE);
  return self->file == NULL && !cw_window_get_modified (self) &&
         cw_document_peek_molecule (self->doc)->n_subs == 0;
}
