/* bench_plan.c - the rotation planner on generated farms of growing size
 * and on the demo: rows, columns, binaries, time to the first verified plan
 * (the baseline), the solver's cost, bound and gap, the baseline's cost,
 * and, when coinor-cbc is installed, cbc on the same exported model with
 * the same time limit.  Instances come from a fixed-seed generator of our
 * own (invented farms).  Prints figures; never fails on time.
 *   usage: bench_plan [SECONDS_PER_INSTANCE [NAME_PART]]   (default 10 s; all
 *   instances, or those whose name contains NAME_PART; BENCH_NO_CBC=1: no cbc;
 *   BENCH_NO_COMPACT=1: no compact model; BENCH_NO_DECOMP=1: no decomposition;
 *   BENCH_NO_ROLLING=1: no rolling horizon) */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#include "plan.h"
#include "planbase.h"
#include "plancg.h"
#include "planmilp.h"
#include "planroll.h"
#include "planverify.h"

static uint64_t rng_state;
static double rnd(void) /* xorshift64 (Marsaglia 2003), in [0, 1) */
{
    rng_state ^= rng_state << 13;
    rng_state ^= rng_state >> 7;
    rng_state ^= rng_state << 17;
    return (double)(rng_state >> 11) / 9007199254740992.0;
}

static double now_s(void)
{
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return t.tv_sec + t.tv_nsec / 1e9;
}

/* An invented farm: paddocks of 2-4 ha, covers and growth of a temperate
 * spring, a flock sized to eat about what the farm grows. */
static int generate(int np, int nw, int nm, uint64_t seed, plan_problem *pb)
{
    memset(pb, 0, sizeof *pb);
    rng_state = seed;
    pb->n_paddocks = np;
    pb->n_weeks = nw;
    pb->n_mobs = nm;
    pb->pd = calloc((size_t)np, sizeof *pb->pd);
    pb->mob = calloc((size_t)nm, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc((size_t)np * nw, sizeof(double));
    pb->open_days = calloc((size_t)np * nw, sizeof(int));
    if (!pb->pd || !pb->mob || !pb->growth_t_ha_d || !pb->open_days)
        return -1;
    double grow = 0;
    for (int p = 0; p < np; p++) {
        plan_paddock *d = &pb->pd[p];
        snprintf(d->id, sizeof d->id, "p%02d", p + 1);
        d->area_ha = 2 + 2 * rnd();
        d->residual_t_ha = 0.7;
        d->ceiling_t_ha = 3.5;
        d->cover0_t_ha = 1.0 + 1.5 * rnd();
        d->senescence_per_day = 0.01;
        for (int t = 0; t < nw; t++) {
            double g = 0.02 + 0.05 * rnd();
            pb->growth_t_ha_d[(size_t)p * nw + t] = g;
            pb->open_days[(size_t)p * nw + t] = rnd() < 0.05 ? 0 : 7;
            grow += g * d->area_ha / nw;
        }
    }
    for (int m = 0; m < nm; m++) {
        snprintf(pb->mob[m].id, sizeof pb->mob[m].id, "mob%d", m + 1);
        pb->mob[m].demand_t_d = grow * 0.8 / nm;
        pb->mob[m].head = (int)(pb->mob[m].demand_t_d / 0.0015);
    }
    pb->rest_weeks = 4;
    pb->spell_weeks = 1;
    pb->max_days_per_visit = 5;
    pb->max_paddocks_per_week = 2;
    pb->terminal_t_ha = 1.2;
    pb->cost_supplement_per_t = 300;
    pb->cost_mowing_per_ha = 60;
    pb->cost_per_move = 25;
    pb->penalty_terminal_per_t = 600;
    return 0;
}

/* cbc on the exported model: its objective, or NaN. */
static double run_cbc(const plan_problem *pb, double seconds, double *bound)
{
    *bound = (double)NAN;
    if (access("/usr/bin/cbc", X_OK) != 0)
        return (double)NAN;
    char mps[] = "/tmp/rowgraze-bench-XXXXXX";
    int fd = mkstemp(mps);
    if (fd < 0)
        return (double)NAN;
    close(fd);
    rg_err e;
    double obj = (double)NAN;
    if (pm_export(pb, mps, 1, &e) == 0) {
        char cmd[512];
        /* cbc's own limit does not cover its preprocessing and root LP, so
         * timeout(1) holds it to twice the time asked for */
        snprintf(cmd, sizeof cmd, "timeout -s KILL %.0f /usr/bin/cbc %s -sec %g -threads 1 -solve -quit 2>&1",
                 2 * seconds + 5, mps, seconds);
        FILE *p = popen(cmd, "r");
        char line[512];
        while (p && fgets(line, sizeof line, p)) {
            const char *k = strstr(line, "Objective value:");
            if (k)
                obj = atof(k + 16);
            k = strstr(line, "Lower bound:");
            if (k)
                *bound = atof(k + 12);
        }
        if (p)
            pclose(p);
    }
    remove(mps);
    return obj;
}

static void one(const char *name, int np, int nw, int nm, uint64_t seed, double seconds)
{
    plan_problem pb;
    if (generate(np, nw, nm, seed, &pb) < 0)
        return;
    plan base, best;
    pv_result vb, vo;
    memset(&vo, 0, sizeof vo);
    double t0 = now_s();
    pb_baseline(&pb, &base);
    int ok = pv_simulate(&pb, &base, &vb) == 0;
    double first = now_s() - t0;
    plan_alloc(&pb, &best);
    pm_options o = {.time_limit_s = seconds, .gap = 0.01, .warm = &base, .strategy = PM_IMPROVE};
    pm_result r;
    if (getenv("BENCH_NO_COMPACT")) { /* the decomposition alone (development runs) */
        memset(&r, 0, sizeof r);
        r.status = PM_NO_PLAN;
        r.objective = r.bound = r.gap = (double)NAN;
    } else
        pm_solve(&pb, &o, &best, &r);
    int vok = r.status <= PM_FEASIBLE && pv_simulate(&pb, &best, &vo) == 0;
    if (r.status == PM_NO_PLAN && isnan(r.objective))
        vok = 1; /* BENCH_NO_COMPACT: nothing to verify */
    /* the decomposition (plancg.c), same time, same warm start */
    plan cgp;
    pv_result vc;
    plan_alloc(&pb, &cgp);
    pm_options oc = o;
    oc.strategy = PM_DECOMP;
    pm_result rc;
    int cok = 1;
    if (getenv("BENCH_NO_DECOMP")) {
        memset(&rc, 0, sizeof rc);
        rc.status = PM_NO_PLAN;
        rc.objective = rc.bound = rc.gap = (double)NAN;
        cok = 0;
    } else {
        pm_solve(&pb, &oc, &cgp, &rc);
        cok = rc.status <= PM_FEASIBLE && pv_simulate(&pb, &cgp, &vc) == 0;
    }
    printf("%-8s decomposition: master rows %d, trajectories %d, nodes %d | cost %10.1f bound %10.1f gap %6.2f %% (%s) in %.1f s%s\n",
           name, rc.rows, rc.binaries, rc.nodes, rc.objective, rc.bound, 100 * rc.gap,
           rc.status == PM_OPTIMAL ? "optimal" : rc.status == PM_FEASIBLE ? "limit" : "no plan",
           rc.seconds, cok ? "" : " (VERIFY FAILED)");
    fflush(stdout);
    /* the rolling horizon (planroll.c), same time, same warm start: the
     * rolled plan alone (its cost from the note) and after the bound phase */
    plan rlp;
    pv_result vr;
    pm_result rr;
    plan_alloc(&pb, &rlp);
    pm_options orl = o;
    orl.strategy = PM_ROLLING;
    double rolled = (double)NAN, rolled_s = (double)NAN;
    int rok = 0;
    memset(&rr, 0, sizeof rr);
    rr.objective = rr.bound = rr.gap = (double)NAN;
    if (!getenv("BENCH_NO_ROLLING")) {
        pm_solve(&pb, &orl, &rlp, &rr);
        rok = rr.status <= PM_FEASIBLE && pv_simulate(&pb, &rlp, &vr) == 0;
        if (sscanf(rr.msg, "rolled plan %lf in %lf", &rolled, &rolled_s) != 2)
            rolled = rolled_s = (double)NAN;
        printf("%-8s rolling horizon: windows %d/%d weeks, rolled plan %10.1f in %.1f s | cost %10.1f bound %10.1f gap %6.2f %% (%s) in %.1f s%s\n",
               name, PRL_WINDOW_WEEKS, PRL_ROLL_WEEKS, rolled, rolled_s, rr.objective, rr.bound, 100 * rr.gap,
               rr.status == PM_OPTIMAL ? "optimal" : rr.status == PM_FEASIBLE ? "limit" : "no plan",
               rr.seconds, rok ? "" : " (VERIFY FAILED)");
        fflush(stdout);
    }
    double cbc_bound = (double)NAN, cbc = getenv("BENCH_NO_CBC") ? (double)NAN : run_cbc(&pb, seconds, &cbc_bound);
    printf("%-8s rows %6d cols %6d binaries %6d | first verified plan %.3f s | cost %10.1f bound %10.1f gap %6.2f %% (%s) | baseline %10.1f%s\n",
           name, r.rows, r.cols, r.binaries, first, r.objective, r.bound, 100 * r.gap,
           r.status == PM_OPTIMAL ? "optimal" : r.status == PM_FEASIBLE ? "limit" : "no plan",
           vb.cost_total, ok && vok ? "" : " (VERIFY FAILED)");
    printf("bench-plan instance=%s seconds=%.1f cost=%.1f bound=%.1f gap_pct=%.2f baseline=%.1f ",
           name, r.seconds, r.objective, r.bound, 100 * r.gap, vb.cost_total);
    if (isnan(cbc))
        printf("cbc_cost=na cbc_bound=na ");
    else
        printf("cbc_cost=%.1f cbc_bound=%.1f ", cbc, cbc_bound);
    printf("cg_seconds=%.1f cg_cost=%.1f cg_bound=%.1f cg_gap_pct=%.2f cg_nodes=%d ", rc.seconds, rc.objective,
           rc.bound, 100 * rc.gap, rc.nodes);
    printf("roll_seconds=%.1f roll_plan=%.1f roll_plan_seconds=%.1f roll_cost=%.1f roll_bound=%.1f roll_gap_pct=%.2f\n",
           rr.seconds, rolled, rolled_s, rr.objective, rr.bound, 100 * rr.gap);
    fflush(stdout);
    if (rok)
        pv_free(&vr);
    plan_free(&rlp);
    if (cok)
        pv_free(&vc);
    plan_free(&cgp);
    if (vok)
        pv_free(&vo);
    pv_free(&vb);
    plan_free(&base);
    plan_free(&best);
    plan_problem_free(&pb);
}

int main(int argc, char **argv)
{
    double seconds = argc > 1 ? atof(argv[1]) : 10;
    const char *only = argc > 2 ? argv[2] : NULL; /* run only the instances whose name contains it */
    printf("rotation planner, %g s per instance (1 core; cbc %s)\n", seconds,
           access("/usr/bin/cbc", X_OK) == 0 ? "alongside" : "not installed: apt-get install coinor-cbc");
    if (!only || strstr("12x13x1", only))
        one("12x13x1", 12, 13, 1, 1201, seconds);
    if (!only || strstr("24x26x2", only))
        one("24x26x2", 24, 26, 2, 2402, seconds);
    if (!only || strstr("48x26x2", only))
        one("48x26x2", 48, 26, 2, 4802, seconds);
    if (!only || strstr("96x52x3", only))
        one("96x52x3", 96, 52, 3, 9603, seconds);
    return 0;
}
