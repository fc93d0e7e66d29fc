/* cw-window-plan.c: propose sequences for the current canal
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-window"

#include "config.h"

#include "cw-propose-window.h"
#include "cw-window-private.h"

static void
propose_action (GtkWidget  *widget,
                const char *name,
                GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  GtkWidget *window = cw_propose_window_new (GTK_WINDOW (self), self->document);

  gtk_window_present (GTK_WINDOW (window));
}

void
_cw_window_install_plan_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.propose", NULL, propose_action);
}
