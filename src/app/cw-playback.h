/* cw-playback.h: stepping through a canal's sequence, each file going in
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib-object.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_PLAYBACK (cw_playback_get_type ())

G_DECLARE_FINAL_TYPE (CwPlayback, cw_playback, CW, PLAYBACK, GObject)

typedef enum
{
  CW_PLAYBACK_AT_DEPTH,   /* the step as planned, its file at its depth */
  CW_PLAYBACK_INSERTING,  /* its file on the way in */
} CwPlaybackPhase;

#define CW_PLAYBACK_MIN_SPEED 0.25
#define CW_PLAYBACK_MAX_SPEED 16.0
/* Seconds a played step stays at its depth before the next one. */
#define CW_PLAYBACK_HOLD 1.5

/* The current step is the document's selected step: selecting a step
 * anywhere (the strip, the keys) moves the playback there. */
CwPlayback          *cw_playback_new            (CwDocument  *document);
CwDocument          *cw_playback_get_document   (CwPlayback  *self);

/* Driven by elapsed real time, so that the tests need no clock. */
void                 cw_playback_tick           (CwPlayback  *self,
                                                 double       seconds);

gboolean             cw_playback_get_playing    (CwPlayback  *self);
void                 cw_playback_set_playing    (CwPlayback  *self,
                                                 gboolean     playing);
void                 cw_playback_toggle         (CwPlayback  *self);
double               cw_playback_get_speed      (CwPlayback  *self);
void                 cw_playback_set_speed      (CwPlayback  *self,
                                                 double       speed);

void                 cw_playback_next           (CwPlayback  *self);
void                 cw_playback_previous       (CwPlayback  *self);
void                 cw_playback_first          (CwPlayback  *self);
void                 cw_playback_last           (CwPlayback  *self);

int                  cw_playback_get_step_index (CwPlayback  *self);
CwPlaybackPhase      cw_playback_get_phase      (CwPlayback  *self);
double               cw_playback_get_depth      (CwPlayback  *self);
guint                cw_playback_get_pecks      (CwPlayback  *self);
/* While inserting, the step at the current tip depth as the engine
 * evaluates it; NULL at depth (draw the step as it is). */
const CwStepResult  *cw_playback_get_partial    (CwPlayback  *self);
/* The figures to show: the partial step, or the step itself. */
const CwStepResult  *cw_playback_get_figures    (CwPlayback  *self);

G_END_DECLS
