/* cw-propose-window.h: the planner's proposals for the current canal
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_PROPOSE_WINDOW (cw_propose_window_get_type ())

G_DECLARE_FINAL_TYPE (CwProposeWindow, cw_propose_window, CW, PROPOSE_WINDOW, GtkWindow)

GtkWidget *cw_propose_window_new         (GtkWindow       *parent,
                                          CwDocument      *document);
guint      cw_propose_window_get_n_plans (CwProposeWindow *self);
gboolean   cw_propose_window_is_ready    (CwProposeWindow *self);
void       cw_propose_window_adopt       (CwProposeWindow *self,
                                          guint            index);

G_END_DECLS
