/* cw-canal-overlays.h: what a teacher can switch on over the canal drawing
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-render-style.h"

G_BEGIN_DECLS

typedef enum
{
  CW_OVERLAY_NONE      = 0,
  CW_OVERLAY_RULER     = 1 << 0,  /* the file's diameter every 1 mm from the tip */
  CW_OVERLAY_STRAIN    = 1 << 1,  /* d / 2R along the curve, as a heat band */
  CW_OVERLAY_CEILING   = 1 << 2,  /* where the file is as wide as the ceiling; the safe depth */
  CW_OVERLAY_CLEARANCE = 1 << 3,  /* where the file still cuts the straight part, and by how much */
  CW_OVERLAY_ENVELOPE  = 1 << 4,  /* the prepared shape before and after the step */
  CW_OVERLAY_ENGAGED   = 1 << 5,  /* the wall the file engages */
  CW_OVERLAY_ZONES     = 1 << 6,  /* the zones named beside the canal */
  CW_OVERLAY_ALL       = 0x7f,
} CwOverlayFlags;

#define CW_N_OVERLAYS 7

/* What slides and the frames export show unless told otherwise. */
#define CW_OVERLAY_TEACHING (CW_OVERLAY_STRAIN | CW_OVERLAY_CEILING | CW_OVERLAY_CLEARANCE | \
                             CW_OVERLAY_ENGAGED | CW_OVERLAY_ZONES)

/* The overlay of index i (0 .. CW_N_OVERLAYS - 1), its id ("ruler",
 * "strain", ...) and its name for menus. */
CwOverlayFlags cw_overlay_nth            (guint           index);
const char    *cw_overlay_id             (CwOverlayFlags  overlay);
const char    *cw_overlay_title          (CwOverlayFlags  overlay);
/* "ruler,strain", "all" or "none". */
gboolean       cw_overlay_flags_parse    (const char     *text,
                                          CwOverlayFlags *flags);

/* A sentence an overlay adds, with its colour as a key. */
typedef struct
{
  CwRgb  colour;
  char  *text;
} CwOverlayNote;

/* The heat band's colour for a strain as a fraction of the alloy's limit:
 * pale at 0, orange at 0.8 (where the rule cautions), dark red from 1. */
CwRgb          cw_overlay_heat_rgb       (double          fraction);

G_END_DECLS
