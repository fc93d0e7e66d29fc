/* cw-plan-sheet.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <langinfo.h>
#include <math.h>
#include <stdint.h>

#include "config.h"
#include "cw-canal-section.h"
#include "cw-plan-sheet.h"
#include "cw-plan-text.h"
#include "cw-text-block.h"

#define MARGIN 42.0      /* points, about 15 mm */
#define FOOTER_SIZE 7.0
#define RUNNING_SIZE 7.5

struct _CwPlanSheet
{
  const CwCase  *kase;
  CwRenderStyle  style;
  double         width, height;
  char          *date;
  CwBlockList   *blocks;
  GArray        *placements;
  guint          n_pages;
  double         footer_height;
  double         running_height;
};

void
cw_paper_size (CwPaper  paper,
               double  *width,
               double  *height)
{
  if (paper == CW_PAPER_LETTER)
    {
      *width = 612;
      *height = 792;
      return;
    }
  *width = 210 / 25.4 * 72;
  *height = 297 / 25.4 * 72;
}

/* glibc keeps the locale's paper width in millimetres (LC_PAPER); the
 * letter-size countries give 216. */
CwPaper
cw_paper_from_locale (void)
{
  intptr_t width = (intptr_t) nl_langinfo (_NL_PAPER_WIDTH);

  return width == 216 ? CW_PAPER_LETTER : CW_PAPER_A4;
}

gboolean
cw_paper_from_string (const char *str,
                      CwPaper    *paper)
{
  if (g_ascii_strcasecmp (str, "a4") == 0)
    *paper = CW_PAPER_A4;
  else if (g_ascii_strcasecmp (str, "letter") == 0)
    *paper = CW_PAPER_LETTER;
  else
    return FALSE;
  return TRUE;
}

static CwTextBlock *
footer_text (CwPlanSheet *sheet,
             guint        page)
{
  CwTextBlock *text = cw_text_block_new (&sheet->style, sheet->width - 2 * MARGIN);
  g_autofree char *line = g_strdup_printf (_("Page %u of %u · exported on %s by Canalwright %s"),
                                           page + 1, MAX (sheet->n_pages, 1), sheet->date, PACKAGE_VERSION);

  cw_text_block_add (text, FOOTER_SIZE, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, cw_plan_cautions ());
  cw_text_block_add (text, FOOTER_SIZE, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, line);
  return text;
}

static char *
running_head (const CwCase *kase)
{
  g_autofree char *tooth = cw_plan_tooth_text (kase);

  return g_strdup_printf ("%s · %s", kase->title && *kase->title ? kase->title : _("Untitled case"), tooth);
}

static void
add_case_header (CwPlanSheet *sheet,
                 GPtrArray   *results)
{
  const CwCase *kase = sheet->kase;
  CwTextBlock *text = cw_text_block_new (&sheet->style, cw_block_list_width (sheet->blocks));
  g_autofree char *tooth = cw_plan_tooth_text (kase);
  g_autofree char *size = g_strdup_printf ("%g", kase->target_apical_size);
  g_autofree char *taper = cw_render_taper (kase->target_apical_taper);
  g_autofree char *line = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%s · %u canal · target apical size %s, taper %s",
                                                        "%s · %u canals · target apical size %s, taper %s", results->len),
                                           tooth, results->len, size, taper);

  cw_text_block_add (text, 16, CW_TEXT_BOLD, CW_TEXT_INK, CW_TEXT_NO_LEVEL,
                     kase->title && *kase->title ? kase->title : _("Untitled case"));
  cw_text_block_add (text, 9, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, line);
  if (kase->notes && *kase->notes)
    cw_text_block_add (text, 7.5, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, kase->notes);
  cw_text_block_append (text, sheet->blocks);
}

static char *
canal_total (const CwCanalResult *result)
{
  g_autofree char *time = cw_plan_duration (result->time);

  return g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "Canal %s: %u step, estimated time %s — %s",
                                       "Canal %s: %u steps, estimated time %s — %s", result->steps->len),
                          result->canal->name, result->steps->len, time, cw_render_level_name (result->verdict));
}

static void
add_totals (CwPlanSheet *sheet,
            GPtrArray   *results)
{
  CwTextBlock *text = cw_text_block_new (&sheet->style, cw_block_list_width (sheet->blocks));
  double time = 0;
  guint steps = 0;
  g_autofree char *all = NULL, *duration = NULL;

  cw_text_block_add (text, 11, CW_TEXT_BOLD, CW_TEXT_INK, CW_TEXT_NO_LEVEL, _("Totals"));
  for (guint i = 0; i < results->len; i++)
    {
      const CwCanalResult *r = g_ptr_array_index (results, i);
      g_autofree char *line = canal_total (r);

      cw_text_block_add (text, 8, CW_TEXT_REGULAR, CW_TEXT_INK, r->verdict, line);
      time += r->time;
      steps += r->steps->len;
    }
  duration = cw_plan_duration (time);
  all = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "All canals: %u step, estimated time %s",
                                      "All canals: %u steps, estimated time %s", steps), steps, duration);
  cw_text_block_add (text, 8, CW_TEXT_BOLD, CW_TEXT_INK, CW_TEXT_NO_LEVEL, all);
  cw_text_block_append (text, sheet->blocks)->space_before = cw_render_style_font (&sheet->style, 16);
}

/* The footer is measured with the widest page numbers it will carry. */
static void
measure_margins (CwPlanSheet *sheet)
{
  g_autoptr(CwTextBlock) footer = NULL;

  sheet->n_pages = 999;
  footer = footer_text (sheet, 998);
  sheet->footer_height = cw_text_block_height (footer);
  sheet->running_height = cw_render_text_height (&sheet->style, RUNNING_SIZE, CW_TEXT_REGULAR, "Ag", 0) * 2;
}

CwPlanSheet *
cw_plan_sheet_new (const CwCase        *kase,
                   GPtrArray           *results,
                   const CwRenderStyle *style,
                   CwPaper              paper,
                   GDateTime           *date)
{
  CwPlanSheet *sheet;
  g_autoptr(GDateTime) now = NULL;

  g_return_val_if_fail (kase != NULL && results != NULL && style != NULL, NULL);

  if (date == NULL)
    date = now = cw_plan_export_date ();
  sheet = g_new0 (CwPlanSheet, 1);
  sheet->kase = kase;
  sheet->style = *style;
  cw_paper_size (paper, &sheet->width, &sheet->height);
  sheet->date = cw_plan_date_text (date);
  sheet->blocks = cw_block_list_new (sheet->width - 2 * MARGIN);
  measure_margins (sheet);
  add_case_header (sheet, results);
  for (guint i = 0; i < results->len; i++)
    cw_canal_section_add_blocks (sheet->blocks, g_ptr_array_index (results, i), style, CW_SECTION_SHEET);
  add_totals (sheet, results);
  sheet->placements = cw_block_list_paginate (sheet->blocks, sheet->height - 2 * MARGIN
                                              - sheet->footer_height - sheet->running_height,
                                              &sheet->n_pages);
  return sheet;
}

void
cw_plan_sheet_free (CwPlanSheet *sheet)
{
  if (sheet == NULL)
    return;
  g_free (sheet->date);
  cw_block_list_free (sheet->blocks);
  g_clear_pointer (&sheet->placements, g_array_unref);
  g_free (sheet);
}

guint
cw_plan_sheet_get_n_pages (CwPlanSheet *sheet)
{
  return sheet->n_pages;
}

static void
draw_frame (CwPlanSheet *sheet,
            cairo_t     *cr,
            guint        page)
{
  const CwPalette *pal = cw_render_style_palette (&sheet->style);
  g_autoptr(CwTextBlock) footer = footer_text (sheet, page);
  g_autofree char *head = running_head (sheet->kase);
  double foot_y = sheet->height - MARGIN - sheet->footer_height;

  cw_render_set_rgb (cr, &pal->background);
  cairo_paint (cr);
  if (page > 0)
    {
      cw_render_set_rgb (cr, &pal->muted);
      cw_render_text_line (cr, &sheet->style, RUNNING_SIZE, CW_TEXT_REGULAR, head,
                           MARGIN, MARGIN, CW_ALIGN_START, CW_ALIGN_START);
    }
  cw_render_set_rgb (cr, &pal->rule);
  cairo_set_line_width (cr, cw_render_style_line (&sheet->style, 0.5));
  cairo_move_to (cr, MARGIN, foot_y - 4);
  cairo_line_to (cr, sheet->width - MARGIN, foot_y - 4);
  cairo_stroke (cr);
  cw_text_block_draw (footer, cr, MARGIN, foot_y);
}

void
cw_plan_sheet_draw_page (CwPlanSheet *sheet,
                         cairo_t     *cr,
                         guint        page)
{
  double top = MARGIN + (page > 0 ? sheet->running_height : 0);

  g_return_if_fail (page < sheet->n_pages);

  cairo_save (cr);
  draw_frame (sheet, cr, page);
  for (guint i = 0; i < sheet->placements->len; i++)
    {
      const CwPlacement *p = &g_array_index (sheet->placements, CwPlacement, i);
      const CwBlock *b = cw_block_list_get (sheet->blocks, p->block);

      if (p->page != page)
        continue;
      cairo_save (cr);
      b->draw (cr, b->data, b->index, MARGIN, top + p->y, cw_block_list_width (sheet->blocks));
      cairo_restore (cr);
    }
  cairo_restore (cr);
}
