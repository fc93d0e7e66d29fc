/* cw-rules.h: the rule set, with the trade's defaults
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-instrument.h"

G_BEGIN_DECLS

#define CW_MAX_CEILING_ROWS 16

/* Tapers computed from a profile carry rounding; compare them this loosely. */
#define CW_TAPER_EPSILON 1e-9

typedef struct
{
  double strain_limit;   /* NAN: not checked */
  double strain_life_a;  /* NAN: fatigue not modelled */
  double strain_life_k;
  double shear_strength; /* MPa */
  double section_factor;
} CwAlloyRules;

typedef struct
{
  double   contact_tolerance;
  double   advance_rate;
  double   peck_increment;
  double   changeover;
  double   at_length_tolerance;
  double   curve_engagement_max;
  double   small_file_tip_max;
  double   small_file_taper_max;
  guint    n_ceilings;
  double   ceiling_taper[CW_MAX_CEILING_ROWS];
  double   ceiling_diameter[CW_MAX_CEILING_ROWS];
  double   glide_path_tip_max;
  gboolean require_taper_change;
  CwAlloyRules alloys[CW_N_ALLOYS];
} CwRules;

void      cw_rules_init_defaults  (CwRules        *rules);
double    cw_rules_ceiling        (const CwRules  *rules,
                                   double          taper,
                                   gboolean       *outside_table);
double    cw_rules_cycles_to_failure (const CwRules *rules,
                                   CwAlloy         alloy,
                                   double          strain);

G_END_DECLS
