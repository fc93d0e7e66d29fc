/* cw-presenter-window.h: the canal and the step in large type, full screen
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-canal-overlays.h"
#include "cw-document.h"
#include "cw-playback.h"

G_BEGIN_DECLS

#define CW_TYPE_PRESENTER_WINDOW (cw_presenter_window_get_type ())

G_DECLARE_FINAL_TYPE (CwPresenterWindow, cw_presenter_window, CW, PRESENTER_WINDOW, GtkWindow)

/* Follows the document's selection and the playback; Space, Left, Right,
 * Home and End drive the playback, + and - its speed, Esc leaves. */
CwPresenterWindow *cw_presenter_window_new          (GtkWindow         *parent,
                                                     CwDocument        *document,
                                                     CwPlayback        *playback);
void               cw_presenter_window_set_overlays (CwPresenterWindow *self,
                                                     CwOverlayFlags     overlays);

G_END_DECLS
