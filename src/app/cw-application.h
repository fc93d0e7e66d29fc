/* cw-application.h
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define CW_APPLICATION_ID "org.canalwright.Canalwright"
#define CW_TYPE_APPLICATION (cw_application_get_type ())

G_DECLARE_FINAL_TYPE (CwApplication, cw_application, CW, APPLICATION, GtkApplication)

CwApplication *cw_application_new           (void);
GSettings     *cw_application_get_settings  (CwApplication *self);
void           cw_application_show_cautions (CwApplication *self,
                                             GtkWindow     *parent);

G_END_DECLS
