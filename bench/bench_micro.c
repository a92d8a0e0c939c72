/* bench_micro.c - times the strip microclimate engine on the demo farm:
 * one full year, hourly, every strip (40 at the demo's 0.15 m), one array
 * geometry.  Prints the median of several runs; `make bench` runs it.
 * Target (issue: strip microclimate engine): at most 50 ms per year on one
 * core of the project's 2-core machine.  Not a test: nothing here fails on
 * time. */
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#include "micro.h"

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
    printf("strip microclimate, %zu hours x %d strips, median of %d runs: %.1f ms "
           "(target 50 ms); geometry set-up (sky view table, once per geometry): %.1f ms\n",
           year->n, c.geom.n_strips, RUNS, ms[RUNS / 2], setup_ms);
    printf("bench-micro hours=%zu strips=%d ms=%.1f setup_ms=%.1f min_ms=%.1f max_ms=%.1f\n",
           year->n, c.geom.n_strips, ms[RUNS / 2], setup_ms, ms[0], ms[RUNS - 1]);
    mc_config_free(&c);
    wx_free(&w);
    site_free(&s);
    return 0;
}
