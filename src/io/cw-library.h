/* cw-library.h: an instrument library file, the clinic's own set of files
 *
 * A library file (".cwlib") is one UTF-8 JSON document:
 *
 *     { "format": "canalwright-library", "version": 1, "title": "Surgery 2",
 *       "instruments": [ ...as in a case file, 0 to 256 of them... ] }
 *
 * Each instrument has the members and ranges of a case file's instruments,
 * ids unique in the file; "title" is optional.  Unknown members are kept at
 * the top and in each instrument and written back; a higher version is
 * refused.  Messages read "FILE: PATH: what", as the case loader's do.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

#include "cw-case.h"

G_BEGIN_DECLS

#define CW_LIBRARY_FORMAT "canalwright-library"
#define CW_LIBRARY_VERSION 1
#define CW_MAX_LIBRARY_INSTRUMENTS 256

typedef struct
{
  char       *title;
  GPtrArray  *instruments;  /* CwInstrument */
  char       *extra_json;   /* members this version does not know */
  char       *path;         /* the file it was read from or last saved to, or NULL */
} CwLibrary;

CwLibrary          *cw_library_new               (const char          *title);
CwLibrary          *cw_library_copy              (const CwLibrary     *self);
void                cw_library_free              (CwLibrary           *self);
CwLibrary          *cw_library_load              (const char          *path,
                                                  GError             **error);
CwLibrary          *cw_library_load_from_data    (const char          *data,
                                                  gssize               length,
                                                  const char          *display_name,
                                                  GError             **error);
char               *cw_library_to_data           (const CwLibrary     *self);
gboolean            cw_library_save              (CwLibrary           *self,
                                                  const char          *path,
                                                  GError             **error);
const char         *cw_library_display_name      (const CwLibrary     *self);
int                 cw_library_find              (const CwLibrary     *self,
                                                  const char          *id);
const CwInstrument *cw_library_lookup            (const CwLibrary     *self,
                                                  const char          *id);
CwInstrument       *cw_library_check_instrument  (const CwLibrary     *self,
                                                  JsonObject          *object,
                                                  int                  index,
                                                  GError             **error);

gboolean            cw_instrument_equal          (const CwInstrument  *a,
                                                  const CwInstrument  *b);
char               *cw_instrument_unique_id      (GPtrArray           *instruments,
                                                  const char          *base);
const char         *cw_case_add_library_copy     (CwCase              *kase,
                                                  const CwInstrument  *instrument,
                                                  GError             **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwLibrary, cw_library_free)

G_END_DECLS
