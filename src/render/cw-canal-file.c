/* cw-canal-file.c: walls and files as bands along the centreline
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <math.h>

#include "cw-canal-layout-private.h"

/* Along an arc the band needs points this close (mm) to look round. */
#define ARC_STEP 0.1

static void
add_arc_samples (const CwCanalLayout *layout,
                 double               s0,
                 double               s1,
                 GArray              *out)
{
  for (guint i = 0; i < layout->path.n_pieces; i++)
    {
      const CwPathPiece *p = &layout->path.pieces[i];
      double a = MAX (p->s0, s0), b = MIN (p->s0 + p->length, s1);

      if (p->turn == 0 || b <= a)
        continue;
      for (double s = a; s < b; s += ARC_STEP)
        g_array_append_val (out, s);
      g_array_append_val (out, b);
    }
}

/* The diameter along [s0, s1] as points in order; a jump gives two points
 * at one s, so the cut's edge is drawn square. */
static GArray *
band_samples (const CwCanalLayout *layout,
              const CwPwl         *diameter,
              double               s0,
              double               s1)
{
  g_autoptr(GArray) where = g_array_new (FALSE, FALSE, sizeof (double));
  GArray *out = g_array_new (FALSE, FALSE, sizeof (CwPoint));

  g_array_append_val (where, s0);
  g_array_append_val (where, s1);
  cw_pwl_collect_breaks (diameter, s0, s1, where);
  add_arc_samples (layout, s0, s1, where);
  cw_sort_unique_doubles (where);
  for (guint i = 0; i < where->len; i++)
    {
      double s = g_array_index (where, double, i);
      CwPoint left = { s, cw_pwl_eval_side (diameter, s, CW_SIDE_LEFT) };
      CwPoint right = { s, cw_pwl_eval_side (diameter, s, CW_SIDE_RIGHT) };

      if (s < s0 || s > s1)
        continue;
      if (s > s0 && (left.v != right.v || s == s1))
        g_array_append_val (out, left);
      if (s < s1)
        g_array_append_val (out, right);
    }
  return out;
}

static void
line_to_wall (cairo_t             *cr,
              const CwCanalLayout *layout,
              const CwPoint       *p,
              double               side)
{
  double x, y;

  cw_canal_layout_to_device (layout, p->s, side * p->v / 2, &x, &y);
  cairo_line_to (cr, x, y);
}

/* One wall (side -1 left, +1 right) from s0 to s1, either way round,
 * continuing the current path. */
void
cw_canal_offset_path (cairo_t             *cr,
                      const CwCanalLayout *layout,
                      const CwPwl         *diameter,
                      double               side,
                      double               s0,
                      double               s1)
{
  g_autoptr(GArray) pts = band_samples (layout, diameter, MIN (s0, s1), MAX (s0, s1));

  for (guint i = 0; i < pts->len; i++)
    {
      guint k = s0 <= s1 ? i : pts->len - 1 - i;

      line_to_wall (cr, layout, &g_array_index (pts, CwPoint, k), side);
    }
}

/* The closed outline of a band of the given diameter over [s0, s1]. */
void
cw_canal_band_path (cairo_t             *cr,
                    const CwCanalLayout *layout,
                    const CwPwl         *diameter,
                    double               s0,
                    double               s1)
{
  cairo_new_path (cr);
  cw_canal_offset_path (cr, layout, diameter, -1, s0, s1);
  cw_canal_offset_path (cr, layout, diameter, 1, s1, s0);
  cairo_close_path (cr);
}

/* d(L - s) along the file, shank included, from its top (or s_top, where
 * the drawing ends) to its tip. */
CwPwl *
cw_canal_file_diameter (const CwStepResult *step,
                        double              s_top)
{
  CwPwl *pwl = cw_pwl_new ();
  CwProfile profile;
  double depth = step->depth;
  double top = MAX (depth - step->instrument->length, s_top);

  cw_profile_init (&profile, step->instrument);
  cw_pwl_append (pwl, top, cw_profile_diameter (&profile, depth - top));
  for (int i = (int) profile.n - 1; i >= 0; i--)
    if (depth - profile.x[i] > top)
      cw_pwl_append (pwl, depth - profile.x[i], profile.d[i]);
  return pwl;
}

static void
hatch (cairo_t             *cr,
       const CwCanalLayout *layout,
       const CwRgb         *fill)
{
  double x0, y0, x1, y1;
  double step = cw_render_style_line (&layout->style, 2.6);

  cairo_clip_extents (cr, &x0, &y0, &x1, &y1);
  if (cw_render_luminance (fill) > 0.45)
    cairo_set_source_rgba (cr, 0, 0, 0, 0.9);
  else
    cairo_set_source_rgba (cr, 1, 1, 1, 0.95);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.9));
  for (double d = -(y1 - y0); d < x1 - x0; d += step)
    {
      cairo_move_to (cr, x0 + d, y1);
      cairo_line_to (cr, x0 + d + (y1 - y0), y0);
    }
  cairo_stroke (cr);
}

static void
draw_engaged (cairo_t             *cr,
              const CwCanalLayout *layout,
              const CwStepResult  *step,
              const CwPwl         *file,
              const CwRgb         *fill)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);

  for (guint i = 0; i < step->engaged->len; i++)
    {
      const CwPoint *e = &g_array_index (step->engaged, CwPoint, i);

      cairo_save (cr);
      cw_canal_band_path (cr, layout, file, e->s, e->v);
      cairo_clip_preserve (cr);
      hatch (cr, layout, fill);
      cairo_restore (cr);
      cw_render_set_rgb (cr, &pal->engaged);
      cairo_set_line_width (cr, cw_render_style_line (&layout->style, 1.6));
      cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
      cairo_stroke (cr);
    }
}

void
cw_canal_file_draw (cairo_t             *cr,
                    const CwCanalLayout *layout,
                    const CwStepResult  *step)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  g_autoptr(CwPwl) file = cw_canal_file_diameter (step, layout->s_top);
  const CwPoint *first = cw_pwl_get_points (file);
  CwRgb fill = cw_render_handle_rgb (step->instrument->tip);

  double split = CLAMP (layout->orifice, first->s, step->depth);

  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.8));
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_MITER);
  /* Above the orifice the file is out of the canal: drawn faintly, so that
   * a wide shank does not outweigh the part that works. */
  if (split > first->s)
    {
      cw_canal_band_path (cr, layout, file, first->s, split);
      cw_render_set_rgba (cr, &fill, 0.35);
      cairo_fill_preserve (cr);
      cw_render_set_rgba (cr, &pal->file_outline, 0.5);
      cairo_stroke (cr);
    }
  cw_canal_band_path (cr, layout, file, split, step->depth);
  cw_render_set_rgb (cr, &fill);
  cairo_fill_preserve (cr);
  cw_render_set_rgb (cr, &pal->file_outline);
  cairo_stroke (cr);
  draw_engaged (cr, layout, step, file, &fill);
}
