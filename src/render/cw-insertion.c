/* cw-insertion.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <math.h>

#include "cw-insertion.h"

void
cw_insertion_init (CwInsertion        *ins,
                   const CwStepResult *step,
                   const CwRules      *rules,
                   double              orifice)
{
  g_return_if_fail (ins != NULL && step != NULL && rules != NULL);

  ins->depth = step->depth;
  /* The engine's pecks; none means it never touches on the way in. */
  ins->pecks = step->pecks;
  ins->contact = isfinite (step->first_contact) && ins->pecks > 0 ? MIN (step->first_contact, step->depth)
                                                                 : step->depth;
  ins->start = MIN (orifice, ins->contact);
  ins->advance_rate = rules->advance_rate > 0 ? rules->advance_rate : 0.5;
  ins->free_rate = ins->advance_rate * CW_INSERTION_FREE_FACTOR;
  ins->increment = rules->peck_increment > 0 ? rules->peck_increment : 1.0;
  ins->lift = MIN (CW_INSERTION_LIFT, ins->increment / 2);
}

static double
approach_time (const CwInsertion *ins)
{
  return (ins->contact - ins->start) / ins->free_rate;
}

static double
lift_time (const CwInsertion *ins)
{
  return 2 * ins->lift / ins->free_rate;
}

double
cw_insertion_duration (const CwInsertion *ins)
{
  g_return_val_if_fail (ins != NULL, 0);

  return approach_time (ins) + (ins->depth - ins->contact) / ins->advance_rate
         + (ins->pecks > 1 ? (ins->pecks - 1) * lift_time (ins) : 0);
}

/* Within the pecks: each advances one increment, then all but the last
 * lift and come back. */
static double
peck_depth (const CwInsertion *ins,
            double             t,
            guint             *pecks)
{
  double from = ins->contact;

  for (guint k = 0; k < ins->pecks; k++)
    {
      double to = k + 1 == ins->pecks ? ins->depth : MIN (ins->contact + (k + 1) * ins->increment, ins->depth);
      double cut = (to - from) / ins->advance_rate;

      if (t < cut)
        {
          *pecks = k;
          return from + t * ins->advance_rate;
        }
      t -= cut;
      *pecks = k + 1;
      if (k + 1 == ins->pecks)
        break;
      if (t < lift_time (ins))
        return to - ins->lift * sin (G_PI * t / lift_time (ins));
      t -= lift_time (ins);
      from = to;
    }
  return ins->depth;
}

double
cw_insertion_depth_at (const CwInsertion *ins,
                       double             t,
                       guint             *pecks)
{
  guint done = 0;
  double depth;

  g_return_val_if_fail (ins != NULL, NAN);

  if (t <= 0)
    depth = ins->start;
  else if (t < approach_time (ins))
    depth = ins->start + t * ins->free_rate;
  else if (t >= cw_insertion_duration (ins))
    {
      depth = ins->depth;
      done = ins->pecks;
    }
  else
    depth = peck_depth (ins, t - approach_time (ins), &done);
  if (pecks)
    *pecks = done;
  return depth;
}

CwEvalState *
cw_insertion_state_before (const CwCase  *kase,
                           const CwCanal *canal,
                           guint          index)
{
  CwEvalState *state;

  g_return_val_if_fail (kase != NULL && canal != NULL, NULL);

  state = cw_eval_state_new (kase, canal);
  for (guint i = 0; i < index && i < cw_canal_get_n_steps (canal); i++)
    {
      const CwStep *step = cw_canal_get_step (canal, i);
      const CwInstrument *inst = cw_case_find_instrument (kase, step->instrument_id);

      if (inst)
        cw_step_result_free (cw_eval_state_apply (state, inst, step->depth, FALSE));
    }
  return state;
}

CwStepResult *
cw_insertion_evaluate (const CwEvalState  *before,
                       const CwInstrument *instrument,
                       double              depth)
{
  g_autoptr(CwEvalState) state = NULL;

  g_return_val_if_fail (before != NULL && instrument != NULL, NULL);

  state = cw_eval_state_copy (before);
  return cw_eval_state_apply (state, instrument, depth, TRUE);
}
