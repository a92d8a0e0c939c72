/* prevplan.h - an earlier plan read back from `rowgraze plan --format json`
 * (input stage).
 *
 * Re-planning (`plan --keep PREVIOUS.json --keep-weeks N`) holds the first
 * weeks of an earlier plan and explains what changed from it.  This module
 * reads the parts of that JSON file it needs: the start date, each week's
 * grazing (mob, paddock, days), mowing and supplement, and the cover the
 * earlier plan predicted for every paddock at the start of every week.  Ids
 * are kept as text: matching them to a site is the caller's job.
 */
#ifndef PREVPLAN_H
#define PREVPLAN_H

#include <stdint.h>

#include "diag.h"
#include "plan.h"

typedef struct pp_graze {
    int week;                        /* 0-based week of the earlier plan */
    char mob[PLAN_ID_LEN], paddock[PLAN_ID_LEN];
    int days;                        /* 1..7 */
} pp_graze;

typedef struct pp_paddock {
    char id[PLAN_ID_LEN];
    double *cover_kgdm_ha;           /* [weeks + 1], start of each week */
} pp_paddock;

typedef struct pp_plan {
    char path[256];
    int64_t start_day;               /* tcal day number of week 0's first day */
    int weeks;
    int n_grazes, n_paddocks, n_mows;
    pp_graze *grazes;
    pp_paddock *paddocks;
    pp_graze *mows;                  /* week and paddock of each mowing (mob, days unused) */
} pp_plan;

/* Reads path.  Returns 0, or -1 with one line in err naming the file and
 * the JSON path of what is wrong (*pl is then empty). */
int pp_load(const char *path, pp_plan *pl, rg_err *err);

/* The earlier plan's predicted cover of paddock id at the start of its
 * week w (0..weeks), kg DM/ha, or -1 when it has no such paddock or week. */
double pp_cover(const pp_plan *pl, const char *id, int w);

void pp_free(pp_plan *pl);

#endif
