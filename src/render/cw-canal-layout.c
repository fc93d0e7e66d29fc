/* cw-canal-layout.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <math.h>

#include "cw-canal-layout-private.h"
#include "cw-render-text.h"

/* Room above the reference point for the files' shanks, and past the
 * deepest tip, in mm. */
#define TOP_MARGIN 1.0
#define END_MARGIN 0.6

typedef struct
{
  double x0, y0, x1, y1;
} Box;

static double
deepest_step (const CwCanal *canal)
{
  double deepest = canal->working_length;

  for (guint i = 0; i < cw_canal_get_n_steps (canal); i++)
    deepest = MAX (deepest, cw_canal_get_step ((CwCanal *) canal, i)->depth);
  return deepest;
}

static void
init_geometry (CwCanalLayout       *layout,
               const CwCanal       *canal,
               const CwCanalResult *result)
{
  if (result)
    layout->geometry = result->geometry;
  else
    cw_canal_get_geometry (canal, &layout->geometry);
  cw_canal_path_init (&layout->path, &layout->geometry);
  layout->working_length = canal->working_length;
  layout->orifice = canal->orifice_depth;
  layout->s_top = -TOP_MARGIN;
  layout->s_end = deepest_step (canal) + END_MARGIN;
  layout->width_factor = CW_RENDER_WIDTH_FACTOR;
}

/* The half width drawn at s: the widest of the walls and of every file. */
static double
half_at (const CwCanalLayout *layout,
         GPtrArray           *bands,
         double               s)
{
  double widest = 0;

  for (guint i = 0; i < bands->len; i++)
    {
      const CwPwl *band = g_ptr_array_index (bands, i);
      const CwPoint *p = cw_pwl_get_points (band);
      guint n = cw_pwl_get_n_points (band);

      if (s >= p[0].s - 0.5 && s <= p[n - 1].s + 0.5)
        widest = MAX (widest, cw_pwl_eval (band, s));
    }
  return widest / 2 * layout->width_factor;
}

/* Everything drawn as a band: the natural canal, the prepared one and
 * each step's file. */
static GPtrArray *
collect_bands (const CwCanalLayout *layout,
               const CwCanal       *canal,
               const CwCanalResult *result)
{
  GPtrArray *bands = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_pwl_free);

  g_ptr_array_add (bands, cw_canal_natural_diameter (canal, layout->working_length));
  for (guint i = 0; result && i < result->steps->len; i++)
    g_ptr_array_add (bands, cw_canal_file_diameter (cw_canal_result_get_step (result, i),
                                                    layout->s_top));
  if (result)
    g_ptr_array_add (bands, cw_pwl_copy (cw_canal_result_envelope (result)));
  return bands;
}

/* The extent in mm of everything drawn along the centreline. */
static Box
canal_box (const CwCanalLayout *layout,
           const CwCanal       *canal,
           const CwCanalResult *result)
{
  g_autoptr(GPtrArray) bands = collect_bands (layout, canal, result);
  Box box = { G_MAXDOUBLE, G_MAXDOUBLE, -G_MAXDOUBLE, -G_MAXDOUBLE };
  int n = (int) ceil ((layout->s_end - layout->s_top) / 0.2);

  for (int i = 0; i <= n; i++)
    {
      double s = layout->s_top + i * (layout->s_end - layout->s_top) / n;
      double w = half_at (layout, bands, s), a = cw_canal_path_heading (&layout->path, s);
      double x, y;

      cw_canal_path_point (&layout->path, s, 0, &x, &y);
      box.x0 = MIN (box.x0, x - w * fabs (cos (a)));
      box.x1 = MAX (box.x1, x + w * fabs (cos (a)));
      box.y0 = MIN (box.y0, y - w * fabs (sin (a)));
      box.y1 = MAX (box.y1, y + w * fabs (sin (a)));
    }
  return box;
}

double
cw_canal_layout_aspect (const CwCanal       *canal,
                        const CwCanalResult *result)
{
  CwCanalLayout layout = { 0 };
  Box box;

  g_return_val_if_fail (canal != NULL, 1.0);
  init_geometry (&layout, canal, result);
  box = canal_box (&layout, canal, result);
  return (box.y1 - box.y0) / (box.x1 - box.x0);
}

static double
widest_label (const CwCanalLayout *layout)
{
  g_autoptr(GArray) marks = cw_canal_marks_collect (layout);
  double size = layout->flags & CW_CANAL_LAYOUT_LABELS ? CW_LABEL_SIZE : CW_SMALL_SIZE;
  double widest = 0;

  for (guint i = 0; i < marks->len; i++)
    {
      const CwCanalMark *m = &g_array_index (marks, CwCanalMark, i);
      g_autoptr(PangoLayout) text = NULL;
      double w;

      if (m->label == NULL)
        continue;
      text = cw_render_text_layout (&layout->style, size, CW_TEXT_REGULAR, m->label);
      cw_render_text_size (text, &w, NULL);
      widest = MAX (widest, w);
    }
  return widest;
}

static gboolean
has_ceiling (const CwCanalLayout *layout,
             const CwCanalResult *result)
{
  for (guint i = 0; result && i < result->steps->len; i++)
    {
      double depth = cw_canal_result_get_step (result, i)->ceiling_depth;

      if (isfinite (depth) && depth < layout->s_end)
        return TRUE;
    }
  return FALSE;
}

static double
legend_height (const CwCanalLayout *layout,
               const CwCanalResult *result,
               double               width)
{
  double tallest = 0;

  if (!(layout->flags & CW_CANAL_LAYOUT_LEGEND) || result == NULL)
    return 0;
  for (int i = CW_RENDER_NO_STEP; i < (int) result->steps->len; i++)
    {
      g_autoptr(GPtrArray) lines = cw_canal_legend_lines (result, i);

      tallest = MAX (tallest, cw_canal_legend_height (&layout->style, lines, width));
    }
  return tallest;
}

static double
scale_bar_height (const CwCanalLayout *layout)
{
  if (!(layout->flags & CW_CANAL_LAYOUT_SCALE))
    return 0;
  return cw_render_text_height (&layout->style, CW_LABEL_SIZE, CW_TEXT_REGULAR, "5 mm", 0)
         + cw_render_style_font (&layout->style, 10);
}

/* Fit the canal box, aspect kept, between the label column, the room for
 * the ceiling label, and the scale bar and legend below. */
static void
fit (CwCanalLayout       *layout,
     const CwCanal       *canal,
     const CwCanalResult *result)
{
  const CwRenderStyle *st = &layout->style;
  const cairo_rectangle_t *a = &layout->area;
  double pad = cw_render_style_font (st, 5);
  double gap = cw_render_style_font (st, 4);
  double leader = cw_render_style_font (st, layout->flags & CW_CANAL_LAYOUT_LABELS ? 14 : 4);
  double right = gap + (has_ceiling (layout, result)
                        ? cw_canal_ceiling_label_width (st, layout->flags) : 0);
  double legend = legend_height (layout, result, a->width - 2 * pad);
  double bar = scale_bar_height (layout);
  double below = (legend > 0 ? legend + gap : 0) + (bar > 0 ? bar + gap : 0);
  Box box = canal_box (layout, canal, result);
  double bw = box.x1 - box.x0, bh = box.y1 - box.y0;
  double aw, ah, x0;

  layout->leader = leader;
  layout->label_width = widest_label (layout) + leader;
  aw = MAX (a->width - 2 * pad - layout->label_width - right, 1);
  ah = MAX (a->height - 2 * pad - below, 1);
  layout->scale = MIN (aw / bw, ah / bh);
  x0 = a->x + pad + (a->width - 2 * pad - (layout->label_width + bw * layout->scale + right)) / 2;
  layout->canal = (cairo_rectangle_t) { x0 + layout->label_width, a->y + pad,
                                        bw * layout->scale, bh * layout->scale };
  layout->ox = layout->canal.x - box.x0 * layout->scale;
  layout->oy = layout->canal.y - box.y0 * layout->scale;
  /* Top-aligned: the scale bar and the legend follow the canal closely. */
  layout->scale_bar = (cairo_rectangle_t) { a->x + pad, layout->canal.y + layout->canal.height + gap,
                                            a->width - 2 * pad, bar };
  layout->legend = (cairo_rectangle_t) { a->x + pad,
                                         layout->scale_bar.y + (bar > 0 ? bar + gap : 0),
                                         a->width - 2 * pad, legend };
}

CwCanalLayout *
cw_canal_layout_new (const CwCanal           *canal,
                     const CwCanalResult     *result,
                     const CwRenderStyle     *style,
                     const cairo_rectangle_t *area,
                     CwCanalLayoutFlags       flags)
{
  CwCanalLayout *layout;

  g_return_val_if_fail (canal != NULL, NULL);
  g_return_val_if_fail (style != NULL, NULL);
  g_return_val_if_fail (area != NULL, NULL);

  layout = g_new0 (CwCanalLayout, 1);
  layout->style = *style;
  layout->flags = flags;
  layout->area = *area;
  init_geometry (layout, canal, result);
  fit (layout, canal, result);
  return layout;
}

void
cw_canal_layout_free (CwCanalLayout *layout)
{
  g_free (layout);
}

void
cw_canal_layout_to_device (const CwCanalLayout *layout,
                           double               s,
                           double               offset,
                           double              *x,
                           double              *y)
{
  double mx, my;

  g_return_if_fail (layout != NULL);

  cw_canal_path_point (&layout->path, s, offset * layout->width_factor, &mx, &my);
  *x = layout->ox + mx * layout->scale;
  *y = layout->oy + my * layout->scale;
}

/* The depth s of the centreline point nearest to the device point (within
 * the range drawn); *offset gets the lateral offset in true mm and
 * *distance the distance from the centreline in device units. */
double
cw_canal_layout_from_device (const CwCanalLayout *layout,
                             double               x,
                             double               y,
                             double              *offset,
                             double              *distance)
{
  double lateral, s;

  g_return_val_if_fail (layout != NULL, NAN);

  s = cw_canal_path_nearest (&layout->path, (x - layout->ox) / layout->scale,
                             (y - layout->oy) / layout->scale,
                             layout->s_top, layout->s_end, &lateral);
  if (offset)
    *offset = lateral / layout->width_factor;
  if (distance)
    {
      double cx, cy;

      cw_canal_layout_to_device (layout, s, 0, &cx, &cy);
      *distance = hypot (x - cx, y - cy);
    }
  return s;
}

double
cw_canal_layout_get_scale (const CwCanalLayout *layout)
{
  return layout->scale;
}

double
cw_canal_layout_get_width_factor (const CwCanalLayout *layout)
{
  return layout->width_factor;
}

void
cw_canal_layout_get_range (const CwCanalLayout *layout,
                           double              *s_top,
                           double              *s_end)
{
  *s_top = layout->s_top;
  *s_end = layout->s_end;
}

void
cw_canal_layout_get_canal_box (const CwCanalLayout *layout,
                               cairo_rectangle_t   *box)
{
  *box = layout->canal;
}

void
cw_canal_layout_get_legend_box (const CwCanalLayout *layout,
                                cairo_rectangle_t   *box)
{
  *box = layout->legend;
}
