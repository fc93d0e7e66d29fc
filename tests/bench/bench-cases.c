/* bench-cases.c: cases shared by the benchmarks
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>
#include <stdlib.h>
#include <time.h>

#include "bench-cases.h"
#include "cw-test-util.h"

/* A 12-step sequence on a two-curve canal, with every kind of file. */
CwCase *
cw_bench_twelve_step_case (void)
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


double
cw_bench_now_ms (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_MONOTONIC, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

static int
compare_doubles (const void *a,
                 const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

/* Sorts times in place; p95 and the like read the sorted array after. */
double
cw_bench_median (double *times,
                 guint   n)
{
  qsort (times, n, sizeof (double), compare_doubles);
  return times[n / 2];
}
