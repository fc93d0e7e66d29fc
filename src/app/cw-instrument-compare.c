/* cw-instrument-compare.c
 *
 * The picture and the table are the renderer's (cw_compare_drawing_draw); the
 * window only picks what to compare.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-instrument-compare"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-compare-drawing.h"
#include "cw-instrument-compare.h"
#include "cw-plan-text.h"

struct _CwInstrumentCompare
{
  GtkWindow         parent_instance;

  CwDocument       *document;
  CwCompareDrawing *comparison;
  GtkBox           *picks;        /* one check button an instrument */
  GtkSpinButton    *depth;
  GtkCheckButton   *natural;
  GtkCheckButton   *after;
  GtkWidget        *area;
  gboolean          updating;
};

G_DEFINE_FINAL_TYPE (CwInstrumentCompare, cw_instrument_compare, GTK_TYPE_WINDOW)

static const char *
button_id (GtkWidget *button)
{
  return g_object_get_data (G_OBJECT (button), "instrument-id");
}

static GPtrArray *
picked (CwInstrumentCompare *self)
{
  GPtrArray *ids = g_ptr_array_new ();

  for (GtkWidget *b = gtk_widget_get_first_child (GTK_WIDGET (self->picks)); b; b = gtk_widget_get_next_sibling (b))
    if (gtk_check_button_get_active (GTK_CHECK_BUTTON (b)))
      g_ptr_array_add (ids, (gpointer) button_id (b));
  return ids;
}

/* Three picked: the others wait until one is let go. */
static void
limit_picks (CwInstrumentCompare *self,
             guint                n)
{
  for (GtkWidget *b = gtk_widget_get_first_child (GTK_WIDGET (self->picks)); b; b = gtk_widget_get_next_sibling (b))
    gtk_widget_set_sensitive (b, n < CW_COMPARE_MAX || gtk_check_button_get_active (GTK_CHECK_BUTTON (b)));
}

static void
recompute (CwInstrumentCompare *self)
{
  g_autoptr(GPtrArray) ids = NULL;
  const CwCanal *canal;
  gboolean after;
  int step;

  if (self->updating || self->document == NULL || (canal = cw_document_get_canal (self->document)) == NULL)
    return;
  step = cw_document_get_step_index (self->document);
  after = gtk_check_button_get_active (self->after) && step >= 0;
  ids = picked (self);
  limit_picks (self, ids->len);
  g_clear_pointer (&self->comparison, cw_compare_drawing_free);
  self->comparison = cw_compare_drawing_new (cw_document_get_case (self->document), canal, after ? step : -1,
                                        (const char * const *) ids->pdata, ids->len,
                                        gtk_spin_button_get_value (self->depth));
  gtk_widget_queue_draw (self->area);
}

static void
draw (GtkDrawingArea *area,
      cairo_t        *cr,
      int             width,
      int             height,
      gpointer        data)
{
  CwInstrumentCompare *self = data;
  cairo_rectangle_t box = { 0, 0, width, height };
  CwRenderStyle style;

  if (self->comparison == NULL)
    return;
  cw_render_style_init (&style, CW_RENDER_LIGHT, 1.25);
  cw_compare_drawing_draw (self->comparison, cr, &box, &style);
}

static void
fill_picks (CwInstrumentCompare *self)
{
  const CwCase *kase = cw_document_get_case (self->document);
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->picks))))
    gtk_box_remove (self->picks, child);
  for (guint i = 0; i < kase->instruments->len; i++)
    {
      const CwInstrument *inst = g_ptr_array_index (kase->instruments, i);
      g_autofree char *label = cw_plan_file_text (inst);
      GtkWidget *button = gtk_check_button_new_with_label (label);

      g_object_set_data_full (G_OBJECT (button), "instrument-id", g_strdup (inst->id), g_free);
      g_signal_connect_swapped (button, "toggled", G_CALLBACK (recompute), self);
      gtk_box_append (self->picks, button);
    }
}

void
cw_instrument_compare_set_ids (CwInstrumentCompare *self,
                               const char * const  *ids)
{
  guint n = 0;

  g_return_if_fail (CW_IS_INSTRUMENT_COMPARE (self));

  self->updating = TRUE;
  for (GtkWidget *b = gtk_widget_get_first_child (GTK_WIDGET (self->picks)); b; b = gtk_widget_get_next_sibling (b))
    {
      gboolean pick = ids && n < CW_COMPARE_MAX && g_strv_contains (ids, button_id (b));

      gtk_check_button_set_active (GTK_CHECK_BUTTON (b), pick);
      n += pick;
    }
  self->updating = FALSE;
  recompute (self);
}

GStrv
cw_instrument_compare_dup_ids (CwInstrumentCompare *self)
{
  g_autoptr(GPtrArray) ids = picked (self);
  GStrvBuilder *builder = g_strv_builder_new ();
  GStrv strv;

  for (guint i = 0; i < ids->len; i++)
    g_strv_builder_add (builder, g_ptr_array_index (ids, i));
  strv = g_strv_builder_end (builder);
  g_strv_builder_unref (builder);
  return strv;
}

void
cw_instrument_compare_set_depth (CwInstrumentCompare *self,
                                 double               depth)
{
  g_return_if_fail (CW_IS_INSTRUMENT_COMPARE (self));
  gtk_spin_button_set_value (self->depth, depth);
}

void
cw_instrument_compare_set_after_step (CwInstrumentCompare *self,
                                      gboolean             after)
{
  g_return_if_fail (CW_IS_INSTRUMENT_COMPARE (self));
  gtk_check_button_set_active (after ? self->after : self->natural, TRUE);
}

/* The selected step's instrument, then the next different ones. */
static void
preselect (CwInstrumentCompare *self)
{
  const CwCanal *canal = cw_document_get_canal (self->document);
  int step = MAX (cw_document_get_step_index (self->document), 0);
  g_autoptr(GPtrArray) ids = g_ptr_array_new ();

  for (guint i = (guint) step; canal && i < canal->sequence->len && ids->len < 2; i++)
    {
      const char *id = cw_canal_get_step (canal, i)->instrument_id;

      if (!g_ptr_array_find_with_equal_func (ids, id, g_str_equal, NULL))
        g_ptr_array_add (ids, (gpointer) id);
    }
  g_ptr_array_add (ids, NULL);
  if (canal && step < (int) canal->sequence->len)
    gtk_spin_button_set_value (self->depth, cw_canal_get_step (canal, (guint) step)->depth);
  else if (canal)
    gtk_spin_button_set_value (self->depth, canal->working_length);
  cw_instrument_compare_set_ids (self, (const char * const *) ids->pdata);
}

static void
update_basis_label (CwInstrumentCompare *self)
{
  int step = cw_document_get_step_index (self->document);
  g_autofree char *text = step >= 0 ? g_strdup_printf (_("After the selected step (%d)"), step + 1)
                                    : g_strdup (_("After the selected step (none selected)"));

  gtk_check_button_set_label (self->after, text);
  gtk_widget_set_sensitive (GTK_WIDGET (self->after), step >= 0);
  recompute (self);
}

static void
document_changed (CwInstrumentCompare *self)
{
  g_auto(GStrv) ids = cw_instrument_compare_dup_ids (self);

  fill_picks (self);
  cw_instrument_compare_set_ids (self, (const char * const *) ids);
}

static GtkWidget *
controls (CwInstrumentCompare *self)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 8);
  GtkWidget *scroll = gtk_scrolled_window_new ();
  GtkWidget *heading = gtk_label_new (_("Pick two or three instruments"));
  GtkWidget *depth_label = gtk_label_new_with_mnemonic (_("Tip _depth (mm)"));
  GtkWidget *basis = gtk_label_new (_("Each one evaluated as a step:"));

  gtk_widget_set_size_request (box, 260, -1);
  gtk_widget_set_margin_start (box, 12);
  gtk_widget_set_margin_top (box, 12);
  gtk_widget_set_margin_bottom (box, 12);
  gtk_label_set_xalign (GTK_LABEL (heading), 0);
  gtk_widget_add_css_class (heading, "heading");
  gtk_box_append (GTK_BOX (box), heading);
  self->picks = GTK_BOX (gtk_box_new (GTK_ORIENTATION_VERTICAL, 2));
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroll), GTK_WIDGET (self->picks));
  gtk_widget_set_vexpand (scroll, TRUE);
  gtk_box_append (GTK_BOX (box), scroll);
  gtk_label_set_xalign (GTK_LABEL (depth_label), 0);
  gtk_box_append (GTK_BOX (box), depth_label);
  self->depth = GTK_SPIN_BUTTON (gtk_spin_button_new_with_range (0, 40, 0.5));
  gtk_spin_button_set_digits (self->depth, 1);
  gtk_label_set_mnemonic_widget (GTK_LABEL (depth_label), GTK_WIDGET (self->depth));
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->depth));
  gtk_label_set_xalign (GTK_LABEL (basis), 0);
  gtk_box_append (GTK_BOX (box), basis);
  self->natural = GTK_CHECK_BUTTON (gtk_check_button_new_with_label (_("From the natural canal")));
  self->after = GTK_CHECK_BUTTON (gtk_check_button_new_with_label (""));
  gtk_check_button_set_group (self->after, self->natural);
  gtk_check_button_set_active (self->natural, TRUE);
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->natural));
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->after));
  return box;
}

CwInstrumentCompare *
cw_instrument_compare_new (GtkWindow  *parent,
                           CwDocument *document)
{
  CwInstrumentCompare *self;

  g_return_val_if_fail (CW_IS_DOCUMENT (document), NULL);

  self = g_object_new (CW_TYPE_INSTRUMENT_COMPARE, "transient-for", parent, "destroy-with-parent", TRUE, NULL);
  self->document = g_object_ref (document);
  fill_picks (self);
  preselect (self);
  update_basis_label (self);
  g_signal_connect_object (document, "changed", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (document_changed), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::step-index", G_CALLBACK (update_basis_label), self,
                           G_CONNECT_SWAPPED);
  return self;
}

static void
cw_instrument_compare_dispose (GObject *object)
{
  CwInstrumentCompare *self = CW_INSTRUMENT_COMPARE (object);

  g_clear_pointer (&self->comparison, cw_compare_drawing_free);
  g_clear_object (&self->document);
  G_OBJECT_CLASS (cw_instrument_compare_parent_class)->dispose (object);
}

static gboolean
close_window (GtkWidget *widget,
              GVariant  *args,
              gpointer   data)
{
  gtk_window_close (GTK_WINDOW (widget));
  return TRUE;
}

static void
cw_instrument_compare_class_init (CwInstrumentCompareClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_instrument_compare_dispose;
  gtk_widget_class_add_binding (widget_class, GDK_KEY_Escape, 0, close_window, NULL);
}

static void
cw_instrument_compare_init (CwInstrumentCompare *self)
{
  GtkWidget *paned = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 12);

  self->updating = TRUE;
  gtk_box_append (GTK_BOX (paned), controls (self));
  self->area = gtk_drawing_area_new ();
  gtk_widget_set_hexpand (self->area, TRUE);
  gtk_widget_set_vexpand (self->area, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->area), draw, self, NULL);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->area), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("The instruments side by side in the canal, with their figures"), -1);
  gtk_box_append (GTK_BOX (paned), self->area);
  gtk_window_set_child (GTK_WINDOW (self), paned);
  gtk_window_set_title (GTK_WINDOW (self), _("Compare Instruments"));
  gtk_window_set_default_size (GTK_WINDOW (self), 1180, 780);
  g_signal_connect_swapped (self->depth, "value-changed", G_CALLBACK (recompute), self);
  g_signal_connect_swapped (self->after, "toggled", G_CALLBACK (recompute), self);
  self->updating = FALSE;
}
