/* fuzz-load.c: libFuzzer target for the case loader
 *
 * Besides not crashing, a case that loads must save to text that loads
 * again to the same case, byte for byte: what the user saves is what the
 * next colleague opens.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include "cw-case-writer.h"
#include "fuzz-common.h"

static void
check_round_trip (const CwCase *kase)
{
  g_autofree char *first = cw_case_to_data (kase);
  g_autoptr(CwCase) copy = cw_case_copy (kase);
  g_autofree char *copied = cw_case_to_data (copy);
  g_autoptr(GError) error = NULL;
  g_autoptr(CwCase) again = cw_case_load_from_data (first, -1, CW_FUZZ_FILE, &error);
  g_autofree char *second = NULL;

  g_assert_cmpstr (copied, ==, first);
  if (again == NULL)
    g_error ("a loaded case saved to text that does not load: %s", error->message);
  second = cw_case_to_data (again);
  g_assert_cmpstr (second, ==, first);
}

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  g_autoptr(CwCase) kase = cw_fuzz_load (data, size);

  if (kase != NULL)
    check_round_trip (kase);
  return 0;
}
