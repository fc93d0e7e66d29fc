/* test-frames.c: canalwright --export-frames, run as a user would, with
 * no display
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <locale.h>
#include <string.h>

#include "cw-case-loader.h"
#include "cw-frames-export.h"
#include "cw-test-util.h"

static int
run (const char * const *args,
     char              **out,
     char              **err)
{
  g_autoptr(GPtrArray) argv = g_ptr_array_new ();
  g_auto(GStrv) envp = g_environ_unsetenv (g_get_environ (), "DISPLAY");
  g_autoptr(GError) error = NULL;
  int status = -1;
  GSpawnFlags flags = (out ? 0 : G_SPAWN_STDOUT_TO_DEV_NULL) | (err ? 0 : G_SPAWN_STDERR_TO_DEV_NULL);

  envp = g_environ_unsetenv (envp, "WAYLAND_DISPLAY");
  g_ptr_array_add (argv, (gpointer) g_getenv ("CW_BINARY"));
  for (guint i = 0; args[i]; i++)
    g_ptr_array_add (argv, (gpointer) args[i]);
  g_ptr_array_add (argv, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, envp, flags, NULL, NULL, out, err,
                               &status, &error));
  g_assert_no_error (error);
  return g_spawn_check_wait_status (status, NULL) ? 0 : WEXITSTATUS (status);
}

static guint
count_png (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;
  guint n = 0;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)))
    n += g_str_has_suffix (name, ".png");
  return n;
}

static void
remove_dir (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d && (name = g_dir_read_name (d)))
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      g_unlink (path);
    }
  g_rmdir (dir);
}

static guint
total_steps (const char *sample)
{
  g_autofree char *path = cw_test_sample_path (sample);
  g_autoptr(CwCase) kase = cw_case_load (path, NULL);
  guint n = 0;

  g_assert_nonnull (kase);
  for (guint i = 0; i < kase->canals->len; i++)
    n += cw_canal_get_n_steps (g_ptr_array_index (kase->canals, i));
  return n;
}

/* The width and height in a PNG's IHDR chunk, big-endian at bytes 16 and 20. */
static void
png_size (const char *path,
          guint      *width,
          guint      *height)
{
  g_autofree guchar *data = NULL;
  gsize len;

  g_assert_true (g_file_get_contents (path, (char **) &data, &len, NULL));
  g_assert_cmpuint (len, >, 24);
  g_assert_true (memcmp (data, "\x89PNG", 4) == 0);
  *width = (guint) data[16] << 24 | (guint) data[17] << 16 | (guint) data[18] << 8 | data[19];
  *height = (guint) data[20] << 24 | (guint) data[21] << 16 | (guint) data[22] << 8 | data[23];
}

/* Steps times frames per step, for every canal of the case; the names
 * sort in playing order. */
static void
test_count_every_canal (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-frames-XXXXXX", NULL);
  g_autofree char *out_dir = g_build_filename (dir, "slides", NULL);
  g_autofree char *sample = cw_test_sample_path ("lower-molar-moderate.cwcase");
  g_autofree char *out = NULL, *err = NULL, *first = NULL, *last = NULL;
  g_auto(GStrv) lines = NULL;
  const char *args[] = { "--export-frames", out_dir, sample, "--frames-per-step", "3", "--dpi", "48", NULL };
  guint w, h;

  g_assert_cmpint (run (args, &out, &err), ==, 0);
  g_assert_cmpuint (count_png (out_dir), ==, total_steps ("lower-molar-moderate.cwcase") * 3);
  g_assert_cmpuint (total_steps ("lower-molar-moderate.cwcase"), ==, 10 + 9 + 8);
  first = cw_frames_path (out_dir, "MB", 1, 1);
  last = cw_frames_path (out_dir, "D", 8, 3);
  g_assert_true (g_file_test (first, G_FILE_TEST_EXISTS));
  g_assert_true (g_file_test (last, G_FILE_TEST_EXISTS));
  g_assert_true (g_str_has_suffix (first, "MB-01-001.png"));
  /* A 960 x 540 pt slide at 48 dpi. */
  png_size (first, &w, &h);
  g_assert_cmpuint (w, ==, 640);
  g_assert_cmpuint (h, ==, 360);
  /* stdout lists every file written. */
  lines = g_strsplit (g_strstrip (out), "\n", -1);
  g_assert_cmpuint (g_strv_length (lines), ==, 27 * 3);
  remove_dir (out_dir);
  g_rmdir (dir);
}

static void
test_count_one_canal (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-frames-XXXXXX", NULL);
  g_autofree char *sample = cw_test_sample_path ("upper-premolar-s-shape.cwcase");
  g_autofree char *path = g_strdup (sample);
  g_autoptr(CwCase) kase = cw_case_load (path, NULL);
  const CwCanal *canal = g_ptr_array_index (kase->canals, 0);
  const char *args[] = { "--export-frames", dir, sample, "--canal", canal->name, NULL };
  guint w, h;

  g_assert_cmpint (run (args, NULL, NULL), ==, 0);
  g_assert_cmpuint (count_png (dir), ==, cw_canal_get_n_steps (canal) * CW_FRAMES_DEFAULT_PER_STEP);
  g_free (path);
  path = cw_frames_path (dir, canal->name, 1, CW_FRAMES_DEFAULT_PER_STEP);
  png_size (path, &w, &h);
  g_assert_cmpuint (w, ==, 1280);
  g_assert_cmpuint (h, ==, 720);
  remove_dir (dir);
}

/* Exit status 2 with a message: a bad case, a folder that cannot be
 * made, a bad option, an unknown canal; nothing written. */
static void
test_failures (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-frames-XXXXXX", NULL);
  g_autofree char *file = g_build_filename (dir, "plain-file", NULL);
  g_autofree char *under = g_build_filename (file, "frames", NULL);
  g_autofree char *bad = g_build_filename (dir, "bad.cwcase", NULL);
  g_autofree char *out_dir = g_build_filename (dir, "out", NULL);
  g_autofree char *sample = cw_test_sample_path ("lower-molar-moderate.cwcase");
  const char *unwritable[] = { "--export-frames", under, sample, NULL };
  const char *broken[] = { "--export-frames", out_dir, bad, NULL };
  const char *zero[] = { "--export-frames", out_dir, sample, "--frames-per-step", "0", NULL };
  const char *canal[] = { "--export-frames", out_dir, sample, "--canal", "XX", NULL };
  const char *usage[] = { "--export-frames", out_dir, NULL };
  const char * const *cases[] = { unwritable, broken, zero, canal, usage };

  g_assert_true (g_file_set_contents (file, "x", 1, NULL));
  g_assert_true (g_file_set_contents (bad, "{ not json", -1, NULL));
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *err = NULL;

      g_assert_cmpint (run (cases[i], NULL, &err), ==, 2);
      g_assert_cmpuint (strlen (err), >, 0);
    }
  g_assert_false (g_file_test (out_dir, G_FILE_TEST_EXISTS));
  g_unlink (file);
  g_unlink (bad);
  g_rmdir (dir);
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/frames/count-every-canal", test_count_every_canal);
  g_test_add_func ("/frames/count-one-canal", test_count_one_canal);
  g_test_add_func ("/frames/failures", test_failures);

  return g_test_run ();
}
