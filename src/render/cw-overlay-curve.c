/* cw-overlay-curve.c: the strain band along the curve, the ceiling and the
 * safe depth
 *
 * The figures in the notes are the engine's; the band only shades the
 * geometry d(x) / 2R at each point of the file in the curve.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-overlays-private.h"
#include "cw-render-text.h"

/* The band is cut in pieces this long (mm), each in its own colour. */
#define BAND_STEP 0.05

static double
strain_scale (const CwOverlayContext *ctx,
              gboolean               *checked)
{
  double limit = ctx->rules->alloys[ctx->step->instrument->alloy].strain_limit;

  *checked = isfinite (limit) && limit > 0;
  if (*checked)
    return limit;
  /* Not checked for this alloy: shade against the largest limit given. */
  limit = 0;
  for (guint i = 0; i < CW_N_ALLOYS; i++)
    if (isfinite (ctx->rules->alloys[i].strain_limit))
      limit = MAX (limit, ctx->rules->alloys[i].strain_limit);
  return limit > 0 ? limit : 0.08;
}

typedef struct
{
  double side;    /* -1 or +1: the outside of the curve */
  double gap;     /* device units between the wall and the band */
  double width;   /* device units across the band */
} Band;

static void
band_point (const CwOverlayContext *ctx,
            const Band             *band,
            double                  s,
            double                  across,
            double                 *x,
            double                 *y)
{
  cw_overlay_point (ctx, s, band->side * cw_overlay_half (ctx, s),
                    band->side * (band->gap + across * band->width), x, y);
}

static void
band_piece (cairo_t                *cr,
            const CwOverlayContext *ctx,
            const Band             *band,
            double                  s0,
            double                  s1)
{
  double x, y;

  band_point (ctx, band, s0, 0, &x, &y);
  cairo_move_to (cr, x, y);
  band_point (ctx, band, s1, 0, &x, &y);
  cairo_line_to (cr, x, y);
  band_point (ctx, band, s1, 1, &x, &y);
  cairo_line_to (cr, x, y);
  band_point (ctx, band, s0, 1, &x, &y);
  cairo_line_to (cr, x, y);
  cairo_close_path (cr);
}

static void
band_edge (const CwOverlayContext *ctx,
           const Band             *band,
           cairo_t                *cr,
           double                  from,
           double                  to,
           double                  across)
{
  int n = (int) ceil (fabs (to - from) / BAND_STEP);

  for (int k = 0; k <= n; k++)
    {
      double x, y;

      band_point (ctx, band, from + (to - from) * k / MAX (n, 1), across, &x, &y);
      cairo_line_to (cr, x, y);
    }
}

/* An ink outline, so that the palest part still shows on a white ground. */
static void
band_outline (cairo_t                *cr,
              const CwOverlayContext *ctx,
              const Band             *band,
              double                  a,
              double                  b)
{
  const CwPalette *pal = cw_render_style_palette (&ctx->layout->style);

  cairo_new_path (cr);
  band_edge (ctx, band, cr, a, b, 0);
  band_edge (ctx, band, cr, b, a, 1);
  cairo_close_path (cr);
  cw_render_set_rgb (cr, &pal->ink);
  cairo_set_line_width (cr, cw_render_style_line (&ctx->layout->style, 0.6));
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  cairo_stroke (cr);
}

/* The file's part in curve i, from the band's point of view. */
static gboolean
curve_span (const CwOverlayContext *ctx,
            guint                   i,
            double                 *a,
            double                 *b)
{
  const CwGeometry *g = &ctx->layout->geometry;
  const CwStepResult *step = ctx->step;

  *a = MAX (g->onset[i], MAX (step->depth - step->instrument->length, ctx->layout->s_top));
  *b = MIN (g->end[i], step->depth);
  return *b - *a > 1e-6;
}

static void
draw_curve_band (cairo_t                *cr,
                 const CwOverlayContext *ctx,
                 guint                   i,
                 double                  limit)
{
  const CwRenderStyle *st = &ctx->layout->style;
  /* The first curve turns to +x, so its outside is at negative offsets;
   * a second one turns back. */
  Band band = { i % 2 == 0 ? -1 : 1, cw_render_style_font (st, 2.5), cw_render_style_font (st, 6) };
  double radius = ctx->layout->geometry.radius[i], a, b;

  if (!curve_span (ctx, i, &a, &b))
    return;
  for (double s = a; s < b; s += BAND_STEP)
    {
      double s1 = MIN (s + BAND_STEP, b);
      double strain = cw_pwl_eval (ctx->file, (s + s1) / 2) / (2 * radius);
      CwRgb heat = cw_overlay_heat_rgb (strain / limit);

      cairo_new_path (cr);
      band_piece (cr, ctx, &band, s, s1);
      cw_render_set_rgb (cr, &heat);
      cairo_fill_preserve (cr);
      /* A hairline of the same colour closes the seams between pieces. */
      cairo_set_line_width (cr, cw_render_style_line (st, 0.3));
      cairo_stroke (cr);
    }
  band_outline (cr, ctx, &band, a, b);
}

static gboolean
strain_shown (const CwOverlayContext *ctx)
{
  return ctx->step && ctx->layout->geometry.n_curves > 0 && isfinite (ctx->step->strain);
}

static char *
percent (double fraction)
{
  return cw_render_number (fraction * 100, 1);
}

void
cw_overlay_strain_note (CwOverlayContext *ctx)
{
  gboolean checked;
  double limit;
  g_autofree char *value = NULL, *max = NULL;
  CwRgb heat;

  if (!strain_shown (ctx))
    return;
  limit = strain_scale (ctx, &checked);
  value = percent (ctx->step->strain);
  max = percent (limit);
  heat = cw_overlay_heat_rgb (ctx->step->strain / limit);
  if (checked)
    cw_overlay_note (ctx, &heat, g_strdup_printf (_("Strain in the curve up to %s %% (alloy limit %s %%): "
                                                    "the band shades d / 2R along the file."), value, max));
  else
    cw_overlay_note (ctx, &heat, g_strdup_printf (_("Strain in the curve up to %s %%; not checked for "
                                                    "this alloy (band shaded against %s %%)."), value, max));
}

/* d(x) / 2R at each point of the file inside a curve, as a band outside
 * the curve, pale to red as it nears the alloy's limit. */
void
cw_overlay_strain_draw (cairo_t          *cr,
                        CwOverlayContext *ctx)
{
  gboolean checked;
  double limit;

  if (!strain_shown (ctx))
    return;
  limit = strain_scale (ctx, &checked);
  cairo_save (cr);
  for (guint i = 0; i < ctx->layout->geometry.n_curves; i++)
    draw_curve_band (cr, ctx, i, limit);
  cairo_restore (cr);
}

/* A line across the canal at s, reach device units past the drawn width. */
static void
across (cairo_t                *cr,
        const CwOverlayContext *ctx,
        double                  s,
        double                  half,
        double                  reach,
        double                 *x1,
        double                 *y1)
{
  double x0, y0;

  cw_overlay_point (ctx, s, -half, -reach, &x0, &y0);
  cw_overlay_point (ctx, s, half, reach, x1, y1);
  cairo_move_to (cr, x0, y0);
  cairo_line_to (cr, *x1, *y1);
}

/* In the label column, with a leader from the line's end; returns the
 * label's width. */
static double
label_at (cairo_t                *cr,
          const CwOverlayContext *ctx,
          const CwRgb            *colour,
          const char             *text,
          double                  x,
          double                  y)
{
  const CwRenderStyle *st = &ctx->layout->style;
  g_autoptr(PangoLayout) layout = cw_render_text_layout (st, cw_overlay_text_size (ctx), CW_TEXT_BOLD, text);
  double w, h, pad = cw_render_style_font (st, 1.5), column = MAX (ctx->column, x + pad);

  cw_render_text_size (layout, &w, &h);
  cw_render_set_rgb (cr, colour);
  cairo_set_line_width (cr, cw_render_style_line (st, 0.6));
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, column, y);
  cairo_stroke (cr);
  cw_render_set_rgba (cr, &cw_render_style_palette (st)->background, 0.85);
  cairo_rectangle (cr, column, y - h / 2 - pad / 2, w + 2 * pad, h + pad);
  cairo_fill (cr);
  cw_render_set_rgb (cr, colour);
  cw_render_text_draw (cr, layout, column + pad, y, CW_ALIGN_START, CW_ALIGN_CENTER);
  return column - ctx->column + w + 2 * pad;
}

/* How far from its tip the file is as wide as the ceiling: geometry of
 * the file, d(x) = ceiling. */
static double
ceiling_reach (const CwStepResult *step)
{
  CwProfile profile;

  cw_profile_init (&profile, step->instrument);
  return cw_profile_reach (&profile, step->ceiling);
}

static gboolean
past_safe_depth (const CwStepResult *step)
{
  return isfinite (step->ceiling_depth) && step->depth > step->ceiling_depth + 1e-9;
}

/* The ring on the file where it is as wide as the ceiling; returns the
 * width its label takes. */
static double
draw_ring (cairo_t                *cr,
           const CwOverlayContext *ctx)
{
  const CwStepResult *step = ctx->step;
  const CwRenderStyle *st = &ctx->layout->style;
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_CEILING);
  g_autofree char *width = cw_render_number (step->ceiling, 2);
  g_autofree char *text = g_strdup_printf (_("ceiling ⌀ %s mm"), width);
  double s = step->depth - ceiling_reach (step), x, y;

  if (!isfinite (s) || s < ctx->layout->s_top || s < step->depth - step->instrument->length)
    return 0;
  across (cr, ctx, s, cw_pwl_eval (ctx->file, s) / 2, cw_render_style_font (st, 4), &x, &y);
  cw_overlay_halo_line (cr, ctx, &ink, cw_render_style_line (st, 2.4));
  return label_at (cr, ctx, &ink, text, x, y);
}

static double
draw_safe_depth (cairo_t                *cr,
                 const CwOverlayContext *ctx)
{
  const CwRenderStyle *st = &ctx->layout->style;
  const CwPalette *pal = cw_render_style_palette (st);
  double s = ctx->step->ceiling_depth, x, y;
  double dashes[] = { cw_render_style_line (st, 5), cw_render_style_line (st, 2.5) };
  g_autofree char *depth = cw_render_number (s, 1);
  g_autofree char *text = g_strdup_printf (_("safe depth %s mm"), depth);
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_CEILING);
  const CwRgb *colour = past_safe_depth (ctx->step) ? &pal->level[CW_LEVEL_STOP] : &ink;

  if (s < ctx->layout->s_top || s > ctx->layout->s_end)
    return 0;
  across (cr, ctx, s, cw_overlay_half (ctx, s), cw_render_style_font (st, 9), &x, &y);
  cw_render_set_rgb (cr, &pal->background);
  cairo_set_line_width (cr, cw_render_style_line (st, 3.6));
  cairo_stroke_preserve (cr);
  cairo_set_dash (cr, dashes, 2, 0);
  cw_render_set_rgb (cr, colour);
  cairo_set_line_width (cr, cw_render_style_line (st, 1.8));
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
  return label_at (cr, ctx, colour, text, x, y);
}

void
cw_overlay_ceiling_note (CwOverlayContext *ctx)
{
  const CwPalette *pal = cw_render_style_palette (&ctx->layout->style);
  const CwStepResult *step = ctx->step;
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_CEILING);
  g_autofree char *ceiling = NULL, *x = NULL, *depth = NULL, *over = NULL;

  if (step == NULL || !isfinite (step->ceiling))
    return;
  ceiling = cw_render_number (step->ceiling, 2);
  x = cw_render_number (ceiling_reach (step), 1);
  depth = cw_render_number (step->ceiling_depth, 1);
  over = cw_render_number (step->depth - step->ceiling_depth, 1);
  if (!isfinite (step->ceiling_depth))
    cw_overlay_note (ctx, &ink,
                     g_strdup_printf (_("Ceiling %s mm: the flutes never grow past it, so it sets no depth."),
                                      ceiling));
  else if (past_safe_depth (step))
    cw_overlay_note (ctx, &pal->level[CW_LEVEL_STOP],
                     g_strdup_printf (_("Ceiling %s mm: the file is that wide %s mm from its tip (ring); "
                                        "the tip is %s mm past the safe depth of %s mm."),
                                      ceiling, x, over, depth));
  else
    cw_overlay_note (ctx, &ink,
                     g_strdup_printf (_("Ceiling %s mm: the file is that wide %s mm from its tip (ring), "
                                        "so the tip may go to %s mm (safe depth)."), ceiling, x, depth));
}

/* The ring where the file is as wide as the ceiling for its taper, and the
 * safe depth: the deepest the tip goes before that ring enters the curve. */
void
cw_overlay_ceiling_draw (cairo_t          *cr,
                         CwOverlayContext *ctx)
{
  const CwStepResult *step = ctx->step;
  double width;

  if (step == NULL || !isfinite (step->ceiling))
    return;
  cairo_save (cr);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  width = draw_ring (cr, ctx);
  if (isfinite (step->ceiling_depth))
    width = MAX (width, draw_safe_depth (cr, ctx));
  cairo_restore (cr);
  ctx->column += width + cw_render_style_font (&ctx->layout->style, 4);
}
