/* cw-case-writer.c
 *
 * Writes a case in the form the loader reads: known members first, in the
 * order of the format description, then at each level the members a newer
 * version wrote and this one kept.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-case-writer"

#include <math.h>

#include "cw-case-writer.h"
#include "cw-error.h"
#include "cw-json-writer.h"

/* Whole numbers go out as JSON integers, so that a size reads "25" rather
 * than the shortest double form, which for 100 would be "1e+02". */
static gboolean
is_whole (double value)
{
  return isfinite (value) && value == floor (value) && fabs (value) < 1e15;
}

static void
set_number (JsonObject *object,
            const char *key,
            double      value)
{
  if (is_whole (value))
    json_object_set_int_member (object, key, (gint64) value);
  else
    json_object_set_double_member (object, key, value);
}

static void
set_optional_number (JsonObject *object,
                     const char *key,
                     double      value)
{
  if (!isnan (value))
    set_number (object, key, value);
}

static void
add_number (JsonArray *array,
            double     value)
{
  if (is_whole (value))
    json_array_add_int_element (array, (gint64) value);
  else
    json_array_add_double_element (array, value);
}

static JsonNode *
parse_object (const char *text)
{
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonNode *root;

  if (!json_parser_load_from_data (parser, text, -1, NULL))
    return NULL;
  root = json_parser_get_root (parser);
  if (root == NULL || !JSON_NODE_HOLDS_OBJECT (root))
    return NULL;
  return json_node_copy (root);
}

/* A known member of the same name wins: the loader never keeps one, so a
 * clash can only come from a program that set extra_json by hand. */
static void
append_extra (JsonObject *object,
              const char *extra_json)
{
  g_autoptr(JsonNode) node = NULL;
  g_autoptr(GList) members = NULL;
  JsonObject *extra;

  if (extra_json == NULL)
    return;
  node = parse_object (extra_json);
  if (node == NULL)
    {
      g_warning ("Dropping unreadable kept members: %s", extra_json);
      return;
    }
  extra = json_node_get_object (node);
  members = json_object_get_members (extra);
  for (GList *l = members; l != NULL; l = l->next)
    if (!json_object_has_member (object, l->data))
      json_object_set_member (object, l->data, json_node_copy (json_object_get_member (extra, l->data)));
}

static JsonArray *
segments_to_json (GArray *segments)
{
  JsonArray *array = json_array_new ();

  for (guint i = 0; i < segments->len; i++)
    {
      const CwTaperSegment *segment = &g_array_index (segments, CwTaperSegment, i);
      JsonObject *object = json_object_new ();

      set_number (object, "to", segment->to);
      set_number (object, "taper", segment->taper);
      json_array_add_object_element (array, object);
    }
  return array;
}

static JsonObject *
instrument_to_json (const CwInstrument *instrument)
{
  JsonObject *object = json_object_new ();

  json_object_set_string_member (object, "id", instrument->id);
  json_object_set_string_member (object, "label",
                                 instrument->label != NULL ? instrument->label : instrument->id);
  set_number (object, "tip", instrument->tip);
  if (instrument->segments != NULL)
    json_object_set_array_member (object, "taper_segments", segments_to_json (instrument->segments));
  else
    set_number (object, "taper", instrument->taper);
  set_optional_number (object, "max_flute_diameter", instrument->max_flute_diameter);
  set_number (object, "flute_length", instrument->flute_length);
  set_number (object, "length", instrument->length);
  json_object_set_string_member (object, "alloy", cw_alloy_to_string (instrument->alloy));
  json_object_set_string_member (object, "motion", cw_motion_to_string (instrument->motion));
  set_optional_number (object, "rpm", instrument->rpm);
  set_optional_number (object, "torque_limit", instrument->torque_limit);
  if (instrument->uses_allowed > 0)
    json_object_set_int_member (object, "uses_allowed", instrument->uses_allowed);
  append_extra (object, instrument->extra_json);
  return object;
}

static JsonObject *
curve_to_json (const CwCurve *curve)
{
  JsonObject *object = json_object_new ();

  set_number (object, "onset", curve->onset);
  if (!isnan (curve->schneider_angle))
    set_number (object, "schneider_angle", curve->schneider_angle);
  else
    {
      set_number (object, "angle", curve->angle);
      set_number (object, "radius", curve->radius);
    }
  append_extra (object, curve->extra_json);
  return object;
}

static JsonObject *
anatomy_to_json (const CwCanal *canal)
{
  JsonObject *object = json_object_new ();

  if (canal->diameters != NULL)
    {
      JsonArray *points = json_array_new ();

      for (guint i = 0; i < canal->diameters->len; i++)
        {
          const CwPoint *point = &g_array_index (canal->diameters, CwPoint, i);
          JsonArray *pair = json_array_new ();

          add_number (pair, point->s);
          add_number (pair, point->v);
          json_array_add_array_element (points, pair);
        }
      json_object_set_array_member (object, "diameters", points);
    }
  else
    {
      set_number (object, "orifice_diameter", canal->orifice_diameter);
      set_number (object, "apical_diameter", canal->apical_diameter);
    }
  append_extra (object, canal->anatomy_extra_json);
  return object;
}

static JsonArray *
sequence_to_json (const CwCanal *canal)
{
  JsonArray *array = json_array_new ();

  for (guint i = 0; i < canal->sequence->len; i++)
    {
      const CwStep *step = &g_array_index (canal->sequence, CwStep, i);
      JsonObject *object = json_object_new ();

      json_object_set_string_member (object, "instrument", step->instrument_id);
      set_number (object, "depth", step->depth);
      if (step->note != NULL)
        json_object_set_string_member (object, "note", step->note);
      append_extra (object, step->extra_json);
      json_array_add_object_element (array, object);
    }
  return array;
}

static JsonObject *
canal_to_json (const CwCanal *canal)
{
  JsonObject *object = json_object_new ();

  json_object_set_string_member (object, "name", canal->name);
  if (canal->reference != NULL)
    json_object_set_string_member (object, "reference", canal->reference);
  set_number (object, "working_length", canal->working_length);
  set_number (object, "orifice_depth", canal->orifice_depth);
  if (canal->n_curves > 0)
    {
      JsonArray *curves = json_array_new ();

      for (guint i = 0; i < canal->n_curves; i++)
        json_array_add_object_element (curves, curve_to_json (&canal->curves[i]));
      json_object_set_array_member (object, "curves", curves);
    }
  json_object_set_object_member (object, "anatomy", anatomy_to_json (canal));
  json_object_set_array_member (object, "sequence", sequence_to_json (canal));
  append_extra (object, canal->extra_json);
  return object;
}

static void
add_tooth (JsonObject   *object,
           const CwCase *kase)
{
  JsonObject *tooth;

  if (kase->tooth_code == NULL)
    return;
  tooth = json_object_new ();
  json_object_set_string_member (tooth, "notation",
                                 kase->notation == CW_NOTATION_UNIVERSAL ? "universal" : "FDI");
  json_object_set_string_member (tooth, "code", kase->tooth_code);
  append_extra (tooth, kase->tooth_extra_json);
  json_object_set_object_member (object, "tooth", tooth);
}

static void
add_targets (JsonObject   *object,
             const CwCase *kase)
{
  JsonObject *targets = json_object_new ();

  set_number (targets, "apical_size", kase->target_apical_size);
  set_number (targets, "apical_taper", kase->target_apical_taper);
  append_extra (targets, kase->targets_extra_json);
  json_object_set_object_member (object, "targets", targets);
}

/* The rules go out as the case wrote them, unknown keys included. */
static void
add_rules (JsonObject   *object,
           const CwCase *kase)
{
  JsonNode *rules;

  if (kase->rules_json == NULL)
    return;
  rules = parse_object (kase->rules_json);
  if (rules == NULL)
    {
      g_warning ("Dropping unreadable rules: %s", kase->rules_json);
      return;
    }
  json_object_set_member (object, "rules", rules);
}

char *
cw_case_to_data (const CwCase *kase)
{
  g_autoptr(JsonObject) object = NULL;
  g_autoptr(JsonNode) root = NULL;
  JsonArray *instruments, *canals;

  g_return_val_if_fail (kase != NULL, NULL);

  object = json_object_new ();
  json_object_set_string_member (object, "format", "canalwright-case");
  json_object_set_int_member (object, "version", CW_CASE_VERSION);
  json_object_set_string_member (object, "title", kase->title != NULL ? kase->title : "");
  add_tooth (object, kase);
  if (kase->notes != NULL)
    json_object_set_string_member (object, "notes", kase->notes);
  add_targets (object, kase);
  add_rules (object, kase);
  instruments = json_array_new ();
  for (guint i = 0; i < kase->instruments->len; i++)
    json_array_add_object_element (instruments, instrument_to_json (g_ptr_array_index (kase->instruments, i)));
  json_object_set_array_member (object, "instruments", instruments);
  canals = json_array_new ();
  for (guint i = 0; i < kase->canals->len; i++)
    json_array_add_object_element (canals, canal_to_json (g_ptr_array_index (kase->canals, i)));
  json_object_set_array_member (object, "canals", canals);
  append_extra (object, kase->extra_json);
  root = json_node_init_object (json_node_alloc (), object);
  return cw_json_write (root, TRUE);
}

gboolean
cw_case_save (const CwCase  *kase,
              const char    *path,
              GError       **error)
{
  g_autofree char *data = NULL;
  g_autoptr(GError) local_error = NULL;

  g_return_val_if_fail (kase != NULL, FALSE);
  g_return_val_if_fail (path != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  data = cw_case_to_data (kase);
  /* A temporary file renamed over the old one: a crash or a full disk
   * leaves either the old case or the new one, never half of one. */
  if (g_file_set_contents_full (path, data, -1,
                                G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE,
                                0644, &local_error))
    return TRUE;
  g_set_error (error, CW_ERROR, CW_ERROR_WRITE, "%s: could not save the case: %s",
               path, local_error->message);
  return FALSE;
}
