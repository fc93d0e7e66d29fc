/* cw-plan-sheet.h: the printed plan of a case, page by page
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <cairo.h>

#include "cw-case.h"
#include "cw-evaluate.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

typedef enum
{
  CW_PAPER_A4,
  CW_PAPER_LETTER,
} CwPaper;

void      cw_paper_size          (CwPaper     paper,
                                  double     *width,
                                  double     *height);
CwPaper   cw_paper_from_locale   (void);
gboolean  cw_paper_from_string   (const char *str,
                                  CwPaper    *paper);

typedef struct _CwPlanSheet CwPlanSheet;

/* results: one CwCanalResult a canal to print, in order.  The sheet keeps
 * references to the case and the results; they must outlive it. */
CwPlanSheet *cw_plan_sheet_new         (const CwCase        *kase,
                                        GPtrArray           *results,
                                        const CwRenderStyle *style,
                                        CwPaper              paper,
                                        GDateTime           *date);
void         cw_plan_sheet_free        (CwPlanSheet         *sheet);
guint        cw_plan_sheet_get_n_pages (CwPlanSheet         *sheet);
/* Draws page (0-based) at (0, 0) in points; the caller shows the page. */
void         cw_plan_sheet_draw_page   (CwPlanSheet         *sheet,
                                        cairo_t             *cr,
                                        guint                page);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwPlanSheet, cw_plan_sheet_free)

G_END_DECLS
