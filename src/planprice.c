/* planprice.c - exact pricing of one paddock's trajectories (plan stage;
 * see planprice.h and docs/decomposition.md, "Pricing").
 *
 * Pricing is a dynamic program over the weeks whose value functions are
 * exact functions of the cover (docs/decomposition.md, "Pricing"): for
 * week t and rule state s (grazed last week: run length and which mobs;
 * else weeks since the last grazing, capped), f_ts(x) is the least priced
 * cost of weeks t..T-1 from cover x.  A week's decision (days of each
 * mob, mowing) maps x to the next cover affinely and is allowed on an
 * interval of x, so every f_ts is piecewise linear in x and is kept as
 * such, with no discretisation; the only slack is DP_EPS t DM/ha on each
 * cover row (a relaxation: the minimum can only fall, the bound stays
 * valid).
 *
 * Layout: pieces and piecewise-linear functions (pw, pwf: push, evaluate,
 * pointwise minimum); rule states (spell run and mobs of last week, or
 * weeks since the last grazing); each week's decisions (days per mob,
 * checked against use, cattle, one, visit, dens); the backward pass
 * (dp_week) and the forward pass that reads the trajectory (dp_choose);
 * the interface. */

#include "planprice.h"

#include "planverify.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#define DP_EPS 1e-9   /* t DM/ha of slack on the cover rows (verifier: 1e-6) */
#define DP_COVER 1e-10 /* a point this close to a piece counts as on it */

typedef struct pw {
    double lo, hi, s, c;  /* s x + c on [lo, hi] */
} pw;

typedef struct pwf {
    int n, cap;
    pw *v;                /* sorted, disjoint but for shared end points */
} pwf;

/* One week's decision: days of each mob, which mobs, what they eat. */
typedef struct prc_dec {
    int mask;             /* mobs present (bit m) */
    double eat_t;         /* sum_m I_m d_m, t DM */
    int first;            /* days[first .. first + M - 1] in prc_pricer.days */
} prc_dec;

struct prc_pricer {
    const plan_problem *pb;
    int p, M, T, S, Jc, nsets, nstates;
    int *ndec, *dec0;     /* [t]: decisions of week t at dec[dec0[t] ...] */
    prc_dec *dec;
    int *days;
    int ndecs, ndays;
    pwf *f;               /* [t * nstates + s], t = 0..T */
    pwf tmp, acc;
    double xmax;
    const int *cap_d;     /* [m * T + t] or NULL: days a decision may give a mob */
    const unsigned char *cap_y; /* [m * T + t] or NULL: 0 bars the mob that week */
    const prc_box *box;   /* branching rules (days in [lo, hi], mowing), or NULL */
};

/* 1 when decision dc of week t keeps the caps (diving) and the box
 * (branching), always without either. */
static int dec_ok(const prc_pricer *pr, int t, const prc_dec *dc)
{
    for (int m = 0; m < pr->M && pr->cap_d; m++) {
        int d = pr->days[dc->first + m];
        if (d > 0 && (d > pr->cap_d[m * pr->T + t] || !pr->cap_y[m * pr->T + t]))
            return 0;
    }
    for (int m = 0; m < pr->M && pr->box; m++) {
        int d = pr->days[dc->first + m], i = m * pr->T + t;
        if (d < pr->box->lo[i] || d > pr->box->hi[i])
            return 0;
    }
    return 1;
}

/* 1 when mowing (w = 1) or not (w = 0) at the end of week t keeps the box. */
static int mow_ok(const prc_pricer *pr, int t, int w)
{
    return !pr->box || pr->box->mow[t] < 0 || pr->box->mow[t] == w;
}

static int pwf_push(pwf *f, double lo, double hi, double s, double c)
{
    if (!(hi >= lo))
        return 0;
    if (f->n > 0) {
        pw *l = &f->v[f->n - 1];
        if (l->s == s && l->c == c && lo <= l->hi) {
            l->hi = fmax(l->hi, hi);
            return 0;
        }
    }
    if (f->n == f->cap) {
        int cap = f->cap ? 2 * f->cap : 16;
        pw *v = realloc(f->v, (size_t)cap * sizeof *v);
        if (!v)
            return -1;
        f->v = v;
        f->cap = cap;
    }
    f->v[f->n++] = (pw){lo, hi, s, c};
    return 0;
}

/* Least value of f at x (+inf where f is not defined). */
static double pwf_eval(const pwf *f, double x)
{
    double best = HUGE_VAL;
    for (int i = 0; i < f->n; i++) {
        const pw *q = &f->v[i];
        if (q->lo > x + DP_COVER)
            break;
        if (x <= q->hi + DP_COVER)
            best = fmin(best, q->s * x + q->c);
    }
    return best;
}

static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return x < y ? -1 : x > y;
}

/* The piece of f covering [u, v] (pointer *i advanced), or NULL. */
static const pw *pwf_at(const pwf *f, int *i, double mid)
{
    while (*i < f->n && f->v[*i].hi < mid)
        (*i)++;
    return *i < f->n && f->v[*i].lo <= mid ? &f->v[*i] : NULL;
}

/* out = min(f, g), pointwise (out distinct from both). */
static int pwf_min(const pwf *f, const pwf *g, pwf *out, double *scratch)
{
    int nb = 0, i = 0, j = 0, ia = 0, ib = 0, na = 2 * f->n, ng = 2 * g->n;
    /* the end points of each function are in order already: merge them */
    while (ia < na || ib < ng) {
        double u = ia < na ? (ia & 1 ? f->v[ia >> 1].hi : f->v[ia >> 1].lo) : HUGE_VAL;
        double v = ib < ng ? (ib & 1 ? g->v[ib >> 1].hi : g->v[ib >> 1].lo) : HUGE_VAL;
        if (u <= v)
            scratch[nb++] = u, ia++;
        else
            scratch[nb++] = v, ib++;
    }
    for (int k = 1; k < nb; k++) /* keeps the order should pieces ever overlap */
        if (scratch[k] < scratch[k - 1]) {
            qsort(scratch, (size_t)nb, sizeof *scratch, cmp_double);
            break;
        }
    out->n = 0;
    for (int k = 0; k + 1 < nb; k++) {
        double u = scratch[k], v = scratch[k + 1], mid = 0.5 * (u + v);
        if (!(v > u))
            continue;
        const pw *a = pwf_at(f, &i, mid), *b = pwf_at(g, &j, mid);
        if (!a || !b) {
            const pw *q = a ? a : b;
            if (q && pwf_push(out, u, v, q->s, q->c) != 0)
                return -1;
            continue;
        }
        double du = (a->s - b->s) * u + (a->c - b->c), dv = (a->s - b->s) * v + (a->c - b->c);
        const pw *lo_u = du <= 0 ? a : b, *lo_v = dv <= 0 ? a : b;
        if (lo_u == lo_v) {
            if (pwf_push(out, u, v, lo_u->s, lo_u->c) != 0)
                return -1;
            continue;
        }
        double xs = u + (v - u) * du / (du - dv);
        if (pwf_push(out, u, xs, lo_u->s, lo_u->c) != 0 || pwf_push(out, xs, v, lo_v->s, lo_v->c) != 0)
            return -1;
    }
    return 0;
}

/* acc = min(acc, g) through pr->tmp. */
static int pwf_min_into(prc_pricer *pr, pwf *acc, const pwf *g)
{
    if (g->n == 0)
        return 0;
    if (acc->n == 0) {
        for (int k = 0; k < g->n; k++)
            if (pwf_push(acc, g->v[k].lo, g->v[k].hi, g->v[k].s, g->v[k].c) != 0)
                return -1;
        return 0;
    }
    double *scratch = malloc((size_t)(2 * (acc->n + g->n)) * sizeof *scratch);
    if (!scratch)
        return -1;
    int rc = pwf_min(acc, g, &pr->tmp, scratch);
    free(scratch);
    pwf t = *acc;
    *acc = pr->tmp;
    pr->tmp = t;
    return rc;
}

/* ---- rule states */

/* Set index of a mob mask: the mask less one with sharing, else the mob. */
static int set_of(const prc_pricer *pr, int mask)
{
    if (pr->pb->share_paddocks)
        return mask - 1;
    int m = 0;
    while (!(mask & (1 << m)))
        m++;
    return m;
}

static int mask_of(const prc_pricer *pr, int set)
{
    return pr->pb->share_paddocks ? set + 1 : 1 << set;
}

/* State after a week with mobs `mask` (0: not grazed) from state s; -1
 * when spell or rest forbids it.  *prev receives the mobs of the week
 * before (for moves). */
static int next_state(const prc_pricer *pr, int s, int mask, int *prev)
{
    int idle = s < pr->Jc - 1;
    int j = idle ? s + 2 : 0, r = idle ? 0 : (s - (pr->Jc - 1)) / pr->nsets + 1;
    *prev = idle ? 0 : mask_of(pr, (s - (pr->Jc - 1)) % pr->nsets);
    if (mask == 0)
        return idle ? (j + 1 < pr->Jc ? j + 1 : pr->Jc) - 2 : 0;
    if (idle ? j < pr->Jc || pr->S < 1 : r + 1 > pr->S)
        return -1;
    return (pr->Jc - 1) + r * pr->nsets + set_of(pr, mask);
}

/* ---- decisions */

static int dec_push(prc_pricer *pr, int t, const int *d)
{
    const plan_problem *pb = pr->pb;
    int mask = 0, n = 0, sum = 0;
    double head = 0, eat = 0;
    for (int m = 0; m < pr->M; m++)
        if (d[m] > 0) {
            mask |= 1 << m, n++, sum += d[m];
            head += pb->mob[m].head;
            eat += pb->mob[m].demand_t_d * d[m];
        }
    for (int m = 0; m < pr->M && t < pb->fixed_weeks; m++)
        if (d[m] != pb->fixed_days[((size_t)m * pb->n_paddocks + (size_t)pr->p) * pb->n_weeks + t])
            return 0; /* a kept week (plan.h fixed_days): its days only */
    if ((!pb->share_paddocks && n > 1) || sum > plan_days_max(pb) ||
        (n > 0 && pb->max_head_per_ha > 0 && head > pb->max_head_per_ha * pb->pd[pr->p].area_ha + 1e-9))
        return 0;
    int *days = realloc(pr->days, (size_t)(pr->ndays + pr->M + 1) * sizeof *days);
    prc_dec *dec = realloc(pr->dec, (size_t)(pr->ndecs + 1) * sizeof *dec);
    if (days)
        pr->days = days;
    if (dec)
        pr->dec = dec;
    if (!days || !dec)
        return -1;
    memcpy(pr->days + pr->ndays, d, (size_t)pr->M * sizeof *d);
    pr->dec[pr->ndecs++] = (prc_dec){mask, eat, pr->ndays};
    pr->ndays += pr->M;
    pr->ndec[t]++;
    return 0;
}

/* Every days vector of week t (odometer over mobs, each 0..its cap). */
static int dec_week(prc_pricer *pr, int t)
{
    int d[32] = {0};
    pr->dec0[t] = pr->ndecs;
    for (;;) {
        if (dec_push(pr, t, d) != 0)
            return -1;
        int m = 0;
        while (m < pr->M && d[m] == plan_day_cap(pr->pb, m, pr->p, t))
            d[m++] = 0;
        if (m == pr->M)
            return 0;
        d[m]++;
    }
}

static void pricer_release(prc_pricer *pr)
{
    if (pr->f)
        for (int i = 0; i < (pr->T + 1) * pr->nstates; i++)
            free(pr->f[i].v);
    free(pr->f);
    free(pr->ndec);
    free(pr->dec0);
    free(pr->dec);
    free(pr->days);
    free(pr->tmp.v);
    free(pr->acc.v);
    memset(pr, 0, sizeof *pr);
}

/* Paddock p's decisions and value functions (no prices yet).  Returns 0,
 * or -1 (no memory, or too many mobs to share a paddock: 2^M states). */
static int pricer_build(prc_pricer *pr, const plan_problem *pb, int p)
{
    pr->pb = pb;
    pr->p = p;
    pr->M = pb->n_mobs;
    pr->T = pb->n_weeks;
    pr->S = pb->spell_weeks;
    pr->Jc = pb->rest_weeks + 1 > 2 ? pb->rest_weeks + 1 : 2;
    if (pr->M > 30 || (pb->share_paddocks && pr->M > 10))
        return -1;
    pr->nsets = pb->share_paddocks ? (1 << pr->M) - 1 : pr->M;
    pr->nstates = (pr->Jc - 1) + pr->S * pr->nsets;
    pr->ndec = calloc((size_t)pr->T, sizeof *pr->ndec);
    pr->dec0 = calloc((size_t)pr->T, sizeof *pr->dec0);
    pr->f = calloc((size_t)(pr->T + 1) * (size_t)pr->nstates, sizeof *pr->f);
    if (!pr->ndec || !pr->dec0 || !pr->f)
        return pricer_release(pr), -1;
    for (int t = 0; t < pr->T; t++)
        if (dec_week(pr, t) != 0)
            return pricer_release(pr), -1;
    const plan_paddock *q = &pb->pd[p];
    double g = 0;
    for (int t = 0; t < pr->T; t++)
        g = fmax(g, pb->growth_t_ha_d[p * pr->T + t]);
    pr->xmax = fmax(q->cover0_t_ha, q->ceiling_t_ha) + 7.0 * g + 1.0;
    return 0;
}

/* The x-interval on which decision dc (mowed or not) keeps week t's cover
 * rows (x' = a x + c before mowing): [*lo, *hi] in x, or 0 when empty. */
static int dec_interval(const prc_pricer *pr, const prc_dec *dc, int mow, double a, double c,
                        double *lo, double *hi)
{
    const plan_paddock *q = &pr->pb->pd[pr->p];
    double ylo = mow || dc->mask ? q->residual_t_ha - DP_EPS : -DP_EPS;
    double yhi = mow ? HUGE_VAL : q->ceiling_t_ha + DP_EPS;
    if (a > 1e-12) {
        *lo = fmax(-DP_EPS, (ylo - c) / a);
        *hi = fmin(pr->xmax, (yhi - c) / a);
    } else {
        *lo = -DP_EPS;
        *hi = c >= ylo && c <= yhi ? pr->xmax : -HUGE_VAL;
    }
    return *hi >= *lo;
}

/* Priced cost of decision dc (and mowing) from a week with mobs prev. */
static double dec_cost(const prc_pricer *pr, const prc_duals *du, int t, const prc_dec *dc,
                       int mow, int prev)
{
    const plan_problem *pb = pr->pb;
    double z = mow ? pb->cost_mowing_per_ha * pb->pd[pr->p].area_ha : 0.0;
    for (int m = 0; m < pr->M; m++) {
        int d = pr->days[dc->first + m];
        if (d == 0)
            continue;
        z -= du->day[m * pr->T + t] * d + du->use[m * pr->T + t];
        for (int r = 0; r < du->n_step; r++)
            z -= d >= du->step_min[r] ? du->step[(r * pr->M + m) * pr->T + t] : 0.0;
        z += prev & (1 << m) ? 0.0 : pb->cost_per_move - (du->move ? du->move[m] : 0.0);
    }
    return z;
}

/* g := the function x -> k + f(x') on decision dc's interval (x' the
 * cover after the week, R when mowed). */
static int dec_image(const prc_pricer *pr, const pwf *f, const prc_dec *dc, int mow, double a,
                     double c, double k, pwf *g)
{
    double lo, hi;
    g->n = 0;
    if (!dec_interval(pr, dc, mow, a, c, &lo, &hi))
        return 0;
    if (mow || a <= 1e-12) {
        double y = mow ? pr->pb->pd[pr->p].residual_t_ha : c, v = pwf_eval(f, y);
        return v < HUGE_VAL ? pwf_push(g, lo, hi, 0.0, v + k) : 0;
    }
    for (int i = 0; i < f->n; i++) {
        const pw *q = &f->v[i];
        double l = fmax(lo, (q->lo - c) / a), h = fmin(hi, (q->hi - c) / a);
        if (h >= l && pwf_push(g, l, h, q->s * a, q->s * c + q->c + k) != 0)
            return -1;
    }
    return 0;
}

/* a and c of week t: x' = a x + c - eat / A. */
static void week_affine(const prc_pricer *pr, int t, double *a, double *c)
{
    const plan_paddock *q = &pr->pb->pd[pr->p];
    *a = 1.0 - 7.0 * q->senescence_per_day;
    *c = 7.0 * pr->pb->growth_t_ha_d[pr->p * pr->T + t];
}

/* f_ts from f_t+1 for every state s. */
static int dp_week(prc_pricer *pr, const prc_duals *du, int t, pwf *img)
{
    double a, c0;
    week_affine(pr, t, &a, &c0);
    double area = pr->pb->pd[pr->p].area_ha;
    for (int s = 0; s < pr->nstates; s++) {
        pwf *acc = &pr->f[t * pr->nstates + s];
        acc->n = 0;
        for (int k = 0; k < pr->ndec[t]; k++) {
            const prc_dec *dc = &pr->dec[pr->dec0[t] + k];
            int prev, s1 = next_state(pr, s, dc->mask, &prev);
            if (s1 < 0 || !dec_ok(pr, t, dc))
                continue;
            const pwf *f1 = &pr->f[(t + 1) * pr->nstates + s1];
            for (int mow = 0; mow < 2; mow++) {
                if (!mow_ok(pr, t, mow))
                    continue;
                double cost = dec_cost(pr, du, t, dc, mow, prev);
                if (dec_image(pr, f1, dc, mow, a, c0 - dc->eat_t / area, cost, img) != 0 ||
                    pwf_min_into(pr, acc, img) != 0)
                    return -1;
            }
        }
    }
    return 0;
}

/* The cheapest decision from (t, s, x): its index, mowing and next cover
 * and state; returns its value (cost plus f_t+1), +inf when none. */
static double dp_choose(const prc_pricer *pr, const prc_duals *du, int t, int s, double x,
                        int *best_k, int *best_mow, double *x1, int *s1)
{
    double a, c0, best = HUGE_VAL;
    week_affine(pr, t, &a, &c0);
    const plan_paddock *q = &pr->pb->pd[pr->p];
    for (int k = 0; k < pr->ndec[t]; k++) {
        const prc_dec *dc = &pr->dec[pr->dec0[t] + k];
        int prev, sn = next_state(pr, s, dc->mask, &prev);
        if (sn < 0 || !dec_ok(pr, t, dc))
            continue;
        double y = a * x + c0 - dc->eat_t / q->area_ha;
        for (int mow = 0; mow < 2; mow++) {
            double lo, hi;
            if (!mow_ok(pr, t, mow) || !dec_interval(pr, dc, mow, a, c0 - dc->eat_t / q->area_ha, &lo, &hi) ||
                x < lo - DP_COVER || x > hi + DP_COVER)
                continue;
            double xe = mow ? q->residual_t_ha : y;
            double v = dec_cost(pr, du, t, dc, mow, prev) + pwf_eval(&pr->f[(t + 1) * pr->nstates + sn], xe);
            if (v < best) {
                best = v, *best_k = k, *best_mow = mow, *x1 = xe, *s1 = sn;
            }
        }
    }
    return best;
}

/* prc_solve and prc_solve_box: 0, 1 when no trajectory keeps the caps and
 * the box, -1 on bad arguments or no memory. */
static int solve(prc_pricer *pr, const prc_duals *du, const int *cap_d, const unsigned char *cap_y,
                 const prc_box *box, double *value, double *bound, int *days, unsigned char *mow)
{
    pr->cap_d = cap_d;
    pr->cap_y = cap_d ? cap_y : NULL;
    pr->box = box;
    if ((cap_d && !cap_y) || (box && (!box->lo || !box->hi || !box->mow)))
        return -1;
    double area = pr->pb->pd[pr->p].area_ha;
    for (int s = 0; s < pr->nstates; s++) {
        pwf *f = &pr->f[pr->T * pr->nstates + s];
        f->n = 0;
        if (pwf_push(f, -DP_EPS, pr->xmax, -du->end * area, 0.0) != 0)
            return -1;
    }
    for (int t = pr->T - 1; t >= 0; t--)
        if (dp_week(pr, du, t, &pr->acc) != 0)
            return -1;
    int s = pr->Jc - 2; /* never grazed: the capped rest state */
    double x = pr->pb->pd[pr->p].cover0_t_ha;
    double best = pwf_eval(&pr->f[s], x), z = 0;
    if (!(best < HUGE_VAL))
        return 1; /* only with caps or a box: the idle trajectory is always there */
    for (int t = 0; t < pr->T; t++) {
        int k = 0, w = 0, sn = s;
        double x1 = x, v = dp_choose(pr, du, t, s, x, &k, &w, &x1, &sn);
        if (!(v < HUGE_VAL))
            return -1; /* cannot happen: f_0 is finite at x */
        const prc_dec *dc = &pr->dec[pr->dec0[t] + k];
        int prev;
        next_state(pr, s, dc->mask, &prev);
        z += dec_cost(pr, du, t, dc, w, prev);
        for (int m = 0; m < pr->M && days; m++)
            days[m * pr->T + t] = pr->days[dc->first + m];
        if (mow)
            mow[t] = (unsigned char)w;
        x = x1, s = sn;
    }
    *value = z - du->end * area * x;
    *bound = fmin(best, *value) - 1e-9 * fmax(1.0, fabs(best));
    return 0;
}

int prc_solve(prc_pricer *pr, const prc_duals *du, const int *cap_d, const unsigned char *cap_y,
             double *value, double *bound, int *days, unsigned char *mow)
{
    int rc = solve(pr, du, cap_d, cap_y, NULL, value, bound, days, mow);
    return rc == 0 ? 0 : -1;
}

int prc_solve_box(prc_pricer *pr, const prc_duals *du, const prc_box *box, double *value,
                  double *bound, int *days, unsigned char *mow)
{
    return solve(pr, du, NULL, NULL, box, value, bound, days, mow);
}


prc_pricer *prc_new(const plan_problem *pb, int p)
{
    if (!pv_problem_valid(pb) || p < 0 || p >= pb->n_paddocks)
        return NULL;
    prc_pricer *pr = calloc(1, sizeof *pr);
    if (!pr || pricer_build(pr, pb, p) != 0) {
        free(pr);
        return NULL;
    }
    return pr;
}

void prc_free(prc_pricer *pr)
{
    if (!pr)
        return;
    pricer_release(pr);
    free(pr);
}

int prc_price(const plan_problem *pb, int p, const prc_duals *du, double *value, double *bound,
             int *days, unsigned char *mow)
{
    if (!du || !value || !bound || (pb && pb->n_mobs > 0 && (!du->day || !du->use)))
        return -1;
    prc_pricer *pr = prc_new(pb, p);
    if (!pr)
        return -1;
    int rc = prc_solve(pr, du, NULL, NULL, value, bound, days, mow);
    prc_free(pr);
    return rc;
}
