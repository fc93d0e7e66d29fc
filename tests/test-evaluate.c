/* test-evaluate.c: every formula and rule of the evaluation, with boundaries
 *
 * Expected values are worked by hand from the definitions of the engine
 * contract (shared engine.md, sections 1-3), in the comments beside them.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>

#include "cw-test-util.h"

#define TOL 1e-9

static CwCanalResult *
evaluate (CwCase  *kase,
          CwCanal *canal)
{
  return cw_evaluate_canal (kase, canal);
}

/* Straight canal, WL 20, orifice 5: P0(s) = 1.00 - 0.04 s (0.80 -> 0.20).
 * A 30/.02 at 20: d(20 - s) = 0.70 - 0.02 s.  Engaged where
 * 0.70 - 0.02 s > 1.01 - 0.04 s, i.e. s > 15.5: 4.5 mm. */
static void
test_engagement_straight (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 20);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);

  cw_assert_near (r->engaged_length, 4.5, TOL);
  cw_assert_near (r->engaged_in_straight, 4.5, TOL);  /* no curve: all straight */
  cw_assert_near (r->engaged_in_curve, 0.0, TOL);
  g_assert_cmpuint (r->engaged->len, ==, 1);
  cw_assert_near (g_array_index (r->engaged, CwPoint, 0).s, 15.5, TOL);
  /* pi * mean diameter (0.39 + 0.30) / 2 * 4.5 */
  cw_assert_near (r->contact_area, G_PI * 4.5 * 0.345, 1e-9);
  /* pi/4 * (int d^2 - int P^2); d 0.39 -> 0.30, P 0.38 -> 0.20 over 4.5 */
  cw_assert_near (r->cut_volume,
                  G_PI / 4 * (4.5 * (0.39 * 0.39 + 0.39 * 0.30 + 0.09) / 3 -
                              4.5 * (0.38 * 0.38 + 0.38 * 0.20 + 0.04) / 3), 1e-9);
  g_assert_true (isnan (r->max_diameter_in_curve));
  g_assert_true (isnan (r->ceiling));
  g_assert_true (isnan (r->ceiling_depth));
  g_assert_true (isnan (r->straight_clearance));
  g_assert_true (isnan (r->strain));
  g_assert_true (isnan (r->cycles_in_curve));
  g_assert_true (isnan (r->fracture_torque_d3));
  g_assert_cmpint (r->verdict, ==, CW_LEVEL_OK);
}

/* Same canal: the tip first touches where P + tol = 0.30, at s = 17.75;
 * every other wall point is touched later (35.5 - s > 17.75).  Advance
 * 2.25 mm at 0.5 mm/s plus 20 s changeover; 3 pecks of 1 mm. */
static void
test_first_contact_time_pecks (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 20);
  cw_canal_add_step (canal, "k30", 20);
  cw_canal_add_step (canal, "k30", 19.75);
  res = evaluate (kase, canal);

  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->first_contact, 17.75, TOL);
  cw_assert_near (r->time, 2.25 / 0.5 + 20, TOL);
  g_assert_cmpuint (r->pecks, ==, 3);

  /* The same file again cuts nothing: its shape is the envelope now. */
  r = cw_canal_result_get_step (res, 1);
  cw_assert_near (r->engaged_length, 0.0, TOL);
  g_assert_true (isnan (r->first_contact));
  cw_assert_near (r->time, 20.0, TOL);
  g_assert_cmpuint (r->pecks, ==, 0);
  cw_assert_near (res->time, 24.5 + 20 + 20, TOL);
}

/* An advance of exactly 2 mm takes 2 pecks, not 3. */
static void
test_pecks_exact_multiple (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 19.75);
  res = evaluate (kase, canal);
  cw_assert_near (cw_canal_result_get_step (res, 0)->first_contact, 17.75, TOL);
  g_assert_cmpuint (cw_canal_result_get_step (res, 0)->pecks, ==, 2);
}

/* The envelope after the 30/.02: P0 up to s = 15, the file's line
 * 0.70 - 0.02 s to the tip at 20, then back to P0 = 0.20 past the tip. */
static void
test_envelope_update_and_final_shape (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  const CwPwl *p;
  const CwFinding *f;

  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 20);
  res = evaluate (kase, canal);
  p = cw_canal_result_envelope (res);

  cw_assert_near (cw_pwl_eval (p, 10), 0.60, TOL);
  cw_assert_near (cw_pwl_eval (p, 15), 0.40, TOL);
  cw_assert_near (cw_pwl_eval (p, 17), 0.36, TOL);
  cw_assert_near (cw_pwl_eval (p, 20), 0.30, TOL);
  cw_assert_near (cw_pwl_eval (p, 20.5), 0.20, TOL);
  cw_assert_near (res->apical_size, 30, TOL);
  cw_assert_near (res->apical_taper, (0.36 - 0.30) / 3, TOL);
  g_assert_true (isnan (res->onset_diameter));
  /* Taper .02 is short of the default .04 target: a caution on the canal. */
  g_assert_cmpuint (res->findings->len, ==, 1);
  f = g_ptr_array_index (res->findings, 0);
  g_assert_cmpint (f->rule, ==, CW_RULE_FINAL_SHAPE);
  g_assert_cmpint (f->level, ==, CW_LEVEL_CAUTION);
  g_assert_cmpint (res->verdict, ==, CW_LEVEL_CAUTION);
  g_assert_false (res->has_stop);
}

/* Apical size: the largest tip within the at-length tolerance (0.5 mm). */
static void
test_apical_size_tolerance (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  cw_test_instrument (kase, "k25", 25, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "k35", 35, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k25", 20);
  cw_canal_add_step (canal, "k30", 19.5);   /* exactly at the tolerance: counts */
  cw_canal_add_step (canal, "k35", 19.4);   /* 0.6 mm short: does not */
  res = evaluate (kase, canal);
  cw_assert_near (res->apical_size, 30, TOL);
}

static void
test_no_file_at_length (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 15);
  res = evaluate (kase, canal);
  g_assert_true (isnan (res->apical_size));
  g_assert_cmpuint (res->findings->len, ==, 1);
}

/* Curved canal used below: WL 21, orifice 6, onset 14, 30 degrees on an 8 mm
 * radius (end 14 + 8 pi / 6), P0 from 0.80 to 0.20. */
static CwCanal *
curved_canal (CwCase *kase)
{
  CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);

  cw_canal_add_curve (canal, 14, 30, 8);
  return canal;
}

/* The trade's rule of thumb: 30/.04 under 0.55 mm reaches 6.25 mm into the
 * curve (common practice, no published source).  At 21 it is 0.75 mm too
 * deep; exactly at 20.25 it is at the ceiling and passes. */
static void
test_ceiling_depth_and_boundary (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "r30", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k15", 21);
  cw_canal_add_step (canal, "r30", 20.25);
  cw_canal_add_step (canal, "r30", 21);
  res = evaluate (kase, canal);

  r = cw_canal_result_get_step (res, 1);
  cw_assert_near (r->ceiling, 0.55, TOL);
  cw_assert_near (r->ceiling_depth, 20.25, TOL);
  cw_assert_near (r->max_diameter_in_curve, 0.55, TOL);
  g_assert_null (cw_test_find (r, CW_RULE_DIAMETER_CEILING));

  r = cw_canal_result_get_step (res, 2);
  cw_assert_near (r->max_diameter_in_curve, 0.58, TOL);
  g_assert_nonnull (cw_test_find (r, CW_RULE_DIAMETER_CEILING));
  g_assert_cmpint (cw_test_find (r, CW_RULE_DIAMETER_CEILING)->level, ==, CW_LEVEL_STOP);
  g_assert_cmpint (r->verdict, ==, CW_LEVEL_STOP);
  g_assert_true (res->has_stop);
  g_assert_cmpint (res->verdict, ==, CW_LEVEL_STOP);
  cw_assert_near (res->onset_diameter, cw_pwl_eval (cw_canal_result_envelope (res), 14), TOL);
}

/* A 10/.02 is 0.42 mm at D16, under every ceiling: no ceiling depth.  A
 * .04 file capped at 0.50 mm never reaches the .04 ceiling of 0.55 either. */
static void
test_ceiling_never_reached (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwInstrument *capped;

  cw_test_instrument (kase, "k10", 10, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  capped = cw_test_instrument (kase, "c20", 20, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  capped->max_flute_diameter = 0.50;
  cw_canal_add_step (canal, "k10", 21);
  cw_canal_add_step (canal, "c20", 21);
  res = evaluate (kase, canal);
  cw_assert_near (cw_canal_result_get_step (res, 0)->ceiling, 0.60, TOL);
  g_assert_true (isnan (cw_canal_result_get_step (res, 0)->ceiling_depth));
  g_assert_true (isnan (cw_canal_result_get_step (res, 1)->ceiling_depth));
  g_assert_null (cw_test_find (cw_canal_result_get_step (res, 1), CW_RULE_DIAMETER_CEILING));
}

/* Tip already wider than the ceiling: x_ceil = 0, the ceiling depth is the
 * onset itself, and any depth past it stops. */
static void
test_ceiling_tip_wider (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "k60", 60, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k60", 14.5);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->ceiling_depth, 14.0, TOL);
  g_assert_nonnull (cw_test_find (r, CW_RULE_DIAMETER_CEILING));
}

/* A file whose tip has not reached the onset has no figure in the curve. */
static void
test_above_the_curve (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "r25", 25, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "r25", 12);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  g_assert_true (isnan (r->max_diameter_in_curve));
  g_assert_true (isnan (r->ceiling_depth));
  g_assert_true (isnan (r->strain));
  g_assert_true (isnan (r->straight_clearance));
  cw_assert_near (r->cycles_in_curve, 0.0, TOL);
  cw_assert_near (r->fatigue_use, 0.0, TOL);
  g_assert_cmpuint (r->findings->len, ==, 0);
}

/* Ceiling table: .03 lies between rows (0.575 mm); .08 is outside, uses the
 * .06 row (0.50 mm) and says so. */
static void
test_ceiling_table_interpolation (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "g15", 15, 0.03, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "o25", 25, 0.08, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "g15", 16);
  cw_canal_add_step (canal, "o25", 15);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->ceiling, 0.575, TOL);
  g_assert_null (cw_test_find (r, CW_RULE_CEILING_TABLE));
  r = cw_canal_result_get_step (res, 1);
  cw_assert_near (r->ceiling, 0.50, TOL);
  cw_assert_near (r->ceiling_depth, 14 + (0.50 - 0.25) / 0.08, TOL);
  g_assert_nonnull (cw_test_find (r, CW_RULE_CEILING_TABLE));
  g_assert_cmpint (cw_test_find (r, CW_RULE_CEILING_TABLE)->level, ==, CW_LEVEL_CAUTION);
}

/* A variable-taper file with only its .08 part in the curve takes the .08
 * ceiling; deeper, with its .04 part there too, still the largest (.08). */
static void
test_variable_taper_ceiling (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwInstrument *v;
  CwTaperSegment segs[] = { { 4, 0.08 }, { 16, 0.04 } };
  CwStepResult *r;

  v = cw_test_instrument (kase, "v25", 25, NAN, CW_ALLOY_NITI_HEAT_TREATED, CW_MOTION_ROTARY);
  cw_instrument_set_segments (v, segs, 2);
  cw_canal_add_step (canal, "v25", 16);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->max_diameter_in_curve, 0.25 + 2 * 0.08, TOL);
  cw_assert_near (r->ceiling, 0.50, TOL);
  cw_assert_near (r->ceiling_depth, 14 + 0.25 / 0.08, TOL);
}

/* Engaged length in the curve: exactly 6 mm passes, 6.5 mm stops, and a
 * small file (tip <= 20, taper <= .04) is exempt.  A narrow canal (0.05 mm)
 * makes every file engage along all its flutes; the curve runs to 20. */
static CwCase *
narrow_curve_case (CwCanal **canal_out)
{
  CwCase *kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 22, 2, 0.05, 0.05);

  cw_canal_add_curve (canal, 10, 30, 10.0 / (G_PI / 6));   /* end at 20 */
  *canal_out = canal;
  return kase;
}

static gboolean
engagement_stops (double  tip,
                  double  taper,
                  double  depth,
                  double *in_curve)
{
  CwCanal *canal;
  g_autoptr(CwCase) kase = narrow_curve_case (&canal);
  g_autoptr(CwCanalResult) res = NULL;

  cw_test_instrument (kase, "f", tip, taper, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "f", depth);
  res = evaluate (kase, canal);
  *in_curve = cw_canal_result_get_step (res, 0)->engaged_in_curve;
  return cw_test_find (cw_canal_result_get_step (res, 0), CW_RULE_CURVE_ENGAGEMENT) != NULL;
}

static void
test_curve_engagement_boundary (void)
{
  double in_curve;

  /* Exactly 6 mm engaged in the curve: allowed. */
  g_assert_false (engagement_stops (25, 0.02, 16, &in_curve));
  cw_assert_near (in_curve, 6.0, TOL);
  /* 6.5 mm: stop. */
  g_assert_true (engagement_stops (25, 0.02, 16.5, &in_curve));
  cw_assert_near (in_curve, 6.5, TOL);
  /* 20/.04 is a small file: exempt even though it engages 6.5 mm. */
  g_assert_false (engagement_stops (20, 0.04, 16.5, &in_curve));
  cw_assert_near (in_curve, 6.5, TOL);
  /* 20/.06 is not (taper over .04), nor 25/.02 (tip over 20). */
  g_assert_true (engagement_stops (20, 0.06, 16.5, &in_curve));
}

/* Once a 25/.06 has opened the straight part to 1.51 - 0.06 s, a 30/.04
 * (1.14 - 0.04 s) clears it: P - d = 0.37 - 0.02 s over [6, 14), least
 * just short of the onset, 0.09 mm, and nothing is cut there. */
static void
test_straight_clearance (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "r25", 25, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r30", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "k15", 21);
  cw_canal_add_step (canal, "r25", 13);
  cw_canal_add_step (canal, "r25", 21);
  cw_canal_add_step (canal, "r30", 21);
  res = evaluate (kase, canal);

  /* Tip above the onset: no clearance figure, and no caution. */
  r = cw_canal_result_get_step (res, 1);
  g_assert_true (isnan (r->straight_clearance));
  g_assert_null (cw_test_find (r, CW_RULE_STRAIGHT_CLEARANCE));

  r = cw_canal_result_get_step (res, 2);
  cw_assert_near (r->straight_clearance, -0.35, TOL);
  g_assert_nonnull (cw_test_find (r, CW_RULE_STRAIGHT_CLEARANCE));

  r = cw_canal_result_get_step (res, 3);
  cw_assert_near (r->straight_clearance, 0.09, TOL);
  cw_assert_near (r->engaged_in_straight, 0.0, TOL);
  g_assert_null (cw_test_find (r, CW_RULE_STRAIGHT_CLEARANCE));
}

static void
test_straight_clearance_first_cut (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  cw_test_instrument (kase, "r25", 25, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "r25", 21);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->straight_clearance, -0.35, TOL);
  cw_assert_near (r->engaged_in_straight, 8.0, TOL);
  g_assert_nonnull (cw_test_find (r, CW_RULE_STRAIGHT_CLEARANCE));
}

/* Taper change: consecutive powered steps with different files of one
 * taper are cautioned; hand steps and repeats of one file are exempt. */
static void
test_taper_change (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  cw_test_instrument (kase, "a", 25, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "b", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "c", 25, 0.06, CW_ALLOY_NITI, CW_MOTION_RECIPROCATING);
  cw_test_instrument (kase, "k", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "l", 20, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k", 15);
  cw_canal_add_step (canal, "l", 15);   /* hand after hand, same taper: exempt */
  cw_canal_add_step (canal, "a", 15);
  cw_canal_add_step (canal, "a", 16);   /* repeat of one file: exempt */
  cw_canal_add_step (canal, "b", 16);   /* .04 after .04: caution */
  cw_canal_add_step (canal, "c", 17);   /* .06 after .04: fine */
  cw_canal_add_step (canal, "k", 17);
  cw_canal_add_step (canal, "c", 17.5); /* after a hand step: exempt */
  res = evaluate (kase, canal);
  for (guint i = 0; i < res->steps->len; i++)
    {
      gboolean expect = i == 4;
      const CwFinding *f = cw_test_find (cw_canal_result_get_step (res, i), CW_RULE_TAPER_CHANGE);

      g_assert_cmpint (f != NULL, ==, expect);
    }
}

/* The rule set may switch the taper-change rule off. */
static void
test_taper_change_disabled (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  kase->rules.require_taper_change = FALSE;
  cw_test_instrument (kase, "a", 25, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "b", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "a", 15);
  cw_canal_add_step (canal, "b", 16);
  res = evaluate (kase, canal);
  g_assert_null (cw_test_find (cw_canal_result_get_step (res, 1), CW_RULE_TAPER_CHANGE));
}

static void
glide_path_case (const char *first_id,
                 double      first_depth,
                 gboolean    expect_caution)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  const CwFinding *f;

  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "k20", 20, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "r25", 25, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "r20", 20, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  if (first_id)
    cw_canal_add_step (canal, first_id, first_depth);
  cw_canal_add_step (canal, "r20", 13);   /* powered but above the curve */
  cw_canal_add_step (canal, "r25", 19);   /* first powered step into the curve */
  cw_canal_add_step (canal, "r20", 20);   /* later ones are not checked */
  res = evaluate (kase, canal);
  f = cw_test_find (cw_canal_result_get_step (res, first_id ? 1 : 0), CW_RULE_GLIDE_PATH);
  g_assert_null (f);
  f = cw_test_find (cw_canal_result_get_step (res, first_id ? 2 : 1), CW_RULE_GLIDE_PATH);
  g_assert_cmpint (f != NULL, ==, expect_caution);
  g_assert_null (cw_test_find (cw_canal_result_get_step (res, first_id ? 3 : 2), CW_RULE_GLIDE_PATH));
}

static void
test_glide_path (void)
{
  glide_path_case (NULL, 0, TRUE);       /* no glide path at all */
  glide_path_case ("k15", 21, FALSE);    /* 15 to length first */
  glide_path_case ("k15", 19, FALSE);    /* exactly as deep as the rotary */
  glide_path_case ("k15", 18.5, TRUE);   /* not as deep */
  glide_path_case ("k20", 21, TRUE);     /* too large to count as a glide path */
}

/* Strain: eps = d / 2R.  A 3 mm radius: 25/.04 at 15 is 0.29 mm in the curve,
 * 4.83 % (over 80 % of the 6 % NiTi limit: caution); at 17 it is 0.37 mm,
 * 6.17 % (over the limit: stop).  Stainless is not checked. */
static void
test_strain_levels (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;

  kase->rules.require_taper_change = FALSE;
  cw_canal_add_curve (canal, 14, 60, 3);
  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_test_instrument (kase, "r25", 25, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "s25", 25, 0.04, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k15", 21);
  cw_canal_add_step (canal, "r25", 14.5);
  cw_canal_add_step (canal, "r25", 15);
  cw_canal_add_step (canal, "r25", 17);
  cw_canal_add_step (canal, "s25", 17);
  res = evaluate (kase, canal);

  r = cw_canal_result_get_step (res, 1);
  cw_assert_near (r->strain, 0.27 / 6, TOL);
  g_assert_null (cw_test_find (r, CW_RULE_STRAIN));
  r = cw_canal_result_get_step (res, 2);
  cw_assert_near (r->strain, 0.29 / 6, TOL);
  g_assert_cmpint (cw_test_find (r, CW_RULE_STRAIN)->level, ==, CW_LEVEL_CAUTION);
  r = cw_canal_result_get_step (res, 3);
  cw_assert_near (r->strain, 0.37 / 6, TOL);
  g_assert_cmpint (cw_test_find (r, CW_RULE_STRAIN)->level, ==, CW_LEVEL_STOP);
  r = cw_canal_result_get_step (res, 4);
  cw_assert_near (r->strain, 0.37 / 6, TOL);
  g_assert_null (cw_test_find (r, CW_RULE_STRAIN));
}

/* Two curves: strain is the worse of d_i / 2 R_i over the curves the file
 * lies in; the largest diameter is at the first onset. */
static void
test_two_curves (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 5, 0.70, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;
  double end1 = 11 + 8 * 20 * G_PI / 180;
  double d2;

  cw_canal_add_curve (canal, 11, 20, 8);
  cw_canal_add_curve (canal, end1 + 1, 25, 4);
  cw_test_instrument (kase, "k20", 20, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k20", 20);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (res->geometry.end[0], end1, TOL);
  cw_assert_near (r->max_diameter_in_curve, 0.20 + 0.02 * 9, TOL);
  d2 = 0.20 + 0.02 * (20 - (end1 + 1));
  cw_assert_near (r->strain, MAX (0.38 / 16, d2 / 8), TOL);
  /* 0.52 mm at D16, under the 0.60 mm ceiling: no limit. */
  g_assert_true (isnan (r->ceiling_depth));
}

/* Cycles in the curve: rpm / 60 * (L - onset) / rate = 5 * 7 / 0.5 = 70 for
 * 300 rpm at 21; fatigue use = 70 / (A (100 eps)^-k) with the NiTi
 * defaults (A = 100000, k = 3.3). */
static void
test_cycles_and_fatigue (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  CwStepResult *r;
  double eps = 0.58 / 16;

  cw_test_instrument (kase, "r30", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k15", 21);
  cw_canal_add_step (canal, "r30", 21);
  res = evaluate (kase, canal);
  r = cw_canal_result_get_step (res, 1);
  cw_assert_near (r->strain, eps, TOL);
  cw_assert_near (r->cycles_in_curve, 70.0, TOL);
  cw_assert_near (r->fatigue_use, 70.0 / (100000.0 * pow (100 * eps, -3.3)), 1e-12);
  /* Hand files have no cycles. */
  g_assert_true (isnan (cw_canal_result_get_step (res, 0)->cycles_in_curve));
  g_assert_true (isnan (cw_canal_result_get_step (res, 0)->fatigue_use));
}

/* Torsion at D3: T = k tau pi d^3 / 16.  30/.04: d3 = 0.42 mm; NiTi k 0.5,
 * tau 700 MPa: 5.0915 N·mm = 0.50915 N·cm.  A 1.0 N·cm limit is above it. */
static void
test_torsion (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwInstrument *a, *b;
  double t = 0.5 * 700 * G_PI * pow (0.42, 3) / 16 / 10;

  a = cw_test_instrument (kase, "a", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  b = cw_test_instrument (kase, "b", 30, 0.06, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_test_instrument (kase, "c", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  a->torque_limit = 1.0;
  b->torque_limit = 0.5 * 700 * G_PI * pow (0.48, 3) / 16 / 10;   /* exactly at it */
  cw_canal_add_step (canal, "a", 15);
  cw_canal_add_step (canal, "b", 15);
  cw_canal_add_step (canal, "c", 16);
  res = evaluate (kase, canal);
  cw_assert_near (cw_canal_result_get_step (res, 0)->fracture_torque_d3, t, 1e-12);
  cw_assert_near (t, 0.50915, 1e-5);
  g_assert_nonnull (cw_test_find (cw_canal_result_get_step (res, 0), CW_RULE_TORSION));
  g_assert_null (cw_test_find (cw_canal_result_get_step (res, 1), CW_RULE_TORSION));
  /* No torque limit set: no check. */
  g_assert_true (isnan (cw_canal_result_get_step (res, 2)->fracture_torque_d3));
}

/* Depth beyond WL stops; exactly at WL does not.  Deeper than the file's own
 * length stops too. */
static void
test_lengths (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 22, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwInstrument *short_file;

  cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  short_file = cw_test_instrument (kase, "k10", 10, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  short_file->length = 21;
  cw_canal_add_step (canal, "k15", 22);
  cw_canal_add_step (canal, "k15", 22.5);
  cw_canal_add_step (canal, "k10", 21);
  cw_canal_add_step (canal, "k10", 21.5);
  res = evaluate (kase, canal);
  g_assert_null (cw_test_find (cw_canal_result_get_step (res, 0), CW_RULE_BEYOND_LENGTH));
  g_assert_cmpint (cw_test_find (cw_canal_result_get_step (res, 1), CW_RULE_BEYOND_LENGTH)->level,
                   ==, CW_LEVEL_STOP);
  g_assert_null (cw_test_find (cw_canal_result_get_step (res, 2), CW_RULE_INSTRUMENT_LENGTH));
  g_assert_cmpint (cw_test_find (cw_canal_result_get_step (res, 3), CW_RULE_INSTRUMENT_LENGTH)->level,
                   ==, CW_LEVEL_STOP);
}

/* A curve given by its Schneider angle runs to WL with phi = 2 x Schneider
 * and R = (WL - onset) / phi. */
static void
test_schneider_curve (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 6, 0.80, 0.20);
  CwGeometry geo;
  double phi = 2 * 20 * G_PI / 180;

  cw_canal_add_schneider (canal, 14, 20);
  cw_canal_get_geometry (canal, &geo);
  cw_assert_near (geo.phi[0], phi, TOL);
  cw_assert_near (geo.radius[0], 6 / phi, TOL);
  cw_assert_near (geo.end[0], 20, TOL);
}

/* Messages name their numbers, in the C locale. */
static void
test_messages_name_numbers (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = curved_canal (kase);
  g_autoptr(CwCanalResult) res = NULL;
  g_autofree char *ceiling = NULL;
  g_autofree char *glide = NULL;

  cw_test_instrument (kase, "r30", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "r30", 21);
  res = evaluate (kase, canal);
  ceiling = cw_finding_describe (cw_test_find (cw_canal_result_get_step (res, 0), CW_RULE_DIAMETER_CEILING), TRUE);
  g_assert_nonnull (strstr (ceiling, "21.00"));
  g_assert_nonnull (strstr (ceiling, "20.25"));
  g_assert_nonnull (strstr (ceiling, "0.55"));
  g_assert_nonnull (strstr (ceiling, "0.580"));
  glide = cw_finding_describe (cw_test_find (cw_canal_result_get_step (res, 0), CW_RULE_GLIDE_PATH), TRUE);
  g_assert_nonnull (strstr (glide, "15"));
}

/* Nothing cuts above the orifice: the access cavity has no wall. */
static void
test_orifice_bounds_engagement (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 8, 0.05, 0.05);
  g_autoptr(CwCanalResult) res = NULL;

  cw_test_instrument (kase, "k25", 25, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k25", 20);   /* flutes span [4, 20] */
  res = evaluate (kase, canal);
  cw_assert_near (cw_canal_result_get_step (res, 0)->engaged_length, 12.0, TOL);
  cw_assert_near (cw_canal_result_get_step (res, 0)->first_contact, 8.0, TOL);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/evaluate/engagement/straight", test_engagement_straight);
  g_test_add_func ("/evaluate/engagement/orifice", test_orifice_bounds_engagement);
  g_test_add_func ("/evaluate/time/first-contact", test_first_contact_time_pecks);
  g_test_add_func ("/evaluate/time/pecks-exact", test_pecks_exact_multiple);
  g_test_add_func ("/evaluate/envelope/update", test_envelope_update_and_final_shape);
  g_test_add_func ("/evaluate/final/apical-size-tolerance", test_apical_size_tolerance);
  g_test_add_func ("/evaluate/final/none-at-length", test_no_file_at_length);
  g_test_add_func ("/evaluate/ceiling/boundary", test_ceiling_depth_and_boundary);
  g_test_add_func ("/evaluate/ceiling/never-reached", test_ceiling_never_reached);
  g_test_add_func ("/evaluate/ceiling/tip-wider", test_ceiling_tip_wider);
  g_test_add_func ("/evaluate/ceiling/table", test_ceiling_table_interpolation);
  g_test_add_func ("/evaluate/ceiling/variable-taper", test_variable_taper_ceiling);
  g_test_add_func ("/evaluate/curve/above", test_above_the_curve);
  g_test_add_func ("/evaluate/curve/engagement-boundary", test_curve_engagement_boundary);
  g_test_add_func ("/evaluate/curve/two-curves", test_two_curves);
  g_test_add_func ("/evaluate/curve/schneider", test_schneider_curve);
  g_test_add_func ("/evaluate/clearance/after-coronal-step", test_straight_clearance);
  g_test_add_func ("/evaluate/clearance/first-cut", test_straight_clearance_first_cut);
  g_test_add_func ("/evaluate/sequence/taper-change", test_taper_change);
  g_test_add_func ("/evaluate/sequence/taper-change-disabled", test_taper_change_disabled);
  g_test_add_func ("/evaluate/sequence/glide-path", test_glide_path);
  g_test_add_func ("/evaluate/strain/levels", test_strain_levels);
  g_test_add_func ("/evaluate/fatigue/cycles", test_cycles_and_fatigue);
  g_test_add_func ("/evaluate/torsion/d3", test_torsion);
  g_test_add_func ("/evaluate/lengths", test_lengths);
  g_test_add_func ("/evaluate/messages", test_messages_name_numbers);

  return g_test_run ();
}
