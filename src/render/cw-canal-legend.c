/* cw-canal-legend.c: the verdict and findings under the canal drawing
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-layout-private.h"
#include "cw-plan-text.h"
#include "cw-render-text.h"

static void
line_free (gpointer data)
{
  CwLegendLine *line = data;

  g_free (line->text);
  g_free (line);
}

static void
add_line (GPtrArray *lines,
          CwLevel    level,
          gboolean   heading,
          char      *text)
{
  CwLegendLine *line = g_new0 (CwLegendLine, 1);

  line->level = level;
  line->heading = heading;
  line->text = text;
  g_ptr_array_add (lines, line);
}

static void
add_findings (GPtrArray *lines,
              GPtrArray *findings)
{
  for (guint i = 0; i < findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (findings, i);

      add_line (lines, f->level, FALSE, cw_finding_describe (f, FALSE));
    }
}

static char *
step_heading (const CwCanalResult *result,
              const CwStepResult  *step)
{
  g_autofree char *file = cw_plan_file_text (step->instrument);
  g_autofree char *depth = cw_render_number (step->depth, 1);

  /* TRANSLATORS: step number, count of steps, file, depth, verdict */
  return g_strdup_printf (_("Step %u of %u: %s to %s mm — %s"), step->index,
                          result->steps->len, file, depth, cw_render_level_name (step->verdict));
}

static char *
final_heading (const CwCanalResult *result)
{
  g_autofree char *size = cw_render_number (result->apical_size, 0);
  g_autofree char *taper = cw_render_taper (result->apical_taper);

  if (!isfinite (result->apical_size))
    return g_strdup_printf (_("Prepared shape after %u steps: no file at the working length — %s"),
                            result->steps->len, cw_render_level_name (result->verdict));
  return g_strdup_printf (_("Prepared shape after %u steps: apical size %s, apical taper %s — %s"),
                          result->steps->len, size, taper, cw_render_level_name (result->verdict));
}

/* The step's heading and findings; with no step, the final shape and the
 * canal's own findings. */
GPtrArray *
cw_canal_legend_lines (const CwCanalResult *result,
                       int                  step)
{
  GPtrArray *lines = g_ptr_array_new_with_free_func (line_free);

  if (step >= 0 && (guint) step < result->steps->len)
    {
      const CwStepResult *r = cw_canal_result_get_step (result, step);

      add_line (lines, r->verdict, TRUE, step_heading (result, r));
      add_findings (lines, r->findings);
    }
  else
    {
      add_line (lines, result->verdict, TRUE, final_heading (result));
      add_findings (lines, result->findings);
    }
  return lines;
}

static double
indent (const CwRenderStyle *style)
{
  return cw_render_style_font (style, 13);
}

double
cw_canal_legend_height (const CwRenderStyle *style,
                        GPtrArray           *lines,
                        double               width)
{
  double height = 0;

  for (guint i = 0; i < lines->len; i++)
    {
      const CwLegendLine *line = g_ptr_array_index (lines, i);

      height += cw_render_text_height (style, CW_LEGEND_SIZE,
                                       line->heading ? CW_TEXT_BOLD : CW_TEXT_REGULAR,
                                       line->text, width - indent (style));
      height += cw_render_style_font (style, 1.5);
    }
  return height;
}

void
cw_canal_legend_draw (cairo_t             *cr,
                      const CwCanalLayout *layout,
                      const CwCanalResult *result,
                      int                  step)
{
  const CwRenderStyle *st = &layout->style;
  const cairo_rectangle_t *box = &layout->legend;
  g_autoptr(GPtrArray) lines = cw_canal_legend_lines (result, step);
  double y = box->y, mark = cw_render_style_font (st, 8);

  cairo_save (cr);
  cairo_rectangle (cr, box->x, box->y, box->width, box->height + 1);
  cairo_clip (cr);
  for (guint i = 0; i < lines->len; i++)
    {
      const CwLegendLine *line = g_ptr_array_index (lines, i);
      g_autoptr(PangoLayout) text = cw_render_text_wrapped (st, CW_LEGEND_SIZE,
                                                            line->heading ? CW_TEXT_BOLD : CW_TEXT_REGULAR,
                                                            line->text, box->width - indent (st));
      double first = cw_render_text_height (st, CW_LEGEND_SIZE, CW_TEXT_REGULAR, "Ag", 0);
      double h;

      cw_render_level_mark (cr, st, line->level, box->x + mark * 0.7, y + first / 2, mark);
      cw_render_set_rgb (cr, &cw_render_style_palette (st)->ink);
      cw_render_text_draw (cr, text, box->x + indent (st), y, CW_ALIGN_START, CW_ALIGN_START);
      cw_render_text_size (text, NULL, &h);
      y += h + cw_render_style_font (st, 1.5);
    }
  cairo_restore (cr);
}
