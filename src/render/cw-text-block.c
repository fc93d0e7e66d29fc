/* cw-text-block.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include "cw-text-block.h"

typedef struct
{
  PangoLayout *layout;
  CwTextTone   tone;
  int          level;
  double       size;
} Paragraph;

struct _CwTextBlock
{
  CwRenderStyle style;
  double        width;
  GArray       *paragraphs;
};

static void
paragraph_clear (gpointer data)
{
  g_clear_object (&((Paragraph *) data)->layout);
}

CwTextBlock *
cw_text_block_new (const CwRenderStyle *style,
                   double               width)
{
  CwTextBlock *block = g_new0 (CwTextBlock, 1);

  block->style = *style;
  block->width = width;
  block->paragraphs = g_array_new (FALSE, TRUE, sizeof (Paragraph));
  g_array_set_clear_func (block->paragraphs, paragraph_clear);
  return block;
}

void
cw_text_block_free (CwTextBlock *block)
{
  if (block == NULL)
    return;
  g_array_unref (block->paragraphs);
  g_free (block);
}

static double
mark_room (const CwTextBlock *block,
           const Paragraph   *p)
{
  return p->level == CW_TEXT_NO_LEVEL ? 0 : cw_render_style_font (&block->style, p->size * 1.6);
}

void
cw_text_block_add (CwTextBlock *block,
                   double       size,
                   CwTextFlags  flags,
                   CwTextTone   tone,
                   int          level,
                   const char  *text)
{
  Paragraph p = { NULL, tone, level, size };

  p.layout = cw_render_text_wrapped (&block->style, size, flags, text,
                                     block->width - mark_room (block, &p));
  g_array_append_val (block->paragraphs, p);
}

static double
spacing (const CwTextBlock *block)
{
  return cw_render_style_font (&block->style, 2);
}

double
cw_text_block_height (CwTextBlock *block)
{
  double height = 0;

  for (guint i = 0; i < block->paragraphs->len; i++)
    {
      double h;

      cw_render_text_size (g_array_index (block->paragraphs, Paragraph, i).layout, NULL, &h);
      height += h + (i > 0 ? spacing (block) : 0);
    }
  return height;
}

void
cw_text_block_draw (CwTextBlock *block,
                    cairo_t     *cr,
                    double       x,
                    double       y)
{
  const CwPalette *pal = cw_render_style_palette (&block->style);

  for (guint i = 0; i < block->paragraphs->len; i++)
    {
      const Paragraph *p = &g_array_index (block->paragraphs, Paragraph, i);
      double room = mark_room (block, p), h;

      cw_render_text_size (p->layout, NULL, &h);
      if (p->level != CW_TEXT_NO_LEVEL)
        {
          double line = pango_layout_get_baseline (p->layout) / (double) PANGO_SCALE;
          double size = cw_render_style_font (&block->style, p->size * 0.9);

          cw_render_level_mark (cr, &block->style, (CwLevel) p->level, x + size / 2,
                                y + line - size * 0.4, size);
        }
      cw_render_set_rgb (cr, p->tone == CW_TEXT_MUTED ? &pal->muted : &pal->ink);
      cw_render_text_draw (cr, p->layout, x + room, y, CW_ALIGN_START, CW_ALIGN_START);
      y += h + spacing (block);
    }
}

static void
draw_cb (cairo_t  *cr,
         gpointer  data,
         guint     index,
         double    x,
         double    y,
         double    width)
{
  cw_text_block_draw (data, cr, x, y);
}

CwBlock *
cw_text_block_append (CwTextBlock *block,
                      CwBlockList *list)
{
  cw_block_list_own (list, block, (GDestroyNotify) cw_text_block_free);
  return cw_block_list_add (list, cw_text_block_height (block), draw_cb, block, 0);
}
