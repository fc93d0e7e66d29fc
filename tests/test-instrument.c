/* test-instrument.c: diameter profiles of constant, segmented and capped files
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>

#include "cw-test-util.h"

static void
test_constant_profile (void)
{
  g_autoptr(CwInstrument) f = cw_instrument_new ("r", 25, 0.06);
  CwProfile p;

  cw_profile_init (&p, f);
  cw_assert_near (cw_profile_diameter (&p, 0), 0.25, 1e-15);
  cw_assert_near (cw_profile_diameter (&p, 10), 0.85, 1e-12);
  /* Past the 16 mm of flutes the shank keeps the last diameter. */
  cw_assert_near (cw_profile_diameter (&p, 20), 0.25 + 0.96, 1e-12);
  cw_assert_near (cw_profile_reach (&p, 0.55), 5, 1e-12);
  cw_assert_near (cw_profile_reach (&p, 0.20), 0, 0);
  g_assert_true (isinf (cw_profile_reach (&p, 1.5)));
  cw_assert_near (cw_profile_largest_taper (&p, 0, 16), 0.06, 1e-12);
  cw_assert_near (cw_profile_largest_taper (&p, 17, 20), 0, 0);
}

/* d(x) = D0 + integral of the taper: .08 over 4 mm, then .04. */
static void
test_segments (void)
{
  g_autoptr(CwInstrument) f = cw_instrument_new ("v", 25, NAN);
  CwTaperSegment segs[] = { { 4, 0.08 }, { 16, 0.04 } };
  CwProfile p;

  cw_instrument_set_segments (f, segs, 2);
  cw_profile_init (&p, f);
  cw_assert_near (cw_profile_diameter (&p, 2), 0.41, 1e-12);
  cw_assert_near (cw_profile_diameter (&p, 4), 0.57, 1e-12);
  cw_assert_near (cw_profile_diameter (&p, 10), 0.81, 1e-12);
  cw_assert_near (cw_profile_diameter (&p, 16), 1.05, 1e-12);
  cw_assert_near (cw_instrument_nominal_taper (f), 0.08, 0);
  cw_assert_near (cw_instrument_largest_taper (f), 0.08, 0);
  cw_assert_near (cw_profile_largest_taper (&p, 5, 9), 0.04, 1e-12);
  cw_assert_near (cw_profile_largest_taper (&p, 3, 9), 0.08, 1e-12);
  cw_assert_near (cw_profile_largest_taper (&p, 4, 4), 0.04, 1e-12);
}

/* Segments that stop short of the flutes: the last taper runs on. */
static void
test_segments_short (void)
{
  g_autoptr(CwInstrument) f = cw_instrument_new ("v", 20, NAN);
  CwTaperSegment segs[] = { { 3, 0.06 } };

  cw_instrument_set_segments (f, segs, 1);
  cw_assert_near (cw_instrument_diameter (f, 16), 0.20 + 0.96, 1e-12);
}

/* Capped at 1.0 mm: 25/.04 reaches it at 18.75 mm, past its 16 mm flutes,
 * so nothing changes; the variable file reaches it at 4 + 0.43/0.04. */
static void
test_max_flute_diameter (void)
{
  g_autoptr(CwInstrument) f = cw_instrument_new ("v", 25, NAN);
  CwTaperSegment segs[] = { { 4, 0.08 }, { 16, 0.04 } };
  CwProfile p;

  cw_instrument_set_segments (f, segs, 2);
  f->max_flute_diameter = 1.0;
  cw_profile_init (&p, f);
  cw_assert_near (cw_profile_diameter (&p, 14.75), 1.0, 1e-12);
  cw_assert_near (cw_profile_diameter (&p, 16), 1.0, 1e-12);
  cw_assert_near (cw_profile_diameter (&p, 14), 0.97, 1e-12);
  cw_assert_near (cw_profile_max_diameter (&p), 1.0, 0);
  g_assert_true (isinf (cw_profile_reach (&p, 1.0)));
  cw_assert_near (cw_profile_largest_taper (&p, 15, 16), 0, 0);
}

static void
test_names (void)
{
  CwAlloy a;
  CwMotion m;

  for (int i = 0; i < CW_N_ALLOYS; i++)
    {
      g_assert_true (cw_alloy_from_string (cw_alloy_to_string (i), &a));
      g_assert_cmpint (a, ==, i);
    }
  for (int i = 0; i < CW_N_MOTIONS; i++)
    {
      g_assert_true (cw_motion_from_string (cw_motion_to_string (i), &m));
      g_assert_cmpint (m, ==, i);
    }
  g_assert_false (cw_alloy_from_string ("titanium", &a));
  g_assert_false (cw_motion_from_string ("oscillating", &m));
  g_assert_cmpstr (cw_alloy_to_string (CW_ALLOY_NITI_HEAT_TREATED), ==, "niti-heat-treated");
}

static void
test_copy (void)
{
  g_autoptr(CwInstrument) f = cw_instrument_new ("v", 25, NAN);
  g_autoptr(CwInstrument) c = NULL;
  CwTaperSegment segs[] = { { 4, 0.08 }, { 16, 0.04 } };

  cw_instrument_set_segments (f, segs, 2);
  f->label = g_strdup ("variable");
  c = cw_instrument_copy (f);
  g_assert_cmpstr (c->label, ==, "variable");
  g_assert_true (c->segments != f->segments);
  g_assert_cmpuint (c->segments->len, ==, 2);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/instrument/profile/constant", test_constant_profile);
  g_test_add_func ("/instrument/profile/segments", test_segments);
  g_test_add_func ("/instrument/profile/segments-short", test_segments_short);
  g_test_add_func ("/instrument/profile/max-flute-diameter", test_max_flute_diameter);
  g_test_add_func ("/instrument/names", test_names);
  g_test_add_func ("/instrument/copy", test_copy);

  return g_test_run ();
}
