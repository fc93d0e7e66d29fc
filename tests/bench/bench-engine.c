/* bench-engine.c: whole-case evaluation time of a 12-step, two-curve canal
 *
 * Prints evaluations per second, the median time of one evaluation and its
 * ratio to the budget (0.17 ms, a hundredth of a 60 Hz frame), measured in
 * the same run.  Fails when the median is over the budget.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>
#include <stdio.h>

#include "bench-cases.h"
#include "cw-test-util.h"

#define BUDGET_MS 0.17
#define RUNS 4000

int
main (int   argc,
      char *argv[])
{
  g_autoptr(CwCase) kase = cw_bench_twelve_step_case ();
  CwCanal *canal = g_ptr_array_index (kase->canals, 0);
  g_autofree double *times = g_new (double, RUNS);
  double start, total, median;

  for (int i = 0; i < 200; i++)
    cw_canal_result_free (cw_evaluate_canal (kase, canal));
  start = cw_bench_now_ms ();
  for (int i = 0; i < RUNS; i++)
    {
      double t0 = cw_bench_now_ms ();

      cw_canal_result_free (cw_evaluate_canal (kase, canal));
      times[i] = cw_bench_now_ms () - t0;
    }
  total = cw_bench_now_ms () - start;
  median = cw_bench_median (times, RUNS);

  printf ("# bench-engine: 12 steps, 2 curves, %d evaluations\n", RUNS);
  printf ("# evaluations per second: %.0f\n", RUNS / (total / 1000));
  printf ("# median per evaluation: %.4f ms (p95 %.4f ms)\n", median, times[RUNS * 95 / 100]);
  printf ("# ratio to the %.2f ms budget: %.3f\n", BUDGET_MS, median / BUDGET_MS);
  printf ("1..1\n%s 1 median under budget\n", median <= BUDGET_MS ? "ok" : "not ok");
  return median <= BUDGET_MS ? 0 : 1;
}
