/* cw-render-text.h: type and numbers on the drawings
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>
#include <pango/pango.h>

#include "cw-instrument.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

#define CW_RENDER_FONT "Sans"

typedef enum
{
  CW_ALIGN_START,
  CW_ALIGN_CENTER,
  CW_ALIGN_END,
} CwAlign;

typedef enum
{
  CW_TEXT_REGULAR = 0,
  CW_TEXT_BOLD = 1 << 0,
} CwTextFlags;

PangoLayout *cw_render_text_layout  (const CwRenderStyle *style,
                                     double               size,
                                     CwTextFlags          flags,
                                     const char          *text);
PangoLayout *cw_render_text_wrapped (const CwRenderStyle *style,
                                     double               size,
                                     CwTextFlags          flags,
                                     const char          *text,
                                     double               width);
void         cw_render_text_size    (PangoLayout         *layout,
                                     double              *width,
                                     double              *height);
double       cw_render_text_height  (const CwRenderStyle *style,
                                     double               size,
                                     CwTextFlags          flags,
                                     const char          *text,
                                     double               width);
void         cw_render_text_draw    (cairo_t             *cr,
                                     PangoLayout         *layout,
                                     double               x,
                                     double               y,
                                     CwAlign              halign,
                                     CwAlign              valign);
double       cw_render_text_line    (cairo_t             *cr,
                                     const CwRenderStyle *style,
                                     double               size,
                                     CwTextFlags          flags,
                                     const char          *text,
                                     double               x,
                                     double               y,
                                     CwAlign              halign,
                                     CwAlign              valign);

char        *cw_render_number       (double               value,
                                     int                  decimals);
char        *cw_render_taper        (double               taper);
char        *cw_render_file_name    (const CwInstrument  *instrument);
const char  *cw_render_level_name   (CwLevel              level);

G_END_DECLS
