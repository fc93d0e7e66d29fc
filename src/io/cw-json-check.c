/* cw-json-check.c
 *
 * The typed readers every loader uses.  A reader checks one member against
 * its type and range and, when it is wrong, says so as "FILE: PATH: what is
 * wrong (allowed range)", so that a user, and a test, sees where the fault
 * is in the words of the format description.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-json-check"

#include <math.h>

#include "cw-instrument.h"
#include "cw-json-check.h"
#include "cw-json-writer.h"

gboolean
cw_json_fail (GError     **error,
              CwError      code,
              const char  *file,
              const char  *path,
              const char  *format,
              ...)
{
  g_autofree char *what = NULL;
  va_list args;

  va_start (args, format);
  what = g_strdup_vprintf (format, args);
  va_end (args);
  if (path != NULL)
    g_set_error (error, CW_ERROR, code, "%s: %s: %s", file, path, what);
  else
    g_set_error (error, CW_ERROR, code, "%s: %s", file, what);
  return FALSE;
}

char *
cw_json_member_path (const char  *parent,
                     const char  *key)
{
  if (parent == NULL || *parent == '\0')
    return g_strdup (key);
  return g_strconcat (parent, ".", key, NULL);
}

char *
cw_json_index_path (const char  *parent,
                    guint        index)
{
  return g_strdup_printf ("%s[%u]", parent, index);
}

char *
cw_json_format_number (double value)
{
  GString *out;

  if (isinf (value))
    return g_strdup (value > 0 ? "infinity" : "-infinity");
  if (value == floor (value) && fabs (value) < 1e15)
    return g_strdup_printf ("%" G_GINT64_FORMAT, (gint64) value);
  out = g_string_new (NULL);
  cw_json_append_number (out, value);
  return g_string_free (out, FALSE);
}

static char *
describe_range (const CwRange *range)
{
  g_autofree char *min = cw_json_format_number (range->min);
  g_autofree char *max = cw_json_format_number (range->max);

  return g_strdup_printf ("%s %s and %s %s%s",
                          range->min_open ? ">" : ">=", min,
                          range->max_open ? "<" : "<=", max,
                          range->unit);
}

static gboolean
in_range (const CwRange *range,
          double         value)
{
  if (range->min_open ? value <= range->min : value < range->min)
    return FALSE;
  return range->max_open ? value < range->max : value <= range->max;
}

const char *
cw_json_describe_node (JsonNode *node)
{
  switch (JSON_NODE_TYPE (node))
    {
    case JSON_NODE_OBJECT:
      return "an object";
    case JSON_NODE_ARRAY:
      return "an array";
    case JSON_NODE_NULL:
      return "null";
    case JSON_NODE_VALUE:
    default:
      break;
    }
  switch (json_node_get_value_type (node))
    {
    case G_TYPE_STRING:
      return "a string";
    case G_TYPE_BOOLEAN:
      return "a boolean";
    default:
      return "a number";
    }
}

gboolean
cw_json_holds_number (JsonNode *node)
{
  GType type;

  if (!JSON_NODE_HOLDS_VALUE (node))
    return FALSE;
  type = json_node_get_value_type (node);
  return type == G_TYPE_INT64 || type == G_TYPE_DOUBLE;
}

static gboolean
holds_string (JsonNode *node)
{
  return JSON_NODE_HOLDS_VALUE (node) && json_node_get_value_type (node) == G_TYPE_STRING;
}

gboolean
cw_json_node_number (const char     *file,
                     const char     *path,
                     JsonNode       *node,
                     const CwRange  *range,
                     double         *value,
                     GError        **error)
{
  g_autofree char *allowed = describe_range (range);
  g_autofree char *got = NULL;

  if (node == NULL)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "is required (a number %s)", allowed);
  if (!cw_json_holds_number (node))
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be a number %s (got %s)",
                         allowed, cw_json_describe_node (node));
  *value = json_node_get_double (node);
  if (isfinite (*value) && in_range (range, *value))
    return TRUE;
  got = cw_json_format_number (*value);
  return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be a number %s (got %s)", allowed, got);
}

gboolean
cw_json_node_integer (const char  *file,
                      const char  *path,
                      JsonNode    *node,
                      gint64       min,
                      gint64       max,
                      gint64      *value,
                      GError     **error)
{
  g_autofree char *got = NULL;
  double v = NAN;

  if (node != NULL && cw_json_holds_number (node))
    {
      v = json_node_get_double (node);
      if (v == floor (v) && v >= (double) min && v <= (double) max)
        {
          *value = (gint64) v;
          return TRUE;
        }
    }
  if (node == NULL)
    got = g_strdup ("nothing");
  else
    got = isnan (v) ? g_strdup (cw_json_describe_node (node)) : cw_json_format_number (v);
  return cw_json_fail (error, CW_ERROR_INVALID, file, path,
                       "must be an integer from %" G_GINT64_FORMAT " to %" G_GINT64_FORMAT " (got %s)",
                       min, max, got);
}

gboolean
cw_json_node_string (const char   *file,
                     const char   *path,
                     JsonNode     *node,
                     gboolean      non_empty,
                     const char  **value,
                     GError      **error)
{
  const char *kind = non_empty ? "a non-empty string" : "a string";

  if (node == NULL)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "is required (%s)", kind);
  if (!holds_string (node))
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be %s (got %s)", kind, cw_json_describe_node (node));
  if (non_empty && *json_node_get_string (node) == '\0')
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be %s (got \"\")", kind);
  *value = json_node_get_string (node);
  return TRUE;
}

gboolean
cw_json_node_object (const char   *file,
                     const char   *path,
                     JsonNode     *node,
                     JsonObject  **object,
                     GError      **error)
{
  if (node == NULL)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "is required (an object)");
  if (!JSON_NODE_HOLDS_OBJECT (node))
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be an object (got %s)", cw_json_describe_node (node));
  *object = json_node_get_object (node);
  return TRUE;
}

/* The length is checked here, before anything is built from the elements. */
gboolean
cw_json_node_array (const char  *file,
                    const char  *path,
                    JsonNode    *node,
                    guint        min,
                    guint        max,
                    const char  *what,
                    JsonArray  **array,
                    GError     **error)
{
  guint n;

  if (node == NULL)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "is required (an array of %u to %u %s)",
                         min, max, what);
  if (!JSON_NODE_HOLDS_ARRAY (node))
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be an array of %u to %u %s (got %s)",
                         min, max, what, cw_json_describe_node (node));
  n = json_array_get_length (json_node_get_array (node));
  if (n < min || n > max)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must hold %u to %u %s (got %u)",
                         min, max, what, n);
  *array = json_node_get_array (node);
  return TRUE;
}

/* A [a, b] pair of numbers, as in measured diameters and the ceiling table. */
gboolean
cw_json_node_pair (const char     *file,
                   const char     *path,
                   JsonNode       *node,
                   const char     *form,
                   const CwRange  *first_range,
                   const CwRange  *second_range,
                   double         *first,
                   double         *second,
                   GError        **error)
{
  g_autofree char *first_path = cw_json_index_path (path, 0);
  g_autofree char *second_path = cw_json_index_path (path, 1);
  JsonArray *pair;

  if (!JSON_NODE_HOLDS_ARRAY (node))
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be a pair %s (got %s)",
                         form, cw_json_describe_node (node));
  pair = json_node_get_array (node);
  if (json_array_get_length (pair) != 2)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be a pair %s (got an array of %u)",
                         form, json_array_get_length (pair));
  return cw_json_node_number (file, first_path, json_array_get_element (pair, 0), first_range, first, error)
         && cw_json_node_number (file, second_path, json_array_get_element (pair, 1), second_range, second, error);
}

gboolean
cw_json_read_number (const char     *file,
                     JsonObject     *object,
                     const char     *parent,
                     const char     *key,
                     const CwRange  *range,
                     gboolean        required,
                     double         *value,
                     GError        **error)
{
  JsonNode *node = json_object_get_member (object, key);
  g_autofree char *path = cw_json_member_path (parent, key);

  if (node == NULL && !required)
    return TRUE;
  return cw_json_node_number (file, path, node, range, value, error);
}

gboolean
cw_json_read_string (const char   *file,
                     JsonObject   *object,
                     const char   *parent,
                     const char   *key,
                     gboolean      required,
                     gboolean      non_empty,
                     const char  **value,
                     GError      **error)
{
  JsonNode *node = json_object_get_member (object, key);
  g_autofree char *path = cw_json_member_path (parent, key);

  if (node == NULL && !required)
    return TRUE;
  return cw_json_node_string (file, path, node, non_empty, value, error);
}

gboolean
cw_json_read_fields (const char           *file,
                     JsonObject           *object,
                     const char           *parent,
                     const CwNumberField  *fields,
                     guint                 n_fields,
                     gpointer              base,
                     GError              **error)
{
  for (guint i = 0; i < n_fields; i++)
    {
      JsonNode *node = json_object_get_member (object, fields[i].key);
      double *value = G_STRUCT_MEMBER_P (base, fields[i].offset);
      g_autofree char *path = cw_json_member_path (parent, fields[i].key);

      if (node == NULL)
        continue;
      if (fields[i].nullable && JSON_NODE_HOLDS_NULL (node))
        *value = NAN;
      else if (!cw_json_node_number (file, path, node, &fields[i].range, value, error))
        return FALSE;
    }
  return TRUE;
}

/* The members this version does not know, kept as compact JSON text so that
 * a save writes them back; NULL when there are none. */
char *
cw_json_collect_unknown (JsonObject          *object,
                         const char * const  *known)
{
  g_autoptr(JsonObject) extra = json_object_new ();
  g_autoptr(GList) members = json_object_get_members (object);
  g_autoptr(JsonNode) node = NULL;

  for (GList *l = members; l != NULL; l = l->next)
    if (!g_strv_contains (known, l->data))
      json_object_set_member (extra, l->data, json_node_copy (json_object_get_member (object, l->data)));
  if (json_object_get_size (extra) == 0)
    return NULL;
  node = json_node_init_object (json_node_alloc (), extra);
  return cw_json_write (node, FALSE);
}

/* The other way: members kept by cw_json_collect_unknown () go back into
 * OBJECT, where it does not have a member of that name already. */
void
cw_json_add_unknown (JsonObject *object,
                     const char *unknown_json)
{
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GList) members = NULL;
  JsonObject *extra;

  if (unknown_json == NULL || !json_parser_load_from_data (parser, unknown_json, -1, NULL)
      || !JSON_NODE_HOLDS_OBJECT (json_parser_get_root (parser)))
    return;
  extra = json_node_get_object (json_parser_get_root (parser));
  members = json_object_get_members (extra);
  for (GList *l = members; l != NULL; l = l->next)
    if (!json_object_has_member (object, l->data))
      json_object_set_member (object, l->data, json_node_copy (json_object_get_member (extra, l->data)));
}

char *
cw_json_alloy_choices (void)
{
  GString *out = g_string_new (NULL);

  for (guint i = 0; i < CW_N_ALLOYS; i++)
    g_string_append_printf (out, "%s\"%s\"", i > 0 ? ", " : "", cw_alloy_to_string ((CwAlloy) i));
  return g_string_free (out, FALSE);
}

char *
cw_json_motion_choices (void)
{
  GString *out = g_string_new (NULL);

  for (guint i = 0; i < CW_N_MOTIONS; i++)
    g_string_append_printf (out, "%s\"%s\"", i > 0 ? ", " : "", cw_motion_to_string ((CwMotion) i));
  return g_string_free (out, FALSE);
}
