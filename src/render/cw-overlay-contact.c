/* cw-overlay-contact.c: the engaged wall, the straight-part clearance and
 * the shape before and after a step
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-overlays-private.h"
#include "cw-render-text.h"

static void
wall_stretch (cairo_t                *cr,
              const CwOverlayContext *ctx,
              double                  side,
              double                  a,
              double                  b)
{
  cairo_new_path (cr);
  cw_canal_offset_path (cr, ctx->layout, ctx->walls, side, a, b);
}

/* The wall the file cuts, both sides, in heavy magenta. */
void
cw_overlay_engaged_draw (cairo_t          *cr,
                         CwOverlayContext *ctx)
{
  const CwStepResult *step = ctx->step;
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_ENGAGED);

  if (step == NULL)
    return;
  cairo_save (cr);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  for (guint i = 0; i < step->engaged->len; i++)
    {
      const CwPoint *e = &g_array_index (step->engaged, CwPoint, i);

      for (int side = -1; side <= 1; side += 2)
        {
          wall_stretch (cr, ctx, side, e->s, e->v);
          cw_overlay_halo_line (cr, ctx, &ink, cw_render_style_line (&ctx->layout->style, 3));
        }
    }
  cairo_restore (cr);
}

void
cw_overlay_engaged_note (CwOverlayContext *ctx)
{
  const CwStepResult *step = ctx->step;
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_ENGAGED);
  g_autofree char *length = NULL, *curve = NULL, *straight = NULL, *area = NULL;

  if (step == NULL)
    return;
  if (step->engaged_length <= 0)
    {
      cw_overlay_note (ctx, &ink, g_strdup (_("Not engaged: the file does not cut the walls at this depth.")));
      return;
    }
  length = cw_render_number (step->engaged_length, 1);
  curve = cw_render_number (step->engaged_in_curve, 1);
  straight = cw_render_number (step->engaged_in_straight, 1);
  area = cw_render_number (step->contact_area, 1);
  cw_overlay_note (ctx, &ink, g_strdup_printf (_("Engaged %s mm (%s in the curve, %s in the straight part): "
                                                 "%s mm² of wall in contact."), length, curve, straight, area));
}

/* A bar just outside each wall from a to b. */
static void
side_bars (cairo_t                *cr,
           const CwOverlayContext *ctx,
           double                  a,
           double                  b,
           double                  gap)
{
  int n = (int) ceil ((b - a) / 0.1);

  for (int side = -1; side <= 1; side += 2)
    {
      cairo_new_path (cr);
      for (int k = 0; k <= n; k++)
        {
          double s = a + (b - a) * k / MAX (n, 1), x, y;

          cw_overlay_point (ctx, s, side * cw_overlay_half (ctx, s), side * gap, &x, &y);
          cairo_line_to (cr, x, y);
        }
      cairo_stroke (cr);
    }
}

static double
straight_end (const CwOverlayContext *ctx)
{
  const CwGeometry *g = &ctx->layout->geometry;

  return g->n_curves ? g->onset[0] : ctx->layout->working_length;
}

/* Draws the cutting parts of the straight segment, with cr NULL only
 * measures them; returns their length. */
static double
cuts (cairo_t                *cr,
      const CwOverlayContext *ctx,
      double                  gap)
{
  const CwStepResult *step = ctx->step;
  double s0 = ctx->layout->orifice, s1 = straight_end (ctx), drawn = 0;

  for (guint i = 0; i < step->engaged->len; i++)
    {
      const CwPoint *e = &g_array_index (step->engaged, CwPoint, i);
      double a = MAX (e->s, s0), b = MIN (e->v, s1);

      if (b - a <= 1e-6)
        continue;
      if (cr)
        side_bars (cr, ctx, a, b, gap);
      drawn += b - a;
    }
  return drawn;
}

static gboolean
clearance_shown (const CwOverlayContext *ctx)
{
  return ctx->step && isfinite (ctx->step->straight_clearance);
}

static gboolean
cutting_straight (const CwOverlayContext *ctx)
{
  return ctx->step->engaged_in_straight > 0 && cuts (NULL, ctx, 0) > 0;
}

void
cw_overlay_clearance_note (CwOverlayContext *ctx)
{
  const CwPalette *pal = cw_render_style_palette (&ctx->layout->style);
  const CwStepResult *step = ctx->step;
  g_autofree char *length = NULL, *over = NULL, *clear = NULL;

  if (!clearance_shown (ctx))
    return;
  length = cw_render_number (step->engaged_in_straight, 1);
  over = cw_render_number (-step->straight_clearance, 2);
  clear = cw_render_number (step->straight_clearance, 2);
  if (cutting_straight (ctx))
    cw_overlay_note (ctx, &pal->level[CW_LEVEL_CAUTION],
                     g_strdup_printf (_("Straight part: the file still cuts over %s mm, up to %s mm wider "
                                        "than the canal there."), length, over));
  else if (step->straight_clearance < 0)
    cw_overlay_note (ctx, &pal->level[CW_LEVEL_OK],
                     g_strdup_printf (_("Straight part: the file touches it, within the contact tolerance "
                                        "(%s mm)."), over));
  else
    cw_overlay_note (ctx, &pal->level[CW_LEVEL_OK],
                     g_strdup_printf (_("Straight part: clear by %s mm; the file works in the curve only."),
                                      clear));
}

/* For a step into the curve: heavy caution bars beside the straight part
 * where the file still cuts it, thin dashed ones where it is clear. */
void
cw_overlay_clearance_draw (cairo_t          *cr,
                           CwOverlayContext *ctx)
{
  const CwRenderStyle *st;
  const CwPalette *pal;
  double gap;

  if (!clearance_shown (ctx))
    return;
  st = &ctx->layout->style;
  pal = cw_render_style_palette (st);
  gap = cw_render_style_font (st, 3.5);
  cairo_save (cr);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  cw_render_set_rgb (cr, &pal->level[CW_LEVEL_CAUTION]);
  cairo_set_line_width (cr, cw_render_style_line (st, 3.5));
  if (cutting_straight (ctx))
    cuts (cr, ctx, gap);
  else
    {
      double dashes[] = { cw_render_style_line (st, 3), cw_render_style_line (st, 2) };

      cw_render_set_rgb (cr, &pal->level[CW_LEVEL_OK]);
      cairo_set_line_width (cr, cw_render_style_line (st, 1.4));
      cairo_set_dash (cr, dashes, 2, 0);
      side_bars (cr, ctx, ctx->layout->orifice, straight_end (ctx), gap);
    }
  cairo_restore (cr);
}

/* Both walls of a shape from the orifice to the working length, as one
 * closed sub-path. */
static void
shape_path (cairo_t                *cr,
            const CwOverlayContext *ctx,
            const CwPwl            *shape)
{
  double wl = ctx->layout->working_length;

  cairo_new_sub_path (cr);
  cw_canal_offset_path (cr, ctx->layout, shape, -1, ctx->layout->orifice, wl);
  cw_canal_offset_path (cr, ctx->layout, shape, 1, wl, ctx->layout->orifice);
  cairo_close_path (cr);
}

static void
removed_area (cairo_t                *cr,
              const CwOverlayContext *ctx,
              const CwPwl            *before,
              const CwPwl            *after,
              const CwRgb            *ink)
{
  cairo_new_path (cr);
  shape_path (cr, ctx, after);
  shape_path (cr, ctx, before);
  cairo_set_fill_rule (cr, CAIRO_FILL_RULE_EVEN_ODD);
  cw_render_set_rgba (cr, ink, 0.55);
  cairo_fill (cr);
  cairo_set_fill_rule (cr, CAIRO_FILL_RULE_WINDING);
}

static void
after_outline (cairo_t                *cr,
               const CwOverlayContext *ctx,
               const CwPwl            *after,
               const CwRgb            *ink)
{
  const CwRenderStyle *st = &ctx->layout->style;
  double dashes[] = { cw_render_style_line (st, 4), cw_render_style_line (st, 2.5) };
  double wl = ctx->layout->working_length;

  for (int side = -1; side <= 1; side += 2)
    {
      cairo_new_path (cr);
      cw_canal_offset_path (cr, ctx->layout, after, side, ctx->layout->orifice, wl);
      cairo_set_dash (cr, dashes, 2, 0);
      cw_overlay_halo_line (cr, ctx, ink, cw_render_style_line (st, 1.5));
    }
  cairo_set_dash (cr, NULL, 0, 0);
}

static double
total_cut (const CwCanalResult *result)
{
  double total = 0;

  for (guint i = 0; i < result->steps->len; i++)
    total += cw_canal_result_get_step (result, i)->cut_volume;
  return total;
}

/* The shape the step meets (the walls) and, dashed, the one it leaves;
 * the wall it removes between them, tinted.  With no step: the natural
 * canal and the prepared shape. */
void
cw_overlay_envelope_draw (cairo_t          *cr,
                          CwOverlayContext *ctx)
{
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_ENVELOPE);
  const CwPwl *before = ctx->step ? ctx->walls : ctx->result->natural;
  const CwPwl *after = ctx->step ? ctx->step->envelope_after : ctx->walls;

  if (after == NULL)
    return;
  cairo_save (cr);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  removed_area (cr, ctx, before, after, &ink);
  after_outline (cr, ctx, after, &ink);
  cairo_restore (cr);
}

void
cw_overlay_envelope_note (CwOverlayContext *ctx)
{
  CwRgb ink = cw_overlay_ink (ctx, CW_OVERLAY_INK_ENVELOPE);
  g_autofree char *volume = NULL;

  if (ctx->step && ctx->step->envelope_after == NULL)
    return;
  volume = cw_render_number (ctx->step ? ctx->step->cut_volume : total_cut (ctx->result), 2);
  if (ctx->step)
    cw_overlay_note (ctx, &ink, g_strdup_printf (_("Shape after this step dashed; it removes %s mm³ "
                                                   "(tinted)."), volume));
  else
    cw_overlay_note (ctx, &ink, g_strdup_printf (_("Prepared shape dashed over the natural canal; "
                                                   "%s mm³ removed in all (tinted)."), volume));
}
