/* cw-text-block.h: paragraphs of wrapped text, measured before drawing
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-render-blocks.h"
#include "cw-render-text.h"

G_BEGIN_DECLS

#define CW_TEXT_NO_LEVEL (-1)

typedef enum
{
  CW_TEXT_INK,
  CW_TEXT_MUTED,
} CwTextTone;

typedef struct _CwTextBlock CwTextBlock;

CwTextBlock *cw_text_block_new     (const CwRenderStyle *style,
                                    double               width);
void         cw_text_block_free    (CwTextBlock         *block);
/* level: a CwLevel to put its mark before the paragraph, or CW_TEXT_NO_LEVEL */
void         cw_text_block_add     (CwTextBlock         *block,
                                    double               size,
                                    CwTextFlags          flags,
                                    CwTextTone           tone,
                                    int                  level,
                                    const char          *text);
double       cw_text_block_height  (CwTextBlock         *block);
void         cw_text_block_draw    (CwTextBlock         *block,
                                    cairo_t             *cr,
                                    double               x,
                                    double               y);
/* Adds the block to the list, which then owns it. */
CwBlock     *cw_text_block_append  (CwTextBlock         *block,
                                    CwBlockList         *list);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwTextBlock, cw_text_block_free)

G_END_DECLS
