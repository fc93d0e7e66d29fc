/* cw-headless.h: the commands that run with no display
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>
#include <stdio.h>

G_BEGIN_DECLS

/* Returns TRUE and sets *status when argv names a headless command; the
 * window is never started for those, so no display is needed. */
gboolean cw_headless_dispatch (int    argc,
                               char **argv,
                               int   *status);
void     cw_headless_usage    (FILE  *out);

G_END_DECLS
