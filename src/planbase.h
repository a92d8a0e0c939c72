/* planbase.h - the rule-of-thumb baseline rotation (plan stage).
 *
 * The plan a grazier would draw up by hand: each week, each mob stays in
 * its paddock while it can and otherwise moves to the rested paddock with
 * the most cover; the rest of its demand is supplement; a paddock that
 * would end the week above its ceiling is mowed.  It is the yardstick the
 * MILP (planmilp.c) is compared with, and its warm start.  The exact rules
 * and every choice made where the rule of thumb is silent are in the
 * comment at the top of planbase.c.
 */
#ifndef PLANBASE_H
#define PLANBASE_H

#include "plan.h"

/* Builds the baseline plan for pb into *out (allocated here with
 * plan_alloc: release with plan_free).  The plan obeys every rule of
 * docs/planner.md (pv_simulate returns 0 on it) and costs no more than
 * feeding every mob supplement all horizon with mowing where needed.
 * Returns 0; -1 (with *out zeroed) on NULL arguments, on a problem the
 * verifier cannot read (pv_problem_valid), on data for which no plan can be
 * legal (senescence outside 0..1/7 a day, negative growth or starting
 * cover, residual below 0 or above the ceiling, open days outside 0..7,
 * negative demand), or when out of memory. */
int pb_baseline(const plan_problem *pb, plan *out);

#endif
