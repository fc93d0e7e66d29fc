/* cw-canal-view.h: the canal drawn by the renderer, with the selected step
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

#define CW_TYPE_CANAL_VIEW (cw_canal_view_get_type ())

G_DECLARE_FINAL_TYPE (CwCanalView, cw_canal_view, CW, CANAL_VIEW, GtkWidget)

void     cw_canal_view_set_document  (CwCanalView *self,
                                      CwDocument  *document);
void     cw_canal_view_zoom          (CwCanalView *self,
                                      double       factor);
void     cw_canal_view_reset_view    (CwCanalView *self);
gboolean cw_canal_view_depth_point   (CwCanalView *self,
                                      double       depth,
                                      double      *x,
                                      double      *y);

/* Teaching: the overlays drawn, and the playback whose file going in is
 * drawn in place of the selected step. */
void           cw_canal_view_set_overlays (CwCanalView    *self,
                                           CwOverlayFlags  overlays);
CwOverlayFlags cw_canal_view_get_overlays (CwCanalView    *self);
void           cw_canal_view_set_playback (CwCanalView    *self,
                                           CwPlayback     *playback);

G_END_DECLS
