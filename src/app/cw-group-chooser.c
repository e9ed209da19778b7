#include "config.h"

#include "cw-group-chooser.h"

#include <glib/gi18n.h>

#include "cw-group-item.h"

struct _CwGroupChooser
{
  GtkWidget parent_instance;

  /* template children */
  GtkMenuButton  *button;
  GtkLabel       *button_label;
  GtkPopover     *popover;
  GtkSearchEntry *search_entry;
  GtkListView    *list_view;

  /* owned */
  GtkFilterListModel *filtered;
  GtkStringFilter    *filter;
  GtkSingleSelection *selection;

  CwEnergyUnit   unit;
  const CwGroup *shown; /* what the button shows, to skip redundant updates */
  gboolean       shown_valid;
  gboolean       list_attached; /* the list view has its model (from the first popup on) */
};

G_DEFINE_FINAL_TYPE (CwGroupChooser, cw_group_chooser, GTK_TYPE_WIDGET)

enum
{
  GROUP_CHOSEN,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

char *
cw_group_chooser_dup_value_text (const CwGroup *group,
                                 CwEnergyUnit   unit)
{
  double a = cw_energy_from_kcal (group->a, unit);
  double s = cw_energy_from_kcal (group->a_sigma, unit);

  /* TRANSLATORS: an A-value with its uncertainty and unit, e.g. "A 1.74 ± 0.05 kcal/mol" */
  return g_strdup_printf (_("A %.2f ± %.2f %s"), a, s, cw_energy_unit_symbol (unit));
}

/* Tooltips are answered on demand: gtk_widget_set_tooltip_text asks the X server where the
 * pointer is each time, a round trip per row and per edit. */
static gboolean
label_text_tooltip_cb (GtkWidget  *widget,
                       int         x,
                       int         y,
                       gboolean    keyboard,
                       GtkTooltip *tooltip,
                       GtkLabel   *label)
{
  const char *text = gtk_label_get_text (label);

  if (text == NULL || *text == '\0')
    return FALSE;
  gtk_tooltip_set_text (tooltip, text);
  return TRUE;
}

static void
setup_row_cb (GtkSignalListItemFactory *factory,
              GtkListItem              *item,
              gpointer                  user_data)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
  GtkWidget *top = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 12);
  GtkWidget *name = gtk_label_new (NULL);
  GtkWidget *value = gtk_label_new (NULL);
  GtkWidget *source = gtk_label_new (NULL);

  gtk_widget_add_css_class (box, "cw-group-row");
  gtk_label_set_xalign (GTK_LABEL (name), 0.0f);
  gtk_widget_set_hexpand (name, TRUE);
  gtk_widget_add_css_class (value, "cw-group-value");
  gtk_label_set_xalign (GTK_LABEL (source), 0.0f);
  gtk_label_set_ellipsize (GTK_LABEL (source), PANGO_ELLIPSIZE_END);
  gtk_label_set_max_width_chars (GTK_LABEL (source), 44);
  gtk_widget_add_css_class (source, "caption");
  gtk_widget_add_css_class (source, "dim-label");
  gtk_box_append (GTK_BOX (top), name);
  gtk_box_append (GTK_BOX (top), value);
  gtk_box_append (GTK_BOX (box), top);
  gtk_box_append (GTK_BOX (box), source);
  gtk_widget_set_has_tooltip (box, TRUE);
  g_signal_connect (box, "query-tooltip", G_CALLBACK (label_text_tooltip_cb), source);
  gtk_list_item_set_child (item, box);
}

static void
bind_row_cb (GtkSignalListItemFactory *factory,
             GtkListItem              *item,
             CwGroupChooser           *self)
{
  CwGroupItem     *gi = gtk_list_item_get_item (item);
  const CwGroup   *g = cw_group_item_get_group (gi);
  GtkWidget       *box = gtk_list_item_get_child (item);
  GtkWidget       *top = gtk_widget_get_first_child (box);
  GtkWidget       *name = gtk_widget_get_first_child (top);
  GtkWidget       *value = gtk_widget_get_next_sibling (name);
  GtkWidget       *source = gtk_widget_get_next_sibling (top);
  g_autofree char *value_text = cw_group_chooser_dup_value_text (g, self->unit);
  g_autofree char *source_text = NULL;
  g_autofree char *markup = NULL;

  if (g->custom)
    markup = g_strdup_printf ("<b>%s</b> <i>(%s)</i>", g->markup ? g->markup : g->label, _("custom"));
  else
    markup = g_strdup_printf ("<b>%s</b>", g->markup ? g->markup : g->label);
  gtk_label_set_markup (GTK_LABEL (name), markup);
  gtk_label_set_text (GTK_LABEL (value), value_text);
  source_text = g_strdup (g->source ? g->source : _("no source given"));
  gtk_label_set_text (GTK_LABEL (source), source_text);
}

static void
choose_item (CwGroupChooser *self,
             CwGroupItem    *item)
{
  const CwGroup *g = cw_group_item_get_group (item);

  gtk_popover_popdown (self->popover);
  g_signal_emit (self, signals[GROUP_CHOSEN], 0, g->id);
}

static void
list_activate_cb (CwGroupChooser *self,
                  guint           position)
{
  g_autoptr (CwGroupItem) item = g_list_model_get_item (G_LIST_MODEL (self->filtered), position);

  if (item != NULL)
    choose_item (self, item);
}

static void
search_changed_cb (CwGroupChooser *self)
{
  gtk_string_filter_set_search (self->filter, gtk_editable_get_text (GTK_EDITABLE (self->search_entry)));
  if (g_list_model_get_n_items (G_LIST_MODEL (self->filtered)) > 0)
    gtk_single_selection_set_selected (self->selection, 0);
}

static void
search_activate_cb (CwGroupChooser *self)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->search_entry));
  guint       pos;

  /* The entry delays search-changed; a quick Enter must still see the typed text. */
  if (g_strcmp0 (text, gtk_string_filter_get_search (self->filter)) != 0)
    search_changed_cb (self);
  pos = gtk_single_selection_get_selected (self->selection);
  if (pos == GTK_INVALID_LIST_POSITION)
    pos = 0;
  list_activate_cb (self, pos);
}

static void
search_stop_cb (CwGroupChooser *self)
{
  gtk_popover_popdown (self->popover);
}

/* The list's rows are made on the first popup, not with the window: most windows never
 * open both choosers, and each costs a few ms of row widgets at start-up. */
static void
attach_list (CwGroupChooser *self)
{
  if (self->list_attached)
    return;
  self->list_attached = TRUE;
  gtk_list_view_set_model (self->list_view, GTK_SELECTION_MODEL (self->selection));
}

static void
popover_show_cb (CwGroupChooser *self)
{
  attach_list (self);
  gtk_widget_grab_focus (GTK_WIDGET (self->search_entry));
}

static gboolean
search_key_cb (GtkEventControllerKey *controller,
               guint                  keyval,
               guint                  keycode,
               GdkModifierType        state,
               CwGroupChooser        *self)
{
  guint pos = gtk_single_selection_get_selected (self->selection);
  guint n = g_list_model_get_n_items (G_LIST_MODEL (self->filtered));

  if (n == 0 || (keyval != GDK_KEY_Down && keyval != GDK_KEY_Up))
    return FALSE;
  /* Up/Down move through the list while the search entry keeps the focus. */
  if (pos == GTK_INVALID_LIST_POSITION)
    pos = 0;
  else if (keyval == GDK_KEY_Down && pos + 1 < n)
    pos++;
  else if (keyval == GDK_KEY_Up && pos > 0)
    pos--;
  gtk_single_selection_set_selected (self->selection, pos);
  gtk_widget_activate_action (GTK_WIDGET (self->list_view), "list.scroll-to-item", "u", pos);
  return TRUE;
}

static void
cw_group_chooser_dispose (GObject *object)
{
  CwGroupChooser *self = CW_GROUP_CHOOSER (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), CW_TYPE_GROUP_CHOOSER);
  g_clear_object (&self->selection);
  g_clear_object (&self->filtered);
  g_clear_object (&self->filter);

  G_OBJECT_CLASS (cw_group_chooser_parent_class)->dispose (object);
}

static gboolean
cw_group_chooser_mnemonic_activate (GtkWidget *widget,
                                    gboolean   group_cycling)
{
  CwGroupChooser *self = CW_GROUP_CHOOSER (widget);

  return gtk_widget_mnemonic_activate (GTK_WIDGET (self->button), group_cycling);
}

static gboolean
cw_group_chooser_grab_focus (GtkWidget *widget)
{
  return gtk_widget_grab_focus (GTK_WIDGET (CW_GROUP_CHOOSER (widget)->button));
}

/* The button's tooltip: the shown group's source, asked for only when a tooltip is due. */
static gboolean
button_tooltip_cb (GtkWidget      *widget,
                   int             x,
                   int             y,
                   gboolean        keyboard,
                   GtkTooltip     *tooltip,
                   CwGroupChooser *self)
{
  if (!self->shown_valid)
    return FALSE;
  gtk_tooltip_set_text (tooltip, self->shown == NULL ? _("No group: choose one")
                      : self->shown->source ? self->shown->source
                                            : _("no source given"));
  return TRUE;
}

static void
cw_group_chooser_class_init (CwGroupChooserClass *klass)
{
  GObjectClass   *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_group_chooser_dispose;
  widget_class->mnemonic_activate = cw_group_chooser_mnemonic_activate;
  widget_class->grab_focus = cw_group_chooser_grab_focus;

  signals[GROUP_CHOSEN] =
    g_signal_new ("group-chosen", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 1, G_TYPE_STRING);

  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_GROUP);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/chairwise/Chairwise/ui/cw-group-chooser.ui");
  gtk_widget_class_bind_template_child (widget_class, CwGroupChooser, button);
  gtk_widget_class_bind_template_child (widget_class, CwGroupChooser, button_label);
  gtk_widget_class_bind_template_child (widget_class, CwGroupChooser, popover);
  gtk_widget_class_bind_template_child (widget_class, CwGroupChooser, search_entry);
  gtk_widget_class_bind_template_child (widget_class, CwGroupChooser, list_view);
  gtk_widget_class_bind_template_callback (widget_class, list_activate_cb);
  gtk_widget_class_bind_template_callback (widget_class, search_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, search_activate_cb);
  gtk_widget_class_bind_template_callback (widget_class, search_stop_cb);
  gtk_widget_class_bind_template_callback (widget_class, popover_show_cb);
}

static void
cw_group_chooser_init (CwGroupChooser *self)
{
  GtkListItemFactory *factory = gtk_signal_list_item_factory_new ();
  GtkEventController *keys = gtk_event_controller_key_new ();

  gtk_widget_init_template (GTK_WIDGET (self));

  self->filter = gtk_string_filter_new (gtk_property_expression_new (CW_TYPE_GROUP_ITEM, NULL, "search-text"));
  gtk_string_filter_set_match_mode (self->filter, GTK_STRING_FILTER_MATCH_MODE_SUBSTRING);
  gtk_string_filter_set_ignore_case (self->filter, TRUE);
  self->filtered = gtk_filter_list_model_new (NULL, g_object_ref (GTK_FILTER (self->filter)));
  self->selection = gtk_single_selection_new (g_object_ref (G_LIST_MODEL (self->filtered)));
  gtk_single_selection_set_autoselect (self->selection, TRUE);

  gtk_widget_set_has_tooltip (GTK_WIDGET (self->button), TRUE);
  g_signal_connect (self->button, "query-tooltip", G_CALLBACK (button_tooltip_cb), self);
  g_signal_connect (factory, "setup", G_CALLBACK (setup_row_cb), NULL);
  g_signal_connect (factory, "bind", G_CALLBACK (bind_row_cb), self);
  gtk_list_view_set_factory (self->list_view, factory);
  g_object_unref (factory);

  g_signal_connect (keys, "key-pressed", G_CALLBACK (search_key_cb), self);
  gtk_widget_add_controller (GTK_WIDGET (self->search_entry), keys);

  cw_group_chooser_set_group (self, NULL);
}

GtkWidget *
cw_group_chooser_new (void)
{
  return g_object_new (CW_TYPE_GROUP_CHOOSER, NULL);
}

void
cw_group_chooser_set_model (CwGroupChooser *self,
                            GListModel     *groups)
{
  g_return_if_fail (CW_IS_GROUP_CHOOSER (self));

  gtk_filter_list_model_set_model (self->filtered, groups);
}

void
cw_group_chooser_set_group (CwGroupChooser *self,
                            const CwGroup  *group)
{
  g_autofree char *markup = NULL;
  g_autofree char *value = NULL;
  g_autofree char *escaped = NULL;

  g_return_if_fail (CW_IS_GROUP_CHOOSER (self));

  if (self->shown_valid && self->shown == group)
    return;
  self->shown = group;
  self->shown_valid = TRUE;
  if (group == NULL)
    {
      gtk_label_set_text (self->button_label, _("None"));
      gtk_accessible_update_property (GTK_ACCESSIBLE (self->button), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                      _("No group: choose one"), -1);
      return;
    }
  value = g_strdup_printf (_("A %.2f %s"), cw_energy_from_kcal (group->a, self->unit),
                              cw_energy_unit_symbol (self->unit));
  /* The plain label (Unicode subscripts): Pango 1.50 warns about <sub> in an ellipsized label. */
  escaped = g_markup_escape_text (group->label, -1);
  markup = g_strdup_printf ("<b>%s</b>  %s", escaped, value);
  gtk_label_set_markup (self->button_label, markup);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->button), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                  group->source ? group->source : "", -1);
}

void
cw_group_chooser_set_energy_unit (CwGroupChooser *self,
                                  CwEnergyUnit    unit)
{
  g_return_if_fail (CW_IS_GROUP_CHOOSER (self));

  self->unit = unit;
  self->shown_valid = FALSE;
  /* Rebind the visible rows so their values follow the unit. */
  if (self->list_attached)
    {
      gtk_list_view_set_model (self->list_view, NULL);
      gtk_list_view_set_model (self->list_view, GTK_SELECTION_MODEL (self->selection));
    }
}

void
cw_group_chooser_popup (CwGroupChooser *self,
                        const char     *search_text)
{
  g_return_if_fail (CW_IS_GROUP_CHOOSER (self));

  attach_list (self);
  gtk_menu_button_popup (self->button);
  gtk_editable_set_text (GTK_EDITABLE (self->search_entry), search_text ? search_text : "");
  gtk_editable_set_position (GTK_EDITABLE (self->search_entry), -1);
  /* search-changed is delayed by the entry; filter at once so Enter picks the right row. */
  search_changed_cb (self);
}
