/* cw-planner-search.c: the exact search for the best plans
 *
 * A* over partial plans, in order of f = g + h compared lexicographically
 * (cautions, time, steps).  h is nothing for a plan that meets the targets;
 * otherwise one more step and its changeover, plus, while no file of the
 * target size has been at length, the fewest cautions that depend on the
 * file and depth alone (torsion, strain, ceiling table) of a step that can
 * bring one there.  h never overestimates and never falls by more than a
 * step costs, so complete plans leave the queue in cost order.
 *
 * Two partial plans have the same future when they share the key: the
 * envelope (the same points, bit for bit), the file that can still set off
 * taper-change (-1 when none can), the glide-path depth (+inf once the rule
 * was checked), the deepest tip (for the move rule) and whether the size
 * has reached length.  Every later step's depth, findings and time follow
 * from the key alone.  Label A dominates B when they share the envelope,
 * cost(A) <= cost(B), steps(A) <= steps(B) (as many steps left), A's
 * previous file is none or B's, A's glide depth is at least B's, A's
 * deepest tip is at most B's and A has the size whenever B has: every
 * completion of B then completes A at no more cost.  A label is dropped
 * when n labels settled before it dominate it, n being the number of plans
 * asked for, so that the alternatives are exact too.
 *
 * Copyright 2026 The Canalwright authors
 * SPDX-License-Identifier: GPL-3.0-or-later
 */
#define G_LOG_DOMAIN "cw-planner"

#include <math.h>

#include "cw-planner-private.h"

/* Queued children keep their state up to this many; past it they are
 * rebuilt from their parent's when they come out. */
#define MAX_QUEUED_STATES 20000

typedef struct
{
  Planner    *p;
  guint       n_plans;
  guint       queued_states;
  GPtrArray  *heap;
  GHashTable *settled;   /* envelope hash -> GPtrArray of PlanNode */
  PlanNode   *bound[CW_PLAN_MAX_ALTERNATIVES + 1];   /* cheapest goals seen */
  guint       n_bound;
  PlanNode   *closest;
} Search;

static gboolean
node_before (const PlanNode *a,
             const PlanNode *b)
{
  int c = cw_plan_cost_compare (&a->f, &b->f);

  return c != 0 ? c < 0 : a->serial < b->serial;
}

static void
heap_push (GPtrArray *heap,
           PlanNode  *node)
{
  guint i = heap->len;

  g_ptr_array_add (heap, node);
  while (i > 0 && node_before (node, g_ptr_array_index (heap, (i - 1) / 2)))
    {
      heap->pdata[i] = heap->pdata[(i - 1) / 2];
      i = (i - 1) / 2;
    }
  heap->pdata[i] = node;
}

static PlanNode *
heap_pop (GPtrArray *heap)
{
  PlanNode *top, *last;
  guint i = 0;

  if (heap->len == 0)
    return NULL;
  top = g_ptr_array_index (heap, 0);
  last = g_ptr_array_steal_index_fast (heap, heap->len - 1);
  if (heap->len == 0)
    return top;
  for (;;)
    {
      guint c = 2 * i + 1;

      if (c >= heap->len)
        break;
      if (c + 1 < heap->len && node_before (heap->pdata[c + 1], heap->pdata[c]))
        c++;
      if (!node_before (heap->pdata[c], last))
        break;
      heap->pdata[i] = heap->pdata[c];
      i = c;
    }
  heap->pdata[i] = last;
  return top;
}

static gboolean
label_dominates (const PlanNode *a,
                 const PlanNode *b)
{
  return a->g.steps <= b->g.steps &&
         cw_plan_cost_compare (&a->g, &b->g) <= 0 &&
         (a->previous < 0 || a->previous == b->previous) &&
         a->glide >= b->glide &&
         a->deepest <= b->deepest &&
         (a->apical_met || !b->apical_met);
}

static gboolean
dominated (const Search   *s,
           const PlanNode *node)
{
  GPtrArray *bucket = g_hash_table_lookup (s->settled, GUINT_TO_POINTER (node->hash));
  const CwPwl *envelope = cw_eval_state_envelope (node->state);
  guint count = 0;

  for (guint i = 0; bucket && i < bucket->len; i++)
    {
      const PlanNode *other = g_ptr_array_index (bucket, i);

      if (label_dominates (other, node) &&
          cw_envelopes_equal (cw_eval_state_envelope (other->state), envelope) &&
          ++count >= s->n_plans)
        return TRUE;
    }
  return FALSE;
}

static void
settle (Search   *s,
        PlanNode *node)
{
  GPtrArray *bucket = g_hash_table_lookup (s->settled, GUINT_TO_POINTER (node->hash));

  if (bucket == NULL)
    {
      bucket = g_ptr_array_new ();
      g_hash_table_insert (s->settled, GUINT_TO_POINTER (node->hash), bucket);
    }
  g_ptr_array_add (bucket, node);
}

/* Nothing costlier than the n-th cheapest complete plan already seen can
 * be among the n best. */
static gboolean
over_bound (const Search   *s,
            const PlanNode *node)
{
  return s->n_bound == s->n_plans &&
         cw_plan_cost_compare (&node->f, &s->bound[s->n_plans - 1]->g) > 0;
}

static void
add_bound (Search   *s,
           PlanNode *goal)
{
  guint i = MIN (s->n_bound, s->n_plans - 1);

  if (s->n_bound == s->n_plans &&
      cw_plan_cost_compare (&goal->g, &s->bound[i]->g) >= 0)
    return;
  while (i > 0 && cw_plan_cost_compare (&goal->g, &s->bound[i - 1]->g) < 0)
    {
      s->bound[i] = s->bound[i - 1];
      i--;
    }
  s->bound[i] = goal;
  s->n_bound = MIN (s->n_bound + 1, s->n_plans);
}

static gboolean
closer (const PlanNode *a,
        const PlanNode *b)
{
  if (b == NULL)
    return TRUE;
  if (fabs (a->shortfall - b->shortfall) > PLAN_EPS)
    return a->shortfall < b->shortfall;
  return cw_plan_cost_compare (&a->g, &b->g) < 0;
}

static void
drop (Search   *s,
      PlanNode *node)
{
  cw_planner_release (node);
  s->p->stats.pruned++;
}

/* FALSE when the budget cut it short. */
static gboolean
expand (Search   *s,
        PlanNode *node)
{
  Planner *p = s->p;

  p->stats.expanded++;
  for (guint i = 0; i < p->n_files; i++)
    {
      PlanNode *child;

      if (cw_planner_out_of_budget (p))
        return FALSE;
      child = cw_planner_move (p, node, i);
      if (child == NULL)
        continue;
      if (closer (child, s->closest))
        s->closest = child;
      if (over_bound (s, child) || dominated (s, child))
        {
          drop (s, child);
          continue;
        }
      if (child->goal)
        add_bound (s, child);
      if (s->queued_states < MAX_QUEUED_STATES)
        s->queued_states++;
      else
        cw_planner_release (child);
      heap_push (s->heap, child);
    }
  return TRUE;
}

/* Takes the next node off the queue that is still worth settling. */
static PlanNode *
next_node (Search *s)
{
  PlanNode *node;

  while ((node = heap_pop (s->heap)) != NULL)
    {
      s->queued_states -= node->state != NULL;
      if (over_bound (s, node))
        {
          drop (s, node);
          continue;
        }
      if (!cw_planner_complete (s->p, node))
        g_error ("A planned step evaluated differently the second time");
      if (dominated (s, node))
        {
          drop (s, node);
          continue;
        }
      return node;
    }
  return NULL;
}

/* Complete plans seen but not proven best, after those that were. */
static guint
add_unproven (const Search  *s,
              PlanNode     **goals,
              guint          n_goals)
{
  for (guint i = 0; i < s->n_bound && n_goals < s->n_plans; i++)
    {
      gboolean known = FALSE;

      for (guint j = 0; j < n_goals; j++)
        known |= goals[j] == s->bound[i];
      if (!known)
        goals[n_goals++] = s->bound[i];
    }
  return n_goals;
}

/* Fills goals with up to n_plans complete plans, best first, and returns
 * how many.  *closest is the partial plan nearest the targets seen.  When
 * the budget runs out, stats.stopped_early is set and the plans after the
 * proven ones are the cheapest seen. */
guint
cw_planner_search (Planner   *p,
                   guint      n_plans,
                   PlanNode **goals,
                   PlanNode **closest)
{
  Search s = { .p = p, .n_plans = n_plans, .queued_states = 1 };
  PlanNode *node;
  guint n_goals = 0;

  g_return_val_if_fail (n_plans >= 1 && n_plans <= CW_PLAN_MAX_ALTERNATIVES + 1, 0);

  s.heap = g_ptr_array_new ();
  s.settled = g_hash_table_new_full (NULL, NULL, NULL, (GDestroyNotify) g_ptr_array_unref);
  heap_push (s.heap, cw_planner_root (p));
  while (n_goals < n_plans && (node = next_node (&s)) != NULL)
    {
      settle (&s, node);
      if (node->goal)
        goals[n_goals++] = node;
      else if (node->g.steps < p->options.max_steps && !expand (&s, node))
        {
          p->stats.stopped_early = TRUE;
          p->stopped_at = p->stats.evaluated;
          break;
        }
    }
  if (p->stats.stopped_early)
    n_goals = add_unproven (&s, goals, n_goals);
  *closest = s.closest;
  g_ptr_array_unref (s.heap);
  g_hash_table_unref (s.settled);
  return n_goals;
}
