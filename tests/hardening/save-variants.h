/* save-variants.h: the two versions of a case the save tests write
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-case.h"

G_BEGIN_DECLS

CwCase *cw_save_variant (const CwCase *base,
                         char          which,
                         gsize         notes_size);

G_END_DECLS
