/* test-export.c: canalwright --export, run as a user would, with no display
 *
 * Checked with the tools a reader of the files would use: poppler's
 * pdfinfo, pdffonts, pdftotext and pdftoppm, ImageMagick, and an XML parser.
 * Page sizes: ISO 216 A4 is 210 x 297 mm (595.3 x 841.9 pt); US Letter is
 * 8.5 x 11 in (612 x 792 pt).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <cairo.h>
#include <glib/gstdio.h>
#include <locale.h>
#include <math.h>
#include <string.h>

#include "cw-case-loader.h"
#include "cw-plan-sheet.h"
#include "cw-plan-text.h"
#include "cw-render-text.h"
#include "cw-test-util.h"

#define FOUR_CANALS "upper-molar-four-canals.cwcase"
/* Fixed, so that the footer's date is the same in every file compared. */
#define EPOCH "1790000000"

typedef struct
{
  int   status;
  char *out;
  char *err;
} Run;

static void
run_clear (Run *run)
{
  g_free (run->out);
  g_free (run->err);
}

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (Run, run_clear)

/* Runs argv with DISPLAY and WAYLAND_DISPLAY unset. */
static void
run_argv (Run         *run,
          const char **argv)
{
  g_auto(GStrv) env = g_get_environ ();
  g_autoptr(GError) error = NULL;
  int wait_status;

  env = g_environ_unsetenv (env, "DISPLAY");
  env = g_environ_unsetenv (env, "WAYLAND_DISPLAY");
  env = g_environ_setenv (env, "SOURCE_DATE_EPOCH", EPOCH, TRUE);
  g_assert_true (g_spawn_sync (NULL, (char **) argv, env, G_SPAWN_SEARCH_PATH, NULL, NULL,
                               &run->out, &run->err, &wait_status, &error));
  g_assert_no_error (error);
  run->status = WIFEXITED (wait_status) ? WEXITSTATUS (wait_status) : -1;
}

/* canalwright --export OUT CASE and up to eight more arguments. */
static void
run_export_va (Run        *run,
               const char *out,
               const char *kase,
               va_list     args)
{
  const char *argv[14] = { g_getenv ("CW_BINARY"), "--export", out, kase };
  guint n = 4;
  const char *arg;

  while ((arg = va_arg (args, const char *)) != NULL && n < G_N_ELEMENTS (argv) - 1)
    argv[n++] = arg;
  run_argv (run, argv);
}

static void
run_export (Run        *run,
            const char *out,
            const char *kase,
            ...)
{
  va_list args;

  va_start (args, kase);
  run_export_va (run, out, kase, args);
  va_end (args);
}

static gboolean
have_tools (const char *first,
            ...)
{
  va_list args;
  const char *tool = first;

  va_start (args, first);
  for (; tool; tool = va_arg (args, const char *))
    {
      g_autofree char *path = g_find_program_in_path (tool);

      if (path == NULL)
        {
          g_autofree char *why = g_strdup_printf ("%s is not installed (tools/setup-debian.sh)", tool);

          va_end (args);
          g_test_skip (why);
          return FALSE;
        }
    }
  va_end (args);
  return TRUE;
}

static char *
tmp_dir (void)
{
  g_autoptr(GError) error = NULL;
  char *dir = g_dir_make_tmp ("cw-export-XXXXXX", &error);

  g_assert_no_error (error);
  return dir;
}

static void
remove_tree (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d && (name = g_dir_read_name (d)))
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      g_remove (path);
    }
  g_rmdir (dir);
}

/* Exports the sample to dir/name with the options that follow (NULL at
 * the end) and returns the path. */
static char *
export_ok (const char *dir,
           const char *name,
           const char *sample,
           ...)
{
  g_auto(Run) run = { 0 };
  g_autofree char *kase = cw_test_sample_path (sample);
  char *out = g_build_filename (dir, name, NULL);
  va_list args;

  va_start (args, sample);
  run_export_va (&run, out, kase, args);
  va_end (args);
  if (run.status != 0)
    g_printerr ("%s", run.err);
  g_assert_cmpint (run.status, ==, 0);
  return out;
}

static guint
sheet_pages (const char *sample,
             CwPaper     paper)
{
  g_autofree char *path = cw_test_sample_path (sample);
  g_autoptr(CwCase) kase = cw_case_load (path, NULL);
  g_autoptr(GPtrArray) results = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_canal_result_free);
  g_autoptr(CwPlanSheet) sheet = NULL;
  CwRenderStyle style;

  g_assert_nonnull (kase);
  for (guint c = 0; c < kase->canals->len; c++)
    g_ptr_array_add (results, cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, c)));
  cw_render_style_init (&style, CW_RENDER_LIGHT, 1.0);
  sheet = cw_plan_sheet_new (kase, results, &style, paper, NULL);
  return cw_plan_sheet_get_n_pages (sheet);
}

/* The value of "Key:" in pdfinfo's output. */
static char *
pdfinfo_value (const char *pdf,
               const char *key)
{
  const char *argv[] = { "pdfinfo", pdf, NULL };
  g_auto(Run) run = { 0 };
  g_auto(GStrv) lines = NULL;

  run_argv (&run, argv);
  g_assert_cmpint (run.status, ==, 0);
  lines = g_strsplit (run.out, "\n", -1);
  for (guint i = 0; lines[i]; i++)
    if (g_str_has_prefix (lines[i], key))
      return g_strstrip (g_strdup (lines[i] + strlen (key)));
  g_assert_not_reached ();
}

static void
check_pdf_pages (const char *paper,
                 CwPaper     kind,
                 double      width,
                 double      height)
{
  g_autofree char *dir = tmp_dir ();
  g_autofree char *pdf = export_ok (dir, "plan.pdf", FOUR_CANALS, "--paper", paper, NULL);
  g_autofree char *pages = pdfinfo_value (pdf, "Pages:");
  g_autofree char *size = pdfinfo_value (pdf, "Page size:");
  double w = 0, h = 0;

  g_assert_cmpint (sscanf (size, "%lf x %lf", &w, &h), ==, 2);
  cw_assert_near (w, width, 0.5);
  cw_assert_near (h, height, 0.5);
  g_assert_cmpuint (g_ascii_strtoull (pages, NULL, 10), ==, sheet_pages (FOUR_CANALS, kind));
  g_assert_cmpuint (g_ascii_strtoull (pages, NULL, 10), >=, 4);
  remove_tree (dir);
}

static void
test_pdf_pages_and_size (void)
{
  if (!have_tools ("pdfinfo", NULL))
    return;
  check_pdf_pages ("a4", CW_PAPER_A4, 595.276, 841.89);
  check_pdf_pages ("letter", CW_PAPER_LETTER, 612, 792);
}

static void
test_pdf_fonts_embedded (void)
{
  g_autofree char *dir = NULL, *pdf = NULL;
  g_auto(Run) run = { 0 };
  g_auto(GStrv) lines = NULL;
  guint fonts = 0;

  if (!have_tools ("pdffonts", NULL))
    return;
  dir = tmp_dir ();
  pdf = export_ok (dir, "plan.pdf", FOUR_CANALS, NULL);
  run_argv (&run, (const char *[]) { "pdffonts", pdf, NULL });
  g_assert_cmpint (run.status, ==, 0);
  lines = g_strsplit (run.out, "\n", -1);
  /* Two heading lines, then one a font: name type encoding emb sub uni ... */
  for (guint i = 2; lines[i] && *lines[i]; i++, fonts++)
    g_assert_nonnull (strstr (lines[i], " yes "));
  g_assert_cmpuint (fonts, >, 0);
  remove_tree (dir);
}

static char *
pdf_text (const char *pdf,
          int         page,
          gboolean    layout)
{
  g_autofree char *first = g_strdup_printf ("%d", page);
  const char *argv[] = { "pdftotext", layout ? "-layout" : "-raw", "-f", first, "-l", first, pdf, "-", NULL };
  g_auto(Run) run = { 0 };

  if (page == 0)
    memmove (&argv[2], &argv[6], 3 * sizeof argv[0]);
  run_argv (&run, argv);
  g_assert_cmpint (run.status, ==, 0);
  return g_steal_pointer (&run.out);
}

/* Whitespace run together, so that sentences wrapped over lines match. */
static char *
flat (const char *text)
{
  g_auto(GStrv) words = g_strsplit_set (text, " \n\t\f", -1);
  g_autoptr(GString) out = g_string_new (NULL);

  for (guint i = 0; words[i]; i++)
    if (*words[i])
      g_string_append_printf (out, "%s%s", out->len ? " " : "", words[i]);
  return g_string_free (g_steal_pointer (&out), FALSE);
}

static gboolean
has_row (char       **lines,
         const char  *label,
         const char  *depth)
{
  g_autofree char *spaced = g_strdup_printf (" %s ", depth);

  for (guint i = 0; lines[i]; i++)
    if (strstr (lines[i], label) && strstr (lines[i], spaced))
      return TRUE;
  return FALSE;
}

static void
check_every_page (const char *pdf,
                  guint       pages)
{
  g_autofree char *cautions = flat (cw_plan_cautions ());

  for (guint p = 1; p <= pages; p++)
    {
      g_autofree char *raw = pdf_text (pdf, (int) p, FALSE);
      g_autofree char *text = flat (raw);
      g_autofree char *number = g_strdup_printf ("Page %u of %u", p, pages);

      g_assert_nonnull (strstr (text, cautions));
      g_assert_nonnull (strstr (text, number));
    }
}

/* Every step's file and depth are in the table; the cautions and the page
 * number are on every page. */
static void
test_pdf_text (void)
{
  g_autofree char *dir = NULL, *pdf = NULL, *all = NULL, *sample = cw_test_sample_path (FOUR_CANALS);
  g_autoptr(CwCase) kase = cw_case_load (sample, NULL);
  g_auto(GStrv) lines = NULL;

  if (!have_tools ("pdftotext", NULL))
    return;
  dir = tmp_dir ();
  pdf = export_ok (dir, "plan.pdf", FOUR_CANALS, NULL);
  all = pdf_text (pdf, 0, TRUE);
  lines = g_strsplit (all, "\n", -1);
  for (guint c = 0; c < kase->canals->len; c++)
    {
      const CwCanal *canal = g_ptr_array_index (kase->canals, c);
      g_autofree char *heading = g_strdup_printf ("Canal %s", canal->name);

      g_assert_nonnull (strstr (all, heading));
      for (guint i = 0; i < cw_canal_get_n_steps (canal); i++)
        {
          const CwStep *step = cw_canal_get_step ((CwCanal *) canal, i);
          const CwInstrument *inst = cw_case_find_instrument (kase, step->instrument_id);
          g_autofree char *depth = g_strdup_printf ("%.1f", step->depth);

          if (!has_row (lines, inst->label, depth))
            g_error ("no table row with “%s” at %s mm", inst->label, depth);
        }
    }
  check_every_page (pdf, sheet_pages (FOUR_CANALS, CW_PAPER_A4));
  remove_tree (dir);
}

static void
png_size (const char *path,
          int        *width,
          int        *height)
{
  cairo_surface_t *surface = cairo_image_surface_create_from_png (path);

  g_assert_cmpint (cairo_surface_status (surface), ==, CAIRO_STATUS_SUCCESS);
  *width = cairo_image_surface_get_width (surface);
  *height = cairo_image_surface_get_height (surface);
  cairo_surface_destroy (surface);
}

/* The diagram is 842 pt wide, so the image is 842 * dpi / 72 pixels. */
static void
test_png_dpi (void)
{
  g_autofree char *dir = tmp_dir ();
  g_autofree char *low = export_ok (dir, "low.png", FOUR_CANALS, "--canal", "MB1", "--dpi", "72", NULL);
  g_autofree char *high = export_ok (dir, "high.png", FOUR_CANALS, "--canal", "MB1", "--dpi", "144", NULL);
  g_autofree char *mid = export_ok (dir, "mid.png", FOUR_CANALS, "--canal", "MB1", "--dpi", "100", NULL);
  int w1, h1, w2, h2, w3, h3;

  png_size (low, &w1, &h1);
  png_size (high, &w2, &h2);
  png_size (mid, &w3, &h3);
  g_assert_cmpint (w1, ==, 842);
  g_assert_cmpint (w2, ==, 1684);
  g_assert_cmpint (w3, ==, (int) ceil (842 * 100 / 72.0));
  g_assert_cmpint (abs (h2 - 2 * h1), <=, 1);
  remove_tree (dir);
}

static double
rmse (const char *a,
      const char *b)
{
  const char *argv[] = { "compare", "-metric", "RMSE", a, b, "null:", NULL };
  g_auto(Run) run = { 0 };
  const char *open;

  run_argv (&run, argv);
  /* "1260.55 (0.0192347)" on stderr: the second number is normalised. */
  open = strchr (run.err, '(');
  g_assert_nonnull (open);
  return g_ascii_strtod (open + 1, NULL);
}

static char *
blurred (const char *path)
{
  char *out = g_strconcat (path, ".blur.png", NULL);
  const char *argv[] = { "convert", path, "-blur", "0x2", out, NULL };
  g_auto(Run) run = { 0 };

  run_argv (&run, argv);
  g_assert_cmpint (run.status, ==, 0);
  return out;
}

/* Antialiasing differs between cairo's rasteriser and poppler's, so both
 * pictures are blurred by 2 px first; what remains is the drawing itself.
 * Measured: the same diagram 0.019, two different canals' diagrams 0.065. */
#define SAME_PICTURE 0.035

static void
test_png_matches_pdf (void)
{
  g_autofree char *dir = NULL, *png = NULL, *pdf = NULL, *other = NULL, *page = NULL;
  g_autofree char *a = NULL, *b = NULL, *c = NULL;
  g_auto(Run) run = { 0 };
  int w1, h1, w2, h2, w3, h3;
  double same;

  if (!have_tools ("pdftoppm", "compare", "convert", NULL))
    return;
  dir = tmp_dir ();
  png = export_ok (dir, "mb2.png", FOUR_CANALS, "--canal", "MB2", "--dpi", "100", NULL);
  other = export_ok (dir, "mb2-dark.png", FOUR_CANALS, "--canal", "MB2", "--theme", "dark", "--dpi", "100", NULL);
  pdf = export_ok (dir, "mb2.pdf", FOUR_CANALS, "--canal", "MB2", "--diagrams", NULL);
  page = g_build_filename (dir, "page", NULL);
  run_argv (&run, (const char *[]) { "pdftoppm", "-r", "100", "-png", "-singlefile", pdf, page, NULL });
  g_assert_cmpint (run.status, ==, 0);
  g_free (page);
  page = g_build_filename (dir, "page.png", NULL);
  png_size (png, &w1, &h1);
  png_size (page, &w2, &h2);
  g_assert_cmpint (abs (w1 - w2), <=, 1);
  g_assert_cmpint (abs (h1 - h2), <=, 1);
  a = blurred (png);
  b = blurred (page);
  same = rmse (a, b);
  g_test_message ("PNG against the rasterised PDF: RMSE %.4f (limit %.3f)", same, SAME_PICTURE);
  g_assert_cmpfloat (same, <, SAME_PICTURE);
  /* The measure does tell pictures apart: the same diagram in the dark theme. */
  png_size (other, &w3, &h3);
  c = blurred (other);
  if (w3 == w1 && h3 == h1)
    {
      double apart = rmse (c, b);

      g_test_message ("the dark theme's diagram: RMSE %.4f", apart);
      g_assert_cmpfloat (apart, >, SAME_PICTURE);
    }
  remove_tree (dir);
}

static void
test_svg_is_xml (void)
{
  g_autofree char *dir = NULL, *svg = NULL;
  g_auto(Run) run = { 0 };
  const char *script = "import sys, xml.etree.ElementTree as E\n"
                       "root = E.parse(sys.argv[1]).getroot()\n"
                       "assert root.tag.endswith('svg'), root.tag\n"
                       "print(root.get('width'))\n";

  if (!have_tools ("python3", NULL))
    return;
  dir = tmp_dir ();
  svg = export_ok (dir, "incisor.svg", "lower-incisor-straight.cwcase", NULL);
  run_argv (&run, (const char *[]) { "python3", "-c", script, svg, NULL });
  if (run.status != 0)
    g_printerr ("%s", run.err);
  g_assert_cmpint (run.status, ==, 0);
  g_assert_true (g_str_has_prefix (run.out, "842"));
  remove_tree (dir);
}

/* Several canals give OUT-NAME.png each; --canal gives exactly OUT. */
static void
test_png_names (void)
{
  static const char *names[] = { "MB1", "MB2", "DB", "P" };
  g_autofree char *dir = tmp_dir ();
  g_autofree char *out = export_ok (dir, "plan.png", FOUR_CANALS, "--dpi", "30", NULL);
  g_autofree char *one = export_ok (dir, "db.png", FOUR_CANALS, "--canal", "DB", "--dpi", "30", NULL);
  g_autofree char *stray = g_build_filename (dir, "db-DB.png", NULL);

  g_assert_false (g_file_test (out, G_FILE_TEST_EXISTS));
  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    {
      g_autofree char *base = g_strdup_printf ("plan-%s.png", names[i]);
      g_autofree char *path = g_build_filename (dir, base, NULL);

      g_assert_true (g_file_test (path, G_FILE_TEST_IS_REGULAR));
    }
  g_assert_true (g_file_test (one, G_FILE_TEST_IS_REGULAR));
  g_assert_false (g_file_test (stray, G_FILE_TEST_EXISTS));
  remove_tree (dir);
}

static void
expect_failure (const char *out,
                const char *kase,
                const char *canal,
                const char *says)
{
  g_auto(Run) run = { 0 };

  run_export (&run, out, kase, canal ? "--canal" : NULL, canal, NULL);
  g_assert_cmpint (run.status, ==, 2);
  if (strstr (run.err, says) == NULL)
    g_error ("stderr “%s” does not name “%s”", run.err, says);
  g_assert_false (g_file_test (out, G_FILE_TEST_EXISTS));
}

static void
test_errors (void)
{
  g_autofree char *dir = tmp_dir ();
  g_autofree char *good = cw_test_sample_path (FOUR_CANALS);
  g_autofree char *bad = g_build_filename (dir, "truncated.cwcase", NULL);
  g_autofree char *file = g_build_filename (dir, "file.txt", NULL);
  g_autofree char *png = g_build_filename (dir, "x.png", NULL);
  g_autofree char *bmp = g_build_filename (dir, "x.bmp", NULL);
  g_autofree char *under_file = g_build_filename (file, "x.png", NULL);
  g_auto(Run) usage = { 0 };

  g_assert_true (g_file_set_contents (bad, "{ \"format\": \"canalwright-case\", \"vers", -1, NULL));
  g_assert_true (g_file_set_contents (file, "not a folder", -1, NULL));
  expect_failure (png, bad, NULL, "truncated.cwcase");
  expect_failure (png, good, "ZZ", "ZZ");
  expect_failure (bmp, good, NULL, "x.bmp");
  expect_failure (under_file, good, NULL, file);
  run_argv (&usage, (const char *[]) { g_getenv ("CW_BINARY"), "--export", png, NULL });
  g_assert_cmpint (usage.status, ==, 2);
  g_assert_nonnull (strstr (usage.err, "--export"));
  remove_tree (dir);
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/export/pdf/pages-and-size", test_pdf_pages_and_size);
  g_test_add_func ("/export/pdf/fonts-embedded", test_pdf_fonts_embedded);
  g_test_add_func ("/export/pdf/text", test_pdf_text);
  g_test_add_func ("/export/png/dpi", test_png_dpi);
  g_test_add_func ("/export/png/matches-pdf", test_png_matches_pdf);
  g_test_add_func ("/export/png/names", test_png_names);
  g_test_add_func ("/export/svg/xml", test_svg_is_xml);
  g_test_add_func ("/export/errors", test_errors);
  return g_test_run ();
}
