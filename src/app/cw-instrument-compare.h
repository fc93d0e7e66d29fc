/* cw-instrument-compare.h: two or three instruments in the same canal
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"

G_BEGIN_DECLS

#define CW_TYPE_INSTRUMENT_COMPARE (cw_instrument_compare_get_type ())

G_DECLARE_FINAL_TYPE (CwInstrumentCompare, cw_instrument_compare, CW, INSTRUMENT_COMPARE, GtkWindow)

/* Starts with the selected step's instrument and depth, and the next
 * different instruments of the sequence. */
CwInstrumentCompare *cw_instrument_compare_new        (GtkWindow           *parent,
                                                       CwDocument          *document);
/* The instruments picked, in the case's order (for the tests). */
GStrv                cw_instrument_compare_dup_ids    (CwInstrumentCompare *self);
void                 cw_instrument_compare_set_ids    (CwInstrumentCompare *self,
                                                       const char * const  *ids);
void                 cw_instrument_compare_set_depth  (CwInstrumentCompare *self,
                                                       double               depth);
/* TRUE: after the selected step; FALSE: from the natural canal. */
void                 cw_instrument_compare_set_after_step (CwInstrumentCompare *self,
                                                           gboolean             after);

G_END_DECLS
