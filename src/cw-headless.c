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
#include "cw-headless.h"

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

/* Each command gets the arguments after its option; -1 means a usage error. */
static const Command commands[] = {
  { "--check", "CASE.cwcase", N_("Check every canal's sequence and print the findings as JSON"), run_check },
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
