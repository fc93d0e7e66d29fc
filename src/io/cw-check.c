/* cw-check.c: canalwright --check CASE
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-check"

#include <glib/gi18n-lib.h>
#include <stdio.h>

#include "cw-case-loader.h"
#include "cw-check.h"
#include "cw-json-writer.h"
#include "cw-report.h"

int
cw_check_run (const char *path)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) kase = NULL;
  g_autoptr(JsonNode) root = NULL;
  g_autofree char *text = NULL;
  gboolean any_stop;

  kase = cw_case_load (path, &error);
  if (kase == NULL)
    {
      fprintf (stderr, "canalwright: %s\n", error->message);
      return 2;
    }
  root = cw_report_case (kase, &any_stop);
  text = cw_json_write (root, TRUE);
  fputs (text, stdout);
  fflush (stdout);
  return any_stop ? 3 : 0;
}
