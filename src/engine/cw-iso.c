/* cw-iso.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-iso"

#include <math.h>
#include <string.h>

#include "cw-iso.h"

static const int standard_sizes[] = {
  6, 8, 10, 15, 20, 25, 30, 35, 40, 45, 50, 55, 60, 70, 80, 90, 100, 110, 120, 130, 140,
};

guint
cw_iso_standard_sizes (const int **sizes)
{
  *sizes = standard_sizes;
  return G_N_ELEMENTS (standard_sizes);
}

gboolean
cw_iso_is_standard_size (double size)
{
  for (guint i = 0; i < G_N_ELEMENTS (standard_sizes); i++)
    if (size == standard_sizes[i])
      return TRUE;
  return FALSE;
}

/* From 15 on the colours run white, yellow, red, blue, green, black and
 * start again at 45 and at 90. */
CwHandleColour
cw_iso_handle_colour (double size)
{
  static const CwHandleColour cycle[] = {
    CW_HANDLE_WHITE, CW_HANDLE_YELLOW, CW_HANDLE_RED,
    CW_HANDLE_BLUE, CW_HANDLE_GREEN, CW_HANDLE_BLACK,
  };
  int n = (int) size;
  int index;

  if (!cw_iso_is_standard_size (size))
    return CW_HANDLE_NONE;
  if (n == 6)
    return CW_HANDLE_PINK;
  if (n == 8)
    return CW_HANDLE_GREY;
  if (n == 10)
    return CW_HANDLE_PURPLE;
  if (n <= 40)
    index = (n - 15) / 5;
  else if (n <= 60)
    index = (n - 45) / 5;
  else if (n <= 80)
    index = 4 + (n - 70) / 10;
  else
    index = (n - 90) / 10;
  return cycle[index];
}

const char *
cw_handle_colour_name (CwHandleColour colour)
{
  static const char *names[] = {
    "none", "pink", "grey", "purple", "white", "yellow", "red", "blue", "green", "black",
  };

  return names[colour];
}

void
cw_handle_colour_rgb (CwHandleColour  colour,
                      double         *r,
                      double         *g,
                      double         *b)
{
  static const double rgb[][3] = {
    { 0.55, 0.55, 0.55 }, { 0.96, 0.60, 0.76 }, { 0.50, 0.50, 0.50 },
    { 0.50, 0.25, 0.65 }, { 0.97, 0.97, 0.95 }, { 0.98, 0.84, 0.10 },
    { 0.85, 0.15, 0.15 }, { 0.15, 0.35, 0.80 }, { 0.15, 0.60, 0.25 },
    { 0.08, 0.08, 0.08 },
  };

  *r = rgb[colour][0];
  *g = rgb[colour][1];
  *b = rgb[colour][2];
}

static gboolean
parse_fdi (const char *code,
           int        *quadrant,
           int        *tooth)
{
  if (code == NULL || strlen (code) != 2 ||
      !g_ascii_isdigit (code[0]) || !g_ascii_isdigit (code[1]))
    return FALSE;
  *quadrant = code[0] - '0';
  *tooth = code[1] - '0';
  if (*quadrant < 1 || *quadrant > 8 || *tooth < 1)
    return FALSE;
  return *tooth <= (*quadrant <= 4 ? 8 : 5);
}

gboolean
cw_tooth_fdi_is_valid (const char *code)
{
  int q, t;

  return parse_fdi (code, &q, &t);
}

gboolean
cw_tooth_universal_is_valid (const char *code)
{
  g_autofree char *fdi = cw_tooth_universal_to_fdi (code);

  return fdi != NULL;
}

/* Permanent teeth are numbered 1-32 from the upper right third molar round
 * to the lower right one; primary teeth A-T the same way. */
char *
cw_tooth_fdi_to_universal (const char *code)
{
  int q, t;

  if (!parse_fdi (code, &q, &t))
    return NULL;
  switch (q)
    {
    case 1: return g_strdup_printf ("%d", 9 - t);
    case 2: return g_strdup_printf ("%d", 8 + t);
    case 3: return g_strdup_printf ("%d", 25 - t);
    case 4: return g_strdup_printf ("%d", 24 + t);
    case 5: return g_strdup_printf ("%c", 'A' + (5 - t));
    case 6: return g_strdup_printf ("%c", 'F' + (t - 1));
    case 7: return g_strdup_printf ("%c", 'K' + (5 - t));
    default: return g_strdup_printf ("%c", 'P' + (t - 1));
    }
}

char *
cw_tooth_universal_to_fdi (const char *code)
{
  for (int q = 1; q <= 8; q++)
    for (int t = 1; t <= (q <= 4 ? 8 : 5); t++)
      {
        char fdi[3] = { (char) ('0' + q), (char) ('0' + t), 0 };
        g_autofree char *u = cw_tooth_fdi_to_universal (fdi);

        if (g_strcmp0 (u, code) == 0)
          return g_strdup (fdi);
      }
  return NULL;
}
