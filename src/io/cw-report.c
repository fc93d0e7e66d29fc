/* cw-report.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-report"

#include <math.h>

#include "cw-report.h"

/* Nine decimals keep far more than the engine's accuracy and drop the
 * rounding noise (6.249999999999999) that would otherwise be printed. */
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
add_string (JsonBuilder *b,
            const char  *name,
            const char  *value)
{
  json_builder_set_member_name (b, name);
  json_builder_add_string_value (b, value);
}

static void
add_findings (JsonBuilder *b,
              GPtrArray   *findings)
{
  json_builder_set_member_name (b, "findings");
  json_builder_begin_array (b);
  for (guint i = 0; i < findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (findings, i);
      g_autofree char *message = cw_finding_describe (f, TRUE);

      json_builder_begin_object (b);
      add_string (b, "rule", cw_rule_to_string (f->rule));
      add_string (b, "level", cw_level_to_string (f->level));
      add_string (b, "message", message);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

static void
add_zones (JsonBuilder      *b,
           const CwCanal    *canal,
           const CwGeometry *geo)
{
  json_builder_set_member_name (b, "zones");
  json_builder_begin_object (b);
  add_number (b, "orifice", canal->orifice_depth);
  json_builder_set_member_name (b, "onsets");
  json_builder_begin_array (b);
  for (guint i = 0; i < geo->n_curves; i++)
    json_builder_add_double_value (b, round (geo->onset[i] * 1e9) / 1e9);
  json_builder_end_array (b);
  json_builder_set_member_name (b, "curve_ends");
  json_builder_begin_array (b);
  for (guint i = 0; i < geo->n_curves; i++)
    json_builder_add_double_value (b, round (geo->end[i] * 1e9) / 1e9);
  json_builder_end_array (b);
  add_number (b, "working_length", canal->working_length);
  json_builder_end_object (b);
}

static void
add_step (JsonBuilder        *b,
          const CwStepResult *r)
{
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "index");
  json_builder_add_int_value (b, r->index);
  add_string (b, "instrument", r->instrument->id);
  add_number (b, "depth", r->depth);
  add_number (b, "engaged_length", r->engaged_length);
  add_number (b, "engaged_in_curve", r->engaged_in_curve);
  add_number (b, "engaged_in_straight", r->engaged_in_straight);
  add_number (b, "contact_area", r->contact_area);
  add_number (b, "cut_volume", r->cut_volume);
  add_number (b, "max_diameter_in_curve", r->max_diameter_in_curve);
  add_number (b, "ceiling", r->ceiling);
  add_number (b, "ceiling_depth", r->ceiling_depth);
  add_number (b, "straight_clearance", r->straight_clearance);
  add_number (b, "strain", r->strain);
  add_number (b, "cycles_in_curve", r->cycles_in_curve);
  add_number (b, "fatigue_use", r->fatigue_use);
  add_number (b, "fracture_torque_d3", r->fracture_torque_d3);
  add_number (b, "first_contact", r->first_contact);
  add_number (b, "time", r->time);
  json_builder_set_member_name (b, "pecks");
  json_builder_add_int_value (b, r->pecks);
  add_string (b, "verdict", cw_level_to_string (r->verdict));
  add_findings (b, r->findings);
  json_builder_end_object (b);
}

static void
build_canal (JsonBuilder         *b,
             const CwCanalResult *result)
{
  json_builder_begin_object (b);
  add_string (b, "name", result->canal->name);
  add_string (b, "verdict", cw_level_to_string (result->verdict));
  add_findings (b, result->findings);
  add_zones (b, result->canal, &result->geometry);
  json_builder_set_member_name (b, "steps");
  json_builder_begin_array (b);
  for (guint i = 0; i < result->steps->len; i++)
    add_step (b, g_ptr_array_index (result->steps, i));
  json_builder_end_array (b);
  json_builder_set_member_name (b, "final");
  json_builder_begin_object (b);
  add_number (b, "apical_size", result->apical_size);
  add_number (b, "apical_taper", result->apical_taper);
  add_number (b, "onset_diameter", result->onset_diameter);
  add_number (b, "time", result->time);
  json_builder_end_object (b);
  json_builder_end_object (b);
}

JsonNode *
cw_report_canal (const CwCanalResult *result)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  g_return_val_if_fail (result != NULL, NULL);

  build_canal (b, result);
  return json_builder_get_root (b);
}

JsonNode *
cw_report_case (const CwCase *kase,
                gboolean     *any_stop)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  g_return_val_if_fail (kase != NULL, NULL);

  if (any_stop)
    *any_stop = FALSE;
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "canals");
  json_builder_begin_array (b);
  for (guint i = 0; i < kase->canals->len; i++)
    {
      g_autoptr(CwCanalResult) result = cw_evaluate_canal (kase, g_ptr_array_index (kase->canals, i));

      build_canal (b, result);
      if (any_stop)
        *any_stop |= result->has_stop;
    }
  json_builder_end_array (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}
