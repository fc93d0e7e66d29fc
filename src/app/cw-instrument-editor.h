/* cw-instrument-editor.h: every field of one library instrument
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-library.h"

G_BEGIN_DECLS

#define CW_TYPE_INSTRUMENT_EDITOR (cw_instrument_editor_get_type ())

G_DECLARE_FINAL_TYPE (CwInstrumentEditor, cw_instrument_editor, CW, INSTRUMENT_EDITOR, GtkWindow)

CwInstrumentEditor *cw_instrument_editor_new             (GtkWindow           *parent,
                                                          const CwLibrary     *library,
                                                          const CwInstrument  *instrument,
                                                          int                  index);
const CwInstrument *cw_instrument_editor_get_instrument  (CwInstrumentEditor  *self);
int                 cw_instrument_editor_get_index       (CwInstrumentEditor  *self);
const char         *cw_instrument_editor_get_message     (CwInstrumentEditor  *self);

G_END_DECLS
