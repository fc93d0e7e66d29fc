/* cw-help-window.h: the short user guide shipped with the program
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_TYPE_HELP_WINDOW (cw_help_window_get_type ())

G_DECLARE_FINAL_TYPE (CwHelpWindow, cw_help_window, CW, HELP_WINDOW, GtkWindow)

GtkWidget *cw_help_window_new (GtkWindow *parent);

G_END_DECLS
