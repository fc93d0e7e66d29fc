/* cw-error.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-error"

#include "cw-error.h"

G_DEFINE_QUARK (cw-error-quark, cw_error)
