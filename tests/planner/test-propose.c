/* test-propose.c: canalwright --propose, run as a user would, with no display
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <json-glib/json-glib.h>
#include <math.h>
#include <sys/wait.h>

#include "cw-case-loader.h"
#include "cw-test-util.h"

typedef struct
{
  int    status;
  char  *out;
  char  *err;
} Run;

static void
run_clear (Run *run)
{
  g_free (run->out);
  g_free (run->err);
}

G_DEFINE_AUTO_CLEANUP_CLEAR_FUNC (Run, run_clear)

static void
run_propose (Run        *run,
             const char *path,
             const char *canal)
{
  const char *argv[] = { g_getenv ("CW_BINARY"), "--propose", path, canal ? "--canal" : NULL, canal, NULL };
  g_auto(GStrv) env = g_get_environ ();
  g_autoptr(GError) error = NULL;
  int wait_status;

  env = g_environ_unsetenv (env, "DISPLAY");
  env = g_environ_unsetenv (env, "WAYLAND_DISPLAY");
  g_assert_true (g_spawn_sync (NULL, (char **) argv, env, G_SPAWN_DEFAULT, NULL, NULL,
                               &run->out, &run->err, &wait_status, &error));
  g_assert_no_error (error);
  run->status = WIFEXITED (wait_status) ? WEXITSTATUS (wait_status) : -1;
}

static JsonNode *
parse (const char *text)
{
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) error = NULL;

  g_assert_true (json_parser_load_from_data (parser, text, -1, &error));
  g_assert_no_error (error);
  return json_node_copy (json_parser_get_root (parser));
}

static void
assert_plan_shape (JsonObject *plan)
{
  JsonArray *steps = json_object_get_array_member (plan, "steps");

  g_assert_cmpuint (json_array_get_length (steps), >, 0);
  for (guint i = 0; i < json_array_get_length (steps); i++)
    {
      JsonObject *step = json_array_get_object_element (steps, i);

      g_assert_nonnull (json_object_get_string_member (step, "instrument"));
      g_assert_cmpfloat (json_object_get_double_member (step, "depth"), >, 0);
    }
  g_assert_cmpint (json_object_get_int_member (plan, "cautions"), >=, 0);
  g_assert_cmpfloat (json_object_get_double_member (plan, "time"), >, 0);
  g_assert_true (json_object_has_member (plan, "apical_size"));
  g_assert_true (json_object_has_member (plan, "apical_taper"));
}

/* Best first: cautions, then time. */
static void
assert_ranked (JsonArray *plans)
{
  for (guint i = 1; i < json_array_get_length (plans); i++)
    {
      JsonObject *a = json_array_get_object_element (plans, i - 1);
      JsonObject *b = json_array_get_object_element (plans, i);
      gint64 ca = json_object_get_int_member (a, "cautions"), cb = json_object_get_int_member (b, "cautions");

      g_assert_cmpint (ca, <=, cb);
      if (ca == cb)
        g_assert_cmpfloat (json_object_get_double_member (a, "time"), <=,
                           json_object_get_double_member (b, "time") + 1e-6);
    }
}

/* The plan, as the canal's sequence, evaluates with no stop and meets the
 * targets, to the figures printed. */
static void
assert_plan_holds (const CwCase *kase,
                   const char   *name,
                   JsonObject   *plan)
{
  JsonArray *steps = json_object_get_array_member (plan, "steps");
  g_autoptr(CwCanal) canal = cw_canal_copy (cw_case_find_canal (kase, name));
  g_autoptr(CwCanalResult) res = NULL;

  cw_canal_clear_sequence (canal);
  for (guint i = 0; i < json_array_get_length (steps); i++)
    {
      JsonObject *step = json_array_get_object_element (steps, i);

      g_assert_nonnull (cw_case_find_instrument (kase, json_object_get_string_member (step, "instrument")));
      cw_canal_add_step (canal, json_object_get_string_member (step, "instrument"),
                         json_object_get_double_member (step, "depth"));
    }
  res = cw_evaluate_canal (kase, canal);
  g_assert_false (res->has_stop);
  g_assert_cmpuint (res->findings->len, ==, 0);
  cw_assert_near (res->time, json_object_get_double_member (plan, "time"), 1e-6);
  cw_assert_near (res->apical_size, json_object_get_double_member (plan, "apical_size"), 1e-9);
}

static void
check_canal (const CwCase *kase,
             JsonObject   *canal)
{
  const char *name = json_object_get_string_member (canal, "name");
  JsonArray *plans = json_object_get_array_member (canal, "plans");
  JsonNode *reason = json_object_get_member (canal, "reason");

  g_assert_nonnull (cw_case_find_canal (kase, name));
  g_assert_nonnull (reason);
  assert_ranked (plans);
  for (guint i = 0; i < json_array_get_length (plans); i++)
    {
      assert_plan_shape (json_array_get_object_element (plans, i));
      if (JSON_NODE_HOLDS_NULL (reason))
        assert_plan_holds (kase, name, json_array_get_object_element (plans, i));
    }
  if (JSON_NODE_HOLDS_NULL (reason))
    g_assert_cmpuint (json_array_get_length (plans), >, 0);
  else
    g_assert_cmpuint (strlen (json_node_get_string (reason)), >, 0);
}

static void
test_sample (gconstpointer data)
{
  g_autofree char *path = cw_test_sample_path (data);
  g_auto(Run) run = { 0 };
  g_autoptr(JsonNode) root = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = cw_case_load (path, &error);
  JsonArray *canals;

  g_assert_no_error (error);
  run_propose (&run, path, NULL);
  g_assert_cmpint (run.status, ==, 0);
  root = parse (run.out);
  canals = json_object_get_array_member (json_node_get_object (root), "canals");
  g_assert_cmpuint (json_array_get_length (canals), ==, kase->canals->len);
  for (guint i = 0; i < json_array_get_length (canals); i++)
    check_canal (kase, json_array_get_object_element (canals, i));
}

static void
test_one_canal (void)
{
  g_autofree char *path = cw_test_sample_path ("lower-molar-moderate.cwcase");
  g_auto(Run) run = { 0 };
  g_autoptr(JsonNode) root = NULL;
  JsonArray *canals;

  run_propose (&run, path, "ML");
  g_assert_cmpint (run.status, ==, 0);
  root = parse (run.out);
  canals = json_object_get_array_member (json_node_get_object (root), "canals");
  g_assert_cmpuint (json_array_get_length (canals), ==, 1);
  g_assert_cmpstr (json_object_get_string_member (json_array_get_object_element (canals, 0), "name"), ==, "ML");
}

/* The upper premolar's targets are out of reach of the model's moves. */
static void
test_reason (void)
{
  g_autofree char *path = cw_test_sample_path ("upper-premolar-s-shape.cwcase");
  g_auto(Run) run = { 0 };
  g_autoptr(JsonNode) root = NULL;
  JsonObject *canal;

  run_propose (&run, path, NULL);
  g_assert_cmpint (run.status, ==, 0);
  root = parse (run.out);
  canal = json_array_get_object_element (json_object_get_array_member (json_node_get_object (root), "canals"), 0);
  g_assert_nonnull (json_object_get_string_member (canal, "reason"));
  g_assert_cmpuint (json_array_get_length (json_object_get_array_member (canal, "plans")), <=, 1);
}

static void
test_unknown_canal (void)
{
  g_autofree char *path = cw_test_sample_path ("lower-molar-moderate.cwcase");
  g_auto(Run) run = { 0 };

  run_propose (&run, path, "XX");
  g_assert_cmpint (run.status, ==, 2);
  g_assert_nonnull (strstr (run.err, "XX"));
  g_assert_cmpstr (run.out, ==, "");
}

static void
test_unreadable (void)
{
  g_auto(Run) run = { 0 };

  run_propose (&run, "/nonexistent/none.cwcase", NULL);
  g_assert_cmpint (run.status, ==, 2);
  g_assert_cmpuint (strlen (run.err), >, 0);
  g_assert_cmpstr (run.out, ==, "");
}

int
main (int   argc,
      char *argv[])
{
  static const char *samples[] = {
    "lower-incisor-straight.cwcase", "lower-molar-moderate.cwcase",
    "severe-curve-rule-breaks.cwcase", "upper-molar-four-canals.cwcase",
    "upper-premolar-s-shape.cwcase",
  };

  g_test_init (&argc, &argv, NULL);

  for (guint i = 0; i < G_N_ELEMENTS (samples); i++)
    {
      g_autofree char *name = g_strdup_printf ("/propose/sample/%s", samples[i]);

      g_test_add_data_func (name, samples[i], test_sample);
    }
  g_test_add_func ("/propose/one-canal", test_one_canal);
  g_test_add_func ("/propose/reason", test_reason);
  g_test_add_func ("/propose/unknown-canal", test_unknown_canal);
  g_test_add_func ("/propose/unreadable", test_unreadable);

  return g_test_run ();
}
