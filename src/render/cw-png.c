/* cw-png.c
 *
 * The format is the W3C's PNG specification (second edition, 2003): the
 * signature, IHDR, pHYs, IDAT (a zlib stream of filtered scanlines), IEND,
 * each chunk with its CRC-32.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <gio/gio.h>
#include <math.h>
#include <string.h>

#include "cw-png.h"

/* zlib's fastest level: flat colours compress well at any level. */
#define LEVEL 1
#define FILTER_SUB 1

static const guint32 *
crc_table (void)
{
  static guint32 table[256];
  static gsize ready;

  if (g_once_init_enter (&ready))
    {
      for (guint32 n = 0; n < 256; n++)
        {
          guint32 c = n;

          for (int k = 0; k < 8; k++)
            c = c & 1 ? 0xedb88320u ^ (c >> 1) : c >> 1;
          table[n] = c;
        }
      g_once_init_leave (&ready, 1);
    }
  return table;
}

static guint32
crc_update (guint32       crc,
            const guint8 *data,
            gsize         length)
{
  const guint32 *table = crc_table ();

  for (gsize i = 0; i < length; i++)
    crc = table[(crc ^ data[i]) & 0xff] ^ (crc >> 8);
  return crc;
}

static void
put_u32 (GByteArray *out,
         guint32     v)
{
  guint8 b[4] = { v >> 24, v >> 16 & 0xff, v >> 8 & 0xff, v & 0xff };

  g_byte_array_append (out, b, 4);
}

static void
chunk (GByteArray   *out,
       const char   *type,
       const guint8 *data,
       gsize         length)
{
  guint32 crc;

  put_u32 (out, (guint32) length);
  g_byte_array_append (out, (const guint8 *) type, 4);
  g_byte_array_append (out, data, (guint) length);
  crc = crc_update (0xffffffffu, (const guint8 *) type, 4);
  crc = crc_update (crc, data, length);
  put_u32 (out, crc ^ 0xffffffffu);
}

/* Each row as RGB bytes after a filter byte; Sub stores each byte less the
 * one three to its left, which turns flat runs into zeros. */
static GByteArray *
scanlines (cairo_surface_t *image)
{
  int w = cairo_image_surface_get_width (image), h = cairo_image_surface_get_height (image);
  int stride = cairo_image_surface_get_stride (image);
  const guint8 *data = cairo_image_surface_get_data (image);
  GByteArray *raw = g_byte_array_sized_new ((guint) ((3 * w + 1) * h));

  g_byte_array_set_size (raw, (guint) ((3 * w + 1) * h));
  for (int y = 0; y < h; y++)
    {
      const guint32 *src = (const guint32 *) (gconstpointer) (data + y * stride);
      guint8 *row = raw->data + y * (3 * w + 1), prev[3] = { 0, 0, 0 };

      row[0] = FILTER_SUB;
      for (int x = 0; x < w; x++)
        {
          guint8 px[3] = { src[x] >> 16 & 0xff, src[x] >> 8 & 0xff, src[x] & 0xff };

          for (int c = 0; c < 3; c++)
            {
              row[1 + 3 * x + c] = (guint8) (px[c] - prev[c]);
              prev[c] = px[c];
            }
        }
    }
  return raw;
}

static gboolean
deflate (GByteArray  *raw,
         GByteArray  *out,
         GError     **error)
{
  g_autoptr(GZlibCompressor) zlib = g_zlib_compressor_new (G_ZLIB_COMPRESSOR_FORMAT_ZLIB, LEVEL);
  gsize done = 0, read, written;
  guint8 buf[65536];
  GConverterResult r;

  do
    {
      r = g_converter_convert (G_CONVERTER (zlib), raw->data + done, raw->len - done, buf, sizeof buf,
                               G_CONVERTER_INPUT_AT_END, &read, &written, error);
      if (r == G_CONVERTER_ERROR)
        return FALSE;
      done += read;
      g_byte_array_append (out, buf, (guint) written);
    }
  while (r != G_CONVERTER_FINISHED);
  return TRUE;
}

static void
header (GByteArray      *out,
        cairo_surface_t *image,
        double           dpi)
{
  static const guint8 signature[8] = { 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n' };
  guint32 w = (guint32) cairo_image_surface_get_width (image);
  guint32 h = (guint32) cairo_image_surface_get_height (image);
  guint32 ppm = (guint32) lround (dpi / 0.0254);
  guint8 ihdr[13] = { w >> 24, w >> 16 & 0xff, w >> 8 & 0xff, w & 0xff,
                      h >> 24, h >> 16 & 0xff, h >> 8 & 0xff, h & 0xff,
                      8, 2, 0, 0, 0 };  /* 8 bits, RGB, deflate, adaptive filters, no interlace */
  guint8 phys[9] = { ppm >> 24, ppm >> 16 & 0xff, ppm >> 8 & 0xff, ppm & 0xff,
                     ppm >> 24, ppm >> 16 & 0xff, ppm >> 8 & 0xff, ppm & 0xff, 1 };

  g_byte_array_append (out, signature, sizeof signature);
  chunk (out, "IHDR", ihdr, sizeof ihdr);
  chunk (out, "pHYs", phys, sizeof phys);
}

gboolean
cw_png_write (cairo_surface_t  *image,
              double            dpi,
              GByteArray       *out,
              GError          **error)
{
  g_autoptr(GByteArray) raw = NULL;
  g_autoptr(GByteArray) packed = g_byte_array_new ();

  g_return_val_if_fail (cairo_image_surface_get_format (image) == CAIRO_FORMAT_RGB24, FALSE);

  cairo_surface_flush (image);
  raw = scanlines (image);
  if (!deflate (raw, packed, error))
    return FALSE;
  header (out, image, dpi);
  chunk (out, "IDAT", packed->data, packed->len);
  chunk (out, "IEND", NULL, 0);
  return TRUE;
}
