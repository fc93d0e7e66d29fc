/* app-driver.c
 *
 * The program runs as a user would start it, in a folder of its own: its
 * cache, settings and recent-files list go to a temporary XDG tree, and
 * the settings are a keyfile with first-start=false, so that the cautions
 * do not stand between the test and the window.  No window manager runs
 * under Xvfb: every window sits at the origin and takes the keyboard
 * focus only when xdotool gives it.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <signal.h>
#include <stdio.h>
#include <sys/prctl.h>
#include <stdlib.h>
#include <string.h>

#include <glib/gstdio.h>

#include "app-driver.h"

static GSubprocess *keeper;

static void
end_keeper (void)
{
  if (keeper != NULL)
    g_subprocess_force_exit (keeper);
}

static void
die_with_parent (gpointer data)
{
  prctl (PR_SET_PDEATHSIG, SIGKILL);
}

/* The X server resets when its last client leaves, and a program started
 * during the reset cannot open the display: one client stays connected
 * for the whole test. */
static void
keep_display (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GSubprocessLauncher) launcher = g_subprocess_launcher_new (G_SUBPROCESS_FLAGS_STDOUT_SILENCE
                                                                      | G_SUBPROCESS_FLAGS_STDERR_SILENCE);

  g_subprocess_launcher_set_child_setup (launcher, die_with_parent, NULL, NULL);
  keeper = g_subprocess_launcher_spawn (launcher, &error, "xdotool", "sleep", "3600", NULL);
  g_assert_no_error (error);
  atexit (end_keeper);
}

void
cw_app_require_display (void)
{
  if (g_getenv ("DISPLAY") == NULL || *g_getenv ("DISPLAY") == '\0')
    {
      g_print ("1..0 # SKIP no display: run under Xvfb (tests/gui/run-under-xvfb.sh)\n");
      exit (77);
    }
  if (g_getenv ("CW_BINARY") == NULL)
    g_error ("CW_BINARY must name the built canalwright (meson test sets it)");
  keep_display ();
}

CwApp *
cw_app_new (void)
{
  CwApp *app = g_new0 (CwApp, 1);
  g_autofree char *settings = NULL;
  g_autofree char *keyfile = NULL;

  app->dir = g_dir_make_tmp ("cw-app-XXXXXX", NULL);
  g_assert_nonnull (app->dir);
  app->cache = g_build_filename (app->dir, "cache", NULL);
  app->config = g_build_filename (app->dir, "config", NULL);
  app->data = g_build_filename (app->dir, "data", NULL);
  app->err_log = g_build_filename (app->dir, "stderr.log", NULL);
  settings = g_build_filename (app->config, "glib-2.0", "settings", NULL);
  keyfile = g_build_filename (settings, "keyfile", NULL);
  g_assert_cmpint (g_mkdir_with_parents (settings, 0700), ==, 0);
  g_assert_cmpint (g_mkdir_with_parents (app->cache, 0700), ==, 0);
  g_assert_cmpint (g_mkdir_with_parents (app->data, 0700), ==, 0);
  g_assert_true (g_file_set_contents (keyfile, "[org/canalwright/Canalwright]\nfirst-start=false\n", -1, NULL));
  return app;
}

static void
remove_tree (const char *path)
{
  if (g_file_test (path, G_FILE_TEST_IS_DIR) && !g_file_test (path, G_FILE_TEST_IS_SYMLINK))
    {
      g_autoptr(GDir) d = g_dir_open (path, 0, NULL);
      const char *name;

      while (d && (name = g_dir_read_name (d)) != NULL)
        {
          g_autofree char *child = g_build_filename (path, name, NULL);

          remove_tree (child);
        }
      g_rmdir (path);
    }
  else
    g_unlink (path);
}

void
cw_app_free (CwApp *app)
{
  cw_app_kill (app);
  remove_tree (app->dir);
  g_free (app->dir);
  g_free (app->cache);
  g_free (app->config);
  g_free (app->data);
  g_free (app->err_log);
  g_free (app);
}

char *
cw_app_path (CwApp      *app,
             const char *name)
{
  return g_build_filename (app->dir, name, NULL);
}

char *
cw_app_autosave_dir (CwApp *app)
{
  return g_build_filename (app->cache, "canalwright", "autosave", NULL);
}

void
cw_app_start (CwApp      *app,
              const char *arg)
{
  g_autoptr(GSubprocessLauncher) launcher = g_subprocess_launcher_new (G_SUBPROCESS_FLAGS_STDOUT_SILENCE);
  g_autoptr(GError) error = NULL;
  const char *argv[] = { g_getenv ("CW_BINARY"), arg, NULL };

  g_assert_null (app->proc);
  g_subprocess_launcher_setenv (launcher, "XDG_CACHE_HOME", app->cache, TRUE);
  g_subprocess_launcher_setenv (launcher, "XDG_CONFIG_HOME", app->config, TRUE);
  g_subprocess_launcher_setenv (launcher, "XDG_DATA_HOME", app->data, TRUE);
  g_subprocess_launcher_setenv (launcher, "GSETTINGS_BACKEND", "keyfile", TRUE);
  g_subprocess_launcher_setenv (launcher, "GTK_A11Y", "none", TRUE);
  g_subprocess_launcher_setenv (launcher, "GSK_RENDERER", "cairo", TRUE);
  g_subprocess_launcher_setenv (launcher, "NO_AT_BRIDGE", "1", TRUE);
  g_subprocess_launcher_unsetenv (launcher, "DBUS_SESSION_BUS_ADDRESS");
  g_subprocess_launcher_set_stderr_file_path (launcher, app->err_log);
  /* A test that fails half-way leaves no program behind. */
  g_subprocess_launcher_set_child_setup (launcher, die_with_parent, NULL, NULL);
  app->proc = g_subprocess_launcher_spawnv (launcher, argv, &error);
  g_assert_no_error (error);
}

gboolean
cw_app_running (CwApp *app)
{
  g_autofree char *stat = NULL;
  g_autofree char *path = NULL;

  if (app->proc == NULL || g_subprocess_get_identifier (app->proc) == NULL)
    return FALSE;
  /* A zombie is not running: it has exited and waits to be reaped. */
  path = g_strdup_printf ("/proc/%s/stat", g_subprocess_get_identifier (app->proc));
  if (!g_file_get_contents (path, &stat, NULL, NULL))
    return FALSE;
  return strstr (stat, ") Z ") == NULL;
}

void
cw_app_kill (CwApp *app)
{
  if (app->proc == NULL)
    return;
  g_subprocess_send_signal (app->proc, SIGKILL);
  g_subprocess_wait (app->proc, NULL, NULL);
  g_clear_object (&app->proc);
}

char *
cw_app_stderr (CwApp *app)
{
  char *text = NULL;

  if (!g_file_get_contents (app->err_log, &text, NULL, NULL))
    return g_strdup ("");
  return text;
}

static char *
xdotool (const char *args)
{
  g_autofree char *cmd = g_strdup_printf ("xdotool %s", args);
  g_autoptr(GError) error = NULL;
  char *out = NULL;
  int status = 0;

  g_assert_true (g_spawn_command_line_sync (cmd, &out, NULL, &status, &error));
  g_assert_no_error (error);
  return out;
}

/* The program's visible toplevels, once there are at least AT_LEAST of
 * them or TIMEOUT_MS has passed: X window ids as strings. */
GPtrArray *
cw_app_windows (CwApp *app,
                guint  at_least,
                guint  timeout_ms)
{
  gint64 end = g_get_monotonic_time () + (gint64) timeout_ms * 1000;
  GPtrArray *found = NULL;

  do
    {
      const char *pid = cw_app_running (app) ? g_subprocess_get_identifier (app->proc) : NULL;
      g_autofree char *args = g_strdup_printf ("search --onlyvisible --pid %s", pid);
      g_autofree char *out = pid ? xdotool (args) : g_strdup ("");
      g_auto(GStrv) lines = g_strsplit (g_strstrip (out), "\n", -1);

      g_clear_pointer (&found, g_ptr_array_unref);
      found = g_ptr_array_new_with_free_func (g_free);
      for (guint i = 0; lines[i] != NULL; i++)
        if (*lines[i] != '\0')
          g_ptr_array_add (found, g_strdup (lines[i]));
      if (found->len >= at_least || !cw_app_running (app))
        break;
      g_usleep (100000);
    }
  while (g_get_monotonic_time () < end);
  return found;
}

char *
cw_app_window_name (const char *window)
{
  g_autofree char *args = g_strdup_printf ("getwindowname %s", window);
  char *out = xdotool (args);

  return g_strchomp (out);
}

/* The program's visible window called NAME, or NULL after TIMEOUT_MS. */
char *
cw_app_find_window (CwApp      *app,
                    const char *name,
                    guint       timeout_ms)
{
  gint64 end = g_get_monotonic_time () + (gint64) timeout_ms * 1000;

  do
    {
      g_autoptr(GPtrArray) windows = cw_app_windows (app, 1, 0);

      for (guint i = 0; i < windows->len; i++)
        {
          g_autofree char *title = cw_app_window_name (g_ptr_array_index (windows, i));

          if (strcmp (title, name) == 0)
            return g_strdup (g_ptr_array_index (windows, i));
        }
      g_usleep (100000);
    }
  while (g_get_monotonic_time () < end);
  return NULL;
}

/* Keyboard input for WINDOW: it is given the focus first. */
void
cw_app_keys (const char *window,
             const char *keys)
{
  g_autofree char *focus = g_strdup_printf ("windowfocus --sync %s", window);
  g_autofree char *press = g_strdup_printf ("key --delay 60 %s", keys);

  g_free (xdotool (focus));
  g_usleep (300000);
  g_free (xdotool (press));
  g_usleep (300000);
}

/* The whole screen, kept beside the test's build folder as an artifact. */
char *
cw_app_screenshot (const char *name)
{
  const char *dir = g_getenv ("G_TEST_BUILDDIR");
  char *path = g_build_filename (dir ? dir : ".", name, NULL);
  g_autofree char *cmd = g_strdup_printf ("import -window root '%s'", path);

  g_assert_true (g_spawn_command_line_sync (cmd, NULL, NULL, NULL, NULL));
  return path;
}
