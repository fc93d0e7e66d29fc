/* cw-propose-window.c
 *
 * The search runs in a worker thread on a copy of the case, so the window
 * stays live; the plans it returns borrow their instruments from that copy,
 * which the window keeps.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-propose"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-compare-window.h"
#include "cw-plan-text.h"
#include "cw-planner.h"
#include "cw-propose-window.h"
#include "cw-sequence-summary.h"

struct _CwProposeWindow
{
  GtkWindow          parent_instance;

  CwDocument        *document;
  guint              canal_index;
  CwCase            *kase;         /* the copy the planner searched */
  CwPlanResult      *result;

  GtkStack          *stack;
  GtkListBox        *list;
  GtkLabel          *reason;
  CwSequenceSummary *preview;
  GtkWidget         *adopt;
  GtkWidget         *compare;
};

G_DEFINE_FINAL_TYPE (CwProposeWindow, cw_propose_window, GTK_TYPE_WINDOW)

static const CwCanal *
searched_canal (CwProposeWindow *self)
{
  return g_ptr_array_index (self->kase->canals, self->canal_index);
}

static CwCanal *
plan_canal (CwProposeWindow *self,
            guint            index)
{
  CwCanal *canal = cw_canal_copy (searched_canal (self));

  cw_plan_to_sequence (g_ptr_array_index (self->result->plans, index), canal);
  return canal;
}

static char *
plan_title (guint index)
{
  return index == 0 ? g_strdup (_("Best plan")) : g_strdup_printf (_("Alternative %u"), index);
}

static GtkWidget *
plan_row (const CwPlan *plan,
          guint         index)
{
  g_autofree char *title = plan_title (index);
  g_autofree char *duration = cw_plan_duration (plan->time);
  g_autofree char *size = isfinite (plan->apical_size) ? g_strdup_printf ("%.0f", plan->apical_size)
                                                       : g_strdup (C_("figure", "—"));
  g_autofree char *text = g_strdup_printf (_("<b>%s</b>\n%u steps · %s · %u cautions · size %s, taper %.3f%s"),
                                           title, plan->steps->len, duration, plan->cautions, size,
                                           plan->apical_taper, plan->complete ? "" : _(" · short of the targets"));
  GtkWidget *label = gtk_label_new (NULL);

  gtk_label_set_markup (GTK_LABEL (label), text);
  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_widget_set_margin_start (label, 6);
  gtk_widget_set_margin_end (label, 6);
  gtk_widget_set_margin_top (label, 4);
  gtk_widget_set_margin_bottom (label, 4);
  return label;
}

static void
row_selected (GtkListBox      *list,
              GtkListBoxRow   *row,
              CwProposeWindow *self)
{
  g_autoptr(CwCanal) canal = NULL;
  g_autofree char *title = NULL;
  guint index;

  if (row == NULL)
    return;
  index = (guint) gtk_list_box_row_get_index (row);
  canal = plan_canal (self, index);
  title = plan_title (index);
  cw_sequence_summary_set (self->preview, self->kase, canal, title);
}

void
cw_propose_window_adopt (CwProposeWindow *self,
                         guint            index)
{
  CwCase *kase;
  CwCanal *canal;

  g_return_if_fail (self->result && index < self->result->plans->len);

  kase = cw_document_begin_edit (self->document, _("Adopt Proposed Sequence"));
  canal = g_ptr_array_index (kase->canals, self->canal_index);
  cw_plan_to_sequence (g_ptr_array_index (self->result->plans, index), canal);
  cw_document_end_edit (self->document);
  gtk_window_close (GTK_WINDOW (self));
}

static guint
selected_index (CwProposeWindow *self)
{
  GtkListBoxRow *row = gtk_list_box_get_selected_row (self->list);

  return row ? (guint) gtk_list_box_row_get_index (row) : 0;
}

static void
adopt_clicked (CwProposeWindow *self)
{
  cw_propose_window_adopt (self, selected_index (self));
}

static void
row_activated (GtkListBox      *list,
               GtkListBoxRow   *row,
               CwProposeWindow *self)
{
  cw_propose_window_adopt (self, (guint) gtk_list_box_row_get_index (row));
}

static void
compare_clicked (CwProposeWindow *self)
{
  g_autoptr(CwCanal) proposal = plan_canal (self, selected_index (self));
  g_autofree char *title = plan_title (selected_index (self));
  GtkWidget *window = cw_compare_window_new (GTK_WINDOW (self), self->kase, searched_canal (self),
                                             _("Your sequence"), proposal, title);

  gtk_window_present (GTK_WINDOW (window));
}

static void
show_result (CwProposeWindow *self)
{
  const char *reason = self->result->reason;
  gboolean any = self->result->plans->len > 0;

  for (guint i = 0; i < self->result->plans->len; i++)
    gtk_list_box_append (self->list, plan_row (g_ptr_array_index (self->result->plans, i), i));
  gtk_label_set_label (self->reason, reason ? reason
                       : _("The best plan is proven best under the planning model: no other sequence of these files reaches the targets with fewer cautions, or as few in less time."));
  gtk_widget_set_sensitive (self->adopt, any);
  gtk_widget_set_sensitive (self->compare, any);
  if (any)
    gtk_list_box_select_row (self->list, gtk_list_box_get_row_at_index (self->list, 0));
  gtk_stack_set_visible_child_name (self->stack, "plans");
  if (any)
    gtk_widget_grab_focus (GTK_WIDGET (gtk_list_box_get_row_at_index (self->list, 0)));
}

static void
search_thread (GTask        *task,
               gpointer      source,
               gpointer      data,
               GCancellable *cancellable)
{
  CwProposeWindow *self = source;
  CwPlanOptions options;

  cw_plan_options_init (&options);
  g_task_return_pointer (task, cw_plan_canal (self->kase, searched_canal (self), &options),
                         (GDestroyNotify) cw_plan_result_free);
}

static void
search_done (GObject      *source,
             GAsyncResult *res,
             gpointer      data)
{
  CwProposeWindow *self = CW_PROPOSE_WINDOW (source);

  self->result = g_task_propagate_pointer (G_TASK (res), NULL);
  if (self->result)
    show_result (self);
}

GtkWidget *
cw_propose_window_new (GtkWindow  *parent,
                       CwDocument *document)
{
  CwProposeWindow *self = g_object_new (CW_TYPE_PROPOSE_WINDOW,
                                        "transient-for", parent,
                                        "title", _("Proposed Sequences"),
                                        "default-width", 900,
                                        "default-height", 700,
                                        NULL);
  g_autoptr(GTask) task = NULL;

  self->document = g_object_ref (document);
  self->canal_index = cw_document_get_canal_index (document);
  self->kase = cw_case_copy (cw_document_get_case (document));
  task = g_task_new (self, NULL, search_done, NULL);
  g_task_run_in_thread (task, search_thread);
  return GTK_WIDGET (self);
}

guint
cw_propose_window_get_n_plans (CwProposeWindow *self)
{
  return self->result ? self->result->plans->len : 0;
}

gboolean
cw_propose_window_is_ready (CwProposeWindow *self)
{
  return self->result != NULL;
}

static void
cw_propose_window_dispose (GObject *object)
{
  CwProposeWindow *self = CW_PROPOSE_WINDOW (object);

  g_clear_object (&self->document);
  G_OBJECT_CLASS (cw_propose_window_parent_class)->dispose (object);
}

static void
cw_propose_window_finalize (GObject *object)
{
  CwProposeWindow *self = CW_PROPOSE_WINDOW (object);

  g_clear_pointer (&self->result, cw_plan_result_free);
  g_clear_pointer (&self->kase, cw_case_free);
  G_OBJECT_CLASS (cw_propose_window_parent_class)->finalize (object);
}

static void
cw_propose_window_class_init (CwProposeWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->dispose = cw_propose_window_dispose;
  object_class->finalize = cw_propose_window_finalize;
  gtk_widget_class_add_binding_action (GTK_WIDGET_CLASS (klass), GDK_KEY_Escape, 0, "window.close", NULL);
}

static GtkWidget *
build_plans_page (CwProposeWindow *self)
{
  GtkWidget *page = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 12);
  GtkWidget *left = gtk_box_new (GTK_ORIENTATION_VERTICAL, 8);
  GtkWidget *buttons = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);

  self->list = GTK_LIST_BOX (gtk_list_box_new ());
  gtk_widget_add_css_class (GTK_WIDGET (self->list), "boxed-list");
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->list), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Proposed plans"), -1);
  g_signal_connect (self->list, "row-selected", G_CALLBACK (row_selected), self);
  g_signal_connect (self->list, "row-activated", G_CALLBACK (row_activated), self);
  self->reason = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_wrap (self->reason, TRUE);
  gtk_label_set_xalign (self->reason, 0);
  gtk_widget_add_css_class (GTK_WIDGET (self->reason), "dim-label");
  self->adopt = gtk_button_new_with_mnemonic (_("_Adopt This Plan"));
  gtk_widget_add_css_class (self->adopt, "suggested-action");
  g_signal_connect_swapped (self->adopt, "clicked", G_CALLBACK (adopt_clicked), self);
  self->compare = gtk_button_new_with_mnemonic (_("_Compare with Yours"));
  g_signal_connect_swapped (self->compare, "clicked", G_CALLBACK (compare_clicked), self);
  gtk_box_append (GTK_BOX (buttons), self->compare);
  gtk_box_append (GTK_BOX (buttons), self->adopt);
  gtk_box_append (GTK_BOX (left), GTK_WIDGET (self->list));
  gtk_box_append (GTK_BOX (left), GTK_WIDGET (self->reason));
  gtk_box_append (GTK_BOX (left), buttons);
  gtk_widget_set_size_request (left, 320, -1);
  self->preview = CW_SEQUENCE_SUMMARY (cw_sequence_summary_new ());
  gtk_widget_set_hexpand (GTK_WIDGET (self->preview), TRUE);
  gtk_box_append (GTK_BOX (page), left);
  gtk_box_append (GTK_BOX (page), GTK_WIDGET (self->preview));
  return page;
}

static void
cw_propose_window_init (CwProposeWindow *self)
{
  GtkWidget *searching = gtk_box_new (GTK_ORIENTATION_VERTICAL, 12);
  GtkWidget *spinner = gtk_spinner_new ();
  GtkWidget *plans = build_plans_page (self);

  gtk_spinner_start (GTK_SPINNER (spinner));
  gtk_widget_set_valign (searching, GTK_ALIGN_CENTER);
  gtk_box_append (GTK_BOX (searching), spinner);
  gtk_box_append (GTK_BOX (searching), gtk_label_new (_("Searching every sequence of the files on hand…")));
  self->stack = GTK_STACK (gtk_stack_new ());
  gtk_stack_add_named (self->stack, searching, "searching");
  gtk_stack_add_named (self->stack, plans, "plans");
  gtk_widget_set_margin_start (GTK_WIDGET (self->stack), 12);
  gtk_widget_set_margin_end (GTK_WIDGET (self->stack), 12);
  gtk_widget_set_margin_top (GTK_WIDGET (self->stack), 12);
  gtk_widget_set_margin_bottom (GTK_WIDGET (self->stack), 12);
  gtk_window_set_child (GTK_WINDOW (self), GTK_WIDGET (self->stack));
  gtk_window_set_default_widget (GTK_WINDOW (self), self->adopt);
}
