/* cw-render-blocks.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include "cw-render-blocks.h"

struct _CwBlockList
{
  double     width;
  GArray    *blocks;   /* CwBlock */
  GPtrArray *owned;    /* whatever the blocks' data needs kept alive */
};

typedef struct
{
  gpointer       data;
  GDestroyNotify free_func;
} Owned;

static void
owned_free (gpointer p)
{
  Owned *o = p;

  o->free_func (o->data);
  g_free (o);
}

CwBlockList *
cw_block_list_new (double width)
{
  CwBlockList *list = g_new0 (CwBlockList, 1);

  list->width = width;
  list->blocks = g_array_new (FALSE, TRUE, sizeof (CwBlock));
  list->owned = g_ptr_array_new_with_free_func (owned_free);
  return list;
}

void
cw_block_list_free (CwBlockList *list)
{
  if (list == NULL)
    return;
  g_array_unref (list->blocks);
  g_ptr_array_unref (list->owned);
  g_free (list);
}

double
cw_block_list_width (CwBlockList *list)
{
  return list->width;
}

CwBlock *
cw_block_list_add (CwBlockList *list,
                   double       height,
                   CwBlockDraw  draw,
                   gpointer     data,
                   guint        index)
{
  CwBlock block = { height, 0, FALSE, -1, draw, data, index };

  g_array_append_val (list->blocks, block);
  return &g_array_index (list->blocks, CwBlock, list->blocks->len - 1);
}

guint
cw_block_list_last (CwBlockList *list)
{
  g_return_val_if_fail (list->blocks->len > 0, 0);
  return list->blocks->len - 1;
}

void
cw_block_list_own (CwBlockList    *list,
                   gpointer        data,
                   GDestroyNotify  free_func)
{
  Owned *o = g_new (Owned, 1);

  o->data = data;
  o->free_func = free_func;
  g_ptr_array_add (list->owned, o);
}

guint
cw_block_list_length (CwBlockList *list)
{
  return list->blocks->len;
}

CwBlock *
cw_block_list_get (CwBlockList *list,
                   guint        index)
{
  g_return_val_if_fail (index < list->blocks->len, NULL);
  return &g_array_index (list->blocks, CwBlock, index);
}

double
cw_block_list_height (CwBlockList *list)
{
  double height = 0;

  for (guint i = 0; i < list->blocks->len; i++)
    {
      const CwBlock *b = cw_block_list_get (list, i);

      height += (i > 0 ? b->space_before : 0) + b->height;
    }
  return height;
}

static void
draw_block (CwBlockList   *list,
            const CwBlock *b,
            cairo_t       *cr,
            double         x,
            double         y)
{
  cairo_save (cr);
  b->draw (cr, b->data, b->index, x, y, list->width);
  cairo_restore (cr);
}

void
cw_block_list_draw (CwBlockList *list,
                    cairo_t     *cr,
                    double       x,
                    double       y)
{
  for (guint i = 0; i < list->blocks->len; i++)
    {
      const CwBlock *b = cw_block_list_get (list, i);

      y += i > 0 ? b->space_before : 0;
      draw_block (list, b, cr, x, y);
      y += b->height;
    }
}

/* The height block i needs at the foot of a page: itself, and the blocks
 * it must stay with. */
static double
needed (CwBlockList *list,
        guint        i)
{
  const CwBlock *b = cw_block_list_get (list, i);
  double h = b->height;

  while (b->keep_with_next && i + 1 < list->blocks->len)
    {
      b = cw_block_list_get (list, ++i);
      h += b->space_before + b->height;
    }
  return h;
}

static void
place (GArray *out,
       guint   block,
       guint   page,
       double  y)
{
  CwPlacement p = { block, page, y };

  g_array_append_val (out, p);
}

GArray *
cw_block_list_paginate (CwBlockList *list,
                        double       page_height,
                        guint       *n_pages)
{
  GArray *out = g_array_new (FALSE, FALSE, sizeof (CwPlacement));
  guint page = 0;
  double y = 0;

  for (guint i = 0; i < list->blocks->len; i++)
    {
      const CwBlock *b = cw_block_list_get (list, i);
      double gap = y > 0 ? b->space_before : 0;

      if (y > 0 && y + gap + needed (list, i) > page_height)
        {
          page++;
          y = gap = 0;
          /* A table that runs on gets its column heads again. */
          if (b->header >= 0 && (guint) b->header != i - 1)
            {
              place (out, (guint) b->header, page, 0);
              y = cw_block_list_get (list, (guint) b->header)->height;
            }
        }
      place (out, i, page, y + gap);
      y += gap + b->height;
    }
  *n_pages = page + 1;
  return out;
}
