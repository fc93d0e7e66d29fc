/* cw-evaluate.c: the evaluation of a sequence, as the engine contract says
 *
 * Exact, not sampled: the file's profile and the prepared envelope are both
 * piecewise linear in arc length, so every set, length, integral, minimum
 * and first-contact depth below is solved in closed form on the union of
 * their breakpoints.  The only tolerance is EPS, for comparing depths that
 * were computed with those given in the file.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-evaluate"

#include <math.h>

#include "cw-evaluate.h"

#define EPS 1e-9

/* Contact is strict (d > P + tol): a file re-inserted 0.5 mm deeper with a
 * .02 taper is exactly tol wider than its own cut, and must not count as
 * cutting however the sum rounds.  Differences within TIE of the threshold
 * are ties. */
#define TIE 1e-9

/* Everything a step's evaluation depends on besides the step itself. */
struct _CwEvalState
{
  const CwCase       *kase;
  const CwRules      *rules;
  const CwCanal      *canal;
  CwGeometry          geo;
  double              s_o;
  double              s_end;
  CwPwl              *envelope;
  double              glide_depth;
  gboolean            glide_checked;
  const CwInstrument *previous;
  double              apical_size;
  double              time;
  guint               n_steps;
  gboolean            has_stop;
};

typedef CwEvalState Eval;

/* What one step does, before it is turned into a result. */
typedef struct
{
  const CwInstrument *instrument;
  CwProfile           profile;
  double              depth;
  double              flute_start;   /* max (s_o, L - flute length) */
  CwPwl              *file;          /* d(L - s) over the fluted part */
} Placement;

void
cw_step_result_free (CwStepResult *step)
{
  if (step == NULL)
    return;
  g_ptr_array_unref (step->findings);
  g_array_unref (step->engaged);
  cw_pwl_free (step->envelope_after);
  g_free (step);
}

void
cw_canal_result_free (CwCanalResult *result)
{
  if (result == NULL)
    return;
  g_ptr_array_unref (result->findings);
  g_ptr_array_unref (result->steps);
  cw_pwl_free (result->natural);
  g_free (result);
}

CwStepResult *
cw_canal_result_get_step (const CwCanalResult *result,
                          guint                index)
{
  g_return_val_if_fail (index < result->steps->len, NULL);
  return g_ptr_array_index (result->steps, index);
}

const CwPwl *
cw_canal_result_envelope (const CwCanalResult *result)
{
  if (result->steps->len == 0)
    return result->natural;
  return cw_canal_result_get_step (result, result->steps->len - 1)->envelope_after;
}

static double
overlap (double a0,
         double a1,
         double b0,
         double b1)
{
  return MAX (0.0, MIN (a1, b1) - MAX (a0, b0));
}

static double
straight_end (const Eval *ev)
{
  return ev->geo.n_curves > 0 ? ev->geo.onset[0] : INFINITY;
}

static CwPwl *
file_function (const CwProfile *profile,
               double           depth)
{
  CwPwl *file = cw_pwl_new ();

  for (guint i = profile->n; i-- > 0;)
    cw_pwl_append (file, depth - profile->x[i], profile->d[i]);
  return file;
}

/* The grid on which both the file and the envelope are linear. */
static GArray *
common_grid (const Eval      *ev,
             const Placement *pl,
             double           a,
             double           b)
{
  GArray *grid = g_array_new (FALSE, FALSE, sizeof (double));

  g_array_append_val (grid, a);
  g_array_append_val (grid, b);
  cw_pwl_collect_breaks (ev->envelope, a, b, grid);
  cw_pwl_collect_breaks (pl->file, a, b, grid);
  cw_sort_unique_doubles (grid);
  return grid;
}

/* One linear piece of the grid: file f and envelope p at both ends. */
typedef struct
{
  double u, w, fu, fw, pu, pw;
} Piece;

static Piece
grid_piece (const Eval      *ev,
            const Placement *pl,
            GArray          *grid,
            guint            k)
{
  Piece p;

  p.u = g_array_index (grid, double, k);
  p.w = g_array_index (grid, double, k + 1);
  p.fu = cw_pwl_eval_side (pl->file, p.u, CW_SIDE_RIGHT);
  p.fw = cw_pwl_eval_side (pl->file, p.w, CW_SIDE_LEFT);
  p.pu = cw_pwl_eval_side (ev->envelope, p.u, CW_SIDE_RIGHT);
  p.pw = cw_pwl_eval_side (ev->envelope, p.w, CW_SIDE_LEFT);
  return p;
}

static double
lerp (double a,
      double b,
      double t)
{
  return a + (b - a) * t;
}

/* Integral of f(s)^2 for f linear from a to b over a length h. */
static double
square_integral (double a,
                 double b,
                 double h)
{
  return h * (a * a + a * b + b * b) / 3.0;
}

static void
add_engaged (CwStepResult *r,
             const Piece  *p,
             double        t0,
             double        t1)
{
  double h = (p->w - p->u) * (t1 - t0);
  double f0 = lerp (p->fu, p->fw, t0), f1 = lerp (p->fu, p->fw, t1);
  double p0 = lerp (p->pu, p->pw, t0), p1 = lerp (p->pu, p->pw, t1);
  CwPoint span = { lerp (p->u, p->w, t0), lerp (p->u, p->w, t1) };
  CwPoint *last = r->engaged->len ? &g_array_index (r->engaged, CwPoint, r->engaged->len - 1) : NULL;

  if (h <= TIE)
    return;
  r->contact_area += G_PI * h * (f0 + f1) / 2.0;
  r->cut_volume += G_PI / 4.0 * (square_integral (f0, f1, h) - square_integral (p0, p1, h));
  if (last && last->v == span.s)
    last->v = span.v;
  else
    g_array_append_val (r->engaged, span);
}

/* E = { s in [flute start, L] : d(L - s) > P(s) + tol }. */
static void
compute_engagement (const Eval      *ev,
                    const Placement *pl,
                    CwStepResult    *r)
{
  g_autoptr(GArray) grid = NULL;
  double tol = ev->rules->contact_tolerance;

  if (!(pl->depth > pl->flute_start))
    return;
  grid = common_grid (ev, pl, pl->flute_start, pl->depth);
  for (guint k = 0; k + 1 < grid->len; k++)
    {
      Piece p = grid_piece (ev, pl, grid, k);
      double gu = p.fu - p.pu - tol, gw = p.fw - p.pw - tol;
      double root = gu != gw ? CLAMP (gu / (gu - gw), 0.0, 1.0) : 0.0;

      /* Ends within TIE of the threshold are ties, not cuts; the root is
       * where the exact difference crosses it. */
      if (gu > TIE && gw > TIE)
        add_engaged (r, &p, 0.0, 1.0);
      else if (gu > TIE)
        add_engaged (r, &p, 0.0, root);
      else if (gw > TIE)
        add_engaged (r, &p, root, 1.0);
    }
}

static void
split_engagement (const Eval   *ev,
                  CwStepResult *r)
{
  for (guint i = 0; i < r->engaged->len; i++)
    {
      const CwPoint *e = &g_array_index (r->engaged, CwPoint, i);

      r->engaged_length += e->v - e->s;
      r->engaged_in_straight += overlap (e->s, e->v, ev->s_o, straight_end (ev));
      for (guint c = 0; c < ev->geo.n_curves; c++)
        r->engaged_in_curve += overlap (e->s, e->v, ev->geo.onset[c], ev->geo.end[c]);
    }
}

/* Items 4, 5 and 7: the whole file bends, engaged or not, so the part of it
 * inside each curve is [max (onset, L - length), min (end, L)]. */
static void
compute_curve_figures (const Eval      *ev,
                       const Placement *pl,
                       CwStepResult    *r,
                       double          *taper_in_curve,
                       double          *onset_used)
{
  double file_top = pl->depth - pl->instrument->length;

  *taper_in_curve = NAN;
  *onset_used = NAN;
  for (guint c = 0; c < ev->geo.n_curves; c++)
    {
      double lo = MAX (ev->geo.onset[c], file_top);
      double hi = MIN (ev->geo.end[c], pl->depth);
      double d, taper;

      if (lo > hi)
        continue;
      d = cw_profile_diameter (&pl->profile, pl->depth - lo);
      taper = cw_profile_largest_taper (&pl->profile, pl->depth - hi, pl->depth - lo);
      if (!isfinite (r->max_diameter_in_curve) || d > r->max_diameter_in_curve)
        r->max_diameter_in_curve = d;
      if (!isfinite (r->strain) || d / (2 * ev->geo.radius[c]) > r->strain)
        r->strain = d / (2 * ev->geo.radius[c]);
      *taper_in_curve = isfinite (*taper_in_curve) ? MAX (*taper_in_curve, taper) : taper;
      if (!isfinite (*onset_used))
        *onset_used = ev->geo.onset[c];
    }
}

static void
compute_ceiling (const Eval      *ev,
                 const Placement *pl,
                 CwStepResult    *r,
                 double           taper,
                 double           onset,
                 gboolean        *outside_table)
{
  double reach;

  *outside_table = FALSE;
  if (!isfinite (taper))
    return;
  r->ceiling = cw_rules_ceiling (ev->rules, taper, outside_table);
  reach = cw_profile_reach (&pl->profile, r->ceiling);
  r->ceiling_depth = isfinite (reach) ? onset + reach : NAN;
}

/* Item 6, on the envelope before the step: the smallest P - d over the
 * straight segment where the flutes lie, with each jump's lower side. */
static void
compute_clearance (const Eval      *ev,
                   const Placement *pl,
                   CwStepResult    *r)
{
  g_autoptr(GArray) grid = NULL;
  double hi = straight_end (ev);

  if (ev->geo.n_curves == 0 || !(pl->depth > hi) || !(hi > pl->flute_start))
    return;
  grid = common_grid (ev, pl, pl->flute_start, hi);
  for (guint k = 0; k + 1 < grid->len; k++)
    {
      Piece p = grid_piece (ev, pl, grid, k);
      double m = MIN (p.pu - p.fu, p.pw - p.fw);

      if (!isfinite (r->straight_clearance) || m < r->straight_clearance)
        r->straight_clearance = m;
    }
}

/* The tip depth at which the wall point s is first touched as the file goes
 * in: s plus the distance from the tip at which the file outgrows P(s) + tol. */
static double
touch_depth (const Placement *pl,
             double           s,
             double           envelope)
{
  return s + cw_profile_reach (&pl->profile, envelope);
}

/* Where P + tol passes the profile's breakpoint diameter d_i on [u, w], the
 * touch depth reaches s + x_i, x_i the first place the file is d_i wide;
 * an end of the piece counts when P + tol falls below d_i inside it, since
 * the touch depth is an infimum there (a file whose widest flute equals
 * P + tol at the orifice touches just below it). */
static double
crossing_touch (const Placement *pl,
                guint            i,
                double           u,
                double           w,
                double           pu,
                double           pw)
{
  double d = pl->profile.d[i];
  double x = pl->profile.x[i];

  for (guint j = 0; j < i; j++)
    if (pl->profile.d[j] >= d)
      x = MIN (x, pl->profile.x[j]);
  if (!(MIN (pu, pw) < d) || !(MAX (pu, pw) >= d) || pu == pw)
    return INFINITY;
  return lerp (u, w, (d - pu) / (pw - pu)) + x;
}

/* Item 8: first contact is the least touch depth over the wall.  On a piece
 * where P is linear the touch depth is linear between the points where
 * P + tol crosses one of the profile's breakpoint diameters. */
static double
first_contact (const Eval      *ev,
               const Placement *pl)
{
  g_autoptr(GArray) grid = g_array_new (FALSE, FALSE, sizeof (double));
  double tol = ev->rules->contact_tolerance, best = INFINITY;

  if (!(pl->depth > ev->s_o))
    return NAN;
  g_array_append_val (grid, ev->s_o);
  g_array_append_val (grid, pl->depth);
  cw_pwl_collect_breaks (ev->envelope, ev->s_o, pl->depth, grid);
  cw_sort_unique_doubles (grid);
  for (guint k = 0; k + 1 < grid->len; k++)
    {
      double u = g_array_index (grid, double, k), w = g_array_index (grid, double, k + 1);
      double pu = cw_pwl_eval_side (ev->envelope, u, CW_SIDE_RIGHT) + tol;
      double pw = cw_pwl_eval_side (ev->envelope, w, CW_SIDE_LEFT) + tol;

      best = MIN (best, touch_depth (pl, u, pu));
      best = MIN (best, touch_depth (pl, w, pw));
      for (guint i = 0; i < pl->profile.n; i++)
        best = MIN (best, crossing_touch (pl, i, u, w, pu, pw));
    }
  /* Touching is strict, as engagement is: contact that would only begin at
   * the final depth never happened. */
  return best < pl->depth - TIE ? best : NAN;
}

static void
compute_time (const Eval      *ev,
              const Placement *pl,
              CwStepResult    *r)
{
  double advance;

  r->first_contact = first_contact (ev, pl);
  advance = isfinite (r->first_contact) ? pl->depth - r->first_contact : 0.0;
  r->time = advance / ev->rules->advance_rate + ev->rules->changeover;
  r->pecks = (guint) MAX (0.0, ceil (advance / ev->rules->peck_increment - EPS));
}

static void
compute_fatigue (const Eval      *ev,
                 const Placement *pl,
                 CwStepResult    *r)
{
  const CwInstrument *inst = pl->instrument;
  double in_curve, n;

  if (!cw_instrument_is_powered (inst) || ev->geo.n_curves == 0 || !isfinite (inst->rpm))
    return;
  in_curve = MAX (0.0, pl->depth - ev->geo.onset[0]);
  r->cycles_in_curve = inst->rpm / 60.0 * in_curve / ev->rules->advance_rate;
  if (!isfinite (ev->rules->alloys[inst->alloy].strain_life_a))
    return;
  n = cw_rules_cycles_to_failure (ev->rules, inst->alloy, isfinite (r->strain) ? r->strain : 0.0);
  r->fatigue_use = isfinite (n) ? r->cycles_in_curve / n : 0.0;
}

/* Item 10: T = k tau pi d^3 / 16 in N·mm for d in mm and tau in MPa. */
static void
compute_torsion (const Eval      *ev,
                 const Placement *pl,
                 CwStepResult    *r)
{
  const CwInstrument *inst = pl->instrument;
  const CwAlloyRules *alloy = &ev->rules->alloys[inst->alloy];
  double d3;

  if (!cw_instrument_is_powered (inst) || !isfinite (inst->torque_limit))
    return;
  d3 = cw_profile_diameter (&pl->profile, 3.0);
  r->fracture_torque_d3 = alloy->section_factor * alloy->shear_strength * G_PI * d3 * d3 * d3 / 16.0 / 10.0;
}

/* Findings keep their numbers; the sentence is written only when a report
 * or a view asks (cw_finding_describe), which keeps the planner fast. */
static void
add_finding (CwStepResult *r,
             CwFinding    *finding)
{
  g_ptr_array_add (r->findings, finding);
}

static gboolean
is_small_file (const Eval         *ev,
               const CwInstrument *inst)
{
  return inst->tip <= ev->rules->small_file_tip_max + EPS &&
         cw_instrument_largest_taper (inst) <= ev->rules->small_file_taper_max + CW_TAPER_EPSILON;
}

static void
check_curve_rules (const Eval      *ev,
                   const Placement *pl,
                   CwStepResult    *r,
                   double           taper,
                   gboolean         outside_table)
{
  if (r->engaged_in_curve > ev->rules->curve_engagement_max + EPS && !is_small_file (ev, pl->instrument))
    add_finding (r, cw_finding_new (CW_RULE_CURVE_ENGAGEMENT, CW_LEVEL_STOP,
                                    r->engaged_in_curve, ev->rules->curve_engagement_max));
  if (isfinite (r->ceiling_depth) && pl->depth > r->ceiling_depth + EPS)
    {
      CwFinding *f = cw_finding_new (CW_RULE_DIAMETER_CEILING, CW_LEVEL_STOP, pl->depth, r->ceiling_depth);

      f->other = r->max_diameter_in_curve;
      f->other_limit = r->ceiling;
      add_finding (r, f);
    }
  if (outside_table)
    add_finding (r, cw_finding_new (CW_RULE_CEILING_TABLE, CW_LEVEL_CAUTION, taper, r->ceiling));
  if (isfinite (r->straight_clearance) && r->engaged_in_straight > 0)
    {
      CwFinding *f = cw_finding_new (CW_RULE_STRAIGHT_CLEARANCE, CW_LEVEL_CAUTION,
                                     r->engaged_in_straight, 0.0);

      f->other = -r->straight_clearance;
      add_finding (r, f);
    }
}

static void
check_sequence_rules (Eval            *ev,
                      const Placement *pl,
                      CwStepResult    *r)
{
  const CwInstrument *inst = pl->instrument, *prev = ev->previous;

  if (ev->rules->require_taper_change && prev && prev != inst &&
      cw_instrument_is_powered (prev) && cw_instrument_is_powered (inst) &&
      fabs (cw_instrument_nominal_taper (prev) - cw_instrument_nominal_taper (inst)) <= CW_TAPER_EPSILON)
    add_finding (r, cw_finding_new (CW_RULE_TAPER_CHANGE, CW_LEVEL_CAUTION,
                                    cw_instrument_nominal_taper (inst), NAN));
  if (!ev->glide_checked && cw_instrument_is_powered (inst) &&
      ev->geo.n_curves > 0 && pl->depth > ev->geo.onset[0])
    {
      ev->glide_checked = TRUE;
      if (!(ev->glide_depth >= pl->depth - EPS))
        {
          CwFinding *f = cw_finding_new (CW_RULE_GLIDE_PATH, CW_LEVEL_CAUTION,
                                         pl->depth, ev->rules->glide_path_tip_max);

          f->other = ev->glide_depth;
          add_finding (r, f);
        }
    }
}

static void
check_instrument_rules (const Eval      *ev,
                        const Placement *pl,
                        CwStepResult    *r)
{
  const CwInstrument *inst = pl->instrument;
  double limit = ev->rules->alloys[inst->alloy].strain_limit;

  if (isfinite (limit) && isfinite (r->strain) && r->strain > 0.8 * limit + EPS)
    add_finding (r, cw_finding_new (CW_RULE_STRAIN,
                                    r->strain > limit + EPS ? CW_LEVEL_STOP : CW_LEVEL_CAUTION,
                                    r->strain, limit));
  if (isfinite (r->fracture_torque_d3) && inst->torque_limit > r->fracture_torque_d3 + EPS)
    add_finding (r, cw_finding_new (CW_RULE_TORSION, CW_LEVEL_CAUTION,
                                    inst->torque_limit, r->fracture_torque_d3));
  if (pl->depth > ev->canal->working_length + EPS)
    add_finding (r, cw_finding_new (CW_RULE_BEYOND_LENGTH, CW_LEVEL_STOP,
                                    pl->depth, ev->canal->working_length));
  if (pl->depth > inst->length + EPS)
    add_finding (r, cw_finding_new (CW_RULE_INSTRUMENT_LENGTH, CW_LEVEL_STOP,
                                    pl->depth, inst->length));
}

static CwStepResult *
step_result_new (guint               index,
                 const CwInstrument *instrument,
                 double              depth)
{
  CwStepResult *r = g_new0 (CwStepResult, 1);

  r->index = index;
  r->instrument = instrument;
  r->depth = depth;
  r->max_diameter_in_curve = r->ceiling = r->ceiling_depth = NAN;
  r->straight_clearance = r->strain = r->cycles_in_curve = NAN;
  r->fatigue_use = r->fracture_torque_d3 = r->first_contact = NAN;
  r->findings = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_finding_free);
  r->engaged = g_array_new (FALSE, FALSE, sizeof (CwPoint));
  return r;
}

static void
track_totals (CwEvalState        *ev,
              const CwStepResult *r)
{
  ev->time += r->time;
  ev->has_stop |= r->verdict == CW_LEVEL_STOP;
  if (r->depth >= ev->canal->working_length - ev->rules->at_length_tolerance - EPS &&
      !(r->instrument->tip <= ev->apical_size))
    ev->apical_size = r->instrument->tip;
}

/* Evaluates one more step and carries the state past it.  The result holds
 * the envelope after the step only when keep_envelope is set. */
CwStepResult *
cw_eval_state_apply (CwEvalState        *ev,
                     const CwInstrument *inst,
                     double              depth,
                     gboolean            keep_envelope)
{
  CwStepResult *r = step_result_new (++ev->n_steps, inst, depth);
  Placement pl = { .instrument = inst, .depth = depth };
  double taper, onset;
  gboolean outside_table;

  cw_profile_init (&pl.profile, inst);
  pl.flute_start = MAX (ev->s_o, depth - inst->flute_length);
  pl.file = file_function (&pl.profile, depth);

  compute_engagement (ev, &pl, r);
  split_engagement (ev, r);
  compute_curve_figures (ev, &pl, r, &taper, &onset);
  compute_ceiling (ev, &pl, r, taper, onset, &outside_table);
  compute_clearance (ev, &pl, r);
  compute_time (ev, &pl, r);
  compute_fatigue (ev, &pl, r);
  compute_torsion (ev, &pl, r);

  check_curve_rules (ev, &pl, r, taper, outside_table);
  check_sequence_rules (ev, &pl, r);
  check_instrument_rules (ev, &pl, r);
  r->verdict = cw_findings_worst (r->findings);

  /* Item 11: the flutes leave their shape in the envelope. */
  cw_pwl_raise (ev->envelope, pl.file, pl.flute_start, MIN (depth, ev->s_end));
  if (keep_envelope)
    r->envelope_after = cw_pwl_copy (ev->envelope);
  track_totals (ev, r);
  if (inst->tip <= ev->rules->glide_path_tip_max + EPS)
    ev->glide_depth = isfinite (ev->glide_depth) ? MAX (ev->glide_depth, depth) : depth;
  ev->previous = inst;
  cw_pwl_free (pl.file);
  return r;
}

double
cw_eval_state_apical_taper (const CwEvalState *ev)
{
  double wl = ev->canal->working_length;

  return (cw_pwl_eval (ev->envelope, wl - 3.0) - cw_pwl_eval (ev->envelope, wl)) / 3.0;
}

double
cw_eval_state_apical_size (const CwEvalState *ev)
{
  return ev->apical_size;
}

double
cw_eval_state_time (const CwEvalState *ev)
{
  return ev->time;
}

const CwPwl *
cw_eval_state_envelope (const CwEvalState *ev)
{
  return ev->envelope;
}

const CwGeometry *
cw_eval_state_geometry (const CwEvalState *ev)
{
  return &ev->geo;
}

/* The canal-level finding on the final shape, or NULL when it meets the
 * case's targets. */
CwFinding *
cw_eval_state_final_shape (const CwEvalState *ev)
{
  double size = ev->apical_size, taper = cw_eval_state_apical_taper (ev);
  CwFinding *f;

  if (size >= ev->kase->target_apical_size - EPS &&
      taper >= ev->kase->target_apical_taper - 1e-6)
    return NULL;
  f = cw_finding_new (CW_RULE_FINAL_SHAPE, CW_LEVEL_CAUTION, size, ev->kase->target_apical_size);
  f->other = taper;
  f->other_limit = ev->kase->target_apical_taper;
  return f;
}

static void
finish_canal (const CwEvalState *ev,
              CwCanalResult     *result)
{
  CwFinding *shape = cw_eval_state_final_shape (ev);

  result->apical_size = ev->apical_size;
  result->apical_taper = cw_eval_state_apical_taper (ev);
  result->onset_diameter = ev->geo.n_curves > 0 ? cw_pwl_eval (ev->envelope, ev->geo.onset[0]) : NAN;
  result->time = ev->time;
  result->has_stop = ev->has_stop;
  if (shape)
    g_ptr_array_add (result->findings, shape);
  result->verdict = cw_findings_worst (result->findings);
  for (guint i = 0; i < result->steps->len; i++)
    result->verdict = MAX (result->verdict, cw_canal_result_get_step (result, i)->verdict);
}

/* The envelope must reach past the deepest tip of the sequence. */
static double
envelope_end (const CwCanal *canal)
{
  double end = MAX (canal->working_length, CW_MAX_LENGTH) + 1.0;

  for (guint i = 0; i < canal->sequence->len; i++)
    end = MAX (end, cw_canal_get_step (canal, i)->depth + 1.0);
  return end;
}

CwEvalState *
cw_eval_state_new (const CwCase  *kase,
                   const CwCanal *canal)
{
  CwEvalState *ev;
  g_autoptr(CwPwl) natural = NULL;

  g_return_val_if_fail (kase != NULL && canal != NULL, NULL);

  ev = g_new0 (CwEvalState, 1);
  ev->kase = kase;
  ev->rules = &kase->rules;
  ev->canal = canal;
  ev->glide_depth = NAN;
  ev->apical_size = NAN;
  cw_canal_get_geometry (canal, &ev->geo);
  ev->s_o = canal->orifice_depth;
  ev->s_end = envelope_end (canal);
  ev->envelope = cw_canal_natural_diameter (canal, ev->s_end);
  return ev;
}

CwEvalState *
cw_eval_state_copy (const CwEvalState *ev)
{
  CwEvalState *copy = g_memdup2 (ev, sizeof *ev);

  copy->envelope = cw_pwl_copy (ev->envelope);
  return copy;
}

void
cw_eval_state_free (CwEvalState *ev)
{
  if (ev == NULL)
    return;
  cw_pwl_free (ev->envelope);
  g_free (ev);
}

CwCanalResult *
cw_evaluate_canal (const CwCase  *kase,
                   const CwCanal *canal)
{
  g_autoptr(CwEvalState) ev = NULL;
  CwCanalResult *result;

  g_return_val_if_fail (kase != NULL && canal != NULL, NULL);

  ev = cw_eval_state_new (kase, canal);
  result = g_new0 (CwCanalResult, 1);
  result->canal = canal;
  result->findings = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_finding_free);
  result->steps = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_step_result_free);
  result->geometry = ev->geo;
  result->natural = cw_pwl_copy (ev->envelope);

  for (guint i = 0; i < canal->sequence->len; i++)
    {
      const CwStep *step = cw_canal_get_step (canal, i);
      const CwInstrument *inst = cw_case_find_instrument (kase, step->instrument_id);

      if (inst == NULL)
        {
          g_critical ("Step %u names unknown instrument '%s'", i + 1, step->instrument_id);
          continue;
        }
      g_ptr_array_add (result->steps, cw_eval_state_apply (ev, inst, step->depth, TRUE));
    }
  finish_canal (ev, result);
  return result;
}
