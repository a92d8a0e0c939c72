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
    /* per hour and strip, index h * n_strips + i */
    double *sw_w_m2;         /* shortwave reaching the ground */
    double *sky_w_m2;        /* its diffuse part (sky light; the rest is beam) */
    double *rain_strip_mm;   /* rain reaching the ground (mm on the strip) */
    double *leaf_c;          /* top-leaf temperature (NaN at night) */
    double *vpd_kpa;         /* leaf-to-air VPD (NaN at night) */
} mc_result;

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

/* Fills rows[0..n_strips-1] for the strips and rows[n_strips] for the open
 * field, summarising every hour of the n results (e.g. several years).
 * Returns 0, or -1 when out of memory (rows untouched). */
int mc_summarise(const mc_config *c, const mc_result *r, int n,
                 mc_strip_summary *rows);

/* Short label of a side: "under", "am-edge", "pm-edge", "open". */
const char *mc_side_name(int side);

#endif
