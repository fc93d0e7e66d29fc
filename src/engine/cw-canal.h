/* cw-canal.h: one canal of one tooth
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

#include "cw-pwl.h"

G_BEGIN_DECLS

#define CW_MAX_CURVES 2

/* A curve is given either by its turning angle and radius or by the
 * Schneider angle (then it runs to the working length).  Angles in degrees. */
typedef struct
{
  double    onset;
  double    angle;            /* turning angle phi; NAN when given by Schneider */
  double    radius;           /* NAN when given by Schneider */
  double    schneider_angle;  /* NAN when given by angle and radius */
  char     *extra_json;
} CwCurve;

typedef struct
{
  char    *instrument_id;
  double   depth;
  char    *note;
  char    *extra_json;
} CwStep;

typedef struct
{
  char     *name;
  char     *reference;
  double    working_length;
  double    orifice_depth;
  CwCurve   curves[CW_MAX_CURVES];
  guint     n_curves;
  /* Natural diameters: linear from orifice to apex, or measured points. */
  double    orifice_diameter;
  double    apical_diameter;
  GArray   *diameters;        /* CwPoint (s, diameter), NULL when linear */
  char     *anatomy_extra_json;
  GArray   *sequence;         /* CwStep */
  char     *extra_json;
} CwCanal;

/* The curves resolved to onset, end, turning angle (radians) and radius. */
typedef struct
{
  guint   n_curves;
  double  onset[CW_MAX_CURVES];
  double  end[CW_MAX_CURVES];
  double  phi[CW_MAX_CURVES];
  double  radius[CW_MAX_CURVES];
} CwGeometry;

CwCanal  *cw_canal_new               (const char     *name,
                                      double          working_length,
                                      double          orifice_depth);
CwCanal  *cw_canal_copy              (const CwCanal  *canal);
void      cw_canal_free              (CwCanal        *canal);
void      cw_canal_add_curve         (CwCanal        *canal,
                                      double          onset,
                                      double          angle,
                                      double          radius);
void      cw_canal_add_schneider     (CwCanal        *canal,
                                      double          onset,
                                      double          schneider_angle);
void      cw_canal_add_step          (CwCanal        *canal,
                                      const char     *instrument_id,
                                      double          depth);
void      cw_canal_clear_sequence    (CwCanal        *canal);
guint     cw_canal_get_n_steps       (const CwCanal  *canal);
CwStep   *cw_canal_get_step          (const CwCanal  *canal,
                                      guint           index);
void      cw_canal_get_geometry      (const CwCanal  *canal,
                                      CwGeometry     *geometry);
double    cw_canal_first_onset       (const CwCanal  *canal);
CwPwl    *cw_canal_natural_diameter  (const CwCanal  *canal,
                                      double          s_end);

double    cw_schneider_to_turning    (double          schneider_angle);
double    cw_curve_chord_angle       (double          phi,
                                      double          radius);

gboolean  cw_canal_validate          (const CwCanal  *canal,
                                      GError        **error);

void      cw_step_clear              (CwStep         *step);
void      cw_curve_clear             (CwCurve        *curve);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwCanal, cw_canal_free)

G_END_DECLS
