/* cw-library-window.c
 *
 * The current library as a sortable, searchable table, and the commands
 * on its instruments.  Every change is saved to the library file by
 * CwLibraries before the table shows it; cases are not touched, they keep
 * their own copies.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-library-window"

#include "config.h"

#include <glib/gi18n.h>
#include <string.h>

#include "cw-instrument-editor.h"
#include "cw-instrument-item.h"
#include "cw-library-window-private.h"
#include "cw-render-text.h"
#include "cw-shelf.h"

G_DEFINE_FINAL_TYPE (CwLibraryWindow, cw_library_window, GTK_TYPE_WINDOW)

typedef enum
{
  COLUMN_LABEL,
  COLUMN_SIZE,
  COLUMN_TAPER,
  COLUMN_ALLOY,
  COLUMN_MOTION,
  COLUMN_LENGTH,
} Column;

void
_cw_library_window_show_error (CwLibraryWindow *self,
                               const char      *primary,
                               const GError    *error)
{
  GtkWidget *dialog = gtk_message_dialog_new (GTK_WINDOW (self),
                                              GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                              GTK_MESSAGE_ERROR, GTK_BUTTONS_CLOSE, "%s", primary);

  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s", error->message);
  g_signal_connect (dialog, "response", G_CALLBACK (gtk_window_destroy), NULL);
  gtk_window_present (GTK_WINDOW (dialog));
}

/* The selection, as items in the order the table shows them. */
static GPtrArray *
selected_items (CwLibraryWindow *self)
{
  GListModel *model = G_LIST_MODEL (self->selection);
  g_autoptr(GtkBitset) set = gtk_selection_model_get_selection (GTK_SELECTION_MODEL (self->selection));
  GPtrArray *items = g_ptr_array_new_with_free_func (g_object_unref);
  GtkBitsetIter iter;
  guint position;

  for (gboolean more = gtk_bitset_iter_init_first (&iter, set, &position); more;
       more = gtk_bitset_iter_next (&iter, &position))
    g_ptr_array_add (items, g_list_model_get_item (model, position));
  return items;
}

static CwInstrumentItem *
first_selected (CwLibraryWindow *self)
{
  g_autoptr(GPtrArray) items = selected_items (self);

  return items->len > 0 ? g_object_ref (g_ptr_array_index (items, 0)) : NULL;
}

static char *
count_text (guint shown,
            guint total)
{
  if (shown < total)
    return g_strdup_printf (_("%u of %u instruments"), shown, total);
  return g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%u instrument", "%u instruments", total), total);
}

static void
update_actions (CwLibraryWindow *self)
{
  g_autoptr(GtkBitset) set = gtk_selection_model_get_selection (GTK_SELECTION_MODEL (self->selection));
  guint64 n = gtk_bitset_get_size (set);
  g_autofree char *count = count_text (g_list_model_get_n_items (G_LIST_MODEL (self->selection)),
                                       g_list_model_get_n_items (G_LIST_MODEL (self->store)));

  gtk_label_set_label (self->count_label, count);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "library.duplicate", n == 1);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "library.edit", n == 1);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "library.remove", n > 0);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "library.add-to-case", n > 0 && self->case_window != NULL);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "library.delete",
                                 cw_libraries_get_n_libraries (self->libraries) > 1);
}

/* GTK 4.8 has no gtk_column_view_scroll_to: the list inside has the action. */
static void
scroll_to (CwLibraryWindow *self,
           guint            position)
{
  for (GtkWidget *child = gtk_widget_get_first_child (GTK_WIDGET (self->column_view)); child;
       child = gtk_widget_get_next_sibling (child))
    if (GTK_IS_LIST_VIEW (child))
      gtk_widget_activate_action (child, "list.scroll-to-item", "u", position);
}

void
cw_library_window_select (CwLibraryWindow *self,
                          const char      *id)
{
  GListModel *model;

  g_return_if_fail (CW_IS_LIBRARY_WINDOW (self));

  model = G_LIST_MODEL (self->selection);
  for (guint i = 0; i < g_list_model_get_n_items (model); i++)
    {
      g_autoptr(CwInstrumentItem) item = g_list_model_get_item (model, i);

      if (g_strcmp0 (cw_instrument_item_get_instrument (item)->id, id) == 0)
        {
          gtk_selection_model_select_item (GTK_SELECTION_MODEL (self->selection), i, TRUE);
          scroll_to (self, i);
          return;
        }
    }
}

/* Filling the table and the choice of library. */

static void
fill_names (CwLibraryWindow *self)
{
  guint n = cw_libraries_get_n_libraries (self->libraries);
  guint old = g_list_model_get_n_items (G_LIST_MODEL (self->library_names));
  g_autoptr(GPtrArray) names = g_ptr_array_new ();

  for (guint i = 0; i < n; i++)
    g_ptr_array_add (names, (gpointer) cw_library_display_name (cw_libraries_get_library (self->libraries, i)));
  g_ptr_array_add (names, NULL);
  gtk_string_list_splice (self->library_names, 0, old, (const char * const *) names->pdata);
  gtk_drop_down_set_selected (self->library_drop, cw_libraries_get_current_index (self->libraries));
}

static void
fill_problems (CwLibraryWindow *self)
{
  GPtrArray *problems = cw_libraries_get_problems (self->libraries);
  g_autoptr(GString) text = g_string_new (NULL);

  for (guint i = 0; i < problems->len; i++)
    g_string_append_printf (text, "%s%s", i > 0 ? "\n" : "", (const char *) g_ptr_array_index (problems, i));
  gtk_label_set_label (self->problems_label, text->str);
  gtk_widget_set_visible (GTK_WIDGET (self->problems_label), problems->len > 0);
}

static char **
selected_ids (CwLibraryWindow *self)
{
  g_autoptr(GPtrArray) items = selected_items (self);
  GStrvBuilder *builder = g_strv_builder_new ();
  char **ids;

  for (guint i = 0; i < items->len; i++)
    g_strv_builder_add (builder, cw_instrument_item_get_instrument (g_ptr_array_index (items, i))->id);
  ids = g_strv_builder_end (builder);
  g_strv_builder_unref (builder);
  return ids;
}

static void
fill_store (CwLibraryWindow *self)
{
  const CwLibrary *library = cw_libraries_get_current (self->libraries);
  g_auto(GStrv) keep = selected_ids (self);
  g_autoptr(GPtrArray) items = g_ptr_array_new_with_free_func (g_object_unref);

  for (guint i = 0; i < library->instruments->len; i++)
    g_ptr_array_add (items, cw_instrument_item_new (g_ptr_array_index (library->instruments, i), i));
  g_list_store_splice (self->store, 0, g_list_model_get_n_items (G_LIST_MODEL (self->store)),
                       items->pdata, items->len);
  for (guint i = 0; keep[i]; i++)
    cw_library_window_select (self, keep[i]);
}

static void
libraries_changed (CwLibraryWindow *self)
{
  self->filling = TRUE;
  fill_names (self);
  fill_problems (self);
  fill_store (self);
  self->filling = FALSE;
  update_actions (self);
}

static void
library_chosen (CwLibraryWindow *self)
{
  guint index = gtk_drop_down_get_selected (self->library_drop);

  if (!self->filling && index != GTK_INVALID_LIST_POSITION)
    cw_libraries_set_current_index (self->libraries, index);
}

/* Searching: every word typed must be somewhere in the instrument's text. */

static gboolean
matches (gpointer item,
         gpointer data)
{
  CwLibraryWindow *self = data;
  g_autofree char *text = NULL;
  g_autofree char *folded = NULL;

  if (self->search_words == NULL)
    return TRUE;
  g_object_get (item, "search-text", &text, NULL);
  folded = g_utf8_casefold (text, -1);
  for (guint i = 0; self->search_words[i]; i++)
    if (*self->search_words[i] && strstr (folded, self->search_words[i]) == NULL)
      return FALSE;
  return TRUE;
}

static void
search_changed (CwLibraryWindow *self)
{
  g_autofree char *folded = g_utf8_casefold (gtk_editable_get_text (GTK_EDITABLE (self->search_entry)), -1);

  g_strfreev (self->search_words);
  self->search_words = *g_strstrip (folded) ? g_strsplit_set (folded, " \t", -1) : NULL;
  gtk_filter_changed (self->filter, GTK_FILTER_CHANGE_DIFFERENT);
  update_actions (self);
}

/* The columns. */

static void
setup_cell (GtkSignalListItemFactory *factory,
            GtkListItem              *list_item)
{
  GtkWidget *label = gtk_label_new (NULL);
  Column column = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (factory), "column"));

  gtk_label_set_xalign (GTK_LABEL (label), column == COLUMN_SIZE || column == COLUMN_LENGTH ? 1 : 0);
  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  gtk_list_item_set_child (list_item, label);
}

/* "25/.08→.04" less its size: the taper part of the designation. */
static char *
taper_text (const CwInstrument *instrument)
{
  g_autofree char *name = cw_render_file_name (instrument);
  const char *slash = strchr (name, '/');

  return g_strdup (slash ? slash + 1 : name);
}

static char *
cell_text (const CwInstrument *inst,
           Column              column)
{
  switch (column)
    {
    case COLUMN_SIZE:
      return g_strdup_printf ("%02.0f", inst->tip);
    case COLUMN_TAPER:
      return taper_text (inst);
    case COLUMN_ALLOY:
      return g_strdup (cw_alloy_label (inst->alloy));
    case COLUMN_MOTION:
      return g_strdup (cw_motion_label (inst->motion));
    case COLUMN_LENGTH:
      return g_strdup_printf (_("%g mm"), inst->length);
    case COLUMN_LABEL:
    default:
      return g_strdup (inst->label ? inst->label : inst->id);
    }
}

static void
bind_cell (GtkSignalListItemFactory *factory,
           GtkListItem              *list_item)
{
  Column column = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (factory), "column"));
  CwInstrumentItem *item = gtk_list_item_get_item (list_item);
  g_autofree char *text = cell_text (cw_instrument_item_get_instrument (item), column);

  gtk_label_set_label (GTK_LABEL (gtk_list_item_get_child (list_item)), text);
  if (column == COLUMN_LABEL)
    gtk_widget_set_tooltip_text (gtk_list_item_get_child (list_item), cw_instrument_item_get_instrument (item)->id);
}

static GtkSorter *
column_sorter (Column column)
{
  static const char *properties[] = {
    [COLUMN_LABEL] = "label", [COLUMN_SIZE] = "tip", [COLUMN_TAPER] = "taper",
    [COLUMN_ALLOY] = "alloy", [COLUMN_MOTION] = "motion", [COLUMN_LENGTH] = "length",
  };
  GtkExpression *expression = gtk_property_expression_new (CW_TYPE_INSTRUMENT_ITEM, NULL, properties[column]);

  if (column == COLUMN_SIZE || column == COLUMN_TAPER || column == COLUMN_LENGTH)
    return GTK_SORTER (gtk_numeric_sorter_new (expression));
  return GTK_SORTER (gtk_string_sorter_new (expression));
}

static void
add_column (CwLibraryWindow *self,
            const char      *title,
            Column           column)
{
  GtkListItemFactory *factory = gtk_signal_list_item_factory_new ();
  g_autoptr(GtkSorter) sorter = column_sorter (column);
  g_autoptr(GtkColumnViewColumn) view_column = NULL;

  g_object_set_data (G_OBJECT (factory), "column", GINT_TO_POINTER (column));
  g_signal_connect (factory, "setup", G_CALLBACK (setup_cell), NULL);
  g_signal_connect (factory, "bind", G_CALLBACK (bind_cell), NULL);
  view_column = gtk_column_view_column_new (title, factory);
  gtk_column_view_column_set_sorter (view_column, sorter);
  gtk_column_view_column_set_expand (view_column, column == COLUMN_LABEL);
  gtk_column_view_column_set_resizable (view_column, TRUE);
  gtk_column_view_append_column (self->column_view, view_column);
}

static void
setup_columns (CwLibraryWindow *self)
{
  add_column (self, _("Label"), COLUMN_LABEL);
  add_column (self, _("Size"), COLUMN_SIZE);
  add_column (self, _("Taper"), COLUMN_TAPER);
  add_column (self, _("Alloy"), COLUMN_ALLOY);
  add_column (self, _("Motion"), COLUMN_MOTION);
  add_column (self, _("Length"), COLUMN_LENGTH);
}

/* The model: the library, filtered by the search, sorted by the columns. */
static void
setup_model (CwLibraryWindow *self)
{
  GtkFilterListModel *filtered;
  GtkSortListModel *sorted;

  self->store = g_list_store_new (CW_TYPE_INSTRUMENT_ITEM);
  self->filter = GTK_FILTER (gtk_custom_filter_new (matches, self, NULL));
  filtered = gtk_filter_list_model_new (G_LIST_MODEL (g_object_ref (self->store)), g_object_ref (self->filter));
  sorted = gtk_sort_list_model_new (G_LIST_MODEL (filtered),
                                    g_object_ref (gtk_column_view_get_sorter (self->column_view)));
  self->selection = gtk_multi_selection_new (G_LIST_MODEL (sorted));
  gtk_column_view_set_model (self->column_view, GTK_SELECTION_MODEL (self->selection));
  g_signal_connect_swapped (self->selection, "selection-changed", G_CALLBACK (update_actions), self);
  g_signal_connect_swapped (self->selection, "items-changed", G_CALLBACK (update_actions), self);
}

/* The instrument commands. */

static void
editor_saved (CwInstrumentEditor *editor,
              CwLibraryWindow    *self)
{
  const CwInstrument *instrument = cw_instrument_editor_get_instrument (editor);
  g_autofree char *id = g_strdup (instrument->id);
  g_autoptr(GError) error = NULL;

  if (!cw_libraries_put_instrument (self->libraries, cw_instrument_editor_get_index (editor),
                                    cw_instrument_copy (instrument), &error))
    {
      _cw_library_window_show_error (self, _("The instrument was not saved"), error);
      return;
    }
  gtk_selection_model_unselect_all (GTK_SELECTION_MODEL (self->selection));
  cw_library_window_select (self, id);
}

static void
open_editor (CwLibraryWindow    *self,
             const CwInstrument *instrument,
             int                 index)
{
  CwInstrumentEditor *editor = cw_instrument_editor_new (GTK_WINDOW (self),
                                                         cw_libraries_get_current (self->libraries),
                                                         instrument, index);

  g_signal_connect_object (editor, "saved", G_CALLBACK (editor_saved), self, 0);
  g_set_weak_pointer (&self->editor, GTK_WINDOW (editor));
  gtk_window_present (GTK_WINDOW (editor));
}

static void
add_instrument_action (GtkWidget  *widget,
                       const char *name,
                       GVariant   *param)
{
  open_editor (CW_LIBRARY_WINDOW (widget), NULL, -1);
}

static void
edit_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  g_autoptr(CwInstrumentItem) item = first_selected (self);

  if (item)
    open_editor (self, cw_instrument_item_get_instrument (item), (int) cw_instrument_item_get_position (item));
}

static void
duplicate_action (GtkWidget  *widget,
                  const char *name,
                  GVariant   *param)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  g_autoptr(CwInstrumentItem) item = first_selected (self);
  g_autoptr(CwInstrument) copy = NULL;
  const CwLibrary *library = cw_libraries_get_current (self->libraries);
  g_autofree char *label = NULL;

  if (item == NULL)
    return;
  copy = cw_instrument_copy (cw_instrument_item_get_instrument (item));
  label = g_strdup_printf (_("%s (copy)"), copy->label ? copy->label : copy->id);
  g_free (copy->label);
  copy->label = g_steal_pointer (&label);
  g_free (copy->id);
  copy->id = cw_instrument_unique_id (library->instruments, cw_instrument_item_get_instrument (item)->id);
  open_editor (self, copy, -1);
}

static void
remove_response (GtkDialog       *dialog,
                 int              response,
                 CwLibraryWindow *self)
{
  g_auto(GStrv) ids = selected_ids (self);
  g_autoptr(GError) error = NULL;

  gtk_window_destroy (GTK_WINDOW (dialog));
  if (response != GTK_RESPONSE_ACCEPT)
    return;
  if (!cw_libraries_remove_instruments (self->libraries, (const char **) ids, &error))
    _cw_library_window_show_error (self, _("The instruments were not deleted"), error);
}

static void
remove_action (GtkWidget  *widget,
               const char *name,
               GVariant   *param)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  g_auto(GStrv) ids = selected_ids (self);
  guint n = g_strv_length (ids);
  GtkWidget *dialog;

  if (n == 0)
    return;
  dialog = gtk_message_dialog_new (GTK_WINDOW (self), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                   GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE,
                                   g_dngettext (GETTEXT_PACKAGE, "Delete %u instrument from the library?",
                                                "Delete %u instruments from the library?", n), n);
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (dialog), "%s",
                                            _("Cases that use them keep their own copies."));
  gtk_dialog_add_buttons (GTK_DIALOG (dialog), _("_Cancel"), GTK_RESPONSE_CANCEL,
                          _("_Delete"), GTK_RESPONSE_ACCEPT, NULL);
  g_signal_connect (dialog, "response", G_CALLBACK (remove_response), self);
  gtk_window_present (GTK_WINDOW (dialog));
}

/* The case window does the adding, as one undoable edit. */
static void
add_to_case_action (GtkWidget  *widget,
                    const char *name,
                    GVariant   *param)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (widget);
  g_auto(GStrv) ids = selected_ids (self);

  if (self->case_window == NULL || ids[0] == NULL)
    return;
  gtk_widget_activate_action (GTK_WIDGET (self->case_window), "win.add-library-instruments",
                              "^as", ids);
}

static void
row_activated (GtkColumnView   *view,
               guint            position,
               CwLibraryWindow *self)
{
  gtk_selection_model_select_item (GTK_SELECTION_MODEL (self->selection), position, TRUE);
  gtk_widget_activate_action (GTK_WIDGET (self), "library.edit", NULL);
}

CwLibraryWindow *
cw_library_window_new (GtkWindow   *case_window,
                       CwLibraries *libraries)
{
  CwLibraryWindow *self;

  g_return_val_if_fail (CW_IS_LIBRARIES (libraries), NULL);

  self = g_object_new (CW_TYPE_LIBRARY_WINDOW,
                       "transient-for", case_window,
                       "application", case_window ? gtk_window_get_application (case_window) : NULL,
                       NULL);
  self->libraries = g_object_ref (libraries);
  g_set_weak_pointer (&self->case_window, case_window);
  g_signal_connect_object (libraries, "changed", G_CALLBACK (libraries_changed), self, G_CONNECT_SWAPPED);
  libraries_changed (self);
  return self;
}

GtkWindow *
cw_library_window_get_editor (CwLibraryWindow *self)
{
  g_return_val_if_fail (CW_IS_LIBRARY_WINDOW (self), NULL);
  return self->editor;
}

guint
cw_library_window_get_n_shown (CwLibraryWindow *self)
{
  g_return_val_if_fail (CW_IS_LIBRARY_WINDOW (self), 0);
  return g_list_model_get_n_items (G_LIST_MODEL (self->selection));
}

static void
cw_library_window_dispose (GObject *object)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (object);

  /* The column view lets go of its sorter as it goes, which re-sorts. */
  if (self->selection)
    g_signal_handlers_disconnect_by_data (self->selection, self);
  g_clear_weak_pointer (&self->case_window);
  g_clear_weak_pointer (&self->editor);
  g_clear_object (&self->libraries);
  gtk_widget_dispose_template (GTK_WIDGET (self), CW_TYPE_LIBRARY_WINDOW);
  g_clear_object (&self->selection);
  g_clear_object (&self->filter);
  g_clear_object (&self->store);
  G_OBJECT_CLASS (cw_library_window_parent_class)->dispose (object);
}

static void
cw_library_window_finalize (GObject *object)
{
  CwLibraryWindow *self = CW_LIBRARY_WINDOW (object);

  g_strfreev (self->search_words);
  G_OBJECT_CLASS (cw_library_window_parent_class)->finalize (object);
}

static void
cw_library_window_class_init (CwLibraryWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_library_window_dispose;
  object_class->finalize = cw_library_window_finalize;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/canalwright/Canalwright/cw-library-window.ui");
  gtk_widget_class_bind_template_child (widget_class, CwLibraryWindow, library_drop);
  gtk_widget_class_bind_template_child (widget_class, CwLibraryWindow, library_names);
  gtk_widget_class_bind_template_child (widget_class, CwLibraryWindow, problems_label);
  gtk_widget_class_bind_template_child (widget_class, CwLibraryWindow, search_entry);
  gtk_widget_class_bind_template_child (widget_class, CwLibraryWindow, column_view);
  gtk_widget_class_bind_template_child (widget_class, CwLibraryWindow, count_label);

  gtk_widget_class_install_action (widget_class, "library.add-instrument", NULL, add_instrument_action);
  gtk_widget_class_install_action (widget_class, "library.duplicate", NULL, duplicate_action);
  gtk_widget_class_install_action (widget_class, "library.edit", NULL, edit_action);
  gtk_widget_class_install_action (widget_class, "library.remove", NULL, remove_action);
  gtk_widget_class_install_action (widget_class, "library.add-to-case", NULL, add_to_case_action);
  _cw_library_window_install_file_actions (widget_class);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_w, GDK_CONTROL_MASK, "window.close", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
cw_library_window_init (CwLibraryWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  setup_columns (self);
  setup_model (self);
  g_signal_connect_swapped (self->search_entry, "search-changed", G_CALLBACK (search_changed), self);
  g_signal_connect_swapped (self->library_drop, "notify::selected", G_CALLBACK (library_chosen), self);
  g_signal_connect (self->column_view, "activate", G_CALLBACK (row_activated), self);
  gtk_search_entry_set_key_capture_widget (self->search_entry, GTK_WIDGET (self));
}
