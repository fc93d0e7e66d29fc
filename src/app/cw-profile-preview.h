/* cw-profile-preview.h: an instrument's profile, drawn live in the editor
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-instrument.h"

G_BEGIN_DECLS

#define CW_TYPE_PROFILE_PREVIEW (cw_profile_preview_get_type ())

G_DECLARE_FINAL_TYPE (CwProfilePreview, cw_profile_preview, CW, PROFILE_PREVIEW, GtkWidget)

GtkWidget          *cw_profile_preview_new             (void);
void                cw_profile_preview_set_instrument  (CwProfilePreview   *self,
                                                        const CwInstrument *instrument);
const CwInstrument *cw_profile_preview_get_instrument  (CwProfilePreview   *self);
void                cw_profile_preview_set_stale       (CwProfilePreview   *self,
                                                        gboolean            stale);

G_END_DECLS
