/* cw-canal-marks.c: zone marks, the ceiling line and the scale bar
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-layout-private.h"
#include "cw-render-text.h"

static void
mark_clear (gpointer data)
{
  g_free (((CwCanalMark *) data)->label);
}

static void
add_mark (GArray     *marks,
          double      s,
          const char *name,
          gboolean    major,
          gboolean    labelled)
{
  g_autofree char *depth = cw_render_number (s, 1);
  CwCanalMark mark = { s, NULL, major };

  if (labelled)
    mark.label = g_strdup_printf (_("%s %s mm"), name, depth);
  else if (major)
    mark.label = g_strdup (name);
  g_array_append_val (marks, mark);
}

static void
add_curve_marks (GArray              *marks,
                 const CwCanalLayout *layout,
                 gboolean             labelled)
{
  const CwGeometry *g = &layout->geometry;

  for (guint i = 0; i < g->n_curves; i++)
    {
      g_autofree char *onset = g->n_curves > 1 ? g_strdup_printf (_("onset %u"), i + 1)
                                               : g_strdup (_("curve onset"));
      g_autofree char *end = g->n_curves > 1 ? g_strdup_printf (_("curve end %u"), i + 1)
                                             : g_strdup (_("curve end"));

      add_mark (marks, g->onset[i], onset, FALSE, labelled);
      /* A curve that runs to the working length ends at its mark. */
      if (fabs (g->end[i] - layout->working_length) > 0.05)
        add_mark (marks, g->end[i], end, FALSE, labelled);
    }
}

/* In depth order; a small multiple labels only the working length. */
GArray *
cw_canal_marks_collect (const CwCanalLayout *layout)
{
  GArray *marks = g_array_new (FALSE, TRUE, sizeof (CwCanalMark));
  gboolean labelled = (layout->flags & CW_CANAL_LAYOUT_LABELS) != 0;

  g_array_set_clear_func (marks, mark_clear);
  /* A small multiple has no room to say what a tick at the top would be. */
  if (labelled)
    add_mark (marks, 0, _("reference"), FALSE, labelled);
  add_mark (marks, layout->orifice, _("orifice"), FALSE, labelled);
  add_curve_marks (marks, layout, labelled);
  add_mark (marks, layout->working_length, _("WL"), TRUE, labelled);
  return marks;
}

/* How far a tick reaches out of the wall, in true mm across the canal. */
static double
tick_reach (const CwCanalLayout *layout)
{
  return cw_render_style_font (&layout->style, 6) / (layout->scale * layout->width_factor);
}

/* Where a mark's tick ends, left of the wall, in device units. */
static void
tick (const CwCanalLayout *layout,
      const CwPwl         *walls,
      double               s,
      double              *x0,
      double              *y0,
      double              *x1,
      double              *y1)
{
  double half = cw_pwl_eval (walls, MAX (s, layout->orifice)) / 2;

  cw_canal_layout_to_device (layout, s, -half, x0, y0);
  cw_canal_layout_to_device (layout, s, -half - tick_reach (layout), x1, y1);
}

/* Labels keep their depth order and at least one line apart. */
static void
spread (double *y,
        guint   n,
        double  line,
        double  bottom)
{
  for (guint i = 1; i < n; i++)
    y[i] = MAX (y[i], y[i - 1] + line);
  if (n > 0 && y[n - 1] > bottom)
    y[n - 1] = bottom;
  for (guint i = n - 1; i > 0; i--)
    y[i - 1] = MIN (y[i - 1], y[i] - line);
}

static void
draw_labels (cairo_t             *cr,
             const CwCanalLayout *layout,
             GArray              *marks,
             const double        *ends)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  double size = layout->flags & CW_CANAL_LAYOUT_LABELS ? CW_LABEL_SIZE : CW_SMALL_SIZE;
  double line = cw_render_text_height (&layout->style, size, CW_TEXT_REGULAR, "Ag", 0) * 1.05;
  double right = layout->canal.x - layout->leader;
  g_autofree double *y = g_new (double, marks->len);
  guint n = 0;

  for (guint i = 0; i < marks->len; i++)
    if (g_array_index (marks, CwCanalMark, i).label)
      y[n++] = ends[2 * i + 1];
  spread (y, n, line, layout->area.y + layout->area.height - line / 2);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.5));
  for (guint i = 0, k = 0; i < marks->len; i++)
    {
      const CwCanalMark *m = &g_array_index (marks, CwCanalMark, i);

      if (m->label == NULL)
        continue;
      cw_render_set_rgb (cr, &pal->mark);
      cairo_move_to (cr, ends[2 * i], ends[2 * i + 1]);
      cairo_line_to (cr, right + cw_render_style_font (&layout->style, 2), y[k]);
      cairo_stroke (cr);
      cw_render_set_rgb (cr, m->major ? &pal->ink : &pal->muted);
      cw_render_text_line (cr, &layout->style, size, m->major ? CW_TEXT_BOLD : CW_TEXT_REGULAR,
                           m->label, right, y[k++], CW_ALIGN_END, CW_ALIGN_CENTER);
    }
}

static void
draw_tick (cairo_t             *cr,
           const CwCanalLayout *layout,
           const CwPwl         *walls,
           const CwCanalMark   *m,
           double              *end)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  double x0, y0, x1, y1;

  tick (layout, walls, m->s, &x0, &y0, &x1, &y1);
  cw_render_set_rgb (cr, m->major ? &pal->ink : &pal->mark);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, m->major ? 1.4 : 0.8));
  cairo_move_to (cr, x1, y1);
  if (m->major)
    {
      /* The working length crosses the canal: it is the line that matters. */
      double half = cw_pwl_eval (walls, m->s) / 2, x2, y2;

      cw_canal_layout_to_device (layout, m->s, half + tick_reach (layout), &x2, &y2);
      cairo_line_to (cr, x2, y2);
    }
  else
    cairo_line_to (cr, x0, y0);
  cairo_stroke (cr);
  end[0] = x1;
  end[1] = y1;
}

void
cw_canal_marks_draw (cairo_t             *cr,
                     const CwCanalLayout *layout,
                     const CwPwl         *walls)
{
  g_autoptr(GArray) marks = cw_canal_marks_collect (layout);
  g_autofree double *ends = g_new (double, 2 * marks->len);

  cairo_save (cr);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  for (guint i = 0; i < marks->len; i++)
    draw_tick (cr, layout, walls, &g_array_index (marks, CwCanalMark, i), &ends[2 * i]);
  draw_labels (cr, layout, marks, ends);
  cairo_restore (cr);
}

double
cw_canal_ceiling_label_width (const CwRenderStyle *style,
                              CwCanalLayoutFlags   flags)
{
  if (flags & CW_CANAL_LAYOUT_LABELS)
    return cw_render_text_height (style, CW_LABEL_SIZE, CW_TEXT_REGULAR, "Ag", 0) * 5.2;
  return cw_render_text_height (style, CW_SMALL_SIZE, CW_TEXT_REGULAR, "Ag", 0) * 3.0;
}

/* Across the walls and the file where the line crosses them, and a little
 * more. */
static double
ceiling_reach (const CwCanalLayout *layout,
               const CwStepResult  *step,
               const CwPwl         *walls,
               double               s)
{
  g_autoptr(CwPwl) file = cw_canal_file_diameter (step, layout->s_top);
  double half = cw_pwl_eval (walls, MAX (s, layout->orifice)) / 2;

  if (s <= step->depth)
    half = MAX (half, cw_pwl_eval (file, s) / 2);
  return half + 1.5 * tick_reach (layout);
}

/* The deepest the tip may go before the file's widest part in the curve
 * passes the ceiling: a dashed line across the canal, named on the right. */
void
cw_canal_ceiling_draw (cairo_t             *cr,
                       const CwCanalLayout *layout,
                       const CwStepResult  *step,
                       const CwPwl         *walls)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  double s = step->ceiling_depth, reach;
  double dashes[] = { cw_render_style_line (&layout->style, 4), cw_render_style_line (&layout->style, 2) };
  g_autofree char *depth = cw_render_number (s, 1);
  g_autofree char *text = NULL;
  double x0, y0, x1, y1;

  if (!isfinite (s) || s < layout->s_top || s > layout->s_end)
    return;
  reach = ceiling_reach (layout, step, walls, s);
  text = layout->flags & CW_CANAL_LAYOUT_LABELS ? g_strdup_printf (_("ceiling %s mm"), depth)
                                                : g_strdup (_("ceiling"));
  cw_canal_layout_to_device (layout, s, -reach, &x0, &y0);
  cw_canal_layout_to_device (layout, s, reach, &x1, &y1);
  cairo_save (cr);
  cairo_move_to (cr, x0, y0);
  cairo_line_to (cr, x1, y1);
  /* A halo in the background colour keeps the line clear of the hatch. */
  cw_render_set_rgb (cr, &pal->background);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 3.2));
  cairo_stroke_preserve (cr);
  cw_render_set_rgb (cr, &pal->ceiling);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 1.3));
  cairo_set_dash (cr, dashes, 2, 0);
  cairo_stroke (cr);
  cw_render_text_line (cr, &layout->style,
                       layout->flags & CW_CANAL_LAYOUT_LABELS ? CW_LABEL_SIZE : CW_SMALL_SIZE,
                       CW_TEXT_REGULAR, text, x1 + cw_render_style_font (&layout->style, 2), y1,
                       CW_ALIGN_START, CW_ALIGN_CENTER);
  cairo_restore (cr);
}

/* The longest round length (1, 2, 5, 10 or 20 mm) that fits the room. */
static double
bar_length (const CwCanalLayout *layout,
            double               room)
{
  static const double lengths[] = { 20, 10, 5, 2, 1 };

  for (guint i = 0; i < G_N_ELEMENTS (lengths); i++)
    if (lengths[i] * layout->scale <= room)
      return lengths[i];
  return 1;
}

void
cw_canal_scale_bar_draw (cairo_t             *cr,
                         const CwCanalLayout *layout)
{
  const CwPalette *pal = cw_render_style_palette (&layout->style);
  const cairo_rectangle_t *r = &layout->scale_bar;
  double mm = bar_length (layout, MAX (layout->canal.width, r->width * 0.3));
  double x = MAX (r->x, layout->canal.x), y = r->y + cw_render_style_font (&layout->style, 2);
  double h = cw_render_style_font (&layout->style, 3);
  g_autofree char *length = cw_render_number (mm, 0);
  g_autofree char *factor = cw_render_number (layout->width_factor, 0);
  g_autofree char *text = g_strdup_printf (_("%s mm · widths ×%s"), length, factor);

  cairo_save (cr);
  cw_render_set_rgb (cr, &pal->ink);
  cairo_set_line_width (cr, cw_render_style_line (&layout->style, 0.8));
  cairo_move_to (cr, x, y + h);
  cairo_line_to (cr, x + mm * layout->scale, y + h);
  for (int i = 0; i <= (int) mm; i += mm > 5 ? 5 : 1)
    {
      cairo_move_to (cr, x + i * layout->scale, y);
      cairo_line_to (cr, x + i * layout->scale, y + h);
    }
  cairo_stroke (cr);
  cw_render_text_line (cr, &layout->style, CW_LABEL_SIZE, CW_TEXT_REGULAR, text,
                       x, y + h + cw_render_style_font (&layout->style, 1.5), CW_ALIGN_START, CW_ALIGN_START);
  cairo_restore (cr);
}
