/* cw-document-edits.c: the commands a user can give on a document
 *
 * Each is one undoable edit with a label for the Undo menu item.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-document"

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "cw-document.h"

#define DEPTH_GRID 0.5

static CwCanal *
edit_canal (CwDocument *self,
            const char *label)
{
  CwCase *kase = cw_document_begin_edit (self, label);

  return g_ptr_array_index (kase->canals, cw_document_get_canal_index (self));
}

static gboolean
has_stop (const CwStepResult *r)
{
  return r->verdict == CW_LEVEL_STOP;
}

/* The deepest rubber-stop depth (0.5 mm grid, at most the working length and
 * the file's own length) at which the new step breaks no stop rule, given
 * the steps before it; the working length when every depth stops, so the
 * user sees why. */
double
cw_document_suggest_depth (CwDocument *self,
                           const char *instrument_id,
                           guint       position)
{
  const CwCase *kase = cw_document_get_case (self);
  const CwCanal *canal = cw_document_get_canal (self);
  const CwInstrument *inst = cw_case_find_instrument (kase, instrument_id);
  g_autoptr(CwEvalState) before = NULL;
  double cap;

  g_return_val_if_fail (canal != NULL && inst != NULL, 0);

  before = cw_eval_state_new (kase, canal);
  for (guint i = 0; i < position && i < canal->sequence->len; i++)
    {
      const CwStep *step = cw_canal_get_step (canal, i);
      const CwInstrument *prev = cw_case_find_instrument (kase, step->instrument_id);

      cw_step_result_free (cw_eval_state_apply (before, prev, step->depth, FALSE));
    }
  cap = floor (MIN (canal->working_length, inst->length) / DEPTH_GRID + 1e-9) * DEPTH_GRID;
  for (double depth = cap; depth > canal->orifice_depth; depth -= DEPTH_GRID)
    {
      g_autoptr(CwEvalState) trial = cw_eval_state_copy (before);
      g_autoptr(CwStepResult) r = cw_eval_state_apply (trial, inst, depth, FALSE);

      if (!has_stop (r))
        return depth;
    }
  return cap;
}

void
cw_document_insert_step (CwDocument *self,
                         const char *instrument_id,
                         int         position)
{
  const CwCanal *canal = cw_document_get_canal (self);
  CwCanal *target;
  CwStep step = { 0 };
  guint at;

  g_return_if_fail (canal != NULL);
  g_return_if_fail (cw_case_find_instrument (cw_document_get_case (self), instrument_id));

  if (canal->sequence->len >= CW_MAX_STEPS)
    return;
  at = position < 0 || (guint) position > canal->sequence->len ? canal->sequence->len : (guint) position;
  step.instrument_id = g_strdup (instrument_id);
  step.depth = cw_document_suggest_depth (self, instrument_id, at);
  target = edit_canal (self, _("Add Step"));
  g_array_insert_val (target->sequence, at, step);
  cw_document_end_edit (self);
  cw_document_set_step_index (self, (int) at);
}

void
cw_document_remove_step (CwDocument *self,
                         guint       index)
{
  const CwCanal *canal = cw_document_get_canal (self);

  g_return_if_fail (canal != NULL);
  if (index >= canal->sequence->len)
    return;
  g_array_remove_index (edit_canal (self, _("Remove Step"))->sequence, index);
  cw_document_end_edit (self);
  cw_document_set_step_index (self, MIN ((int) index, (int) canal->sequence->len - 1));
}

void
cw_document_move_step (CwDocument *self,
                       guint       from,
                       guint       to)
{
  const CwCanal *canal = cw_document_get_canal (self);
  CwCanal *target;
  CwStep step;
  const CwStep *src;

  g_return_if_fail (canal != NULL);
  if (from >= canal->sequence->len || to >= canal->sequence->len || from == to)
    return;
  target = edit_canal (self, _("Move Step"));
  src = &g_array_index (target->sequence, CwStep, from);
  /* A copy moves; removing the original clears its own strings. */
  step = (CwStep) { g_strdup (src->instrument_id), src->depth, g_strdup (src->note), g_strdup (src->extra_json) };
  g_array_remove_index (target->sequence, from);
  g_array_insert_val (target->sequence, to, step);
  cw_document_end_edit (self);
  cw_document_set_step_index (self, (int) to);
}

/* Within an edit already begun (a drag) this only updates it; otherwise it
 * is a command of its own. */
void
cw_document_set_step_depth (CwDocument *self,
                            guint       index,
                            double      depth)
{
  gboolean live = cw_document_in_edit (self);
  const CwCase *kase = cw_document_get_case (self);
  CwCanal *canal;

  g_return_if_fail (index < cw_document_get_canal (self)->sequence->len);

  depth = CLAMP (round (depth * 100) / 100, 0.5, CW_MAX_LENGTH);
  if (live)
    canal = g_ptr_array_index (kase->canals, cw_document_get_canal_index (self));
  else
    canal = edit_canal (self, _("Change Depth"));
  g_array_index (canal->sequence, CwStep, index).depth = depth;
  if (live)
    cw_document_update_edit (self);
  else
    cw_document_end_edit (self);
}

guint
cw_document_add_canal (CwDocument *self)
{
  const CwCase *kase = cw_document_get_case (self);
  const CwCanal *current = cw_document_get_canal (self);
  CwCanal *canal;
  CwCase *edit;
  g_autofree char *name = NULL;
  guint n = kase->canals->len;

  if (n >= CW_MAX_CANALS)
    return n - 1;
  for (guint i = n + 1; name == NULL || cw_case_find_canal (kase, name); i++)
    {
      g_free (name);
      name = g_strdup_printf (_("Canal %u"), i);
    }
  canal = cw_canal_new (name, current ? current->working_length : 21.0,
                        current ? current->orifice_depth : 7.0);
  canal->orifice_diameter = 0.60;
  canal->apical_diameter = 0.20;
  edit = cw_document_begin_edit (self, _("Add Canal"));
  cw_case_add_canal (edit, canal);
  cw_document_end_edit (self);
  cw_document_set_canal_index (self, n);
  return n;
}

void
cw_document_remove_canal (CwDocument *self,
                          guint       index)
{
  const CwCase *kase = cw_document_get_case (self);
  CwCase *edit;

  if (index >= kase->canals->len || kase->canals->len <= 1)
    return;
  edit = cw_document_begin_edit (self, _("Remove Canal"));
  g_ptr_array_remove_index (edit->canals, index);
  cw_document_end_edit (self);
}
