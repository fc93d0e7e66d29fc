/* cw-export.h: a case's plan written as PNG, PDF or SVG
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-case.h"
#include "cw-plan-sheet.h"
#include "cw-render-style.h"

G_BEGIN_DECLS

typedef enum
{
  CW_EXPORT_PNG,
  CW_EXPORT_PDF,
  CW_EXPORT_SVG,
} CwExportFormat;

typedef struct
{
  CwExportFormat format;
  const char    *canal;     /* NULL: every canal */
  double         dpi;       /* PNG only */
  CwPaper        paper;     /* the plan sheet */
  gboolean       diagrams;  /* PDF: the sequence diagrams, a page each, not the plan sheet */
  CwRenderTheme  theme;
  GDateTime     *date;      /* NULL: now, or SOURCE_DATE_EPOCH */
} CwExportOptions;

#define CW_EXPORT_DEFAULT_DPI 96.0
#define CW_EXPORT_MAX_DPI 1200.0

void      cw_export_options_init     (CwExportOptions       *options,
                                      CwExportFormat         format);
gboolean  cw_export_format_for_path  (const char            *path,
                                      CwExportFormat        *format);
/* Writes a PDF plan sheet (or diagrams) to out, or a PNG or SVG picture a
 * canal: exactly out for one canal, out-NAME.ext for each of several.
 * Appends the paths written to written when it is not NULL.  Each file is
 * written whole or not at all. */
gboolean  cw_export_case             (const CwCase          *kase,
                                      const char            *out,
                                      const CwExportOptions *options,
                                      GPtrArray             *written,
                                      GError               **error);
char     *cw_export_canal_path       (const char            *out,
                                      const char            *canal);

G_END_DECLS
