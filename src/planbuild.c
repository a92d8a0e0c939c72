/* planbuild.c - site + growth forecast -> plan_problem (see planbuild.h).
 *
 * Conversions and defaults (docs/planner.md lists them too):
 *   covers: kg DM/ha by each sward's height-mass relation, then t DM/ha;
 *   start cover: the paddock's start_cover_kgdm_ha when given, else the
 *     residual plus a third of the way to the ceiling, a paddock part-way
 *     through regrowth (common practice, no source);
 *   growth: the forecast's chosen percentile for each plan week, t/ha/day,
 *     plus s R (below);
 *   senescence: the sward's senescence_per_day s, acting on the cover above
 *     the residual R only: the stubble below the grazing horizon is not
 *     lost within a season, its turnover being matched by its own regrowth
 *     (a modelling choice: common practice, no source).  Since
 *     s (x - R) = s x - s R, the planner's balance keeps its form
 *     (1 - 7 s) x + 7 G with s R added to G;
 *   open days: the longest run of days of the week outside maintenance
 *     windows, the keep-off period after them (herbicide, spray) and the
 *     rest after recorded grazing (a visit is one run of days; the calendar
 *     places it on free days by open_mask);
 *   cattle barred from paddocks under the array when the lowest panel edge
 *     is below rules.cattle_min_clearance_m;
 *   terminal cover: the area-weighted mean residual plus half the way to
 *     the lower of the mean start cover and the mean cover the farm would
 *     end with if nothing grazed it (mowed at the ceiling); when that is
 *     below the residual, that cover itself (a plan may use the standing
 *     feed it starts with, but not eat the farm bare on its last week; and
 *     it is not charged for what growth and senescence take anyway);
 *   terminal shortfall penalty: 1.5 times the supplement price per t DM
 *     (dearer than feeding supplement, so the plan keeps that cover unless
 *     grazing it early saves more than it costs at the end; common
 *     practice, no source).
 */
#include "planbuild.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "forecast.h"
#include "tcal.h"

/* Which days of week [d0, d0 + 7) paddock p is free of maintenance windows
 * (with their keep-off) and of the rest after recorded grazing (h): bit i
 * for day d0 + i. */
static unsigned open_mask(const site *s, const ph_state *h, int p, int64_t d0)
{
    unsigned mask = 0;
    for (int i = 0; i < 7; i++) {
        int64_t d = d0 + i;
        int closed = h && h->pd[p].may_graze_day != INT64_MIN && d < h->pd[p].may_graze_day;
        for (int k = 0; k < s->n_windows && !closed; k++) {
            const site_window *w = &s->windows[k];
            if (d < w->from_day || d > w->to_day + w->keep_off_days)
                continue;
            for (int j = 0; j < w->n_paddocks; j++)
                closed |= w->paddocks[j] == p;
        }
        mask |= (unsigned)!closed << i;
    }
    return mask;
}

/* The longest run of free days in a week's mask: what one visit may use. */
static int longest_run(unsigned mask)
{
    int best = 0, run = 0;
    for (int i = 0; i < 7; i++) {
        run = (mask >> i) & 1u ? run + 1 : 0;
        best = run > best ? run : best;
    }
    return best;
}

static void fill_paddock(const site *s, const ph_state *h, int i, plan_paddock *pd)
{
    const site_paddock *sp = &s->paddocks[i];
    const sward_params *sw = &s->swards[sp->sward].p;
    snprintf(pd->id, sizeof pd->id, "%s", sp->id);
    pd->area_ha = sp->area_ha;
    pd->residual_t_ha = sward_cover_kgdm_ha(sw, s->rules.residual_height_cm) / 1000.0;
    pd->ceiling_t_ha = sward_cover_kgdm_ha(sw, s->rules.ceiling_height_cm) / 1000.0;
    pd->cover0_t_ha = sp->start_cover_kgdm_ha >= 0
                          ? sp->start_cover_kgdm_ha / 1000.0
                          : pd->residual_t_ha + (pd->ceiling_t_ha - pd->residual_t_ha) / 3.0;
    if (h && h->pd[i].source != PH_DEFAULT)
        pd->cover0_t_ha = h->pd[i].cover_kgdm_ha / 1000.0;
    pd->senescence_per_day = sw->senescence_per_day;
    pd->cattle_barred = sp->array_share > 0 &&
                        site_lowest_edge_m(&s->array) < s->rules.cattle_min_clearance_m;
}

/* Sum over paddocks of A_p x_pT if nothing grazed (the balance row with no
 * intake, mowed back to the residual when it would pass the ceiling), t DM. */
static double ungrazed_end(const plan_problem *pb)
{
    double total = 0;
    for (int p = 0; p < pb->n_paddocks; p++) {
        const plan_paddock *q = &pb->pd[p];
        double x = q->cover0_t_ha;
        for (int t = 0; t < pb->n_weeks; t++) {
            x = (1.0 - 7.0 * q->senescence_per_day) * x + 7.0 * pb->growth_t_ha_d[(size_t)p * pb->n_weeks + t];
            x = x > q->ceiling_t_ha ? q->residual_t_ha : x;
        }
        total += q->area_ha * x;
    }
    return total;
}

static void fill_rules(const site *s, plan_problem *pb)
{
    const site_rules *r = &s->rules;
    pb->rest_weeks = (r->min_rest_days + 6) / 7;
    pb->spell_weeks = (r->max_days_per_visit + 6) / 7;
    pb->max_days_per_visit = r->max_days_per_visit;
    pb->max_paddocks_per_week = r->max_paddocks_per_week;
    pb->share_paddocks = r->share_paddocks;
    pb->max_head_per_ha = r->max_head_per_ha;
    pb->cost_supplement_per_t = s->costs.supplement_per_t_dm;
    pb->cost_mowing_per_ha = s->costs.mowing_per_ha;
    pb->cost_per_move = s->costs.per_move;
    pb->penalty_terminal_per_t = 1.5 * s->costs.supplement_per_t_dm;
}

static int alloc_problem(const site *s, int weeks, plan_problem *pb)
{
    memset(pb, 0, sizeof *pb);
    pb->n_paddocks = s->n_paddocks;
    pb->n_mobs = s->n_mobs;
    pb->n_weeks = weeks;
    size_t cells = (size_t)s->n_paddocks * (size_t)weeks;
    pb->pd = calloc((size_t)s->n_paddocks, sizeof *pb->pd);
    pb->mob = calloc((size_t)s->n_mobs, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc(cells, sizeof *pb->growth_t_ha_d);
    pb->open_days = calloc(cells, sizeof *pb->open_days);
    pb->open_mask = calloc(cells, sizeof *pb->open_mask);
    if (pb->pd && pb->mob && pb->growth_t_ha_d && pb->open_days && pb->open_mask)
        return 0;
    plan_problem_free(pb);
    return -1;
}

int plan_build(const site *s, const wx_set *wx, int64_t start_day, int weeks, int percentile,
               plan_problem *pb, rg_err *err)
{
    return plan_build_from(s, wx, NULL, start_day, weeks, percentile, pb, err);
}

int plan_build_from(const site *s, const wx_set *wx, const ph_state *h, int64_t start_day, int weeks,
                    int percentile, plan_problem *pb, rg_err *err)
{
    int y0, m0, dd0, y1, m1, dd1;
    tcal_civil(start_day, &y0, &m0, &dd0);
    tcal_civil(start_day + 7 * (int64_t)weeks - 1, &y1, &m1, &dd1);
    if (y1 > y0 + 1 || (y1 == y0 + 1 && m1 * 100 + dd1 >= m0 * 100 + dd0))
        return rg_fail(err, "%s: the plan's %d weeks from %04d-%02d-%02d run to %04d-%02d-%02d; a plan covers at most one year (the growth forecast is a season of the year)",
                       s->path, weeks, y0, m0, dd0, y1, m1, dd1), RG_EXIT_INPUT;
    if ((m0 == 2 && dd0 == 29) || (m1 == 2 && dd1 == 29))
        return rg_fail(err, "%s: the plan may not start or end on 29 February", s->path), RG_EXIT_INPUT;
    fc_season season = {m0 * 100 + dd0, m1 * 100 + dd1, 0};
    fc_table f;
    int rc = fc_build(s, wx, &season, &f, err);
    if (rc != RG_EXIT_OK)
        return rc;
    if (alloc_problem(s, weeks, pb) < 0) {
        fc_table_free(&f);
        return rg_fail(err, "out of memory"), RG_EXIT_RUNTIME;
    }
    pb->start_day = start_day;
    double area = 0, cover = 0, residual = 0;
    for (int i = 0; i < s->n_paddocks; i++) {
        fill_paddock(s, h, i, &pb->pd[i]);
        area += pb->pd[i].area_ha;
        cover += pb->pd[i].area_ha * pb->pd[i].cover0_t_ha;
        residual += pb->pd[i].area_ha * pb->pd[i].residual_t_ha;
        for (int t = 0; t < weeks; t++) {
            /* senescence acts on the cover above the residual: s (x - R)
             * = s x - s R, so the balance keeps its form with s R in G */
            pb->growth_t_ha_d[(size_t)i * weeks + t] =
                fc_rate_pct(&f, i, t, percentile) / 1000.0 +
                pb->pd[i].senescence_per_day * pb->pd[i].residual_t_ha;
            unsigned mask = open_mask(s, h, i, start_day + 7 * t);
            pb->open_mask[(size_t)i * weeks + t] = (unsigned char)mask;
            pb->open_days[(size_t)i * weeks + t] = longest_run(mask);
        }
    }
    for (int m = 0; m < s->n_mobs; m++) {
        plan_mob *pm = &pb->mob[m];
        snprintf(pm->id, sizeof pm->id, "%s", s->mobs[m].id);
        pm->head = s->mobs[m].head;
        pm->is_cattle = s->mobs[m].species == SPECIES_CATTLE;
        pm->demand_t_d = s->mobs[m].head * s->mobs[m].intake_kgdm_d / 1000.0;
    }
    fill_rules(s, pb);
    double base = cover < ungrazed_end(pb) ? cover : ungrazed_end(pb);
    pb->terminal_t_ha = (base <= residual ? base : residual + 0.5 * (base - residual)) / area;
    fc_table_free(&f);
    return RG_EXIT_OK;
}
