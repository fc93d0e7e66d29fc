/* test-recovery.c: autosave and recovery after the window was killed
 *
 * The real program opens a copy of a sample case; a step is removed with
 * the keyboard; once the autosave is written the program is killed with
 * SIGKILL.  Started again, it must offer the autosaved work back, and the
 * recovered case, saved with Ctrl+S, must be the edited one, over the
 * original file.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <string.h>

#include <glib/gstdio.h>

#include "app-driver.h"
#include "cw-case-loader.h"
#include "cw-case-writer.h"

#define SAMPLE "lower-incisor-straight.cwcase"
#define AUTOSAVE_WAIT_US (10 * G_USEC_PER_SEC)

static char *
copy_sample (CwApp *app)
{
  g_autofree char *src = g_build_filename (g_getenv ("CW_SAMPLE_CASES"), SAMPLE, NULL);
  g_autofree char *data = NULL;
  char *path = cw_app_path (app, "case.cwcase");
  gsize length = 0;

  g_assert_true (g_file_get_contents (src, &data, &length, NULL));
  g_assert_true (g_file_set_contents (path, data, (gssize) length, NULL));
  return path;
}

static CwCase *
load (const char *path)
{
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load (path, &error);

  g_assert_no_error (error);
  return kase;
}

static guint
n_steps (const CwCase *kase)
{
  return cw_canal_get_n_steps (g_ptr_array_index (kase->canals, 0));
}

static char *
read_text (const char *path)
{
  char *text = NULL;

  g_assert_true (g_file_get_contents (path, &text, NULL, NULL));
  return text;
}

/* Edits the case in the window and waits for the autosave; returns the
 * autosaved case's text. */
static char *
edit_and_autosave (CwApp      *app,
                   const char *path,
                   guint       steps_before)
{
  g_autoptr(GPtrArray) windows = NULL;
  g_autofree char *dir = cw_app_autosave_dir (app);
  g_autofree char *name = NULL;
  g_autofree char *autosave = NULL;
  g_autofree char *origin = NULL;
  g_autofree char *origin_uri = NULL;
  g_autofree char *uri = NULL;
  g_autoptr(CwCase) saved = NULL;
  g_autoptr(GFile) file = g_file_new_for_path (path);

  cw_app_start (app, path);
  windows = cw_app_windows (app, 1, 20000);
  g_assert_cmpuint (windows->len, ==, 1);
  /* Ctrl+2 puts the focus on the first step of the sequence. */
  cw_app_keys (g_ptr_array_index (windows, 0), "ctrl+2 Delete");
  name = g_strdup_printf ("%s-1", g_subprocess_get_identifier (app->proc));
  autosave = g_strdup_printf ("%s/%s.cwcase", dir, name);
  origin = g_strdup_printf ("%s/%s.origin", dir, name);
  /* Written two seconds after the change; a loaded machine may take longer. */
  for (gint64 end = g_get_monotonic_time () + AUTOSAVE_WAIT_US;
       !g_file_test (origin, G_FILE_TEST_EXISTS) && g_get_monotonic_time () < end;)
    g_usleep (100000);
  if (!g_file_test (autosave, G_FILE_TEST_EXISTS) || !g_file_test (origin, G_FILE_TEST_EXISTS))
    g_error ("no autosave %s ten seconds after the edit", autosave);
  saved = load (autosave);
  g_assert_cmpuint (n_steps (saved), ==, steps_before - 1);
  origin_uri = read_text (origin);
  uri = g_file_get_uri (file);
  g_assert_cmpstr (origin_uri, ==, uri);
  return cw_case_to_data (saved);
}

static char *
dialog_window (CwApp *app)
{
  g_autoptr(GPtrArray) windows = cw_app_windows (app, 2, 20000);

  g_assert_cmpuint (windows->len, ==, 2);
  for (guint i = 0; i < windows->len; i++)
    {
      g_autofree char *title = cw_app_window_name (g_ptr_array_index (windows, i));

      /* The empty new-case window, and the dialog (which has no title). */
      if (strcmp (title, "New Case") != 0)
        return g_strdup (g_ptr_array_index (windows, i));
    }
  g_error ("the recovery dialog did not appear");
}

static gboolean
wait_for_change (const char *path,
                 const char *old_text,
                 guint       timeout_ms)
{
  gint64 end = g_get_monotonic_time () + (gint64) timeout_ms * 1000;

  while (g_get_monotonic_time () < end)
    {
      g_autofree char *now = NULL;

      if (g_file_get_contents (path, &now, NULL, NULL) && strcmp (now, old_text) != 0)
        return TRUE;
      g_usleep (100000);
    }
  return FALSE;
}

static void
test_recovery_after_kill (void)
{
  g_autoptr(CwApp) app = cw_app_new ();
  g_autofree char *path = copy_sample (app);
  g_autofree char *original = read_text (path);
  g_autoptr(CwCase) before = load (path);
  g_autofree char *dir = cw_app_autosave_dir (app);
  g_autofree char *edited = NULL;
  g_autofree char *dialog = NULL;
  g_autofree char *window = NULL;
  g_autofree char *shot = NULL;
  g_autofree char *now = NULL;
  g_autoptr(CwCase) after = NULL;
  g_autoptr(GDir) left = NULL;

  g_assert_cmpuint (n_steps (before), >=, 2);
  edited = edit_and_autosave (app, path, n_steps (before));
  cw_app_kill (app);
  now = read_text (path);
  g_assert_cmpstr (now, ==, original);

  cw_app_start (app, NULL);
  dialog = dialog_window (app);
  shot = cw_app_screenshot ("hardening-recovery-dialog.png");
  g_test_message ("recovery dialog: %s", shot);
  cw_app_keys (dialog, "Return");
  window = cw_app_find_window (app, before->title, 10000);
  if (window == NULL)
    g_error ("no window for the recovered case \"%s\" after Return", before->title);
  cw_app_keys (window, "ctrl+s");
  if (!wait_for_change (path, original, 10000))
    g_error ("Ctrl+S in the recovered window did not save over %s", path);
  after = load (path);
  g_clear_pointer (&now, g_free);
  now = cw_case_to_data (after);
  g_assert_cmpstr (now, ==, edited);
  g_assert_cmpuint (n_steps (after), ==, n_steps (before) - 1);

  /* The killed window's files were taken back, not left to offer again. */
  left = g_dir_open (dir, 0, NULL);
  for (const char *name; left && (name = g_dir_read_name (left)) != NULL;)
    if (!g_str_has_prefix (name, g_subprocess_get_identifier (app->proc)))
      g_error ("autosave %s still there after the recovery", name);
  g_assert_true (cw_app_running (app));
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  cw_app_require_display ();

  g_test_add_func ("/hardening/recovery/after-kill", test_recovery_after_kill);
  return g_test_run ();
}
