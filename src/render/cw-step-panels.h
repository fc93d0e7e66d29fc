/* cw-step-panels.h: the canal drawn once a step, side by side
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-evaluate.h"
#include "cw-render-blocks.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

/* One block a row of panels; every panel has the same size and scale. */
void cw_step_panels_add_blocks (CwBlockList         *list,
                                const CwCanalResult *result,
                                const CwRenderStyle *style);

G_END_DECLS
