/* cw-evaluate.h: the evaluation of a canal's sequence
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-case.h"
#include "cw-finding.h"
#include "cw-pwl.h"

G_BEGIN_DECLS

/* Every number that does not apply is NAN (null in the JSON). */
typedef struct
{
  guint               index;          /* 1-based */
  const CwInstrument *instrument;     /* borrowed from the case */
  double              depth;
  double              engaged_length;
  double              engaged_in_curve;
  double              engaged_in_straight;
  double              contact_area;
  double              cut_volume;
  double              max_diameter_in_curve;
  double              ceiling;
  double              ceiling_depth;
  double              straight_clearance;
  double              strain;
  double              cycles_in_curve;
  double              fatigue_use;
  double              fracture_torque_d3;
  double              first_contact;
  double              time;
  guint               pecks;
  CwLevel             verdict;
  GPtrArray          *findings;       /* CwFinding */
  GArray             *engaged;        /* CwPoint as (start, end) intervals of E */
  CwPwl              *envelope_after; /* P(s) after the step, or NULL */
} CwStepResult;

typedef struct
{
  const CwCanal  *canal;
  CwGeometry      geometry;
  CwLevel         verdict;
  GPtrArray      *findings;          /* canal-level */
  GPtrArray      *steps;             /* CwStepResult */
  CwPwl          *natural;           /* P0(s) */
  double          apical_size;       /* NAN when no file reached length */
  double          apical_taper;
  double          onset_diameter;    /* NAN without a curve */
  double          time;
  gboolean        has_stop;
} CwCanalResult;

typedef struct _CwEvalState CwEvalState;

CwCanalResult *cw_evaluate_canal        (const CwCase        *kase,
                                         const CwCanal       *canal);

/* Step by step, for the planner and for live checks while a depth is
 * dragged: the state before a step is all the next step depends on. */
CwEvalState   *cw_eval_state_new          (const CwCase       *kase,
                                           const CwCanal      *canal);
CwEvalState   *cw_eval_state_copy         (const CwEvalState  *state);
void           cw_eval_state_free         (CwEvalState        *state);
CwStepResult  *cw_eval_state_apply        (CwEvalState        *state,
                                           const CwInstrument *instrument,
                                           double              depth,
                                           gboolean            keep_envelope);
const CwPwl   *cw_eval_state_envelope     (const CwEvalState  *state);
const CwGeometry *cw_eval_state_geometry  (const CwEvalState  *state);
double         cw_eval_state_apical_size  (const CwEvalState  *state);
double         cw_eval_state_apical_taper (const CwEvalState  *state);
double         cw_eval_state_time         (const CwEvalState  *state);
CwFinding     *cw_eval_state_final_shape  (const CwEvalState  *state);
void           cw_step_result_free        (CwStepResult       *step);
void           cw_canal_result_free     (CwCanalResult       *result);
CwStepResult  *cw_canal_result_get_step (const CwCanalResult *result,
                                         guint                index);
const CwPwl   *cw_canal_result_envelope (const CwCanalResult *result);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwCanalResult, cw_canal_result_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwEvalState, cw_eval_state_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwStepResult, cw_step_result_free)

G_END_DECLS
