/* cw-window-library.c: the window's commands on the instrument library
 *
 * A case takes copies of library instruments, as one undoable edit, so
 * that it opens the same after the library changes; the shelf marks a copy
 * that no longer matches the library's.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-window"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-libraries.h"
#include "cw-library-window.h"
#include "cw-window-private.h"

#define LIBRARY_WINDOW_KEY "cw-library-window"

static void
free_weak_ref (GWeakRef *ref)
{
  g_weak_ref_clear (ref);
  g_free (ref);
}

/* One library window for each case window, raised when asked again. */
static CwLibraryWindow *
library_window (CwWindow *self)
{
  GWeakRef *ref = g_object_get_data (G_OBJECT (self), LIBRARY_WINDOW_KEY);
  g_autoptr(CwLibraryWindow) existing = ref ? g_weak_ref_get (ref) : NULL;
  CwLibraryWindow *window;

  if (existing)
    return existing;
  window = cw_library_window_new (GTK_WINDOW (self), cw_libraries_get_default ());
  ref = g_new0 (GWeakRef, 1);
  g_weak_ref_init (ref, window);
  g_object_set_data_full (G_OBJECT (self), LIBRARY_WINDOW_KEY, ref, (GDestroyNotify) free_weak_ref);
  return window;
}

static void
show_library_action (GtkWidget  *widget,
                     const char *name,
                     GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  CwLibraryWindow *window = library_window (self);
  const char *id = cw_document_get_instrument (self->document);

  if (id && g_str_equal (name, "win.show-library"))
    cw_library_window_select (window, id);
  gtk_window_present (GTK_WINDOW (window));
}

static void
report_not_added (CwWindow     *self,
                  const GError *error)
{
  _cw_window_show_error (self, _("Not every instrument was added to the case"), error);
}

/* win.add-library-instruments: copies of these instruments of the current
 * library into the case.  A copy already in the case is not added again;
 * an id the case uses for another instrument gets a new one. */
static void
add_library_instruments_action (GtkWidget  *widget,
                                const char *name,
                                GVariant   *param)
{
  CwWindow *self = CW_WINDOW (widget);
  const CwLibrary *library = cw_libraries_get_current (cw_libraries_get_default ());
  g_autofree const char **ids = g_variant_get_strv (param, NULL);
  g_autoptr(GError) error = NULL;
  g_autofree char *first = NULL;
  guint before = cw_document_get_case (self->document)->instruments->len;
  CwCase *kase = cw_document_begin_edit (self->document, _("Add Instruments from the Library"));

  for (guint i = 0; ids[i] && error == NULL; i++)
    {
      const CwInstrument *instrument = cw_library_lookup (library, ids[i]);
      const char *added = instrument ? cw_case_add_library_copy (kase, instrument, &error) : NULL;

      if (added && first == NULL)
        first = g_strdup (added);
    }
  if (kase->instruments->len > before)
    cw_document_end_edit (self->document);
  else
    cw_document_cancel_edit (self->document);
  if (first)
    cw_document_set_instrument (self->document, first);
  if (error)
    report_not_added (self, error);
}

void
_cw_window_install_library_actions (GtkWidgetClass *klass)
{
  gtk_widget_class_install_action (klass, "win.show-library", NULL, show_library_action);
  gtk_widget_class_install_action (klass, "win.add-from-library", NULL, show_library_action);
  gtk_widget_class_install_action (klass, "win.add-library-instruments", "as", add_library_instruments_action);
}

void
_cw_window_setup_library (CwWindow *self)
{
  g_menu_append (self->library_section, _("Instrument _Library…"), "win.show-library");
  g_menu_append (self->library_section, _("Add Instruments from the Li_brary…"), "win.add-from-library");
  cw_shelf_set_libraries (self->shelf, cw_libraries_get_default ());
}
