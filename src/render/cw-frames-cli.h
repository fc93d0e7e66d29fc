/* cw-frames-cli.h: canalwright --export-frames DIR CASE [--canal NAME]
 * [--frames-per-step N] [--dpi N] [--overlays LIST] [--theme NAME]
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* argv holds the arguments after --export-frames.  Returns 0 when every
 * frame was written, 2 with a message on stderr otherwise, -1 for a usage
 * error. */
int cw_frames_cli_run (int    argc,
                       char **argv);

G_END_DECLS
