/* test-save-kill.c: no lost work when a save is interrupted or fails
 *
 * A helper saves two versions of a case in turn to one path and is killed
 * with SIGKILL at a random moment, 200 times: the file must always be one
 * version or the other, complete.  On a full disk a save must fail with a
 * message naming the file and leave the old case as it was.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <errno.h>
#include <fcntl.h>
#include <signal.h>
#include <string.h>
#include <sys/mount.h>
#include <unistd.h>

#include <gio/gio.h>
#include <glib/gstdio.h>

#include "cw-case-loader.h"
#include "cw-case-writer.h"
#include "cw-error.h"
#include "save-variants.h"

#define N_KILLS 200
#define MAX_DELAY_US 20000
#define NOTES_BYTES (2 * 1024 * 1024)
#define SAMPLE "lower-molar-moderate.cwcase"

static char *
sample_path (void)
{
  return g_build_filename (g_getenv ("CW_SAMPLE_CASES"), SAMPLE, NULL);
}

static CwCase *
load_sample (void)
{
  g_autofree char *path = sample_path ();
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load (path, &error);

  g_assert_no_error (error);
  return kase;
}

static void
remove_dir_contents (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d && (name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      g_unlink (path);
    }
}

/* What a save killed before its rename leaves: "NAME.XXXXXX" from
 * g_file_set_contents_full, or any other name built on NAME (a hidden
 * ".NAME..." of a writer that makes its own temporary files). */
static gboolean
is_temp_of (const char *name,
            const char *target)
{
  return strcmp (name, target) != 0 && strstr (name, target) != NULL;
}

typedef struct
{
  guint a;
  guint b;
  guint temps;
  gsize temp_bytes;
} Tally;

/* Everything in DIR is the case or an interrupted save's temporary file;
 * the temporary files are counted and removed. */
static void
sweep_temps (const char *dir,
             Tally      *tally)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);
      GStatBuf st;

      if (strcmp (name, "case.cwcase") == 0)
        continue;
      if (!is_temp_of (name, "case.cwcase"))
        g_error ("unexpected file %s after a killed save", name);
      g_assert_cmpint (g_stat (path, &st), ==, 0);
      tally->temps++;
      tally->temp_bytes += (gsize) st.st_size;
      g_unlink (path);
    }
}

static void
check_outcome (const char *path,
               const char *a,
               const char *b,
               Tally      *tally)
{
  g_autofree char *bytes = NULL;
  g_autofree char *again = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = NULL;

  g_assert_true (g_file_get_contents (path, &bytes, NULL, &error));
  g_assert_no_error (error);
  if (strcmp (bytes, a) == 0)
    tally->a++;
  else if (strcmp (bytes, b) == 0)
    tally->b++;
  else
    g_error ("after a kill the case is neither version A nor B (%" G_GSIZE_FORMAT " bytes)", strlen (bytes));
  kase = cw_case_load (path, &error);
  g_assert_no_error (error);
  again = cw_case_to_data (kase);
  g_assert_cmpstr (again, ==, bytes);
}

static void
kill_one_save (const char *loop,
               const char *sample,
               const char *path,
               guint       delay_us)
{
  g_autofree char *notes = g_strdup_printf ("%d", NOTES_BYTES);
  g_autoptr(GError) error = NULL;
  g_autoptr(GSubprocess) proc = g_subprocess_new (G_SUBPROCESS_FLAGS_STDOUT_PIPE, &error,
                                                  loop, sample, path, notes, NULL);
  g_autoptr(GDataInputStream) out = NULL;
  g_autofree char *line = NULL;

  g_assert_no_error (error);
  out = g_data_input_stream_new (g_subprocess_get_stdout_pipe (proc));
  line = g_data_input_stream_read_line (out, NULL, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (line, ==, "ready");
  g_usleep (delay_us);
  g_subprocess_send_signal (proc, SIGKILL);
  g_subprocess_wait (proc, NULL, &error);
  g_assert_no_error (error);
  if (!g_subprocess_get_if_signaled (proc))
    g_error ("save-loop ended by itself (status %d) instead of being killed",
             g_subprocess_get_exit_status (proc));
  g_assert_cmpint (g_subprocess_get_term_sig (proc), ==, SIGKILL);
}

static void
test_save_killed_200_times (void)
{
  const char *loop = g_getenv ("CW_SAVE_LOOP");
  g_autofree char *sample = sample_path ();
  g_autofree char *dir = g_dir_make_tmp ("cw-save-kill-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "case.cwcase", NULL);
  g_autoptr(CwCase) base = load_sample ();
  g_autoptr(CwCase) va = cw_save_variant (base, 'A', NOTES_BYTES);
  g_autoptr(CwCase) vb = cw_save_variant (base, 'B', NOTES_BYTES);
  g_autofree char *a = cw_case_to_data (va);
  g_autofree char *b = cw_case_to_data (vb);
  g_autoptr(GError) error = NULL;
  Tally tally = { 0 };

  g_assert_nonnull (loop);
  g_assert_cmpstr (a, !=, b);
  g_assert_true (cw_case_save (va, path, &error));
  g_assert_no_error (error);
  for (guint i = 0; i < N_KILLS; i++)
    {
      kill_one_save (loop, sample, path, (guint) g_test_rand_int_range (0, MAX_DELAY_US + 1));
      check_outcome (path, a, b, &tally);
      sweep_temps (dir, &tally);
    }
  g_test_message ("%d kills: %u times version A, %u times B; %u temporary files left behind "
                  "(%" G_GSIZE_FORMAT " bytes in all)",
                  N_KILLS, tally.a, tally.b, tally.temps, tally.temp_bytes);
  /* Otherwise the kills did not land while saves were going on. */
  g_assert_cmpuint (tally.a, >, 0);
  g_assert_cmpuint (tally.b, >, 0);
  g_assert_cmpuint (tally.temps, >, 0);
  remove_dir_contents (dir);
  g_rmdir (dir);
}

static void
test_save_into_missing_folder_fails (void)
{
  g_autoptr(CwCase) kase = load_sample ();
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("cw-save-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "gone", "case.cwcase", NULL);

  g_assert_false (cw_case_save (kase, path, &error));
  g_assert_error (error, CW_ERROR, CW_ERROR_WRITE);
  g_assert_nonnull (strstr (error->message, "case.cwcase"));
  g_rmdir (dir);
}

/* What loaded must, once saved, load again: a save that would write a
 * file the loader refuses has to fail instead, and keep the old file. */
static void
check_reopens (const char *name,
               GString    *text)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-save-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "case.cwcase", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load_from_data (text->str, (gssize) text->len, name, &error);
  g_autoptr(CwCase) again = NULL;
  g_autofree char *why = NULL;

  if (kase == NULL)
    g_test_message ("%s refused on load: %s", name, error->message);
  else if (!cw_case_save (kase, path, &error))
    {
      g_test_message ("%s refused on save: %s", name, error->message);
      g_assert_true (g_error_matches (error, CW_ERROR, CW_ERROR_WRITE)
                     || g_error_matches (error, CW_ERROR, CW_ERROR_TOO_LARGE));
      g_assert_nonnull (strstr (error->message, "case.cwcase"));
      g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
    }
  else if ((again = cw_case_load (path, &error)) == NULL)
    {
      why = g_strdup_printf ("%s: a %" G_GSIZE_FORMAT "-byte case that loaded was saved as a file "
                             "that does not load again: %s", name, text->len, error->message);
      g_test_incomplete (why);
    }
  g_unlink (path);
  g_rmdir (dir);
}

/* 3 MiB of raw control characters in the notes: JSON has them only as
 * escapes, which take six bytes each. */
static void
test_save_reopens_control_characters (void)
{
  g_autofree char *sample = sample_path ();
  g_autofree char *text = NULL;
  g_autoptr(GString) notes = g_string_new (NULL);
  const char *at;

  g_assert_true (g_file_get_contents (sample, &text, NULL, NULL));
  at = strstr (text, "\"notes\": \"");
  g_assert_nonnull (at);
  g_string_append_len (notes, text, at - text + strlen ("\"notes\": \""));
  for (guint i = 0; i < 3 * 1024 * 1024; i++)
    g_string_append_c (notes, '\x01');
  g_string_append (notes, at + strlen ("\"notes\": \""));
  check_reopens ("control.cwcase", notes);
}

/* A newer version's member, kept and written back: 240 000 small objects
 * 28 levels down take 2 MB as written, but every one gets lines of its own,
 * indented, when the case is saved. */
static void
test_save_reopens_deep_unknown_member (void)
{
  g_autofree char *sample = sample_path ();
  g_autofree char *text = NULL;
  g_autoptr(GString) deep = g_string_new (NULL);
  const char *end;

  g_assert_true (g_file_get_contents (sample, &text, NULL, NULL));
  end = strrchr (text, '}');
  g_assert_nonnull (end);
  g_string_append_len (deep, text, end - text);
  g_string_append (deep, ", \"x-newer\": ");
  for (guint i = 0; i < 28; i++)
    g_string_append_c (deep, '[');
  for (guint a = 0; a < 24; a++)
    {
      g_string_append (deep, a > 0 ? ",[" : "[");
      for (guint i = 0; i < 10000; i++)
        g_string_append (deep, i > 0 ? ",{\"a\":1}" : "{\"a\":1}");
      g_string_append_c (deep, ']');
    }
  for (guint i = 0; i < 28; i++)
    g_string_append_c (deep, ']');
  g_string_append (deep, "}\n");
  check_reopens ("deep.cwcase", deep);
}

/* Fills the file system holding DIR; returns the filler's path. */
static char *
fill_disk (const char *dir)
{
  char *filler = g_build_filename (dir, "filler", NULL);
  int fd = g_open (filler, O_WRONLY | O_CREAT | O_TRUNC, 0644);
  char chunk[4096];

  g_assert_cmpint (fd, >=, 0);
  memset (chunk, 'x', sizeof chunk);
  for (;;)
    {
      gssize n = write (fd, chunk, sizeof chunk);

      if (n < 0 && errno == ENOSPC)
        break;
      g_assert_cmpint (n, >, 0);
    }
  g_assert_cmpint (write (fd, chunk, 1), <, 0);
  g_close (fd, NULL);
  return filler;
}

static void
test_save_to_full_disk_keeps_old_file (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-full-disk-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "case.cwcase", NULL);
  g_autofree char *filler = NULL;
  g_autofree char *old = NULL;
  g_autofree char *now = NULL;
  g_autoptr(CwCase) base = load_sample ();
  g_autoptr(CwCase) small = cw_save_variant (base, 'A', 1000);
  g_autoptr(CwCase) big = cw_save_variant (base, 'B', 256 * 1024);
  g_autoptr(GError) error = NULL;

  if (mount ("tmpfs", dir, "tmpfs", MS_NOSUID | MS_NODEV, "size=1m,mode=0700") != 0)
    {
      g_autofree char *why = g_strdup_printf ("cannot mount a 1 MiB tmpfs: %s", g_strerror (errno));

      g_rmdir (dir);
      g_test_skip (why);
      return;
    }
  g_assert_true (cw_case_save (small, path, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (path, &old, NULL, NULL));
  filler = fill_disk (dir);
  g_assert_false (cw_case_save (big, path, &error));
  g_test_message ("full disk: %s", error->message);
  g_assert_error (error, CW_ERROR, CW_ERROR_WRITE);
  g_assert_nonnull (strstr (error->message, path));
  g_assert_nonnull (strstr (error->message, g_strerror (ENOSPC)));
  g_assert_true (g_file_get_contents (path, &now, NULL, NULL));
  g_assert_cmpstr (now, ==, old);
  {
    Tally tally = { 0 };

    /* The failed save cleans up after itself. */
    g_unlink (filler);
    sweep_temps (dir, &tally);
    g_assert_cmpuint (tally.temps, ==, 0);
  }
  g_clear_error (&error);
  g_assert_true (cw_case_save (big, path, &error));
  g_assert_no_error (error);
  g_assert_cmpint (umount2 (dir, MNT_DETACH), ==, 0);
  g_rmdir (dir);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/hardening/save/killed-200-times", test_save_killed_200_times);
  g_test_add_func ("/hardening/save/missing-folder", test_save_into_missing_folder_fails);
  g_test_add_func ("/hardening/save/full-disk", test_save_to_full_disk_keeps_old_file);
  g_test_add_func ("/hardening/save/reopens/control-characters", test_save_reopens_control_characters);
  g_test_add_func ("/hardening/save/reopens/deep-unknown-member", test_save_reopens_deep_unknown_member);
  return g_test_run ();
}
