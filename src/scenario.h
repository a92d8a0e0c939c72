/* scenario.h - one setting of a site changed: "mobs.ewes.head=300"
 * (input stage, for `rowgraze compare`).
 *
 * A setting names a value of the loaded site by a dotted path and gives it
 * a new value, checked against the same ranges the site file's reader
 * (site.c) applies.  The paths (docs/compare.md lists them):
 *   mobs.ID.head | liveweight_kg | intake_pct_lw | intake_kgdm_d
 *   paddocks.ID.area_ha | start_cover_kgdm_ha
 *   rules.residual_height_cm | min_rest_days | max_days_per_visit |
 *         ceiling_height_cm | max_paddocks_per_week | max_head_per_ha |
 *         share_paddocks
 *   costs.supplement_per_t_dm | mowing_per_ha | per_move
 *   plan.start | weeks | percentile
 * An axis is one path with several values, "PATH=V1,V2,...".  Only scalar
 * fields of the site change, so a scn_saved copy of them undoes a scenario.
 */
#ifndef SCENARIO_H
#define SCENARIO_H

#include "diag.h"
#include "site.h"

#define SCN_PATH_LEN 128
#define SCN_VALUE_LEN 64
#define SCN_MAX_VALUES 32

/* One --set argument: a path and the values it takes. */
typedef struct scn_axis {
    char path[SCN_PATH_LEN];
    int n_values;
    char values[SCN_MAX_VALUES][SCN_VALUE_LEN];
} scn_axis;

/* Reads "PATH=V1,V2,..." (1 to SCN_MAX_VALUES values, none empty) into
 * *ax.  Returns 0, or -1 with one line in err. */
int scn_parse_axis(const char *arg, scn_axis *ax, rg_err *err);

/* Sets path to value in s (and what follows from it: a mob's intake when
 * its liveweight or intake share changes, a fixed ceiling when
 * ceiling_height_cm is set).  Returns 0, or -1 with one line in err naming
 * the path and what was expected (s unchanged). */
int scn_apply(site *s, const char *path, const char *value, rg_err *err);

/* Checks what only a whole scenario can break: the residual below the
 * ceiling.  label names the scenario in the message.  Returns 0 or -1. */
int scn_check(const site *s, const char *label, rg_err *err);

/* The fields a setting may change, to put a site back as it was. */
typedef struct scn_saved {
    site_rules rules;
    site_costs costs;
    site_plan plan;
    site_mob *mobs;          /* [n_mobs] */
    site_paddock *paddocks;  /* [n_paddocks] */
} scn_saved;

/* Copies s's changeable fields into *sv (allocates: scn_saved_free).
 * Returns 0, or -1 when out of memory. */
int scn_save(const site *s, scn_saved *sv);
void scn_restore(site *s, const scn_saved *sv);
void scn_saved_free(scn_saved *sv);

#endif
