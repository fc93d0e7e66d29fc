/* cw-sequence-summary.c
 *
 * Holds its own copy of the case and the canal, so that a proposal or a
 * variant can be shown without touching the document.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-summary"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-canal-layout.h"
#include "cw-canal-renderer.h"
#include "cw-plan-text.h"
#include "cw-sequence-summary.h"
#include "cw-step-tile.h"

struct _CwSequenceSummary
{
  GtkWidget      parent_instance;

  CwCase        *kase;
  CwCanal       *canal;
  CwCanalResult *result;

  GtkWidget     *box;
  GtkLabel      *title;
  GtkWidget     *drawing;
  GtkGrid       *table;
  GtkLabel      *totals;
};

G_DEFINE_FINAL_TYPE (CwSequenceSummary, cw_sequence_summary, GTK_TYPE_WIDGET)

void
cw_sequence_totals (const CwCanalResult *result,
                    CwSequenceTotals    *totals)
{
  *totals = (CwSequenceTotals) { result->time, 0, 0, result->apical_size, result->apical_taper,
                                 result->steps->len };
  for (guint i = 0; i < result->steps->len; i++)
    {
      const CwStepResult *r = cw_canal_result_get_step (result, i);

      totals->stops += r->verdict == CW_LEVEL_STOP;
      for (guint k = 0; k < r->findings->len; k++)
        totals->cautions += ((CwFinding *) g_ptr_array_index (r->findings, k))->level == CW_LEVEL_CAUTION;
    }
}

static void
draw_canal (GtkDrawingArea *area,
            cairo_t        *cr,
            int             width,
            int             height,
            gpointer        data)
{
  CwSequenceSummary *self = data;
  cairo_rectangle_t rect = { 0, 0, width, height };
  g_autoptr(CwCanalLayout) layout = NULL;
  CwRenderStyle style;

  if (self->result == NULL)
    return;
  cw_render_style_init (&style, CW_RENDER_LIGHT, 1.0);
  cw_render_set_rgb (cr, &cw_render_style_palette (&style)->background);
  cairo_paint (cr);
  layout = cw_canal_layout_new (self->canal, self->result, &style, &rect, CW_CANAL_LAYOUT_FULL);
  cw_canal_draw (cr, layout, self->result, CW_RENDER_NO_STEP);
}

static GtkWidget *
cell (const char *text,
      gboolean    numeric)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), numeric ? 1 : 0);
  if (numeric)
    gtk_widget_add_css_class (label, "numeric");
  return label;
}

static void
fill_row (GtkGrid            *grid,
          int                 row,
          const CwStepResult *r)
{
  g_autofree char *n = g_strdup_printf ("%u", r->index);
  g_autofree char *file = cw_plan_file_text (r->instrument);
  g_autofree char *depth = g_strdup_printf ("%.1f", r->depth);
  g_autofree char *curve = g_strdup_printf ("%.2f", r->engaged_in_curve);
  g_autofree char *time = g_strdup_printf ("%.0f", r->time);
  GtkWidget *verdict = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 4);

  gtk_box_append (GTK_BOX (verdict), gtk_image_new_from_icon_name (cw_level_icon_name (r->verdict)));
  gtk_box_append (GTK_BOX (verdict), gtk_label_new (cw_level_label (r->verdict)));
  gtk_grid_attach (grid, cell (n, TRUE), 0, row, 1, 1);
  gtk_grid_attach (grid, cell (file, FALSE), 1, row, 1, 1);
  gtk_grid_attach (grid, cell (depth, TRUE), 2, row, 1, 1);
  gtk_grid_attach (grid, cell (curve, TRUE), 3, row, 1, 1);
  gtk_grid_attach (grid, cell (time, TRUE), 4, row, 1, 1);
  gtk_grid_attach (grid, verdict, 5, row, 1, 1);
}

static void
rebuild_table (CwSequenceSummary *self)
{
  static const char *heads[] = { N_("#"), N_("File"), N_("Depth mm"), N_("In curve mm"), N_("Time s"), N_("Verdict") };
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->table))))
    gtk_grid_remove (self->table, child);
  for (guint c = 0; c < G_N_ELEMENTS (heads); c++)
    {
      GtkWidget *head = cell (_(heads[c]), c != 1 && c != 5);

      gtk_widget_add_css_class (head, "dim-label");
      gtk_grid_attach (self->table, head, (int) c, 0, 1, 1);
    }
  for (guint i = 0; i < self->result->steps->len; i++)
    fill_row (self->table, (int) i + 1, cw_canal_result_get_step (self->result, i));
}

static void
update_totals (CwSequenceSummary *self)
{
  CwSequenceTotals t;
  g_autofree char *duration = NULL;
  g_autofree char *text = NULL;
  g_autofree char *size = NULL;

  cw_sequence_totals (self->result, &t);
  duration = cw_plan_duration (t.time);
  size = isfinite (t.apical_size) ? g_strdup_printf ("%.0f", t.apical_size) : g_strdup (C_("figure", "—"));
  text = g_strdup_printf (_("%u steps · %s · %u cautions · %u stops · final size %s, taper %.3f"),
                          t.steps, duration, t.cautions, t.stops, size, t.apical_taper);
  gtk_label_set_label (self->totals, text);
}

void
cw_sequence_summary_set (CwSequenceSummary *self,
                         const CwCase      *kase,
                         const CwCanal     *canal,
                         const char        *title)
{
  g_return_if_fail (CW_IS_SEQUENCE_SUMMARY (self));

  g_clear_pointer (&self->result, cw_canal_result_free);
  g_clear_pointer (&self->kase, cw_case_free);
  self->kase = cw_case_copy (kase);
  self->canal = cw_canal_copy (canal);
  cw_case_add_canal (self->kase, self->canal);
  self->result = cw_evaluate_canal (self->kase, self->canal);
  gtk_label_set_label (self->title, title);
  rebuild_table (self);
  update_totals (self);
  gtk_widget_queue_draw (self->drawing);
}

const CwCanalResult *
cw_sequence_summary_get_result (CwSequenceSummary *self)
{
  return self->result;
}

GtkWidget *
cw_sequence_summary_new (void)
{
  return g_object_new (CW_TYPE_SEQUENCE_SUMMARY, NULL);
}

static void
cw_sequence_summary_dispose (GObject *object)
{
  CwSequenceSummary *self = CW_SEQUENCE_SUMMARY (object);

  g_clear_pointer (&self->result, cw_canal_result_free);
  g_clear_pointer (&self->kase, cw_case_free);
  g_clear_pointer (&self->box, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_sequence_summary_parent_class)->dispose (object);
}

static void
cw_sequence_summary_class_init (CwSequenceSummaryClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_sequence_summary_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "sequencesummary");
}

static void
cw_sequence_summary_init (CwSequenceSummary *self)
{
  GtkWidget *scroller = gtk_scrolled_window_new ();

  self->box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  gtk_widget_set_parent (self->box, GTK_WIDGET (self));
  self->title = GTK_LABEL (gtk_label_new (""));
  gtk_widget_add_css_class (GTK_WIDGET (self->title), "heading");
  gtk_label_set_xalign (self->title, 0);
  gtk_label_set_wrap (self->title, TRUE);
  self->drawing = gtk_drawing_area_new ();
  gtk_widget_set_size_request (self->drawing, 260, 320);
  gtk_widget_set_vexpand (self->drawing, TRUE);
  gtk_drawing_area_set_draw_func (GTK_DRAWING_AREA (self->drawing), draw_canal, self, NULL);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->drawing), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("The canal's final shape with this sequence"), -1);
  self->table = GTK_GRID (gtk_grid_new ());
  gtk_grid_set_column_spacing (self->table, 10);
  gtk_grid_set_row_spacing (self->table, 2);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), GTK_WIDGET (self->table));
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (scroller), GTK_POLICY_NEVER, GTK_POLICY_AUTOMATIC);
  gtk_widget_set_size_request (scroller, -1, 180);
  self->totals = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_wrap (self->totals, TRUE);
  gtk_label_set_xalign (self->totals, 0);
  gtk_box_append (GTK_BOX (self->box), GTK_WIDGET (self->title));
  gtk_box_append (GTK_BOX (self->box), self->drawing);
  gtk_box_append (GTK_BOX (self->box), scroller);
  gtk_box_append (GTK_BOX (self->box), GTK_WIDGET (self->totals));
}
