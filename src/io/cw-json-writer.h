/* cw-json-writer.h: JSON text with short, exact numbers
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

G_BEGIN_DECLS

char  *cw_json_write          (JsonNode    *root,
                               gboolean     pretty);
void   cw_json_append_number  (GString     *out,
                               double       value);

G_END_DECLS
