/* planbuild.h - the planning problem from a site and its growth forecast
 * (plan stage, first step).
 *
 * Reads the checked site (paddocks, mobs, rules, costs, maintenance) and
 * the growth forecast of forecast.c for the plan's weeks, converts to
 * tonnes, and fills a plan_problem (plan.h) that the baseline, the MILP and
 * the verifier all read.  The defaults it applies are listed in
 * docs/planner.md.
 */
#ifndef PLANBUILD_H
#define PLANBUILD_H

#include <stdint.h>

#include "diag.h"
#include "plan.h"
#include "planhist.h"
#include "site.h"
#include "weather.h"

/* Builds the problem for weeks weeks from start_day (tcal.h day number),
 * with the growth forecast's percentile-th percentile (10, 50 or 90).
 * Returns RG_EXIT_OK, RG_EXIT_INPUT (the weather does not cover the plan's
 * weeks, or they cross the new year) or RG_EXIT_RUNTIME, with a message. */
int plan_build(const site *s, const wx_set *wx, int64_t start_day, int weeks, int percentile,
               plan_problem *pb, rg_err *err);

/* The same from the paddocks' state at the start (planhist.h; h may be
 * NULL): a measured or carried-forward cover replaces the start cover, and
 * a paddock still resting from recorded grazing is closed on the days
 * before its rest ends (whole days, as for maintenance). */
int plan_build_from(const site *s, const wx_set *wx, const ph_state *h, int64_t start_day, int weeks,
                    int percentile, plan_problem *pb, rg_err *err);

#endif
