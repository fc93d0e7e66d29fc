/* cw-overlay-ruler.c: the diameter ruler along the file and the zone labels
 *
 * Both put their labels in a column right of the canal, at the height of
 * what they name, so that they never fold into a tight curve's inside.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-overlays-private.h"
#include "cw-render-text.h"

static double
line_height (const CwOverlayContext *ctx)
{
  return cw_render_text_height (&ctx->layout->style, cw_overlay_text_size (ctx), CW_TEXT_REGULAR, "Ag", 0);
}

/* How many millimetres between labels (1, 2 or 5) so that none overlap:
 * the ticks crowd where the canal turns across the page. */
static int
label_every (const CwOverlayContext *ctx,
             int                     n)
{
  static const int choices[] = { 1, 2, 5 };
  double need = line_height (ctx) * 1.05;

  for (guint c = 0; c < G_N_ELEMENTS (choices); c++)
    {
      gboolean fits = TRUE;

      for (int k = choices[c]; k <= n && fits; k += choices[c])
        {
          double x0, y0, x1, y1;

          cw_canal_layout_to_device (ctx->layout, ctx->step->depth - (k - choices[c]), 0, &x0, &y0);
          cw_canal_layout_to_device (ctx->layout, ctx->step->depth - k, 0, &x1, &y1);
          fits = fabs (y1 - y0) >= need;
        }
      if (fits)
        return choices[c];
    }
  return 10;
}

/* The number of whole millimetres of flutes drawn above the tip. */
static int
ruler_length (const CwOverlayContext *ctx)
{
  const CwStepResult *step = ctx->step;
  double top = MAX (ctx->layout->s_top, step->depth - step->instrument->length);

  return (int) floor (MIN (step->instrument->flute_length, step->depth - top) + 1e-9);
}

static void
draw_tick (cairo_t                *cr,
           const CwOverlayContext *ctx,
           double                  s,
           double                 *end_x,
           double                 *end_y)
{
  const CwPalette *pal = cw_render_style_palette (&ctx->layout->style);
  double half = cw_pwl_eval (ctx->file, s) / 2, x0, y0;

  cw_overlay_point (ctx, s, -half, 0, &x0, &y0);
  cw_overlay_point (ctx, s, cw_overlay_half (ctx, s), cw_render_style_font (&ctx->layout->style, 3),
                    end_x, end_y);
  cairo_move_to (cr, x0, y0);
  cairo_line_to (cr, *end_x, *end_y);
  cw_overlay_halo_line (cr, ctx, &pal->ink, cw_render_style_line (&ctx->layout->style, 1.1));
}

static void
draw_label (cairo_t                *cr,
            const CwOverlayContext *ctx,
            int                     k,
            double                  s,
            double                  x,
            double                  y)
{
  const CwRenderStyle *st = &ctx->layout->style;
  const CwPalette *pal = cw_render_style_palette (st);
  g_autofree char *d = cw_render_number (cw_pwl_eval (ctx->file, s), 2);
  /* TRANSLATORS: D5 is the trade's name for the diameter 5 mm from the tip */
  g_autofree char *text = g_strdup_printf (_("D%d %s"), k, d);
  double column = ctx->column;

  cw_render_set_rgb (cr, &pal->mark);
  cairo_set_line_width (cr, cw_render_style_line (st, 0.5));
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, column - cw_render_style_font (st, 2), y);
  cairo_stroke (cr);
  cw_render_set_rgb (cr, &pal->ink);
  cw_render_text_line (cr, st, cw_overlay_text_size (ctx), CW_TEXT_REGULAR, text, column, y,
                       CW_ALIGN_START, CW_ALIGN_CENTER);
}

static double
text_width (const CwRenderStyle *style,
            double               size,
            CwTextFlags          flags,
            const char          *text)
{
  g_autoptr(PangoLayout) layout = cw_render_text_layout (style, size, flags, text);
  double width;

  cw_render_text_size (layout, &width, NULL);
  return width;
}

static double
ruler_width (const CwRenderStyle *style,
             double               size)
{
  return text_width (style, size, CW_TEXT_REGULAR, _("D16 0.00")) + cw_render_style_font (style, 8);
}

/* A tick across the file every millimetre from its tip along the flutes,
 * each labelled with the diameter there as far as room allows. */
void
cw_overlay_ruler_draw (cairo_t          *cr,
                       CwOverlayContext *ctx)
{
  int n, every;

  if (ctx->step == NULL)
    return;
  n = ruler_length (ctx);
  every = label_every (ctx, n);
  cairo_save (cr);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  for (int k = 0; k <= n; k++)
    {
      double s = ctx->step->depth - k, x, y;

      draw_tick (cr, ctx, s, &x, &y);
      if (k % every == 0)
        draw_label (cr, ctx, k, s, x, y);
    }
  cairo_restore (cr);
  ctx->column += ruler_width (&ctx->layout->style, cw_overlay_text_size (ctx));
}

typedef struct
{
  double s0, s1;
  char  *name;
} Zone;

static void
zone_clear (gpointer data)
{
  g_free (((Zone *) data)->name);
}

static void
add_zone (GArray *zones,
          double  s0,
          double  s1,
          char   *name)
{
  Zone zone = { s0, s1, name };

  if (s1 - s0 > 0.05)
    g_array_append_val (zones, zone);
  else
    g_free (name);
}

static char *
curve_name (const CwGeometry *g,
            guint             i)
{
  g_autofree char *angle = cw_render_number (g->phi[i] * 180 / G_PI, 0);
  g_autofree char *radius = cw_render_number (g->radius[i], 1);

  if (g->n_curves > 1)
    /* TRANSLATORS: curve number, turning angle in degrees, radius in mm */
    return g_strdup_printf (_("curve %u: %s°\nR %s mm"), i + 1, angle, radius);
  /* TRANSLATORS: turning angle in degrees, radius in mm */
  return g_strdup_printf (_("curve %s°\nR %s mm"), angle, radius);
}

/* The canal's zones in the trade's words, in depth order, from the
 * orifice (the access cavity above it is not the canal's). */
static GArray *
collect_zones (const CwCanalLayout *layout)
{
  const CwGeometry *g = &layout->geometry;
  GArray *zones = g_array_new (FALSE, FALSE, sizeof (Zone));
  double wl = layout->working_length, s = layout->orifice;

  g_array_set_clear_func (zones, zone_clear);
  for (guint i = 0; i < g->n_curves; i++)
    {
      add_zone (zones, s, g->onset[i], g_strdup (i == 0 ? _("straight segment") : _("between curves")));
      add_zone (zones, g->onset[i], MIN (g->end[i], wl), curve_name (g, i));
      s = MIN (g->end[i], wl);
    }
  add_zone (zones, s, wl, g_strdup (g->n_curves ? _("apical part") : _("straight segment")));
  return zones;
}

static double
depth_y (const CwCanalLayout *layout,
         double               s)
{
  double x, y;

  cw_canal_layout_to_device (layout, s, 0, &x, &y);
  return y;
}

/* A dotted guide from the right wall at a zone's edge to the column. */
static void
draw_guide (cairo_t                *cr,
            const CwOverlayContext *ctx,
            double                  s,
            double                  x1)
{
  double dots[] = { cw_render_style_line (&ctx->layout->style, 0.6), cw_render_style_line (&ctx->layout->style, 2) };
  double x, y;

  cw_overlay_point (ctx, s, cw_overlay_half (ctx, s), 0, &x, &y);
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, x1, depth_y (ctx->layout, s));
  cairo_set_dash (cr, dots, 2, 0);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
}

static void
draw_bracket (cairo_t                *cr,
              const CwOverlayContext *ctx,
              const Zone             *zone,
              double                  x)
{
  const CwRenderStyle *st = &ctx->layout->style;
  const CwPalette *pal = cw_render_style_palette (st);
  double y0 = depth_y (ctx->layout, zone->s0), y1 = depth_y (ctx->layout, zone->s1);
  double arm = cw_render_style_font (st, 3), inset = cw_render_style_line (st, 1);

  cw_render_set_rgb (cr, &pal->ink);
  cairo_set_line_width (cr, cw_render_style_line (st, 1.1));
  cairo_move_to (cr, x - arm, y0 + inset);
  cairo_line_to (cr, x, y0 + inset);
  cairo_line_to (cr, x, y1 - inset);
  cairo_line_to (cr, x - arm, y1 - inset);
  cairo_stroke (cr);
  cw_render_text_line (cr, st, cw_overlay_text_size (ctx), CW_TEXT_BOLD, zone->name,
                       x + cw_render_style_font (st, 3), (y0 + y1) / 2, CW_ALIGN_START, CW_ALIGN_CENTER);
}

/* Each zone as a bracket in the column, its name beside it. */
void
cw_overlay_zones_draw (cairo_t          *cr,
                       CwOverlayContext *ctx)
{
  g_autoptr(GArray) zones = collect_zones (ctx->layout);
  const CwPalette *pal = cw_render_style_palette (&ctx->layout->style);
  double x = ctx->column + cw_render_style_font (&ctx->layout->style, 3);

  cairo_save (cr);
  cw_render_set_rgb (cr, &pal->mark);
  cairo_set_line_width (cr, cw_render_style_line (&ctx->layout->style, 0.5));
  for (guint i = 0; i < zones->len; i++)
    {
      const Zone *z = &g_array_index (zones, Zone, i);

      if (z->s0 > 0)
        draw_guide (cr, ctx, z->s0, x);
    }
  draw_guide (cr, ctx, ctx->layout->working_length, x);
  for (guint i = 0; i < zones->len; i++)
    draw_bracket (cr, ctx, &g_array_index (zones, Zone, i), x);
  cairo_restore (cr);
}

double
cw_canal_overlays_room (const CwRenderStyle *style,
                        CwCanalLayoutFlags   flags,
                        CwOverlayFlags       overlays)
{
  double size = flags & CW_CANAL_LAYOUT_LABELS ? CW_LABEL_SIZE : CW_SMALL_SIZE;
  double room = 0;

  g_return_val_if_fail (style != NULL, 0);

  if (overlays & CW_OVERLAY_RULER)
    room += ruler_width (style, size);
  /* The layout keeps room for the plain ceiling label, which this
   * overlay draws in its place. */
  if (overlays & CW_OVERLAY_CEILING)
    room += MAX (0, cw_render_style_font (style, 7) + text_width (style, size, CW_TEXT_BOLD, _("safe depth 20.0 mm"))
                    - cw_canal_ceiling_label_width (style, flags));
  if (overlays & CW_OVERLAY_ZONES)
    room += cw_render_style_font (style, 14) + text_width (style, size, CW_TEXT_BOLD, _("straight segment"));
  return room;
}

CwCanalLayout *
cw_canal_layout_new_for_overlays (const CwCanal           *canal,
                                  const CwCanalResult     *result,
                                  const CwRenderStyle     *style,
                                  const cairo_rectangle_t *area,
                                  CwCanalLayoutFlags       flags,
                                  CwOverlayFlags           overlays)
{
  double room = cw_canal_overlays_room (style, flags, overlays);
  cairo_rectangle_t box = *area;
  CwCanalLayout *layout;

  g_return_val_if_fail (area != NULL, NULL);

  /* The layout centres what it draws in its area, so an area narrower by
   * the room centres the canal and the room together. */
  if (room > 0)
    box.width = MAX (box.width - room - cw_render_style_font (style, 6), 1);
  layout = cw_canal_layout_new (canal, result, style, &box, flags);
  if (layout)
    layout->area = *area;
  return layout;
}
