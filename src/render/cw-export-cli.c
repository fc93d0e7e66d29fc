/* cw-export-cli.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-export"

#include <glib/gi18n-lib.h>
#include <stdio.h>
#include <string.h>

#include "cw-case-loader.h"
#include "cw-export-cli.h"
#include "cw-export.h"

typedef struct
{
  const char *out;
  const char *case_path;
  const char *canal;
  const char *dpi;
  const char *paper;
  const char *theme;
  gboolean    diagrams;
} Arguments;

static int
fail (const char *message)
{
  fprintf (stderr, "canalwright: %s\n", message);
  return 2;
}

/* An option with a value takes the next argument. */
static gboolean
take_option (Arguments  *args,
             int         argc,
             char      **argv,
             int        *i)
{
  static const char *names[] = { "--canal", "--dpi", "--paper", "--theme" };
  const char **slots[] = { &args->canal, &args->dpi, &args->paper, &args->theme };

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
      if (strcmp (argv[i], "--diagrams") == 0)
        args->diagrams = TRUE;
      else if (g_str_has_prefix (argv[i], "--"))
        return FALSE;
      else if (args->out == NULL)
        args->out = argv[i];
      else if (args->case_path == NULL)
        args->case_path = argv[i];
      else
        return FALSE;
    }
  return args->case_path != NULL;
}

static gboolean
parse_dpi (const char *text,
           double     *dpi)
{
  char *end = NULL;

  *dpi = g_ascii_strtod (text, &end);
  return end != text && *end == '\0' && *dpi >= 10 && *dpi <= CW_EXPORT_MAX_DPI;
}

/* Turns the arguments into options; a message for the user when one is bad. */
static char *
options_from (const Arguments *args,
              CwExportOptions *options)
{
  CwExportFormat format;

  if (!cw_export_format_for_path (args->out, &format))
    return g_strdup_printf (_("%s: unknown export format (use a name ending in .png, .pdf or .svg)"), args->out);
  cw_export_options_init (options, format);
  options->canal = args->canal;
  options->diagrams = args->diagrams;
  if (args->dpi && !parse_dpi (args->dpi, &options->dpi))
    return g_strdup_printf (_("--dpi %s: give a number from 10 to %g"), args->dpi, CW_EXPORT_MAX_DPI);
  if (args->paper && !cw_paper_from_string (args->paper, &options->paper))
    return g_strdup_printf (_("--paper %s: give a4 or letter"), args->paper);
  if (args->theme && !cw_render_theme_from_string (args->theme, &options->theme))
    return g_strdup_printf (_("--theme %s: give light, dark or high-contrast"), args->theme);
  return NULL;
}

int
cw_export_cli_run (int    argc,
                   char **argv)
{
  Arguments args = { 0 };
  CwExportOptions options;
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
  if (kase == NULL || !cw_export_case (kase, args.out, &options, written, &error))
    return fail (error->message);
  for (guint i = 0; i < written->len; i++)
    printf ("%s\n", (const char *) g_ptr_array_index (written, i));
  return 0;
}
