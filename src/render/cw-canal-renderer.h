/* cw-canal-renderer.h: the schematic canal, for the window and the exports
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>

#include "cw-canal-layout.h"
#include "cw-evaluate.h"

G_BEGIN_DECLS

/* Draws result->canal into the layout's rectangle: background, the
 * natural canal faintly, the prepared walls, the zone marks and the scale
 * bar; with a step (0-based, or CW_RENDER_NO_STEP), the walls as that step
 * finds them, its file in its ISO colour with the engaged parts hatched and
 * outlined, its ceiling depth and its legend.  With no step, the walls after
 * the last step and the canal's final shape.  An empty sequence draws the
 * natural canal. */
void cw_canal_draw (cairo_t             *cr,
                    const CwCanalLayout *layout,
                    const CwCanalResult *result,
                    int                  step);

/* The walls the given step meets (the envelope before it), or after the
 * last step for CW_RENDER_NO_STEP.  Borrowed from the result. */
const CwPwl *cw_canal_render_walls (const CwCanalResult *result,
                                    int                  step);

G_END_DECLS
