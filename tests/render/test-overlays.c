/* test-overlays.c: each teaching overlay, drawn with no display, found by
 * its pixels where the drawing's conventions put it
 *
 * Positions come from the layout (cw-canal-layout-private.h) and the
 * conventions in src/render/README.md: offsets along the normal, the first
 * curve turning towards +x, so its outside at negative offsets.  The case
 * is the invented sample lower-molar-moderate, canal MB, step 6: a 40/.04
 * to 18 mm that engages 11 mm (3.7 in the curve), still cuts the straight
 * part and stops 0.05 mm short of its safe depth (engine figures, see
 * tests/test-evaluate.c for how they are checked).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <glib/gstdio.h>
#include <locale.h>
#include <math.h>

#include "cw-canal-layout-private.h"
#include "cw-canal-renderer.h"
#include "cw-case-loader.h"
#include "cw-insertion.h"
#include "cw-teaching-frame.h"
#include "cw-test-util.h"

#define WIDTH 800
#define HEIGHT 800
#define SCALE 1.3
#define STEP 5

typedef struct
{
  CwCase        *kase;
  CwCanalResult *result;
  CwCanalLayout *layout;
} Scene;

static void
scene_init (Scene          *sc,
            const char     *sample,
            guint           canal,
            CwOverlayFlags  overlays)
{
  g_autofree char *path = cw_test_sample_path (sample);
  g_autoptr(GError) error = NULL;
  cairo_rectangle_t area = { 0, 0, WIDTH, HEIGHT };
  CwRenderStyle style;

  sc->kase = cw_case_load (path, &error);
  g_assert_no_error (error);
  sc->result = cw_evaluate_canal (sc->kase, g_ptr_array_index (sc->kase->canals, canal));
  cw_render_style_init (&style, CW_RENDER_LIGHT, SCALE);
  sc->layout = cw_canal_layout_new_for_overlays (sc->result->canal, sc->result, &style, &area,
                                                 CW_CANAL_LAYOUT_FULL, overlays);
}

static void
scene_clear (Scene *sc)
{
  cw_canal_layout_free (sc->layout);
  cw_canal_result_free (sc->result);
  cw_case_free (sc->kase);
}

static const CwStepResult *
scene_step (const Scene *sc,
            guint        i)
{
  return cw_canal_result_get_step (sc->result, i);
}

static char *
artifact (const char *name)
{
  const char *dir = g_getenv ("G_TEST_BUILDDIR");

  return g_build_filename (dir ? dir : ".", name, NULL);
}

/* Draws the step with the overlays; keeps the picture as an artifact. */
static cairo_surface_t *
render (const Scene        *sc,
        int                 step,
        CwOverlayFlags      overlays,
        const CwStepResult *partial,
        const char         *name)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, WIDTH, HEIGHT);
  cairo_t *cr = cairo_create (surface);
  CwCanalDrawOptions options;

  cw_canal_draw_options_init (&options);
  options.overlays = overlays;
  options.partial = partial;
  options.rules = &sc->kase->rules;
  cw_canal_draw_full (cr, sc->layout, sc->result, step, &options);
  g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_flush (surface);
  if (name)
    {
      g_autofree char *file = g_strdup_printf ("overlay-%s.png", name);
      g_autofree char *out = artifact (file);

      cairo_surface_write_to_png (surface, out);
    }
  return surface;
}

static CwRgb
pixel (cairo_surface_t *surface,
       double           x,
       double           y)
{
  int stride = cairo_image_surface_get_stride (surface);
  const guint8 *data = cairo_image_surface_get_data (surface);
  int px = (int) floor (x), py = (int) floor (y);
  guint32 v;

  g_assert_cmpint (px, >=, 0);
  g_assert_cmpint (py, >=, 0);
  g_assert_cmpint (px, <, WIDTH);
  g_assert_cmpint (py, <, HEIGHT);
  v = *(const guint32 *) (gconstpointer) (data + py * stride + px * 4);
  return (CwRgb) { (v >> 16 & 0xff) / 255.0, (v >> 8 & 0xff) / 255.0, (v & 0xff) / 255.0 };
}

static double
distance (CwRgb        p,
          const CwRgb *c)
{
  return MAX (MAX (fabs (p.r - c->r), fabs (p.g - c->g)), fabs (p.b - c->b));
}

static CwRgb
hex (guint32 v)
{
  return (CwRgb) { (v >> 16 & 0xff) / 255.0, (v >> 8 & 0xff) / 255.0, (v & 0xff) / 255.0 };
}

static double
font (const Scene *sc,
      double       size)
{
  return cw_render_style_font (&sc->layout->style, size);
}

/* The device point at a lateral offset (true mm) pushed extra device
 * units further along the normal (cos a, -sin a). */
static void
point (const Scene *sc,
       double       s,
       double       offset,
       double       extra,
       double      *x,
       double      *y)
{
  double a = cw_canal_path_heading (&sc->layout->path, s);

  cw_canal_layout_to_device (sc->layout, s, offset, x, y);
  *x += extra * cos (a);
  *y -= extra * sin (a);
}

/* Half the drawn width at s: the walls the step meets, or its file. */
static double
half (const Scene        *sc,
      const CwStepResult *step,
      int                 index,
      double              s)
{
  const CwPwl *walls = cw_canal_render_walls (sc->result, index);
  double h = cw_pwl_eval (walls, s) / 2;

  if (s <= step->depth)
    h = MAX (h, cw_instrument_diameter (step->instrument, step->depth - s) / 2);
  return h;
}

/* How many pixels of a box are within tol of a colour. */
static guint
count_near (cairo_surface_t *surface,
            double           x0,
            double           y0,
            double           w,
            double           h,
            const CwRgb     *colour,
            double           tol)
{
  guint n = 0;

  for (double y = MAX (y0, 0); y < MIN (y0 + h, HEIGHT); y += 1)
    for (double x = MAX (x0, 0); x < MIN (x0 + w, WIDTH); x += 1)
      n += distance (pixel (surface, x, y), colour) <= tol;
  return n;
}

/* The darkest pixel within r of a point: thin lines cover pixels only in
 * part. */
static double
darkest (cairo_surface_t *surface,
         double           x,
         double           y,
         int              r)
{
  double least = 1;

  for (int dy = -r; dy <= r; dy++)
    for (int dx = -r; dx <= r; dx++)
      {
        CwRgb p = pixel (surface, x + dx, y + dy);

        least = MIN (least, cw_render_luminance (&p));
      }
  return least;
}

static double
column_x (const Scene *sc)
{
  return sc->layout->canal.x + sc->layout->canal.width + font (sc, 6);
}

/* A tick across the file 5 mm from its tip (at 13 mm), its end out past
 * the right wall in ink where the plain drawing has none, and the D5
 * label in the column right of the canal. */
static void
test_ruler (void)
{
  Scene sc;
  cairo_surface_t *plain, *ruled;
  const CwStepResult *r;
  const CwRgb ink = hex (0x1d2125), white = hex (0xffffff);
  double s, x, y, cx;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_RULER);
  r = scene_step (&sc, STEP);
  s = r->depth - 5;
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  ruled = render (&sc, STEP, CW_OVERLAY_RULER, NULL, "ruler");
  point (&sc, s, half (&sc, r, STEP, s), font (&sc, 2), &x, &y);
  g_assert_cmpfloat (darkest (ruled, x, y, 1), <, 0.5);
  g_assert_cmpfloat (darkest (plain, x, y, 1), >, 0.98);
  g_assert_cmpfloat (distance (pixel (plain, x, y), &white), <, 0.02);
  cx = column_x (&sc);
  g_assert_cmpuint (count_near (ruled, cx, y - font (&sc, 5), font (&sc, 40), font (&sc, 10), &ink, 0.2), >, 10);
  g_assert_cmpuint (count_near (plain, cx, y - font (&sc, 5), font (&sc, 40), font (&sc, 10), &ink, 0.2), ==, 0);
  cairo_surface_destroy (plain);
  cairo_surface_destroy (ruled);
  scene_clear (&sc);
}

/* Halfway along the file's part in the curve, outside the curve, the band
 * has the heat colour of d(x) / 2R against the NiTi limit of 6 %; in the
 * straight part there is no band. */
static void
test_strain (void)
{
  Scene sc;
  cairo_surface_t *plain, *heat;
  const CwStepResult *r;
  const CwGeometry *g;
  const CwRgb white = hex (0xffffff);
  CwRgb expected;
  double s, x, y, across;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_STRAIN);
  r = scene_step (&sc, STEP);
  g = &sc.result->geometry;
  s = (g->onset[0] + MIN (g->end[0], r->depth)) / 2;
  expected = cw_overlay_heat_rgb (cw_instrument_diameter (r->instrument, r->depth - s) / (2 * g->radius[0])
                                  / sc.kase->rules.alloys[CW_ALLOY_NITI].strain_limit);
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  heat = render (&sc, STEP, CW_OVERLAY_STRAIN, NULL, "strain");
  across = -(font (&sc, 2.5) + font (&sc, 6) / 2);
  point (&sc, s, -half (&sc, r, STEP, s), across, &x, &y);
  g_assert_cmpfloat (distance (pixel (heat, x, y), &expected), <, 0.06);
  g_assert_cmpfloat (distance (pixel (plain, x, y), &white), <, 0.02);
  s = g->onset[0] - 2;
  point (&sc, s, -half (&sc, r, STEP, s), across, &x, &y);
  g_assert_cmpfloat (distance (pixel (heat, x, y), &white), <, 0.02);
  cairo_surface_destroy (plain);
  cairo_surface_destroy (heat);
  scene_clear (&sc);
}

/* 40/.04 under the 0.55 mm ceiling: the file is that wide (0.55 - 0.40) /
 * 0.04 = 3.75 mm from its tip, so the ring is at 18 - 3.75 = 14.25 mm and
 * the safe depth at 14.3 + 3.75 = 18.05 mm (the rule of thumb's own
 * example of the ceiling depth, domain reference). */
static void
test_ceiling (void)
{
  Scene sc;
  cairo_surface_t *plain, *ceiling;
  const CwStepResult *r;
  const CwRgb violet = hex (0x4527a0);
  double x, y, h;
  guint hits = 0;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_CEILING);
  r = scene_step (&sc, STEP);
  cw_assert_near (r->ceiling_depth, 18.05, 1e-9);
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  ceiling = render (&sc, STEP, CW_OVERLAY_CEILING, NULL, "ceiling");
  point (&sc, 14.25, 0.05, 0, &x, &y);
  g_assert_cmpfloat (distance (pixel (ceiling, x, y), &violet), <, 0.1);
  g_assert_cmpfloat (distance (pixel (plain, x, y), &violet), >, 0.3);
  /* The safe-depth line is dashed: some of it across the canal. */
  h = half (&sc, r, STEP, 18.05);
  for (int k = -10; k <= 10; k++)
    {
      point (&sc, 18.05, h * k / 10.0, 0, &x, &y);
      hits += distance (pixel (ceiling, x, y), &violet) < 0.1;
    }
  g_assert_cmpuint (hits, >=, 5);
  cairo_surface_destroy (plain);
  cairo_surface_destroy (ceiling);
  scene_clear (&sc);
}

/* A tip past its safe depth: the severe curve's 30/.06 to 20 mm may go to
 * 15.33 mm only; the line is in the stop colour. */
static void
test_ceiling_passed (void)
{
  Scene sc;
  cairo_surface_t *surface;
  const CwStepResult *r;
  const CwRgb stop = hex (0xc0392b);
  double x, y, h;
  guint hits = 0;

  scene_init (&sc, "severe-curve-rule-breaks.cwcase", 0, CW_OVERLAY_CEILING);
  r = scene_step (&sc, 4);
  g_assert_cmpfloat (r->depth, >, r->ceiling_depth);
  surface = render (&sc, 4, CW_OVERLAY_CEILING, NULL, "ceiling-passed");
  h = half (&sc, r, 4, r->ceiling_depth);
  for (int k = -10; k <= 10; k++)
    {
      point (&sc, r->ceiling_depth, h * k / 10.0, 0, &x, &y);
      hits += distance (pixel (surface, x, y), &stop) < 0.1;
    }
  g_assert_cmpuint (hits, >=, 5);
  cairo_surface_destroy (surface);
  scene_clear (&sc);
}

/* The step cuts the whole straight part (7.3 mm): a caution bar outside
 * each wall halfway down it.  A later step clear of it (the glide-path
 * file, 0.21 mm to spare) gets thin dashed bars in the ok colour. */
static void
test_clearance (void)
{
  Scene sc;
  cairo_surface_t *plain, *bars, *clear;
  const CwStepResult *r;
  const CwRgb caution = hex (0xa85f00), ok = hex (0x2e7d32), white = hex (0xffffff);
  double s, x, y;
  guint dashes = 0;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_CLEARANCE);
  r = scene_step (&sc, STEP);
  g_assert_cmpfloat (r->engaged_in_straight, >, 7);
  s = (sc.result->canal->orifice_depth + sc.result->geometry.onset[0]) / 2;
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  bars = render (&sc, STEP, CW_OVERLAY_CLEARANCE, NULL, "clearance");
  for (int side = -1; side <= 1; side += 2)
    {
      point (&sc, s, side * half (&sc, r, STEP, s), side * font (&sc, 3.5), &x, &y);
      g_assert_cmpfloat (distance (pixel (bars, x, y), &caution), <, 0.1);
      g_assert_cmpfloat (distance (pixel (plain, x, y), &white), <, 0.02);
    }
  r = scene_step (&sc, 6);
  g_assert_cmpfloat (r->straight_clearance, >, 0.2);
  clear = render (&sc, 6, CW_OVERLAY_CLEARANCE, NULL, "clearance-clear");
  for (double t = sc.result->canal->orifice_depth + 0.5; t < sc.result->geometry.onset[0] - 0.5; t += 0.05)
    {
      point (&sc, t, -half (&sc, r, 6, t), -font (&sc, 3.5), &x, &y);
      dashes += distance (pixel (clear, x, y), &ok) < 0.15;
      g_assert_cmpfloat (distance (pixel (clear, x, y), &caution), >, 0.2);
    }
  g_assert_cmpuint (dashes, >, 20);
  cairo_surface_destroy (plain);
  cairo_surface_destroy (bars);
  cairo_surface_destroy (clear);
  scene_clear (&sc);
}

/* Between the walls the step meets and the shape it leaves (the file's
 * own width there), the removed wall is tinted teal over the file. */
static void
test_envelope (void)
{
  Scene sc;
  cairo_surface_t *plain, *shape;
  const CwStepResult *r;
  double s = 10, before, after, x, y;
  CwRgb p, q;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_ENVELOPE);
  r = scene_step (&sc, STEP);
  before = cw_pwl_eval (cw_canal_render_walls (sc.result, STEP), s);
  after = cw_pwl_eval (r->envelope_after, s);
  g_assert_cmpfloat (after - before, >, 0.1);
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  shape = render (&sc, STEP, CW_OVERLAY_ENVELOPE, NULL, "envelope");
  for (int side = -1; side <= 1; side += 2)
    {
      point (&sc, s, side * (before + after) / 4, 0, &x, &y);
      p = pixel (shape, x, y);
      q = pixel (plain, x, y);
      g_assert_cmpfloat (distance (p, &q), >, 0.1);
      g_assert_cmpfloat (p.g, >, p.r + 0.1);
      g_assert_cmpfloat (p.b, >, p.r + 0.1);
    }
  cairo_surface_destroy (plain);
  cairo_surface_destroy (shape);
  scene_clear (&sc);
}

/* On both walls where the file cuts them, heavy magenta. */
static void
test_engaged (void)
{
  Scene sc;
  cairo_surface_t *plain, *engaged;
  const CwStepResult *r;
  const CwRgb magenta = hex (0xc2185b);
  double s = 10, x, y, wall;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_ENGAGED);
  r = scene_step (&sc, STEP);
  g_assert_cmpfloat (g_array_index (r->engaged, CwPoint, 0).s, <, s);
  wall = cw_pwl_eval (cw_canal_render_walls (sc.result, STEP), s) / 2;
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  engaged = render (&sc, STEP, CW_OVERLAY_ENGAGED, NULL, "engaged");
  for (int side = -1; side <= 1; side += 2)
    {
      point (&sc, s, side * wall, 0, &x, &y);
      g_assert_cmpfloat (distance (pixel (engaged, x, y), &magenta), <, 0.1);
      g_assert_cmpfloat (distance (pixel (plain, x, y), &magenta), >, 0.3);
    }
  /* Its sentence in the box in the top right corner, with a magenta key. */
  g_assert_cmpuint (count_near (engaged, WIDTH * 0.6, 0, WIDTH * 0.4, font (&sc, 30), &magenta, 0.05), >, 20);
  g_assert_cmpuint (count_near (plain, WIDTH * 0.6, 0, WIDTH * 0.4, font (&sc, 30), &magenta, 0.05), ==, 0);
  cairo_surface_destroy (plain);
  cairo_surface_destroy (engaged);
  scene_clear (&sc);
}

/* A bracket in the column right of the canal spans each zone: ink there
 * halfway down the straight segment, and its name beside it. */
static void
test_zones (void)
{
  Scene sc;
  cairo_surface_t *plain, *zones;
  const CwRgb ink = hex (0x1d2125), white = hex (0xffffff);
  double s, x, y, bracket;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_ZONES);
  s = (sc.result->canal->orifice_depth + sc.result->geometry.onset[0]) / 2;
  plain = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  zones = render (&sc, STEP, CW_OVERLAY_ZONES, NULL, "zones");
  cw_canal_layout_to_device (sc.layout, s, 0, &x, &y);
  bracket = column_x (&sc) + font (&sc, 3);
  g_assert_cmpfloat (darkest (zones, bracket, y, 1), <, 0.5);
  g_assert_cmpfloat (distance (pixel (plain, bracket, y), &white), <, 0.02);
  g_assert_cmpuint (count_near (zones, bracket + font (&sc, 3), y - font (&sc, 5), font (&sc, 60), font (&sc, 10),
                                &ink, 0.25), >, 20);
  cairo_surface_destroy (plain);
  cairo_surface_destroy (zones);
  scene_clear (&sc);
}

/* A partial insertion draws the file at its tip depth: between 15 and
 * 18 mm the canal is empty then, and the file's figures are those at 15. */
static void
test_partial (void)
{
  Scene sc;
  cairo_surface_t *full, *partial;
  g_autoptr(CwEvalState) before = NULL;
  g_autoptr(CwStepResult) at15 = NULL;
  const CwStepResult *r;
  const CwRgb lumen = hex (0xe4ebf0);
  double x, y;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_NONE);
  r = scene_step (&sc, STEP);
  before = cw_insertion_state_before (sc.kase, sc.result->canal, STEP);
  at15 = cw_insertion_evaluate (before, r->instrument, 15);
  g_assert_cmpfloat (at15->engaged_length, <, r->engaged_length);
  full = render (&sc, STEP, CW_OVERLAY_NONE, NULL, NULL);
  partial = render (&sc, STEP, CW_OVERLAY_NONE, at15, "partial");
  point (&sc, 16.5, 0.1, 0, &x, &y);
  g_assert_cmpfloat (distance (pixel (partial, x, y), &lumen), <, 0.02);
  g_assert_cmpfloat (distance (pixel (full, x, y), &lumen), >, 0.1);
  point (&sc, 13, 0.1, 0, &x, &y);
  g_assert_cmpfloat (darkest (partial, x, y, 2), <, 0.3);
  cairo_surface_destroy (full);
  cairo_surface_destroy (partial);
  scene_clear (&sc);
}

/* Every overlay at once, in each theme, on every canal and step of every
 * sample: no cairo error, and the notes are there. */
static void
test_all_samples (void)
{
  static const char *samples[] = {
    "lower-incisor-straight.cwcase", "lower-molar-moderate.cwcase", "severe-curve-rule-breaks.cwcase",
    "upper-molar-four-canals.cwcase", "upper-premolar-s-shape.cwcase",
  };

  for (guint i = 0; i < G_N_ELEMENTS (samples); i++)
    {
      Scene sc;

      scene_init (&sc, samples[i], 0, CW_OVERLAY_ALL);
      for (int step = CW_RENDER_NO_STEP; step < (int) sc.result->steps->len; step++)
        {
          CwCanalDrawOptions options;
          g_autoptr(GPtrArray) notes = NULL;

          cairo_surface_destroy (render (&sc, step, CW_OVERLAY_ALL, NULL, NULL));
          cw_canal_draw_options_init (&options);
          options.overlays = CW_OVERLAY_ALL;
          notes = cw_canal_overlay_notes (sc.layout, sc.result, step, &options);
          g_assert_cmpuint (notes->len, >=, step >= 0 ? 2 : 1);
        }
      scene_clear (&sc);
    }
}

/* The slide: big numerals of the tip depth on the right, in ink. */
static void
test_teaching_frame (void)
{
  Scene sc;
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 1280, 720);
  cairo_rectangle_t area = { 0, 0, 1280, 720 };
  cairo_t *cr = cairo_create (surface);
  CwTeachingFrame frame;
  const CwRgb black = hex (0x000000);
  guint n = 0;

  scene_init (&sc, "lower-molar-moderate.cwcase", 0, CW_OVERLAY_TEACHING);
  cw_teaching_frame_init (&frame, sc.result, STEP);
  frame.options.rules = &sc.kase->rules;
  cw_teaching_frame_draw (cr, &area, CW_RENDER_HIGH_CONTRAST, &frame);
  g_assert_cmpint (cairo_status (cr), ==, CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_flush (surface);
  {
    int stride = cairo_image_surface_get_stride (surface);
    const guint8 *data = cairo_image_surface_get_data (surface);

    /* The depth's numerals, 62 pt on a 960 pt slide: a dark block in the
     * panel's upper part. */
    for (int y = 140; y < 240; y++)
      for (int x = 820; x < 1000; x++)
        {
          guint32 v = *(const guint32 *) (gconstpointer) (data + y * stride + x * 4);
          CwRgb p = hex (v & 0xffffff);

          n += distance (p, &black) < 0.1;
        }
  }
  g_assert_cmpuint (n, >, 2000);
  {
    g_autofree char *out = artifact ("teaching-frame.png");

    cairo_surface_write_to_png (surface, out);
  }
  cairo_surface_destroy (surface);
  scene_clear (&sc);
}

static void
test_flags (void)
{
  CwOverlayFlags flags = CW_OVERLAY_NONE;
  CwRgb pale = cw_overlay_heat_rgb (0), orange = cw_overlay_heat_rgb (0.8), red = cw_overlay_heat_rgb (1);
  CwRgb past = cw_overlay_heat_rgb (3);

  g_assert_true (cw_overlay_flags_parse ("ruler, strain", &flags));
  g_assert_cmpint (flags, ==, CW_OVERLAY_RULER | CW_OVERLAY_STRAIN);
  g_assert_true (cw_overlay_flags_parse ("all", &flags));
  g_assert_cmpint (flags, ==, CW_OVERLAY_ALL);
  g_assert_true (cw_overlay_flags_parse ("none", &flags));
  g_assert_cmpint (flags, ==, CW_OVERLAY_NONE);
  g_assert_false (cw_overlay_flags_parse ("ruler,bogus", &flags));
  for (guint i = 0; i < CW_N_OVERLAYS; i++)
    {
      CwOverlayFlags f = CW_OVERLAY_NONE;

      g_assert_true (cw_overlay_flags_parse (cw_overlay_id (cw_overlay_nth (i)), &f));
      g_assert_cmpint (f, ==, cw_overlay_nth (i));
      g_assert_nonnull (cw_overlay_title (f));
    }
  /* Pale, then orange where the strain rule cautions, red at its stop. */
  g_assert_cmpfloat (cw_render_luminance (&pale), >, cw_render_luminance (&orange));
  g_assert_cmpfloat (cw_render_luminance (&orange), >, cw_render_luminance (&red));
  g_assert_cmpfloat (distance (past, &red), <, 1e-12);
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/overlays/flags", test_flags);
  g_test_add_func ("/overlays/ruler", test_ruler);
  g_test_add_func ("/overlays/strain", test_strain);
  g_test_add_func ("/overlays/ceiling", test_ceiling);
  g_test_add_func ("/overlays/ceiling-passed", test_ceiling_passed);
  g_test_add_func ("/overlays/clearance", test_clearance);
  g_test_add_func ("/overlays/envelope", test_envelope);
  g_test_add_func ("/overlays/engaged", test_engaged);
  g_test_add_func ("/overlays/zones", test_zones);
  g_test_add_func ("/overlays/partial-insertion", test_partial);
  g_test_add_func ("/overlays/all-samples", test_all_samples);
  g_test_add_func ("/overlays/teaching-frame", test_teaching_frame);

  return g_test_run ();
}
