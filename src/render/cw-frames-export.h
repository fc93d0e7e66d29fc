/* cw-frames-export.h: every playback frame of a case as PNG, for slides
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-case.h"
#include "cw-teaching-frame.h"

G_BEGIN_DECLS

#define CW_FRAMES_DEFAULT_PER_STEP 12
#define CW_FRAMES_MAX_PER_STEP 240
/* 96 dpi makes a 960 x 540 pt slide 1280 x 720 pixels. */
#define CW_FRAMES_DEFAULT_DPI 96.0

typedef struct
{
  const char     *canal;            /* NULL: every canal */
  guint           frames_per_step;
  double          dpi;
  CwOverlayFlags  overlays;
  CwRenderTheme   theme;
} CwFramesOptions;

void      cw_frames_options_init (CwFramesOptions       *options);
/* DIR/<canal>-<step>-<frame>.png, step and frame from 1, zero-padded so
 * that the names sort in playing order. */
char     *cw_frames_path         (const char            *dir,
                                  const char            *canal,
                                  guint                  step,
                                  guint                  frame);
/* Each step's insertion in frames_per_step frames evenly spaced in time,
 * the last at the step's depth: steps x frames_per_step files a canal.
 * Makes dir if need be; appends the paths written to written. */
gboolean  cw_frames_export       (const CwCase          *kase,
                                  const char            *dir,
                                  const CwFramesOptions *options,
                                  GPtrArray             *written,
                                  GError               **error);
/* One frame as a PNG slide at dpi. */
gboolean  cw_frames_write_png    (const CwTeachingFrame *frame,
                                  CwRenderTheme          theme,
                                  double                 dpi,
                                  const char            *path,
                                  GError               **error);

G_END_DECLS
