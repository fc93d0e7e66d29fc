/* test-playback.c: the playback's state machine, driven by hand-fed time
 *
 * No display: the model is a GObject over the document; time is given to
 * cw_playback_tick, so every run is the same.  The insertion's timing is
 * the project's own model (cw-insertion.h: free travel at four times the
 * advance rate, then pecks of the rule set's increment at the advance
 * rate); the advance rate and peck increment are the trade's rules of
 * thumb (common practice, no published source).
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#include <locale.h>
#include <math.h>

#include "cw-insertion.h"
#include "cw-playback.h"
#include "cw-test-util.h"

typedef struct
{
  CwDocument *document;
  CwPlayback *playback;
} Fixture;

static void
setup (Fixture       *f,
       gconstpointer  data)
{
  g_autofree char *path = cw_test_sample_path ("lower-molar-moderate.cwcase");
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autoptr(GError) error = NULL;

  f->document = cw_document_open (file, &error);
  g_assert_no_error (error);
  f->playback = cw_playback_new (f->document);
}

static void
teardown (Fixture       *f,
          gconstpointer  data)
{
  g_clear_object (&f->playback);
  g_clear_object (&f->document);
}

static const CwStepResult *
step (Fixture *f,
      guint    i)
{
  return cw_canal_result_get_step (cw_document_get_result (f->document), i);
}

static guint
n_steps (Fixture *f)
{
  return cw_document_get_result (f->document)->steps->len;
}

static double
duration (Fixture *f,
          guint    i)
{
  CwInsertion ins;

  cw_insertion_init (&ins, step (f, i), &cw_document_get_case (f->document)->rules,
                     cw_document_get_canal (f->document)->orifice_depth);
  return cw_insertion_duration (&ins);
}

static void
assert_at (Fixture         *f,
           int              index,
           CwPlaybackPhase  phase)
{
  g_assert_cmpint (cw_playback_get_step_index (f->playback), ==, index);
  g_assert_cmpint (cw_document_get_step_index (f->document), ==, index);
  g_assert_cmpint (cw_playback_get_phase (f->playback), ==, phase);
}

/* Left, Right, Home and End go through the document's selection, and a
 * selection made elsewhere (the strip) moves the playback too. */
static void
test_keys (Fixture       *f,
           gconstpointer  data)
{
  guint last = n_steps (f) - 1;

  g_assert_cmpuint (n_steps (f), ==, 10);
  assert_at (f, -1, CW_PLAYBACK_AT_DEPTH);
  cw_playback_previous (f->playback);
  assert_at (f, -1, CW_PLAYBACK_AT_DEPTH);
  cw_playback_next (f->playback);
  assert_at (f, 0, CW_PLAYBACK_AT_DEPTH);
  cw_playback_next (f->playback);
  cw_playback_next (f->playback);
  assert_at (f, 2, CW_PLAYBACK_AT_DEPTH);
  cw_playback_previous (f->playback);
  assert_at (f, 1, CW_PLAYBACK_AT_DEPTH);
  cw_playback_last (f->playback);
  assert_at (f, (int) last, CW_PLAYBACK_AT_DEPTH);
  cw_playback_next (f->playback);
  assert_at (f, (int) last, CW_PLAYBACK_AT_DEPTH);
  cw_playback_first (f->playback);
  assert_at (f, 0, CW_PLAYBACK_AT_DEPTH);
  cw_playback_previous (f->playback);
  assert_at (f, 0, CW_PLAYBACK_AT_DEPTH);
  cw_document_set_step_index (f->document, 4);
  assert_at (f, 4, CW_PLAYBACK_AT_DEPTH);
  cw_assert_near (cw_playback_get_depth (f->playback), step (f, 4)->depth, 0);
  g_assert_null (cw_playback_get_partial (f->playback));
  g_assert_true (cw_playback_get_figures (f->playback) == step (f, 4));
  /* Paused, ticks change nothing. */
  cw_playback_tick (f->playback, 100);
  assert_at (f, 4, CW_PLAYBACK_AT_DEPTH);
}

/* Played from no selection, every step goes in, in order, and the
 * playback stops at the last step at its depth; playing again starts
 * over from the first. */
static void
test_play_to_the_end (Fixture       *f,
                      gconstpointer  data)
{
  guint n = n_steps (f);
  int seen = -1, ticks = 0;

  cw_playback_set_playing (f->playback, TRUE);
  g_assert_true (cw_playback_get_playing (f->playback));
  assert_at (f, 0, CW_PLAYBACK_INSERTING);
  cw_assert_near (cw_playback_get_depth (f->playback), cw_document_get_canal (f->document)->orifice_depth, 1e-12);
  while (cw_playback_get_playing (f->playback) && ticks++ < 100000)
    {
      int now = cw_playback_get_step_index (f->playback);

      g_assert_true (now == seen || now == seen + 1);
      seen = now;
      g_assert_cmpfloat (cw_playback_get_depth (f->playback), <=, step (f, (guint) now)->depth + 1e-9);
      cw_playback_tick (f->playback, 1 / 30.0);
    }
  g_assert_false (cw_playback_get_playing (f->playback));
  assert_at (f, (int) n - 1, CW_PLAYBACK_AT_DEPTH);
  cw_assert_near (cw_playback_get_depth (f->playback), step (f, n - 1)->depth, 0);
  cw_playback_toggle (f->playback);
  g_assert_true (cw_playback_get_playing (f->playback));
  assert_at (f, 0, CW_PLAYBACK_INSERTING);
}

/* A whole canal in one long tick crosses every phase, as many short
 * ones do: duration of each insertion plus the hold between steps. */
static void
test_one_long_tick (Fixture       *f,
                    gconstpointer  data)
{
  double total = 0;

  for (guint i = 0; i < n_steps (f); i++)
    total += duration (f, i) + CW_PLAYBACK_HOLD;
  cw_playback_set_playing (f->playback, TRUE);
  cw_playback_tick (f->playback, total - 0.01);
  g_assert_true (cw_playback_get_playing (f->playback));
  assert_at (f, (int) n_steps (f) - 1, CW_PLAYBACK_AT_DEPTH);
  cw_playback_tick (f->playback, 0.02);
  g_assert_false (cw_playback_get_playing (f->playback));
}

/* Step 6 (40/.04 to 18 mm, first contact at 12.25 mm): 5.25 mm from the
 * orifice at 2 mm/s, 5.75 mm of cutting at 0.5 mm/s in six pecks with five
 * lifts of 0.5 mm and back at 2 mm/s: 2.625 + 11.5 + 2.5 = 16.625 s. */
static void
test_speed (Fixture       *f,
            gconstpointer  data)
{
  double d;

  cw_document_set_step_index (f->document, 5);
  d = duration (f, 5);
  cw_assert_near (d, 2.625 + 11.5 + 2.5, 1e-9);
  cw_playback_set_playing (f->playback, TRUE);
  assert_at (f, 5, CW_PLAYBACK_INSERTING);
  cw_playback_tick (f->playback, d - 0.01);
  assert_at (f, 5, CW_PLAYBACK_INSERTING);
  cw_playback_tick (f->playback, 0.02);
  assert_at (f, 5, CW_PLAYBACK_AT_DEPTH);

  cw_playback_set_playing (f->playback, FALSE);
  cw_playback_set_speed (f->playback, 4);
  cw_assert_near (cw_playback_get_speed (f->playback), 4, 0);
  cw_document_set_step_index (f->document, 4);
  cw_document_set_step_index (f->document, 5);
  cw_playback_set_playing (f->playback, TRUE);
  cw_playback_tick (f->playback, d / 4 - 0.01);
  assert_at (f, 5, CW_PLAYBACK_INSERTING);
  cw_playback_tick (f->playback, 0.02);
  assert_at (f, 5, CW_PLAYBACK_AT_DEPTH);

  cw_playback_set_speed (f->playback, 1000);
  cw_assert_near (cw_playback_get_speed (f->playback), CW_PLAYBACK_MAX_SPEED, 0);
  cw_playback_set_speed (f->playback, 0.001);
  cw_assert_near (cw_playback_get_speed (f->playback), CW_PLAYBACK_MIN_SPEED, 0);
}

/* The hold at depth, then the next step. */
static void
test_hold (Fixture       *f,
           gconstpointer  data)
{
  cw_document_set_step_index (f->document, 2);
  cw_playback_set_playing (f->playback, TRUE);
  cw_playback_tick (f->playback, duration (f, 2) + CW_PLAYBACK_HOLD - 0.01);
  assert_at (f, 2, CW_PLAYBACK_AT_DEPTH);
  cw_playback_tick (f->playback, 0.02);
  assert_at (f, 3, CW_PLAYBACK_INSERTING);
}

/* Pausing keeps the file where it is; playing again goes on from there. */
static void
test_pause_resumes (Fixture       *f,
                    gconstpointer  data)
{
  double depth;

  cw_document_set_step_index (f->document, 5);
  cw_playback_set_playing (f->playback, TRUE);
  cw_playback_tick (f->playback, 5);
  depth = cw_playback_get_depth (f->playback);
  cw_playback_toggle (f->playback);
  g_assert_false (cw_playback_get_playing (f->playback));
  cw_playback_tick (f->playback, 30);
  cw_assert_near (cw_playback_get_depth (f->playback), depth, 0);
  assert_at (f, 5, CW_PLAYBACK_INSERTING);
  cw_playback_toggle (f->playback);
  cw_assert_near (cw_playback_get_depth (f->playback), depth, 0);
  cw_playback_tick (f->playback, 0.5);
  g_assert_cmpfloat (cw_playback_get_depth (f->playback), !=, depth);
}

/* A step selected while playing goes in from the start. */
static void
test_select_while_playing (Fixture       *f,
                           gconstpointer  data)
{
  cw_document_set_step_index (f->document, 5);
  cw_playback_set_playing (f->playback, TRUE);
  cw_playback_tick (f->playback, 6);
  cw_playback_previous (f->playback);
  assert_at (f, 4, CW_PLAYBACK_INSERTING);
  cw_assert_near (cw_playback_get_depth (f->playback), cw_document_get_canal (f->document)->orifice_depth, 1e-12);
  g_assert_true (cw_playback_get_playing (f->playback));
}

/* The pecks: one more at each increment, the engine's count at the end,
 * and a lift (the tip going up) between each two. */
static void
test_pecks (Fixture       *f,
            gconstpointer  data)
{
  const CwStepResult *r = step (f, 5);
  guint lifts = 0, last_pecks = 0;
  gboolean going_in = TRUE;
  double last = -1;

  cw_document_set_step_index (f->document, 5);
  cw_playback_set_playing (f->playback, TRUE);
  while (cw_playback_get_phase (f->playback) == CW_PLAYBACK_INSERTING)
    {
      double depth = cw_playback_get_depth (f->playback);
      guint pecks = cw_playback_get_pecks (f->playback);

      g_assert_cmpuint (pecks, >=, last_pecks);
      g_assert_cmpuint (pecks, <=, last_pecks + 1);
      if (depth < last - 1e-12 && going_in)
        {
          /* A lift comes only after a finished peck. */
          g_assert_cmpuint (pecks, ==, lifts + 1);
          lifts++;
          going_in = FALSE;
        }
      else if (depth > last + 1e-12)
        going_in = TRUE;
      last = depth;
      last_pecks = pecks;
      cw_playback_tick (f->playback, 0.05);
    }
  g_assert_cmpuint (r->pecks, ==, 6);
  g_assert_cmpuint (cw_playback_get_pecks (f->playback), ==, r->pecks);
  g_assert_cmpuint (lifts, ==, r->pecks - 1);
}

/* While the file goes in, its figures are the engine's at that tip depth:
 * the same as evaluating the steps before and this one to that depth. */
static void
test_figures_from_the_engine (Fixture       *f,
                              gconstpointer  data)
{
  const CwCase *kase = cw_document_get_case (f->document);
  const CwCanal *canal = cw_document_get_canal (f->document);
  const CwStepResult *partial;
  g_autoptr(CwEvalState) state = cw_eval_state_new (kase, canal);
  g_autoptr(CwStepResult) expected = NULL;

  cw_document_set_step_index (f->document, 5);
  cw_playback_set_playing (f->playback, TRUE);
  cw_playback_tick (f->playback, 9);
  partial = cw_playback_get_partial (f->playback);
  g_assert_nonnull (partial);
  g_assert_true (cw_playback_get_figures (f->playback) == partial);
  cw_assert_near (partial->depth, cw_playback_get_depth (f->playback), 0);
  g_assert_cmpfloat (partial->depth, <, step (f, 5)->depth);
  for (guint i = 0; i < 5; i++)
    cw_step_result_free (cw_eval_state_apply (state, step (f, i)->instrument, step (f, i)->depth, FALSE));
  expected = cw_eval_state_apply (state, step (f, 5)->instrument, partial->depth, TRUE);
  cw_assert_near (partial->engaged_length, expected->engaged_length, 1e-12);
  cw_assert_near (partial->engaged_in_curve, expected->engaged_in_curve, 1e-12);
  cw_assert_near (partial->strain, expected->strain, 1e-12);
  g_assert_cmpfloat (partial->engaged_length, >, 0);
  g_assert_cmpfloat (partial->engaged_length, <, step (f, 5)->engaged_length);
}

/* Another canal: the playback stops and has no step. */
static void
test_canal_change (Fixture       *f,
                   gconstpointer  data)
{
  cw_document_set_step_index (f->document, 3);
  cw_playback_set_playing (f->playback, TRUE);
  cw_document_set_canal_index (f->document, 1);
  g_assert_false (cw_playback_get_playing (f->playback));
  assert_at (f, -1, CW_PLAYBACK_AT_DEPTH);
  cw_playback_next (f->playback);
  assert_at (f, 0, CW_PLAYBACK_AT_DEPTH);
}

int
main (int   argc,
      char *argv[])
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);

#define ADD(path, fn) g_test_add (path, Fixture, NULL, setup, fn, teardown)
  ADD ("/playback/keys", test_keys);
  ADD ("/playback/play-to-the-end", test_play_to_the_end);
  ADD ("/playback/one-long-tick", test_one_long_tick);
  ADD ("/playback/speed", test_speed);
  ADD ("/playback/hold", test_hold);
  ADD ("/playback/pause-resumes", test_pause_resumes);
  ADD ("/playback/select-while-playing", test_select_while_playing);
  ADD ("/playback/pecks", test_pecks);
  ADD ("/playback/figures-from-the-engine", test_figures_from_the_engine);
  ADD ("/playback/canal-change", test_canal_change);
#undef ADD

  return g_test_run ();
}
