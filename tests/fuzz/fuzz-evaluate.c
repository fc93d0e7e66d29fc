/* fuzz-evaluate.c: libFuzzer target for load, evaluate, report and plan
 *
 * Whatever loads must evaluate: one result a step, verdicts in range, a
 * report that is valid JSON, and a planner that keeps to its budget and
 * says why when it stops early.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>

#include "cw-evaluate.h"
#include "cw-json-writer.h"
#include "cw-planner.h"
#include "cw-report.h"
#include "fuzz-common.h"

/* Small enough that one input plans in well under the fuzzer's timeout. */
#define FUZZ_NODE_BUDGET 3000
#define FUZZ_MAX_STEPS 6

static void
check_canal (const CwCase  *kase,
             const CwCanal *canal)
{
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, canal);

  g_assert_nonnull (result);
  g_assert_cmpuint (result->steps->len, ==, canal->sequence->len);
  g_assert_true (result->verdict <= CW_LEVEL_STOP);
  for (guint i = 0; i < result->steps->len; i++)
    {
      const CwStepResult *step = g_ptr_array_index (result->steps, i);

      g_assert_cmpuint (step->index, ==, i + 1);
      g_assert_true (step->verdict <= result->verdict);
      g_assert_false (isinf (step->engaged_length));
      g_assert_false (isinf (step->cut_volume));
    }
}

static void
check_report (const CwCase *kase)
{
  gboolean any_stop = FALSE;
  g_autoptr(JsonNode) root = cw_report_case (kase, &any_stop);
  g_autofree char *text = cw_json_write (root, FALSE);
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) error = NULL;

  if (!json_parser_load_from_data (parser, text, -1, &error))
    g_error ("the report is not JSON: %s", error->message);
}

static void
check_plan (const CwCase  *kase,
            const CwCanal *canal)
{
  CwPlanOptions options;
  g_autoptr(CwPlanResult) result = NULL;

  cw_plan_options_init (&options);
  options.node_budget = FUZZ_NODE_BUDGET;
  options.max_steps = FUZZ_MAX_STEPS;
  options.n_alternatives = 1;
  result = cw_plan_canal (kase, canal, &options);
  g_assert_nonnull (result);
  /* The search may finish the level it is on and explain itself: a
   * quarter of the budget more (cw-planner-reason.c). */
  g_assert_cmpuint (result->stats.evaluated, <=, 2 * FUZZ_NODE_BUDGET + 64);
  if (result->stats.stopped_early)
    g_assert_nonnull (result->reason);
  for (guint i = 0; i < result->plans->len; i++)
    {
      const CwPlan *plan = g_ptr_array_index (result->plans, i);
      g_autoptr(CwCase) planned = cw_case_copy (kase);
      CwCanal *target = cw_case_find_canal (planned, canal->name);

      g_assert_cmpuint (plan->steps->len, <=, FUZZ_MAX_STEPS);
      cw_plan_to_sequence (plan, target);
      check_canal (planned, target);
    }
}

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  g_autoptr(CwCase) kase = cw_fuzz_load (data, size);

  if (kase == NULL)
    return 0;
  for (guint i = 0; i < kase->canals->len; i++)
    check_canal (kase, g_ptr_array_index (kase->canals, i));
  check_report (kase);
  for (guint i = 0; i < kase->canals->len; i++)
    check_plan (kase, g_ptr_array_index (kase->canals, i));
  return 0;
}
