/* cw-json-writer.c
 *
 * json-glib prints doubles with 17 digits (0.04 becomes 0.040000000000000001),
 * which hand-edited case files should not show.  This writer prints the
 * shortest decimal that reads back to the same double, always in the C locale.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-json"

#include <math.h>
#include <string.h>

#include "cw-json-writer.h"

static void write_node (GString *out, JsonNode *node, gboolean pretty, guint depth);

static void
shortest (char   *buf,
          gsize   size,
          double  value,
          char    conversion)
{
  for (int digits = conversion == 'f' ? 0 : 1; digits <= 17; digits++)
    {
      char fmt[8];

      g_snprintf (fmt, sizeof fmt, "%%.%d%c", digits, conversion);
      g_ascii_formatd (buf, size, fmt, value);
      if (g_ascii_strtod (buf, NULL) == value)
        return;
    }
}

void
cw_json_append_number (GString *out,
                       double   value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  if (!isfinite (value))
    {
      g_string_append (out, "null");
      return;
    }
  /* Plain decimals for the lengths, diameters and counts of a case; the
   * exponent form only far outside them. */
  if (fabs (value) >= 1e-5 && fabs (value) < 1e15)
    shortest (buf, sizeof buf, value, 'f');
  else
    shortest (buf, sizeof buf, value, 'g');
  g_string_append (out, buf);
}

static void
write_string (GString    *out,
              const char *str)
{
  g_string_append_c (out, '"');
  for (const char *p = str; *p; p++)
    {
      guchar c = (guchar) *p;

      switch (c)
        {
        case '"': g_string_append (out, "\\\""); break;
        case '\\': g_string_append (out, "\\\\"); break;
        case '\n': g_string_append (out, "\\n"); break;
        case '\r': g_string_append (out, "\\r"); break;
        case '\t': g_string_append (out, "\\t"); break;
        case '\b': g_string_append (out, "\\b"); break;
        case '\f': g_string_append (out, "\\f"); break;
        default:
          if (c < 0x20)
            g_string_append_printf (out, "\\u%04x", c);
          else
            g_string_append_c (out, (char) c);
        }
    }
  g_string_append_c (out, '"');
}

static void
newline (GString  *out,
         gboolean  pretty,
         guint     depth)
{
  if (!pretty)
    return;
  g_string_append_c (out, '\n');
  for (guint i = 0; i < depth; i++)
    g_string_append (out, "  ");
}

static void
write_object (GString    *out,
              JsonObject *object,
              gboolean    pretty,
              guint       depth)
{
  g_autoptr(GList) members = json_object_get_members (object);

  g_string_append_c (out, '{');
  for (GList *l = members; l; l = l->next)
    {
      newline (out, pretty, depth + 1);
      write_string (out, l->data);
      g_string_append (out, pretty ? ": " : ":");
      write_node (out, json_object_get_member (object, l->data), pretty, depth + 1);
      if (l->next)
        g_string_append_c (out, ',');
    }
  if (members)
    newline (out, pretty, depth);
  g_string_append_c (out, '}');
}

static gboolean
is_flat_array (JsonArray *array)
{
  guint n = json_array_get_length (array);

  for (guint i = 0; i < n; i++)
    if (!JSON_NODE_HOLDS_VALUE (json_array_get_element (array, i)))
      return FALSE;
  return TRUE;
}

static void
write_array (GString   *out,
             JsonArray *array,
             gboolean   pretty,
             guint      depth)
{
  guint n = json_array_get_length (array);
  gboolean flat = is_flat_array (array);

  g_string_append_c (out, '[');
  for (guint i = 0; i < n; i++)
    {
      if (flat)
        {
          if (i > 0 && pretty)
            g_string_append_c (out, ' ');
        }
      else
        newline (out, pretty, depth + 1);
      write_node (out, json_array_get_element (array, i), pretty, depth + 1);
      if (i + 1 < n)
        g_string_append_c (out, ',');
    }
  if (n > 0 && !flat)
    newline (out, pretty, depth);
  g_string_append_c (out, ']');
}

static void
write_value (GString  *out,
             JsonNode *node)
{
  switch (json_node_get_value_type (node))
    {
    case G_TYPE_INT64:
      g_string_append_printf (out, "%" G_GINT64_FORMAT, json_node_get_int (node));
      break;
    case G_TYPE_DOUBLE:
      cw_json_append_number (out, json_node_get_double (node));
      break;
    case G_TYPE_BOOLEAN:
      g_string_append (out, json_node_get_boolean (node) ? "true" : "false");
      break;
    case G_TYPE_STRING:
      write_string (out, json_node_get_string (node));
      break;
    default:
      g_string_append (out, "null");
    }
}

static void
write_node (GString  *out,
            JsonNode *node,
            gboolean  pretty,
            guint     depth)
{
  switch (JSON_NODE_TYPE (node))
    {
    case JSON_NODE_OBJECT:
      write_object (out, json_node_get_object (node), pretty, depth);
      break;
    case JSON_NODE_ARRAY:
      write_array (out, json_node_get_array (node), pretty, depth);
      break;
    case JSON_NODE_VALUE:
      write_value (out, node);
      break;
    case JSON_NODE_NULL:
    default:
      g_string_append (out, "null");
    }
}

char *
cw_json_write (JsonNode *root,
               gboolean  pretty)
{
  GString *out = g_string_new (NULL);

  g_return_val_if_fail (root != NULL, NULL);

  write_node (out, root, pretty, 0);
  if (pretty)
    g_string_append_c (out, '\n');
  return g_string_free (out, FALSE);
}
