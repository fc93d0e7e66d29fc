/* cw-propose.h: canalwright --propose, the planner's JSON report
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

#include "cw-case.h"
#include "cw-planner.h"

G_BEGIN_DECLS

JsonNode *cw_propose_canal (const CwCanal       *canal,
                            const CwPlanResult  *result);
int       cw_propose_run   (const char          *path,
                            const char          *canal_name);

G_END_DECLS
