/* cw-plan-text.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cw-iso.h"
#include "cw-plan-text.h"
#include "cw-render-text.h"

/* The cautions of every exported plan (domain reference, "Cautions the
 * program shows"). */
const char *
cw_plan_cautions (void)
{
  return _("Canalwright is a planning aid. Lengths from a radiograph are estimates: confirm the "
           "working length with an electronic apex locator and a radiograph. The instrument "
           "maker's instructions for use, clinical judgement and local regulations come first.");
}

/* "Tooth 36 (FDI), Universal 19", or the other way round. */
char *
cw_plan_tooth_text (const CwCase *kase)
{
  const char *code = kase->tooth_code ? kase->tooth_code : "?";
  g_autofree char *other = NULL;

  if (kase->notation == CW_NOTATION_FDI)
    {
      other = cw_tooth_fdi_to_universal (code);
      if (other)
        return g_strdup_printf (_("Tooth %s (FDI), Universal %s"), code, other);
      return g_strdup_printf (_("Tooth %s (FDI)"), code);
    }
  other = cw_tooth_universal_to_fdi (code);
  if (other)
    return g_strdup_printf (_("Tooth %s (Universal), FDI %s"), code, other);
  return g_strdup_printf (_("Tooth %s (universal)"), code);
}

/* SOURCE_DATE_EPOCH, when set, makes exports reproducible. */
GDateTime *
cw_plan_export_date (void)
{
  const char *epoch = g_getenv ("SOURCE_DATE_EPOCH");

  if (epoch && *epoch)
    return g_date_time_new_from_unix_utc (g_ascii_strtoll (epoch, NULL, 10));
  return g_date_time_new_now_local ();
}

char *
cw_plan_date_text (GDateTime *date)
{
  return g_date_time_format (date, "%x");
}

char *
cw_plan_duration (double seconds)
{
  int total = (int) lround (isfinite (seconds) ? seconds : 0);

  if (total < 60)
    return g_strdup_printf (_("%d s"), total);
  return g_strdup_printf (_("%d min %02d s"), total / 60, total % 60);
}

/* The user's label, with size and taper when the label does not say them. */
char *
cw_plan_file_text (const CwInstrument *instrument)
{
  g_autofree char *name = cw_render_file_name (instrument);
  const char *label = instrument->label;

  if (label == NULL || *label == '\0')
    return g_steal_pointer (&name);
  if (strstr (label, name))
    return g_strdup (label);
  return g_strdup_printf ("%s, %s", label, name);
}

static void
append_zone (GString    *text,
             const char *name,
             double      s)
{
  g_autofree char *depth = cw_render_number (s, 1);

  if (text->len > 0)
    g_string_append (text, " · ");
  g_string_append_printf (text, _("%s %s mm"), name, depth);
}

/* "orifice 7.0 mm · curve onset 14.3 mm · curve end 18.0 mm · WL 20.5 mm" */
char *
cw_plan_zones_text (const CwCanal    *canal,
                    const CwGeometry *geometry)
{
  g_autoptr(GString) text = g_string_new (NULL);

  append_zone (text, _("orifice"), canal->orifice_depth);
  for (guint i = 0; i < geometry->n_curves; i++)
    {
      append_zone (text, _("curve onset"), geometry->onset[i]);
      append_zone (text, _("curve end"), geometry->end[i]);
    }
  append_zone (text, _("WL"), canal->working_length);
  return g_string_free (g_steal_pointer (&text), FALSE);
}

char *
cw_plan_final_text (const CwCanalResult *result)
{
  g_autofree char *time = cw_plan_duration (result->time);
  g_autofree char *size = cw_render_number (result->apical_size, 0);
  g_autofree char *taper = cw_render_taper (result->apical_taper);

  if (!isfinite (result->apical_size))
    return g_strdup_printf (_("Final shape: no file reached the working length. Estimated time %s."), time);
  return g_strdup_printf (_("Final shape: apical size %s, apical taper %s. Estimated time %s."),
                          size, taper, time);
}
