/* cw-pwl.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-pwl"

#include <math.h>

#include "cw-pwl.h"

struct _CwPwl
{
  GArray *points;
};

CwPwl *
cw_pwl_new (void)
{
  CwPwl *self = g_new0 (CwPwl, 1);

  self->points = g_array_sized_new (FALSE, FALSE, sizeof (CwPoint), 16);
  return self;
}

CwPwl *
cw_pwl_new_linear (double s0,
                   double v0,
                   double s1,
                   double v1)
{
  CwPwl *self = cw_pwl_new ();

  cw_pwl_append (self, s0, v0);
  cw_pwl_append (self, s1, v1);
  return self;
}

CwPwl *
cw_pwl_copy (const CwPwl *pwl)
{
  CwPwl *self = g_new0 (CwPwl, 1);

  g_return_val_if_fail (pwl != NULL, NULL);

  self->points = g_array_copy (pwl->points);
  return self;
}

void
cw_pwl_free (CwPwl *pwl)
{
  if (pwl == NULL)
    return;
  g_array_unref (pwl->points);
  g_free (pwl);
}

void
cw_pwl_append (CwPwl  *pwl,
               double  s,
               double  v)
{
  CwPoint p = { s, v };

  g_return_if_fail (pwl != NULL);
  g_return_if_fail (pwl->points->len == 0 ||
                    s >= g_array_index (pwl->points, CwPoint, pwl->points->len - 1).s);

  g_array_append_val (pwl->points, p);
}

guint
cw_pwl_get_n_points (const CwPwl *pwl)
{
  return pwl->points->len;
}

const CwPoint *
cw_pwl_get_points (const CwPwl *pwl)
{
  return (const CwPoint *) (gpointer) pwl->points->data;
}

/* Index of the first point with p.s >= s (n when none). */
static guint
lower_bound (const CwPwl *pwl,
             double       s)
{
  const CwPoint *p = cw_pwl_get_points (pwl);
  guint lo = 0, hi = pwl->points->len;

  while (lo < hi)
    {
      guint mid = (lo + hi) / 2;

      if (p[mid].s < s)
        lo = mid + 1;
      else
        hi = mid;
    }
  return lo;
}

double
cw_pwl_eval_side (const CwPwl *pwl,
                  double       s,
                  CwSide       side)
{
  const CwPoint *p = cw_pwl_get_points (pwl);
  guint n = pwl->points->len;
  guint i;

  if (n == 0)
    return NAN;
  i = lower_bound (pwl, s);
  if (i == n)
    return p[n - 1].v;
  if (p[i].s == s)
    {
      if (side == CW_SIDE_LEFT)
        return p[i].v;
      while (i + 1 < n && p[i + 1].s == s)
        i++;
      return p[i].v;
    }
  if (i == 0)
    return p[0].v;
  return p[i - 1].v + (p[i].v - p[i - 1].v) * (s - p[i - 1].s) / (p[i].s - p[i - 1].s);
}

double
cw_pwl_eval (const CwPwl *pwl,
             double       s)
{
  const CwPoint *p = cw_pwl_get_points (pwl);
  guint n = pwl->points->len;
  guint i = lower_bound (pwl, s);
  double best;

  if (i == n || p[i].s != s)
    return cw_pwl_eval_side (pwl, s, CW_SIDE_LEFT);
  best = p[i].v;
  for (; i < n && p[i].s == s; i++)
    best = MAX (best, p[i].v);
  return best;
}

static int
compare_doubles (gconstpointer a,
                 gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

void
cw_sort_unique_doubles (GArray *values)
{
  double *v;
  guint out = 0;

  g_array_sort (values, compare_doubles);
  v = (double *) (gpointer) values->data;
  for (guint i = 0; i < values->len; i++)
    if (out == 0 || v[i] != v[out - 1])
      v[out++] = v[i];
  g_array_set_size (values, out);
}

void
cw_pwl_collect_breaks (const CwPwl *pwl,
                       double       a,
                       double       b,
                       GArray      *out)
{
  const CwPoint *p = cw_pwl_get_points (pwl);

  for (guint i = lower_bound (pwl, a); i < pwl->points->len && p[i].s <= b; i++)
    g_array_append_val (out, p[i].s);
}

static void
push (GArray *out,
      double  s,
      double  v)
{
  CwPoint p = { s, v };

  if (out->len > 0)
    {
      CwPoint *last = &g_array_index (out, CwPoint, out->len - 1);

      if (last->s == s && last->v == v)
        return;
    }
  g_array_append_val (out, p);
}

/* Drop points that lie on the line through their neighbours, so that the
 * envelope does not grow with every step that leaves it unchanged. */
static void
simplify (GArray *points)
{
  CwPoint *p = (CwPoint *) (gpointer) points->data;
  guint out = 0;

  for (guint i = 0; i < points->len; i++)
    {
      if (out >= 2 && i + 1 <= points->len)
        {
          CwPoint *a = &p[out - 2], *b = &p[out - 1], *c = &p[i];

          if (a->s < b->s && b->s < c->s)
            {
              double expect = a->v + (c->v - a->v) * (b->s - a->s) / (c->s - a->s);

              if (fabs (expect - b->v) <= 1e-12)
                out--;
            }
        }
      p[out++] = p[i];
    }
  g_array_set_size (points, out);
}

static void
raise_piece (GArray      *out,
             const CwPwl *self,
             const CwPwl *other,
             double       u,
             double       w)
{
  double pu = cw_pwl_eval_side (self, u, CW_SIDE_RIGHT);
  double pw = cw_pwl_eval_side (self, w, CW_SIDE_LEFT);
  double ou = cw_pwl_eval_side (other, u, CW_SIDE_RIGHT);
  double ow = cw_pwl_eval_side (other, w, CW_SIDE_LEFT);
  double du = ou - pu, dw = ow - pw;

  if ((du > 0 && dw < 0) || (du < 0 && dw > 0))
    {
      double f = du / (du - dw);

      push (out, u + (w - u) * f, pu + (pw - pu) * f);
    }
  push (out, w, MAX (pw, ow));
}

/* self = max (self, other) on [a, b].  other must be defined there; outside
 * [a, b] self keeps its values, so the edges of the cut become jumps. */
void
cw_pwl_raise (CwPwl       *pwl,
              const CwPwl *other,
              double       a,
              double       b)
{
  g_autoptr(GArray) grid = g_array_new (FALSE, FALSE, sizeof (double));
  GArray *out;
  const CwPoint *p = cw_pwl_get_points (pwl);
  guint i;

  g_return_if_fail (pwl != NULL && other != NULL);
  if (!(b > a))
    return;

  g_array_append_val (grid, a);
  g_array_append_val (grid, b);
  cw_pwl_collect_breaks (pwl, a, b, grid);
  cw_pwl_collect_breaks (other, a, b, grid);
  cw_sort_unique_doubles (grid);

  out = g_array_sized_new (FALSE, FALSE, sizeof (CwPoint), pwl->points->len + grid->len * 2 + 4);
  for (i = 0; i < pwl->points->len && p[i].s < a; i++)
    push (out, p[i].s, p[i].v);
  push (out, a, cw_pwl_eval_side (pwl, a, CW_SIDE_LEFT));
  push (out, a, MAX (cw_pwl_eval_side (pwl, a, CW_SIDE_RIGHT),
                     cw_pwl_eval_side (other, a, CW_SIDE_RIGHT)));
  for (guint k = 0; k + 1 < grid->len; k++)
    {
      double u = g_array_index (grid, double, k);
      double w = g_array_index (grid, double, k + 1);

      raise_piece (out, pwl, other, u, w);
      if (k + 2 < grid->len)
        push (out, w, MAX (cw_pwl_eval_side (pwl, w, CW_SIDE_RIGHT),
                           cw_pwl_eval_side (other, w, CW_SIDE_RIGHT)));
    }
  push (out, b, cw_pwl_eval_side (pwl, b, CW_SIDE_RIGHT));
  for (; i < pwl->points->len; i++)
    if (p[i].s > b)
      push (out, p[i].s, p[i].v);

  simplify (out);
  g_array_unref (pwl->points);
  pwl->points = out;
}
