/* test-loader.c: malformed and hostile case files are refused, clearly
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include <glib/gstdio.h>

#include "cw-case-loader.h"
#include "cw-error.h"

/* Limits and ranges are those of the case format (docs: case-format.md,
 * version 1); these tests check that the loader enforces them, and that it
 * fails fast and cleanly on hostile input. */

/* 2 s, stretched by CW_TEST_TIME_SCALE under valgrind and the sanitizers. */
#define TIME_LIMIT_US (time_limit_us ())

static gint64
time_limit_us (void)
{
  const char *scale = g_getenv ("CW_TEST_TIME_SCALE");
  double factor = scale ? g_ascii_strtod (scale, NULL) : 1.0;

  return (gint64) (2 * G_USEC_PER_SEC * (factor >= 1.0 ? factor : 1.0));
}

typedef struct
{
  const char *file;
  CwError     code;
  const char *path;   /* NULL for faults that have no JSON path */
} BadFile;

static const BadFile bad_files[] = {
  { "truncated.cwcase", CW_ERROR_SYNTAX, NULL },
  { "trailing-comma.cwcase", CW_ERROR_SYNTAX, NULL },
  { "root-array.cwcase", CW_ERROR_INVALID, "document" },
  { "wrong-format.cwcase", CW_ERROR_INVALID, "format" },
  { "format-missing.cwcase", CW_ERROR_INVALID, "format" },
  { "version-2.cwcase", CW_ERROR_NEWER_VERSION, "version" },
  { "version-string.cwcase", CW_ERROR_INVALID, "version" },
  { "version-0.cwcase", CW_ERROR_INVALID, "version" },
  { "missing-canals.cwcase", CW_ERROR_INVALID, "canals" },
  { "empty-instruments.cwcase", CW_ERROR_INVALID, "instruments" },
  { "instruments-65.cwcase", CW_ERROR_INVALID, "instruments" },
  { "canals-9.cwcase", CW_ERROR_INVALID, "canals" },
  { "steps-41.cwcase", CW_ERROR_INVALID, "canals[0].sequence" },
  { "taper-and-segments.cwcase", CW_ERROR_INVALID, "instruments[1].taper" },
  { "taper-missing.cwcase", CW_ERROR_INVALID, "instruments[0].taper" },
  { "taper-zero.cwcase", CW_ERROR_INVALID, "instruments[0].taper" },
  { "taper-0.2.cwcase", CW_ERROR_INVALID, "instruments[0].taper" },
  { "segments-not-increasing.cwcase", CW_ERROR_INVALID, "instruments[1].taper_segments[1].to" },
  { "segments-overlapping.cwcase", CW_ERROR_INVALID, "instruments[1].taper_segments[2].to" },
  { "segment-past-40.cwcase", CW_ERROR_INVALID, "instruments[1].taper_segments[1].to" },
  { "segments-empty.cwcase", CW_ERROR_INVALID, "instruments[1].taper_segments" },
  { "segment-taper-missing.cwcase", CW_ERROR_INVALID, "instruments[1].taper_segments[0].taper" },
  { "tip-5.cwcase", CW_ERROR_INVALID, "instruments[0].tip" },
  { "tip-150.cwcase", CW_ERROR_INVALID, "instruments[0].tip" },
  { "tip-null.cwcase", CW_ERROR_INVALID, "instruments[0].tip" },
  { "max-flute-below-tip.cwcase", CW_ERROR_INVALID, "instruments[1].max_flute_diameter" },
  { "flute-longer-than-file.cwcase", CW_ERROR_INVALID, "instruments[0].flute_length" },
  { "unknown-alloy.cwcase", CW_ERROR_INVALID, "instruments[0].alloy" },
  { "unknown-motion.cwcase", CW_ERROR_INVALID, "instruments[1].motion" },
  { "alloy-missing.cwcase", CW_ERROR_INVALID, "instruments[0].alloy" },
  { "uses-allowed-fraction.cwcase", CW_ERROR_INVALID, "instruments[1].uses_allowed" },
  { "rpm-negative.cwcase", CW_ERROR_INVALID, "instruments[1].rpm" },
  { "empty-id.cwcase", CW_ERROR_INVALID, "instruments[0].id" },
  { "instrument-not-object.cwcase", CW_ERROR_INVALID, "instruments[1]" },
  { "duplicate-instrument-id.cwcase", CW_ERROR_INVALID, "instruments[1].id" },
  { "duplicate-canal-name.cwcase", CW_ERROR_INVALID, "canals[1].name" },
  { "unknown-instrument-in-sequence.cwcase", CW_ERROR_INVALID, "canals[0].sequence[1].instrument" },
  { "depth-zero.cwcase", CW_ERROR_INVALID, "canals[0].sequence[0].depth" },
  { "negative-working-length.cwcase", CW_ERROR_INVALID, "canals[0].working_length" },
  { "working-length-41.cwcase", CW_ERROR_INVALID, "canals[0].working_length" },
  { "zero-orifice.cwcase", CW_ERROR_INVALID, "canals[0].orifice_depth" },
  { "orifice-at-wl.cwcase", CW_ERROR_INVALID, "canals[0].orifice_depth" },
  { "onset-above-orifice.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].onset" },
  { "curve-past-wl.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].radius" },
  { "radius-negative.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].radius" },
  { "angle-200.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].angle" },
  { "curves-overlap.cwcase", CW_ERROR_INVALID, "canals[0].curves[1].onset" },
  { "three-curves.cwcase", CW_ERROR_INVALID, "canals[0].curves" },
  { "schneider-first-of-two.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].schneider_angle" },
  { "schneider-and-angle.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].schneider_angle" },
  { "schneider-90.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].schneider_angle" },
  { "curve-without-angle.cwcase", CW_ERROR_INVALID, "canals[0].curves[0].angle" },
  { "anatomy-missing.cwcase", CW_ERROR_INVALID, "canals[0].anatomy" },
  { "anatomy-both-forms.cwcase", CW_ERROR_INVALID, "canals[0].anatomy.diameters" },
  { "orifice-diameter-4.cwcase", CW_ERROR_INVALID, "canals[0].anatomy.orifice_diameter" },
  { "diameters-not-increasing.cwcase", CW_ERROR_INVALID, "canals[0].anatomy.diameters[2][0]" },
  { "measured-diameter-zero.cwcase", CW_ERROR_INVALID, "canals[0].anatomy.diameters[1][1]" },
  { "diameters-one-point.cwcase", CW_ERROR_INVALID, "canals[0].anatomy.diameters" },
  { "diameter-triple.cwcase", CW_ERROR_INVALID, "canals[0].anatomy.diameters[1]" },
  { "ceilings-not-increasing.cwcase", CW_ERROR_INVALID, "rules.diameter_ceilings[1][0]" },
  { "ceiling-row-short.cwcase", CW_ERROR_INVALID, "rules.diameter_ceilings[0]" },
  { "alloy-unobtainium.cwcase", CW_ERROR_INVALID, "rules.alloys.unobtainium" },
  { "strain-limit-2.cwcase", CW_ERROR_INVALID, "rules.alloys.niti.strain_limit" },
  { "contact-tolerance-string.cwcase", CW_ERROR_INVALID, "rules.contact_tolerance" },
  { "taper-change-yes.cwcase", CW_ERROR_INVALID, "rules.require_taper_change" },
  { "string-for-number.cwcase", CW_ERROR_INVALID, "canals[0].working_length" },
  { "object-for-array.cwcase", CW_ERROR_INVALID, "canals[0].sequence" },
  { "target-size-5.cwcase", CW_ERROR_INVALID, "targets.apical_size" },
  { "tooth-fdi-99.cwcase", CW_ERROR_INVALID, "tooth.code" },
  { "tooth-fdi-56.cwcase", CW_ERROR_INVALID, "tooth.code" },
  { "tooth-universal-33.cwcase", CW_ERROR_INVALID, "tooth.code" },
  { "tooth-notation-unknown.cwcase", CW_ERROR_INVALID, "tooth.notation" },
  { "title-number.cwcase", CW_ERROR_INVALID, "title" },
};

static char *
bad_path (const char *name)
{
  return g_test_build_filename (G_TEST_DIST, "data", "bad", name, NULL);
}

static char *
good_path (const char *name)
{
  return g_test_build_filename (G_TEST_DIST, "data", "good", name, NULL);
}

/* The message must start "FILE: PATH: " exactly, or "FILE: " without a path. */
static void
assert_refused (CwCase     *kase,
                GError     *error,
                CwError     code,
                const char *file,
                const char *path)
{
  g_autofree char *prefix = NULL;

  g_assert_null (kase);
  g_assert_error (error, CW_ERROR, (int) code);
  prefix = path != NULL ? g_strdup_printf ("%s: %s: ", file, path) : g_strdup_printf ("%s: ", file);
  if (!g_str_has_prefix (error->message, prefix))
    g_error ("message \"%s\" does not start with \"%s\"", error->message, prefix);
}

static void
assert_data_refused (const char *data,
                     gssize      length,
                     CwError     code,
                     const char *path)
{
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load_from_data (data, length, "hostile.cwcase", &error);

  assert_refused (kase, error, code, "hostile.cwcase", path);
}

/* A valid case with one member's text replaced by VALUE. */
static char *
case_with (const char *value)
{
  return g_strdup_printf ("{\"format\": \"canalwright-case\", \"version\": 1,\n"
                          " \"instruments\": [{\"id\": \"k10\", \"tip\": 10, \"taper\": 0.02,"
                          " \"alloy\": \"stainless\", \"motion\": \"hand\"}],\n"
                          " \"canals\": [{\"name\": \"MB\", \"working_length\": 21, \"orifice_depth\": 6,"
                          " \"curves\": [{\"onset\": 14, \"angle\": 30, \"radius\": 6}],"
                          " \"anatomy\": {\"orifice_diameter\": 0.6, \"apical_diameter\": 0.2}}],\n"
                          " \"x\": %s}\n", value);
}

static void
test_loader_bad_files_refused_with_path (void)
{
  gint64 start = g_get_monotonic_time ();

  for (guint i = 0; i < G_N_ELEMENTS (bad_files); i++)
    {
      g_autofree char *path = bad_path (bad_files[i].file);
      g_autoptr(GError) error = NULL;
      CwCase *kase = cw_case_load (path, &error);

      g_test_message ("%s: %s", bad_files[i].file, error ? error->message : "(loaded)");
      assert_refused (kase, error, bad_files[i].code, bad_files[i].file, bad_files[i].path);
    }
  g_assert_cmpint (g_get_monotonic_time () - start, <, TIME_LIMIT_US);
}

static void
test_loader_bad_files_all_in_table (void)
{
  g_autofree char *dir_path = g_test_build_filename (G_TEST_DIST, "data", "bad", NULL);
  g_autoptr(GDir) dir = g_dir_open (dir_path, 0, NULL);
  const char *name;
  guint n = 0;

  g_assert_nonnull (dir);
  while ((name = g_dir_read_name (dir)) != NULL)
    {
      gboolean listed = FALSE;

      for (guint i = 0; i < G_N_ELEMENTS (bad_files) && !listed; i++)
        listed = strcmp (bad_files[i].file, name) == 0;
      if (!listed)
        g_error ("tests/data/bad/%s has no row in the table", name);
      n++;
    }
  g_assert_cmpuint (n, ==, G_N_ELEMENTS (bad_files));
  g_assert_cmpuint (n, >=, 30);
}

/* Every bad file is this one with one fault, so this one must load. */
static void
test_loader_base_of_bad_files_loads (void)
{
  g_autofree char *path = good_path ("base.cwcase");
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load (path, &error);

  g_assert_no_error (error);
  g_assert_nonnull (kase);
}

static void
test_loader_messages_name_range_and_value (void)
{
  static const struct { const char *file; const char *text; } expected[] = {
    { "radius-negative.cwcase", "must be a number > 0 and <= 40 mm (got -3)" },
    { "tip-5.cwcase", "must be a number >= 6 and <= 140 (got 5)" },
    { "taper-0.2.cwcase", "must be a number > 0 and <= 0.12 (got 0.2)" },
    { "curve-past-wl.cwcase", "the curve ends at 24.47 mm, past the working length 21 mm" },
    { "version-2.cwcase", "was written by a newer Canalwright (file version 2, this program reads up to 1)" },
    { "unknown-instrument-in-sequence.cwcase", "\"r99\"" },
    { "string-for-number.cwcase", "(got a string)" },
    { "instruments-65.cwcase", "must hold 1 to 64 instruments (got 65)" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (expected); i++)
    {
      g_autofree char *path = bad_path (expected[i].file);
      g_autoptr(GError) error = NULL;
      g_autoptr(CwCase) kase = cw_case_load (path, &error);

      g_assert_nonnull (error);
      if (strstr (error->message, expected[i].text) == NULL)
        g_error ("message \"%s\" lacks \"%s\"", error->message, expected[i].text);
    }
}

static void
test_loader_syntax_error_gives_line_and_column (void)
{
  g_autofree char *path = bad_path ("truncated.cwcase");
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load (path, &error);

  g_assert_error (error, CW_ERROR, CW_ERROR_SYNTAX);
  if (!g_regex_match_simple ("^truncated\\.cwcase: ([^ ]+: )?[0-9]+:[0-9]+: ", error->message, 0, 0))
    g_error ("message \"%s\" gives no line and column", error->message);
}

static void
test_loader_refuses_file_over_16_mib_unread (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "huge.cwcase", NULL);
  g_autoptr(GError) error = NULL;
  CwCase *kase;
  FILE *f = g_fopen (path, "w");

  /* A sparse file: the loader must refuse it from its size alone. */
  g_assert_nonnull (f);
  g_assert_cmpint (ftruncate (fileno (f), 17 * 1024 * 1024), ==, 0);
  fclose (f);
  kase = cw_case_load (path, &error);
  assert_refused (kase, error, CW_ERROR_TOO_LARGE, "huge.cwcase", NULL);
  g_unlink (path);
  g_rmdir (dir);
}

static void
test_loader_refuses_data_over_16_mib (void)
{
  gsize length = 17 * 1024 * 1024;
  g_autofree char *data = g_malloc (length);

  memset (data, ' ', length);
  assert_data_refused (data, (gssize) length, CW_ERROR_TOO_LARGE, NULL);
}

static char *
nested (const char *open,
        guint       depth)
{
  GString *text = g_string_new (open);

  for (guint i = 0; i < depth; i++)
    g_string_append_c (text, '[');
  g_string_append_c (text, '1');
  for (guint i = 0; i < depth; i++)
    g_string_append_c (text, ']');
  g_string_append (text, "]");
  return g_string_free (text, FALSE);
}

static void
test_loader_refuses_nesting_10000_deep (void)
{
  g_autofree char *value = nested ("[", 10000);
  g_autofree char *data = case_with (value);

  assert_data_refused (data, -1, CW_ERROR_TOO_LARGE, NULL);
}

/* The JSON parser reads more than strict JSON: '...' strings, slash-to-slash
 * comments, and a \u escape that swallows the character after it.  Each of
 * these hides brackets from a naive depth check; the strict check refuses
 * them as text that is not JSON before any depth is reached. */
static void
test_loader_refuses_nesting_hidden_from_naive_scan (void)
{
  static const char *openings[] = {
    "[\"\\ud800\" \", ",
    "[\"\\u12\" \", ",
    "[1 / \" / , ",
    "['\"' , ",
  };

  for (guint i = 0; i < G_N_ELEMENTS (openings); i++)
    {
      g_autofree char *value = nested (openings[i], 100000);
      g_autofree char *data = case_with (value);

      assert_data_refused (data, -1, CW_ERROR_SYNTAX, NULL);
    }
}

/* What json-glib would read leniently, and the strict check refuses with
 * the path of the value: a file must load as it reads (RFC 8259). */
static void
test_loader_strict_json (void)
{
  static const struct { const char *value; CwError code; const char *path; } cases[] = {
    { "021", CW_ERROR_SYNTAX, "x" },                      /* octal in json-glib */
    { "0x15", CW_ERROR_SYNTAX, "x" },                     /* hexadecimal */
    { "-18446744073709551595", CW_ERROR_INVALID, "x" },   /* wraps round 64 bits */
    { "{\"a\": 1, \"a\": 2}", CW_ERROR_SYNTAX, "x.a" },   /* the last would win */
    { "\"ab\\u0000cd\"", CW_ERROR_SYNTAX, "x" },          /* cut short */
    { "\"\\ud800\"", CW_ERROR_SYNTAX, "x" },              /* half a surrogate pair */
    { "\"\\063\\066\"", CW_ERROR_SYNTAX, "x" },           /* an octal escape */
    { "\"a\tb\"", CW_ERROR_SYNTAX, "x" },                 /* a raw control character */
    { "'single'", CW_ERROR_SYNTAX, "x" },
    { "/* a comment */ 1", CW_ERROR_SYNTAX, "x" },
    { "[1, 2, ]", CW_ERROR_SYNTAX, "x[2]" },
    { "+1", CW_ERROR_SYNTAX, "x" },
    { ".5", CW_ERROR_SYNTAX, "x" },
    { "1.", CW_ERROR_SYNTAX, "x" },
    { "tru", CW_ERROR_SYNTAX, "x" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *data = case_with (cases[i].value);

      assert_data_refused (data, -1, cases[i].code, cases[i].path);
    }
}

/* A case may hold more than the loader keeps (unknown members), but not
 * millions of values, which json-glib would take seconds to build. */
static void
test_loader_bounds_values_and_lengths (void)
{
  GString *many = g_string_new ("[");
  GString *wide = g_string_new ("[");
  g_autofree char *many_data = NULL, *wide_data = NULL;

  /* 10 000 arrays of 50 numbers: 510 001 values, none nested deep. */
  for (guint i = 0; i < 10000; i++)
    {
      g_string_append (many, i ? ", [" : "[");
      for (guint k = 0; k < 50; k++)
        g_string_append (many, k ? ",1" : "1");
      g_string_append_c (many, ']');
    }
  g_string_append (many, "]");
  for (guint i = 0; i < 10001; i++)
    g_string_append (wide, i ? ", 0" : "0");
  g_string_append (wide, "]");
  many_data = case_with (many->str);
  wide_data = case_with (wide->str);
  assert_data_refused (many_data, -1, CW_ERROR_TOO_LARGE, NULL);
  assert_data_refused (wide_data, -1, CW_ERROR_INVALID, "x");
  g_string_free (many, TRUE);
  g_string_free (wide, TRUE);
}

static void
test_loader_accepts_brackets_inside_strings (void)
{
  g_autofree char *brackets = g_strnfill (200, '[');
  g_autofree char *value = g_strdup_printf ("{\"a\": \"%s\", \"b\": \"\\\"{{{{\\\\\"}", brackets);
  g_autofree char *data = case_with (value);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load_from_data (data, -1, "strings.cwcase", &error);

  g_assert_no_error (error);
  g_assert_nonnull (kase);
}

static void
test_loader_accepts_nesting_of_32 (void)
{
  g_autofree char *value = nested ("[", 30);
  g_autofree char *data = case_with (value);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load_from_data (data, -1, "deep.cwcase", &error);

  /* The document object, then 31 arrays: 32 levels. */
  g_assert_no_error (error);
  g_assert_nonnull (kase);
  g_clear_pointer (&value, g_free);
  g_clear_pointer (&data, g_free);
  value = nested ("[", 31);
  data = case_with (value);
  assert_data_refused (data, -1, CW_ERROR_TOO_LARGE, NULL);
}

static void
test_loader_refuses_100000_instruments_before_building (void)
{
  GString *text = g_string_new ("{\"format\": \"canalwright-case\", \"version\": 1, \"instruments\": [");
  g_autofree char *data = NULL;
  gint64 start = g_get_monotonic_time ();

  for (guint i = 0; i < 100000; i++)
    g_string_append (text, i > 0 ? ",{}" : "{}");
  g_string_append (text, "], \"canals\": []}");
  data = g_string_free (text, FALSE);
  assert_data_refused (data, -1, CW_ERROR_INVALID, "instruments");
  g_assert_cmpint (g_get_monotonic_time () - start, <, TIME_LIMIT_US);
}

static void
test_loader_refuses_invalid_utf8_with_offset (void)
{
  g_autofree char *data = case_with ("\"caf\xC3\x28\"");
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load_from_data (data, -1, "hostile.cwcase", &error);
  g_autofree char *offset = g_strdup_printf ("offset %d", (int) (strstr (data, "\xC3") - data));

  assert_refused (kase, error, CW_ERROR_SYNTAX, "hostile.cwcase", NULL);
  g_assert_nonnull (strstr (error->message, offset));
}

static void
test_loader_refuses_nul_byte (void)
{
  g_autofree char *data = case_with ("\"a b\"");
  gsize length = strlen (data);

  *strchr (data, ' ') = '\0';
  assert_data_refused (data, (gssize) length, CW_ERROR_SYNTAX, NULL);
}

static void
test_loader_refuses_empty_and_blank_text (void)
{
  assert_data_refused ("", 0, CW_ERROR_SYNTAX, NULL);
  assert_data_refused ("  \n\t ", -1, CW_ERROR_SYNTAX, NULL);
  assert_data_refused ("/* nothing */", -1, CW_ERROR_SYNTAX, NULL);
}

static void
test_loader_refuses_empty_file (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "empty.cwcase", NULL);
  g_autoptr(GError) error = NULL;
  CwCase *kase;

  g_assert_true (g_file_set_contents (path, "", 0, NULL));
  kase = cw_case_load (path, &error);
  assert_refused (kase, error, CW_ERROR_SYNTAX, "empty.cwcase", NULL);
  g_unlink (path);
  g_rmdir (dir);
}

static void
test_loader_refuses_directory (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "folder.cwcase", NULL);
  g_autoptr(GError) error = NULL;
  CwCase *kase;

  g_assert_cmpint (g_mkdir (path, 0755), ==, 0);
  kase = cw_case_load (path, &error);
  assert_refused (kase, error, CW_ERROR_READ, "folder.cwcase", NULL);
  g_assert_nonnull (strstr (error->message, path));
  g_rmdir (path);
  g_rmdir (dir);
}

static void
test_loader_refuses_pipe_without_waiting (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "pipe.cwcase", NULL);
  g_autoptr(GError) error = NULL;
  CwCase *kase;

  g_assert_cmpint (mkfifo (path, 0600), ==, 0);
  kase = cw_case_load (path, &error);
  assert_refused (kase, error, CW_ERROR_READ, "pipe.cwcase", NULL);
  g_unlink (path);
  g_rmdir (dir);
}

static void
test_loader_refuses_missing_file (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "absent.cwcase", NULL);
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load (path, &error);

  assert_refused (kase, error, CW_ERROR_READ, "absent.cwcase", NULL);
  g_assert_nonnull (strstr (error->message, path));
  g_rmdir (dir);
}

static void
test_loader_refuses_unreadable_file (void)
{
  g_autofree char *dir = NULL;
  g_autofree char *path = NULL;
  g_autofree char *source = good_path ("minimal.cwcase");
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  CwCase *kase;

  if (geteuid () == 0)
    {
      g_test_skip ("running as root, which reads a file whatever its mode");
      return;
    }
  dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  path = g_build_filename (dir, "locked.cwcase", NULL);
  g_assert_true (g_file_get_contents (source, &text, NULL, NULL));
  g_assert_true (g_file_set_contents (path, text, -1, NULL));
  g_assert_cmpint (g_chmod (path, 0000), ==, 0);
  kase = cw_case_load (path, &error);
  assert_refused (kase, error, CW_ERROR_READ, "locked.cwcase", NULL);
  g_chmod (path, 0600);
  g_unlink (path);
  g_rmdir (dir);
}

static char *
case_with_radius (const char *radius)
{
  g_autofree char *data = case_with ("0");
  char *at = strstr (data, "\"radius\": 6");
  GString *edit = g_string_new_len (data, at - data);

  g_string_append_printf (edit, "\"radius\": %s%s", radius, at + strlen ("\"radius\": 6"));
  return g_string_free (edit, FALSE);
}

static void
test_loader_refuses_nan_and_infinity_tokens (void)
{
  static const char *tokens[] = { "NaN", "Infinity", "-Infinity", "nan", "inf" };

  for (guint i = 0; i < G_N_ELEMENTS (tokens); i++)
    {
      g_autofree char *data = case_with_radius (tokens[i]);

      assert_data_refused (data, -1, CW_ERROR_SYNTAX, NULL);
    }
}

static void
test_loader_refuses_huge_and_infinite_numbers (void)
{
  static const char *values[] = { "1e308", "1e999", "-1e999", "99999999999999999999" };

  for (guint i = 0; i < G_N_ELEMENTS (values); i++)
    {
      g_autofree char *data = case_with_radius (values[i]);

      assert_data_refused (data, -1, CW_ERROR_INVALID, "canals[0].curves[0].radius");
    }
}

static void
test_loader_hostile_inputs_fail_fast (void)
{
  gint64 start = g_get_monotonic_time ();

  test_loader_refuses_nesting_10000_deep ();
  test_loader_refuses_nesting_hidden_from_naive_scan ();
  test_loader_refuses_nan_and_infinity_tokens ();
  test_loader_refuses_huge_and_infinite_numbers ();
  test_loader_refuses_invalid_utf8_with_offset ();
  test_loader_refuses_empty_and_blank_text ();
  g_assert_cmpint (g_get_monotonic_time () - start, <, TIME_LIMIT_US);
}

static void
test_loader_refuses_script_assignment (void)
{
  g_autofree char *body = case_with ("0");
  g_autofree char *data = g_strconcat ("var kase = ", body, ";", NULL);

  assert_data_refused (data, -1, CW_ERROR_SYNTAX, NULL);
}

/* The parser would keep only the last of two objects in a row. */
static void
test_loader_refuses_second_top_level_value (void)
{
  g_autofree char *body = case_with ("0");
  g_autofree char *data = g_strconcat (body, "{\"format\": \"canalwright-case\", \"version\": 1}", NULL);

  assert_data_refused (data, -1, CW_ERROR_SYNTAX, NULL);
}

static void
test_loader_names_display_name_for_data (void)
{
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load_from_data ("{\"format\": 3}", -1, "pasted text", &error);

  assert_refused (kase, error, CW_ERROR_INVALID, "pasted text", "format");
}

static CwCase *
load_good (const char *name)
{
  g_autofree char *path = good_path (name);
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load (path, &error);

  g_assert_no_error (error);
  g_assert_nonnull (kase);
  return kase;
}

static const CwInstrument *
instrument_at (const CwCase *kase,
               guint         index)
{
  g_assert_cmpuint (index, <, kase->instruments->len);
  return g_ptr_array_index (kase->instruments, index);
}

static const CwCanal *
canal_at (const CwCase *kase,
          guint         index)
{
  g_assert_cmpuint (index, <, kase->canals->len);
  return g_ptr_array_index (kase->canals, index);
}

static gboolean
same_number (double a,
             double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

static void
assert_rules_equal (const CwRules *a,
                    const CwRules *b)
{
  g_assert_true (same_number (a->contact_tolerance, b->contact_tolerance));
  g_assert_true (same_number (a->advance_rate, b->advance_rate));
  g_assert_true (same_number (a->peck_increment, b->peck_increment));
  g_assert_true (same_number (a->changeover, b->changeover));
  g_assert_true (same_number (a->at_length_tolerance, b->at_length_tolerance));
  g_assert_true (same_number (a->curve_engagement_max, b->curve_engagement_max));
  g_assert_true (same_number (a->small_file_tip_max, b->small_file_tip_max));
  g_assert_true (same_number (a->small_file_taper_max, b->small_file_taper_max));
  g_assert_true (same_number (a->glide_path_tip_max, b->glide_path_tip_max));
  g_assert_cmpint (a->require_taper_change, ==, b->require_taper_change);
  g_assert_cmpuint (a->n_ceilings, ==, b->n_ceilings);
  for (guint i = 0; i < a->n_ceilings; i++)
    {
      g_assert_true (same_number (a->ceiling_taper[i], b->ceiling_taper[i]));
      g_assert_true (same_number (a->ceiling_diameter[i], b->ceiling_diameter[i]));
    }
  for (guint i = 0; i < CW_N_ALLOYS; i++)
    {
      g_assert_true (same_number (a->alloys[i].strain_limit, b->alloys[i].strain_limit));
      g_assert_true (same_number (a->alloys[i].strain_life_a, b->alloys[i].strain_life_a));
      g_assert_true (same_number (a->alloys[i].strain_life_k, b->alloys[i].strain_life_k));
      g_assert_true (same_number (a->alloys[i].shear_strength, b->alloys[i].shear_strength));
      g_assert_true (same_number (a->alloys[i].section_factor, b->alloys[i].section_factor));
    }
}

static void
test_loader_minimal_file_gets_defaults (void)
{
  g_autoptr(CwCase) kase = load_good ("minimal.cwcase");
  const CwInstrument *k15 = instrument_at (kase, 0);
  const CwCanal *canal = canal_at (kase, 0);
  CwRules defaults;

  g_assert_cmpstr (kase->title, ==, "");
  g_assert_null (kase->notes);
  g_assert_null (kase->tooth_code);
  g_assert_cmpint (kase->notation, ==, CW_NOTATION_FDI);
  g_assert_cmpfloat (kase->target_apical_size, ==, CW_DEFAULT_TARGET_SIZE);
  g_assert_cmpfloat (kase->target_apical_taper, ==, CW_DEFAULT_TARGET_TAPER);
  g_assert_null (kase->rules_json);
  g_assert_null (kase->extra_json);
  cw_rules_init_defaults (&defaults);
  assert_rules_equal (&kase->rules, &defaults);
  g_assert_cmpstr (k15->id, ==, "k15");
  g_assert_cmpstr (k15->label, ==, "k15");
  g_assert_cmpfloat (k15->tip, ==, 15);
  g_assert_cmpfloat (k15->taper, ==, 0.02);
  g_assert_null (k15->segments);
  g_assert_cmpfloat (k15->flute_length, ==, CW_DEFAULT_FLUTE_LENGTH);
  g_assert_cmpfloat (k15->length, ==, CW_DEFAULT_INSTRUMENT_LENGTH);
  g_assert_true (isnan (k15->max_flute_diameter));
  g_assert_true (isnan (k15->rpm));
  g_assert_true (isnan (k15->torque_limit));
  g_assert_cmpint (k15->uses_allowed, ==, 0);
  g_assert_null (k15->extra_json);
  g_assert_cmpstr (canal->name, ==, "P");
  g_assert_null (canal->reference);
  g_assert_cmpfloat (canal->working_length, ==, 22);
  g_assert_cmpfloat (canal->orifice_depth, ==, 5);
  g_assert_cmpuint (canal->n_curves, ==, 0);
  g_assert_null (canal->diameters);
  g_assert_cmpfloat (canal->orifice_diameter, ==, 0.5);
  g_assert_cmpfloat (canal->apical_diameter, ==, 0.15);
  g_assert_cmpuint (canal->sequence->len, ==, 0);
  g_assert_null (canal->extra_json);
  g_assert_null (canal->anatomy_extra_json);
}

static void
test_loader_full_file_values_as_written (void)
{
  g_autoptr(CwCase) kase = load_good ("full.cwcase");
  const CwInstrument *r25v = instrument_at (kase, 1);
  const CwInstrument *rc25 = instrument_at (kase, 2);
  const CwCanal *mb = canal_at (kase, 0);
  const CwTaperSegment *segments;
  const CwPoint *points;
  const CwStep *steps;

  g_assert_cmpstr (kase->title, ==, "Upper first molar, S-shaped mesiobuccal canal");
  g_assert_cmpstr (kase->notes, ==, "Invented scenario for the loader tests.");
  g_assert_cmpint (kase->notation, ==, CW_NOTATION_UNIVERSAL);
  g_assert_cmpstr (kase->tooth_code, ==, "3");
  g_assert_cmpfloat (kase->target_apical_size, ==, 35);
  g_assert_cmpfloat (kase->target_apical_taper, ==, 0.06);
  g_assert_cmpstr (instrument_at (kase, 0)->label, ==, "hand K-type 10/.02");
  g_assert_cmpfloat (instrument_at (kase, 0)->length, ==, 21);

  g_assert_cmpfloat (r25v->tip, ==, 25);
  g_assert_true (isnan (r25v->taper));
  g_assert_cmpuint (r25v->segments->len, ==, 2);
  segments = (const CwTaperSegment *) r25v->segments->data;
  g_assert_cmpfloat (segments[0].to, ==, 4);
  g_assert_cmpfloat (segments[0].taper, ==, 0.08);
  g_assert_cmpfloat (segments[1].to, ==, 16);
  g_assert_cmpfloat (segments[1].taper, ==, 0.04);
  g_assert_cmpfloat (r25v->max_flute_diameter, ==, 1.0);
  g_assert_cmpint (r25v->alloy, ==, CW_ALLOY_NITI_HEAT_TREATED);
  g_assert_cmpint (r25v->motion, ==, CW_MOTION_ROTARY);
  g_assert_cmpfloat (r25v->rpm, ==, 400);
  g_assert_cmpfloat (r25v->torque_limit, ==, 1.5);
  g_assert_cmpint (r25v->uses_allowed, ==, 3);
  g_assert_cmpstr (rc25->label, ==, "rc25");
  g_assert_cmpint (rc25->motion, ==, CW_MOTION_RECIPROCATING);

  g_assert_cmpstr (mb->reference, ==, "mesiobuccal cusp tip");
  g_assert_cmpuint (mb->n_curves, ==, 2);
  g_assert_cmpfloat (mb->curves[0].onset, ==, 12);
  g_assert_cmpfloat (mb->curves[0].angle, ==, 20);
  g_assert_cmpfloat (mb->curves[0].radius, ==, 8);
  g_assert_true (isnan (mb->curves[0].schneider_angle));
  g_assert_cmpfloat (mb->curves[1].onset, ==, 16);
  g_assert_cmpfloat (mb->curves[1].schneider_angle, ==, 15);
  g_assert_true (isnan (mb->curves[1].angle));
  g_assert_true (isnan (mb->curves[1].radius));
  g_assert_cmpuint (mb->diameters->len, ==, 4);
  points = (const CwPoint *) mb->diameters->data;
  g_assert_cmpfloat (points[1].s, ==, 12);
  g_assert_cmpfloat (points[1].v, ==, 0.42);
  g_assert_true (isnan (mb->orifice_diameter));
  g_assert_cmpuint (mb->sequence->len, ==, 3);
  steps = (const CwStep *) mb->sequence->data;
  g_assert_cmpstr (steps[0].instrument_id, ==, "h10");
  g_assert_cmpstr (steps[0].note, ==, "scout");
  g_assert_cmpfloat (steps[1].depth, ==, 19.5);
  g_assert_cmpstr (steps[1].note, ==, "");
  g_assert_null (steps[2].note);
}

/* A depth past the working length is the engine's finding, not a load error. */
static void
test_loader_depth_beyond_working_length_loads (void)
{
  g_autoptr(CwCase) kase = load_good ("full.cwcase");
  const CwCanal *p = canal_at (kase, 1);

  g_assert_cmpfloat (g_array_index (p->sequence, CwStep, 0).depth, ==, 24);
  g_assert_cmpfloat (p->working_length, ==, 22.5);
}

static void
test_loader_rules_overrides_and_defaults (void)
{
  g_autoptr(CwCase) kase = load_good ("full.cwcase");
  const CwRules *r = &kase->rules;
  CwRules expected;

  cw_rules_init_defaults (&expected);
  expected.contact_tolerance = 0.02;
  expected.changeover = 15;
  expected.n_ceilings = 4;
  expected.ceiling_taper[0] = 0.02;
  expected.ceiling_taper[1] = 0.04;
  expected.ceiling_taper[2] = 0.06;
  expected.ceiling_taper[3] = 0.08;
  expected.ceiling_diameter[0] = 0.62;
  expected.ceiling_diameter[1] = 0.56;
  expected.ceiling_diameter[2] = 0.5;
  expected.ceiling_diameter[3] = 0.45;
  expected.require_taper_change = FALSE;
  expected.alloys[CW_ALLOY_NITI].strain_limit = 0.07;
  expected.alloys[CW_ALLOY_NITI].shear_strength = 750;
  expected.alloys[CW_ALLOY_STAINLESS].strain_limit = NAN;
  expected.alloys[CW_ALLOY_STAINLESS].strain_life_k = 2.5;
  assert_rules_equal (r, &expected);
  g_assert_nonnull (kase->rules_json);
}

static void
test_loader_rules_file_applies_over_defaults (void)
{
  g_autofree char *path = good_path ("custom.cwrules");
  g_autoptr(GError) error = NULL;
  CwRules rules, expected;

  memset (&rules, 0, sizeof rules);
  g_assert_true (cw_rules_load (path, &rules, &error));
  g_assert_no_error (error);
  cw_rules_init_defaults (&expected);
  expected.advance_rate = 0.4;
  expected.peck_increment = 0.5;
  expected.glide_path_tip_max = 10;
  expected.alloys[CW_ALLOY_NITI_HEAT_TREATED].strain_limit = 0.09;
  expected.alloys[CW_ALLOY_NITI_HEAT_TREATED].strain_life_a = NAN;
  assert_rules_equal (&rules, &expected);
}

static void
test_loader_rules_file_refused_untouched (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-loader-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "bad.cwrules", NULL);
  g_autofree char *case_path = good_path ("minimal.cwcase");
  g_autoptr(GError) error = NULL;
  CwRules rules, before;

  cw_rules_init_defaults (&rules);
  rules.changeover = 99;
  before = rules;
  g_assert_true (g_file_set_contents (path, "{\"format\": \"canalwright-rules\", \"version\": 1,"
                                      " \"changeover\": 5, \"advance_rate\": 0}", -1, NULL));
  g_assert_false (cw_rules_load (path, &rules, &error));
  g_assert_error (error, CW_ERROR, CW_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, "bad.cwrules: advance_rate: "));
  assert_rules_equal (&rules, &before);
  g_clear_error (&error);
  g_assert_false (cw_rules_load (case_path, &rules, &error));
  g_assert_true (g_str_has_prefix (error->message, "minimal.cwcase: format: "));
  g_unlink (path);
  g_rmdir (dir);
}

static void
test_loader_accepts_byte_order_mark (void)
{
  g_autofree char *body = case_with ("0");
  g_autofree char *data = g_strconcat ("\xEF\xBB\xBF", body, NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load_from_data (data, -1, "bom.cwcase", &error);

  g_assert_no_error (error);
  g_assert_nonnull (kase);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/loader/strict-json", test_loader_strict_json);
  g_test_add_func ("/loader/bounds-values-and-lengths", test_loader_bounds_values_and_lengths);
  g_test_add_func ("/loader/bad-files-refused-with-path", test_loader_bad_files_refused_with_path);
  g_test_add_func ("/loader/bad-files-all-in-table", test_loader_bad_files_all_in_table);
  g_test_add_func ("/loader/base-of-bad-files-loads", test_loader_base_of_bad_files_loads);
  g_test_add_func ("/loader/messages-name-range-and-value", test_loader_messages_name_range_and_value);
  g_test_add_func ("/loader/syntax-error-gives-line-and-column", test_loader_syntax_error_gives_line_and_column);
  g_test_add_func ("/loader/refuses-file-over-16-mib-unread", test_loader_refuses_file_over_16_mib_unread);
  g_test_add_func ("/loader/refuses-data-over-16-mib", test_loader_refuses_data_over_16_mib);
  g_test_add_func ("/loader/refuses-nesting-10000-deep", test_loader_refuses_nesting_10000_deep);
  g_test_add_func ("/loader/refuses-nesting-hidden-from-naive-scan",
                   test_loader_refuses_nesting_hidden_from_naive_scan);
  g_test_add_func ("/loader/accepts-brackets-inside-strings", test_loader_accepts_brackets_inside_strings);
  g_test_add_func ("/loader/accepts-nesting-of-32", test_loader_accepts_nesting_of_32);
  g_test_add_func ("/loader/refuses-100000-instruments-before-building",
                   test_loader_refuses_100000_instruments_before_building);
  g_test_add_func ("/loader/refuses-invalid-utf8-with-offset", test_loader_refuses_invalid_utf8_with_offset);
  g_test_add_func ("/loader/refuses-nul-byte", test_loader_refuses_nul_byte);
  g_test_add_func ("/loader/refuses-empty-and-blank-text", test_loader_refuses_empty_and_blank_text);
  g_test_add_func ("/loader/refuses-empty-file", test_loader_refuses_empty_file);
  g_test_add_func ("/loader/refuses-directory", test_loader_refuses_directory);
  g_test_add_func ("/loader/refuses-pipe-without-waiting", test_loader_refuses_pipe_without_waiting);
  g_test_add_func ("/loader/refuses-missing-file", test_loader_refuses_missing_file);
  g_test_add_func ("/loader/refuses-unreadable-file", test_loader_refuses_unreadable_file);
  g_test_add_func ("/loader/refuses-nan-and-infinity-tokens", test_loader_refuses_nan_and_infinity_tokens);
  g_test_add_func ("/loader/refuses-huge-and-infinite-numbers", test_loader_refuses_huge_and_infinite_numbers);
  g_test_add_func ("/loader/hostile-inputs-fail-fast", test_loader_hostile_inputs_fail_fast);
  g_test_add_func ("/loader/refuses-script-assignment", test_loader_refuses_script_assignment);
  g_test_add_func ("/loader/refuses-second-top-level-value", test_loader_refuses_second_top_level_value);
  g_test_add_func ("/loader/names-display-name-for-data", test_loader_names_display_name_for_data);
  g_test_add_func ("/loader/minimal-file-gets-defaults", test_loader_minimal_file_gets_defaults);
  g_test_add_func ("/loader/full-file-values-as-written", test_loader_full_file_values_as_written);
  g_test_add_func ("/loader/depth-beyond-working-length-loads", test_loader_depth_beyond_working_length_loads);
  g_test_add_func ("/loader/rules-overrides-and-defaults", test_loader_rules_overrides_and_defaults);
  g_test_add_func ("/loader/rules-file-applies-over-defaults", test_loader_rules_file_applies_over_defaults);
  g_test_add_func ("/loader/rules-file-refused-untouched", test_loader_rules_file_refused_untouched);
  g_test_add_func ("/loader/accepts-byte-order-mark", test_loader_accepts_byte_order_mark);

  return g_test_run ();
}
