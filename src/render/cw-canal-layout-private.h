/* cw-canal-layout-private.h: what the canal drawing reads from its layout
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-canal-layout.h"
#include "cw-canal-path.h"

G_BEGIN_DECLS

/* Sizes of type in points at scale 1. */
#define CW_LABEL_SIZE 8.0
#define CW_SMALL_SIZE 6.5
#define CW_LEGEND_SIZE 8.5

struct _CwCanalLayout
{
  CwRenderStyle      style;
  CwCanalLayoutFlags flags;
  CwCanalPath        path;
  CwGeometry         geometry;
  double             working_length;
  double             orifice;
  double             s_top;          /* the drawing runs from here ... */
  double             s_end;          /* ... to here */
  double             width_factor;
  double             scale;          /* device units per millimetre */
  double             ox, oy;         /* device point of the canal's (0, 0) */
  double             label_width;    /* the label column left of the canal */
  double             leader;         /* its part taken by the leaders */
  cairo_rectangle_t  area;
  cairo_rectangle_t  canal;          /* the canal with its walls */
  cairo_rectangle_t  scale_bar;
  cairo_rectangle_t  legend;
};

typedef struct
{
  double   s;
  char    *label;
  gboolean major;   /* the working length, drawn heavier */
} CwCanalMark;

typedef struct
{
  CwLevel  level;
  gboolean heading;
  char    *text;
} CwLegendLine;

GArray    *cw_canal_marks_collect     (const CwCanalLayout  *layout);
GPtrArray *cw_canal_legend_lines      (const CwCanalResult  *result,
                                       int                   step);
double     cw_canal_legend_height     (const CwRenderStyle  *style,
                                       GPtrArray            *lines,
                                       double                width);
void       cw_canal_legend_draw       (cairo_t              *cr,
                                       const CwCanalLayout  *layout,
                                       const CwCanalResult  *result,
                                       int                   step);
void       cw_canal_marks_draw        (cairo_t              *cr,
                                       const CwCanalLayout  *layout,
                                       const CwPwl          *walls);
void       cw_canal_scale_bar_draw    (cairo_t              *cr,
                                       const CwCanalLayout  *layout);
void       cw_canal_ceiling_draw      (cairo_t              *cr,
                                       const CwCanalLayout  *layout,
                                       const CwStepResult   *step,
                                       const CwPwl          *walls);
void       cw_canal_offset_path       (cairo_t              *cr,
                                       const CwCanalLayout  *layout,
                                       const CwPwl          *diameter,
                                       double                side,
                                       double                s0,
                                       double                s1);
void       cw_canal_band_path         (cairo_t              *cr,
                                       const CwCanalLayout  *layout,
                                       const CwPwl          *diameter,
                                       double                s0,
                                       double                s1);
void       cw_canal_file_draw         (cairo_t              *cr,
                                       const CwCanalLayout  *layout,
                                       const CwStepResult   *step);
CwPwl     *cw_canal_file_diameter     (const CwStepResult   *step,
                                       double                s_top);
double     cw_canal_ceiling_label_width (const CwRenderStyle *style,
                                         CwCanalLayoutFlags   flags);

G_END_DECLS
