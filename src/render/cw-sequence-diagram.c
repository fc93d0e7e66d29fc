/* cw-sequence-diagram.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>

#include "config.h"
#include "cw-canal-section.h"
#include "cw-plan-text.h"
#include "cw-sequence-diagram.h"
#include "cw-text-block.h"

#define TITLE_SIZE 14.0
#define FOOTER_SIZE 7.0

struct _CwSequenceDiagram
{
  CwRenderStyle style;
  double        width;
  double        margin;
  CwBlockList  *blocks;
};

static void
add_header (CwSequenceDiagram *d,
            const CwCase      *kase,
            const CwCanal     *canal)
{
  CwTextBlock *text = cw_text_block_new (&d->style, cw_block_list_width (d->blocks));
  g_autofree char *tooth = cw_plan_tooth_text (kase);
  g_autofree char *line = g_strdup_printf (_("%s · canal %s"), tooth, canal->name);

  cw_text_block_add (text, TITLE_SIZE, CW_TEXT_BOLD, CW_TEXT_INK, CW_TEXT_NO_LEVEL,
                     kase->title && *kase->title ? kase->title : _("Untitled case"));
  cw_text_block_add (text, 9, CW_TEXT_REGULAR, CW_TEXT_INK, CW_TEXT_NO_LEVEL, line);
  cw_text_block_append (text, d->blocks);
}

static void
add_footer (CwSequenceDiagram *d,
            GDateTime         *date)
{
  CwTextBlock *text = cw_text_block_new (&d->style, cw_block_list_width (d->blocks));
  g_autofree char *day = cw_plan_date_text (date);
  g_autofree char *made = g_strdup_printf (_("Exported on %s by Canalwright %s"), day, PACKAGE_VERSION);

  cw_text_block_add (text, FOOTER_SIZE, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, cw_plan_cautions ());
  cw_text_block_add (text, FOOTER_SIZE, CW_TEXT_REGULAR, CW_TEXT_MUTED, CW_TEXT_NO_LEVEL, made);
  cw_text_block_append (text, d->blocks)->space_before = cw_render_style_font (&d->style, 14);
}

CwSequenceDiagram *
cw_sequence_diagram_new (const CwCase        *kase,
                         const CwCanalResult *result,
                         const CwRenderStyle *style,
                         double               width,
                         GDateTime           *date)
{
  CwSequenceDiagram *d;
  g_autoptr(GDateTime) now = NULL;

  g_return_val_if_fail (kase != NULL && result != NULL && style != NULL, NULL);

  if (date == NULL)
    date = now = cw_plan_export_date ();
  d = g_new0 (CwSequenceDiagram, 1);
  d->style = *style;
  d->width = width;
  d->margin = cw_render_style_font (style, 24);
  d->blocks = cw_block_list_new (width - 2 * d->margin);
  add_header (d, kase, result->canal);
  cw_canal_section_add_blocks (d->blocks, result, style, CW_SECTION_DIAGRAM);
  add_footer (d, date);
  return d;
}

void
cw_sequence_diagram_free (CwSequenceDiagram *diagram)
{
  if (diagram == NULL)
    return;
  cw_block_list_free (diagram->blocks);
  g_free (diagram);
}

void
cw_sequence_diagram_get_size (CwSequenceDiagram *diagram,
                              double            *width,
                              double            *height)
{
  *width = diagram->width;
  *height = cw_block_list_height (diagram->blocks) + 2 * diagram->margin;
}

void
cw_sequence_diagram_draw (CwSequenceDiagram *diagram,
                          cairo_t           *cr)
{
  double w, h;

  cw_sequence_diagram_get_size (diagram, &w, &h);
  cairo_save (cr);
  cw_render_set_rgb (cr, &cw_render_style_palette (&diagram->style)->background);
  cairo_rectangle (cr, 0, 0, w, h);
  cairo_fill (cr);
  cw_block_list_draw (diagram->blocks, cr, diagram->margin, diagram->margin);
  cairo_restore (cr);
}
