/* cw-compare-drawing.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-renderer.h"
#include "cw-compare-drawing.h"
#include "cw-insertion.h"
#include "cw-plan-text.h"
#include "cw-render-text.h"

#define TITLE_SIZE 11.0
#define TABLE_SIZE 10.0

struct _CwCompareDrawing
{
  CwCanalResult *result;
  CwRules        rules;
  char          *basis;
};

static char *
basis_text (const CwCase  *kase,
            const CwCanal *canal,
            int            after)
{
  const CwStep *step;
  const CwInstrument *inst;
  g_autofree char *file = NULL, *depth = NULL;

  if (after < 0)
    return g_strdup (_("Each file as the first step, from the natural canal."));
  step = cw_canal_get_step (canal, (guint) after);
  inst = cw_case_find_instrument (kase, step->instrument_id);
  file = inst ? cw_plan_file_text (inst) : g_strdup (step->instrument_id);
  depth = cw_render_number (step->depth, 1);
  /* TRANSLATORS: step number, its file, its depth */
  return g_strdup_printf (_("Each file as the next step after step %d (%s to %s mm)."), after + 1, file, depth);
}

static CwCanalResult *
result_new (const CwCanal     *canal,
            const CwEvalState *state)
{
  CwCanalResult *result = g_new0 (CwCanalResult, 1);

  result->canal = canal;
  result->geometry = *cw_eval_state_geometry (state);
  result->findings = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_finding_free);
  result->steps = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_step_result_free);
  result->natural = cw_pwl_copy (cw_eval_state_envelope (state));
  result->apical_size = result->apical_taper = result->onset_diameter = result->time = NAN;
  return result;
}

CwCompareDrawing *
cw_compare_drawing_new (const CwCase       *kase,
                        const CwCanal      *canal,
                        int                 after,
                        const char * const *ids,
                        guint               n_ids,
                        double              depth)
{
  g_autoptr(CwEvalState) state = NULL;
  CwCompareDrawing *c;

  g_return_val_if_fail (kase != NULL && canal != NULL && (ids != NULL || n_ids == 0), NULL);

  if (after >= (int) cw_canal_get_n_steps (canal))
    after = (int) cw_canal_get_n_steps (canal) - 1;
  state = cw_insertion_state_before (kase, canal, after < 0 ? 0 : (guint) after + 1);
  c = g_new0 (CwCompareDrawing, 1);
  c->rules = kase->rules;
  c->basis = basis_text (kase, canal, after);
  c->result = result_new (canal, state);
  for (guint i = 0; i < n_ids && c->result->steps->len < CW_COMPARE_MAX; i++)
    {
      const CwInstrument *inst = cw_case_find_instrument (kase, ids[i]);
      CwStepResult *step;

      if (inst == NULL)
        continue;
      step = cw_insertion_evaluate (state, inst, depth);
      c->result->verdict = MAX (c->result->verdict, step->verdict);
      g_ptr_array_add (c->result->steps, step);
    }
  return c;
}

void
cw_compare_drawing_free (CwCompareDrawing *c)
{
  if (c == NULL)
    return;
  cw_canal_result_free (c->result);
  g_free (c->basis);
  g_free (c);
}

const CwCanalResult *
cw_compare_drawing_get_result (const CwCompareDrawing *c)
{
  return c->result;
}

const char *
cw_compare_drawing_get_basis (const CwCompareDrawing *c)
{
  return c->basis;
}

static double
row_height (const CwRenderStyle *style)
{
  return cw_render_text_height (style, TABLE_SIZE, CW_TEXT_REGULAR, "Ag", 0) * 1.35;
}

typedef enum
{
  UNIT_MM,
  UNIT_PERCENT,
  UNIT_AREA,
} Unit;

/* Each row a figure of the step result, read at its offset. */
static const struct
{
  const char *name;
  gsize       offset;
  int         decimals;
  Unit        unit;
} rows[] = {
  { N_("engaged in the curve"), G_STRUCT_OFFSET (CwStepResult, engaged_in_curve), 1, UNIT_MM },
  { N_("engaged in all"), G_STRUCT_OFFSET (CwStepResult, engaged_length), 1, UNIT_MM },
  { N_("widest in the curve"), G_STRUCT_OFFSET (CwStepResult, max_diameter_in_curve), 2, UNIT_MM },
  { N_("safe depth"), G_STRUCT_OFFSET (CwStepResult, ceiling_depth), 1, UNIT_MM },
  { N_("strain in the curve"), G_STRUCT_OFFSET (CwStepResult, strain), 1, UNIT_PERCENT },
  { N_("fatigue use"), G_STRUCT_OFFSET (CwStepResult, fatigue_use), 2, UNIT_PERCENT },
  { N_("wall in contact"), G_STRUCT_OFFSET (CwStepResult, contact_area), 1, UNIT_AREA },
  { N_("straight-part clearance"), G_STRUCT_OFFSET (CwStepResult, straight_clearance), 2, UNIT_MM },
};

static char *
figure_text (const CwStepResult *r,
             guint               row)
{
  double value = G_STRUCT_MEMBER (double, r, rows[row].offset);
  g_autofree char *number = NULL;

  if (rows[row].unit == UNIT_PERCENT)
    value *= 100;
  number = cw_render_number (value, rows[row].decimals);
  if (!isfinite (value))
    return g_steal_pointer (&number);
  if (rows[row].unit == UNIT_PERCENT)
    return g_strdup_printf (_("%s %%"), number);
  if (rows[row].unit == UNIT_AREA)
    return g_strdup_printf (_("%s mm²"), number);
  return g_strdup_printf (_("%s mm"), number);
}

/* The figures' rows, then the verdict's. */
#define N_ROWS (G_N_ELEMENTS (rows) + 1)

static double
table_height (const CwRenderStyle *style)
{
  return row_height (style) * (N_ROWS + 1);
}

static void
draw_row (cairo_t             *cr,
          const CwRenderStyle *style,
          const CwCanalResult *result,
          guint                row,
          double               x,
          double               y,
          double               first,
          double               column)
{
  const CwPalette *pal = cw_render_style_palette (style);
  double h = row_height (style);
  gboolean last = row + 1 == N_ROWS;

  if (row % 2 == 1)
    {
      cw_render_set_rgb (cr, &pal->stripe);
      cairo_rectangle (cr, x, y, first + column * result->steps->len, h);
      cairo_fill (cr);
    }
  cw_render_set_rgb (cr, &pal->muted);
  cw_render_text_line (cr, style, TABLE_SIZE, CW_TEXT_REGULAR, last ? _("verdict") : _(rows[row].name),
                       x + h * 0.3, y + h / 2, CW_ALIGN_START, CW_ALIGN_CENTER);
  for (guint i = 0; i < result->steps->len; i++)
    {
      const CwStepResult *r = cw_canal_result_get_step (result, i);
      g_autofree char *text = last ? g_strdup (cw_render_level_name (r->verdict)) : figure_text (r, row);

      cw_render_set_rgb (cr, last ? &pal->level[r->verdict] : &pal->ink);
      cw_render_text_line (cr, style, TABLE_SIZE, CW_TEXT_BOLD, text, x + first + column * (i + 0.5), y + h / 2,
                           CW_ALIGN_CENTER, CW_ALIGN_CENTER);
    }
}

/* The files' names over their columns, each with its ISO colour. */
static void
draw_header (cairo_t             *cr,
             const CwRenderStyle *style,
             const CwCanalResult *result,
             double               x,
             double               y,
             double               column)
{
  const CwPalette *pal = cw_render_style_palette (style);
  double h = row_height (style), box = h * 0.55;

  for (guint i = 0; i < result->steps->len; i++)
    {
      const CwStepResult *r = cw_canal_result_get_step (result, i);
      g_autofree char *name = cw_render_file_name (r->instrument);
      CwRgb fill = cw_render_handle_rgb (r->instrument->tip);
      double cx = x + column * (i + 0.5), w;
      g_autoptr(PangoLayout) text = cw_render_text_layout (style, TABLE_SIZE, CW_TEXT_BOLD, name);

      cw_render_text_size (text, &w, NULL);
      cairo_rectangle (cr, cx - (w + box * 1.4) / 2, y + (h - box) / 2, box, box);
      cw_render_set_rgb (cr, &fill);
      cairo_fill_preserve (cr);
      cw_render_set_rgb (cr, &pal->file_outline);
      cairo_set_line_width (cr, cw_render_style_line (style, 0.6));
      cairo_stroke (cr);
      cw_render_set_rgb (cr, &pal->ink);
      cw_render_text_draw (cr, text, cx - (w + box * 1.4) / 2 + box * 1.4, y + h / 2, CW_ALIGN_START,
                           CW_ALIGN_CENTER);
    }
}

static void
draw_table (cairo_t             *cr,
            const CwRenderStyle *style,
            const CwCanalResult *result,
            double               x,
            double               y,
            double               width)
{
  double first = width * 0.28, column = (width - first) / MAX (result->steps->len, 1);
  double h = row_height (style);

  draw_header (cr, style, result, x + first, y, column);
  for (guint row = 0; row < N_ROWS; row++)
    draw_row (cr, style, result, row, x, y + (row + 1) * h, first, column);
}

static void
draw_title (cairo_t             *cr,
            const CwRenderStyle *style,
            const CwStepResult  *step,
            double               x,
            double               y,
            double               width)
{
  const CwPalette *pal = cw_render_style_palette (style);
  g_autofree char *name = cw_plan_file_text (step->instrument);
  g_autofree char *depth = cw_render_number (step->depth, 1);
  g_autofree char *text = g_strdup_printf (_("%s · %s mm"), name, depth);
  g_autoptr(PangoLayout) layout = cw_render_text_layout (style, TITLE_SIZE, CW_TEXT_BOLD, text);
  CwRgb fill = cw_render_handle_rgb (step->instrument->tip);
  double box = cw_render_style_font (style, TITLE_SIZE);

  cairo_rectangle (cr, x, y, box, box);
  cw_render_set_rgb (cr, &fill);
  cairo_fill_preserve (cr);
  cw_render_set_rgb (cr, &pal->file_outline);
  cairo_set_line_width (cr, cw_render_style_line (style, 0.8));
  cairo_stroke (cr);
  pango_layout_set_width (layout, (int) ((width - box * 1.5) * PANGO_SCALE));
  pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_END);
  cw_render_set_rgb (cr, &pal->ink);
  cw_render_text_draw (cr, layout, x + box * 1.5, y, CW_ALIGN_START, CW_ALIGN_START);
}

static void
draw_panels (const CwCompareDrawing  *c,
             cairo_t                 *cr,
             const cairo_rectangle_t *box,
             const CwRenderStyle     *style)
{
  const CwCanalResult *result = c->result;
  guint n = MAX (result->steps->len, 1);
  double gap = cw_render_style_font (style, 10), title = cw_render_style_font (style, TITLE_SIZE) * 2;
  double width = (box->width - gap * (n - 1)) / n;
  cairo_rectangle_t panel = { box->x, box->y + title, width, box->height - title };
  /* One layout for every panel: the same scale, so widths compare. */
  g_autoptr(CwCanalLayout) layout = cw_canal_layout_new (result->canal, result, style, &panel,
                                                         CW_CANAL_LAYOUT_COMPACT | CW_CANAL_LAYOUT_SCALE);
  CwCanalDrawOptions options;

  cw_canal_draw_options_init (&options);
  options.overlays = CW_OVERLAY_ENGAGED | CW_OVERLAY_STRAIN;
  options.rules = &c->rules;
  options.hide_notes = TRUE;
  for (guint i = 0; i < result->steps->len; i++)
    {
      cairo_save (cr);
      cairo_translate (cr, i * (width + gap), 0);
      options.partial = cw_canal_result_get_step (result, i);
      draw_title (cr, style, options.partial, box->x, box->y, width);
      cw_canal_draw_full (cr, layout, result, 0, &options);
      cairo_restore (cr);
    }
}

void
cw_compare_drawing_draw (const CwCompareDrawing  *c,
                         cairo_t                 *cr,
                         const cairo_rectangle_t *area,
                         const CwRenderStyle     *style)
{
  const CwPalette *pal = cw_render_style_palette (style);
  double pad = cw_render_style_font (style, 10), line;
  double table = table_height (style);
  cairo_rectangle_t box;

  g_return_if_fail (c != NULL && cr != NULL && area != NULL && style != NULL);

  line = cw_render_text_height (style, TITLE_SIZE, CW_TEXT_REGULAR, "Ag", 0);
  box = (cairo_rectangle_t) { area->x + pad, area->y + pad + line * 1.5, area->width - 2 * pad,
                              area->height - 3 * pad - table - line * 1.5 };
  cairo_save (cr);
  cw_render_set_rgb (cr, &pal->background);
  cairo_rectangle (cr, area->x, area->y, area->width, area->height);
  cairo_fill (cr);
  cw_render_set_rgb (cr, &pal->muted);
  cw_render_text_line (cr, style, TITLE_SIZE, CW_TEXT_REGULAR, c->basis, area->x + pad, area->y + pad,
                       CW_ALIGN_START, CW_ALIGN_START);
  if (c->result->steps->len > 0 && box.height > 20)
    draw_panels (c, cr, &box, style);
  draw_table (cr, style, c->result, area->x + pad, area->y + area->height - pad - table, area->width - 2 * pad);
  cairo_restore (cr);
}
