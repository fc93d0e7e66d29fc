/* cw-render-blocks.h: drawings stacked down a page, never split
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>
#include <glib.h>

G_BEGIN_DECLS

typedef void (*CwBlockDraw) (cairo_t  *cr,
                             gpointer  data,
                             guint     index,
                             double    x,
                             double    y,
                             double    width);

/* A block is drawn whole on one page: a heading, a row of panels, a table
 * row with its findings.  A block with a header (a table row) gets that
 * header again when it opens a page. */
typedef struct
{
  double      height;
  double      space_before;
  gboolean    keep_with_next;
  int         header;         /* index of the block to repeat, or -1 */
  CwBlockDraw draw;
  gpointer    data;
  guint       index;
} CwBlock;

typedef struct _CwBlockList CwBlockList;

CwBlockList *cw_block_list_new      (double          width);
void         cw_block_list_free     (CwBlockList    *list);
double       cw_block_list_width    (CwBlockList    *list);
CwBlock     *cw_block_list_add      (CwBlockList    *list,
                                     double          height,
                                     CwBlockDraw     draw,
                                     gpointer        data,
                                     guint           index);
guint        cw_block_list_last     (CwBlockList    *list);
void         cw_block_list_own      (CwBlockList    *list,
                                     gpointer        data,
                                     GDestroyNotify  free_func);
guint        cw_block_list_length   (CwBlockList    *list);
CwBlock     *cw_block_list_get      (CwBlockList    *list,
                                     guint           index);
double       cw_block_list_height   (CwBlockList    *list);
void         cw_block_list_draw     (CwBlockList    *list,
                                     cairo_t        *cr,
                                     double          x,
                                     double          y);

/* Where each block goes when the list flows over pages of the given
 * content height: page[i] and y[i] for block i; repeated headers are
 * listed in the returned array as (block, page, y). */
typedef struct
{
  guint  block;
  guint  page;
  double y;
} CwPlacement;

GArray      *cw_block_list_paginate (CwBlockList    *list,
                                     double          page_height,
                                     guint          *n_pages);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwBlockList, cw_block_list_free)

G_END_DECLS
