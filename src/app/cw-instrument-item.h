/* cw-instrument-item.h: one library instrument in a list model
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib-object.h>

#include "cw-instrument.h"

G_BEGIN_DECLS

#define CW_TYPE_INSTRUMENT_ITEM (cw_instrument_item_get_type ())

G_DECLARE_FINAL_TYPE (CwInstrumentItem, cw_instrument_item, CW, INSTRUMENT_ITEM, GObject)

CwInstrumentItem   *cw_instrument_item_new             (const CwInstrument *instrument,
                                                        guint               position);
const CwInstrument *cw_instrument_item_get_instrument  (CwInstrumentItem   *self);
guint               cw_instrument_item_get_position    (CwInstrumentItem   *self);

G_END_DECLS
