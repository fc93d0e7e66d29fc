/* cw-planner-reason.c: why no plan reaches the targets, and the closest one
 *
 * The checks that need no search are proofs: a missing size, a size that no
 * file can take to length whatever came before (ceiling, strain and length
 * depend on the file and the canal only), or an apical taper above what any
 * envelope of the set can give.  Otherwise the reason names the rule that
 * stops every file of the size short of length after the closest plan.
 * Numbers are written in the C locale, like the JSON report's messages.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-planner"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "cw-planner-private.h"

typedef struct
{
  char bufs[6][G_ASCII_DTOSTR_BUF_SIZE];
  guint next;
} Numbers;

static const char *
num (Numbers *n,
     double   value,
     int      decimals)
{
  char *buf = n->bufs[n->next++ % G_N_ELEMENTS (n->bufs)];

  static const char *formats[] = { "%.0f", "%.1f", "%.2f", "%.3f" };

  return g_ascii_formatd (buf, G_ASCII_DTOSTR_BUF_SIZE, formats[CLAMP (decimals, 0, 3)], value);
}

static gboolean
is_apical_file (const Planner *p,
                guint          file)
{
  return p->files[file].instrument->tip >= p->target_size - PLAN_EPS;
}

static double
at_length (const Planner *p)
{
  return p->canal->working_length - p->rules->at_length_tolerance - PLAN_EPS;
}

/* The stop of the file at the deepest depth that would count as at length,
 * after the state given; NULL when some such depth has no stop. */
static CwFinding *
stop_at_length (Planner           *p,
                const CwEvalState *state,
                guint              file)
{
  const PlanFile *f = &p->files[file];
  CwFinding *first = NULL;

  for (int k = f->top; k >= f->bottom && k * CW_PLAN_GRID >= at_length (p); k--)
    {
      g_autoptr(CwEvalState) copy = cw_eval_state_copy (state);
      g_autoptr(CwStepResult) r = NULL;

      r = cw_eval_state_apply (copy, f->instrument, k * CW_PLAN_GRID, FALSE);
      p->stats.evaluated++;
      if (r->verdict != CW_LEVEL_STOP)
        {
          cw_finding_free (first);
          return NULL;
        }
      for (guint i = 0; first == NULL && i < r->findings->len; i++)
        if (((CwFinding *) g_ptr_array_index (r->findings, i))->level == CW_LEVEL_STOP)
          first = g_ptr_array_steal_index (r->findings, i);
    }
  if (first == NULL)
    {
      first = cw_finding_new (CW_RULE_INSTRUMENT_LENGTH, CW_LEVEL_STOP, p->canal->working_length,
                              f->instrument->length);
    }
  return first;
}

static char *
missing_size (const Planner *p)
{
  Numbers n = { 0 };

  for (guint i = 0; i < p->n_files; i++)
    if (is_apical_file (p, i))
      return NULL;
  return g_strdup_printf (_("No file in the set has a tip of size %s or more; the target size needs one at the working length."),
                          num (&n, p->target_size, 0));
}

/* Which files of the size, and by which rule, never reach length. */
static char *
size_never_at_length (Planner *p)
{
  g_autoptr(GString) which = g_string_new (NULL);
  Numbers n = { 0 };

  if (p->apical_cautions != G_MAXUINT)
    return NULL;
  for (guint i = 0; i < p->n_files; i++)
    {
      g_autoptr(CwFinding) stop = NULL;

      if (!is_apical_file (p, i))
        continue;
      stop = stop_at_length (p, p->root_state, i);
      g_string_append_printf (which, "%s%s (%s)", which->len ? ", " : "",
                              p->files[i].instrument->id,
                              cw_rule_to_string (stop ? stop->rule : CW_RULE_INSTRUMENT_LENGTH));
    }
  return g_strdup_printf (_("No file of size %s or more can reach the working length without a stop, whatever is done before: %s."),
                          num (&n, p->target_size, 0), which->str);
}

/* The widest the file can make the canal at s: its flutes must cover s,
 * at a depth no fixed rule stops.  A file that never narrows is widest
 * there at the deepest such depth. */
static double
widest_file_at (Planner *p,
                guint    file,
                double   s)
{
  const PlanFile *f = &p->files[file];
  double widest = 0.0;

  if (s < p->canal->orifice_depth)
    return widest;
  for (int k = f->top; k >= f->bottom && k * CW_PLAN_GRID >= s; k--)
    if (k * CW_PLAN_GRID - f->instrument->flute_length <= s && !cw_planner_fixed_stop (p, file, k))
      {
        widest = MAX (widest, cw_instrument_diameter (f->instrument, k * CW_PLAN_GRID - s));
        if (f->widest)
          break;
      }
  return widest;
}

/* The widest any file can make the canal 3 mm short of length. */
static double
widest_at (Planner *p,
           double   s)
{
  double widest = cw_pwl_eval (cw_eval_state_envelope (p->root_state), s);

  for (guint i = 0; i < p->n_files; i++)
    widest = MAX (widest, widest_file_at (p, i, s));
  return widest;
}

static char *
taper_out_of_reach (Planner *p)
{
  double wl = p->canal->working_length, largest = 0.0, most;
  Numbers n = { 0 };

  most = (widest_at (p, wl - 3.0) - cw_pwl_eval (cw_eval_state_envelope (p->root_state), wl)) / 3.0;
  if (most >= p->target_taper - 1e-6)
    return NULL;
  for (guint i = 0; i < p->n_files; i++)
    largest = MAX (largest, cw_instrument_largest_taper (p->files[i].instrument));
  if (largest < p->target_taper - CW_TAPER_EPSILON)
    return g_strdup_printf (_("No file in the set has a taper of %s or more, and the files on hand give an apical taper of %s at most (step-back included), short of the target %s."),
                            num (&n, p->target_taper, 3), num (&n, most, 3),
                            num (&n, p->target_taper, 3));
  return g_strdup_printf (_("The files on hand give an apical taper of %s at most, short of the target %s."),
                          num (&n, most, 3), num (&n, p->target_taper, 3));
}

/* A reason that holds for every sequence, or NULL. */
char *
cw_planner_unreachable (Planner *p)
{
  char *reason = missing_size (p);

  if (reason == NULL)
    reason = size_never_at_length (p);
  if (reason == NULL)
    reason = taper_out_of_reach (p);
  return reason;
}

static gboolean
is_tapered_apical_file (const Planner *p,
                        guint          file)
{
  double taper = cw_instrument_largest_taper (p->files[file].instrument);

  return is_apical_file (p, file) && taper >= p->target_taper - CW_TAPER_EPSILON;
}

typedef gboolean (*FileFilter) (const Planner *p,
                                guint          file);

/* The stops that keep each file the filter picks from length after the
 * state, as "id: sentence id: sentence"; NULL when one can get there.
 * *rule is the rule they share, or -1. */
static char *
blocked_files (Planner           *p,
               const CwEvalState *state,
               FileFilter         filter,
               int               *rule)
{
  g_autoptr(GString) which = g_string_new (NULL);

  *rule = -1;
  for (guint i = 0; i < p->n_files; i++)
    {
      g_autoptr(CwFinding) stop = NULL;
      g_autofree char *sentence = NULL;

      if (!filter (p, i))
        continue;
      stop = stop_at_length (p, state, i);
      if (stop == NULL)
        return NULL;
      *rule = which->len == 0 || *rule == (int) stop->rule ? (int) stop->rule : -2;
      sentence = cw_finding_describe (stop, TRUE);
      g_string_append_printf (which, "%s%s: %s", which->len ? " " : "", p->files[i].instrument->id,
                              sentence);
    }
  return g_string_free (g_steal_pointer (&which), FALSE);
}

/* What keeps the files of the size from length after the closest plan. */
static char *
size_blocked (Planner           *p,
              const CwEvalState *state)
{
  g_autofree char *which = NULL;
  Numbers n = { 0 };
  int rule;

  which = blocked_files (p, state, is_apical_file, &rule);
  if (which == NULL)
    return NULL;
  if (rule >= 0)
    return g_strdup_printf (_("%s stops every file of size %s or more short of the working length. %s"),
                            cw_rule_to_string (rule), num (&n, p->target_size, 0), which);
  return g_strdup_printf (_("Every file of size %s or more is stopped short of the working length. %s"),
                          num (&n, p->target_size, 0), which);
}

/* A file of the size and taper at length would give both at once. */
static char *
taper_blocked (Planner           *p,
               const CwEvalState *state)
{
  g_autofree char *which = NULL;
  Numbers n = { 0 };
  int rule;

  which = blocked_files (p, state, is_tapered_apical_file, &rule);
  if (which == NULL)
    return NULL;
  if (*which == '\0')
    return g_strdup_printf (_("No file in the set has size %s or more and a taper of %s or more."),
                            num (&n, p->target_size, 0), num (&n, p->target_taper, 3));
  return g_strdup_printf (_("Every file of size %s or more with a taper of %s or more is stopped short of the working length. %s"),
                          num (&n, p->target_size, 0), num (&n, p->target_taper, 3), which);
}

static char *
shape_short (const Planner     *p,
             const CwEvalState *state)
{
  Numbers n = { 0 };
  double size = cw_eval_state_apical_size (state);

  if (!isfinite (size))
    return g_strdup_printf (_("No file reaches the working length; the target is size %s at taper %s."),
                            num (&n, p->target_size, 0), num (&n, p->target_taper, 3));
  return g_strdup_printf (_("The closest shape is size %s at apical taper %s, short of the target size %s at taper %s."),
                          num (&n, size, 0), num (&n, cw_eval_state_apical_taper (state), 3),
                          num (&n, p->target_size, 0), num (&n, p->target_taper, 3));
}

static CwEvalState *
replay (Planner        *p,
        const PlanNode *node)
{
  CwEvalState *state;

  if (node == NULL || node->parent == NULL)
    return cw_eval_state_copy (p->root_state);
  state = replay (p, node->parent);
  cw_step_result_free (cw_eval_state_apply (state, p->files[node->instrument].instrument,
                                            node->depth, FALSE));
  return state;
}

/* After a search that found no complete plan and no proof that none exists. */
char *
cw_planner_explain (Planner  *p,
                    PlanNode *closest)
{
  g_autoptr(CwEvalState) state = replay (p, closest);
  g_autofree char *why = size_blocked (p, state);
  g_autofree char *shape = shape_short (p, state);
  g_autofree char *head = NULL;

  if (why == NULL)
    why = taper_blocked (p, state);
  if (p->stats.stopped_early)
    head = g_strdup_printf (_("The search stopped early after %u evaluated steps (the node budget) without a plan that meets the targets."),
                            p->stopped_at);
  else
    head = g_strdup_printf (_("No sequence of at most %u moves meets the targets without a stop."),
                            p->options.max_steps);
  if (closest == NULL || closest->parent == NULL)
    return g_strdup_printf ("%s %s %s", head, _("No file has a move in this canal."), shape);
  return g_strjoin (" ", head, why ? why : shape, why ? shape : NULL, NULL);
}

static int
compare_closeness (gconstpointer a,
                   gconstpointer b)
{
  const PlanNode *x = *(PlanNode * const *) a, *y = *(PlanNode * const *) b;

  if (fabs (x->shortfall - y->shortfall) > PLAN_EPS)
    return x->shortfall < y->shortfall ? -1 : 1;
  return cw_plan_cost_compare (&x->g, &y->g);
}

static void
keep_best (GPtrArray *level,
           guint      width)
{
  g_ptr_array_sort (level, compare_closeness);
  for (guint i = width; i < level->len; i++)
    cw_planner_release (g_ptr_array_index (level, i));
  if (level->len > width)
    g_ptr_array_set_size (level, width);
}

/* When no plan exists the queue order says nothing about closeness, so
 * the closest plan comes from a beam over the same moves, kept by
 * shortfall: not proven closest, but bounded in time. */
PlanNode *
cw_planner_beam (Planner *p,
                 guint    width)
{
  g_autoptr(GPtrArray) level = g_ptr_array_new ();
  PlanNode *best = NULL;
  guint limit = p->stats.evaluated + p->options.node_budget / 4 + 1;

  g_ptr_array_add (level, cw_planner_root (p));
  for (guint step = 0; step < p->options.max_steps && level->len > 0; step++)
    {
      g_autoptr(GPtrArray) next = g_ptr_array_new ();

      for (guint i = 0; i < level->len && p->stats.evaluated < limit; i++)
        for (guint j = 0; j < p->n_files && p->stats.evaluated < limit; j++)
          {
            PlanNode *child = cw_planner_move (p, g_ptr_array_index (level, i), j);

            if (child)
              g_ptr_array_add (next, child);
          }
      keep_best (next, width);
      for (guint i = 0; i < level->len; i++)
        cw_planner_release (g_ptr_array_index (level, i));
      if (next->len > 0 && (best == NULL || compare_closeness (&next->pdata[0], &best) < 0))
        best = next->pdata[0];
      if (best && best->goal)
        break;
      g_ptr_array_unref (level);
      level = g_steal_pointer (&next);
    }
  return best;
}
