#pragma once

#include "cw-couplings.h"
#include "cw-group-chooser.h"
#include "cw-history.h"
#include "cw-isomers.h"
#include "cw-paint-job.h"
#include "cw-reactivity.h"
#include "cw-render.h"
#include "cw-ring-canvas.h"
#include "cw-result-sheet.h"
#include "cw-steady-label.h"
#include "cw-window.h"

G_BEGIN_DECLS

struct _CwWindow
{
  GtkApplicationWindow parent_instance;

  /* template children */
  GtkLabel       *title_label;
  CwSteadyLabel  *subtitle_label;
  GtkMenuButton  *temperature_button;
  CwSteadyLabel  *temperature_label;
  GtkMenuButton  *primary_menu_button;
  GtkMenuButton  *export_menu_button;
  GMenuModel     *primary_menu;
  GMenuModel     *export_menu;
  GtkSpinButton  *temperature_spin;
  GtkAdjustment  *temperature_adjustment;
  GtkLabel       *temperature_error_label;
  GtkDropDown    *energy_unit_dropdown;
  CwRingCanvas   *ring_canvas;
  GtkLabel       *carbon_label;
  CwGroupChooser *up_chooser;
  CwGroupChooser *down_chooser;
  GtkButton      *up_clear;
  GtkButton      *down_clear;
  GtkDrawingArea *chairs_area;
  GtkDrawingArea *profile_area;
  GtkDrawingArea *scan_area;
  CwSteadyLabel  *pop1_label;
  CwSteadyLabel  *pop2_label;
  CwSteadyLabel  *summary_label;
  CwResultSheet   *result_sheet;
  GtkStack       *lower_stack;
  GtkLabel       *caution_label;
  GMenu          *recent_section;
  GtkEntry       *smiles_entry;
  GtkLabel       *smiles_note_label;
  GtkGrid        *couplings_grid;
  GtkLabel       *couplings_note;
  GtkGrid        *reactions_grid;
  GtkLabel       *reactions_note;
  GtkCheckButton *reactivity_check;
  GtkGrid        *isomers_grid;
  GtkLabel       *isomers_note;

  /* owned */
  CwDocument   *doc;
  GFile        *file;
  CwHistory    *history;
  GSettings    *settings;
  GListStore   *groups_store;
  GtkWidget    *pending_dialog; /* the unsaved-changes or restore dialog, when shown */
  char         *autosave_path;
  char         *analysis_error;
  CwCouplings  *couplings;  /* 11 kB: kept on the heap, reused */
  CwReactivity *reactivity; /* valid when reactivity_valid */
  CwIsomerSet  *isomers;    /* what the isomers page shows, NULL until it is shown */

  /* the units, as in the settings (read_units in cw-window.c) */
  CwEnergyUnit      energy_unit;
  CwTemperatureUnit temperature_unit;

  /* the figures (chairs, profile, scan) as last drawn, so that a change that leaves a
   * figure as it was does not redraw it */
  CwScene *figure_drawn[3];
  gboolean figure_drawn_valid[3];
  gboolean figure_drawn_dark[3];
  int      figure_drawn_width[3];
  int      figure_drawn_height[3];
  /* a changed figure as laid out when its redraw was queued, and being painted on the
   * worker thread meanwhile (the job holds the scene); drawn as it is unless something
   * has changed since (figure_stamp counts changes of the document, analysis and pages) */
  CwPaintJob     *figure_pending[3];
  CwRenderOptions figure_pending_opt[3];
  int             figure_pending_width[3];
  int             figure_pending_height[3];
  int             figure_pending_scale[3];
  guint           figure_pending_stamp[3];
  guint           figure_stamp;
  guint           n_worker_figures; /* figures drawn from the worker's image (for tests) */
  guint           n_worker_layouts; /* figures also laid out on the worker after a change (for tests) */
  char           *figure_spec[3];   /* the molecule each figure was last drawn for (a ring spec) */
  CwPaintJob     *warm_up_job;      /* loads the worker's fonts while the window is built */
  guint           warm_up_id;       /* idle that loads the window's own fonts for the figures, once */
  gboolean        warm_up_done;
  gboolean        fonts_loaded;     /* by warm_up_id: the window lays out its figures itself */

  /* state */
  const CwData *data; /* process-wide, see cw-app-data.h */
  CwAnalysis    an;
  gboolean      an_valid;
  gboolean      refreshed; /* widgets filled at least once (done at realize at the latest) */
  gboolean      reactivity_valid;
  guint         serial;
  guint         saved_serial;
  guint         next_serial;
  guint         autosave_id;
  gulong        first_frame_id; /* after-paint handler that sets the window icon */
  gboolean      frame_sync;     /* X11: frame sync with the window manager is on */
  gulong        sync_id;        /* X11: before-paint handler, a round trip while frame sync is off */
  gulong        prefault_id;    /* X11: after-paint handler looking for Cairo's frame memory */
  guint         prefault_idle;
  guint         prefault_tries;
  gboolean      prefault_found;
  guint         n_custom_shown; /* custom groups in groups_store */
  gboolean      updating_temperature;
  gboolean      close_confirmed;
  gboolean      close_after_save;
};

/* cw-window.c */
void              cw_window_begin_edit (CwWindow   *self,
                                        const char *merge_key);
void              cw_window_end_edit (CwWindow *self);
void              cw_window_refresh (CwWindow *self);
void              cw_window_update_title (CwWindow *self);
void              cw_window_show_error (CwWindow     *self,
                                        const char   *primary,
                                        const GError *error);
CwEnergyUnit      cw_window_get_energy_unit (CwWindow *self);
CwTemperatureUnit cw_window_get_temperature_unit (CwWindow *self);
void              cw_window_render_options (CwWindow        *self,
                                            GtkWidget       *widget,
                                            CwRenderOptions *opt);

/* cw-window-pages.c: the Couplings, Reactions and Isomers pages, computed only when shown. */
void      cw_window_update_pages (CwWindow *self);
void      cw_window_class_add_page_actions (GtkWidgetClass *widget_class);
CwWindow *cw_window_open_isomer (CwWindow *self,
                                 int       index,
                                 GError  **error);
void      cw_window_grid_set_rows (GtkGrid     *grid,
                                   guint        n_columns,
                                   const char **cells,
                                   guint        n_rows);

/* cw-window-smiles.c: the SMILES entry, copy and paste. */
void     cw_window_class_add_smiles_actions (GtkWidgetClass *widget_class);
void     cw_window_update_smiles (CwWindow *self);
gboolean cw_window_set_smiles (CwWindow   *self,
                               const char *smiles,
                               GError    **error);

/* cw-window-draw.c: the figures on screen (through the render layer). */
void cw_window_queue_figures (CwWindow *self);
void cw_window_clear_figures (CwWindow *self);
void cw_window_start_figures (CwWindow *self);
void cw_window_stop_figures (CwWindow *self);
void cw_window_draw_chairs_cb (GtkDrawingArea *area,
                               cairo_t        *cr,
                               int             width,
                               int             height,
                               gpointer        user_data);
void cw_window_draw_profile_cb (GtkDrawingArea *area,
                                cairo_t        *cr,
                                int             width,
                                int             height,
                                gpointer        user_data);
void cw_window_draw_scan_cb (GtkDrawingArea *area,
                             cairo_t        *cr,
                             int             width,
                             int             height,
                             gpointer        user_data);

/* cw-window-results.c: the labels, terms table and flags for the current analysis. */
void cw_window_update_results (CwWindow *self);

/* cw-window-edit.c: ring edits, temperature, custom groups, undo and redo. */
void     cw_window_class_add_edit_actions (GtkWidgetClass *widget_class);
gboolean cw_window_set_group (CwWindow   *self,
                              int         position,
                              CwFace      face,
                              const char *group_id,
                              GError    **error);
gboolean cw_window_remove_group (CwWindow *self,
                                 int       position,
                                 CwFace    face);
gboolean cw_window_place_custom_group (CwWindow   *self,
                                       const char *name,
                                       double      a_kcal,
                                       double      sigma_kcal,
                                       const char *source,
                                       int         position,
                                       CwFace      face,
                                       GError    **error);
void     cw_window_set_temperature (CwWindow *self,
                                    double    kelvin);
void     cw_window_undo (CwWindow *self);
void     cw_window_redo (CwWindow *self);
void     cw_window_update_edit_actions (CwWindow *self);

/* cw-window-file.c: open, save, recent documents, close, drag and drop, autosave. */
void     cw_window_class_add_file_actions (GtkWidgetClass *widget_class);
void     cw_window_file_init (CwWindow *self);
gboolean cw_window_save_to (CwWindow *self,
                            GFile    *file,
                            GError  **error);
void     cw_window_schedule_autosave (CwWindow *self);
void     cw_window_drop_autosave (CwWindow *self);
void     cw_window_update_recent_menu (CwWindow *self);
gboolean cw_window_close_request (CwWindow *self);

/* cw-window-export.c: figures, report and clipboard. */
void     cw_window_class_add_export_actions (GtkWidgetClass *widget_class);
gboolean cw_window_export_to (CwWindow   *self,
                              const char *target,
                              const char *path,
                              GError    **error);
gboolean cw_window_copy_figure (CwWindow   *self,
                                const char *figure,
                                GError    **error);

G_END_DECLS
