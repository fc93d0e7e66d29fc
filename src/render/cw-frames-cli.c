/* cw-frames-cli.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-export"

#include <glib/gi18n-lib.h>
#include <stdio.h>
#include <string.h>

#include "cw-case-loader.h"
#include "cw-export.h"
#include "cw-frames-cli.h"
#include "cw-frames-export.h"

typedef struct
{
  const char *dir;
  const char *case_path;
  const char *canal;
  const char *frames;
  const char *dpi;
  const char *overlays;
  const char *theme;
} Arguments;

static int
fail (const char *message)
{
  fprintf (stderr, "canalwright: %s\n", message);
  return 2;
}

static gboolean
take_option (Arguments  *args,
             int         argc,
             char      **argv,
             int        *i)
{
  static const char *names[] = { "--canal", "--frames-per-step", "--dpi", "--overlays", "--theme" };
  const char **slots[] = { &args->canal, &args->frames, &args->dpi, &args->overlays, &args->theme };

  for (guint k = 0; k < G_N_ELEMENTS (names); k++)
    if (strcmp (argv[*i], names[k]) == 0 && *i + 1 < argc)
      {
        *slots[k] = argv[++*i];
        return TRUE;
      }
  return FALSE;
}

static gboolean
parse (Arguments  *args,
       int         argc,
       char      **argv)
{
  for (int i = 0; i < argc; i++)
    {
      if (take_option (args, argc, argv, &i))
        continue;
      if (g_str_has_prefix (argv[i], "--"))
        return FALSE;
      if (args->dir == NULL)
        args->dir = argv[i];
      else if (args->case_path == NULL)
        args->case_path = argv[i];
      else
        return FALSE;
    }
  return args->case_path != NULL;
}

static gboolean
parse_number (const char *text,
              double      low,
              double      high,
              double     *value)
{
  char *end = NULL;

  *value = g_ascii_strtod (text, &end);
  return end != text && *end == '\0' && *value >= low && *value <= high;
}

static char *
options_from (const Arguments *args,
              CwFramesOptions *options)
{
  double n;

  cw_frames_options_init (options);
  options->canal = args->canal;
  if (args->frames && (!parse_number (args->frames, 1, CW_FRAMES_MAX_PER_STEP, &n) || n != (guint) n))
    return g_strdup_printf (_("--frames-per-step %s: give a whole number from 1 to %d"), args->frames,
                            CW_FRAMES_MAX_PER_STEP);
  if (args->frames)
    options->frames_per_step = (guint) n;
  if (args->dpi && !parse_number (args->dpi, 10, CW_EXPORT_MAX_DPI, &options->dpi))
    return g_strdup_printf (_("--dpi %s: give a number from 10 to %g"), args->dpi, CW_EXPORT_MAX_DPI);
  if (args->overlays && !cw_overlay_flags_parse (args->overlays, &options->overlays))
    return g_strdup_printf (_("--overlays %s: give all, none or a list of ruler, strain, ceiling, "
                              "clearance, envelope, engaged, zones"), args->overlays);
  if (args->theme && !cw_render_theme_from_string (args->theme, &options->theme))
    return g_strdup_printf (_("--theme %s: give light, dark or high-contrast"), args->theme);
  return NULL;
}

int
cw_frames_cli_run (int    argc,
                   char **argv)
{
  Arguments args = { 0 };
  CwFramesOptions options;
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = NULL;
  g_autoptr(GPtrArray) written = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *problem = NULL;

  if (!parse (&args, argc, argv))
    return -1;
  problem = options_from (&args, &options);
  if (problem)
    return fail (problem);
  kase = cw_case_load (args.case_path, &error);
  if (kase == NULL || !cw_frames_export (kase, args.dir, &options, written, &error))
    return fail (error->message);
  for (guint i = 0; i < written->len; i++)
    printf ("%s\n", (const char *) g_ptr_array_index (written, i));
  return 0;
}
