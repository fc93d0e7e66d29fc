/* cw-step-table.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-plan-text.h"
#include "cw-render-text.h"
#include "cw-step-table.h"

#define N_COLUMNS 9
#define CELL_SIZE 7.5
#define HEAD_SIZE 7.0

typedef struct
{
  const char *title;
  double      share;     /* of the table's width */
  gboolean    numeric;
} Column;

static const Column columns[N_COLUMNS] = {
  { N_("#"), 0.04, TRUE },
  { N_("File"), 0.27, FALSE },
  { N_("Depth\nmm"), 0.08, TRUE },
  { N_("Engaged in curve\nmm"), 0.11, TRUE },
  { N_("Largest Ø in curve / ceiling\nmm"), 0.15, TRUE },
  { N_("Straight clearance\nmm"), 0.11, TRUE },
  { N_("Strain\n%"), 0.07, TRUE },
  { N_("Time\ns"), 0.06, TRUE },
  { N_("Verdict"), 0.11, FALSE },
};

typedef struct
{
  const CwCanalResult *result;
  CwRenderStyle        style;
  double               width;
  GPtrArray           *cells;     /* N_COLUMNS strings a row */
  GArray              *heights;   /* of each row's figures */
} Table;

static void
table_free (gpointer data)
{
  Table *t = data;

  g_ptr_array_unref (t->cells);
  g_array_unref (t->heights);
  g_free (t);
}

static double
pad (const Table *t)
{
  return cw_render_style_font (&t->style, 2.5);
}

static double
column_x (const Table *t,
          guint        column)
{
  double share = 0;

  for (guint i = 0; i < column; i++)
    share += columns[i].share;
  return share * t->width;
}

static PangoLayout *
cell_layout (const Table *t,
             guint        column,
             const char  *text,
             CwTextFlags  flags,
             double       size)
{
  double w = columns[column].share * t->width - 2 * pad (t);
  PangoLayout *layout = cw_render_text_wrapped (&t->style, size, flags, text, w);

  if (columns[column].numeric)
    pango_layout_set_alignment (layout, PANGO_ALIGN_RIGHT);
  return layout;
}

static char *
pair (double a,
      double b)
{
  g_autofree char *x = cw_render_number (a, 3);
  g_autofree char *y = cw_render_number (b, 2);

  if (!isfinite (a))
    return g_strdup ("–");
  return g_strdup_printf ("%s / %s", x, y);
}

static void
add_cells (Table              *t,
           const CwStepResult *r)
{
  g_ptr_array_add (t->cells, g_strdup_printf ("%u", r->index));
  g_ptr_array_add (t->cells, cw_plan_file_text (r->instrument));
  g_ptr_array_add (t->cells, cw_render_number (r->depth, 1));
  /* A straight canal has no curve to be engaged in. */
  g_ptr_array_add (t->cells, cw_render_number (t->result->geometry.n_curves > 0 ? r->engaged_in_curve : NAN, 2));
  g_ptr_array_add (t->cells, pair (r->max_diameter_in_curve, r->ceiling));
  g_ptr_array_add (t->cells, cw_render_number (r->straight_clearance, 2));
  g_ptr_array_add (t->cells, cw_render_number (r->strain * 100, 2));
  g_ptr_array_add (t->cells, cw_render_number (r->time, 0));
  g_ptr_array_add (t->cells, g_strdup (cw_render_level_name (r->verdict)));
}

static double
cells_height (const Table *t,
              guint        row)
{
  double tallest = 0;

  for (guint c = 0; c < N_COLUMNS; c++)
    {
      const char *text = g_ptr_array_index (t->cells, row * N_COLUMNS + c);
      g_autoptr(PangoLayout) layout = cell_layout (t, c, text, CW_TEXT_REGULAR, CELL_SIZE);
      double h;

      cw_render_text_size (layout, NULL, &h);
      tallest = MAX (tallest, h);
    }
  return tallest + 2 * pad (t);
}

static double
findings_indent (const Table *t)
{
  return column_x (t, 1) + pad (t);
}

static double
findings_height (const Table        *t,
                 const CwStepResult *r)
{
  double h = 0;

  for (guint i = 0; i < r->findings->len; i++)
    {
      g_autofree char *text = cw_finding_describe (g_ptr_array_index (r->findings, i), FALSE);

      h += cw_render_text_height (&t->style, CELL_SIZE, CW_TEXT_REGULAR, text,
                                  t->width - findings_indent (t) - pad (t))
           + cw_render_style_font (&t->style, 1);
    }
  return h > 0 ? h + pad (t) : 0;
}

static char *
caption (const Table *t)
{
  return g_strdup_printf (_("Steps of canal %s"), t->result->canal->name);
}

static double
caption_height (const Table *t)
{
  g_autofree char *text = caption (t);

  return cw_render_text_height (&t->style, CELL_SIZE, CW_TEXT_BOLD, text, 0);
}

/* The caption names the canal, so that a table run on to the next page
 * still says whose steps these are. */
static double
head_height (const Table *t)
{
  double tallest = 0;

  for (guint c = 0; c < N_COLUMNS; c++)
    {
      g_autoptr(PangoLayout) layout = cell_layout (t, c, _(columns[c].title), CW_TEXT_BOLD, HEAD_SIZE);
      double h;

      cw_render_text_size (layout, NULL, &h);
      tallest = MAX (tallest, h);
    }
  return caption_height (t) + tallest + 2 * pad (t);
}

static void
rule (cairo_t     *cr,
      const Table *t,
      double       x,
      double       y,
      double       width)
{
  cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->rule);
  cairo_set_line_width (cr, cw_render_style_line (&t->style, width));
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, x + t->width, y);
  cairo_stroke (cr);
}

/* Column heads sit at the foot of their cell, over a heavier rule. */
static void
draw_head (cairo_t  *cr,
           gpointer  data,
           guint     index,
           double    x,
           double    y,
           double    width)
{
  Table *t = data;
  double h = head_height (t);
  g_autofree char *text = caption (t);

  cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->ink);
  cw_render_text_line (cr, &t->style, CELL_SIZE, CW_TEXT_BOLD, text, x + pad (t), y,
                       CW_ALIGN_START, CW_ALIGN_START);
  for (guint c = 0; c < N_COLUMNS; c++)
    {
      g_autoptr(PangoLayout) layout = cell_layout (t, c, _(columns[c].title), CW_TEXT_BOLD, HEAD_SIZE);

      cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->ink);
      cw_render_text_draw (cr, layout, x + column_x (t, c) + pad (t), y + h - pad (t),
                           CW_ALIGN_START, CW_ALIGN_END);
    }
  rule (cr, t, x, y + h, 1.0);
}

static void
draw_verdict (cairo_t            *cr,
              const Table        *t,
              const CwStepResult *r,
              double              x,
              double              y)
{
  double size = cw_render_style_font (&t->style, 6.5);
  double line = cw_render_text_height (&t->style, CELL_SIZE, CW_TEXT_REGULAR, "Ag", 0);

  cw_render_level_mark (cr, &t->style, r->verdict, x + size / 2, y + line / 2, size);
  cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->ink);
  cw_render_text_line (cr, &t->style, CELL_SIZE, r->verdict == CW_LEVEL_OK ? CW_TEXT_REGULAR : CW_TEXT_BOLD,
                       cw_render_level_name (r->verdict), x + size * 1.5, y,
                       CW_ALIGN_START, CW_ALIGN_START);
}

static void
draw_cells (cairo_t            *cr,
            const Table        *t,
            const CwStepResult *r,
            double              x,
            double              y)
{
  guint row = r->index - 1;

  cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->ink);
  for (guint c = 0; c + 1 < N_COLUMNS; c++)
    {
      const char *text = g_ptr_array_index (t->cells, row * N_COLUMNS + c);
      g_autoptr(PangoLayout) layout = cell_layout (t, c, text, CW_TEXT_REGULAR, CELL_SIZE);

      cw_render_text_draw (cr, layout, x + column_x (t, c) + pad (t), y + pad (t),
                           CW_ALIGN_START, CW_ALIGN_START);
    }
  draw_verdict (cr, t, r, x + column_x (t, N_COLUMNS - 1) + pad (t), y + pad (t));
}

static void
draw_findings (cairo_t            *cr,
               const Table        *t,
               const CwStepResult *r,
               double              x,
               double              y)
{
  double size = cw_render_style_font (&t->style, 6.5);
  double line = cw_render_text_height (&t->style, CELL_SIZE, CW_TEXT_REGULAR, "Ag", 0);
  double left = x + findings_indent (t);

  for (guint i = 0; i < r->findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (r->findings, i);
      g_autofree char *text = cw_finding_describe (f, FALSE);
      g_autoptr(PangoLayout) layout = cw_render_text_wrapped (&t->style, CELL_SIZE, CW_TEXT_REGULAR, text,
                                                              t->width - findings_indent (t) - pad (t) - size * 1.6);
      double h;

      cw_render_level_mark (cr, &t->style, f->level, left + size / 2, y + line / 2, size);
      cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->ink);
      cw_render_text_draw (cr, layout, left + size * 1.6, y, CW_ALIGN_START, CW_ALIGN_START);
      cw_render_text_size (layout, NULL, &h);
      y += h + cw_render_style_font (&t->style, 1);
    }
}

static void
draw_row (cairo_t  *cr,
          gpointer  data,
          guint     index,
          double    x,
          double    y,
          double    width)
{
  Table *t = data;
  const CwStepResult *r = cw_canal_result_get_step (t->result, index);
  double cells = g_array_index (t->heights, double, index);
  double total = cells + findings_height (t, r);

  if (index % 2 == 1)
    {
      cw_render_set_rgb (cr, &cw_render_style_palette (&t->style)->stripe);
      cairo_rectangle (cr, x, y, t->width, total);
      cairo_fill (cr);
    }
  draw_cells (cr, t, r, x, y);
  draw_findings (cr, t, r, x, y + cells);
  rule (cr, t, x, y + total, 0.4);
}

void
cw_step_table_add_blocks (CwBlockList         *list,
                          const CwCanalResult *result,
                          const CwRenderStyle *style)
{
  Table *t = g_new0 (Table, 1);
  guint head;

  g_return_if_fail (list != NULL && result != NULL && style != NULL);

  t->result = result;
  t->style = *style;
  t->width = cw_block_list_width (list);
  t->cells = g_ptr_array_new_with_free_func (g_free);
  t->heights = g_array_new (FALSE, FALSE, sizeof (double));
  cw_block_list_own (list, t, table_free);
  cw_block_list_add (list, head_height (t), draw_head, t, 0)->keep_with_next = TRUE;
  head = cw_block_list_last (list);
  for (guint i = 0; i < result->steps->len; i++)
    {
      const CwStepResult *r = cw_canal_result_get_step (result, i);
      CwBlock *b;
      double h;

      add_cells (t, r);
      h = cells_height (t, i);
      g_array_append_val (t->heights, h);
      b = cw_block_list_add (list, h + findings_height (t, r), draw_row, t, i);
      b->header = (int) head;
      /* No last row alone at the top of a page. */
      b->keep_with_next = i + 2 >= result->steps->len && result->steps->len > 1;
    }
}
