/* plandays.h - which days of a week each visit takes (plan stage).
 *
 * The model counts grazing days per mob, paddock and week (plan.days); a
 * person needs dates.  A mob's visits in one week are runs of consecutive
 * days, one after another, each on days its paddock is free (plan.h
 * open_mask: maintenance, keep-off, recorded rest).  The calendar, the
 * presence schedule and the calendar feeds all place days through here,
 * so they agree.
 */
#ifndef PLANDAYS_H
#define PLANDAYS_H

#include "plan.h"

/* Places mob m's visits of week t: first[p] gets the first day (0 = the
 * week's first day) of its visit to paddock p, or -1 where it has none.
 * The paddock prev (the one the mob was in at the end of the week before,
 * or -1) comes first when it can.  Returns 0 when every visit lies on free
 * days without overlap; else the number of grazing days that had to fall
 * on closed days (visits end to end, the order with the fewest; the caller
 * must warn); -1 on bad arguments (more than 7 days, or more than 6 visits,
 * in the week).  first has pb->n_paddocks entries. */
int pday_place(const plan_problem *pb, const plan *pl, int m, int t, int prev, int *first);

/* The paddock mob m is in at the end of week t by the placement first (its
 * visit that ends latest), or -1 when it grazes nowhere that week: the
 * prev of week t + 1.  Callers place weeks in order so that every output
 * lays the days out the same way. */
int pday_last_of(const plan_problem *pb, const plan *pl, int m, int t, const int *first);

#endif
