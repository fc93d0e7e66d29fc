/* cw-inspector.c
 *
 * Numbers follow the user's locale here; the JSON report keeps the C locale.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-inspector"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-inspector.h"
#include "cw-shelf.h"
#include "cw-step-tile.h"

struct _CwInspector
{
  GtkWidget   parent_instance;

  CwDocument *document;
  GtkWidget  *scroller;
  GtkWidget  *content;
};

G_DEFINE_FINAL_TYPE (CwInspector, cw_inspector, GTK_TYPE_WIDGET)

static char *
value_text (double      value,
            int         decimals,
            const char *unit)
{
  if (!isfinite (value))
    return g_strdup (C_("figure", "—"));
  return g_strdup_printf ("%.*f %s", decimals, value, unit);
}

static void
add_row (GtkGrid    *grid,
         int         row,
         const char *name,
         char       *value)
{
  GtkWidget *n = gtk_label_new (name);
  GtkWidget *v = gtk_label_new (value);

  gtk_label_set_xalign (GTK_LABEL (n), 0);
  gtk_label_set_wrap (GTK_LABEL (n), TRUE);
  gtk_label_set_xalign (GTK_LABEL (v), 1);
  gtk_label_set_selectable (GTK_LABEL (v), TRUE);
  gtk_widget_add_css_class (n, "dim-label");
  gtk_widget_add_css_class (v, "numeric");
  gtk_widget_set_hexpand (n, TRUE);
  gtk_grid_attach (grid, n, 0, row, 1, 1);
  gtk_grid_attach (grid, v, 1, row, 1, 1);
  g_free (value);
}

static GtkWidget *
heading (const char *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_widget_add_css_class (label, "heading");
  return label;
}

static GtkWidget *
finding_row (const CwFinding *f)
{
  GtkWidget *row = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkWidget *icon = gtk_image_new_from_icon_name (cw_level_icon_name (f->level));
  g_autofree char *text = cw_finding_describe (f, FALSE);
  g_autofree char *full = g_strdup_printf ("%s: %s", cw_level_label (f->level), text);
  GtkWidget *label = gtk_label_new (full);

  gtk_widget_set_valign (icon, GTK_ALIGN_START);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_selectable (GTK_LABEL (label), TRUE);
  gtk_widget_set_hexpand (label, TRUE);
  gtk_box_append (GTK_BOX (row), icon);
  gtk_box_append (GTK_BOX (row), label);
  gtk_widget_add_css_class (row, f->level == CW_LEVEL_STOP ? "verdict-stop" : "verdict-caution");
  return row;
}

static void
add_findings (GtkBox    *box,
              GPtrArray *findings,
              const char *none)
{
  if (findings->len == 0)
    {
      GtkWidget *ok = gtk_label_new (none);

      gtk_label_set_xalign (GTK_LABEL (ok), 0);
      gtk_label_set_wrap (GTK_LABEL (ok), TRUE);
      gtk_box_append (box, ok);
    }
  for (guint i = 0; i < findings->len; i++)
    gtk_box_append (box, finding_row (g_ptr_array_index (findings, i)));
}

static GtkWidget *
step_figures (const CwStepResult *r)
{
  GtkGrid *grid = GTK_GRID (gtk_grid_new ());
  int row = 0;

  gtk_grid_set_column_spacing (grid, 12);
  gtk_grid_set_row_spacing (grid, 2);
  add_row (grid, row++, _("Depth"), value_text (r->depth, 2, _("mm")));
  add_row (grid, row++, _("Engaged length"), value_text (r->engaged_length, 2, _("mm")));
  add_row (grid, row++, _("… in the curve"), value_text (r->engaged_in_curve, 2, _("mm")));
  add_row (grid, row++, _("… in the straight part"), value_text (r->engaged_in_straight, 2, _("mm")));
  add_row (grid, row++, _("Largest diameter in the curve"), value_text (r->max_diameter_in_curve, 3, _("mm")));
  add_row (grid, row++, _("Ceiling for its taper"), value_text (r->ceiling, 3, _("mm")));
  add_row (grid, row++, _("Deepest tip under the ceiling"), value_text (r->ceiling_depth, 2, _("mm")));
  add_row (grid, row++, _("Straight-part clearance"), value_text (r->straight_clearance, 3, _("mm")));
  add_row (grid, row++, _("Bending strain"), value_text (r->strain * 100, 2, "%"));
  add_row (grid, row++, _("Cycles in the curve"), value_text (r->cycles_in_curve, 0, ""));
  add_row (grid, row++, _("Fatigue use"), value_text (r->fatigue_use * 100, 2, "%"));
  add_row (grid, row++, _("Fracture torque at D3"), value_text (r->fracture_torque_d3, 2, _("N·cm")));
  add_row (grid, row++, _("Contact area"), value_text (r->contact_area, 1, _("mm²")));
  add_row (grid, row++, _("Cut volume"), value_text (r->cut_volume, 2, _("mm³")));
  add_row (grid, row++, _("First contact"), value_text (r->first_contact, 2, _("mm")));
  add_row (grid, row++, _("Time"), value_text (r->time, 0, _("s")));
  add_row (grid, row++, _("Pecks"), g_strdup_printf ("%u", r->pecks));
  return GTK_WIDGET (grid);
}

static GtkWidget *
canal_totals (const CwCase        *kase,
              const CwCanalResult *result)
{
  GtkGrid *grid = GTK_GRID (gtk_grid_new ());
  g_autofree char *size = isfinite (result->apical_size) ? g_strdup_printf ("%.0f", result->apical_size)
                                                         : g_strdup (C_("figure", "—"));

  gtk_grid_set_column_spacing (grid, 12);
  add_row (grid, 0, _("Apical size / target"), g_strdup_printf ("%s / %.0f", size, kase->target_apical_size));
  add_row (grid, 1, _("Apical taper / target"),
           g_strdup_printf ("%.3f / %.3f", result->apical_taper, kase->target_apical_taper));
  add_row (grid, 2, _("Diameter at the curve onset"), value_text (result->onset_diameter, 3, _("mm")));
  add_row (grid, 3, _("Total time"), g_strdup_printf (_("%.0f min %02.0f s"), floor (result->time / 60),
                                                      fmod (result->time, 60)));
  return GTK_WIDGET (grid);
}

/* One sentence for the canal view's accessible description. */
char *
cw_step_summary (const CwStepResult *r)
{
  g_autofree char *curve = value_text (r->engaged_in_curve, 1, _("mm"));
  g_autofree char *dmax = value_text (r->max_diameter_in_curve, 2, _("mm"));
  g_autofree char *ceiling = value_text (r->ceiling, 2, _("mm"));

  return g_strdup_printf (_("Step %u, %s at %.1f mm: %s. Engaged in the curve %s; largest diameter in the curve %s against a ceiling of %s."),
                          r->index, r->instrument->label ? r->instrument->label : r->instrument->id,
                          r->depth, cw_level_label (r->verdict), curve, dmax, ceiling);
}

static void
rebuild (CwInspector *self)
{
  const CwCanalResult *result = cw_document_get_result (self->document);
  int step = cw_document_get_step_index (self->document);
  GtkBox *box = GTK_BOX (gtk_box_new (GTK_ORIENTATION_VERTICAL, 8));

  if (result && step >= 0 && step < (int) result->steps->len)
    {
      const CwStepResult *r = cw_canal_result_get_step (result, step);
      g_autofree char *title = g_strdup_printf (_("Step %u: %s"), r->index,
                                                r->instrument->label ? r->instrument->label : r->instrument->id);
      g_autofree char *detail = cw_instrument_describe (r->instrument);
      GtkWidget *sub = gtk_label_new (detail);

      gtk_box_append (box, heading (title));
      gtk_label_set_xalign (GTK_LABEL (sub), 0);
      gtk_widget_add_css_class (sub, "dim-label");
      gtk_box_append (box, sub);
      add_findings (box, r->findings, _("No rule is broken at this depth."));
      gtk_box_append (box, step_figures (r));
    }
  else
    gtk_box_append (box, heading (_("Select a step to see its checks")));
  if (result)
    {
      g_autofree char *canal = g_strdup_printf (_("Canal %s"), result->canal->name);

      gtk_box_append (box, gtk_separator_new (GTK_ORIENTATION_HORIZONTAL));
      gtk_box_append (box, heading (canal));
      add_findings (box, result->findings, _("The final shape meets the targets."));
      gtk_box_append (box, canal_totals (cw_document_get_case (self->document), result));
    }
  gtk_widget_set_margin_start (GTK_WIDGET (box), 12);
  gtk_widget_set_margin_end (GTK_WIDGET (box), 12);
  gtk_widget_set_margin_bottom (GTK_WIDGET (box), 12);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (self->scroller), GTK_WIDGET (box));
}

void
cw_inspector_set_document (CwInspector *self,
                           CwDocument  *document)
{
  g_return_if_fail (CW_IS_INSPECTOR (self));

  g_set_object (&self->document, document);
  g_signal_connect_object (document, "changed", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::step-index", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (rebuild), self, G_CONNECT_SWAPPED);
  rebuild (self);
}

static void
cw_inspector_dispose (GObject *object)
{
  CwInspector *self = CW_INSPECTOR (object);

  g_clear_object (&self->document);
  g_clear_pointer (&self->scroller, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_inspector_parent_class)->dispose (object);
}

static void
cw_inspector_class_init (CwInspectorClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_inspector_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "inspector");
}

static void
cw_inspector_init (CwInspector *self)
{
  self->scroller = gtk_scrolled_window_new ();
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (self->scroller), GTK_POLICY_NEVER, GTK_POLICY_AUTOMATIC);
  gtk_widget_set_parent (self->scroller, GTK_WIDGET (self));
}
