/* cw-library-window.h: the instrument libraries, listed, searched, edited
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-libraries.h"

G_BEGIN_DECLS

#define CW_TYPE_LIBRARY_WINDOW (cw_library_window_get_type ())

G_DECLARE_FINAL_TYPE (CwLibraryWindow, cw_library_window, CW, LIBRARY_WINDOW, GtkWindow)

CwLibraryWindow *cw_library_window_new          (GtkWindow       *case_window,
                                                 CwLibraries     *libraries);
void             cw_library_window_select       (CwLibraryWindow *self,
                                                 const char      *id);
GtkWindow       *cw_library_window_get_editor   (CwLibraryWindow *self);
guint            cw_library_window_get_n_shown  (CwLibraryWindow *self);

G_END_DECLS
