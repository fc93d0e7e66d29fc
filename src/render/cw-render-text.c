/* cw-render-text.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

#include "cw-render-text.h"

/* One context for measuring and drawing alike, at 72 units an inch and with
 * unhinted metrics, so that a layout measured for a PNG has the same size in
 * a PDF and on the screen, whatever the target's resolution. */
static PangoContext *
text_context (void)
{
  static gsize context;

  if (g_once_init_enter (&context))
    {
      PangoFontMap *map = pango_cairo_font_map_get_default ();
      PangoContext *ctx = pango_font_map_create_context (map);
      cairo_font_options_t *options = cairo_font_options_create ();

      cairo_font_options_set_hint_metrics (options, CAIRO_HINT_METRICS_OFF);
      cairo_font_options_set_hint_style (options, CAIRO_HINT_STYLE_NONE);
      pango_cairo_context_set_font_options (ctx, options);
      pango_cairo_context_set_resolution (ctx, 72.0);
      pango_context_set_round_glyph_positions (ctx, FALSE);
      cairo_font_options_destroy (options);
      g_once_init_leave (&context, (gsize) ctx);
    }
  return (PangoContext *) context;
}

PangoLayout *
cw_render_text_layout (const CwRenderStyle *style,
                       double               size,
                       CwTextFlags          flags,
                       const char          *text)
{
  PangoLayout *layout = pango_layout_new (text_context ());
  PangoFontDescription *font = pango_font_description_from_string (CW_RENDER_FONT);

  pango_font_description_set_absolute_size (font, cw_render_style_font (style, size) * PANGO_SCALE);
  if (flags & CW_TEXT_BOLD)
    pango_font_description_set_weight (font, PANGO_WEIGHT_BOLD);
  pango_layout_set_font_description (layout, font);
  pango_layout_set_text (layout, text, -1);
  pango_font_description_free (font);
  return layout;
}

PangoLayout *
cw_render_text_wrapped (const CwRenderStyle *style,
                        double               size,
                        CwTextFlags          flags,
                        const char          *text,
                        double               width)
{
  PangoLayout *layout = cw_render_text_layout (style, size, flags, text);

  pango_layout_set_width (layout, (int) (width * PANGO_SCALE));
  pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
  return layout;
}

void
cw_render_text_size (PangoLayout *layout,
                     double      *width,
                     double      *height)
{
  PangoRectangle logical;

  pango_layout_get_extents (layout, NULL, &logical);
  if (width)
    *width = (double) logical.width / PANGO_SCALE;
  if (height)
    *height = (double) logical.height / PANGO_SCALE;
}

/* The height of the text wrapped at width; width <= 0 for one line. */
double
cw_render_text_height (const CwRenderStyle *style,
                       double               size,
                       CwTextFlags          flags,
                       const char          *text,
                       double               width)
{
  g_autoptr(PangoLayout) layout = width > 0
    ? cw_render_text_wrapped (style, size, flags, text, width)
    : cw_render_text_layout (style, size, flags, text);
  double height;

  cw_render_text_size (layout, NULL, &height);
  return height;
}

static double
aligned (double  at,
         double  extent,
         CwAlign align)
{
  if (align == CW_ALIGN_CENTER)
    return at - extent / 2;
  if (align == CW_ALIGN_END)
    return at - extent;
  return at;
}

void
cw_render_text_draw (cairo_t     *cr,
                     PangoLayout *layout,
                     double       x,
                     double       y,
                     CwAlign      halign,
                     CwAlign      valign)
{
  double width, height;

  cw_render_text_size (layout, &width, &height);
  if (pango_layout_get_width (layout) > 0 && halign != CW_ALIGN_START)
    width = (double) pango_layout_get_width (layout) / PANGO_SCALE;
  cairo_move_to (cr, aligned (x, width, halign), aligned (y, height, valign));
  pango_cairo_show_layout (cr, layout);
  cairo_new_path (cr);
}

/* Draws one line in the current source colour and returns its width. */
double
cw_render_text_line (cairo_t             *cr,
                     const CwRenderStyle *style,
                     double               size,
                     CwTextFlags          flags,
                     const char          *text,
                     double               x,
                     double               y,
                     CwAlign              halign,
                     CwAlign              valign)
{
  g_autoptr(PangoLayout) layout = cw_render_text_layout (style, size, flags, text);
  double width;

  cw_render_text_draw (cr, layout, x, y, halign, valign);
  cw_render_text_size (layout, &width, NULL);
  return width;
}

/* In the user's locale: the pictures follow it, the JSON does not. */
char *
cw_render_number (double value,
                  int    decimals)
{
  if (!isfinite (value))
    return g_strdup ("–");
  if (fabs (value) < 0.5 * pow (10, -decimals))
    value = 0.0;
  return g_strdup_printf ("%.*f", decimals, value);
}

static int
taper_decimals (double taper)
{
  return fabs (taper * 100 - round (taper * 100)) > 1e-6 ? 3 : 2;
}

/* ".04", as the trade writes a taper where the decimal mark is a point; in
 * a locale with another mark the number keeps its zero: "0,04". */
char *
cw_render_taper (double taper)
{
  g_autofree char *text = g_strdup_printf ("%.*f", taper_decimals (taper), taper);

  if (g_str_has_prefix (text, "0."))
    return g_strdup (text + 1);
  return g_steal_pointer (&text);
}

/* In a file's name the taper is part of a designation, written as on the
 * files themselves in every locale: "25/.04". */
static char *
designation_taper (double taper)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  g_ascii_formatd (buf, sizeof buf, taper_decimals (taper) == 3 ? "%.3f" : "%.2f", taper);
  return g_strdup (buf[0] == '0' ? buf + 1 : buf);
}

/* Size and taper: "25/.04"; a file with taper segments lists them from the
 * tip: "25/.08→.04". */
char *
cw_render_file_name (const CwInstrument *instrument)
{
  g_autoptr(GString) name = g_string_new (NULL);

  if (instrument->tip == round (instrument->tip))
    g_string_append_printf (name, "%02d/", (int) instrument->tip);   /* ISO writes 06, 08 */
  else
    {
      char buf[G_ASCII_DTOSTR_BUF_SIZE];

      g_string_append_printf (name, "%s/", g_ascii_formatd (buf, sizeof buf, "%.1f", instrument->tip));
    }
  if (instrument->segments == NULL || instrument->segments->len == 0)
    {
      g_autofree char *taper = designation_taper (instrument->taper);

      g_string_append (name, taper);
      return g_string_free (g_steal_pointer (&name), FALSE);
    }
  for (guint i = 0; i < instrument->segments->len; i++)
    {
      const CwTaperSegment *seg = &g_array_index (instrument->segments, CwTaperSegment, i);
      g_autofree char *taper = designation_taper (seg->taper);

      if (i > 0)
        g_string_append (name, "→");
      g_string_append (name, taper);
    }
  return g_string_free (g_steal_pointer (&name), FALSE);
}

const char *
cw_render_level_name (CwLevel level)
{
  switch (level)
    {
    case CW_LEVEL_STOP: return _("stop");
    case CW_LEVEL_CAUTION: return _("caution");
    case CW_LEVEL_OK:
    default: return _("ok");
    }
}
