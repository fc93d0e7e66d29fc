/* cw-png.h: a quick PNG writer for the exported pictures
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>
#include <glib.h>

G_BEGIN_DECLS

/* Appends an 8-bit RGB PNG of an opaque image surface (CAIRO_FORMAT_RGB24)
 * to out, recording dpi in its pHYs chunk.  cairo's own writer compresses
 * hard and is most of an export's time; this one compresses lightly. */
gboolean cw_png_write (cairo_surface_t  *image,
                       double            dpi,
                       GByteArray       *out,
                       GError          **error);

G_END_DECLS
