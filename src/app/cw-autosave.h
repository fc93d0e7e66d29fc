/* cw-autosave.h: a copy of unsaved work in the user's cache folder
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_AUTOSAVE (cw_autosave_get_type ())

G_DECLARE_FINAL_TYPE (CwAutosave, cw_autosave, CW, AUTOSAVE, GObject)

CwAutosave *cw_autosave_new            (CwDocument *document);
void        cw_autosave_discard        (CwAutosave *self);
gboolean    cw_autosave_write_now      (CwAutosave *self);
char       *cw_autosave_dir            (void);
void        cw_autosave_offer_recovery (GtkWindow  *parent);

G_END_DECLS
