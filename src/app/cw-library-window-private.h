/* cw-library-window-private.h
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-library-window.h"

G_BEGIN_DECLS

struct _CwLibraryWindow
{
  GtkWindow           parent_instance;

  CwLibraries        *libraries;
  GtkWindow          *case_window;   /* weak: where "Add to the Case" adds */
  GtkWindow          *editor;        /* weak: the instrument editor, when open */
  GListStore         *store;         /* CwInstrumentItem, in the library's order */
  GtkFilter          *filter;
  GtkMultiSelection  *selection;
  char              **search_words;
  gboolean            filling;

  GtkDropDown        *library_drop;
  GtkStringList      *library_names;
  GtkLabel           *problems_label;
  GtkSearchEntry     *search_entry;
  GtkColumnView      *column_view;
  GtkLabel           *count_label;
};

void _cw_library_window_install_file_actions (GtkWidgetClass  *widget_class);
void _cw_library_window_show_error           (CwLibraryWindow *self,
                                              const char      *primary,
                                              const GError    *error);

G_END_DECLS
