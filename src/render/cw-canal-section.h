/* cw-canal-section.h: one canal in an exported plan
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-evaluate.h"
#include "cw-render-blocks.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

typedef enum
{
  CW_SECTION_DIAGRAM = 0,       /* heading and zones, panels, table, final shape */
  CW_SECTION_SHEET   = 1 << 0,  /* the canal's parameters and labelled drawing too */
} CwSectionFlags;

void cw_canal_section_add_blocks (CwBlockList         *list,
                                  const CwCanalResult *result,
                                  const CwRenderStyle *style,
                                  CwSectionFlags       flags);

G_END_DECLS
