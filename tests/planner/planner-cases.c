/* planner-cases.c: invented inventories and the exhaustive enumeration
 *
 * The enumeration shares no code with the planner: it walks every sequence
 * of moves of the model up to the step limit, finding each move's depth by
 * evaluating every grid depth from the deepest allowed one down, and keeps
 * every complete plan (a plan ends where the targets are first met).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-test"

#include <math.h>

#include "planner-cases.h"

typedef struct
{
  const char *id;
  double      tip;
  double      taper;
  CwAlloy     alloy;
  CwMotion    motion;
  double      torque_limit;   /* NAN: none */
  double      flute_length;
  double      length;
} FileSpec;

#define ST CW_ALLOY_STAINLESS
#define NT CW_ALLOY_NITI
#define HT CW_ALLOY_NITI_HEAT_TREATED
#define HAND CW_MOTION_HAND
#define ROT CW_MOTION_ROTARY
#define REC CW_MOTION_RECIPROCATING

/* Ordered so that the first eight make a sensible drawer on their own. */
static const FileSpec general_files[] = {
  { "k10", 10, 0.02, ST, HAND, NAN, 16, 25 },
  { "k15", 15, 0.02, ST, HAND, NAN, 16, 25 },
  { "r20-04", 20, 0.04, NT, ROT, NAN, 16, 25 },
  { "r25-06", 25, 0.06, HT, ROT, NAN, 16, 25 },
  { "r30-04", 30, 0.04, NT, ROT, NAN, 16, 25 },
  { "k20", 20, 0.02, ST, HAND, NAN, 16, 25 },
  { "r25-04", 25, 0.04, NT, ROT, NAN, 16, 25 },
  { "os25-08", 25, 0.08, NT, ROT, 0.6, 10, 19 },
  { "r30-06", 30, 0.06, HT, ROT, NAN, 16, 25 },
  { "gp15-03", 15, 0.03, HT, ROT, 0.05, 16, 25 },
  { "r35-04", 35, 0.04, NT, ROT, NAN, 16, 25 },
  { "k25", 25, 0.02, ST, HAND, NAN, 16, 25 },
  { "rc25-06", 25, 0.06, HT, REC, NAN, 16, 25 },
  { "r40-04", 40, 0.04, NT, ROT, NAN, 16, 25 },
};

/* Same-taper files with torque limits: taper-change and torsion decide. */
static const FileSpec peer_files[] = {
  { "k10", 10, 0.02, ST, HAND, NAN, 16, 25 },
  { "k15", 15, 0.02, ST, HAND, NAN, 16, 25 },
  { "r20-04", 20, 0.04, NT, ROT, 0.3, 16, 25 },
  { "r25-04", 25, 0.04, NT, ROT, 0.5, 16, 25 },
  { "r30-04", 30, 0.04, NT, ROT, 2.0, 16, 25 },
  { "r35-04", 35, 0.04, NT, ROT, 0.8, 16, 25 },
  { "r25-06", 25, 0.06, HT, ROT, NAN, 16, 25 },
  { "r30-06", 30, 0.06, HT, ROT, 3.0, 16, 25 },
  { "gp15-03", 15, 0.03, HT, ROT, NAN, 16, 25 },
  { "r35-06", 35, 0.06, HT, ROT, NAN, 16, 25 },
  { "k20", 20, 0.02, ST, HAND, NAN, 16, 25 },
  { "r40-04", 40, 0.04, NT, ROT, NAN, 16, 25 },
};

static void
add_file (CwCase         *kase,
          const FileSpec *spec)
{
  CwInstrument *inst = cw_test_instrument (kase, spec->id, spec->tip, spec->taper, spec->alloy, spec->motion);

  inst->torque_limit = spec->torque_limit;
  inst->flute_length = spec->flute_length;
  inst->length = spec->length;
}

static void
add_files (CwCase         *kase,
           const FileSpec *files,
           guint           n_files,
           guint           n)
{
  for (guint i = 0; i < MIN (n, n_files); i++)
    add_file (kase, &files[i]);
}

static void
set_targets (CwCase *kase,
             double  size,
             double  taper)
{
  kase->target_apical_size = size;
  kase->target_apical_taper = taper;
}

/* Canals, diameters and targets are invented to exercise the rules. */
CwCase *
planner_case (PlannerCaseKind kind,
              guint           n_files)
{
  CwCase *kase = cw_case_new ();
  CwCanal *canal;

  switch (kind)
    {
    case PLANNER_CASE_ONE_CURVE:
      canal = cw_test_canal (kase, 21.0, 7.0, 0.55, 0.18);
      cw_canal_add_curve (canal, 15.5, 25, 8);
      set_targets (kase, 30, 0.04);
      break;
    case PLANNER_CASE_S_SHAPE:
      canal = cw_test_canal (kase, 20.0, 7.5, 0.45, 0.18);
      cw_canal_add_curve (canal, 13.0, 15, 10);
      cw_canal_add_curve (canal, 16.0, 20, 6);
      set_targets (kase, 25, 0.04);
      break;
    case PLANNER_CASE_STRAIGHT:
      canal = cw_test_canal (kase, 22.0, 8.0, 0.70, 0.22);
      set_targets (kase, 30, 0.05);
      break;
    case PLANNER_CASE_PEERS:
      canal = cw_test_canal (kase, 20.5, 6.5, 0.60, 0.20);
      cw_canal_add_curve (canal, 16.0, 25, 8);
      set_targets (kase, 35, 0.04);
      add_files (kase, peer_files, G_N_ELEMENTS (peer_files), n_files);
      return kase;
    case PLANNER_CASE_SEVERE:
    default:
      canal = cw_test_canal (kase, 20.0, 7.0, 0.50, 0.16);
      cw_canal_add_curve (canal, 12.5, 40, 5);
      set_targets (kase, 25, 0.04);
      break;
    }
  add_files (kase, general_files, G_N_ELEMENTS (general_files), n_files);
  return kase;
}

static void
add_series (CwCase     *kase,
            const char *prefix,
            const int  *tips,
            guint       n,
            double      taper,
            CwAlloy     alloy,
            CwMotion    motion)
{
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *id = g_strdup_printf ("%s%02d", prefix, tips[i]);

      cw_test_instrument (kase, id, tips[i], taper, alloy, motion);
    }
}

/* A well-stocked drawer of 40 files, a two-curve canal, target 35/.04. */
CwCase *
planner_case_forty (void)
{
  static const int hand[] = { 6, 8, 10, 15, 20, 25, 30, 35, 40, 45, 50, 55 };
  static const int r04[] = { 15, 20, 25, 30, 35, 40, 45, 50 };
  static const int h06[] = { 15, 20, 25, 30, 35, 40 };
  static const int r02[] = { 15, 20, 25, 30, 35, 40 };
  static const int r05[] = { 20, 25, 30, 35 };
  CwCase *kase = cw_case_new ();
  CwCanal *canal = cw_test_canal (kase, 21.5, 7.0, 0.60, 0.20);
  CwTaperSegment segs[] = { { 3, 0.07 }, { 16, 0.04 } };
  CwInstrument *v;

  cw_canal_add_curve (canal, 12.0, 22, 9);
  cw_canal_add_curve (canal, 16.5, 18, 6);
  set_targets (kase, 35, 0.04);
  add_series (kase, "k", hand, G_N_ELEMENTS (hand), 0.02, ST, HAND);
  add_series (kase, "r04-", r04, G_N_ELEMENTS (r04), 0.04, NT, ROT);
  add_series (kase, "h06-", h06, G_N_ELEMENTS (h06), 0.06, HT, ROT);
  add_series (kase, "r02-", r02, G_N_ELEMENTS (r02), 0.02, HT, ROT);
  add_series (kase, "r05-", r05, G_N_ELEMENTS (r05), 0.05, NT, ROT);
  add_file (kase, &(FileSpec) { "gp15-03", 15, 0.03, HT, ROT, NAN, 16, 25 });
  add_file (kase, &(FileSpec) { "os25-08", 25, 0.08, NT, ROT, 0.6, 10, 19 });
  add_file (kase, &(FileSpec) { "rc25-08", 25, 0.08, HT, REC, NAN, 16, 25 });
  v = cw_test_instrument (kase, "v25", 25, NAN, HT, ROT);
  cw_instrument_set_segments (v, segs, G_N_ELEMENTS (segs));
  v->max_flute_diameter = 1.0;
  g_assert_cmpuint (kase->instruments->len, ==, 40);
  return kase;
}

static const FileSpec pool_files[] = {
  { "k08", 8, 0.02, ST, HAND, NAN, 16, 25 },
  { "k10", 10, 0.02, ST, HAND, NAN, 16, 21 },
  { "k15", 15, 0.02, ST, HAND, NAN, 16, 25 },
  { "k20", 20, 0.02, ST, HAND, NAN, 16, 25 },
  { "k25", 25, 0.02, ST, HAND, NAN, 16, 31 },
  { "k30", 30, 0.02, ST, HAND, NAN, 16, 25 },
  { "k35", 35, 0.02, ST, HAND, NAN, 16, 25 },
  { "k40", 40, 0.02, ST, HAND, NAN, 16, 21 },
  { "gp15-03", 15, 0.03, HT, ROT, 0.05, 16, 25 },
  { "r15-04", 15, 0.04, NT, ROT, NAN, 16, 25 },
  { "r20-04", 20, 0.04, NT, ROT, 0.4, 16, 25 },
  { "r25-04", 25, 0.04, NT, ROT, NAN, 16, 21 },
  { "r30-04", 30, 0.04, NT, ROT, 1.2, 16, 25 },
  { "r35-04", 35, 0.04, NT, ROT, NAN, 16, 31 },
  { "r40-04", 40, 0.04, NT, ROT, NAN, 16, 25 },
  { "h20-06", 20, 0.06, HT, ROT, NAN, 16, 25 },
  { "h25-06", 25, 0.06, HT, ROT, 2.0, 16, 25 },
  { "h30-06", 30, 0.06, HT, ROT, NAN, 16, 25 },
  { "os25-08", 25, 0.08, NT, ROT, 0.6, 10, 19 },
  { "rc25-08", 25, 0.08, HT, REC, NAN, 16, 25 },
  { "rc40-06", 40, 0.06, HT, REC, NAN, 16, 25 },
  { "k20-21", 20, 0.02, ST, HAND, NAN, 16, 21 },
};

static double
uniform (GRand  *rand,
         double  lo,
         double  hi,
         double  step)
{
  return lo + step * g_rand_int_range (rand, 0, (int) round ((hi - lo) / step) + 1);
}

static void
random_curves (GRand   *rand,
               CwCanal *canal)
{
  double wl = canal->working_length, start = canal->orifice_depth + 1.0;
  guint n = g_rand_int_range (rand, 0, 3);

  for (guint i = 0; i < n; i++)
    {
      double onset = uniform (rand, start, MAX (start, wl - 3.0), 0.1);
      double angle = uniform (rand, 10, 40, 1), radius = uniform (rand, 4, 12, 0.5);
      double end = onset + radius * angle * G_PI / 180.0;

      if (end > wl)
        return;
      cw_canal_add_curve (canal, onset, angle, radius);
      start = end;
    }
}

static void
random_rules (GRand   *rand,
              CwRules *rules)
{
  static const double changeovers[] = { 0, 10, 20, 20 };

  rules->changeover = changeovers[g_rand_int_range (rand, 0, 4)];
  rules->require_taper_change = g_rand_int_range (rand, 0, 4) != 0;
  rules->advance_rate = g_rand_boolean (rand) ? 0.5 : 1.0;
  rules->curve_engagement_max = uniform (rand, 1.0, 6.0, 0.5);
  rules->small_file_tip_max = g_rand_boolean (rand) ? 15 : 20;
}

/* A random canal, rule set, targets and drawer, the same for each seed. */
CwCase *
planner_case_random (guint32 seed,
                     guint   n_files)
{
  static const double sizes[] = { 20, 25, 30, 35 };
  static const double tapers[] = { 0.02, 0.03, 0.04, 0.05, 0.06 };
  g_autoptr(GRand) rand = g_rand_new_with_seed (seed);
  CwCase *kase = cw_case_new ();
  CwCanal *canal;
  gboolean taken[G_N_ELEMENTS (pool_files)] = { FALSE };

  canal = cw_test_canal (kase, uniform (rand, 18, 23, 0.1), uniform (rand, 5, 9, 0.1),
                         uniform (rand, 0.3, 0.7, 0.01), uniform (rand, 0.08, 0.2, 0.01));
  random_curves (rand, canal);
  random_rules (rand, &kase->rules);
  set_targets (kase, sizes[g_rand_int_range (rand, 0, 4)], tapers[g_rand_int_range (rand, 0, 5)]);
  for (guint i = 0; i < MIN (n_files, G_N_ELEMENTS (pool_files)); i++)
    {
      guint k = g_rand_int_range (rand, 0, G_N_ELEMENTS (pool_files));

      while (taken[k])
        k = (k + 1) % G_N_ELEMENTS (pool_files);
      taken[k] = TRUE;
      add_file (kase, &pool_files[k]);
    }
  return kase;
}

void
enumeration_clear (Enumeration *e)
{
  g_clear_pointer (&e->plans, g_array_unref);
}

static void
enum_plan_clear (gpointer data)
{
  g_array_unref (((EnumPlan *) data)->steps);
}

int
enum_plan_compare (gconstpointer a,
                   gconstpointer b)
{
  const EnumPlan *x = a, *y = b;

  if (x->cautions != y->cautions)
    return x->cautions < y->cautions ? -1 : 1;
  if (fabs (x->time - y->time) > 1e-9)
    return x->time < y->time ? -1 : 1;
  return (x->steps->len > y->steps->len) - (x->steps->len < y->steps->len);
}

static gboolean
stops (const CwEvalState  *state,
       const CwInstrument *inst,
       double              depth)
{
  g_autoptr(CwEvalState) copy = cw_eval_state_copy (state);
  g_autoptr(CwStepResult) r = cw_eval_state_apply (copy, inst, depth, FALSE);

  return r->verdict == CW_LEVEL_STOP;
}

/* Deepest grid depth without a stop, by evaluating each from the top. */
double
model_depth (const CwEvalState  *state,
             const CwCanal      *canal,
             const CwInstrument *inst)
{
  double cap = MIN (canal->working_length, inst->length);

  for (int k = (int) floor (cap / 0.5 + 1e-9); k * 0.5 > canal->orifice_depth + 1e-9; k--)
    if (!stops (state, inst, k * 0.5))
      return k * 0.5;
  return NAN;
}

/* A move gains depth or raises the envelope by more than the tolerance; a
 * raise within 1e-9 mm of it is the tolerance itself, rounded. */
gboolean
model_is_move (const CwCase      *kase,
               const CwEvalState *before,
               const CwEvalState *after,
               double             deepest,
               double             depth)
{
  return depth > deepest + 1e-9 ||
         envelope_raise (cw_eval_state_envelope (before), cw_eval_state_envelope (after)) >
         kase->rules.contact_tolerance + 1e-9;
}

static void
add_breaks (GArray      *at,
            const CwPwl *pwl)
{
  for (guint i = 0; i < cw_pwl_get_n_points (pwl); i++)
    g_array_append_val (at, cw_pwl_get_points (pwl)[i].s);
}

/* The most the envelope grew anywhere: the difference of two piecewise
 * linear functions peaks at a breakpoint of one of them. */
double
envelope_raise (const CwPwl *before,
                const CwPwl *after)
{
  g_autoptr(GArray) at = g_array_new (FALSE, FALSE, sizeof (double));
  double most = 0.0;

  add_breaks (at, before);
  add_breaks (at, after);
  for (guint i = 0; i < at->len; i++)
    {
      double s = g_array_index (at, double, i);

      most = MAX (most, cw_pwl_eval_side (after, s, CW_SIDE_LEFT) - cw_pwl_eval_side (before, s, CW_SIDE_LEFT));
      most = MAX (most, cw_pwl_eval_side (after, s, CW_SIDE_RIGHT) - cw_pwl_eval_side (before, s, CW_SIDE_RIGHT));
    }
  return most;
}

typedef struct
{
  const CwCase  *kase;
  const CwCanal *canal;
  guint          max_steps;
  Enumeration   *e;
  GArray        *seq;
} Walk;

static guint
count_cautions (const CwStepResult *r)
{
  guint n = 0;

  for (guint i = 0; i < r->findings->len; i++)
    n += ((CwFinding *) g_ptr_array_index (r->findings, i))->level == CW_LEVEL_CAUTION;
  return n;
}

static void
record (Walk  *w,
        guint  cautions,
        double time)
{
  EnumPlan plan = { g_array_copy (w->seq), cautions, time };

  g_array_append_val (w->e->plans, plan);
}

static void walk (Walk              *w,
                  const CwEvalState *state,
                  double             deepest,
                  guint              cautions);

static void
try_file (Walk               *w,
          const CwEvalState  *state,
          const CwInstrument *inst,
          double              deepest,
          guint               cautions)
{
  double depth = model_depth (state, w->canal, inst);
  g_autoptr(CwEvalState) next = NULL;
  g_autoptr(CwStepResult) r = NULL;
  CwPlanStep step = { inst, depth };

  if (isnan (depth))
    return;
  next = cw_eval_state_copy (state);
  r = cw_eval_state_apply (next, inst, depth, FALSE);
  if (!model_is_move (w->kase, state, next, deepest, depth))
    return;
  g_array_append_val (w->seq, step);
  walk (w, next, MAX (deepest, depth), cautions + count_cautions (r));
  g_array_set_size (w->seq, w->seq->len - 1);
}

static void
walk (Walk              *w,
      const CwEvalState *state,
      double             deepest,
      guint              cautions)
{
  g_autoptr(CwFinding) shape = cw_eval_state_final_shape (state);

  w->e->sequences++;
  if (w->seq->len > 0 && shape == NULL)
    {
      record (w, cautions, cw_eval_state_time (state));
      return;
    }
  if (w->seq->len >= w->max_steps)
    return;
  for (guint i = 0; i < w->kase->instruments->len; i++)
    try_file (w, state, g_ptr_array_index (w->kase->instruments, i), deepest, cautions);
}

void
enumeration_run (Enumeration   *e,
                 const CwCase  *kase,
                 const CwCanal *canal,
                 guint          max_steps)
{
  g_autoptr(CwEvalState) state = cw_eval_state_new (kase, canal);
  g_autoptr(GArray) seq = g_array_new (FALSE, FALSE, sizeof (CwPlanStep));
  Walk w = { kase, canal, max_steps, e, seq };

  e->plans = g_array_new (FALSE, FALSE, sizeof (EnumPlan));
  g_array_set_clear_func (e->plans, enum_plan_clear);
  e->sequences = 0;
  walk (&w, state, canal->orifice_depth, 0);
  g_array_sort (e->plans, enum_plan_compare);
}
