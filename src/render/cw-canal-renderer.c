/* cw-canal-renderer.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <math.h>

#include "cw-canal-layout-private.h"
#include "cw-canal-overlays-private.h"
#include "cw-canal-renderer.h"

const CwPwl *
cw_canal_render_walls (const CwCanalResult *result,
                       int                  step)
{
  const CwPwl *walls = NULL;

  g_return_val_if_fail (result != NULL, NULL);

  if (step == 0 || result->steps->len == 0)
    return result->natural;
  if (step > 0 && (guint) step <= result->steps->len)
    walls = cw_canal_result_get_step (result, step - 1)->envelope_after;
  else
    walls = cw_canal_result_envelope (result);
  return walls ? walls : result->natural;
}

/* The walls from the orifice down to the working length and round the
 * apical end, as one open path. */
static void
u_path (cairo_t             *cr,
        const CwCanalLayout *layout,
        const CwPwl         *diameter)
{
  double wl = layout->working_length;
  double a = cw_canal_path_heading (&layout->path, wl);
  double r = cw_pwl_eval (diameter, wl) / 2 * layout->width_factor * layout->scale;
  double cx, cy;

  cairo_new_path (cr);
  cw_canal_offset_path (cr, layout, diameter, -1, layout->orifice, wl);
  cw_canal_layout_to_device (layout, wl, 0, &cx, &cy);
  /* From the left wall (angle pi - a) round the apical end to the right. */
  cairo_arc_negative (cr, cx, cy, r, G_PI - a, -a);
  cw_canal_offset_path (cr, layout, diameter, 1, wl, layout->orifice);
}

static void
draw_canal (cairo_t             *cr,
            const CwCanalLayout *layout,
            const CwPwl         *natural,
            const CwPwl         *walls)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  double dash[] = { cw_render_style_line (&layout->style, 2.5), cw_render_style_line (&layout->style, 1.8) };

  u_path (cr, layout, walls);
  cairo_close_path (cr);
  cw_render_set_rgb (cr, &pal->lumen);
  cairo_fill (cr);
  u_path (cr, layout, natural);
  cw_render_set_rgb (cr, &pal->natural);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.6));
  cairo_set_dash (cr, dash, 2, 0);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
}

static void
draw_centreline (cairo_t             *cr,
                 const CwCanalLayout *layout)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  g_autoptr(CwPwl) zero = cw_pwl_new_linear (0, 0, layout->working_length, 0);
  double dots[] = { cw_render_style_line (&layout->style, 0.6), cw_render_style_line (&layout->style, 2.4) };

  cairo_new_path (cr);
  cw_canal_offset_path (cr, layout, zero, 1, 0, layout->working_length);
  cw_render_set_rgb (cr, &pal->muted);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.6));
  cairo_set_dash (cr, dots, 2, 0);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
}

static void
draw_walls (cairo_t             *cr,
            const CwCanalLayout *layout,
            const CwPwl         *walls)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);

  u_path (cr, layout, walls);
  cw_render_set_rgb (cr, &pal->wall);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.9));
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  cairo_stroke (cr);
}

static void
draw_background (cairo_t             *cr,
                 const CwCanalLayout *layout)
{
  const cairo_rectangle_t *a = &layout->area;

  cairo_rectangle (cr, a->x, a->y, a->width, a->height);
  cairo_clip_preserve (cr);
  cw_render_set_rgb (cr, &cw_render_style_palette (&layout->style)->background);
  cairo_fill (cr);
}

void
cw_canal_draw_options_init (CwCanalDrawOptions *options)
{
  g_return_if_fail (options != NULL);

  options->overlays = CW_OVERLAY_NONE;
  options->partial = NULL;
  options->rules = NULL;
  options->hide_notes = FALSE;
}

static void
draw_step (cairo_t                  *cr,
           const CwCanalLayout      *layout,
           const CwCanalResult      *result,
           int                       step,
           const CwCanalDrawOptions *options)
{
  const CwStepResult *r = NULL;
  const CwPwl *walls;

  if (step >= 0 && (guint) step < result->steps->len)
    r = cw_canal_result_get_step (result, step);
  walls = cw_canal_render_walls (result, r ? step : CW_RENDER_NO_STEP);

  cairo_save (cr);
  draw_background (cr, layout);
  draw_canal (cr, layout, result->natural, walls);
  draw_centreline (cr, layout);
  if (r)
    cw_canal_file_draw (cr, layout, r);
  draw_walls (cr, layout, walls);
  cw_canal_marks_draw (cr, layout, walls);
  /* The ceiling overlay draws this line with more around it. */
  if (r && !(options->overlays & CW_OVERLAY_CEILING))
    cw_canal_ceiling_draw (cr, layout, r, walls);
  if (layout->flags & CW_CANAL_LAYOUT_SCALE)
    cw_canal_scale_bar_draw (cr, layout);
  if (layout->flags & CW_CANAL_LAYOUT_LEGEND)
    cw_canal_legend_draw (cr, layout, result, r ? step : CW_RENDER_NO_STEP);
  cairo_restore (cr);
  /* Not clipped to the layout's area: their labels may take the room
   * cw_canal_overlays_room () asked the caller to leave beside it. */
  cw_canal_overlays_draw (cr, layout, result, r ? step : CW_RENDER_NO_STEP, options);
}

void
cw_canal_draw_full (cairo_t                  *cr,
                    const CwCanalLayout      *layout,
                    const CwCanalResult      *result,
                    int                       step,
                    const CwCanalDrawOptions *options)
{
  CwCanalDrawOptions defaults;
  g_autoptr(GPtrArray) steps = NULL;
  CwCanalResult shown;

  g_return_if_fail (cr != NULL && layout != NULL && result != NULL);

  if (options == NULL)
    {
      cw_canal_draw_options_init (&defaults);
      options = &defaults;
    }
  if (options->partial == NULL || step < 0 || (guint) step >= result->steps->len)
    {
      draw_step (cr, layout, result, step, options);
      return;
    }
  /* The same result with the step at its partial depth: every part of the
   * drawing, the legend too, then shows the figures there. */
  shown = *result;
  steps = g_ptr_array_copy (result->steps, NULL, NULL);
  g_ptr_array_set_free_func (steps, NULL);
  g_ptr_array_index (steps, step) = (gpointer) options->partial;
  shown.steps = steps;
  draw_step (cr, layout, &shown, step, options);
}

void
cw_canal_draw (cairo_t             *cr,
               const CwCanalLayout *layout,
               const CwCanalResult *result,
               int                  step)
{
  cw_canal_draw_full (cr, layout, result, step, NULL);
}
