/* cw-headless.c: dispatch of the commands that need no display
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "canalwright"

#include "config.h"

#include <glib/gi18n.h>
#include <string.h>

#include "cw-check.h"
#include "cw-export-cli.h"
#include "cw-frames-cli.h"
#include "cw-headless.h"
#include "cw-propose.h"

typedef struct
{
  const char *option;
  const char *arguments;
  const char *summary;
  int       (*run) (int argc, char **argv);
} Command;

/* canalwright --check CASE */
static int
run_check (int    argc,
           char **argv)
{
  if (argc != 1)
    return -1;
  return cw_check_run (argv[0]);
}

/* canalwright --propose CASE [--canal NAME] */
static int
run_propose (int    argc,
             char **argv)
{
  const char *path = NULL, *canal = NULL;

  for (int i = 0; i < argc; i++)
    if (strcmp (argv[i], "--canal") == 0 && i + 1 < argc && canal == NULL)
      canal = argv[++i];
    else if (path == NULL && argv[i][0] != '-')
      path = argv[i];
    else
      return -1;
  if (path == NULL)
    return -1;
  return cw_propose_run (path, canal);
}

/* canalwright --export OUT CASE [--canal NAME] [--dpi N] */
static int
run_export (int    argc,
            char **argv)
{
  return cw_export_cli_run (argc, argv);
}

/* Each command gets the arguments after its option; -1 means a usage error. */
static const Command commands[] = {
  { "--check", "CASE.cwcase", N_("Check every canal's sequence and print the findings as JSON"), run_check },
  { "--propose", "CASE.cwcase [--canal NAME]", N_("Plan the best sequence for each canal and print the plans as JSON"), run_propose },
  { "--export", "OUT.png|OUT.pdf|OUT.svg CASE.cwcase [--canal NAME] [--dpi N] [--paper a4|letter] [--theme light|dark|high-contrast] [--diagrams]",
    N_("Draw the plan: a PDF plan sheet, or a PNG or SVG sequence diagram a canal (OUT-NAME.ext when there are several)"), run_export },
  { "--export-frames", "DIR CASE.cwcase [--canal NAME] [--frames-per-step N] [--dpi N] [--overlays LIST] [--theme light|dark|high-contrast]",
    N_("Draw every playback frame as a PNG slide: DIR/CANAL-STEP-FRAME.png"), cw_frames_cli_run },
};

void
cw_headless_usage (FILE *out)
{
  fprintf (out, "%s\n  canalwright [CASE.cwcase]\n", _("Usage:"));
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    fprintf (out, "  canalwright %s %s\n      %s\n", commands[i].option,
             commands[i].arguments, _(commands[i].summary));
  fprintf (out, "  canalwright --help\n      %s\n", _("Show this help"));
}

gboolean
cw_headless_dispatch (int    argc,
                      char **argv,
                      int   *status)
{
  if (argc < 2)
    return FALSE;
  if (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0)
    {
      cw_headless_usage (stdout);
      *status = 0;
      return TRUE;
    }
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    if (strcmp (argv[1], commands[i].option) == 0)
      {
        *status = commands[i].run (argc - 2, argv + 2);
        if (*status < 0)
          {
            cw_headless_usage (stderr);
            *status = 2;
          }
        return TRUE;
      }
  return FALSE;
}
