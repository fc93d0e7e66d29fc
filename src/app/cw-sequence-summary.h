/* cw-sequence-summary.h: one sequence of a canal, drawn with its figures
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <gtk/gtk.h>

#include "cw-case.h"
#include "cw-evaluate.h"

G_BEGIN_DECLS

#define CW_TYPE_SEQUENCE_SUMMARY (cw_sequence_summary_get_type ())

G_DECLARE_FINAL_TYPE (CwSequenceSummary, cw_sequence_summary, CW, SEQUENCE_SUMMARY, GtkWidget)

typedef struct
{
  double time;
  guint  cautions;
  guint  stops;
  double apical_size;
  double apical_taper;
  guint  steps;
} CwSequenceTotals;

GtkWidget           *cw_sequence_summary_new        (void);
void                 cw_sequence_summary_set        (CwSequenceSummary *self,
                                                     const CwCase      *kase,
                                                     const CwCanal     *canal,
                                                     const char        *title);
const CwCanalResult *cw_sequence_summary_get_result (CwSequenceSummary *self);
void                 cw_sequence_totals             (const CwCanalResult *result,
                                                     CwSequenceTotals    *totals);

G_END_DECLS
