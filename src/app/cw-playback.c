/* cw-playback.c
 *
 * A state machine with no clock of its own: the window feeds it elapsed
 * time, the tests feed it numbers.  While a file goes in, its figures at
 * the current tip depth come from the engine (cw_insertion_evaluate), not
 * from a formula here.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-playback"

#include "config.h"

#include <math.h>

#include "cw-insertion.h"
#include "cw-playback.h"

struct _CwPlayback
{
  GObject          parent_instance;

  CwDocument      *document;
  gboolean         playing;
  double           speed;

  int              step;       /* the document's selected step, or -1 */
  CwPlaybackPhase  phase;
  CwInsertion      insertion;
  double           t;          /* seconds into the insertion, at speed 1 */
  gboolean         holding;    /* a played step resting at its depth */
  double           held;       /* real seconds it has rested */
  gboolean         finished;   /* played through the last step */
  double           depth;
  guint            pecks;

  CwEvalState     *before;     /* the engine's state before the step */
  CwStepResult    *partial;    /* the step at depth, while inserting */
};

G_DEFINE_FINAL_TYPE (CwPlayback, cw_playback, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_DOCUMENT,
  PROP_PLAYING,
  PROP_SPEED,
  PROP_PHASE,
  PROP_DEPTH,
  N_PROPS
};

enum {
  CHANGED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static const CwStepResult *
planned_step (CwPlayback *self)
{
  const CwCanalResult *result = cw_document_get_result (self->document);

  if (result == NULL || self->step < 0 || (guint) self->step >= result->steps->len)
    return NULL;
  return cw_canal_result_get_step (result, (guint) self->step);
}

static guint
n_steps (CwPlayback *self)
{
  const CwCanalResult *result = cw_document_get_result (self->document);

  return result ? result->steps->len : 0;
}

static void
clear_partial (CwPlayback *self)
{
  g_clear_pointer (&self->partial, cw_step_result_free);
}

static void
clear_caches (CwPlayback *self)
{
  clear_partial (self);
  g_clear_pointer (&self->before, cw_eval_state_free);
}

static void
emit_changed (CwPlayback *self)
{
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_DEPTH]);
  g_signal_emit (self, signals[CHANGED], 0);
}

static void
set_phase (CwPlayback      *self,
           CwPlaybackPhase  phase)
{
  if (self->phase == phase)
    return;
  self->phase = phase;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_PHASE]);
}

static void
set_playing_flag (CwPlayback *self,
                  gboolean    playing)
{
  if (self->playing == playing)
    return;
  self->playing = playing;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_PLAYING]);
}

/* The depth and pecks at the insertion's time t. */
static void
update_depth (CwPlayback *self)
{
  const CwStepResult *step = planned_step (self);

  clear_partial (self);
  if (step == NULL)
    {
      self->depth = NAN;
      self->pecks = 0;
    }
  else if (self->phase == CW_PLAYBACK_AT_DEPTH)
    {
      self->depth = step->depth;
      self->pecks = step->pecks;
    }
  else
    self->depth = cw_insertion_depth_at (&self->insertion, self->t, &self->pecks);
}

static void
show_at_depth (CwPlayback *self)
{
  set_phase (self, CW_PLAYBACK_AT_DEPTH);
  self->holding = FALSE;
  self->held = 0;
  update_depth (self);
}

static void
begin_insertion (CwPlayback *self)
{
  const CwStepResult *step = planned_step (self);
  const CwCanal *canal = cw_document_get_canal (self->document);

  if (step == NULL)
    {
      show_at_depth (self);
      return;
    }
  cw_insertion_init (&self->insertion, step, &cw_document_get_case (self->document)->rules,
                     canal->orifice_depth);
  self->t = 0;
  self->holding = FALSE;
  self->held = 0;
  set_phase (self, CW_PLAYBACK_INSERTING);
  update_depth (self);
}

/* A step newly current: it goes in when playing, it is shown at its
 * depth when not. */
static void
enter_step (CwPlayback *self,
            int         step)
{
  if (step != self->step)
    g_clear_pointer (&self->before, cw_eval_state_free);
  self->step = step;
  self->finished = FALSE;
  if (self->playing && step >= 0)
    begin_insertion (self);
  else
    show_at_depth (self);
  emit_changed (self);
}

static void
go_to (CwPlayback *self,
       int         step)
{
  if (step == cw_document_get_step_index (self->document))
    enter_step (self, step);
  else
    cw_document_set_step_index (self->document, step);
}

static void
step_index_changed (CwPlayback *self)
{
  int index = cw_document_get_step_index (self->document);

  if (index != self->step)
    enter_step (self, index);
}

/* An edit may change every step: the insertion starts over from the
 * same time, which keeps a drag of the depth steady. */
static void
document_changed (CwPlayback *self)
{
  double t = self->t;

  clear_caches (self);
  self->step = cw_document_get_step_index (self->document);
  if (self->phase == CW_PLAYBACK_INSERTING && planned_step (self))
    {
      begin_insertion (self);
      self->t = MIN (t, cw_insertion_duration (&self->insertion));
      update_depth (self);
    }
  else
    show_at_depth (self);
  emit_changed (self);
}

static void
canal_changed (CwPlayback *self)
{
  set_playing_flag (self, FALSE);
  clear_caches (self);
  self->step = -2;
  step_index_changed (self);
}

CwPlayback *
cw_playback_new (CwDocument *document)
{
  g_return_val_if_fail (CW_IS_DOCUMENT (document), NULL);

  return g_object_new (CW_TYPE_PLAYBACK, "document", document, NULL);
}

CwDocument *
cw_playback_get_document (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), NULL);
  return self->document;
}

/* Rests at the depth, then moves on; after the last step it stops. */
static double
hold_for (CwPlayback *self,
          double      seconds)
{
  double need = CW_PLAYBACK_HOLD - self->held;

  if (seconds < need)
    {
      self->held += seconds;
      return 0;
    }
  if (self->step + 1 < (int) n_steps (self))
    go_to (self, self->step + 1);
  else
    {
      self->holding = FALSE;
      self->finished = TRUE;
      set_playing_flag (self, FALSE);
    }
  return seconds - need;
}

static double
insert_for (CwPlayback *self,
            double      seconds)
{
  double left = (cw_insertion_duration (&self->insertion) - self->t) / self->speed;

  if (seconds < left)
    {
      self->t += seconds * self->speed;
      update_depth (self);
      return 0;
    }
  self->t = cw_insertion_duration (&self->insertion);
  show_at_depth (self);
  self->holding = TRUE;
  return seconds - left;
}

void
cw_playback_tick (CwPlayback *self,
                  double      seconds)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  if (!self->playing || !(seconds > 0))
    return;
  /* A long gap (a busy machine, a test) may cross several phases. */
  while (seconds > 0 && self->playing)
    {
      if (planned_step (self) == NULL)
        set_playing_flag (self, FALSE);
      else if (self->phase == CW_PLAYBACK_INSERTING)
        seconds = insert_for (self, seconds);
      else if (self->holding)
        seconds = hold_for (self, seconds);
      else
        begin_insertion (self);
    }
  emit_changed (self);
}

gboolean
cw_playback_get_playing (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), FALSE);
  return self->playing;
}

/* Playing from a step shown at its depth plays that step's insertion;
 * after the end, or with no step, it starts again from the first. */
void
cw_playback_set_playing (CwPlayback *self,
                         gboolean    playing)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  if (playing == self->playing || (playing && n_steps (self) == 0))
    return;
  set_playing_flag (self, playing);
  if (!playing)
    {
      emit_changed (self);
      return;
    }
  if (self->step < 0 || self->finished)
    go_to (self, 0);
  else if (self->phase == CW_PLAYBACK_AT_DEPTH && !self->holding)
    {
      begin_insertion (self);
      emit_changed (self);
    }
}

void
cw_playback_toggle (CwPlayback *self)
{
  cw_playback_set_playing (self, !cw_playback_get_playing (self));
}

double
cw_playback_get_speed (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), 1.0);
  return self->speed;
}

void
cw_playback_set_speed (CwPlayback *self,
                       double      speed)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  speed = CLAMP (isfinite (speed) ? speed : 1.0, CW_PLAYBACK_MIN_SPEED, CW_PLAYBACK_MAX_SPEED);
  if (speed == self->speed)
    return;
  self->speed = speed;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SPEED]);
}

void
cw_playback_next (CwPlayback *self)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  if (self->step + 1 < (int) n_steps (self))
    go_to (self, self->step + 1);
}

void
cw_playback_previous (CwPlayback *self)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  if (self->step > 0)
    go_to (self, self->step - 1);
}

void
cw_playback_first (CwPlayback *self)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  if (n_steps (self) > 0)
    go_to (self, 0);
}

void
cw_playback_last (CwPlayback *self)
{
  g_return_if_fail (CW_IS_PLAYBACK (self));

  if (n_steps (self) > 0)
    go_to (self, (int) n_steps (self) - 1);
}

int
cw_playback_get_step_index (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), -1);
  return self->step;
}

CwPlaybackPhase
cw_playback_get_phase (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), CW_PLAYBACK_AT_DEPTH);
  return self->phase;
}

double
cw_playback_get_depth (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), NAN);
  return self->depth;
}

guint
cw_playback_get_pecks (CwPlayback *self)
{
  g_return_val_if_fail (CW_IS_PLAYBACK (self), 0);
  return self->pecks;
}

const CwStepResult *
cw_playback_get_partial (CwPlayback *self)
{
  const CwStepResult *step;

  g_return_val_if_fail (CW_IS_PLAYBACK (self), NULL);

  if (self->phase != CW_PLAYBACK_INSERTING || (step = planned_step (self)) == NULL)
    return NULL;
  if (self->partial == NULL)
    {
      if (self->before == NULL)
        self->before = cw_insertion_state_before (cw_document_get_case (self->document),
                                                  cw_document_get_canal (self->document),
                                                  (guint) self->step);
      self->partial = cw_insertion_evaluate (self->before, step->instrument, self->depth);
    }
  return self->partial;
}

const CwStepResult *
cw_playback_get_figures (CwPlayback *self)
{
  const CwStepResult *partial = cw_playback_get_partial (self);

  return partial ? partial : planned_step (self);
}

static void
set_document (CwPlayback *self,
              CwDocument *document)
{
  self->document = g_object_ref (document);
  g_signal_connect_object (document, "changed", G_CALLBACK (document_changed), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::step-index", G_CALLBACK (step_index_changed), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::canal-index", G_CALLBACK (canal_changed), self,
                           G_CONNECT_SWAPPED);
  self->step = cw_document_get_step_index (document);
  show_at_depth (self);
}

static void
cw_playback_set_property (GObject      *object,
                          guint         prop_id,
                          const GValue *value,
                          GParamSpec   *pspec)
{
  CwPlayback *self = CW_PLAYBACK (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      set_document (self, g_value_get_object (value));
      break;
    case PROP_PLAYING:
      cw_playback_set_playing (self, g_value_get_boolean (value));
      break;
    case PROP_SPEED:
      cw_playback_set_speed (self, g_value_get_double (value));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_playback_get_property (GObject    *object,
                          guint       prop_id,
                          GValue     *value,
                          GParamSpec *pspec)
{
  CwPlayback *self = CW_PLAYBACK (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      g_value_set_object (value, self->document);
      break;
    case PROP_PLAYING:
      g_value_set_boolean (value, self->playing);
      break;
    case PROP_SPEED:
      g_value_set_double (value, self->speed);
      break;
    case PROP_PHASE:
      g_value_set_int (value, self->phase);
      break;
    case PROP_DEPTH:
      g_value_set_double (value, self->depth);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_playback_dispose (GObject *object)
{
  CwPlayback *self = CW_PLAYBACK (object);

  clear_caches (self);
  g_clear_object (&self->document);
  G_OBJECT_CLASS (cw_playback_parent_class)->dispose (object);
}

static void
cw_playback_class_init (CwPlaybackClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->dispose = cw_playback_dispose;
  object_class->set_property = cw_playback_set_property;
  object_class->get_property = cw_playback_get_property;

  properties[PROP_DOCUMENT] =
    g_param_spec_object ("document", NULL, NULL, CW_TYPE_DOCUMENT,
                         G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  properties[PROP_PLAYING] =
    g_param_spec_boolean ("playing", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_SPEED] =
    g_param_spec_double ("speed", NULL, NULL, CW_PLAYBACK_MIN_SPEED, CW_PLAYBACK_MAX_SPEED, 1.0,
                         G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_PHASE] =
    g_param_spec_int ("phase", NULL, NULL, CW_PLAYBACK_AT_DEPTH, CW_PLAYBACK_INSERTING,
                      CW_PLAYBACK_AT_DEPTH, G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_DEPTH] =
    g_param_spec_double ("depth", NULL, NULL, -G_MAXDOUBLE, G_MAXDOUBLE, 0,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /* Anything shown changed: the step, the phase, the depth. */
  signals[CHANGED] =
    g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                  0, NULL, NULL, NULL, G_TYPE_NONE, 0);
}

static void
cw_playback_init (CwPlayback *self)
{
  self->speed = 1.0;
  self->step = -1;
  self->phase = CW_PLAYBACK_AT_DEPTH;
  self->depth = NAN;
}
