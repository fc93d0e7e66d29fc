/* cw-profile-plot.h: an instrument's diameter against the distance from
 * its tip
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>

#include "cw-instrument.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

/* The plot's frame in the area, and the scale of its axes. */
typedef struct
{
  cairo_rectangle_t frame;
  double            x_max;   /* mm from the tip at the right edge */
  double            d_max;   /* mm of diameter at the top edge */
  double            d_step;  /* mm between the diameter ticks */
} CwProfilePlot;

void  cw_profile_plot_layout  (CwProfilePlot            *plot,
                               const CwRenderStyle      *style,
                               const CwInstrument       *instrument,
                               const cairo_rectangle_t  *area);
void  cw_profile_plot_point   (const CwProfilePlot      *plot,
                               double                    x,
                               double                    d,
                               double                   *px,
                               double                   *py);
void  cw_profile_plot_draw    (cairo_t                  *cr,
                               const CwRenderStyle      *style,
                               const CwInstrument       *instrument,
                               const cairo_rectangle_t  *area);

G_END_DECLS
