/* cw-window-private.h
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-autosave.h"
#include "cw-canal-editor.h"
#include "cw-canal-view.h"
#include "cw-inspector.h"
#include "cw-sequence-strip.h"
#include "cw-shelf.h"
#include "cw-window.h"

G_BEGIN_DECLS

struct _CwWindow
{
  GtkApplicationWindow  parent_instance;

  CwDocument           *document;
  CwAutosave           *autosave;
  gboolean              close_confirmed;

  GtkLabel             *title_label;
  GtkLabel             *subtitle_label;
  GtkBox               *canal_switcher;
  CwShelf              *shelf;
  CwCanalView          *canal_view;
  CwInspector          *inspector;
  CwCanalEditor        *canal_editor;
  CwSequenceStrip      *strip;
  GtkStack             *side_stack;
  GMenu                *recent_menu;
  GMenu                *library_section;   /* filled by cw-window-library.c */
  GMenu                *teaching_section;  /* filled by cw-window-teaching.c */
};

void _cw_window_install_actions (GtkWidgetClass *widget_class);
void _cw_window_install_export_actions (GtkWidgetClass *widget_class);
void _cw_window_install_teaching_actions (GtkWidgetClass *klass);
void _cw_window_setup_teaching  (CwWindow       *self);
CwPlayback *_cw_window_get_playback (CwWindow   *self);
gboolean _cw_window_export_frames (CwWindow       *self,
                                   const char     *dir,
                                   guint           frames_per_step,
                                   GError        **error);
void _cw_window_install_library_actions (GtkWidgetClass *klass);
void _cw_window_setup_library   (CwWindow       *self);
void _cw_window_install_plan_actions   (GtkWidgetClass *widget_class);
gboolean _cw_window_print_to_file (CwWindow       *self,
                                   const char     *path,
                                   GError        **error);
void _cw_window_update_actions  (CwWindow       *self);
void _cw_window_save_as         (CwWindow       *self,
                                 gboolean        close_after);
void _cw_window_show_error      (CwWindow       *self,
                                 const char     *primary,
                                 const GError   *error);

G_END_DECLS
