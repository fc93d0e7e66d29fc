/* cw-teaching-frame.c
 *
 * Sizes are in slide points (CW_FRAME_WIDTH across); the style's scale
 * turns them into the area's units.  An area of another shape than 16:9
 * (a 16:10 projector) gives the canal the room left over.  Type is large on purpose: the frame
 * is read from the back of a room.
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
#include "cw-teaching-frame.h"

#define PANEL_WIDTH 322.0
#define CANAL_TYPE 1.35     /* the canal's labels, times their size in a plan */
#define PANEL_GAP 16.0
#define MARGIN 22.0
#define FRAME_LAYOUT (CW_CANAL_LAYOUT_LABELS | CW_CANAL_LAYOUT_SCALE)

typedef struct
{
  cairo_t             *cr;
  CwRenderStyle        style;
  const CwPalette     *pal;
  double               x, y, width, bottom;
} Pen;

static double
pt (const Pen *pen,
    double     size)
{
  return cw_render_style_font (&pen->style, size);
}

/* One paragraph, wrapped; the pen moves below it.  FALSE when it would
 * run off the panel, and then nothing is drawn. */
static gboolean
pen_write (Pen         *pen,
           double       size,
           CwTextFlags  flags,
           const CwRgb *colour,
           const char  *text,
           double       indent)
{
  g_autoptr(PangoLayout) layout = cw_render_text_wrapped (&pen->style, size, flags, text, pen->width - indent);
  double h;

  cw_render_text_size (layout, NULL, &h);
  if (pen->y + h > pen->bottom)
    return FALSE;
  cw_render_set_rgb (pen->cr, colour);
  cw_render_text_draw (pen->cr, layout, pen->x + indent, pen->y, CW_ALIGN_START, CW_ALIGN_START);
  pen->y += h;
  return TRUE;
}

static const CwStepResult *
shown_step (const CwTeachingFrame *frame)
{
  if (frame->step < 0 || (guint) frame->step >= frame->result->steps->len)
    return NULL;
  if (frame->options.partial)
    return frame->options.partial;
  return cw_canal_result_get_step (frame->result, frame->step);
}

static void
write_header (Pen                   *pen,
              const CwTeachingFrame *frame)
{
  const CwCanalResult *result = frame->result;
  g_autofree char *text = NULL;

  if (shown_step (frame))
    /* TRANSLATORS: canal name, step number, number of steps */
    text = g_strdup_printf (_("Canal %s · step %d of %u"), result->canal->name, frame->step + 1,
                            result->steps->len);
  else
    text = g_strdup_printf (_("Canal %s · the shape after %u steps"), result->canal->name, result->steps->len);
  pen_write (pen, 15, CW_TEXT_BOLD, &pen->pal->muted, text, 0);
  pen->y += pt (pen, 4);
}

static void
write_file (Pen                *pen,
            const CwStepResult *step)
{
  g_autofree char *name = cw_plan_file_text (step->instrument);
  CwRgb fill = cw_render_handle_rgb (step->instrument->tip);
  double swatch = pt (pen, 20);

  cairo_rectangle (pen->cr, pen->x, pen->y + pt (pen, 2), swatch, swatch);
  cw_render_set_rgb (pen->cr, &fill);
  cairo_fill_preserve (pen->cr);
  cw_render_set_rgb (pen->cr, &pen->pal->file_outline);
  cairo_set_line_width (pen->cr, cw_render_style_line (&pen->style, 1.2));
  cairo_stroke (pen->cr);
  pen_write (pen, 20, CW_TEXT_BOLD, &pen->pal->ink, name, swatch + pt (pen, 8));
  pen->y += pt (pen, 6);
}

/* A large number with its unit or context after it, and a caption. */
static void
write_big (Pen        *pen,
           double      size,
           const char *number,
           const char *after,
           const char *caption)
{
  double w, h, small = size * 0.36;
  g_autoptr(PangoLayout) big = cw_render_text_layout (&pen->style, size, CW_TEXT_BOLD, number);

  cw_render_text_size (big, &w, &h);
  if (pen->y + h > pen->bottom)
    return;
  cw_render_set_rgb (pen->cr, &pen->pal->ink);
  cw_render_text_draw (pen->cr, big, pen->x, pen->y, CW_ALIGN_START, CW_ALIGN_START);
  cw_render_text_line (pen->cr, &pen->style, small, CW_TEXT_BOLD, after, pen->x + w + pt (pen, 6),
                       pen->y + h * 0.78, CW_ALIGN_START, CW_ALIGN_END);
  pen->y += h * 0.92;
  pen_write (pen, 13, CW_TEXT_REGULAR, &pen->pal->muted, caption, 0);
  pen->y += pt (pen, 8);
}

static void
write_depth (Pen                   *pen,
             const CwTeachingFrame *frame,
             const CwStepResult    *step)
{
  const CwStepResult *planned = cw_canal_result_get_step (frame->result, frame->step);
  g_autofree char *depth = cw_render_number (step->depth, 1);
  g_autofree char *target = cw_render_number (planned->depth, 1);
  g_autofree char *after = NULL, *caption = NULL;

  if (frame->options.partial)
    {
      after = g_strdup_printf (_("of %s mm"), target);
      if (planned->pecks == 0)
        caption = g_strdup (_("tip depth, going in · it touches no wall"));
      else
        caption = g_strdup_printf (_("tip depth, going in · peck %u of %u"), MIN (frame->pecks + 1, planned->pecks),
                                   planned->pecks);
    }
  else
    {
      after = g_strdup (_("mm"));
      caption = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "tip depth · %u peck", "tip depth · %u pecks",
                                              planned->pecks), planned->pecks);
    }
  write_big (pen, 62, depth, after, caption);
}

typedef struct
{
  char       *value;
  const char *caption;
} Figure;

static void
write_grid (Pen          *pen,
            const Figure *figures,
            guint         n)
{
  double column = (pen->width - pt (pen, 10)) / 2, row = 0;
  double value_h = cw_render_text_height (&pen->style, 26, CW_TEXT_BOLD, "0", 0);
  double caption_h = cw_render_text_height (&pen->style, 12, CW_TEXT_REGULAR, "Ag", 0);

  for (guint i = 0; i < n; i++)
    {
      double x = pen->x + (i % 2) * (column + pt (pen, 10));

      row = pen->y + (i / 2) * (value_h + caption_h + pt (pen, 6));
      if (row + value_h + caption_h > pen->bottom)
        break;
      cw_render_set_rgb (pen->cr, &pen->pal->ink);
      cw_render_text_line (pen->cr, &pen->style, 26, CW_TEXT_BOLD, figures[i].value, x, row,
                           CW_ALIGN_START, CW_ALIGN_START);
      cw_render_set_rgb (pen->cr, &pen->pal->muted);
      cw_render_text_line (pen->cr, &pen->style, 12, CW_TEXT_REGULAR, figures[i].caption, x, row + value_h,
                           CW_ALIGN_START, CW_ALIGN_START);
    }
  pen->y = MIN (row + value_h + caption_h + pt (pen, 10), pen->bottom);
}

static char *
mm (double value)
{
  g_autofree char *number = cw_render_number (value, 1);

  if (!isfinite (value))
    return g_steal_pointer (&number);
  return g_strdup_printf (_("%s mm"), number);
}

static char *
clearance (double value)
{
  g_autofree char *number = cw_render_number (fabs (value), 2);

  if (!isfinite (value))
    return g_strdup ("–");
  /* TRANSLATORS: a clearance in mm: "+" clear, "−" still cutting */
  return g_strdup_printf (value < 0 ? _("−%s mm") : _("+%s mm"), number);
}

static void
write_figures (Pen                *pen,
               const CwStepResult *step)
{
  g_autofree char *strain = cw_render_number (step->strain * 100, 1);
  Figure figures[] = {
    { mm (step->engaged_in_curve), _("engaged in the curve") },
    { mm (step->engaged_length), _("engaged in all") },
    { isfinite (step->strain) ? g_strdup_printf (_("%s %%"), strain) : g_strdup ("–"), _("strain in the curve") },
    { mm (step->ceiling_depth), _("safe depth") },
    { clearance (step->straight_clearance), _("straight-part clearance") },
    { mm (step->first_contact), _("first contact") },
  };

  write_grid (pen, figures, G_N_ELEMENTS (figures));
  for (guint i = 0; i < G_N_ELEMENTS (figures); i++)
    g_free (figures[i].value);
}

static void
write_verdict (Pen       *pen,
               CwLevel    level,
               GPtrArray *findings)
{
  double mark = pt (pen, 22), indent = mark + pt (pen, 8);
  double top = pen->y;

  if (!pen_write (pen, 20, CW_TEXT_BOLD, &pen->pal->level[level], cw_render_level_name (level), indent))
    return;
  cw_render_level_mark (pen->cr, &pen->style, level, pen->x + mark / 2, top + (pen->y - top) / 2, mark);
  for (guint i = 0; i < findings->len && i < 2; i++)
    {
      g_autofree char *text = cw_finding_describe (g_ptr_array_index (findings, i), FALSE);

      if (!pen_write (pen, 12.5, CW_TEXT_REGULAR, &pen->pal->ink, text, indent))
        break;
      pen->y += pt (pen, 2);
    }
  pen->y += pt (pen, 8);
}

static char *
step_line (const CwStepResult *r,
           gboolean            first)
{
  g_autofree char *name = cw_plan_file_text (r->instrument);
  g_autofree char *depth = cw_render_number (r->depth, 1);

  if (first)
    return g_strdup_printf (_("First: %s to %s mm"), name, depth);
  return g_strdup_printf (_("Next: %s to %s mm"), name, depth);
}

static void
write_next (Pen                   *pen,
            const CwTeachingFrame *frame)
{
  const CwCanalResult *result = frame->result;
  guint next = (guint) (frame->step + 1);
  g_autofree char *text = NULL;

  if (next < result->steps->len)
    text = step_line (cw_canal_result_get_step (result, next), frame->step < 0);
  else if (frame->step >= 0)
    text = g_strdup (_("Last step: next comes the final shape."));
  else
    return;
  pen_write (pen, 16, CW_TEXT_BOLD, &pen->pal->ink, text, 0);
  pen->y += pt (pen, 8);
}

static void
write_tally (Pen                 *pen,
             const CwCanalResult *result)
{
  guint counts[3] = { 0 };
  g_autofree char *text = NULL;

  for (guint i = 0; i < result->steps->len; i++)
    counts[cw_canal_result_get_step (result, i)->verdict]++;
  /* TRANSLATORS: numbers of steps with each verdict */
  text = g_strdup_printf (_("Steps: %u ok, %u caution, %u stop."), counts[CW_LEVEL_OK],
                          counts[CW_LEVEL_CAUTION], counts[CW_LEVEL_STOP]);
  pen_write (pen, 14, CW_TEXT_REGULAR, &pen->pal->ink, text, 0);
  pen->y += pt (pen, 8);
}

static void
write_final (Pen                 *pen,
             const CwCanalResult *result)
{
  g_autofree char *size = cw_render_number (result->apical_size, 0);
  g_autofree char *taper = cw_render_taper (result->apical_taper);
  g_autofree char *time = cw_plan_duration (result->time);
  g_autofree char *after = g_strdup_printf (_("/ %s"), taper);

  write_big (pen, 62, size, after, _("apical size and taper"));
  pen_write (pen, 16, CW_TEXT_BOLD, &pen->pal->ink, time, 0);
  pen_write (pen, 12, CW_TEXT_REGULAR, &pen->pal->muted, _("estimated working time"), 0);
  pen->y += pt (pen, 10);
}

static void
write_notes (Pen                   *pen,
             const CwCanalLayout   *layout,
             const CwTeachingFrame *frame)
{
  g_autoptr(GPtrArray) notes = cw_canal_overlay_notes (layout, frame->result, frame->step, &frame->options);
  double swatch = pt (pen, 9);

  for (guint i = 0; i < notes->len; i++)
    {
      const CwOverlayNote *note = g_ptr_array_index (notes, i);
      double top = pen->y;

      if (!pen_write (pen, 11, CW_TEXT_REGULAR, &pen->pal->ink, note->text, swatch + pt (pen, 6)))
        break;
      cw_render_set_rgb (pen->cr, &note->colour);
      cairo_rectangle (pen->cr, pen->x, top + pt (pen, 2), swatch, swatch);
      cairo_fill (pen->cr);
      pen->y += pt (pen, 3);
    }
}

static void
draw_panel (Pen                   *pen,
            const CwCanalLayout   *layout,
            const CwTeachingFrame *frame)
{
  const CwStepResult *step = shown_step (frame);

  write_header (pen, frame);
  if (step)
    {
      write_file (pen, step);
      write_depth (pen, frame, step);
      write_figures (pen, step);
      write_verdict (pen, step->verdict, step->findings);
    }
  else
    {
      write_final (pen, frame->result);
      write_verdict (pen, frame->result->verdict, frame->result->findings);
      write_tally (pen, frame->result);
    }
  write_next (pen, frame);
  write_notes (pen, layout, frame);
}

static void
draw_status (Pen        *pen,
             const char *status)
{
  if (status == NULL)
    return;
  pen->y = pen->bottom;
  pen->bottom += pt (pen, 40);
  pen_write (pen, 12, CW_TEXT_REGULAR, &pen->pal->muted, status, 0);
}

void
cw_teaching_frame_init (CwTeachingFrame     *frame,
                        const CwCanalResult *result,
                        int                  step)
{
  g_return_if_fail (frame != NULL);

  frame->result = result;
  frame->step = step;
  cw_canal_draw_options_init (&frame->options);
  frame->options.overlays = CW_OVERLAY_TEACHING;
  frame->pecks = 0;
  frame->status = NULL;
}

void
cw_teaching_frame_draw (cairo_t                 *cr,
                        const cairo_rectangle_t *area,
                        CwRenderTheme            theme,
                        const CwTeachingFrame   *frame)
{
  double k = MIN (area->width / CW_FRAME_WIDTH, area->height / CW_FRAME_HEIGHT);
  double fw = area->width / k, fh = area->height / k, x0 = area->x, y0 = area->y;
  double canal_width = fw - PANEL_WIDTH - PANEL_GAP - MARGIN;
  cairo_rectangle_t canal = { x0, y0, canal_width * k, fh * k };
  g_autoptr(CwCanalLayout) layout = NULL;
  CwCanalDrawOptions options = frame->options;
  CwRenderStyle style;
  Pen pen = { cr };

  g_return_if_fail (cr != NULL && area != NULL && frame != NULL && frame->result != NULL);

  cw_render_style_init (&style, theme, k * CANAL_TYPE);
  cw_render_style_init (&pen.style, theme, k);
  pen.pal = cw_render_style_palette (&pen.style);
  cairo_save (cr);
  cw_render_set_rgb (cr, &pen.pal->background);
  cairo_rectangle (cr, area->x, area->y, area->width, area->height);
  cairo_fill (cr);
  layout = cw_canal_layout_new_for_overlays (frame->result->canal, frame->result, &style, &canal,
                                             FRAME_LAYOUT, options.overlays);
  options.hide_notes = TRUE;
  cw_canal_draw_full (cr, layout, frame->result, frame->step, &options);
  pen.x = x0 + (canal_width + PANEL_GAP) * k;
  pen.y = y0 + MARGIN * k;
  pen.width = PANEL_WIDTH * k;
  pen.bottom = y0 + (fh - MARGIN - (frame->status ? 22 : 0)) * k;
  draw_panel (&pen, layout, frame);
  draw_status (&pen, frame->status);
  cairo_restore (cr);
}
