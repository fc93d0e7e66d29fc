/* cw-test-util.h: small builders shared by the engine tests
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include "cw-case.h"
#include "cw-evaluate.h"

G_BEGIN_DECLS

CwInstrument     *cw_test_instrument       (CwCase       *kase,
                                            const char   *id,
                                            double        tip,
                                            double        taper,
                                            CwAlloy       alloy,
                                            CwMotion      motion);
CwCanal          *cw_test_canal            (CwCase       *kase,
                                            double        working_length,
                                            double        orifice,
                                            double        orifice_diameter,
                                            double        apical_diameter);
const CwFinding  *cw_test_find             (const CwStepResult *step,
                                            CwRule        rule);
char             *cw_test_sample_path      (const char   *name);

#define cw_assert_near(a, b, tol) \
  G_STMT_START { \
    double __a = (a), __b = (b); \
    if (!(fabs (__a - __b) <= (tol))) \
      g_error ("%s:%d: %s = %.9g, expected %.9g (within %g)", __FILE__, __LINE__, #a, __a, __b, (double) (tol)); \
  } G_STMT_END

G_END_DECLS
