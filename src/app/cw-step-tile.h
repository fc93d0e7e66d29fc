/* cw-step-tile.h: one step of the sequence strip
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-evaluate.h"

G_BEGIN_DECLS

#define CW_TYPE_STEP_TILE (cw_step_tile_get_type ())

G_DECLARE_FINAL_TYPE (CwStepTile, cw_step_tile, CW, STEP_TILE, GtkWidget)

GtkWidget *cw_step_tile_new          (const CwStepResult *result);
guint      cw_step_tile_get_index    (CwStepTile         *self);
void       cw_step_tile_set_selected (CwStepTile         *self,
                                      gboolean            selected);
const char *cw_level_icon_name       (CwLevel             level);
const char *cw_level_label           (CwLevel             level);

G_END_DECLS
