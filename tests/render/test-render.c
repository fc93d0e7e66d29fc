/* test-render.c: the canal drawing, its geometry and its pixels, with no
 * display
 *
 * Expected positions are worked by hand from the drawing's conventions
 * (src/render/cw-canal-path.h): millimetres, x to the right, y down, the
 * first curve turning towards +x as a circular arc of its radius.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <locale.h>
#include <math.h>

#include "cw-canal-layout-private.h"
#include "cw-canal-path.h"
#include "cw-canal-renderer.h"
#include "cw-case-loader.h"
#include "cw-plan-sheet.h"
#include "cw-png.h"
#include "cw-render-blocks.h"
#include "cw-render-text.h"
#include "cw-sequence-diagram.h"
#include "cw-test-util.h"

static const char *samples[] = {
  "lower-incisor-straight.cwcase", "lower-molar-moderate.cwcase",
  "severe-curve-rule-breaks.cwcase", "upper-molar-four-canals.cwcase",
  "upper-premolar-s-shape.cwcase",
};

static CwCase *
load_sample (const char *name)
{
  g_autofree char *path = cw_test_sample_path (name);
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load (path, &error);

  g_assert_no_error (error);
  return kase;
}

static void
geometry_one_curve (CwGeometry *g,
                    double      onset,
                    double      degrees,
                    double      radius)
{
  g->n_curves = 1;
  g->onset[0] = onset;
  g->phi[0] = degrees * G_PI / 180;
  g->radius[0] = radius;
  g->end[0] = onset + radius * g->phi[0];
}

static void
test_path_straight (void)
{
  CwGeometry g = { 0 };
  CwCanalPath path;
  double x, y, offset, s;

  cw_canal_path_init (&path, &g);
  cw_canal_path_point (&path, 5, 0, &x, &y);
  cw_assert_near (x, 0, 1e-12);
  cw_assert_near (y, 5, 1e-12);
  /* A positive offset lies to the right, +x, on the straight part. */
  cw_canal_path_point (&path, 5, 1, &x, &y);
  cw_assert_near (x, 1, 1e-12);
  cw_canal_path_point (&path, -1, 0, &x, &y);
  cw_assert_near (y, -1, 1e-12);
  s = cw_canal_path_nearest (&path, 0.3, 7, 0, 20, &offset);
  cw_assert_near (s, 7, 1e-12);
  cw_assert_near (offset, 0.3, 1e-12);
}

/* Onset 10, 90 degrees on R = 4: the arc's centre is (4, 10), its end
 * (4, 14) heading along +x; halfway, at 45 degrees,
 * (4 - 4 cos 45, 10 + 4 sin 45) = (1.1716, 12.8284). */
static void
test_path_arc (void)
{
  CwGeometry g = { 0 };
  CwCanalPath path;
  double end, x, y;

  geometry_one_curve (&g, 10, 90, 4);
  cw_canal_path_init (&path, &g);
  end = g.end[0];
  cw_canal_path_point (&path, end, 0, &x, &y);
  cw_assert_near (x, 4, 1e-12);
  cw_assert_near (y, 14, 1e-12);
  cw_assert_near (cw_canal_path_heading (&path, end), G_PI / 2, 1e-12);
  cw_canal_path_point (&path, 10 + G_PI, 0, &x, &y);
  cw_assert_near (x, 4 - 4 * cos (G_PI / 4), 1e-12);
  cw_assert_near (y, 10 + 4 * sin (G_PI / 4), 1e-12);
  cw_canal_path_point (&path, end + 3, 0, &x, &y);
  cw_assert_near (x, 7, 1e-12);
  cw_assert_near (y, 14, 1e-12);
  for (double s = 10; s <= end; s += 0.37)
    {
      cw_canal_path_point (&path, s, 0, &x, &y);
      cw_assert_near (hypot (x - 4, y - 10), 4, 1e-12);
    }
  /* On the first curve a positive offset lies on the inside, towards the centre. */
  cw_canal_path_point (&path, 10 + G_PI, 1, &x, &y);
  cw_assert_near (hypot (x - 4, y - 10), 3, 1e-12);
}

/* Two curves of 30 degrees, the second turning back: the canal heads
 * straight down again after both, displaced to the right. */
static void
test_path_s_shape (void)
{
  CwGeometry g = { 0 };
  CwCanalPath path;
  double x0, y0, cx, cy, x, y, a0;

  geometry_one_curve (&g, 8, 30, 8);
  g.n_curves = 2;
  g.onset[1] = 13;
  g.phi[1] = G_PI / 6;
  g.radius[1] = 5;
  g.end[1] = 13 + 5 * G_PI / 6;
  cw_canal_path_init (&path, &g);
  cw_assert_near (cw_canal_path_heading (&path, 12.5), G_PI / 6, 1e-12);
  cw_assert_near (cw_canal_path_heading (&path, 20), 0, 1e-12);
  cw_canal_path_point (&path, 20, 0, &x, &y);
  g_assert_cmpfloat (x, >, 1.0);
  /* The second arc's centre lies R along -n from its first point. */
  cw_canal_path_point (&path, 13, 0, &x0, &y0);
  a0 = cw_canal_path_heading (&path, 13);
  cx = x0 - 5 * cos (a0);
  cy = y0 + 5 * sin (a0);
  for (double s = 13; s <= g.end[1]; s += 0.2)
    {
      cw_canal_path_point (&path, s, 0, &x, &y);
      cw_assert_near (hypot (x - cx, y - cy), 5, 1e-12);
    }
}

typedef void (*CanalFunc) (CwCase *kase, CwCanal *canal, CwCanalResult *result);

static void
each_sample_canal (CanalFunc func)
{
  for (guint i = 0; i < G_N_ELEMENTS (samples); i++)
    {
      g_autoptr(CwCase) kase = load_sample (samples[i]);

      for (guint c = 0; c < kase->canals->len; c++)
        {
          CwCanal *canal = g_ptr_array_index (kase->canals, c);
          g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, canal);

          func (kase, canal, result);
        }
    }
}

static CwCanalLayout *
full_layout (const CwCanalResult *result,
             CwRenderTheme        theme,
             double               x,
             double               y,
             double               w,
             double               h)
{
  CwRenderStyle style;
  cairo_rectangle_t area = { x, y, w, h };

  cw_render_style_init (&style, theme, 1.0);
  return cw_canal_layout_new (result->canal, result, &style, &area, CW_CANAL_LAYOUT_FULL);
}

static void
check_round_trip (CwCase        *kase,
                  CwCanal       *canal,
                  CwCanalResult *result)
{
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 10, 20, 500, 700);

  for (double s = 0; s <= canal->working_length; s += 0.25)
    for (double off = -0.3; off <= 0.3; off += 0.15)
      {
        double x, y, back, offset, distance;

        cw_canal_layout_to_device (layout, s, off, &x, &y);
        back = cw_canal_layout_from_device (layout, x, y, &offset, &distance);
        cw_assert_near (back, s, 1e-6);
        cw_assert_near (offset, off, 1e-6);
        cw_assert_near (distance, fabs (off) * cw_canal_layout_get_width_factor (layout)
                                  * cw_canal_layout_get_scale (layout), 1e-6);
      }
}

static void
test_layout_round_trip (void)
{
  each_sample_canal (check_round_trip);
}

/* Everything drawn lies in the rectangle; lengths along the canal and
 * across it use one scale, the widths times the width factor. */
static void
check_fit (CwCase        *kase,
           CwCanal       *canal,
           CwCanalResult *result)
{
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 10, 20, 400, 600);
  const CwPwl *walls = cw_canal_render_walls (result, CW_RENDER_NO_STEP);
  double k = cw_canal_layout_get_scale (layout), f = cw_canal_layout_get_width_factor (layout);
  double x0, y0, x1, y1;
  cairo_rectangle_t box;

  cw_canal_layout_get_canal_box (layout, &box);
  g_assert_cmpfloat (box.x, >=, 10 - 1e-9);
  g_assert_cmpfloat (box.y, >=, 20 - 1e-9);
  g_assert_cmpfloat (box.x + box.width, <=, 410 + 1e-9);
  g_assert_cmpfloat (box.y + box.height, <=, 620 + 1e-9);
  for (double s = canal->orifice_depth; s <= canal->working_length; s += 0.5)
    for (int side = -1; side <= 1; side += 2)
      {
        cw_canal_layout_to_device (layout, s, side * cw_pwl_eval (walls, s) / 2, &x0, &y0);
        g_assert_cmpfloat (x0, >=, box.x - 1e-6);
        g_assert_cmpfloat (x0, <=, box.x + box.width + 1e-6);
        g_assert_cmpfloat (y0, <=, box.y + box.height + 1e-6);
      }
  cw_canal_layout_to_device (layout, 0, 0, &x0, &y0);
  cw_canal_layout_to_device (layout, 5, 0, &x1, &y1);
  cw_assert_near (hypot (x1 - x0, y1 - y0), 5 * k, 1e-9);
  cw_canal_layout_to_device (layout, 2, 0.5, &x1, &y1);
  cw_canal_layout_to_device (layout, 2, 0, &x0, &y0);
  cw_assert_near (x1 - x0, 0.5 * f * k, 1e-9);
  cw_assert_near (f, CW_RENDER_WIDTH_FACTOR, 0);
}

static void
test_layout_fits (void)
{
  each_sample_canal (check_fit);
}

static void
test_from_device_tip (void)
{
  g_autoptr(CwCase) kase = load_sample ("lower-molar-moderate.cwcase");
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, 0));
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 0, 0, 600, 800);
  double depth = cw_canal_result_get_step (result, 0)->depth, x, y, s, offset, distance;
  double a;

  cw_canal_layout_to_device (layout, depth, 0, &x, &y);
  s = cw_canal_layout_from_device (layout, x, y, &offset, &distance);
  cw_assert_near (s, depth, 1e-9);
  cw_assert_near (distance, 0, 1e-9);
  /* Ten device units across the canal still pick the tip's depth. */
  a = cw_canal_path_heading (&layout->path, depth);
  s = cw_canal_layout_from_device (layout, x + 10 * cos (a), y - 10 * sin (a), &offset, &distance);
  cw_assert_near (s, depth, 1e-9);
  cw_assert_near (distance, 10, 1e-9);
  g_assert_cmpfloat (offset, >, 0);
}

typedef struct
{
  double r, g, b;
} Pixel;

static Pixel
pixel_at (cairo_surface_t *surface,
          double           x,
          double           y)
{
  int stride = cairo_image_surface_get_stride (surface);
  const guint8 *data = cairo_image_surface_get_data (surface);
  int px = (int) floor (x), py = (int) floor (y);
  guint32 v;

  g_assert_cmpint (px, >=, 0);
  g_assert_cmpint (py, >=, 0);
  g_assert_cmpint (px, <, cairo_image_surface_get_width (surface));
  g_assert_cmpint (py, <, cairo_image_surface_get_height (surface));
  v = *(const guint32 *) (gconstpointer) (data + py * stride + px * 4);
  return (Pixel) { (v >> 16 & 0xff) / 255.0, (v >> 8 & 0xff) / 255.0, (v & 0xff) / 255.0 };
}

static double
luminance (Pixel p)
{
  return 0.2126 * p.r + 0.7152 * p.g + 0.0722 * p.b;
}

static double
distance_rgb (Pixel        p,
              const CwRgb *c)
{
  return MAX (MAX (fabs (p.r - c->r), fabs (p.g - c->g)), fabs (p.b - c->b));
}

static cairo_surface_t *
draw (const CwCanalLayout *layout,
      const CwCanalResult *result,
      int                  step,
      int                  width,
      int                  height)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, width, height);
  cairo_t *cr = cairo_create (surface);

  cw_canal_draw (cr, layout, result, step);
  g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_flush (surface);
  return surface;
}

/* The working-length mark crosses the canal: 3 device units outside the
 * right wall at the working length it is ink, 1 mm higher it is not. */
static void
test_working_length_mark (void)
{
  g_autoptr(CwCase) kase = load_sample ("lower-molar-moderate.cwcase");
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, 0));
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 0, 0, 600, 800);
  cairo_surface_t *surface = draw (layout, result, CW_RENDER_NO_STEP, 600, 800);
  const CwPwl *walls = cw_canal_render_walls (result, CW_RENDER_NO_STEP);
  double wl = result->canal->working_length, out = 3 / (layout->scale * layout->width_factor);
  double x, y, darkest = 1;

  cw_canal_layout_to_device (layout, wl, cw_pwl_eval (walls, wl) / 2 + out, &x, &y);
  for (int dx = -1; dx <= 1; dx++)
    for (int dy = -1; dy <= 1; dy++)
      darkest = MIN (darkest, luminance (pixel_at (surface, x + dx, y + dy)));
  g_assert_cmpfloat (darkest, <, 0.35);
  cw_canal_layout_to_device (layout, wl - 1, cw_pwl_eval (walls, wl - 1) / 2 + out, &x, &y);
  g_assert_cmpfloat (luminance (pixel_at (surface, x, y)), >, 0.85);
  cairo_surface_destroy (surface);
}

/* At the tip of the selected step the file shows in its ISO handle colour
 * (ISO 3630-1, from memory: 10 purple). */
static void
test_tip_colour (void)
{
  g_autoptr(CwCase) kase = load_sample ("lower-molar-moderate.cwcase");
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, 0));
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 0, 0, 600, 800);
  const CwStepResult *r = cw_canal_result_get_step (result, 0);
  cairo_surface_t *surface = draw (layout, result, 0, 600, 800);
  CwRgb purple = cw_render_handle_rgb (10);
  double x, y;

  g_assert_cmpfloat (r->instrument->tip, ==, 10);
  g_assert_cmpuint (cw_iso_handle_colour (10), ==, CW_HANDLE_PURPLE);
  g_assert_cmpuint (r->engaged->len, ==, 0);
  cw_canal_layout_to_device (layout, r->depth - 0.15, 0, &x, &y);
  g_assert_cmpfloat (distance_rgb (pixel_at (surface, x, y), &purple), <, 0.03);
  cairo_surface_destroy (surface);
}

/* A white file (15) has a dark outline so that it shows on a light ground. */
static void
test_white_file_outline (void)
{
  g_autoptr(CwCase) kase = load_sample ("lower-molar-moderate.cwcase");
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, 0));
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 0, 0, 600, 800);
  const CwStepResult *r = cw_canal_result_get_step (result, 1);
  cairo_surface_t *surface = draw (layout, result, 1, 600, 800);
  double s = r->depth - 1.0, d = cw_instrument_diameter (r->instrument, 1.0), x, y, darkest = 1;

  g_assert_cmpuint (cw_iso_handle_colour (r->instrument->tip), ==, CW_HANDLE_WHITE);
  cw_canal_layout_to_device (layout, s, 0, &x, &y);
  g_assert_cmpfloat (luminance (pixel_at (surface, x, y)), >, 0.9);
  cw_canal_layout_to_device (layout, s, d / 2, &x, &y);
  for (int dx = -1; dx <= 1; dx++)
    darkest = MIN (darkest, luminance (pixel_at (surface, x + dx, y)));
  g_assert_cmpfloat (darkest, <, 0.5);
  cairo_surface_destroy (surface);
}

/* How many pixels of a 5x5 window are far from the file's colour: the hatch
 * lines, in black or white. */
static guint
off_colour (cairo_surface_t *surface,
            double           x,
            double           y,
            const CwRgb     *fill)
{
  guint n = 0;

  for (int dx = -2; dx <= 2; dx++)
    for (int dy = -2; dy <= 2; dy++)
      n += distance_rgb (pixel_at (surface, x + dx, y + dy), fill) > 0.25;
  return n;
}

static gboolean
near_any (double        s,
          const double *marks,
          guint         n,
          double        clearance)
{
  for (guint i = 0; i < n; i++)
    if (fabs (s - marks[i]) < clearance)
      return TRUE;
  return FALSE;
}

static gboolean
in_engaged (const CwStepResult *r,
            double              s)
{
  for (guint i = 0; i < r->engaged->len; i++)
    {
      const CwPoint *e = &g_array_index (r->engaged, CwPoint, i);

      if (s >= e->s && s <= e->v)
        return TRUE;
    }
  return FALSE;
}

static void
check_hatch_step (const CwCanalResult *result,
                  guint                step,
                  guint               *hatched,
                  guint               *plain)
{
  const CwStepResult *r = cw_canal_result_get_step (result, step);
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_LIGHT, 0, 0, 600, 900);
  cairo_surface_t *surface = draw (layout, result, (int) step, 600, 900);
  CwRgb fill = cw_render_handle_rgb (r->instrument->tip);
  double marks[16] = { r->ceiling_depth, result->canal->working_length, result->canal->orifice_depth };
  guint n_marks = 3;
  double top = MAX (result->canal->orifice_depth, r->depth - r->instrument->flute_length);

  for (guint i = 0; i < r->engaged->len; i++)
    {
      marks[n_marks++] = g_array_index (r->engaged, CwPoint, i).s;
      marks[n_marks++] = g_array_index (r->engaged, CwPoint, i).v;
    }
  for (double s = top + 0.2; s < r->depth - 0.2; s += 0.1)
    {
      double x, y;
      guint n;

      if (near_any (s, marks, n_marks, 0.4))
        continue;
      cw_canal_layout_to_device (layout, s, 0, &x, &y);
      n = off_colour (surface, x, y, &fill);
      if (in_engaged (r, s))
        {
          g_assert_cmpuint (n, >=, 3);
          (*hatched)++;
        }
      else
        {
          g_assert_cmpuint (n, ==, 0);
          (*plain)++;
        }
    }
  cairo_surface_destroy (surface);
}

/* The hatch appears where the step is engaged and nowhere else on the file. */
static void
test_hatch_only_where_engaged (void)
{
  guint hatched = 0, plain = 0;

  for (guint i = 0; i < G_N_ELEMENTS (samples); i++)
    {
      g_autoptr(CwCase) kase = load_sample (samples[i]);

      for (guint c = 0; c < kase->canals->len; c++)
        {
          g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, c));

          for (guint k = 0; k < result->steps->len; k++)
            check_hatch_step (result, k, &hatched, &plain);
        }
    }
  /* Both kinds were really seen. */
  g_assert_cmpuint (hatched, >, 100);
  g_assert_cmpuint (plain, >, 100);
}

static void
test_themes_background (void)
{
  g_autoptr(CwCase) kase = load_sample ("upper-premolar-s-shape.cwcase");
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, 0));

  for (int theme = CW_RENDER_LIGHT; theme <= CW_RENDER_HIGH_CONTRAST; theme++)
    {
      g_autoptr(CwCanalLayout) layout = full_layout (result, theme, 0, 0, 400, 600);
      cairo_surface_t *surface = draw (layout, result, 4, 400, 600);
      CwRenderStyle style;
      const CwPalette *pal;

      cw_render_style_init (&style, theme, 1.0);
      pal = cw_render_style_palette (&style);
      g_assert_cmpfloat (distance_rgb (pixel_at (surface, 1, 1), &pal->background), <, 0.01);
      g_assert_cmpfloat (distance_rgb (pixel_at (surface, 398, 598), &pal->background), <, 0.01);
      if (theme == CW_RENDER_DARK)
        g_assert_cmpfloat (luminance (pixel_at (surface, 1, 1)), <, 0.2);
      cairo_surface_destroy (surface);
    }
}

/* Blocks flow down pages: none crosses a page's foot, a table row that
 * opens a page has its column heads above it, a heading stays with what
 * follows it. */
static void
noop_draw (cairo_t  *cr,
           gpointer  data,
           guint     index,
           double    x,
           double    y,
           double    width)
{
}

static void
test_blocks_paginate (void)
{
  g_autoptr(CwBlockList) list = cw_block_list_new (500);
  g_autoptr(GArray) placed = NULL;
  guint pages, head = 0;
  GRand *rand = g_rand_new_with_seed (7);

  for (guint i = 0; i < 200; i++)
    {
      double h = g_rand_double_range (rand, 5, 120);
      CwBlock *b = cw_block_list_add (list, h, noop_draw, NULL, i);

      b->space_before = 4;
      if (i % 40 == 0)
        {
          b->keep_with_next = TRUE;
          head = i;
        }
      else
        b->header = (int) head;
    }
  placed = cw_block_list_paginate (list, 700, &pages);
  g_assert_cmpuint (pages, >, 5);
  for (guint i = 0; i < placed->len; i++)
    {
      const CwPlacement *p = &g_array_index (placed, CwPlacement, i);
      const CwBlock *b = cw_block_list_get (list, p->block);

      g_assert_cmpfloat (p->y + b->height, <=, 700 + 1e-9);
      if (b->header >= 0 && p->y == 0 && p->page > 0)
        g_assert_not_reached ();  /* a row never opens a page: its heads come first */
      if (b->keep_with_next && i + 1 < placed->len)
        g_assert_cmpuint (g_array_index (placed, CwPlacement, i + 1).page, ==, p->page);
    }
  g_rand_free (rand);
}

static void
check_sheet (const char *name,
             CwPaper     paper)
{
  g_autoptr(CwCase) kase = load_sample (name);
  g_autoptr(GPtrArray) results = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_canal_result_free);
  g_autoptr(CwPlanSheet) sheet = NULL;
  cairo_surface_t *surface;
  cairo_t *cr;
  CwRenderStyle style;
  double w, h;

  for (guint c = 0; c < kase->canals->len; c++)
    g_ptr_array_add (results, cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, c)));
  cw_render_style_init (&style, CW_RENDER_LIGHT, 1.0);
  sheet = cw_plan_sheet_new (kase, results, &style, paper, NULL);
  g_assert_cmpuint (cw_plan_sheet_get_n_pages (sheet), >=, 1);
  cw_paper_size (paper, &w, &h);
  surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR, &(cairo_rectangle_t) { 0, 0, w, h });
  cr = cairo_create (surface);
  for (guint i = 0; i < cw_plan_sheet_get_n_pages (sheet); i++)
    cw_plan_sheet_draw_page (sheet, cr, i);
  g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
}

static void
test_plan_sheets_draw (void)
{
  for (guint i = 0; i < G_N_ELEMENTS (samples); i++)
    {
      check_sheet (samples[i], CW_PAPER_A4);
      check_sheet (samples[i], CW_PAPER_LETTER);
    }
}

static void
check_diagram (CwCase        *kase,
               CwCanal       *canal,
               CwCanalResult *result)
{
  CwRenderStyle style;
  g_autoptr(CwSequenceDiagram) d = NULL;
  cairo_surface_t *surface;
  cairo_t *cr;
  double w, h;

  cw_render_style_init (&style, CW_RENDER_LIGHT, 1.0);
  d = cw_sequence_diagram_new (kase, result, &style, CW_DIAGRAM_WIDTH, NULL);
  cw_sequence_diagram_get_size (d, &w, &h);
  cw_assert_near (w, CW_DIAGRAM_WIDTH, 0);
  g_assert_cmpfloat (h, >, 300);
  surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) ceil (w), (int) ceil (h));
  cr = cairo_create (surface);
  cw_sequence_diagram_draw (d, cr);
  g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
}

static void
test_diagrams_draw (void)
{
  each_sample_canal (check_diagram);
}

/* Pictures follow the user's locale; the JSON stays in C. */
static void
test_locale_numbers (void)
{
  g_autoptr(CwInstrument) file = cw_instrument_new ("r25", 25, 0.04);
  g_autofree char *number = NULL, *taper = NULL, *name = NULL;

  if (setlocale (LC_NUMERIC, "de_DE.UTF-8") == NULL)
    {
      g_test_skip ("de_DE.UTF-8 is not installed (tools/setup-debian.sh adds it)");
      return;
    }
  number = cw_render_number (21.5, 1);
  taper = cw_render_taper (0.04);
  name = cw_render_file_name (file);
  setlocale (LC_NUMERIC, "C");
  g_assert_cmpstr (number, ==, "21,5");
  g_assert_cmpstr (taper, ==, "0,04");
  /* A file's designation reads as it does on the file. */
  g_assert_cmpstr (name, ==, "25/.04");
}

static void
test_file_names (void)
{
  g_autoptr(CwInstrument) plain = cw_instrument_new ("r25", 25, 0.04);
  g_autoptr(CwInstrument) varied = cw_instrument_new ("v25", 25, NAN);
  CwTaperSegment segs[] = { { 4, 0.08 }, { 16, 0.04 } };
  g_autofree char *a = cw_render_file_name (plain);
  g_autofree char *b = NULL, *c = cw_render_taper (0.035);

  cw_instrument_set_segments (varied, segs, 2);
  b = cw_render_file_name (varied);
  g_assert_cmpstr (a, ==, "25/.04");
  g_assert_cmpstr (b, ==, "25/.08→.04");
  g_assert_cmpstr (c, ==, ".035");
}

/* What the quick PNG writer writes, libpng (through cairo) reads back pixel
 * for pixel, and its pHYs chunk holds the resolution in pixels a metre
 * (PNG specification, 2nd edition, 11.3.5.3): 300 dpi = 11811. */
static void
test_png_round_trip (void)
{
  g_autoptr(CwCase) kase = load_sample ("upper-premolar-s-shape.cwcase");
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, 0));
  g_autoptr(CwCanalLayout) layout = full_layout (result, CW_RENDER_DARK, 0, 0, 301, 433);
  cairo_surface_t *surface = draw (layout, result, 4, 301, 433), *back;
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  g_autoptr(GError) error = NULL;
  g_autofree char *path = g_build_filename (g_get_tmp_dir (), "cw-test-render.png", NULL);
  const guint8 *p;

  g_assert_true (cw_png_write (surface, 300, bytes, &error));
  g_assert_no_error (error);
  p = bytes->data + 8 + 25;
  g_assert_cmpmem (p + 4, 4, "pHYs", 4);
  g_assert_cmpuint ((guint32) p[8] << 24 | p[9] << 16 | p[10] << 8 | p[11], ==, 11811);
  g_assert_true (g_file_set_contents (path, (const char *) bytes->data, bytes->len, NULL));
  back = cairo_image_surface_create_from_png (path);
  g_assert_cmpint (cairo_surface_status (back), ==, CAIRO_STATUS_SUCCESS);
  g_assert_cmpint (cairo_image_surface_get_width (back), ==, 301);
  g_assert_cmpint (cairo_image_surface_get_height (back), ==, 433);
  for (int y = 0; y < 433; y++)
    for (int x = 0; x < 301; x++)
      {
        Pixel a = pixel_at (surface, x, y), b = pixel_at (back, x, y);

        g_assert_true (a.r == b.r && a.g == b.g && a.b == b.b);
      }
  g_unlink (path);
  cairo_surface_destroy (back);
  cairo_surface_destroy (surface);
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "");
  setlocale (LC_NUMERIC, "C");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/render/path/straight", test_path_straight);
  g_test_add_func ("/render/path/arc", test_path_arc);
  g_test_add_func ("/render/path/s-shape", test_path_s_shape);
  g_test_add_func ("/render/layout/round-trip", test_layout_round_trip);
  g_test_add_func ("/render/layout/fits", test_layout_fits);
  g_test_add_func ("/render/layout/from-device-tip", test_from_device_tip);
  g_test_add_func ("/render/pixels/working-length-mark", test_working_length_mark);
  g_test_add_func ("/render/pixels/tip-colour", test_tip_colour);
  g_test_add_func ("/render/pixels/white-file-outline", test_white_file_outline);
  g_test_add_func ("/render/pixels/hatch-only-where-engaged", test_hatch_only_where_engaged);
  g_test_add_func ("/render/pixels/themes-background", test_themes_background);
  g_test_add_func ("/render/blocks/paginate", test_blocks_paginate);
  g_test_add_func ("/render/sheet/draws", test_plan_sheets_draw);
  g_test_add_func ("/render/diagram/draws", test_diagrams_draw);
  g_test_add_func ("/render/text/locale-numbers", test_locale_numbers);
  g_test_add_func ("/render/text/file-names", test_file_names);
  g_test_add_func ("/render/png/round-trip", test_png_round_trip);
  return g_test_run ();
}
