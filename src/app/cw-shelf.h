/* cw-shelf.h: the case's instruments, each a drag source
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-document.h"
#include "cw-libraries.h"

G_BEGIN_DECLS

#define CW_TYPE_SHELF (cw_shelf_get_type ())

G_DECLARE_FINAL_TYPE (CwShelf, cw_shelf, CW, SHELF, GtkWidget)

void  cw_shelf_set_document  (CwShelf    *self,
                              CwDocument *document);
void  cw_shelf_set_libraries  (CwShelf     *self,
                              CwLibraries *libraries);
void  cw_shelf_grab_focus    (CwShelf    *self);
char *cw_instrument_describe (const CwInstrument *instrument);
const char *cw_alloy_label   (CwAlloy             alloy);
const char *cw_motion_label  (CwMotion            motion);

G_END_DECLS
