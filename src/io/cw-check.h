/* cw-check.h: the headless check's JSON report
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

int cw_check_run (const char *path);

G_END_DECLS
