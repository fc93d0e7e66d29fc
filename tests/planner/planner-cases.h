/* planner-cases.h: small invented inventories for the planner's tests and
 * benchmark, and an exhaustive enumeration of the planner's model
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-planner.h"
#include "cw-test-util.h"

G_BEGIN_DECLS

typedef enum
{
  PLANNER_CASE_ONE_CURVE,
  PLANNER_CASE_S_SHAPE,
  PLANNER_CASE_STRAIGHT,
  PLANNER_CASE_PEERS,
  PLANNER_CASE_SEVERE,
  PLANNER_N_CASES
} PlannerCaseKind;

typedef struct
{
  GArray *steps;       /* CwPlanStep */
  guint   cautions;
  double  time;
} EnumPlan;

typedef struct
{
  GArray *plans;       /* EnumPlan, every complete plan of the model */
  guint64 sequences;   /* partial plans visited */
} Enumeration;

CwCase      *planner_case             (PlannerCaseKind      kind,
                                       guint                n_files);
CwCase      *planner_case_forty       (void);
CwCase      *planner_case_random      (guint32              seed,
                                       guint                n_files);
void         enumeration_run          (Enumeration         *e,
                                       const CwCase        *kase,
                                       const CwCanal       *canal,
                                       guint                max_steps);
void         enumeration_clear        (Enumeration         *e);
int          enum_plan_compare        (gconstpointer        a,
                                       gconstpointer        b);
double       model_depth              (const CwEvalState   *state,
                                       const CwCanal       *canal,
                                       const CwInstrument  *inst);
gboolean     model_is_move            (const CwCase        *kase,
                                       const CwEvalState   *before,
                                       const CwEvalState   *after,
                                       double               deepest,
                                       double               depth);
double       envelope_raise           (const CwPwl         *before,
                                       const CwPwl         *after);

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (Enumeration, enumeration_clear)

G_END_DECLS
