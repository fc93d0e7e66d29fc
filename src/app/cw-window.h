/* cw-window.h
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-application.h"
#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_WINDOW (cw_window_get_type ())

G_DECLARE_FINAL_TYPE (CwWindow, cw_window, CW, WINDOW, GtkApplicationWindow)

CwWindow   *cw_window_new          (CwApplication *application,
                                    CwDocument    *document);
CwDocument *cw_window_get_document (CwWindow      *self);

G_END_DECLS
