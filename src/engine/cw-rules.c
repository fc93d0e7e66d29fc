/* cw-rules.c
 *
 * The defaults are the trade's rules of thumb (common practice, no published
 * source) and, for the alloys, illustrative placeholders recalled from the
 * published range of values: not data for clinical decisions.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-rules"

#include <math.h>

#include "cw-rules.h"

void
cw_rules_init_defaults (CwRules *rules)
{
  static const CwAlloyRules alloys[CW_N_ALLOYS] = {
    [CW_ALLOY_STAINLESS] = { NAN, NAN, NAN, 800.0, 0.5 },
    [CW_ALLOY_NITI] = { 0.06, 100000.0, 3.3, 700.0, 0.5 },
    [CW_ALLOY_NITI_HEAT_TREATED] = { 0.08, 300000.0, 3.3, 600.0, 0.5 },
  };

  *rules = (CwRules) {
    .contact_tolerance = 0.01,
    .advance_rate = 0.5,
    .peck_increment = 1.0,
    .changeover = 20.0,
    .at_length_tolerance = 0.5,
    .curve_engagement_max = 6.0,
    .small_file_tip_max = 20.0,
    .small_file_taper_max = 0.04,
    .n_ceilings = 3,
    .ceiling_taper = { 0.02, 0.04, 0.06 },
    .ceiling_diameter = { 0.60, 0.55, 0.50 },
    .glide_path_tip_max = 15.0,
    .require_taper_change = TRUE,
  };
  for (guint i = 0; i < CW_N_ALLOYS; i++)
    rules->alloys[i] = alloys[i];
}

/* Linear between the table's rows, which are sorted by taper (the loader
 * refuses any other order); outside it the nearest row, and the caller is
 * told so that it can say the table was left. */
double
cw_rules_ceiling (const CwRules *rules,
                  double         taper,
                  gboolean      *outside_table)
{
  guint n = rules->n_ceilings;
  const double *t = rules->ceiling_taper, *d = rules->ceiling_diameter;

  g_return_val_if_fail (n > 0, NAN);

  if (outside_table)
    *outside_table = taper < t[0] - CW_TAPER_EPSILON || taper > t[n - 1] + CW_TAPER_EPSILON;
  if (taper <= t[0])
    return d[0];
  for (guint i = 1; i < n; i++)
    if (taper <= t[i])
      return d[i - 1] + (d[i] - d[i - 1]) * (taper - t[i - 1]) / (t[i] - t[i - 1]);
  return d[n - 1];
}

/* N(eps) = A (100 eps)^-k; INFINITY when the alloy's fatigue is not modelled
 * or nothing bends. */
double
cw_rules_cycles_to_failure (const CwRules *rules,
                            CwAlloy        alloy,
                            double         strain)
{
  const CwAlloyRules *a = &rules->alloys[alloy];

  if (!isfinite (a->strain_life_a) || !isfinite (a->strain_life_k) || !(strain > 0))
    return INFINITY;
  return a->strain_life_a * pow (100.0 * strain, -a->strain_life_k);
}
