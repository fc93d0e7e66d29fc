/* cw-planner-private.h: what the planner's files share
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-evaluate.h"
#include "cw-planner.h"

G_BEGIN_DECLS

#define PLAN_EPS 1e-9

/* A raise of exactly the contact tolerance, which the 0.5 mm grid makes
 * common (a .02 file half a millimetre deeper is 0.01 mm wider), is no
 * raise "by more than" it, whatever the rounding says. */
#define PLAN_RAISE_MARGIN 1e-9

/* Ranked lexicographically: cautions, then time, then steps. */
typedef struct
{
  guint  cautions;
  double time;
  guint  steps;
} PlanCost;

typedef struct _PlanNode PlanNode;

/* A partial plan.  The key (envelope, previous, glide, deepest, apical_met)
 * is all its future depends on; see cw-planner-search.c. */
struct _PlanNode
{
  PlanNode    *parent;
  CwEvalState *state;          /* NULL while queued past the cap; kept once settled */
  guint        instrument;
  double       depth;
  PlanCost     g;
  PlanCost     f;              /* g plus a lower bound of the rest */
  guint        hash;           /* of the envelope */
  int          previous;       /* file that can still set off taper-change, or -1 */
  double       glide;          /* glide-path depth so far; +inf once it cannot matter */
  double       deepest;
  gboolean     apical_met;
  gboolean     goal;
  double       shortfall;      /* mm of diameter short of the targets */
  guint        serial;
};

/* What the planner knows of one file of the set. */
typedef struct
{
  const CwInstrument *instrument;
  gboolean            powered;
  gboolean            glide_file;
  gboolean            taper_peer;  /* another powered file has its nominal taper */
  int                 top;         /* grid index of the deepest allowed depth */
  int                 bottom;      /* grid index of the shallowest depth past the orifice */
  guint8             *fixed;       /* per grid index: 0 unknown, 1 free, 2 stopped */
  guint8             *fixed_cautions;
  CwPwl              *widest;      /* the widest it can be at each s, at any depth; or NULL */
} PlanFile;

typedef struct
{
  const CwCase   *kase;
  CwCanal        *canal;           /* a copy with no sequence */
  const CwRules  *rules;
  CwPlanOptions   options;
  double          target_size;
  double          target_taper;
  CwGeometry      geo;
  PlanFile       *files;
  guint           n_files;
  CwEvalState    *root_state;
  double          glide_start;
  guint           apical_cautions; /* least fixed cautions of a step that can give the size */
  GPtrArray      *nodes;           /* every PlanNode, freed at the end */
  CwPlanStats     stats;
  guint           stopped_at;      /* evaluations when the budget stopped the search */
} Planner;

Planner  *cw_planner_new          (const CwCase        *kase,
                                   const CwCanal       *canal,
                                   const CwPlanOptions *options);
void      cw_planner_free         (Planner             *p);
PlanNode *cw_planner_root         (Planner             *p);
PlanNode *cw_planner_move         (Planner             *p,
                                   PlanNode            *from,
                                   guint                file);
gboolean  cw_planner_complete     (Planner             *p,
                                   PlanNode            *node);
void      cw_planner_release      (PlanNode            *node);
gboolean  cw_planner_fixed_stop   (Planner             *p,
                                   guint                file,
                                   int                  k);
gboolean  cw_planner_out_of_budget (const Planner      *p);
int       cw_plan_cost_compare    (const PlanCost      *a,
                                   const PlanCost      *b);
gboolean  cw_envelopes_equal      (const CwPwl         *a,
                                   const CwPwl         *b);

guint     cw_planner_search       (Planner             *p,
                                   guint                n_plans,
                                   PlanNode           **goals,
                                   PlanNode           **closest);
PlanNode *cw_planner_beam         (Planner             *p,
                                   guint                width);

char     *cw_planner_unreachable  (Planner             *p);
char     *cw_planner_explain      (Planner             *p,
                                   PlanNode            *closest);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (Planner, cw_planner_free)

G_END_DECLS
