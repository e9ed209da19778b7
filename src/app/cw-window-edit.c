#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-custom-group-dialog.h"
#include "cw-window-private.h"

static const CwGroup *
lookup_group (CwWindow   *self,
              const char *id)
{
  const CwMolecule *mol = cw_document_peek_molecule (self->doc);
  const CwGroup    *g = cw_molecule_find_custom_group (mol, id);

  return g != NULL ? g : cw_group_table_lookup (self->data->groups, id);
}

gboolean
cw_window_set_group (CwWindow   *self,
                     int         position,
                     CwFace      face,
                     const char *group_id,
                     GError    **error)
{
  const CwGroup *g = lookup_group (self, group_id);
  g_autoptr (CwDocument) before = NULL;
  const CwSubstituent *old;

  if (g == NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_UNKNOWN_GROUP, _("There is no group “%s”"), group_id);
      return FALSE;
    }
  old = cw_molecule_get (cw_document_peek_molecule (self->doc), position, face);
  if (old != NULL && old->group == g)
    return TRUE;
  before = cw_document_copy (self->doc);
  if (!cw_molecule_set (cw_document_get_molecule (self->doc), position, face, g, error))
    return FALSE;
  /* Record the state before the edit only once the edit is known to be valid. */
  cw_history_push (self->history, before, self->serial, NULL);
  cw_window_end_edit (self);
  return TRUE;
}

gboolean
cw_window_remove_group (CwWindow *self,
                        int       position,
                        CwFace    face)
{
  if (cw_molecule_get (cw_document_peek_molecule (self->doc), position, face) == NULL)
    return FALSE;
  cw_window_begin_edit (self, NULL);
  cw_molecule_remove (cw_document_get_molecule (self->doc), position, face);
  cw_window_end_edit (self);
  return TRUE;
}

static char *
custom_id_for (const char *name)
{
  GString         *id = g_string_new ("custom-");
  g_autofree char *norm = g_utf8_normalize (name, -1, G_NORMALIZE_DEFAULT);

  for (const char *p = norm; p && *p; p = g_utf8_next_char (p))
    {
      gunichar c = g_utf8_get_char (p);

      if (g_unichar_isalnum (c))
        g_string_append_unichar (id, g_unichar_tolower (c));
      else if (id->str[id->len - 1] != '-')
        g_string_append_c (id, '-');
    }
  return g_string_free (id, FALSE);
}

gboolean
cw_window_place_custom_group (CwWindow   *self,
                              const char *name,
                              double      a_kcal,
                              double      sigma_kcal,
                              const char *source,
                              int         position,
                              CwFace      face,
                              GError    **error)
{
  g_autofree char *stripped = g_strstrip (g_strdup (name ? name : ""));
  g_autofree char *id = NULL;
  g_autoptr (CwDocument) before = NULL;
  CwMolecule    *mol;
  const CwGroup *g;

  if (*stripped == '\0')
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID, _("The custom group needs a name"));
      return FALSE;
    }
  if (!isfinite (a_kcal) || !isfinite (sigma_kcal) || sigma_kcal < 0)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("The A-value and its uncertainty must be numbers, the uncertainty not negative"));
      return FALSE;
    }
  if (cw_group_table_lookup (self->data->groups, stripped) != NULL)
    {
      g_set_error (error, CW_CORE_ERROR, CW_CORE_ERROR_INVALID,
                   _("“%s” is already a group in the table; choose another name"), stripped);
      return FALSE;
    }
  id = custom_id_for (stripped);
  before = cw_document_copy (self->doc);
  mol = cw_document_get_molecule (self->doc);
  g = cw_molecule_add_custom_group (mol, cw_group_new_custom (id, stripped, a_kcal, sigma_kcal, source));
  if (!cw_molecule_set (mol, position, face, g, error))
    {
      /* Put the document back exactly as it was; the chooser rows pointed into the old one. */
      g_clear_pointer (&self->doc, cw_document_free);
      self->doc = g_steal_pointer (&before);
      self->n_custom_shown = G_MAXUINT;
      cw_window_refresh (self);
      return FALSE;
    }
  cw_history_push (self->history, before, self->serial, NULL);
  /* Rows of the chooser point at the custom groups, which add_custom_group may move. */
  self->n_custom_shown = G_MAXUINT;
  cw_window_end_edit (self);
  return TRUE;
}

void
cw_window_set_temperature (CwWindow *self,
                           double    kelvin)
{
  g_autoptr (GError) error = NULL;

  if (!cw_check_temperature (kelvin, &error))
    {
      gtk_label_set_text (self->temperature_error_label, error->message);
      gtk_widget_set_visible (GTK_WIDGET (self->temperature_error_label), TRUE);
      return;
    }
  gtk_widget_set_visible (GTK_WIDGET (self->temperature_error_label), FALSE);
  if (fabs (kelvin - cw_document_get_temperature (self->doc)) < 1e-9)
    return;
  /* Dragging the slider is one edit, not a hundred. */
  cw_window_begin_edit (self, "temperature");
  cw_document_set_temperature (self->doc, kelvin);
  cw_window_end_edit (self);
}

static void
apply_history (CwWindow   *self,
               CwDocument *doc,
               guint       serial)
{
  if (doc == NULL)
    return;
  g_clear_pointer (&self->doc, cw_document_free);
  self->doc = doc;
  self->serial = serial;
  self->n_custom_shown = G_MAXUINT;
  cw_window_refresh (self);
  cw_window_schedule_autosave (self);
}

void
cw_window_undo (CwWindow *self)
{
  guint       serial = 0;
  CwDocument *doc = cw_history_undo (self->history, self->doc, self->serial, &serial);

  apply_history (self, doc, serial);
}

void
cw_window_redo (CwWindow *self)
{
  guint       serial = 0;
  CwDocument *doc = cw_history_redo (self->history, self->doc, self->serial, &serial);

  apply_history (self, doc, serial);
}

void
cw_window_update_edit_actions (CwWindow *self)
{
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.undo", cw_history_can_undo (self->history));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.redo", cw_history_can_redo (self->history));
}

/* ---- actions ------------------------------------------------------------------------ */

static gboolean
parse_face (CwWindow   *self,
            const char *s,
            CwFace     *face)
{
  if (cw_face_from_string (s, face))
    return TRUE;
  g_warning ("Unknown face “%s”", s);
  return FALSE;
}

static void
set_group_action (GtkWidget  *widget,
                  const char *action_name,
                  GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr (GError) error = NULL;
  const char *face_s, *id;
  int         pos;
  CwFace      face;

  g_variant_get (param, "(i&s&s)", &pos, &face_s, &id);
  if (!parse_face (self, face_s, &face))
    return;
  if (!cw_window_set_group (self, pos, face, id, &error))
    cw_window_show_error (self, _("The group could not be placed"), error);
}

static void
remove_group_action (GtkWidget  *widget,
                     const char *action_name,
                     GVariant   *param)
{
  CwWindow   *self = CW_WINDOW (widget);
  const char *face_s;
  int         pos;
  CwFace      face;

  g_variant_get (param, "(i&s)", &pos, &face_s);
  if (parse_face (self, face_s, &face))
    cw_window_remove_group (self, pos, face);
}

static void
clear_carbon_action (GtkWidget  *widget,
                     const char *action_name,
                     GVariant   *param)
{
  CwWindow   *self = CW_WINDOW (widget);
  int         pos = g_variant_get_int32 (param);
  CwMolecule *mol = cw_document_get_molecule (self->doc);

  if (cw_molecule_get (mol, pos, CW_FACE_UP) == NULL && cw_molecule_get (mol, pos, CW_FACE_DOWN) == NULL)
    return;
  cw_window_begin_edit (self, NULL);
  cw_molecule_remove (mol, pos, CW_FACE_UP);
  cw_molecule_remove (mol, pos, CW_FACE_DOWN);
  cw_window_end_edit (self);
}

static void
select_carbon_action (GtkWidget  *widget,
                      const char *action_name,
                      GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  cw_ring_canvas_set_selected (self->ring_canvas, g_variant_get_int32 (param));
}

static void
set_temperature_action (GtkWidget  *widget,
                        const char *action_name,
                        GVariant   *param)
{
  cw_window_set_temperature (CW_WINDOW (widget), g_variant_get_double (param));
}

static void
undo_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *param)
{
  cw_window_undo (CW_WINDOW (widget));
}

static void
redo_action (GtkWidget  *widget,
             const char *action_name,
             GVariant   *param)
{
  cw_window_redo (CW_WINDOW (widget));
}

static void
place_custom_group_action (GtkWidget  *widget,
                           const char *action_name,
                           GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr (GError) error = NULL;
  const char *name, *source, *face_s;
  double      a, sigma;
  int         pos;
  CwFace      face;

  g_variant_get (param, "(&sdd&si&s)", &name, &a, &sigma, &source, &pos, &face_s);
  if (!parse_face (self, face_s, &face))
    return;
  if (!cw_window_place_custom_group (self, name, a, sigma, source, pos, face, &error))
    cw_window_show_error (self, _("The custom group could not be placed"), error);
}

static gboolean
custom_group_defined_cb (CwCustomGroupDialog *dialog,
                         const char          *name,
                         double               a_kcal,
                         double               sigma_kcal,
                         const char          *source,
                         int                  face,
                         CwWindow            *self)
{
  g_autoptr (GError) error = NULL;
  int pos = cw_ring_canvas_get_selected (self->ring_canvas);

  if (!cw_window_place_custom_group (self, name, a_kcal, sigma_kcal, source, pos, face, &error))
    {
      cw_custom_group_dialog_show_error (dialog, error->message);
      return FALSE;
    }
  return TRUE;
}

static void
custom_group_action (GtkWidget  *widget,
                     const char *action_name,
                     GVariant   *param)
{
  CwWindow            *self = CW_WINDOW (widget);
  CwCustomGroupDialog *dialog = cw_custom_group_dialog_new (GTK_WINDOW (self), cw_window_get_energy_unit (self),
                                                            cw_ring_canvas_get_selected (self->ring_canvas));

  g_signal_connect_object (dialog, "defined", G_CALLBACK (custom_group_defined_cb), self, 0);
  gtk_window_present (GTK_WINDOW (dialog));
}

void
cw_window_class_add_edit_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.set-group", "(iss)", set_group_action);
  gtk_widget_class_install_action (widget_class, "win.remove-group", "(is)", remove_group_action);
  gtk_widget_class_install_action (widget_class, "win.clear-carbon", "i", clear_carbon_action);
  gtk_widget_class_install_action (widget_class, "win.select-carbon", "i", select_carbon_action);
  gtk_widget_class_install_action (widget_class, "win.set-temperature", "d", set_temperature_action);
  gtk_widget_class_install_action (widget_class, "win.place-custom-group", "(sddsis)", place_custom_group_action);
  gtk_widget_class_install_action (widget_class, "win.custom-group", NULL, custom_group_action);
  gtk_widget_class_install_action (widget_class, "win.undo", NULL, undo_action);
  gtk_widget_class_install_action (widget_class, "win.redo", NULL, redo_action);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_z, GDK_CONTROL_MASK, "win.undo", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_z, GDK_CONTROL_MASK | GDK_SHIFT_MASK, "win.redo", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Z, GDK_CONTROL_MASK | GDK_SHIFT_MASK, "win.redo", NULL);
}
