/* cw-finding.h: what a rule says about a step or a canal
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef enum
{
  CW_LEVEL_OK,
  CW_LEVEL_CAUTION,
  CW_LEVEL_STOP,
} CwLevel;

typedef enum
{
  CW_RULE_CURVE_ENGAGEMENT,
  CW_RULE_DIAMETER_CEILING,
  CW_RULE_CEILING_TABLE,
  CW_RULE_STRAIGHT_CLEARANCE,
  CW_RULE_TAPER_CHANGE,
  CW_RULE_GLIDE_PATH,
  CW_RULE_STRAIN,
  CW_RULE_TORSION,
  CW_RULE_BEYOND_LENGTH,
  CW_RULE_INSTRUMENT_LENGTH,
  CW_RULE_FINAL_SHAPE,
  CW_N_RULES
} CwRule;

/* The numbers a finding names; cw_finding_describe writes the sentence,
 * in the C locale for the JSON report or in the user's for the views.
 * message is spare room for a caller that keeps one. */
typedef struct
{
  CwRule   rule;
  CwLevel  level;
  double   value;
  double   limit;
  double   other;
  double   other_limit;
  char    *message;
} CwFinding;

CwFinding   *cw_finding_new          (CwRule            rule,
                                      CwLevel           level,
                                      double            value,
                                      double            limit);
void         cw_finding_free         (CwFinding        *finding);
char        *cw_finding_describe     (const CwFinding  *finding,
                                      gboolean          c_locale);
const char  *cw_rule_to_string       (CwRule            rule);
const char  *cw_level_to_string      (CwLevel           level);
CwLevel      cw_findings_worst       (GPtrArray        *findings);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwFinding, cw_finding_free)

G_END_DECLS
