/* micro.h - the strip microclimate engine (microclimate stage).
 *
 * Turns the site's array geometry and one hourly weather series into what
 * the pasture experiences, strip by strip across one row pitch, every hour:
 * shortwave light reaching the ground, rain reaching it, and the leaf
 * temperature and leaf-to-air vapour pressure deficit of the sward's top
 * leaves.  An open-field reference (no panels) is computed alongside.  The
 * growth stage reads an mc_result and nothing else of this stage.
 *
 * Pipeline per hour (micro.c): sun position (sun.c, SPA) -> beam/diffuse
 * split (irrad.c, Erbs) -> tracker angle (tracker.c) -> beam and sky light
 * and rain per strip (strips.c) -> leaf energy balance (leaf.c).
 */
#ifndef MICRO_H
#define MICRO_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "site.h"
#include "strips.h"
#include "sun.h"
#include "tracker.h"
#include "weather.h"

typedef struct mc_config {
    strip_geom geom;
    trk_config trk;
    sun_site sun;
    double utc_offset_h;
    strip_sky_table *sky;    /* sky view factor by rotation, built once */
} mc_config;

/* Side of the row a strip belongs to (labels decided from geometry and
 * the computed timing of light, see mc_summarise). */
enum mc_side { MC_UNDER, MC_AM_EDGE, MC_PM_EDGE, MC_OPEN };

typedef struct mc_result {
    int n_strips;
    size_t n_hours;
    int64_t t0_h;            /* hour number (tcal.h) of the first hour */
    double *offset_m;        /* [strip] centre, + towards sunrise side */
    /* per hour */
    double *zenith_deg, *azimuth_deg, *hour_angle_deg, *tracker_deg;
    double *ghi_w_m2, *rain_mm, *t_air_c;
    double *dhi_w_m2;        /* diffuse part of ghi_w_m2 (the open field's sky light) */
    double *open_leaf_c, *open_vpd_kpa;   /* open-field reference leaf */
    /* per rainy hour (rain_mm > 0) and strip, index mc_rain_at(r, h) + i;
     * the dry hours, most of them, are not stored (0 on every strip) */
    int32_t *rain_row;       /* [hour] row of the hour, -1 when dry */
    size_t n_rain;           /* rainy hours (rows) */
    double *rain_strip_mm;   /* rain reaching the ground (mm on the strip) */
    /* per daylight hour and strip, index mc_lit_at(r, h) + i.  Daylight:
     * the sun above the horizon and GHI > 0.  The night hours are not
     * stored (about half of a year's hours, so half the memory to fill):
     * at night no light reaches any strip and the leaf has no
     * temperature or VPD (read them as 0, 0, NaN, NaN). */
    int32_t *lit_row;        /* [hour] row of the hour in these, -1 at night */
    size_t n_lit;            /* daylight hours (rows) */
    double *sw_w_m2;         /* shortwave reaching the ground (its sky
                                light: mc_sky_w_m2) */
    double *leaf_c;          /* top-leaf temperature */
    double *vpd_kpa;         /* leaf-to-air VPD */
    strip_sky_table *sky;    /* the geometry's sky view table (a counted
                                reference), for mc_sky_w_m2 */
} mc_result;

/* Index of hour h's first strip in the daylight arrays of r (sw_w_m2,
 * leaf_c, vpd_kpa), or -1 when h is a night hour. */
static inline ptrdiff_t mc_lit_at(const mc_result *r, size_t h)
{
    int32_t row = r->lit_row[h];
    return row < 0 ? -1 : (ptrdiff_t)row * r->n_strips;
}

/* Index of hour h's first strip in rain_strip_mm, or -1 when h is dry. */
static inline ptrdiff_t mc_rain_at(const mc_result *r, size_t h)
{
    int32_t row = r->rain_row[h];
    return row < 0 ? -1 : (ptrdiff_t)row * r->n_strips;
}

/* One row of the per-strip summary; the open-field row has strip = -1. */
typedef struct mc_strip_summary {
    int strip;
    double offset_m;
    int side;                /* enum mc_side */
    double light_share;      /* strip light / open-field light */
    double light_am_share;   /* share of the strip's light before solar noon */
    double rain_share;       /* strip rain / open-field rain */
    double leaf_temp_c;      /* light-weighted daytime mean */
    double leaf_vpd_kpa;     /* light-weighted daytime mean */
} mc_strip_summary;

/* Builds the engine's settings from a checked site, including the sky
 * view table that every run with this geometry shares.  A horizontal axis
 * is given the one of its two directions whose right-hand side (Aa - 90)
 * faces the sunrise half of the sky, so that offsets are positive towards
 * the side the sun rises on; a tilted axis keeps the site's direction.
 * Returns 0, or -1 with a message (out of memory, or a geometry the site
 * checks should already have refused). */
int mc_config_from_site(const site *s, mc_config *c, rg_err *err);

/* Frees what mc_config_from_site allocated. */
void mc_config_free(mc_config *c);

/* Runs hours [from, from + n) of series w.  Returns 0, or -1 with a message
 * (out of memory, or a sun position outside the algorithm's range). */
int mc_run(const mc_config *c, const wx_series *w, size_t from, size_t n,
           mc_result *out, rg_err *err);

void mc_free(mc_result *r);

/* The diffuse (sky) part of the shortwave reaching each strip in hour h,
 * W/m2, into sky_w_m2[0..n_strips-1]: the strip's sky view factor at the
 * hour's tracker angle times the diffuse light dhi_w_m2[h] (0 at night),
 * the same numbers mc_run() lit the strips with.  Made on demand from the
 * table rather than stored: a year of them would be as large as sw_w_m2. */
void mc_sky_w_m2(const mc_result *r, size_t h, double *sky_w_m2);

/* Fills rows[0..n_strips-1] for the strips and rows[n_strips] for the open
 * field, summarising every hour of the n results (e.g. several years).
 * Returns 0, or -1 when out of memory (rows untouched). */
int mc_summarise(const mc_config *c, const mc_result *r, int n,
                 mc_strip_summary *rows);

/* Short label of a side: "under", "am-edge", "pm-edge", "open". */
const char *mc_side_name(int side);

#endif
