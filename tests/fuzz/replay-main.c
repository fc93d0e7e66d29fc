/* replay-main.c: a fuzz target as an ordinary program
 *
 * replay PATH...: feeds each file, and each file of each folder (one
 * level down as well, for regressions/<target>/), to the target's
 * LLVMFuzzerTestOneInput, so that the seed corpus and every crash once
 * found run in the normal build and its test suite.  A TAP line a file;
 * exits 1 when any input failed.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <stdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include <glib/gstdio.h>

#include "fuzz-common.h"

static guint n_run;
static guint n_failed;

static void
replay_file (const char *path)
{
  g_autofree char *data = NULL;
  g_autoptr(GError) error = NULL;
  gsize size = 0;
  int status = 0;
  pid_t pid;

  if (!g_file_get_contents (path, &data, &size, &error))
    g_error ("%s", error->message);
  printf ("# %s (%" G_GSIZE_FORMAT " bytes)\n", path, size);
  fflush (stdout);
  /* Each input in a child of its own, so that one that still crashes is
   * reported and the others run. */
  pid = fork ();
  g_assert_cmpint (pid, >=, 0);
  if (pid == 0)
    {
      LLVMFuzzerTestOneInput ((const uint8_t *) data, size);
      fflush (NULL);
      _exit (0);
    }
  g_assert_cmpint (waitpid (pid, &status, 0), ==, pid);
  n_run++;
  if (WIFEXITED (status) && WEXITSTATUS (status) == 0)
    printf ("ok %u %s\n", n_run, path);
  else if (WIFSIGNALED (status))
    {
      printf ("not ok %u %s # killed by signal %d (%s)\n", n_run, path,
              WTERMSIG (status), g_strsignal (WTERMSIG (status)));
      n_failed++;
    }
  else
    {
      printf ("not ok %u %s # exit status %d\n", n_run, path, WEXITSTATUS (status));
      n_failed++;
    }
  fflush (stdout);
}

static int
compare_names (gconstpointer a,
               gconstpointer b)
{
  return strcmp (*(const char * const *) a, *(const char * const *) b);
}

static void
replay_path (const char *path,
             guint       depth)
{
  g_autoptr(GPtrArray) names = NULL;
  g_autoptr(GDir) dir = NULL;
  const char *name;

  if (!g_file_test (path, G_FILE_TEST_IS_DIR))
    {
      replay_file (path);
      return;
    }
  if (depth > 1)
    return;
  dir = g_dir_open (path, 0, NULL);
  names = g_ptr_array_new_with_free_func (g_free);
  while (dir && (name = g_dir_read_name (dir)) != NULL)
    if (name[0] != '.')
      g_ptr_array_add (names, g_build_filename (path, name, NULL));
  g_ptr_array_sort (names, compare_names);
  for (guint i = 0; i < names->len; i++)
    replay_path (g_ptr_array_index (names, i), depth + 1);
}

int
main (int   argc,
      char *argv[])
{
  if (argc < 2)
    {
      fprintf (stderr, "usage: %s FILE-OR-FOLDER...\n", argv[0]);
      return 2;
    }
  for (int i = 1; i < argc; i++)
    replay_path (argv[i], 0);
  printf ("1..%u\n", n_run);
  return n_failed > 0 ? 1 : 0;
}
