/* cw-frames-export.c
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-render"

#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>

#include "cw-error.h"
#include "cw-frames-export.h"
#include "cw-insertion.h"
#include "cw-png.h"

void
cw_frames_options_init (CwFramesOptions *options)
{
  g_return_if_fail (options != NULL);

  options->canal = NULL;
  options->frames_per_step = CW_FRAMES_DEFAULT_PER_STEP;
  options->dpi = CW_FRAMES_DEFAULT_DPI;
  options->overlays = CW_OVERLAY_TEACHING;
  options->theme = CW_RENDER_LIGHT;
}

char *
cw_frames_path (const char *dir,
                const char *canal,
                guint       step,
                guint       frame)
{
  g_autofree char *name = g_strdup (canal);
  g_autofree char *file = NULL;

  /* As the plan's exports name a canal's file. */
  g_strcanon (name, G_CSET_A_2_Z G_CSET_a_2_z G_CSET_DIGITS "-_+.", '_');
  if (name[0] == '.')
    name[0] = '_';
  file = g_strdup_printf ("%s-%02u-%03u.png", name, step, frame);
  return g_build_filename (dir, file, NULL);
}

gboolean
cw_frames_write_png (const CwTeachingFrame *frame,
                     CwRenderTheme          theme,
                     double                 dpi,
                     const char            *path,
                     GError               **error)
{
  double k = dpi / 72.0;
  int w = (int) ceil (CW_FRAME_WIDTH * k), h = (int) ceil (CW_FRAME_HEIGHT * k);
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, w, h);
  cairo_rectangle_t area = { 0, 0, w, h };
  g_autoptr(GByteArray) bytes = g_byte_array_new ();
  g_autoptr(GError) local = NULL;
  cairo_t *cr = cairo_create (surface);
  gboolean ok;

  cw_teaching_frame_draw (cr, &area, theme, frame);
  cairo_destroy (cr);
  ok = cw_png_write (surface, dpi, bytes, error);
  cairo_surface_destroy (surface);
  if (!ok)
    return FALSE;
  if (!g_file_set_contents_full (path, (const char *) bytes->data, bytes->len,
                                 G_FILE_SET_CONTENTS_CONSISTENT, 0644, &local))
    {
      g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not write: %s"), path, local->message);
      return FALSE;
    }
  return TRUE;
}

typedef struct
{
  const CwCase          *kase;
  const CwFramesOptions *options;
  const char            *dir;
  GPtrArray             *written;
  GError               **error;
} Job;

static gboolean
write_frame (const Job             *job,
             const CwTeachingFrame *frame,
             guint                  number)
{
  g_autofree char *path = cw_frames_path (job->dir, frame->result->canal->name, frame->step + 1, number);

  if (!cw_frames_write_png (frame, job->options->theme, job->options->dpi, path, job->error))
    return FALSE;
  if (job->written)
    g_ptr_array_add (job->written, g_steal_pointer (&path));
  return TRUE;
}

/* Frame k of n at k/n of the insertion's time: the last at the depth. */
static gboolean
write_step (const Job           *job,
            const CwCanalResult *result,
            guint                index,
            const CwEvalState   *before)
{
  const CwStepResult *step = cw_canal_result_get_step (result, index);
  guint n = job->options->frames_per_step;
  CwInsertion insertion;
  CwTeachingFrame frame;

  cw_insertion_init (&insertion, step, &job->kase->rules, result->canal->orifice_depth);
  cw_teaching_frame_init (&frame, result, (int) index);
  frame.options.overlays = job->options->overlays;
  frame.options.rules = &job->kase->rules;
  for (guint k = 1; k <= n; k++)
    {
      g_autoptr(CwStepResult) partial = NULL;
      double depth = cw_insertion_depth_at (&insertion, cw_insertion_duration (&insertion) * k / n,
                                            &frame.pecks);

      if (k < n)
        partial = cw_insertion_evaluate (before, step->instrument, depth);
      frame.options.partial = partial;
      if (!write_frame (job, &frame, k))
        return FALSE;
    }
  return TRUE;
}

static gboolean
write_canal (const Job     *job,
             const CwCanal *canal)
{
  g_autoptr(CwCanalResult) result = cw_evaluate_canal (job->kase, canal);
  g_autoptr(CwEvalState) state = cw_eval_state_new (job->kase, canal);

  for (guint i = 0; i < result->steps->len; i++)
    {
      const CwStepResult *step = cw_canal_result_get_step (result, i);

      if (!write_step (job, result, i, state))
        return FALSE;
      cw_step_result_free (cw_eval_state_apply (state, step->instrument, step->depth, FALSE));
    }
  return TRUE;
}

static gboolean
make_dir (const char  *dir,
          GError     **error)
{
  int saved;

  if (g_mkdir_with_parents (dir, 0755) == 0 && g_file_test (dir, G_FILE_TEST_IS_DIR))
    return TRUE;
  saved = errno;
  g_set_error (error, CW_ERROR, CW_ERROR_WRITE, _("%s: could not make the folder: %s"), dir,
               g_strerror (saved ? saved : ENOTDIR));
  return FALSE;
}

static gboolean
has_canal (const CwCase *kase,
           const char   *name)
{
  return name == NULL || cw_case_find_canal ((CwCase *) kase, name) != NULL;
}

gboolean
cw_frames_export (const CwCase          *kase,
                  const char            *dir,
                  const CwFramesOptions *options,
                  GPtrArray             *written,
                  GError               **error)
{
  Job job = { kase, options, dir, written, error };

  g_return_val_if_fail (kase != NULL && dir != NULL && options != NULL, FALSE);
  g_return_val_if_fail (options->frames_per_step > 0, FALSE);

  if (!has_canal (kase, options->canal))
    {
      g_set_error (error, CW_ERROR, CW_ERROR_INVALID, _("The case has no canal named “%s”"), options->canal);
      return FALSE;
    }
  if (!make_dir (dir, error))
    return FALSE;
  for (guint i = 0; i < kase->canals->len; i++)
    {
      const CwCanal *canal = g_ptr_array_index (kase->canals, i);

      if (options->canal && g_strcmp0 (options->canal, canal->name) != 0)
        continue;
      if (!write_canal (&job, canal))
        return FALSE;
    }
  return TRUE;
}
