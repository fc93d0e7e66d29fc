/* cw-gui-util.h: driving a real window under Xvfb with xdotool
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-application.h"

G_BEGIN_DECLS

void     cw_gui_init          (int        *argc,
                               char     ***argv);
CwApplication *cw_gui_app     (void);
void     cw_gui_settle        (guint       ms);
gboolean cw_gui_run           (const char *script);
void     cw_gui_screen_point  (GtkWidget  *widget,
                               double      x,
                               double      y,
                               int        *sx,
                               int        *sy);
void     cw_gui_center        (GtkWidget  *widget,
                               int        *sx,
                               int        *sy);
void     cw_gui_drag          (int         x0,
                               int         y0,
                               int         x1,
                               int         y1);
void     cw_gui_click         (int         x,
                               int         y);
void     cw_gui_focus_window (const char *title);
void     cw_gui_key           (const char *keys);
GtkWidget *cw_gui_find_named   (GtkWidget  *root,
                                const char *name);
GtkWidget *cw_gui_find_tile    (GtkWidget  *root,
                                guint       index);
char    *cw_gui_screenshot    (const char *name);

G_END_DECLS
