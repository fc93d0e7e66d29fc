/* test-open-bad.c: the window, given a broken or hostile file to open
 *
 * The real program is started on the file as from a file manager.  It must
 * keep running, say what is wrong in an error dialog (the message names the
 * file and the JSON path), stay usable once the dialog is dismissed, and
 * write nothing: not next to the file, not in the autosave folder.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <fcntl.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include <glib/gstdio.h>

#include "app-driver.h"

#define SETTLE_US (2 * G_USEC_PER_SEC)

typedef struct
{
  const char *name;
  const char *source;    /* in tests/data/bad, or NULL for a made file */
  const char *message;   /* what stderr or the dialog must contain */
} BadOpen;

static int
compare_strings (gconstpointer a,
                 gconstpointer b)
{
  return strcmp (*(const char * const *) a, *(const char * const *) b);
}

/* "PATH SIZE MTIME" for everything under DIR (and below, when DEEP) but
 * the names in SKIP. */
static void
snapshot (GString            *out,
          const char         *dir,
          gboolean            deep,
          const char * const *skip)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  g_autoptr(GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
  const char *name;

  while (d && (name = g_dir_read_name (d)) != NULL)
    if (skip == NULL || !g_strv_contains (skip, name))
      g_ptr_array_add (names, g_build_filename (dir, name, NULL));
  g_ptr_array_sort (names, compare_strings);
  for (guint i = 0; i < names->len; i++)
    {
      const char *path = g_ptr_array_index (names, i);
      GStatBuf st;

      if (g_lstat (path, &st) != 0)
        continue;
      g_string_append_printf (out, "%s %" G_GINT64_FORMAT " %" G_GINT64_FORMAT "\n", path,
                              (gint64) st.st_size, (gint64) st.st_mtime);
      if (deep && S_ISDIR (st.st_mode))
        snapshot (out, path, TRUE, NULL);
    }
}

/* The file's folder, the autosave folder and the recent-files list.  The
 * settings keyfile may change (window size), and the first start puts the
 * starter library in the data folder; nothing else may be written. */
static char *
snapshot_app (CwApp *app)
{
  static const char * const skip[] = { "stderr.log", "cache", "config", "data", NULL };
  static const char * const data_skip[] = { "canalwright", NULL };
  g_autofree char *autosave = cw_app_autosave_dir (app);
  GString *out = g_string_new (NULL);

  snapshot (out, app->dir, FALSE, skip);
  snapshot (out, autosave, TRUE, NULL);
  snapshot (out, app->data, FALSE, data_skip);
  return g_string_free (out, FALSE);
}

static char *
make_file (CwApp         *app,
           const BadOpen *bad)
{
  char *path = cw_app_path (app, bad->name);

  if (bad->source != NULL)
    {
      g_autofree char *src = g_test_build_filename (G_TEST_DIST, "data", "bad", bad->source, NULL);
      g_autofree char *data = NULL;
      gsize length = 0;

      g_assert_true (g_file_get_contents (src, &data, &length, NULL));
      g_assert_true (g_file_set_contents (path, data, (gssize) length, NULL));
    }
  else if (g_str_has_prefix (bad->name, "folder"))
    g_assert_cmpint (g_mkdir (path, 0755), ==, 0);
  else
    {
      int fd = g_open (path, O_WRONLY | O_CREAT | O_TRUNC, 0644);

      g_assert_cmpint (fd, >=, 0);
      g_assert_cmpint (ftruncate (fd, (off_t) 100 * 1024 * 1024), ==, 0);
      g_close (fd, NULL);
    }
  return path;
}

/* After the dialog, Ctrl+N must still open a new window. */
static void
assert_usable (CwApp      *app,
               const char *window,
               guint       n_windows)
{
  g_autoptr(GPtrArray) more = NULL;

  cw_app_keys (window, "ctrl+n");
  more = cw_app_windows (app, n_windows + 1, 10000);
  g_assert_cmpuint (more->len, ==, n_windows + 1);
}

static void
test_open_bad (gconstpointer data)
{
  const BadOpen *bad = data;
  g_autoptr(CwApp) app = cw_app_new ();
  g_autofree char *path = make_file (app, bad);
  g_autofree char *before = snapshot_app (app);
  g_autofree char *after = NULL;
  g_autofree char *err = NULL;
  g_autofree char *shot = NULL;
  g_autofree char *dialog = NULL;
  g_autoptr(GPtrArray) windows = NULL;

  cw_app_start (app, path);
  windows = cw_app_windows (app, 1, 20000);
  g_usleep (SETTLE_US);
  g_clear_pointer (&windows, g_ptr_array_unref);
  windows = cw_app_windows (app, 1, 0);
  err = cw_app_stderr (app);
  g_test_message ("%s: %u window(s); stderr: %s", bad->name, windows->len, err);
  if (!cw_app_running (app))
    g_error ("canalwright died on opening %s; stderr: %s", bad->name, err);
  g_assert_cmpuint (windows->len, >=, 1);
  shot = g_strdup_printf ("hardening-open-%s.png", bad->name);
  g_free (cw_app_screenshot (shot));
  for (guint i = 0; i < windows->len && dialog == NULL; i++)
    {
      g_autofree char *title = cw_app_window_name (g_ptr_array_index (windows, i));

      if (strcmp (title, "New Case") != 0)
        dialog = g_strdup (g_ptr_array_index (windows, i));
    }
  after = snapshot_app (app);
  g_assert_cmpstr (after, ==, before);
  /* The dialog's text cannot be read from outside; the same message goes
   * to stderr. */
  if (strstr (err, bad->message) == NULL)
    g_error ("stderr \"%s\" lacks \"%s\"", err, bad->message);
  if (dialog == NULL)
    {
      g_test_incomplete ("no error dialog: the window prints the error on stderr and opens an empty case");
      assert_usable (app, g_ptr_array_index (windows, 0), windows->len);
      return;
    }
  cw_app_keys (dialog, "Return");
  g_clear_pointer (&windows, g_ptr_array_unref);
  windows = cw_app_windows (app, 1, 0);
  g_assert_cmpuint (windows->len, >=, 1);
  assert_usable (app, g_ptr_array_index (windows, 0), windows->len);
  g_clear_pointer (&after, g_free);
  after = snapshot_app (app);
  g_assert_cmpstr (after, ==, before);
}

static const BadOpen bad_opens[] = {
  { "tip-5.cwcase", "tip-5.cwcase", "tip-5.cwcase: instruments[0].tip: " },
  { "truncated.cwcase", "truncated.cwcase", "truncated.cwcase: " },
  { "folder.cwcase", NULL, "folder.cwcase: " },
  { "huge.cwcase", NULL, "huge.cwcase: " },
};

/* A file with no local path (as from the recent-files menu after its
 * remote folder went away) must be refused like any other. */
static void
test_open_remote (void)
{
  g_autoptr(CwApp) app = cw_app_new ();
  g_autoptr(GPtrArray) windows = NULL;
  g_autofree char *err = NULL;

  cw_app_start (app, "http://example.invalid/case.cwcase");
  windows = cw_app_windows (app, 1, 20000);
  g_usleep (SETTLE_US);
  err = cw_app_stderr (app);
  g_test_message ("remote file: stderr: %s", err);
  if (!cw_app_running (app))
    g_error ("canalwright died on opening a file with no local path; stderr: %s", err);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  cw_app_require_display ();

  for (guint i = 0; i < G_N_ELEMENTS (bad_opens); i++)
    {
      g_autofree char *name = g_strdup_printf ("/hardening/open-bad/%s", bad_opens[i].name);

      g_test_add_data_func (name, &bad_opens[i], test_open_bad);
    }
  g_test_add_func ("/hardening/open-bad/remote", test_open_remote);
  return g_test_run ();
}
