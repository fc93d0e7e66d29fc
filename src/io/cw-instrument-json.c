/* cw-instrument-json.c
 *
 * One instrument as the case and library files give it, checked member by
 * member with the loaders' messages.  The case loader, the library loader
 * and the instrument editor all go through here, so a value the editor
 * refuses is refused in a file with the same words.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-instrument-json"

#include <math.h>
#include <string.h>

#include "cw-instrument-json.h"
#include "cw-json-check.h"

static gboolean
read_segments (const char    *file,
               JsonObject    *object,
               const char    *parent,
               CwInstrument  *instrument,
               GError       **error)
{
  static const CwRange to_range = CW_LENGTH_RANGE;
  static const CwRange taper_range = CW_TAPER_RANGE;
  g_autofree char *path = cw_json_member_path (parent, "taper_segments");
  CwTaperSegment segments[CW_MAX_SEGMENTS];
  JsonArray *array = NULL;
  guint n;

  if (!cw_json_node_array (file, path, json_object_get_member (object, "taper_segments"),
                           1, CW_MAX_SEGMENTS, "segments", &array, error))
    return FALSE;
  n = json_array_get_length (array);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *item = cw_json_index_path (path, i);
      JsonObject *segment = NULL;
      CwTaperSegment *s = &segments[i];

      if (!cw_json_node_object (file, item, json_array_get_element (array, i), &segment, error)
          || !cw_json_read_number (file, segment, item, "to", &to_range, TRUE, &s->to, error))
        return FALSE;
      if (i > 0 && s->to <= s[-1].to)
        {
          g_autofree char *to_path = cw_json_member_path (item, "to");
          g_autofree char *before = cw_json_format_number (s[-1].to);
          g_autofree char *got = cw_json_format_number (s->to);

          return cw_json_fail (error, CW_ERROR_INVALID, file, to_path,
                               "must be greater than the end of the segment before (%s mm) and <= 40 mm (got %s)",
                               before, got);
        }
      if (!cw_json_read_number (file, segment, item, "taper", &taper_range, TRUE, &s->taper, error))
        return FALSE;
    }
  cw_instrument_set_segments (instrument, segments, n);
  return TRUE;
}

static gboolean
read_taper (const char    *file,
            JsonObject    *object,
            const char    *parent,
            CwInstrument  *instrument,
            GError       **error)
{
  static const CwRange taper_range = CW_TAPER_RANGE;
  gboolean has_taper = json_object_has_member (object, "taper");
  gboolean has_segments = json_object_has_member (object, "taper_segments");
  g_autofree char *path = cw_json_member_path (parent, "taper");

  if (has_taper && has_segments)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "give either taper or taper_segments, not both");
  if (!has_taper && !has_segments)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path,
                         "is required (a number > 0 and <= 0.12), or taper_segments instead");
  if (has_segments)
    return read_segments (file, object, parent, instrument, error);
  return cw_json_read_number (file, object, parent, "taper", &taper_range, TRUE, &instrument->taper, error);
}

/* An enumerated member: absent, or a name not in CHOICES, is refused with
 * the list of names. */
static gboolean
read_name (const char   *file,
           JsonObject   *object,
           const char   *parent,
           const char   *key,
           const char   *choices,
           const char  **value,
           GError      **error)
{
  g_autofree char *path = cw_json_member_path (parent, key);

  if (!json_object_has_member (object, key))
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "is required (one of %s)", choices);
  return cw_json_read_string (file, object, parent, key, TRUE, FALSE, value, error);
}

static gboolean
read_kind (const char    *file,
           JsonObject    *object,
           const char    *parent,
           CwInstrument  *instrument,
           GError       **error)
{
  g_autofree char *alloys = cw_json_alloy_choices ();
  g_autofree char *motions = cw_json_motion_choices ();
  g_autofree char *alloy_path = cw_json_member_path (parent, "alloy");
  g_autofree char *motion_path = cw_json_member_path (parent, "motion");
  const char *alloy = NULL, *motion = NULL;

  if (!read_name (file, object, parent, "alloy", alloys, &alloy, error))
    return FALSE;
  if (!cw_alloy_from_string (alloy, &instrument->alloy))
    return cw_json_fail (error, CW_ERROR_INVALID, file, alloy_path, "must be one of %s (got \"%s\")", alloys, alloy);
  if (!read_name (file, object, parent, "motion", motions, &motion, error))
    return FALSE;
  if (!cw_motion_from_string (motion, &instrument->motion))
    return cw_json_fail (error, CW_ERROR_INVALID, file, motion_path, "must be one of %s (got \"%s\")", motions, motion);
  return TRUE;
}

static gboolean
check_lengths (const char    *file,
               const char    *parent,
               CwInstrument  *instrument,
               GError       **error)
{
  g_autofree char *path = cw_json_member_path (parent, "flute_length");
  g_autofree char *length = NULL;
  g_autofree char *got = NULL;

  if (instrument->flute_length <= instrument->length)
    return TRUE;
  length = cw_json_format_number (instrument->length);
  got = cw_json_format_number (instrument->flute_length);
  return cw_json_fail (error, CW_ERROR_INVALID, file, path,
                       "must be a number > 0 and <= the length of the file, %s mm (got %s)", length, got);
}

static gboolean
read_extras (const char    *file,
             JsonObject    *object,
             const char    *parent,
             CwInstrument  *instrument,
             GError       **error)
{
  /* The flutes stop growing there, so it must be wider than the tip. */
  CwRange flute_range = { instrument->tip / 100.0, 3, TRUE, FALSE, " mm" };
  JsonNode *uses = json_object_get_member (object, "uses_allowed");
  g_autofree char *uses_path = cw_json_member_path (parent, "uses_allowed");
  gint64 n_uses = 0;

  if (!cw_json_read_number (file, object, parent, "max_flute_diameter", &flute_range, FALSE,
                            &instrument->max_flute_diameter, error))
    return FALSE;
  if (uses == NULL)
    return TRUE;
  if (!cw_json_node_integer (file, uses_path, uses, 1, 1000, &n_uses, error))
    return FALSE;
  instrument->uses_allowed = (int) n_uses;
  return TRUE;
}

CwInstrument *
cw_instrument_load_json (JsonObject  *object,
                         const char  *file,
                         const char  *path,
                         GError     **error)
{
  static const char * const keys[] = {
    "id", "label", "tip", "taper", "taper_segments", "flute_length", "length",
    "max_flute_diameter", "alloy", "motion", "rpm", "torque_limit", "uses_allowed", NULL
  };
  static const CwNumberField fields[] = {
    { "flute_length", G_STRUCT_OFFSET (CwInstrument, flute_length), CW_LENGTH_RANGE, FALSE },
    { "length", G_STRUCT_OFFSET (CwInstrument, length), CW_LENGTH_RANGE, FALSE },
    { "rpm", G_STRUCT_OFFSET (CwInstrument, rpm), { 0, 5000, TRUE, FALSE, " rpm" }, FALSE },
    { "torque_limit", G_STRUCT_OFFSET (CwInstrument, torque_limit), { 0, 20, TRUE, FALSE, " N·cm" }, FALSE },
  };
  static const CwRange tip_range = CW_SIZE_RANGE;
  g_autoptr(CwInstrument) instrument = NULL;
  const char *id = NULL, *label = NULL;
  double tip = 0;

  g_return_val_if_fail (object != NULL, NULL);
  g_return_val_if_fail (file != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!cw_json_read_string (file, object, path, "id", TRUE, TRUE, &id, error)
      || !cw_json_read_string (file, object, path, "label", FALSE, FALSE, &label, error)
      || !cw_json_read_number (file, object, path, "tip", &tip_range, TRUE, &tip, error))
    return NULL;
  instrument = cw_instrument_new (id, tip, NAN);
  instrument->label = g_strdup (label != NULL ? label : id);
  instrument->flute_length = CW_DEFAULT_FLUTE_LENGTH;
  instrument->length = CW_DEFAULT_INSTRUMENT_LENGTH;
  if (!read_taper (file, object, path, instrument, error)
      || !cw_json_read_fields (file, object, path, fields, G_N_ELEMENTS (fields), instrument, error)
      || !check_lengths (file, path, instrument, error)
      || !read_extras (file, object, path, instrument, error)
      || !read_kind (file, object, path, instrument, error))
    return NULL;
  instrument->extra_json = cw_json_collect_unknown (object, keys);
  return g_steal_pointer (&instrument);
}

static int
find_id (GPtrArray  *instruments,
         const char *id)
{
  for (guint i = 0; i < instruments->len; i++)
    {
      const CwInstrument *instrument = g_ptr_array_index (instruments, i);

      if (strcmp (instrument->id, id) == 0)
        return (int) i;
    }
  return -1;
}

/* The "instruments" member of a document, MIN to MAX of them with unique
 * ids, appended to INSTRUMENTS only when every one is valid. */
gboolean
cw_instrument_load_array (JsonObject  *object,
                          const char  *file,
                          guint        min,
                          guint        max,
                          GPtrArray   *instruments,
                          GError     **error)
{
  g_autoptr(GPtrArray) loaded = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_instrument_free);
  JsonArray *array = NULL;

  g_return_val_if_fail (object != NULL, FALSE);
  g_return_val_if_fail (instruments != NULL, FALSE);

  if (!cw_json_node_array (file, "instruments", json_object_get_member (object, "instruments"),
                           min, max, "instruments", &array, error))
    return FALSE;
  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_autofree char *path = cw_json_index_path ("instruments", i);
      g_autofree char *id_path = cw_json_member_path (path, "id");
      g_autoptr(CwInstrument) instrument = NULL;
      JsonObject *item = NULL;
      int earlier;

      if (!cw_json_node_object (file, path, json_array_get_element (array, i), &item, error))
        return FALSE;
      instrument = cw_instrument_load_json (item, file, path, error);
      if (instrument == NULL)
        return FALSE;
      earlier = find_id (loaded, instrument->id);
      if (earlier >= 0)
        return cw_json_fail (error, CW_ERROR_INVALID, file, id_path,
                             "must be unique, but instruments[%d] has the id \"%s\" too", earlier, instrument->id);
      g_ptr_array_add (loaded, g_steal_pointer (&instrument));
    }
  g_ptr_array_extend_and_steal (instruments, g_steal_pointer (&loaded));
  return TRUE;
}
