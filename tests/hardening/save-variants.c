/* save-variants.c
 *
 * Versions A and B of a case differ in the title, the first step's depth
 * and a long note, so that a file holding parts of both cannot pass for
 * either and a save takes long enough to be interrupted.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include "save-variants.h"

static char *
make_notes (char  which,
            gsize size)
{
  GString *notes = g_string_sized_new (size + 80);
  guint line = 0;

  while (notes->len < size)
    g_string_append_printf (notes, "Version %c, line %u: the long note that makes a save slow.\n",
                            which, ++line);
  return g_string_free (notes, FALSE);
}

CwCase *
cw_save_variant (const CwCase *base,
                 char          which,
                 gsize         notes_size)
{
  CwCase *kase = cw_case_copy (base);
  CwCanal *canal;
  CwStep *step;

  g_assert (which == 'A' || which == 'B');
  g_assert_cmpuint (kase->canals->len, >, 0);
  g_free (kase->title);
  kase->title = g_strdup_printf ("Version %c", which);
  g_free (kase->notes);
  kase->notes = make_notes (which, notes_size);
  canal = g_ptr_array_index (kase->canals, 0);
  g_assert_cmpuint (cw_canal_get_n_steps (canal), >, 0);
  step = cw_canal_get_step (canal, 0);
  step->depth = which == 'A' ? 10.0 : 10.5;
  return kase;
}
