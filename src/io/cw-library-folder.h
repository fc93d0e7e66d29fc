/* cw-library-folder.h: the folder of the user's instrument libraries
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gio/gio.h>

G_BEGIN_DECLS

#define CW_LIBRARY_SUFFIX ".cwlib"

char       *cw_library_folder_default   (void);
GPtrArray  *cw_library_folder_list      (const char  *dir);
gboolean    cw_library_folder_seed      (const char  *dir,
                                         const char  *name,
                                         GBytes      *starter,
                                         GError     **error);
char       *cw_library_folder_new_path  (const char  *dir,
                                         const char  *title);
char       *cw_library_slug             (const char  *text,
                                         const char  *fallback);

G_END_DECLS
