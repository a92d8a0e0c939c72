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
