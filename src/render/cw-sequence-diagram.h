/* cw-sequence-diagram.h: one canal's sequence as one picture
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

/* Width of the picture in points at scale 1 (an A4 page across). */
#define CW_DIAGRAM_WIDTH 842.0

typedef struct _CwSequenceDiagram CwSequenceDiagram;

/* The case's title, tooth and canal; the canal drawn once a step, side by
 * side in rows; the table of the steps with their findings; the final
 * shape; the cautions and the date.  width in the units of the target, as
 * the style's scale is. */
CwSequenceDiagram *cw_sequence_diagram_new      (const CwCase        *kase,
                                                 const CwCanalResult *result,
                                                 const CwRenderStyle *style,
                                                 double               width,
                                                 GDateTime           *date);
void               cw_sequence_diagram_free     (CwSequenceDiagram   *diagram);
void               cw_sequence_diagram_get_size (CwSequenceDiagram   *diagram,
                                                 double              *width,
                                                 double              *height);
/* Draws at (0, 0), background included. */
void               cw_sequence_diagram_draw     (CwSequenceDiagram   *diagram,
                                                 cairo_t             *cr);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwSequenceDiagram, cw_sequence_diagram_free)

G_END_DECLS
