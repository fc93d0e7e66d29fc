/* cw-sequence-strip.c
 *
 * Drops carry a string: "instrument:ID" from the shelf inserts a step where
 * it lands; "step:N" from a tile moves that step there.  A tile dragged off
 * to nowhere is removed.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-sequence-strip"

#include "config.h"

#include <glib/gi18n.h>
#include <stdlib.h>

#include "cw-sequence-strip.h"
#include "cw-step-tile.h"

struct _CwSequenceStrip
{
  GtkWidget   parent_instance;

  CwDocument *document;
  GtkWidget  *frame;
  GtkWidget  *tiles;
  GtkWidget  *hint;
};

G_DEFINE_FINAL_TYPE (CwSequenceStrip, cw_sequence_strip, GTK_TYPE_WIDGET)

static void
tile_pressed (GtkGestureClick *gesture,
              int              n_press,
              double           x,
              double           y,
              CwSequenceStrip *self)
{
  GtkWidget *tile = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (gesture));

  cw_document_set_step_index (self->document, cw_step_tile_get_index (CW_STEP_TILE (tile)));
  gtk_widget_grab_focus (tile);
}

static void
tile_focused (GtkEventControllerFocus *focus,
              CwSequenceStrip         *self)
{
  GtkWidget *tile = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (focus));

  cw_document_set_step_index (self->document, cw_step_tile_get_index (CW_STEP_TILE (tile)));
}

static GdkContentProvider *
tile_drag_prepare (GtkDragSource *source,
                   double         x,
                   double         y,
                   GtkWidget     *tile)
{
  g_autofree char *data = g_strdup_printf ("step:%u", cw_step_tile_get_index (CW_STEP_TILE (tile)));

  return gdk_content_provider_new_typed (G_TYPE_STRING, data);
}

static void
tile_drag_begin (GtkDragSource *source,
                 GdkDrag       *drag,
                 GtkWidget     *tile)
{
  g_autoptr(GdkPaintable) icon = gtk_widget_paintable_new (tile);

  gtk_drag_source_set_icon (source, icon, 0, 0);
}

/* Dragged off the strip and dropped where nothing takes it: remove. */
static gboolean
tile_drag_cancel (GtkDragSource       *source,
                  GdkDrag             *drag,
                  GdkDragCancelReason  reason,
                  CwSequenceStrip     *self)
{
  GtkWidget *tile = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (source));

  if (reason != GDK_DRAG_CANCEL_NO_TARGET)
    return FALSE;
  cw_document_remove_step (self->document, cw_step_tile_get_index (CW_STEP_TILE (tile)));
  return TRUE;
}

static void
attach_tile_controllers (CwSequenceStrip *self,
                         GtkWidget       *tile)
{
  GtkGesture *click = gtk_gesture_click_new ();
  GtkEventController *focus = gtk_event_controller_focus_new ();
  GtkDragSource *source = gtk_drag_source_new ();

  g_signal_connect (click, "pressed", G_CALLBACK (tile_pressed), self);
  gtk_widget_add_controller (tile, GTK_EVENT_CONTROLLER (click));
  g_signal_connect (focus, "enter", G_CALLBACK (tile_focused), self);
  gtk_widget_add_controller (tile, focus);
  gtk_drag_source_set_actions (source, GDK_ACTION_MOVE);
  g_signal_connect (source, "prepare", G_CALLBACK (tile_drag_prepare), tile);
  g_signal_connect (source, "drag-begin", G_CALLBACK (tile_drag_begin), tile);
  g_signal_connect (source, "drag-cancel", G_CALLBACK (tile_drag_cancel), self);
  gtk_widget_add_controller (tile, GTK_EVENT_CONTROLLER (source));
}

static void
update_selection (CwSequenceStrip *self)
{
  int step = cw_document_get_step_index (self->document);

  for (GtkWidget *c = gtk_widget_get_first_child (self->tiles); c; c = gtk_widget_get_next_sibling (c))
    if (CW_IS_STEP_TILE (c))
      cw_step_tile_set_selected (CW_STEP_TILE (c), (int) cw_step_tile_get_index (CW_STEP_TILE (c)) == step);
}

static void
rebuild (CwSequenceStrip *self)
{
  const CwCanalResult *result = cw_document_get_result (self->document);
  GtkWidget *child;
  gboolean had_focus = gtk_widget_has_focus (GTK_WIDGET (self)) ||
                       gtk_widget_get_focus_child (self->tiles) != NULL;

  while ((child = gtk_widget_get_first_child (self->tiles)))
    gtk_box_remove (GTK_BOX (self->tiles), child);
  for (guint i = 0; result && i < result->steps->len; i++)
    {
      GtkWidget *tile = cw_step_tile_new (cw_canal_result_get_step (result, i));

      attach_tile_controllers (self, tile);
      gtk_box_append (GTK_BOX (self->tiles), tile);
    }
  gtk_widget_set_visible (self->hint, result == NULL || result->steps->len == 0);
  update_selection (self);
  if (had_focus)
    gtk_widget_grab_focus (GTK_WIDGET (self));
}

/* The insertion position for a drop at x: before the first tile whose
 * middle lies right of x. */
guint
cw_sequence_strip_position_at (CwSequenceStrip *self,
                               double           x)
{
  guint position = 0;

  for (GtkWidget *c = gtk_widget_get_first_child (self->tiles); c; c = gtk_widget_get_next_sibling (c))
    {
      graphene_point_t in = GRAPHENE_POINT_INIT ((float) gtk_widget_get_width (c) / 2, 0), out;

      if (!CW_IS_STEP_TILE (c))
        continue;
      if (gtk_widget_compute_point (c, GTK_WIDGET (self), &in, &out) && x < out.x)
        return position;
      position++;
    }
  return position;
}

static gboolean
on_drop (GtkDropTarget   *target,
         const GValue    *value,
         double           x,
         double           y,
         CwSequenceStrip *self)
{
  const char *data = g_value_get_string (value);
  guint position = cw_sequence_strip_position_at (self, x);

  if (data == NULL)
    return FALSE;
  if (g_str_has_prefix (data, "instrument:"))
    {
      cw_document_insert_step (self->document, data + strlen ("instrument:"), position);
      return TRUE;
    }
  if (g_str_has_prefix (data, "step:"))
    {
      guint from = (guint) strtoul (data + strlen ("step:"), NULL, 10);

      /* Dropping after itself leaves the step where it was. */
      cw_document_move_step (self->document, from, position > from ? position - 1 : position);
      return TRUE;
    }
  return FALSE;
}

void
cw_sequence_strip_set_document (CwSequenceStrip *self,
                                CwDocument      *document)
{
  g_return_if_fail (CW_IS_SEQUENCE_STRIP (self));

  g_set_object (&self->document, document);
  g_signal_connect_object (document, "changed", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::step-index", G_CALLBACK (update_selection), self, G_CONNECT_SWAPPED);
  rebuild (self);
}

/* Focus lands on the selected step, so the keys act on it at once. */
static gboolean
cw_sequence_strip_grab_focus (GtkWidget *widget)
{
  CwSequenceStrip *self = CW_SEQUENCE_STRIP (widget);
  int step = self->document ? cw_document_get_step_index (self->document) : -1;
  GtkWidget *c = gtk_widget_get_first_child (self->tiles);

  for (int i = 0; c && i < step; i++)
    c = gtk_widget_get_next_sibling (c);
  if (c && CW_IS_STEP_TILE (c))
    return gtk_widget_grab_focus (c);
  return GTK_WIDGET_CLASS (cw_sequence_strip_parent_class)->grab_focus (widget);
}

static void
cw_sequence_strip_dispose (GObject *object)
{
  CwSequenceStrip *self = CW_SEQUENCE_STRIP (object);

  g_clear_object (&self->document);
  g_clear_pointer (&self->frame, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_sequence_strip_parent_class)->dispose (object);
}

static void
add_key (GtkWidgetClass  *widget_class,
         guint            key,
         GdkModifierType  mods,
         const char      *action)
{
  gtk_widget_class_add_binding_action (widget_class, key, mods, action, NULL);
}

static void
cw_sequence_strip_class_init (CwSequenceStripClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_sequence_strip_dispose;
  widget_class->grab_focus = cw_sequence_strip_grab_focus;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sequencestrip");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_LIST);

  /* Keyboard equivalents of the drags, while focus is in the strip. */
  add_key (widget_class, GDK_KEY_Delete, 0, "win.remove-step");
  add_key (widget_class, GDK_KEY_BackSpace, 0, "win.remove-step");
  add_key (widget_class, GDK_KEY_Up, GDK_ALT_MASK, "win.move-step-earlier");
  add_key (widget_class, GDK_KEY_Left, GDK_ALT_MASK, "win.move-step-earlier");
  add_key (widget_class, GDK_KEY_Down, GDK_ALT_MASK, "win.move-step-later");
  add_key (widget_class, GDK_KEY_Right, GDK_ALT_MASK, "win.move-step-later");
  add_key (widget_class, GDK_KEY_plus, 0, "win.deeper");
  add_key (widget_class, GDK_KEY_equal, 0, "win.deeper");
  add_key (widget_class, GDK_KEY_KP_Add, 0, "win.deeper");
  add_key (widget_class, GDK_KEY_minus, 0, "win.shallower");
  add_key (widget_class, GDK_KEY_KP_Subtract, 0, "win.shallower");
  add_key (widget_class, GDK_KEY_Right, 0, "win.next-step");
  add_key (widget_class, GDK_KEY_Left, 0, "win.previous-step");
}

static void
cw_sequence_strip_init (CwSequenceStrip *self)
{
  GtkWidget *scroller = gtk_scrolled_window_new ();
  GtkDropTarget *target = gtk_drop_target_new (G_TYPE_STRING, GDK_ACTION_COPY | GDK_ACTION_MOVE);
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkWidget *heading = gtk_label_new (_("Sequence"));

  self->frame = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  gtk_widget_set_parent (self->frame, GTK_WIDGET (self));
  gtk_widget_add_css_class (heading, "heading");
  gtk_widget_set_margin_start (heading, 8);
  gtk_box_append (GTK_BOX (self->frame), heading);
  self->tiles = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  self->hint = gtk_label_new (_("Drop files here to build the sequence"));
  gtk_widget_add_css_class (self->hint, "dim-label");
  gtk_box_append (GTK_BOX (box), self->tiles);
  gtk_box_append (GTK_BOX (box), self->hint);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), box);
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (scroller), GTK_POLICY_AUTOMATIC, GTK_POLICY_NEVER);
  gtk_widget_set_hexpand (scroller, TRUE);
  gtk_widget_set_size_request (scroller, -1, 92);
  gtk_box_append (GTK_BOX (self->frame), scroller);

  g_signal_connect (target, "drop", G_CALLBACK (on_drop), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (target));
  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Sequence of steps"), -1);
}
