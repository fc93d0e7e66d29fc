/* cw-export-cli.h: canalwright --export OUT CASE [--canal NAME] [--dpi N]
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* argv holds the arguments after --export.  Returns 0 when every file was
 * written, 2 with a message on stderr otherwise, -1 for a usage error. */
int cw_export_cli_run (int    argc,
                       char **argv);

G_END_DECLS
