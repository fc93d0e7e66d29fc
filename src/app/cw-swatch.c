/* cw-swatch.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-swatch"

#include "cw-iso.h"
#include "cw-swatch.h"

#define SWATCH_SIZE 16

struct _CwSwatch
{
  GtkWidget      parent_instance;
  CwHandleColour colour;
};

G_DEFINE_FINAL_TYPE (CwSwatch, cw_swatch, GTK_TYPE_WIDGET)

GtkWidget *
cw_swatch_new (double size)
{
  CwSwatch *self = g_object_new (CW_TYPE_SWATCH, NULL);

  self->colour = cw_iso_handle_colour (size);
  return GTK_WIDGET (self);
}

/* A disc in the handle colour with a dark ring, so white and yellow show on
 * a light background; a non-standard size gets a ring only. */
static void
cw_swatch_snapshot (GtkWidget   *widget,
                    GtkSnapshot *snapshot)
{
  CwSwatch *self = CW_SWATCH (widget);
  graphene_rect_t bounds = GRAPHENE_RECT_INIT (0, 0, SWATCH_SIZE, SWATCH_SIZE);
  cairo_t *cr = gtk_snapshot_append_cairo (snapshot, &bounds);
  double r, g, b;

  cairo_arc (cr, SWATCH_SIZE / 2.0, SWATCH_SIZE / 2.0, SWATCH_SIZE / 2.0 - 1.5, 0, 2 * G_PI);
  if (self->colour != CW_HANDLE_NONE)
    {
      cw_handle_colour_rgb (self->colour, &r, &g, &b);
      cairo_set_source_rgb (cr, r, g, b);
      cairo_fill_preserve (cr);
    }
  cairo_set_source_rgba (cr, 0.1, 0.1, 0.1, 0.8);
  cairo_set_line_width (cr, 1.2);
  cairo_stroke (cr);
  cairo_destroy (cr);
}

static void
cw_swatch_measure (GtkWidget      *widget,
                   GtkOrientation  orientation,
                   int             for_size,
                   int            *minimum,
                   int            *natural,
                   int            *minimum_baseline,
                   int            *natural_baseline)
{
  *minimum = *natural = SWATCH_SIZE;
}

static void
cw_swatch_class_init (CwSwatchClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  widget_class->snapshot = cw_swatch_snapshot;
  widget_class->measure = cw_swatch_measure;
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_PRESENTATION);
}

static void
cw_swatch_init (CwSwatch *self)
{
  gtk_widget_set_valign (GTK_WIDGET (self), GTK_ALIGN_CENTER);
}
