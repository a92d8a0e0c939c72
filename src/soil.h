/* soil.h - hourly soil water balance of one ground strip: interface.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * Method: the FAO-56 dual crop coefficient water balance (Allen, R.G.,
 * Pereira, L.S., Raes, D. & Smith, M. (1998) Crop evapotranspiration. FAO
 * Irrigation and Drainage Paper 56, "FAO-56"), chapter 7 (surface
 * evaporation layer: eq. 71-77, 79, Table 19) and chapter 8 (root zone:
 * eq. 82-85, 88), stepped once per HOUR instead of once per day. soil.c
 * says how each daily equation was adapted.
 *
 * Two depletions describe a strip (both in mm of water over the strip):
 *   dr_mm  root-zone depletion below field capacity, 0 (field capacity)
 *          .. taw_mm (wilting point);
 *   de_mm  depletion of the thin surface layer that dries by evaporation,
 *          0 (wet) .. tew_mm (air-dry).
 * The surface layer is the top of the root zone: rain that enters the soil
 * lowers both, evaporation raises both, transpiration raises dr only.
 *
 * Units: every depth of water is in mm over the strip's area for the hour
 * passed in (rain_mm, eto_mm are that hour's totals).
 *
 * Typical values for a grazed sward, all FROM MEMORY of FAO-56 (the book
 * could not be re-read from this workplace): depletion fraction p = 0.60
 * and rooting depth 0.5-1.5 m for grazing pasture (Table 22); basal crop
 * coefficient of a rotationally grazed pasture Kcb mid 0.80-1.00 (Table
 * 17); water held between field capacity and wilting point 130 mm per m
 * for a loam (Table 19, theta_FC - theta_WP = 0.13-0.18 -> 130-180 mm/m).
 */
#ifndef SOIL_H
#define SOIL_H

/* Parameters of one strip's soil and sward. */
typedef struct soil_params {
    double taw_mm;            /* total available water of the root zone,
                               * FAO-56 eq. 82: water held per m of soil
                               * x rooting depth */
    double p;                 /* depletion fraction: RAW = p TAW (eq. 83) */
    double tew_mm;            /* total evaporable water of the surface
                               * layer, eq. 73 */
    double rew_mm;            /* readily evaporable water (stage-1
                               * evaporation), Table 19 */
    double infiltration_mm_h; /* rain beyond this in an hour runs off;
                               * INFINITY means never */
    double kcb_full;          /* basal crop coefficient of a full green
                               * cover (cover_frac = 1) */
    double kc_max;            /* upper Kc after rain, eq. 72 (see soil.c) */
} soil_params;

/* Water state of one strip. {0, 0} is a soil at field capacity with a wet
 * surface. */
typedef struct soil_state {
    double dr_mm;             /* root-zone depletion, 0 .. taw_mm */
    double de_mm;             /* surface-layer depletion, 0 .. tew_mm */
} soil_state;

/* What happened in one hour. Identity (exact to rounding):
 *   rain_mm = runoff_mm + evaporation_mm + transpiration_mm + drainage_mm
 *             + (storage after - storage before),
 * with storage from soil_storage_mm(). */
typedef struct soil_flux {
    double rain_mm;           /* rain reaching the strip (as passed in) */
    double infiltrated_mm;    /* rain that entered the soil */
    double runoff_mm;         /* rain beyond the infiltration capacity */
    double evaporation_mm;    /* from the exposed soil surface */
    double transpiration_mm;  /* by the sward, from the root zone */
    double drainage_mm;       /* percolation below the root zone */
    double ks;                /* water stress coefficient used (eq. 84) */
    double kr;                /* evaporation reduction coefficient used
                               * (eq. 74) */
} soil_flux;

/* Total available water of a root zone, FAO-56 eq. 82:
 * TAW = 1000 (theta_FC - theta_WP) Zr, written as
 * water_held_mm_per_m x rooting_depth_m where water_held_mm_per_m =
 * 1000 (theta_FC - theta_WP). NAN unless 0 < water_held_mm_per_m <= 1000
 * and 0 < rooting_depth_m <= 10 (NaN fails both). */
double soil_taw_mm(double water_held_mm_per_m, double rooting_depth_m);

/* Total evaporable water of the surface layer, FAO-56 eq. 73:
 * TEW = 1000 (theta_FC - 0.5 theta_WP) Ze, thetas in m3/m3, Ze in m.
 * NAN unless 0 <= theta_wp < theta_fc <= 1 and 0 < ze_m <= 1. */
double soil_tew_mm(double theta_fc, double theta_wp, double ze_m);

/* Fills *out for a medium (loam) soil: taw_mm by eq. 82; tew_mm = 19 mm by
 * eq. 73 with Ze = 0.10 m, theta_FC = 0.25, theta_WP = 0.12; rew_mm = 9 mm;
 * kcb_full = 0.90; kc_max = 1.20 (soil.c gives the source of each). The
 * caller may overwrite any field afterwards and re-check with
 * soil_params_check(). Returns 0, or -1 with *out untouched when
 * soil_taw_mm() is NAN, p is outside [0, 1), infiltration_mm_h is not
 * > 0 (INFINITY allowed), or out is NULL. */
int soil_params_make(double water_held_mm_per_m, double rooting_depth_m,
                     double infiltration_mm_h, double p, soil_params *out);

/* 0 if every field of *p is usable, -1 otherwise (or p NULL): taw_mm,
 * tew_mm, kc_max finite and > 0; p in [0, 1); rew_mm finite, >= 0 and
 * < tew_mm; infiltration_mm_h > 0 (INFINITY allowed); kcb_full finite,
 * >= 0. */
int soil_params_check(const soil_params *p);

/* Evaporation reduction coefficient Kr, FAO-56 eq. 74:
 * 1 while de_mm <= rew_mm (stage 1), (TEW - De)/(TEW - REW) after,
 * 0 at or beyond TEW. NAN if any argument is NaN, tew_mm <= 0, rew_mm < 0
 * or rew_mm >= tew_mm. */
double soil_kr(double tew_mm, double rew_mm, double de_mm);

/* Soil evaporation coefficient Ke, FAO-56 eq. 71 with eq. 75:
 * Ke = min(Kr (Kc_max - Kcb), few Kc_max), few = min(1 - fc, fw) with
 * fw = 1 (rain wets the whole surface, FAO-56 Table 20), clamped to >= 0.
 * kc_max is the value already raised to Kcb + 0.05 where eq. 72 says so.
 * NAN if any argument is NaN, kr or cover_frac outside [0, 1], kcb < 0 or
 * kc_max <= 0. */
double soil_ke(double kr, double kcb, double kc_max, double cover_frac);

/* Water stress coefficient Ks, FAO-56 eq. 84 (with RAW = p TAW, eq. 83):
 * 1 while Dr <= RAW, (TAW - Dr) / ((1 - p) TAW) beyond, 0 at Dr >= TAW.
 * NAN if either pointer is NULL, soil_params_check() fails or dr_mm is
 * NaN or negative. */
double soil_ks(const soil_params *p, const soil_state *s);

/* Water held in the root zone above wilting point, taw_mm - dr_mm. NAN if
 * either pointer is NULL. */
double soil_storage_mm(const soil_params *p, const soil_state *s);

/* Advances *s by one hour and reports the hour in *out.
 *   rain_mm     rain reaching the strip in the hour (>= 0);
 *   eto_mm      reference evapotranspiration of the hour
 *               (et_hour_mm_h() with the strip's radiation); negative
 *               values (night dew) are taken as 0;
 *   cover_frac  fraction of the ground covered by green sward, 0..1.
 * Returns 0; or -1 when p or s or out is NULL, soil_params_check(p) fails,
 * s is outside its ranges (dr_mm 0..taw_mm, de_mm 0..tew_mm), rain_mm is
 * negative or not finite, eto_mm is not finite, or cover_frac is outside
 * [0, 1] or NaN;
 * then *s is unchanged and every field of *out (if out is not NULL) is
 * NAN. */
int soil_hour(const soil_params *p, soil_state *s, double rain_mm,
              double eto_mm, double cover_frac, soil_flux *out);

/* As soil_hour(), with one reference ET for the soil's evaporation
 * (eto_e_mm, FAO-56 Ke ETo, eq. 69) and another for the sward's
 * transpiration (eto_t_mm, Ks Kcb ETo), e.g. when the sward's stomata are
 * partly shut in shade but the bare soil between its tillers still
 * evaporates as the reference says.  soil_hour() is this with both equal.
 * Same refusals as soil_hour(), eto_t_mm included. */
int soil_hour_split(const soil_params *p, soil_state *s, double rain_mm,
                    double eto_e_mm, double eto_t_mm, double cover_frac, soil_flux *out);

#endif
