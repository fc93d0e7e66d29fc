/* cw-instrument-json.h: reading an instrument from its JSON object
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

#include "cw-instrument.h"

G_BEGIN_DECLS

CwInstrument *cw_instrument_load_json   (JsonObject  *object,
                                         const char  *file,
                                         const char  *path,
                                         GError     **error);
gboolean      cw_instrument_load_array  (JsonObject  *object,
                                         const char  *file,
                                         guint        min,
                                         guint        max,
                                         GPtrArray   *instruments,
                                         GError     **error);

G_END_DECLS
