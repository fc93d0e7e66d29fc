/* cw-profile-plot.c
 *
 * The profile d(x) of one instrument as a graph, with the diameters the
 * trade names it by marked: D0 at the tip, D3 where the torsion test grips,
 * D16 at the end of standard flutes.  The flutes are drawn solid, the shank
 * dashed, so that a capped or short-fluted file reads at a glance.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-profile-plot.h"
#include "cw-render-text.h"

#define TEXT_SIZE 8.0
#define MARK_SIZE 7.5

static const double marks[] = { 0, 3, 16 };

/* A label on a patch of the background, so that it reads over the grid
 * and the profile. */
static void
draw_label (cairo_t             *cr,
            const CwRenderStyle *style,
            CwTextFlags          flags,
            const char          *text,
            double               x,
            double               y,
            CwAlign              halign,
            CwAlign              valign)
{
  const CwPalette *palette = cw_render_style_palette (style);
  g_autoptr(PangoLayout) layout = cw_render_text_layout (style, MARK_SIZE, flags, text);
  double width, height, left, pad = 1.5 * style->scale;

  cw_render_text_size (layout, &width, &height);
  left = halign == CW_ALIGN_END ? x - width : (halign == CW_ALIGN_CENTER ? x - width / 2 : x);
  cw_render_set_rgba (cr, &palette->background, 0.85);
  cairo_rectangle (cr, left - pad, (valign == CW_ALIGN_END ? y - height : y) - pad,
                   width + 2 * pad, height + 2 * pad);
  cairo_fill (cr);
  cw_render_set_rgb (cr, &palette->ink);
  cw_render_text_draw (cr, layout, x, y, halign, valign);
}

/* A round step for the diameter axis: ticks 0.1, 0.2 or 0.5 mm apart. */
static double
diameter_step (double d_max)
{
  if (d_max <= 0.6)
    return 0.1;
  if (d_max <= 1.4)
    return 0.2;
  return 0.5;
}

void
cw_profile_plot_layout (CwProfilePlot           *plot,
                        const CwRenderStyle     *style,
                        const CwInstrument      *instrument,
                        const cairo_rectangle_t *area)
{
  CwProfile profile;
  double left = cw_render_style_font (style, 44), bottom = cw_render_style_font (style, 30);
  double top = cw_render_style_font (style, 20), right = cw_render_style_font (style, 16);
  cw_profile_init (&profile, instrument);
  plot->x_max = MIN (instrument->length, MAX (instrument->flute_length, 16.0) + 3.0);
  plot->x_max = MAX (plot->x_max, 1.0);
  plot->d_step = diameter_step (cw_profile_max_diameter (&profile) * 1.1);
  plot->d_max = ceil (cw_profile_max_diameter (&profile) * 1.1 / plot->d_step - 1e-9) * plot->d_step;
  plot->frame.x = area->x + left;
  plot->frame.y = area->y + top;
  plot->frame.width = MAX (area->width - left - right, 10);
  plot->frame.height = MAX (area->height - top - bottom, 10);
}

void
cw_profile_plot_point (const CwProfilePlot *plot,
                       double               x,
                       double               d,
                       double              *px,
                       double              *py)
{
  *px = plot->frame.x + plot->frame.width * x / plot->x_max;
  *py = plot->frame.y + plot->frame.height * (1.0 - d / plot->d_max);
}

static void
draw_grid (cairo_t             *cr,
           const CwRenderStyle *style,
           const CwProfilePlot *plot)
{
  const CwPalette *palette = cw_render_style_palette (style);
  guint n_d = (guint) round (plot->d_max / plot->d_step);
  double px, py;

  cairo_set_line_width (cr, cw_render_style_line (style, 0.5));
  for (double x = 0; x <= plot->x_max + 1e-9; x += 2)
    {
      g_autofree char *label = cw_render_number (x, 0);

      cw_profile_plot_point (plot, x, 0, &px, &py);
      cw_render_set_rgb (cr, &palette->rule);
      cairo_move_to (cr, px, plot->frame.y);
      cairo_line_to (cr, px, py);
      cairo_stroke (cr);
      cw_render_set_rgb (cr, &palette->muted);
      cw_render_text_line (cr, style, TEXT_SIZE, CW_TEXT_REGULAR, label, px, py + 3 * style->scale,
                           CW_ALIGN_CENTER, CW_ALIGN_START);
    }
  for (guint i = 0; i <= n_d; i++)
    {
      double d = i * plot->d_step;
      g_autofree char *label = cw_render_number (d, 1);

      cw_profile_plot_point (plot, 0, d, &px, &py);
      cw_render_set_rgb (cr, &palette->rule);
      cairo_move_to (cr, px, py);
      cairo_line_to (cr, plot->frame.x + plot->frame.width, py);
      cairo_stroke (cr);
      cw_render_set_rgb (cr, &palette->muted);
      cw_render_text_line (cr, style, TEXT_SIZE, CW_TEXT_REGULAR, label, px - 4 * style->scale, py,
                           CW_ALIGN_END, CW_ALIGN_CENTER);
    }
}

static void
draw_axis_titles (cairo_t             *cr,
                  const CwRenderStyle *style,
                  const CwProfilePlot *plot)
{
  const cairo_rectangle_t *f = &plot->frame;

  cw_render_set_rgb (cr, &cw_render_style_palette (style)->muted);
  cw_render_text_line (cr, style, TEXT_SIZE, CW_TEXT_REGULAR, _("distance from the tip (mm)"),
                       f->x + f->width, f->y + f->height + 16 * style->scale, CW_ALIGN_END, CW_ALIGN_START);
  cw_render_text_line (cr, style, TEXT_SIZE, CW_TEXT_REGULAR, _("diameter (mm)"),
                       f->x - 40 * style->scale, f->y - 6 * style->scale, CW_ALIGN_START, CW_ALIGN_END);
}

static void
trace_profile (cairo_t             *cr,
               const CwProfilePlot *plot,
               const CwProfile     *profile,
               double               x_end)
{
  double px, py;

  for (guint i = 0; i < profile->n && profile->x[i] <= x_end; i++)
    {
      cw_profile_plot_point (plot, profile->x[i], profile->d[i], &px, &py);
      if (i == 0)
        cairo_move_to (cr, px, py);
      else
        cairo_line_to (cr, px, py);
    }
  cw_profile_plot_point (plot, x_end, cw_profile_diameter (profile, x_end), &px, &py);
  cairo_line_to (cr, px, py);
}

/* The flutes filled in the file's handle colour and outlined; the shank,
 * which never cuts, dashed. */
static void
draw_profile (cairo_t             *cr,
              const CwRenderStyle *style,
              const CwProfilePlot *plot,
              const CwInstrument  *instrument,
              const CwProfile     *profile)
{
  const CwPalette *palette = cw_render_style_palette (style);
  CwRgb fill = cw_render_handle_rgb (instrument->tip);
  double flutes = MIN (profile->flute_length, plot->x_max), px, py, qx, qy;
  double dashes[] = { 5 * style->scale, 3 * style->scale };

  trace_profile (cr, plot, profile, flutes);
  cw_profile_plot_point (plot, flutes, 0, &px, &py);
  cairo_line_to (cr, px, py);
  cw_profile_plot_point (plot, 0, 0, &px, &py);
  cairo_line_to (cr, px, py);
  cairo_close_path (cr);
  /* A white handle would not show on a light ground. */
  if (fabs (cw_render_luminance (&fill) - cw_render_luminance (&palette->background)) < 0.2)
    cw_render_set_rgb (cr, &palette->lumen);
  else
    cw_render_set_rgba (cr, &fill, 0.35);
  cairo_fill (cr);

  cairo_set_line_width (cr, cw_render_style_line (style, 2.0));
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  cw_render_set_rgb (cr, &palette->ink);
  trace_profile (cr, plot, profile, flutes);
  cairo_stroke (cr);
  if (flutes >= plot->x_max)
    return;
  cw_profile_plot_point (plot, flutes, cw_profile_max_diameter (profile), &px, &py);
  cw_profile_plot_point (plot, plot->x_max, cw_profile_max_diameter (profile), &qx, &qy);
  cairo_set_dash (cr, dashes, 2, 0);
  cairo_move_to (cr, px, py);
  cairo_line_to (cr, qx, qy);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
}

static void
draw_cap (cairo_t             *cr,
          const CwRenderStyle *style,
          const CwProfilePlot *plot,
          double               cap)
{
  g_autofree char *value = cw_render_number (cap, 2);
  g_autofree char *label = g_strdup_printf (_("largest flute diameter %s mm"), value);
  double dashes[] = { 2 * style->scale, 3 * style->scale };
  double px, py;

  cw_profile_plot_point (plot, 0, cap, &px, &py);
  cw_render_set_rgb (cr, &cw_render_style_palette (style)->mark);
  cairo_set_line_width (cr, cw_render_style_line (style, 0.8));
  cairo_set_dash (cr, dashes, 2, 0);
  cairo_move_to (cr, px, py);
  cairo_line_to (cr, plot->frame.x + plot->frame.width, py);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
  /* Under the line near the tip, where the profile is still far below it
   * and the marks' labels, which sit above their dots, are not. */
  draw_label (cr, style, CW_TEXT_REGULAR, label, px + 4 * style->scale, py + 3 * style->scale,
              CW_ALIGN_START, CW_ALIGN_START);
}

/* A dot on the profile, a dotted drop to the axis and "D3 0.37 mm": above
 * and to the left of the dot, where a rising profile leaves room; D0 to
 * the right, under it. */
static void
draw_mark (cairo_t             *cr,
           const CwRenderStyle *style,
           const CwProfilePlot *plot,
           const CwProfile     *profile,
           double               x)
{
  double d = cw_profile_diameter (profile, x), px, py, ax, ay;
  double dots[] = { 1 * style->scale, 2 * style->scale }, gap = 5 * style->scale;
  g_autofree char *value = cw_render_number (d, 2);
  g_autofree char *label = g_strdup_printf (_("D%.0f %s mm"), x, value);

  cw_profile_plot_point (plot, x, d, &px, &py);
  cw_profile_plot_point (plot, x, 0, &ax, &ay);
  cw_render_set_rgb (cr, &cw_render_style_palette (style)->ink);
  cairo_set_line_width (cr, cw_render_style_line (style, 0.8));
  cairo_set_dash (cr, dots, 2, 0);
  cairo_move_to (cr, px, py);
  cairo_line_to (cr, ax, ay);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
  cairo_arc (cr, px, py, 3 * style->scale, 0, 2 * G_PI);
  cairo_fill (cr);
  if (x <= 0)
    draw_label (cr, style, CW_TEXT_BOLD, label, px + gap, py + gap, CW_ALIGN_START, CW_ALIGN_START);
  else
    draw_label (cr, style, CW_TEXT_BOLD, label, px - gap, py - gap, CW_ALIGN_END, CW_ALIGN_END);
}

static void
draw_title (cairo_t             *cr,
            const CwRenderStyle *style,
            const CwProfilePlot *plot,
            const CwInstrument  *instrument)
{
  g_autofree char *name = cw_render_file_name (instrument);

  cw_render_set_rgb (cr, &cw_render_style_palette (style)->ink);
  cw_render_text_line (cr, style, TEXT_SIZE + 1, CW_TEXT_BOLD, name,
                       plot->frame.x + plot->frame.width, plot->frame.y - 6 * style->scale,
                       CW_ALIGN_END, CW_ALIGN_END);
}

void
cw_profile_plot_draw (cairo_t                 *cr,
                      const CwRenderStyle     *style,
                      const CwInstrument      *instrument,
                      const cairo_rectangle_t *area)
{
  CwProfilePlot plot;
  CwProfile profile;

  g_return_if_fail (cr != NULL && style != NULL && instrument != NULL && area != NULL);

  cw_profile_init (&profile, instrument);
  cw_profile_plot_layout (&plot, style, instrument, area);
  cairo_save (cr);
  draw_grid (cr, style, &plot);
  draw_axis_titles (cr, style, &plot);
  draw_profile (cr, style, &plot, instrument, &profile);
  if (isfinite (instrument->max_flute_diameter))
    draw_cap (cr, style, &plot, instrument->max_flute_diameter);
  for (guint i = 0; i < G_N_ELEMENTS (marks); i++)
    if (marks[i] <= plot.x_max)
      draw_mark (cr, style, &plot, &profile, marks[i]);
  draw_title (cr, style, &plot, instrument);
  cairo_restore (cr);
}
