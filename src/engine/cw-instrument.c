/* cw-instrument.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-instrument"

#include <math.h>
#include <string.h>

#include "cw-instrument.h"

static const char *alloy_names[CW_N_ALLOYS] = { "stainless", "niti", "niti-heat-treated" };
static const char *motion_names[CW_N_MOTIONS] = { "hand", "rotary", "reciprocating" };

CwInstrument *
cw_instrument_new (const char *id,
                   double      tip,
                   double      taper)
{
  CwInstrument *self = g_new0 (CwInstrument, 1);

  self->id = g_strdup (id);
  self->tip = tip;
  self->taper = taper;
  self->flute_length = CW_DEFAULT_FLUTE_LENGTH;
  self->length = CW_DEFAULT_INSTRUMENT_LENGTH;
  self->max_flute_diameter = NAN;
  self->alloy = CW_ALLOY_STAINLESS;
  self->motion = CW_MOTION_HAND;
  self->rpm = NAN;
  self->torque_limit = NAN;
  return self;
}

CwInstrument *
cw_instrument_copy (const CwInstrument *instrument)
{
  CwInstrument *self;

  g_return_val_if_fail (instrument != NULL, NULL);

  self = g_memdup2 (instrument, sizeof *instrument);
  self->id = g_strdup (instrument->id);
  self->label = g_strdup (instrument->label);
  self->extra_json = g_strdup (instrument->extra_json);
  if (instrument->segments)
    self->segments = g_array_copy (instrument->segments);
  return self;
}

void
cw_instrument_free (CwInstrument *instrument)
{
  if (instrument == NULL)
    return;
  g_free (instrument->id);
  g_free (instrument->label);
  g_free (instrument->extra_json);
  g_clear_pointer (&instrument->segments, g_array_unref);
  g_free (instrument);
}

void
cw_instrument_set_segments (CwInstrument         *instrument,
                            const CwTaperSegment *segments,
                            guint                 n_segments)
{
  g_return_if_fail (instrument != NULL);
  g_return_if_fail (n_segments > 0 && segments != NULL);

  g_clear_pointer (&instrument->segments, g_array_unref);
  instrument->segments = g_array_sized_new (FALSE, FALSE, sizeof (CwTaperSegment), n_segments);
  g_array_append_vals (instrument->segments, segments, n_segments);
  instrument->taper = NAN;
}

gboolean
cw_instrument_is_powered (const CwInstrument *instrument)
{
  return instrument->motion != CW_MOTION_HAND;
}

double
cw_instrument_tip_diameter (const CwInstrument *instrument)
{
  return instrument->tip / 100.0;
}

/* The nominal taper taper of a segment at distance x from the tip; past the
 * last segment its taper goes on to the end of the flutes. */
double
cw_instrument_taper_at (const CwInstrument *instrument,
                        double              x)
{
  const CwTaperSegment *seg;
  guint n;

  if (instrument->segments == NULL)
    return instrument->taper;
  seg = (const CwTaperSegment *) (gpointer) instrument->segments->data;
  n = instrument->segments->len;
  for (guint i = 0; i < n; i++)
    if (x < seg[i].to)
      return seg[i].taper;
  return seg[n - 1].taper;
}

/* The taper the trade names a file by: the one at its tip. */
double
cw_instrument_nominal_taper (const CwInstrument *instrument)
{
  return cw_instrument_taper_at (instrument, 0.0);
}

double
cw_instrument_largest_taper (const CwInstrument *instrument)
{
  const CwTaperSegment *seg;
  double best = 0.0;

  if (instrument->segments == NULL)
    return instrument->taper;
  seg = (const CwTaperSegment *) (gpointer) instrument->segments->data;
  for (guint i = 0; i < instrument->segments->len; i++)
    {
      double from = i == 0 ? 0.0 : seg[i - 1].to;

      if (from < instrument->flute_length)
        best = MAX (best, seg[i].taper);
    }
  return best;
}

double
cw_instrument_diameter (const CwInstrument *instrument,
                        double              x)
{
  CwProfile profile;

  cw_profile_init (&profile, instrument);
  return cw_profile_diameter (&profile, x);
}

static gboolean
lookup (const char * const *names,
        guint               n,
        const char         *str,
        int                *out)
{
  for (guint i = 0; i < n; i++)
    if (g_strcmp0 (names[i], str) == 0)
      {
        *out = (int) i;
        return TRUE;
      }
  return FALSE;
}

const char *
cw_alloy_to_string (CwAlloy alloy)
{
  g_return_val_if_fail (alloy < CW_N_ALLOYS, NULL);
  return alloy_names[alloy];
}

gboolean
cw_alloy_from_string (const char *str,
                      CwAlloy    *alloy)
{
  int v;

  if (!lookup (alloy_names, CW_N_ALLOYS, str, &v))
    return FALSE;
  *alloy = (CwAlloy) v;
  return TRUE;
}

const char *
cw_motion_to_string (CwMotion motion)
{
  g_return_val_if_fail (motion < CW_N_MOTIONS, NULL);
  return motion_names[motion];
}

gboolean
cw_motion_from_string (const char *str,
                       CwMotion   *motion)
{
  int v;

  if (!lookup (motion_names, CW_N_MOTIONS, str, &v))
    return FALSE;
  *motion = (CwMotion) v;
  return TRUE;
}

static void
profile_add (CwProfile *profile,
             double     x,
             double     d)
{
  g_assert (profile->n < G_N_ELEMENTS (profile->x));
  if (profile->n > 0 && profile->x[profile->n - 1] == x)
    return;
  profile->x[profile->n] = x;
  profile->d[profile->n] = d;
  profile->n++;
}

/* Truncate the rising profile where it first reaches the cap, then run flat
 * to the end of the flutes. */
static void
profile_cap (CwProfile *profile,
             double     cap)
{
  for (guint i = 1; i < profile->n; i++)
    {
      if (profile->d[i] <= cap)
        continue;
      if (profile->d[i - 1] < cap)
        {
          double f = (cap - profile->d[i - 1]) / (profile->d[i] - profile->d[i - 1]);

          profile->x[i] = profile->x[i - 1] + f * (profile->x[i] - profile->x[i - 1]);
          profile->d[i] = cap;
          profile->n = i + 1;
        }
      else
        profile->n = i;
      profile_add (profile, profile->flute_length, cap);
      return;
    }
}

void
cw_profile_init (CwProfile          *profile,
                 const CwInstrument *instrument)
{
  double x = 0.0, d = cw_instrument_tip_diameter (instrument);
  double flutes = instrument->flute_length;

  memset (profile, 0, sizeof *profile);
  profile->flute_length = flutes;
  profile_add (profile, 0.0, d);
  if (instrument->segments != NULL)
    {
      for (guint i = 0; i < instrument->segments->len && x < flutes; i++)
        {
          const CwTaperSegment *seg = &g_array_index (instrument->segments, CwTaperSegment, i);
          double to = i + 1 == instrument->segments->len ? flutes : MIN (seg->to, flutes);

          d += seg->taper * (to - x);
          x = to;
          profile_add (profile, x, d);
        }
    }
  else
    profile_add (profile, flutes, d + instrument->taper * flutes);

  if (isfinite (instrument->max_flute_diameter))
    profile_cap (profile, instrument->max_flute_diameter);
}

double
cw_profile_diameter (const CwProfile *profile,
                     double           x)
{
  if (x <= 0.0)
    return profile->d[0];
  for (guint i = 1; i < profile->n; i++)
    if (x <= profile->x[i])
      return profile->d[i - 1] + (profile->d[i] - profile->d[i - 1]) *
             (x - profile->x[i - 1]) / (profile->x[i] - profile->x[i - 1]);
  return profile->d[profile->n - 1];
}

double
cw_profile_max_diameter (const CwProfile *profile)
{
  return profile->d[profile->n - 1];
}

/* The largest x at which d(x) <= value: 0 when the tip is already wider,
 * INFINITY when the flutes never grow past value.  A widest flute within
 * rounding of value (a 40/.02 of 10 mm flutes against a 0.60 mm ceiling)
 * does not grow past it. */
double
cw_profile_reach (const CwProfile *profile,
                  double           value)
{
  if (value < profile->d[0])
    return 0.0;
  if (value >= cw_profile_max_diameter (profile) - 1e-12)
    return INFINITY;
  for (guint i = 1; i < profile->n; i++)
    if (value < profile->d[i])
      return profile->x[i - 1] + (profile->x[i] - profile->x[i - 1]) *
             (value - profile->d[i - 1]) / (profile->d[i] - profile->d[i - 1]);
  return INFINITY;
}

/* The largest local taper (slope of the profile) over [x0, x1]; a single
 * point takes the slope just past it.  The shank and a capped part have 0. */
double
cw_profile_largest_taper (const CwProfile *profile,
                          double           x0,
                          double           x1)
{
  double best = 0.0;

  for (guint i = 1; i < profile->n; i++)
    {
      double a = profile->x[i - 1], b = profile->x[i];
      gboolean overlaps = x1 > x0 ? (a < x1 && b > x0) : (x0 >= a && x0 < b);

      if (overlaps)
        best = MAX (best, (profile->d[i] - profile->d[i - 1]) / (b - a));
    }
  return best;
}
