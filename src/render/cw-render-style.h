/* cw-render-style.h: themes, colours and sizes of the drawings
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "cw-finding.h"
#include "cw-iso.h"

G_BEGIN_DECLS

typedef enum
{
  CW_RENDER_LIGHT,
  CW_RENDER_DARK,
  CW_RENDER_HIGH_CONTRAST,
} CwRenderTheme;

typedef struct
{
  double r, g, b;
} CwRgb;

typedef struct
{
  CwRgb background;
  CwRgb ink;           /* text and the main lines */
  CwRgb muted;         /* secondary text, the centreline */
  CwRgb lumen;         /* inside of the prepared canal */
  CwRgb wall;          /* prepared walls */
  CwRgb natural;       /* the natural canal, drawn faintly */
  CwRgb mark;          /* zone ticks and leaders */
  CwRgb file_outline;  /* shows white files on light ground, black on dark */
  CwRgb engaged;       /* outline and side bar of the engaged parts */
  CwRgb ceiling;
  CwRgb rule;          /* table rules */
  CwRgb stripe;        /* every other table row */
  CwRgb level[3];      /* ok, caution, stop */
  double line_factor;  /* high contrast draws heavier lines */
} CwPalette;

/* scale multiplies every line width and font size: 1.0 draws an export in
 * points; the window passes its own factor for pixels. */
typedef struct
{
  CwRenderTheme theme;
  double        scale;
} CwRenderStyle;

void             cw_render_style_init      (CwRenderStyle       *style,
                                            CwRenderTheme        theme,
                                            double               scale);
const CwPalette *cw_render_style_palette   (const CwRenderStyle *style);
double           cw_render_style_line      (const CwRenderStyle *style,
                                            double               width);
double           cw_render_style_font      (const CwRenderStyle *style,
                                            double               size);
gboolean         cw_render_theme_from_string (const char        *str,
                                              CwRenderTheme     *theme);

void             cw_render_set_rgb         (cairo_t             *cr,
                                            const CwRgb         *rgb);
void             cw_render_set_rgba        (cairo_t             *cr,
                                            const CwRgb         *rgb,
                                            double               alpha);
CwRgb            cw_render_handle_rgb      (double               tip);
double           cw_render_luminance       (const CwRgb         *rgb);
void             cw_render_level_mark      (cairo_t             *cr,
                                            const CwRenderStyle *style,
                                            CwLevel              level,
                                            double               cx,
                                            double               cy,
                                            double               size);

G_END_DECLS
