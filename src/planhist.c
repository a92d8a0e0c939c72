/* planhist.c - paddock state at the plan start from records (see planhist.h).
 *
 * Carrying a walk record forward, day by day from the walk to the day
 * before the start (the record is the cover at the start of its day):
 *     x_{d+1} = (1 - s) x_d + s R + G_d - E_d / A
 * with s the sward's senescence per day (acting on the cover above the
 * residual R, as in planbuild.c), G_d the forecast growth of the
 * paddock that day (kg DM/ha/day; the week's mean rate of forecast.c), E_d
 * what the recorded mobs ate there that day (head x intake, kg DM) and A
 * its area; cover never below zero.  This is the daily form of the
 * planner's weekly balance (docs/planner.md, "bal").
 */
#include "planhist.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "forecast.h"
#include "tcal.h"

static int year_of(int64_t day)
{
    int y, m, d;
    tcal_civil(day, &y, &m, &d);
    return y;
}

static int md_of(int64_t day)
{
    int y, m, d;
    tcal_civil(day, &y, &m, &d);
    return m * 100 + d;
}

/* Growth of paddock i on day, kg DM/ha/day, from table f (built from f0):
 * the weather of those very days when the files have it (the season that
 * starts in f0's year, also when it runs over the new year), else the
 * percentile. */
static double growth_on(const fc_table *f, int64_t f0, int i, int64_t day, int percentile)
{
    int wk = (int)((day - f0) / 7);
    if (wk >= f->n_weeks)
        wk = f->n_weeks - 1;
    int y = year_of(f0);
    for (int k = 0; k < f->n_years; k++)
        if (f->years[k] == y)
            return f->rate[((size_t)i * f->n_weeks + wk) * f->n_years + k];
    return fc_rate_pct(f, i, wk, percentile);
}

/* Walk records carried forward: before the start, less than a year old
 * (the forecast that carries them is a season of at most a year). */
#define PH_CARRY_MAX_DAYS 365

static int carried(const rec_walk *r, int64_t start)
{
    return r && r->day < start && start - r->day <= PH_CARRY_MAX_DAYS;
}

/* The earliest walk record to carry. */
static int64_t earliest_carry(const site *s, const rec_walks *w, int64_t start)
{
    int64_t first = start;
    for (int i = 0; w && i < s->n_paddocks; i++) {
        const rec_walk *r = rec_walk_latest(w, i, start);
        if (carried(r, start) && r->day < first)
            first = r->day;
    }
    return first;
}

static void carry(const site *s, const rec_grazes *g, const fc_table *f, int64_t f0, int i,
                  int percentile, int64_t start, ph_paddock *q)
{
    const site_paddock *sp = &s->paddocks[i];
    const sward_params *sw = &s->swards[sp->sward].p;
    double sen = sw->senescence_per_day, x = q->walk_kgdm_ha;
    double residual = sward_cover_kgdm_ha(sw, s->rules.residual_height_cm);
    for (int64_t d = q->walk_day; d < start; d++) {
        double eaten = g ? rec_graze_intake_kgdm(s, g, i, d, d) : 0.0;
        x = (1.0 - sen) * x + sen * residual + growth_on(f, f0, i, d, percentile) - eaten / sp->area_ha;
        x = x > 0 ? x : 0.0;
        q->grazed_kgdm += eaten;
    }
    q->cover_kgdm_ha = x;
}

/* The forecast table for the days from *f0 to the day before start.
 * Seasons are month-days of every year, so 29 February cannot bound one:
 * start a day later, or end a day earlier (growth_on keeps the last
 * week's rate for the day left out).  *f0 gets the first day used;
 * RG_EXIT_OK with *f0 >= start (and no table) when there is nothing to
 * carry across (a record of 29 February, start 1 March). */
static int carry_table(const site *s, const wx_set *wx, int64_t *f0, int64_t start, fc_table *f,
                       rg_err *err)
{
    if (md_of(*f0) == 229)
        (*f0)++;
    if (*f0 >= start)
        return RG_EXIT_OK;
    int to_md = md_of(start - 1) == 229 ? 228 : md_of(start - 1);
    fc_season season = {md_of(*f0), to_md, 0};
    return fc_build(s, wx, &season, f, err);
}

/* Back to the default start for paddock i: its walk record of last year
 * is not carried (no weather runs over the new year to carry it). */
static void uncarry(const site *s, int i, ph_paddock *q)
{
    char a[11];
    tcal_format_date(q->walk_day, a);
    rg_warn("paddock %s: the walk record of %s is not carried forward (no weather file runs "
            "over the new year); its start cover is estimated", s->paddocks[i].id, a);
    q->source = PH_DEFAULT;
    q->walk_day = INT64_MIN;
    q->walk_kgdm_ha = -1;
    q->walk_method = -1;
    q->cover_kgdm_ha = -1;
}

/* The earliest carried walk left after uncarry(). */
static int64_t earliest_carry_in_year(const site *s, const ph_state *h, int64_t start)
{
    int64_t first = start;
    for (int i = 0; i < s->n_paddocks; i++)
        if (h->pd[i].source == PH_CARRIED && h->pd[i].walk_day < first)
            first = h->pd[i].walk_day;
    return first;
}

static void walk_state(const site *s, const rec_walks *w, int i, int64_t start, ph_paddock *q)
{
    const rec_walk *r = w ? rec_walk_latest(w, i, start) : NULL;
    if (!r)
        return;
    if (r->day < start && !carried(r, start)) {
        char a[11];
        tcal_format_date(r->day, a);
        rg_warn("paddock %s: the walk record of %s is more than a year old and is not carried "
                "forward; its start cover is estimated", s->paddocks[i].id, a);
        return;
    }
    q->walk_day = r->day;
    q->walk_kgdm_ha = r->cover_kgdm_ha;
    q->walk_method = r->method;
    q->source = r->day == start ? PH_MEASURED : PH_CARRIED;
    q->cover_kgdm_ha = r->cover_kgdm_ha;
}

int ph_build(const site *s, const wx_set *wx, const rec_walks *walks, const rec_grazes *grazes,
             int64_t start_day, int percentile, ph_state *out, rg_err *err)
{
    memset(out, 0, sizeof *out);
    out->n_paddocks = s->n_paddocks;
    out->start_day = start_day;
    out->pd = calloc((size_t)s->n_paddocks + 1, sizeof *out->pd);
    if (!out->pd)
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    for (int i = 0; i < s->n_paddocks; i++) {
        ph_paddock *q = &out->pd[i];
        *q = (ph_paddock){PH_DEFAULT, INT64_MIN, -1, -1, -1, 0, INT64_MIN, INT64_MIN};
        walk_state(s, walks, i, start_day, q);
        if (grazes) {
            q->last_grazed_day = rec_graze_last_day(grazes, i, start_day);
            if (q->last_grazed_day != INT64_MIN)
                q->may_graze_day = q->last_grazed_day + 1 + s->rules.min_rest_days;
        }
    }
    int64_t f0 = earliest_carry(s, walks, start_day);
    fc_table f;
    int rc = carry_table(s, wx, &f0, start_day, &f, err);
    if (rc == RG_EXIT_INPUT && year_of(f0) != year_of(start_day)) {
        /* no weather runs over the new year: last year's records cannot be
         * carried; their paddocks start from the default */
        for (int i = 0; i < s->n_paddocks; i++)
            if (out->pd[i].source == PH_CARRIED && year_of(out->pd[i].walk_day) != year_of(start_day))
                uncarry(s, i, &out->pd[i]);
        f0 = earliest_carry_in_year(s, out, start_day);
        rc = carry_table(s, wx, &f0, start_day, &f, err);
    }
    if (rc != RG_EXIT_OK || f0 >= start_day)
        return rc;
    for (int i = 0; i < s->n_paddocks; i++)
        if (out->pd[i].source == PH_CARRIED)
            carry(s, grazes, &f, f0, i, percentile, start_day, &out->pd[i]);
    fc_table_free(&f);
    return RG_EXIT_OK;
}

void ph_describe(const ph_state *h, int i, char *buf, size_t cap)
{
    const ph_paddock *q = &h->pd[i];
    char a[11];
    if (q->source == PH_DEFAULT) {
        snprintf(buf, cap, "no walk record (estimated)");
        return;
    }
    tcal_format_date(q->walk_day, a);
    if (q->source == PH_MEASURED)
        snprintf(buf, cap, "walk %s %s (measured)", a, rec_method_name(q->walk_method));
    else
        snprintf(buf, cap, "walk %s %s, +%d d (estimated)", a, rec_method_name(q->walk_method),
                 (int)(h->start_day - q->walk_day));
}

void ph_free(ph_state *h)
{
    if (!h)
        return;
    free(h->pd);
    memset(h, 0, sizeof *h);
}
