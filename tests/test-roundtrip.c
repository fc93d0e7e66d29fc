/* test-roundtrip.c: a saved case loads back the same, unknown members kept
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

/* The case format (case-format.md, version 1) keeps members it does not
 * know and writes them back; saving replaces the file in one step. */

static const char *good_files[] = {
  "unknown-keys.cwcase", "full.cwcase", "minimal.cwcase", "base.cwcase",
};

static char *
good_path (const char *name)
{
  return g_test_build_filename (G_TEST_DIST, "data", "good", name, NULL);
}

static char *
read_text (const char *path)
{
  g_autoptr(GError) error = NULL;
  char *text = NULL;

  g_file_get_contents (path, &text, NULL, &error);
  g_assert_no_error (error);
  return text;
}

static CwCase *
load (const char *path)
{
  g_autoptr(GError) error = NULL;
  CwCase *kase = cw_case_load (path, &error);

  g_assert_no_error (error);
  g_assert_nonnull (kase);
  return kase;
}

static void
save (const CwCase *kase,
      const char   *path)
{
  g_autoptr(GError) error = NULL;

  g_assert_true (cw_case_save (kase, path, &error));
  g_assert_no_error (error);
}

static void
remove_tree (const char *dir_path)
{
  g_autoptr(GDir) dir = g_dir_open (dir_path, 0, NULL);
  const char *name;

  while (dir != NULL && (name = g_dir_read_name (dir)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir_path, name, NULL);

      if (g_file_test (path, G_FILE_TEST_IS_DIR))
        remove_tree (path);
      else
        g_unlink (path);
    }
  g_rmdir (dir_path);
}

static void
assert_same_number (double a,
                    double b)
{
  if (!((isnan (a) && isnan (b)) || a == b))
    g_error ("%.17g differs from %.17g", a, b);
}

static void
assert_same_rules (const CwRules *a,
                   const CwRules *b)
{
  assert_same_number (a->contact_tolerance, b->contact_tolerance);
  assert_same_number (a->advance_rate, b->advance_rate);
  assert_same_number (a->peck_increment, b->peck_increment);
  assert_same_number (a->changeover, b->changeover);
  assert_same_number (a->at_length_tolerance, b->at_length_tolerance);
  assert_same_number (a->curve_engagement_max, b->curve_engagement_max);
  assert_same_number (a->small_file_tip_max, b->small_file_tip_max);
  assert_same_number (a->small_file_taper_max, b->small_file_taper_max);
  g_assert_cmpuint (a->n_ceilings, ==, b->n_ceilings);
  for (guint i = 0; i < a->n_ceilings; i++)
    {
      assert_same_number (a->ceiling_taper[i], b->ceiling_taper[i]);
      assert_same_number (a->ceiling_diameter[i], b->ceiling_diameter[i]);
    }
  assert_same_number (a->glide_path_tip_max, b->glide_path_tip_max);
  g_assert_cmpint (a->require_taper_change, ==, b->require_taper_change);
  for (guint i = 0; i < CW_N_ALLOYS; i++)
    {
      assert_same_number (a->alloys[i].strain_limit, b->alloys[i].strain_limit);
      assert_same_number (a->alloys[i].strain_life_a, b->alloys[i].strain_life_a);
      assert_same_number (a->alloys[i].strain_life_k, b->alloys[i].strain_life_k);
      assert_same_number (a->alloys[i].shear_strength, b->alloys[i].shear_strength);
      assert_same_number (a->alloys[i].section_factor, b->alloys[i].section_factor);
    }
}

static void
assert_same_instrument (const CwInstrument *a,
                        const CwInstrument *b)
{
  g_assert_cmpstr (a->id, ==, b->id);
  g_assert_cmpstr (a->label, ==, b->label);
  assert_same_number (a->tip, b->tip);
  assert_same_number (a->taper, b->taper);
  g_assert_cmpint (a->segments != NULL, ==, b->segments != NULL);
  if (a->segments != NULL)
    {
      g_assert_cmpuint (a->segments->len, ==, b->segments->len);
      g_assert_cmpmem (a->segments->data, a->segments->len * sizeof (CwTaperSegment),
                       b->segments->data, b->segments->len * sizeof (CwTaperSegment));
    }
  assert_same_number (a->flute_length, b->flute_length);
  assert_same_number (a->length, b->length);
  assert_same_number (a->max_flute_diameter, b->max_flute_diameter);
  g_assert_cmpint (a->alloy, ==, b->alloy);
  g_assert_cmpint (a->motion, ==, b->motion);
  assert_same_number (a->rpm, b->rpm);
  assert_same_number (a->torque_limit, b->torque_limit);
  g_assert_cmpint (a->uses_allowed, ==, b->uses_allowed);
  g_assert_cmpstr (a->extra_json, ==, b->extra_json);
}

static void
assert_same_curves (const CwCanal *a,
                    const CwCanal *b)
{
  g_assert_cmpuint (a->n_curves, ==, b->n_curves);
  for (guint i = 0; i < a->n_curves; i++)
    {
      assert_same_number (a->curves[i].onset, b->curves[i].onset);
      assert_same_number (a->curves[i].angle, b->curves[i].angle);
      assert_same_number (a->curves[i].radius, b->curves[i].radius);
      assert_same_number (a->curves[i].schneider_angle, b->curves[i].schneider_angle);
      g_assert_cmpstr (a->curves[i].extra_json, ==, b->curves[i].extra_json);
    }
}

static void
assert_same_canal (const CwCanal *a,
                   const CwCanal *b)
{
  g_assert_cmpstr (a->name, ==, b->name);
  g_assert_cmpstr (a->reference, ==, b->reference);
  assert_same_number (a->working_length, b->working_length);
  assert_same_number (a->orifice_depth, b->orifice_depth);
  assert_same_curves (a, b);
  assert_same_number (a->orifice_diameter, b->orifice_diameter);
  assert_same_number (a->apical_diameter, b->apical_diameter);
  g_assert_cmpint (a->diameters != NULL, ==, b->diameters != NULL);
  if (a->diameters != NULL)
    g_assert_cmpmem (a->diameters->data, a->diameters->len * sizeof (CwPoint),
                     b->diameters->data, b->diameters->len * sizeof (CwPoint));
  g_assert_cmpstr (a->anatomy_extra_json, ==, b->anatomy_extra_json);
  g_assert_cmpuint (a->sequence->len, ==, b->sequence->len);
  for (guint i = 0; i < a->sequence->len; i++)
    {
      const CwStep *x = &g_array_index (a->sequence, CwStep, i);
      const CwStep *y = &g_array_index (b->sequence, CwStep, i);

      g_assert_cmpstr (x->instrument_id, ==, y->instrument_id);
      assert_same_number (x->depth, y->depth);
      g_assert_cmpstr (x->note, ==, y->note);
      g_assert_cmpstr (x->extra_json, ==, y->extra_json);
    }
  g_assert_cmpstr (a->extra_json, ==, b->extra_json);
}

static void
assert_same_case (const CwCase *a,
                  const CwCase *b)
{
  g_assert_cmpstr (a->title, ==, b->title);
  g_assert_cmpstr (a->notes, ==, b->notes);
  g_assert_cmpint (a->notation, ==, b->notation);
  g_assert_cmpstr (a->tooth_code, ==, b->tooth_code);
  g_assert_cmpstr (a->tooth_extra_json, ==, b->tooth_extra_json);
  assert_same_number (a->target_apical_size, b->target_apical_size);
  assert_same_number (a->target_apical_taper, b->target_apical_taper);
  g_assert_cmpstr (a->targets_extra_json, ==, b->targets_extra_json);
  assert_same_rules (&a->rules, &b->rules);
  g_assert_cmpstr (a->rules_json, ==, b->rules_json);
  g_assert_cmpstr (a->extra_json, ==, b->extra_json);
  g_assert_cmpuint (a->instruments->len, ==, b->instruments->len);
  for (guint i = 0; i < a->instruments->len; i++)
    assert_same_instrument (g_ptr_array_index (a->instruments, i), g_ptr_array_index (b->instruments, i));
  g_assert_cmpuint (a->canals->len, ==, b->canals->len);
  for (guint i = 0; i < a->canals->len; i++)
    assert_same_canal (g_ptr_array_index (a->canals, i), g_ptr_array_index (b->canals, i));
}

static void
test_roundtrip_second_save_byte_identical_same_values (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-roundtrip-XXXXXX", NULL);

  for (guint i = 0; i < G_N_ELEMENTS (good_files); i++)
    {
      g_autofree char *source = good_path (good_files[i]);
      g_autofree char *first_path = g_build_filename (dir, "first.cwcase", NULL);
      g_autofree char *second_path = g_build_filename (dir, "second.cwcase", NULL);
      g_autoptr(CwCase) first = load (source);
      g_autoptr(CwCase) second = NULL;
      g_autofree char *first_text = NULL;
      g_autofree char *second_text = NULL;

      save (first, first_path);
      second = load (first_path);
      save (second, second_path);
      first_text = read_text (first_path);
      second_text = read_text (second_path);
      g_assert_cmpstr (first_text, ==, second_text);
      assert_same_case (first, second);
    }
  remove_tree (dir);
}

/* The node at PATH, written "canals/0/curves/1/key". */
static JsonNode *
node_at (JsonNode   *root,
         const char *path)
{
  g_auto(GStrv) parts = g_strsplit (path, "/", -1);
  JsonNode *node = root;

  for (guint i = 0; parts[i] != NULL && node != NULL; i++)
    {
      if (g_ascii_isdigit (parts[i][0]))
        {
          JsonArray *array = json_node_get_array (node);
          guint index = (guint) g_ascii_strtoull (parts[i], NULL, 10);

          node = index < json_array_get_length (array) ? json_array_get_element (array, index) : NULL;
        }
      else
        node = json_object_get_member (json_node_get_object (node), parts[i]);
    }
  return node;
}

static JsonNode *
parse (const char *text)
{
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) error = NULL;

  json_parser_load_from_data (parser, text, -1, &error);
  g_assert_no_error (error);
  return json_node_copy (json_parser_get_root (parser));
}

static void
test_roundtrip_unknown_keys_saved_at_every_level (void)
{
  static const struct { const char *path; const char *value; } kept[] = {
    { "x_document", "{\"nested\": [1, 2.5, {\"deep\": true}], \"empty\": {}}" },
    { "x_last", "\"after the canals\"" },
    { "tooth/x_tooth_surface", "\"mesial\"" },
    { "targets/x_target_note", "\"keep me\"" },
    { "rules/x_rule_future", "{\"weights\": [0.25, 0.75], \"on\": false}" },
    { "rules/alloys/niti/x_alloy_batch", "\"A7\"" },
    { "instruments/0/x_instrument_stock", "{\"boxes\": 3, \"sizes\": [21, 25, 31]}" },
    { "instruments/1/x_null", "null" },
    { "canals/0/x_canal_shape", "{\"class\": \"II\", \"angles\": [10, 20]}" },
    { "canals/0/curves/0/x_curve_plane", "\"mesiodistal\"" },
    { "canals/0/curves/1/x_curve_seen_on", "[\"radiograph\", 2]" },
    { "canals/0/anatomy/x_anatomy_source", "{\"scan\": \"cone-beam\", \"voxel\": 0.075}" },
    { "canals/0/sequence/0/x_step_irrigation", "{\"agent\": \"hypochlorite\", \"ml\": 2}" },
    { "canals/0/sequence/1/x_step_flag", "1e-7" },
  };
  g_autofree char *dir = g_dir_make_tmp ("cw-roundtrip-XXXXXX", NULL);
  g_autofree char *source = good_path ("unknown-keys.cwcase");
  g_autofree char *path = g_build_filename (dir, "saved.cwcase", NULL);
  g_autoptr(CwCase) kase = load (source);
  g_autofree char *text = NULL;
  g_autoptr(JsonNode) root = NULL;

  save (kase, path);
  text = read_text (path);
  root = parse (text);
  for (guint i = 0; i < G_N_ELEMENTS (kept); i++)
    {
      g_autoptr(JsonNode) expected = parse (kept[i].value);
      JsonNode *found = node_at (root, kept[i].path);

      if (found == NULL)
        g_error ("%s is missing from the saved case", kept[i].path);
      if (!json_node_equal (found, expected))
        g_error ("%s was saved with another value", kept[i].path);
    }
  remove_tree (dir);
}

static void
test_roundtrip_unknown_keys_follow_known_members (void)
{
  g_autofree char *source = good_path ("unknown-keys.cwcase");
  g_autoptr(CwCase) kase = load (source);
  g_autofree char *text = cw_case_to_data (kase);
  g_autoptr(JsonNode) root = parse (text);
  g_autoptr(GList) members = json_object_get_members (json_node_get_object (root));
  g_autoptr(GList) canal = json_object_get_members (json_node_get_object (node_at (root, "canals/0")));

  g_assert_cmpstr (members->data, ==, "format");
  g_assert_cmpstr (g_list_nth_data (members, 1), ==, "version");
  g_assert_cmpstr (g_list_last (members)->prev->data, ==, "x_document");
  g_assert_cmpstr (g_list_last (members)->data, ==, "x_last");
  g_assert_cmpstr (g_list_last (canal)->data, ==, "x_canal_shape");
}

static void
test_roundtrip_text_is_plain_json (void)
{
  g_autofree char *source = good_path ("full.cwcase");
  g_autoptr(CwCase) kase = load (source);
  g_autofree char *text = cw_case_to_data (kase);
  g_autoptr(JsonNode) root = parse (text);

  g_assert_true (g_str_has_prefix (text, "{\n  \"format\": \"canalwright-case\",\n  \"version\": 1,\n"));
  g_assert_true (g_str_has_suffix (text, "}\n"));
  g_assert_nonnull (strstr (text, "\"tip\": 25,"));
  g_assert_nonnull (strstr (text, "\"working_length\": 21,"));
  g_assert_nonnull (strstr (text, "\"taper\": 0.08"));
  g_assert_null (strstr (text, "0000000"));
  g_assert_null (strstr (text, "e+"));
  /* Each curve in the form it was given. */
  g_assert_nonnull (node_at (root, "canals/0/curves/0/angle"));
  g_assert_null (node_at (root, "canals/0/curves/0/schneider_angle"));
  g_assert_nonnull (node_at (root, "canals/0/curves/1/schneider_angle"));
  g_assert_null (node_at (root, "canals/0/curves/1/angle"));
  g_assert_null (node_at (root, "canals/0/curves/1/radius"));
  g_assert_nonnull (node_at (root, "instruments/1/taper_segments/1/to"));
  g_assert_null (node_at (root, "instruments/1/taper"));
  g_assert_nonnull (node_at (root, "canals/0/anatomy/diameters/3/1"));
  g_assert_null (node_at (root, "canals/0/sequence/2/note"));
}

static void
test_roundtrip_optional_members_left_out (void)
{
  g_autofree char *source = good_path ("minimal.cwcase");
  g_autoptr(CwCase) kase = load (source);
  g_autofree char *text = cw_case_to_data (kase);
  g_autoptr(JsonNode) root = parse (text);

  g_assert_null (node_at (root, "tooth"));
  g_assert_null (node_at (root, "notes"));
  g_assert_null (node_at (root, "rules"));
  g_assert_null (node_at (root, "instruments/0/rpm"));
  g_assert_null (node_at (root, "instruments/0/uses_allowed"));
  g_assert_null (node_at (root, "instruments/0/max_flute_diameter"));
  g_assert_null (node_at (root, "canals/0/reference"));
  g_assert_cmpstr (json_node_get_string (node_at (root, "instruments/0/label")), ==, "k15");
  g_assert_cmpstr (json_node_get_string (node_at (root, "title")), ==, "");
  g_assert_nonnull (node_at (root, "targets/apical_size"));
}

static void
test_roundtrip_from_data_string (void)
{
  static const char data[] =
    "{\"format\": \"canalwright-case\", \"version\": 1, \"title\": \"From a string\","
    " \"instruments\": [{\"id\": \"v\", \"tip\": 20, \"alloy\": \"niti\", \"motion\": \"reciprocating\","
    "   \"taper_segments\": [{\"to\": 3, \"taper\": 0.07}, {\"to\": 16, \"taper\": 0.03}], \"torque_limit\": 2}],"
    " \"canals\": [{\"name\": \"B\", \"working_length\": 19.75, \"orifice_depth\": 4.25,"
    "   \"curves\": [{\"onset\": 12.5, \"schneider_angle\": 28}],"
    "   \"anatomy\": {\"diameters\": [[4.25, 0.7], [19.75, 0.25]]},"
    "   \"sequence\": [{\"instrument\": \"v\", \"depth\": 19.75, \"note\": \"one file\"}]}]}";
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) first = cw_case_load_from_data (data, -1, "string", &error);
  g_autoptr(CwCase) second = NULL;
  g_autofree char *first_text = NULL;
  g_autofree char *second_text = NULL;

  g_assert_no_error (error);
  first_text = cw_case_to_data (first);
  second = cw_case_load_from_data (first_text, -1, "string", &error);
  g_assert_no_error (error);
  second_text = cw_case_to_data (second);
  g_assert_cmpstr (first_text, ==, second_text);
  assert_same_case (first, second);
}

static void
test_roundtrip_save_replaces_existing_file (void)
{
  g_autofree char *dir_path = g_dir_make_tmp ("cw-roundtrip-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir_path, "plan.cwcase", NULL);
  g_autofree char *source = good_path ("minimal.cwcase");
  g_autofree char *old = g_strnfill (200000, 'x');
  g_autoptr(CwCase) kase = load (source);
  g_autofree char *expected = cw_case_to_data (kase);
  g_autofree char *text = NULL;
  g_autoptr(GDir) dir = NULL;
  guint n_files = 0;

  g_assert_true (g_file_set_contents (path, old, -1, NULL));
  save (kase, path);
  text = read_text (path);
  g_assert_cmpstr (text, ==, expected);
  dir = g_dir_open (dir_path, 0, NULL);
  while (g_dir_read_name (dir) != NULL)
    n_files++;
  /* No temporary file is left behind. */
  g_assert_cmpuint (n_files, ==, 1);
  remove_tree (dir_path);
}

static void
test_roundtrip_save_into_missing_folder_fails (void)
{
  g_autofree char *dir = g_dir_make_tmp ("cw-roundtrip-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "no-such-folder", "plan.cwcase", NULL);
  g_autofree char *source = good_path ("minimal.cwcase");
  g_autoptr(CwCase) kase = load (source);
  g_autoptr(GError) error = NULL;

  g_assert_false (cw_case_save (kase, path, &error));
  g_assert_error (error, CW_ERROR, CW_ERROR_WRITE);
  g_assert_nonnull (strstr (error->message, "plan.cwcase"));
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
  remove_tree (dir);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/roundtrip/second-save-byte-identical-same-values",
                   test_roundtrip_second_save_byte_identical_same_values);
  g_test_add_func ("/roundtrip/unknown-keys-saved-at-every-level",
                   test_roundtrip_unknown_keys_saved_at_every_level);
  g_test_add_func ("/roundtrip/unknown-keys-follow-known-members",
                   test_roundtrip_unknown_keys_follow_known_members);
  g_test_add_func ("/roundtrip/text-is-plain-json", test_roundtrip_text_is_plain_json);
  g_test_add_func ("/roundtrip/optional-members-left-out", test_roundtrip_optional_members_left_out);
  g_test_add_func ("/roundtrip/from-data-string", test_roundtrip_from_data_string);
  g_test_add_func ("/roundtrip/save-replaces-existing-file", test_roundtrip_save_replaces_existing_file);
  g_test_add_func ("/roundtrip/save-into-missing-folder-fails", test_roundtrip_save_into_missing_folder_fails);

  return g_test_run ();
}
