/* planhist.h - each paddock's state at the plan start, from the farm's
 * records (plan stage, before planbuild.c).
 *
 * A grazier re-plans from what the pasture walk measured and where the
 * mobs actually went (records.h).  For every paddock this module works out
 *   - its cover on the plan's first day: the latest walk record on or
 *     before that day, carried forward to it by simulating growth (the
 *     growth forecast of forecast.c: the weather of that year where the
 *     weather files have it, else the chosen percentile) and the recorded
 *     grazing since; a paddock with no record keeps the site's default and
 *     is marked estimated;
 *   - the first day it may be grazed again: the day after its last
 *     recorded grazing day plus the minimum rest, so the rest rule holds
 *     across the boundary between the records and the plan.
 */
#ifndef PLANHIST_H
#define PLANHIST_H

#include <stdint.h>

#include "diag.h"
#include "records.h"
#include "site.h"
#include "weather.h"

enum ph_source {
    PH_DEFAULT,   /* no walk record: the site's start cover or its default (estimated) */
    PH_MEASURED,  /* measured on the plan's first day */
    PH_CARRIED    /* measured earlier, carried forward (estimated) */
};

typedef struct ph_paddock {
    int source;              /* enum ph_source */
    int64_t walk_day;        /* day of the walk record used, or INT64_MIN */
    double walk_kgdm_ha;     /* its cover, kg DM/ha, or -1 */
    int walk_method;         /* enum rec_method, or -1 */
    double cover_kgdm_ha;    /* on the plan's first day, or -1 for PH_DEFAULT */
    double grazed_kgdm;      /* eaten by recorded grazing since the walk, kg DM */
    int64_t last_grazed_day; /* last recorded grazing day before the start, or INT64_MIN */
    int64_t may_graze_day;   /* first day the rest allows grazing, or INT64_MIN */
} ph_paddock;

typedef struct ph_state {
    int n_paddocks;
    int64_t start_day;
    ph_paddock *pd;          /* [n_paddocks] */
} ph_state;

/* Works out every paddock's state on start_day.  walks and grazes may each
 * be NULL.  Walk records from an earlier calendar year than the start are
 * not carried (the forecast runs year by year): the paddock is marked
 * PH_DEFAULT with a warning.  Returns RG_EXIT_OK, or RG_EXIT_INPUT /
 * RG_EXIT_RUNTIME with a message (the weather does not cover the days
 * between a record and the start, out of memory). */
int ph_build(const site *s, const wx_set *wx, const rec_walks *walks, const rec_grazes *grazes,
             int64_t start_day, int percentile, ph_state *out, rg_err *err);

/* "walk 2024-05-28 plate (measured)", "walk 2024-05-20 stick, +9 d
 * (estimated)", "no walk record (estimated)": how paddock i's start cover
 * was found. */
void ph_describe(const ph_state *h, int i, char *buf, size_t cap);

void ph_free(ph_state *h);

#endif
