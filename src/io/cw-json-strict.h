/* cw-json-strict.h: JSON as RFC 8259 writes it, and nothing else
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Far over anything a case holds (64 instruments, 8 canals of 40 steps),
 * and under what json-glib builds in a fraction of a second. */
#define CW_MAX_JSON_VALUES 500000
#define CW_MAX_JSON_ELEMENTS 10000

gboolean cw_json_strict_check (const char  *file,
                               const char  *data,
                               gsize        length,
                               GError     **error);

G_END_DECLS
