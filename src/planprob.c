/* planprob.c - the planning problem's storage (plan stage).
 * See plan.h; the problem's construction from a site and a growth
 * forecast lives in planbuild.c. */
#include "plan.h"

#include <stdlib.h>
#include <string.h>

int plan_alloc(const plan_problem *pb, plan *pl)
{
    memset(pl, 0, sizeof *pl);
    pl->n_paddocks = pb->n_paddocks;
    pl->n_mobs = pb->n_mobs;
    pl->n_weeks = pb->n_weeks;
    size_t cells = (size_t)pb->n_paddocks * (size_t)pb->n_weeks;
    pl->days = calloc(cells * (size_t)pb->n_mobs + 1, sizeof *pl->days);
    pl->mow = calloc(cells + 1, sizeof *pl->mow);
    pl->supplement_t = calloc((size_t)pb->n_mobs * (size_t)pb->n_weeks + 1, sizeof *pl->supplement_t);
    if (pl->days && pl->mow && pl->supplement_t)
        return 0;
    plan_free(pl);
    return -1;
}

void plan_free(plan *pl)
{
    free(pl->days);
    free(pl->mow);
    free(pl->supplement_t);
    memset(pl, 0, sizeof *pl);
}

void plan_problem_free(plan_problem *pb)
{
    free(pb->pd);
    free(pb->mob);
    free(pb->growth_t_ha_d);
    free(pb->open_days);
    free(pb->fixed_days);
    free(pb->open_mask);
    memset(pb, 0, sizeof *pb);
}

/* Copies n elements of size sz from a into a new block at *b (NULL stays NULL). */
static int dup_array(const void *a, size_t n, size_t sz, void **b)
{
    *b = NULL;
    if (!a)
        return 0;
    *b = malloc(n * sz + 1);
    if (!*b)
        return -1;
    memcpy(*b, a, n * sz);
    return 0;
}

int plan_problem_copy(const plan_problem *a, plan_problem *b)
{
    *b = *a;
    size_t P = (size_t)a->n_paddocks, M = (size_t)a->n_mobs, T = (size_t)a->n_weeks;
    void *pd, *mob, *g, *od, *om, *fx;
    int bad = dup_array(a->pd, P, sizeof *a->pd, &pd) | dup_array(a->mob, M, sizeof *a->mob, &mob) |
              dup_array(a->growth_t_ha_d, P * T, sizeof *a->growth_t_ha_d, &g) |
              dup_array(a->open_days, P * T, sizeof *a->open_days, &od) |
              dup_array(a->open_mask, P * T, sizeof *a->open_mask, &om) |
              dup_array(a->fixed_days, M * P * T, sizeof *a->fixed_days, &fx);
    b->pd = pd;
    b->mob = mob;
    b->growth_t_ha_d = g;
    b->open_days = od;
    b->open_mask = om;
    b->fixed_days = fx;
    if (bad) {
        plan_problem_free(b);
        return -1;
    }
    return 0;
}
