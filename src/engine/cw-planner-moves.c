/* cw-planner-moves.c: the one move each file has from a partial plan
 *
 * A move takes a file to the deepest grid depth, at most the working length
 * and the file's own length, whose step has no stop finding, and it must
 * gain depth or raise the envelope by more than the contact tolerance.
 * Every step is evaluated by the engine itself, so that a plan evaluates
 * again to the same figures.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-planner"

#include <math.h>
#include <string.h>

#include "cw-planner-private.h"


int
cw_plan_cost_compare (const PlanCost *a,
                      const PlanCost *b)
{
  if (a->cautions != b->cautions)
    return a->cautions < b->cautions ? -1 : 1;
  if (fabs (a->time - b->time) > PLAN_EPS)
    return a->time < b->time ? -1 : 1;
  if (a->steps != b->steps)
    return a->steps < b->steps ? -1 : 1;
  return 0;
}

/* Bit for bit: the engine is deterministic, so the same points give the
 * same future.  Envelopes equal only to rounding are kept apart, since
 * rounding decides contact where a file lies exactly the tolerance over
 * the wall, which the 0.5 mm grid makes common. */
gboolean
cw_envelopes_equal (const CwPwl *a,
                    const CwPwl *b)
{
  guint n = cw_pwl_get_n_points (a);

  return n == cw_pwl_get_n_points (b) &&
         memcmp (cw_pwl_get_points (a), cw_pwl_get_points (b), n * sizeof (CwPoint)) == 0;
}

static double
raise_at (const CwPwl *before,
          const CwPwl *after,
          double       s,
          CwSide       side)
{
  return cw_pwl_eval_side (after, s, side) - cw_pwl_eval_side (before, s, side);
}

/* Whether the envelope rose by more than limit somewhere in [a, b], where
 * the step cut: the difference of the two peaks at a breakpoint of one. */
static gboolean
raised_over (const CwPwl *before,
             const CwPwl *after,
             double       a,
             double       b,
             double       limit)
{
  g_autoptr(GArray) at = g_array_new (FALSE, FALSE, sizeof (double));

  g_array_append_val (at, a);
  g_array_append_val (at, b);
  cw_pwl_collect_breaks (after, a, b, at);
  cw_pwl_collect_breaks (before, a, b, at);
  for (guint i = 0; i < at->len; i++)
    {
      double s = g_array_index (at, double, i);

      if (raise_at (before, after, s, CW_SIDE_LEFT) > limit ||
          raise_at (before, after, s, CW_SIDE_RIGHT) > limit)
        return TRUE;
    }
  return FALSE;
}

static guint
envelope_hash (const CwPwl *envelope)
{
  const CwPoint *p = cw_pwl_get_points (envelope);
  guint64 hash = 14695981039346656037u;

  for (guint i = 0; i < cw_pwl_get_n_points (envelope); i++)
    {
      guint64 bits[2];

      memcpy (bits, &p[i], sizeof bits);
      hash = (hash ^ bits[0]) * 1099511628211u;
      hash = (hash ^ bits[1]) * 1099511628211u;
    }
  return (guint) (hash ^ (hash >> 32));
}

static guint
count_cautions (const CwStepResult *r)
{
  guint n = 0;

  for (guint i = 0; i < r->findings->len; i++)
    n += ((const CwFinding *) g_ptr_array_index (r->findings, i))->level == CW_LEVEL_CAUTION;
  return n;
}

/* Cautions no earlier step can take away: they depend on the file, its
 * depth and the canal only. */
static guint
count_fixed_cautions (const CwStepResult *r)
{
  guint n = 0;

  for (guint i = 0; i < r->findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (r->findings, i);

      n += f->level == CW_LEVEL_CAUTION &&
           (f->rule == CW_RULE_TORSION || f->rule == CW_RULE_STRAIN ||
            f->rule == CW_RULE_CEILING_TABLE);
    }
  return n;
}

static gboolean
has_fixed_stop (const CwStepResult *r)
{
  for (guint i = 0; i < r->findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (r->findings, i);

      if (f->level == CW_LEVEL_STOP && f->rule != CW_RULE_CURVE_ENGAGEMENT)
        return TRUE;
    }
  return FALSE;
}

gboolean
cw_planner_out_of_budget (const Planner *p)
{
  return p->stats.evaluated >= p->options.node_budget;
}

/* The ceiling, strain and length rules depend on the file, its depth and
 * the canal only, so the natural canal answers for every state. */
gboolean
cw_planner_fixed_stop (Planner *p,
                       guint    file,
                       int      k)
{
  PlanFile *f = &p->files[file];

  if (f->fixed[k] == 0)
    {
      g_autoptr(CwEvalState) state = cw_eval_state_copy (p->root_state);
      g_autoptr(CwStepResult) r = NULL;

      r = cw_eval_state_apply (state, f->instrument, k * CW_PLAN_GRID, FALSE);
      p->stats.evaluated++;
      f->fixed[k] = has_fixed_stop (r) ? 2 : 1;
      f->fixed_cautions[k] = count_fixed_cautions (r);
    }
  return f->fixed[k] == 2;
}

static double
next_glide (const Planner  *p,
            const PlanFile *f,
            double          glide,
            double          depth)
{
  if (glide == INFINITY)
    return glide;
  if (f->powered && depth > p->geo.onset[0])
    return INFINITY;
  return f->glide_file ? MAX (glide, depth) : glide;
}

/* The engine's own final-shape check decides; a taper clearly short of
 * the target spares it writing its sentence. */
static gboolean
shape_met (const Planner     *p,
           const CwEvalState *state)
{
  g_autoptr(CwFinding) shape = NULL;

  if (cw_eval_state_apical_taper (state) < p->target_taper - 1e-3)
    return FALSE;
  shape = cw_eval_state_final_shape (state);
  return shape == NULL;
}

static double
shortfall_of (const Planner     *p,
              const CwEvalState *state)
{
  double size = cw_eval_state_apical_size (state);
  double size_gap = (p->target_size - (isfinite (size) ? size : 0.0)) / 100.0;
  double taper_gap = 3.0 * (p->target_taper - cw_eval_state_apical_taper (state));

  return MAX (0.0, size_gap) + MAX (0.0, taper_gap);
}

static PlanNode *
node_new (Planner *p)
{
  PlanNode *node = g_new0 (PlanNode, 1);

  node->serial = p->nodes->len;
  g_ptr_array_add (p->nodes, node);
  return node;
}

/* f = g + a lower bound of the rest: a step that is not yet the last costs
 * a changeover at least, and the step that brings the size to length has
 * the fixed cautions of the best file for it. */
static void
set_bound (const Planner *p,
           PlanNode      *node)
{
  node->f = node->g;
  if (node->goal)
    return;
  node->f.time += MAX (0.0, p->rules->changeover);
  node->f.steps += 1;
  if (!node->apical_met && p->apical_cautions != G_MAXUINT)
    node->f.cautions += p->apical_cautions;
}

static void
set_key (Planner  *p,
         PlanNode *node)
{
  double size = cw_eval_state_apical_size (node->state);

  node->apical_met = size >= p->target_size - PLAN_EPS;
  node->goal = node->apical_met && shape_met (p, node->state);
  node->shortfall = shortfall_of (p, node->state);
  node->hash = envelope_hash (cw_eval_state_envelope (node->state));
  set_bound (p, node);
}

PlanNode *
cw_planner_root (Planner *p)
{
  PlanNode *root = node_new (p);

  root->state = cw_eval_state_copy (p->root_state);
  root->instrument = G_MAXUINT;
  root->depth = NAN;
  root->previous = -1;
  root->glide = p->glide_start;
  root->deepest = p->canal->orifice_depth;
  set_key (p, root);
  return root;
}

static PlanNode *
child_new (Planner            *p,
           PlanNode           *from,
           guint               file,
           CwEvalState        *state,
           const CwStepResult *r)
{
  const PlanFile *f = &p->files[file];
  PlanNode *node = node_new (p);

  node->parent = from;
  node->state = state;
  node->instrument = file;
  node->depth = r->depth;
  node->g.cautions = from->g.cautions + count_cautions (r);
  node->g.time = from->g.time + r->time;
  node->g.steps = from->g.steps + 1;
  node->previous = f->taper_peer ? (int) file : -1;
  node->glide = next_glide (p, f, from->glide, r->depth);
  node->deepest = MAX (from->deepest, r->depth);
  set_key (p, node);
  return node;
}

/* The largest d - P over [a, b], taking the lower side of each jump of P. */
static double
largest_gap (const CwPwl *widest,
             const CwPwl *envelope,
             double       a,
             double       b)
{
  g_autoptr(GArray) at = g_array_new (FALSE, FALSE, sizeof (double));
  double most = -INFINITY;

  g_array_append_val (at, a);
  g_array_append_val (at, b);
  cw_pwl_collect_breaks (widest, a, b, at);
  cw_pwl_collect_breaks (envelope, a, b, at);
  for (guint i = 0; i < at->len; i++)
    {
      double s = g_array_index (at, double, i), d = cw_pwl_eval (widest, s);

      most = MAX (most, d - cw_pwl_eval_side (envelope, s, CW_SIDE_LEFT));
      most = MAX (most, d - cw_pwl_eval_side (envelope, s, CW_SIDE_RIGHT));
    }
  return most;
}

/* A file that can neither go deeper than any before it nor, at any depth,
 * be wider than the tolerance over the envelope anywhere has no move; the
 * check costs far less than an evaluation. */
static gboolean
may_move (const Planner  *p,
          const PlanNode *from,
          const PlanFile *f)
{
  double top = f->top * CW_PLAN_GRID;

  if (f->widest == NULL || top > from->deepest + PLAN_EPS)
    return TRUE;
  return largest_gap (f->widest, cw_eval_state_envelope (from->state), p->canal->orifice_depth, top) >
         p->rules->contact_tolerance + PLAN_RAISE_MARGIN;
}

/* The envelope changes only where the flutes lay. */
static gboolean
is_move (const Planner      *p,
         const PlanNode     *from,
         const CwEvalState  *after,
         const CwInstrument *inst,
         double              depth)
{
  double top = MAX (p->canal->orifice_depth, depth - inst->flute_length);

  if (depth > from->deepest + PLAN_EPS)
    return TRUE;
  return raised_over (cw_eval_state_envelope (from->state), cw_eval_state_envelope (after),
                      top, depth, p->rules->contact_tolerance + PLAN_RAISE_MARGIN);
}

/* The scan is literal: the deepest grid depth without a stop, whether or
 * not a deeper one is also free of stops.  The rules need not be monotone
 * in depth (flutes can leave a curve coronally as the tip goes on, and a
 * variable taper changes the ceiling), so no depth is skipped by bisection. */
PlanNode *
cw_planner_move (Planner  *p,
                 PlanNode *from,
                 guint     file)
{
  const PlanFile *f = &p->files[file];

  if (!may_move (p, from, f))
    return NULL;
  for (int k = f->top; k >= f->bottom; k--)
    {
      g_autoptr(CwEvalState) state = NULL;
      g_autoptr(CwStepResult) r = NULL;

      if (cw_planner_fixed_stop (p, file, k))
        continue;
      state = cw_eval_state_copy (from->state);
      r = cw_eval_state_apply (state, f->instrument, k * CW_PLAN_GRID, FALSE);
      p->stats.evaluated++;
      if (r->verdict == CW_LEVEL_STOP)
        continue;
      if (!is_move (p, from, state, f->instrument, r->depth))
        return NULL;
      return child_new (p, from, file, g_steal_pointer (&state), r);
    }
  return NULL;
}

/* Rebuilds the state of a queued node from its parent's; FALSE if the step
 * then has a stop, which would mean that evaluation is not repeatable. */
gboolean
cw_planner_complete (Planner  *p,
                     PlanNode *node)
{
  g_autoptr(CwStepResult) r = NULL;

  if (node->state || node->parent == NULL)
    return TRUE;
  g_return_val_if_fail (node->parent->state != NULL, FALSE);

  node->state = cw_eval_state_copy (node->parent->state);
  r = cw_eval_state_apply (node->state, p->files[node->instrument].instrument, node->depth, FALSE);
  p->stats.evaluated++;
  return r->verdict != CW_LEVEL_STOP;
}

void
cw_planner_release (PlanNode *node)
{
  g_clear_pointer (&node->state, cw_eval_state_free);
}

static gboolean
has_taper_peer (const Planner      *p,
                const CwInstrument *inst)
{
  double taper = cw_instrument_nominal_taper (inst);

  if (!p->rules->require_taper_change || !cw_instrument_is_powered (inst))
    return FALSE;
  for (guint i = 0; i < p->kase->instruments->len; i++)
    {
      const CwInstrument *other = g_ptr_array_index (p->kase->instruments, i);

      if (other != inst && cw_instrument_is_powered (other) &&
          fabs (cw_instrument_nominal_taper (other) - taper) <= CW_TAPER_EPSILON)
        return TRUE;
    }
  return FALSE;
}

/* d (min (flute length, top - s)): at any depth up to top, the fluted part
 * at s is no wider.  NULL when the profile narrows somewhere, where that
 * would not hold. */
static CwPwl *
widest_function (const CwInstrument *inst,
                 double              top)
{
  CwProfile profile;
  CwPwl *widest;

  cw_profile_init (&profile, inst);
  for (guint i = 1; i < profile.n; i++)
    if (profile.d[i] < profile.d[i - 1])
      return NULL;
  widest = cw_pwl_new ();
  cw_pwl_append (widest, top - profile.flute_length, cw_profile_diameter (&profile, profile.flute_length));
  for (guint i = profile.n; i-- > 0;)
    if (profile.x[i] < profile.flute_length)
      cw_pwl_append (widest, top - profile.x[i], profile.d[i]);
  return widest;
}

static void
init_file (Planner            *p,
           PlanFile           *f,
           const CwInstrument *inst)
{
  double cap = MIN (p->canal->working_length, inst->length);

  f->instrument = inst;
  f->powered = cw_instrument_is_powered (inst);
  f->glide_file = inst->tip <= p->rules->glide_path_tip_max + PLAN_EPS;
  f->taper_peer = has_taper_peer (p, inst);
  f->top = (int) floor (cap / CW_PLAN_GRID + PLAN_EPS);
  f->bottom = (int) floor (p->canal->orifice_depth / CW_PLAN_GRID + PLAN_EPS) + 1;
  f->widest = widest_function (inst, f->top * CW_PLAN_GRID);
  f->fixed = g_new0 (guint8, MAX (f->top, 0) + 1);
  f->fixed_cautions = g_new0 (guint8, MAX (f->top, 0) + 1);
}

/* The least fixed cautions of a step that brings a file of the target size
 * to length; G_MAXUINT when no file can. */
static guint
least_apical_cautions (Planner *p)
{
  double at_length = p->canal->working_length - p->rules->at_length_tolerance - PLAN_EPS;
  guint least = G_MAXUINT;

  for (guint i = 0; i < p->n_files; i++)
    {
      PlanFile *f = &p->files[i];

      if (!(f->instrument->tip >= p->target_size - PLAN_EPS))
        continue;
      for (int k = f->top; k >= f->bottom && k * CW_PLAN_GRID >= at_length; k--)
        if (!cw_planner_fixed_stop (p, i, k))
          least = MIN (least, f->fixed_cautions[k]);
    }
  return least;
}

static gboolean
any_powered (const CwCase *kase)
{
  for (guint i = 0; i < kase->instruments->len; i++)
    if (cw_instrument_is_powered (g_ptr_array_index (kase->instruments, i)))
      return TRUE;
  return FALSE;
}

Planner *
cw_planner_new (const CwCase        *kase,
                const CwCanal       *canal,
                const CwPlanOptions *options)
{
  Planner *p = g_new0 (Planner, 1);

  p->kase = kase;
  p->canal = cw_canal_copy (canal);
  cw_canal_clear_sequence (p->canal);
  p->rules = &kase->rules;
  p->options = *options;
  p->target_size = kase->target_apical_size;
  p->target_taper = kase->target_apical_taper;
  cw_canal_get_geometry (p->canal, &p->geo);
  p->root_state = cw_eval_state_new (kase, p->canal);
  p->glide_start = p->geo.n_curves > 0 && any_powered (kase) ? -INFINITY : INFINITY;
  p->nodes = g_ptr_array_new_with_free_func (g_free);
  p->n_files = kase->instruments->len;
  p->files = g_new0 (PlanFile, MAX (p->n_files, 1));
  for (guint i = 0; i < p->n_files; i++)
    init_file (p, &p->files[i], g_ptr_array_index (kase->instruments, i));
  p->apical_cautions = least_apical_cautions (p);
  return p;
}

void
cw_planner_free (Planner *p)
{
  if (p == NULL)
    return;
  for (guint i = 0; i < p->nodes->len; i++)
    cw_planner_release (g_ptr_array_index (p->nodes, i));
  g_ptr_array_unref (p->nodes);
  for (guint i = 0; i < p->n_files; i++)
    {
      g_free (p->files[i].fixed);
      cw_pwl_free (p->files[i].widest);
      g_free (p->files[i].fixed_cautions);
    }
  g_free (p->files);
  cw_eval_state_free (p->root_state);
  cw_canal_free (p->canal);
  g_free (p);
}
