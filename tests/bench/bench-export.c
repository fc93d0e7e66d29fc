/* bench-export.c: how long canalwright --export takes for a four-canal case
 *
 * Runs the program as a user would (a new process each time, fonts and all)
 * on sample-cases/upper-molar-four-canals.cwcase, for each format: the PDF
 * plan sheet, and a PNG and an SVG diagram a canal.  Prints the median of
 * RUNS runs and its ratio to the budget of 0.3 s; fails when a median is
 * over it.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <stdio.h>
#include <stdlib.h>

#include "cw-test-util.h"

#define RUNS 7
#define BUDGET_S 0.3

static int
compare_doubles (const void *a,
                 const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

static double
run_once (const char *out,
          const char *kase)
{
  const char *argv[] = { g_getenv ("CW_BINARY"), "--export", out, kase, NULL };
  g_autoptr(GError) error = NULL;
  g_auto(GStrv) env = g_environ_unsetenv (g_get_environ (), "DISPLAY");
  gint64 start = g_get_monotonic_time ();
  int status;

  if (!g_spawn_sync (NULL, (char **) argv, env, G_SPAWN_STDOUT_TO_DEV_NULL, NULL, NULL,
                     NULL, NULL, &status, &error) || !g_spawn_check_wait_status (status, &error))
    {
      printf ("Bail out! %s\n", error->message);
      exit (1);
    }
  return (g_get_monotonic_time () - start) / 1e6;
}

static double
median_of (const char *dir,
           const char *name,
           const char *kase)
{
  g_autofree char *out = g_build_filename (dir, name, NULL);
  double times[RUNS];

  for (int i = 0; i < RUNS; i++)
    times[i] = run_once (out, kase);
  qsort (times, RUNS, sizeof times[0], compare_doubles);
  printf ("# %s: median %.3f s (fastest %.3f, slowest %.3f), ratio to the %.1f s budget: %.3f\n",
          name, times[RUNS / 2], times[0], times[RUNS - 1], BUDGET_S, times[RUNS / 2] / BUDGET_S);
  return times[RUNS / 2];
}

static void
remove_tree (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d && (name = g_dir_read_name (d)))
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      g_remove (path);
    }
  g_rmdir (dir);
}

int
main (void)
{
  static const char *outputs[] = { "plan.pdf", "plan.png", "plan.svg" };
  g_autofree char *kase = cw_test_sample_path ("upper-molar-four-canals.cwcase");
  g_autofree char *dir = g_dir_make_tmp ("cw-bench-XXXXXX", NULL);
  double worst = 0;

  printf ("# bench-export: upper-molar-four-canals.cwcase, 4 canals, 31 steps, %d runs a format\n", RUNS);
  for (guint i = 0; i < G_N_ELEMENTS (outputs); i++)
    {
      double median = median_of (dir, outputs[i], kase);

      worst = MAX (worst, median);
    }
  printf ("# worst ratio to the budget: %.3f\n", worst / BUDGET_S);
  printf ("1..1\n%s 1 every format under %.1f s\n", worst <= BUDGET_S ? "ok" : "not ok", BUDGET_S);
  remove_tree (dir);
  return 0;
}
