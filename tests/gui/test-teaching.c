/* test-teaching.c: overlays, playback keys, the presenter and the
 * comparison in the real window under Xvfb
 *
 * Keys go in through xdotool; screenshots of the designer with overlays,
 * the presenter and the comparison stay in the build folder.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>

#include "cw-gui-util.h"
#include "cw-instrument-compare.h"
#include "cw-presenter-window.h"
#include "cw-window-private.h"

typedef struct
{
  char       *path;
  CwDocument *document;
  CwWindow   *window;
} Fixture;

static void
fixture_setup (Fixture       *f,
               gconstpointer  data)
{
  g_autoptr(GFile) file = NULL;
  g_autoptr(GError) error = NULL;

  f->path = g_build_filename (g_getenv ("CW_SAMPLE_CASES"), "lower-molar-moderate.cwcase", NULL);
  file = g_file_new_for_path (f->path);
  f->document = cw_document_open (file, &error);
  g_assert_no_error (error);
  f->window = cw_window_new (cw_gui_app (), f->document);
  gtk_window_set_default_size (GTK_WINDOW (f->window), 1280, 800);
  gtk_window_present (GTK_WINDOW (f->window));
  cw_gui_settle (800);
}

static GtkWindow *
find_toplevel (GType type)
{
  GListModel *list = gtk_window_get_toplevels ();

  for (guint i = 0; i < g_list_model_get_n_items (list); i++)
    {
      g_autoptr(GtkWindow) w = g_list_model_get_item (list, i);

      if (G_TYPE_CHECK_INSTANCE_TYPE (w, type) && gtk_widget_get_visible (GTK_WIDGET (w)))
        return w;
    }
  return NULL;
}

static void
fixture_teardown (Fixture       *f,
                  gconstpointer  data)
{
  GtkWindow *other;

  while ((other = find_toplevel (CW_TYPE_PRESENTER_WINDOW)) || (other = find_toplevel (CW_TYPE_INSTRUMENT_COMPARE)))
    gtk_window_destroy (other);
  cw_document_set_modified (f->document, FALSE);
  gtk_window_destroy (GTK_WINDOW (f->window));
  cw_gui_settle (100);
  g_clear_object (&f->document);
  g_free (f->path);
}

static gboolean
menu_has (GMenuModel *menu,
          const char *action)
{
  for (int i = 0; i < g_menu_model_get_n_items (menu); i++)
    {
      g_autofree char *name = NULL;
      g_autoptr(GMenuModel) sub = g_menu_model_get_item_link (menu, i, G_MENU_LINK_SUBMENU);

      if (g_menu_model_get_item_attribute (menu, i, G_MENU_ATTRIBUTE_ACTION, "s", &name)
          && g_str_equal (name, action))
        return TRUE;
      if (sub && menu_has (sub, action))
        return TRUE;
    }
  return FALSE;
}

/* The menu section has every teaching command; an overlay toggle is a
 * boolean state that reaches the canal drawing. */
static void
test_menu_and_overlays (Fixture       *f,
                        gconstpointer  data)
{
  GMenuModel *section = G_MENU_MODEL (f->window->teaching_section);
  static const char *actions[] = {
    "win.overlay-ruler", "win.overlay-strain", "win.overlay-ceiling", "win.overlay-clearance",
    "win.overlay-envelope", "win.overlay-engaged", "win.overlay-zones", "win.play-pause",
    "win.presenter", "win.compare-instruments", "win.export-view", "win.export-frames",
  };
  g_autoptr(GVariant) state = NULL;

  for (guint i = 0; i < G_N_ELEMENTS (actions); i++)
    g_assert_true (menu_has (section, actions[i]));
  g_assert_cmpint (cw_canal_view_get_overlays (f->window->canal_view), ==, CW_OVERLAY_NONE);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.overlay-ruler", NULL);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.overlay-strain", NULL);
  g_assert_cmpint (cw_canal_view_get_overlays (f->window->canal_view), ==, CW_OVERLAY_RULER | CW_OVERLAY_STRAIN);
  state = g_action_group_get_action_state (G_ACTION_GROUP (f->window), "overlay-ruler");
  g_assert_true (g_variant_get_boolean (state));
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.overlay-ruler", NULL);
  g_assert_cmpint (cw_canal_view_get_overlays (f->window->canal_view), ==, CW_OVERLAY_STRAIN);
}

/* Home, End, Left and Space in the canal drawing: the same step selection
 * as the strip's, and the playback's play and pause. */
static void
test_keys (Fixture       *f,
           gconstpointer  data)
{
  CwPlayback *playback = _cw_window_get_playback (f->window);
  int last = (int) cw_document_get_canal (f->document)->sequence->len - 1;

  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.focus-canal", NULL);
  cw_gui_settle (200);
  cw_gui_key ("End");
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, last);
  cw_gui_key ("Left Left");
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, last - 2);
  g_assert_cmpint (cw_playback_get_step_index (playback), ==, last - 2);
  cw_gui_key ("Home");
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, 0);
  cw_gui_key ("Right");
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, 1);
  g_assert_false (cw_playback_get_playing (playback));
  cw_gui_key ("space");
  g_assert_true (cw_playback_get_playing (playback));
  cw_gui_key ("space");
  g_assert_false (cw_playback_get_playing (playback));
}

/* Played in the window, the window's clock moves the file in. */
static void
test_playback_runs (Fixture       *f,
                    gconstpointer  data)
{
  CwPlayback *playback = _cw_window_get_playback (f->window);
  double depth;

  cw_document_set_step_index (f->document, 5);
  cw_playback_set_speed (playback, 4);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.play-pause", NULL);
  g_assert_cmpint (cw_playback_get_phase (playback), ==, CW_PLAYBACK_INSERTING);
  depth = cw_playback_get_depth (playback);
  cw_gui_settle (700);
  g_assert_cmpfloat (cw_playback_get_depth (playback), >, depth + 1);
  g_assert_nonnull (cw_playback_get_partial (playback));
  g_free (cw_gui_screenshot ("teaching-playing.png"));
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.play-pause", NULL);
  g_assert_false (cw_playback_get_playing (playback));
}

static void
image_stats (const char *path,
             double     *mean,
             guint      *dark,
             guint      *width,
             guint      *height)
{
  cairo_surface_t *image = cairo_image_surface_create_from_png (path);
  int stride = cairo_image_surface_get_stride (image);
  const guint8 *data = cairo_image_surface_get_data (image);
  double sum = 0;

  g_assert_cmpint (cairo_surface_status (image), ==, CAIRO_STATUS_SUCCESS);
  *width = (guint) cairo_image_surface_get_width (image);
  *height = (guint) cairo_image_surface_get_height (image);
  *dark = 0;
  for (guint y = 0; y < *height; y++)
    for (guint x = 0; x < *width; x++)
      {
        guint32 v = *(const guint32 *) (gconstpointer) (data + y * stride + x * 4);
        double l = (0.2126 * (v >> 16 & 0xff) + 0.7152 * (v >> 8 & 0xff) + 0.0722 * (v & 0xff)) / 255;

        sum += l;
        /* The large numerals on the right, in black. */
        *dark += l < 0.1 && x > *width * 0.62 && y < *height * 0.45;
      }
  *mean = sum / (*width * *height);
  cairo_surface_destroy (image);
}

/* F5: the presenter fills the screen in high contrast, with the step's
 * numbers in large black type; its keys drive the same playback and
 * selection; Esc leaves. */
/* An instrumented build answers keys more slowly: wait, within reason. */
static void
wait_for_playing (CwPlayback *playback,
                  gboolean    playing)
{
  gint64 deadline = g_get_monotonic_time () + 3 * G_USEC_PER_SEC;

  while (cw_playback_get_playing (playback) != playing && g_get_monotonic_time () < deadline)
    cw_gui_settle (50);
}

static void
test_presenter (Fixture       *f,
                gconstpointer  data)
{
  CwPlayback *playback = _cw_window_get_playback (f->window);
  g_autofree char *path = NULL;
  GtkWindow *presenter;
  guint dark, width, height;
  double mean;

  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.overlay-ceiling", NULL);
  cw_document_set_step_index (f->document, 5);
  cw_gui_key ("F5");
  cw_gui_settle (800);
  presenter = find_toplevel (CW_TYPE_PRESENTER_WINDOW);
  g_assert_nonnull (presenter);
  g_assert_cmpint (gtk_widget_get_width (GTK_WIDGET (presenter)), ==, 1280);
  g_assert_cmpint (gtk_widget_get_height (GTK_WIDGET (presenter)), ==, 800);
  path = cw_gui_screenshot ("presenter.png");
  image_stats (path, &mean, &dark, &width, &height);
  g_assert_cmpuint (width, ==, 1280);
  g_assert_cmpuint (height, ==, 800);
  /* White ground, black type: mostly light, with a block of black. */
  g_assert_cmpfloat (mean, >, 0.75);
  g_assert_cmpuint (dark, >, 8000);
  cw_gui_key ("Right");
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, 6);
  cw_gui_key ("space");
  wait_for_playing (playback, TRUE);
  g_assert_true (cw_playback_get_playing (playback));
  cw_gui_key ("plus");
  g_assert_cmpfloat (cw_playback_get_speed (playback), ==, 2);
  cw_gui_settle (400);
  g_free (cw_gui_screenshot ("presenter-playing.png"));
  cw_gui_key ("space Escape");
  wait_for_playing (playback, FALSE);
  g_assert_false (cw_playback_get_playing (playback));
  g_assert_null (find_toplevel (CW_TYPE_PRESENTER_WINDOW));
}

/* Three files in the same canal at one depth, their figures side by side. */
static void
test_compare (Fixture       *f,
              gconstpointer  data)
{
  const char *ids[] = { "r30-04", "r35-04", "r40-04", "k10", NULL };
  GtkWindow *compare;
  g_auto(GStrv) picked = NULL;

  cw_document_set_step_index (f->document, 4);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.compare-instruments", NULL);
  cw_gui_settle (600);
  compare = find_toplevel (CW_TYPE_INSTRUMENT_COMPARE);
  g_assert_nonnull (compare);
  picked = cw_instrument_compare_dup_ids (CW_INSTRUMENT_COMPARE (compare));
  g_assert_cmpuint (g_strv_length (picked), ==, 2);
  /* A fourth is not taken. */
  cw_instrument_compare_set_ids (CW_INSTRUMENT_COMPARE (compare), ids);
  g_strfreev (picked);
  picked = cw_instrument_compare_dup_ids (CW_INSTRUMENT_COMPARE (compare));
  g_assert_cmpuint (g_strv_length (picked), ==, 3);
  cw_instrument_compare_set_ids (CW_INSTRUMENT_COMPARE (compare), (const char *[]) { "r30-04", "r35-04", "r40-04", NULL });
  cw_instrument_compare_set_depth (CW_INSTRUMENT_COMPARE (compare), 18);
  cw_instrument_compare_set_after_step (CW_INSTRUMENT_COMPARE (compare), TRUE);
  gtk_window_set_default_size (compare, 1280, 800);
  cw_gui_settle (500);
  g_free (cw_gui_screenshot ("compare.png"));
  cw_gui_key ("Escape");
  g_assert_null (find_toplevel (CW_TYPE_INSTRUMENT_COMPARE));
}

/* From the window: steps times frames per step, for the current canal. */
static void
test_export_frames (Fixture       *f,
                    gconstpointer  data)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-gui-frames-XXXXXX", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(GDir) d = NULL;
  const char *name;
  guint n = 0;

  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.overlay-zones", NULL);
  g_assert_true (_cw_window_export_frames (f->window, dir, 2, &error));
  g_assert_no_error (error);
  d = g_dir_open (dir, 0, NULL);
  while ((name = g_dir_read_name (d)))
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      n++;
      g_unlink (path);
    }
  g_assert_cmpuint (n, ==, cw_document_get_canal (f->document)->sequence->len * 2);
  g_rmdir (dir);
}

/* The designer with overlays on, for a look. */
static void
test_screenshot (Fixture       *f,
                 gconstpointer  data)
{
  static const char *on[] = { "win.overlay-strain", "win.overlay-ceiling", "win.overlay-engaged", "win.overlay-zones" };

  for (guint i = 0; i < G_N_ELEMENTS (on); i++)
    gtk_widget_activate_action (GTK_WIDGET (f->window), on[i], NULL);
  cw_document_set_step_index (f->document, 5);
  cw_gui_settle (400);
  g_free (cw_gui_screenshot ("teaching-designer.png"));
}

int
main (int   argc,
      char *argv[])
{
  cw_gui_init (&argc, &argv);

#define ADD(path, fn) g_test_add (path, Fixture, NULL, fixture_setup, fn, fixture_teardown)
  ADD ("/gui/teaching/menu-and-overlays", test_menu_and_overlays);
  ADD ("/gui/teaching/keys", test_keys);
  ADD ("/gui/teaching/playback-runs", test_playback_runs);
  ADD ("/gui/teaching/presenter", test_presenter);
  ADD ("/gui/teaching/compare", test_compare);
  ADD ("/gui/teaching/export-frames", test_export_frames);
  ADD ("/gui/teaching/screenshot", test_screenshot);
#undef ADD

  return g_test_run ();
}
