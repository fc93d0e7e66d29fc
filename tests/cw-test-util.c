/* cw-test-util.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-test"

#include <math.h>

#include "cw-test-util.h"

CwInstrument *
cw_test_instrument (CwCase     *kase,
                    const char *id,
                    double      tip,
                    double      taper,
                    CwAlloy     alloy,
                    CwMotion    motion)
{
  CwInstrument *inst = cw_instrument_new (id, tip, taper);

  inst->label = g_strdup (id);
  inst->alloy = alloy;
  inst->motion = motion;
  if (motion != CW_MOTION_HAND)
    inst->rpm = 300;
  cw_case_add_instrument (kase, inst);
  return inst;
}

CwCanal *
cw_test_canal (CwCase *kase,
               double  working_length,
               double  orifice,
               double  orifice_diameter,
               double  apical_diameter)
{
  CwCanal *canal = cw_canal_new ("T", working_length, orifice);

  canal->orifice_diameter = orifice_diameter;
  canal->apical_diameter = apical_diameter;
  cw_case_add_canal (kase, canal);
  return canal;
}

const CwFinding *
cw_test_find (const CwStepResult *step,
              CwRule              rule)
{
  for (guint i = 0; i < step->findings->len; i++)
    {
      const CwFinding *f = g_ptr_array_index (step->findings, i);

      if (f->rule == rule)
        return f;
    }
  return NULL;
}

char *
cw_test_sample_path (const char *name)
{
  const char *dir = g_getenv ("CW_SAMPLE_CASES");

  return g_build_filename (dir ? dir : "sample-cases", name, NULL);
}
