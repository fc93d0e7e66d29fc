/* test-library.c: the instrument library window and the instrument editor,
 * driven as a user would
 *
 * A new instrument is made in the editor with real keys (its mistakes
 * answered with the loader's messages), saved to the library file, added
 * to the case and dragged from the shelf into the sequence.  The library
 * folder is a throwaway one, seeded with the starter library as on a first
 * start.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <string.h>

#include "cw-gui-util.h"
#include "cw-instrument-editor.h"
#include "cw-libraries.h"
#include "cw-library-folder.h"
#include "cw-library-window.h"
#include "cw-step-tile.h"
#include "cw-window-private.h"

#define NEW_LABEL "test rotary 30 variable"
#define NEW_ID "test-rotary-30-variable"

typedef struct
{
  char       *dir;
  char       *path;
  CwDocument *document;
  CwWindow   *window;
} Fixture;

static char *data_home;

static void
fixture_setup (Fixture       *f,
               gconstpointer  data)
{
  const char *name = data ? data : "lower-incisor-straight.cwcase";
  g_autofree char *src = g_build_filename (g_getenv ("CW_SAMPLE_CASES"), name, NULL);
  g_autofree char *contents = NULL;
  g_autoptr(GFile) file = NULL;
  g_autoptr(GError) error = NULL;
  gsize len;

  f->dir = g_dir_make_tmp ("cw-gui-library-XXXXXX", NULL);
  f->path = g_build_filename (f->dir, name, NULL);
  g_assert_true (g_file_get_contents (src, &contents, &len, NULL));
  g_assert_true (g_file_set_contents (f->path, contents, len, NULL));
  file = g_file_new_for_path (f->path);
  f->document = cw_document_open (file, &error);
  g_assert_no_error (error);
  f->window = cw_window_new (cw_gui_app (), f->document);
  gtk_window_set_default_size (GTK_WINDOW (f->window), 1280, 800);
  gtk_window_present (GTK_WINDOW (f->window));
  cw_gui_settle (800);
}

static void
close_other_windows (Fixture *f)
{
  GList *toplevels = gtk_window_list_toplevels ();

  for (GList *l = toplevels; l; l = l->next)
    if (l->data != f->window && gtk_widget_get_visible (l->data))
      gtk_window_destroy (l->data);
  g_list_free (toplevels);
}

static void
fixture_teardown (Fixture       *f,
                  gconstpointer  data)
{
  close_other_windows (f);
  cw_document_set_modified (f->document, FALSE);
  gtk_window_destroy (GTK_WINDOW (f->window));
  cw_gui_settle (100);
  g_clear_object (&f->document);
  g_unlink (f->path);
  g_rmdir (f->dir);
  g_free (f->path);
  g_free (f->dir);
}

static GtkWidget *
named (gpointer    root,
       const char *name)
{
  GtkWidget *widget = cw_gui_find_named (GTK_WIDGET (root), name);

  if (widget == NULL)
    g_error ("no widget named %s", name);
  return widget;
}

/* xdotool's mousemove --sync waits some 15 s for a move that does not
 * happen, so a second click on one spot starts from beside it. */
static void
click (GtkWidget *widget)
{
  g_autofree char *beside = NULL;
  int x, y;

  cw_gui_center (widget, &x, &y);
  beside = g_strdup_printf ("xdotool mousemove %d %d", x + 2, y + 2);
  g_assert_true (cw_gui_run (beside));
  cw_gui_click (x, y);
  cw_gui_settle (150);
}

/* Select all the entry's text and type over it, as a user would. */
static void
type_into (GtkWidget  *entry,
           const char *text)
{
  g_autofree char *quoted = g_shell_quote (text);
  g_autofree char *script = g_strdup_printf ("xdotool type --delay 30 %s", quoted);

  click (entry);
  cw_gui_key ("ctrl+a");
  if (*text == '\0')
    cw_gui_key ("BackSpace");
  else
    g_assert_true (cw_gui_run (script));
  cw_gui_settle (150);
}

static CwLibraryWindow *
show_library (Fixture *f)
{
  GList *toplevels;
  CwLibraryWindow *found = NULL;

  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.show-library", NULL);
  cw_gui_settle (600);
  toplevels = gtk_window_list_toplevels ();
  for (GList *l = toplevels; l; l = l->next)
    if (CW_IS_LIBRARY_WINDOW (l->data) && gtk_widget_get_visible (l->data))
      found = l->data;
  g_list_free (toplevels);
  g_assert_nonnull (found);
  return found;
}

static const char *
editor_message (CwInstrumentEditor *editor)
{
  return gtk_label_get_label (GTK_LABEL (named (editor, "editor-message")));
}

static void
assert_editor_refuses (CwInstrumentEditor *editor,
                       const char         *what)
{
  g_autofree char *expected = g_strdup_printf ("starter-library.cwlib: instruments[22].%s", what);

  g_assert_cmpstr (cw_instrument_editor_get_message (editor), ==, expected);
  g_assert_cmpstr (editor_message (editor), ==, expected);
  g_assert_false (gtk_widget_get_sensitive (named (editor, "editor-save")));
}

static void
assert_editor_accepts (CwInstrumentEditor *editor)
{
  g_assert_null (cw_instrument_editor_get_message (editor));
  g_assert_nonnull (cw_instrument_editor_get_instrument (editor));
  g_assert_true (gtk_widget_get_sensitive (named (editor, "editor-save")));
}

/* The first start put the starter library in the (throwaway) folder; the
 * list shows it, searches it with several words and sorts by a column. */
static void
test_library_window (Fixture       *f,
                     gconstpointer  data)
{
  CwLibraryWindow *window = show_library (f);
  g_autofree char *starter = g_build_filename (data_home, "canalwright", "libraries",
                                               "starter-library.cwlib", NULL);
  GtkColumnView *view = GTK_COLUMN_VIEW (named (window, "library-list"));
  GListModel *model = G_LIST_MODEL (gtk_column_view_get_model (view));
  GListModel *columns = gtk_column_view_get_columns (view);
  g_autoptr(GtkColumnViewColumn) size = g_list_model_get_item (columns, 1);
  g_autoptr(GObject) first = NULL;
  g_autofree char *screenshot = NULL;
  double tip = 0;

  g_assert_true (g_file_test (starter, G_FILE_TEST_IS_REGULAR));
  g_assert_cmpuint (cw_library_window_get_n_shown (window), ==, 22);
  type_into (named (window, "library-search"), "niti 25");
  cw_gui_settle (400);
  /* 25/.04, heat-treated 25/.06, the orifice shaper, the variable 25 and the reciprocating 25. */
  g_assert_cmpuint (cw_library_window_get_n_shown (window), ==, 5);
  screenshot = cw_gui_screenshot ("library-window-search.png");
  type_into (named (window, "library-search"), "");
  cw_gui_settle (400);
  g_assert_cmpuint (cw_library_window_get_n_shown (window), ==, 22);

  gtk_column_view_sort_by_column (view, size, GTK_SORT_DESCENDING);
  first = g_list_model_get_item (model, 0);
  g_object_get (first, "tip", &tip, NULL);
  g_assert_cmpfloat (tip, ==, 40);
  g_clear_pointer (&screenshot, g_free);
  screenshot = cw_gui_screenshot ("library-window.png");
  g_test_message ("screenshot: %s", screenshot);
}

static void
make_instrument (CwLibraryWindow *window)
{
  CwInstrumentEditor *editor;
  g_autofree char *screenshot = NULL;

  click (named (window, "library-add"));
  cw_gui_settle (500);
  editor = CW_INSTRUMENT_EDITOR (cw_library_window_get_editor (window));
  g_assert_nonnull (editor);
  assert_editor_accepts (editor);

  type_into (named (editor, "editor-label"), NEW_LABEL);
  g_assert_cmpstr (gtk_editable_get_text (GTK_EDITABLE (named (editor, "editor-id"))), ==, NEW_ID);
  gtk_drop_down_set_selected (GTK_DROP_DOWN (named (editor, "editor-tip")), 6);   /* size 30 */

  type_into (named (editor, "editor-taper"), "0.2");
  assert_editor_refuses (editor, "taper: must be a number > 0 and <= 0.12 (got 0.2)");
  g_free (cw_gui_screenshot ("instrument-editor-refused.png"));
  type_into (named (editor, "editor-taper"), "0,06");
  assert_editor_accepts (editor);

  click (named (editor, "editor-segmented"));
  type_into (named (editor, "segment-to-1"), "3");
  assert_editor_refuses (editor, "taper_segments[1].to: must be greater than the end of the "
                         "segment before (4 mm) and <= 40 mm (got 3)");
  type_into (named (editor, "segment-to-1"), "16");
  type_into (named (editor, "segment-taper-1"), "0.04");
  assert_editor_accepts (editor);

  type_into (named (editor, "editor-max-flute"), "0.2");
  assert_editor_refuses (editor, "max_flute_diameter: must be a number > 0.3 and <= 3 mm (got 0.2)");
  type_into (named (editor, "editor-max-flute"), "0.95");
  type_into (named (editor, "editor-rpm"), "350");
  assert_editor_accepts (editor);
  screenshot = cw_gui_screenshot ("instrument-editor.png");
  g_test_message ("screenshot: %s", screenshot);

  click (named (editor, "editor-save"));
  cw_gui_settle (400);
  g_assert_null (cw_library_window_get_editor (window));
}

static void
drag_into_sequence (Fixture    *f,
                    const char *id)
{
  GtkWidget *row = named (f->window->shelf, id);
  GtkWidget *tile = cw_gui_find_tile (GTK_WIDGET (f->window->strip), 1);
  guint n = cw_document_get_canal (f->document)->sequence->len;
  int x0, y0, x1, y1;

  g_assert_nonnull (tile);
  cw_gui_center (row, &x0, &y0);
  cw_gui_screen_point (tile, gtk_widget_get_width (tile) + 3, gtk_widget_get_height (tile) / 2.0, &x1, &y1);
  cw_gui_drag (x0, y0, x1, y1);
  g_assert_cmpuint (cw_document_get_canal (f->document)->sequence->len, ==, n + 1);
  g_assert_cmpstr (cw_canal_get_step (cw_document_get_canal (f->document), 2)->instrument_id, ==, id);
}

/* Made in the editor, saved in the library file, copied into the case in
 * one undoable edit, then dragged from the shelf into the sequence. */
static void
test_create_and_drag (Fixture       *f,
                      gconstpointer  data)
{
  CwLibraryWindow *window = show_library (f);
  CwLibraries *libraries = cw_libraries_get_default ();
  const CwInstrument *made;
  g_autoptr(CwLibrary) on_disk = NULL;
  g_autoptr(GError) error = NULL;
  guint n_case = cw_document_get_case (f->document)->instruments->len;

  make_instrument (window);
  made = cw_library_lookup (cw_libraries_get_current (libraries), NEW_ID);
  g_assert_nonnull (made);
  g_assert_cmpfloat (made->tip, ==, 30);
  g_assert_cmpuint (made->segments->len, ==, 2);
  g_assert_cmpfloat (made->max_flute_diameter, ==, 0.95);
  on_disk = cw_library_load (cw_libraries_get_current (libraries)->path, &error);
  g_assert_no_error (error);
  g_assert_true (cw_instrument_equal (cw_library_lookup (on_disk, NEW_ID), made));

  click (named (window, "library-add-to-case"));
  g_assert_cmpuint (cw_document_get_case (f->document)->instruments->len, ==, n_case + 1);
  g_assert_true (cw_instrument_equal (cw_case_find_instrument (cw_document_get_case (f->document), NEW_ID), made));
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL);
  g_assert_cmpuint (cw_document_get_case (f->document)->instruments->len, ==, n_case);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.redo", NULL);
  g_assert_cmpuint (cw_document_get_case (f->document)->instruments->len, ==, n_case + 1);

  gtk_window_close (GTK_WINDOW (window));
  cw_gui_settle (400);
  drag_into_sequence (f, NEW_ID);
  g_free (cw_gui_screenshot ("library-instrument-in-sequence.png"));
  g_assert_null (cw_gui_find_named (named (f->window->shelf, NEW_ID), "differs"));
}

/* Editing the library afterwards leaves the case's copy alone; the shelf
 * marks it as differing. */
static void
test_case_keeps_copy (Fixture       *f,
                      gconstpointer  data)
{
  CwLibraries *libraries = cw_libraries_get_default ();
  const CwLibrary *library = cw_libraries_get_current (libraries);
  int index = cw_library_find (library, "k25");
  g_autoptr(CwInstrument) longer = cw_instrument_copy (g_ptr_array_index (library->instruments, index));
  g_autoptr(CwInstrument) original = cw_instrument_copy (longer);
  g_autoptr(GError) error = NULL;
  GtkWidget *mark;

  g_assert_null (cw_gui_find_named (named (f->window->shelf, "k25"), "differs"));
  longer->length = 31;
  g_assert_true (cw_libraries_put_instrument (libraries, index, g_steal_pointer (&longer), &error));
  g_assert_no_error (error);
  cw_gui_settle (200);
  g_assert_true (cw_instrument_equal (cw_case_find_instrument (cw_document_get_case (f->document), "k25"),
                                      original));
  mark = cw_gui_find_named (named (f->window->shelf, "k25"), "differs");
  g_assert_nonnull (mark);
  g_assert_cmpstr (gtk_widget_get_tooltip_text (mark), ==, "Differs from the library");
  g_assert_null (cw_gui_find_named (named (f->window->shelf, "k20"), "differs"));
  g_free (cw_gui_screenshot ("shelf-differs.png"));

  g_assert_true (cw_libraries_put_instrument (libraries, index, g_steal_pointer (&original), &error));
  cw_gui_settle (200);
  g_assert_null (cw_gui_find_named (named (f->window->shelf, "k25"), "differs"));
}

/* Libraries, one per surgery: a new one becomes current and the choice is
 * kept in the settings; the last one cannot be deleted. */
static void
test_several_libraries (Fixture       *f,
                        gconstpointer  data)
{
  CwLibraries *libraries = cw_libraries_get_default ();
  g_autoptr(GSettings) settings = g_settings_new (CW_APPLICATION_ID);
  g_autofree char *chosen = NULL;
  g_autoptr(GError) error = NULL;
  guint n = cw_libraries_get_n_libraries (libraries);
  CwLibraryWindow *window = show_library (f);
  GtkDropDown *choice = GTK_DROP_DOWN (named (window, "library-choice"));

  g_assert_true (cw_libraries_create (libraries, "Surgery 2", &error));
  g_assert_no_error (error);
  cw_gui_settle (200);
  g_assert_cmpuint (cw_libraries_get_n_libraries (libraries), ==, n + 1);
  g_assert_cmpstr (cw_libraries_get_current (libraries)->title, ==, "Surgery 2");
  chosen = g_settings_get_string (settings, "current-library");
  g_assert_cmpstr (chosen, ==, "surgery-2.cwlib");
  g_assert_cmpuint (gtk_drop_down_get_selected (choice), ==, cw_libraries_get_current_index (libraries));
  g_assert_cmpuint (cw_library_window_get_n_shown (window), ==, 0);

  g_assert_true (cw_libraries_delete (libraries, cw_libraries_get_current_index (libraries), &error));
  g_assert_no_error (error);
  cw_gui_settle (200);
  g_assert_cmpuint (cw_libraries_get_n_libraries (libraries), ==, n);
  g_assert_cmpuint (cw_library_window_get_n_shown (window), >=, 22);
}

/* Export writes the current library elsewhere; import checks a file and
 * copies it into the folder, under a name of its own. */
static void
test_import_export (Fixture       *f,
                    gconstpointer  data)
{
  CwLibraries *libraries = cw_libraries_get_default ();
  g_autofree char *out = g_build_filename (f->dir, "exported.cwlib", NULL);
  g_autofree char *bad = g_build_filename (f->dir, "bad.cwlib", NULL);
  g_autoptr(CwLibrary) exported = NULL;
  g_autoptr(GError) error = NULL;
  guint n = cw_libraries_get_n_libraries (libraries);
  guint current = cw_libraries_get_current_index (libraries);
  const CwLibrary *imported;

  g_assert_true (cw_libraries_export (libraries, current, out, &error));
  g_assert_no_error (error);
  exported = cw_library_load (out, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (exported->instruments->len, ==, cw_libraries_get_current (libraries)->instruments->len);

  g_assert_true (cw_libraries_import (libraries, out, &error));
  g_assert_no_error (error);
  imported = cw_libraries_get_current (libraries);
  g_assert_cmpuint (cw_libraries_get_n_libraries (libraries), ==, n + 1);
  g_assert_true (g_str_has_prefix (imported->path, cw_libraries_get_dir (libraries)));
  g_assert_true (g_str_has_suffix (imported->path, "/exported.cwlib"));
  g_assert_cmpuint (imported->instruments->len, ==, exported->instruments->len);

  g_assert_true (g_file_set_contents (bad, "{ \"format\": \"canalwright-library\", \"version\": 7 }", -1, NULL));
  g_assert_false (cw_libraries_import (libraries, bad, &error));
  g_assert_cmpstr (error->message, ==, "bad.cwlib: version: was written by a newer Canalwright "
                   "(file version 7, this program reads up to 1)");
  g_clear_error (&error);
  g_assert_cmpuint (cw_libraries_get_n_libraries (libraries), ==, n + 1);

  g_assert_true (cw_libraries_delete (libraries, cw_libraries_get_current_index (libraries), &error));
  g_unlink (out);
  g_unlink (bad);
}

/* A library file that does not load is named, with what is wrong, above
 * the list; the others load, and the starter library is not added again. */
static void
test_unreadable_library (Fixture       *f,
                         gconstpointer  data)
{
  g_autofree char *dir = g_build_filename (f->dir, "libraries", NULL);
  g_autofree char *broken = g_build_filename (dir, "broken.cwlib", NULL);
  g_autofree char *seeded = g_build_filename (dir, "starter-library.cwlib", NULL);
  g_autoptr(CwLibraries) libraries = NULL;
  CwLibraryWindow *window;
  GPtrArray *problems;

  g_assert_cmpint (g_mkdir_with_parents (dir, 0755), ==, 0);
  g_assert_true (g_file_set_contents (broken, "{ \"format\": \"canalwright-library\" }", -1, NULL));
  libraries = cw_libraries_new (dir, NULL);
  problems = cw_libraries_get_problems (libraries);
  g_assert_cmpuint (problems->len, ==, 1);
  g_assert_cmpstr (g_ptr_array_index (problems, 0), ==, "broken.cwlib: version: is required (the integer 1)");
  g_assert_false (g_file_test (seeded, G_FILE_TEST_EXISTS));
  g_assert_cmpuint (cw_libraries_get_n_libraries (libraries), ==, 1);
  g_assert_cmpuint (cw_libraries_get_current (libraries)->instruments->len, ==, 0);

  window = cw_library_window_new (GTK_WINDOW (f->window), libraries);
  gtk_window_present (GTK_WINDOW (window));
  cw_gui_settle (300);
  g_assert_true (g_str_has_prefix (gtk_label_get_label (GTK_LABEL (named (window, "library-problems"))),
                                   "broken.cwlib: version:"));
  gtk_window_destroy (GTK_WINDOW (window));
  g_unlink (broken);
  g_rmdir (dir);
}

static void
remove_tree (const char *path)
{
  g_autoptr(GDir) dir = g_dir_open (path, 0, NULL);
  const char *name;

  while (dir && (name = g_dir_read_name (dir)) != NULL)
    {
      g_autofree char *child = g_build_filename (path, name, NULL);

      if (g_file_test (child, G_FILE_TEST_IS_DIR))
        remove_tree (child);
      else
        g_unlink (child);
    }
  g_rmdir (path);
}

int
main (int   argc,
      char *argv[])
{
  g_autoptr(GError) error = NULL;
  int status;

  /* Before anything asks for the user's data folder, which GLib keeps. */
  data_home = g_dir_make_tmp ("cw-gui-data-XXXXXX", &error);
  g_assert_no_error (error);
  g_setenv ("XDG_DATA_HOME", data_home, TRUE);
  cw_gui_init (&argc, &argv);

#define ADD(path, fn, data) g_test_add (path, Fixture, data, fixture_setup, fn, fixture_teardown)
  ADD ("/gui/library/window", test_library_window, NULL);
  ADD ("/gui/library/create-and-drag", test_create_and_drag, NULL);
  ADD ("/gui/library/case-keeps-copy", test_case_keeps_copy, NULL);
  ADD ("/gui/library/several-libraries", test_several_libraries, NULL);
  ADD ("/gui/library/import-export", test_import_export, NULL);
  ADD ("/gui/library/unreadable", test_unreadable_library, NULL);
#undef ADD

  status = g_test_run ();
  remove_tree (data_home);
  return status;
}
