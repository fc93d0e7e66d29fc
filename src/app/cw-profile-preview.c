/* cw-profile-preview.c
 *
 * The renderer's profile plot in a widget.  While a field holds a value
 * that does not check, the last good profile stays, faded, so that the
 * graph does not jump about as the user types.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-profile-preview"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-profile-plot.h"
#include "cw-profile-preview.h"
#include "cw-render-text.h"

struct _CwProfilePreview
{
  GtkWidget     parent_instance;

  CwInstrument *instrument;
  gboolean      stale;
};

G_DEFINE_FINAL_TYPE (CwProfilePreview, cw_profile_preview, GTK_TYPE_WIDGET)

GtkWidget *
cw_profile_preview_new (void)
{
  return g_object_new (CW_TYPE_PROFILE_PREVIEW, NULL);
}

static void
update_description (CwProfilePreview *self)
{
  g_autofree char *text = NULL;
  g_autofree char *d0 = NULL;
  g_autofree char *d3 = NULL;
  g_autofree char *d16 = NULL;

  if (self->instrument == NULL)
    {
      gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                      _("No profile yet"), -1);
      return;
    }
  d0 = cw_render_number (cw_instrument_diameter (self->instrument, 0), 2);
  d3 = cw_render_number (cw_instrument_diameter (self->instrument, 3), 2);
  d16 = cw_render_number (cw_instrument_diameter (self->instrument, 16), 2);
  text = g_strdup_printf (_("Diameter at the tip %s mm, at 3 mm %s mm, at 16 mm %s mm"), d0, d3, d16);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, text, -1);
}

void
cw_profile_preview_set_instrument (CwProfilePreview   *self,
                                   const CwInstrument *instrument)
{
  g_return_if_fail (CW_IS_PROFILE_PREVIEW (self));

  g_clear_pointer (&self->instrument, cw_instrument_free);
  self->instrument = instrument ? cw_instrument_copy (instrument) : NULL;
  self->stale = FALSE;
  update_description (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

const CwInstrument *
cw_profile_preview_get_instrument (CwProfilePreview *self)
{
  g_return_val_if_fail (CW_IS_PROFILE_PREVIEW (self), NULL);
  return self->instrument;
}

void
cw_profile_preview_set_stale (CwProfilePreview *self,
                              gboolean          stale)
{
  g_return_if_fail (CW_IS_PROFILE_PREVIEW (self));

  if (self->stale == stale)
    return;
  self->stale = stale;
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

static gboolean
prefers_dark (GtkWidget *widget)
{
  gboolean dark = FALSE;

  g_object_get (gtk_widget_get_settings (widget), "gtk-application-prefer-dark-theme", &dark, NULL);
  return dark;
}

static void
cw_profile_preview_snapshot (GtkWidget   *widget,
                             GtkSnapshot *snapshot)
{
  CwProfilePreview *self = CW_PROFILE_PREVIEW (widget);
  int width = gtk_widget_get_width (widget), height = gtk_widget_get_height (widget);
  cairo_rectangle_t area = { 0, 0, width, height };
  graphene_rect_t bounds = GRAPHENE_RECT_INIT (0, 0, width, height);
  CwRenderStyle style;
  cairo_t *cr;

  if (self->instrument == NULL || width < 40 || height < 40)
    return;
  cw_render_style_init (&style, prefers_dark (widget) ? CW_RENDER_DARK : CW_RENDER_LIGHT, 1.3);
  if (self->stale)
    gtk_snapshot_push_opacity (snapshot, 0.35);
  cr = gtk_snapshot_append_cairo (snapshot, &bounds);
  cw_render_set_rgb (cr, &cw_render_style_palette (&style)->background);
  cairo_paint (cr);
  cw_profile_plot_draw (cr, &style, self->instrument, &area);
  cairo_destroy (cr);
  if (self->stale)
    gtk_snapshot_pop (snapshot);
}

static void
cw_profile_preview_measure (GtkWidget      *widget,
                            GtkOrientation  orientation,
                            int             for_size,
                            int            *minimum,
                            int            *natural,
                            int            *minimum_baseline,
                            int            *natural_baseline)
{
  *minimum = orientation == GTK_ORIENTATION_HORIZONTAL ? 320 : 200;
  *natural = orientation == GTK_ORIENTATION_HORIZONTAL ? 480 : 260;
}

static void
cw_profile_preview_finalize (GObject *object)
{
  CwProfilePreview *self = CW_PROFILE_PREVIEW (object);

  g_clear_pointer (&self->instrument, cw_instrument_free);
  G_OBJECT_CLASS (cw_profile_preview_parent_class)->finalize (object);
}

static void
cw_profile_preview_class_init (CwProfilePreviewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->finalize = cw_profile_preview_finalize;
  widget_class->snapshot = cw_profile_preview_snapshot;
  widget_class->measure = cw_profile_preview_measure;
  gtk_widget_class_set_css_name (widget_class, "profilepreview");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_IMG);
}

static void
cw_profile_preview_init (CwProfilePreview *self)
{
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Profile: diameter against the distance from the tip"), -1);
  update_description (self);
}
