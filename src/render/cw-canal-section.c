/* cw-canal-section.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-canal-path.h"
#include "cw-canal-renderer.h"
#include "cw-canal-section.h"
#include "cw-plan-text.h"
#include "cw-step-panels.h"
#include "cw-step-table.h"
#include "cw-text-block.h"

#define HEADING_SIZE 11.0
#define BODY_SIZE 8.0
#define NOTE_SIZE 7.0

typedef struct
{
  const CwCanalResult *result;
  CwRenderStyle        style;
  CwTextBlock         *text;
  double               text_width;
  double               height;
} Parameters;

static void
parameters_free (gpointer data)
{
  Parameters *p = data;

  cw_text_block_free (p->text);
  g_free (p);
}

static void
add_heading (CwBlockList         *list,
             const CwCanalResult *result,
             const CwRenderStyle *style)
{
  CwTextBlock *text = cw_text_block_new (style, cw_block_list_width (list));
  g_autofree char *title = g_strdup_printf (_("Canal %s — %s"), result->canal->name,
                                            cw_render_level_name (result->verdict));
  CwBlock *b;

  cw_text_block_add (text, HEADING_SIZE, CW_TEXT_BOLD, CW_TEXT_INK, result->verdict, title);
  b = cw_text_block_append (text, list);
  b->keep_with_next = TRUE;
  b->space_before = cw_render_style_font (style, 14);
}

static const char *
panel_note (void)
{
  return _("Each panel shows the canal as the step finds it: the file in its ISO handle colour, "
           "the parts that engage the wall hatched and outlined, the dashed line at the ceiling "
           "depth. Widths ×6, depths and curves true to scale, every panel to the same scale.");
}

/* The Schneider angle as a radiograph shows it: between the canal's
 * direction at the onset and the line from the onset to the working
 * length. */
static double
schneider_degrees (const CwCanalPath *path,
                   double             onset,
                   double             wl)
{
  double x0, y0, x1, y1, a = cw_canal_path_heading (path, onset);

  cw_canal_path_point (path, onset, 0, &x0, &y0);
  cw_canal_path_point (path, wl, 0, &x1, &y1);
  return fabs (remainder (atan2 (x1 - x0, y1 - y0) - a, 2 * G_PI)) * 180 / G_PI;
}

static char *
curve_text (const CwCanalResult *result,
            const CwCanalPath   *path,
            guint                i)
{
  const CwGeometry *g = &result->geometry;
  g_autofree char *onset = cw_render_number (g->onset[i], 1);
  g_autofree char *phi = cw_render_number (g->phi[i] * 180 / G_PI, 0);
  g_autofree char *radius = cw_render_number (g->radius[i], 1);
  g_autofree char *end = cw_render_number (g->end[i], 1);
  g_autofree char *schneider = cw_render_number (schneider_degrees (path, g->onset[i],
                                                                    result->canal->working_length), 0);

  return g_strdup_printf (_("Curve %u: onset %s mm, turning angle %s°, radius %s mm, ends at %s mm; "
                            "Schneider angle %s° (onset to working length)"),
                          i + 1, onset, phi, radius, end, schneider);
}

static char *
diameter_text (const CwCanal *canal)
{
  if (canal->diameters && canal->diameters->len > 0)
    {
      const CwPoint *p = (const CwPoint *) (gpointer) canal->diameters->data;
      g_autofree char *first = cw_render_number (p[0].v, 2);
      g_autofree char *last = cw_render_number (p[canal->diameters->len - 1].v, 2);

      return g_strdup_printf (_("Natural diameter measured at %u points, %s mm to %s mm"),
                              canal->diameters->len, first, last);
    }
  {
    g_autofree char *top = cw_render_number (canal->orifice_diameter, 2);
    g_autofree char *apex = cw_render_number (canal->apical_diameter, 2);

    return g_strdup_printf (_("Natural diameter %s mm at the orifice to %s mm at the working length"),
                            top, apex);
  }
}

static void
fill_parameters (CwTextBlock         *text,
                 const CwCanalResult *result)
{
  const CwCanal *canal = result->canal;
  g_autofree char *wl = cw_render_number (canal->working_length, 1);
  g_autofree char *orifice = cw_render_number (canal->orifice_depth, 1);
  g_autofree char *lengths = g_strdup_printf (_("Working length %s mm, orifice at %s mm"), wl, orifice);
  g_autofree char *diameters = diameter_text (canal);
  CwCanalPath path;

  cw_canal_path_init (&path, &result->geometry);
  if (canal->reference && *canal->reference)
    {
      g_autofree char *ref = g_strdup_printf (_("Lengths from the %s"), canal->reference);

      cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, ref);
    }
  cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, lengths);
  if (result->geometry.n_curves == 0)
    cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, _("Straight canal"));
  for (guint i = 0; i < result->geometry.n_curves; i++)
    {
      g_autofree char *curve = curve_text (result, &path, i);

      cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, curve);
    }
  cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, diameters);
  cw_text_block_add (text, NOTE_SIZE, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, panel_note ());
}

static void
draw_parameters (cairo_t  *cr,
                 gpointer  data,
                 guint     index,
                 double    x,
                 double    y,
                 double    width)
{
  Parameters *p = data;
  double gap = cw_render_style_font (&p->style, 10);
  cairo_rectangle_t area = { x + p->text_width + gap, y, width - p->text_width - gap, p->height };
  g_autoptr(CwCanalLayout) layout = cw_canal_layout_new (p->result->canal, p->result, &p->style, &area,
                                                         CW_CANAL_LAYOUT_LABELS | CW_CANAL_LAYOUT_SCALE);

  cw_text_block_draw (p->text, cr, x, y);
  cw_canal_draw (cr, layout, p->result, CW_RENDER_NO_STEP);
}

/* The parameters on the left, the prepared canal with its labels on the
 * right. */
static void
add_parameters (CwBlockList         *list,
                const CwCanalResult *result,
                const CwRenderStyle *style)
{
  Parameters *p = g_new0 (Parameters, 1);
  double width = cw_block_list_width (list);

  p->result = result;
  p->style = *style;
  p->text_width = width * 0.5;
  p->text = cw_text_block_new (style, p->text_width);
  fill_parameters (p->text, result);
  p->height = MAX (cw_text_block_height (p->text), cw_render_style_font (style, 250));
  cw_block_list_own (list, p, parameters_free);
  cw_block_list_add (list, p->height, draw_parameters, p, 0)->space_before = cw_render_style_font (style, 4);
}

static void
add_zones (CwBlockList         *list,
           const CwCanalResult *result,
           const CwRenderStyle *style)
{
  CwTextBlock *text = cw_text_block_new (style, cw_block_list_width (list));
  g_autofree char *zones = cw_plan_zones_text (result->canal, &result->geometry);
  CwBlock *b;

  cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, zones);
  cw_text_block_add (text, NOTE_SIZE, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, panel_note ());
  b = cw_text_block_append (text, list);
  b->keep_with_next = TRUE;
  b->space_before = cw_render_style_font (style, 3);
}

static void
add_final (CwBlockList         *list,
           const CwCanalResult *result,
           const CwRenderStyle *style)
{
  CwTextBlock *text = cw_text_block_new (style, cw_block_list_width (list));
  g_autofree char *final = cw_plan_final_text (result);

  cw_text_block_add (text, BODY_SIZE, CW_TEXT_BOLD, CW_TEXT_INK, cw_findings_worst (result->findings), final);
  for (guint i = 0; i < result->findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (result->findings, i);
      g_autofree char *sentence = cw_finding_describe (f, FALSE);

      cw_text_block_add (text, BODY_SIZE, CW_TEXT_REGULAR, CW_TEXT_INK, f->level, sentence);
    }
  cw_text_block_append (text, list)->space_before = cw_render_style_font (style, 5);
}

void
cw_canal_section_add_blocks (CwBlockList         *list,
                             const CwCanalResult *result,
                             const CwRenderStyle *style,
                             CwSectionFlags       flags)
{
  g_return_if_fail (list != NULL && result != NULL && style != NULL);

  add_heading (list, result, style);
  if (flags & CW_SECTION_SHEET)
    add_parameters (list, result, style);
  else
    add_zones (list, result, style);
  cw_step_panels_add_blocks (list, result, style);
  if (result->steps->len > 0)
    {
      guint first = cw_block_list_length (list);

      cw_step_table_add_blocks (list, result, style);
      cw_block_list_get (list, first)->space_before = cw_render_style_font (style, 8);
    }
  add_final (list, result, style);
}
