/* cw-swatch.h: a file's ISO handle colour, as a small round mark
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_SWATCH (cw_swatch_get_type ())

G_DECLARE_FINAL_TYPE (CwSwatch, cw_swatch, CW, SWATCH, GtkWidget)

GtkWidget *cw_swatch_new (double size);

G_END_DECLS
