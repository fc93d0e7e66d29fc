/* cw-propose.c: canalwright --propose CASE [--canal NAME]
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-propose"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdio.h>

#include "cw-case-loader.h"
#include "cw-json-writer.h"
#include "cw-propose.h"

/* Nine decimals, as in the check report: the engine's accuracy without
 * the rounding noise. */
static void
add_number (JsonBuilder *b,
            const char  *name,
            double       value)
{
  json_builder_set_member_name (b, name);
  if (isfinite (value))
    json_builder_add_double_value (b, round (value * 1e9) / 1e9);
  else
    json_builder_add_null_value (b);
}

static void
add_plan (JsonBuilder  *b,
          const CwPlan *plan)
{
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "steps");
  json_builder_begin_array (b);
  for (guint i = 0; i < plan->steps->len; i++)
    {
      const CwPlanStep *step = &g_array_index (plan->steps, CwPlanStep, i);

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "instrument");
      json_builder_add_string_value (b, step->instrument->id);
      add_number (b, "depth", step->depth);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_set_member_name (b, "cautions");
  json_builder_add_int_value (b, plan->cautions);
  add_number (b, "time", plan->time);
  add_number (b, "apical_size", plan->apical_size);
  add_number (b, "apical_taper", plan->apical_taper);
  json_builder_end_object (b);
}

JsonNode *
cw_propose_canal (const CwCanal      *canal,
                  const CwPlanResult *result)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  g_return_val_if_fail (canal != NULL && result != NULL, NULL);

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, canal->name);
  json_builder_set_member_name (b, "plans");
  json_builder_begin_array (b);
  for (guint i = 0; i < result->plans->len; i++)
    add_plan (b, g_ptr_array_index (result->plans, i));
  json_builder_end_array (b);
  json_builder_set_member_name (b, "reason");
  if (result->reason)
    json_builder_add_string_value (b, result->reason);
  else
    json_builder_add_null_value (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

static JsonNode *
propose_case (const CwCase  *kase,
              const CwCanal *only)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "canals");
  json_builder_begin_array (b);
  for (guint i = 0; i < kase->canals->len; i++)
    {
      const CwCanal *canal = g_ptr_array_index (kase->canals, i);
      g_autoptr(CwPlanResult) result = NULL;

      if (only && canal != only)
        continue;
      result = cw_plan_canal (kase, canal, NULL);
      json_builder_add_value (b, cw_propose_canal (canal, result));
    }
  json_builder_end_array (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

/* Exit status 2 when the case cannot be loaded or has no canal of that
 * name; 0 otherwise, whether or not a plan reaches the targets. */
int
cw_propose_run (const char *path,
                const char *canal_name)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = NULL;
  g_autoptr(JsonNode) root = NULL;
  g_autofree char *text = NULL;
  const CwCanal *only = NULL;

  kase = cw_case_load (path, &error);
  if (kase == NULL)
    {
      fprintf (stderr, "canalwright: %s\n", error->message);
      return 2;
    }
  if (canal_name && (only = cw_case_find_canal (kase, canal_name)) == NULL)
    {
      fprintf (stderr, _("canalwright: %s: no canal named '%s'\n"), path, canal_name);
      return 2;
    }
  root = propose_case (kase, only);
  text = cw_json_write (root, TRUE);
  fputs (text, stdout);
  fflush (stdout);
  return 0;
}
