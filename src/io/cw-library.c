/* cw-library.c
 *
 * A library holds the instruments a clinic owns, in the same JSON form as a
 * case's instruments, and is read with the case loader's checks and
 * messages.  A case never refers to a library: it takes copies, so that an
 * old case opens the same however the library has changed since.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-library"

#include "config.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "cw-case-writer.h"
#include "cw-instrument-json.h"
#include "cw-json-check.h"
#include "cw-json-source.h"
#include "cw-json-writer.h"
#include "cw-library.h"

CwLibrary *
cw_library_new (const char *title)
{
  CwLibrary *self = g_new0 (CwLibrary, 1);

  self->title = g_strdup (title != NULL ? title : "");
  self->instruments = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_instrument_free);
  return self;
}

CwLibrary *
cw_library_copy (const CwLibrary *self)
{
  CwLibrary *copy;

  g_return_val_if_fail (self != NULL, NULL);

  copy = cw_library_new (self->title);
  for (guint i = 0; i < self->instruments->len; i++)
    g_ptr_array_add (copy->instruments, cw_instrument_copy (g_ptr_array_index (self->instruments, i)));
  copy->extra_json = g_strdup (self->extra_json);
  copy->path = g_strdup (self->path);
  return copy;
}

void
cw_library_free (CwLibrary *self)
{
  if (self == NULL)
    return;
  g_free (self->title);
  g_ptr_array_unref (self->instruments);
  g_free (self->extra_json);
  g_free (self->path);
  g_free (self);
}

/* The name messages start with, as the case loader's do: the file's. */
static char *
file_name (const CwLibrary *self)
{
  return self->path != NULL ? g_filename_display_basename (self->path) : g_strdup ("(library)");
}

const char *
cw_library_display_name (const CwLibrary *self)
{
  const char *slash;

  g_return_val_if_fail (self != NULL, NULL);

  if (self->title != NULL && *self->title != '\0')
    return self->title;
  if (self->path == NULL)
    return _("Untitled library");
  slash = strrchr (self->path, G_DIR_SEPARATOR);
  return slash != NULL ? slash + 1 : self->path;
}

static CwLibrary *
read_library (const char  *file,
              JsonNode    *root,
              GError     **error)
{
  static const char * const keys[] = { "format", "version", "title", "instruments", NULL };
  g_autoptr(CwLibrary) library = cw_library_new (NULL);
  JsonObject *object = NULL;
  const char *title = "";

  if (!cw_json_node_object (file, "document", root, &object, error)
      || !cw_json_check_format (file, object, CW_LIBRARY_FORMAT, error)
      || !cw_json_check_version (file, object, CW_LIBRARY_VERSION, error)
      || !cw_json_read_string (file, object, NULL, "title", FALSE, FALSE, &title, error)
      || !cw_instrument_load_array (object, file, 0, CW_MAX_LIBRARY_INSTRUMENTS,
                                    library->instruments, error))
    return NULL;
  g_free (library->title);
  library->title = g_strdup (title);
  library->extra_json = cw_json_collect_unknown (object, keys);
  return g_steal_pointer (&library);
}

CwLibrary *
cw_library_load_from_data (const char  *data,
                           gssize       length,
                           const char  *display_name,
                           GError     **error)
{
  const char *file = display_name != NULL ? display_name : "(data)";
  g_autoptr(JsonParser) parser = NULL;

  g_return_val_if_fail (data != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  parser = cw_json_parse_text (file, data, length < 0 ? strlen (data) : (gsize) length, error);
  if (parser == NULL)
    return NULL;
  return read_library (file, json_parser_get_root (parser), error);
}

CwLibrary *
cw_library_load (const char  *path,
                 GError     **error)
{
  g_autofree char *file = NULL;
  g_autofree char *data = NULL;
  CwLibrary *library;
  gsize length = 0;

  g_return_val_if_fail (path != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  file = g_filename_display_basename (path);
  data = cw_json_read_file (file, path, &length, error);
  if (data == NULL)
    return NULL;
  library = cw_library_load_from_data (data, (gssize) length, file, error);
  if (library != NULL)
    library->path = g_strdup (path);
  return library;
}

/* The case writer's form of each instrument, so that a library and a case
 * write an instrument alike, unknown members and number forms included. */
static JsonNode *
instruments_to_json (GPtrArray *instruments)
{
  g_autoptr(CwCase) kase = cw_case_new ();
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autofree char *data = NULL;
  JsonObject *root;

  for (guint i = 0; i < instruments->len; i++)
    cw_case_add_instrument (kase, cw_instrument_copy (g_ptr_array_index (instruments, i)));
  data = cw_case_to_data (kase);
  if (!json_parser_load_from_data (parser, data, -1, NULL))
    g_assert_not_reached ();
  root = json_node_get_object (json_parser_get_root (parser));
  return json_node_copy (json_object_get_member (root, "instruments"));
}

char *
cw_library_to_data (const CwLibrary *self)
{
  g_autoptr(JsonNode) root = NULL;
  JsonObject *object;

  g_return_val_if_fail (self != NULL, NULL);

  object = json_object_new ();
  json_object_set_string_member (object, "format", CW_LIBRARY_FORMAT);
  json_object_set_int_member (object, "version", CW_LIBRARY_VERSION);
  json_object_set_string_member (object, "title", self->title != NULL ? self->title : "");
  json_object_set_member (object, "instruments", instruments_to_json (self->instruments));
  cw_json_add_unknown (object, self->extra_json);
  root = json_node_init_object (json_node_alloc (), object);
  json_object_unref (object);
  return cw_json_write (root, TRUE);
}

gboolean
cw_library_save (CwLibrary   *self,
                 const char  *path,
                 GError     **error)
{
  g_autofree char *data = NULL;
  g_autoptr(GError) local_error = NULL;

  g_return_val_if_fail (self != NULL, FALSE);
  g_return_val_if_fail (path != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  data = cw_library_to_data (self);
  /* Renamed over the old file, as a case is: never half a library. */
  if (!g_file_set_contents_full (path, data, -1,
                                 G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE,
                                 0644, &local_error))
    {
      g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not save the library: %s"),
                   path, local_error->message);
      return FALSE;
    }
  if (self->path != path)
    {
      g_free (self->path);
      self->path = g_strdup (path);
    }
  return TRUE;
}

int
cw_library_find (const CwLibrary *self,
                 const char      *id)
{
  g_return_val_if_fail (self != NULL, -1);
  g_return_val_if_fail (id != NULL, -1);

  for (guint i = 0; i < self->instruments->len; i++)
    if (g_strcmp0 (((const CwInstrument *) g_ptr_array_index (self->instruments, i))->id, id) == 0)
      return (int) i;
  return -1;
}

const CwInstrument *
cw_library_lookup (const CwLibrary *self,
                   const char      *id)
{
  int index = cw_library_find (self, id);

  return index >= 0 ? g_ptr_array_index (self->instruments, index) : NULL;
}

/* The instrument an editor holds, as a JSON object, checked as the loader
 * would check it at instruments[INDEX] of this library's file (a new one
 * goes at the end), its id unique among the others. */
CwInstrument *
cw_library_check_instrument (const CwLibrary  *self,
                             JsonObject       *object,
                             int               index,
                             GError          **error)
{
  guint at = index >= 0 ? (guint) index : self->instruments->len;
  g_autofree char *file = file_name (self);
  g_autofree char *path = cw_json_index_path ("instruments", at);
  g_autofree char *id_path = cw_json_member_path (path, "id");
  g_autoptr(CwInstrument) instrument = NULL;
  int other;

  g_return_val_if_fail (self != NULL, NULL);
  g_return_val_if_fail (object != NULL, NULL);

  instrument = cw_instrument_load_json (object, file, path, error);
  if (instrument == NULL)
    return NULL;
  other = cw_library_find (self, instrument->id);
  if (other >= 0 && (guint) other != at)
    {
      cw_json_fail (error, CW_ERROR_INVALID, file, id_path,
                    "must be unique, but instruments[%d] has the id \"%s\" too", other, instrument->id);
      return NULL;
    }
  return g_steal_pointer (&instrument);
}

static gboolean
same_number (double a,
             double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

static gboolean
same_segments (GArray *a,
               GArray *b)
{
  if (a == NULL || b == NULL)
    return a == b;
  if (a->len != b->len)
    return FALSE;
  for (guint i = 0; i < a->len; i++)
    {
      const CwTaperSegment *s = &g_array_index (a, CwTaperSegment, i);
      const CwTaperSegment *t = &g_array_index (b, CwTaperSegment, i);

      if (s->to != t->to || s->taper != t->taper)
        return FALSE;
    }
  return TRUE;
}

/* Every field the files hold, unknown members too: what a save would write. */
gboolean
cw_instrument_equal (const CwInstrument *a,
                     const CwInstrument *b)
{
  g_return_val_if_fail (a != NULL && b != NULL, FALSE);

  return g_strcmp0 (a->id, b->id) == 0
         && g_strcmp0 (a->label, b->label) == 0
         && a->tip == b->tip
         && same_number (a->taper, b->taper)
         && same_segments (a->segments, b->segments)
         && a->flute_length == b->flute_length
         && a->length == b->length
         && same_number (a->max_flute_diameter, b->max_flute_diameter)
         && a->alloy == b->alloy
         && a->motion == b->motion
         && same_number (a->rpm, b->rpm)
         && same_number (a->torque_limit, b->torque_limit)
         && a->uses_allowed == b->uses_allowed
         && g_strcmp0 (a->extra_json, b->extra_json) == 0;
}

static gboolean
has_id (GPtrArray  *instruments,
        const char *id)
{
  for (guint i = 0; i < instruments->len; i++)
    if (g_strcmp0 (((const CwInstrument *) g_ptr_array_index (instruments, i))->id, id) == 0)
      return TRUE;
  return FALSE;
}

/* BASE itself when it is free, else BASE-2, BASE-3, ... */
char *
cw_instrument_unique_id (GPtrArray  *instruments,
                         const char *base)
{
  char *id;

  g_return_val_if_fail (instruments != NULL && base != NULL, NULL);

  if (!has_id (instruments, base))
    return g_strdup (base);
  for (guint n = 2;; n++)
    {
      id = g_strdup_printf ("%s-%u", base, n);
      if (!has_id (instruments, id))
        return id;
      g_free (id);
    }
}

/* A copy already in the case, under its own id or a renamed one. */
static const CwInstrument *
find_copy (const CwCase       *kase,
           const CwInstrument *instrument)
{
  for (guint i = 0; i < kase->instruments->len; i++)
    {
      const CwInstrument *present = g_ptr_array_index (kase->instruments, i);
      g_autoptr(CwInstrument) renamed = cw_instrument_copy (instrument);

      g_free (renamed->id);
      renamed->id = g_strdup (present->id);
      if (cw_instrument_equal (present, renamed))
        return present;
    }
  return NULL;
}

/* Adds a copy of a library instrument to the case and returns its id in
 * the case: that of a copy already there, its own, or a new one when a
 * different instrument has its id. */
const char *
cw_case_add_library_copy (CwCase              *kase,
                          const CwInstrument  *instrument,
                          GError             **error)
{
  const CwInstrument *present;
  CwInstrument *copy;

  g_return_val_if_fail (kase != NULL && instrument != NULL, NULL);

  present = find_copy (kase, instrument);
  if (present != NULL)
    return present->id;
  if (kase->instruments->len >= CW_MAX_INSTRUMENTS)
    {
      g_set_error (error, CW_ERROR, CW_ERROR_INVALID,
                   _("A case holds at most %d instruments; “%s” was not added."),
                   CW_MAX_INSTRUMENTS, instrument->label != NULL ? instrument->label : instrument->id);
      return NULL;
    }
  copy = cw_instrument_copy (instrument);
  g_free (copy->id);
  copy->id = cw_instrument_unique_id (kase->instruments, instrument->id);
  cw_case_add_instrument (kase, copy);
  return copy->id;
}
