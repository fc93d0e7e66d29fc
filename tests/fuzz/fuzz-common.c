/* fuzz-common.c
 *
 * A warning or a critical from the program's own code means a state its
 * authors thought impossible, so under the fuzzer they abort like a crash.
 * So do the targets' own checks (g_assert, g_error).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "cw-error.h"
#include "fuzz-common.h"

/* GLib ends a fatal message with a breakpoint trap, which libFuzzer does
 * not catch: abort instead, so that the input is saved. */
static void
fatal_handler (const char     *domain,
               GLogLevelFlags  level,
               const char     *message,
               gpointer        data)
{
  if ((level & (G_LOG_LEVEL_ERROR | G_LOG_LEVEL_CRITICAL | G_LOG_LEVEL_WARNING | G_LOG_FLAG_FATAL)) == 0)
    {
      g_log_default_handler (domain, level, message, data);
      return;
    }
  /* Not through the default handler, which traps on G_LOG_LEVEL_ERROR. */
  fprintf (stderr, "%s: %s\n", domain ? domain : "fuzz", message);
  abort ();
}

static void
fuzz_init_once (void)
{
  static gboolean done;

  if (done)
    return;
  done = TRUE;
  g_log_set_default_handler (fatal_handler, NULL);
}

/* A refusal must be one of ours, name the file and be text a window can
 * show; a case, only whole. */
CwCase *
cw_fuzz_load (const uint8_t *data,
              size_t         size)
{
  g_autoptr(GError) error = NULL;
  CwCase *kase;

  fuzz_init_once ();
  kase = cw_case_load_from_data (size > 0 ? (const char *) data : "", (gssize) size, CW_FUZZ_FILE, &error);
  if (kase == NULL)
    {
      g_assert_nonnull (error);
      g_assert_true (error->domain == CW_ERROR);
      g_assert_true (g_str_has_prefix (error->message, CW_FUZZ_FILE ": "));
      g_assert_true (g_utf8_validate (error->message, -1, NULL));
      return NULL;
    }
  g_assert_no_error (error);
  g_assert_cmpuint (kase->canals->len, >=, 1);
  g_assert_cmpuint (kase->canals->len, <=, CW_MAX_CANALS);
  g_assert_cmpuint (kase->instruments->len, <=, CW_MAX_INSTRUMENTS);
  return kase;
}
