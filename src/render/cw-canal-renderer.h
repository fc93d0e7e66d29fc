/* cw-canal-renderer.h: the schematic canal, for the window and the exports
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>

#include "cw-canal-layout.h"
#include "cw-canal-overlays.h"
#include "cw-evaluate.h"
#include "cw-rules.h"

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

typedef struct
{
  CwOverlayFlags      overlays;
  /* The selected step's file at another tip depth (a playback frame), as
   * the engine evaluates it there: drawn, with its figures, in place of
   * the step.  NULL: the step at its own depth. */
  const CwStepResult *partial;
  /* The case's rules, for the heat band's scale; NULL: the defaults. */
  const CwRules      *rules;
  /* The overlays' sentences go in a box in the top right corner, unless
   * the caller shows cw_canal_overlay_notes () itself. */
  gboolean            hide_notes;
} CwCanalDrawOptions;

void cw_canal_draw_options_init (CwCanalDrawOptions *options);

/* cw_canal_draw with overlays and a partial insertion; cw_canal_draw is
 * this with the options' defaults (no overlays, the step at its depth). */
void cw_canal_draw_full (cairo_t                  *cr,
                         const CwCanalLayout      *layout,
                         const CwCanalResult      *result,
                         int                       step,
                         const CwCanalDrawOptions *options);

/* The width the overlays' labels take right of the canal, in the style's
 * units: a layout given that much less room keeps them in view. */
double cw_canal_overlays_room (const CwRenderStyle *style,
                               CwCanalLayoutFlags   flags,
                               CwOverlayFlags       overlays);

/* A layout that leaves that room inside the area: the canal and its
 * columns centred together, the canal smaller only when it must be. */
CwCanalLayout *cw_canal_layout_new_for_overlays (const CwCanal           *canal,
                                                 const CwCanalResult     *result,
                                                 const CwRenderStyle     *style,
                                                 const cairo_rectangle_t *area,
                                                 CwCanalLayoutFlags       flags,
                                                 CwOverlayFlags           overlays);

/* The sentences (CwOverlayNote) of the overlays in options, for the step
 * as drawn: the engine's figures behind what they show. */
GPtrArray *cw_canal_overlay_notes (const CwCanalLayout      *layout,
                                   const CwCanalResult      *result,
                                   int                       step,
                                   const CwCanalDrawOptions *options);

/* The walls the given step meets (the envelope before it), or after the
 * last step for CW_RENDER_NO_STEP.  Borrowed from the result. */
const CwPwl *cw_canal_render_walls (const CwCanalResult *result,
                                    int                  step);

G_END_DECLS
