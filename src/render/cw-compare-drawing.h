/* cw-compare-drawing.h: two or three files in the same canal at one depth
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>

#include "cw-case.h"
#include "cw-evaluate.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

#define CW_COMPARE_MAX 3

typedef struct _CwCompareDrawing CwCompareDrawing;

/* Evaluates each instrument as one step to depth, every one from the same
 * state: the natural canal (after < 0) or the canal after the steps up to
 * and including step index after.  Unknown ids are left out. */
CwCompareDrawing    *cw_compare_drawing_new        (const CwCase            *kase,
                                                   const CwCanal           *canal,
                                                   int                      after,
                                                   const char * const      *ids,
                                                   guint                    n_ids,
                                                   double                   depth);
void                 cw_compare_drawing_free       (CwCompareDrawing        *drawing);
/* The evaluation as a canal result: one step an instrument, in order,
 * each from the same walls (the result's natural diameter). */
const CwCanalResult *cw_compare_drawing_get_result (const CwCompareDrawing  *drawing);
/* What the files are compared from, in a sentence. */
const char          *cw_compare_drawing_get_basis  (const CwCompareDrawing  *drawing);
/* The canal once a file, side by side at one scale, the walls each file
 * engages in magenta and the strain band; below, their figures in a
 * table.  Draws the background over the whole area. */
void                 cw_compare_drawing_draw       (const CwCompareDrawing  *drawing,
                                                   cairo_t                 *cr,
                                                   const cairo_rectangle_t *area,
                                                   const CwRenderStyle     *style);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwCompareDrawing, cw_compare_drawing_free)

G_END_DECLS
