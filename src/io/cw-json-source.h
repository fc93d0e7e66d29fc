/* cw-json-source.h: reading and parsing a file the program did not write
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

G_BEGIN_DECLS

char        *cw_json_read_file      (const char  *file,
                                     const char  *path,
                                     gsize       *length,
                                     GError     **error);
JsonParser  *cw_json_parse_text     (const char  *file,
                                     const char  *data,
                                     gsize        length,
                                     GError     **error);
gboolean     cw_json_check_format   (const char  *file,
                                     JsonObject  *object,
                                     const char  *format,
                                     GError     **error);
gboolean     cw_json_check_version  (const char  *file,
                                     JsonObject  *object,
                                     int          max_version,
                                     GError     **error);

G_END_DECLS
