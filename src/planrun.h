/* planrun.h - one planning run: problem, baseline, solver, verifier (plan stage).
 *
 * What `rowgraze plan`, `report`, `compare` and `capacity` all do before
 * they print anything: build the problem from the site and its forecast
 * (planbuild.c), make the rule-of-thumb baseline (planbase.c), solve from it
 * (planmilp.c), and re-check both plans with the verifier (planverify.c).
 * A plan that breaks a rule is a runtime failure, never a result.  When the
 * solver gives no plan the baseline stands in for it, with a warning.
 */
#ifndef PLANRUN_H
#define PLANRUN_H

#include "diag.h"
#include "plan.h"
#include "planmilp.h"
#include "planverify.h"
#include "planhist.h"
#include "prevplan.h"
#include "site.h"
#include "weather.h"

typedef struct pr_options {
    double time_limit_s;   /* solver time, s (> 0) */
    double gap;            /* relative gap at which to stop, e.g. 0.01 */
    int progress;          /* 1: the solver's one-line progress on stderr */
    int quiet;             /* 1: no warning when the baseline stands in */
    int strategy;          /* PM_IMPROVE, PM_DECOMP, PM_ROLLING or PM_AUTO (planmilp.h); 0 is read
                              as PM_AUTO (PM_DIRECT is not offered here) */
    const char *export_path; /* also write the model here (.lp: LP format, else MPS), or NULL */
    const pp_plan *keep;   /* an earlier plan whose first keep_weeks weeks to hold, or NULL */
    const rec_walks *walks;   /* pasture walk records, or NULL */
    const rec_grazes *grazes; /* grazing records, or NULL */
    int keep_weeks;
} pr_options;

typedef struct pr_run {
    plan_problem pb;
    plan opt, base;        /* the solver's plan (or the baseline's copy), the baseline */
    pv_result vopt, vbase; /* their verified simulations */
    pm_result milp;        /* the solver's status, objective, bound, gap */
    int fell_back;         /* 1: the solver gave no plan, opt is the baseline */
    ph_state start;        /* each paddock's state at the start (records) */
    int kept_weeks;        /* weeks of the earlier plan held (pr_options.keep) */
    char keep_why[320];    /* why fewer weeks than asked were kept, or "" */
} pr_run;

/* Plans the site as its plan section says (start, weeks, percentile).
 * Returns RG_EXIT_OK, RG_EXIT_INPUT (the site or weather cannot make the
 * problem) or RG_EXIT_RUNTIME, with a message; *r is always safe to pass to
 * pr_free afterwards. */
int pr_plan(const site *s, const wx_set *wx, const pr_options *o, pr_run *r, rg_err *err);

/* Solves an already built problem r->pb the same way (used where the problem
 * is changed between runs, as `capacity` changes the head count). */
int pr_solve(const pr_options *o, pr_run *r, rg_err *err);

/* Releases everything in *r and zeroes it. */
void pr_free(pr_run *r);

#endif
