/* cw-libraries.h: the user's instrument libraries and the current one
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gio/gio.h>

#include "cw-library.h"

G_BEGIN_DECLS

#define CW_TYPE_LIBRARIES (cw_libraries_get_type ())

G_DECLARE_FINAL_TYPE (CwLibraries, cw_libraries, CW, LIBRARIES, GObject)

CwLibraries     *cw_libraries_new                (const char    *dir,
                                                  GSettings     *settings);
CwLibraries     *cw_libraries_get_default        (void);
const char      *cw_libraries_get_dir            (CwLibraries   *self);
guint            cw_libraries_get_n_libraries    (CwLibraries   *self);
const CwLibrary *cw_libraries_get_library        (CwLibraries   *self,
                                                  guint          index);
guint            cw_libraries_get_current_index  (CwLibraries   *self);
void             cw_libraries_set_current_index  (CwLibraries   *self,
                                                  guint          index);
const CwLibrary *cw_libraries_get_current        (CwLibraries   *self);
GPtrArray       *cw_libraries_get_problems       (CwLibraries   *self);

gboolean         cw_libraries_put_instrument     (CwLibraries   *self,
                                                  int            index,
                                                  CwInstrument  *instrument,
                                                  GError       **error);
gboolean         cw_libraries_remove_instruments (CwLibraries   *self,
                                                  const char   **ids,
                                                  GError       **error);
gboolean         cw_libraries_create             (CwLibraries   *self,
                                                  const char    *title,
                                                  GError       **error);
gboolean         cw_libraries_import             (CwLibraries   *self,
                                                  const char    *path,
                                                  GError       **error);
gboolean         cw_libraries_export             (CwLibraries   *self,
                                                  guint          index,
                                                  const char    *path,
                                                  GError       **error);
gboolean         cw_libraries_delete             (CwLibraries   *self,
                                                  guint          index,
                                                  GError       **error);

G_END_DECLS
