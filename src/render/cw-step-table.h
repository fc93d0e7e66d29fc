/* cw-step-table.h: the steps of a canal with their key figures
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-evaluate.h"
#include "cw-render-blocks.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

/* Adds the column heads and one block a step (its figures and, below
 * them, its findings as sentences), so that a page break never splits a
 * row and a table that runs on repeats its heads. */
void cw_step_table_add_blocks (CwBlockList         *list,
                               const CwCanalResult *result,
                               const CwRenderStyle *style);

G_END_DECLS
