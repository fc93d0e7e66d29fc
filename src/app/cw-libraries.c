/* cw-libraries.c
 *
 * Every library file in the user's library folder, loaded whole (they are
 * small), and the one chosen as current, kept by name in the settings.  A
 * change is saved to its file first and shown only once it is saved, so
 * that what the window shows is what is on disk.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-libraries"

#include "config.h"

#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <string.h>

#include "cw-application.h"
#include "cw-error.h"
#include "cw-libraries.h"
#include "cw-library-folder.h"

#define STARTER_NAME "starter-library.cwlib"
#define STARTER_RESOURCE "/org/canalwright/Canalwright/starter-library.cwlib"

struct _CwLibraries
{
  GObject     parent_instance;

  char       *dir;
  GSettings  *settings;
  GPtrArray  *libraries;   /* CwLibrary, sorted by file name */
  GPtrArray  *problems;    /* char *: files that did not load */
  guint       current;
};

G_DEFINE_FINAL_TYPE (CwLibraries, cw_libraries, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_CURRENT,
  N_PROPS
};

enum {
  CHANGED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static void
seed (CwLibraries *self)
{
  g_autoptr(GBytes) starter = g_resources_lookup_data (STARTER_RESOURCE, 0, NULL);
  g_autoptr(GError) error = NULL;

  if (starter == NULL)
    {
      g_warning ("The starter library is missing from the resources");
      return;
    }
  if (!cw_library_folder_seed (self->dir, STARTER_NAME, starter, &error))
    g_ptr_array_add (self->problems, g_strdup (error->message));
}

static int
compare_libraries (gconstpointer a,
                   gconstpointer b)
{
  const CwLibrary *x = *(const CwLibrary * const *) a;
  const CwLibrary *y = *(const CwLibrary * const *) b;

  return g_utf8_collate (x->path, y->path);
}

static guint
index_of_path (CwLibraries *self,
               const char  *path)
{
  for (guint i = 0; i < self->libraries->len; i++)
    if (g_strcmp0 (((CwLibrary *) g_ptr_array_index (self->libraries, i))->path, path) == 0)
      return i;
  return 0;
}

static char *
current_name (CwLibraries *self)
{
  const CwLibrary *library = cw_libraries_get_current (self);

  return g_path_get_basename (library->path);
}

static void
pick_current (CwLibraries *self)
{
  g_autofree char *name = self->settings ? g_settings_get_string (self->settings, "current-library") : NULL;
  g_autofree char *path = name && *name ? g_build_filename (self->dir, name, NULL) : NULL;

  self->current = path ? index_of_path (self, path) : 0;
}

/* With no library to be had (a folder that cannot be written, files that
 * do not load), an empty one, saved on its first change. */
static void
ensure_one (CwLibraries *self)
{
  CwLibrary *library;

  if (self->libraries->len > 0)
    return;
  library = cw_library_new (_("My instruments"));
  library->path = cw_library_folder_new_path (self->dir, library->title);
  g_ptr_array_add (self->libraries, library);
}

static void
load_all (CwLibraries *self)
{
  g_autoptr(GPtrArray) paths = NULL;

  g_ptr_array_set_size (self->libraries, 0);
  g_ptr_array_set_size (self->problems, 0);
  seed (self);
  paths = cw_library_folder_list (self->dir);
  for (guint i = 0; i < paths->len; i++)
    {
      g_autoptr(GError) error = NULL;
      CwLibrary *library = cw_library_load (g_ptr_array_index (paths, i), &error);

      if (library != NULL)
        g_ptr_array_add (self->libraries, library);
      else
        g_ptr_array_add (self->problems, g_strdup (error->message));
    }
  ensure_one (self);
  pick_current (self);
}

static void
emit_changed (CwLibraries *self)
{
  g_signal_emit (self, signals[CHANGED], 0);
}

CwLibraries *
cw_libraries_new (const char *dir,
                  GSettings  *settings)
{
  CwLibraries *self;

  g_return_val_if_fail (dir != NULL, NULL);
  g_return_val_if_fail (settings == NULL || G_IS_SETTINGS (settings), NULL);

  self = g_object_new (CW_TYPE_LIBRARIES, NULL);
  self->dir = g_strdup (dir);
  self->settings = settings ? g_object_ref (settings) : NULL;
  load_all (self);
  return self;
}

/* Settings where the schema is installed (or compiled into the build
 * folder for the tests); without it the choice is not kept. */
static GSettings *
lookup_settings (void)
{
  GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
  g_autoptr(GSettingsSchema) schema = source ? g_settings_schema_source_lookup (source, CW_APPLICATION_ID, TRUE)
                                             : NULL;

  return schema ? g_settings_new_full (schema, NULL, NULL) : NULL;
}

/* One set for the whole program, as every window shows the same folder. */
CwLibraries *
cw_libraries_get_default (void)
{
  static CwLibraries *instance;

  if (instance == NULL)
    {
      g_autofree char *dir = cw_library_folder_default ();
      g_autoptr(GSettings) settings = lookup_settings ();

      instance = cw_libraries_new (dir, settings);
    }
  return instance;
}

const char *
cw_libraries_get_dir (CwLibraries *self)
{
  g_return_val_if_fail (CW_IS_LIBRARIES (self), NULL);
  return self->dir;
}

guint
cw_libraries_get_n_libraries (CwLibraries *self)
{
  g_return_val_if_fail (CW_IS_LIBRARIES (self), 0);
  return self->libraries->len;
}

const CwLibrary *
cw_libraries_get_library (CwLibraries *self,
                          guint        index)
{
  g_return_val_if_fail (CW_IS_LIBRARIES (self), NULL);
  g_return_val_if_fail (index < self->libraries->len, NULL);
  return g_ptr_array_index (self->libraries, index);
}

guint
cw_libraries_get_current_index (CwLibraries *self)
{
  g_return_val_if_fail (CW_IS_LIBRARIES (self), 0);
  return self->current;
}

void
cw_libraries_set_current_index (CwLibraries *self,
                                guint        index)
{
  g_autofree char *name = NULL;

  g_return_if_fail (CW_IS_LIBRARIES (self));
  g_return_if_fail (index < self->libraries->len);

  if (index == self->current)
    return;
  self->current = index;
  name = current_name (self);
  if (self->settings)
    g_settings_set_string (self->settings, "current-library", name);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CURRENT]);
  emit_changed (self);
}

const CwLibrary *
cw_libraries_get_current (CwLibraries *self)
{
  g_return_val_if_fail (CW_IS_LIBRARIES (self), NULL);
  return g_ptr_array_index (self->libraries, self->current);
}

GPtrArray *
cw_libraries_get_problems (CwLibraries *self)
{
  g_return_val_if_fail (CW_IS_LIBRARIES (self), NULL);
  return self->problems;
}

/* REPLACEMENT takes the place of library INDEX once it is saved. */
static gboolean
replace (CwLibraries  *self,
         guint         index,
         CwLibrary    *replacement,
         GError      **error)
{
  g_autoptr(CwLibrary) library = replacement;
  CwLibrary *old;

  if (!cw_library_save (library, library->path, error))
    return FALSE;
  old = g_ptr_array_index (self->libraries, index);
  g_ptr_array_index (self->libraries, index) = g_steal_pointer (&library);
  cw_library_free (old);
  emit_changed (self);
  return TRUE;
}

/* Replaces instrument INDEX of the current library, or adds one at the
 * end when INDEX is -1. */
gboolean
cw_libraries_put_instrument (CwLibraries   *self,
                             int            index,
                             CwInstrument  *instrument,
                             GError       **error)
{
  g_autoptr(CwInstrument) owned = instrument;
  CwLibrary *library;

  g_return_val_if_fail (CW_IS_LIBRARIES (self), FALSE);
  g_return_val_if_fail (instrument != NULL, FALSE);

  g_return_val_if_fail (index < (int) cw_libraries_get_current (self)->instruments->len, FALSE);

  library = cw_library_copy (cw_libraries_get_current (self));
  if (index < 0)
    g_ptr_array_add (library->instruments, g_steal_pointer (&owned));
  else
    {
      cw_instrument_free (g_ptr_array_index (library->instruments, index));
      g_ptr_array_index (library->instruments, index) = g_steal_pointer (&owned);
    }
  return replace (self, self->current, library, error);
}

gboolean
cw_libraries_remove_instruments (CwLibraries  *self,
                                 const char  **ids,
                                 GError      **error)
{
  CwLibrary *library;

  g_return_val_if_fail (CW_IS_LIBRARIES (self), FALSE);
  g_return_val_if_fail (ids != NULL, FALSE);

  library = cw_library_copy (cw_libraries_get_current (self));
  for (guint i = 0; ids[i] != NULL; i++)
    {
      int at = cw_library_find (library, ids[i]);

      if (at >= 0)
        g_ptr_array_remove_index (library->instruments, at);
    }
  return replace (self, self->current, library, error);
}

/* LIBRARY, saved to its path, joins the set and becomes the current one. */
static gboolean
add_library (CwLibraries  *self,
             CwLibrary    *library,
             GError      **error)
{
  g_autoptr(CwLibrary) owned = library;
  g_autofree char *path = g_strdup (library->path);

  if (!cw_library_save (owned, path, error))
    return FALSE;
  g_ptr_array_add (self->libraries, g_steal_pointer (&owned));
  g_ptr_array_sort (self->libraries, compare_libraries);
  self->current = G_MAXUINT;
  cw_libraries_set_current_index (self, index_of_path (self, path));
  return TRUE;
}

gboolean
cw_libraries_create (CwLibraries  *self,
                     const char   *title,
                     GError      **error)
{
  CwLibrary *library;

  g_return_val_if_fail (CW_IS_LIBRARIES (self), FALSE);
  g_return_val_if_fail (title != NULL, FALSE);

  if (g_mkdir_with_parents (self->dir, 0755) != 0)
    {
      int saved_errno = errno;

      g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not create the library folder: %s"),
                   self->dir, g_strerror (saved_errno));
      return FALSE;
    }
  library = cw_library_new (title);
  library->path = cw_library_folder_new_path (self->dir, title);
  return add_library (self, library, error);
}

/* A library file from elsewhere is checked like any other and copied into
 * the folder, under its own name where that is free, so that it stays when
 * the original moves. */
gboolean
cw_libraries_import (CwLibraries  *self,
                     const char   *path,
                     GError      **error)
{
  g_autoptr(CwLibrary) library = NULL;
  g_autofree char *base = NULL;

  g_return_val_if_fail (CW_IS_LIBRARIES (self), FALSE);
  g_return_val_if_fail (path != NULL, FALSE);

  library = cw_library_load (path, error);
  if (library == NULL)
    return FALSE;
  base = g_path_get_basename (path);
  if (g_str_has_suffix (base, CW_LIBRARY_SUFFIX))
    base[strlen (base) - strlen (CW_LIBRARY_SUFFIX)] = '\0';
  g_mkdir_with_parents (self->dir, 0755);
  g_free (library->path);
  library->path = cw_library_folder_new_path (self->dir, base);
  return add_library (self, g_steal_pointer (&library), error);
}

gboolean
cw_libraries_export (CwLibraries  *self,
                     guint         index,
                     const char   *path,
                     GError      **error)
{
  g_autoptr(CwLibrary) copy = NULL;

  g_return_val_if_fail (CW_IS_LIBRARIES (self), FALSE);
  g_return_val_if_fail (index < self->libraries->len, FALSE);
  g_return_val_if_fail (path != NULL, FALSE);

  copy = cw_library_copy (g_ptr_array_index (self->libraries, index));
  return cw_library_save (copy, path, error);
}

/* The file goes; the last library stays, so that there is always one to
 * add instruments to. */
gboolean
cw_libraries_delete (CwLibraries  *self,
                     guint         index,
                     GError      **error)
{
  const CwLibrary *library;

  g_return_val_if_fail (CW_IS_LIBRARIES (self), FALSE);
  g_return_val_if_fail (index < self->libraries->len, FALSE);

  library = g_ptr_array_index (self->libraries, index);
  if (self->libraries->len == 1)
    {
      g_set_error (error, CW_ERROR, CW_ERROR_INVALID, _("“%s” is the only library; it is kept."),
                   cw_library_display_name (library));
      return FALSE;
    }
  if (g_unlink (library->path) != 0 && errno != ENOENT)
    {
      int saved_errno = errno;

      g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not delete the library: %s"),
                   library->path, g_strerror (saved_errno));
      return FALSE;
    }
  g_ptr_array_remove_index (self->libraries, index);
  if (self->current >= index && self->current > 0)
    self->current--;
  index = self->current;
  self->current = G_MAXUINT;
  cw_libraries_set_current_index (self, index);
  return TRUE;
}

static void
cw_libraries_get_property (GObject    *object,
                           guint       prop_id,
                           GValue     *value,
                           GParamSpec *pspec)
{
  CwLibraries *self = CW_LIBRARIES (object);

  switch (prop_id)
    {
    case PROP_CURRENT:
      g_value_set_uint (value, self->current);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_libraries_set_property (GObject      *object,
                           guint         prop_id,
                           const GValue *value,
                           GParamSpec   *pspec)
{
  CwLibraries *self = CW_LIBRARIES (object);

  switch (prop_id)
    {
    case PROP_CURRENT:
      if (g_value_get_uint (value) < self->libraries->len)
        cw_libraries_set_current_index (self, g_value_get_uint (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_libraries_finalize (GObject *object)
{
  CwLibraries *self = CW_LIBRARIES (object);

  g_free (self->dir);
  g_clear_object (&self->settings);
  g_ptr_array_unref (self->libraries);
  g_ptr_array_unref (self->problems);
  G_OBJECT_CLASS (cw_libraries_parent_class)->finalize (object);
}

static void
cw_libraries_class_init (CwLibrariesClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = cw_libraries_finalize;
  object_class->get_property = cw_libraries_get_property;
  object_class->set_property = cw_libraries_set_property;

  properties[PROP_CURRENT] =
    g_param_spec_uint ("current", NULL, NULL, 0, G_MAXUINT, 0,
                       G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  signals[CHANGED] = g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                   0, NULL, NULL, NULL, G_TYPE_NONE, 0);
}

static void
cw_libraries_init (CwLibraries *self)
{
  self->libraries = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_library_free);
  self->problems = g_ptr_array_new_with_free_func (g_free);
}
