/* cw-library-folder.c
 *
 * The libraries live as files in one folder of the user's data
 * ($XDG_DATA_HOME/canalwright/libraries), so that a library is copied,
 * backed up or shared like any other file.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-library"

#include "config.h"

#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <string.h>

#include "cw-error.h"
#include "cw-library-folder.h"

char *
cw_library_folder_default (void)
{
  return g_build_filename (g_get_user_data_dir (), "canalwright", "libraries", NULL);
}

static int
compare_paths (gconstpointer a,
               gconstpointer b)
{
  return g_utf8_collate (*(const char * const *) a, *(const char * const *) b);
}

/* The library files in DIR, sorted; empty when DIR does not exist. */
GPtrArray *
cw_library_folder_list (const char *dir)
{
  GPtrArray *paths = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GDir) folder = NULL;
  const char *name;

  g_return_val_if_fail (dir != NULL, paths);

  folder = g_dir_open (dir, 0, NULL);
  if (folder == NULL)
    return paths;
  while ((name = g_dir_read_name (folder)) != NULL)
    {
      char *path;

      if (!g_str_has_suffix (name, CW_LIBRARY_SUFFIX) || name[0] == '.')
        continue;
      path = g_build_filename (dir, name, NULL);
      if (g_file_test (path, G_FILE_TEST_IS_REGULAR))
        g_ptr_array_add (paths, path);
      else
        g_free (path);
    }
  g_ptr_array_sort (paths, compare_paths);
  return paths;
}

/* On first start the folder is created and given the starter library as
 * NAME; a folder that already holds a library is left alone. */
gboolean
cw_library_folder_seed (const char  *dir,
                        const char  *name,
                        GBytes      *starter,
                        GError     **error)
{
  g_autoptr(GPtrArray) present = NULL;
  g_autofree char *path = NULL;
  g_autoptr(GError) local_error = NULL;
  gsize size = 0;
  const char *data;

  g_return_val_if_fail (dir != NULL && name != NULL && starter != NULL, FALSE);

  if (g_mkdir_with_parents (dir, 0755) != 0)
    {
      int saved_errno = errno;

      g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not create the library folder: %s"),
                   dir, g_strerror (saved_errno));
      return FALSE;
    }
  present = cw_library_folder_list (dir);
  if (present->len > 0)
    return TRUE;
  path = g_build_filename (dir, name, NULL);
  data = g_bytes_get_data (starter, &size);
  if (g_file_set_contents_full (path, data, (gssize) size, G_FILE_SET_CONTENTS_CONSISTENT,
                                0644, &local_error))
    return TRUE;
  g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not create the starter library: %s"),
               path, local_error->message);
  return FALSE;
}

/* Letters and digits of TEXT in lower case, other runs as one dash: a
 * name for a file or an id; FALLBACK when nothing is left. */
char *
cw_library_slug (const char *text,
                 const char *fallback)
{
  g_autofree char *ascii = g_str_to_ascii (text != NULL ? text : "", NULL);
  GString *stem = g_string_new (NULL);

  for (const char *p = ascii; *p != '\0'; p++)
    if (g_ascii_isalnum (*p))
      g_string_append_c (stem, g_ascii_tolower (*p));
    else if (stem->len > 0 && stem->str[stem->len - 1] != '-')
      g_string_append_c (stem, '-');
  while (stem->len > 0 && stem->str[stem->len - 1] == '-')
    g_string_truncate (stem, stem->len - 1);
  if (stem->len == 0)
    g_string_assign (stem, fallback);
  return g_string_free (stem, FALSE);
}

/* A file name for a new library from its title, unique in DIR. */
char *
cw_library_folder_new_path (const char *dir,
                            const char *title)
{
  g_autofree char *stem = cw_library_slug (title, "library");
  char *path;

  g_return_val_if_fail (dir != NULL, NULL);

  for (guint n = 1;; n++)
    {
      g_autofree char *name = n == 1 ? g_strconcat (stem, CW_LIBRARY_SUFFIX, NULL)
                                     : g_strdup_printf ("%s-%u%s", stem, n, CW_LIBRARY_SUFFIX);

      path = g_build_filename (dir, name, NULL);
      if (!g_file_test (path, G_FILE_TEST_EXISTS))
        return path;
      g_free (path);
    }
}
