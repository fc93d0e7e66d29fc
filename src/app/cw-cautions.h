/* cw-cautions.h: the cautions the program shows at first start and in About
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

const char *cw_cautions_text (void);
void        cw_cautions_show (GtkWindow *parent);

G_END_DECLS
