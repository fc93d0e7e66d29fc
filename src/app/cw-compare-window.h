/* cw-compare-window.h: two sequences of one canal side by side
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-case.h"

G_BEGIN_DECLS

#define CW_TYPE_COMPARE_WINDOW (cw_compare_window_get_type ())

G_DECLARE_FINAL_TYPE (CwCompareWindow, cw_compare_window, CW, COMPARE_WINDOW, GtkWindow)

GtkWidget *cw_compare_window_new (GtkWindow     *parent,
                                  const CwCase  *kase,
                                  const CwCanal *left,
                                  const char    *left_title,
                                  const CwCanal *right,
                                  const char    *right_title);
char      *cw_compare_window_dup_difference (CwCompareWindow *self);

G_END_DECLS
