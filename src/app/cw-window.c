/* cw-window.c: one window per open case
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-window"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-iso.h"
#include "cw-window-private.h"

G_DEFINE_FINAL_TYPE (CwWindow, cw_window, GTK_TYPE_APPLICATION_WINDOW)

enum {
  PROP_0,
  PROP_DOCUMENT,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

CwWindow *
cw_window_new (CwApplication *application,
               CwDocument    *document)
{
  return g_object_new (CW_TYPE_WINDOW,
                       "application", application,
                       "document", document,
                       NULL);
}

CwDocument *
cw_window_get_document (CwWindow *self)
{
  g_return_val_if_fail (CW_IS_WINDOW (self), NULL);
  return self->document;
}

static char *
tooth_text (const CwCase *kase)
{
  if (kase->tooth_code == NULL)
    return g_strdup (_("No tooth set"));
  if (kase->notation == CW_NOTATION_UNIVERSAL)
    return g_strdup_printf (_("Tooth %s (Universal)"), kase->tooth_code);
  return g_strdup_printf (_("Tooth %s (FDI)"), kase->tooth_code);
}

static void
update_title (CwWindow *self)
{
  g_autofree char *title = cw_document_dup_title (self->document);
  g_autofree char *shown = NULL;
  g_autofree char *tooth = tooth_text (cw_document_get_case (self->document));
  g_autofree char *subtitle = NULL;
  GFile *file = cw_document_get_file (self->document);

  shown = cw_document_get_modified (self->document) ? g_strdup_printf ("• %s", title) : g_strdup (title);
  if (file)
    {
      g_autofree char *name = g_file_get_basename (file);

      subtitle = g_strdup_printf ("%s — %s", tooth, name);
    }
  else
    subtitle = g_strdup_printf ("%s — %s", tooth, _("not saved yet"));
  gtk_label_set_label (self->title_label, shown);
  gtk_label_set_label (self->subtitle_label, subtitle);
  gtk_window_set_title (GTK_WINDOW (self), title);
}

static void
canal_button_toggled (GtkToggleButton *button,
                      CwWindow        *self)
{
  if (gtk_toggle_button_get_active (button))
    cw_document_set_canal_index (self->document,
                                 GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (button), "canal-index")));
}

/* One linked toggle per canal; rebuilt when the canals change. */
static void
rebuild_switcher (CwWindow *self)
{
  const CwCase *kase = cw_document_get_case (self->document);
  GtkWidget *child, *first = NULL;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->canal_switcher))))
    gtk_box_remove (self->canal_switcher, child);
  for (guint i = 0; i < kase->canals->len; i++)
    {
      const CwCanal *canal = g_ptr_array_index (kase->canals, i);
      GtkWidget *button = gtk_toggle_button_new_with_label (canal->name);

      g_object_set_data (G_OBJECT (button), "canal-index", GUINT_TO_POINTER (i));
      if (first)
        gtk_toggle_button_set_group (GTK_TOGGLE_BUTTON (button), GTK_TOGGLE_BUTTON (first));
      else
        first = button;
      gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (button),
                                    i == cw_document_get_canal_index (self->document));
      g_signal_connect (button, "toggled", G_CALLBACK (canal_button_toggled), self);
      gtk_box_append (self->canal_switcher, button);
    }
}

static void
document_changed (CwWindow *self)
{
  update_title (self);
  rebuild_switcher (self);
  _cw_window_update_actions (self);
}

static void
set_document (CwWindow   *self,
              CwDocument *document)
{
  self->document = document ? g_object_ref (document) : cw_document_new ();
  g_signal_connect_object (self->document, "changed", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::modified", G_CALLBACK (update_title), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::file", G_CALLBACK (update_title), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::canal-index", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::step-index", G_CALLBACK (_cw_window_update_actions), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::instrument", G_CALLBACK (_cw_window_update_actions), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::can-undo", G_CALLBACK (_cw_window_update_actions), self, G_CONNECT_SWAPPED);
  cw_shelf_set_document (self->shelf, self->document);
  cw_canal_view_set_document (self->canal_view, self->document);
  cw_inspector_set_document (self->inspector, self->document);
  cw_canal_editor_set_document (self->canal_editor, self->document);
  cw_sequence_strip_set_document (self->strip, self->document);
  self->autosave = cw_autosave_new (self->document);
  document_changed (self);
}

void
_cw_window_show_error (CwWindow     *self,
                       const char   *primary,
                       const GError *error)
{
  GtkWidget *dialog = gtk_message_dialog_new (GTK_WINDOW (self),
                                              GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                              GTK_MESSAGE_ERROR, GTK_BUTTONS_CLOSE, "%s", primary);

  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s", error->message);
  g_signal_connect (dialog, "response", G_CALLBACK (gtk_window_destroy), NULL);
  gtk_window_present (GTK_WINDOW (dialog));
}

static void
close_response (GtkDialog *dialog,
                int        response,
                CwWindow  *self)
{
  g_autoptr(GError) error = NULL;

  gtk_window_destroy (GTK_WINDOW (dialog));
  if (response == GTK_RESPONSE_CANCEL || response == GTK_RESPONSE_DELETE_EVENT)
    return;
  if (response == GTK_RESPONSE_ACCEPT)
    {
      if (cw_document_get_file (self->document) == NULL)
        {
          _cw_window_save_as (self, TRUE);
          return;
        }
      if (!cw_document_save (self->document, NULL, &error))
        {
          _cw_window_show_error (self, _("The case could not be saved"), error);
          return;
        }
    }
  self->close_confirmed = TRUE;
  gtk_window_close (GTK_WINDOW (self));
}

static gboolean
cw_window_close_request (GtkWindow *window)
{
  CwWindow *self = CW_WINDOW (window);
  GtkWidget *dialog;
  g_autofree char *title = NULL;

  if (self->close_confirmed || !cw_document_get_modified (self->document))
    {
      cw_autosave_discard (self->autosave);
      return GTK_WINDOW_CLASS (cw_window_parent_class)->close_request (window);
    }
  title = cw_document_dup_title (self->document);
  dialog = gtk_message_dialog_new (window, GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE,
                                   _("Save the changes to “%s” before closing?"), title);
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s",
                                            _("If you close without saving, the changes are lost."));
  gtk_dialog_add_buttons (GTK_DIALOG (dialog),
                          _("Close _without Saving"), GTK_RESPONSE_REJECT,
                          _("_Cancel"), GTK_RESPONSE_CANCEL,
                          _("_Save"), GTK_RESPONSE_ACCEPT,
                          NULL);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  g_signal_connect (dialog, "response", G_CALLBACK (close_response), self);
  gtk_window_present (GTK_WINDOW (dialog));
  return TRUE;
}

/* Up to eight recent cases, newest first, in the primary menu. */
static void
fill_recent_menu (CwWindow *self)
{
  GtkRecentManager *manager = gtk_recent_manager_get_default ();
  GList *items = gtk_recent_manager_get_items (manager);
  guint n = 0;

  g_menu_remove_all (self->recent_menu);
  for (GList *l = items; l && n < 8; l = l->next)
    {
      GtkRecentInfo *info = l->data;
      const char *uri = gtk_recent_info_get_uri (info);
      g_autoptr(GMenuItem) item = NULL;

      if (!g_str_has_suffix (uri, ".cwcase") || !gtk_recent_info_exists (info))
        continue;
      item = g_menu_item_new (gtk_recent_info_get_display_name (info), NULL);
      g_menu_item_set_action_and_target (item, "app.open-recent", "s", uri);
      g_menu_append_item (self->recent_menu, item);
      n++;
    }
  if (n == 0)
    {
      g_autoptr(GMenuItem) none = g_menu_item_new (_("No recent cases"), "win.none");

      g_menu_append_item (self->recent_menu, none);
    }
  g_list_free_full (items, (GDestroyNotify) gtk_recent_info_unref);
}

static void
cw_window_constructed (GObject *object)
{
  CwWindow *self = CW_WINDOW (object);
  CwApplication *app = CW_APPLICATION (gtk_window_get_application (GTK_WINDOW (self)));
  GSettings *settings = app ? cw_application_get_settings (app) : NULL;

  G_OBJECT_CLASS (cw_window_parent_class)->constructed (object);

  if (settings)
    {
      g_settings_bind (settings, "window-width", self, "default-width", G_SETTINGS_BIND_DEFAULT);
      g_settings_bind (settings, "window-height", self, "default-height", G_SETTINGS_BIND_DEFAULT);
      g_settings_bind (settings, "window-maximized", self, "maximized", G_SETTINGS_BIND_DEFAULT);
    }
  if (self->document == NULL)
    set_document (self, NULL);
  fill_recent_menu (self);
  g_signal_connect_object (gtk_recent_manager_get_default (), "changed",
                           G_CALLBACK (fill_recent_menu), self, G_CONNECT_SWAPPED);
}

static void
cw_window_set_property (GObject      *object,
                        guint         prop_id,
                        const GValue *value,
                        GParamSpec   *pspec)
{
  CwWindow *self = CW_WINDOW (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      if (g_value_get_object (value))
        set_document (self, g_value_get_object (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_window_get_property (GObject    *object,
                        guint       prop_id,
                        GValue     *value,
                        GParamSpec *pspec)
{
  CwWindow *self = CW_WINDOW (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      g_value_set_object (value, self->document);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_window_dispose (GObject *object)
{
  CwWindow *self = CW_WINDOW (object);

  g_clear_object (&self->autosave);
  g_clear_object (&self->document);
  gtk_widget_dispose_template (GTK_WIDGET (self), CW_TYPE_WINDOW);
  G_OBJECT_CLASS (cw_window_parent_class)->dispose (object);
}

static void
cw_window_class_init (CwWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);
  GtkWindowClass *window_class = GTK_WINDOW_CLASS (klass);

  object_class->constructed = cw_window_constructed;
  object_class->dispose = cw_window_dispose;
  object_class->set_property = cw_window_set_property;
  object_class->get_property = cw_window_get_property;
  window_class->close_request = cw_window_close_request;

  properties[PROP_DOCUMENT] =
    g_param_spec_object ("document", NULL, NULL, CW_TYPE_DOCUMENT,
                         G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  g_type_ensure (CW_TYPE_SHELF);
  g_type_ensure (CW_TYPE_CANAL_VIEW);
  g_type_ensure (CW_TYPE_INSPECTOR);
  g_type_ensure (CW_TYPE_CANAL_EDITOR);
  g_type_ensure (CW_TYPE_SEQUENCE_STRIP);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/canalwright/Canalwright/cw-window.ui");
  gtk_widget_class_bind_template_child (widget_class, CwWindow, title_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, subtitle_label);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, canal_switcher);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, shelf);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, canal_view);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, inspector);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, canal_editor);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, strip);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, side_stack);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, recent_menu);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, library_section);
  gtk_widget_class_bind_template_child (widget_class, CwWindow, teaching_section);

  _cw_window_install_actions (widget_class);
  _cw_window_install_export_actions (widget_class);
  _cw_window_install_teaching_actions (widget_class);
  _cw_window_install_library_actions (widget_class);
  _cw_window_install_plan_actions (widget_class);
}

static void
cw_window_init (CwWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  _cw_window_setup_library (self);
  _cw_window_setup_teaching (self);
}
