/* cw-canal.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-canal"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdarg.h>

#include "cw-canal.h"
#include "cw-error.h"

void
cw_step_clear (CwStep *step)
{
  g_clear_pointer (&step->instrument_id, g_free);
  g_clear_pointer (&step->note, g_free);
  g_clear_pointer (&step->extra_json, g_free);
}

void
cw_curve_clear (CwCurve *curve)
{
  g_clear_pointer (&curve->extra_json, g_free);
}

static GArray *
new_sequence (void)
{
  GArray *seq = g_array_new (FALSE, TRUE, sizeof (CwStep));

  g_array_set_clear_func (seq, (GDestroyNotify) cw_step_clear);
  return seq;
}

CwCanal *
cw_canal_new (const char *name,
              double      working_length,
              double      orifice_depth)
{
  CwCanal *self = g_new0 (CwCanal, 1);

  self->name = g_strdup (name);
  self->working_length = working_length;
  self->orifice_depth = orifice_depth;
  self->orifice_diameter = NAN;
  self->apical_diameter = NAN;
  self->sequence = new_sequence ();
  return self;
}

CwCanal *
cw_canal_copy (const CwCanal *canal)
{
  CwCanal *self;

  g_return_val_if_fail (canal != NULL, NULL);

  self = g_memdup2 (canal, sizeof *canal);
  self->name = g_strdup (canal->name);
  self->reference = g_strdup (canal->reference);
  self->anatomy_extra_json = g_strdup (canal->anatomy_extra_json);
  self->extra_json = g_strdup (canal->extra_json);
  for (guint i = 0; i < canal->n_curves; i++)
    self->curves[i].extra_json = g_strdup (canal->curves[i].extra_json);
  if (canal->diameters)
    self->diameters = g_array_copy (canal->diameters);
  self->sequence = new_sequence ();
  for (guint i = 0; i < canal->sequence->len; i++)
    {
      const CwStep *src = &g_array_index (canal->sequence, CwStep, i);
      CwStep step = {
        g_strdup (src->instrument_id), src->depth,
        g_strdup (src->note), g_strdup (src->extra_json),
      };

      g_array_append_val (self->sequence, step);
    }
  return self;
}

void
cw_canal_free (CwCanal *canal)
{
  if (canal == NULL)
    return;
  g_free (canal->name);
  g_free (canal->reference);
  g_free (canal->anatomy_extra_json);
  g_free (canal->extra_json);
  for (guint i = 0; i < canal->n_curves; i++)
    cw_curve_clear (&canal->curves[i]);
  g_clear_pointer (&canal->diameters, g_array_unref);
  g_clear_pointer (&canal->sequence, g_array_unref);
  g_free (canal);
}

static CwCurve *
next_curve (CwCanal *canal,
            double   onset)
{
  CwCurve *curve;

  g_return_val_if_fail (canal->n_curves < CW_MAX_CURVES, NULL);
  curve = &canal->curves[canal->n_curves++];
  curve->onset = onset;
  curve->angle = NAN;
  curve->radius = NAN;
  curve->schneider_angle = NAN;
  curve->extra_json = NULL;
  return curve;
}

void
cw_canal_add_curve (CwCanal *canal,
                    double   onset,
                    double   angle,
                    double   radius)
{
  CwCurve *curve = next_curve (canal, onset);

  if (curve == NULL)
    return;
  curve->angle = angle;
  curve->radius = radius;
}

void
cw_canal_add_schneider (CwCanal *canal,
                        double   onset,
                        double   schneider_angle)
{
  CwCurve *curve = next_curve (canal, onset);

  if (curve == NULL)
    return;
  curve->schneider_angle = schneider_angle;
}

void
cw_canal_add_step (CwCanal    *canal,
                   const char *instrument_id,
                   double      depth)
{
  CwStep step = { g_strdup (instrument_id), depth, NULL, NULL };

  g_return_if_fail (canal != NULL);
  g_array_append_val (canal->sequence, step);
}

void
cw_canal_clear_sequence (CwCanal *canal)
{
  g_array_set_size (canal->sequence, 0);
}

guint
cw_canal_get_n_steps (const CwCanal *canal)
{
  return canal->sequence->len;
}

CwStep *
cw_canal_get_step (const CwCanal *canal,
                   guint          index)
{
  g_return_val_if_fail (index < canal->sequence->len, NULL);
  return &g_array_index (canal->sequence, CwStep, index);
}

/* A circular arc's chord makes half the turning angle with the arc's first
 * tangent, so a curve that runs to the apex turns through twice the angle
 * Schneider measures on the radiograph.  Degrees in, degrees out. */
double
cw_schneider_to_turning (double schneider_angle)
{
  return 2.0 * schneider_angle;
}

/* The angle between the first tangent and the chord of an arc, found by
 * construction: start at the origin heading along +x, turn left through phi
 * on radius R; the chord runs to the end point. Radians in and out. */
double
cw_curve_chord_angle (double phi,
                      double radius)
{
  double ex = radius * sin (phi);
  double ey = radius * (1.0 - cos (phi));

  return atan2 (ey, ex);
}

void
cw_canal_get_geometry (const CwCanal *canal,
                       CwGeometry    *geometry)
{
  geometry->n_curves = canal->n_curves;
  for (guint i = 0; i < canal->n_curves; i++)
    {
      const CwCurve *curve = &canal->curves[i];
      double phi, radius;

      if (isfinite (curve->schneider_angle))
        {
          phi = cw_schneider_to_turning (curve->schneider_angle) * G_PI / 180.0;
          radius = (canal->working_length - curve->onset) / phi;
        }
      else
        {
          phi = curve->angle * G_PI / 180.0;
          radius = curve->radius;
        }
      geometry->onset[i] = curve->onset;
      geometry->phi[i] = phi;
      geometry->radius[i] = radius;
      geometry->end[i] = curve->onset + radius * phi;
    }
}

double
cw_canal_first_onset (const CwCanal *canal)
{
  return canal->n_curves > 0 ? canal->curves[0].onset : NAN;
}

/* P0(s): linear from the orifice to the apex, or the measured points; both
 * keep their end values beyond, out to s_end. */
CwPwl *
cw_canal_natural_diameter (const CwCanal *canal,
                           double         s_end)
{
  CwPwl *pwl = cw_pwl_new ();

  if (canal->diameters != NULL && canal->diameters->len > 0)
    {
      const CwPoint *p = (const CwPoint *) (gpointer) canal->diameters->data;

      for (guint i = 0; i < canal->diameters->len; i++)
        cw_pwl_append (pwl, p[i].s, p[i].v);
    }
  else
    {
      cw_pwl_append (pwl, canal->orifice_depth, canal->orifice_diameter);
      cw_pwl_append (pwl, canal->working_length, canal->apical_diameter);
    }
  if (s_end > cw_pwl_get_points (pwl)[cw_pwl_get_n_points (pwl) - 1].s)
    cw_pwl_append (pwl, s_end, cw_pwl_get_points (pwl)[cw_pwl_get_n_points (pwl) - 1].v);
  return pwl;
}

static gboolean
fail (GError     **error,
      const char  *format,
      ...) G_GNUC_PRINTF (2, 3);

static gboolean
fail (GError     **error,
      const char  *format,
      ...)
{
  va_list args;
  g_autofree char *message = NULL;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  g_set_error_literal (error, CW_ERROR, CW_ERROR_INVALID, message);
  return FALSE;
}

/* The order the zones must keep: orifice < onset < curve end <= WL, a second
 * curve after the first; the same rules as the case loader's. */
gboolean
cw_canal_validate (const CwCanal  *canal,
                   GError        **error)
{
  CwGeometry geo;

  if (!(canal->working_length > 0 && canal->working_length <= 40))
    return fail (error, _("The working length must be over 0 and at most 40 mm."));
  if (!(canal->orifice_depth > 0 && canal->orifice_depth < canal->working_length))
    return fail (error, _("The orifice must lie between the reference point and the working length."));
  cw_canal_get_geometry (canal, &geo);
  for (guint i = 0; i < geo.n_curves; i++)
    {
      if (!(geo.onset[i] > canal->orifice_depth))
        return fail (error, _("Curve %u must start below the orifice (%.1f mm)."), i + 1, canal->orifice_depth);
      if (!(geo.radius[i] > 0 && geo.phi[i] > 0))
        return fail (error, _("Curve %u needs an angle and a radius over 0."), i + 1);
      if (geo.end[i] > canal->working_length + 1e-9)
        return fail (error, _("Curve %u ends at %.1f mm, past the working length of %.1f mm."),
                     i + 1, geo.end[i], canal->working_length);
      if (i > 0 && geo.onset[i] < geo.end[i - 1] - 1e-9)
        return fail (error, _("Curve 2 must start where curve 1 ends (%.1f mm) or below."), geo.end[i - 1]);
    }
  return TRUE;
}
