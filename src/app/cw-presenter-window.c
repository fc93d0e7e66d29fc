/* cw-presenter-window.c
 *
 * Everything on it is drawn by the renderer (cw_teaching_frame_draw) in
 * the high-contrast theme, so what the room sees is what the slides
 * export.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-presenter"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-presenter-window.h"
#include "cw-render-text.h"
#include "cw-teaching-frame.h"

struct _CwPresenterWindow
{
  GtkWindow       parent_instance;

  CwDocument     *document;
  CwPlayback     *playback;
  CwOverlayFlags  overlays;
  GtkWidget      *area;
};

G_DEFINE_FINAL_TYPE (CwPresenterWindow, cw_presenter_window, GTK_TYPE_WINDOW)

enum {
  PROP_0,
  PROP_DOCUMENT,
  PROP_PLAYBACK,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

static char *
status_text (CwPresenterWindow *self)
{
  double factor = cw_playback_get_speed (self->playback);
  g_autofree char *speed = cw_render_number (factor, factor == floor (factor) ? 0 : 2);

  if (cw_playback_get_playing (self->playback))
    /* TRANSLATORS: the speed factor of the playback, then the keys */
    return g_strdup_printf (_("Playing ×%s · Space pause · ← → step · + − speed · Esc leave"), speed);
  return g_strdup_printf (_("Paused ×%s · Space play · ← → step · + − speed · Esc leave"), speed);
}

static void
draw (GtkDrawingArea *area,
      cairo_t        *cr,
      int             width,
      int             height,
      gpointer        data)
{
  CwPresenterWindow *self = data;
  const CwCanalResult *result = cw_document_get_result (self->document);
  cairo_rectangle_t box = { 0, 0, width, height };
  g_autofree char *status = NULL;
  CwTeachingFrame frame;

  if (result == NULL)
    return;
  status = status_text (self);
  cw_teaching_frame_init (&frame, result, cw_document_get_step_index (self->document));
  frame.options.overlays = self->overlays;
  frame.options.rules = &cw_document_get_case (self->document)->rules;
  frame.options.partial = cw_playback_get_partial (self->playback);
  frame.pecks = cw_playback_get_pecks (self->playback);
  frame.status = status;
  cw_teaching_frame_draw (cr, &box, CW_RENDER_HIGH_CONTRAST, &frame);
}

CwPresenterWindow *
cw_presenter_window_new (GtkWindow  *parent,
                         CwDocument *document,
                         CwPlayback *playback)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (document) && CW_IS_PLAYBACK (playback), NULL);

  return g_object_new (CW_TYPE_PRESENTER_WINDOW,
                       "transient-for", parent,
                       "destroy-with-parent", TRUE,
                       "document", document,
                       "playback", playback,
                       NULL);
}

void
cw_presenter_window_set_overlays (CwPresenterWindow *self,
                                  CwOverlayFlags     overlays)
{
  g_return_if_fail (CW_IS_PRESENTER_WINDOW (self));

  self->overlays = overlays;
  gtk_widget_queue_draw (self->area);
}

static void
redraw (CwPresenterWindow *self)
{
  gtk_widget_queue_draw (self->area);
}

static gboolean
key_action (GtkWidget *widget,
            GVariant  *args,
            gpointer   data)
{
  CwPresenterWindow *self = CW_PRESENTER_WINDOW (widget);
  const char *what = data;
  double speed = cw_playback_get_speed (self->playback);

  if (g_str_equal (what, "toggle"))
    cw_playback_toggle (self->playback);
  else if (g_str_equal (what, "next"))
    cw_playback_next (self->playback);
  else if (g_str_equal (what, "previous"))
    cw_playback_previous (self->playback);
  else if (g_str_equal (what, "first"))
    cw_playback_first (self->playback);
  else if (g_str_equal (what, "last"))
    cw_playback_last (self->playback);
  else if (g_str_equal (what, "faster"))
    cw_playback_set_speed (self->playback, speed * 2);
  else if (g_str_equal (what, "slower"))
    cw_playback_set_speed (self->playback, speed / 2);
  else
    gtk_window_close (GTK_WINDOW (self));
  redraw (self);
  return TRUE;
}

/* Without a window manager fullscreen does nothing, so the window takes
 * its monitor's size as well. */
static void
fill_monitor (CwPresenterWindow *self)
{
  GdkDisplay *display = gtk_widget_get_display (GTK_WIDGET (self));
  GListModel *monitors = gdk_display_get_monitors (display);
  g_autoptr(GdkMonitor) monitor = g_list_model_get_n_items (monitors) ? g_list_model_get_item (monitors, 0) : NULL;
  GdkRectangle geometry;

  if (monitor)
    {
      gdk_monitor_get_geometry (monitor, &geometry);
      gtk_window_set_default_size (GTK_WINDOW (self), geometry.width, geometry.height);
    }
  gtk_window_fullscreen (GTK_WINDOW (self));
}

static void
cw_presenter_window_constructed (GObject *object)
{
  CwPresenterWindow *self = CW_PRESENTER_WINDOW (object);

  G_OBJECT_CLASS (cw_presenter_window_parent_class)->constructed (object);

  g_signal_connect_object (self->playback, "changed", G_CALLBACK (redraw), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->playback, "notify::playing", G_CALLBACK (redraw), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "changed", G_CALLBACK (redraw), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::step-index", G_CALLBACK (redraw), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->document, "notify::canal-index", G_CALLBACK (redraw), self, G_CONNECT_SWAPPED);
  fill_monitor (self);
}

static void
cw_presenter_window_set_property (GObject      *object,
                                  guint         prop_id,
                                  const GValue *value,
                                  GParamSpec   *pspec)
{
  CwPresenterWindow *self = CW_PRESENTER_WINDOW (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      self->document = g_value_dup_object (value);
      break;
    case PROP_PLAYBACK:
      self->playback = g_value_dup_object (value);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_presenter_window_get_property (GObject    *object,
                                  guint       prop_id,
                                  GValue     *value,
                                  GParamSpec *pspec)
{
  CwPresenterWindow *self = CW_PRESENTER_WINDOW (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      g_value_set_object (value, self->document);
      break;
    case PROP_PLAYBACK:
      g_value_set_object (value, self->playback);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_presenter_window_dispose (GObject *object)
{
  CwPresenterWindow *self = CW_PRESENTER_WINDOW (object);

  g_clear_object (&self->playback);
  g_clear_object (&self->document);
  G_OBJECT_CLASS (cw_presenter_window_parent_class)->dispose (object);
}

static void
bind_key (GtkShortcutController *keys,
          guint                  key,
          const char            *what)
{
  GtkShortcutAction *action = gtk_callback_action_new (key_action, (gpointer) what, NULL);

  gtk_shortcut_controller_add_shortcut (keys, gtk_shortcut_new (gtk_keyval_trigger_new (key, 0), action));
}

/* In the capture phase: the window's own arrow keys move the focus. */
static void
install_keys (CwPresenterWindow *self)
{
  static const struct { guint key; const char *what; } keys[] = {
    { GDK_KEY_Escape, "leave" }, { GDK_KEY_space, "toggle" }, { GDK_KEY_KP_Space, "toggle" },
    { GDK_KEY_Right, "next" }, { GDK_KEY_Page_Down, "next" }, { GDK_KEY_Left, "previous" },
    { GDK_KEY_Page_Up, "previous" }, { GDK_KEY_Home, "first" }, { GDK_KEY_End, "last" },
    { GDK_KEY_plus, "faster" }, { GDK_KEY_equal, "faster" }, { GDK_KEY_KP_Add, "faster" },
    { GDK_KEY_minus, "slower" }, { GDK_KEY_KP_Subtract, "slower" },
  };
  GtkEventController *controller = gtk_shortcut_controller_new ();

  gtk_event_controller_set_propagation_phase (controller, GTK_PHASE_CAPTURE);
  for (guint i = 0; i < G_N_ELEMENTS (keys); i++)
    bind_key (GTK_SHORTCUT_CONTROLLER (controller), keys[i].key, keys[i].what);
  gtk_widget_add_controller (GTK_WIDGET (self), controller);
}

static void
cw_presenter_window_class_init (CwPresenterWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->constructed = cw_presenter_window_constructed;
  object_class->dispose = cw_presenter_window_dispose;
  object_class->set_property = cw_presenter_window_set_property;
  object_class->get_property = cw_presenter_window_get_property;

  properties[PROP_DOCUMENT] =
    g_param_spec_object ("document", NULL, NULL, CW_TYPE_DOCUMENT,
                         G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  properties[PROP_PLAYBACK] =
    g_param_spec_object ("playback", NULL, NULL, CW_TYPE_PLAYBACK,
                         G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);
  gtk_widget_class_set_css_name (widget_class, "presenterwindow");
}

static void
cw_presenter_window_init (CwPresenterWindow *self)
{
  self->overlays = CW_OVERLAY_TEACHING;
  install_keys (self);
  self->area = gtk_drawing_area_new ();
  gtk_widget_set_focusable (self->area, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->area), draw, self, NULL);
  gtk_window_set_child (GTK_WINDOW (self), self->area);
  gtk_window_set_title (GTK_WINDOW (self), _("Canalwright — Presenter"));
  gtk_window_set_decorated (GTK_WINDOW (self), FALSE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->area), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("The canal and the current step in large type"), -1);
}
