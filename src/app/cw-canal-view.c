/* cw-canal-view.c
 *
 * The renderer lays the canal out in the widget; zoom and pan are a
 * transform on top of that layout, so hit tests undo the transform first.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-canal-view"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "cw-canal-layout.h"
#include "cw-canal-renderer.h"
#include "cw-canal-view.h"
#include "cw-inspector.h"
#include "cw-render-text.h"

#define TIP_GRAB_RADIUS 14.0
#define DEPTH_SNAP 0.5

struct _CwCanalView
{
  GtkWidget      parent_instance;

  CwDocument    *document;
  double         zoom;
  double         pan_x, pan_y;

  /* The layout is kept while the canal and the widget's size stay the
   * same, and always during a drag, so that the drawing does not move
   * under the pointer and a frame is only a re-check and a redraw. */
  CwCanalLayout *layout;
  int            layout_width, layout_height;

  /* a drag in progress: the tip's depth, or the view */
  gboolean       dragging_tip;
  double         drag_pan_x, drag_pan_y;
  double         drag_start_depth;

  /* teaching */
  CwOverlayFlags overlays;
  CwPlayback    *playback;
};

G_DEFINE_FINAL_TYPE (CwCanalView, cw_canal_view, GTK_TYPE_WIDGET)

static gboolean
prefers_dark (GtkWidget *widget)
{
  GtkSettings *settings = gtk_widget_get_settings (widget);
  gboolean dark = FALSE;

  g_object_get (settings, "gtk-application-prefer-dark-theme", &dark, NULL);
  return dark;
}

static void
view_style (CwCanalView   *self,
            CwRenderStyle *style)
{
  cw_render_style_init (style, prefers_dark (GTK_WIDGET (self)) ? CW_RENDER_DARK : CW_RENDER_LIGHT, 1.3);
}

static const CwCanalLayout *
get_layout (CwCanalView *self)
{
  const CwCanalResult *result = cw_document_get_result (self->document);
  int width = gtk_widget_get_width (GTK_WIDGET (self));
  int height = gtk_widget_get_height (GTK_WIDGET (self));
  cairo_rectangle_t area = { 0, 0, width, height };
  CwRenderStyle style;

  if (self->layout && width == self->layout_width && height == self->layout_height)
    return self->layout;
  g_clear_pointer (&self->layout, cw_canal_layout_free);
  if (result == NULL || width < 10 || height < 10)
    return NULL;
  view_style (self, &style);
  self->layout = cw_canal_layout_new_for_overlays (result->canal, result, &style, &area, CW_CANAL_LAYOUT_FULL,
                                                   self->overlays);
  self->layout_width = width;
  self->layout_height = height;
  return self->layout;
}

static void
invalidate_layout (CwCanalView *self)
{
  g_clear_pointer (&self->layout, cw_canal_layout_free);
}

/* The zoom keeps the middle of the widget in place. */
static void
view_transform (CwCanalView    *self,
                cairo_matrix_t *m)
{
  double cx = gtk_widget_get_width (GTK_WIDGET (self)) / 2.0;
  double cy = gtk_widget_get_height (GTK_WIDGET (self)) / 2.0;

  cairo_matrix_init_translate (m, cx + self->pan_x, cy + self->pan_y);
  cairo_matrix_scale (m, self->zoom, self->zoom);
  cairo_matrix_translate (m, -cx, -cy);
}

static void
draw_canal (CwCanalView         *self,
            cairo_t             *cr,
            const CwCanalLayout *layout)
{
  CwCanalDrawOptions options;

  cw_canal_draw_options_init (&options);
  options.overlays = self->overlays;
  options.rules = &cw_document_get_case (self->document)->rules;
  if (self->playback)
    options.partial = cw_playback_get_partial (self->playback);
  cw_canal_draw_full (cr, layout, cw_document_get_result (self->document),
                      cw_document_get_step_index (self->document), &options);
}

static char *
hud_text (CwCanalView *self)
{
  const CwStepResult *r = cw_playback_get_figures (self->playback);
  const CwStepResult *planned = cw_canal_result_get_step (cw_document_get_result (self->document),
                                                          (guint) cw_playback_get_step_index (self->playback));
  double factor = cw_playback_get_speed (self->playback);
  g_autofree char *speed = cw_render_number (factor, factor == floor (factor) ? 0 : 2);
  g_autofree char *tip = cw_render_number (r->depth, 1), *depth = cw_render_number (planned->depth, 1);
  g_autofree char *engaged = cw_render_number (r->engaged_length, 1);
  g_autofree char *curve = cw_render_number (r->engaged_in_curve, 1);
  g_autofree char *number = cw_render_number (r->strain * 100, 1);
  g_autofree char *strain = isfinite (r->strain) ? g_strdup_printf (_("%s %%"), number) : g_strdup ("–");
  g_autofree char *pecks = planned->pecks == 0
    ? g_strdup (_("it touches no wall"))
    : g_strdup_printf (_("peck %u of %u"), MIN (cw_playback_get_pecks (self->playback) + 1, planned->pecks),
                       planned->pecks);

  /* TRANSLATORS: playing or paused, speed, tip depth, planned depth, pecks,
   * engaged length, of it in the curve, strain */
  return g_strdup_printf (_("%s ×%s · tip %s of %s mm · %s\nengaged %s mm, %s in the curve · strain %s"),
                          cw_playback_get_playing (self->playback) ? _("Playing") : _("Paused"), speed, tip, depth,
                          pecks, engaged, curve, strain);
}

/* While a file goes in, its figures there in the top left corner. */
static void
draw_playback_hud (CwCanalView   *self,
                   cairo_t       *cr,
                   CwRenderStyle *style)
{
  g_autoptr(PangoLayout) text = NULL;
  g_autofree char *line = NULL;
  double w, h, pad = cw_render_style_font (style, 5);

  if (self->playback == NULL || cw_playback_get_phase (self->playback) != CW_PLAYBACK_INSERTING
      || cw_playback_get_figures (self->playback) == NULL)
    return;
  line = hud_text (self);
  text = cw_render_text_layout (style, 8, CW_TEXT_BOLD, line);
  cw_render_text_size (text, &w, &h);
  cw_render_set_rgba (cr, &cw_render_style_palette (style)->background, 0.9);
  cairo_rectangle (cr, pad / 2, pad / 2, w + pad * 2, h + pad);
  cairo_fill (cr);
  cw_render_set_rgb (cr, &cw_render_style_palette (style)->ink);
  cw_render_text_draw (cr, text, pad * 1.5, pad, CW_ALIGN_START, CW_ALIGN_START);
}

static void
cw_canal_view_snapshot (GtkWidget   *widget,
                        GtkSnapshot *snapshot)
{
  CwCanalView *self = CW_CANAL_VIEW (widget);
  const CwCanalLayout *layout;
  graphene_rect_t bounds;
  CwRenderStyle style;
  cairo_matrix_t m;
  cairo_t *cr;

  if (self->document == NULL || (layout = get_layout (self)) == NULL)
    return;
  view_style (self, &style);
  graphene_rect_init (&bounds, 0, 0, gtk_widget_get_width (widget), gtk_widget_get_height (widget));
  cr = gtk_snapshot_append_cairo (snapshot, &bounds);
  cw_render_set_rgb (cr, &cw_render_style_palette (&style)->background);
  cairo_paint (cr);
  cairo_save (cr);
  view_transform (self, &m);
  cairo_transform (cr, &m);
  draw_canal (self, cr, layout);
  cairo_restore (cr);
  draw_playback_hud (self, cr, &style);
  cairo_destroy (cr);
}

static void
to_widget (CwCanalView *self,
           double      *x,
           double      *y)
{
  cairo_matrix_t m;

  view_transform (self, &m);
  cairo_matrix_transform_point (&m, x, y);
}

static void
from_widget (CwCanalView *self,
             double      *x,
             double      *y)
{
  cairo_matrix_t m;

  view_transform (self, &m);
  cairo_matrix_invert (&m);
  cairo_matrix_transform_point (&m, x, y);
}

/* Where the centreline is at a depth, in widget coordinates; the GUI tests
 * read it to aim their drags. */
gboolean
cw_canal_view_depth_point (CwCanalView *self,
                           double       depth,
                           double      *x,
                           double      *y)
{
  const CwCanalLayout *layout = get_layout (self);

  if (layout == NULL)
    return FALSE;
  cw_canal_layout_to_device (layout, depth, 0, x, y);
  to_widget (self, x, y);
  return TRUE;
}

static double
depth_at (CwCanalView *self,
          double       x,
          double       y)
{
  const CwCanalLayout *layout = get_layout (self);
  double offset, distance;

  if (layout == NULL)
    return NAN;
  from_widget (self, &x, &y);
  return cw_canal_layout_from_device (layout, x, y, &offset, &distance);
}

static const CwStep *
selected_step (CwCanalView *self)
{
  const CwCanal *canal = cw_document_get_canal (self->document);
  int step = cw_document_get_step_index (self->document);

  return canal && step >= 0 ? cw_canal_get_step (canal, step) : NULL;
}

static void
drag_begin (GtkGestureDrag *gesture,
            double          x,
            double          y,
            CwCanalView    *self)
{
  const CwStep *step = selected_step (self);
  double tx, ty;

  gtk_widget_grab_focus (GTK_WIDGET (self));
  self->dragging_tip = FALSE;
  self->drag_pan_x = self->pan_x;
  self->drag_pan_y = self->pan_y;
  if (step == NULL || !cw_canal_view_depth_point (self, step->depth, &tx, &ty))
    return;
  if (hypot (tx - x, ty - y) <= TIP_GRAB_RADIUS)
    {
      self->dragging_tip = TRUE;
      self->drag_start_depth = step->depth;
      cw_document_begin_edit (self->document, _("Change Depth"));
    }
}

static void
drag_update (GtkGestureDrag *gesture,
             double          dx,
             double          dy,
             CwCanalView    *self)
{
  const CwStep *step = selected_step (self);
  double x, y, depth;

  if (!self->dragging_tip)
    {
      self->pan_x = self->drag_pan_x + dx;
      self->pan_y = self->drag_pan_y + dy;
      gtk_widget_queue_draw (GTK_WIDGET (self));
      return;
    }
  gtk_gesture_drag_get_start_point (gesture, &x, &y);
  depth = depth_at (self, x + dx, y + dy);
  if (!isfinite (depth))
    return;
  depth = round (depth / DEPTH_SNAP) * DEPTH_SNAP;
  if (step && depth != step->depth)
    cw_document_set_step_depth (self->document, cw_document_get_step_index (self->document), depth);
}

static void
drag_end (GtkGestureDrag *gesture,
          double          dx,
          double          dy,
          CwCanalView    *self)
{
  const CwStep *step = selected_step (self);

  if (!self->dragging_tip)
    return;
  self->dragging_tip = FALSE;
  if (step && step->depth != self->drag_start_depth)
    cw_document_end_edit (self->document);
  else
    cw_document_cancel_edit (self->document);
}

static gboolean
on_scroll (GtkEventControllerScroll *scroll,
           double                    dx,
           double                    dy,
           CwCanalView              *self)
{
  GdkModifierType mods = gtk_event_controller_get_current_event_state (GTK_EVENT_CONTROLLER (scroll));

  if (mods & GDK_CONTROL_MASK)
    cw_canal_view_zoom (self, dy < 0 ? 1.1 : 1 / 1.1);
  else
    {
      self->pan_x -= dx * 30;
      self->pan_y -= dy * 30;
      gtk_widget_queue_draw (GTK_WIDGET (self));
    }
  return TRUE;
}

static gboolean
on_drop (GtkDropTarget *target,
         const GValue  *value,
         double         x,
         double         y,
         CwCanalView   *self)
{
  const char *data = g_value_get_string (value);
  int step = cw_document_get_step_index (self->document);

  if (data == NULL || !g_str_has_prefix (data, "instrument:"))
    return FALSE;
  cw_document_insert_step (self->document, data + strlen ("instrument:"), step < 0 ? -1 : step + 1);
  return TRUE;
}

void
cw_canal_view_zoom (CwCanalView *self,
                    double       factor)
{
  self->zoom = CLAMP (self->zoom * factor, 0.5, 12.0);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

void
cw_canal_view_reset_view (CwCanalView *self)
{
  self->zoom = 1.0;
  self->pan_x = self->pan_y = 0;
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

/* Screen readers get the selected step's figures in a sentence. */
static void
update_description (CwCanalView *self)
{
  const CwCanalResult *result = cw_document_get_result (self->document);
  int step = cw_document_get_step_index (self->document);
  g_autofree char *text = NULL;

  if (result && step >= 0 && step < (int) result->steps->len)
    text = cw_step_summary (cw_canal_result_get_step (result, step));
  else
    text = g_strdup (_("No step selected."));
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, text, -1);
}

static void
document_changed (CwCanalView *self)
{
  if (!cw_document_in_edit (self->document))
    invalidate_layout (self);
  update_description (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

void
cw_canal_view_set_document (CwCanalView *self,
                            CwDocument  *document)
{
  g_return_if_fail (CW_IS_CANAL_VIEW (self));

  g_set_object (&self->document, document);
  g_signal_connect_object (document, "changed", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::step-index", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (invalidate_layout), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (cw_canal_view_reset_view), self, G_CONNECT_SWAPPED);
  document_changed (self);
}

void
cw_canal_view_set_overlays (CwCanalView    *self,
                            CwOverlayFlags  overlays)
{
  g_return_if_fail (CW_IS_CANAL_VIEW (self));

  if (overlays == self->overlays)
    return;
  self->overlays = overlays;
  invalidate_layout (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

CwOverlayFlags
cw_canal_view_get_overlays (CwCanalView *self)
{
  g_return_val_if_fail (CW_IS_CANAL_VIEW (self), CW_OVERLAY_NONE);
  return self->overlays;
}

void
cw_canal_view_set_playback (CwCanalView *self,
                            CwPlayback  *playback)
{
  g_return_if_fail (CW_IS_CANAL_VIEW (self));

  if (self->playback)
    g_signal_handlers_disconnect_by_data (self->playback, self);
  g_set_object (&self->playback, playback);
  if (playback)
    g_signal_connect_object (playback, "changed", G_CALLBACK (gtk_widget_queue_draw), self, G_CONNECT_SWAPPED);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

static void
cw_canal_view_dispose (GObject *object)
{
  CwCanalView *self = CW_CANAL_VIEW (object);

  g_clear_object (&self->playback);
  g_clear_object (&self->document);
  invalidate_layout (self);
  G_OBJECT_CLASS (cw_canal_view_parent_class)->dispose (object);
}

static void
cw_canal_view_class_init (CwCanalViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_canal_view_dispose;
  widget_class->snapshot = cw_canal_view_snapshot;
  gtk_widget_class_set_css_name (widget_class, "canalview");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_IMG);

  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_plus, 0, "win.deeper", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_equal, 0, "win.deeper", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Add, 0, "win.deeper", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Down, 0, "win.deeper", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_minus, 0, "win.shallower", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Subtract, 0, "win.shallower", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Up, 0, "win.shallower", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Right, 0, "win.next-step", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Left, 0, "win.previous-step", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Delete, 0, "win.remove-step", NULL);
  /* Playback (cw-window-teaching.c); Left and Right above step it too. */
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_space, 0, "win.play-pause", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Space, 0, "win.play-pause", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Home, 0, "win.first-step", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Home, 0, "win.first-step", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_End, 0, "win.last-step", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_End, 0, "win.last-step", NULL);
}

static void
cw_canal_view_init (CwCanalView *self)
{
  GtkGesture *drag = gtk_gesture_drag_new ();
  GtkEventController *scroll = gtk_event_controller_scroll_new (GTK_EVENT_CONTROLLER_SCROLL_BOTH_AXES);
  GtkDropTarget *target = gtk_drop_target_new (G_TYPE_STRING, GDK_ACTION_COPY);

  self->zoom = 1.0;
  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_widget_set_focus_on_click (GTK_WIDGET (self), TRUE);
  g_signal_connect (drag, "drag-begin", G_CALLBACK (drag_begin), self);
  g_signal_connect (drag, "drag-update", G_CALLBACK (drag_update), self);
  g_signal_connect (drag, "drag-end", G_CALLBACK (drag_end), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (drag));
  g_signal_connect (scroll, "scroll", G_CALLBACK (on_scroll), self);
  gtk_widget_add_controller (GTK_WIDGET (self), scroll);
  g_signal_connect (target, "drop", G_CALLBACK (on_drop), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (target));
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Canal drawing with the selected step's file"), -1);
}
