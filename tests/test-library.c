/* test-library.c: instrument library files, the library folder, and the
 * instrument checks the editor uses
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <math.h>
#include <string.h>

#include <glib/gstdio.h>

#include "cw-case-loader.h"
#include "cw-case-writer.h"
#include "cw-error.h"
#include "cw-library-folder.h"
#include "cw-library.h"
#include "cw-test-util.h"

#define STARTER "starter-library.cwlib"

static CwLibrary *
load_starter (void)
{
  g_autofree char *path = cw_test_sample_path (STARTER);
  g_autoptr(GError) error = NULL;
  CwLibrary *library = cw_library_load (path, &error);

  g_assert_no_error (error);
  g_assert_nonnull (library);
  return library;
}

static char *
temp_dir (void)
{
  g_autoptr(GError) error = NULL;
  char *dir = g_dir_make_tmp ("cw-library-XXXXXX", &error);

  g_assert_no_error (error);
  return dir;
}

static void
remove_dir (const char *dir)
{
  g_autoptr(GDir) folder = g_dir_open (dir, 0, NULL);
  const char *name;

  while (folder != NULL && (name = g_dir_read_name (folder)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      g_unlink (path);
    }
  g_rmdir (dir);
}

static void
test_library_starter (void)
{
  g_autoptr(CwLibrary) library = load_starter ();
  const CwInstrument *v25;

  g_assert_cmpstr (library->title, ==, "Starter library (invented demonstration set)");
  g_assert_cmpuint (library->instruments->len, ==, 22);
  g_assert_cmpint (cw_library_find (library, "k08"), ==, 0);
  g_assert_cmpint (cw_library_find (library, "nonesuch"), ==, -1);
  v25 = cw_library_lookup (library, "v25");
  g_assert_nonnull (v25);
  g_assert_nonnull (v25->segments);
  g_assert_cmpuint (v25->segments->len, >=, 2);
  g_assert_true (g_str_has_suffix (library->path, STARTER));
}

/* Written, read back and written again: the same bytes, unknown members
 * kept at the top and inside an instrument. */
static void
test_library_round_trip (void)
{
  static const char text[] =
    "{ \"format\": \"canalwright-library\", \"version\": 1, \"title\": \"Surgery 2\",\n"
    "  \"owner\": { \"room\": 2 },\n"
    "  \"instruments\": [\n"
    "    { \"id\": \"a\", \"label\": \"hand 15/.02\", \"tip\": 15, \"taper\": 0.02,\n"
    "      \"alloy\": \"stainless\", \"motion\": \"hand\", \"lot\": \"x7\" },\n"
    "    { \"id\": \"b\", \"tip\": 25, \"taper_segments\": [ { \"to\": 4, \"taper\": 0.08 },\n"
    "      { \"to\": 16, \"taper\": 0.035 } ], \"max_flute_diameter\": 0.95, \"length\": 21,\n"
    "      \"alloy\": \"niti-heat-treated\", \"motion\": \"rotary\", \"rpm\": 350,\n"
    "      \"torque_limit\": 1.2, \"uses_allowed\": 4 } ] }\n";
  g_autoptr(GError) error = NULL;
  g_autoptr(CwLibrary) library = cw_library_load_from_data (text, -1, "s2.cwlib", &error);
  g_autoptr(CwLibrary) again = NULL;
  g_autoptr(CwLibrary) reread = NULL;
  g_autofree char *first = NULL;
  g_autofree char *second = NULL;
  g_autofree char *dir = temp_dir ();
  g_autofree char *path = g_build_filename (dir, "s2.cwlib", NULL);
  g_autofree char *saved = NULL;

  g_assert_no_error (error);
  first = cw_library_to_data (library);
  g_assert_nonnull (strstr (first, "\"owner\""));
  g_assert_nonnull (strstr (first, "\"lot\": \"x7\""));
  again = cw_library_load_from_data (first, -1, "s2.cwlib", &error);
  g_assert_no_error (error);
  second = cw_library_to_data (again);
  g_assert_cmpstr (first, ==, second);
  for (guint i = 0; i < library->instruments->len; i++)
    g_assert_true (cw_instrument_equal (g_ptr_array_index (library->instruments, i),
                                        g_ptr_array_index (again->instruments, i)));

  g_assert_true (cw_library_save (library, path, &error));
  g_assert_no_error (error);
  g_assert_cmpstr (library->path, ==, path);
  g_assert_true (g_file_get_contents (path, &saved, NULL, NULL));
  g_assert_cmpstr (saved, ==, first);
  reread = cw_library_load (path, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (reread->title, ==, "Surgery 2");
  remove_dir (dir);
}

/* The starter file reads back the same after a save: every instrument
 * and the title. */
static void
test_library_starter_round_trip (void)
{
  g_autoptr(CwLibrary) library = load_starter ();
  g_autofree char *data = cw_library_to_data (library);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwLibrary) back = cw_library_load_from_data (data, -1, STARTER, &error);

  g_assert_no_error (error);
  g_assert_cmpstr (back->title, ==, library->title);
  g_assert_cmpuint (back->instruments->len, ==, library->instruments->len);
  for (guint i = 0; i < library->instruments->len; i++)
    g_assert_true (cw_instrument_equal (g_ptr_array_index (library->instruments, i),
                                        g_ptr_array_index (back->instruments, i)));
}

static void
assert_library_refused (const char *text,
                        CwError     code,
                        const char *message)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(CwLibrary) library = cw_library_load_from_data (text, -1, "bad.cwlib", &error);

  g_assert_null (library);
  g_assert_error (error, CW_ERROR, (int) code);
  if (message != NULL)
    g_assert_cmpstr (error->message, ==, message);
}

static void
test_library_refused (void)
{
  assert_library_refused ("{ \"format\": \"canalwright-case\", \"version\": 1, \"instruments\": [] }",
                          CW_ERROR_INVALID,
                          "bad.cwlib: format: must be \"canalwright-library\" (got \"canalwright-case\")");
  assert_library_refused ("{ \"format\": \"canalwright-library\", \"version\": 2, \"instruments\": [] }",
                          CW_ERROR_NEWER_VERSION,
                          "bad.cwlib: version: was written by a newer Canalwright "
                          "(file version 2, this program reads up to 1)");
  assert_library_refused ("{ \"format\": \"canalwright-library\", \"version\": 1 }",
                          CW_ERROR_INVALID,
                          "bad.cwlib: instruments: is required (an array of 0 to 256 instruments)");
  assert_library_refused ("{ \"format\": \"canalwright-library\", \"version\": 1, \"instruments\": [\n"
                          "  { \"id\": \"a\", \"tip\": 15, \"taper\": 0.02, \"alloy\": \"niti\", \"motion\": \"hand\" },\n"
                          "  { \"id\": \"a\", \"tip\": 20, \"taper\": 0.02, \"alloy\": \"niti\", \"motion\": \"hand\" } ] }",
                          CW_ERROR_INVALID,
                          "bad.cwlib: instruments[1].id: must be unique, but instruments[0] has the id \"a\" too");
  assert_library_refused ("{ \"format\": \"canalwright-library\", \"version\": 1, \"instruments\": [\n"
                          "  { \"id\": \"a\", \"tip\": 15, \"taper\": 0.02, \"alloy\": \"gold\", \"motion\": \"hand\" } ] }",
                          CW_ERROR_INVALID,
                          "bad.cwlib: instruments[0].alloy: must be one of \"stainless\", \"niti\", "
                          "\"niti-heat-treated\" (got \"gold\")");
  assert_library_refused ("[]", CW_ERROR_INVALID, "bad.cwlib: document: must be an object (got an array)");
  assert_library_refused ("{", CW_ERROR_SYNTAX, NULL);
}

/* An empty library is valid: a new one starts so. */
static void
test_library_empty (void)
{
  g_autoptr(CwLibrary) library = cw_library_new ("Surgery 3");
  g_autofree char *data = cw_library_to_data (library);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwLibrary) back = cw_library_load_from_data (data, -1, "new.cwlib", &error);

  g_assert_no_error (error);
  g_assert_cmpuint (back->instruments->len, ==, 0);
  g_assert_cmpstr (back->title, ==, "Surgery 3");
}

static char *
save_case (const CwCase *kase,
           const char   *dir)
{
  char *path = g_build_filename (dir, "case.cwcase", NULL);
  g_autoptr(GError) error = NULL;

  g_assert_true (cw_case_save (kase, path, &error));
  g_assert_no_error (error);
  return path;
}

/* A case keeps its own copies: editing and saving the library afterwards
 * leaves the saved case, and the case in memory, as they were. */
static void
test_library_edit_leaves_case (void)
{
  g_autofree char *case_path = cw_test_sample_path ("lower-incisor-straight.cwcase");
  g_autofree char *dir = temp_dir ();
  g_autofree char *lib_path = g_build_filename (dir, STARTER, NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwLibrary) library = load_starter ();
  g_autoptr(CwCase) kase = cw_case_load (case_path, &error);
  g_autoptr(CwCase) reopened = NULL;
  g_autoptr(CwLibrary) edited_back = NULL;
  g_autofree char *saved_case = NULL;
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  CwInstrument *edited;

  g_assert_no_error (error);
  g_assert_true (cw_instrument_equal (cw_case_find_instrument (kase, "k25"), cw_library_lookup (library, "k25")));
  saved_case = save_case (kase, dir);
  before = cw_case_to_data (kase);

  edited = g_ptr_array_index (library->instruments, cw_library_find (library, "k25"));
  edited->taper = 0.04;
  edited->length = 31;
  g_assert_true (cw_library_save (library, lib_path, &error));
  edited_back = cw_library_load (lib_path, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (cw_library_lookup (edited_back, "k25")->taper, ==, 0.04);

  reopened = cw_case_load (saved_case, &error);
  g_assert_no_error (error);
  after = cw_case_to_data (reopened);
  g_assert_cmpstr (after, ==, before);
  g_assert_cmpfloat (cw_case_find_instrument (reopened, "k25")->taper, ==, 0.02);
  g_assert_false (cw_instrument_equal (cw_case_find_instrument (reopened, "k25"),
                                       cw_library_lookup (edited_back, "k25")));
  remove_dir (dir);
}

/* Adding from a library copies; an id taken by a different instrument gets
 * a new one; a copy already there is not added twice. */
static void
test_library_add_to_case (void)
{
  g_autofree char *case_path = cw_test_sample_path ("lower-incisor-straight.cwcase");
  g_autoptr(GError) error = NULL;
  g_autoptr(CwLibrary) library = load_starter ();
  g_autoptr(CwCase) kase = cw_case_load (case_path, &error);
  g_autoptr(CwInstrument) changed = NULL;
  guint n = kase->instruments->len;
  const char *id;

  g_assert_no_error (error);
  id = cw_case_add_library_copy (kase, cw_library_lookup (library, "k25"), &error);
  g_assert_cmpstr (id, ==, "k25");
  g_assert_cmpuint (kase->instruments->len, ==, n);

  id = cw_case_add_library_copy (kase, cw_library_lookup (library, "r25-04"), &error);
  g_assert_no_error (error);
  g_assert_cmpstr (id, ==, "r25-04");
  g_assert_cmpuint (kase->instruments->len, ==, n + 1);
  g_assert_true (cw_case_find_instrument (kase, "r25-04") != cw_library_lookup (library, "r25-04"));

  changed = cw_instrument_copy (cw_library_lookup (library, "k25"));
  changed->length = 21;
  id = cw_case_add_library_copy (kase, changed, &error);
  g_assert_cmpstr (id, ==, "k25-2");
  g_assert_cmpfloat (cw_case_find_instrument (kase, "k25")->length, ==, 25);
  g_assert_cmpfloat (cw_case_find_instrument (kase, "k25-2")->length, ==, 21);
  id = cw_case_add_library_copy (kase, changed, &error);
  g_assert_cmpstr (id, ==, "k25-2");
  g_assert_cmpuint (kase->instruments->len, ==, n + 2);
}

static void
test_library_case_full (void)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  g_autoptr(CwInstrument) one = cw_instrument_new ("x", 25, 0.04);
  g_autoptr(GError) error = NULL;

  for (guint i = 0; i < CW_MAX_INSTRUMENTS; i++)
    {
      g_autofree char *id = g_strdup_printf ("f%u", i);

      cw_case_add_instrument (kase, cw_instrument_new (id, 10 + i, 0.02));
    }
  g_assert_null (cw_case_add_library_copy (kase, one, &error));
  g_assert_error (error, CW_ERROR, CW_ERROR_INVALID);
  g_assert_cmpuint (kase->instruments->len, ==, CW_MAX_INSTRUMENTS);
}

static void
test_library_unique_id (void)
{
  g_autoptr(GPtrArray) list = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_instrument_free);
  g_autofree char *a = NULL;
  g_autofree char *b = NULL;
  g_autofree char *c = NULL;

  a = cw_instrument_unique_id (list, "r25");
  g_assert_cmpstr (a, ==, "r25");
  g_ptr_array_add (list, cw_instrument_new ("r25", 25, 0.04));
  g_ptr_array_add (list, cw_instrument_new ("r25-2", 25, 0.04));
  b = cw_instrument_unique_id (list, "r25");
  g_assert_cmpstr (b, ==, "r25-3");
  c = cw_instrument_unique_id (list, "r25-2");
  g_assert_cmpstr (c, ==, "r25-2-2");
}

/* The editor's fields, as the JSON object it checks. */
static JsonObject *
editor_object (const char *members)
{
  g_autofree char *text = g_strdup_printf ("{ \"id\": \"new\", \"label\": \"new file\", \"tip\": 25, %s,"
                                           " \"alloy\": \"niti\", \"motion\": \"rotary\" }", members);
  g_autoptr(JsonParser) parser = json_parser_new ();

  g_assert_true (json_parser_load_from_data (parser, text, -1, NULL));
  return json_object_ref (json_node_get_object (json_parser_get_root (parser)));
}

/* The same instrument inside a case file: the case loader's message. */
static char *
loader_message (const char *members)
{
  g_autofree char *text = g_strdup_printf (
    "{ \"format\": \"canalwright-case\", \"version\": 1, \"instruments\": [\n"
    "  { \"id\": \"new\", \"label\": \"new file\", \"tip\": 25, %s, \"alloy\": \"niti\", \"motion\": \"rotary\" } ],\n"
    "  \"canals\": [ { \"name\": \"MB\", \"working_length\": 21, \"orifice_depth\": 6,\n"
    "    \"anatomy\": { \"orifice_diameter\": 0.6, \"apical_diameter\": 0.2 } } ] }", members);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load_from_data (text, -1, "case.cwcase", &error);

  g_assert_null (kase);
  g_assert_nonnull (error);
  g_assert_true (g_str_has_prefix (error->message, "case.cwcase: instruments[0]."));
  return g_strdup (error->message + strlen ("case.cwcase: instruments[0]."));
}

/* The editor's message is the loader's, at the instrument's place in the
 * library file. */
static void
assert_editor_says (const char *members,
                    const char *expected)
{
  g_autoptr(CwLibrary) library = load_starter ();
  g_autoptr(JsonObject) object = editor_object (members);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwInstrument) instrument = cw_library_check_instrument (library, object, -1, &error);
  g_autofree char *prefix = g_strdup_printf ("%s: instruments[22].", STARTER);
  g_autofree char *from_loader = loader_message (members);

  g_assert_null (instrument);
  g_assert_error (error, CW_ERROR, CW_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, prefix));
  g_assert_cmpstr (error->message + strlen (prefix), ==, expected);
  g_assert_cmpstr (from_loader, ==, expected);
}

static void
test_editor_taper_out_of_range (void)
{
  assert_editor_says ("\"taper\": 0.2", "taper: must be a number > 0 and <= 0.12 (got 0.2)");
  assert_editor_says ("\"taper\": 0", "taper: must be a number > 0 and <= 0.12 (got 0)");
  assert_editor_says ("\"taper\": \"0.o4\"", "taper: must be a number > 0 and <= 0.12 (got a string)");
}

static void
test_editor_invalid_segments (void)
{
  assert_editor_says ("\"taper_segments\": []", "taper_segments: must hold 1 to 8 segments (got 0)");
  assert_editor_says ("\"taper_segments\": [ { \"to\": 4 } ]",
                      "taper_segments[0].taper: is required (a number > 0 and <= 0.12)");
  assert_editor_says ("\"taper_segments\": [ { \"to\": 4, \"taper\": 0.06 }, { \"to\": 16, \"taper\": 0.15 } ]",
                      "taper_segments[1].taper: must be a number > 0 and <= 0.12 (got 0.15)");
  assert_editor_says ("\"taper_segments\": [ { \"to\": 0, \"taper\": 0.06 } ]",
                      "taper_segments[0].to: must be a number > 0 and <= 40 mm (got 0)");
  assert_editor_says ("\"taper\": 0.04, \"taper_segments\": [ { \"to\": 4, \"taper\": 0.06 } ]",
                      "taper: give either taper or taper_segments, not both");
}

static void
test_editor_overlapping_segments (void)
{
  assert_editor_says ("\"taper_segments\": [ { \"to\": 4, \"taper\": 0.08 }, { \"to\": 3, \"taper\": 0.04 } ]",
                      "taper_segments[1].to: must be greater than the end of the segment before (4 mm) "
                      "and <= 40 mm (got 3)");
  assert_editor_says ("\"taper_segments\": [ { \"to\": 4, \"taper\": 0.08 }, { \"to\": 4, \"taper\": 0.04 } ]",
                      "taper_segments[1].to: must be greater than the end of the segment before (4 mm) "
                      "and <= 40 mm (got 4)");
}

static void
test_editor_max_flute_below_tip (void)
{
  assert_editor_says ("\"taper\": 0.04, \"max_flute_diameter\": 0.2",
                      "max_flute_diameter: must be a number > 0.25 and <= 3 mm (got 0.2)");
  assert_editor_says ("\"taper\": 0.04, \"max_flute_diameter\": 0.25",
                      "max_flute_diameter: must be a number > 0.25 and <= 3 mm (got 0.25)");
}

static void
test_editor_lengths_and_extras (void)
{
  assert_editor_says ("\"taper\": 0.04, \"flute_length\": 30, \"length\": 25",
                      "flute_length: must be a number > 0 and <= the length of the file, 25 mm (got 30)");
  assert_editor_says ("\"taper\": 0.04, \"uses_allowed\": 2.5",
                      "uses_allowed: must be an integer from 1 to 1000 (got 2.5)");
  assert_editor_says ("\"taper\": 0.04, \"rpm\": -5",
                      "rpm: must be a number > 0 and <= 5000 rpm (got -5)");
}

/* A valid instrument passes; its id must be its own, whether it is new or
 * edited in place. */
static void
test_editor_ids (void)
{
  g_autoptr(CwLibrary) library = load_starter ();
  g_autoptr(JsonObject) fresh = editor_object ("\"taper\": 0.04, \"max_flute_diameter\": 0.9");
  g_autoptr(JsonObject) clash = editor_object ("\"taper\": 0.04");
  g_autoptr(GError) error = NULL;
  g_autoptr(CwInstrument) ok = cw_library_check_instrument (library, fresh, -1, &error);
  g_autoptr(CwInstrument) in_place = NULL;
  g_autoptr(CwInstrument) taken = NULL;
  int k25 = cw_library_find (library, "k25");

  g_assert_no_error (error);
  g_assert_nonnull (ok);
  cw_assert_near (ok->max_flute_diameter, 0.9, 0);
  json_object_set_string_member (clash, "id", "k25");
  in_place = cw_library_check_instrument (library, clash, k25, &error);
  g_assert_no_error (error);
  g_assert_nonnull (in_place);
  taken = cw_library_check_instrument (library, clash, 0, &error);
  g_assert_null (taken);
  g_assert_cmpstr (error->message, ==,
                   "starter-library.cwlib: instruments[0].id: must be unique, but instruments[4] has the id \"k25\" too");
}

static void
test_library_equal (void)
{
  g_autoptr(CwLibrary) library = load_starter ();
  const CwInstrument *v25 = cw_library_lookup (library, "v25");
  g_autoptr(CwInstrument) copy = cw_instrument_copy (v25);

  g_assert_true (cw_instrument_equal (v25, copy));
  g_array_index (copy->segments, CwTaperSegment, 0).taper += 0.01;
  g_assert_false (cw_instrument_equal (v25, copy));
  g_clear_pointer (&copy, cw_instrument_free);
  copy = cw_instrument_copy (v25);
  copy->rpm = NAN;
  g_assert_false (cw_instrument_equal (v25, copy));
  copy->rpm = v25->rpm;
  g_free (copy->extra_json);
  copy->extra_json = g_strdup ("{\"lot\":1}");
  g_assert_false (cw_instrument_equal (v25, copy));
}

/* First start fills an empty folder with the starter library; later
 * starts leave the folder as the user made it. */
static void
test_library_folder (void)
{
  g_autofree char *root = temp_dir ();
  g_autofree char *dir = g_build_filename (root, "canalwright", "libraries", NULL);
  g_autofree char *starter_path = cw_test_sample_path (STARTER);
  g_autofree char *data = NULL;
  g_autoptr(GBytes) starter = NULL;
  g_autoptr(GPtrArray) listed = NULL;
  g_autoptr(GPtrArray) again = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *fresh = NULL;
  g_autofree char *second = NULL;
  g_autofree char *parent = g_path_get_dirname (dir);
  gsize length;

  g_assert_true (g_file_get_contents (starter_path, &data, &length, NULL));
  starter = g_bytes_new (data, length);
  listed = cw_library_folder_list (dir);
  g_assert_cmpuint (listed->len, ==, 0);
  g_assert_true (cw_library_folder_seed (dir, STARTER, starter, &error));
  g_assert_no_error (error);
  g_clear_pointer (&listed, g_ptr_array_unref);
  listed = cw_library_folder_list (dir);
  g_assert_cmpuint (listed->len, ==, 1);
  g_assert_true (g_str_has_suffix (g_ptr_array_index (listed, 0), STARTER));

  fresh = cw_library_folder_new_path (dir, "Surgery 2 — Dr. Ölund");
  g_assert_true (g_str_has_suffix (fresh, "/surgery-2-dr-olund.cwlib"));
  g_assert_true (g_file_set_contents (fresh, "{}", -1, NULL));
  second = cw_library_folder_new_path (dir, "Surgery 2 — Dr. Ölund");
  g_assert_true (g_str_has_suffix (second, "/surgery-2-dr-olund-2.cwlib"));
  g_unlink (g_ptr_array_index (listed, 0));
  g_assert_true (cw_library_folder_seed (dir, STARTER, starter, &error));
  again = cw_library_folder_list (dir);
  g_assert_cmpuint (again->len, ==, 1);
  g_assert_cmpstr (g_ptr_array_index (again, 0), ==, fresh);

  g_unlink (fresh);
  g_rmdir (dir);
  g_rmdir (parent);
  g_rmdir (root);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/library/starter", test_library_starter);
  g_test_add_func ("/library/round-trip", test_library_round_trip);
  g_test_add_func ("/library/starter-round-trip", test_library_starter_round_trip);
  g_test_add_func ("/library/refused", test_library_refused);
  g_test_add_func ("/library/empty", test_library_empty);
  g_test_add_func ("/library/edit-leaves-case", test_library_edit_leaves_case);
  g_test_add_func ("/library/add-to-case", test_library_add_to_case);
  g_test_add_func ("/library/case-full", test_library_case_full);
  g_test_add_func ("/library/unique-id", test_library_unique_id);
  g_test_add_func ("/library/equal", test_library_equal);
  g_test_add_func ("/library/folder", test_library_folder);
  g_test_add_func ("/library/editor/taper-out-of-range", test_editor_taper_out_of_range);
  g_test_add_func ("/library/editor/invalid-segments", test_editor_invalid_segments);
  g_test_add_func ("/library/editor/overlapping-segments", test_editor_overlapping_segments);
  g_test_add_func ("/library/editor/max-flute-below-tip", test_editor_max_flute_below_tip);
  g_test_add_func ("/library/editor/lengths-and-extras", test_editor_lengths_and_extras);
  g_test_add_func ("/library/editor/ids", test_editor_ids);

  return g_test_run ();
}
