/* cw-case-loader.c
 *
 * Case files are written by hand and by other programs, so everything is
 * checked before it is used: the loader builds into a private case and hands
 * it over only when the whole file was valid.  Every message starts with
 * "FILE: PATH: " so that a user (and a test) can see where the fault is.
 * The limits and ranges are those of the case format, version 1.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-case-loader"

#include <math.h>
#include <string.h>

#include "cw-case-loader.h"
#include "cw-error.h"
#include "cw-instrument-json.h"
#include "cw-json-check.h"
#include "cw-json-source.h"
#include "cw-json-writer.h"

/* Curve ends are sums of products; a value typed to match one must not be
 * refused for the last bit of rounding. */
#define LENGTH_EPSILON 1e-9

static char *
format_mm (double value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  return g_strdup (g_ascii_formatd (buf, sizeof buf, "%.2f", value));
}

static gboolean
read_boolean (const char   *file,
              JsonObject   *object,
              const char   *parent,
              const char   *key,
              gboolean     *value,
              GError      **error)
{
  JsonNode *node = json_object_get_member (object, key);
  g_autofree char *path = cw_json_member_path (parent, key);

  if (node == NULL)
    return TRUE;
  if (!JSON_NODE_HOLDS_VALUE (node) || json_node_get_value_type (node) != G_TYPE_BOOLEAN)
    return cw_json_fail (error, CW_ERROR_INVALID, file, path, "must be true or false (got %s)",
                         cw_json_describe_node (node));
  *value = json_node_get_boolean (node);
  return TRUE;
}

/* The rule set. */

#define RULE(key, lo, hi, lo_open, unit) \
  { #key, G_STRUCT_OFFSET (CwRules, key), { lo, hi, lo_open, FALSE, unit }, FALSE }

static const CwNumberField rule_fields[] = {
  RULE (contact_tolerance, 0, 0.5, FALSE, " mm"),
  RULE (advance_rate, 0, 10, TRUE, " mm/s"),
  RULE (peck_increment, 0, 10, TRUE, " mm"),
  RULE (changeover, 0, 600, FALSE, " s"),
  RULE (at_length_tolerance, 0, 5, FALSE, " mm"),
  RULE (curve_engagement_max, 0, CW_MAX_LENGTH, TRUE, " mm"),
  RULE (small_file_tip_max, 6, 140, FALSE, ""),
  RULE (small_file_taper_max, 0, 0.12, TRUE, ""),
  RULE (glide_path_tip_max, 6, 140, FALSE, ""),
};

#define ALLOY_RULE(key, hi, unit, nullable) \
  { #key, G_STRUCT_OFFSET (CwAlloyRules, key), { 0, hi, TRUE, FALSE, unit }, nullable }

static const CwNumberField alloy_fields[] = {
  ALLOY_RULE (strain_limit, 1, "", TRUE),
  ALLOY_RULE (strain_life_a, 1e12, "", TRUE),
  ALLOY_RULE (strain_life_k, 20, "", FALSE),
  ALLOY_RULE (shear_strength, 5000, " MPa", FALSE),
  ALLOY_RULE (section_factor, 1, "", FALSE),
};

static gboolean
read_ceilings (const char  *file,
               JsonObject  *object,
               const char  *parent,
               CwRules     *rules,
               GError     **error)
{
  static const CwRange taper_range = CW_TAPER_RANGE;
  static const CwRange diameter_range = CW_DIAMETER_RANGE;
  JsonNode *node = json_object_get_member (object, "diameter_ceilings");
  g_autofree char *path = cw_json_member_path (parent, "diameter_ceilings");
  JsonArray *rows = NULL;
  guint n;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_array (file, path, node, 1, CW_MAX_CEILING_ROWS, "[taper, diameter] rows", &rows, error))
    return FALSE;
  n = json_array_get_length (rows);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *row = cw_json_index_path (path, i);
      double *taper = &rules->ceiling_taper[i];

      if (!cw_json_node_pair (file, row, json_array_get_element (rows, i), "[taper, diameter]",
                              &taper_range, &diameter_range, taper, &rules->ceiling_diameter[i], error))
        return FALSE;
      if (i > 0 && *taper <= taper[-1])
        {
          g_autofree char *taper_path = cw_json_index_path (row, 0);
          g_autofree char *before = cw_json_format_number (taper[-1]);
          g_autofree char *got = cw_json_format_number (*taper);

          return cw_json_fail (error, CW_ERROR_INVALID, file, taper_path,
                               "must be greater than the taper of the row before, %s (got %s)", before, got);
        }
    }
  rules->n_ceilings = n;
  return TRUE;
}

static gboolean
read_alloy_rules (const char  *file,
                  JsonObject  *alloys,
                  const char  *parent,
                  const char  *name,
                  CwRules     *rules,
                  GError     **error)
{
  g_autofree char *path = cw_json_member_path (parent, name);
  JsonObject *object = NULL;
  CwAlloy alloy;

  if (!cw_alloy_from_string (name, &alloy))
    {
      g_autofree char *choices = cw_json_alloy_choices ();

      return cw_json_fail (error, CW_ERROR_INVALID, file, path, "is not a known alloy (allowed: %s)", choices);
    }
  return cw_json_node_object (file, path, json_object_get_member (alloys, name), &object, error)
         && cw_json_read_fields (file, object, path, alloy_fields, G_N_ELEMENTS (alloy_fields),
                                 &rules->alloys[alloy], error);
}

static gboolean
read_alloys (const char  *file,
             JsonObject  *object,
             const char  *parent,
             CwRules     *rules,
             GError     **error)
{
  JsonNode *node = json_object_get_member (object, "alloys");
  g_autofree char *path = cw_json_member_path (parent, "alloys");
  g_autoptr(GList) names = NULL;
  JsonObject *alloys = NULL;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_object (file, path, node, &alloys, error))
    return FALSE;
  names = json_object_get_members (alloys);
  for (GList *l = names; l != NULL; l = l->next)
    if (!read_alloy_rules (file, alloys, path, l->data, rules, error))
      return FALSE;
  return TRUE;
}

gboolean
cw_rules_apply_json (CwRules     *rules,
                     JsonObject  *object,
                     const char  *display_name,
                     const char  *path_prefix,
                     GError     **error)
{
  const char *file = display_name != NULL ? display_name : "(rules)";
  CwRules result;

  g_return_val_if_fail (rules != NULL, FALSE);
  g_return_val_if_fail (object != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  result = *rules;
  if (!cw_json_read_fields (file, object, path_prefix, rule_fields, G_N_ELEMENTS (rule_fields), &result, error)
      || !read_ceilings (file, object, path_prefix, &result, error)
      || !read_boolean (file, object, path_prefix, "require_taper_change",
                        &result.require_taper_change, error)
      || !read_alloys (file, object, path_prefix, &result, error))
    return FALSE;
  *rules = result;
  return TRUE;
}

/* Tooth, targets, rules and texts of a case. */

static gboolean
is_fdi_code (const char *code)
{
  int quadrant, tooth;

  if (strlen (code) != 2 || !g_ascii_isdigit (code[0]) || !g_ascii_isdigit (code[1]))
    return FALSE;
  quadrant = code[0] - '0';
  tooth = code[1] - '0';
  if (quadrant < 1 || quadrant > 8 || tooth < 1)
    return FALSE;
  /* Quadrants 5 to 8 are the primary teeth: five a quadrant. */
  return tooth <= (quadrant >= 5 ? 5 : 8);
}

static gboolean
is_universal_code (const char *code)
{
  int number;

  if (code[0] >= 'A' && code[0] <= 'T' && code[1] == '\0')
    return TRUE;
  if (code[0] < '1' || code[0] > '9')
    return FALSE;
  number = code[0] - '0';
  if (code[1] == '\0')
    return TRUE;
  if (!g_ascii_isdigit (code[1]) || code[2] != '\0')
    return FALSE;
  number = number * 10 + (code[1] - '0');
  return number <= 32;
}

static gboolean
read_notation (const char  *file,
               JsonObject  *tooth,
               CwNotation  *notation,
               GError     **error)
{
  const char *name = "FDI";

  if (!cw_json_read_string (file, tooth, "tooth", "notation", FALSE, FALSE, &name, error))
    return FALSE;
  if (strcmp (name, "FDI") == 0)
    *notation = CW_NOTATION_FDI;
  else if (strcmp (name, "universal") == 0)
    *notation = CW_NOTATION_UNIVERSAL;
  else
    return cw_json_fail (error, CW_ERROR_INVALID, file, "tooth.notation",
                         "must be \"FDI\" or \"universal\" (got \"%s\")", name);
  return TRUE;
}

static gboolean
read_tooth (const char  *file,
            JsonObject  *object,
            CwCase      *kase,
            GError     **error)
{
  static const char * const keys[] = { "notation", "code", NULL };
  JsonNode *node = json_object_get_member (object, "tooth");
  JsonObject *tooth = NULL;
  CwNotation notation = CW_NOTATION_FDI;
  const char *code = NULL;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_object (file, "tooth", node, &tooth, error)
      || !read_notation (file, tooth, &notation, error)
      || !cw_json_read_string (file, tooth, "tooth", "code", TRUE, TRUE, &code, error))
    return FALSE;
  if (notation == CW_NOTATION_FDI && !is_fdi_code (code))
    return cw_json_fail (error, CW_ERROR_INVALID, file, "tooth.code",
                         "must be an FDI tooth number: quadrant 1-8 then tooth 1-8, "
                         "or 1-5 in the primary quadrants 5-8 (got \"%s\")", code);
  if (notation == CW_NOTATION_UNIVERSAL && !is_universal_code (code))
    return cw_json_fail (error, CW_ERROR_INVALID, file, "tooth.code",
                         "must be a universal tooth number, 1 to 32 or a letter A to T (got \"%s\")", code);
  kase->notation = notation;
  kase->tooth_code = g_strdup (code);
  kase->tooth_extra_json = cw_json_collect_unknown (tooth, keys);
  return TRUE;
}

static gboolean
read_targets (const char  *file,
              JsonObject  *object,
              CwCase      *kase,
              GError     **error)
{
  static const char * const keys[] = { "apical_size", "apical_taper", NULL };
  static const CwNumberField fields[] = {
    { "apical_size", G_STRUCT_OFFSET (CwCase, target_apical_size), CW_SIZE_RANGE, FALSE },
    { "apical_taper", G_STRUCT_OFFSET (CwCase, target_apical_taper), CW_TAPER_RANGE, FALSE },
  };
  JsonNode *node = json_object_get_member (object, "targets");
  JsonObject *targets = NULL;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_object (file, "targets", node, &targets, error)
      || !cw_json_read_fields (file, targets, "targets", fields, G_N_ELEMENTS (fields), kase, error))
    return FALSE;
  kase->targets_extra_json = cw_json_collect_unknown (targets, keys);
  return TRUE;
}

static gboolean
read_case_rules (const char  *file,
                 JsonObject  *object,
                 CwCase      *kase,
                 GError     **error)
{
  JsonNode *node = json_object_get_member (object, "rules");
  JsonObject *rules = NULL;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_object (file, "rules", node, &rules, error)
      || !cw_rules_apply_json (&kase->rules, rules, file, "rules", error))
    return FALSE;
  kase->rules_json = cw_json_write (node, FALSE);
  return TRUE;
}

static gboolean
read_texts (const char  *file,
            JsonObject  *object,
            CwCase      *kase,
            GError     **error)
{
  const char *title = "";
  const char *notes = NULL;

  if (!cw_json_read_string (file, object, NULL, "title", FALSE, FALSE, &title, error)
      || !cw_json_read_string (file, object, NULL, "notes", FALSE, FALSE, &notes, error))
    return FALSE;
  g_free (kase->title);
  kase->title = g_strdup (title);
  kase->notes = g_strdup (notes);
  return TRUE;
}

/* Canals: curves, anatomy and sequence. */

static double
arc_end (double onset,
         double angle,
         double radius)
{
  return onset + radius * angle * G_PI / 180.0;
}

static gboolean
check_onset (const char     *file,
             const char     *path,
             const CwCanal  *canal,
             double          onset,
             GError        **error)
{
  const CwCurve *first = &canal->curves[0];
  g_autofree char *onset_path = cw_json_member_path (path, "onset");
  g_autofree char *wl = cw_json_format_number (canal->working_length);
  g_autofree char *got = cw_json_format_number (onset);
  g_autofree char *start = NULL;

  if (canal->n_curves == 0)
    {
      if (onset > canal->orifice_depth && onset < canal->working_length)
        return TRUE;
      start = cw_json_format_number (canal->orifice_depth);
      return cw_json_fail (error, CW_ERROR_INVALID, file, onset_path,
                           "must be a number > %s mm (the orifice depth) and < %s mm (the working length) (got %s)",
                           start, wl, got);
    }
  start = format_mm (arc_end (first->onset, first->angle, first->radius));
  if (onset >= arc_end (first->onset, first->angle, first->radius) - LENGTH_EPSILON
      && onset < canal->working_length)
    return TRUE;
  return cw_json_fail (error, CW_ERROR_INVALID, file, onset_path,
                       "must be a number >= %s mm (where the first curve ends) and < %s mm "
                       "(the working length) (got %s)", start, wl, got);
}

static gboolean
read_arc (const char  *file,
          const char  *path,
          JsonObject  *object,
          CwCanal     *canal,
          double       onset,
          GError     **error)
{
  static const CwRange angle_range = { 0, 180, TRUE, FALSE, " degrees" };
  static const CwRange radius_range = CW_LENGTH_RANGE;
  g_autofree char *radius_path = cw_json_member_path (path, "radius");
  double angle = 0, radius = 0, end;

  if (!cw_json_read_number (file, object, path, "angle", &angle_range, TRUE, &angle, error)
      || !cw_json_read_number (file, object, path, "radius", &radius_range, TRUE, &radius, error))
    return FALSE;
  end = arc_end (onset, angle, radius);
  if (end > canal->working_length + LENGTH_EPSILON)
    {
      g_autofree char *ends = format_mm (end);
      g_autofree char *wl = cw_json_format_number (canal->working_length);
      g_autofree char *most = format_mm (floor ((canal->working_length - onset) * 180.0 / (G_PI * angle) * 100) / 100);
      g_autofree char *got = cw_json_format_number (radius);

      return cw_json_fail (error, CW_ERROR_INVALID, file, radius_path,
                           "the curve ends at %s mm, past the working length %s mm "
                           "(allowed for this onset and angle: <= %s mm; got %s)", ends, wl, most, got);
    }
  cw_canal_add_curve (canal, onset, angle, radius);
  return TRUE;
}

static gboolean
read_schneider (const char  *file,
                const char  *path,
                JsonObject  *object,
                CwCanal     *canal,
                double       onset,
                gboolean     last,
                GError     **error)
{
  static const CwRange schneider_range = { 0, 90, TRUE, TRUE, " degrees" };
  g_autofree char *schneider_path = cw_json_member_path (path, "schneider_angle");
  double angle = 0;

  if (!last)
    return cw_json_fail (error, CW_ERROR_INVALID, file, schneider_path,
                         "only the last curve may be given by its Schneider angle, "
                         "since such a curve runs to the working length");
  if (!cw_json_read_number (file, object, path, "schneider_angle", &schneider_range, TRUE, &angle, error))
    return FALSE;
  cw_canal_add_schneider (canal, onset, angle);
  return TRUE;
}

static gboolean
read_curve (const char  *file,
            const char  *path,
            JsonObject  *object,
            CwCanal     *canal,
            gboolean     last,
            GError     **error)
{
  static const char * const keys[] = { "onset", "angle", "radius", "schneider_angle", NULL };
  static const CwRange onset_range = CW_LENGTH_RANGE;
  gboolean by_schneider = json_object_has_member (object, "schneider_angle");
  gboolean by_arc = json_object_has_member (object, "angle") || json_object_has_member (object, "radius");
  g_autofree char *schneider_path = cw_json_member_path (path, "schneider_angle");
  double onset = 0;

  if (by_schneider && by_arc)
    return cw_json_fail (error, CW_ERROR_INVALID, file, schneider_path,
                         "give either angle and radius or schneider_angle, not both");
  if (!cw_json_read_number (file, object, path, "onset", &onset_range, TRUE, &onset, error)
      || !check_onset (file, path, canal, onset, error))
    return FALSE;
  if (by_schneider ? !read_schneider (file, path, object, canal, onset, last, error)
                   : !read_arc (file, path, object, canal, onset, error))
    return FALSE;
  canal->curves[canal->n_curves - 1].extra_json = cw_json_collect_unknown (object, keys);
  return TRUE;
}

static gboolean
read_curves (const char  *file,
             JsonObject  *object,
             const char  *parent,
             CwCanal     *canal,
             GError     **error)
{
  JsonNode *node = json_object_get_member (object, "curves");
  g_autofree char *path = cw_json_member_path (parent, "curves");
  JsonArray *array = NULL;
  guint n;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_array (file, path, node, 0, CW_MAX_CURVES, "curves", &array, error))
    return FALSE;
  n = json_array_get_length (array);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *item = cw_json_index_path (path, i);
      JsonObject *curve = NULL;

      if (!cw_json_node_object (file, item, json_array_get_element (array, i), &curve, error)
          || !read_curve (file, item, curve, canal, i + 1 == n, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
read_diameter_points (const char  *file,
                      JsonObject  *object,
                      const char  *parent,
                      CwCanal     *canal,
                      GError     **error)
{
  static const CwRange s_range = CW_LENGTH_RANGE;
  static const CwRange d_range = CW_DIAMETER_RANGE;
  g_autofree char *path = cw_json_member_path (parent, "diameters");
  g_autoptr(GArray) points = NULL;
  JsonArray *array = NULL;
  guint n;

  if (!cw_json_node_array (file, path, json_object_get_member (object, "diameters"),
                           2, CW_MAX_DIAMETER_POINTS, "[s, diameter] points", &array, error))
    return FALSE;
  n = json_array_get_length (array);
  points = g_array_sized_new (FALSE, FALSE, sizeof (CwPoint), n);
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *item = cw_json_index_path (path, i);
      CwPoint p;

      if (!cw_json_node_pair (file, item, json_array_get_element (array, i), "[s, diameter]",
                              &s_range, &d_range, &p.s, &p.v, error))
        return FALSE;
      if (i > 0 && p.s <= g_array_index (points, CwPoint, i - 1).s)
        {
          g_autofree char *s_path = cw_json_index_path (item, 0);
          g_autofree char *before = cw_json_format_number (g_array_index (points, CwPoint, i - 1).s);
          g_autofree char *got = cw_json_format_number (p.s);

          return cw_json_fail (error, CW_ERROR_INVALID, file, s_path,
                               "must be greater than the s of the point before, %s mm, and <= 40 mm (got %s)",
                               before, got);
        }
      g_array_append_val (points, p);
    }
  canal->diameters = g_steal_pointer (&points);
  return TRUE;
}

static gboolean
read_anatomy (const char  *file,
              JsonObject  *object,
              const char  *parent,
              CwCanal     *canal,
              GError     **error)
{
  static const char * const keys[] = { "orifice_diameter", "apical_diameter", "diameters", NULL };
  static const CwRange d_range = CW_DIAMETER_RANGE;
  g_autofree char *path = cw_json_member_path (parent, "anatomy");
  g_autofree char *points_path = cw_json_member_path (path, "diameters");
  JsonObject *anatomy = NULL;
  gboolean by_points, by_ends;

  if (!cw_json_node_object (file, path, json_object_get_member (object, "anatomy"), &anatomy, error))
    return FALSE;
  by_points = json_object_has_member (anatomy, "diameters");
  by_ends = json_object_has_member (anatomy, "orifice_diameter")
            || json_object_has_member (anatomy, "apical_diameter");
  if (by_points && by_ends)
    return cw_json_fail (error, CW_ERROR_INVALID, file, points_path,
                         "give either orifice_diameter and apical_diameter or diameters, not both");
  if (by_points ? !read_diameter_points (file, anatomy, path, canal, error)
                : (!cw_json_read_number (file, anatomy, path, "orifice_diameter", &d_range, TRUE,
                                         &canal->orifice_diameter, error)
                   || !cw_json_read_number (file, anatomy, path, "apical_diameter", &d_range, TRUE,
                                            &canal->apical_diameter, error)))
    return FALSE;
  canal->anatomy_extra_json = cw_json_collect_unknown (anatomy, keys);
  return TRUE;
}

static gboolean
read_step (const char    *file,
           const char    *path,
           JsonObject    *object,
           const CwCase  *kase,
           CwCanal       *canal,
           GError       **error)
{
  static const char * const keys[] = { "instrument", "depth", "note", NULL };
  static const CwRange depth_range = CW_LENGTH_RANGE;
  g_autofree char *id_path = cw_json_member_path (path, "instrument");
  const char *id = NULL, *note = NULL;
  double depth = 0;
  CwStep *step;

  if (!cw_json_read_string (file, object, path, "instrument", TRUE, TRUE, &id, error))
    return FALSE;
  if (cw_case_find_instrument (kase, id) == NULL)
    return cw_json_fail (error, CW_ERROR_INVALID, file, id_path,
                         "must be the id of one of the case's instruments (got \"%s\")", id);
  /* A depth past the working length loads: the evaluation reports it. */
  if (!cw_json_read_number (file, object, path, "depth", &depth_range, TRUE, &depth, error)
      || !cw_json_read_string (file, object, path, "note", FALSE, FALSE, &note, error))
    return FALSE;
  cw_canal_add_step (canal, id, depth);
  step = &g_array_index (canal->sequence, CwStep, canal->sequence->len - 1);
  step->note = g_strdup (note);
  step->extra_json = cw_json_collect_unknown (object, keys);
  return TRUE;
}

static gboolean
read_sequence (const char    *file,
               JsonObject    *object,
               const char    *parent,
               const CwCase  *kase,
               CwCanal       *canal,
               GError       **error)
{
  JsonNode *node = json_object_get_member (object, "sequence");
  g_autofree char *path = cw_json_member_path (parent, "sequence");
  JsonArray *array = NULL;

  if (node == NULL)
    return TRUE;
  if (!cw_json_node_array (file, path, node, 0, CW_MAX_STEPS, "steps", &array, error))
    return FALSE;
  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_autofree char *item = cw_json_index_path (path, i);
      JsonObject *step = NULL;

      if (!cw_json_node_object (file, item, json_array_get_element (array, i), &step, error)
          || !read_step (file, item, step, kase, canal, error))
        return FALSE;
    }
  return TRUE;
}

static CwCanal *
read_canal (const char    *file,
            const char    *path,
            JsonObject    *object,
            const CwCase  *kase,
            GError       **error)
{
  static const char * const keys[] = {
    "name", "reference", "working_length", "orifice_depth", "curves", "anatomy", "sequence", NULL
  };
  static const CwRange length_range = CW_LENGTH_RANGE;
  g_autofree char *orifice_path = cw_json_member_path (path, "orifice_depth");
  g_autoptr(CwCanal) canal = NULL;
  const char *name = NULL, *reference = NULL;
  double wl = 0, orifice = 0;

  if (!cw_json_read_string (file, object, path, "name", TRUE, TRUE, &name, error)
      || !cw_json_read_string (file, object, path, "reference", FALSE, FALSE, &reference, error)
      || !cw_json_read_number (file, object, path, "working_length", &length_range, TRUE, &wl, error)
      || !cw_json_read_number (file, object, path, "orifice_depth", &length_range, TRUE, &orifice, error))
    return NULL;
  if (orifice >= wl)
    {
      g_autofree char *wl_text = cw_json_format_number (wl);
      g_autofree char *got = cw_json_format_number (orifice);

      cw_json_fail (error, CW_ERROR_INVALID, file, orifice_path,
                    "must be a number > 0 and < %s mm (the working length) (got %s)", wl_text, got);
      return NULL;
    }
  canal = cw_canal_new (name, wl, orifice);
  canal->reference = g_strdup (reference);
  if (!read_curves (file, object, path, canal, error)
      || !read_anatomy (file, object, path, canal, error)
      || !read_sequence (file, object, path, kase, canal, error))
    return NULL;
  canal->extra_json = cw_json_collect_unknown (object, keys);
  return g_steal_pointer (&canal);
}

static gboolean
read_canals (const char  *file,
             JsonObject  *object,
             CwCase      *kase,
             GError     **error)
{
  JsonArray *array = NULL;

  if (!cw_json_node_array (file, "canals", json_object_get_member (object, "canals"),
                           1, CW_MAX_CANALS, "canals", &array, error))
    return FALSE;
  for (guint i = 0; i < json_array_get_length (array); i++)
    {
      g_autofree char *path = cw_json_index_path ("canals", i);
      g_autofree char *name_path = cw_json_member_path (path, "name");
      g_autoptr(CwCanal) canal = NULL;
      JsonObject *item = NULL;

      if (!cw_json_node_object (file, path, json_array_get_element (array, i), &item, error))
        return FALSE;
      canal = read_canal (file, path, item, kase, error);
      if (canal == NULL)
        return FALSE;
      for (guint j = 0; j < kase->canals->len; j++)
        if (strcmp (((CwCanal *) g_ptr_array_index (kase->canals, j))->name, canal->name) == 0)
          return cw_json_fail (error, CW_ERROR_INVALID, file, name_path,
                               "must be unique, but canals[%u] has the name \"%s\" too", j, canal->name);
      cw_case_add_canal (kase, g_steal_pointer (&canal));
    }
  return TRUE;
}

static CwCase *
read_document (const char  *file,
               JsonNode    *root,
               GError     **error)
{
  static const char * const keys[] = {
    "format", "version", "title", "tooth", "notes", "targets", "rules", "instruments", "canals", NULL
  };
  g_autoptr(CwCase) kase = cw_case_new ();
  JsonObject *object = NULL;

  /* Format and version first: a newer file is refused as such, not for
   * whatever else it may have changed. */
  if (!cw_json_node_object (file, "document", root, &object, error)
      || !cw_json_check_format (file, object, "canalwright-case", error)
      || !cw_json_check_version (file, object, CW_CASE_VERSION, error)
      || !read_texts (file, object, kase, error)
      || !read_tooth (file, object, kase, error)
      || !read_targets (file, object, kase, error)
      || !read_case_rules (file, object, kase, error)
      || !cw_instrument_load_array (object, file, 1, CW_MAX_INSTRUMENTS, kase->instruments, error)
      || !read_canals (file, object, kase, error))
    return NULL;
  kase->extra_json = cw_json_collect_unknown (object, keys);
  return g_steal_pointer (&kase);
}

CwCase *
cw_case_load_from_data (const char  *data,
                        gssize       length,
                        const char  *display_name,
                        GError     **error)
{
  const char *file = display_name != NULL ? display_name : "(data)";
  g_autoptr(JsonParser) parser = NULL;

  g_return_val_if_fail (data != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  parser = cw_json_parse_text (file, data, length < 0 ? strlen (data) : (gsize) length, error);
  if (parser == NULL)
    return NULL;
  return read_document (file, json_parser_get_root (parser), error);
}

CwCase *
cw_case_load (const char  *path,
              GError     **error)
{
  g_autofree char *file = NULL;
  g_autofree char *data = NULL;
  gsize length = 0;

  g_return_val_if_fail (path != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  file = g_filename_display_basename (path);
  data = cw_json_read_file (file, path, &length, error);
  if (data == NULL)
    return NULL;
  return cw_case_load_from_data (data, (gssize) length, file, error);
}

gboolean
cw_rules_load (const char  *path,
               CwRules     *rules,
               GError     **error)
{
  g_autofree char *file = NULL;
  g_autofree char *data = NULL;
  g_autoptr(JsonParser) parser = NULL;
  JsonObject *object = NULL;
  gsize length = 0;
  CwRules result;

  g_return_val_if_fail (path != NULL, FALSE);
  g_return_val_if_fail (rules != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  file = g_filename_display_basename (path);
  data = cw_json_read_file (file, path, &length, error);
  if (data == NULL)
    return FALSE;
  parser = cw_json_parse_text (file, data, length, error);
  if (parser == NULL
      || !cw_json_node_object (file, "document", json_parser_get_root (parser), &object, error)
      || !cw_json_check_format (file, object, "canalwright-rules", error)
      || !cw_json_check_version (file, object, CW_CASE_VERSION, error))
    return FALSE;
  cw_rules_init_defaults (&result);
  if (!cw_rules_apply_json (&result, object, file, NULL, error))
    return FALSE;
  *rules = result;
  return TRUE;
}
