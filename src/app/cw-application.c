/* cw-application.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-application"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-application.h"
#include "cw-autosave.h"
#include "cw-cautions.h"
#include "cw-help-window.h"
#include "cw-window.h"

struct _CwApplication
{
  GtkApplication  parent_instance;
  GSettings      *settings;
};

G_DEFINE_FINAL_TYPE (CwApplication, cw_application, GTK_TYPE_APPLICATION)

CwApplication *
cw_application_new (void)
{
  return g_object_new (CW_TYPE_APPLICATION,
                       "application-id", CW_APPLICATION_ID,
                       "flags", G_APPLICATION_HANDLES_OPEN,
                       "resource-base-path", "/org/canalwright/Canalwright",
                       NULL);
}

GSettings *
cw_application_get_settings (CwApplication *self)
{
  g_return_val_if_fail (CW_IS_APPLICATION (self), NULL);
  return self->settings;
}

static CwWindow *
new_window (CwApplication *self,
            CwDocument    *document)
{
  CwWindow *window = cw_window_new (self, document);

  gtk_window_present (GTK_WINDOW (window));
  return window;
}

/* The cautions come before any work, once; About repeats them. */
static void
maybe_first_start (CwApplication *self,
                   GtkWindow     *parent)
{
  if (self->settings == NULL || !g_settings_get_boolean (self->settings, "first-start"))
    return;
  cw_application_show_cautions (self, parent);
  g_settings_set_boolean (self->settings, "first-start", FALSE);
}

void
cw_application_show_cautions (CwApplication *self,
                              GtkWindow     *parent)
{
  cw_cautions_show (parent);
}

static void
cw_application_activate (GApplication *app)
{
  CwApplication *self = CW_APPLICATION (app);
  GtkWindow *window = gtk_application_get_active_window (GTK_APPLICATION (app));
  g_autoptr(CwDocument) document = NULL;

  if (window)
    {
      gtk_window_present (window);
      return;
    }
  document = cw_document_new ();
  window = GTK_WINDOW (new_window (self, document));
  maybe_first_start (self, window);
  cw_autosave_offer_recovery (window);
}

/* A file that does not load leaves every window as it was and says why. */
static void
show_open_error (CwApplication *self,
                 GFile         *file,
                 const GError  *error)
{
  GtkWindow *parent = gtk_application_get_active_window (GTK_APPLICATION (self));
  g_autofree char *name = g_file_get_basename (file);
  GtkWidget *dialog;

  if (parent == NULL)
    {
      g_autoptr(CwDocument) document = cw_document_new ();

      parent = GTK_WINDOW (new_window (self, document));
    }
  dialog = gtk_message_dialog_new (parent, GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_ERROR, GTK_BUTTONS_CLOSE,
                                   _("“%s” could not be opened"), name);
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s", error->message);
  g_signal_connect (dialog, "response", G_CALLBACK (gtk_window_destroy), NULL);
  gtk_window_present (GTK_WINDOW (dialog));
}

static void
cw_application_open (GApplication  *app,
                     GFile        **files,
                     int            n_files,
                     const char    *hint)
{
  CwApplication *self = CW_APPLICATION (app);
  GtkWindow *last = NULL;

  for (int i = 0; i < n_files; i++)
    {
      g_autoptr(GError) error = NULL;
      g_autoptr(CwDocument) document = cw_document_open (files[i], &error);

      if (document == NULL)
        {
          g_printerr ("canalwright: %s\n", error->message);
          show_open_error (self, files[i], error);
          last = gtk_application_get_active_window (GTK_APPLICATION (app));
          continue;
        }
      last = GTK_WINDOW (new_window (self, document));
      {
        g_autofree char *uri = g_file_get_uri (files[i]);

        gtk_recent_manager_add_item (gtk_recent_manager_get_default (), uri);
      }
    }
  if (last == NULL)
    cw_application_activate (app);
  else
    maybe_first_start (self, last);
}

static void
quit_activated (GSimpleAction *action,
                GVariant      *param,
                gpointer       user_data)
{
  GtkApplication *app = GTK_APPLICATION (user_data);
  GList *windows = g_list_copy (gtk_application_get_windows (app));

  /* Each window asks about its own unsaved changes. */
  for (GList *l = windows; l; l = l->next)
    gtk_window_close (GTK_WINDOW (l->data));
  g_list_free (windows);
}

static void
new_activated (GSimpleAction *action,
               GVariant      *param,
               gpointer       user_data)
{
  g_autoptr(CwDocument) document = cw_document_new ();

  new_window (CW_APPLICATION (user_data), document);
}

static void
about_activated (GSimpleAction *action,
                 GVariant      *param,
                 gpointer       user_data)
{
  GtkApplication *app = GTK_APPLICATION (user_data);
  static const char *authors[] = { "The Canalwright authors", NULL };
  g_autofree char *comments = g_strdup_printf ("%s\n\n%s",
                                               _("Design and check the sequence of files that shapes each root canal."),
                                               cw_cautions_text ());

  gtk_show_about_dialog (gtk_application_get_active_window (app),
                         "program-name", "Canalwright",
                         "logo-icon-name", CW_APPLICATION_ID,
                         "version", PACKAGE_VERSION,
                         "comments", comments,
                         "license-type", GTK_LICENSE_GPL_3_0,
                         "authors", authors,
                         "copyright", "© 2026 The Canalwright authors",
                         NULL);
}

static void
open_response (GtkNativeDialog *dialog,
               int              response,
               gpointer         user_data)
{
  GApplication *app = G_APPLICATION (user_data);

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));

      g_application_open (app, &file, 1, "");
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

static void
open_activated (GSimpleAction *action,
                GVariant      *param,
                gpointer       user_data)
{
  GtkApplication *app = GTK_APPLICATION (user_data);
  GtkFileChooserNative *dialog;
  g_autoptr(GtkFileFilter) filter = gtk_file_filter_new ();

  dialog = gtk_file_chooser_native_new (_("Open Case"), gtk_application_get_active_window (app),
                                        GTK_FILE_CHOOSER_ACTION_OPEN, _("_Open"), _("_Cancel"));
  gtk_file_filter_set_name (filter, _("Canalwright cases"));
  gtk_file_filter_add_pattern (filter, "*.cwcase");
  gtk_file_filter_add_mime_type (filter, "application/x-canalwright-case");
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (dialog), filter);
  g_signal_connect (dialog, "response", G_CALLBACK (open_response), app);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

static void
open_recent_activated (GSimpleAction *action,
                       GVariant      *param,
                       gpointer       user_data)
{
  g_autoptr(GFile) file = g_file_new_for_uri (g_variant_get_string (param, NULL));

  g_application_open (G_APPLICATION (user_data), &file, 1, "");
}

static void
help_activated (GSimpleAction *action,
                GVariant      *param,
                gpointer       user_data)
{
  GtkWindow *parent = gtk_application_get_active_window (GTK_APPLICATION (user_data));

  gtk_window_present (GTK_WINDOW (cw_help_window_new (parent)));
}

static void
cautions_activated (GSimpleAction *action,
                    GVariant      *param,
                    gpointer       user_data)
{
  CwApplication *self = CW_APPLICATION (user_data);

  cw_application_show_cautions (self, gtk_application_get_active_window (GTK_APPLICATION (self)));
}

static const GActionEntry app_actions[] = {
  { "new", new_activated },
  { "open", open_activated },
  { "quit", quit_activated },
  { "about", about_activated },
  { "cautions", cautions_activated },
  { "open-recent", open_recent_activated, "s" },
  { "help", help_activated },
};

static void
set_accels (GtkApplication *app)
{
  static const struct { const char *action; const char *accels[3]; } accels[] = {
    { "app.new", { "<Control>n", NULL } },
    { "app.open", { "<Control>o", NULL } },
    { "app.quit", { "<Control>q", NULL } },
    { "app.help", { "F1", NULL } },
    { "win.save", { "<Control>s", NULL } },
    { "win.save-as", { "<Shift><Control>s", NULL } },
    { "win.close", { "<Control>w", NULL } },
    { "win.export", { "<Control>e", NULL } },
    { "win.print", { "<Control>p", NULL } },
    { "win.propose", { "<Control>r", NULL } },
    { "win.show-library", { "<Control>l", NULL } },
    { "win.undo", { "<Control>z", NULL } },
    { "win.redo", { "<Shift><Control>z", "<Control>y", NULL } },
    { "win.add-canal", { "<Shift><Control>n", NULL } },
    { "win.next-canal", { "<Control>Page_Down", NULL } },
    { "win.previous-canal", { "<Control>Page_Up", NULL } },
    { "win.zoom-in", { "<Control>plus", "<Control>equal", NULL } },
    { "win.zoom-out", { "<Control>minus", NULL } },
    { "win.zoom-reset", { "<Control>0", NULL } },
    { "win.focus-shelf", { "<Control>1", NULL } },
    { "win.focus-sequence", { "<Control>2", NULL } },
    { "win.focus-canal", { "<Control>3", NULL } },
    { "win.edit-canal", { "<Control>4", NULL } },
    { "win.show-help-overlay", { "<Control>question", NULL } },
    { "win.presenter", { "F5", NULL } },
    { "win.export-view", { "<Shift><Control>e", NULL } },
  };

  for (guint i = 0; i < G_N_ELEMENTS (accels); i++)
    gtk_application_set_accels_for_action (app, accels[i].action, accels[i].accels);
}

/* Settings only where the schema is installed (or compiled into the build
 * folder for the tests): a missing schema would abort the program. */
static GSettings *
load_settings (void)
{
  GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
  g_autoptr(GSettingsSchema) schema = NULL;

  if (source)
    schema = g_settings_schema_source_lookup (source, CW_APPLICATION_ID, TRUE);
  if (schema == NULL)
    {
      g_warning ("Settings schema %s is not installed; settings will not be kept", CW_APPLICATION_ID);
      return NULL;
    }
  return g_settings_new_full (schema, NULL, NULL);
}

static void
cw_application_startup (GApplication *app)
{
  CwApplication *self = CW_APPLICATION (app);
  g_autoptr(GtkCssProvider) css = gtk_css_provider_new ();

  /* GtkApplication finds gtk/help-overlay.ui under the resource base path
   * by itself, but not a style sheet. */
  G_APPLICATION_CLASS (cw_application_parent_class)->startup (app);
  gtk_css_provider_load_from_resource (css, "/org/canalwright/Canalwright/style.css");
  gtk_style_context_add_provider_for_display (gdk_display_get_default (), GTK_STYLE_PROVIDER (css),
                                              GTK_STYLE_PROVIDER_PRIORITY_APPLICATION);

  self->settings = load_settings ();
  g_action_map_add_action_entries (G_ACTION_MAP (app), app_actions, G_N_ELEMENTS (app_actions), app);
  set_accels (GTK_APPLICATION (app));
}

static void
cw_application_dispose (GObject *object)
{
  CwApplication *self = CW_APPLICATION (object);

  g_clear_object (&self->settings);
  G_OBJECT_CLASS (cw_application_parent_class)->dispose (object);
}

static void
cw_application_class_init (CwApplicationClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GApplicationClass *app_class = G_APPLICATION_CLASS (klass);

  object_class->dispose = cw_application_dispose;
  app_class->activate = cw_application_activate;
  app_class->open = cw_application_open;
  app_class->startup = cw_application_startup;
}

static void
cw_application_init (CwApplication *self)
{
}
