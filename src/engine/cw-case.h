/* cw-case.h: a case: one tooth, its instruments and canals
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-canal.h"
#include "cw-instrument.h"
#include "cw-rules.h"

G_BEGIN_DECLS

#define CW_CASE_VERSION 1
#define CW_MAX_INSTRUMENTS 64
#define CW_MAX_CANALS 8
#define CW_MAX_STEPS 40
#define CW_MAX_SEGMENTS 8
#define CW_MAX_DIAMETER_POINTS 200
#define CW_MAX_LENGTH 40.0
#define CW_MAX_FILE_SIZE (16 * 1024 * 1024)

typedef enum
{
  CW_NOTATION_FDI,
  CW_NOTATION_UNIVERSAL,
} CwNotation;

typedef struct
{
  char       *title;
  char       *notes;
  CwNotation  notation;
  char       *tooth_code;
  char       *tooth_extra_json;
  double      target_apical_size;
  double      target_apical_taper;
  char       *targets_extra_json;
  CwRules     rules;            /* defaults with the case's overrides applied */
  char       *rules_json;       /* the case's overrides as written, or NULL */
  GPtrArray  *instruments;      /* CwInstrument */
  GPtrArray  *canals;           /* CwCanal */
  char       *extra_json;
} CwCase;

#define CW_DEFAULT_TARGET_SIZE 30.0
#define CW_DEFAULT_TARGET_TAPER 0.04

CwCase             *cw_case_new               (void);
CwCase             *cw_case_copy              (const CwCase  *self);
void                cw_case_free              (CwCase        *self);
void                cw_case_add_instrument    (CwCase        *self,
                                               CwInstrument  *instrument);
void                cw_case_add_canal         (CwCase        *self,
                                               CwCanal       *canal);
const CwInstrument *cw_case_find_instrument   (const CwCase  *self,
                                               const char    *id);
CwCanal            *cw_case_find_canal        (const CwCase  *self,
                                               const char    *name);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwCase, cw_case_free)

G_END_DECLS
