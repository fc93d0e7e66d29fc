/* test-rules.c: the rule set's defaults and look-ups
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>

#include "cw-test-util.h"

/* The defaults of the engine contract (engine.md section 3): rules of thumb
 * of the trade, common practice with no published source; alloy values are
 * illustrative, from memory. */
static void
test_defaults (void)
{
  CwRules r;

  cw_rules_init_defaults (&r);
  cw_assert_near (r.contact_tolerance, 0.01, 0);
  cw_assert_near (r.advance_rate, 0.5, 0);
  cw_assert_near (r.peck_increment, 1.0, 0);
  cw_assert_near (r.changeover, 20, 0);
  cw_assert_near (r.at_length_tolerance, 0.5, 0);
  cw_assert_near (r.curve_engagement_max, 6, 0);
  cw_assert_near (r.small_file_tip_max, 20, 0);
  cw_assert_near (r.small_file_taper_max, 0.04, 0);
  cw_assert_near (r.glide_path_tip_max, 15, 0);
  g_assert_true (r.require_taper_change);
  g_assert_cmpuint (r.n_ceilings, ==, 3);
  g_assert_true (isnan (r.alloys[CW_ALLOY_STAINLESS].strain_limit));
  cw_assert_near (r.alloys[CW_ALLOY_NITI].strain_limit, 0.06, 0);
  cw_assert_near (r.alloys[CW_ALLOY_NITI_HEAT_TREATED].strain_limit, 0.08, 0);
  cw_assert_near (r.alloys[CW_ALLOY_NITI].strain_life_a, 100000, 0);
  cw_assert_near (r.alloys[CW_ALLOY_NITI_HEAT_TREATED].strain_life_a, 300000, 0);
  cw_assert_near (r.alloys[CW_ALLOY_STAINLESS].shear_strength, 800, 0);
  cw_assert_near (r.alloys[CW_ALLOY_NITI].shear_strength, 700, 0);
  cw_assert_near (r.alloys[CW_ALLOY_NITI_HEAT_TREATED].shear_strength, 600, 0);
}

static void
test_ceiling_lookup (void)
{
  CwRules r;
  gboolean outside;

  cw_rules_init_defaults (&r);
  cw_assert_near (cw_rules_ceiling (&r, 0.02, &outside), 0.60, 1e-15);
  g_assert_false (outside);
  cw_assert_near (cw_rules_ceiling (&r, 0.05, &outside), 0.525, 1e-12);
  g_assert_false (outside);
  cw_assert_near (cw_rules_ceiling (&r, 0.06, &outside), 0.50, 1e-15);
  g_assert_false (outside);
  /* A taper a rounding error over the last row is still in the table. */
  cw_rules_ceiling (&r, 0.06 + 1e-12, &outside);
  g_assert_false (outside);
  cw_assert_near (cw_rules_ceiling (&r, 0.08, &outside), 0.50, 1e-15);
  g_assert_true (outside);
  cw_assert_near (cw_rules_ceiling (&r, 0.01, &outside), 0.60, 1e-15);
  g_assert_true (outside);
}

/* N(eps) = A (100 eps)^-k; not modelled for stainless. */
static void
test_strain_life (void)
{
  CwRules r;

  cw_rules_init_defaults (&r);
  cw_assert_near (cw_rules_cycles_to_failure (&r, CW_ALLOY_NITI, 0.01), 100000, 1e-6);
  cw_assert_near (cw_rules_cycles_to_failure (&r, CW_ALLOY_NITI, 0.02), 100000 * pow (2, -3.3), 1e-6);
  g_assert_true (isinf (cw_rules_cycles_to_failure (&r, CW_ALLOY_STAINLESS, 0.02)));
  g_assert_true (isinf (cw_rules_cycles_to_failure (&r, CW_ALLOY_NITI, 0)));
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/rules/defaults", test_defaults);
  g_test_add_func ("/rules/ceiling", test_ceiling_lookup);
  g_test_add_func ("/rules/strain-life", test_strain_life);

  return g_test_run ();
}
