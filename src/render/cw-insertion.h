/* cw-insertion.h: a step's file going in, as the playback and the frames
 * show it
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-evaluate.h"

G_BEGIN_DECLS

/* The file goes in freely from the orifice to its first contact, then
 * cuts at the rule set's advance rate in pecks of the rule set's
 * increment (the last one shorter), lifting a little between pecks; so
 * the pecks are the engine's count.  Times in seconds at speed 1. */
#define CW_INSERTION_FREE_FACTOR 4.0   /* free travel and lifts, times the advance rate */
#define CW_INSERTION_LIFT 0.5          /* mm lifted between pecks, at most half a peck */

typedef struct
{
  double start;         /* tip depth at the beginning */
  double contact;       /* where cutting begins (the depth itself for a step that never touches) */
  double depth;
  double advance_rate;  /* mm/s while cutting */
  double free_rate;     /* mm/s in free travel and lifts */
  double increment;
  double lift;
  guint  pecks;
} CwInsertion;

void          cw_insertion_init          (CwInsertion        *insertion,
                                          const CwStepResult *step,
                                          const CwRules      *rules,
                                          double              orifice);
double        cw_insertion_duration      (const CwInsertion  *insertion);
/* The tip depth t seconds in (clamped to the insertion); *pecks gets the
 * pecks finished by then. */
double        cw_insertion_depth_at      (const CwInsertion  *insertion,
                                          double              t,
                                          guint              *pecks);

/* The engine's state before step index (0-based) of the canal: the steps
 * before it applied in order. */
CwEvalState  *cw_insertion_state_before  (const CwCase       *kase,
                                          const CwCanal      *canal,
                                          guint               index);
/* The step's file at another tip depth, evaluated by the engine from the
 * state before the step (which it leaves as it was). */
CwStepResult *cw_insertion_evaluate      (const CwEvalState  *before,
                                          const CwInstrument *instrument,
                                          double              depth);

G_END_DECLS
