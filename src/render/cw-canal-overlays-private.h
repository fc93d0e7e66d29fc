/* cw-canal-overlays-private.h: the overlays' parts of the canal drawing
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-canal-layout-private.h"
#include "cw-canal-renderer.h"

G_BEGIN_DECLS

typedef enum
{
  CW_OVERLAY_INK_ENVELOPE,
  CW_OVERLAY_INK_ENGAGED,
  CW_OVERLAY_INK_CEILING,
  CW_N_OVERLAY_INKS
} CwOverlayInk;

/* What every overlay reads: the step as drawn (partial or not), the walls
 * it meets and its file's diameter along the canal. */
typedef struct
{
  const CwCanalLayout *layout;
  const CwCanalResult *result;
  const CwStepResult  *step;    /* NULL with no step */
  const CwPwl         *walls;   /* the envelope the step meets */
  CwPwl               *file;    /* d(L - s) along the file, NULL with no step */
  const CwRules       *rules;
  GPtrArray           *notes;   /* CwOverlayNote, the overlays' sentences */
  double               column;  /* device x where the right-hand labels start */
} CwOverlayContext;

void       cw_canal_overlays_draw     (cairo_t                  *cr,
                                       const CwCanalLayout      *layout,
                                       const CwCanalResult      *result,
                                       int                       step,
                                       const CwCanalDrawOptions *options);

/* Shared by the overlays */
CwRgb      cw_overlay_ink             (const CwOverlayContext   *ctx,
                                       CwOverlayInk              ink);
void       cw_overlay_note            (CwOverlayContext         *ctx,
                                       const CwRgb              *colour,
                                       char                     *text);
double     cw_overlay_half            (const CwOverlayContext   *ctx,
                                       double                    s);
void       cw_overlay_point           (const CwOverlayContext   *ctx,
                                       double                    s,
                                       double                    offset,
                                       double                    extra,
                                       double                   *x,
                                       double                   *y);
double     cw_overlay_text_size       (const CwOverlayContext   *ctx);
void       cw_overlay_halo_line       (cairo_t                  *cr,
                                       const CwOverlayContext   *ctx,
                                       const CwRgb              *colour,
                                       double                    width);

/* One function an overlay */
void       cw_overlay_ruler_draw      (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);
void       cw_overlay_zones_draw      (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);
void       cw_overlay_strain_draw     (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);
void       cw_overlay_ceiling_draw    (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);
void       cw_overlay_clearance_draw  (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);
void       cw_overlay_envelope_draw   (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);
void       cw_overlay_engaged_draw    (cairo_t                  *cr,
                                       CwOverlayContext         *ctx);

/* Their sentences, with the engine's figures */
void       cw_overlay_strain_note     (CwOverlayContext         *ctx);
void       cw_overlay_ceiling_note    (CwOverlayContext         *ctx);
void       cw_overlay_clearance_note  (CwOverlayContext         *ctx);
void       cw_overlay_envelope_note   (CwOverlayContext         *ctx);
void       cw_overlay_engaged_note    (CwOverlayContext         *ctx);

G_END_DECLS
