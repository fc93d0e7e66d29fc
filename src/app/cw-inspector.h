/* cw-inspector.h: every figure of the selected step, and the canal's totals
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_INSPECTOR (cw_inspector_get_type ())

G_DECLARE_FINAL_TYPE (CwInspector, cw_inspector, CW, INSPECTOR, GtkWidget)

void  cw_inspector_set_document (CwInspector *self,
                                 CwDocument  *document);
char *cw_step_summary           (const CwStepResult *r);

G_END_DECLS
