/* cw-json-check.h: typed readers of JSON members, with the loaders' messages
 *
 * Shared by the case, rule-set and library loaders so that every file the
 * program reads says what is wrong in the same words: "FILE: PATH: what".
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#pragma once

#include <json-glib/json-glib.h>

#include "cw-case.h"
#include "cw-error.h"

G_BEGIN_DECLS

typedef struct
{
  double       min;
  double       max;
  gboolean     min_open;
  gboolean     max_open;
  const char  *unit;
} CwRange;

#define CW_LENGTH_RANGE    { 0, CW_MAX_LENGTH, TRUE, FALSE, " mm" }
#define CW_DIAMETER_RANGE  { 0, 3, TRUE, FALSE, " mm" }
#define CW_SIZE_RANGE      { 6, 140, FALSE, FALSE, "" }
#define CW_TAPER_RANGE     { 0, 0.12, TRUE, FALSE, "" }

/* An optional double member of a struct, found by its offset. */
typedef struct
{
  const char  *key;
  gsize        offset;
  CwRange      range;
  gboolean     nullable;  /* null stands for "not given": NAN */
} CwNumberField;

gboolean     cw_json_fail             (GError              **error,
                                       CwError               code,
                                       const char           *file,
                                       const char           *path,
                                       const char           *format,
                                       ...) G_GNUC_PRINTF (5, 6);
char        *cw_json_member_path      (const char           *parent,
                                       const char           *key);
char        *cw_json_index_path       (const char           *parent,
                                       guint                 index);
char        *cw_json_format_number    (double                value);
const char  *cw_json_describe_node    (JsonNode             *node);
gboolean     cw_json_holds_number     (JsonNode             *node);

/* Typed readers of one node.  A NULL node is a missing required member. */
gboolean     cw_json_node_number      (const char           *file,
                                       const char           *path,
                                       JsonNode             *node,
                                       const CwRange        *range,
                                       double               *value,
                                       GError              **error);
gboolean     cw_json_node_integer     (const char           *file,
                                       const char           *path,
                                       JsonNode             *node,
                                       gint64                min,
                                       gint64                max,
                                       gint64               *value,
                                       GError              **error);
gboolean     cw_json_node_string      (const char           *file,
                                       const char           *path,
                                       JsonNode             *node,
                                       gboolean              non_empty,
                                       const char          **value,
                                       GError              **error);
gboolean     cw_json_node_object      (const char           *file,
                                       const char           *path,
                                       JsonNode             *node,
                                       JsonObject          **object,
                                       GError              **error);
gboolean     cw_json_node_array       (const char           *file,
                                       const char           *path,
                                       JsonNode             *node,
                                       guint                 min,
                                       guint                 max,
                                       const char           *what,
                                       JsonArray           **array,
                                       GError              **error);
gboolean     cw_json_node_pair        (const char           *file,
                                       const char           *path,
                                       JsonNode             *node,
                                       const char           *form,
                                       const CwRange        *first_range,
                                       const CwRange        *second_range,
                                       double               *first,
                                       double               *second,
                                       GError              **error);

/* Readers of one member of an object; an optional member that is absent
 * leaves the value as it was. */
gboolean     cw_json_read_number      (const char           *file,
                                       JsonObject           *object,
                                       const char           *parent,
                                       const char           *key,
                                       const CwRange        *range,
                                       gboolean              required,
                                       double               *value,
                                       GError              **error);
gboolean     cw_json_read_string      (const char           *file,
                                       JsonObject           *object,
                                       const char           *parent,
                                       const char           *key,
                                       gboolean              required,
                                       gboolean              non_empty,
                                       const char          **value,
                                       GError              **error);
gboolean     cw_json_read_fields      (const char           *file,
                                       JsonObject           *object,
                                       const char           *parent,
                                       const CwNumberField  *fields,
                                       guint                 n_fields,
                                       gpointer              base,
                                       GError              **error);
char        *cw_json_collect_unknown  (JsonObject           *object,
                                       const char * const   *known);
void         cw_json_add_unknown      (JsonObject           *object,
                                       const char           *unknown_json);

char        *cw_json_alloy_choices    (void);
char        *cw_json_motion_choices   (void);

G_END_DECLS
