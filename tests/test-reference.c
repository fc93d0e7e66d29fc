/* test-reference.c: the engine against the outside world
 *
 * Each check names its source.  GSL (Debian's libgsl) is used as an
 * independent numerical reference, only here in the tests.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <gsl/gsl_integration.h>
#include <math.h>
#include <stdlib.h>

#include "cw-iso.h"
#include "cw-test-util.h"

/* ISO 3630-1: standard hand files have a .02 taper over a 16 mm cutting
 * part, so D16 = D0 + 0.32 mm, for every standard size (from memory). */
static void
test_iso_3630_d16 (void)
{
  const int *sizes;
  guint n = cw_iso_standard_sizes (&sizes);

  for (guint i = 0; i < n; i++)
    {
      g_autoptr(CwInstrument) k = cw_instrument_new ("k", sizes[i], 0.02);

      cw_assert_near (cw_instrument_diameter (k, 0), sizes[i] / 100.0, 1e-12);
      cw_assert_near (cw_instrument_diameter (k, 16), sizes[i] / 100.0 + 0.32, 1e-12);
      cw_assert_near (cw_instrument_diameter (k, 3), sizes[i] / 100.0 + 0.06, 1e-12);
    }
}

/* ISO 3630-1 size series: 06, 08, 10, 15 ... 60 in steps of 5, then 70 ...
 * 140 in steps of 10 (from memory). */
static void
test_iso_3630_sizes (void)
{
  static const int expect[] = {
    6, 8, 10, 15, 20, 25, 30, 35, 40, 45, 50, 55, 60, 70, 80, 90, 100, 110, 120, 130, 140,
  };
  const int *sizes;
  guint n = cw_iso_standard_sizes (&sizes);

  g_assert_cmpuint (n, ==, G_N_ELEMENTS (expect));
  for (guint i = 0; i < n; i++)
    g_assert_cmpint (sizes[i], ==, expect[i]);
  g_assert_false (cw_iso_is_standard_size (12));
  g_assert_false (cw_iso_is_standard_size (65));
}

/* ISO 3630-1 handle colours: 06 pink, 08 grey, 10 purple, then white,
 * yellow, red, blue, green, black from 15 to 40, repeating from 45 and from
 * 90 (from memory). */
static void
test_iso_3630_colours (void)
{
  static const struct { int size; const char *colour; } table[] = {
    { 6, "pink" }, { 8, "grey" }, { 10, "purple" }, { 15, "white" }, { 20, "yellow" },
    { 25, "red" }, { 30, "blue" }, { 35, "green" }, { 40, "black" }, { 45, "white" },
    { 50, "yellow" }, { 55, "red" }, { 60, "blue" }, { 70, "green" }, { 80, "black" },
    { 90, "white" }, { 100, "yellow" }, { 110, "red" }, { 120, "blue" }, { 130, "green" },
    { 140, "black" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (table); i++)
    g_assert_cmpstr (cw_handle_colour_name (cw_iso_handle_colour (table[i].size)), ==,
                     table[i].colour);
  g_assert_cmpint (cw_iso_handle_colour (17), ==, CW_HANDLE_NONE);
}

/* ISO 3950 (FDI) to the Universal numbering: 18 = 1, 11 = 8, 21 = 9,
 * 28 = 16, 38 = 17, 36 = 19, 31 = 24, 41 = 25, 46 = 30, 48 = 32 (from memory). */
static void
test_iso_3950_universal (void)
{
  static const char *pairs[][2] = {
    { "18", "1" }, { "11", "8" }, { "21", "9" }, { "28", "16" }, { "38", "17" },
    { "36", "19" }, { "31", "24" }, { "41", "25" }, { "46", "30" }, { "48", "32" },
    { "55", "A" }, { "51", "E" }, { "61", "F" }, { "65", "J" }, { "75", "K" },
    { "71", "O" }, { "81", "P" }, { "85", "T" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (pairs); i++)
    {
      g_autofree char *u = cw_tooth_fdi_to_universal (pairs[i][0]);
      g_autofree char *f = cw_tooth_universal_to_fdi (pairs[i][1]);

      g_assert_cmpstr (u, ==, pairs[i][1]);
      g_assert_cmpstr (f, ==, pairs[i][0]);
    }
  /* Every permanent tooth maps to a distinct number 1-32 and back. */
  for (int q = 1; q <= 4; q++)
    for (int t = 1; t <= 8; t++)
      {
        char fdi[3] = { (char) ('0' + q), (char) ('0' + t), 0 };
        g_autofree char *u = cw_tooth_fdi_to_universal (fdi);
        g_autofree char *back = cw_tooth_universal_to_fdi (u);
        int number = atoi (u);

        g_assert_cmpint (number, >=, 1);
        g_assert_cmpint (number, <=, 32);
        g_assert_cmpstr (back, ==, fdi);
      }
  g_assert_false (cw_tooth_fdi_is_valid ("19"));
  g_assert_false (cw_tooth_fdi_is_valid ("56"));
  g_assert_false (cw_tooth_fdi_is_valid ("09"));
  g_assert_false (cw_tooth_universal_is_valid ("33"));
  g_assert_false (cw_tooth_universal_is_valid ("U"));
}

typedef struct
{
  double radius;
  gboolean y;
} ArcParams;

static double
arc_tangent (double s,
             void  *data)
{
  const ArcParams *p = data;

  return p->y ? sin (s / p->radius) : cos (s / p->radius);
}

/* Schneider (1971) measures the angle between the canal's first direction
 * and the line to the apex; for a circular arc that chord angle is half the
 * turning angle (Pruett et al. 1997 give curves by angle and radius).  The
 * arc is built explicitly: its end point is the integral of its unit
 * tangent, computed by GSL's adaptive quadrature. */
static void
test_schneider_half_angle (void)
{
  gsl_integration_workspace *w = gsl_integration_workspace_alloc (200);
  static const double cases[][2] = { { 20, 4 }, { 35, 6 }, { 60, 3 }, { 90, 10 }, { 140, 5 } };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      double phi = cases[i][0] * G_PI / 180, radius = cases[i][1];
      ArcParams px = { radius, FALSE }, py = { radius, TRUE };
      gsl_function fx = { arc_tangent, &px }, fy = { arc_tangent, &py };
      double ex, ey, err;

      gsl_integration_qag (&fx, 0, radius * phi, 1e-12, 1e-12, 200, GSL_INTEG_GAUSS41, w, &ex, &err);
      gsl_integration_qag (&fy, 0, radius * phi, 1e-12, 1e-12, 200, GSL_INTEG_GAUSS41, w, &ey, &err);
      cw_assert_near (atan2 (ey, ex), phi / 2, 1e-9);
      cw_assert_near (cw_curve_chord_angle (phi, radius), phi / 2, 1e-12);
      cw_assert_near (cw_schneider_to_turning (cases[i][0] / 2), cases[i][0], 1e-12);
    }
  gsl_integration_workspace_free (w);
}

typedef struct
{
  const CwProfile *profile;
  double           canal;
  gboolean         area;
} ProfileParams;

static double
profile_integrand (double x,
                   void  *data)
{
  const ProfileParams *p = data;
  double d = cw_profile_diameter (p->profile, x);

  if (p->area)
    return G_PI * d;
  return G_PI / 4 * (d * d - p->canal * p->canal);
}

static double
frustum_volume (double r1,
                double r2,
                double h)
{
  return G_PI * h * (r1 * r1 + r1 * r2 + r2 * r2) / 3;
}

static double
frustum_lateral_area (double r1,
                      double r2,
                      double h)
{
  return G_PI * (r1 + r2) * sqrt (h * h + (r1 - r2) * (r1 - r2));
}

/* Frustum volume pi h (r1^2 + r1 r2 + r2^2) / 3 and lateral area
 * pi (r1 + r2) sqrt (h^2 + (r1 - r2)^2) (handbook geometry), against the
 * engine's cut volume and contact area for a file engaged along all its
 * flutes in a narrow cylindrical canal, and against GSL quadrature.  The
 * contact area is the integral of pi d ds, which is the lateral area
 * divided by the slant factor sqrt (1 + (taper / 2)^2). */
static void
test_frustum_against_gsl (void)
{
  gsl_integration_workspace *w = gsl_integration_workspace_alloc (200);
  static const double files[][2] = { { 25, 0.02 }, { 30, 0.04 }, { 20, 0.06 }, { 40, 0.08 } };

  for (guint i = 0; i < G_N_ELEMENTS (files); i++)
    {
      g_autoptr(CwCase) kase = cw_case_new ();
      CwCanal *canal = cw_test_canal (kase, 30, 2, 0.05, 0.05);
      g_autoptr(CwCanalResult) res = NULL;
      CwStepResult *r;
      CwProfile profile;
      ProfileParams pv, pa;
      gsl_function fv, fa;
      double r1 = files[i][0] / 200, r2 = r1 + files[i][1] * 16 / 2, pr = 0.025;
      double gv, ga, err;

      cw_test_instrument (kase, "f", files[i][0], files[i][1], CW_ALLOY_STAINLESS, CW_MOTION_HAND);
      cw_canal_add_step (canal, "f", 20);
      res = cw_evaluate_canal (kase, canal);
      r = cw_canal_result_get_step (res, 0);
      cw_profile_init (&profile, g_ptr_array_index (kase->instruments, 0));
      pv = (ProfileParams) { &profile, 0.05, FALSE };
      pa = (ProfileParams) { &profile, 0.05, TRUE };
      fv = (gsl_function) { profile_integrand, &pv };
      fa = (gsl_function) { profile_integrand, &pa };
      gsl_integration_qag (&fv, 0, 16, 1e-12, 1e-12, 200, GSL_INTEG_GAUSS41, w, &gv, &err);
      gsl_integration_qag (&fa, 0, 16, 1e-12, 1e-12, 200, GSL_INTEG_GAUSS41, w, &ga, &err);

      cw_assert_near (r->engaged_length, 16, 1e-9);
      cw_assert_near (r->cut_volume, frustum_volume (r1, r2, 16) - G_PI * pr * pr * 16, 1e-9);
      cw_assert_near (r->cut_volume, gv, 1e-9);
      cw_assert_near (r->contact_area, ga, 1e-9);
      cw_assert_near (r->contact_area * sqrt (1 + pow (files[i][1] / 2, 2)),
                      frustum_lateral_area (r1, r2, 16), 1e-9);
    }
  gsl_integration_workspace_free (w);
}

/* Torsion of a solid round shaft, tau = 16 T / (pi d^3) (Timoshenko and
 * Gere, Mechanics of Materials).  Worked by hand: d = 0.42 mm, tau_u =
 * 700 MPa, section factor 0.5: T = 0.5 * 700 * pi * 0.074088 / 16
 * = 5.0915 N·mm = 0.50915 N·cm. */
static void
test_torsion_worked (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  CwInstrument *r30;
  double t;

  r30 = cw_test_instrument (kase, "r30", 30, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  r30->torque_limit = 0.4;
  cw_canal_add_step (canal, "r30", 12);
  res = cw_evaluate_canal (kase, canal);
  t = cw_canal_result_get_step (res, 0)->fracture_torque_d3;
  cw_assert_near (t, 0.50915, 5e-5);
  /* And back: the shear stress at the fracture torque is k tau_u. */
  cw_assert_near (16 * t * 10 / (G_PI * pow (0.42, 3)), 0.5 * 700, 1e-9);
}

/* Surface strain of a round bar bent to radius R: eps = d / (2 R)
 * (Timoshenko and Gere).  Worked by hand: a 30/.04 at 21 mm with the curve
 * starting at 14 mm is 0.58 mm there; on an 8 mm radius, 3.625 %. */
static void
test_bending_worked (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 22, 6, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  cw_canal_add_curve (canal, 14, 40, 8);
  cw_test_instrument (kase, "k30", 30, 0.04, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 21);
  res = cw_evaluate_canal (kase, canal);
  cw_assert_near (cw_canal_result_get_step (res, 0)->strain, 0.03625, 1e-12);
}

static double
ceiling_reach (double tip,
               double taper)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 30, 4, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;

  cw_canal_add_curve (canal, 10, 60, 15);
  cw_test_instrument (kase, "f", tip, taper, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "f", 11);
  res = cw_evaluate_canal (kase, canal);
  return cw_canal_result_get_step (res, 0)->ceiling_depth - 10;
}

/* The trade's rule of thumb (common practice, no published source): the tip
 * goes into a curve only as far as (ceiling - tip diameter) / taper, with
 * ceilings 0.60 / 0.55 / 0.50 mm for .02 / .04 / .06.  Worked examples:
 * 30/.04 reaches 6.25 mm, 20/.06 5 mm, 35/.02 12.5 mm. */
static void
test_rule_of_thumb_ceiling (void)
{
  cw_assert_near (ceiling_reach (30, 0.04), 6.25, 1e-9);
  cw_assert_near (ceiling_reach (20, 0.06), 5.0, 1e-9);
  cw_assert_near (ceiling_reach (35, 0.02), 12.5, 1e-9);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/reference/iso-3630-1/d16", test_iso_3630_d16);
  g_test_add_func ("/reference/iso-3630-1/sizes", test_iso_3630_sizes);
  g_test_add_func ("/reference/iso-3630-1/handle-colours", test_iso_3630_colours);
  g_test_add_func ("/reference/iso-3950/fdi-universal", test_iso_3950_universal);
  g_test_add_func ("/reference/schneider-1971/half-angle-gsl", test_schneider_half_angle);
  g_test_add_func ("/reference/frustum/gsl", test_frustum_against_gsl);
  g_test_add_func ("/reference/timoshenko/torsion", test_torsion_worked);
  g_test_add_func ("/reference/timoshenko/bending", test_bending_worked);
  g_test_add_func ("/reference/rule-of-thumb/ceiling-reach", test_rule_of_thumb_ceiling);

  return g_test_run ();
}
