/* cw-teaching-frame.h: one step on a slide, for the presenter and the
 * playback frames
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>

#include "cw-canal-renderer.h"
#include "cw-case.h"

G_BEGIN_DECLS

/* The frame is laid out on a 16:9 slide of this many points, scaled to
 * fit the area it is given. */
#define CW_FRAME_WIDTH 960.0
#define CW_FRAME_HEIGHT 540.0

typedef struct
{
  const CwCanalResult *result;
  int                  step;      /* 0-based, or CW_RENDER_NO_STEP for the final shape */
  CwCanalDrawOptions   options;   /* overlays, a partial insertion, the rules */
  guint                pecks;     /* pecks done, while the file goes in */
  const char          *status;    /* a line at the foot (the presenter's keys), or NULL */
} CwTeachingFrame;

void cw_teaching_frame_init (CwTeachingFrame         *frame,
                             const CwCanalResult     *result,
                             int                      step);
/* The canal with the overlays on the left; on the right, in large type,
 * the step, its file, the tip depth, its key figures, its verdict and the
 * next step.  Draws the background over the whole area. */
void cw_teaching_frame_draw (cairo_t                 *cr,
                             const cairo_rectangle_t *area,
                             CwRenderTheme            theme,
                             const CwTeachingFrame   *frame);

G_END_DECLS
