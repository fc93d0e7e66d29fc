/* cw-case-writer.h: writing case files
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-case.h"

G_BEGIN_DECLS

char      *cw_case_to_data  (const CwCase  *kase);
gboolean   cw_case_save     (const CwCase  *kase,
                             const char    *path,
                             GError       **error);

G_END_DECLS
