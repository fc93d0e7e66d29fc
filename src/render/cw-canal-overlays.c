/* cw-canal-overlays.c: the overlays' names, colours and order of drawing
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-canal-overlays-private.h"
#include "cw-render-text.h"

#define RGB(hex) { ((hex) >> 16 & 0xff) / 255.0, ((hex) >> 8 & 0xff) / 255.0, ((hex) & 0xff) / 255.0 }

static const struct
{
  CwOverlayFlags flag;
  const char    *id;
  const char    *title;
} overlays[CW_N_OVERLAYS] = {
  { CW_OVERLAY_RULER, "ruler", N_("Diameter Ruler") },
  { CW_OVERLAY_STRAIN, "strain", N_("Strain Along the Curve") },
  { CW_OVERLAY_CEILING, "ceiling", N_("Ceiling and Safe Depth") },
  { CW_OVERLAY_CLEARANCE, "clearance", N_("Straight-Part Clearance") },
  { CW_OVERLAY_ENVELOPE, "envelope", N_("Shape Before and After") },
  { CW_OVERLAY_ENGAGED, "engaged", N_("Engaged Surface") },
  { CW_OVERLAY_ZONES, "zones", N_("Zone Labels") },
};

/* Colours of their own, apart from the files' ISO colours and the levels:
 * teal for the shape, magenta for the wall in contact, violet for the
 * ceiling. */
static const CwRgb inks[][CW_N_OVERLAY_INKS] = {
  [CW_RENDER_LIGHT] = { RGB (0x00838f), RGB (0xc2185b), RGB (0x4527a0) },
  [CW_RENDER_DARK] = { RGB (0x4dd0e1), RGB (0xf48fb1), RGB (0xb39ddb) },
  [CW_RENDER_HIGH_CONTRAST] = { RGB (0x005b66), RGB (0xa0004a), RGB (0x2a0080) },
};

CwOverlayFlags
cw_overlay_nth (guint index)
{
  g_return_val_if_fail (index < CW_N_OVERLAYS, CW_OVERLAY_NONE);
  return overlays[index].flag;
}

static int
find (CwOverlayFlags overlay)
{
  for (guint i = 0; i < CW_N_OVERLAYS; i++)
    if (overlays[i].flag == overlay)
      return (int) i;
  return -1;
}

const char *
cw_overlay_id (CwOverlayFlags overlay)
{
  int i = find (overlay);

  g_return_val_if_fail (i >= 0, NULL);
  return overlays[i].id;
}

const char *
cw_overlay_title (CwOverlayFlags overlay)
{
  int i = find (overlay);

  g_return_val_if_fail (i >= 0, NULL);
  return _(overlays[i].title);
}

static gboolean
parse_one (const char     *id,
           CwOverlayFlags *flags)
{
  if (strcmp (id, "all") == 0)
    *flags |= CW_OVERLAY_ALL;
  else if (strcmp (id, "none") != 0)
    {
      guint i;

      for (i = 0; i < CW_N_OVERLAYS && strcmp (id, overlays[i].id) != 0; i++)
        ;
      if (i == CW_N_OVERLAYS)
        return FALSE;
      *flags |= overlays[i].flag;
    }
  return TRUE;
}

gboolean
cw_overlay_flags_parse (const char     *text,
                        CwOverlayFlags *flags)
{
  g_auto(GStrv) ids = NULL;
  CwOverlayFlags parsed = CW_OVERLAY_NONE;

  g_return_val_if_fail (text != NULL && flags != NULL, FALSE);

  ids = g_strsplit (text, ",", -1);
  for (guint i = 0; ids[i]; i++)
    if (!parse_one (g_strstrip (ids[i]), &parsed))
      return FALSE;
  *flags = parsed;
  return TRUE;
}

static CwRgb
mix (const CwRgb *a,
     const CwRgb *b,
     double       t)
{
  return (CwRgb) { a->r + (b->r - a->r) * t, a->g + (b->g - a->g) * t, a->b + (b->b - a->b) * t };
}

CwRgb
cw_overlay_heat_rgb (double fraction)
{
  static const CwRgb pale = RGB (0xfff1a8), orange = RGB (0xf57c00), red = RGB (0xb71c1c);
  double f = isfinite (fraction) ? CLAMP (fraction, 0.0, 1.0) : 0.0;

  if (f <= 0.8)
    return mix (&pale, &orange, f / 0.8);
  return mix (&orange, &red, (f - 0.8) / 0.2);
}

CwRgb
cw_overlay_ink (const CwOverlayContext *ctx,
                CwOverlayInk            ink)
{
  return inks[ctx->layout->style.theme][ink];
}

void
cw_overlay_note (CwOverlayContext *ctx,
                 const CwRgb      *colour,
                 char             *text)
{
  CwOverlayNote *note = g_new0 (CwOverlayNote, 1);

  note->colour = *colour;
  note->text = text;
  g_ptr_array_add (ctx->notes, note);
}

/* Half the width drawn at s, in true mm: the walls or the file, the wider. */
double
cw_overlay_half (const CwOverlayContext *ctx,
                 double                  s)
{
  double half = cw_pwl_eval (ctx->walls, MAX (s, ctx->layout->orifice)) / 2;

  if (ctx->file && s <= ctx->step->depth && s >= cw_pwl_get_points (ctx->file)->s)
    half = MAX (half, cw_pwl_eval (ctx->file, s) / 2);
  return half;
}

/* The device point at a lateral offset (true mm), pushed further along the
 * same normal by extra device units: a gap that does not grow six times. */
void
cw_overlay_point (const CwOverlayContext *ctx,
                  double                  s,
                  double                  offset,
                  double                  extra,
                  double                 *x,
                  double                 *y)
{
  double a = cw_canal_path_heading (&ctx->layout->path, s);

  cw_canal_layout_to_device (ctx->layout, s, offset, x, y);
  *x += extra * cos (a);
  *y -= extra * sin (a);
}

double
cw_overlay_text_size (const CwOverlayContext *ctx)
{
  return ctx->layout->flags & CW_CANAL_LAYOUT_LABELS ? CW_LABEL_SIZE : CW_SMALL_SIZE;
}

/* Strokes the current path over a halo of the background colour, so that
 * the line reads over files of any colour. */
void
cw_overlay_halo_line (cairo_t                *cr,
                      const CwOverlayContext *ctx,
                      const CwRgb            *colour,
                      double                  width)
{
  const CwPalette *pal = cw_render_style_palette (&ctx->layout->style);

  cw_render_set_rgb (cr, &pal->background);
  cairo_set_line_width (cr, width + cw_render_style_line (&ctx->layout->style, 1.6));
  cairo_stroke_preserve (cr);
  cw_render_set_rgb (cr, colour);
  cairo_set_line_width (cr, width);
  cairo_stroke (cr);
}

static void
note_free (gpointer data)
{
  CwOverlayNote *note = data;

  g_free (note->text);
  g_free (note);
}

static double
notes_width (const CwOverlayContext *ctx)
{
  const CwCanalLayout *l = ctx->layout;

  return MIN (l->area.width * 0.4, cw_render_style_font (&l->style, 230));
}

static double
draw_note (cairo_t                *cr,
           const CwOverlayContext *ctx,
           const CwOverlayNote    *note,
           double                  x,
           double                  y,
           double                  width)
{
  const CwRenderStyle *st = &ctx->layout->style;
  double swatch = cw_render_style_font (st, 7), h;
  g_autoptr(PangoLayout) text = cw_render_text_wrapped (st, cw_overlay_text_size (ctx), CW_TEXT_REGULAR,
                                                        note->text, width - swatch * 1.6);

  cw_render_set_rgb (cr, &note->colour);
  cairo_rectangle (cr, x, y + swatch * 0.25, swatch, swatch);
  cairo_fill (cr);
  cw_render_set_rgb (cr, &cw_render_style_palette (st)->ink);
  cw_render_text_draw (cr, text, x + swatch * 1.6, y, CW_ALIGN_START, CW_ALIGN_START);
  cw_render_text_size (text, NULL, &h);
  return h + cw_render_style_font (st, 2);
}

static double
notes_height (const CwOverlayContext *ctx,
              double                  width)
{
  const CwRenderStyle *st = &ctx->layout->style;
  double h = 0, swatch = cw_render_style_font (st, 7);

  for (guint i = 0; i < ctx->notes->len; i++)
    {
      const CwOverlayNote *note = g_ptr_array_index (ctx->notes, i);

      h += cw_render_text_height (st, cw_overlay_text_size (ctx), CW_TEXT_REGULAR, note->text,
                                  width - swatch * 1.6) + cw_render_style_font (st, 2);
    }
  return h;
}

/* The overlays' sentences in a box in the top right corner: the numbers
 * behind what they draw, and what each colour means. */
static void
draw_notes (cairo_t                *cr,
            const CwOverlayContext *ctx)
{
  const CwCanalLayout *l = ctx->layout;
  const CwPalette *pal = cw_render_style_palette (&l->style);
  double pad = cw_render_style_font (&l->style, 4);
  double width = notes_width (ctx), height, x, y;

  if (ctx->notes->len == 0)
    return;
  height = notes_height (ctx, width - 2 * pad) + 2 * pad;
  x = l->area.x + l->area.width - width - pad;
  y = l->area.y + pad;
  cairo_rectangle (cr, x, y, width, height);
  cw_render_set_rgba (cr, &pal->background, 0.9);
  cairo_fill_preserve (cr);
  cw_render_set_rgb (cr, &pal->rule);
  cairo_set_line_width (cr, cw_render_style_line (&l->style, 0.6));
  cairo_stroke (cr);
  y += pad;
  for (guint i = 0; i < ctx->notes->len; i++)
    y += draw_note (cr, ctx, g_ptr_array_index (ctx->notes, i), x + pad, y, width - 2 * pad);
}

static void
context_init (CwOverlayContext         *ctx,
              const CwCanalLayout      *layout,
              const CwCanalResult      *result,
              int                       step,
              const CwCanalDrawOptions *options,
              CwRules                  *defaults)
{
  memset (ctx, 0, sizeof *ctx);
  ctx->layout = layout;
  ctx->result = result;
  if (step >= 0 && (guint) step < result->steps->len)
    ctx->step = options->partial ? options->partial : cw_canal_result_get_step (result, step);
  ctx->walls = cw_canal_render_walls (result, ctx->step ? step : CW_RENDER_NO_STEP);
  if (ctx->step)
    ctx->file = cw_canal_file_diameter (ctx->step, layout->s_top);
  if (options->rules)
    ctx->rules = options->rules;
  else
    {
      cw_rules_init_defaults (defaults);
      ctx->rules = defaults;
    }
  ctx->notes = g_ptr_array_new_with_free_func (note_free);
  ctx->column = layout->canal.x + layout->canal.width + cw_render_style_font (&layout->style, 6);
}

static void
collect_notes (CwOverlayContext *ctx,
               CwOverlayFlags    f)
{
  if (f & CW_OVERLAY_STRAIN)
    cw_overlay_strain_note (ctx);
  if (f & CW_OVERLAY_CEILING)
    cw_overlay_ceiling_note (ctx);
  if (f & CW_OVERLAY_ENGAGED)
    cw_overlay_engaged_note (ctx);
  if (f & CW_OVERLAY_CLEARANCE)
    cw_overlay_clearance_note (ctx);
  if (f & CW_OVERLAY_ENVELOPE)
    cw_overlay_envelope_note (ctx);
}

static void
context_clear (CwOverlayContext *ctx)
{
  g_clear_pointer (&ctx->notes, g_ptr_array_unref);
  g_clear_pointer (&ctx->file, cw_pwl_free);
}

GPtrArray *
cw_canal_overlay_notes (const CwCanalLayout      *layout,
                        const CwCanalResult      *result,
                        int                       step,
                        const CwCanalDrawOptions *options)
{
  CwOverlayContext ctx;
  CwRules defaults;
  GPtrArray *notes;

  g_return_val_if_fail (layout != NULL && result != NULL && options != NULL, NULL);

  context_init (&ctx, layout, result, step, options, &defaults);
  collect_notes (&ctx, options->overlays);
  notes = g_steal_pointer (&ctx.notes);
  context_clear (&ctx);
  return notes;
}

void
cw_canal_overlays_draw (cairo_t                  *cr,
                        const CwCanalLayout      *layout,
                        const CwCanalResult      *result,
                        int                       step,
                        const CwCanalDrawOptions *options)
{
  CwOverlayFlags f = options->overlays;
  CwOverlayContext ctx;
  CwRules defaults;

  if (f == CW_OVERLAY_NONE)
    return;
  context_init (&ctx, layout, result, step, options, &defaults);
  cairo_save (cr);
  /* Under the others: areas first, then lines, then labels. */
  if (f & CW_OVERLAY_ENVELOPE)
    cw_overlay_envelope_draw (cr, &ctx);
  if (f & CW_OVERLAY_STRAIN)
    cw_overlay_strain_draw (cr, &ctx);
  if (f & CW_OVERLAY_ENGAGED)
    cw_overlay_engaged_draw (cr, &ctx);
  if (f & CW_OVERLAY_CLEARANCE)
    cw_overlay_clearance_draw (cr, &ctx);
  /* Each of these puts its labels in the next column to the right. */
  if (f & CW_OVERLAY_RULER)
    cw_overlay_ruler_draw (cr, &ctx);
  if (f & CW_OVERLAY_CEILING)
    cw_overlay_ceiling_draw (cr, &ctx);
  if (f & CW_OVERLAY_ZONES)
    cw_overlay_zones_draw (cr, &ctx);
  if (!options->hide_notes)
    {
      collect_notes (&ctx, f);
      draw_notes (cr, &ctx);
    }
  cairo_restore (cr);
  context_clear (&ctx);
}
