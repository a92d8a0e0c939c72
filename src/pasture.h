/* pasture.h - soil water and forage growth per strip across the row
 * (growth stage).
 *
 * Reads the microclimate (mc_result) and the weather series it came from
 * (for air humidity and wind, which ETo needs), and runs, hour by hour and
 * strip by strip, the soil water balance of soil.c (FAO-56 dual Kc, with
 * each strip's own rain and its own ETo: the open field's FAO-56 eq. 53
 * with the strip's sun, et_hour_shaded_mm_h; the sward transpires against
 * the same with its stomata partly shut in shade, Noilhan & Planton 1989,
 * gr_stomata_light_f1) and the growth of growth.c
 * (sunlit and shaded leaves' photosynthesis from the strip's beam and sky
 * light x f(leaf T) x f(leaf VPD) x Ks).  An open-ground
 * reference runs beside the strips, with the open field's sun, rain and
 * leaf.  The sward follows a reference management: it starts at the
 * residual cover and is grazed back to it every rest period, so the
 * growth rates are those of a sward in rotation.  The forecast
 * (forecast.c) reads a ps_result and nothing else of this stage.
 */
#ifndef PASTURE_H
#define PASTURE_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "lateral.h"
#include "micro.h"
#include "site.h"
#include "soil.h"
#include "sward.h"
#include "weather.h"

typedef struct ps_config {
    sward_params sward;
    soil_params soil;
    double residual_kgdm_ha;   /* grazed back to this ... */
    int rest_days;             /* ... every rest_days days */
    double lat_deg, lon_east_deg, zone_east_deg, elev_m; /* for ETo */
    double pitch_m;            /* of the strips, for the sideways spread */
    double spread_m;           /* rain reaching a strip is shared over
                                  +/- spread_m across the row (see pasture.c) */
    int lateral;               /* 1: soil water flows sideways between strips
                                  (the soil names its texture; lateral.h) */
    lf_soil lat;               /* its diffusivity table, when lateral */
} ps_config;

/* Water balance totals of one strip over a run, mm. */
typedef struct ps_water {
    double rain, runoff, evaporation, transpiration, drainage;
    double lateral_in;         /* soil water that flowed in sideways from the
                                  neighbouring strips (negative: out) */
    double storage_start, storage_end;
} ps_water;

typedef struct ps_result {
    int n_cols;                /* strips + 1: the last column is open ground */
    size_t n_days;
    int64_t day0;              /* day number (tcal.h) of the first day */
    double *growth;            /* [day * n_cols + col] growth (new dry matter,
                                  before senescence), kg DM/ha/day */
    double *senescence;        /* [day * n_cols + col] green lost, kg DM/ha/day */
    int *stress_days;          /* [col] days ending with Ks < 1 (FAO-56: depletion past RAW) */
    ps_water *water;           /* [col] */
} ps_result;

/* Settings for paddocks of soil index soil and sward index sward of s.
 * Returns 0, or -1 with a message. */
int ps_config_make(const site *s, int soil, int sward, ps_config *c, rg_err *err);

/* Runs the whole days of m (which must start at midnight and span whole
 * days) against w, the series m was computed from.  Returns 0, or -1 with
 * a message (out of memory, or a value the soil or growth steps refuse,
 * which checked inputs should not produce). */
int ps_run(const ps_config *c, const mc_result *m, const wx_series *w,
           ps_result *out, rg_err *err);

void ps_free(ps_result *r);

/* Season total of growth for column col over days [d0, d1), kg DM/ha. */
double ps_total_kgdm_ha(const ps_result *r, int col, size_t d0, size_t d1);

#endif
