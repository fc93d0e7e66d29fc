/* bench-cases.h
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-case.h"

G_BEGIN_DECLS

CwCase *cw_bench_twelve_step_case (void);
double  cw_bench_now_ms           (void);
double  cw_bench_median           (double *times,
                                   guint   n);

G_END_DECLS
