/* cw-plan-text.h: the sentences the exported plans share
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-case.h"
#include "cw-evaluate.h"

G_BEGIN_DECLS

const char *cw_plan_cautions      (void);
char       *cw_plan_tooth_text    (const CwCase        *kase);
char       *cw_plan_date_text     (GDateTime           *date);
char       *cw_plan_duration      (double               seconds);
char       *cw_plan_file_text     (const CwInstrument  *instrument);
char       *cw_plan_zones_text    (const CwCanal       *canal,
                                   const CwGeometry    *geometry);
char       *cw_plan_final_text    (const CwCanalResult *result);
GDateTime  *cw_plan_export_date   (void);

G_END_DECLS
