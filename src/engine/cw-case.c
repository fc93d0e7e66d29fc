/* cw-case.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-case"

#include "cw-case.h"

CwCase *
cw_case_new (void)
{
  CwCase *self = g_new0 (CwCase, 1);

  self->title = g_strdup ("");
  self->notation = CW_NOTATION_FDI;
  self->target_apical_size = CW_DEFAULT_TARGET_SIZE;
  self->target_apical_taper = CW_DEFAULT_TARGET_TAPER;
  cw_rules_init_defaults (&self->rules);
  self->instruments = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_instrument_free);
  self->canals = g_ptr_array_new_with_free_func ((GDestroyNotify) cw_canal_free);
  return self;
}

static gpointer
copy_instrument (gconstpointer src,
                 gpointer      data)
{
  return cw_instrument_copy (src);
}

static gpointer
copy_canal (gconstpointer src,
            gpointer      data)
{
  return cw_canal_copy (src);
}

CwCase *
cw_case_copy (const CwCase *self)
{
  CwCase *copy;

  g_return_val_if_fail (self != NULL, NULL);

  copy = g_memdup2 (self, sizeof *self);
  copy->title = g_strdup (self->title);
  copy->notes = g_strdup (self->notes);
  copy->tooth_code = g_strdup (self->tooth_code);
  copy->tooth_extra_json = g_strdup (self->tooth_extra_json);
  copy->targets_extra_json = g_strdup (self->targets_extra_json);
  copy->rules_json = g_strdup (self->rules_json);
  copy->extra_json = g_strdup (self->extra_json);
  copy->instruments = g_ptr_array_copy (self->instruments, copy_instrument, NULL);
  g_ptr_array_set_free_func (copy->instruments, (GDestroyNotify) cw_instrument_free);
  copy->canals = g_ptr_array_copy (self->canals, copy_canal, NULL);
  g_ptr_array_set_free_func (copy->canals, (GDestroyNotify) cw_canal_free);
  return copy;
}

void
cw_case_free (CwCase *self)
{
  if (self == NULL)
    return;
  g_free (self->title);
  g_free (self->notes);
  g_free (self->tooth_code);
  g_free (self->tooth_extra_json);
  g_free (self->targets_extra_json);
  g_free (self->rules_json);
  g_free (self->extra_json);
  g_ptr_array_unref (self->instruments);
  g_ptr_array_unref (self->canals);
  g_free (self);
}

void
cw_case_add_instrument (CwCase       *self,
                        CwInstrument *instrument)
{
  g_return_if_fail (self != NULL && instrument != NULL);
  g_ptr_array_add (self->instruments, instrument);
}

void
cw_case_add_canal (CwCase  *self,
                   CwCanal *canal)
{
  g_return_if_fail (self != NULL && canal != NULL);
  g_ptr_array_add (self->canals, canal);
}

const CwInstrument *
cw_case_find_instrument (const CwCase *self,
                         const char   *id)
{
  for (guint i = 0; i < self->instruments->len; i++)
    {
      const CwInstrument *instrument = g_ptr_array_index (self->instruments, i);

      if (g_strcmp0 (instrument->id, id) == 0)
        return instrument;
    }
  return NULL;
}

CwCanal *
cw_case_find_canal (const CwCase *self,
                    const char   *name)
{
  for (guint i = 0; i < self->canals->len; i++)
    {
      CwCanal *canal = g_ptr_array_index (self->canals, i);

      if (g_strcmp0 (canal->name, name) == 0)
        return canal;
    }
  return NULL;
}
