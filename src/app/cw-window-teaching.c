/* cw-window-teaching.c: overlays, playback, the presenter, comparing
 * instruments and slides
 *
 * The playback selects steps through the document, as the strip and the
 * arrow keys do, so there is one current step.  The window keeps its
 * teaching state on the side (g_object_set_data) to stay out of the
 * window's own struct.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-window"

#include "config.h"

#include <glib/gi18n.h>
#include <stdlib.h>

#include "cw-frames-export.h"
#include "cw-instrument-compare.h"
#include "cw-playback.h"
#include "cw-presenter-window.h"
#include "cw-window-private.h"

#define TEACHING_KEY "cw-window-teaching"
/* Slides exported from the window: a 960 x 540 pt slide at 1920 x 1080. */
#define VIEW_DPI 144.0

typedef struct
{
  CwWindow          *window;
  CwPlayback        *playback;
  CwOverlayFlags     overlays;
  CwPresenterWindow *presenter;
  GtkWidget         *play_button;
  guint              timer;
  gint64             last_tick;
} Teaching;

static void
teaching_free (Teaching *t)
{
  g_clear_handle_id (&t->timer, g_source_remove);
  if (t->presenter)
    g_object_remove_weak_pointer (G_OBJECT (t->presenter), (gpointer *) &t->presenter);
  g_clear_object (&t->playback);
  g_free (t);
}

static Teaching *
teaching (CwWindow *self)
{
  return g_object_get_data (G_OBJECT (self), TEACHING_KEY);
}

static gboolean
tick (gpointer data)
{
  Teaching *t = data;
  gint64 now = g_get_monotonic_time ();

  cw_playback_tick (t->playback, (now - t->last_tick) / (double) G_USEC_PER_SEC);
  t->last_tick = now;
  return G_SOURCE_CONTINUE;
}

/* A 60 Hz clock while playing, whichever window shows the playback. */
static void
playing_changed (CwWindow *self)
{
  Teaching *t = teaching (self);
  gboolean playing = cw_playback_get_playing (t->playback);

  if (playing && t->timer == 0)
    {
      t->last_tick = g_get_monotonic_time ();
      t->timer = g_timeout_add (16, tick, t);
    }
  else if (!playing)
    g_clear_handle_id (&t->timer, g_source_remove);
  if (t->play_button)
    {
      gtk_button_set_icon_name (GTK_BUTTON (t->play_button),
                                playing ? "media-playback-pause-symbolic" : "media-playback-start-symbolic");
      gtk_widget_set_tooltip_text (t->play_button, playing ? _("Pause the playback (Space)")
                                                           : _("Play the sequence step by step (Space)"));
    }
}

static void
speed_changed (CwWindow *self)
{
  Teaching *t = teaching (self);
  g_autofree char *speed = g_strdup_printf ("%g", cw_playback_get_speed (t->playback));
  GAction *action = g_action_map_lookup_action (G_ACTION_MAP (t->window), "playback-speed");

  if (action)
    g_simple_action_set_state (G_SIMPLE_ACTION (action), g_variant_new_string (speed));
}

static void
update_enabled (CwWindow *self)
{
  Teaching *t = teaching (self);
  const CwCanal *canal = cw_document_get_canal (t->window->document);
  gboolean steps = canal && canal->sequence->len > 0;

  gtk_widget_action_set_enabled (GTK_WIDGET (t->window), "win.play-pause", steps);
  gtk_widget_action_set_enabled (GTK_WIDGET (t->window), "win.first-step", steps);
  gtk_widget_action_set_enabled (GTK_WIDGET (t->window), "win.last-step", steps);
  gtk_widget_action_set_enabled (GTK_WIDGET (t->window), "win.export-frames", steps);
  gtk_widget_action_set_enabled (GTK_WIDGET (t->window), "win.compare-instruments",
                                 cw_document_get_case (t->window->document)->instruments->len > 0);
}

/* The playback follows the window's document, which is set after the
 * window's init, so it is made when the document is there. */
static CwPlayback *
ensure_playback (Teaching *t)
{
  CwDocument *document = t->window->document;

  if (t->playback || document == NULL)
    return t->playback;
  t->playback = cw_playback_new (document);
  g_signal_connect_object (t->playback, "notify::playing", G_CALLBACK (playing_changed), t->window,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (t->playback, "notify::speed", G_CALLBACK (speed_changed), t->window,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "changed", G_CALLBACK (update_enabled), t->window, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (update_enabled), t->window,
                           G_CONNECT_SWAPPED);
  cw_canal_view_set_playback (t->window->canal_view, t->playback);
  update_enabled (t->window);
  return t->playback;
}

static void
play_pause_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *param)
{
  CwPlayback *playback = ensure_playback (teaching (CW_WINDOW (widget)));

  if (playback)
    cw_playback_toggle (playback);
}

static void
first_last_action (GtkWidget  *widget,
                   const char *name,
                   GVariant   *param)
{
  CwPlayback *playback = ensure_playback (teaching (CW_WINDOW (widget)));

  if (playback == NULL)
    return;
  if (g_str_equal (name, "win.first-step"))
    cw_playback_first (playback);
  else
    cw_playback_last (playback);
}

static void
presenter_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  Teaching *t = teaching (self);

  if (ensure_playback (t) == NULL)
    return;
  if (t->presenter == NULL)
    {
      t->presenter = cw_presenter_window_new (GTK_WINDOW (self), self->document, t->playback);
      g_object_add_weak_pointer (G_OBJECT (t->presenter), (gpointer *) &t->presenter);
      cw_presenter_window_set_overlays (t->presenter, t->overlays ? t->overlays : CW_OVERLAY_TEACHING);
    }
  gtk_window_present (GTK_WINDOW (t->presenter));
}

static void
compare_action (GtkWidget  *widget,
                const char *name,
                GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);

  gtk_window_present (GTK_WINDOW (cw_instrument_compare_new (GTK_WINDOW (self), self->document)));
}

/* The frame the presenter would show now, in the window's overlays. */
static void
current_frame (Teaching        *t,
               CwTeachingFrame *frame)
{
  CwDocument *document = t->window->document;

  cw_teaching_frame_init (frame, cw_document_get_result (document), cw_document_get_step_index (document));
  frame->options.overlays = t->overlays;
  frame->options.rules = &cw_document_get_case (document)->rules;
  if (t->playback)
    {
      frame->options.partial = cw_playback_get_partial (t->playback);
      frame->pecks = cw_playback_get_pecks (t->playback);
    }
}

static char *
suggested_name (CwWindow   *self,
                const char *suffix)
{
  g_autofree char *title = cw_document_dup_title (self->document);
  const CwCanal *canal = cw_document_get_canal (self->document);

  g_strdelimit (title, "/\\:", '-');
  return g_strdup_printf ("%s-%s%s", title, canal ? canal->name : "", suffix);
}

static void
export_view_response (GtkNativeDialog *dialog,
                      int              response,
                      CwWindow        *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = g_file_get_path (file);
      g_autoptr(GError) error = NULL;
      CwTeachingFrame frame;

      current_frame (teaching (self), &frame);
      if (frame.result == NULL
          || !cw_frames_write_png (&frame, CW_RENDER_LIGHT, VIEW_DPI, path, &error))
        _cw_window_show_error (self, _("The view was not exported"), error);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

static void
export_view_action (GtkWidget  *widget,
                    const char *name,
                    GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  g_autofree char *suggested = suggested_name (self, ".png");
  GtkFileChooserNative *dialog;

  dialog = gtk_file_chooser_native_new (_("Export This View as a Slide"), GTK_WINDOW (self),
                                        GTK_FILE_CHOOSER_ACTION_SAVE, _("_Export"), _("_Cancel"));
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (dialog), suggested);
  g_signal_connect (dialog, "response", G_CALLBACK (export_view_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

/* Every frame of the current canal's playback into a folder. */
gboolean
_cw_window_export_frames (CwWindow    *self,
                          const char  *dir,
                          guint        frames_per_step,
                          GError     **error)
{
  Teaching *t = teaching (self);
  const CwCanal *canal = cw_document_get_canal (self->document);
  CwFramesOptions options;

  cw_frames_options_init (&options);
  options.canal = canal ? canal->name : NULL;
  options.frames_per_step = frames_per_step;
  options.overlays = t->overlays ? t->overlays : CW_OVERLAY_TEACHING;
  return cw_frames_export (cw_document_get_case (self->document), dir, &options, NULL, error);
}

static void
export_frames_response (GtkNativeDialog *dialog,
                        int              response,
                        CwWindow        *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) folder = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *dir = g_file_get_path (folder);
      const char *frames = gtk_file_chooser_get_choice (GTK_FILE_CHOOSER (dialog), "frames");
      g_autoptr(GError) error = NULL;

      if (!_cw_window_export_frames (self, dir, frames ? (guint) atoi (frames) : CW_FRAMES_DEFAULT_PER_STEP,
                                     &error))
        _cw_window_show_error (self, _("The playback frames were not exported"), error);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

static void
export_frames_action (GtkWidget  *widget,
                      const char *name,
                      GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  const char *ids[] = { "6", "12", "24", NULL };
  const char *labels[] = { _("6 a step"), _("12 a step"), _("24 a step"), NULL };
  GtkFileChooserNative *dialog;

  dialog = gtk_file_chooser_native_new (_("Export the Playback Frames to a Folder"), GTK_WINDOW (self),
                                        GTK_FILE_CHOOSER_ACTION_SELECT_FOLDER, _("_Export"), _("_Cancel"));
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  gtk_file_chooser_add_choice (GTK_FILE_CHOOSER (dialog), "frames", _("Frames"), ids, labels);
  gtk_file_chooser_set_choice (GTK_FILE_CHOOSER (dialog), "frames", "12");
  g_signal_connect (dialog, "response", G_CALLBACK (export_frames_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

void
_cw_window_install_teaching_actions (GtkWidgetClass *klass)
{
  gtk_widget_class_install_action (klass, "win.play-pause", NULL, play_pause_action);
  gtk_widget_class_install_action (klass, "win.first-step", NULL, first_last_action);
  gtk_widget_class_install_action (klass, "win.last-step", NULL, first_last_action);
  gtk_widget_class_install_action (klass, "win.presenter", NULL, presenter_action);
  gtk_widget_class_install_action (klass, "win.compare-instruments", NULL, compare_action);
  gtk_widget_class_install_action (klass, "win.export-view", NULL, export_view_action);
  gtk_widget_class_install_action (klass, "win.export-frames", NULL, export_frames_action);
}

/* win.overlay-ruler and the others: boolean states, one a flag. */
static void
overlay_changed (GSimpleAction *action,
                 GVariant      *state,
                 gpointer       data)
{
  CwWindow *self = data;
  Teaching *t = teaching (self);
  CwOverlayFlags flag = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (action), "overlay"));

  g_simple_action_set_state (action, state);
  if (g_variant_get_boolean (state))
    t->overlays |= flag;
  else
    t->overlays &= ~flag;
  cw_canal_view_set_overlays (self->canal_view, t->overlays);
  if (t->presenter)
    cw_presenter_window_set_overlays (t->presenter, t->overlays);
}

static void
speed_action (GSimpleAction *action,
              GVariant      *state,
              gpointer       data)
{
  CwPlayback *playback = ensure_playback (teaching (CW_WINDOW (data)));

  g_simple_action_set_state (action, state);
  if (playback)
    cw_playback_set_speed (playback, g_ascii_strtod (g_variant_get_string (state, NULL), NULL));
}

static void
add_overlay_actions (CwWindow *self,
                     GMenu    *menu)
{
  for (guint i = 0; i < CW_N_OVERLAYS; i++)
    {
      CwOverlayFlags flag = cw_overlay_nth (i);
      g_autofree char *name = g_strdup_printf ("overlay-%s", cw_overlay_id (flag));
      g_autofree char *detailed = g_strdup_printf ("win.%s", name);
      g_autoptr(GSimpleAction) action = g_simple_action_new_stateful (name, NULL, g_variant_new_boolean (FALSE));

      g_object_set_data (G_OBJECT (action), "overlay", GUINT_TO_POINTER (flag));
      g_signal_connect (action, "change-state", G_CALLBACK (overlay_changed), self);
      g_action_map_add_action (G_ACTION_MAP (self), G_ACTION (action));
      g_menu_append (menu, cw_overlay_title (flag), detailed);
    }
}

static GMenu *
speed_menu (CwWindow *self)
{
  static const char *speeds[] = { "0.5", "1", "2", "4", "8" };
  g_autoptr(GSimpleAction) action = g_simple_action_new_stateful ("playback-speed", G_VARIANT_TYPE_STRING,
                                                                  g_variant_new_string ("1"));
  GMenu *menu = g_menu_new ();

  g_signal_connect (action, "change-state", G_CALLBACK (speed_action), self);
  g_action_map_add_action (G_ACTION_MAP (self), G_ACTION (action));
  for (guint i = 0; i < G_N_ELEMENTS (speeds); i++)
    {
      /* TRANSLATORS: a playback speed factor */
      g_autofree char *label = g_strdup_printf (_("×%s"), speeds[i]);
      g_autoptr(GMenuItem) item = g_menu_item_new (label, NULL);

      g_menu_item_set_action_and_target (item, "win.playback-speed", "s", speeds[i]);
      g_menu_append_item (menu, item);
    }
  return menu;
}

static GMenu *
overlays_menu (CwWindow *self)
{
  GMenu *menu = g_menu_new ();

  add_overlay_actions (self, menu);
  return menu;
}

static void
fill_menu (CwWindow *self,
           GMenu    *overlays)
{
  g_autoptr(GMenu) speeds = speed_menu (self);

  g_menu_append_submenu (self->teaching_section, _("Teaching _Overlays"), G_MENU_MODEL (overlays));
  g_menu_append (self->teaching_section, _("_Play or Pause"), "win.play-pause");
  g_menu_append_submenu (self->teaching_section, _("Playback _Speed"), G_MENU_MODEL (speeds));
  g_menu_append (self->teaching_section, _("Presenter _Mode"), "win.presenter");
  g_menu_append (self->teaching_section, _("_Compare Instruments…"), "win.compare-instruments");
  g_menu_append (self->teaching_section, _("Export This _View…"), "win.export-view");
  g_menu_append (self->teaching_section, _("Export Playback _Frames…"), "win.export-frames");
}

static void
add_header_buttons (CwWindow *self,
                    GMenu    *overlays)
{
  GtkWidget *bar = gtk_window_get_titlebar (GTK_WINDOW (self));
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 0);
  GtkWidget *present = gtk_button_new_from_icon_name ("view-fullscreen-symbolic");
  GtkWidget *menu = gtk_menu_button_new ();
  Teaching *t = teaching (self);

  if (!GTK_IS_HEADER_BAR (bar))
    return;
  gtk_widget_add_css_class (box, "linked");
  t->play_button = gtk_button_new_from_icon_name ("media-playback-start-symbolic");
  gtk_actionable_set_action_name (GTK_ACTIONABLE (t->play_button), "win.play-pause");
  gtk_widget_set_tooltip_text (t->play_button, _("Play the sequence step by step (Space)"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (t->play_button), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Play or pause"), -1);
  gtk_actionable_set_action_name (GTK_ACTIONABLE (present), "win.presenter");
  gtk_widget_set_tooltip_text (present, _("Presenter mode (F5)"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (present), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Presenter mode"), -1);
  gtk_menu_button_set_icon_name (GTK_MENU_BUTTON (menu), "view-reveal-symbolic");
  gtk_menu_button_set_menu_model (GTK_MENU_BUTTON (menu), G_MENU_MODEL (overlays));
  gtk_widget_set_tooltip_text (menu, _("Teaching overlays"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (menu), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Teaching overlays"), -1);
  gtk_box_append (GTK_BOX (box), t->play_button);
  gtk_box_append (GTK_BOX (box), menu);
  gtk_box_append (GTK_BOX (box), present);
  gtk_header_bar_pack_end (GTK_HEADER_BAR (bar), box);
}

static void
document_set (CwWindow *self)
{
  ensure_playback (teaching (self));
}

/* No tick may reach a window on its way out. */
static void
window_destroyed (CwWindow *self)
{
  Teaching *t = teaching (self);

  if (t->playback)
    cw_playback_set_playing (t->playback, FALSE);
  g_clear_handle_id (&t->timer, g_source_remove);
}

void
_cw_window_setup_teaching (CwWindow *self)
{
  Teaching *t = g_new0 (Teaching, 1);
  g_autoptr(GMenu) overlays = NULL;

  t->window = self;
  g_object_set_data_full (G_OBJECT (self), TEACHING_KEY, t, (GDestroyNotify) teaching_free);
  overlays = overlays_menu (self);
  fill_menu (self, overlays);
  add_header_buttons (self, overlays);
  g_signal_connect (self, "notify::document", G_CALLBACK (document_set), NULL);
  g_signal_connect (self, "destroy", G_CALLBACK (window_destroyed), NULL);
}

/* For the tests: the window's playback (made on first use). */
CwPlayback *
_cw_window_get_playback (CwWindow *self)
{
  return ensure_playback (teaching (self));
}
