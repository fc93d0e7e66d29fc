/* cw-library-window-files.c: new, import, export and delete a library
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-library-window"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-library-folder.h"
#include "cw-library-window-private.h"

static GtkFileFilter *
library_filter (void)
{
  GtkFileFilter *filter = gtk_file_filter_new ();

  gtk_file_filter_set_name (filter, _("Canalwright instrument libraries"));
  gtk_file_filter_add_pattern (filter, "*" CW_LIBRARY_SUFFIX);
  return filter;
}

static void
new_response (GtkDialog       *dialog,
              int              response,
              CwLibraryWindow *self)
{
  GtkEditable *entry = g_object_get_data (G_OBJECT (dialog), "entry");
  g_autofree char *title = g_strstrip (g_strdup (gtk_editable_get_text (entry)));
  g_autoptr(GError) error = NULL;

  gtk_window_destroy (GTK_WINDOW (dialog));
  if (response != GTK_RESPONSE_ACCEPT || *title == '\0')
    return;
  if (!cw_libraries_create (self->libraries, title, &error))
    _cw_library_window_show_error (self, _("The library was not created"), error);
}

static void
new_action (GtkWidget  *widget,
            const char *name,
            GVariant   *param)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  GtkWidget *dialog, *entry = gtk_entry_new ();

  dialog = gtk_message_dialog_new (GTK_WINDOW (self), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE, "%s", _("New Library"));
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s",
                                            _("A library of its own, for example for one surgery. "
                                              "It starts empty and becomes the current library."));
  gtk_editable_set_text (GTK_EDITABLE (entry), _("Surgery 2"));
  gtk_entry_set_activates_default (GTK_ENTRY (entry), TRUE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (entry), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Name of the new library"), -1);
  gtk_box_append (GTK_BOX (gtk_message_dialog_get_message_area (GTK_MESSAGE_DIALOG (dialog))), entry);
  gtk_dialog_add_buttons (GTK_DIALOG (dialog), _("_Cancel"), GTK_RESPONSE_CANCEL,
                          _("C_reate"), GTK_RESPONSE_ACCEPT, NULL);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  g_object_set_data (G_OBJECT (dialog), "entry", entry);
  g_signal_connect (dialog, "response", G_CALLBACK (new_response), self);
  gtk_window_present (GTK_WINDOW (dialog));
}

/* What a file chooser does with the file it gives, and what it says when
 * that fails. */
typedef struct
{
  gboolean   (*run) (CwLibraryWindow  *self,
                     const char       *path,
                     GError          **error);
  const char  *failure;
} FileTask;

static gboolean
import_file (CwLibraryWindow  *self,
             const char       *path,
             GError          **error)
{
  return cw_libraries_import (self->libraries, path, error);
}

static gboolean
export_file (CwLibraryWindow  *self,
             const char       *path,
             GError          **error)
{
  return cw_libraries_export (self->libraries, cw_libraries_get_current_index (self->libraries), path, error);
}

static void
file_response (GtkNativeDialog *dialog,
               int              response,
               CwLibraryWindow *self)
{
  const FileTask *task = g_object_get_data (G_OBJECT (dialog), "task");

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = g_file_get_path (file);
      g_autoptr(GError) error = NULL;

      if (path == NULL)
        g_set_error (&error, G_IO_ERROR, G_IO_ERROR_NOT_SUPPORTED,
                     _("Only a file on this computer can be used; copy it here first."));
      if (error != NULL || !task->run (self, path, &error))
        _cw_library_window_show_error (self, _(task->failure), error);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

static GtkFileChooser *
file_chooser (CwLibraryWindow      *self,
              const char           *title,
              GtkFileChooserAction  action,
              const char           *accept,
              const FileTask       *task)
{
  g_autoptr(GtkFileFilter) filter = library_filter ();
  GtkFileChooserNative *dialog = gtk_file_chooser_native_new (title, GTK_WINDOW (self), action,
                                                              accept, _("_Cancel"));

  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (dialog), filter);
  g_object_set_data (G_OBJECT (dialog), "task", (gpointer) task);
  g_signal_connect (dialog, "response", G_CALLBACK (file_response), self);
  return GTK_FILE_CHOOSER (dialog);
}

static void
import_action (GtkWidget  *widget,
               const char *name,
               GVariant   *param)
{
  static const FileTask task = { import_file, N_("The library was not imported") };
  GtkFileChooser *chooser = file_chooser (CW_LIBRARY_WINDOW (widget), _("Import a Library"),
                                          GTK_FILE_CHOOSER_ACTION_OPEN, _("_Import"), &task);

  gtk_native_dialog_show (GTK_NATIVE_DIALOG (chooser));
}

static void
export_action (GtkWidget  *widget,
               const char *name,
               GVariant   *param)
{
  static const FileTask task = { export_file, N_("The library was not exported") };
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  g_autofree char *file_name = g_path_get_basename (cw_libraries_get_current (self->libraries)->path);
  GtkFileChooser *chooser = file_chooser (self, _("Export the Library"), GTK_FILE_CHOOSER_ACTION_SAVE,
                                          _("_Export"), &task);

  gtk_file_chooser_set_current_name (chooser, file_name);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (chooser));
}

static void
delete_response (GtkDialog       *dialog,
                 int              response,
                 CwLibraryWindow *self)
{
  g_autoptr(GError) error = NULL;

  gtk_window_destroy (GTK_WINDOW (dialog));
  if (response != GTK_RESPONSE_ACCEPT)
    return;
  if (!cw_libraries_delete (self->libraries, cw_libraries_get_current_index (self->libraries), &error))
    _cw_library_window_show_error (self, _("The library was not deleted"), error);
}

static void
delete_action (GtkWidget  *widget,
               const char *name,
               GVariant   *param)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  const CwLibrary *library = cw_libraries_get_current (self->libraries);
  GtkWidget *dialog;

  dialog = gtk_message_dialog_new (GTK_WINDOW (self), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_WARNING, GTK_BUTTONS_NONE,
                                   _("Delete the library “%s”?"), cw_library_display_name (library));
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog),
                                            _("Its file %s is removed. Cases keep their own copies of its "
                                              "instruments; export the library first to keep a copy of it."),
                                            library->path);
  gtk_dialog_add_buttons (GTK_DIALOG (dialog), _("_Cancel"), GTK_RESPONSE_CANCEL,
                          _("_Delete"), GTK_RESPONSE_ACCEPT, NULL);
  g_signal_connect (dialog, "response", G_CALLBACK (delete_response), self);
  gtk_window_present (GTK_WINDOW (dialog));
}

void
_cw_library_window_install_file_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "library.new", NULL, new_action);
  gtk_widget_class_install_action (widget_class, "library.import", NULL, import_action);
  gtk_widget_class_install_action (widget_class, "library.export", NULL, export_action);
  gtk_widget_class_install_action (widget_class, "library.delete", NULL, delete_action);
}
