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

#include "cw-application.h"
#include "cw-headless.h"

int
main (int   argc,
      char *argv[])
{
  int status;

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  /* The headless commands run before GTK is touched, so they need no display. */
  if (cw_headless_dispatch (argc, argv, &status))
    return status;

  {
    g_autoptr(CwApplication) app = cw_application_new ();

    return g_application_run (G_APPLICATION (app), argc, argv);
  }
}
