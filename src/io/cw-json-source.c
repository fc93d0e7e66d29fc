/* cw-json-source.c
 *
 * Reading a file the program did not write: bounded in size, checked for
 * UTF-8 and against the strict JSON grammar before json-glib sees it, then
 * its "format" and "version".  Shared by every loader, so each refuses a hostile file the
 * same way and with the same words.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-json-source"

#include <errno.h>
#include <fcntl.h>
#include <math.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include <glib/gstdio.h>

#include "cw-case-loader.h"
#include "cw-json-check.h"
#include "cw-json-source.h"
#include "cw-json-strict.h"

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
    return cw_json_fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: it is a folder, not a file", path);
  if (!S_ISREG (st->st_mode))
    return cw_json_fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: it is not a regular file", path);
  if (st->st_size > CW_MAX_FILE_SIZE)
    return cw_json_fail (error, CW_ERROR_TOO_LARGE, file, NULL,
                         "the file has %" G_GINT64_FORMAT " bytes, more than the %d MiB a file may have",
                         (gint64) st->st_size, CW_MAX_FILE_SIZE / (1024 * 1024));
  return TRUE;
}

/* Opened before it is measured, so that what is measured is what is read;
 * non-blocking, so that a pipe put in the file's place cannot hang us. */
char *
cw_json_read_file (const char  *file,
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
      cw_json_fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: %s", path, g_strerror (saved_errno));
      return NULL;
    }
  if (fstat (fd, &st) != 0)
    {
      saved_errno = errno;
      cw_json_fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: %s", path, g_strerror (saved_errno));
    }
  else if (check_stat (file, path, &st, error))
    {
      data = read_bounded (fd, length, &saved_errno);
      if (data == NULL)
        cw_json_fail (error, CW_ERROR_READ, file, NULL, "cannot read %s: %s", path, g_strerror (saved_errno));
    }
  g_close (fd, NULL);
  return g_steal_pointer (&data);
}

static gboolean
check_text (const char  *file,
            const char  *data,
            gsize        length,
            GError     **error)
{
  const char *end = NULL;

  if (length > CW_MAX_FILE_SIZE)
    return cw_json_fail (error, CW_ERROR_TOO_LARGE, file, NULL,
                         "the file has %" G_GSIZE_FORMAT " bytes, more than the %d MiB a file may have",
                         length, CW_MAX_FILE_SIZE / (1024 * 1024));
  if (length == 0)
    return cw_json_fail (error, CW_ERROR_SYNTAX, file, NULL, "the file is empty");
  if (!g_utf8_validate_len (data, length, &end))
    return cw_json_fail (error, CW_ERROR_SYNTAX, file, NULL,
                         "the file is not UTF-8 text (invalid byte at offset %" G_GSIZE_FORMAT ")",
                         (gsize) (end - data));
  /* Strict JSON only, and bounded in depth and in values, before json-glib
   * (which recurses and is lenient) builds anything. */
  return cw_json_strict_check (file, data, length, error);
}

static gboolean
syntax_error (const char  *file,
              GError      *parse_error,
              GError     **error)
{
  const char *message = parse_error->message;
  g_autofree char *valid = NULL;

  if (g_str_has_prefix (message, "<data>:"))
    message += strlen ("<data>:");
  /* json-glib quotes the offending bytes, which may cut a UTF-8 sequence. */
  valid = g_utf8_make_valid (message, -1);
  return cw_json_fail (error, CW_ERROR_SYNTAX, file, NULL, "%s", valid);
}

static gboolean valid_node (JsonNode *node, GString *path);

static gboolean
valid_object (JsonObject *object,
              GString    *path)
{
  g_autoptr(GList) members = json_object_get_members (object);
  gsize len = path->len;

  for (GList *l = members; l; l = l->next)
    {
      g_autofree char *name = g_utf8_make_valid (l->data, -1);

      g_string_append_printf (path, "%s%s", len ? "." : "", name);
      if (!g_utf8_validate (l->data, -1, NULL) ||
          !valid_node (json_object_get_member (object, l->data), path))
        return FALSE;
      g_string_truncate (path, len);
    }
  return TRUE;
}

static gboolean
valid_array (JsonArray *array,
             GString   *path)
{
  gsize len = path->len;

  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_string_append_printf (path, "[%u]", i);
      if (!valid_node (json_array_get_element (array, i), path))
        return FALSE;
      g_string_truncate (path, len);
    }
  return TRUE;
}

/* json-glib turns escapes such as a lone \ud800 into bytes that are not
 * UTF-8; such a string would be saved as a file that cannot be read back. */
static gboolean
valid_node (JsonNode *node,
            GString  *path)
{
  switch (JSON_NODE_TYPE (node))
    {
    case JSON_NODE_OBJECT:
      return valid_object (json_node_get_object (node), path);
    case JSON_NODE_ARRAY:
      return valid_array (json_node_get_array (node), path);
    case JSON_NODE_VALUE:
      return json_node_get_value_type (node) != G_TYPE_STRING ||
             g_utf8_validate (json_node_get_string (node), -1, NULL);
    case JSON_NODE_NULL:
    default:
      return TRUE;
    }
}

JsonParser *
cw_json_parse_text (const char  *file,
                    const char  *data,
                    gsize        length,
                    GError     **error)
{
  g_autoptr(JsonParser) parser = NULL;
  g_autoptr(GError) parse_error = NULL;

  /* Editors on some systems start UTF-8 files with a byte-order mark. */
  if (length >= 3 && memcmp (data, "\xEF\xBB\xBF", 3) == 0)
    {
      data += 3;
      length -= 3;
    }
  if (!check_text (file, data, length, error))
    return NULL;
  parser = json_parser_new ();
  if (!json_parser_load_from_data (parser, data, (gssize) length, &parse_error))
    {
      syntax_error (file, parse_error, error);
      return NULL;
    }
  if (json_parser_get_root (parser) == NULL)
    {
      cw_json_fail (error, CW_ERROR_SYNTAX, file, NULL, "the file holds no JSON value");
      return NULL;
    }
  if (json_parser_has_assignment (parser, NULL))
    {
      cw_json_fail (error, CW_ERROR_SYNTAX, file, NULL, "the file is a script assignment, not a JSON document");
      return NULL;
    }
  {
    g_autoptr(GString) path = g_string_new (NULL);

    if (!valid_node (json_parser_get_root (parser), path))
      {
        cw_json_fail (error, CW_ERROR_SYNTAX, file, path->len ? path->str : "document",
                      "an escape in this string is not a valid character (allowed: UTF-8 text)");
        return NULL;
      }
  }
  return g_steal_pointer (&parser);
}

gboolean
cw_json_check_format (const char  *file,
                      JsonObject  *object,
                      const char  *format,
                      GError     **error)
{
  const char *value = NULL;

  if (!cw_json_read_string (file, object, NULL, "format", TRUE, FALSE, &value, error))
    return FALSE;
  if (strcmp (value, format) == 0)
    return TRUE;
  return cw_json_fail (error, CW_ERROR_INVALID, file, "format", "must be \"%s\" (got \"%s\")", format, value);
}

gboolean
cw_json_check_version (const char  *file,
                       JsonObject  *object,
                       int          max_version,
                       GError     **error)
{
  JsonNode *node = json_object_get_member (object, "version");
  double version = node != NULL && cw_json_holds_number (node) ? json_node_get_double (node) : NAN;
  g_autofree char *got = NULL;

  if (node == NULL)
    return cw_json_fail (error, CW_ERROR_INVALID, file, "version", "is required (the integer %d)", max_version);
  got = isnan (version) ? g_strdup (cw_json_describe_node (node)) : cw_json_format_number (version);
  if (!isfinite (version) || version != floor (version) || version < 1)
    return cw_json_fail (error, CW_ERROR_INVALID, file, "version",
                         "must be an integer >= 1 (got %s)", got);
  if (version > max_version)
    return cw_json_fail (error, CW_ERROR_NEWER_VERSION, file, "version",
                         "was written by a newer Canalwright (file version %s, this program reads up to %d)",
                         got, max_version);
  return TRUE;
}
