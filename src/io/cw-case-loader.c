/* cw-case-loader.c
 *
 * Case files are written by hand and by other programs, so everything is
 * checked before it is used: the loader builds into a private case and hands
 * it over only when the whole file was valid.  Every message starts with
 * "FILE: PATH: " so that a user (and a test) can see where the fault is.
 * The limits and ranges are those of the case format, version 1.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-case-loader"

#include <errno.h>
#include <fcntl.h>
#include <math.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include <glib/gstdio.h>

#include "cw-case-loader.h"
#include "cw-error.h"
#include "cw-json-writer.h"

/* Curve ends are sums of products; a value typed to match one must not be
 * refused for the last bit of rounding. */
#define LENGTH_EPSILON 1e-9

typedef struct
{
  double       min;
  double       max;
  gboolean     min_open;
  gboolean     max_open;
  const char  *unit;
} Range;

#define LENGTH_RANGE    { 0, CW_MAX_LENGTH, TRUE, FALSE, " mm" }
#define DIAMETER_RANGE  { 0, 3, TRUE, FALSE, " mm" }
#define SIZE_RANGE      { 6, 140, FALSE, FALSE, "" }
#define TAPER_RANGE     { 0, 0.12, TRUE, FALSE, "" }

/* An optional double member of a struct, found by its offset. */
typedef struct
{
  const char  *key;
  gsize        offset;
  Range        range;
  gboolean     nullable;  /* null stands for "not given": NAN */
} NumberField;

static gboolean fail (GError     **error,
                      CwError      code,
                      const char  *file,
                      const char  *path,
                      const char  *format,
                      ...) G_GNUC_PRINTF (5, 6);

static gboolean
fail (GError     **error,
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

static char *
member_path (const char *parent,
             const char *key)
{
  if (parent == NULL || *parent == '\0')
    return g_strdup (key);
  return g_strconcat (parent, ".", key, NULL);
}

static char *
index_path (const char *parent,
            guint       index)
{
  return g_strdup_printf ("%s[%u]", parent, index);
}

static char *
format_number (double value)
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
format_mm (double value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  return g_strdup (g_ascii_formatd (buf, sizeof buf, "%.2f", value));
}

static char *
describe_range (const Range *range)
{
  g_autofree char *min = format_number (range->min);
  g_autofree char *max = format_number (range->max);

  return g_strdup_printf ("%s %s and %s %s%s",
                          range->min_open ? ">" : ">=", min,
                          range->max_open ? "<" : "<=", max,
                          range->unit);
}

static gboolean
in_range (const Range *range,
          double       value)
{
  if (range->min_open ? value <= range->min : value < range->min)
    return FALSE;
  return range->max_open ? value < range->max : value <= range->max;
}

static const char *
describe_node (JsonNode *node)
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

static gboolean
holds_number (JsonNode *node)
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

/* Typed readers of one node.  A NULL node is a missing required member. */

static gboolean
node_number (const char   *file,
             const char   *path,
             JsonNode     *node,
             const Range  *range,
             double       *value,
             GError      **error)
{
  g_autofree char *allowed = describe_range (range);
  g_autofree char *got = NULL;

  if (node == NULL)
    return fail (error, CW_ERROR_INVALID, file, path, "is required (a number %s)", allowed);
  if (!holds_number (node))
    return fail (error, CW_ERROR_INVALID, file, path, "must be a number %s (got %s)",
                 allowed, describe_node (node));
  *value = json_node_get_double (node);
  if (isfinite (*value) && in_range (range, *value))
    return TRUE;
  got = format_number (*value);
  return fail (error, CW_ERROR_INVALID, file, path, "must be a number %s (got %s)", allowed, got);
}

static gboolean
node_integer (const char  *file,
              const char  *path,
              JsonNode    *node,
              gint64       min,
              gint64       max,
              gint64      *value,
              GError     **error)
{
  g_autofree char *got = NULL;
  double v = NAN;

  if (node != NULL && holds_number (node))
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
    got = isnan (v) ? g_strdup (describe_node (node)) : format_number (v);
  return fail (error, CW_ERROR_INVALID, file, path,
               "must be an integer from %" G_GINT64_FORMAT " to %" G_GINT64_FORMAT " (got %s)",
               min, max, got);
}

static gboolean
node_string (const char   *file,
             const char   *path,
             JsonNode     *node,
             gboolean      non_empty,
             const char  **value,
             GError      **error)
{
  const char *kind = non_empty ? "a non-empty string" : "a string";

  if (node == NULL)
    return fail (error, CW_ERROR_INVALID, file, path, "is required (%s)", kind);
  if (!holds_string (node))
    return fail (error, CW_ERROR_INVALID, file, path, "must be %s (got %s)", kind, describe_node (node));
  if (non_empty && *json_node_get_string (node) == '\0')
    return fail (error, CW_ERROR_INVALID, file, path, "must be %s (got \"\")", kind);
  *value = json_node_get_string (node);
  return TRUE;
}

static gboolean
node_object (const char   *file,
             const char   *path,
             JsonNode     *node,
             JsonObject  **object,
             GError      **error)
{
  if (node == NULL)
    return fail (error, CW_ERROR_INVALID, file, path, "is required (an object)");
  if (!JSON_NODE_HOLDS_OBJECT (node))
    return fail (error, CW_ERROR_INVALID, file, path, "must be an object (got %s)", describe_node (node));
  *object = json_node_get_object (node);
  return TRUE;
}

/* The length is checked here, before anything is built from the elements. */
static gboolean
node_array (const char   *file,
            const char   *path,
            JsonNode     *node,
            guint         min,
            guint         max,
            const char   *what,
            JsonArray   **array,
            GError      **error)
{
  guint n;

  if (node == NULL)
    return fail (error, CW_ERROR_INVALID, file, path, "is required (an array of %u to %u %s)",
                 min, max, what);
  if (!JSON_NODE_HOLDS_ARRAY (node))
    return fail (error, CW_ERROR_INVALID, file, path, "must be an array of %u to %u %s (got %s)",
                 min, max, what, describe_node (node));
  n = json_array_get_length (json_node_get_array (node));
  if (n < min || n > max)
    return fail (error, CW_ERROR_INVALID, file, path, "must hold %u to %u %s (got %u)",
                 min, max, what, n);
  *array = json_node_get_array (node);
  return TRUE;
}

/* A [a, b] pair of numbers, as in measured diameters and the ceiling table. */
static gboolean
node_pair (const char   *file,
           const char   *path,
           JsonNode     *node,
           const char   *form,
           const Range  *first_range,
           const Range  *second_range,
           double       *first,
           double       *second,
           GError      **error)
{
  g_autofree char *first_path = index_path (path, 0);
  g_autofree char *second_path = index_path (path, 1);
  JsonArray *pair;

  if (!JSON_NODE_HOLDS_ARRAY (node))
    return fail (error, CW_ERROR_INVALID, file, path, "must be a pair %s (got %s)",
                 form, describe_node (node));
  pair = json_node_get_array (node);
  if (json_array_get_length (pair) != 2)
    return fail (error, CW_ERROR_INVALID, file, path, "must be a pair %s (got an array of %u)",
                 form, json_array_get_length (pair));
  return node_number (file, first_path, json_array_get_element (pair, 0), first_range, first, error)
         && node_number (file, second_path, json_array_get_element (pair, 1), second_range, second, error);
}

/* Readers of one member of an object; an optional member that is absent
 * leaves the value as it was. */

static gboolean
read_number (const char   *file,
             JsonObject   *object,
             const char   *parent,
             const char   *key,
             const Range  *range,
             gboolean      required,
             double       *value,
             GError      **error)
{
  JsonNode *node = json_object_get_member (object, key);
  g_autofree char *path = member_path (parent, key);

  if (node == NULL && !required)
    return TRUE;
  return node_number (file, path, node, range, value, error);
}

static gboolean
read_string (const char   *file,
             JsonObject   *object,
             const char   *parent,
             const char   *key,
             gboolean      required,
             gboolean      non_empty,
             const char  **value,
             GError      **error)
{
  JsonNode *node = json_object_get_member (object, key);
  g_autofree char *path = member_path (parent, key);

  if (node == NULL && !required)
    return TRUE;
  return node_string (file, path, node, non_empty, value, error);
}

static gboolean
read_boolean (const char   *file,
              JsonObject   *object,
              const char   *parent,
              const char   *key,
              gboolean     *value,
              GError      **error)
{
  JsonNode *node = json_object_get_member (object, key);
  g_autofree char *path = member_path (parent, key);

  if (node == NULL)
    return TRUE;
  if (!JSON_NODE_HOLDS_VALUE (node) || json_node_get_value_type (node) != G_TYPE_BOOLEAN)
    return fail (error, CW_ERROR_INVALID, file, path, "must be true or false (got %s)",
                 describe_node (node));
  *value = json_node_get_boolean (node);
  return TRUE;
}

static gboolean
read_fields (const char         *file,
             JsonObject         *object,
             const char         *parent,
             const NumberField  *fields,
             guint               n_fields,
             gpointer            base,
             GError            **error)
{
  for (guint i = 0; i < n_fields; i++)
    {
      JsonNode *node = json_object_get_member (object, fields[i].key);
      double *value = G_STRUCT_MEMBER_P (base, fields[i].offset);
      g_autofree char *path = member_path (parent, fields[i].key);

      if (node == NULL)
        continue;
      if (fields[i].nullable && JSON_NODE_HOLDS_NULL (node))
        *value = NAN;
      else if (!node_number (file, path, node, &fields[i].range, value, error))
        return FALSE;
    }
  return TRUE;
}

/* The members this version does not know, kept as compact JSON text so that
 * a save writes them back; NULL when there are none. */
static char *
collect_unknown (JsonObject         *object,
                 const char * const *known)
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

/* Reading the text. */

static char *
read_bounded (int     fd,
              gsize  *length,
              int    *saved_errno)
{
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  guint8 chunk[65536];

  /* Stop one chunk past the limit: the file may have grown since it was
   * measured, and the caller only needs to know that it is too large. */
  while (bytes->len <= CW_MAX_FILE_SIZE)
    {
      gssize n = read (fd, chunk, sizeof chunk);

      if (n < 0 && errno == EINTR)
        continue;
      if (n < 0)
        {
          *saved_errno = errno;
          return NULL;
        }
      if (n == 0)
        break;
      g_byte_array_append (bytes, chunk, (guint) n);
    }
  *length = bytes->len;
  g_byte_array_append (bytes, (const guint8 *) "", 1);
  return (char *) g_byte_array_free (g_steal_pointer (&bytes), FALSE);
}

static gboolean
check_stat (const char         *file,
            const char         *path,
            const struct stat  *st,
            GError            **error)
{
  if (S_ISDIR (st->st_mode))
    return fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: it is a folder, not a file", path);
  if (!S_ISREG (st->st_mode))
    return fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: it is not a regular file", path);
  if (st->st_size > CW_MAX_FILE_SIZE)
    return fail (error, CW_ERROR_TOO_LARGE, file, NULL,
                 "the file has %" G_GINT64_FORMAT " bytes, more than the %d MiB a file may have",
                 (gint64) st->st_size, CW_MAX_FILE_SIZE / (1024 * 1024));
  return TRUE;
}

/* Opened before it is measured, so that what is measured is what is read;
 * non-blocking, so that a pipe put in the file's place cannot hang us. */
static char *
read_file (const char  *file,
           const char  *path,
           gsize       *length,
           GError     **error)
{
  g_autofree char *data = NULL;
  struct stat st;
  int fd, saved_errno = 0;

  fd = g_open (path, O_RDONLY | O_NONBLOCK | O_CLOEXEC, 0);
  if (fd < 0)
    {
      saved_errno = errno;
      fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: %s", path, g_strerror (saved_errno));
      return NULL;
    }
  if (fstat (fd, &st) != 0)
    {
      saved_errno = errno;
      fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: %s", path, g_strerror (saved_errno));
    }
  else if (check_stat (file, path, &st, error))
    {
      data = read_bounded (fd, length, &saved_errno);
      if (data == NULL)
        fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: %s", path, g_strerror (saved_errno));
    }
  g_close (fd, NULL);
  return g_steal_pointer (&data);
}

/* The nesting check reads the text the way json-glib 1.6's scanner does,
 * since a bracket it sees and this check missed would let a hostile file
 * recurse the parser off the stack: "..." strings with backslash escapes,
 * where a \u escape also swallows the character that ends its four digits
 * and a lone surrogate the one or two after it; '...' strings without
 * escapes; and text from one slash to the next is a comment.  Where the
 * scanner would give up, so does the check, and the parser reports it. */
typedef struct
{
  const guchar *p;
  const guchar *end;
} Cursor;

static guchar
next_char (Cursor *c)
{
  return c->p < c->end ? *c->p++ : 0;
}

static guchar
peek_char (Cursor *c)
{
  return c->p < c->end ? *c->p : 0;
}

static gunichar
next_hex4 (Cursor *c)
{
  gunichar value = 0;

  for (int i = 0; i < 4; i++)
    {
      guchar ch = next_char (c);

      if (!g_ascii_isxdigit (ch))
        break;
      value += (gunichar) g_ascii_xdigit_value (ch) << ((3 - i) * 4);
    }
  return value;
}

static gboolean
skip_escape (Cursor *c)
{
  gunichar first, second;

  if (next_char (c) != 'u' || !g_ascii_isxdigit (peek_char (c)))
    return TRUE;
  first = next_hex4 (c);
  if (first < 0xd800 || first > 0xdfff)
    return TRUE;
  if (next_char (c) != '\\' || next_char (c) != 'u')
    return TRUE;
  second = next_hex4 (c);
  return first <= 0xdbff && second >= 0xdc00 && second <= 0xdfff;
}

static gboolean
skip_dq_string (Cursor *c)
{
  for (;;)
    {
      guchar ch = next_char (c);

      if (ch == 0)
        return FALSE;
      if (ch == '"')
        return TRUE;
      if (ch == '\\' && !skip_escape (c))
        return FALSE;
    }
}

static gboolean
skip_past (Cursor *c,
           guchar  delimiter)
{
  const guchar *found = memchr (c->p, delimiter, (gsize) (c->end - c->p));

  if (found == NULL)
    return FALSE;
  c->p = found + 1;
  return TRUE;
}

typedef enum
{
  SCAN_OK,
  SCAN_TOO_DEEP,
  SCAN_SECOND_VALUE,
} ScanResult;

/* The parser takes "{...} {...}" and keeps only the last object, so a
 * second top-level bracket is refused here too.  OFFSET is where. */
static ScanResult
scan_brackets (const char *data,
               gsize       length,
               gsize      *offset)
{
  Cursor c = { (const guchar *) data, (const guchar *) data + length };
  gboolean go_on = TRUE, closed = FALSE;
  guint depth = 0;

  while (go_on && c.p < c.end)
    {
      guchar ch = next_char (&c);

      *offset = (gsize) (c.p - 1 - (const guchar *) data);
      if ((ch == '[' || ch == '{') && depth == 0 && closed)
        return SCAN_SECOND_VALUE;
      if (ch == '[' || ch == '{')
        {
          if (++depth > CW_MAX_NESTING)
            return SCAN_TOO_DEEP;
        }
      else if (ch == ']' || ch == '}')
        {
          depth = depth > 0 ? depth - 1 : 0;
          closed = closed || depth == 0;
        }
      else if (ch == '"')
        go_on = skip_dq_string (&c);
      else if (ch == '\'' || ch == '/')
        go_on = skip_past (&c, ch);
    }
  return SCAN_OK;
}

static gboolean
check_text (const char  *file,
            const char  *data,
            gsize        length,
            GError     **error)
{
  const char *end = NULL;
  gsize offset = 0;

  if (length > CW_MAX_FILE_SIZE)
    return fail (error, CW_ERROR_TOO_LARGE, file, NULL,
                 "the file has %" G_GSIZE_FORMAT " bytes, more than the %d MiB a file may have",
                 length, CW_MAX_FILE_SIZE / (1024 * 1024));
  if (length == 0)
    return fail (error, CW_ERROR_SYNTAX, file, NULL, "the file is empty");
  if (!g_utf8_validate_len (data, length, &end))
    return fail (error, CW_ERROR_SYNTAX, file, NULL,
                 "the file is not UTF-8 text (invalid byte at offset %" G_GSIZE_FORMAT ")",
                 (gsize) (end - data));
  switch (scan_brackets (data, length, &offset))
    {
    case SCAN_TOO_DEEP:
      return fail (error, CW_ERROR_TOO_LARGE, file, NULL,
                   "arrays and objects are nested deeper than %d levels (at byte offset %" G_GSIZE_FORMAT ")",
                   CW_MAX_NESTING, offset);
    case SCAN_SECOND_VALUE:
      return fail (error, CW_ERROR_SYNTAX, file, NULL,
                   "the file holds more than one JSON value (the second starts at byte offset %" G_GSIZE_FORMAT ")",
                   offset);
    case SCAN_OK:
    default:
      return TRUE;
    }
}

static gboolean
syntax_error (const char  *file,
              GError      *parse_error,
              GError     **error)
{
  const char *message = parse_error->message;

  if (g_str_has_prefix (message, "<data>:"))
    message += strlen ("<data>:");
  return fail (error, CW_ERROR_SYNTAX, file, NULL, "%s", message);
}

static JsonParser *
parse_text (const char  *file,
            const char  *data,
            gsize        length,
            GError     **error)
{
  g_autoptr(JsonParser) parser = NULL;
  g_autoptr(GError) parse_error = NULL;

  if (!check_text (file, data, length, error))
    return NULL;
  /* Editors on some systems start UTF-8 files with a byte-order mark. */
  if (length >= 3 && memcmp (data, "\xEF\xBB\xBF", 3) == 0)
    {
      data += 3;
      length -= 3;
    }
  parser = json_parser_new ();
  if (!json_parser_load_from_data (parser, data, (gssize) length, &parse_error))
    {
      syntax_error (file, parse_error, error);
      return NULL;
    }
  if (json_parser_get_root (parser) == NULL)
    {
      fail (error, CW_ERROR_SYNTAX, file, NULL, "the file holds no JSON value");
      return NULL;
    }
  if (json_parser_has_assignment (parser, NULL))
    {
      fail (error, CW_ERROR_SYNTAX, file, NULL, "the file is a script assignment, not a JSON document");
      return NULL;
    }
  return g_steal_pointer (&parser);
}

static gboolean
check_format (const char  *file,
              JsonObject  *object,
              const char  *format,
              GError     **error)
{
  const char *value = NULL;

  if (!read_string (file, object, NULL, "format", TRUE, FALSE, &value, error))
    return FALSE;
  if (strcmp (value, format) == 0)
    return TRUE;
  return fail (error, CW_ERROR_INVALID, file, "format", "must be \"%s\" (got \"%s\")", format, value);
}

static gboolean
check_version (const char  *file,
               JsonObject  *object,
               GError     **error)
{
  JsonNode *node = json_object_get_member (object, "version");
  double version = node != NULL && holds_number (node) ? json_node_get_double (node) : NAN;
  g_autofree char *got = NULL;

  if (node == NULL)
    return fail (error, CW_ERROR_INVALID, file, "version", "is required (the integer %d)", CW_CASE_VERSION);
  got = isnan (version) ? g_strdup (describe_node (node)) : format_number (version);
  if (!isfinite (version) || version != floor (version) || version < 1)
    return fail (error, CW_ERROR_INVALID, file, "version",
                 "must be an integer >= 1 (got %s)", got);
  if (version > CW_CASE_VERSION)
    return fail (error, CW_ERROR_NEWER_VERSION, file, "version",
                 "was written by a newer Canalwright (file version %s, this program reads up to %d)",
                 got, CW_CASE_VERSION);
  return TRUE;
}

/* The rule set. */

#define RULE(key, lo, hi, lo_open, unit) \
  { #key, G_STRUCT_OFFSET (CwRules, key), { lo, hi, lo_open, FALSE, unit }, FALSE }

static const NumberField rule_fields[] = {
  RULE (contact_tolerance, 0, 0.5, FALSE, " mm"),
  RULE (advance_rate, 0, 10, TRUE, " mm/s"),
  RULE (peck_increment, 0, 10, TRUE, " mm"),
  RULE (changeover, 0, 600, FALSE, " s"),
  RULE (at_length_tolerance, 0, 5, FALSE, " mm"),
  RULE (curve_engagement_max, 0, CW_MAX_LENGTH, TRUE, " mm"),
  RULE (small_file_tip_max, 6, 140, FALSE, ""),
  RULE (small_file_taper_max, 0, 0.12, TRUE, ""),
  RULE (glide_path_tip_max, 6, 140, FALSE, ""),
};

#define ALLOY_RULE(key, hi, unit, nullable) \
  { #key, G_STRUCT_OFFSET (CwAlloyRules, key), { 0, hi, TRUE, FALSE, unit }, nullable }

static const NumberField alloy_fields[] = {
  ALLOY_RULE (strain_limit, 1, "", TRUE),
  ALLOY_RULE (strain_life_a, 1e12, "", TRUE),
  ALLOY_RULE (strain_life_k, 20, "", FALSE),
  ALLOY_RULE (shear_strength, 5000, " MPa", FALSE),
  ALLOY_RULE (section_factor, 1, "", FALSE),
};

static gboolean
read_ceilings (const char  *file,
               JsonObject  *object,
               const char  *parent,
               CwRules     *rules,
               GError     **error)
{
  static const Range taper_range = TAPER_RANGE;
  static const Range diameter_range = DIAMETER_RANGE;
  JsonNode *node = json_object_get_member (object, "diameter_ceilings");
  g_autofree char *path = member_path (parent, "diameter_ceilings");
  JsonArray *rows = NULL;
  guint n;

  if (node == NULL)
    return TRUE;
  if (!node_array (file, path, node, 1, CW_MAX_CEILING_ROWS, "[taper, diameter] rows", &rows, error))
    return FALSE;
  n = json_array_get_length (rows);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *row = index_path (path, i);
      double *taper = &rules->ceiling_taper[i];

      if (!node_pair (file, row, json_array_get_element (rows, i), "[taper, diameter]",
                      &taper_range, &diameter_range, taper, &rules->ceiling_diameter[i], error))
        return FALSE;
      if (i > 0 && *taper <= taper[-1])
        {
          g_autofree char *taper_path = index_path (row, 0);
          g_autofree char *before = format_number (taper[-1]);
          g_autofree char *got = format_number (*taper);

          return fail (error, CW_ERROR_INVALID, file, taper_path,
                       "must be greater than the taper of the row before, %s (got %s)", before, got);
        }
    }
  rules->n_ceilings = n;
  return TRUE;
}

static char *
alloy_choices (void)
{
  GString *out = g_string_new (NULL);

  for (guint i = 0; i < CW_N_ALLOYS; i++)
    g_string_append_printf (out, "%s\"%s\"", i > 0 ? ", " : "", cw_alloy_to_string ((CwAlloy) i));
  return g_string_free (out, FALSE);
}

static char *
motion_choices (void)
{
  GString *out = g_string_new (NULL);

  for (guint i = 0; i < CW_N_MOTIONS; i++)
    g_string_append_printf (out, "%s\"%s\"", i > 0 ? ", " : "", cw_motion_to_string ((CwMotion) i));
  return g_string_free (out, FALSE);
}

static gboolean
read_alloy_rules (const char  *file,
                  JsonObject  *alloys,
                  const char  *parent,
                  const char  *name,
                  CwRules     *rules,
                  GError     **error)
{
  g_autofree char *path = member_path (parent, name);
  JsonObject *object = NULL;
  CwAlloy alloy;

  if (!cw_alloy_from_string (name, &alloy))
    {
      g_autofree char *choices = alloy_choices ();

      return fail (error, CW_ERROR_INVALID, file, path, "is not a known alloy (allowed: %s)", choices);
    }
  return node_object (file, path, json_object_get_member (alloys, name), &object, error)
         && read_fields (file, object, path, alloy_fields, G_N_ELEMENTS (alloy_fields),
                         &rules->alloys[alloy], error);
}

static gboolean
read_alloys (const char  *file,
             JsonObject  *object,
             const char  *parent,
             CwRules     *rules,
             GError     **error)
{
  JsonNode *node = json_object_get_member (object, "alloys");
  g_autofree char *path = member_path (parent, "alloys");
  g_autoptr(GList) names = NULL;
  JsonObject *alloys = NULL;

  if (node == NULL)
    return TRUE;
  if (!node_object (file, path, node, &alloys, error))
    return FALSE;
  names = json_object_get_members (alloys);
  for (GList *l = names; l != NULL; l = l->next)
    if (!read_alloy_rules (file, alloys, path, l->data, rules, error))
      return FALSE;
  return TRUE;
}

gboolean
cw_rules_apply_json (CwRules     *rules,
                     JsonObject  *object,
                     const char  *display_name,
                     const char  *path_prefix,
                     GError     **error)
{
  const char *file = display_name != NULL ? display_name : "(rules)";
  CwRules result;

  g_return_val_if_fail (rules != NULL, FALSE);
  g_return_val_if_fail (object != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  result = *rules;
  if (!read_fields (file, object, path_prefix, rule_fields, G_N_ELEMENTS (rule_fields), &result, error)
      || !read_ceilings (file, object, path_prefix, &result, error)
      || !read_boolean (file, object, path_prefix, "require_taper_change",
                        &result.require_taper_change, error)
      || !read_alloys (file, object, path_prefix, &result, error))
    return FALSE;
  *rules = result;
  return TRUE;
}

/* Tooth, targets, rules and texts of a case. */

static gboolean
is_fdi_code (const char *code)
{
  int quadrant, tooth;

  if (strlen (code) != 2 || !g_ascii_isdigit (code[0]) || !g_ascii_isdigit (code[1]))
    return FALSE;
  quadrant = code[0] - '0';
  tooth = code[1] - '0';
  if (quadrant < 1 || quadrant > 8 || tooth < 1)
    return FALSE;
  /* Quadrants 5 to 8 are the primary teeth: five a quadrant. */
  return tooth <= (quadrant >= 5 ? 5 : 8);
}

static gboolean
is_universal_code (const char *code)
{
  int number;

  if (code[0] >= 'A' && code[0] <= 'T' && code[1] == '\0')
    return TRUE;
  if (code[0] < '1' || code[0] > '9')
    return FALSE;
  number = code[0] - '0';
  if (code[1] == '\0')
    return TRUE;
  if (!g_ascii_isdigit (code[1]) || code[2] != '\0')
    return FALSE;
  number = number * 10 + (code[1] - '0');
  return number <= 32;
}

static gboolean
read_notation (const char  *file,
               JsonObject  *tooth,
               CwNotation  *notation,
               GError     **error)
{
  const char *name = "FDI";

  if (!read_string (file, tooth, "tooth", "notation", FALSE, FALSE, &name, error))
    return FALSE;
  if (strcmp (name, "FDI") == 0)
    *notation = CW_NOTATION_FDI;
  else if (strcmp (name, "universal") == 0)
    *notation = CW_NOTATION_UNIVERSAL;
  else
    return fail (error, CW_ERROR_INVALID, file, "tooth.notation",
                 "must be \"FDI\" or \"universal\" (got \"%s\")", name);
  return TRUE;
}

static gboolean
read_tooth (const char  *file,
            JsonObject  *object,
            CwCase      *kase,
            GError     **error)
{
  static const char * const keys[] = { "notation", "code", NULL };
  JsonNode *node = json_object_get_member (object, "tooth");
  JsonObject *tooth = NULL;
  CwNotation notation = CW_NOTATION_FDI;
  const char *code = NULL;

  if (node == NULL)
    return TRUE;
  if (!node_object (file, "tooth", node, &tooth, error)
      || !read_notation (file, tooth, &notation, error)
      || !read_string (file, tooth, "tooth", "code", TRUE, TRUE, &code, error))
    return FALSE;
  if (notation == CW_NOTATION_FDI && !is_fdi_code (code))
    return fail (error, CW_ERROR_INVALID, file, "tooth.code",
                 "must be an FDI tooth number: quadrant 1-8 then tooth 1-8, "
                 "or 1-5 in the primary quadrants 5-8 (got \"%s\")", code);
  if (notation == CW_NOTATION_UNIVERSAL && !is_universal_code (code))
    return fail (error, CW_ERROR_INVALID, file, "tooth.code",
                 "must be a universal tooth number, 1 to 32 or a letter A to T (got \"%s\")", code);
  kase->notation = notation;
  kase->tooth_code = g_strdup (code);
  kase->tooth_extra_json = collect_unknown (tooth, keys);
  return TRUE;
}

static gboolean
read_targets (const char  *file,
              JsonObject  *object,
              CwCase      *kase,
              GError     **error)
{
  static const char * const keys[] = { "apical_size", "apical_taper", NULL };
  static const NumberField fields[] = {
    { "apical_size", G_STRUCT_OFFSET (CwCase, target_apical_size), SIZE_RANGE, FALSE },
    { "apical_taper", G_STRUCT_OFFSET (CwCase, target_apical_taper), TAPER_RANGE, FALSE },
  };
  JsonNode *node = json_object_get_member (object, "targets");
  JsonObject *targets = NULL;

  if (node == NULL)
    return TRUE;
  if (!node_object (file, "targets", node, &targets, error)
      || !read_fields (file, targets, "targets", fields, G_N_ELEMENTS (fields), kase, error))
    return FALSE;
  kase->targets_extra_json = collect_unknown (targets, keys);
  return TRUE;
}

static gboolean
read_case_rules (const char  *file,
                 JsonObject  *object,
                 CwCase      *kase,
                 GError     **error)
{
  JsonNode *node = json_object_get_member (object, "rules");
  JsonObject *rules = NULL;

  if (node == NULL)
    return TRUE;
  if (!node_object (file, "rules", node, &rules, error)
      || !cw_rules_apply_json (&kase->rules, rules, file, "rules", error))
    return FALSE;
  kase->rules_json = cw_json_write (node, FALSE);
  return TRUE;
}

static gboolean
read_texts (const char  *file,
            JsonObject  *object,
            CwCase      *kase,
            GError     **error)
{
  const char *title = "";
  const char *notes = NULL;

  if (!read_string (file, object, NULL, "title", FALSE, FALSE, &title, error)
      || !read_string (file, object, NULL, "notes", FALSE, FALSE, &notes, error))
    return FALSE;
  g_free (kase->title);
  kase->title = g_strdup (title);
  kase->notes = g_strdup (notes);
  return TRUE;
}

/* Instruments. */

static int
find_instrument_index (const CwCase *kase,
                       const char   *id)
{
  for (guint i = 0; i < kase->instruments->len; i++)
    {
      const CwInstrument *instrument = g_ptr_array_index (kase->instruments, i);

      if (strcmp (instrument->id, id) == 0)
        return (int) i;
    }
  return -1;
}

static gboolean
read_segments (const char    *file,
               JsonObject    *object,
               const char    *parent,
               CwInstrument  *instrument,
               GError       **error)
{
  static const Range to_range = LENGTH_RANGE;
  static const Range taper_range = TAPER_RANGE;
  g_autofree char *path = member_path (parent, "taper_segments");
  CwTaperSegment segments[CW_MAX_SEGMENTS];
  JsonArray *array = NULL;
  guint n;

  if (!node_array (file, path, json_object_get_member (object, "taper_segments"),
                   1, CW_MAX_SEGMENTS, "segments", &array, error))
    return FALSE;
  n = json_array_get_length (array);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *item = index_path (path, i);
      JsonObject *segment = NULL;
      CwTaperSegment *s = &segments[i];

      if (!node_object (file, item, json_array_get_element (array, i), &segment, error)
          || !read_number (file, segment, item, "to", &to_range, TRUE, &s->to, error))
        return FALSE;
      if (i > 0 && s->to <= s[-1].to)
        {
          g_autofree char *to_path = member_path (item, "to");
          g_autofree char *before = format_number (s[-1].to);
          g_autofree char *got = format_number (s->to);

          return fail (error, CW_ERROR_INVALID, file, to_path,
                       "must be greater than the end of the segment before (%s mm) and <= 40 mm (got %s)",
                       before, got);
        }
      if (!read_number (file, segment, item, "taper", &taper_range, TRUE, &s->taper, error))
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
  static const Range taper_range = TAPER_RANGE;
  gboolean has_taper = json_object_has_member (object, "taper");
  gboolean has_segments = json_object_has_member (object, "taper_segments");
  g_autofree char *path = member_path (parent, "taper");

  if (has_taper && has_segments)
    return fail (error, CW_ERROR_INVALID, file, path, "give either taper or taper_segments, not both");
  if (!has_taper && !has_segments)
    return fail (error, CW_ERROR_INVALID, file, path,
                 "is required (a number > 0 and <= 0.12), or taper_segments instead");
  if (has_segments)
    return read_segments (file, object, parent, instrument, error);
  return read_number (file, object, parent, "taper", &taper_range, TRUE, &instrument->taper, error);
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
  g_autofree char *path = member_path (parent, key);

  if (!json_object_has_member (object, key))
    return fail (error, CW_ERROR_INVALID, file, path, "is required (one of %s)", choices);
  return read_string (file, object, parent, key, TRUE, FALSE, value, error);
}

static gboolean
read_kind (const char    *file,
           JsonObject    *object,
           const char    *parent,
           CwInstrument  *instrument,
           GError       **error)
{
  g_autofree char *alloys = alloy_choices ();
  g_autofree char *motions = motion_choices ();
  g_autofree char *alloy_path = member_path (parent, "alloy");
  g_autofree char *motion_path = member_path (parent, "motion");
  const char *alloy = NULL, *motion = NULL;

  if (!read_name (file, object, parent, "alloy", alloys, &alloy, error))
    return FALSE;
  if (!cw_alloy_from_string (alloy, &instrument->alloy))
    return fail (error, CW_ERROR_INVALID, file, alloy_path, "must be one of %s (got \"%s\")", alloys, alloy);
  if (!read_name (file, object, parent, "motion", motions, &motion, error))
    return FALSE;
  if (!cw_motion_from_string (motion, &instrument->motion))
    return fail (error, CW_ERROR_INVALID, file, motion_path, "must be one of %s (got \"%s\")", motions, motion);
  return TRUE;
}

static gboolean
check_lengths (const char    *file,
               const char    *parent,
               CwInstrument  *instrument,
               GError       **error)
{
  g_autofree char *path = member_path (parent, "flute_length");
  g_autofree char *length = NULL;
  g_autofree char *got = NULL;

  if (instrument->flute_length <= instrument->length)
    return TRUE;
  length = format_number (instrument->length);
  got = format_number (instrument->flute_length);
  return fail (error, CW_ERROR_INVALID, file, path,
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
  Range flute_range = { instrument->tip / 100.0, 3, TRUE, FALSE, " mm" };
  JsonNode *uses = json_object_get_member (object, "uses_allowed");
  g_autofree char *uses_path = member_path (parent, "uses_allowed");
  gint64 n_uses = 0;

  if (!read_number (file, object, parent, "max_flute_diameter", &flute_range, FALSE,
                    &instrument->max_flute_diameter, error))
    return FALSE;
  if (uses == NULL)
    return TRUE;
  if (!node_integer (file, uses_path, uses, 1, 1000, &n_uses, error))
    return FALSE;
  instrument->uses_allowed = (int) n_uses;
  return TRUE;
}

static CwInstrument *
read_instrument (const char  *file,
                 const char  *path,
                 JsonObject  *object,
                 GError     **error)
{
  static const char * const keys[] = {
    "id", "label", "tip", "taper", "taper_segments", "flute_length", "length",
    "max_flute_diameter", "alloy", "motion", "rpm", "torque_limit", "uses_allowed", NULL
  };
  static const NumberField fields[] = {
    { "flute_length", G_STRUCT_OFFSET (CwInstrument, flute_length), LENGTH_RANGE, FALSE },
    { "length", G_STRUCT_OFFSET (CwInstrument, length), LENGTH_RANGE, FALSE },
    { "rpm", G_STRUCT_OFFSET (CwInstrument, rpm), { 0, 5000, TRUE, FALSE, " rpm" }, FALSE },
    { "torque_limit", G_STRUCT_OFFSET (CwInstrument, torque_limit), { 0, 20, TRUE, FALSE, " N·cm" }, FALSE },
  };
  static const Range tip_range = SIZE_RANGE;
  g_autoptr(CwInstrument) instrument = NULL;
  const char *id = NULL, *label = NULL;
  double tip = 0;

  if (!read_string (file, object, path, "id", TRUE, TRUE, &id, error)
      || !read_string (file, object, path, "label", FALSE, FALSE, &label, error)
      || !read_number (file, object, path, "tip", &tip_range, TRUE, &tip, error))
    return NULL;
  instrument = cw_instrument_new (id, tip, NAN);
  instrument->label = g_strdup (label != NULL ? label : id);
  instrument->flute_length = CW_DEFAULT_FLUTE_LENGTH;
  instrument->length = CW_DEFAULT_INSTRUMENT_LENGTH;
  if (!read_taper (file, object, path, instrument, error)
      || !read_fields (file, object, path, fields, G_N_ELEMENTS (fields), instrument, error)
      || !check_lengths (file, path, instrument, error)
      || !read_extras (file, object, path, instrument, error)
      || !read_kind (file, object, path, instrument, error))
    return NULL;
  instrument->extra_json = collect_unknown (object, keys);
  return g_steal_pointer (&instrument);
}

static gboolean
read_instruments (const char  *file,
                  JsonObject  *object,
                  CwCase      *kase,
                  GError     **error)
{
  JsonArray *array = NULL;

  if (!node_array (file, "instruments", json_object_get_member (object, "instruments"),
                   1, CW_MAX_INSTRUMENTS, "instruments", &array, error))
    return FALSE;
  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_autofree char *path = index_path ("instruments", i);
      g_autofree char *id_path = member_path (path, "id");
      g_autoptr(CwInstrument) instrument = NULL;
      JsonObject *item = NULL;
      int earlier;

      if (!node_object (file, path, json_array_get_element (array, i), &item, error))
        return FALSE;
      instrument = read_instrument (file, path, item, error);
      if (instrument == NULL)
        return FALSE;
      earlier = find_instrument_index (kase, instrument->id);
      if (earlier >= 0)
        return fail (error, CW_ERROR_INVALID, file, id_path,
                     "must be unique, but instruments[%d] has the id \"%s\" too", earlier, instrument->id);
      cw_case_add_instrument (kase, g_steal_pointer (&instrument));
    }
  return TRUE;
}

/* Canals: curves, anatomy and sequence. */

static double
arc_end (double onset,
         double angle,
         double radius)
{
  return onset + radius * angle * G_PI / 180.0;
}

static gboolean
check_onset (const char     *file,
             const char     *path,
             const CwCanal  *canal,
             double          onset,
             GError        **error)
{
  const CwCurve *first = &canal->curves[0];
  g_autofree char *onset_path = member_path (path, "onset");
  g_autofree char *wl = format_number (canal->working_length);
  g_autofree char *got = format_number (onset);
  g_autofree char *start = NULL;

  if (canal->n_curves == 0)
    {
      if (onset > canal->orifice_depth && onset < canal->working_length)
        return TRUE;
      start = format_number (canal->orifice_depth);
      return fail (error, CW_ERROR_INVALID, file, onset_path,
                   "must be a number > %s mm (the orifice depth) and < %s mm (the working length) (got %s)",
                   start, wl, got);
    }
  start = format_mm (arc_end (first->onset, first->angle, first->radius));
  if (onset >= arc_end (first->onset, first->angle, first->radius) - LENGTH_EPSILON
      && onset < canal->working_length)
    return TRUE;
  return fail (error, CW_ERROR_INVALID, file, onset_path,
               "must be a number >= %s mm (where the first curve ends) and < %s mm "
               "(the working length) (got %s)", start, wl, got);
}

static gboolean
read_arc (const char  *file,
          const char  *path,
          JsonObject  *object,
          CwCanal     *canal,
          double       onset,
          GError     **error)
{
  static const Range angle_range = { 0, 180, TRUE, FALSE, " degrees" };
  static const Range radius_range = LENGTH_RANGE;
  g_autofree char *radius_path = member_path (path, "radius");
  double angle = 0, radius = 0, end;

  if (!read_number (file, object, path, "angle", &angle_range, TRUE, &angle, error)
      || !read_number (file, object, path, "radius", &radius_range, TRUE, &radius, error))
    return FALSE;
  end = arc_end (onset, angle, radius);
  if (end > canal->working_length + LENGTH_EPSILON)
    {
      g_autofree char *ends = format_mm (end);
      g_autofree char *wl = format_number (canal->working_length);
      g_autofree char *most = format_mm (floor ((canal->working_length - onset) * 180.0 / (G_PI * angle) * 100) / 100);
      g_autofree char *got = format_number (radius);

      return fail (error, CW_ERROR_INVALID, file, radius_path,
                   "the curve ends at %s mm, past the working length %s mm "
                   "(allowed for this onset and angle: <= %s mm; got %s)", ends, wl, most, got);
    }
  cw_canal_add_curve (canal, onset, angle, radius);
  return TRUE;
}

static gboolean
read_schneider (const char  *file,
                const char  *path,
                JsonObject  *object,
                CwCanal     *canal,
                double       onset,
                gboolean     last,
                GError     **error)
{
  static const Range schneider_range = { 0, 90, TRUE, TRUE, " degrees" };
  g_autofree char *schneider_path = member_path (path, "schneider_angle");
  double angle = 0;

  if (!last)
    return fail (error, CW_ERROR_INVALID, file, schneider_path,
                 "only the last curve may be given by its Schneider angle, "
                 "since such a curve runs to the working length");
  if (!read_number (file, object, path, "schneider_angle", &schneider_range, TRUE, &angle, error))
    return FALSE;
  cw_canal_add_schneider (canal, onset, angle);
  return TRUE;
}

static gboolean
read_curve (const char  *file,
            const char  *path,
            JsonObject  *object,
            CwCanal     *canal,
            gboolean     last,
            GError     **error)
{
  static const char * const keys[] = { "onset", "angle", "radius", "schneider_angle", NULL };
  static const Range onset_range = LENGTH_RANGE;
  gboolean by_schneider = json_object_has_member (object, "schneider_angle");
  gboolean by_arc = json_object_has_member (object, "angle") || json_object_has_member (object, "radius");
  g_autofree char *schneider_path = member_path (path, "schneider_angle");
  double onset = 0;

  if (by_schneider && by_arc)
    return fail (error, CW_ERROR_INVALID, file, schneider_path,
                 "give either angle and radius or schneider_angle, not both");
  if (!read_number (file, object, path, "onset", &onset_range, TRUE, &onset, error)
      || !check_onset (file, path, canal, onset, error))
    return FALSE;
  if (by_schneider ? !read_schneider (file, path, object, canal, onset, last, error)
                   : !read_arc (file, path, object, canal, onset, error))
    return FALSE;
  canal->curves[canal->n_curves - 1].extra_json = collect_unknown (object, keys);
  return TRUE;
}

static gboolean
read_curves (const char  *file,
             JsonObject  *object,
             const char  *parent,
             CwCanal     *canal,
             GError     **error)
{
  JsonNode *node = json_object_get_member (object, "curves");
  g_autofree char *path = member_path (parent, "curves");
  JsonArray *array = NULL;
  guint n;

  if (node == NULL)
    return TRUE;
  if (!node_array (file, path, node, 0, CW_MAX_CURVES, "curves", &array, error))
    return FALSE;
  n = json_array_get_length (array);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *item = index_path (path, i);
      JsonObject *curve = NULL;

      if (!node_object (file, item, json_array_get_element (array, i), &curve, error)
          || !read_curve (file, item, curve, canal, i + 1 == n, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
read_diameter_points (const char  *file,
                      JsonObject  *object,
                      const char  *parent,
                      CwCanal     *canal,
                      GError     **error)
{
  static const Range s_range = LENGTH_RANGE;
  static const Range d_range = DIAMETER_RANGE;
  g_autofree char *path = member_path (parent, "diameters");
  g_autoptr(GArray) points = NULL;
  JsonArray *array = NULL;
  guint n;

  if (!node_array (file, path, json_object_get_member (object, "diameters"),
                   2, CW_MAX_DIAMETER_POINTS, "[s, diameter] points", &array, error))
    return FALSE;
  n = json_array_get_length (array);
  points = g_array_sized_new (FALSE, FALSE, sizeof (CwPoint), n);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *item = index_path (path, i);
      CwPoint p;

      if (!node_pair (file, item, json_array_get_element (array, i), "[s, diameter]",
                      &s_range, &d_range, &p.s, &p.v, error))
        return FALSE;
      if (i > 0 && p.s <= g_array_index (points, CwPoint, i - 1).s)
        {
          g_autofree char *s_path = index_path (item, 0);
          g_autofree char *before = format_number (g_array_index (points, CwPoint, i - 1).s);
          g_autofree char *got = format_number (p.s);

          return fail (error, CW_ERROR_INVALID, file, s_path,
                       "must be greater than the s of the point before, %s mm, and <= 40 mm (got %s)",
                       before, got);
        }
      g_array_append_val (points, p);
    }
  canal->diameters = g_steal_pointer (&points);
  return TRUE;
}

static gboolean
read_anatomy (const char  *file,
              JsonObject  *object,
              const char  *parent,
              CwCanal     *canal,
              GError     **error)
{
  static const char * const keys[] = { "orifice_diameter", "apical_diameter", "diameters", NULL };
  static const Range d_range = DIAMETER_RANGE;
  g_autofree char *path = member_path (parent, "anatomy");
  g_autofree char *points_path = member_path (path, "diameters");
  JsonObject *anatomy = NULL;
  gboolean by_points, by_ends;

  if (!node_object (file, path, json_object_get_member (object, "anatomy"), &anatomy, error))
    return FALSE;
  by_points = json_object_has_member (anatomy, "diameters");
  by_ends = json_object_has_member (anatomy, "orifice_diameter")
            || json_object_has_member (anatomy, "apical_diameter");
  if (by_points && by_ends)
    return fail (error, CW_ERROR_INVALID, file, points_path,
                 "give either orifice_diameter and apical_diameter or diameters, not both");
  if (by_points ? !read_diameter_points (file, anatomy, path, canal, error)
                : (!read_number (file, anatomy, path, "orifice_diameter", &d_range, TRUE,
                                 &canal->orifice_diameter, error)
                   || !read_number (file, anatomy, path, "apical_diameter", &d_range, TRUE,
                                    &canal->apical_diameter, error)))
    return FALSE;
  canal->anatomy_extra_json = collect_unknown (anatomy, keys);
  return TRUE;
}

static gboolean
read_step (const char    *file,
           const char    *path,
           JsonObject    *object,
           const CwCase  *kase,
           CwCanal       *canal,
           GError       **error)
{
  static const char * const keys[] = { "instrument", "depth", "note", NULL };
  static const Range depth_range = LENGTH_RANGE;
  g_autofree char *id_path = member_path (path, "instrument");
  const char *id = NULL, *note = NULL;
  double depth = 0;
  CwStep *step;

  if (!read_string (file, object, path, "instrument", TRUE, TRUE, &id, error))
    return FALSE;
  if (find_instrument_index (kase, id) < 0)
    return fail (error, CW_ERROR_INVALID, file, id_path,
                 "must be the id of one of the case's instruments (got \"%s\")", id);
  /* A depth past the working length loads: the evaluation reports it. */
  if (!read_number (file, object, path, "depth", &depth_range, TRUE, &depth, error)
      || !read_string (file, object, path, "note", FALSE, FALSE, &note, error))
    return FALSE;
  cw_canal_add_step (canal, id, depth);
  step = &g_array_index (canal->sequence, CwStep, canal->sequence->len - 1);
  step->note = g_strdup (note);
  step->extra_json = collect_unknown (object, keys);
  return TRUE;
}

static gboolean
read_sequence (const char    *file,
               JsonObject    *object,
               const char    *parent,
               const CwCase  *kase,
               CwCanal       *canal,
               GError       **error)
{
  JsonNode *node = json_object_get_member (object, "sequence");
  g_autofree char *path = member_path (parent, "sequence");
  JsonArray *array = NULL;

  if (node == NULL)
    return TRUE;
  if (!node_array (file, path, node, 0, CW_MAX_STEPS, "steps", &array, error))
    return FALSE;
  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_autofree char *item = index_path (path, i);
      JsonObject *step = NULL;

      if (!node_object (file, item, json_array_get_element (array, i), &step, error)
          || !read_step (file, item, step, kase, canal, error))
        return FALSE;
    }
  return TRUE;
}

static CwCanal *
read_canal (const char    *file,
            const char    *path,
            JsonObject    *object,
            const CwCase  *kase,
            GError       **error)
{
  static const char * const keys[] = {
    "name", "reference", "working_length", "orifice_depth", "curves", "anatomy", "sequence", NULL
  };
  static const Range length_range = LENGTH_RANGE;
  g_autofree char *orifice_path = member_path (path, "orifice_depth");
  g_autoptr(CwCanal) canal = NULL;
  const char *name = NULL, *reference = NULL;
  double wl = 0, orifice = 0;

  if (!read_string (file, object, path, "name", TRUE, TRUE, &name, error)
      || !read_string (file, object, path, "reference", FALSE, FALSE, &reference, error)
      || !read_number (file, object, path, "working_length", &length_range, TRUE, &wl, error)
      || !read_number (file, object, path, "orifice_depth", &length_range, TRUE, &orifice, error))
    return NULL;
  if (orifice >= wl)
    {
      g_autofree char *wl_text = format_number (wl);
      g_autofree char *got = format_number (orifice);

      fail (error, CW_ERROR_INVALID, file, orifice_path,
            "must be a number > 0 and < %s mm (the working length) (got %s)", wl_text, got);
      return NULL;
    }
  canal = cw_canal_new (name, wl, orifice);
  canal->reference = g_strdup (reference);
  if (!read_curves (file, object, path, canal, error)
      || !read_anatomy (file, object, path, canal, error)
      || !read_sequence (file, object, path, kase, canal, error))
    return NULL;
  canal->extra_json = collect_unknown (object, keys);
  return g_steal_pointer (&canal);
}

static gboolean
read_canals (const char  *file,
             JsonObject  *object,
             CwCase      *kase,
             GError     **error)
{
  JsonArray *array = NULL;

  if (!node_array (file, "canals", json_object_get_member (object, "canals"),
                   1, CW_MAX_CANALS, "canals", &array, error))
    return FALSE;
  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_autofree char *path = index_path ("canals", i);
      g_autofree char *name_path = member_path (path, "name");
      g_autoptr(CwCanal) canal = NULL;
      JsonObject *item = NULL;

      if (!node_object (file, path, json_array_get_element (array, i), &item, error))
        return FALSE;
      canal = read_canal (file, path, item, kase, error);
      if (canal == NULL)
        return FALSE;
      for (guint j = 0; j < kase->canals->len; j++)
        if (strcmp (((CwCanal *) g_ptr_array_index (kase->canals, j))->name, canal->name) == 0)
          return fail (error, CW_ERROR_INVALID, file, name_path,
                       "must be unique, but canals[%u] has the name \"%s\" too", j, canal->name);
      cw_case_add_canal (kase, g_steal_pointer (&canal));
    }
  return TRUE;
}

static CwCase *
read_document (const char  *file,
               JsonNode    *root,
               GError     **error)
{
  static const char * const keys[] = {
    "format", "version", "title", "tooth", "notes", "targets", "rules", "instruments", "canals", NULL
  };
  g_autoptr(CwCase) kase = cw_case_new ();
  JsonObject *object = NULL;

  /* Format and version first: a newer file is refused as such, not for
   * whatever else it may have changed. */
  if (!node_object (file, "document", root, &object, error)
      || !check_format (file, object, "canalwright-case", error)
      || !check_version (file, object, error)
      || !read_texts (file, object, kase, error)
      || !read_tooth (file, object, kase, error)
      || !read_targets (file, object, kase, error)
      || !read_case_rules (file, object, kase, error)
      || !read_instruments (file, object, kase, error)
      || !read_canals (file, object, kase, error))
    return NULL;
  kase->extra_json = collect_unknown (object, keys);
  return g_steal_pointer (&kase);
}

CwCase *
cw_case_load_from_data (const char  *data,
                        gssize       length,
                        const char  *display_name,
                        GError     **error)
{
  const char *file = display_name != NULL ? display_name : "(data)";
  g_autoptr(JsonParser) parser = NULL;

  g_return_val_if_fail (data != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  parser = parse_text (file, data, length < 0 ? strlen (data) : (gsize) length, error);
  if (parser == NULL)
    return NULL;
  return read_document (file, json_parser_get_root (parser), error);
}

CwCase *
cw_case_load (const char  *path,
              GError     **error)
{
  g_autofree char *file = NULL;
  g_autofree char *data = NULL;
  gsize length = 0;

  g_return_val_if_fail (path != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  file = g_path_get_basename (path);
  data = read_file (file, path, &length, error);
  if (data == NULL)
    return NULL;
  return cw_case_load_from_data (data, (gssize) length, file, error);
}

gboolean
cw_rules_load (const char  *path,
               CwRules     *rules,
               GError     **error)
{
  g_autofree char *file = NULL;
  g_autofree char *data = NULL;
  g_autoptr(JsonParser) parser = NULL;
  JsonObject *object = NULL;
  gsize length = 0;
  CwRules result;

  g_return_val_if_fail (path != NULL, FALSE);
  g_return_val_if_fail (rules != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  file = g_path_get_basename (path);
  data = read_file (file, path, &length, error);
  if (data == NULL)
    return FALSE;
  parser = parse_text (file, data, length, error);
  if (parser == NULL
      || !node_object (file, "document", json_parser_get_root (parser), &object, error)
      || !check_format (file, object, "canalwright-rules", error)
      || !check_version (file, object, error))
    return FALSE;
  cw_rules_init_defaults (&result);
  if (!cw_rules_apply_json (&result, object, file, NULL, error))
    return FALSE;
  *rules = result;
  return TRUE;
}
