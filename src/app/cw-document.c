/* cw-document.c
 *
 * The history keeps whole snapshots of the case: a case is at most a few
 * hundred kilobytes of small structs, so a copy per command is cheap, and
 * undoing restores the exact values the user had, down to the byte on save.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-document"

#include "config.h"

#include <glib/gi18n.h>

#include "cw-case-loader.h"
#include "cw-case-writer.h"
#include "cw-error.h"
#include "cw-document.h"

#define HISTORY_MAX 200

typedef struct
{
  char   *label;
  CwCase *kase;
} Snapshot;

struct _CwDocument
{
  GObject        parent_instance;

  CwCase        *kase;
  GFile         *file;
  gboolean       modified;

  guint          canal_index;
  int            step_index;
  char          *instrument;

  CwCanalResult *result;

  GQueue         undo;       /* Snapshot, newest first */
  GQueue         redo;
  Snapshot      *pending;    /* the case before the edit in progress */
};

G_DEFINE_FINAL_TYPE (CwDocument, cw_document, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_MODIFIED,
  PROP_FILE,
  PROP_CANAL_INDEX,
  PROP_STEP_INDEX,
  PROP_INSTRUMENT,
  PROP_CAN_UNDO,
  PROP_CAN_REDO,
  N_PROPS
};

enum {
  CHANGED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static void
snapshot_free (Snapshot *snap)
{
  g_free (snap->label);
  cw_case_free (snap->kase);
  g_free (snap);
}

static Snapshot *
snapshot_new (const char   *label,
              const CwCase *kase)
{
  Snapshot *snap = g_new0 (Snapshot, 1);

  snap->label = g_strdup (label);
  snap->kase = cw_case_copy (kase);
  return snap;
}

static void
cw_document_finalize (GObject *object)
{
  CwDocument *self = (CwDocument *)object;

  g_queue_clear_full (&self->undo, (GDestroyNotify) snapshot_free);
  g_queue_clear_full (&self->redo, (GDestroyNotify) snapshot_free);
  g_clear_pointer (&self->pending, snapshot_free);
  g_clear_pointer (&self->result, cw_canal_result_free);
  g_clear_pointer (&self->kase, cw_case_free);
  g_clear_pointer (&self->instrument, g_free);
  g_clear_object (&self->file);

  G_OBJECT_CLASS (cw_document_parent_class)->finalize (object);
}

static void
cw_document_get_property (GObject    *object,
                          guint       prop_id,
                          GValue     *value,
                          GParamSpec *pspec)
{
  CwDocument *self = CW_DOCUMENT (object);

  switch (prop_id)
    {
    case PROP_MODIFIED:
      g_value_set_boolean (value, self->modified);
      break;
    case PROP_FILE:
      g_value_set_object (value, self->file);
      break;
    case PROP_CANAL_INDEX:
      g_value_set_uint (value, self->canal_index);
      break;
    case PROP_STEP_INDEX:
      g_value_set_int (value, self->step_index);
      break;
    case PROP_INSTRUMENT:
      g_value_set_string (value, self->instrument);
      break;
    case PROP_CAN_UNDO:
      g_value_set_boolean (value, cw_document_can_undo (self));
      break;
    case PROP_CAN_REDO:
      g_value_set_boolean (value, cw_document_can_redo (self));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_document_class_init (CwDocumentClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = cw_document_finalize;
  object_class->get_property = cw_document_get_property;

  properties[PROP_MODIFIED] =
    g_param_spec_boolean ("modified", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_FILE] =
    g_param_spec_object ("file", NULL, NULL, G_TYPE_FILE,
                         G_PARAM_READABLE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_CANAL_INDEX] =
    g_param_spec_uint ("canal-index", NULL, NULL, 0, G_MAXUINT, 0,
                       G_PARAM_READABLE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_STEP_INDEX] =
    g_param_spec_int ("step-index", NULL, NULL, -1, G_MAXINT, -1,
                      G_PARAM_READABLE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_INSTRUMENT] =
    g_param_spec_string ("instrument", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_CAN_UNDO] =
    g_param_spec_boolean ("can-undo", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_CAN_REDO] =
    g_param_spec_boolean ("can-redo", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /* The case changed: views redraw and re-read the evaluation. */
  signals[CHANGED] =
    g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                  0, NULL, NULL, NULL, G_TYPE_NONE, 0);
}

static void
cw_document_init (CwDocument *self)
{
  self->step_index = -1;
  g_queue_init (&self->undo);
  g_queue_init (&self->redo);
}

/* A new case has one canal with plausible lengths, so there is something to
 * draw and to drop files on; the user edits them first. */
CwDocument *
cw_document_new (void)
{
  CwDocument *self = g_object_new (CW_TYPE_DOCUMENT, NULL);
  CwCanal *canal = cw_canal_new (_("Canal 1"), 21.0, 7.0);

  canal->orifice_diameter = 0.60;
  canal->apical_diameter = 0.20;
  self->kase = cw_case_new ();
  cw_case_add_canal (self->kase, canal);
  return self;
}

CwDocument *
cw_document_open (GFile   *file,
                  GError **error)
{
  g_autofree char *path = g_file_get_path (file);
  CwCase *kase;
  CwDocument *self;

  g_return_val_if_fail (G_IS_FILE (file), NULL);

  if (path == NULL)
    {
      g_autofree char *uri = g_file_get_uri (file);

      g_set_error (error, CW_ERROR, CW_ERROR_READ, _("%s: only cases on this computer's disks can be opened"), uri);
      return NULL;
    }
  kase = cw_case_load (path, error);
  if (kase == NULL)
    return NULL;
  self = g_object_new (CW_TYPE_DOCUMENT, NULL);
  self->kase = kase;
  self->file = g_object_ref (file);
  return self;
}

gboolean
cw_document_save (CwDocument  *self,
                  GFile       *file,
                  GError     **error)
{
  g_autofree char *path = NULL;

  g_return_val_if_fail (CW_IS_DOCUMENT (self), FALSE);

  if (file == NULL)
    file = self->file;
  g_return_val_if_fail (G_IS_FILE (file), FALSE);

  path = g_file_get_path (file);
  if (!cw_case_save (self->kase, path, error))
    return FALSE;
  cw_document_set_file (self, file);
  cw_document_set_modified (self, FALSE);
  return TRUE;
}

const CwCase *
cw_document_get_case (CwDocument *self)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (self), NULL);
  return self->kase;
}

GFile *
cw_document_get_file (CwDocument *self)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (self), NULL);
  return self->file;
}

void
cw_document_set_file (CwDocument *self,
                      GFile      *file)
{
  g_return_if_fail (CW_IS_DOCUMENT (self));

  if (g_set_object (&self->file, file))
    g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_FILE]);
}

char *
cw_document_dup_title (CwDocument *self)
{
  if (self->kase->title && *self->kase->title)
    return g_strdup (self->kase->title);
  if (self->file)
    return g_file_get_basename (self->file);
  return g_strdup (_("New Case"));
}

gboolean
cw_document_get_modified (CwDocument *self)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (self), FALSE);
  return self->modified;
}

void
cw_document_set_modified (CwDocument *self,
                          gboolean    modified)
{
  g_return_if_fail (CW_IS_DOCUMENT (self));

  modified = !!modified;
  if (self->modified == modified)
    return;
  self->modified = modified;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_MODIFIED]);
}

guint
cw_document_get_canal_index (CwDocument *self)
{
  return self->canal_index;
}

static void
clamp_selection (CwDocument *self)
{
  const CwCanal *canal;

  if (self->canal_index >= self->kase->canals->len)
    self->canal_index = self->kase->canals->len ? self->kase->canals->len - 1 : 0;
  canal = cw_document_get_canal (self);
  if (canal == NULL || self->step_index >= (int) canal->sequence->len)
    self->step_index = canal && canal->sequence->len ? (int) canal->sequence->len - 1 : -1;
}

void
cw_document_set_canal_index (CwDocument *self,
                             guint       index)
{
  g_return_if_fail (CW_IS_DOCUMENT (self));

  if (index >= self->kase->canals->len || index == self->canal_index)
    return;
  self->canal_index = index;
  self->step_index = -1;
  g_clear_pointer (&self->result, cw_canal_result_free);
  clamp_selection (self);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CANAL_INDEX]);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_STEP_INDEX]);
}

const CwCanal *
cw_document_get_canal (CwDocument *self)
{
  if (self->canal_index >= self->kase->canals->len)
    return NULL;
  return g_ptr_array_index (self->kase->canals, self->canal_index);
}

int
cw_document_get_step_index (CwDocument *self)
{
  return self->step_index;
}

void
cw_document_set_step_index (CwDocument *self,
                            int         index)
{
  const CwCanal *canal = cw_document_get_canal (self);

  g_return_if_fail (CW_IS_DOCUMENT (self));

  if (canal == NULL || index < -1 || index >= (int) canal->sequence->len)
    index = -1;
  if (self->step_index == index)
    return;
  self->step_index = index;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_STEP_INDEX]);
}

const char *
cw_document_get_instrument (CwDocument *self)
{
  return self->instrument;
}

void
cw_document_set_instrument (CwDocument *self,
                            const char *id)
{
  g_return_if_fail (CW_IS_DOCUMENT (self));

  if (g_strcmp0 (self->instrument, id) == 0)
    return;
  g_free (self->instrument);
  self->instrument = g_strdup (id);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_INSTRUMENT]);
}

/* Evaluated on demand and kept until the next change: one whole-canal
 * evaluation is a few tens of microseconds. */
const CwCanalResult *
cw_document_get_result (CwDocument *self)
{
  const CwCanal *canal = cw_document_get_canal (self);

  if (canal == NULL)
    return NULL;
  if (self->result == NULL)
    self->result = cw_evaluate_canal (self->kase, canal);
  return self->result;
}

static void
emit_changed (CwDocument *self)
{
  int step = self->step_index;

  g_clear_pointer (&self->result, cw_canal_result_free);
  clamp_selection (self);
  g_signal_emit (self, signals[CHANGED], 0);
  if (step != self->step_index)
    g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_STEP_INDEX]);
}

static void
notify_history (CwDocument *self)
{
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CAN_UNDO]);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CAN_REDO]);
}

CwCase *
cw_document_begin_edit (CwDocument *self,
                        const char *label)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (self), NULL);
  g_return_val_if_fail (self->pending == NULL, self->kase);

  self->pending = snapshot_new (label, self->kase);
  return self->kase;
}

void
cw_document_update_edit (CwDocument *self)
{
  g_return_if_fail (self->pending != NULL);
  emit_changed (self);
}

void
cw_document_end_edit (CwDocument *self)
{
  g_return_if_fail (CW_IS_DOCUMENT (self));
  g_return_if_fail (self->pending != NULL);

  g_queue_push_head (&self->undo, g_steal_pointer (&self->pending));
  while (self->undo.length > HISTORY_MAX)
    snapshot_free (g_queue_pop_tail (&self->undo));
  g_queue_clear_full (&self->redo, (GDestroyNotify) snapshot_free);
  cw_document_set_modified (self, TRUE);
  emit_changed (self);
  notify_history (self);
}

void
cw_document_cancel_edit (CwDocument *self)
{
  Snapshot *snap;

  g_return_if_fail (self->pending != NULL);

  snap = g_steal_pointer (&self->pending);
  cw_case_free (self->kase);
  self->kase = g_steal_pointer (&snap->kase);
  snapshot_free (snap);
  emit_changed (self);
}

gboolean
cw_document_in_edit (CwDocument *self)
{
  return self->pending != NULL;
}

gboolean
cw_document_can_undo (CwDocument *self)
{
  return self->undo.length > 0 && self->pending == NULL;
}

gboolean
cw_document_can_redo (CwDocument *self)
{
  return self->redo.length > 0 && self->pending == NULL;
}

const char *
cw_document_get_undo_label (CwDocument *self)
{
  Snapshot *snap = g_queue_peek_head (&self->undo);

  return snap ? snap->label : NULL;
}

const char *
cw_document_get_redo_label (CwDocument *self)
{
  Snapshot *snap = g_queue_peek_head (&self->redo);

  return snap ? snap->label : NULL;
}

/* Moves the newest snapshot of one stack into the case, and the case, under
 * the same label, onto the other stack. */
static gboolean
swap_history (CwDocument *self,
              GQueue     *from,
              GQueue     *to)
{
  Snapshot *snap;
  CwCase *current;

  if (from->length == 0 || self->pending != NULL)
    return FALSE;
  snap = g_queue_pop_head (from);
  current = self->kase;
  self->kase = snap->kase;
  snap->kase = current;
  g_queue_push_head (to, snap);
  cw_document_set_modified (self, TRUE);
  emit_changed (self);
  notify_history (self);
  return TRUE;
}

gboolean
cw_document_undo (CwDocument *self)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (self), FALSE);
  return swap_history (self, &self->undo, &self->redo);
}

gboolean
cw_document_redo (CwDocument *self)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (self), FALSE);
  return swap_history (self, &self->redo, &self->undo);
}
