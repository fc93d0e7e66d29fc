/* cw-instrument-editor.c
 *
 * The form is the instrument's JSON object: every keystroke builds that
 * object from the fields' text and checks it with the loader's own
 * instrument reader, so the editor refuses exactly what a library file
 * would, in the same words, and the profile shows what would be saved.
 * Text that is not a number goes in as text, and the loader says so.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-instrument-editor"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "cw-instrument-editor.h"
#include "cw-iso.h"
#include "cw-json-check.h"
#include "cw-json-writer.h"
#include "cw-library-folder.h"
#include "cw-profile-preview.h"
#include "cw-shelf.h"

typedef struct
{
  GtkWidget *from;
  GtkEntry  *to;
  GtkEntry  *taper;
  GtkWidget *remove;
} SegmentRow;

struct _CwInstrumentEditor
{
  GtkWindow         parent_instance;

  CwLibrary        *library;          /* a copy: ids are checked against it */
  int               index;            /* in the library; -1 for a new one */
  char             *extra_json;       /* members the form does not show, kept */
  CwInstrument     *checked;          /* the form as it last checked, or NULL */
  char             *message;
  GArray           *tips;             /* double: the sizes in tip_drop */
  GArray           *segments;         /* SegmentRow */
  GtkWidget        *marked;           /* the field the message is about */
  gboolean          id_follows_label;
  gboolean          filling;

  GtkWidget        *save_button;
  GtkEntry         *label_entry;
  GtkEntry         *id_entry;
  GtkDropDown      *tip_drop;
  GtkStringList    *tip_sizes;
  GtkCheckButton   *constant_button;
  GtkCheckButton   *segments_button;
  GtkEntry         *taper_entry;
  GtkWidget        *segments_box;
  GtkGrid          *segments_grid;
  GtkEntry         *flute_entry;
  GtkEntry         *length_entry;
  GtkEntry         *max_flute_entry;
  GtkDropDown      *alloy_drop;
  GtkStringList    *alloys;
  GtkDropDown      *motion_drop;
  GtkStringList    *motions;
  GtkEntry         *rpm_entry;
  GtkEntry         *torque_entry;
  GtkEntry         *uses_entry;
  CwProfilePreview *preview;
  GtkLabel         *message_label;
};

G_DEFINE_FINAL_TYPE (CwInstrumentEditor, cw_instrument_editor, GTK_TYPE_WINDOW)

enum {
  SAVED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

static void check (CwInstrumentEditor *self);

/* The shortest text that reads back as the same number; empty for none. */
static char *
number_text (double value)
{
  GString *out;

  if (isnan (value))
    return g_strdup ("");
  out = g_string_new (NULL);
  cw_json_append_number (out, value);
  return g_string_free (out, FALSE);
}

static void
set_number (GtkEntry *entry,
            double    value)
{
  g_autofree char *text = number_text (value);

  gtk_editable_set_text (GTK_EDITABLE (entry), text);
}

/* A number where the text is one (with a point or a comma), the text
 * itself where it is not, nothing where it is empty. */
static JsonNode *
text_node (GtkEntry *entry)
{
  g_autofree char *text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (entry))));
  g_autofree char *c_text = g_strdup (text);
  char *end = NULL;
  double value;

  if (*text == '\0')
    return NULL;
  g_strdelimit (c_text, ",", '.');
  value = g_ascii_strtod (c_text, &end);
  if (end == c_text || *end != '\0' || !isfinite (value))
    return json_node_init_string (json_node_alloc (), text);
  if (value == floor (value) && fabs (value) < 1e15)
    return json_node_init_int (json_node_alloc (), (gint64) value);
  return json_node_init_double (json_node_alloc (), value);
}

static void
set_member (JsonObject *object,
            const char *key,
            GtkEntry   *entry)
{
  JsonNode *node = text_node (entry);

  if (node != NULL)
    json_object_set_member (object, key, node);
}

/* Segments. */

static void
update_from_labels (CwInstrumentEditor *self)
{
  const char *from = "0";

  for (guint i = 0; i < self->segments->len; i++)
    {
      SegmentRow *row = &g_array_index (self->segments, SegmentRow, i);
      g_autofree char *text = g_strdup_printf (_("from %s mm to"), *from ? from : "…");

      gtk_label_set_label (GTK_LABEL (row->from), text);
      from = gtk_editable_get_text (GTK_EDITABLE (row->to));
    }
}

static void
remove_clicked (GtkButton          *button,
                CwInstrumentEditor *self)
{
  for (guint i = 0; i < self->segments->len; i++)
    {
      SegmentRow *row = &g_array_index (self->segments, SegmentRow, i);

      if (row->remove != GTK_WIDGET (button))
        continue;
      gtk_grid_remove_row (self->segments_grid, (int) i);
      g_array_remove_index (self->segments, i);
      break;
    }
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.add-segment", self->segments->len < CW_MAX_SEGMENTS);
  update_from_labels (self);
  check (self);
}

static GtkEntry *
segment_entry (CwInstrumentEditor *self,
               const char         *text,
               const char         *a11y,
               guint               row)
{
  GtkWidget *entry = gtk_entry_new ();
  g_autofree char *name = g_strdup_printf ("%s-%u", a11y, row);

  gtk_editable_set_text (GTK_EDITABLE (entry), text);
  gtk_editable_set_width_chars (GTK_EDITABLE (entry), 6);
  gtk_entry_set_activates_default (GTK_ENTRY (entry), TRUE);
  gtk_widget_set_name (entry, name);
  gtk_accessible_update_property (GTK_ACCESSIBLE (entry), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  g_str_equal (a11y, "segment-to") ? _("Segment end (mm)") : _("Segment taper"), -1);
  g_signal_connect_swapped (entry, "changed", G_CALLBACK (update_from_labels), self);
  g_signal_connect_swapped (entry, "changed", G_CALLBACK (check), self);
  return GTK_ENTRY (entry);
}

static void
add_segment_row (CwInstrumentEditor *self,
                 const char         *to,
                 const char         *taper)
{
  guint i = self->segments->len;
  SegmentRow row;
  GtkWidget *taper_label = gtk_label_new (_("mm, taper"));

  row.from = gtk_label_new (NULL);
  gtk_label_set_xalign (GTK_LABEL (row.from), 1);
  row.to = segment_entry (self, to, "segment-to", i);
  row.taper = segment_entry (self, taper, "segment-taper", i);
  row.remove = gtk_button_new_from_icon_name ("list-remove-symbolic");
  gtk_widget_set_tooltip_text (row.remove, _("Remove this segment"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (row.remove), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Remove this segment"), -1);
  g_signal_connect (row.remove, "clicked", G_CALLBACK (remove_clicked), self);
  gtk_grid_attach (self->segments_grid, row.from, 0, (int) i, 1, 1);
  gtk_grid_attach (self->segments_grid, GTK_WIDGET (row.to), 1, (int) i, 1, 1);
  gtk_grid_attach (self->segments_grid, taper_label, 2, (int) i, 1, 1);
  gtk_grid_attach (self->segments_grid, GTK_WIDGET (row.taper), 3, (int) i, 1, 1);
  gtk_grid_attach (self->segments_grid, row.remove, 4, (int) i, 1, 1);
  g_array_append_val (self->segments, row);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.add-segment", self->segments->len < CW_MAX_SEGMENTS);
  update_from_labels (self);
}

static void
clear_segments (CwInstrumentEditor *self)
{
  while (self->segments->len > 0)
    {
      gtk_grid_remove_row (self->segments_grid, 0);
      g_array_remove_index (self->segments, 0);
    }
}

/* A new segment runs on from the last one, 4 mm further, at its taper. */
static void
add_segment_action (GtkWidget  *widget,
                    const char *name,
                    GVariant   *param)
{
  CwInstrumentEditor *self = CW_INSTRUMENT_EDITOR (widget);
  const char *taper = gtk_editable_get_text (GTK_EDITABLE (self->taper_entry));
  g_autofree char *to = NULL;
  double last = 0;

  if (self->segments->len > 0)
    {
      SegmentRow *row = &g_array_index (self->segments, SegmentRow, self->segments->len - 1);

      last = g_ascii_strtod (gtk_editable_get_text (GTK_EDITABLE (row->to)), NULL);
      taper = gtk_editable_get_text (GTK_EDITABLE (row->taper));
    }
  to = number_text (MIN (last + 4, CW_MAX_LENGTH));
  add_segment_row (self, to, taper);
  check (self);
}

static void
show_taper_form (CwInstrumentEditor *self)
{
  gboolean segmented = gtk_check_button_get_active (self->segments_button);

  gtk_widget_set_visible (GTK_WIDGET (self->taper_entry), !segmented);
  gtk_widget_set_visible (self->segments_box, segmented);
}

/* Switching to segments starts from the constant taper, in two parts. */
static void
taper_form_toggled (CwInstrumentEditor *self)
{
  const char *taper = gtk_editable_get_text (GTK_EDITABLE (self->taper_entry));

  show_taper_form (self);
  if (self->filling)
    return;
  if (gtk_check_button_get_active (self->segments_button) && self->segments->len == 0)
    {
      add_segment_row (self, "4", taper);
      add_segment_row (self, "16", taper);
    }
  check (self);
}

/* The object the loader reads. */

static JsonArray *
segments_json (CwInstrumentEditor *self)
{
  JsonArray *array = json_array_new ();

  for (guint i = 0; i < self->segments->len; i++)
    {
      SegmentRow *row = &g_array_index (self->segments, SegmentRow, i);
      JsonObject *segment = json_object_new ();

      set_member (segment, "to", row->to);
      set_member (segment, "taper", row->taper);
      json_array_add_object_element (array, segment);
    }
  return array;
}

static JsonObject *
form_json (CwInstrumentEditor *self)
{
  JsonObject *object = json_object_new ();
  const char *label = gtk_editable_get_text (GTK_EDITABLE (self->label_entry));
  guint tip = gtk_drop_down_get_selected (self->tip_drop);

  json_object_set_string_member (object, "id", gtk_editable_get_text (GTK_EDITABLE (self->id_entry)));
  if (*label != '\0')
    json_object_set_string_member (object, "label", label);
  if (tip < self->tips->len)
    json_object_set_double_member (object, "tip", g_array_index (self->tips, double, tip));
  if (gtk_check_button_get_active (self->segments_button))
    json_object_set_array_member (object, "taper_segments", segments_json (self));
  else
    set_member (object, "taper", self->taper_entry);
  set_member (object, "flute_length", self->flute_entry);
  set_member (object, "length", self->length_entry);
  set_member (object, "max_flute_diameter", self->max_flute_entry);
  json_object_set_string_member (object, "alloy",
                                 cw_alloy_to_string ((CwAlloy) gtk_drop_down_get_selected (self->alloy_drop)));
  json_object_set_string_member (object, "motion",
                                 cw_motion_to_string ((CwMotion) gtk_drop_down_get_selected (self->motion_drop)));
  set_member (object, "rpm", self->rpm_entry);
  set_member (object, "torque_limit", self->torque_entry);
  set_member (object, "uses_allowed", self->uses_entry);
  cw_json_add_unknown (object, self->extra_json);
  return object;
}

/* Checking. */

static GtkWidget *
segment_field (CwInstrumentEditor *self,
               const char         *path)
{
  guint64 i = g_ascii_strtoull (path + strlen ("taper_segments["), NULL, 10);
  SegmentRow *row;

  if (i >= self->segments->len)
    return GTK_WIDGET (self->segments_grid);
  row = &g_array_index (self->segments, SegmentRow, i);
  return GTK_WIDGET (strstr (path, "].to") ? row->to : row->taper);
}

/* The field a message's path names: "instruments[3].taper_segments[1].to". */
static GtkWidget *
field_for_message (CwInstrumentEditor *self,
                   const char         *message)
{
  const struct { const char *key; gsize offset; } fields[] = {
    { "id", G_STRUCT_OFFSET (CwInstrumentEditor, id_entry) },
    { "label", G_STRUCT_OFFSET (CwInstrumentEditor, label_entry) },
    { "tip", G_STRUCT_OFFSET (CwInstrumentEditor, tip_drop) },
    { "taper", G_STRUCT_OFFSET (CwInstrumentEditor, taper_entry) },
    { "flute_length", G_STRUCT_OFFSET (CwInstrumentEditor, flute_entry) },
    { "length", G_STRUCT_OFFSET (CwInstrumentEditor, length_entry) },
    { "max_flute_diameter", G_STRUCT_OFFSET (CwInstrumentEditor, max_flute_entry) },
    { "rpm", G_STRUCT_OFFSET (CwInstrumentEditor, rpm_entry) },
    { "torque_limit", G_STRUCT_OFFSET (CwInstrumentEditor, torque_entry) },
    { "uses_allowed", G_STRUCT_OFFSET (CwInstrumentEditor, uses_entry) },
  };
  const char *path = strstr (message, "].");

  if (path == NULL)
    return NULL;
  path += 2;
  if (g_str_has_prefix (path, "taper_segments["))
    return segment_field (self, path);
  if (g_str_has_prefix (path, "taper_segments:"))
    return GTK_WIDGET (self->segments_grid);
  for (guint i = 0; i < G_N_ELEMENTS (fields); i++)
    if (g_str_has_prefix (path, fields[i].key) && path[strlen (fields[i].key)] == ':')
      return G_STRUCT_MEMBER (GtkWidget *, self, fields[i].offset);
  return NULL;
}

static void
mark (CwInstrumentEditor *self,
      GtkWidget          *field)
{
  if (self->marked)
    gtk_widget_remove_css_class (self->marked, "error");
  g_set_weak_pointer (&self->marked, field);
  if (field)
    gtk_widget_add_css_class (field, "error");
}

static void
show_message (CwInstrumentEditor *self,
              const char         *message)
{
  g_free (self->message);
  self->message = g_strdup (message);
  gtk_label_set_label (self->message_label, message ? message : _("Every field checks: the instrument can be saved."));
  if (message)
    {
      gtk_widget_remove_css_class (GTK_WIDGET (self->message_label), "dim-label");
      gtk_widget_add_css_class (GTK_WIDGET (self->message_label), "error");
    }
  else
    {
      gtk_widget_remove_css_class (GTK_WIDGET (self->message_label), "error");
      gtk_widget_add_css_class (GTK_WIDGET (self->message_label), "dim-label");
    }
}

static void
check (CwInstrumentEditor *self)
{
  g_autoptr(JsonObject) object = NULL;
  g_autoptr(GError) error = NULL;

  if (self->filling)
    return;
  object = form_json (self);
  g_clear_pointer (&self->checked, cw_instrument_free);
  self->checked = cw_library_check_instrument (self->library, object, self->index, &error);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "editor.save", self->checked != NULL);
  if (self->checked)
    {
      cw_profile_preview_set_instrument (self->preview, self->checked);
      show_message (self, NULL);
      mark (self, NULL);
      return;
    }
  cw_profile_preview_set_stale (self->preview, TRUE);
  show_message (self, error->message);
  mark (self, field_for_message (self, error->message));
}

/* A new instrument's id follows its label until the user types one. */
static void
label_changed (CwInstrumentEditor *self)
{
  g_autofree char *slug = NULL;
  g_autofree char *id = NULL;

  if (self->filling || !self->id_follows_label)
    return;
  slug = cw_library_slug (gtk_editable_get_text (GTK_EDITABLE (self->label_entry)), "file");
  id = cw_instrument_unique_id (self->library->instruments, slug);
  self->filling = TRUE;
  gtk_editable_set_text (GTK_EDITABLE (self->id_entry), id);
  self->filling = FALSE;
}

static void
id_changed (CwInstrumentEditor *self)
{
  if (!self->filling)
    self->id_follows_label = FALSE;
}

/* Filling the form. */

static void
fill_tips (CwInstrumentEditor *self,
           double              tip)
{
  const int *sizes;
  guint n = cw_iso_standard_sizes (&sizes), selected = 0;
  gboolean placed = FALSE;

  for (guint i = 0; i < n || !placed; i++)
    {
      double size = i < n ? sizes[i] : INFINITY;
      g_autofree char *text = NULL;

      /* A size outside the series, from a file written by hand, keeps its place. */
      if (!placed && tip <= size)
        {
          placed = TRUE;
          selected = self->tips->len;
          if (tip < size)
            {
              g_autofree char *odd = g_strdup_printf ("%g", tip);

              g_array_append_val (self->tips, tip);
              gtk_string_list_append (self->tip_sizes, odd);
            }
        }
      if (i >= n)
        break;
      g_array_append_val (self->tips, size);
      text = g_strdup_printf ("%02d", sizes[i]);
      gtk_string_list_append (self->tip_sizes, text);
    }
  gtk_drop_down_set_selected (self->tip_drop, selected);
}

static void
fill_segments (CwInstrumentEditor *self,
               const CwInstrument *instrument)
{
  clear_segments (self);
  for (guint i = 0; instrument->segments && i < instrument->segments->len; i++)
    {
      const CwTaperSegment *segment = &g_array_index (instrument->segments, CwTaperSegment, i);
      g_autofree char *to = number_text (segment->to);
      g_autofree char *taper = number_text (segment->taper);

      add_segment_row (self, to, taper);
    }
}

static void
fill_form (CwInstrumentEditor *self,
           const CwInstrument *instrument)
{
  self->filling = TRUE;
  gtk_editable_set_text (GTK_EDITABLE (self->label_entry), instrument->label ? instrument->label : "");
  gtk_editable_set_text (GTK_EDITABLE (self->id_entry), instrument->id);
  fill_tips (self, instrument->tip);
  set_number (self->taper_entry, instrument->segments ? cw_instrument_nominal_taper (instrument)
                                                      : instrument->taper);
  fill_segments (self, instrument);
  gtk_check_button_set_active (instrument->segments ? self->segments_button : self->constant_button, TRUE);
  show_taper_form (self);
  set_number (self->flute_entry, instrument->flute_length);
  set_number (self->length_entry, instrument->length);
  set_number (self->max_flute_entry, instrument->max_flute_diameter);
  gtk_drop_down_set_selected (self->alloy_drop, instrument->alloy);
  gtk_drop_down_set_selected (self->motion_drop, instrument->motion);
  set_number (self->rpm_entry, instrument->rpm);
  set_number (self->torque_entry, instrument->torque_limit);
  set_number (self->uses_entry, instrument->uses_allowed > 0 ? instrument->uses_allowed : NAN);
  self->extra_json = g_strdup (instrument->extra_json);
  self->filling = FALSE;
}

static CwInstrument *
new_instrument (const CwLibrary *library)
{
  g_autofree char *id = cw_instrument_unique_id (library->instruments, "new-file");
  CwInstrument *instrument = cw_instrument_new (id, 25, 0.04);

  instrument->label = g_strdup (_("new file"));
  instrument->alloy = CW_ALLOY_NITI;
  instrument->motion = CW_MOTION_ROTARY;
  return instrument;
}

CwInstrumentEditor *
cw_instrument_editor_new (GtkWindow          *parent,
                          const CwLibrary    *library,
                          const CwInstrument *instrument,
                          int                 index)
{
  CwInstrumentEditor *self;
  g_autoptr(CwInstrument) fresh = NULL;

  g_return_val_if_fail (library != NULL, NULL);

  self = g_object_new (CW_TYPE_INSTRUMENT_EDITOR, "transient-for", parent, NULL);
  self->library = cw_library_copy (library);
  self->index = index;
  self->id_follows_label = instrument == NULL;
  if (instrument == NULL)
    instrument = fresh = new_instrument (library);
  gtk_window_set_title (GTK_WINDOW (self), index < 0 ? _("New Instrument") : _("Edit Instrument"));
  fill_form (self, instrument);
  check (self);
  return self;
}

const CwInstrument *
cw_instrument_editor_get_instrument (CwInstrumentEditor *self)
{
  g_return_val_if_fail (CW_IS_INSTRUMENT_EDITOR (self), NULL);
  return self->checked;
}

int
cw_instrument_editor_get_index (CwInstrumentEditor *self)
{
  g_return_val_if_fail (CW_IS_INSTRUMENT_EDITOR (self), -1);
  return self->index;
}

const char *
cw_instrument_editor_get_message (CwInstrumentEditor *self)
{
  g_return_val_if_fail (CW_IS_INSTRUMENT_EDITOR (self), NULL);
  return self->message;
}

static void
save_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  CwInstrumentEditor *self = CW_INSTRUMENT_EDITOR (widget);

  check (self);
  if (self->checked == NULL)
    return;
  g_signal_emit (self, signals[SAVED], 0);
  gtk_window_destroy (GTK_WINDOW (self));
}

static void
fill_choices (CwInstrumentEditor *self)
{
  for (guint i = 0; i < CW_N_ALLOYS; i++)
    gtk_string_list_append (self->alloys, cw_alloy_label ((CwAlloy) i));
  for (guint i = 0; i < CW_N_MOTIONS; i++)
    gtk_string_list_append (self->motions, cw_motion_label ((CwMotion) i));
}

static void
connect_fields (CwInstrumentEditor *self)
{
  GtkEntry *entries[] = {
    self->label_entry, self->id_entry, self->taper_entry, self->flute_entry, self->length_entry,
    self->max_flute_entry, self->rpm_entry, self->torque_entry, self->uses_entry,
  };
  GObject *choices[] = {
    G_OBJECT (self->tip_drop), G_OBJECT (self->alloy_drop), G_OBJECT (self->motion_drop),
  };

  g_signal_connect_swapped (self->label_entry, "changed", G_CALLBACK (label_changed), self);
  g_signal_connect_swapped (self->id_entry, "changed", G_CALLBACK (id_changed), self);
  for (guint i = 0; i < G_N_ELEMENTS (entries); i++)
    {
      gtk_entry_set_activates_default (entries[i], TRUE);
      g_signal_connect_swapped (entries[i], "changed", G_CALLBACK (check), self);
    }
  for (guint i = 0; i < G_N_ELEMENTS (choices); i++)
    g_signal_connect_swapped (choices[i], "notify::selected", G_CALLBACK (check), self);
  g_signal_connect_swapped (self->segments_button, "toggled", G_CALLBACK (taper_form_toggled), self);
}

static void
cw_instrument_editor_dispose (GObject *object)
{
  CwInstrumentEditor *self = CW_INSTRUMENT_EDITOR (object);

  g_clear_weak_pointer (&self->marked);
  gtk_widget_dispose_template (GTK_WIDGET (self), CW_TYPE_INSTRUMENT_EDITOR);
  G_OBJECT_CLASS (cw_instrument_editor_parent_class)->dispose (object);
}

static void
cw_instrument_editor_finalize (GObject *object)
{
  CwInstrumentEditor *self = CW_INSTRUMENT_EDITOR (object);

  g_clear_pointer (&self->library, cw_library_free);
  g_clear_pointer (&self->checked, cw_instrument_free);
  g_free (self->extra_json);
  g_free (self->message);
  g_array_unref (self->tips);
  g_array_unref (self->segments);
  G_OBJECT_CLASS (cw_instrument_editor_parent_class)->finalize (object);
}

static void
cw_instrument_editor_class_init (CwInstrumentEditorClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_instrument_editor_dispose;
  object_class->finalize = cw_instrument_editor_finalize;

  signals[SAVED] = g_signal_new ("saved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                 0, NULL, NULL, NULL, G_TYPE_NONE, 0);

  g_type_ensure (CW_TYPE_PROFILE_PREVIEW);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/canalwright/Canalwright/cw-instrument-editor.ui");
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, save_button);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, label_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, id_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, tip_drop);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, tip_sizes);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, constant_button);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, segments_button);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, taper_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, segments_box);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, segments_grid);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, flute_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, length_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, max_flute_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, alloy_drop);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, alloys);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, motion_drop);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, motions);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, rpm_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, torque_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, uses_entry);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, preview);
  gtk_widget_class_bind_template_child (widget_class, CwInstrumentEditor, message_label);

  gtk_widget_class_install_action (widget_class, "editor.save", NULL, save_action);
  gtk_widget_class_install_action (widget_class, "editor.add-segment", NULL, add_segment_action);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
cw_instrument_editor_init (CwInstrumentEditor *self)
{
  self->tips = g_array_new (FALSE, FALSE, sizeof (double));
  self->segments = g_array_new (FALSE, FALSE, sizeof (SegmentRow));
  gtk_widget_init_template (GTK_WIDGET (self));
  fill_choices (self);
  connect_fields (self);
  gtk_window_set_default_widget (GTK_WINDOW (self), self->save_button);
}
