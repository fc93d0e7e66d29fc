/* cw-help-window.c
 *
 * The guide is plain text in the resources: "# " and "## " start headings,
 * "- " starts a list item, anything else is a paragraph.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-help"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-help-window.h"

struct _CwHelpWindow
{
  GtkWindow parent_instance;
};

G_DEFINE_FINAL_TYPE (CwHelpWindow, cw_help_window, GTK_TYPE_WINDOW)

static GtkWidget *
guide_line (const char *line)
{
  GtkWidget *label;
  g_autofree char *text = NULL;

  if (g_str_has_prefix (line, "## "))
    text = g_markup_printf_escaped ("<span size='large' weight='bold'>%s</span>", line + 3);
  else if (g_str_has_prefix (line, "# "))
    text = g_markup_printf_escaped ("<span size='x-large' weight='bold'>%s</span>", line + 2);
  else if (g_str_has_prefix (line, "- "))
    text = g_markup_printf_escaped ("•  %s", line + 2);
  else
    text = g_markup_escape_text (line, -1);
  label = gtk_label_new (NULL);
  gtk_label_set_markup (GTK_LABEL (label), text);
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_selectable (GTK_LABEL (label), TRUE);
  if (g_str_has_prefix (line, "- "))
    gtk_widget_set_margin_start (label, 12);
  if (g_str_has_prefix (line, "#"))
    gtk_widget_set_margin_top (label, 10);
  return label;
}

GtkWidget *
cw_help_window_new (GtkWindow *parent)
{
  GtkWidget *self = g_object_new (CW_TYPE_HELP_WINDOW,
                                  "title", _("Canalwright Help"),
                                  "default-width", 640,
                                  "default-height", 720,
                                  "transient-for", parent,
                                  NULL);
  g_autoptr(GBytes) bytes = g_resources_lookup_data ("/org/canalwright/Canalwright/help/guide.txt", 0, NULL);
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  GtkWidget *scroller = gtk_scrolled_window_new ();
  g_auto(GStrv) lines = NULL;

  g_return_val_if_fail (bytes != NULL, self);

  lines = g_strsplit (g_bytes_get_data (bytes, NULL), "\n", -1);
  for (guint i = 0; lines[i]; i++)
    if (*lines[i])
      gtk_box_append (GTK_BOX (box), guide_line (lines[i]));
  gtk_widget_set_margin_start (box, 24);
  gtk_widget_set_margin_end (box, 24);
  gtk_widget_set_margin_top (box, 12);
  gtk_widget_set_margin_bottom (box, 24);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), box);
  gtk_window_set_child (GTK_WINDOW (self), scroller);
  return self;
}

static void
cw_help_window_class_init (CwHelpWindowClass *klass)
{
  gtk_widget_class_add_binding_action (GTK_WIDGET_CLASS (klass), GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
cw_help_window_init (CwHelpWindow *self)
{
}
