/* cw-gui-util.c
 *
 * xdotool drags need pauses between the press, the moves and the release
 * for GTK to see a drag; one chained call without them fails.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include "cw-gui-util.h"
#include "cw-step-tile.h"

void
cw_gui_init (int    *argc,
             char ***argv)
{
  if (g_getenv ("DISPLAY") == NULL || *g_getenv ("DISPLAY") == '\0')
    {
      g_print ("1..0 # SKIP no display: run under Xvfb (tests/gui/run-under-xvfb.sh)\n");
      exit (77);
    }
  gtk_test_init (argc, argv, NULL);
}

/* The real application, registered so that its startup installs the
 * accelerators, the app actions and the styles; non-unique, so that
 * nothing on a session bus is needed. */
CwApplication *
cw_gui_app (void)
{
  static CwApplication *app;
  g_autoptr(GError) error = NULL;

  if (app)
    return app;
  app = g_object_new (CW_TYPE_APPLICATION,
                      "application-id", CW_APPLICATION_ID,
                      "flags", G_APPLICATION_NON_UNIQUE,
                      "resource-base-path", "/org/canalwright/Canalwright",
                      NULL);
  g_assert_true (g_application_register (G_APPLICATION (app), NULL, &error));
  g_assert_no_error (error);
  return app;
}

/* Lets the main loop run for ms milliseconds: layout, drawing, input. */
void
cw_gui_settle (guint ms)
{
  gint64 end = g_get_monotonic_time () + ms * 1000;

  while (g_get_monotonic_time () < end)
    {
      while (g_main_context_iteration (NULL, FALSE))
        ;
      g_usleep (2000);
    }
}

static void
wait_done (GObject      *source,
           GAsyncResult *result,
           gpointer      data)
{
  g_subprocess_wait_finish (G_SUBPROCESS (source), result, NULL);
  *(gboolean *) data = TRUE;
}

/* Runs a shell command while the main loop keeps going, so the window
 * answers the input the command sends. */
gboolean
cw_gui_run (const char *script)
{
  g_autoptr(GError) error = NULL;
  const char *argv[] = { "/bin/sh", "-c", script, NULL };
  g_autoptr(GSubprocess) proc = g_subprocess_newv (argv, G_SUBPROCESS_FLAGS_NONE, &error);
  gboolean done = FALSE;

  g_assert_no_error (error);
  g_subprocess_wait_async (proc, NULL, wait_done, &done);
  while (!done)
    g_main_context_iteration (NULL, TRUE);
  cw_gui_settle (150);
  return g_subprocess_get_successful (proc);
}

/* Widget coordinates to the screen: no window manager runs under Xvfb, so
 * the toplevel's surface sits at the origin. */
void
cw_gui_screen_point (GtkWidget *widget,
                     double     x,
                     double     y,
                     int       *sx,
                     int       *sy)
{
  GtkNative *native = gtk_widget_get_native (widget);
  graphene_point_t in = GRAPHENE_POINT_INIT ((float) x, (float) y), out;
  double tx, ty;

  g_assert_true (gtk_widget_compute_point (widget, GTK_WIDGET (native), &in, &out));
  gtk_native_get_surface_transform (native, &tx, &ty);
  *sx = (int) (out.x + tx + 0.5);
  *sy = (int) (out.y + ty + 0.5);
}

void
cw_gui_center (GtkWidget *widget,
               int       *sx,
               int       *sy)
{
  cw_gui_screen_point (widget, gtk_widget_get_width (widget) / 2.0,
                       gtk_widget_get_height (widget) / 2.0, sx, sy);
}

void
cw_gui_drag (int x0,
             int y0,
             int x1,
             int y1)
{
  GString *s = g_string_new (NULL);

  g_string_append_printf (s, "xdotool mousemove --sync %d %d; sleep 0.1; xdotool mousedown 1; sleep 0.1; ", x0, y0);
  for (int i = 1; i <= 10; i++)
    g_string_append_printf (s, "xdotool mousemove %d %d; sleep 0.05; ",
                            x0 + (x1 - x0) * i / 10, y0 + (y1 - y0) * i / 10);
  g_string_append (s, "sleep 0.2; xdotool mouseup 1");
  g_assert_true (cw_gui_run (s->str));
  g_string_free (s, TRUE);
  cw_gui_settle (200);
}

void
cw_gui_click (int x,
              int y)
{
  g_autofree char *s = g_strdup_printf ("xdotool mousemove --sync %d %d; sleep 0.05; xdotool click 1", x, y);

  g_assert_true (cw_gui_run (s));
}

void
cw_gui_key (const char *keys)
{
  g_autofree char *s = g_strdup_printf ("xdotool key --delay 60 %s", keys);

  g_assert_true (cw_gui_run (s));
  cw_gui_settle (100);
}

/* The whole screen, kept beside the test's build folder as an artifact. */
char *
cw_gui_screenshot (const char *name)
{
  const char *dir = g_getenv ("G_TEST_BUILDDIR");
  char *path = g_build_filename (dir ? dir : ".", name, NULL);
  g_autofree char *cmd = g_strdup_printf ("import -window root '%s'", path);

  g_assert_true (cw_gui_run (cmd));
  return path;
}

/* No window manager gives new windows the keyboard: do it by title. */
void
cw_gui_focus_window (const char *title)
{
  g_autofree char *s = g_strdup_printf ("xdotool search --sync --name '^%s$' windowfocus --sync", title);

  g_assert_true (cw_gui_run (s));
  cw_gui_settle (400);
}

/* The first widget below root with this name (rows are named after their
 * instrument's id). */
GtkWidget *
cw_gui_find_named (GtkWidget  *root,
                   const char *name)
{
  if (g_strcmp0 (gtk_widget_get_name (root), name) == 0)
    return root;
  for (GtkWidget *c = gtk_widget_get_first_child (root); c; c = gtk_widget_get_next_sibling (c))
    {
      GtkWidget *found = cw_gui_find_named (c, name);

      if (found)
        return found;
    }
  return NULL;
}

/* The sequence strip's tile of step index (0-based). */
GtkWidget *
cw_gui_find_tile (GtkWidget *root,
                  guint      index)
{
  if (CW_IS_STEP_TILE (root) && cw_step_tile_get_index (CW_STEP_TILE (root)) == index)
    return root;
  for (GtkWidget *c = gtk_widget_get_first_child (root); c; c = gtk_widget_get_next_sibling (c))
    {
      GtkWidget *found = cw_gui_find_tile (c, index);

      if (found)
        return found;
    }
  return NULL;
}
