/* cw-compare-window.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-compare"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-compare-window.h"
#include "cw-plan-text.h"
#include "cw-sequence-summary.h"

struct _CwCompareWindow
{
  GtkWindow          parent_instance;
  CwSequenceSummary *left;
  CwSequenceSummary *right;
  GtkLabel          *difference;
};

G_DEFINE_FINAL_TYPE (CwCompareWindow, cw_compare_window, GTK_TYPE_WINDOW)

/* "The right-hand sequence takes 1 min 10 s less, with 2 fewer cautions." */
char *
cw_compare_window_dup_difference (CwCompareWindow *self)
{
  CwSequenceTotals a, b;
  g_autofree char *duration = NULL;
  double dt;

  cw_sequence_totals (cw_sequence_summary_get_result (self->left), &a);
  cw_sequence_totals (cw_sequence_summary_get_result (self->right), &b);
  dt = b.time - a.time;
  duration = cw_plan_duration (fabs (dt));
  if (fabs (dt) < 0.5)
    return g_strdup_printf (_("Both take the same time; cautions %u against %u, stops %u against %u."),
                            a.cautions, b.cautions, a.stops, b.stops);
  return g_strdup_printf (dt < 0 ? _("The right-hand sequence takes %s less; cautions %u against %u, stops %u against %u.")
                                 : _("The right-hand sequence takes %s more; cautions %u against %u, stops %u against %u."),
                          duration, a.cautions, b.cautions, a.stops, b.stops);
}

GtkWidget *
cw_compare_window_new (GtkWindow     *parent,
                       const CwCase  *kase,
                       const CwCanal *left,
                       const char    *left_title,
                       const CwCanal *right,
                       const char    *right_title)
{
  CwCompareWindow *self = g_object_new (CW_TYPE_COMPARE_WINDOW,
                                        "transient-for", parent,
                                        "title", _("Compare Sequences"),
                                        "default-width", 1000,
                                        "default-height", 720,
                                        NULL);
  g_autofree char *difference = NULL;

  cw_sequence_summary_set (self->left, kase, left, left_title);
  cw_sequence_summary_set (self->right, kase, right, right_title);
  difference = cw_compare_window_dup_difference (self);
  gtk_label_set_label (self->difference, difference);
  return GTK_WIDGET (self);
}

static void
cw_compare_window_class_init (CwCompareWindowClass *klass)
{
  gtk_widget_class_add_binding_action (GTK_WIDGET_CLASS (klass), GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
cw_compare_window_init (CwCompareWindow *self)
{
  GtkWidget *outer = gtk_box_new (GTK_ORIENTATION_VERTICAL, 12);
  GtkWidget *sides = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 18);

  self->left = CW_SEQUENCE_SUMMARY (cw_sequence_summary_new ());
  self->right = CW_SEQUENCE_SUMMARY (cw_sequence_summary_new ());
  gtk_widget_set_hexpand (GTK_WIDGET (self->left), TRUE);
  gtk_widget_set_hexpand (GTK_WIDGET (self->right), TRUE);
  gtk_box_append (GTK_BOX (sides), GTK_WIDGET (self->left));
  gtk_box_append (GTK_BOX (sides), gtk_separator_new (GTK_ORIENTATION_VERTICAL));
  gtk_box_append (GTK_BOX (sides), GTK_WIDGET (self->right));
  self->difference = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_wrap (self->difference, TRUE);
  gtk_widget_add_css_class (GTK_WIDGET (self->difference), "heading");
  gtk_box_append (GTK_BOX (outer), sides);
  gtk_box_append (GTK_BOX (outer), GTK_WIDGET (self->difference));
  gtk_widget_set_margin_start (outer, 12);
  gtk_widget_set_margin_end (outer, 12);
  gtk_widget_set_margin_top (outer, 12);
  gtk_widget_set_margin_bottom (outer, 12);
  gtk_window_set_child (GTK_WINDOW (self), outer);
}
