/* fuzz-common.h: what both fuzz targets share
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <stddef.h>
#include <stdint.h>

#include "cw-case-loader.h"

G_BEGIN_DECLS

#define CW_FUZZ_FILE "fuzz.cwcase"

int     LLVMFuzzerTestOneInput (const uint8_t *data,
                                size_t         size);

CwCase *cw_fuzz_load           (const uint8_t *data,
                                size_t         size);

G_END_DECLS
