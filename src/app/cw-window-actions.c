/* cw-window-actions.c: the window's commands, one action each
 *
 * The menu, the keyboard and the tests all go through these actions.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-window"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-window-private.h"

#define DEPTH_STEP 0.5

static void
save_as_response (GtkNativeDialog *dialog,
                  int              response,
                  CwWindow        *self)
{
  gboolean close_after = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (dialog), "close-after"));

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autoptr(GError) error = NULL;

      if (!cw_document_save (self->document, file, &error))
        _cw_window_show_error (self, _("The case could not be saved"), error);
      else
        {
          g_autofree char *uri = g_file_get_uri (file);

          gtk_recent_manager_add_item (gtk_recent_manager_get_default (), uri);
          cw_autosave_discard (self->autosave);
          if (close_after)
            gtk_window_close (GTK_WINDOW (self));
        }
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

void
_cw_window_save_as (CwWindow *self,
                    gboolean  close_after)
{
  GtkFileChooserNative *dialog;
  g_autofree char *title = cw_document_dup_title (self->document);
  g_autofree char *name = g_strdup_printf ("%s.cwcase", title);

  dialog = gtk_file_chooser_native_new (_("Save Case"), GTK_WINDOW (self), GTK_FILE_CHOOSER_ACTION_SAVE,
                                        _("_Save"), _("_Cancel"));
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  if (cw_document_get_file (self->document))
    gtk_file_chooser_set_file (GTK_FILE_CHOOSER (dialog), cw_document_get_file (self->document), NULL);
  else
    gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (dialog), name);
  g_object_set_data (G_OBJECT (dialog), "close-after", GINT_TO_POINTER (close_after));
  g_signal_connect (dialog, "response", G_CALLBACK (save_as_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

static void
save_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autoptr(GError) error = NULL;

  if (cw_document_get_file (self->document) == NULL)
    {
      _cw_window_save_as (self, FALSE);
      return;
    }
  if (!cw_document_save (self->document, NULL, &error))
    _cw_window_show_error (self, _("The case could not be saved"), error);
  else
    cw_autosave_discard (self->autosave);
}

static void
save_as_action (GtkWidget  *widget,
                const char *name,
                GVariant   *param)
{
  _cw_window_save_as (CW_WINDOW (widget), FALSE);
}

static void
close_action (GtkWidget  *widget,
              const char *name,
              GVariant   *param)
{
  gtk_window_close (GTK_WINDOW (widget));
}

static void
undo_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  cw_document_undo (CW_WINDOW (widget)->document);
}

static void
redo_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  cw_document_redo (CW_WINDOW (widget)->document);
}

/* win.add-step: the given instrument, or the one selected on the shelf,
 * after the selected step (at the end when none is selected). */
static void
add_step_action (GtkWidget  *widget,
                 const char *name,
                 GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  const char *id = param ? g_variant_get_string (param, NULL) : "";
  int step = cw_document_get_step_index (self->document);

  if (*id == '\0')
    id = cw_document_get_instrument (self->document);
  if (id == NULL || cw_case_find_instrument (cw_document_get_case (self->document), id) == NULL)
    return;
  cw_document_insert_step (self->document, id, step < 0 ? -1 : step + 1);
}

static void
remove_step_action (GtkWidget  *widget,
                    const char *name,
                    GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  int step = cw_document_get_step_index (self->document);

  if (step >= 0)
    cw_document_remove_step (self->document, step);
}

static void
move_step (CwWindow *self,
           int       delta)
{
  int step = cw_document_get_step_index (self->document);
  const CwCanal *canal = cw_document_get_canal (self->document);

  if (step < 0 || step + delta < 0 || step + delta >= (int) canal->sequence->len)
    return;
  cw_document_move_step (self->document, step, step + delta);
}

static void
move_earlier_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *param)
{
  move_step (CW_WINDOW (widget), -1);
}

static void
move_later_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *param)
{
  move_step (CW_WINDOW (widget), +1);
}

static void
change_depth (CwWindow *self,
              double    delta)
{
  int step = cw_document_get_step_index (self->document);
  const CwCanal *canal = cw_document_get_canal (self->document);

  if (step < 0)
    return;
  cw_document_set_step_depth (self->document, step, cw_canal_get_step (canal, step)->depth + delta);
}

static void
deeper_action (GtkWidget  *widget,
               const char *name,
               GVariant   *param)
{
  change_depth (CW_WINDOW (widget), DEPTH_STEP);
}

static void
shallower_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *param)
{
  change_depth (CW_WINDOW (widget), -DEPTH_STEP);
}

static void
select_step (CwWindow *self,
             int       delta)
{
  const CwCanal *canal = cw_document_get_canal (self->document);
  int step = cw_document_get_step_index (self->document) + delta;

  if (canal && step >= 0 && step < (int) canal->sequence->len)
    cw_document_set_step_index (self->document, step);
}

static void
next_step_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *param)
{
  select_step (CW_WINDOW (widget), +1);
}

static void
previous_step_action (GtkWidget  *widget,
                      const char *name,
                      GVariant   *param)
{
  select_step (CW_WINDOW (widget), -1);
}

static void
add_canal_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  cw_document_add_canal (self->document);
  gtk_stack_set_visible_child_name (self->side_stack, "canal");
}

static void
remove_canal_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  cw_document_remove_canal (self->document, cw_document_get_canal_index (self->document));
}

static void
switch_canal (CwWindow *self,
              int       delta)
{
  guint n = cw_document_get_case (self->document)->canals->len;
  int index = (int) cw_document_get_canal_index (self->document) + delta;

  if (index >= 0 && index < (int) n)
    cw_document_set_canal_index (self->document, index);
}

static void
next_canal_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *param)
{
  switch_canal (CW_WINDOW (widget), +1);
}

static void
previous_canal_action (GtkWidget  *widget,
                       const char *name,
                       GVariant   *param)
{
  switch_canal (CW_WINDOW (widget), -1);
}

static void
zoom_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  if (g_str_equal (name, "win.zoom-in"))
    cw_canal_view_zoom (self->canal_view, 1.25);
  else if (g_str_equal (name, "win.zoom-out"))
    cw_canal_view_zoom (self->canal_view, 0.8);
  else
    cw_canal_view_reset_view (self->canal_view);
}

static void
focus_action (GtkWidget  *widget,
              const char *name,
              GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  if (g_str_equal (name, "win.focus-shelf"))
    cw_shelf_grab_focus (self->shelf);
  else if (g_str_equal (name, "win.focus-sequence"))
    gtk_widget_grab_focus (GTK_WIDGET (self->strip));
  else if (g_str_equal (name, "win.focus-canal"))
    gtk_widget_grab_focus (GTK_WIDGET (self->canal_view));
  else
    {
      gtk_stack_set_visible_child_name (self->side_stack, "canal");
      gtk_widget_child_focus (GTK_WIDGET (self->canal_editor), GTK_DIR_TAB_FORWARD);
    }
}

void
_cw_window_update_actions (CwWindow *self)
{
  CwDocument *doc = self->document;
  const CwCanal *canal = cw_document_get_canal (doc);
  int step = cw_document_get_step_index (doc);
  gboolean has_step = step >= 0;
  guint n_canals = cw_document_get_case (doc)->canals->len;

  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.undo", cw_document_can_undo (doc));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.redo", cw_document_can_redo (doc));
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.remove-step", has_step);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.deeper", has_step);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.shallower", has_step);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.move-step-earlier", has_step && step > 0);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.move-step-later",
                                 has_step && canal && step + 1 < (int) canal->sequence->len);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.remove-canal", n_canals > 1);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.add-canal", n_canals < CW_MAX_CANALS);
}

typedef struct
{
  const char *name;
  const char *param;
  GtkWidgetActionActivateFunc activate;
} ActionEntry;

void
_cw_window_install_actions (GtkWidgetClass *widget_class)
{
  static const ActionEntry entries[] = {
    { "win.save", NULL, save_action },
    { "win.save-as", NULL, save_as_action },
    { "win.close", NULL, close_action },
    { "win.undo", NULL, undo_action },
    { "win.redo", NULL, redo_action },
    { "win.add-step", "s", add_step_action },
    { "win.remove-step", NULL, remove_step_action },
    { "win.move-step-earlier", NULL, move_earlier_action },
    { "win.move-step-later", NULL, move_later_action },
    { "win.deeper", NULL, deeper_action },
    { "win.shallower", NULL, shallower_action },
    { "win.next-step", NULL, next_step_action },
    { "win.previous-step", NULL, previous_step_action },
    { "win.add-canal", NULL, add_canal_action },
    { "win.remove-canal", NULL, remove_canal_action },
    { "win.next-canal", NULL, next_canal_action },
    { "win.previous-canal", NULL, previous_canal_action },
    { "win.zoom-in", NULL, zoom_action },
    { "win.zoom-out", NULL, zoom_action },
    { "win.zoom-reset", NULL, zoom_action },
    { "win.focus-shelf", NULL, focus_action },
    { "win.focus-sequence", NULL, focus_action },
    { "win.focus-canal", NULL, focus_action },
    { "win.edit-canal", NULL, focus_action },
  };

  for (guint i = 0; i < G_N_ELEMENTS (entries); i++)
    gtk_widget_class_install_action (widget_class, entries[i].name, entries[i].param, entries[i].activate);
}
