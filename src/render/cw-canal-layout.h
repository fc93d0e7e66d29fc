/* cw-canal-layout.h: where the canal goes in a rectangle, and back
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "cw-evaluate.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

/* Canal diameters (0.2-1.2 mm) are tiny against its length (about 20 mm),
 * so every width is drawn this many times too wide; the drawing says so.
 * The centreline, the arcs and all depths are drawn true to scale. */
#define CW_RENDER_WIDTH_FACTOR 6.0

#define CW_RENDER_NO_STEP (-1)

typedef enum
{
  CW_CANAL_LAYOUT_COMPACT = 0,       /* a small multiple: ticks, WL, no legend */
  CW_CANAL_LAYOUT_LABELS  = 1 << 0,  /* zone labels with leaders on the left */
  CW_CANAL_LAYOUT_SCALE   = 1 << 1,  /* millimetre scale bar and width note */
  CW_CANAL_LAYOUT_LEGEND  = 1 << 2,  /* the step's verdict and findings below */
  CW_CANAL_LAYOUT_FULL    = 0x7,
} CwCanalLayoutFlags;

typedef struct _CwCanalLayout CwCanalLayout;

/* The layout depends on the canal and on every step of the result (so that
 * it stays put while the selection changes or a depth is dragged), not on
 * the selected step.  result may be NULL: the natural canal alone. */
CwCanalLayout *cw_canal_layout_new          (const CwCanal           *canal,
                                             const CwCanalResult     *result,
                                             const CwRenderStyle     *style,
                                             const cairo_rectangle_t *area,
                                             CwCanalLayoutFlags       flags);
void           cw_canal_layout_free         (CwCanalLayout           *layout);

/* Canal coordinates (s along the centreline, offset across it, both in real
 * millimetres; offset > 0 to the right of the straight part) to device
 * coordinates of the cairo context the layout was made for, and back. */
void           cw_canal_layout_to_device    (const CwCanalLayout     *layout,
                                             double                   s,
                                             double                   offset,
                                             double                  *x,
                                             double                  *y);
double         cw_canal_layout_from_device  (const CwCanalLayout     *layout,
                                             double                   x,
                                             double                   y,
                                             double                  *offset,
                                             double                  *distance);

double         cw_canal_layout_get_scale        (const CwCanalLayout *layout);
double         cw_canal_layout_get_width_factor (const CwCanalLayout *layout);
void           cw_canal_layout_get_range        (const CwCanalLayout *layout,
                                                 double              *s_top,
                                                 double              *s_end);
void           cw_canal_layout_get_canal_box    (const CwCanalLayout *layout,
                                                 cairo_rectangle_t   *box);
void           cw_canal_layout_get_legend_box   (const CwCanalLayout *layout,
                                                 cairo_rectangle_t   *box);
double         cw_canal_layout_aspect           (const CwCanal       *canal,
                                                 const CwCanalResult *result);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwCanalLayout, cw_canal_layout_free)

G_END_DECLS
