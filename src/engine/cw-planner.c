/* cw-planner.c: the best sequence of files to the case's target shape
 *
 * The model: a step takes one file to the deepest 0.5 mm grid depth, at
 * most the working length and the file's length, whose step has no stop
 * finding; it must gain depth or raise the envelope by more than the contact
 * tolerance; a plan is complete when the final shape meets the targets (it
 * ends there); plans rank by cautions, time, steps.  The alternatives are
 * the next best plans: since a state and a file fix the depth, two plans
 * first differ in the file used, as the issue asks.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-planner"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-planner-private.h"

#define BEAM_WIDTH 24

void
cw_plan_options_init (CwPlanOptions *options)
{
  g_return_if_fail (options != NULL);

  *options = (CwPlanOptions) {
    .max_steps = CW_PLAN_DEFAULT_MAX_STEPS,
    .n_alternatives = CW_PLAN_DEFAULT_ALTERNATIVES,
    .node_budget = CW_PLAN_DEFAULT_NODE_BUDGET,
  };
}

void
cw_plan_free (CwPlan *plan)
{
  if (plan == NULL)
    return;
  g_array_unref (plan->steps);
  g_free (plan);
}

void
cw_plan_result_free (CwPlanResult *result)
{
  if (result == NULL)
    return;
  g_ptr_array_unref (result->plans);
  g_free (result->reason);
  g_free (result);
}

gboolean
cw_plan_result_complete (const CwPlanResult *result)
{
  g_return_val_if_fail (result != NULL, FALSE);

  return result->plans->len > 0 && ((CwPlan *) g_ptr_array_index (result->plans, 0))->complete;
}

void
cw_plan_to_sequence (const CwPlan *plan,
                     CwCanal      *canal)
{
  g_return_if_fail (plan != NULL && canal != NULL);

  cw_canal_clear_sequence (canal);
  for (guint i = 0; i < plan->steps->len; i++)
    {
      const CwPlanStep *step = &g_array_index (plan->steps, CwPlanStep, i);

      cw_canal_add_step (canal, step->instrument->id, step->depth);
    }
}

static void
collect_steps (const Planner  *p,
               const PlanNode *node,
               GArray         *steps)
{
  CwPlanStep step;

  if (node->parent == NULL)
    return;
  collect_steps (p, node->parent, steps);
  step.instrument = p->files[node->instrument].instrument;
  step.depth = node->depth;
  g_array_append_val (steps, step);
}

/* The figures come from the engine evaluating the plan from the start. */
static CwPlan *
plan_new (const Planner  *p,
          const PlanNode *node)
{
  CwPlan *plan = g_new0 (CwPlan, 1);
  g_autoptr(CwEvalState) state = cw_eval_state_new (p->kase, p->canal);
  g_autoptr(CwFinding) shape = NULL;
  gboolean stop = FALSE;

  plan->steps = g_array_new (FALSE, FALSE, sizeof (CwPlanStep));
  collect_steps (p, node, plan->steps);
  for (guint i = 0; i < plan->steps->len; i++)
    {
      const CwPlanStep *step = &g_array_index (plan->steps, CwPlanStep, i);
      g_autoptr(CwStepResult) r = cw_eval_state_apply (state, step->instrument, step->depth, FALSE);

      stop |= r->verdict == CW_LEVEL_STOP;
      for (guint j = 0; j < r->findings->len; j++)
        {
          const CwFinding *f = g_ptr_array_index (r->findings, j);

          plan->cautions += f->level == CW_LEVEL_CAUTION;
        }
    }
  shape = cw_eval_state_final_shape (state);
  plan->time = cw_eval_state_time (state);
  plan->apical_size = cw_eval_state_apical_size (state);
  plan->apical_taper = cw_eval_state_apical_taper (state);
  plan->complete = !stop && shape == NULL;
  return plan;
}

static void
sanitize_options (CwPlanOptions       *out,
                  const CwPlanOptions *options)
{
  if (options)
    *out = *options;
  else
    cw_plan_options_init (out);
  out->max_steps = MIN (out->max_steps, CW_MAX_STEPS);
  out->n_alternatives = MIN (out->n_alternatives, CW_PLAN_MAX_ALTERNATIVES);
}

static char *
unproven_reason (const Planner *p)
{
  return g_strdup_printf (_("The search stopped early after %u evaluated steps (the node budget); the plans shown meet the targets but are not proven best."),
                          p->stopped_at);
}

/* No plan: the closest of the search's and a beam's, and why. */
static void
fill_closest (Planner      *p,
              CwPlanResult *result,
              PlanNode     *closest)
{
  PlanNode *beam = cw_planner_beam (p, BEAM_WIDTH);

  if (beam && (closest == NULL || beam->goal || beam->shortfall < closest->shortfall - PLAN_EPS))
    closest = beam;
  if (closest && closest->goal)
    result->reason = unproven_reason (p);
  else if (result->reason == NULL)
    result->reason = cw_planner_explain (p, closest);
  if (closest && closest->parent)
    g_ptr_array_add (result->plans, plan_new (p, closest));
}

static void
search (Planner      *p,
        CwPlanResult *result)
{
  PlanNode *goals[CW_PLAN_MAX_ALTERNATIVES + 1], *closest = NULL;
  guint n = cw_planner_search (p, p->options.n_alternatives + 1, goals, &closest);

  for (guint i = 0; i < n; i++)
    g_ptr_array_add (result->plans, plan_new (p, goals[i]));
  if (n == 0)
    fill_closest (p, result, closest);
  else if (p->stats.stopped_early)
    result->reason = unproven_reason (p);
}

CwPlanResult *
cw_plan_canal (const CwCase        *kase,
               const CwCanal       *canal,
               const CwPlanOptions *options)
{
  g_autoptr(Planner) p = NULL;
  CwPlanResult *result;
  CwPlanOptions opts;
  gint64 start = g_get_monotonic_time ();

  g_return_val_if_fail (kase != NULL && canal != NULL, NULL);

  sanitize_options (&opts, options);
  p = cw_planner_new (kase, canal, &opts);
  result = g_new0 (CwPlanResult, 1);
  result->plans = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_plan_free);
  result->reason = cw_planner_unreachable (p);
  if (result->reason)
    fill_closest (p, result, NULL);
  else
    search (p, result);
  result->stats = p->stats;
  result->stats.elapsed_ms = (g_get_monotonic_time () - start) / 1000.0;
  return result;
}
