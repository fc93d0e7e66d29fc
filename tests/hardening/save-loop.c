/* save-loop.c: saves versions B and A of a case in turn, for ever
 *
 * save-loop CASE OUT NOTES_BYTES: the test has written version A to OUT;
 * this prints "ready" once both versions are built and then saves B, A,
 * B, ... through cw_case_save until it is killed.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <stdio.h>
#include <stdlib.h>

#include "cw-case-loader.h"
#include "cw-case-writer.h"
#include "save-variants.h"

int
main (int   argc,
      char *argv[])
{
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) base = NULL;
  g_autoptr(CwCase) a = NULL;
  g_autoptr(CwCase) b = NULL;

  if (argc != 4)
    {
      fprintf (stderr, "usage: save-loop CASE OUT NOTES_BYTES\n");
      return 2;
    }
  base = cw_case_load (argv[1], &error);
  if (base == NULL)
    {
      fprintf (stderr, "save-loop: %s\n", error->message);
      return 1;
    }
  a = cw_save_variant (base, 'A', (gsize) g_ascii_strtoull (argv[3], NULL, 10));
  b = cw_save_variant (base, 'B', (gsize) g_ascii_strtoull (argv[3], NULL, 10));
  fputs ("ready\n", stdout);
  fflush (stdout);
  for (guint i = 0;; i++)
    if (!cw_case_save (i % 2 == 0 ? b : a, argv[2], &error))
      {
        fprintf (stderr, "save-loop: %s\n", error->message);
        return 1;
      }
}
