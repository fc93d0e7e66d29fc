/* cw-render-style.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <math.h>
#include <string.h>

#include "cw-render-style.h"

#define RGB(hex) { ((hex) >> 16 & 0xff) / 255.0, ((hex) >> 8 & 0xff) / 255.0, ((hex) & 0xff) / 255.0 }

/* The files keep their ISO colours; everything else is kept quiet so that
 * the files and the verdicts are what the eye finds first. */
static const CwPalette palettes[] = {
  [CW_RENDER_LIGHT] = {
    RGB (0xffffff), RGB (0x1d2125), RGB (0x5f666d), RGB (0xe4ebf0), RGB (0x34414b),
    RGB (0x9aa6b0), RGB (0x4a535b), RGB (0x1d2125), RGB (0x000000), RGB (0x4a535b),
    RGB (0xc3c9ce), RGB (0xf2f4f6),
    { RGB (0x2e7d32), RGB (0xa85f00), RGB (0xc0392b) }, 1.0,
  },
  [CW_RENDER_DARK] = {
    RGB (0x1e2226), RGB (0xe9ecef), RGB (0xa3abb2), RGB (0x2f3a43), RGB (0xc6d3dc),
    RGB (0x6b7883), RGB (0xb8c0c7), RGB (0xe9ecef), RGB (0xffffff), RGB (0xc8ced4),
    RGB (0x4d565e), RGB (0x262b30),
    { RGB (0x6fcf73), RGB (0xf0b04a), RGB (0xff7a6b) }, 1.0,
  },
  [CW_RENDER_HIGH_CONTRAST] = {
    RGB (0xffffff), RGB (0x000000), RGB (0x000000), RGB (0xe8e8e8), RGB (0x000000),
    RGB (0x555555), RGB (0x000000), RGB (0x000000), RGB (0x000000), RGB (0x000000),
    RGB (0x000000), RGB (0xffffff),
    { RGB (0x005f00), RGB (0x6b3d00), RGB (0x9c0000) }, 1.6,
  },
};

void
cw_render_style_init (CwRenderStyle *style,
                      CwRenderTheme  theme,
                      double         scale)
{
  g_return_if_fail (style != NULL);

  style->theme = theme;
  style->scale = scale > 0 ? scale : 1.0;
}

const CwPalette *
cw_render_style_palette (const CwRenderStyle *style)
{
  return &palettes[style->theme];
}

double
cw_render_style_line (const CwRenderStyle *style,
                      double               width)
{
  return width * style->scale * palettes[style->theme].line_factor;
}

double
cw_render_style_font (const CwRenderStyle *style,
                      double               size)
{
  return size * style->scale;
}

gboolean
cw_render_theme_from_string (const char    *str,
                             CwRenderTheme *theme)
{
  static const char *names[] = { "light", "dark", "high-contrast" };

  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    if (g_strcmp0 (str, names[i]) == 0)
      {
        *theme = (CwRenderTheme) i;
        return TRUE;
      }
  return FALSE;
}

void
cw_render_set_rgb (cairo_t     *cr,
                   const CwRgb *rgb)
{
  cairo_set_source_rgb (cr, rgb->r, rgb->g, rgb->b);
}

void
cw_render_set_rgba (cairo_t     *cr,
                    const CwRgb *rgb,
                    double       alpha)
{
  cairo_set_source_rgba (cr, rgb->r, rgb->g, rgb->b, alpha);
}

CwRgb
cw_render_handle_rgb (double tip)
{
  CwRgb rgb;

  cw_handle_colour_rgb (cw_iso_handle_colour (tip), &rgb.r, &rgb.g, &rgb.b);
  return rgb;
}

/* Relative luminance with the sRGB weights; enough to pick black or white
 * lines over a fill. */
double
cw_render_luminance (const CwRgb *rgb)
{
  return 0.2126 * rgb->r + 0.7152 * rgb->g + 0.0722 * rgb->b;
}

static void
polygon (cairo_t *cr,
         double   cx,
         double   cy,
         double   radius,
         int      n,
         double   start)
{
  for (int i = 0; i < n; i++)
    {
      double a = start + 2 * G_PI * i / n;

      cairo_line_to (cr, cx + radius * cos (a), cy + radius * sin (a));
    }
  cairo_close_path (cr);
}

/* Each level has its own shape, so the verdict reads without colour: a
 * circle for ok, a triangle for caution, an octagon with a bar for stop. */
void
cw_render_level_mark (cairo_t             *cr,
                      const CwRenderStyle *style,
                      CwLevel              level,
                      double               cx,
                      double               cy,
                      double               size)
{
  const CwPalette *pal = cw_render_style_palette (style);
  double r = size / 2;

  cairo_save (cr);
  cairo_new_path (cr);
  if (level == CW_LEVEL_OK)
    cairo_arc (cr, cx, cy, r * 0.8, 0, 2 * G_PI);
  else if (level == CW_LEVEL_CAUTION)
    polygon (cr, cx, cy + r * 0.15, r * 1.05, 3, -G_PI / 2);
  else
    polygon (cr, cx, cy, r, 8, G_PI / 8);
  cw_render_set_rgb (cr, &pal->level[level]);
  cairo_fill (cr);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_set_line_width (cr, MAX (size * 0.14, 0.5));
  if (level == CW_LEVEL_STOP)
    {
      cairo_move_to (cr, cx - r * 0.5, cy);
      cairo_line_to (cr, cx + r * 0.5, cy);
    }
  else if (level == CW_LEVEL_CAUTION)
    {
      cairo_move_to (cr, cx, cy - r * 0.3);
      cairo_line_to (cr, cx, cy + r * 0.25);
    }
  cairo_stroke (cr);
  cairo_restore (cr);
}
