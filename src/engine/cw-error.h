/* cw-error.h
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define CW_ERROR (cw_error_quark ())

typedef enum
{
  CW_ERROR_READ,
  CW_ERROR_TOO_LARGE,
  CW_ERROR_SYNTAX,
  CW_ERROR_INVALID,
  CW_ERROR_NEWER_VERSION,
  CW_ERROR_WRITE,
} CwError;

GQuark cw_error_quark (void);

G_END_DECLS
