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
#include <time.h>

#include "cw-test-util.h"

#define BUDGET_MS 0.17
#define RUNS 4000

static CwCase *
bench_case (void)
{
  CwCase *kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21.5, 6.5, 0.70, 0.20);
  static const char *seq[][2] = {
    { "k10", "21.5" }, { "k15", "21.5" }, { "o25", "11" }, { "g15", "21.5" },
    { "r25-6", "13" }, { "r40-4", "16" }, { "r35-4", "17.5" }, { "k20", "21.5" },
    { "r25-4", "21.5" }, { "r30-6", "18" }, { "r30-4", "21.5" }, { "v25", "21" },
  };
  CwTaperSegment segs[] = { { 4, 0.08 }, { 16, 0.04 } };
  CwInstrument *v;

  cw_canal_add_curve (canal, 12.5, 25, 8);
  cw_canal_add_curve (canal, 17, 20, 5);
  cw_test_instrument (kase, "k10", 10, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "k20", 20, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "o25", 25, 0.08, CW_ALLOY_NITI, CW_MOTION_ROTARY)->torque_limit = 1.0;
  cw_test_instrument (kase, "g15", 15, 0.03, CW_ALLOY_NITI_HEAT_TREATED, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r25-6", 25, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r30-6", 30, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r25-4", 25, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r30-4", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY)->torque_limit = 0.4;
  cw_test_instrument (kase, "r35-4", 35, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r40-4", 40, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  v = cw_test_instrument (kase, "v25", 25, NAN, CW_ALLOY_NITI_HEAT_TREATED, CW_MOTION_ROTARY);
  cw_instrument_set_segments (v, segs, 2);
  v->max_flute_diameter = 1.0;
  for (guint i = 0; i < G_N_ELEMENTS (seq); i++)
    cw_canal_add_step (canal, seq[i][0], g_ascii_strtod (seq[i][1], NULL));
  return kase;
}

static double
now_ms (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_MONOTONIC, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

static int
compare_doubles (gconstpointer a,
                 gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

int
main (int   argc,
      char *argv[])
{
  g_autoptr(CwCase) kase = bench_case ();
  CwCanal *canal = g_ptr_array_index (kase->canals, 0);
  g_autofree double *times = g_new (double, RUNS);
  double start, total, median;

  for (int i = 0; i < 200; i++)
    cw_canal_result_free (cw_evaluate_canal (kase, canal));
  start = now_ms ();
  for (int i = 0; i < RUNS; i++)
    {
      double t0 = now_ms ();

      cw_canal_result_free (cw_evaluate_canal (kase, canal));
      times[i] = now_ms () - t0;
    }
  total = now_ms () - start;
  qsort (times, RUNS, sizeof (double), compare_doubles);
  median = times[RUNS / 2];

  printf ("# bench-engine: 12 steps, 2 curves, %d evaluations\n", RUNS);
  printf ("# evaluations per second: %.0f\n", RUNS / (total / 1000));
  printf ("# median per evaluation: %.4f ms (p95 %.4f ms)\n", median, times[RUNS * 95 / 100]);
  printf ("# ratio to the %.2f ms budget: %.3f\n", BUDGET_MS, median / BUDGET_MS);
  printf ("1..1\n%s 1 median under budget\n", median <= BUDGET_MS ? "ok" : "not ok");
  return median <= BUDGET_MS ? 0 : 1;
}
