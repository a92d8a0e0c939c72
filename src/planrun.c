/* planrun.c - one planning run: problem, baseline, solver, verifier (see planrun.h). */
#include "planrun.h"

#include <string.h>

#include "planbase.h"
#include "planbuild.h"
#include "plankeep.h"

/* Copies plan a into b (same problem size). */
static void plan_copy(const plan_problem *pb, const plan *a, plan *b)
{
    size_t dmp = (size_t)pb->n_mobs * pb->n_paddocks * pb->n_weeks;
    memcpy(b->days, a->days, sizeof *b->days * dmp);
    memcpy(b->mow, a->mow, (size_t)pb->n_paddocks * pb->n_weeks);
    memcpy(b->supplement_t, a->supplement_t, sizeof *b->supplement_t * (size_t)pb->n_mobs * pb->n_weeks);
}

int pr_solve(const pr_options *o, pr_run *r, rg_err *err)
{
    const plan_problem *pb = &r->pb;
    if (pb_baseline(pb, &r->base) < 0)
        return rg_fail(err, "the baseline plan could not be built (out of memory?)"), RG_EXIT_RUNTIME;
    if (pv_simulate(pb, &r->base, &r->vbase) != 0)
        return rg_fail(err, "the baseline plan breaks a rule: %s (a bug: please report it with the site file)",
                       r->vbase.first_violation), RG_EXIT_RUNTIME;
    if (plan_alloc(pb, &r->opt) < 0)
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    pm_options po = {.time_limit_s = o->time_limit_s, .gap = o->gap, .warm = &r->base,
                     .progress = o->progress, .strategy = o->strategy ? o->strategy : PM_AUTO};
    if (pm_solve(pb, &po, &r->opt, &r->milp) < 0 || r->milp.status == PM_NO_PLAN) {
        /* the baseline is a plan: fall back to it rather than fail */
        plan_copy(pb, &r->base, &r->opt);
        r->fell_back = 1;
        if (!o->quiet)
            rg_warn("the solver gave no plan (%s); showing the baseline", r->milp.msg);
    }
    if (pv_simulate(pb, &r->opt, &r->vopt) != 0)
        return rg_fail(err, "the solver's plan breaks a rule: %s (a bug: please report it with the site file)",
                       r->vopt.first_violation), RG_EXIT_RUNTIME;
    return RG_EXIT_OK;
}

int pr_plan(const site *s, const wx_set *wx, const pr_options *o, pr_run *r, rg_err *err)
{
    memset(r, 0, sizeof *r);
    if (s->plan.start_day == INT64_MIN)
        return rg_fail(err, "%s: no plan start: give --start DATE or $.plan.start", s->path), RG_EXIT_INPUT;
    int rc = ph_build(s, wx, o->walks, o->grazes, s->plan.start_day, s->plan.percentile, &r->start, err);
    if (rc != RG_EXIT_OK)
        return rc;
    rc = plan_build_from(s, wx, &r->start, s->plan.start_day, s->plan.weeks, s->plan.percentile, &r->pb, err);
    if (rc != RG_EXIT_OK)
        return rc;
    if (o->keep && o->keep_weeks > 0) {
        int k = pk_apply(&r->pb, o->keep, o->keep_weeks, r->keep_why, sizeof r->keep_why, err);
        if (k < 0)
            return RG_EXIT_INPUT;
        r->kept_weeks = k;
    }
    if (o->export_path) {
        size_t len = strlen(o->export_path);
        int mps = !(len > 3 && strcmp(o->export_path + len - 3, ".lp") == 0);
        if (pm_export(&r->pb, o->export_path, mps, err) < 0)
            return RG_EXIT_RUNTIME;
    }
    return pr_solve(o, r, err);
}

void pr_free(pr_run *r)
{
    if (!r)
        return;
    plan_free(&r->opt);
    plan_free(&r->base);
    pv_free(&r->vopt);
    pv_free(&r->vbase);
    plan_problem_free(&r->pb);
    ph_free(&r->start);
    memset(r, 0, sizeof *r);
}
