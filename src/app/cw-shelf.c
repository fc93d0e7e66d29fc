/* cw-shelf.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-shelf"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-iso.h"
#include "cw-render-text.h"
#include "cw-shelf.h"
#include "cw-swatch.h"

struct _CwShelf
{
  GtkWidget    parent_instance;

  CwDocument  *document;
  CwLibraries *libraries;
  GtkWidget   *box;
  GtkListBox  *list;
  GtkDropDown *taper_filter;
  GtkDropDown *motion_filter;
};

G_DEFINE_FINAL_TYPE (CwShelf, cw_shelf, GTK_TYPE_WIDGET)

const char *
cw_alloy_label (CwAlloy alloy)
{
  switch (alloy)
    {
    case CW_ALLOY_NITI: return _("NiTi");
    case CW_ALLOY_NITI_HEAT_TREATED: return _("heat-treated NiTi");
    case CW_ALLOY_STAINLESS:
    default: return _("stainless steel");
    }
}

const char *
cw_motion_label (CwMotion motion)
{
  switch (motion)
    {
    case CW_MOTION_ROTARY: return _("rotary");
    case CW_MOTION_RECIPROCATING: return _("reciprocating");
    case CW_MOTION_HAND:
    default: return _("hand");
    }
}

/* "25/.04 · NiTi · rotary · 25 mm", with "var." for taper segments. */
char *
cw_instrument_describe (const CwInstrument *inst)
{
  g_autofree char *taper = NULL;

  if (inst->segments)
    taper = g_strdup_printf (_("%.0f/var. %.2f"), inst->tip, cw_instrument_nominal_taper (inst));
  else
    taper = g_strdup_printf ("%.0f/%.2f", inst->tip, inst->taper);
  return g_strdup_printf (_("%s · %s · %s · %.0f mm"), taper, cw_alloy_label (inst->alloy),
                          cw_motion_label (inst->motion), inst->length);
}

static gboolean
passes_filter (CwShelf            *self,
               const CwInstrument *inst)
{
  static const double tapers[] = { 0, 0.02, 0.04, 0.06 };
  guint t = gtk_drop_down_get_selected (self->taper_filter);
  guint m = gtk_drop_down_get_selected (self->motion_filter);
  double taper = cw_instrument_nominal_taper (inst);

  if (m > 0 && m != GTK_INVALID_LIST_POSITION && inst->motion != (CwMotion) (m - 1))
    return FALSE;
  if (t == 0 || t == GTK_INVALID_LIST_POSITION)
    return TRUE;
  if (t < G_N_ELEMENTS (tapers))
    return fabs (taper - tapers[t]) < 1e-6;
  for (guint i = 1; i < G_N_ELEMENTS (tapers); i++)
    if (fabs (taper - tapers[i]) < 1e-6)
      return FALSE;
  return TRUE;
}

static GdkContentProvider *
drag_prepare (GtkDragSource *source,
              double         x,
              double         y,
              GtkWidget     *row)
{
  g_autofree char *data = g_strdup_printf ("instrument:%s", (const char *) g_object_get_data (G_OBJECT (row), "id"));

  return gdk_content_provider_new_typed (G_TYPE_STRING, data);
}

static void
drag_begin (GtkDragSource *source,
            GdkDrag       *drag,
            GtkWidget     *row)
{
  g_autoptr(GdkPaintable) icon = gtk_widget_paintable_new (row);

  gtk_drag_source_set_icon (source, icon, 0, 0);
}

/* The case keeps its own copy; this says when the library's has changed
 * since, or never matched. */
static gboolean
differs_from_library (CwShelf            *self,
                      const CwInstrument *inst)
{
  const CwInstrument *kept;

  if (self->libraries == NULL)
    return FALSE;
  kept = cw_library_lookup (cw_libraries_get_current (self->libraries), inst->id);
  return kept != NULL && !cw_instrument_equal (kept, inst);
}

static GtkWidget *
difference_mark (void)
{
  GtkWidget *mark = gtk_image_new_from_icon_name ("document-edit-symbolic");

  gtk_widget_set_name (mark, "differs");
  gtk_widget_set_valign (mark, GTK_ALIGN_CENTER);
  gtk_widget_add_css_class (mark, "warning");
  gtk_widget_set_tooltip_text (mark, _("Differs from the library"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (mark), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Differs from the library"), -1);
  return mark;
}

static GtkWidget *
make_row (CwShelf            *self,
          const CwInstrument *inst)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
  GtkWidget *text = gtk_box_new (GTK_ORIENTATION_VERTICAL, 0);
  GtkWidget *title = gtk_label_new (inst->label ? inst->label : inst->id);
  g_autofree char *detail = cw_instrument_describe (inst);
  GtkWidget *sub = gtk_label_new (detail);
  GtkDragSource *source = gtk_drag_source_new ();
  gboolean differs = differs_from_library (self, inst);
  g_autofree char *a11y = g_strdup_printf (differs ? _("%s, %s, differs from the library") : "%s, %s",
                                           inst->label ? inst->label : inst->id, detail);

  gtk_label_set_xalign (GTK_LABEL (title), 0);
  gtk_label_set_ellipsize (GTK_LABEL (title), PANGO_ELLIPSIZE_END);
  gtk_label_set_xalign (GTK_LABEL (sub), 0);
  gtk_label_set_ellipsize (GTK_LABEL (sub), PANGO_ELLIPSIZE_END);
  gtk_widget_add_css_class (sub, "dim-label");
  gtk_widget_add_css_class (sub, "caption");
  gtk_box_append (GTK_BOX (text), title);
  gtk_box_append (GTK_BOX (text), sub);
  gtk_box_append (GTK_BOX (box), cw_swatch_new (inst->tip));
  gtk_box_append (GTK_BOX (box), text);
  gtk_widget_set_hexpand (text, TRUE);
  if (differs)
    gtk_box_append (GTK_BOX (box), difference_mark ());
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
  g_object_set_data_full (G_OBJECT (row), "id", g_strdup (inst->id), g_free);
  gtk_widget_set_tooltip_text (row, detail);
  gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, a11y, -1);
  gtk_widget_set_name (row, inst->id);

  gtk_drag_source_set_actions (source, GDK_ACTION_COPY);
  g_signal_connect (source, "prepare", G_CALLBACK (drag_prepare), row);
  g_signal_connect (source, "drag-begin", G_CALLBACK (drag_begin), row);
  gtk_widget_add_controller (row, GTK_EVENT_CONTROLLER (source));
  return row;
}

static void
rebuild (CwShelf *self)
{
  const CwCase *kase;
  const char *selected;
  GtkWidget *child;

  if (self->document == NULL)
    return;
  kase = cw_document_get_case (self->document);
  selected = cw_document_get_instrument (self->document);
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->list))))
    gtk_list_box_remove (self->list, child);
  for (guint i = 0; i < kase->instruments->len; i++)
    {
      const CwInstrument *inst = g_ptr_array_index (kase->instruments, i);
      GtkWidget *row;

      if (!passes_filter (self, inst))
        continue;
      row = make_row (self, inst);
      gtk_list_box_append (self->list, row);
      if (g_strcmp0 (selected, inst->id) == 0)
        gtk_list_box_select_row (self->list, GTK_LIST_BOX_ROW (row));
    }
}

static void
row_selected (GtkListBox    *list,
              GtkListBoxRow *row,
              CwShelf       *self)
{
  if (row && self->document)
    cw_document_set_instrument (self->document, g_object_get_data (G_OBJECT (row), "id"));
}

static void
row_activated (GtkListBox    *list,
               GtkListBoxRow *row,
               CwShelf       *self)
{
  const char *id = g_object_get_data (G_OBJECT (row), "id");

  gtk_widget_activate_action (GTK_WIDGET (self), "win.add-step", "s", id);
}

void
cw_shelf_set_document (CwShelf    *self,
                       CwDocument *document)
{
  g_return_if_fail (CW_IS_SHELF (self));

  g_set_object (&self->document, document);
  g_signal_connect_object (document, "changed", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  rebuild (self);
}

void
cw_shelf_set_libraries (CwShelf     *self,
                        CwLibraries *libraries)
{
  g_return_if_fail (CW_IS_SHELF (self));
  g_return_if_fail (libraries == NULL || CW_IS_LIBRARIES (libraries));

  if (self->libraries)
    g_signal_handlers_disconnect_by_func (self->libraries, rebuild, self);
  g_set_object (&self->libraries, libraries);
  if (libraries)
    g_signal_connect_object (libraries, "changed", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  rebuild (self);
}

void
cw_shelf_grab_focus (CwShelf *self)
{
  GtkListBoxRow *row = gtk_list_box_get_selected_row (self->list);

  if (row == NULL)
    row = gtk_list_box_get_row_at_index (self->list, 0);
  if (row)
    gtk_widget_grab_focus (GTK_WIDGET (row));
}

static void
cw_shelf_dispose (GObject *object)
{
  CwShelf *self = CW_SHELF (object);

  g_clear_object (&self->document);
  g_clear_object (&self->libraries);
  gtk_widget_dispose_template (GTK_WIDGET (self), CW_TYPE_SHELF);
  G_OBJECT_CLASS (cw_shelf_parent_class)->dispose (object);
}

static void
cw_shelf_class_init (CwShelfClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_shelf_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "shelf");
  gtk_widget_class_set_template_from_resource (widget_class, "/org/canalwright/Canalwright/cw-shelf.ui");
  gtk_widget_class_bind_template_child (widget_class, CwShelf, box);
  gtk_widget_class_bind_template_child (widget_class, CwShelf, list);
  gtk_widget_class_bind_template_child (widget_class, CwShelf, taper_filter);
  gtk_widget_class_bind_template_child (widget_class, CwShelf, motion_filter);
}

static GtkWidget *
empty_placeholder (void)
{
  GtkWidget *label = gtk_label_new (_("No instruments in this case yet: add them from the library."));

  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_widget_set_margin_top (label, 12);
  gtk_widget_set_margin_start (label, 6);
  gtk_widget_set_margin_end (label, 6);
  gtk_widget_add_css_class (label, "dim-label");
  return label;
}

static void
cw_shelf_init (CwShelf *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  gtk_list_box_set_placeholder (self->list, empty_placeholder ());
  g_signal_connect (self->list, "row-selected", G_CALLBACK (row_selected), self);
  g_signal_connect (self->list, "row-activated", G_CALLBACK (row_activated), self);
  g_signal_connect_swapped (self->taper_filter, "notify::selected", G_CALLBACK (rebuild), self);
  g_signal_connect_swapped (self->motion_filter, "notify::selected", G_CALLBACK (rebuild), self);
}
