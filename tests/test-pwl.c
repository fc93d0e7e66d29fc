/* test-pwl.c: piecewise-linear functions, jumps and the raise operation
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>

#include "cw-test-util.h"

static void
test_eval_linear (void)
{
  g_autoptr(CwPwl) p = cw_pwl_new_linear (0, 1, 10, 0);

  cw_assert_near (cw_pwl_eval (p, 5), 0.5, 1e-15);
  cw_assert_near (cw_pwl_eval (p, -3), 1, 1e-15);   /* end values kept */
  cw_assert_near (cw_pwl_eval (p, 12), 0, 1e-15);
}

/* A jump holds both sides; the point itself takes the larger. */
static void
test_eval_jump (void)
{
  g_autoptr(CwPwl) p = cw_pwl_new ();

  cw_pwl_append (p, 0, 1);
  cw_pwl_append (p, 5, 1);
  cw_pwl_append (p, 5, 3);
  cw_pwl_append (p, 10, 3);
  cw_assert_near (cw_pwl_eval_side (p, 5, CW_SIDE_LEFT), 1, 1e-15);
  cw_assert_near (cw_pwl_eval_side (p, 5, CW_SIDE_RIGHT), 3, 1e-15);
  cw_assert_near (cw_pwl_eval (p, 5), 3, 1e-15);
  cw_assert_near (cw_pwl_eval (p, 4), 1, 1e-15);
}

/* max (1 - s/10, 0.2 + 0.06 (s - 5)) on [5, 10]: the lines cross at
 * s = 5 + 0.3 / 0.16 = 6.875; outside [5, 10] the original stays. */
static void
test_raise_crossing (void)
{
  g_autoptr(CwPwl) p = cw_pwl_new_linear (0, 1, 20, -1);
  g_autoptr(CwPwl) f = cw_pwl_new_linear (5, 0.2, 10, 0.5);

  cw_pwl_raise (p, f, 5, 10);
  cw_assert_near (cw_pwl_eval (p, 4), 0.6, 1e-12);
  cw_assert_near (cw_pwl_eval (p, 6), 0.4, 1e-12);
  cw_assert_near (cw_pwl_eval (p, 6.875), 0.3125, 1e-12);
  cw_assert_near (cw_pwl_eval (p, 8), 0.38, 1e-12);
  cw_assert_near (cw_pwl_eval_side (p, 10, CW_SIDE_LEFT), 0.5, 1e-12);
  cw_assert_near (cw_pwl_eval_side (p, 10, CW_SIDE_RIGHT), 0.0, 1e-12);
  cw_assert_near (cw_pwl_eval (p, 11), -0.1, 1e-12);
}

/* Raising with a lower function changes nothing, and no points pile up. */
static void
test_raise_below_is_identity (void)
{
  g_autoptr(CwPwl) p = cw_pwl_new_linear (0, 1, 20, 1);
  g_autoptr(CwPwl) f = cw_pwl_new_linear (2, 0.2, 10, 0.5);

  for (int i = 0; i < 50; i++)
    cw_pwl_raise (p, f, 2, 10);
  g_assert_cmpuint (cw_pwl_get_n_points (p), <=, 4);
  cw_assert_near (cw_pwl_eval (p, 6), 1, 1e-15);
}

static void
test_sort_unique (void)
{
  g_autoptr(GArray) v = g_array_new (FALSE, FALSE, sizeof (double));
  double in[] = { 3, 1, 2, 3, 1, 0.5 };

  g_array_append_vals (v, in, G_N_ELEMENTS (in));
  cw_sort_unique_doubles (v);
  g_assert_cmpuint (v->len, ==, 4);
  cw_assert_near (g_array_index (v, double, 0), 0.5, 0);
  cw_assert_near (g_array_index (v, double, 3), 3, 0);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/pwl/eval/linear", test_eval_linear);
  g_test_add_func ("/pwl/eval/jump", test_eval_jump);
  g_test_add_func ("/pwl/raise/crossing", test_raise_crossing);
  g_test_add_func ("/pwl/raise/below", test_raise_below_is_identity);
  g_test_add_func ("/pwl/sort-unique", test_sort_unique);

  return g_test_run ();
}
