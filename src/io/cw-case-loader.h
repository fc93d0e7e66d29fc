/* cw-case-loader.h: reading case and rule-set files
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

#include "cw-case.h"
#include "cw-rules.h"

G_BEGIN_DECLS

#define CW_MAX_NESTING 32

CwCase   *cw_case_load            (const char  *path,
                                   GError     **error);
CwCase   *cw_case_load_from_data  (const char  *data,
                                   gssize       length,
                                   const char  *display_name,
                                   GError     **error);
gboolean  cw_rules_load           (const char  *path,
                                   CwRules     *rules,
                                   GError     **error);
gboolean  cw_rules_apply_json     (CwRules     *rules,
                                   JsonObject  *object,
                                   const char  *display_name,
                                   const char  *path_prefix,
                                   GError     **error);

G_END_DECLS
