/* cw-canal-editor.c
 *
 * Each field applies when it is committed (Enter, focus out, the arrows) as
 * one undoable edit, after the canal's zones are checked; a canal that would
 * not load is never made.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-canal-editor"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-canal-editor.h"
#include "cw-iso.h"

typedef enum
{
  FIELD_WL,
  FIELD_ORIFICE,
  FIELD_ORIFICE_DIAMETER,
  FIELD_APICAL_DIAMETER,
  FIELD_TARGET_SIZE,
  FIELD_TARGET_TAPER,
  FIELD_ONSET_1,
  FIELD_ANGLE_1,
  FIELD_RADIUS_1,
  FIELD_SCHNEIDER_1,
  FIELD_ONSET_2,
  FIELD_ANGLE_2,
  FIELD_RADIUS_2,
  FIELD_SCHNEIDER_2,
  N_FIELDS
} Field;

struct _CwCanalEditor
{
  GtkWidget    parent_instance;

  CwDocument  *document;
  gboolean     updating;
  GtkWidget   *scroller;
  GtkGrid     *grid;
  GtkEntry    *title;
  GtkDropDown *notation;
  GtkEntry    *tooth;
  GtkEntry    *name;
  GtkEntry    *reference;
  GtkSpinButton *spins[N_FIELDS];
  GtkDropDown *curve_form[CW_MAX_CURVES];
  GtkLabel    *curve_info[CW_MAX_CURVES];
  GtkLabel    *anatomy_note;
  GtkLabel    *error;
  int          row;
};

G_DEFINE_FINAL_TYPE (CwCanalEditor, cw_canal_editor, GTK_TYPE_WIDGET)

static CwCanal *
current_canal (CwCanalEditor *self)
{
  const CwCase *kase = cw_document_get_case (self->document);

  return g_ptr_array_index (kase->canals, cw_document_get_canal_index (self->document));
}

static void
show_error (CwCanalEditor *self,
            const char    *message)
{
  gtk_label_set_label (self->error, message ? message : "");
  gtk_widget_set_visible (GTK_WIDGET (self->error), message != NULL);
}

static double
spin (CwCanalEditor *self,
      Field          field)
{
  return gtk_spin_button_get_value (self->spins[field]);
}

/* The curves as the form shows them: 0, 1 or 2, each by angle and radius
 * or by the Schneider angle. */
static void
read_curves (CwCanalEditor *self,
             CwCanal       *canal)
{
  for (guint i = 0; i < canal->n_curves; i++)
    cw_curve_clear (&canal->curves[i]);
  canal->n_curves = 0;
  for (guint i = 0; i < CW_MAX_CURVES; i++)
    {
      guint form = gtk_drop_down_get_selected (self->curve_form[i]);
      Field base = i == 0 ? FIELD_ONSET_1 : FIELD_ONSET_2;

      if (form == 0)
        continue;
      if (form == 1)
        cw_canal_add_curve (canal, spin (self, base), spin (self, base + 1), spin (self, base + 2));
      else
        cw_canal_add_schneider (canal, spin (self, base), spin (self, base + 3));
    }
}

static void
read_form (CwCanalEditor *self,
           CwCanal       *canal)
{
  canal->working_length = spin (self, FIELD_WL);
  canal->orifice_depth = spin (self, FIELD_ORIFICE);
  if (canal->diameters == NULL)
    {
      canal->orifice_diameter = spin (self, FIELD_ORIFICE_DIAMETER);
      canal->apical_diameter = spin (self, FIELD_APICAL_DIAMETER);
    }
  read_curves (self, canal);
}

static gboolean
name_is_free (CwCanalEditor *self,
              const char    *name)
{
  const CwCanal *other = cw_case_find_canal (cw_document_get_case (self->document), name);

  return other == NULL || other == current_canal (self);
}

/* Check a copy first; only a valid canal becomes an edit. */
static void
apply (CwCanalEditor *self)
{
  g_autoptr(CwCanal) trial = NULL;
  g_autoptr(GError) error = NULL;
  const char *name = gtk_editable_get_text (GTK_EDITABLE (self->name));
  CwCase *kase;
  CwCanal *canal;

  if (self->updating || self->document == NULL)
    return;
  trial = cw_canal_copy (current_canal (self));
  read_form (self, trial);
  if (!cw_canal_validate (trial, &error))
    return show_error (self, error->message);
  if (*name == '\0' || !name_is_free (self, name))
    return show_error (self, _("Each canal needs a name of its own."));
  show_error (self, NULL);

  kase = cw_document_begin_edit (self->document, _("Edit Canal"));
  canal = current_canal (self);
  read_form (self, canal);
  g_free (canal->name);
  canal->name = g_strdup (name);
  g_free (canal->reference);
  canal->reference = g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->reference)));
  g_free (kase->title);
  kase->title = g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->title)));
  kase->target_apical_size = spin (self, FIELD_TARGET_SIZE);
  kase->target_apical_taper = spin (self, FIELD_TARGET_TAPER);
  cw_document_end_edit (self->document);
}

static void
apply_tooth (CwCanalEditor *self)
{
  const char *code = gtk_editable_get_text (GTK_EDITABLE (self->tooth));
  CwNotation notation = gtk_drop_down_get_selected (self->notation) == 1 ? CW_NOTATION_UNIVERSAL : CW_NOTATION_FDI;
  gboolean valid = notation == CW_NOTATION_FDI ? cw_tooth_fdi_is_valid (code) : cw_tooth_universal_is_valid (code);
  CwCase *kase;

  if (self->updating)
    return;
  if (*code != '\0' && !valid)
    return show_error (self, notation == CW_NOTATION_FDI
                             ? _("An FDI tooth number has two digits: quadrant 1-8, then tooth 1-8.")
                             : _("A Universal tooth number is 1-32, or A-T for primary teeth."));
  show_error (self, NULL);
  kase = cw_document_begin_edit (self->document, _("Edit Tooth"));
  kase->notation = notation;
  g_free (kase->tooth_code);
  kase->tooth_code = *code ? g_strdup (code) : NULL;
  cw_document_end_edit (self->document);
}

/* Switching the notation converts the number, so the tooth stays the same. */
static void
notation_changed (CwCanalEditor *self)
{
  const CwCase *kase = cw_document_get_case (self->document);
  g_autofree char *converted = NULL;

  if (self->updating || kase->tooth_code == NULL)
    return apply_tooth (self);
  if (gtk_drop_down_get_selected (self->notation) == 1 && kase->notation == CW_NOTATION_FDI)
    converted = cw_tooth_fdi_to_universal (kase->tooth_code);
  else if (gtk_drop_down_get_selected (self->notation) == 0 && kase->notation == CW_NOTATION_UNIVERSAL)
    converted = cw_tooth_universal_to_fdi (kase->tooth_code);
  if (converted)
    {
      self->updating = TRUE;
      gtk_editable_set_text (GTK_EDITABLE (self->tooth), converted);
      self->updating = FALSE;
    }
  apply_tooth (self);
}

static void
label_cell (CwCanalEditor *self,
            const char    *text,
            GtkWidget     *widget)
{
  GtkWidget *label = gtk_label_new_with_mnemonic (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_mnemonic_widget (GTK_LABEL (label), widget);
  gtk_widget_set_hexpand (widget, TRUE);
  gtk_grid_attach (self->grid, label, 0, self->row, 1, 1);
  gtk_grid_attach (self->grid, widget, 1, self->row++, 1, 1);
}

static void
section (CwCanalEditor *self,
         const char    *text)
{
  GtkWidget *label = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_widget_add_css_class (label, "heading");
  gtk_widget_set_margin_top (label, 8);
  gtk_grid_attach (self->grid, label, 0, self->row++, 2, 1);
}

static void
add_spin (CwCanalEditor *self,
          Field          field,
          const char    *label,
          double         lo,
          double         hi,
          double         step,
          guint          digits)
{
  GtkWidget *spin_button = gtk_spin_button_new_with_range (lo, hi, step);

  gtk_spin_button_set_digits (GTK_SPIN_BUTTON (spin_button), digits);
  g_signal_connect_swapped (spin_button, "value-changed", G_CALLBACK (apply), self);
  self->spins[field] = GTK_SPIN_BUTTON (spin_button);
  label_cell (self, label, spin_button);
}

static GtkEntry *
add_entry (CwCanalEditor *self,
           const char    *label,
           GCallback      callback)
{
  GtkWidget *entry = gtk_entry_new ();

  g_signal_connect_swapped (entry, "activate", callback, self);
  label_cell (self, label, entry);
  return GTK_ENTRY (entry);
}

static void
build_curve (CwCanalEditor *self,
             guint          i)
{
  static const char *forms[] = { N_("None"), N_("Angle and radius"), N_("Schneider angle, to the apex"), NULL };
  const char *translated[4] = { _(forms[0]), _(forms[1]), _(forms[2]), NULL };
  Field base = i == 0 ? FIELD_ONSET_1 : FIELD_ONSET_2;
  g_autofree char *title = g_strdup_printf (_("Curve %u"), i + 1);
  GtkWidget *info = gtk_label_new ("");

  section (self, title);
  self->curve_form[i] = GTK_DROP_DOWN (gtk_drop_down_new_from_strings (translated));
  g_signal_connect_swapped (self->curve_form[i], "notify::selected", G_CALLBACK (apply), self);
  label_cell (self, _("Given by"), GTK_WIDGET (self->curve_form[i]));
  add_spin (self, base, _("Onset (mm)"), 0.5, 40, 0.5, 1);
  add_spin (self, base + 1, _("Turning angle (°)"), 1, 180, 1, 0);
  add_spin (self, base + 2, _("Radius (mm)"), 0.5, 40, 0.5, 1);
  add_spin (self, base + 3, _("Schneider angle (°)"), 1, 89, 1, 0);
  gtk_label_set_xalign (GTK_LABEL (info), 0);
  gtk_label_set_wrap (GTK_LABEL (info), TRUE);
  gtk_widget_add_css_class (info, "dim-label");
  gtk_grid_attach (self->grid, info, 0, self->row++, 2, 1);
  self->curve_info[i] = GTK_LABEL (info);
}

static void
build_form (CwCanalEditor *self)
{
  const char *notations[] = { _("FDI (ISO 3950)"), _("Universal"), NULL };

  section (self, _("Case"));
  self->title = add_entry (self, _("_Title"), G_CALLBACK (apply));
  self->notation = GTK_DROP_DOWN (gtk_drop_down_new_from_strings (notations));
  g_signal_connect_swapped (self->notation, "notify::selected", G_CALLBACK (notation_changed), self);
  label_cell (self, _("Tooth n_umbering"), GTK_WIDGET (self->notation));
  self->tooth = add_entry (self, _("Too_th"), G_CALLBACK (apply_tooth));
  add_spin (self, FIELD_TARGET_SIZE, _("Target apical size"), 6, 140, 5, 0);
  add_spin (self, FIELD_TARGET_TAPER, _("Target apical taper"), 0.01, 0.12, 0.01, 2);
  section (self, _("Canal"));
  self->name = add_entry (self, _("_Name"), G_CALLBACK (apply));
  self->reference = add_entry (self, _("_Reference point"), G_CALLBACK (apply));
  add_spin (self, FIELD_WL, _("_Working length (mm)"), 0.5, 40, 0.5, 1);
  add_spin (self, FIELD_ORIFICE, _("_Orifice depth (mm)"), 0.5, 40, 0.5, 1);
  add_spin (self, FIELD_ORIFICE_DIAMETER, _("Diameter at the orifice (mm)"), 0.05, 3, 0.05, 2);
  add_spin (self, FIELD_APICAL_DIAMETER, _("Diameter at the apex (mm)"), 0.05, 3, 0.05, 2);
  self->anatomy_note = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_wrap (self->anatomy_note, TRUE);
  gtk_label_set_xalign (self->anatomy_note, 0);
  gtk_grid_attach (self->grid, GTK_WIDGET (self->anatomy_note), 0, self->row++, 2, 1);
  for (guint i = 0; i < CW_MAX_CURVES; i++)
    build_curve (self, i);
}

static void
set_spin (CwCanalEditor *self,
          Field          field,
          double         value)
{
  gtk_spin_button_set_value (self->spins[field], isfinite (value) ? value : 0);
}

static void
refresh_curve (CwCanalEditor    *self,
               const CwCanal    *canal,
               const CwGeometry *geo,
               guint             i)
{
  Field base = i == 0 ? FIELD_ONSET_1 : FIELD_ONSET_2;
  gboolean present = i < canal->n_curves;
  gboolean schneider = present && isfinite (canal->curves[i].schneider_angle);
  g_autofree char *info = NULL;

  gtk_drop_down_set_selected (self->curve_form[i], present ? (schneider ? 2 : 1) : 0);
  for (Field f = base; f <= base + 3; f++)
    gtk_widget_set_sensitive (GTK_WIDGET (self->spins[f]), present);
  if (!present)
    {
      /* Plausible values for when the user turns the curve on. */
      double onset = i > 0 && canal->n_curves > 0 ? geo->end[0]
                                                  : MAX (canal->orifice_depth + 1, canal->working_length - 7);
      double room = MAX (0.5, canal->working_length - onset);

      set_spin (self, base, onset);
      set_spin (self, base + 1, 20);
      set_spin (self, base + 2, floor (MIN (8.0, 0.8 * room / (20 * G_PI / 180)) * 2) / 2);
      set_spin (self, base + 3, 15);
      gtk_label_set_label (self->curve_info[i], "");
      return;
    }
  set_spin (self, base, canal->curves[i].onset);
  set_spin (self, base + 1, geo->phi[i] * 180 / G_PI);
  set_spin (self, base + 2, geo->radius[i]);
  set_spin (self, base + 3, geo->phi[i] * 90 / G_PI);
  gtk_widget_set_sensitive (GTK_WIDGET (self->spins[base + 1]), !schneider);
  gtk_widget_set_sensitive (GTK_WIDGET (self->spins[base + 2]), !schneider);
  gtk_widget_set_sensitive (GTK_WIDGET (self->spins[base + 3]), schneider);
  /* Both angles, as the clinician may know either one. */
  info = g_strdup_printf (_("Turns %.0f° on a %.1f mm radius (Schneider angle %.0f°), from %.1f to %.1f mm."),
                          geo->phi[i] * 180 / G_PI, geo->radius[i], geo->phi[i] * 90 / G_PI,
                          geo->onset[i], geo->end[i]);
  gtk_label_set_label (self->curve_info[i], info);
}

static void
refresh (CwCanalEditor *self)
{
  const CwCase *kase = cw_document_get_case (self->document);
  const CwCanal *canal = cw_document_get_canal (self->document);
  CwGeometry geo;

  if (canal == NULL || cw_document_in_edit (self->document))
    return;
  self->updating = TRUE;
  cw_canal_get_geometry (canal, &geo);
  gtk_editable_set_text (GTK_EDITABLE (self->title), kase->title ? kase->title : "");
  gtk_drop_down_set_selected (self->notation, kase->notation == CW_NOTATION_UNIVERSAL ? 1 : 0);
  gtk_editable_set_text (GTK_EDITABLE (self->tooth), kase->tooth_code ? kase->tooth_code : "");
  set_spin (self, FIELD_TARGET_SIZE, kase->target_apical_size);
  set_spin (self, FIELD_TARGET_TAPER, kase->target_apical_taper);
  gtk_editable_set_text (GTK_EDITABLE (self->name), canal->name);
  gtk_editable_set_text (GTK_EDITABLE (self->reference), canal->reference ? canal->reference : "");
  set_spin (self, FIELD_WL, canal->working_length);
  set_spin (self, FIELD_ORIFICE, canal->orifice_depth);
  set_spin (self, FIELD_ORIFICE_DIAMETER, canal->orifice_diameter);
  set_spin (self, FIELD_APICAL_DIAMETER, canal->apical_diameter);
  gtk_widget_set_sensitive (GTK_WIDGET (self->spins[FIELD_ORIFICE_DIAMETER]), canal->diameters == NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (self->spins[FIELD_APICAL_DIAMETER]), canal->diameters == NULL);
  gtk_label_set_label (self->anatomy_note, canal->diameters
                       ? _("The natural diameters are measured points from the case file.")
                       : _("The natural canal narrows evenly from the orifice to the apex."));
  for (guint i = 0; i < CW_MAX_CURVES; i++)
    refresh_curve (self, canal, &geo, i);
  self->updating = FALSE;
}

void
cw_canal_editor_set_document (CwCanalEditor *self,
                              CwDocument    *document)
{
  g_return_if_fail (CW_IS_CANAL_EDITOR (self));

  g_set_object (&self->document, document);
  g_signal_connect_object (document, "changed", G_CALLBACK (refresh), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (refresh), self, G_CONNECT_SWAPPED);
  refresh (self);
}

static void
cw_canal_editor_dispose (GObject *object)
{
  CwCanalEditor *self = CW_CANAL_EDITOR (object);

  g_clear_object (&self->document);
  g_clear_pointer (&self->scroller, gtk_widget_unparent);
  G_OBJECT_CLASS (cw_canal_editor_parent_class)->dispose (object);
}

static void
cw_canal_editor_class_init (CwCanalEditorClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = cw_canal_editor_dispose;
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "canaleditor");
}

static void
cw_canal_editor_init (CwCanalEditor *self)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  GtkWidget *remove = gtk_button_new_with_mnemonic (_("_Remove This Canal"));

  self->scroller = gtk_scrolled_window_new ();
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (self->scroller), GTK_POLICY_NEVER, GTK_POLICY_AUTOMATIC);
  gtk_widget_set_parent (self->scroller, GTK_WIDGET (self));
  self->grid = GTK_GRID (gtk_grid_new ());
  gtk_grid_set_row_spacing (self->grid, 4);
  gtk_grid_set_column_spacing (self->grid, 8);
  self->error = GTK_LABEL (gtk_label_new (""));
  gtk_label_set_wrap (self->error, TRUE);
  gtk_label_set_xalign (self->error, 0);
  gtk_widget_add_css_class (GTK_WIDGET (self->error), "error");
  gtk_widget_set_visible (GTK_WIDGET (self->error), FALSE);
  build_form (self);
  gtk_actionable_set_action_name (GTK_ACTIONABLE (remove), "win.remove-canal");
  gtk_widget_add_css_class (remove, "destructive-action");
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->error));
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->grid));
  gtk_box_append (GTK_BOX (box), remove);
  gtk_widget_set_margin_start (box, 12);
  gtk_widget_set_margin_end (box, 12);
  gtk_widget_set_margin_bottom (box, 12);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (self->scroller), box);
}
