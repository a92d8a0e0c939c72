/* capacity.c - carrying capacity by exact decisions and bisection (see
 * capacity.h and docs/capacity.md). */
#include "capacity.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "planbase.h"

void cap_set_head(plan_problem *pb, int m, int head, double intake_kgdm_d)
{
    pb->mob[m].head = head;
    pb->mob[m].demand_t_d = head * intake_kgdm_d / 1000.0;
}

static void set_limits(plan_problem *pb, const cap_options *o)
{
    pb->limit_supplement = o->limit_supplement;
    pb->limit_mowing = o->limit_mowing;
    pb->max_supplement_t = o->max_supplement_t;
    pb->max_mowed_ha = o->max_mowed_ha;
    pb->limit_shortfall = o->limit_shortfall;
    pb->max_shortfall_t = o->max_shortfall_t;
}

const char *cap_verdict_text(int v)
{
    switch (v) {
    case CAP_CARRIED: return "carried";
    case CAP_NO_PLAN_LP: return "not carried (LP relaxation infeasible)";
    case CAP_NO_PLAN_TREE: return "not carried (branch and bound exhausted)";
    default: return "not proven (time limit)";
    }
}

/* Turns a plan made for another head count into a start for this one
 * (pb at the new head): week by week, the cover simulated as the verifier
 * does, a paddock that would end below its residual loses grazing days
 * (the largest mob's first) until it does not, one that would end above
 * its ceiling is mowed, and supplement fills each mob's week.  A heuristic:
 * the result is only offered as the warm plan, which the solver checks
 * against every row and refuses (for the baseline) if it breaks one. */
static void repair(const plan_problem *pb, plan *pl)
{
    int P = pb->n_paddocks, M = pb->n_mobs, T = pb->n_weeks;
    for (int p = 0; p < P; p++) {
        const plan_paddock *pd = &pb->pd[p];
        double x = pd->cover0_t_ha;
        for (int t = 0; t < T; t++) {
            double x1;
            for (;;) {
                double eaten = 0;
                int big = -1;
                for (int m = 0; m < M; m++) {
                    int d = pl->days[((size_t)m * P + p) * T + t];
                    eaten += pb->mob[m].demand_t_d * d;
                    if (d > 0 && (big < 0 || pb->mob[m].demand_t_d > pb->mob[big].demand_t_d))
                        big = m;
                }
                x1 = (1.0 - 7.0 * pd->senescence_per_day) * x + 7.0 * pb->growth_t_ha_d[(size_t)p * T + t] -
                     eaten / pd->area_ha;
                if (x1 >= pd->residual_t_ha - 1e-9 || big < 0)
                    break;
                pl->days[((size_t)big * P + p) * T + t]--;
            }
            if (x1 > pd->ceiling_t_ha + 1e-9 && x1 >= pd->residual_t_ha)
                pl->mow[(size_t)p * T + t] = 1;
            x = pl->mow[(size_t)p * T + t] ? pd->residual_t_ha : x1;
        }
    }
    for (int m = 0; m < M; m++)
        for (int t = 0; t < T; t++) {
            int total = 0;
            for (int p = 0; p < P; p++)
                total += pl->days[((size_t)m * P + p) * T + t];
            pl->supplement_t[(size_t)m * T + t] = pb->mob[m].demand_t_d * (7 - total);
        }
}

int cap_decide(plan_problem *pb, const cap_options *o, int head, const plan *near, cap_probe *pr, plan *plan_out,
               rg_err *err)
{
    memset(pr, 0, sizeof *pr);
    pr->head = head;
    pr->bound_supplement_t = -HUGE_VAL;
    cap_set_head(pb, o->mob, head, o->intake_kgdm_d);
    set_limits(pb, o);
    plan pl, warm;
    memset(&warm, 0, sizeof warm);
    if (plan_alloc(pb, &pl) < 0)
        return rg_fail(err, "out of memory");
    if (near && near->days) {
        if (plan_alloc(pb, &warm) < 0) {
            plan_free(&pl);
            return rg_fail(err, "out of memory");
        }
        memcpy(warm.days, near->days, sizeof *warm.days * (size_t)pb->n_mobs * pb->n_paddocks * pb->n_weeks);
        memcpy(warm.mow, near->mow, (size_t)pb->n_paddocks * pb->n_weeks);
        repair(pb, &warm);
    }
    pm_options po = {.time_limit_s = o->time_limit_s, .strategy = PM_DECIDE, .warm = warm.days ? &warm : NULL};
    pm_result res;
    int rc = pm_solve(pb, &po, &pl, &res);
    plan_free(&warm);
    if (rc < 0) {
        plan_free(&pl);
        return rg_fail(err, "capacity at %d head: the solver failed: %s", head, res.msg);
    }
    pr->seconds = res.seconds;
    if (res.status == PM_OPTIMAL || res.status == PM_FEASIBLE) {
        pv_result v;
        int bad = pv_simulate(pb, &pl, &v);
        if (bad != 0) {
            rg_fail(err, "capacity at %d head: the deciding plan breaks a rule: %s (a bug: please report it with the site file)",
                    head, bad < 0 ? "cannot be read" : v.first_violation);
            pv_free(&v);
            plan_free(&pl);
            return -1;
        }
        pr->verdict = CAP_CARRIED;
        pr->supplement_t = v.supplement_t;
        pr->mowed_ha = v.mowed_ha;
        pv_free(&v);
        if (plan_out)
            *plan_out = pl;
        else
            plan_free(&pl);
        return 0;
    }
    plan_free(&pl);
    if (res.infeasible)
        pr->verdict = res.bound == HUGE_VAL ? CAP_NO_PLAN_TREE : CAP_NO_PLAN_LP;
    else {
        pr->verdict = CAP_NOT_PROVEN;
        pr->bound_supplement_t = res.bound;
    }
    return 0;
}

/* Decides head into the next probe; keeps the carried plan with the
 * largest head in *best (best_head). */
static int probe(cap_result *r, plan_problem *pb, const cap_options *o, int head, plan *best, int *best_head,
                 rg_err *err)
{
    if (r->n_probes == CAP_MAX_PROBES)
        return rg_fail(err, "capacity: more than %d decisions (a bug)", CAP_MAX_PROBES);
    cap_probe *pr = &r->probe[r->n_probes++];
    plan pl;
    memset(&pl, 0, sizeof pl);
    if (cap_decide(pb, o, head, best, pr, &pl, err) < 0)
        return -1;
    if (o->progress)
        fprintf(stderr, "capacity: %d head: %s (%.1f s)\n", head, cap_verdict_text(pr->verdict), pr->seconds);
    if (pr->verdict == CAP_CARRIED) {
        if (head > *best_head) {
            plan_free(best);
            *best = pl;
            *best_head = head;
        } else
            plan_free(&pl);
    }
    return 0;
}

/* The latest verdict at head h, or -1 when h was not decided. */
static int verdict_at(const cap_result *r, int h)
{
    int v = -1;
    for (int k = 0; k < r->n_probes; k++)
        if (r->probe[k].head == h)
            v = r->probe[k].verdict;
    return v;
}

/* The smallest head count above lo decided and not carried, or
 * CAP_MAX_HEAD + 1. */
static int next_refused(const cap_result *r, int lo)
{
    int hi = CAP_MAX_HEAD + 1;
    for (int k = 0; k < r->n_probes; k++) {
        int h = r->probe[k].head;
        if (h > lo && h < hi && verdict_at(r, h) != CAP_CARRIED)
            hi = h;
    }
    return hi;
}

/* The search: a bracket lo (carried, 0 = none) < hi (not carried), then
 * bisection until hi = lo + 1.  When lo + 1 is not proven, it is decided
 * once more from the plan at lo (repaired: the nearest start there is);
 * carried, the search goes on above it. */
static int search(cap_result *r, plan_problem *pb, const cap_options *o, plan *best, int *best_head,
                  rg_err *err)
{
    int lo = 0, hi = CAP_MAX_HEAD + 1;
    int h = o->head0 < 1 ? 1 : o->head0 > CAP_MAX_HEAD ? CAP_MAX_HEAD : o->head0;
    for (;;) { /* the bracket */
        if (probe(r, pb, o, h, best, best_head, err) < 0)
            return -1;
        if (verdict_at(r, h) == CAP_CARRIED) {
            lo = h;
            if (h == CAP_MAX_HEAD || hi <= CAP_MAX_HEAD)
                break;
            h = h > CAP_MAX_HEAD / 2 ? CAP_MAX_HEAD : 2 * h;
        } else {
            hi = h;
            if (h == 1 || lo > 0)
                break;
            h = h / 2;
        }
    }
    int retried = 0;
    for (;;) {
        while (hi - lo > 1 && hi <= CAP_MAX_HEAD) {
            int mid = lo + (hi - lo) / 2;
            if (probe(r, pb, o, mid, best, best_head, err) < 0)
                return -1;
            if (verdict_at(r, mid) == CAP_CARRIED)
                lo = mid;
            else
                hi = mid;
        }
        if (hi > CAP_MAX_HEAD || lo == 0 || verdict_at(r, hi) != CAP_NOT_PROVEN || retried == hi ||
            r->n_probes + 24 > CAP_MAX_PROBES)
            break;
        retried = hi;
        if (probe(r, pb, o, hi, best, best_head, err) < 0)
            return -1;
        if (verdict_at(r, hi) != CAP_CARRIED)
            break;
        lo = hi;
        hi = next_refused(r, lo);
    }
    r->head = lo;
    r->settled = verdict_at(r, lo + 1) == CAP_NO_PLAN_LP || verdict_at(r, lo + 1) == CAP_NO_PLAN_TREE;
    return 0;
}

/* The plan at the capacity: optimised for cost within the limits from the
 * deciding plan, verified; the baseline (limits off) beside it. */
static int final_plan(cap_result *r, const cap_options *o, plan *warm, rg_err *err)
{
    plan_problem *pb = &r->pb;
    cap_set_head(pb, o->mob, r->head, o->intake_kgdm_d);
    set_limits(pb, o);
    if (plan_alloc(pb, &r->opt) < 0)
        return rg_fail(err, "out of memory");
    pm_options po = {.time_limit_s = o->time_limit_s, .gap = o->gap, .warm = warm, .strategy = PM_IMPROVE};
    if (pm_solve(pb, &po, &r->opt, &r->milp) < 0)
        return rg_fail(err, "capacity at %d head: the solver failed: %s", r->head, r->milp.msg);
    if (r->milp.status != PM_OPTIMAL && r->milp.status != PM_FEASIBLE) {
        /* the deciding plan keeps every row: it stands */
        memcpy(r->opt.days, warm->days, sizeof *warm->days * (size_t)pb->n_mobs * pb->n_paddocks * pb->n_weeks);
        memcpy(r->opt.mow, warm->mow, (size_t)pb->n_paddocks * pb->n_weeks);
        memcpy(r->opt.supplement_t, warm->supplement_t, sizeof *warm->supplement_t * (size_t)pb->n_mobs * pb->n_weeks);
    }
    int bad = pv_simulate(pb, &r->opt, &r->vopt);
    if (bad != 0)
        return rg_fail(err, "capacity at %d head: the plan breaks a rule: %s (a bug: please report it with the site file)",
                       r->head, bad < 0 ? "cannot be read" : r->vopt.first_violation);
    plan_problem nolim = *pb;
    nolim.limit_supplement = nolim.limit_mowing = nolim.limit_shortfall = 0;
    if (pb_baseline(&nolim, &r->base) < 0 || pv_simulate(&nolim, &r->base, &r->vbase) != 0)
        return rg_fail(err, "capacity at %d head: the baseline plan could not be built or breaks a rule (a bug)", r->head);
    return 0;
}

int cap_search(const plan_problem *pb0, const cap_options *o, cap_result *r, rg_err *err)
{
    memset(r, 0, sizeof *r);
    if (!o->limit_supplement && !o->limit_mowing)
        return rg_fail(err, "capacity needs a limit on supplement or mowing (without one any flock can be fed from supplement)"),
               RG_EXIT_INPUT;
    if (o->mob < 0 || o->mob >= pb0->n_mobs)
        return rg_fail(err, "capacity: no mob %d", o->mob), RG_EXIT_INPUT;
    if (plan_problem_copy(pb0, &r->pb) < 0)
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    plan best;
    memset(&best, 0, sizeof best);
    int best_head = 0;
    int rc = search(r, &r->pb, o, &best, &best_head, err);
    if (rc == 0 && r->head > 0 && best_head != r->head)
        rc = rg_fail(err, "capacity: no plan kept for %d head (a bug)", r->head);
    else if (rc == 0 && r->head > 0)
        rc = final_plan(r, o, &best, err);
    plan_free(&best);
    return rc == 0 ? RG_EXIT_OK : RG_EXIT_RUNTIME;
}

void cap_free(cap_result *r)
{
    if (!r)
        return;
    plan_problem_free(&r->pb);
    plan_free(&r->opt);
    plan_free(&r->base);
    pv_free(&r->vopt);
    pv_free(&r->vbase);
    memset(r, 0, sizeof *r);
}
