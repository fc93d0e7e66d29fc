/* cw-autosave.c
 *
 * Each window writes <pid>-<n>.cwcase (and .origin, the case's own file, if
 * any) two seconds after a change.  A clean close removes them; files left
 * by a process that is no longer running are offered back at start.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-autosave"

#include "config.h"

#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <stdlib.h>
#include <unistd.h>

#include "cw-application.h"
#include "cw-autosave.h"
#include "cw-case-writer.h"
#include "cw-window.h"

#define AUTOSAVE_DELAY_MS 2000

struct _CwAutosave
{
  GObject     parent_instance;
  CwDocument *document;
  char       *path;
  guint       timeout_id;
};

G_DEFINE_FINAL_TYPE (CwAutosave, cw_autosave, G_TYPE_OBJECT)

char *
cw_autosave_dir (void)
{
  return g_build_filename (g_get_user_cache_dir (), "canalwright", "autosave", NULL);
}

static char *
origin_path (const char *path)
{
  g_autofree char *stem = g_strndup (path, strlen (path) - strlen (".cwcase"));

  return g_strconcat (stem, ".origin", NULL);
}

gboolean
cw_autosave_write_now (CwAutosave *self)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = cw_autosave_dir ();
  g_autofree char *origin = origin_path (self->path);
  GFile *file = cw_document_get_file (self->document);
  g_autofree char *uri = file ? g_file_get_uri (file) : g_strdup ("");

  g_clear_handle_id (&self->timeout_id, g_source_remove);
  if (!cw_document_get_modified (self->document))
    return FALSE;
  if (g_mkdir_with_parents (dir, 0700) != 0 ||
      !cw_case_save (cw_document_get_case (self->document), self->path, &error) ||
      !g_file_set_contents (origin, uri, -1, &error))
    {
      g_warning ("Could not autosave: %s", error ? error->message : g_strerror (errno));
      return FALSE;
    }
  return TRUE;
}

static gboolean
autosave_timeout (gpointer data)
{
  CwAutosave *self = data;

  self->timeout_id = 0;
  cw_autosave_write_now (self);
  return G_SOURCE_REMOVE;
}

static void
document_changed (CwAutosave *self)
{
  if (self->timeout_id == 0 && cw_document_get_modified (self->document))
    self->timeout_id = g_timeout_add (AUTOSAVE_DELAY_MS, autosave_timeout, self);
}

void
cw_autosave_discard (CwAutosave *self)
{
  g_autofree char *origin = origin_path (self->path);

  g_clear_handle_id (&self->timeout_id, g_source_remove);
  g_unlink (self->path);
  g_unlink (origin);
}

CwAutosave *
cw_autosave_new (CwDocument *document)
{
  static guint counter;
  CwAutosave *self = g_object_new (CW_TYPE_AUTOSAVE, NULL);
  g_autofree char *dir = cw_autosave_dir ();
  g_autofree char *name = g_strdup_printf ("%d-%u.cwcase", (int) getpid (), ++counter);

  self->document = g_object_ref (document);
  self->path = g_build_filename (dir, name, NULL);
  g_signal_connect_object (document, "changed", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  if (cw_document_get_modified (document))
    document_changed (self);
  return self;
}

static void
cw_autosave_finalize (GObject *object)
{
  CwAutosave *self = CW_AUTOSAVE (object);

  g_clear_handle_id (&self->timeout_id, g_source_remove);
  g_clear_object (&self->document);
  g_free (self->path);
  G_OBJECT_CLASS (cw_autosave_parent_class)->finalize (object);
}

static void
cw_autosave_class_init (CwAutosaveClass *klass)
{
  G_OBJECT_CLASS (klass)->finalize = cw_autosave_finalize;
}

static void
cw_autosave_init (CwAutosave *self)
{
}

/* Files whose writer is still running belong to another window. */
static gboolean
is_orphan (const char *name)
{
  long pid = strtol (name, NULL, 10);

  if (pid <= 0 || pid == (long) getpid ())
    return FALSE;
  return kill ((pid_t) pid, 0) != 0 && errno == ESRCH;
}

static GPtrArray *
find_orphans (void)
{
  g_autofree char *dir = cw_autosave_dir ();
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  GPtrArray *found = g_ptr_array_new_with_free_func (g_free);
  const char *name;

  while (d && (name = g_dir_read_name (d)))
    if (g_str_has_suffix (name, ".cwcase") && is_orphan (name))
      g_ptr_array_add (found, g_build_filename (dir, name, NULL));
  return found;
}

static CwDocument *
recover_one (const char *path)
{
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autofree char *origin = origin_path (path);
  g_autofree char *uri = NULL;
  CwDocument *document = cw_document_open (file, NULL);

  if (document == NULL)
    return NULL;
  cw_document_set_file (document, NULL);
  if (g_file_get_contents (origin, &uri, NULL, NULL) && *uri)
    {
      g_autoptr(GFile) original = g_file_new_for_uri (uri);

      cw_document_set_file (document, original);
    }
  cw_document_set_modified (document, TRUE);
  return document;
}

static void
recovery_response (GtkDialog *dialog,
                   int        response,
                   GPtrArray *paths)
{
  GtkApplication *app = gtk_window_get_application (gtk_window_get_transient_for (GTK_WINDOW (dialog)));

  for (guint i = 0; i < paths->len; i++)
    {
      const char *path = g_ptr_array_index (paths, i);
      g_autofree char *origin = origin_path (path);
      g_autoptr(CwDocument) document = response == GTK_RESPONSE_ACCEPT ? recover_one (path) : NULL;

      if (document)
        {
          CwWindow *window = cw_window_new (CW_APPLICATION (app), document);

          gtk_window_present (GTK_WINDOW (window));
        }
      g_unlink (path);
      g_unlink (origin);
    }
  g_ptr_array_unref (paths);
  gtk_window_destroy (GTK_WINDOW (dialog));
}

void
cw_autosave_offer_recovery (GtkWindow *parent)
{
  GPtrArray *paths = find_orphans ();
  GtkWidget *dialog;

  if (paths->len == 0)
    {
      g_ptr_array_unref (paths);
      return;
    }
  dialog = gtk_message_dialog_new (parent, GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE,
                                   "%s", _("Recover unsaved work?"));
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog),
                                            g_dngettext (GETTEXT_PACKAGE,
                                                         "Canalwright stopped before %u case was saved. Its last autosaved state can be opened again.",
                                                         "Canalwright stopped before %u cases were saved. Their last autosaved states can be opened again.",
                                                         paths->len),
                                            paths->len);
  gtk_dialog_add_buttons (GTK_DIALOG (dialog), _("_Discard"), GTK_RESPONSE_REJECT,
                          _("_Recover"), GTK_RESPONSE_ACCEPT, NULL);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  g_signal_connect (dialog, "response", G_CALLBACK (recovery_response), paths);
  gtk_window_present (GTK_WINDOW (dialog));
}
