/* test-designer.c: the designer window, driven as a user would
 *
 * Real pointer drags and keys go through xdotool into the window under
 * Xvfb; the model and the engine's verdicts are checked after each.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cw-case-loader.h"
#include "cw-case-writer.h"
#include "cw-gui-util.h"
#include "cw-compare-window.h"
#include "cw-propose-window.h"
#include "cw-step-tile.h"
#include "cw-window-private.h"

typedef struct
{
  char       *dir;
  char       *path;        /* a copy of the sample case */
  char       *original;    /* its bytes as opened */
  CwDocument *document;
  CwWindow   *window;
} Fixture;

static void
fixture_setup (Fixture       *f,
               gconstpointer  data)
{
  const char *name = data ? data : "lower-incisor-straight.cwcase";
  g_autofree char *src = g_build_filename (g_getenv ("CW_SAMPLE_CASES"), name, NULL);
  g_autoptr(GFile) file = NULL;
  g_autoptr(GError) error = NULL;
  gsize len;

  f->dir = g_dir_make_tmp ("cw-gui-XXXXXX", NULL);
  f->path = g_build_filename (f->dir, name, NULL);
  g_assert_true (g_file_get_contents (src, &f->original, &len, NULL));
  g_assert_true (g_file_set_contents (f->path, f->original, len, NULL));
  file = g_file_new_for_path (f->path);
  f->document = cw_document_open (file, &error);
  g_assert_no_error (error);
  f->window = cw_window_new (cw_gui_app (), f->document);
  gtk_window_set_default_size (GTK_WINDOW (f->window), 1280, 800);
  gtk_window_present (GTK_WINDOW (f->window));
  cw_gui_settle (800);
}

static void
fixture_teardown (Fixture       *f,
                  gconstpointer  data)
{
  cw_document_set_modified (f->document, FALSE);
  gtk_window_destroy (GTK_WINDOW (f->window));
  cw_gui_settle (100);
  g_clear_object (&f->document);
  g_unlink (f->path);
  g_rmdir (f->dir);
  g_free (f->path);
  g_free (f->dir);
  g_free (f->original);
}

static const CwCanal *
canal (Fixture *f)
{
  return cw_document_get_canal (f->document);
}

static const char *
step_id (Fixture *f,
         guint    i)
{
  return cw_canal_get_step (canal (f), i)->instrument_id;
}

static void
tile_edge (Fixture *f,
           guint    index,
           gboolean right,
           int     *x,
           int     *y)
{
  GtkWidget *tile = cw_gui_find_tile (GTK_WIDGET (f->window->strip), index);

  g_assert_nonnull (tile);
  cw_gui_screen_point (tile, right ? gtk_widget_get_width (tile) + 3 : -3,
                       gtk_widget_get_height (tile) / 2.0, x, y);
}

static CwLevel
verdict (Fixture *f,
         guint    i)
{
  return cw_canal_result_get_step (cw_document_get_result (f->document), i)->verdict;
}

/* Every command is an action: add, move, deepen, remove, undo, redo. */
static void
test_actions (Fixture       *f,
              gconstpointer  data)
{
  GtkWidget *w = GTK_WIDGET (f->window);
  guint n = canal (f)->sequence->len;

  cw_document_set_step_index (f->document, 1);
  gtk_widget_activate_action (w, "win.add-step", "s", "k25");
  g_assert_cmpuint (canal (f)->sequence->len, ==, n + 1);
  g_assert_cmpstr (step_id (f, 2), ==, "k25");
  /* The new step goes to the deepest depth with no stop: the working length. */
  g_assert_cmpfloat (cw_canal_get_step (canal (f), 2)->depth, ==, 21.0);
  g_assert_cmpint (verdict (f, 2), !=, CW_LEVEL_STOP);
  gtk_widget_activate_action (w, "win.shallower", NULL);
  g_assert_cmpfloat (cw_canal_get_step (canal (f), 2)->depth, ==, 20.5);
  gtk_widget_activate_action (w, "win.move-step-later", NULL);
  g_assert_cmpstr (step_id (f, 3), ==, "k25");
  gtk_widget_activate_action (w, "win.remove-step", NULL);
  g_assert_cmpuint (canal (f)->sequence->len, ==, n);
  gtk_widget_activate_action (w, "win.undo", NULL);
  g_assert_cmpuint (canal (f)->sequence->len, ==, n + 1);
  gtk_widget_activate_action (w, "win.redo", NULL);
  g_assert_cmpuint (canal (f)->sequence->len, ==, n);
}

/* A real drag from the shelf drops a step where it lands: between the
 * second and third tiles it becomes step 3. */
static void
test_drag_from_shelf (Fixture       *f,
                      gconstpointer  data)
{
  GtkWidget *row = cw_gui_find_named (GTK_WIDGET (f->window->shelf), "k25");
  guint n = canal (f)->sequence->len;
  int x0, y0, x1, y1;

  g_assert_nonnull (row);
  cw_gui_center (row, &x0, &y0);
  tile_edge (f, 1, TRUE, &x1, &y1);
  cw_gui_drag (x0, y0, x1, y1);
  g_assert_cmpuint (canal (f)->sequence->len, ==, n + 1);
  g_assert_cmpstr (step_id (f, 2), ==, "k25");
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, 2);
  /* After two hand files the 25/.02 cuts, within every rule. */
  g_assert_cmpint (verdict (f, 2), ==, CW_LEVEL_OK);
  g_assert_cmpfloat (cw_canal_result_get_step (cw_document_get_result (f->document), 2)->engaged_length, >, 0);
}

/* Dragging the first tile past the third moves it there. */
static void
test_drag_reorder (Fixture       *f,
                   gconstpointer  data)
{
  g_autofree char *first = g_strdup (step_id (f, 0));
  g_autofree char *second = g_strdup (step_id (f, 1));
  GtkWidget *tile = cw_gui_find_tile (GTK_WIDGET (f->window->strip), 0);
  int x0, y0, x1, y1;

  cw_gui_center (tile, &x0, &y0);
  tile_edge (f, 2, TRUE, &x1, &y1);
  cw_gui_drag (x0, y0, x1, y1);
  g_assert_cmpstr (step_id (f, 0), ==, second);
  g_assert_cmpstr (step_id (f, 2), ==, first);
}

/* A tile dropped where nothing takes it is removed. */
static void
test_drag_off (Fixture       *f,
               gconstpointer  data)
{
  GtkWidget *tile = cw_gui_find_tile (GTK_WIDGET (f->window->strip), 3);
  g_autofree char *after = g_strdup (step_id (f, 4));
  guint n = canal (f)->sequence->len;
  int x0, y0, x1, y1;

  cw_gui_center (tile, &x0, &y0);
  cw_gui_center (GTK_WIDGET (f->window->inspector), &x1, &y1);
  cw_gui_drag (x0, y0, x1, y1);
  g_assert_cmpuint (canal (f)->sequence->len, ==, n - 1);
  g_assert_cmpstr (step_id (f, 3), ==, after);
}

/* Dragging the selected step's tip along the canal changes its depth; the
 * checks follow.  The reciprocating file at 21 mm is dragged to 18 mm. */
static void
test_drag_depth (Fixture       *f,
                 gconstpointer  data)
{
  double tx, ty, ux, uy;
  int x0, y0, x1, y1;
  double engaged_before;

  cw_document_set_step_index (f->document, 4);
  cw_gui_settle (200);
  g_assert_cmpstr (step_id (f, 4), ==, "rc25");
  engaged_before = cw_canal_result_get_step (cw_document_get_result (f->document), 4)->engaged_length;
  g_assert_true (cw_canal_view_depth_point (f->window->canal_view, 21.0, &tx, &ty));
  g_assert_true (cw_canal_view_depth_point (f->window->canal_view, 18.0, &ux, &uy));
  cw_gui_screen_point (GTK_WIDGET (f->window->canal_view), tx, ty, &x0, &y0);
  cw_gui_screen_point (GTK_WIDGET (f->window->canal_view), ux, uy, &x1, &y1);
  cw_gui_drag (x0, y0, x1, y1);
  g_assert_cmpfloat (fabs (cw_canal_get_step (canal (f), 4)->depth - 18.0), <=, 0.5);
  g_assert_cmpfloat (cw_canal_result_get_step (cw_document_get_result (f->document), 4)->engaged_length,
                     !=, engaged_before);
  /* The whole drag is one command. */
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL);
  g_assert_cmpfloat (cw_canal_get_step (canal (f), 4)->depth, ==, 21.0);
}

/* The keyboard does what the drags do, from the sequence strip. */
static void
test_keyboard_equivalents (Fixture       *f,
                           gconstpointer  data)
{
  guint n = canal (f)->sequence->len;
  g_autofree char *third = g_strdup (step_id (f, 2));
  double depth;

  cw_document_set_step_index (f->document, 2);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.focus-sequence", NULL);
  cw_gui_settle (200);
  cw_gui_key ("alt+Up");
  g_assert_cmpstr (step_id (f, 1), ==, third);
  depth = cw_canal_get_step (canal (f), 1)->depth;
  cw_gui_key ("minus");
  g_assert_cmpfloat (cw_canal_get_step (canal (f), 1)->depth, ==, depth - 0.5);
  cw_gui_key ("plus");
  g_assert_cmpfloat (cw_canal_get_step (canal (f), 1)->depth, ==, depth);
  cw_gui_key ("Delete");
  g_assert_cmpuint (canal (f)->sequence->len, ==, n - 1);
  /* Enter on the shelf adds the selected instrument after the selected step. */
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.focus-shelf", NULL);
  cw_gui_settle (200);
  cw_gui_key ("Down Return");
  g_assert_cmpuint (canal (f)->sequence->len, ==, n);
}

/* The whole workflow with no pointer: pick files, order them, set depths,
 * add and edit a canal, save; every input is a key press. */
static void
test_keyboard_only_workflow (Fixture       *f,
                             gconstpointer  data)
{
  g_autoptr(CwCase) saved = NULL;
  const CwCanal *second;
  guint n = canal (f)->sequence->len;

  cw_gui_key ("ctrl+1 Down Down Return");
  g_assert_cmpuint (canal (f)->sequence->len, ==, n + 1);
  cw_gui_key ("ctrl+2 minus minus alt+Left");
  g_assert_cmpuint (canal (f)->sequence->len, ==, n + 1);
  cw_gui_key ("Delete");
  g_assert_cmpuint (canal (f)->sequence->len, ==, n);
  cw_gui_key ("ctrl+shift+n");
  g_assert_cmpuint (cw_document_get_case (f->document)->canals->len, ==, 2);
  g_assert_cmpuint (cw_document_get_canal_index (f->document), ==, 1);
  /* A new canal: its first instrument goes in from the shelf. */
  cw_gui_key ("ctrl+1 Return");
  g_assert_cmpuint (canal (f)->sequence->len, ==, 1);
  /* The canal editor: Alt+N goes to the canal's name (its mnemonic); a
   * new name and Enter apply it. */
  cw_gui_key ("ctrl+4");
  {
    GtkWidget *focus = gtk_root_get_focus (GTK_ROOT (f->window));

    g_assert_nonnull (focus);
    g_assert_true (gtk_widget_is_ancestor (focus, GTK_WIDGET (f->window->canal_editor)));
  }
  cw_gui_key ("alt+n ctrl+a B U C C A L Return");
  second = g_ptr_array_index (cw_document_get_case (f->document)->canals, 1);
  g_assert_cmpstr (second->name, ==, "BUCCAL");
  cw_gui_key ("ctrl+Page_Up");
  g_assert_cmpuint (cw_document_get_canal_index (f->document), ==, 0);
  cw_gui_key ("ctrl+s");
  g_assert_false (cw_document_get_modified (f->document));
  saved = cw_case_load (f->path, NULL);
  g_assert_nonnull (saved);
  g_assert_cmpuint (saved->canals->len, ==, 2);
  g_assert_nonnull (cw_case_find_canal (saved, "BUCCAL"));
}

/* Save, load again: the same case. */
static void
test_save_reload (Fixture       *f,
                  gconstpointer  data)
{
  g_autofree char *out = g_build_filename (f->dir, "saved.cwcase", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (out);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) again = NULL;
  g_autofree char *a = NULL, *b = NULL;

  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.add-step", "s", "k15");
  g_assert_true (cw_document_save (f->document, file, &error));
  g_assert_false (cw_document_get_modified (f->document));
  again = cw_case_load (out, &error);
  g_assert_no_error (error);
  a = cw_case_to_data (cw_document_get_case (f->document));
  b = cw_case_to_data (again);
  g_assert_cmpstr (a, ==, b);
  g_unlink (out);
}

/* Undo every edit, save: the very bytes that were opened. */
static void
test_undo_to_original_bytes (Fixture       *f,
                             gconstpointer  data)
{
  GtkWidget *w = GTK_WIDGET (f->window);
  g_autofree char *saved = NULL;
  g_autoptr(GError) error = NULL;

  cw_document_set_step_index (f->document, 0);
  gtk_widget_activate_action (w, "win.add-step", "s", "k25");
  gtk_widget_activate_action (w, "win.deeper", NULL);
  gtk_widget_activate_action (w, "win.move-step-later", NULL);
  gtk_widget_activate_action (w, "win.add-canal", NULL);
  gtk_widget_activate_action (w, "win.previous-canal", NULL);
  cw_document_set_step_index (f->document, 0);
  gtk_widget_activate_action (w, "win.remove-step", NULL);
  while (cw_document_can_undo (f->document))
    gtk_widget_activate_action (w, "win.undo", NULL);
  g_assert_true (cw_document_save (f->document, NULL, &error));
  g_assert_true (g_file_get_contents (f->path, &saved, NULL, NULL));
  g_assert_cmpstr (saved, ==, f->original);
  /* And redo brings every edit back. */
  while (cw_document_can_redo (f->document))
    gtk_widget_activate_action (w, "win.redo", NULL);
  g_assert_cmpuint (cw_document_get_case (f->document)->canals->len, ==, 2);
}

static GtkWindow *
find_toplevel (GType type)
{
  g_autoptr(GList) windows = gtk_window_list_toplevels ();

  for (GList *l = windows; l; l = l->next)
    if (G_TYPE_CHECK_INSTANCE_TYPE (l->data, type) && gtk_widget_get_visible (l->data))
      return l->data;
  return NULL;
}

/* Ctrl+R proposes sequences; the best is previewed, Enter adopts it as one
 * undoable edit, and it checks with no stop.  Compare shows it beside the
 * user's own. */
static CwProposeWindow *
open_proposals (void)
{
  CwProposeWindow *propose;
  gint64 deadline = g_get_monotonic_time () + 30 * G_USEC_PER_SEC;

  cw_gui_key ("ctrl+r");
  propose = CW_PROPOSE_WINDOW (find_toplevel (CW_TYPE_PROPOSE_WINDOW));
  g_assert_nonnull (propose);
  while (!cw_propose_window_is_ready (propose) && g_get_monotonic_time () < deadline)
    cw_gui_settle (100);
  g_assert_true (cw_propose_window_is_ready (propose));
  g_assert_cmpuint (cw_propose_window_get_n_plans (propose), >=, 1);
  cw_gui_settle (300);
  cw_gui_focus_window ("Proposed Sequences");
  return propose;
}

static void
test_propose_and_adopt (Fixture       *f,
                        gconstpointer  data)
{
  g_autofree char *before = cw_case_to_data (cw_document_get_case (f->document));
  const CwCanalResult *result;
  GtkWindow *compare;

  open_proposals ();
  cw_gui_key ("alt+c");
  compare = find_toplevel (CW_TYPE_COMPARE_WINDOW);
  g_assert_nonnull (compare);
  {
    g_autofree char *difference = cw_compare_window_dup_difference (CW_COMPARE_WINDOW (compare));

    g_assert_nonnull (strstr (difference, "cautions"));
  }
  gtk_window_destroy (compare);
  cw_gui_focus_window ("Proposed Sequences");
  cw_gui_key ("Escape");
  g_assert_null (find_toplevel (CW_TYPE_PROPOSE_WINDOW));
  g_assert_false (cw_document_get_modified (f->document));

  /* Enter on the best plan adopts it. */
  open_proposals ();
  cw_gui_key ("Return");
  g_assert_null (find_toplevel (CW_TYPE_PROPOSE_WINDOW));
  result = cw_document_get_result (f->document);
  g_assert_false (result->has_stop);
  g_assert_cmpuint (result->findings->len, ==, 0);   /* the targets are met */
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL);
  {
    g_autofree char *after = cw_case_to_data (cw_document_get_case (f->document));

    g_assert_cmpstr (after, ==, before);
  }
}

static int
pdf_pages (const char *path)
{
  g_autofree char *cmd = g_strdup_printf ("pdfinfo '%s'", path);
  g_autofree char *out = NULL;
  const char *line;

  g_assert_true (g_spawn_command_line_sync (cmd, &out, NULL, NULL, NULL));
  line = strstr (out, "Pages:");
  g_assert_nonnull (line);
  return atoi (line + strlen ("Pages:"));
}

/* Ctrl+E opens the export dialog; a typed name ending in .pdf writes the
 * plan sheet there.  Printing to a file gives the same pages. */
static void
test_export_and_print (Fixture       *f,
                       gconstpointer  data)
{
  g_autofree char *pdf = g_build_filename (f->dir, "plan.pdf", NULL);
  g_autofree char *printed = g_build_filename (f->dir, "printed.pdf", NULL);
  g_autofree char *keys = NULL;
  g_autoptr(GError) error = NULL;
  GString *typed = g_string_new (NULL);

  for (const char *p = pdf; *p; p++)
    g_string_append_printf (typed, "0x%04x ", (guchar) *p);
  cw_gui_key ("ctrl+e");
  cw_gui_settle (800);
  keys = g_strdup_printf ("ctrl+a %s Return", typed->str);
  cw_gui_key (keys);
  cw_gui_settle (800);
  g_string_free (typed, TRUE);
  g_assert_true (g_file_test (pdf, G_FILE_TEST_EXISTS));
  g_assert_cmpint (pdf_pages (pdf), >=, 1);
  g_assert_true (_cw_window_print_to_file (f->window, printed, &error));
  g_assert_no_error (error);
  g_assert_cmpint (pdf_pages (printed), ==, pdf_pages (pdf));
  g_unlink (pdf);
  g_unlink (printed);
}

/* The window is drawn: right size, many colours; the PNG stays as an
 * artifact of the test run. */
static void
test_screenshot (Fixture       *f,
                 gconstpointer  data)
{
  g_autofree char *path = NULL;
  g_autofree char *out = NULL;
  g_autofree char *cmd = NULL;
  int width = 0, height = 0, colours = 0;

  cw_document_set_step_index (f->document, 2);
  cw_gui_settle (300);
  path = cw_gui_screenshot (data ? "designer-molar.png" : "designer.png");
  cmd = g_strdup_printf ("identify -format '%%w %%h %%k' '%s'", path);
  g_assert_true (g_spawn_command_line_sync (cmd, &out, NULL, NULL, NULL));
  g_assert_cmpint (sscanf (out, "%d %d %d", &width, &height, &colours), ==, 3);
  g_assert_cmpint (width, ==, 1280);
  g_assert_cmpint (height, ==, 800);
  g_assert_cmpint (colours, >, 100);
}

int
main (int   argc,
      char *argv[])
{
  cw_gui_init (&argc, &argv);

#define ADD(path, fn, data) g_test_add (path, Fixture, data, fixture_setup, fn, fixture_teardown)
  ADD ("/gui/designer/actions", test_actions, NULL);
  ADD ("/gui/designer/drag-from-shelf", test_drag_from_shelf, NULL);
  ADD ("/gui/designer/drag-reorder", test_drag_reorder, NULL);
  ADD ("/gui/designer/drag-off-removes", test_drag_off, NULL);
  ADD ("/gui/designer/drag-depth", test_drag_depth, NULL);
  ADD ("/gui/designer/keyboard", test_keyboard_equivalents, NULL);
  ADD ("/gui/designer/keyboard-only-workflow", test_keyboard_only_workflow, NULL);
  ADD ("/gui/designer/save-reload", test_save_reload, NULL);
  ADD ("/gui/designer/undo-to-original-bytes", test_undo_to_original_bytes, NULL);
  ADD ("/gui/designer/export-and-print", test_export_and_print, NULL);
  ADD ("/gui/designer/propose-and-adopt", test_propose_and_adopt, "lower-molar-moderate.cwcase");
  ADD ("/gui/designer/screenshot", test_screenshot, NULL);
  ADD ("/gui/designer/screenshot-molar", test_screenshot, "lower-molar-moderate.cwcase");
#undef ADD

  return g_test_run ();
}
