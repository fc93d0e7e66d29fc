/* cw-step-panels.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-renderer.h"
#include "cw-plan-text.h"
#include "cw-render-text.h"
#include "cw-step-panels.h"

#define TITLE_SIZE 7.5
#define MIN_PANEL_WIDTH 104.0
#define MAX_PANEL_WIDTH 150.0

typedef struct
{
  const CwCanalResult *result;
  CwRenderStyle        style;
  guint                columns;
  double               panel_width;
  double               title_height;
  double               canal_height;
  double               gap;
} Panels;

static double
line_height (const Panels *p)
{
  return cw_render_text_height (&p->style, TITLE_SIZE, CW_TEXT_BOLD, "Ag", 0);
}

static void
fit (Panels *p,
     double  width)
{
  guint n = MAX (p->result->steps->len, 1);
  double aspect = cw_canal_layout_aspect (p->result->canal, p->result);
  double min_w = cw_render_style_font (&p->style, MIN_PANEL_WIDTH);

  p->gap = cw_render_style_font (&p->style, 6);
  p->columns = CLAMP ((guint) floor ((width + p->gap) / (min_w + p->gap)), 1, n);
  p->panel_width = MIN ((width - (p->columns - 1) * p->gap) / p->columns,
                        cw_render_style_font (&p->style, MAX_PANEL_WIDTH));
  p->title_height = 3 * line_height (p) + cw_render_style_font (&p->style, 4);
  /* The canal takes about half the panel's width; its labels the rest. */
  p->canal_height = CLAMP (p->panel_width * 0.55 * aspect,
                           cw_render_style_font (&p->style, 130),
                           cw_render_style_font (&p->style, 300));
}

static void
draw_title (cairo_t            *cr,
            const Panels       *p,
            const CwStepResult *r,
            double              x,
            double              y)
{
  const CwPalette *pal = cw_render_style_palette (&p->style);
  double inner = p->panel_width - cw_render_style_font (&p->style, 8);
  double line = line_height (p), mark = cw_render_style_font (&p->style, 7);
  g_autofree char *name = cw_render_file_name (r->instrument);
  g_autofree char *depth = cw_render_number (r->depth, 1);
  g_autofree char *head = g_strdup_printf (_("%u · %s · %s mm"), r->index, name, depth);
  g_autoptr(PangoLayout) label = cw_render_text_layout (&p->style, TITLE_SIZE, CW_TEXT_REGULAR,
                                                        r->instrument->label ? r->instrument->label : "");

  x += cw_render_style_font (&p->style, 4);
  y += cw_render_style_font (&p->style, 3);
  cw_render_set_rgb (cr, &pal->ink);
  cw_render_text_line (cr, &p->style, TITLE_SIZE, CW_TEXT_BOLD, head, x, y, CW_ALIGN_START, CW_ALIGN_START);
  pango_layout_set_width (label, (int) (inner * PANGO_SCALE));
  pango_layout_set_ellipsize (label, PANGO_ELLIPSIZE_END);
  cw_render_set_rgb (cr, &pal->muted);
  cw_render_text_draw (cr, label, x, y + line, CW_ALIGN_START, CW_ALIGN_START);
  cw_render_level_mark (cr, &p->style, r->verdict, x + mark / 2, y + 2.5 * line, mark);
  cw_render_set_rgb (cr, &pal->ink);
  cw_render_text_line (cr, &p->style, TITLE_SIZE, r->verdict == CW_LEVEL_OK ? CW_TEXT_REGULAR : CW_TEXT_BOLD,
                       cw_render_level_name (r->verdict), x + mark * 1.4, y + 2 * line,
                       CW_ALIGN_START, CW_ALIGN_START);
}

static void
draw_panel (cairo_t      *cr,
            const Panels *p,
            guint         step,
            double        x,
            double        y)
{
  const CwPalette *pal = cw_render_style_palette (&p->style);
  cairo_rectangle_t area = { x, y + p->title_height, p->panel_width, p->canal_height };
  g_autoptr(CwCanalLayout) layout = cw_canal_layout_new (p->result->canal, p->result, &p->style,
                                                         &area, CW_CANAL_LAYOUT_COMPACT);

  cw_canal_draw (cr, layout, p->result, (int) step);
  draw_title (cr, p, cw_canal_result_get_step (p->result, step), x, y);
  cw_render_set_rgb (cr, &pal->rule);
  cairo_set_line_width (cr, cw_render_style_line (&p->style, 0.5));
  cairo_rectangle (cr, x, y, p->panel_width, p->title_height + p->canal_height);
  cairo_stroke (cr);
}

static void
draw_row (cairo_t  *cr,
          gpointer  data,
          guint     index,
          double    x,
          double    y,
          double    width)
{
  const Panels *p = data;
  guint first = index * p->columns;

  for (guint i = first; i < MIN (first + p->columns, p->result->steps->len); i++)
    draw_panel (cr, p, i, x + (i - first) * (p->panel_width + p->gap), y);
}

void
cw_step_panels_add_blocks (CwBlockList         *list,
                           const CwCanalResult *result,
                           const CwRenderStyle *style)
{
  Panels *p = g_new0 (Panels, 1);
  guint rows;

  g_return_if_fail (list != NULL && result != NULL && style != NULL);

  p->result = result;
  p->style = *style;
  fit (p, cw_block_list_width (list));
  cw_block_list_own (list, p, g_free);
  rows = (result->steps->len + p->columns - 1) / p->columns;
  for (guint r = 0; r < rows; r++)
    cw_block_list_add (list, p->title_height + p->canal_height, draw_row, p, r)->space_before = p->gap;
}
