/* cw-canal-path.h: the canal's centreline in the plane of the drawing
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-canal.h"

G_BEGIN_DECLS

/* Millimetres, x to the right, y downwards, the reference point (s = 0) at
 * the origin.  The canal leaves the reference point straight down; the first
 * curve turns towards +x (to the right of the drawing), a second curve turns
 * back towards -x, which makes the S-shape.  Each curve is a true circular
 * arc of its radius through its turning angle.  Before s = 0 and after the
 * last curve the centreline runs on straight.
 *
 * A lateral offset is measured along the normal n = (cos a, -sin a), a the
 * heading (0 straight down, growing as the canal turns towards +x): on the
 * straight part a positive offset lies to the right, on the first curve it
 * lies on the inside of the bend. */
typedef struct
{
  double s0;       /* arc length where the piece starts */
  double x0, y0;   /* its first point */
  double a0;       /* its first heading, radians */
  double turn;     /* +1 or -1 along an arc, 0 along a straight piece */
  double radius;
  double length;   /* G_MAXDOUBLE for the last piece */
} CwPathPiece;

typedef struct
{
  guint       n_pieces;
  CwPathPiece pieces[2 * CW_MAX_CURVES + 1];
} CwCanalPath;

void    cw_canal_path_init     (CwCanalPath       *path,
                                const CwGeometry  *geometry);
void    cw_canal_path_point    (const CwCanalPath *path,
                                double             s,
                                double             offset,
                                double            *x,
                                double            *y);
double  cw_canal_path_heading  (const CwCanalPath *path,
                                double             s);
double  cw_canal_path_nearest  (const CwCanalPath *path,
                                double             x,
                                double             y,
                                double             s_min,
                                double             s_max,
                                double            *offset);
gboolean cw_canal_path_is_curved (const CwCanalPath *path,
                                  double             s0,
                                  double             s1);

G_END_DECLS
