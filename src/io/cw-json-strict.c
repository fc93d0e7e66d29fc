/* cw-json-strict.c
 *
 * json-glib's scanner is lenient: it reads 021 as octal and 0x15 as hex,
 * takes comments, 'quoted' strings and raw control characters, cuts a
 * string at \u0000, keeps the last of two members of one name, and builds
 * any number of values.  A case file read that way can say one thing and
 * load another, so every text is first checked here against the grammar
 * of RFC 8259, without recursion, before json-glib sees it.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-json-strict"

#include <string.h>

#include "cw-case-loader.h"
#include "cw-json-check.h"
#include "cw-json-strict.h"

typedef struct
{
  gboolean    object;
  guint       count;
  char       *key;       /* the member being read, for the path */
  GHashTable *keys;      /* the members seen, for duplicates */
} Frame;

typedef struct
{
  const char *file;
  const char *start;
  const char *p;
  const char *end;
  Frame       stack[CW_MAX_NESTING + 1];
  guint       depth;
  guint       values;
  GError    **error;
} Strict;

/* The path of a value inside the first n open containers. */
static char *
path_of (Strict *s,
         guint   n)
{
  GString *path = g_string_new (NULL);

  for (guint i = 0; i < n; i++)
    {
      Frame *f = &s->stack[i];

      if (f->object && f->key)
        g_string_append_printf (path, "%s%s", path->len ? "." : "", f->key);
      else if (!f->object && f->count > 0)
        g_string_append_printf (path, "[%u]", f->count - 1);
    }
  return g_string_free (path, FALSE);
}

/* "FILE: PATH: LINE:COLUMN: what", the path where there is one. */
static gboolean
fail_as (Strict     *s,
         CwError     code,
         const char *what)
{
  g_autofree char *path = path_of (s, s->depth);
  guint line = 1, column = 1;

  for (const char *q = s->start; q < s->p && q < s->end; q++)
    {
      line += *q == '\n';
      column = *q == '\n' ? 1 : column + 1;
    }
  return cw_json_fail (s->error, code, s->file, *path ? path : NULL,
                       "%u:%u: %s (allowed: strict JSON as RFC 8259 defines it)",
                       line, column, what);
}

static gboolean
fail (Strict     *s,
      const char *what)
{
  return fail_as (s, CW_ERROR_SYNTAX, what);
}

/* An array or object too long to be a case's, named by its own path. */
static gboolean
fail_too_long (Strict *s)
{
  g_autofree char *path = path_of (s, s->depth - 1);

  return cw_json_fail (s->error, CW_ERROR_INVALID, s->file, *path ? path : "document",
                       "more than %d elements or members (allowed: far fewer; see the case format's limits)",
                       CW_MAX_JSON_ELEMENTS);
}

static void
skip_space (Strict *s)
{
  while (s->p < s->end && (*s->p == ' ' || *s->p == '\t' || *s->p == '\n' || *s->p == '\r'))
    s->p++;
}

static gboolean
read_hex4 (Strict   *s,
           gunichar *value)
{
  *value = 0;
  for (int i = 0; i < 4; i++, s->p++)
    {
      if (s->p >= s->end || !g_ascii_isxdigit (*s->p))
        return fail (s, "a \\u escape needs four hexadecimal digits");
      *value = *value * 16 + (gunichar) g_ascii_xdigit_value (*s->p);
    }
  return TRUE;
}

/* \uD800-\uDBFF must be followed by \uDC00-\uDFFF; \u0000 would cut the
 * string short. */
static gboolean
read_unicode_escape (Strict  *s,
                     GString *out)
{
  gunichar c, low;

  if (!read_hex4 (s, &c))
    return FALSE;
  if (c == 0)
    return fail (s, "a string holds the character U+0000");
  if (c >= 0xdc00 && c <= 0xdfff)
    return fail (s, "a \\u escape is half of a surrogate pair");
  if (c >= 0xd800 && c <= 0xdbff)
    {
      if (s->end - s->p < 2 || s->p[0] != '\\' || s->p[1] != 'u')
        return fail (s, "a \\u escape is half of a surrogate pair");
      s->p += 2;
      if (!read_hex4 (s, &low))
        return FALSE;
      if (low < 0xdc00 || low > 0xdfff)
        return fail (s, "a \\u escape is half of a surrogate pair");
      c = 0x10000 + ((c - 0xd800) << 10) + (low - 0xdc00);
    }
  g_string_append_unichar (out, c);
  return TRUE;
}

static gboolean
read_escape (Strict  *s,
             GString *out)
{
  static const char simple[] = "\"\\/bfnrt";
  static const char meaning[] = "\"\\/\b\f\n\r\t";
  const char *found;

  if (s->p >= s->end)
    return fail (s, "a string is not closed");
  if (*s->p == 'u')
    {
      s->p++;
      return read_unicode_escape (s, out);
    }
  found = strchr (simple, *s->p);
  if (*s->p == '\0' || found == NULL)
    return fail (s, "a backslash starts an escape JSON does not have");
  g_string_append_c (out, meaning[found - simple]);
  s->p++;
  return TRUE;
}

/* Reads a "..." string; the text is already known to be UTF-8. */
static gboolean
read_string (Strict  *s,
             GString *out)
{
  s->p++;
  while (s->p < s->end && *s->p != '"')
    {
      guchar c = (guchar) *s->p;

      if (c < 0x20)
        return fail (s, "a string holds a raw control character (write it as an escape)");
      if (c == '\\')
        {
          s->p++;
          if (!read_escape (s, out))
            return FALSE;
          continue;
        }
      g_string_append_c (out, (char) c);
      s->p++;
    }
  if (s->p >= s->end)
    return fail (s, "a string is not closed");
  s->p++;
  return TRUE;
}

static gboolean
read_digits (Strict *s)
{
  const char *from = s->p;

  while (s->p < s->end && g_ascii_isdigit (*s->p))
    s->p++;
  return s->p > from;
}

/* -?(0|[1-9][0-9]*)(\.[0-9]+)?([eE][+-]?[0-9]+)?  An integer of more than
 * 15 digits is refused too: json-glib would wrap it round 64 bits. */
static gboolean
read_number (Strict *s)
{
  const char *digits;

  if (*s->p == '-')
    s->p++;
  digits = s->p;
  if (s->p < s->end && *s->p == '0')
    {
      s->p++;
      if (s->p < s->end && (g_ascii_isdigit (*s->p) || *s->p == 'x' || *s->p == 'X'))
        return fail (s, "a number starts with 0 (octal and hexadecimal are not JSON)");
    }
  else if (!read_digits (s))
    return fail (s, "a number has no digits");
  if (s->p - digits > 15 && (s->p >= s->end || (*s->p != '.' && *s->p != 'e' && *s->p != 'E')))
    return fail_as (s, CW_ERROR_INVALID, "an integer has more than 15 digits, too many to read exactly");
  if (s->p < s->end && *s->p == '.')
    {
      s->p++;
      if (!read_digits (s))
        return fail (s, "a number has no digits after its decimal point");
    }
  if (s->p < s->end && (*s->p == 'e' || *s->p == 'E'))
    {
      s->p++;
      if (s->p < s->end && (*s->p == '+' || *s->p == '-'))
        s->p++;
      if (!read_digits (s))
        return fail (s, "a number has no digits in its exponent");
    }
  return TRUE;
}

static gboolean
read_word (Strict *s)
{
  static const char *words[] = { "true", "false", "null" };

  for (guint i = 0; i < G_N_ELEMENTS (words); i++)
    {
      gsize n = strlen (words[i]);

      if ((gsize) (s->end - s->p) >= n && memcmp (s->p, words[i], n) == 0)
        {
          s->p += n;
          return TRUE;
        }
    }
  if (*s->p == '/')
    return fail (s, "comments are not JSON");
  if (*s->p == '\'')
    return fail (s, "strings are written in double quotes");
  return fail (s, "a value was expected here");
}

static gboolean
push (Strict   *s,
      gboolean  object)
{
  Frame *f;

  if (s->depth >= CW_MAX_NESTING)
    return cw_json_fail (s->error, CW_ERROR_TOO_LARGE, s->file, NULL,
                         "arrays and objects are nested deeper than %d levels (at byte offset %" G_GSIZE_FORMAT ")",
                         CW_MAX_NESTING, (gsize) (s->p - s->start));
  f = &s->stack[s->depth++];
  *f = (Frame) { object, 0, NULL, object ? g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL) : NULL };
  s->p++;
  return TRUE;
}

static void
pop (Strict *s)
{
  Frame *f = &s->stack[--s->depth];

  g_clear_pointer (&f->key, g_free);
  g_clear_pointer (&f->keys, g_hash_table_unref);
}

/* A scalar or the opening of a container, counted against the limit. */
static gboolean
read_value (Strict *s)
{
  g_autoptr(GString) ignored = NULL;

  if (++s->values > CW_MAX_JSON_VALUES)
    return cw_json_fail (s->error, CW_ERROR_TOO_LARGE, s->file, NULL,
                         "the file holds more than %d JSON values", CW_MAX_JSON_VALUES);
  if (s->p >= s->end)
    return fail (s, "a value was expected here");
  if (*s->p == '{' || *s->p == '[')
    return push (s, *s->p == '{');
  if (*s->p == '"')
    {
      ignored = g_string_new (NULL);
      return read_string (s, ignored);
    }
  if (*s->p == '-' || g_ascii_isdigit (*s->p))
    return read_number (s);
  return read_word (s);
}

static gboolean
read_key (Strict *s,
          Frame  *f)
{
  g_autoptr(GString) key = g_string_new (NULL);

  if (s->p < s->end && *s->p == '\'')
    return fail (s, "strings are written in double quotes");
  if (s->p >= s->end || *s->p != '"')
    return fail (s, "a member name in double quotes was expected");
  if (!read_string (s, key))
    return FALSE;
  g_free (f->key);
  f->key = g_strdup (key->str);
  if (!g_hash_table_add (f->keys, g_strdup (key->str)))
    return fail (s, "the member is given twice");
  skip_space (s);
  if (s->p >= s->end || *s->p != ':')
    return fail (s, "a colon was expected after the member name");
  s->p++;
  return TRUE;
}

/* Inside a container: a separator or its end, then the next member. */
static gboolean
step_container (Strict *s)
{
  Frame *f = &s->stack[s->depth - 1];
  char close = f->object ? '}' : ']';

  skip_space (s);
  if (s->p < s->end && *s->p == close)
    {
      s->p++;
      pop (s);
      return TRUE;
    }
  if (f->count > 0)
    {
      if (s->p >= s->end || *s->p != ',')
        return fail (s, f->object ? "a comma or } was expected" : "a comma or ] was expected");
      s->p++;
      skip_space (s);
    }
  if (++f->count > CW_MAX_JSON_ELEMENTS)
    return fail_too_long (s);
  if (f->object && !read_key (s, f))
    return FALSE;
  skip_space (s);
  return read_value (s);
}

gboolean
cw_json_strict_check (const char  *file,
                      const char  *data,
                      gsize        length,
                      GError     **error)
{
  Strict s = { file, data, data, data + length, { { 0 } }, 0, 0, error };
  gboolean ok;

  skip_space (&s);
  ok = read_value (&s);
  while (ok && s.depth > 0)
    ok = step_container (&s);
  if (ok)
    {
      skip_space (&s);
      if (s.p < s.end)
        ok = fail (&s, "the file holds more than one JSON value");
    }
  while (s.depth > 0)
    pop (&s);
  return ok;
}
