/* cw-finding.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-finding"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-finding.h"

static const char *rule_ids[CW_N_RULES] = {
  "curve-engagement", "diameter-ceiling", "ceiling-table", "straight-clearance",
  "taper-change", "glide-path", "strain", "torsion", "beyond-length",
  "instrument-length", "final-shape",
};

const char *
cw_rule_to_string (CwRule rule)
{
  g_return_val_if_fail (rule < CW_N_RULES, NULL);
  return rule_ids[rule];
}

const char *
cw_level_to_string (CwLevel level)
{
  switch (level)
    {
    case CW_LEVEL_STOP: return "stop";
    case CW_LEVEL_CAUTION: return "caution";
    case CW_LEVEL_OK:
    default: return "ok";
    }
}

CwFinding *
cw_finding_new (CwRule  rule,
                CwLevel level,
                double  value,
                double  limit)
{
  CwFinding *self = g_new0 (CwFinding, 1);

  self->rule = rule;
  self->level = level;
  self->value = value;
  self->limit = limit;
  self->other = NAN;
  self->other_limit = NAN;
  return self;
}

void
cw_finding_free (CwFinding *finding)
{
  if (finding == NULL)
    return;
  g_free (finding->message);
  g_free (finding);
}

CwLevel
cw_findings_worst (GPtrArray *findings)
{
  CwLevel worst = CW_LEVEL_OK;

  for (guint i = 0; i < findings->len; i++)
    worst = MAX (worst, ((CwFinding *) g_ptr_array_index (findings, i))->level);
  return worst;
}

typedef struct
{
  gboolean c_locale;
  char     bufs[6][G_ASCII_DTOSTR_BUF_SIZE];
  guint    next;
} Numbers;

/* A number with the given decimals, in the C locale for the JSON report or
 * in the user's locale for the window and the exports. */
static const char *
num (Numbers *n,
     double   value,
     int      decimals)
{
  char *buf = n->bufs[n->next++ % G_N_ELEMENTS (n->bufs)];
  char fmt[8];

  if (!n->c_locale)
    {
      g_snprintf (buf, G_ASCII_DTOSTR_BUF_SIZE, "%.*f", decimals, value);
      return buf;
    }
  g_snprintf (fmt, sizeof fmt, "%%.%df", decimals);
  return g_ascii_formatd (buf, G_ASCII_DTOSTR_BUF_SIZE, fmt, value);
}

static char *
describe_final_shape (const CwFinding *f,
                      Numbers         *n)
{
  if (!isfinite (f->value))
    return g_strdup_printf (_("No file reached the working length; the target is size %s at taper %s."),
                            num (n, f->limit, 0), num (n, f->other_limit, 3));
  return g_strdup_printf (_("The final shape is size %s at apical taper %s, short of the target size %s at taper %s."),
                          num (n, f->value, 0), num (n, f->other, 3),
                          num (n, f->limit, 0), num (n, f->other_limit, 3));
}

static char *
describe_strain (const CwFinding *f,
                 Numbers         *n)
{
  if (f->level == CW_LEVEL_STOP)
    return g_strdup_printf (_("Bending strain in the curve is %s %%, over the alloy's limit of %s %%."),
                            num (n, f->value * 100, 2), num (n, f->limit * 100, 2));
  return g_strdup_printf (_("Bending strain in the curve is %s %%, over 80 %% of the alloy's limit of %s %%."),
                          num (n, f->value * 100, 2), num (n, f->limit * 100, 2));
}

static char *
describe_glide_path (const CwFinding *f,
                     Numbers         *n)
{
  if (!isfinite (f->other))
    return g_strdup_printf (_("No file of size %s or smaller has been to %s mm before this powered file enters the curve."),
                            num (n, f->limit, 0), num (n, f->value, 1));
  return g_strdup_printf (_("No file of size %s or smaller has been to %s mm before this powered file enters the curve; the glide path reaches %s mm."),
                          num (n, f->limit, 0), num (n, f->value, 1), num (n, f->other, 1));
}

static char *
describe_step_rule (const CwFinding *f,
                    Numbers         *n)
{
  switch (f->rule)
    {
    case CW_RULE_CURVE_ENGAGEMENT:
      return g_strdup_printf (_("%s mm of the file engages the wall in the curve; at most %s mm should."),
                              num (n, f->value, 2), num (n, f->limit, 2));
    case CW_RULE_DIAMETER_CEILING:
      return g_strdup_printf (_("At %s mm the file is %s mm wide in the curve, over the %s mm ceiling; it may go to %s mm at most."),
                              num (n, f->value, 2), num (n, f->other, 3),
                              num (n, f->other_limit, 2), num (n, f->limit, 2));
    case CW_RULE_CEILING_TABLE:
      return g_strdup_printf (_("Taper %s is outside the ceiling table; the nearest row, %s mm, is used."),
                              num (n, f->value, 3), num (n, f->limit, 2));
    case CW_RULE_STRAIGHT_CLEARANCE:
      return g_strdup_printf (_("While working the curve the file still cuts %s mm of the straight part, up to %s mm over its width."),
                              num (n, f->value, 2), num (n, f->other, 3));
    case CW_RULE_TAPER_CHANGE:
      return g_strdup_printf (_("Same taper (%s) as the previous powered file; change to a different taper."),
                              num (n, f->value, 3));
    case CW_RULE_TORSION:
      return g_strdup_printf (_("The torque limit of %s N·cm is above the estimated fracture torque at D3 of %s N·cm; the motor will not protect the tip."),
                              num (n, f->value, 2), num (n, f->limit, 2));
    case CW_RULE_BEYOND_LENGTH:
      return g_strdup_printf (_("Depth %s mm is %s mm beyond the working length of %s mm."),
                              num (n, f->value, 2), num (n, f->value - f->limit, 2), num (n, f->limit, 2));
    case CW_RULE_INSTRUMENT_LENGTH:
      return g_strdup_printf (_("Depth %s mm is deeper than the file's own length of %s mm."),
                              num (n, f->value, 2), num (n, f->limit, 2));
    default:
      g_assert_not_reached ();
    }
}

char *
cw_finding_describe (const CwFinding *finding,
                     gboolean         c_locale)
{
  Numbers n = { .c_locale = c_locale };

  g_return_val_if_fail (finding != NULL, NULL);

  switch (finding->rule)
    {
    case CW_RULE_FINAL_SHAPE:
      return describe_final_shape (finding, &n);
    case CW_RULE_STRAIN:
      return describe_strain (finding, &n);
    case CW_RULE_GLIDE_PATH:
      return describe_glide_path (finding, &n);
    default:
      return describe_step_rule (finding, &n);
    }
}
