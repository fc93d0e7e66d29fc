/* cw-pwl.h: piecewise-linear functions of arc length
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* A piecewise-linear function given by points (s, v) with s non-decreasing.
 * Two points with the same s make a jump: the first holds the limit from the
 * left, the second the limit from the right.  Outside the points the function
 * keeps its end values.  A point on a jump evaluates to the larger side, since
 * every jump in a prepared envelope is the edge of a cut that includes it. */
typedef struct
{
  double s;
  double v;
} CwPoint;

typedef struct _CwPwl CwPwl;

typedef enum
{
  CW_SIDE_LEFT,
  CW_SIDE_RIGHT,
} CwSide;

CwPwl          *cw_pwl_new             (void);
CwPwl          *cw_pwl_new_linear      (double        s0,
                                        double        v0,
                                        double        s1,
                                        double        v1);
CwPwl          *cw_pwl_copy            (const CwPwl  *pwl);
void            cw_pwl_free            (CwPwl        *pwl);
void            cw_pwl_append          (CwPwl        *pwl,
                                        double        s,
                                        double        v);
guint           cw_pwl_get_n_points    (const CwPwl  *pwl);
const CwPoint  *cw_pwl_get_points      (const CwPwl  *pwl);
double          cw_pwl_eval            (const CwPwl  *pwl,
                                        double        s);
double          cw_pwl_eval_side       (const CwPwl  *pwl,
                                        double        s,
                                        CwSide        side);
void            cw_pwl_raise           (CwPwl        *pwl,
                                        const CwPwl  *other,
                                        double        a,
                                        double        b);
void            cw_pwl_collect_breaks  (const CwPwl  *pwl,
                                        double        a,
                                        double        b,
                                        GArray       *out);

void            cw_sort_unique_doubles (GArray       *values);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwPwl, cw_pwl_free)

G_END_DECLS
