/* test-crosscheck.c: an independent, sampled evaluation of a sequence,
 * compared with the engine on random cases
 *
 * Everything below the engine's public structs is computed here again from
 * the definitions of the engine contract (shared engine.md, sections 1-3),
 * on a grid of XC_H mm, without the engine's closed forms: the envelope is
 * kept at cell midpoints, lengths, areas and volumes are midpoint sums, the
 * first contact is found by scanning tip positions on the grid.  Each figure
 * of each step, the findings and the canal's final figures must agree with
 * cw_evaluate_canal () within the grid's resolution.
 *
 * Where engine.md can be read two ways, the reading taken here is marked
 * "AMBIGUOUS" with the other reading beside it: the taper a rule names for a
 * variable-taper file (xc_rule_taper), a tip exactly on the onset
 * (xc_curve_figures), a widest flute exactly at the ceiling
 * (xc_ceiling_depth), the flutes past the last taper segment (xc_diameter),
 * the straight part of E in a canal with no curve (all of E, past WL too)
 * and in a curved one (only [s_o, first onset): E between two curves or
 * below the last one is in neither part).
 *
 * Exact ties (d(x) = P(s) + tol at a point or along a piece, the widest
 * flute at the ceiling) are met often, since lengths are typed to 0.01 mm,
 * depths lie on a 0.5 mm grid and the tolerance is 0.01 mm.  This file
 * takes the exact reading of the strict inequalities (a tie is not a
 * contact, a file at the ceiling is not over it) and compares tie steps
 * like any other; the report names them "[contact tie]" or "[ceiling tie]",
 * and /crosscheck/tie/ pins one small case of each kind, worked by hand.
 *
 * CW_CROSSCHECK_SEED, CW_CROSSCHECK_CASES and CW_CROSSCHECK_ONLY (a case
 * index, printed step by step) run other or more cases.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-test"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cw-test-util.h"

#ifndef XC_H
#define XC_H 0.0005            /* grid step, mm */
#endif
#define XC_TIE 1e-9            /* "a > b" means a > b + XC_TIE: exact ties do not count */
#define XC_N_CASES 1000

/* Exact ties (see xc_has_point_tie): named in the report, still compared. */
#define XC_TIE_CONTACT 1      /* d(x) = P(s) + tol at a point or along a piece */
#define XC_TIE_CEILING 2      /* the widest flute exactly at the ceiling */
#define XC_SEED 20260611

/* Tolerances of the comparison (the brief's). */
#define XC_TOL_LENGTH 0.005
#define XC_TOL_DIAMETER 0.001
#define XC_TOL_RELATIVE 0.01
#define XC_TOL_STRAIN 0.0002
#define XC_TOL_CONTACT 0.005

typedef struct
{
  guint  n;
  double onset[CW_MAX_CURVES];
  double end[CW_MAX_CURVES];
  double radius[CW_MAX_CURVES];
} XcCurves;

typedef struct
{
  const CwInstrument *file;
  double              depth;
} XcDone;

typedef struct
{
  const CwCase  *kase;
  const CwCanal *canal;
  const CwRules *rules;
  XcCurves       curves;
  double        *p;           /* envelope at the cell midpoints (i + 1/2) h */
  gint64         n_cells;
  GArray        *done;        /* XcDone, the steps so far */
  gboolean       glide_checked;
} XcState;

/* A figure NAN is null.  level[] is -1 where the rule says nothing (ok);
 * unsure[] is set where the grid cannot decide the rule (the deciding
 * figure lies within the grid's resolution of its threshold). */
typedef struct
{
  double   engaged, in_curve, in_straight, area, volume;
  double   max_diameter, ceiling, ceiling_depth, clearance, strain;
  double   cycles, fatigue, torque, first_contact, time;
  double   largest_taper;
  guint    pecks;
  gboolean pecks_unsure;
  int      level[CW_N_RULES];
  int      alt_level[CW_N_RULES];   /* under the other reading of an AMBIGUOUS point */
  gboolean unsure[CW_N_RULES];
  double   length_error;       /* bound of the grid's error on the lengths */
  double   area_error;
  double   volume_error;
  guint    ties;               /* XC_TIE_CONTACT | XC_TIE_CEILING */
} XcStep;

/* ---------------------------------------------------------------- model */

/* d(x), engine.md section 1.  AMBIGUOUS: past the end of the last taper
 * segment but inside the flutes (the loader allows a last "to" short of the
 * flute length), the last segment's taper is taken to go on, as the engine
 * does; the other reading would hold the diameter there (taper 0). */
static double
xc_diameter (const CwInstrument *f,
             double              x)
{
  double d = f->tip / 100.0;

  x = CLAMP (x, 0.0, f->flute_length);
  if (f->segments != NULL && f->segments->len > 0)
    {
      double from = 0.0, last = 0.0;

      for (guint k = 0; k < f->segments->len && from < x; k++)
        {
          const CwTaperSegment *seg = &g_array_index (f->segments, CwTaperSegment, k);
          double to = MIN (seg->to, x);

          if (to > from)
            d += seg->taper * (to - from);
          from = MAX (from, seg->to);
          last = seg->taper;
        }
      if (from < x)
        d += last * (x - from);
    }
  else
    {
      d += f->taper * x;
    }
  if (!isnan (f->max_flute_diameter))
    d = MIN (d, f->max_flute_diameter);
  return d;
}

/* The slope of d at x (from the right): 0 on the shank and where capped. */
static double
xc_local_taper (const CwInstrument *f,
                double              x)
{
  double from = 0.0, taper = f->taper;

  if (x >= f->flute_length)
    return 0.0;
  if (!isnan (f->max_flute_diameter) && xc_diameter (f, x) >= f->max_flute_diameter - 1e-12)
    return 0.0;
  if (f->segments == NULL || f->segments->len == 0)
    return taper;
  for (guint k = 0; k < f->segments->len; k++)
    {
      const CwTaperSegment *seg = &g_array_index (f->segments, CwTaperSegment, k);

      taper = seg->taper;
      if (x >= from && x < seg->to)
        return taper;
      from = seg->to;
    }
  return taper;
}

/* The one taper a rule names for a file.  AMBIGUOUS for a variable taper:
 * engine.md says only "taper" in the small-file exemption ("tip <= 20 and
 * taper <= .04") and in the taper-change rule ("should differ in taper").
 * Reading A: the largest taper along the flutes (a file with any .06 part
 * is not small).  Reading B: the tip segment's taper, the one a variable-
 * taper file is usually called by.  Where the readings decide differently,
 * either finding is accepted (counted as "ambiguous" in the log). */
typedef enum
{
  XC_TAPER_LARGEST,
  XC_TAPER_TIP,
} XcTaperReading;

static double
xc_rule_taper (const CwInstrument *f,
               XcTaperReading      reading)
{
  double t = 0.0;

  if (f->segments == NULL || f->segments->len == 0)
    return f->taper;
  if (reading == XC_TAPER_TIP)
    return g_array_index (f->segments, CwTaperSegment, 0).taper;
  for (guint k = 0; k < f->segments->len; k++)
    t = MAX (t, g_array_index (f->segments, CwTaperSegment, k).taper);
  return t;
}

static gboolean
xc_powered (const CwInstrument *f)
{
  return f->motion == CW_MOTION_ROTARY || f->motion == CW_MOTION_RECIPROCATING;
}

/* P0(s), engine.md section 2: constant beyond the ends. */
static double
xc_natural (const CwCanal *c,
            double         s)
{
  const CwPoint *pt;
  guint n;

  if (c->diameters == NULL || c->diameters->len == 0)
    {
      double so = c->orifice_depth, wl = c->working_length;

      if (s <= so)
        return c->orifice_diameter;
      if (s >= wl)
        return c->apical_diameter;
      return c->orifice_diameter + (c->apical_diameter - c->orifice_diameter) * (s - so) / (wl - so);
    }
  pt = (const CwPoint *) c->diameters->data;
  n = c->diameters->len;
  if (s <= pt[0].s)
    return pt[0].v;
  for (guint k = 1; k < n; k++)
    if (s <= pt[k].s)
      return pt[k - 1].v + (pt[k].v - pt[k - 1].v) * (s - pt[k - 1].s) / (pt[k].s - pt[k - 1].s);
  return pt[n - 1].v;
}

static void
xc_get_curves (const CwCanal *c,
               XcCurves      *g)
{
  g->n = c->n_curves;
  for (guint k = 0; k < c->n_curves; k++)
    {
      const CwCurve *cv = &c->curves[k];
      double phi, r;

      if (!isnan (cv->angle))
        {
          phi = cv->angle * G_PI / 180.0;
          r = cv->radius;
        }
      else
        {
          phi = 2.0 * cv->schneider_angle * G_PI / 180.0;
          r = (c->working_length - cv->onset) / phi;
        }
      g->onset[k] = cv->onset;
      g->radius[k] = r;
      g->end[k] = cv->onset + r * phi;
    }
}

static gboolean
xc_in_curve (const XcCurves *g,
             double          s)
{
  for (guint k = 0; k < g->n; k++)
    if (s >= g->onset[k] && s <= g->end[k])
      return TRUE;
  return FALSE;
}

/* The rule set's ceiling table, read as points (taper, diameter) sorted here
 * by taper; linear between rows, the nearest row outside. */
static double
xc_ceiling (const CwRules *r,
            double         taper,
            gboolean      *outside)
{
  double t[CW_MAX_CEILING_ROWS], c[CW_MAX_CEILING_ROWS];
  guint n = r->n_ceilings;

  g_assert (n > 0 && n <= CW_MAX_CEILING_ROWS);
  for (guint i = 0; i < n; i++)
    {
      guint j = i;

      while (j > 0 && t[j - 1] > r->ceiling_taper[i])
        {
          t[j] = t[j - 1];
          c[j] = c[j - 1];
          j--;
        }
      t[j] = r->ceiling_taper[i];
      c[j] = r->ceiling_diameter[i];
    }
  *outside = taper < t[0] - CW_TAPER_EPSILON || taper > t[n - 1] + CW_TAPER_EPSILON;
  if (taper <= t[0])
    return c[0];
  for (guint i = 1; i < n; i++)
    if (taper <= t[i])
      return c[i - 1] + (c[i] - c[i - 1]) * (taper - t[i - 1]) / (t[i] - t[i - 1]);
  return c[n - 1];
}

/* The envelope at one point, from its definition (not from the grid): the
 * natural diameter raised by every earlier step over its fluted part, the
 * closed interval [L - flute, L], so that a point on the edge of a cut
 * takes the cut's value. */
static double
xc_envelope_at (const XcState *st,
                double         s)
{
  double v = xc_natural (st->canal, s);

  for (guint k = 0; k < st->done->len; k++)
    {
      const XcDone *dn = &g_array_index (st->done, XcDone, k);

      if (s >= dn->depth - dn->file->flute_length && s <= dn->depth)
        v = MAX (v, xc_diameter (dn->file, dn->depth - s));
    }
  return v;
}

static gint64
xc_first_cell_at_or_after (double s)
{
  return (gint64) MAX (0.0, ceil (s / XC_H - 0.5));
}

static double
xc_cell_s (gint64 i)
{
  return (i + 0.5) * XC_H;
}

/* ----------------------------------------------------------- one step */

typedef struct
{
  const CwInstrument *f;
  double             *d;       /* d((j + 1/2) h) for j < n */
  gint64              n;
  double              d_end;   /* d past the flutes */
} XcTable;

static void
xc_table_init (XcTable            *tab,
               const CwInstrument *f)
{
  tab->f = f;
  tab->n = (gint64) floor (f->flute_length / XC_H + 0.5);
  tab->d = g_new (double, tab->n);
  for (gint64 j = 0; j < tab->n; j++)
    tab->d[j] = xc_diameter (f, (j + 0.5) * XC_H);
  tab->d_end = xc_diameter (f, f->flute_length);
}

static double
xc_table_get (const XcTable *tab,
              gint64         j)
{
  return j < tab->n ? tab->d[j] : tab->d_end;
}

static void
xc_add (GArray *a,
        double  v)
{
  g_array_append_val (a, v);
}

/* An exact tie, d(x) = P(s) + tol, at a pair of breakpoints that the tip
 * reaches on its way to the depth: there the spec's strict ">" is decided
 * by rounding in any floating-point implementation.  Such steps are still
 * compared (this side takes the exact reading: a tie does not touch); the
 * flag only names them in the report. */
static gboolean
xc_has_point_tie (const XcState *st,
                  const XcTable *tab,
                  double         depth)
{
  const CwInstrument *f = tab->f;
  const CwCanal *c = st->canal;
  double tol = st->rules->contact_tolerance;
  g_autoptr(GArray) ss = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) xs = g_array_new (FALSE, FALSE, sizeof (double));
  gboolean tie = FALSE;

  xc_add (ss, c->orifice_depth);
  xc_add (ss, c->working_length);
  xc_add (ss, depth);
  xc_add (ss, depth - f->flute_length);
  for (guint k = 0; c->diameters != NULL && k < c->diameters->len; k++)
    xc_add (ss, g_array_index (c->diameters, CwPoint, k).s);
  for (guint k = 0; k < st->done->len; k++)
    {
      const XcDone *dn = &g_array_index (st->done, XcDone, k);

      xc_add (ss, dn->depth);
      xc_add (ss, dn->depth - dn->file->flute_length);
    }
  /* the kinks of P where two cuts cross: where the grid's second difference
   * is not zero, the crossing of the lines through the cells either side */
  for (gint64 i = 2; i + 2 < st->n_cells && xc_cell_s (i) < depth + 1; i++)
    {
      const double *p = st->p;
      double a1, a2, x;

      if (fabs (p[i + 1] - 2 * p[i] + p[i - 1]) < 1e-12)
        continue;
      a1 = (p[i - 1] - p[i - 2]) / XC_H;
      a2 = (p[i + 2] - p[i + 1]) / XC_H;
      if (fabs (a1 - a2) < 1e-9)
        continue;
      x = (p[i + 1] - p[i - 1] - a2 * 2 * XC_H) / (a1 - a2);   /* from s_{i-1} */
      if (x >= 0 && x <= 3 * XC_H)
        xc_add (ss, xc_cell_s (i - 1) + x);
    }
  xc_add (xs, 0.0);
  xc_add (xs, f->flute_length);
  for (guint k = 0; f->segments != NULL && k < f->segments->len; k++)
    xc_add (xs, g_array_index (f->segments, CwTaperSegment, k).to);
  if (!isnan (f->max_flute_diameter))
    {
      double a = 0.0, b = f->flute_length;

      for (int it = 0; it < 80; it++)
        {
          double m = (a + b) / 2;

          if (xc_diameter (f, m) >= f->max_flute_diameter)
            b = m;
          else
            a = m;
        }
      xc_add (xs, b);
    }
  for (guint k = 0, n = ss->len; k < n; k++)
    xc_add (xs, depth - g_array_index (ss, double, k));
  for (guint k = 0, n = xs->len; k < n; k++)
    xc_add (ss, depth - g_array_index (xs, double, k));

  for (guint i = 0; i < ss->len && !tie; i++)
    for (int side = -1; side <= 1 && !tie; side++)
      {
        double s = g_array_index (ss, double, i);
        double p;

        if (s < c->orifice_depth - 1e-12 || s > depth + 1e-12)
          continue;
        p = xc_envelope_at (st, s + side * 1e-9);
        for (guint j = 0; j < xs->len && !tie; j++)
          {
            double x = g_array_index (xs, double, j);

            if (x < -1e-12 || x > f->flute_length + 1e-12 || s + x > depth + 1e-9)
              continue;
            if (fabs (xc_diameter (f, x) - p - tol) < 1e-8)
              tie = TRUE;
          }
      }
  return tie;
}

/* Items 1-3 and 6: the engaged set, its measures, and the clearance. */
static void
xc_engagement (const XcState *st,
               const XcTable *tab,
               double         depth,
               XcStep        *o)
{
  const CwCanal *c = st->canal;
  double tol = st->rules->contact_tolerance;
  double sc = st->curves.n > 0 ? st->curves.onset[0] : INFINITY;
  double lo = MAX (c->orifice_depth, depth - tab->f->flute_length);
  gint64 k = llround (depth / XC_H);
  gint64 i0 = xc_first_cell_at_or_after (lo);
  double clearance = INFINITY, straight_margin = -INFINITY, curve_margin = -INFINITY;
  double dmax = 0.0, vmax = 0.0;
  gboolean was = FALSE, has_clear = FALSE;
  guint crossings = 0, crossings_curve = 0;

  o->engaged = o->in_curve = o->in_straight = o->area = o->volume = 0.0;
  o->ties = 0;
  for (gint64 i = i0; i < k && i < st->n_cells; i++)
    {
      double s = xc_cell_s (i);
      double dd = xc_table_get (tab, k - 1 - i);
      double pp = st->p[i];
      double m = dd - pp - tol;
      gboolean eng = m > XC_TIE;
      gboolean curve = xc_in_curve (&st->curves, s);
      gboolean straight = st->curves.n == 0 || s < sc;

      if (fabs (m) < 1e-7)
        o->ties |= XC_TIE_CONTACT;
      if (eng != was)
        {
          crossings++;
          if (curve)
            crossings_curve++;
        }
      was = eng;
      dmax = MAX (dmax, dd);
      if (straight)
        straight_margin = MAX (straight_margin, m);
      if (curve)
        curve_margin = MAX (curve_margin, m);
      if (eng)
        {
          o->engaged += XC_H;
          o->area += G_PI * dd * XC_H;
          o->volume += G_PI / 4 * (dd * dd - pp * pp) * XC_H;
          vmax = MAX (vmax, G_PI / 4 * (dd * dd - pp * pp));
          if (curve)
            o->in_curve += XC_H;
          if (straight)
            o->in_straight += XC_H;
        }
      if (depth > sc && s < sc)
        {
          clearance = MIN (clearance, pp - dd);
          has_clear = TRUE;
        }
    }
  /* Each change of state, and each end of the window, costs at most a cell. */
  o->length_error = (crossings + 3 + 2 * st->curves.n) * XC_H;
  o->area_error = o->length_error * G_PI * dmax;
  o->volume_error = o->length_error * vmax;
  o->clearance = NAN;
  if (depth > sc && lo < sc)
    {
      /* the closed end of [lo, sc) exactly, where P may be steep */
      clearance = MIN (clearance, xc_envelope_at (st, lo) - xc_diameter (tab->f, depth - lo));
      if (!has_clear)   /* shorter than a cell */
        clearance = MIN (clearance, xc_envelope_at (st, (lo + sc) / 2) - xc_diameter (tab->f, depth - (lo + sc) / 2));
      o->clearance = clearance;
    }
  /* A cut narrower than a cell, or a tie, is beyond the grid. */
  o->unsure[CW_RULE_STRAIGHT_CLEARANCE] = o->in_straight == 0.0 && straight_margin > -XC_H;
  o->unsure[CW_RULE_CURVE_ENGAGEMENT] = (o->in_curve == 0.0 && curve_margin > -XC_H) ||
    fabs (o->in_curve - st->rules->curve_engagement_max) <= (crossings_curve + 2 + 2 * st->curves.n) * XC_H;
}

/* Item 4: the largest diameter in the curve(s) (whole file, engaged or not),
 * the largest local taper of the part inside them, and item 7, the strain. */
static void
xc_curve_figures (const XcState *st,
                  const XcTable *tab,
                  double         depth,
                  double        *max_diameter,
                  double        *largest_taper,
                  double        *strain)
{
  const CwInstrument *f = tab->f;
  gint64 k = llround (depth / XC_H);

  *max_diameter = *largest_taper = *strain = NAN;
  for (guint c = 0; c < st->curves.n; c++)
    {
      double a = st->curves.onset[c];
      double b = MIN (st->curves.end[c], depth);
      double top = MAX (a, depth - f->length);   /* the file's own length */
      double dc, tc;

      /* AMBIGUOUS at a tip exactly on the onset: "s in the curve and
       * s <= L" is then the one point s_c, so the figures are those of the
       * tip (d(0), the taper at the tip, d(0) / 2R), as the engine has it;
       * the other reading ("the part of the file inside the curve" has no
       * length) would leave them null, like a tip above the curve. */
      if (depth < a || top > b)
        continue;
      /* Over s in [top, b]: both ends, and every cell midpoint between. */
      dc = MAX (xc_diameter (f, depth - top), xc_diameter (f, depth - b));
      tc = MAX (xc_local_taper (f, depth - b + 1e-9), xc_local_taper (f, MAX (0.0, depth - top - 1e-9)));
      for (gint64 i = xc_first_cell_at_or_after (top); xc_cell_s (i) <= b; i++)
        {
          dc = MAX (dc, xc_table_get (tab, k - 1 - i));
          tc = MAX (tc, xc_local_taper (f, depth - xc_cell_s (i)));
        }
      *max_diameter = isnan (*max_diameter) ? dc : MAX (*max_diameter, dc);
      *largest_taper = isnan (*largest_taper) ? tc : MAX (*largest_taper, tc);
      *strain = isnan (*strain) ? dc / (2 * st->curves.radius[c]) : MAX (*strain, dc / (2 * st->curves.radius[c]));
    }
}

/* Item 5: the deepest tip position at which the largest diameter in the
 * curve stays at or under the ceiling.  AMBIGUOUS when the file's widest
 * flute is exactly at the ceiling (d(flute) = ceiling, or a cap equal to
 * it): the formula s_c + x_ceil with d(x_ceil) = ceiling gives a depth, but
 * the definition ("the deepest tip position at which [it] stays at or
 * under") has none, since the file is never over the ceiling at any depth.
 * The definition is taken here (null, and no stop), as the engine does; the
 * other reading would stop a file that is never wider than the ceiling. */
static double
xc_ceiling_depth (const XcState      *st,
                  const CwInstrument *f,
                  double              ceiling)
{
  double a = 0.0, b = f->flute_length;

  if (xc_diameter (f, f->flute_length) <= ceiling + XC_TIE)
    return NAN;
  if (xc_diameter (f, 0) >= ceiling)
    return st->curves.onset[0];
  for (int it = 0; it < 80; it++)
    {
      double m = (a + b) / 2;

      if (xc_diameter (f, m) >= ceiling)
        b = m;
      else
        a = m;
    }
  return st->curves.onset[0] + b;
}

/* Item 8: the first contact, scanning the tip down the grid t = m h.  With
 * the tip at t, wall point s_i (a cell midpoint) meets the file at
 * x = t - s_i, a half-grid point (j + 1/2) h.  Since d never falls along the
 * flutes, s_i is touched from the first such x with d(x) > P(s_i) + tol until
 * x leaves the flutes: so the shallowest touching t is the least, over the
 * cells, of s_i + that x, which a binary search in the table finds. */
static double
xc_first_contact (const XcState *st,
                  const XcTable *tab,
                  double         depth)
{
  double tol = st->rules->contact_tolerance;
  gint64 k = llround (depth / XC_H);
  gint64 best = G_MAXINT64;

  for (gint64 i = xc_first_cell_at_or_after (st->canal->orifice_depth); i < k && i < st->n_cells; i++)
    {
      double v = st->p[i] + tol + XC_TIE;
      gint64 lo = 0, hi = tab->n - 1;

      if (tab->n == 0 || tab->d[hi] <= v)
        continue;
      while (lo < hi)
        {
          gint64 mid = (lo + hi) / 2;

          if (tab->d[mid] > v)
            hi = mid;
          else
            lo = mid + 1;
        }
      /* a tip at (i + j + 1) h; an x on the first half cell counts from the tip */
      if (lo == 0 && tab->d[0] > v)
        best = MIN (best, i + 1);
      else if (i + lo + 1 <= k)
        best = MIN (best, i + lo + 1);
    }
  {
    /* The orifice itself, exactly: a steep P there moves the first touch
     * by |P'| h / taper, more than the grid's resolution. */
    double so = st->canal->orifice_depth;
    double v = xc_envelope_at (st, so) + tol + XC_TIE;
    double a = 0.0, b = tab->f->flute_length, t0 = INFINITY;

    if (xc_diameter (tab->f, 0) > v)
      t0 = so;
    else if (xc_diameter (tab->f, b) > v)
      {
        for (int it = 0; it < 80; it++)
          {
            double m = (a + b) / 2;

            if (xc_diameter (tab->f, m) > v)
              b = m;
            else
              a = m;
          }
        t0 = so + b;
      }
    if (t0 <= depth && (best == G_MAXINT64 || t0 < best * XC_H))
      return t0;
  }
  return best == G_MAXINT64 || best > k ? NAN : best * XC_H;
}

static void
xc_raise (XcState       *st,
          const XcTable *tab,
          double         depth)
{
  gint64 k = llround (depth / XC_H);

  for (gint64 i = xc_first_cell_at_or_after (depth - tab->f->flute_length); i < k && i < st->n_cells; i++)
    st->p[i] = MAX (st->p[i], xc_table_get (tab, k - 1 - i));
}

static void
xc_findings (XcState            *st,
             const CwInstrument *f,
             double              depth,
             gboolean            ceiling_outside,
             const XcDone       *previous,
             XcStep             *o)
{
  const CwRules *r = st->rules;
  const CwAlloyRules *alloy = &r->alloys[f->alloy];
  double sc = st->curves.n > 0 ? st->curves.onset[0] : INFINITY;
  gboolean small[2];

  for (int rd = 0; rd < 2; rd++)
    {
      small[rd] = f->tip <= r->small_file_tip_max &&
                  xc_rule_taper (f, rd) <= r->small_file_taper_max + CW_TAPER_EPSILON;
      if (!small[rd] && o->in_curve > r->curve_engagement_max)
        (rd == XC_TAPER_LARGEST ? o->level : o->alt_level)[CW_RULE_CURVE_ENGAGEMENT] = CW_LEVEL_STOP;
    }
  if (small[0] && small[1])
    o->unsure[CW_RULE_CURVE_ENGAGEMENT] = FALSE;
  if (!isnan (o->ceiling_depth) && depth > o->ceiling_depth + XC_TIE)
    o->level[CW_RULE_DIAMETER_CEILING] = CW_LEVEL_STOP;
  if (!isnan (o->ceiling) && ceiling_outside)
    o->level[CW_RULE_CEILING_TABLE] = CW_LEVEL_CAUTION;
  if (depth > sc && o->in_straight > 0.0)
    o->level[CW_RULE_STRAIGHT_CLEARANCE] = CW_LEVEL_CAUTION;
  if (depth <= sc)
    o->unsure[CW_RULE_STRAIGHT_CLEARANCE] = FALSE;
  for (int rd = 0; rd < 2; rd++)
    if (r->require_taper_change && xc_powered (f) && previous != NULL && xc_powered (previous->file) &&
        previous->file != f && fabs (xc_rule_taper (previous->file, rd) - xc_rule_taper (f, rd)) < CW_TAPER_EPSILON)
      (rd == XC_TAPER_LARGEST ? o->level : o->alt_level)[CW_RULE_TAPER_CHANGE] = CW_LEVEL_CAUTION;
  if (!st->glide_checked && xc_powered (f) && depth > sc)
    {
      gboolean ok = FALSE;

      for (guint k = 0; k < st->done->len; k++)
        {
          const XcDone *dn = &g_array_index (st->done, XcDone, k);

          if (dn->file->tip <= r->glide_path_tip_max && dn->depth >= depth - XC_TIE)
            ok = TRUE;
        }
      if (!ok)
        o->level[CW_RULE_GLIDE_PATH] = CW_LEVEL_CAUTION;
      st->glide_checked = TRUE;
    }
  if (!isnan (alloy->strain_limit) && !isnan (o->strain))
    {
      if (o->strain > alloy->strain_limit + XC_TIE)
        o->level[CW_RULE_STRAIN] = CW_LEVEL_STOP;
      else if (o->strain > 0.8 * alloy->strain_limit + XC_TIE)
        o->level[CW_RULE_STRAIN] = CW_LEVEL_CAUTION;
    }
  if (!isnan (o->torque) && f->torque_limit > o->torque + XC_TIE)
    o->level[CW_RULE_TORSION] = CW_LEVEL_CAUTION;
  if (depth > st->canal->working_length + XC_TIE)
    o->level[CW_RULE_BEYOND_LENGTH] = CW_LEVEL_STOP;
  if (depth > f->length + XC_TIE)
    o->level[CW_RULE_INSTRUMENT_LENGTH] = CW_LEVEL_STOP;
}

static void
xc_step (XcState            *st,
         const CwInstrument *f,
         double              depth,
         XcStep             *o)
{
  const CwRules *r = st->rules;
  const CwAlloyRules *alloy = &r->alloys[f->alloy];
  double sc = st->curves.n > 0 ? st->curves.onset[0] : NAN;
  const XcDone *previous = st->done->len > 0 ? &g_array_index (st->done, XcDone, st->done->len - 1) : NULL;
  XcTable tab;
  XcDone dn = { f, depth };
  double largest_taper, advance;
  gboolean outside = FALSE;

  for (int q = 0; q < CW_N_RULES; q++)
    {
      o->level[q] = o->alt_level[q] = -1;
      o->unsure[q] = FALSE;
    }
  xc_table_init (&tab, f);
  xc_engagement (st, &tab, depth, o);
  if (xc_has_point_tie (st, &tab, depth))
    o->ties |= XC_TIE_CONTACT;
  xc_curve_figures (st, &tab, depth, &o->max_diameter, &largest_taper, &o->strain);
  o->largest_taper = largest_taper;
  o->ceiling = o->ceiling_depth = NAN;
  if (!isnan (largest_taper))
    {
      o->ceiling = xc_ceiling (r, largest_taper, &outside);
      o->ceiling_depth = xc_ceiling_depth (st, f, o->ceiling);
      if (fabs (xc_diameter (f, f->flute_length) - o->ceiling) < 1e-8)
        o->ties |= XC_TIE_CEILING;
    }

  o->first_contact = xc_first_contact (st, &tab, depth);
  advance = isnan (o->first_contact) ? 0.0 : depth - o->first_contact;
  o->time = advance / r->advance_rate + r->changeover;
  o->pecks = (guint) ceil (advance / r->peck_increment - 1e-12);
  {
    double q = advance / r->peck_increment;

    o->pecks_unsure = !isnan (o->first_contact) && fabs (q - round (q)) * r->peck_increment <= 2 * XC_H;
  }

  o->cycles = o->fatigue = o->torque = NAN;
  if (xc_powered (f) && st->curves.n > 0)
    {
      o->cycles = f->rpm / 60.0 * MAX (0.0, depth - sc) / r->advance_rate;
      if (o->cycles == 0.0)
        o->fatigue = 0.0;
      else if (!isnan (alloy->strain_life_a) && !isnan (o->strain))
        o->fatigue = o->cycles / (alloy->strain_life_a * pow (100 * o->strain, -alloy->strain_life_k));
    }
  if (xc_powered (f) && !isnan (f->torque_limit))
    o->torque = alloy->section_factor * alloy->shear_strength * G_PI * pow (xc_diameter (f, 3), 3) / 16 / 10;

  xc_findings (st, f, depth, outside, previous, o);
  for (int q = 0; q < CW_N_RULES; q++)
    if (q != CW_RULE_CURVE_ENGAGEMENT && q != CW_RULE_TAPER_CHANGE)
      o->alt_level[q] = o->level[q];
  xc_raise (st, &tab, depth);
  g_array_append_val (st->done, dn);
  g_free (tab.d);
}

/* ------------------------------------------------------------- compare */

typedef struct
{
  guint  count;
  char  *example;
} XcClass;

typedef struct
{
  GHashTable *classes;        /* name -> XcClass */
  guint       steps, cases, unsure_rules, unsure_pecks, ties, ambiguous;
  guint       seen[CW_N_RULES];   /* coverage: findings met, by rule */
  guint       seen_capped_taper, seen_tip_wider, seen_clearance_empty, seen_engaged, seen_contact;
  const char *describe;       /* the current case, for the examples */
  guint       tie;            /* the current step's exact ties */
  guint       case_tie;       /* those of every step of the current case */
  gboolean    verbose;
  guint       case_index, step_index;
} XcReport;

static void
xc_class_free (gpointer data)
{
  XcClass *cl = data;

  g_free (cl->example);
  g_free (cl);
}

static void
xc_disagree (XcReport   *rep,
             const char *name,
             const char *detail)
{
  g_autofree char *key = g_strdup_printf ("%s%s%s", name,
                                          rep->tie & XC_TIE_CONTACT ? " [contact tie]" : "",
                                          rep->tie & XC_TIE_CEILING ? " [ceiling tie]" : "");
  XcClass *cl = g_hash_table_lookup (rep->classes, key);

  if (cl == NULL)
    {
      cl = g_new0 (XcClass, 1);
      cl->example = g_strdup_printf ("case %u, step %u: %s\n%s", rep->case_index, rep->step_index,
                                     detail, rep->describe);
      g_hash_table_insert (rep->classes, g_strdup (key), cl);
    }
  cl->count++;
}

static void
xc_compare (XcReport   *rep,
            const char *what,
            double      mine,
            double      engine,
            double      tol)
{
  g_autofree char *detail = NULL;
  g_autofree char *name = NULL;

  if (isnan (mine) && isnan (engine))
    return;
  if (!isnan (mine) && !isnan (engine) && fabs (mine - engine) <= tol)
    return;
  detail = g_strdup_printf ("%s: crosscheck %.6g, engine %.6g", what, mine, engine);
  name = g_strdup_printf ("%s%s", what,
                          isnan (mine) ? " (null here)" : isnan (engine) ? " (null in engine)" : "");
  xc_disagree (rep, name, detail);
}

static double
xc_rel (double value,
        double floor_)
{
  return MAX (XC_TOL_RELATIVE * fabs (value), floor_);
}

static void
xc_compare_step (XcReport           *rep,
                 const CwRules      *rules,
                 const XcStep       *o,
                 const CwStepResult *r)
{
  int level[CW_N_RULES];

  rep->tie = o->ties;
  rep->case_tie |= o->ties;
  if (rep->verbose)
    g_printerr ("step %u %s@%g: E %.5f/%.5f C %.5f/%.5f S %.5f/%.5f A %.5f/%.5f V %.6f/%.6f dmax %.5f/%.5f "
                "ceil %.4f/%.4f cd %.4f/%.4f clr %.5f/%.5f eps %.5f/%.5f fc %.4f/%.4f tie %d\n",
                rep->step_index, r->instrument->id, r->depth, o->engaged, r->engaged_length,
                o->in_curve, r->engaged_in_curve, o->in_straight, r->engaged_in_straight,
                o->area, r->contact_area, o->volume, r->cut_volume, o->max_diameter,
                r->max_diameter_in_curve, o->ceiling, r->ceiling, o->ceiling_depth, r->ceiling_depth,
                o->clearance, r->straight_clearance, o->strain, r->strain, o->first_contact,
                r->first_contact, o->ties);
  xc_compare (rep, "engaged_length", o->engaged, r->engaged_length, XC_TOL_LENGTH);
  xc_compare (rep, "engaged_in_curve", o->in_curve, r->engaged_in_curve, XC_TOL_LENGTH);
  xc_compare (rep, "engaged_in_straight", o->in_straight, r->engaged_in_straight, XC_TOL_LENGTH);
  xc_compare (rep, "contact_area", o->area, r->contact_area, xc_rel (o->area, MAX (o->area_error, 1e-12)));
  xc_compare (rep, "cut_volume", o->volume, r->cut_volume, xc_rel (o->volume, MAX (o->volume_error, 1e-12)));
  xc_compare (rep, "max_diameter_in_curve", o->max_diameter, r->max_diameter_in_curve, XC_TOL_DIAMETER);
  xc_compare (rep, "ceiling", o->ceiling, r->ceiling, XC_TOL_DIAMETER);
  xc_compare (rep, "ceiling_depth", o->ceiling_depth, r->ceiling_depth, XC_TOL_LENGTH);
  xc_compare (rep, "straight_clearance", o->clearance, r->straight_clearance, XC_TOL_DIAMETER);
  xc_compare (rep, "strain", o->strain, r->strain, XC_TOL_STRAIN);
  xc_compare (rep, "cycles_in_curve", o->cycles, r->cycles_in_curve, 1e-6 * MAX (1.0, fabs (o->cycles)));
  xc_compare (rep, "fatigue_use", o->fatigue, r->fatigue_use, xc_rel (o->fatigue, 1e-12));
  xc_compare (rep, "fracture_torque_d3", o->torque, r->fracture_torque_d3, 1e-6);
  xc_compare (rep, "first_contact", o->first_contact, r->first_contact, XC_TOL_CONTACT);
  xc_compare (rep, "time", o->time, r->time, XC_TOL_CONTACT / rules->advance_rate);
  if (!o->pecks_unsure && o->pecks != r->pecks)
    {
      g_autofree char *detail = g_strdup_printf ("pecks: crosscheck %u, engine %u", o->pecks, r->pecks);

      xc_disagree (rep, "pecks", detail);
    }
  if (o->pecks_unsure)
    {
      /* an advance within the grid's resolution of a whole number of pecks:
       * the engine's count must be one of the two, and follow from its own
       * first contact */
      double q = (r->depth - r->first_contact) / rules->peck_increment;
      guint near = (guint) round ((r->depth - o->first_contact) / rules->peck_increment);

      if (isnan (r->first_contact) || (r->pecks != near && r->pecks != near + 1) ||
          r->pecks != (guint) ceil (q - 1e-9))
        {
          g_autofree char *detail = g_strdup_printf ("pecks: crosscheck %u (undecided), engine %u for advance %.9g",
                                                     o->pecks, r->pecks, q * rules->peck_increment);

          xc_disagree (rep, "pecks (undecided by the grid)", detail);
        }
    }
  rep->unsure_pecks += o->pecks_unsure;
  rep->ties += o->ties != 0;

  for (int q = 0; q < CW_N_RULES; q++)
    rep->seen[q] += o->level[q] >= 0;
  rep->seen_capped_taper += !isnan (o->largest_taper) &&
                            o->largest_taper < cw_instrument_nominal_taper (r->instrument) - CW_TAPER_EPSILON &&
                            r->instrument->segments == NULL;
  rep->seen_tip_wider += !isnan (o->ceiling) && r->instrument->tip / 100 >= o->ceiling;
  rep->seen_clearance_empty += isnan (o->clearance) && !isnan (o->max_diameter);
  rep->seen_engaged += o->engaged > 0;
  rep->seen_contact += !isnan (o->first_contact);

  for (int q = 0; q < CW_N_RULES; q++)
    level[q] = -1;
  for (guint k = 0; k < r->findings->len; k++)
    {
      const CwFinding *fd = g_ptr_array_index (r->findings, k);

      level[fd->rule] = MAX (level[fd->rule], (int) fd->level);
    }
  for (int q = 0; q < CW_N_RULES; q++)
    {
      g_autofree char *name = NULL;
      g_autofree char *detail = NULL;

      if (o->unsure[q])
        {
          rep->unsure_rules++;
          continue;
        }
      if (level[q] == o->level[q])
        continue;
      if (level[q] == o->alt_level[q])
        {
          rep->ambiguous++;
          continue;
        }
      name = g_strdup_printf ("finding %s: %s here, %s in engine", cw_rule_to_string (q),
                              o->level[q] < 0 ? "none" : cw_level_to_string (o->level[q]),
                              level[q] < 0 ? "none" : cw_level_to_string (level[q]));
      detail = g_strdup_printf ("%s (engaged %.4f in curve %.4f straight %.4f clearance %.4f, engine %.4f %.4f %.4f %.4f)",
                                name, o->engaged, o->in_curve, o->in_straight, o->clearance,
                                r->engaged_length, r->engaged_in_curve, r->engaged_in_straight,
                                r->straight_clearance);
      xc_disagree (rep, name, detail);
    }
}

/* ------------------------------------------------------------ one canal */

/* The canal's final figures, item "final shape", from the definition. */
static void
xc_final (XcReport            *rep,
          XcState             *st,
          const CwCanalResult *res,
          double               time)
{
  const CwCanal *c = st->canal;
  const CwRules *r = st->rules;
  double wl = c->working_length;
  double size = NAN, taper, onset = NAN;
  int mine = -1, engine = -1;

  for (guint k = 0; k < st->done->len; k++)
    {
      const XcDone *dn = &g_array_index (st->done, XcDone, k);

      if (dn->depth >= wl - r->at_length_tolerance - XC_TIE)
        size = isnan (size) ? dn->file->tip : MAX (size, dn->file->tip);
    }
  taper = (xc_envelope_at (st, wl - 3) - xc_envelope_at (st, wl)) / 3;
  if (st->curves.n > 0)
    onset = xc_envelope_at (st, st->curves.onset[0]);
  rep->step_index = 0;
  rep->tie = rep->case_tie;
  xc_compare (rep, "final apical_size", size, res->apical_size, 1e-9);
  xc_compare (rep, "final apical_taper", taper, res->apical_taper, 1e-6);
  xc_compare (rep, "final onset_diameter", onset, res->onset_diameter, XC_TOL_DIAMETER);
  xc_compare (rep, "final time", time, res->time, MAX (1u, st->done->len) * XC_TOL_CONTACT / r->advance_rate);
  if (isnan (size) || size < st->kase->target_apical_size - XC_TIE ||
      taper < st->kase->target_apical_taper - CW_TAPER_EPSILON)
    mine = CW_LEVEL_CAUTION;
  rep->seen[CW_RULE_FINAL_SHAPE] += mine >= 0;
  for (guint k = 0; k < res->findings->len; k++)
    {
      const CwFinding *fd = g_ptr_array_index (res->findings, k);

      if (fd->rule == CW_RULE_FINAL_SHAPE)
        engine = MAX (engine, (int) fd->level);
      else
        xc_disagree (rep, "canal finding other than final-shape", cw_rule_to_string (fd->rule));
    }
  if (mine != engine)
    {
      g_autofree char *name = g_strdup_printf ("finding final-shape: %s here, %s in engine",
                                               mine < 0 ? "none" : "caution",
                                               engine < 0 ? "none" : cw_level_to_string (engine));
      g_autofree char *detail = g_strdup_printf ("%s (size %g taper %.9g, targets %g %.9g)", name,
                                                 size, taper, st->kase->target_apical_size,
                                                 st->kase->target_apical_taper);

      xc_disagree (rep, name, detail);
    }
}

static void
xc_check_canal (XcReport      *rep,
                const CwCase  *kase,
                const CwCanal *canal,
                XcStep        *mine)
{
  g_autoptr(CwCanalResult) res = cw_evaluate_canal (kase, canal);
  XcState st = { 0 };
  double time = 0.0;

  rep->case_tie = 0;
  st.kase = kase;
  st.canal = canal;
  st.rules = &kase->rules;
  xc_get_curves (canal, &st.curves);
  st.n_cells = (gint64) ceil ((canal->working_length + 2.0) / XC_H);
  st.p = g_new (double, st.n_cells);
  for (gint64 i = 0; i < st.n_cells; i++)
    st.p[i] = xc_natural (canal, xc_cell_s (i));
  st.done = g_array_new (FALSE, FALSE, sizeof (XcDone));

  g_assert_cmpuint (res->steps->len, ==, cw_canal_get_n_steps (canal));
  for (guint c = 0; c < st.curves.n; c++)
    {
      rep->step_index = 0;
      xc_compare (rep, "geometry onset", st.curves.onset[c], res->geometry.onset[c], 1e-9);
      xc_compare (rep, "geometry end", st.curves.end[c], res->geometry.end[c], 1e-9);
    }
  for (guint k = 0; k < cw_canal_get_n_steps (canal); k++)
    {
      const CwStep *step = cw_canal_get_step (canal, k);
      const CwInstrument *f = cw_case_find_instrument (kase, step->instrument_id);
      XcStep o;

      rep->step_index = k + 1;
      xc_step (&st, f, step->depth, &o);
      xc_compare_step (rep, &kase->rules, &o, cw_canal_result_get_step (res, k));
      if (mine != NULL)
        mine[k] = o;
      time += o.time;
      rep->steps++;
    }
  xc_final (rep, &st, res, time);
  rep->cases++;
  g_array_unref (st.done);
  g_free (st.p);
}

/* ------------------------------------------------------------- generate */

static double
xc_round (double x,
          double unit)
{
  return round (x / unit) * unit;
}

static double
xc_pick (GRand        *rnd,
         const double *values,
         guint         n)
{
  return values[g_rand_int_range (rnd, 0, (gint32) n)];
}

static gboolean
xc_chance (GRand  *rnd,
           double  p)
{
  return g_rand_double (rnd) < p;
}

static void
xc_powered_fields (GRand        *rnd,
                   CwInstrument *f)
{
  f->motion = CW_MOTION_ROTARY;
  f->alloy = xc_chance (rnd, 0.6) ? CW_ALLOY_NITI : CW_ALLOY_NITI_HEAT_TREATED;
  f->rpm = 250 + 50 * g_rand_int_range (rnd, 0, 8);
  if (xc_chance (rnd, 0.4))
    f->torque_limit = xc_round (g_rand_double_range (rnd, 0.3, 3.0), 0.01);
}

static CwInstrument *
xc_random_instrument (GRand  *rnd,
                      CwCase *kase,
                      guint   index,
                      int     kind)
{
  static const double hand_tips[] = { 8, 10, 15, 20, 25, 30, 35, 40, 8, 10, 15, 20, 25, 30, 35, 40, 50, 60, 70, 80 };
  static const double rotary_tips[] = { 15, 20, 25, 30, 35, 40 };
  static const double lengths[] = { 21, 25, 25, 31 };
  static const CwTaperSegment variable[][3] = {
    { { 4, 0.08 }, { 16, 0.04 }, { 0, 0 } },
    { { 3, 0.06 }, { 16, 0.04 }, { 0, 0 } },
    { { 2, 0.05 }, { 6, 0.04 }, { 16, 0.03 } },
    { { 4, 0.04 }, { 16, 0.06 }, { 0, 0 } },    /* taper growing coronally */
    { { 4, 0.08 }, { 10, 0.04 }, { 0, 0 } },    /* segments ending before the flutes do */
  };
  g_autofree char *id = g_strdup_printf ("f%u", index);
  CwInstrument *f = NULL;

  switch (kind)
    {
    case 0:   /* hand stainless .02 */
      f = cw_instrument_new (id, xc_pick (rnd, hand_tips, G_N_ELEMENTS (hand_tips)), 0.02);
      f->alloy = CW_ALLOY_STAINLESS;
      f->motion = CW_MOTION_HAND;
      if (xc_chance (rnd, 0.15))
        f->flute_length = 10 + 2 * g_rand_int_range (rnd, 0, 3);
      break;
    case 1:   /* rotary NiTi .04 or .06 */
    case 2:
      f = cw_instrument_new (id, xc_pick (rnd, rotary_tips, G_N_ELEMENTS (rotary_tips)), kind == 1 ? 0.04 : 0.06);
      xc_powered_fields (rnd, f);
      break;
    case 3:   /* variable taper */
      {
        guint v = g_rand_int_range (rnd, 0, G_N_ELEMENTS (variable));

        f = cw_instrument_new (id, xc_chance (rnd, 0.5) ? 20 : 25, NAN);
        cw_instrument_set_segments (f, variable[v], v == 2 ? 3 : 2);
        xc_powered_fields (rnd, f);
        f->alloy = CW_ALLOY_NITI_HEAT_TREATED;
        if (xc_chance (rnd, 0.2))
          f->flute_length = 12;   /* flutes ending inside the last segment */
      }
      break;
    case 4:   /* capped */
      f = cw_instrument_new (id, 20 + 5 * g_rand_int_range (rnd, 0, 3), xc_chance (rnd, 0.5) ? 0.04 : 0.06);
      xc_powered_fields (rnd, f);
      f->max_flute_diameter = xc_round (g_rand_double_range (rnd, 0.56, 1.0), 0.001);
      break;
    default:  /* reciprocating */
      f = cw_instrument_new (id, xc_chance (rnd, 0.5) ? 25 : 40, xc_chance (rnd, 0.75) ? 0.06 : 0.08);
      xc_powered_fields (rnd, f);
      f->motion = CW_MOTION_RECIPROCATING;
      break;
    }
  f->label = g_strdup (id);
  f->length = xc_pick (rnd, lengths, G_N_ELEMENTS (lengths));
  cw_case_add_instrument (kase, f);
  return f;
}

static gboolean
xc_try_curves (GRand   *rnd,
               CwCanal *c,
               guint    n)
{
  double wl = c->working_length;
  double start = c->orifice_depth + 0.5;
  double onset[2], angle[2], radius[2], schneider[2];

  for (guint k = 0; k < n; k++)
    {
      double phi;

      angle[k] = xc_round (g_rand_double_range (rnd, 10, 60), 0.01);
      radius[k] = xc_round (g_rand_double_range (rnd, 3, 15), 0.01);
      schneider[k] = NAN;
      if (k == 0)
        onset[k] = xc_round (g_rand_double_range (rnd, start, wl - 1), xc_chance (rnd, 0.15) ? 0.5 : 0.0001);
      else if (xc_chance (rnd, 0.3))
        onset[k] = ceil (start / 0.0001) * 0.0001;
      else
        onset[k] = xc_round (start + g_rand_double_range (rnd, 0, 3), 0.0001);
      if (k == n - 1 && xc_chance (rnd, 0.15))
        {
          /* given by the Schneider angle: runs to WL */
          schneider[k] = xc_round (angle[k] / 2, 0.01);
          phi = 2 * schneider[k] * G_PI / 180;
          if ((wl - onset[k]) / phi < 1.0)
            return FALSE;
          start = wl;
        }
      else
        {
          phi = angle[k] * G_PI / 180;
          start = onset[k] + radius[k] * phi;
        }
      if (start > wl || onset[k] >= wl)
        return FALSE;
    }
  for (guint k = 0; k < n; k++)
    if (isnan (schneider[k]))
      cw_canal_add_curve (c, onset[k], angle[k], radius[k]);
    else
      cw_canal_add_schneider (c, onset[k], schneider[k]);
  return TRUE;
}

static void
xc_random_anatomy (GRand   *rnd,
                   CwCanal *c)
{
  double od = xc_round (g_rand_double_range (rnd, 0.3, 1.2), 0.001);
  double ad = xc_round (g_rand_double_range (rnd, 0.08, 0.35), 0.001);
  double s0, s1, s[8];
  guint n;

  if (xc_chance (rnd, 0.6))
    {
      c->orifice_diameter = od;
      c->apical_diameter = ad;
      return;
    }
  n = g_rand_int_range (rnd, 2, 9);
  s0 = c->orifice_depth + g_rand_double_range (rnd, -1, 1);
  s1 = c->working_length + g_rand_double_range (rnd, -1, 0.5);
  for (guint k = 0; k < n; k++)
    s[k] = k == 0 ? s0 : k == n - 1 ? s1 : g_rand_double_range (rnd, s0, s1);
  for (guint k = 1; k < n; k++)   /* sort */
    for (guint j = k; j > 0 && s[j - 1] > s[j]; j--)
      {
        double t = s[j];

        s[j] = s[j - 1];
        s[j - 1] = t;
      }
  c->diameters = g_array_new (FALSE, FALSE, sizeof (CwPoint));
  for (guint k = 0; k < n; k++)
    {
      CwPoint pt;
      double u = (s[k] - s0) / (s1 - s0);

      /* Measured points at least 0.3 mm apart: P no steeper than the grid
       * resolves (the first contact moves by |P'| h / taper). */
      pt.s = xc_round (s[k], 0.001);
      if (k > 0 && k < n - 1 &&
          (pt.s - g_array_index (c->diameters, CwPoint, c->diameters->len - 1).s < 0.3 || s1 - pt.s < 0.3))
        continue;
      pt.v = xc_round (MAX (0.06, od + (ad - od) * u + g_rand_double_range (rnd, -0.04, 0.04)), 0.001);
      if (c->diameters->len > 0 && pt.s <= g_array_index (c->diameters, CwPoint, c->diameters->len - 1).s)
        continue;
      g_array_append_val (c->diameters, pt);
    }
}

static void
xc_random_rules (GRand  *rnd,
                 CwCase *kase)
{
  CwRules *r = &kase->rules;

  if (xc_chance (rnd, 0.15))
    {
      /* a ceiling table of one to four rows, by rising taper as the loader
       * requires (it refuses any other order) */
      static const double tapers[] = { 0.02, 0.03, 0.04, 0.05, 0.06, 0.08 };
      guint n = g_rand_int_range (rnd, 1, 5);

      r->n_ceilings = 0;
      for (guint k = 0; k < G_N_ELEMENTS (tapers) && r->n_ceilings < n; k++)
        if (xc_chance (rnd, 0.5))
          {
            r->ceiling_taper[r->n_ceilings] = tapers[k];
            r->ceiling_diameter[r->n_ceilings++] = xc_round (g_rand_double_range (rnd, 0.4, 0.7), 0.01);
          }
      if (r->n_ceilings == 0)
        {
          r->ceiling_taper[0] = 0.04;
          r->ceiling_diameter[0] = 0.55;
          r->n_ceilings = 1;
        }
    }
  if (xc_chance (rnd, 0.15))
    {
      r->alloys[CW_ALLOY_NITI].strain_limit = xc_round (g_rand_double_range (rnd, 0.02, 0.06), 0.001);
      r->alloys[CW_ALLOY_NITI_HEAT_TREATED].strain_limit = xc_round (g_rand_double_range (rnd, 0.03, 0.08), 0.001);
      r->small_file_tip_max = xc_chance (rnd, 0.5) ? 25 : 15;
      r->small_file_taper_max = xc_chance (rnd, 0.5) ? 0.06 : 0.02;
      r->glide_path_tip_max = xc_chance (rnd, 0.5) ? 10 : 20;
    }
  if (xc_chance (rnd, 0.7))
    return;
  r->contact_tolerance = xc_chance (rnd, 0.5) ? 0.005 : 0.02;
  r->advance_rate = xc_chance (rnd, 0.5) ? 0.25 : 1.0;
  r->peck_increment = xc_chance (rnd, 0.5) ? 0.5 : 2.0;
  r->changeover = xc_chance (rnd, 0.5) ? 10 : 30;
  r->curve_engagement_max = xc_chance (rnd, 0.5) ? 4 : 8;
  r->at_length_tolerance = xc_chance (rnd, 0.5) ? 0.25 : 1.0;
  if (xc_chance (rnd, 0.3))
    r->require_taper_change = FALSE;
  if (xc_chance (rnd, 0.5))
    {
      kase->target_apical_size = xc_chance (rnd, 0.5) ? 25 : 40;
      kase->target_apical_taper = xc_chance (rnd, 0.5) ? 0.05 : 0.06;
    }
}

static double
xc_random_depth (GRand         *rnd,
                 const CwCanal *c)
{
  double lo = ceil ((c->orifice_depth + 2) * 2) / 2;
  double hi = floor ((c->working_length + 1) * 2) / 2;

  if (xc_chance (rnd, 0.5))
    lo = MAX (lo, hi - 3.0);
  return lo + 0.5 * g_rand_int_range (rnd, 0, (gint32) ((hi - lo) * 2) + 1);
}

static CwCase *
xc_random_case (GRand *rnd)
{
  CwCase *kase = cw_case_new ();
  CwCanal *c;
  double wl = xc_chance (rnd, 0.5) ? 15 + 0.5 * g_rand_int_range (rnd, 0, 21)
                                   : xc_round (g_rand_double_range (rnd, 15, 25), 0.01);
  double so = xc_round (g_rand_double_range (rnd, 4, 8), 0.01);
  guint n_curves = xc_chance (rnd, 0.25) ? 0 : xc_chance (rnd, 0.6) ? 1 : 2;
  guint n_files = g_rand_int_range (rnd, 4, 11);
  guint n_steps = g_rand_int_range (rnd, 1, 13);

  c = cw_canal_new ("X", wl, so);
  cw_case_add_canal (kase, c);
  for (; n_curves > 0; n_curves--)
    {
      int attempt;

      for (attempt = 0; attempt < 500 && !xc_try_curves (rnd, c, n_curves); attempt++)
        ;
      if (attempt < 500)
        break;
    }
  xc_random_anatomy (rnd, c);
  xc_random_rules (rnd, kase);
  for (guint k = 0; k < n_files; k++)
    {
      /* a hand file and a rotary one first; a variable and a capped one often */
      int kind = k == 0 ? 0 : k == 1 ? 1 : k == 2 ? 3 : k == 3 ? 4 : g_rand_int_range (rnd, 0, 6);

      if ((k == 2 || k == 3) && xc_chance (rnd, 0.35))
        kind = g_rand_int_range (rnd, 0, 3);
      xc_random_instrument (rnd, kase, k, kind);
    }
  for (guint k = 0; k < n_steps; k++)
    {
      const CwInstrument *f = g_ptr_array_index (kase->instruments,
                                                 g_rand_int_range (rnd, 0, (gint32) n_files));

      if (k == 0 && xc_chance (rnd, 0.5))
        {
          /* a glide path first, half the time */
          f = g_ptr_array_index (kase->instruments, 0);
          cw_canal_add_step (c, f->id, floor ((wl + 0.25) * 2) / 2);
          continue;
        }
      cw_canal_add_step (c, f->id, xc_random_depth (rnd, c));
    }
  return kase;
}

/* The case as the builder calls that make it again. */
static char *
xc_describe (const CwCase *kase)
{
  const CwCanal *c = g_ptr_array_index (kase->canals, 0);
  const CwRules *r = &kase->rules;
  GString *out = g_string_new (NULL);

  g_string_append_printf (out, "  canal = cw_canal_new (\"X\", %.17g, %.17g);\n", c->working_length, c->orifice_depth);
  for (guint k = 0; k < c->n_curves; k++)
    if (isnan (c->curves[k].angle))
      g_string_append_printf (out, "  cw_canal_add_schneider (canal, %.17g, %.17g);\n",
                              c->curves[k].onset, c->curves[k].schneider_angle);
    else
      g_string_append_printf (out, "  cw_canal_add_curve (canal, %.17g, %.17g, %.17g);\n",
                              c->curves[k].onset, c->curves[k].angle, c->curves[k].radius);
  if (c->diameters == NULL)
    g_string_append_printf (out, "  diameters linear %.17g -> %.17g\n", c->orifice_diameter, c->apical_diameter);
  else
    {
      g_string_append (out, "  diameters points");
      for (guint k = 0; k < c->diameters->len; k++)
        g_string_append_printf (out, " (%.17g, %.17g)", g_array_index (c->diameters, CwPoint, k).s,
                                g_array_index (c->diameters, CwPoint, k).v);
      g_string_append (out, "\n");
    }
  g_string_append_printf (out, "  rules tol %g rate %g peck %g changeover %g engage-max %g at-length %g taper-change %d; "
                          "small %g/%g glide %g strain limits %g %g; targets %g %g; ceilings",
                          r->contact_tolerance, r->advance_rate, r->peck_increment, r->changeover,
                          r->curve_engagement_max, r->at_length_tolerance, r->require_taper_change,
                          r->small_file_tip_max, r->small_file_taper_max, r->glide_path_tip_max,
                          r->alloys[CW_ALLOY_NITI].strain_limit, r->alloys[CW_ALLOY_NITI_HEAT_TREATED].strain_limit,
                          kase->target_apical_size, kase->target_apical_taper);
  for (guint k = 0; k < r->n_ceilings; k++)
    g_string_append_printf (out, " (%g, %g)", r->ceiling_taper[k], r->ceiling_diameter[k]);
  g_string_append (out, "\n");
  for (guint k = 0; k < kase->instruments->len; k++)
    {
      const CwInstrument *f = g_ptr_array_index (kase->instruments, k);

      g_string_append_printf (out, "  %s: %g/", f->id, f->tip);
      if (f->segments == NULL)
        g_string_append_printf (out, "%g", f->taper);
      else
        for (guint j = 0; j < f->segments->len; j++)
          g_string_append_printf (out, "%s%g to %g", j ? "," : "[",
                                  g_array_index (f->segments, CwTaperSegment, j).taper,
                                  g_array_index (f->segments, CwTaperSegment, j).to);
      g_string_append_printf (out, "%s flute %g length %g cap %g %s %s rpm %g torque %g\n",
                              f->segments ? "]" : "", f->flute_length, f->length, f->max_flute_diameter,
                              cw_alloy_to_string (f->alloy), cw_motion_to_string (f->motion), f->rpm,
                              f->torque_limit);
    }
  g_string_append (out, "  steps:");
  for (guint k = 0; k < cw_canal_get_n_steps (c); k++)
    g_string_append_printf (out, " %s@%g", cw_canal_get_step (c, k)->instrument_id, cw_canal_get_step (c, k)->depth);
  g_string_append (out, "\n");
  return g_string_free (out, FALSE);
}

static void
xc_print_class (gpointer key,
                gpointer value,
                gpointer data)
{
  XcClass *cl = value;

  g_printerr ("\n== %s: %u\n%s", (const char *) key, cl->count, cl->example);
}

static void
test_random_cases (void)
{
  g_autoptr(GRand) rnd = NULL;
  XcReport rep = { 0 };
  const char *seed = g_getenv ("CW_CROSSCHECK_SEED");
  const char *n_env = g_getenv ("CW_CROSSCHECK_CASES");
  const char *only = g_getenv ("CW_CROSSCHECK_ONLY");
  guint n = n_env ? (guint) atoi (n_env) : XC_N_CASES;

  rnd = g_rand_new_with_seed (seed ? (guint32) atol (seed) : XC_SEED);
  rep.classes = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, xc_class_free);
  for (guint i = 0; i < n; i++)
    {
      g_autoptr(CwCase) kase = xc_random_case (rnd);
      g_autofree char *text = xc_describe (kase);

      rep.case_index = i;
      rep.describe = text;
      rep.verbose = only != NULL && (guint) atoi (only) == i;
      if (only != NULL && !rep.verbose)
        continue;
      if (rep.verbose)
        g_printerr ("%s", text);
      xc_check_canal (&rep, kase, g_ptr_array_index (kase->canals, 0), NULL);
      rep.describe = NULL;
    }
  g_test_message ("%u cases, %u steps; %u rule decisions and %u peck counts within the grid's "
                  "resolution of their threshold left out; %u steps with an exact tie; %u findings "
                  "decided by the engine's reading of an ambiguous point",
                  rep.cases, rep.steps, rep.unsure_rules, rep.unsure_pecks, rep.ties, rep.ambiguous);
  g_test_message ("coverage: %u steps engaged, %u touched; %u with a cap lowering the taper in the curve, "
                  "%u with the tip over the ceiling, %u past the onset with no flute in the straight part",
                  rep.seen_engaged, rep.seen_contact, rep.seen_capped_taper, rep.seen_tip_wider,
                  rep.seen_clearance_empty);
  for (int q = 0; q < CW_N_RULES; q++)
    if (q != CW_RULE_FINAL_SHAPE)
      g_test_message ("coverage: %u steps with a finding of rule %s", rep.seen[q], cw_rule_to_string (q));
  g_test_message ("coverage: %u canals with a finding of rule final-shape", rep.seen[CW_RULE_FINAL_SHAPE]);
  if (g_getenv ("CW_CROSSCHECK_VERBOSE") || g_hash_table_size (rep.classes) > 0)
    g_hash_table_foreach (rep.classes, xc_print_class, NULL);
  g_assert_cmpuint (g_hash_table_size (rep.classes), ==, 0);
  g_hash_table_unref (rep.classes);
}

/* ------------------------------------------------------ exact ties
 *
 * The random cases meet exact ties often (diameters typed to 0.001 mm,
 * depths on a 0.5 mm grid, tapers of .02/.04/.06, a 0.01 mm tolerance).
 * engine.md's tests are strict ("d(L - s) > P(s) + tol"; "null if the file
 * never reaches the ceiling"), so in exact arithmetic a tie does not count.
 * Below, one small case of each kind, worked by hand; each checks this
 * file's grid evaluation first, then the engine. */

static void
xc_mine (const CwCase  *kase,
         const CwCanal *canal,
         XcStep        *mine)
{
  XcReport rep = { 0 };

  rep.classes = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, xc_class_free);
  rep.describe = "";
  xc_check_canal (&rep, kase, canal, mine);
  g_hash_table_unref (rep.classes);
}

/* The same .02 file again, 0.5 mm deeper: it is 0.5 * 0.02 = 0.01 mm wider
 * than its own cut, exactly the tolerance, all along [15.5, 19.5]: no
 * engagement there.  Only the new 0.5 mm at the tip, [19.5, 20], engages
 * (d 0.31 -> 0.30 over P0 0.22 -> 0.20).  Canal as in test-evaluate.c. */
static void
test_tie_same_file_deeper (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, 0.80, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  XcStep mine[2];
  double area = G_PI * 0.5 * (0.31 + 0.30) / 2;
  double volume = G_PI / 4 * 0.5 * ((0.31 * 0.31 + 0.31 * 0.30 + 0.30 * 0.30) -
                                    (0.22 * 0.22 + 0.22 * 0.20 + 0.20 * 0.20)) / 3;
  CwStepResult *r;

  cw_test_instrument (kase, "k30", 30, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k30", 19.5);
  cw_canal_add_step (canal, "k30", 20);
  xc_mine (kase, canal, mine);
  cw_assert_near (mine[1].engaged, 0.5, XC_TOL_LENGTH);
  cw_assert_near (mine[1].area, area, 0.01 * area);
  cw_assert_near (mine[1].volume, volume, 0.01 * volume);
  cw_assert_near (mine[1].first_contact, 19.5, XC_TOL_CONTACT);

  res = cw_evaluate_canal (kase, canal);
  r = cw_canal_result_get_step (res, 1);
  cw_assert_near (r->first_contact, 19.5, 1e-9);
  cw_assert_near (r->engaged_length, 0.5, 1e-9);
  cw_assert_near (r->engaged_in_straight, 0.5, 1e-9);
  cw_assert_near (r->contact_area, area, 1e-9);
  cw_assert_near (r->cut_volume, volume, 1e-9);
}

/* A contact that starts at a tie.  WL 22, orifice 5, P0 0.78 -> 0.20
 * (slope -0.58/17); 15/.04 at 21.5, D16 = 0.79 = P0(5) + tol.  With the tip
 * at t, the top of the flutes (x = 16, d = 0.79) lies at s = t - 16, where
 * P0 + tol = 0.79 - (0.58/17) (t - 21): so it touches for every t > 21 and
 * not at 21 itself.  First contact 21 (the infimum), advance 0.5 mm: 21 s
 * and one peck.  At 21.5 it engages [5.5, 8.4]. */
static void
test_tie_contact_at_flute_end (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 22, 5, 0.78, 0.20);
  g_autoptr(CwCanalResult) res = NULL;
  XcStep mine[1];
  CwStepResult *r;

  cw_test_instrument (kase, "r15", 15, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  cw_canal_add_step (canal, "r15", 21.5);
  xc_mine (kase, canal, mine);
  cw_assert_near (mine[0].engaged, 2.9, XC_TOL_LENGTH);
  cw_assert_near (mine[0].first_contact, 21.0, XC_TOL_CONTACT);
  g_assert_cmpuint (mine[0].pecks, ==, 1);

  res = cw_evaluate_canal (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->engaged_length, 2.9, 1e-9);
  cw_assert_near (r->first_contact, 21.0, 1e-9);
  cw_assert_near (r->time, 0.5 / 0.5 + 20, 1e-9);
  g_assert_cmpuint (r->pecks, ==, 1);
}

/* The same with a cap: WL 24, orifice 4.8, P0 0.878 -> 0.174 (slope
 * -0.704/19.2); 25/.04 capped at 0.888 = P0(4.8) + tol, reached at
 * x = 15.95.  The capped part touches as soon as it passes below the
 * orifice: first contact 4.8 + 15.95 = 20.75.  At 21 it engages [5, 7.8]. */
static void
test_tie_contact_at_cap (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 24, 4.8, 0.878, 0.174);
  g_autoptr(CwCanalResult) res = NULL;
  CwInstrument *f;
  XcStep mine[1];
  CwStepResult *r;

  f = cw_test_instrument (kase, "c25", 25, 0.04, CW_ALLOY_NITI, CW_MOTION_ROTARY);
  f->max_flute_diameter = 0.888;
  cw_canal_add_step (canal, "c25", 21);
  xc_mine (kase, canal, mine);
  cw_assert_near (mine[0].engaged, 2.8, XC_TOL_LENGTH);
  cw_assert_near (mine[0].first_contact, 20.75, XC_TOL_CONTACT);

  res = cw_evaluate_canal (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->engaged_length, 2.8, 1e-9);
  cw_assert_near (r->first_contact, 20.75, 1e-9);
  g_assert_cmpuint (r->pecks, ==, 1);
}

/* A tie at one point only: measured P0 (5, 0.60) -> (19, 0.25), constant
 * past 19; 25/.02 at 19.5 is 0.26 = P0(19) + tol at s = 19 and narrower
 * than P0 + tol everywhere else.  Nothing is engaged, nothing touched. */
static void
test_tie_single_point (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 20, 5, NAN, NAN);
  CwPoint a = { 5, 0.60 }, b = { 19, 0.25 };
  g_autoptr(CwCanalResult) res = NULL;
  XcStep mine[1];
  CwStepResult *r;

  canal->diameters = g_array_new (FALSE, FALSE, sizeof (CwPoint));
  g_array_append_val (canal->diameters, a);
  g_array_append_val (canal->diameters, b);
  cw_test_instrument (kase, "k25", 25, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
  cw_canal_add_step (canal, "k25", 19.5);
  xc_mine (kase, canal, mine);
  cw_assert_near (mine[0].engaged, 0.0, XC_TOL_LENGTH);
  g_assert_true (isnan (mine[0].first_contact));

  res = cw_evaluate_canal (kase, canal);
  r = cw_canal_result_get_step (res, 0);
  cw_assert_near (r->engaged_length, 0.0, 1e-9);
  g_assert_true (isnan (r->first_contact));
  cw_assert_near (r->time, 20.0, 1e-9);
  g_assert_cmpuint (r->pecks, ==, 0);
}

/* The widest flute exactly at the ceiling: a 40/.02 with 10 mm flutes is
 * 0.60 mm at D10, the .02 row.  At 21, 11 mm past the onset at 10, the
 * part in the curve is 0.60 mm wide (the shank keeps D10): at the ceiling,
 * not over it, at any depth, so no ceiling depth and no stop (see
 * xc_ceiling_depth).  A 30/.02 with 15 mm flutes (also 0.60 at D15) must
 * be treated alike; the engine's answer may not hang on how 0.4 + 0.02 x 10
 * rounds. */
static void
test_tie_ceiling_at_widest_flute (void)
{
  static const double tips[] = { 40, 30, 28 };
  static const double flutes[] = { 10, 15, 16 };

  for (guint v = 0; v < G_N_ELEMENTS (tips); v++)
    {
      g_autoptr(CwCase) kase = cw_case_new ();
      CwCanal *canal = cw_test_canal (kase, 21, 6, 0.80, 0.20);
      g_autoptr(CwCanalResult) res = NULL;
      CwInstrument *f;
      XcStep mine[2];
      CwStepResult *r;

      cw_canal_add_curve (canal, 10, 30, 8);
      cw_test_instrument (kase, "k15", 15, 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
      f = cw_test_instrument (kase, "k", tips[v], 0.02, CW_ALLOY_STAINLESS, CW_MOTION_HAND);
      f->flute_length = flutes[v];
      cw_canal_add_step (canal, "k15", 21);
      cw_canal_add_step (canal, "k", 21);
      xc_mine (kase, canal, mine);
      g_assert_true (isnan (mine[1].ceiling_depth));
      g_assert_cmpint (mine[1].level[CW_RULE_DIAMETER_CEILING], <, 0);

      res = cw_evaluate_canal (kase, canal);
      r = cw_canal_result_get_step (res, 1);
      cw_assert_near (r->ceiling, 0.60, 1e-9);
      g_assert_true (isnan (r->ceiling_depth));
      g_assert_null (cw_test_find (r, CW_RULE_DIAMETER_CEILING));
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/crosscheck/random", test_random_cases);
  g_test_add_func ("/crosscheck/tie/same-file-deeper", test_tie_same_file_deeper);
  g_test_add_func ("/crosscheck/tie/contact-at-flute-end", test_tie_contact_at_flute_end);
  g_test_add_func ("/crosscheck/tie/contact-at-cap", test_tie_contact_at_cap);
  g_test_add_func ("/crosscheck/tie/single-point", test_tie_single_point);
  g_test_add_func ("/crosscheck/tie/ceiling-at-widest-flute", test_tie_ceiling_at_widest_flute);

  return g_test_run ();
}
