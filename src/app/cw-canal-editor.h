/* cw-canal-editor.h: the tooth, the case's targets and the selected canal
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_CANAL_EDITOR (cw_canal_editor_get_type ())

G_DECLARE_FINAL_TYPE (CwCanalEditor, cw_canal_editor, CW, CANAL_EDITOR, GtkWidget)

void cw_canal_editor_set_document (CwCanalEditor *self,
                                   CwDocument    *document);

G_END_DECLS
