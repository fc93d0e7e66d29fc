/* main.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "canalwright"

#include "config.h"

#include <glib/gi18n.h>
#include <locale.h>
#include <stdio.h>
#include <string.h>

#include "cw-check.h"

static void
print_usage (FILE *out)
{
  fprintf (out, "%s\n", _("Usage:"));
  fprintf (out, "  canalwright --check CASE.cwcase    %s\n",
           _("Check every canal's sequence and print the findings as JSON"));
  fprintf (out, "  canalwright --help                 %s\n", _("Show this help"));
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  /* The headless commands run before any display is touched. */
  if (argc >= 2 && strcmp (argv[1], "--check") == 0)
    {
      if (argc != 3)
        {
          print_usage (stderr);
          return 2;
        }
      return cw_check_run (argv[2]);
    }
  if (argc >= 2 && (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0))
    {
      print_usage (stdout);
      return 0;
    }
  print_usage (stderr);
  return argc > 1 ? 2 : 0;
}
