/* bench_micro.c - times the strip microclimate engine on the demo farm:
 * one full year, hourly, every strip (40 at the demo's 0.15 m), one array
 * geometry.  Prints the median of several runs; `make bench` runs it.
 * Target (issue: strip microclimate engine): at most 50 ms per year on one
 * core of the project's 2-core machine.  Then the growth stage on top:
 * soil water and growth for every strip, once per soil x sward pair of the
 * demo's paddocks (issue: soil water and growth), target 100 ms for the
 * whole year from weather to paddock growth.  Not a test: nothing here
 * fails on time. */
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#include "micro.h"
#include "pasture.h"

static double now_ms(void)
{
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return t.tv_sec * 1e3 + t.tv_nsec / 1e6;
}

static int by_value(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

int main(int argc, char **argv)
{
    const char *path = argc > 1 ? argv[1] : "examples/demo/site.json";
    site s;
    wx_set w;
    mc_config c;
    rg_err e = {{0}};
    if (site_load(path, "models", &s, &e) < 0 || wx_load(&s.weather, &w, &e) < 0) {
        fprintf(stderr, "bench: %s\n", e.msg);
        return 1;
    }
    double t0 = now_ms();
    if (mc_config_from_site(&s, &c, &e) < 0) {
        fprintf(stderr, "bench: %s\n", e.msg);
        return 1;
    }
    double setup_ms = now_ms() - t0;
    enum { RUNS = 9 };
    double ms[RUNS];
    const wx_series *year = &w.s[w.n - 1];
    for (int k = 0; k < RUNS; k++) {
        mc_result r;
        double a = now_ms();
        if (mc_run(&c, year, 0, year->n, &r, &e) < 0) {
            fprintf(stderr, "bench: %s\n", e.msg);
            return 1;
        }
        ms[k] = now_ms() - a;
        mc_free(&r);
    }
    qsort(ms, RUNS, sizeof ms[0], by_value);
    /* growth: microclimate once, then one pasture run per soil x sward pair */
    int pairs[16][2], n_pairs = 0;
    for (int i = 0; i < s.n_paddocks && n_pairs < 16; i++) {
        int k = 0;
        while (k < n_pairs && !(pairs[k][0] == s.paddocks[i].soil && pairs[k][1] == s.paddocks[i].sward))
            k++;
        if (k == n_pairs) {
            pairs[n_pairs][0] = s.paddocks[i].soil;
            pairs[n_pairs++][1] = s.paddocks[i].sward;
        }
    }
    double gms[RUNS];
    for (int k = 0; k < RUNS; k++) {
        mc_result r;
        double a = now_ms();
        if (mc_run(&c, year, 0, year->n, &r, &e) < 0)
            return 1;
        for (int j = 0; j < n_pairs; j++) {
            ps_config pc;
            ps_result p;
            if (ps_config_make(&s, pairs[j][0], pairs[j][1], &pc, &e) < 0 || ps_run(&pc, &r, year, &p, &e) < 0) {
                fprintf(stderr, "bench: %s\n", e.msg);
                return 1;
            }
            ps_free(&p);
        }
        gms[k] = now_ms() - a;
        mc_free(&r);
    }
    qsort(gms, RUNS, sizeof gms[0], by_value);
    printf("strip microclimate, %zu hours x %d strips, median of %d runs: %.1f ms "
           "(target 50 ms); geometry set-up (sky view table, once per geometry): %.1f ms\n",
           year->n, c.geom.n_strips, RUNS, ms[RUNS / 2], setup_ms);
    printf("bench-micro hours=%zu strips=%d ms=%.1f setup_ms=%.1f min_ms=%.1f max_ms=%.1f\n",
           year->n, c.geom.n_strips, ms[RUNS / 2], setup_ms, ms[0], ms[RUNS - 1]);
    printf("growth, weather to every strip of %d soil x sward pair(s) for %d paddocks, median of %d: "
           "%.1f ms (target 100 ms)\n", n_pairs, s.n_paddocks, RUNS, gms[RUNS / 2]);
    printf("bench-growth hours=%zu strips=%d pairs=%d paddocks=%d ms=%.1f min_ms=%.1f max_ms=%.1f\n",
           year->n, c.geom.n_strips, n_pairs, s.n_paddocks, gms[RUNS / 2], gms[0], gms[RUNS - 1]);
    mc_config_free(&c);
    wx_free(&w);
    site_free(&s);
    return 0;
}
