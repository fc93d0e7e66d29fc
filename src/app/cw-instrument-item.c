/* cw-instrument-item.c
 *
 * The columns of the library list read these properties, and its sorters
 * and its search compare them, so each is the value as the column shows it
 * or as it sorts (the taper by number, not by its text).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-instrument-item"

#include "config.h"

#include "cw-instrument-item.h"
#include "cw-render-text.h"
#include "cw-shelf.h"

struct _CwInstrumentItem
{
  GObject        parent_instance;

  CwInstrument  *instrument;
  guint          position;   /* in the library */
};

G_DEFINE_FINAL_TYPE (CwInstrumentItem, cw_instrument_item, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_ID,
  PROP_LABEL,
  PROP_TIP,
  PROP_TAPER,
  PROP_DESIGNATION,
  PROP_ALLOY,
  PROP_MOTION,
  PROP_LENGTH,
  PROP_SEARCH_TEXT,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

CwInstrumentItem *
cw_instrument_item_new (const CwInstrument *instrument,
                        guint               position)
{
  CwInstrumentItem *self;

  g_return_val_if_fail (instrument != NULL, NULL);

  self = g_object_new (CW_TYPE_INSTRUMENT_ITEM, NULL);
  self->instrument = cw_instrument_copy (instrument);
  self->position = position;
  return self;
}

const CwInstrument *
cw_instrument_item_get_instrument (CwInstrumentItem *self)
{
  g_return_val_if_fail (CW_IS_INSTRUMENT_ITEM (self), NULL);
  return self->instrument;
}

guint
cw_instrument_item_get_position (CwInstrumentItem *self)
{
  g_return_val_if_fail (CW_IS_INSTRUMENT_ITEM (self), 0);
  return self->position;
}

/* Everything a user might type to find a file: its words, its id and its
 * designation ("25/.04"). */
static char *
search_text (const CwInstrument *instrument)
{
  g_autofree char *name = cw_render_file_name (instrument);

  return g_strjoin (" ", instrument->label ? instrument->label : "", instrument->id, name,
                    cw_alloy_label (instrument->alloy), cw_motion_label (instrument->motion), NULL);
}

static void
cw_instrument_item_get_property (GObject    *object,
                                 guint       prop_id,
                                 GValue     *value,
                                 GParamSpec *pspec)
{
  CwInstrumentItem *self = CW_INSTRUMENT_ITEM (object);
  const CwInstrument *inst = self->instrument;

  switch (prop_id)
    {
    case PROP_ID:
      g_value_set_string (value, inst->id);
      break;
    case PROP_LABEL:
      g_value_set_string (value, inst->label ? inst->label : inst->id);
      break;
    case PROP_TIP:
      g_value_set_double (value, inst->tip);
      break;
    case PROP_TAPER:
      g_value_set_double (value, cw_instrument_nominal_taper (inst));
      break;
    case PROP_DESIGNATION:
      g_value_take_string (value, cw_render_file_name (inst));
      break;
    case PROP_ALLOY:
      g_value_set_string (value, cw_alloy_label (inst->alloy));
      break;
    case PROP_MOTION:
      g_value_set_string (value, cw_motion_label (inst->motion));
      break;
    case PROP_LENGTH:
      g_value_set_double (value, inst->length);
      break;
    case PROP_SEARCH_TEXT:
      g_value_take_string (value, search_text (inst));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_instrument_item_finalize (GObject *object)
{
  CwInstrumentItem *self = CW_INSTRUMENT_ITEM (object);

  cw_instrument_free (self->instrument);
  G_OBJECT_CLASS (cw_instrument_item_parent_class)->finalize (object);
}

static GParamSpec *
string_property (const char *name)
{
  return g_param_spec_string (name, NULL, NULL, NULL, G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
}

static GParamSpec *
number_property (const char *name)
{
  return g_param_spec_double (name, NULL, NULL, -G_MAXDOUBLE, G_MAXDOUBLE, 0,
                              G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
}

static void
cw_instrument_item_class_init (CwInstrumentItemClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = cw_instrument_item_finalize;
  object_class->get_property = cw_instrument_item_get_property;

  properties[PROP_ID] = string_property ("id");
  properties[PROP_LABEL] = string_property ("label");
  properties[PROP_TIP] = number_property ("tip");
  properties[PROP_TAPER] = number_property ("taper");
  properties[PROP_DESIGNATION] = string_property ("designation");
  properties[PROP_ALLOY] = string_property ("alloy");
  properties[PROP_MOTION] = string_property ("motion");
  properties[PROP_LENGTH] = number_property ("length");
  properties[PROP_SEARCH_TEXT] = string_property ("search-text");
  g_object_class_install_properties (object_class, N_PROPS, properties);
}

static void
cw_instrument_item_init (CwInstrumentItem *self)
{
}
