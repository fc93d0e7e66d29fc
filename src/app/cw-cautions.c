/* cw-cautions.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-cautions"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-cautions.h"

const char *
cw_cautions_text (void)
{
  return _("Canalwright is a planning aid. Lengths from a radiograph are estimates: "
           "confirm the working length with an electronic apex locator and a radiograph. "
           "The instrument maker's instructions for use, your clinical judgement and local "
           "regulations come first. The default rules are rules of thumb and the alloy "
           "figures are illustrative, not data for clinical decisions.");
}

static void
on_response (GtkDialog *dialog,
             int        response,
             gpointer   user_data)
{
  gtk_window_destroy (GTK_WINDOW (dialog));
}

void
cw_cautions_show (GtkWindow *parent)
{
  GtkWidget *dialog;

  dialog = gtk_message_dialog_new (parent,
                                   GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_INFO, GTK_BUTTONS_NONE,
                                   "%s", _("Before you plan"));
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s", cw_cautions_text ());
  gtk_dialog_add_button (GTK_DIALOG (dialog), _("_I Understand"), GTK_RESPONSE_ACCEPT);
  gtk_dialog_set_default_response (GTK_DIALOG (dialog), GTK_RESPONSE_ACCEPT);
  gtk_widget_add_css_class (dialog, "cautions");
  g_signal_connect (dialog, "response", G_CALLBACK (on_response), NULL);
  gtk_window_present (GTK_WINDOW (dialog));
}
