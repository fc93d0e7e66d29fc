/* cw-report.h: the evaluation as the JSON document other programs read
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

#include "cw-evaluate.h"

G_BEGIN_DECLS

JsonNode *cw_report_canal  (const CwCanalResult *result);
JsonNode *cw_report_case   (const CwCase        *kase,
                            gboolean            *any_stop);

G_END_DECLS
