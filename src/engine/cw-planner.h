/* cw-planner.h: the best sequence of files to the case's target shape
 *
 * The model.  A step takes one file of the case to the deepest depth on the
 * 0.5 mm grid (from the canal's reference point; at most the working length
 * and the file's own length; deeper than the orifice) at which the engine
 * finds no stop.  A step must take the tip deeper than any before it or
 * raise the envelope somewhere by more than the contact tolerance (a raise
 * within 1e-9 mm of it does not count, whatever the rounding), or it is no
 * move.  A plan
 * is complete when the engine's final-shape check passes; it ends there,
 * after at most max_steps steps.  Plans rank by caution findings over all
 * steps, then estimated time (equal within 1e-9 s), then steps.  The best
 * plan is the optimum of this model, found by an exact search; the
 * alternatives are the next best plans, each of which first differs from
 * every plan before it in the file used (a state and a file fix the depth).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-case.h"

G_BEGIN_DECLS

/* Rubber stops are set on this grid, from the canal's reference point. */
#define CW_PLAN_GRID 0.5
#define CW_PLAN_DEFAULT_MAX_STEPS 10
#define CW_PLAN_DEFAULT_ALTERNATIVES 2
#define CW_PLAN_DEFAULT_NODE_BUDGET 400000
#define CW_PLAN_MAX_ALTERNATIVES 8

typedef struct
{
  guint max_steps;        /* at most CW_MAX_STEPS */
  guint n_alternatives;   /* plans besides the best, at most CW_PLAN_MAX_ALTERNATIVES */
  guint node_budget;      /* steps the engine may evaluate before the search gives up */
} CwPlanOptions;

typedef struct
{
  const CwInstrument *instrument;   /* borrowed from the case */
  double              depth;
} CwPlanStep;

/* The figures are those of the engine evaluating the plan from the start. */
typedef struct
{
  GArray   *steps;          /* CwPlanStep */
  guint     cautions;       /* caution findings over all steps */
  double    time;
  double    apical_size;    /* NAN when no file reached length */
  double    apical_taper;
  gboolean  complete;       /* meets the targets with no stop */
} CwPlan;

typedef struct
{
  guint     evaluated;      /* steps evaluated by the engine, depth probes included */
  guint     expanded;       /* states whose moves were generated */
  guint     pruned;         /* states dropped as dominated or over the bound */
  gboolean  stopped_early;  /* the node budget ran out */
  double    elapsed_ms;
} CwPlanStats;

/* When the targets can be met, plans holds the best plan and then the
 * alternatives, and reason is NULL.  Otherwise plans holds the one plan
 * that comes closest (or none when no file has a move) and reason says why:
 * the missing file or the rule that blocks the way.  reason is also set
 * when the node budget stopped the search; the plans shown then are the
 * best seen, not proven best. */
typedef struct
{
  GPtrArray   *plans;       /* CwPlan */
  char        *reason;      /* NULL when the best plan is proven best */
  CwPlanStats  stats;
} CwPlanResult;

void          cw_plan_options_init    (CwPlanOptions       *options);
CwPlanResult *cw_plan_canal           (const CwCase        *kase,
                                       const CwCanal       *canal,
                                       const CwPlanOptions *options);
void          cw_plan_result_free     (CwPlanResult        *result);
gboolean      cw_plan_result_complete (const CwPlanResult  *result);
void          cw_plan_free            (CwPlan              *plan);
void          cw_plan_to_sequence     (const CwPlan        *plan,
                                       CwCanal             *canal);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwPlanResult, cw_plan_result_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwPlan, cw_plan_free)

G_END_DECLS
