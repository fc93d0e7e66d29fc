/* cw-canal-path.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <math.h>

#include "cw-canal-path.h"

/* Where a piece ends: position and heading after length u along it. */
static void
piece_at (const CwPathPiece *p,
          double             u,
          double            *x,
          double            *y,
          double            *a)
{
  if (p->turn == 0)
    {
      *a = p->a0;
      *x = p->x0 + u * sin (p->a0);
      *y = p->y0 + u * cos (p->a0);
      return;
    }
  /* Heading t = (sin a, cos a) with da/du = turn / R integrates to this. */
  *a = p->a0 + p->turn * u / p->radius;
  *x = p->x0 + p->turn * p->radius * (cos (p->a0) - cos (*a));
  *y = p->y0 + p->turn * p->radius * (sin (*a) - sin (p->a0));
}

static void
add_piece (CwCanalPath *path,
           double       s0,
           double       length,
           double       turn,
           double       radius)
{
  CwPathPiece *p = &path->pieces[path->n_pieces];
  double x = 0, y = 0, a = 0;

  if (path->n_pieces > 0)
    {
      const CwPathPiece *prev = p - 1;

      piece_at (prev, prev->length, &x, &y, &a);
    }
  *p = (CwPathPiece) { s0, x, y, a, turn, radius, length };
  path->n_pieces++;
}

void
cw_canal_path_init (CwCanalPath      *path,
                    const CwGeometry *geometry)
{
  double s = 0;

  path->n_pieces = 0;
  for (guint i = 0; i < geometry->n_curves; i++)
    {
      double onset = MAX (geometry->onset[i], s);

      if (onset > s)
        add_piece (path, s, onset - s, 0, 0);
      add_piece (path, onset, geometry->radius[i] * geometry->phi[i],
                 i % 2 == 0 ? 1.0 : -1.0, geometry->radius[i]);
      s = onset + geometry->radius[i] * geometry->phi[i];
    }
  add_piece (path, s, G_MAXDOUBLE, 0, 0);
}

static const CwPathPiece *
piece_for (const CwCanalPath *path,
           double             s)
{
  guint i = path->n_pieces - 1;

  while (i > 0 && s < path->pieces[i].s0)
    i--;
  return &path->pieces[i];
}

void
cw_canal_path_point (const CwCanalPath *path,
                     double             s,
                     double             offset,
                     double            *x,
                     double            *y)
{
  const CwPathPiece *p = piece_for (path, s);
  double u = s - p->s0, a, cx, cy;

  if (u < 0)
    {
      /* Above the reference point the first, straight, piece runs on. */
      cx = p->x0 + u * sin (p->a0);
      cy = p->y0 + u * cos (p->a0);
      a = p->a0;
    }
  else
    piece_at (p, u, &cx, &cy, &a);
  *x = cx + offset * cos (a);
  *y = cy - offset * sin (a);
}

double
cw_canal_path_heading (const CwCanalPath *path,
                       double             s)
{
  const CwPathPiece *p = piece_for (path, s);
  double x, y, a;

  piece_at (p, MAX (s - p->s0, 0), &x, &y, &a);
  return a;
}

/* The arc length on piece p, within [u0, u1], nearest to (x, y). */
static double
piece_nearest (const CwPathPiece *p,
               double             x,
               double             y,
               double             u0,
               double             u1)
{
  double cx, cy, vx, vy, a, delta;

  if (p->turn == 0)
    return CLAMP ((x - p->x0) * sin (p->a0) + (y - p->y0) * cos (p->a0), u0, u1);
  /* The centre of the arc lies turn * R along the normal of its first point. */
  cx = p->x0 + p->turn * p->radius * cos (p->a0);
  cy = p->y0 - p->turn * p->radius * sin (p->a0);
  vx = x - cx;
  vy = y - cy;
  if (hypot (vx, vy) < 1e-12)
    return u0;
  a = atan2 (p->turn * vy, -p->turn * vx);
  delta = remainder (p->turn * (a - p->a0) - p->length / (2 * p->radius), 2 * G_PI)
          + p->length / (2 * p->radius);
  return CLAMP (delta * p->radius, u0, u1);
}

/* The arc length in [s_min, s_max] of the centreline point nearest to
 * (x, y), all in millimetres; *offset gets the signed lateral distance. */
double
cw_canal_path_nearest (const CwCanalPath *path,
                       double             x,
                       double             y,
                       double             s_min,
                       double             s_max,
                       double            *offset)
{
  double best_s = s_min, best_d = G_MAXDOUBLE;

  for (guint i = 0; i < path->n_pieces; i++)
    {
      const CwPathPiece *p = &path->pieces[i];
      double lo = (i == 0 ? s_min : MAX (p->s0, s_min)) - p->s0;
      double hi = MIN (i + 1 < path->n_pieces ? path->pieces[i + 1].s0 : s_max, s_max) - p->s0;
      double u, px, py;

      if (hi < lo)
        continue;
      u = p->turn == 0 ? CLAMP ((x - p->x0) * sin (p->a0) + (y - p->y0) * cos (p->a0), lo, hi)
                       : piece_nearest (p, x, y, MAX (lo, 0), hi);
      cw_canal_path_point (path, p->s0 + u, 0, &px, &py);
      if (hypot (x - px, y - py) < best_d)
        {
          best_d = hypot (x - px, y - py);
          best_s = p->s0 + u;
        }
    }
  if (offset)
    {
      double a = cw_canal_path_heading (path, best_s), px, py;

      cw_canal_path_point (path, best_s, 0, &px, &py);
      *offset = (x - px) * cos (a) - (y - py) * sin (a);
    }
  return best_s;
}

gboolean
cw_canal_path_is_curved (const CwCanalPath *path,
                         double             s0,
                         double             s1)
{
  for (guint i = 0; i < path->n_pieces; i++)
    {
      const CwPathPiece *p = &path->pieces[i];

      if (p->turn != 0 && p->s0 < s1 && p->s0 + p->length > s0)
        return TRUE;
    }
  return FALSE;
}
