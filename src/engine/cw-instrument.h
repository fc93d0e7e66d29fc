/* cw-instrument.h: one endodontic file type and its diameter profile
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef enum
{
  CW_ALLOY_STAINLESS,
  CW_ALLOY_NITI,
  CW_ALLOY_NITI_HEAT_TREATED,
  CW_N_ALLOYS
} CwAlloy;

typedef enum
{
  CW_MOTION_HAND,
  CW_MOTION_ROTARY,
  CW_MOTION_RECIPROCATING,
  CW_N_MOTIONS
} CwMotion;

typedef struct
{
  double to;     /* mm from the tip where this segment ends */
  double taper;  /* mm of diameter per mm of length */
} CwTaperSegment;

/* Optional numbers are NAN when not given. */
typedef struct
{
  char     *id;
  char     *label;
  double    tip;                 /* ISO size number: D0 = tip / 100 mm */
  double    taper;               /* constant taper; NAN when segments are used */
  GArray   *segments;            /* CwTaperSegment, NULL for a constant taper */
  double    flute_length;
  double    length;
  double    max_flute_diameter;
  CwAlloy   alloy;
  CwMotion  motion;
  double    rpm;
  double    torque_limit;        /* N·cm */
  int       uses_allowed;        /* 0 when not given */
  char     *extra_json;          /* members this version does not know, as a JSON object */
} CwInstrument;

#define CW_DEFAULT_FLUTE_LENGTH 16.0
#define CW_DEFAULT_INSTRUMENT_LENGTH 25.0

CwInstrument *cw_instrument_new            (const char          *id,
                                            double               tip,
                                            double               taper);
CwInstrument *cw_instrument_copy           (const CwInstrument  *instrument);
void          cw_instrument_free           (CwInstrument        *instrument);
void          cw_instrument_set_segments   (CwInstrument        *instrument,
                                            const CwTaperSegment *segments,
                                            guint                n_segments);
gboolean      cw_instrument_is_powered     (const CwInstrument  *instrument);
double        cw_instrument_tip_diameter   (const CwInstrument  *instrument);
double        cw_instrument_taper_at       (const CwInstrument  *instrument,
                                            double               x);
double        cw_instrument_nominal_taper  (const CwInstrument  *instrument);
double        cw_instrument_largest_taper  (const CwInstrument  *instrument);
double        cw_instrument_diameter       (const CwInstrument  *instrument,
                                            double               x);

const char   *cw_alloy_to_string           (CwAlloy              alloy);
gboolean      cw_alloy_from_string         (const char          *str,
                                            CwAlloy             *alloy);
const char   *cw_motion_to_string          (CwMotion             motion);
gboolean      cw_motion_from_string        (const char          *str,
                                            CwMotion            *motion);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (CwInstrument, cw_instrument_free)

/* The diameter profile d(x), x the distance from the tip, as breakpoints
 * (x, d): linear between them, capped at the maximum flute diameter, constant
 * past the flutes (the shank). */
typedef struct
{
  guint   n;
  double  x[20];
  double  d[20];
  double  flute_length;
} CwProfile;

void          cw_profile_init              (CwProfile           *profile,
                                            const CwInstrument  *instrument);
double        cw_profile_diameter          (const CwProfile     *profile,
                                            double               x);
double        cw_profile_max_diameter      (const CwProfile     *profile);
double        cw_profile_reach             (const CwProfile     *profile,
                                            double               value);
double        cw_profile_largest_taper     (const CwProfile     *profile,
                                            double               x0,
                                            double               x1);

G_END_DECLS
