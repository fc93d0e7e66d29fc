/* cw-iso.h: ISO 3630-1 sizes and handle colours, ISO 3950 tooth numbers
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef enum
{
  CW_HANDLE_NONE,
  CW_HANDLE_PINK,
  CW_HANDLE_GREY,
  CW_HANDLE_PURPLE,
  CW_HANDLE_WHITE,
  CW_HANDLE_YELLOW,
  CW_HANDLE_RED,
  CW_HANDLE_BLUE,
  CW_HANDLE_GREEN,
  CW_HANDLE_BLACK,
} CwHandleColour;

gboolean        cw_iso_is_standard_size   (double          size);
guint           cw_iso_standard_sizes     (const int     **sizes);
CwHandleColour  cw_iso_handle_colour      (double          size);
const char     *cw_handle_colour_name     (CwHandleColour  colour);
void            cw_handle_colour_rgb      (CwHandleColour  colour,
                                           double         *r,
                                           double         *g,
                                           double         *b);

gboolean        cw_tooth_fdi_is_valid       (const char     *code);
gboolean        cw_tooth_universal_is_valid (const char     *code);
char           *cw_tooth_fdi_to_universal   (const char     *code);
char           *cw_tooth_universal_to_fdi   (const char     *code);

G_END_DECLS
