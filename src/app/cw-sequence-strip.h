/* cw-sequence-strip.h: the selected canal's steps, in order
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_SEQUENCE_STRIP (cw_sequence_strip_get_type ())

G_DECLARE_FINAL_TYPE (CwSequenceStrip, cw_sequence_strip, CW, SEQUENCE_STRIP, GtkWidget)

void cw_sequence_strip_set_document (CwSequenceStrip *self,
                                     CwDocument      *document);
guint cw_sequence_strip_position_at (CwSequenceStrip *self,
                                     double           x);

G_END_DECLS
