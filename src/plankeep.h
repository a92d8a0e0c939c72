/* plankeep.h - holding the first weeks of an earlier plan (plan stage).
 *
 * `rowgraze plan --keep PREVIOUS.json --keep-weeks N` re-plans with the
 * first N weeks of an earlier plan (prevplan.h) held where they are: the
 * mobs graze the same paddocks for the same days.  A kept week must still
 * keep every rule with the new data (a walk may show less cover than the
 * earlier plan expected, a paddock may now be closed): pk_apply keeps the
 * longest run of weeks from the start that does, and says why it stopped.
 * Mowing and supplement in kept weeks stay free: they follow from the cover.
 */
#ifndef PLANKEEP_H
#define PLANKEEP_H

#include <stddef.h>

#include "diag.h"
#include "plan.h"
#include "prevplan.h"

/* Sets pb->fixed_weeks and pb->fixed_days from prev's weeks that fall on
 * pb's first keep_weeks weeks (prev must start on the same weekday, on or
 * before pb's start).  Returns the number of weeks kept (0..keep_weeks; why
 * gets the reason when fewer than asked, else ""), or -1 with a message in
 * err when prev does not fit the site (unknown mob or paddock, another
 * weekday, ended before pb starts). */
int pk_apply(plan_problem *pb, const pp_plan *prev, int keep_weeks, char *why, size_t cap,
             rg_err *err);

/* Week of prev that is week t of pb, or -1 (prev starts on a different
 * weekday, later, or has ended by then). */
int pk_prev_week(const plan_problem *pb, const pp_plan *prev, int t);

#endif
