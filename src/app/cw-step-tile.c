/* cw-step-tile.c
 *
 * The verdict shows as a shape (tick, triangle, octagon), a word and a
 * colour, so it reads in grey and for colour-blind users.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-step-tile"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-render-text.h"
#include "cw-shelf.h"
#include "cw-step-tile.h"
#include "cw-swatch.h"

struct _CwStepTile
{
  GtkWidget  parent_instance;
  guint      index;          /* 0-based */
  GtkWidget *box;
};

G_DEFINE_FINAL_TYPE (CwStepTile, cw_step_tile, GTK_TYPE_WIDGET)

const char *
cw_level_icon_name (CwLevel level)
{
  switch (level)
    {
    case CW_LEVEL_STOP: return "process-stop-symbolic";
    case CW_LEVEL_CAUTION: return "dialog-warning-symbolic";
    case CW_LEVEL_OK:
    default: return "emblem-ok-symbolic";
    }
}

const char *
cw_level_label (CwLevel level)
{
  switch (level)
    {
    case CW_LEVEL_STOP: return _("stop");
    case CW_LEVEL_CAUTION: return _("caution");
    case CW_LEVEL_OK:
    default: return _("ok");
    }
}

static const char *
level_class (CwLevel level)
{
  switch (level)
    {
    case CW_LEVEL_STOP: return "verdict-stop";
    case CW_LEVEL_CAUTION: return "verdict-caution";
    case CW_LEVEL_OK:
    default: return "verdict-ok";
    }
}

static char *
size_text (const CwInstrument *inst)
{
  return cw_render_file_name (inst);
}

static GtkWidget *
verdict_row (CwLevel level)
{
  GtkWidget *row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 4);
  GtkWidget *icon = gtk_image_new_from_icon_name (cw_level_icon_name (level));
  GtkWidget *label = gtk_label_new (cw_level_label (level));

  gtk_box_append (GTK_BOX (row), icon);
  gtk_box_append (GTK_BOX (row), label);
  gtk_widget_add_css_class (row, level_class (level));
  return row;
}

GtkWidget *
cw_step_tile_new (const CwStepResult *r)
{
  CwStepTile *self = g_object_new (CW_TYPE_STEP_TILE, NULL);
  GtkWidget *top = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 4);
  g_autofree char *number = g_strdup_printf ("%u", r->index);
  g_autofree char *size = size_text (r->instrument);
  g_autofree char *depth = g_strdup_printf (_("%.1f mm"), r->depth);
  g_autofree char *a11y = NULL;
  GtkWidget *num = gtk_label_new (number);
  GtkWidget *depth_label = gtk_label_new (depth);

  self->index = r->index - 1;
  gtk_widget_add_css_class (num, "step-number");
  gtk_box_append (GTK_BOX (top), num);
  gtk_box_append (GTK_BOX (top), cw_swatch_new (r->instrument->tip));
  gtk_box_append (GTK_BOX (top), gtk_label_new (size));
  gtk_box_append (GTK_BOX (self->box), top);
  gtk_widget_add_css_class (depth_label, "numeric");
  gtk_box_append (GTK_BOX (self->box), depth_label);
  gtk_box_append (GTK_BOX (self->box), verdict_row (r->verdict));
  gtk_widget_add_css_class (GTK_WIDGET (self), level_class (r->verdict));
  gtk_widget_set_tooltip_text (GTK_WIDGET (self), r->instrument->label);
  a11y = g_strdup_printf (_("Step %u: %s %s to %s, %s"), r->index,
                          r->instrument->label ? r->instrument->label : r->instrument->id,
                          size, depth, cw_level_label (r->verdict));
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, a11y, -1);
  return GTK_WIDGET (self);
}

guint
cw_step_tile_get_index (CwStepTile *self)
{
  return self->index;
}

void
cw_step_tile_set_selected (CwStepTile *self,
                           gboolean    selected)
{
  if (selected)
    gtk_widget_add_css_class (GTK_WIDGET (self), "selected");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self), "selected");
  gtk_accessible_update_state (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_STATE_SELECTED, selected, -1);
}

static void
cw_step_tile_dispose (GObject *object)
{
  CwStepTile *self = CW_STEP_TILE (object);

  g_clear_pointer (&self->box, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_step_tile_parent_class)->dispose (object);
}

static void
cw_step_tile_class_init (CwStepTileClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_step_tile_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "steptile");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_BUTTON);
}

static void
cw_step_tile_init (CwStepTile *self)
{
  self->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
  gtk_widget_set_parent (self->box, GTK_WIDGET (self));
  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  gtk_widget_set_focus_on_click (GTK_WIDGET (self), TRUE);
}
