/* soil.c - hourly soil water balance of one ground strip (FAO-56 dual Kc).
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * What it is for: the growth stage needs, for every strip across a tracker
 * row and every hour, how much water the sward could transpire and how
 * stressed it is. This file keeps the soil water of ONE strip; the caller
 * runs one soil_state per strip, feeding each the rain that reached it and
 * the hourly ETo computed with its own radiation (et.h).
 *
 * Method: Allen, R.G., Pereira, L.S., Raes, D. & Smith, M. (1998) Crop
 * evapotranspiration - Guidelines for computing crop water requirements.
 * FAO Irrigation and Drainage Paper 56 ("FAO-56"), Rome: chapter 7
 * (ETc = (Ks Kcb + Ke) ETo, surface evaporation layer) and chapter 8 (root
 * zone). Written from the equations; equation numbers are FAO-56's. The
 * book itself could not be re-read from this workplace, so the equations
 * and the table values below are FROM MEMORY and say so.
 *
 * How the pieces fit (soil_hour, one hour):
 *   1. water in: rain beyond the infiltration capacity runs off; the rest
 *      lowers the surface-layer depletion De (eq. 77, its excess
 *      percolating on into the rest of the root zone, eq. 79) and the
 *      root-zone depletion Dr (eq. 85); whatever would take Dr below 0
 *      drains out of the root zone (eq. 88);
 *   2. water out, with coefficients from the state after step 1:
 *      transpiration Ks Kcb ETo (eq. 84 for Ks), then evaporation
 *      Ke ETo (eq. 71, 72, 74, 75); transpiration raises Dr, evaporation
 *      raises Dr and De (by E/few, eq. 77).
 *
 * Adapting the daily method to hours (each point is our choice and is
 * stated where it is coded):
 *   - the hour's rain is taken to arrive at the start of the hour, so the
 *     drainage of eq. 88 is computed before that hour's ETc rather than
 *     netted against it; Kr and Ks use the depletions after the rain
 *     (FAO-56 uses the previous day's De, Dr; with hourly steps the
 *     difference is one hour's ET, at most about 1 mm);
 *   - Kc_max (eq. 72) is the constant 1.20, the value of its first term at
 *     FAO-56's standard climate (u2 = 2 m/s, RHmin = 45 %), raised to
 *     Kcb + 0.05 when that is larger, as eq. 72 says; for a sward ~0.1 m
 *     tall the climate term is multiplied by (h/3)^0.3 ~ 0.36 and would
 *     move Kc_max by a few hundredths only;
 *   - the depletion fraction p is not adjusted for ETc (FAO-56's daily
 *     p + 0.04 (5 - ETc) rule has no hourly meaning);
 *   - no runoff by curve number: rain beyond infiltration_mm_h in the hour
 *     runs off (infiltration-capacity excess; common practice, no source);
 *     a full root zone drains freely (no water table, no capillary rise,
 *     CR = 0 in eq. 85);
 *   - Tew (transpiration drawn from the surface layer, eq. 77) is taken as
 *     0, which FAO-56 allows for most crops;
 *   - night ETo from et_hour_mm_h() can be slightly negative (dew): taken
 *     as 0, so dew is not added to the soil.
 *
 * Water is conserved exactly: storage = TAW - Dr, and every change of Dr is
 * one of infiltration, drainage, transpiration or evaporation. Evaporation
 * is also capped at the water left in the root zone (TAW - Dr), so Dr never
 * passes TAW. (FAO-56's surface layer dries to half the wilting point,
 * eq. 73, i.e. below the water counted in TAW; that small amount is not
 * tracked separately here.)
 */
#include "soil.h"

#include <math.h>
#include <stddef.h>

#define SOIL_NAN ((double)NAN) /* NAN is a float; spare -Wdouble-promotion */

/* Medium (loam) soil of soil_params_make(). FAO-56 Table 19, FROM MEMORY:
 * loam theta_FC 0.20-0.30, theta_WP 0.07-0.17, REW 8-10 mm, TEW 16-22 mm
 * (Ze = 0.10 m); the midpoints are used. */
#define SOIL_ZE_M 0.10        /* FAO-56 ch. 7 evaporation layer 0.10-0.15 m;
                               * the smaller value, as Table 19 uses */
#define SOIL_THETA_FC 0.25    /* Table 19 loam midpoint, from memory */
#define SOIL_THETA_WP 0.12    /* Table 19 loam midpoint, from memory */
#define SOIL_REW_MM 9.0       /* Table 19 loam midpoint, from memory */

/* Basal crop coefficient of a full green sward: FAO-56 Table 17,
 * "grazing pasture, rotated grazing" Kcb mid 0.80-1.00, midpoint; FROM
 * MEMORY (the table was not reachable to verify). */
#define SOIL_KCB_FULL 0.90
/* Kc_max: first term of FAO-56 eq. 72 at u2 = 2 m/s, RHmin = 45 %. */
#define SOIL_KC_MAX 1.20
/* Eq. 72's lower bound Kc_max >= Kcb + 0.05. */
#define SOIL_KC_MAX_MARGIN 0.05
/* Wetted fraction fw for rain: FAO-56 Table 20 (from memory): 1.0. */
#define SOIL_FW_RAIN 1.0

/* Sanity bounds on inputs (common practice, no source): 1000 mm/m is all
 * of a soil's volume; 10 m is far deeper than any pasture root zone. */
#define SOIL_MAX_HELD_MM_PER_M 1000.0
#define SOIL_MAX_ROOT_M 10.0

/* ---- Published equations, one function each ------------------------- */

double soil_taw_mm(double water_held_mm_per_m, double rooting_depth_m)
{
    /* FAO-56 eq. 82: TAW = 1000 (theta_FC - theta_WP) Zr. */
    if (!(water_held_mm_per_m > 0.0 &&
          water_held_mm_per_m <= SOIL_MAX_HELD_MM_PER_M))
        return SOIL_NAN;
    if (!(rooting_depth_m > 0.0 && rooting_depth_m <= SOIL_MAX_ROOT_M))
        return SOIL_NAN;
    return water_held_mm_per_m * rooting_depth_m;
}

double soil_tew_mm(double theta_fc, double theta_wp, double ze_m)
{
    /* FAO-56 eq. 73: TEW = 1000 (theta_FC - 0.5 theta_WP) Ze. */
    if (!(theta_wp >= 0.0 && theta_wp < theta_fc && theta_fc <= 1.0))
        return SOIL_NAN;
    if (!(ze_m > 0.0 && ze_m <= 1.0))
        return SOIL_NAN;
    return 1000.0 * (theta_fc - 0.5 * theta_wp) * ze_m;
}

/* FAO-56 eq. 74: Kr = (TEW - De) / (TEW - REW) for De > REW, else 1;
 * 0 at and beyond TEW. Arguments already checked (REW < TEW). */
static double kr_eq74(double tew_mm, double rew_mm, double de_mm)
{
    if (de_mm <= rew_mm)
        return 1.0;
    if (de_mm >= tew_mm)
        return 0.0;
    return (tew_mm - de_mm) / (tew_mm - rew_mm);
}

double soil_kr(double tew_mm, double rew_mm, double de_mm)
{
    if (isnan(de_mm) || !(tew_mm > 0.0) || !(rew_mm >= 0.0) ||
        !(rew_mm < tew_mm) || !isfinite(tew_mm))
        return SOIL_NAN;
    return kr_eq74(tew_mm, rew_mm, de_mm);
}

/* FAO-56 eq. 72, hourly form: Kc_max = max(kc_max_climate, Kcb + 0.05),
 * where kc_max_climate is the constant of the parameter set (see the top
 * of this file). */
static double kc_max_eq72(double kc_max_climate, double kcb)
{
    double floor_kcb = kcb + SOIL_KC_MAX_MARGIN;
    return kc_max_climate > floor_kcb ? kc_max_climate : floor_kcb;
}

/* FAO-56 eq. 75: few = min(1 - fc, fw), the exposed and wetted fraction. */
static double few_eq75(double cover_frac)
{
    double exposed = 1.0 - cover_frac;
    return exposed < SOIL_FW_RAIN ? exposed : SOIL_FW_RAIN;
}

/* FAO-56 eq. 71: Ke = Kr (Kc_max - Kcb) <= few Kc_max, with few from
 * eq. 75; not below 0. Arguments already checked. */
static double ke_eq71(double kr, double kcb, double kc_max, double cover_frac)
{
    double ke = kr * (kc_max - kcb);
    double cap = few_eq75(cover_frac) * kc_max;
    if (ke > cap)
        ke = cap;
    return ke > 0.0 ? ke : 0.0;
}

double soil_ke(double kr, double kcb, double kc_max, double cover_frac)
{
    if (!(kr >= 0.0 && kr <= 1.0) || !(kcb >= 0.0) || !(kc_max > 0.0) ||
        !(cover_frac >= 0.0 && cover_frac <= 1.0) || !isfinite(kcb) ||
        !isfinite(kc_max))
        return SOIL_NAN;
    return ke_eq71(kr, kcb, kc_max, cover_frac);
}

int soil_params_check(const soil_params *p)
{
    if (p == NULL)
        return -1;
    if (!(p->taw_mm > 0.0 && isfinite(p->taw_mm)))
        return -1;
    if (!(p->p >= 0.0 && p->p < 1.0))
        return -1;
    if (!(p->tew_mm > 0.0 && isfinite(p->tew_mm)))
        return -1;
    if (!(p->rew_mm >= 0.0 && p->rew_mm < p->tew_mm))
        return -1;
    if (!(p->infiltration_mm_h > 0.0))
        return -1;
    if (!(p->kcb_full >= 0.0 && isfinite(p->kcb_full)))
        return -1;
    if (!(p->kc_max > 0.0 && isfinite(p->kc_max)))
        return -1;
    return 0;
}

/* FAO-56 eq. 83: RAW = p TAW; eq. 84: Ks = (TAW - Dr) / ((1 - p) TAW)
 * for Dr > RAW, else 1; 0 at and beyond TAW. Arguments already checked. */
static double ks_eq84(const soil_params *p, double dr_mm)
{
    double raw_mm = p->p * p->taw_mm;
    if (dr_mm <= raw_mm)
        return 1.0;
    if (dr_mm >= p->taw_mm)
        return 0.0;
    return (p->taw_mm - dr_mm) / ((1.0 - p->p) * p->taw_mm);
}

double soil_ks(const soil_params *p, const soil_state *s)
{
    if (s == NULL || soil_params_check(p) != 0 || !(s->dr_mm >= 0.0))
        return SOIL_NAN;
    return ks_eq84(p, s->dr_mm);
}

double soil_storage_mm(const soil_params *p, const soil_state *s)
{
    if (p == NULL || s == NULL)
        return SOIL_NAN;
    return p->taw_mm - s->dr_mm;
}

int soil_params_make(double water_held_mm_per_m, double rooting_depth_m,
                     double infiltration_mm_h, double p, soil_params *out)
{
    double taw_mm = soil_taw_mm(water_held_mm_per_m, rooting_depth_m);
    if (out == NULL || isnan(taw_mm) || !(p >= 0.0 && p < 1.0) ||
        !(infiltration_mm_h > 0.0))
        return -1;
    soil_params q;
    q.taw_mm = taw_mm;
    q.p = p;
    q.tew_mm = soil_tew_mm(SOIL_THETA_FC, SOIL_THETA_WP, SOIL_ZE_M);
    q.rew_mm = SOIL_REW_MM;
    q.infiltration_mm_h = infiltration_mm_h;
    q.kcb_full = SOIL_KCB_FULL;
    q.kc_max = SOIL_KC_MAX;
    *out = q;
    return 0;
}

/* ---- One hour --------------------------------------------------------- */

/* Basal crop coefficient of a partly covered sward: Kcb = fc x Kcb_full.
 * A simplification of FAO-56's Kcb from ground cover (ch. 9, Kcb = Kc_min
 * + Kd (Kcb_full - Kc_min); equation numbers 97-98 from memory) with
 * Kc_min = 0 and Kd = fc: bare ground does not transpire, and its dry-soil
 * evaporation is left to Ke. Common practice, no source for the linear
 * form. */
static double kcb_of_cover(const soil_params *p, double cover_frac)
{
    return cover_frac * p->kcb_full;
}

static int state_ok(const soil_params *p, const soil_state *s)
{
    return s->dr_mm >= 0.0 && s->dr_mm <= p->taw_mm && s->de_mm >= 0.0 &&
           s->de_mm <= p->tew_mm;
}

static int inputs_ok(double rain_mm, double eto_mm, double cover_frac)
{
    return rain_mm >= 0.0 && isfinite(rain_mm) && isfinite(eto_mm) &&
           cover_frac >= 0.0 && cover_frac <= 1.0;
}

static void flux_nan(soil_flux *out)
{
    out->rain_mm = out->infiltrated_mm = out->runoff_mm = SOIL_NAN;
    out->evaporation_mm = out->transpiration_mm = SOIL_NAN;
    out->drainage_mm = out->ks = out->kr = SOIL_NAN;
}

/* Step 1, water in. Runoff: infiltration-capacity excess (common
 * practice, no source). Surface layer: eq. 77 with P - RO, fw = 1; its
 * excess (eq. 79, DPe) moves down inside the root zone, so it is not a
 * loss. Root zone: eq. 85 with I = CR = 0; eq. 88 drainage is what would
 * take Dr below 0 (this hour's ETc is removed afterwards, see top). */
static void water_in(const soil_params *p, soil_state *s, double rain_mm,
                     soil_flux *out)
{
    double runoff_mm = 0.0;
    if (rain_mm > p->infiltration_mm_h)
        runoff_mm = rain_mm - p->infiltration_mm_h;
    double infiltrated_mm = rain_mm - runoff_mm;

    double de_mm = s->de_mm - infiltrated_mm;
    s->de_mm = de_mm > 0.0 ? de_mm : 0.0;

    double dr_mm = s->dr_mm - infiltrated_mm;
    out->drainage_mm = dr_mm < 0.0 ? -dr_mm : 0.0;
    s->dr_mm = dr_mm > 0.0 ? dr_mm : 0.0;

    out->rain_mm = rain_mm;
    out->runoff_mm = runoff_mm;
    out->infiltrated_mm = infiltrated_mm;
}

/* Step 2, water out: transpiration first (FAO-56 gives Kcb priority over
 * Ke in eq. 71), then evaporation. Transpiration = Ks Kcb ETo (eq. 84,
 * ch. 8 ETc adj = (Ks Kcb + Ke) ETo). Evaporation = Ke ETo (eq. 71),
 * limited so the exposed layer does not pass TEW (E/few <= TEW - De,
 * eq. 77) and the root zone does not pass TAW. */
static void water_out(const soil_params *p, soil_state *s, double eto_mm,
                      double eto_t_mm, double cover_frac, soil_flux *out)
{
    double kcb = kcb_of_cover(p, cover_frac);
    double ks = ks_eq84(p, s->dr_mm);
    double kr = kr_eq74(p->tew_mm, p->rew_mm, s->de_mm);
    double ke = ke_eq71(kr, kcb, kc_max_eq72(p->kc_max, kcb), cover_frac);

    double t_mm = ks * kcb * eto_t_mm;
    if (t_mm > p->taw_mm - s->dr_mm)
        t_mm = p->taw_mm - s->dr_mm;
    s->dr_mm += t_mm;

    double few = few_eq75(cover_frac);
    double e_mm = ke * eto_mm;
    if (e_mm > few * (p->tew_mm - s->de_mm))
        e_mm = few * (p->tew_mm - s->de_mm);
    if (e_mm > p->taw_mm - s->dr_mm)
        e_mm = p->taw_mm - s->dr_mm;
    if (e_mm > 0.0) {
        s->de_mm += e_mm / few;   /* few > 0 here, else the cap gave 0 */
        s->dr_mm += e_mm;
    } else {
        e_mm = 0.0;
    }
    /* Rounding may leave a depletion one ulp past its limit. */
    if (s->de_mm > p->tew_mm)
        s->de_mm = p->tew_mm;
    if (s->dr_mm > p->taw_mm)
        s->dr_mm = p->taw_mm;

    out->transpiration_mm = t_mm;
    out->evaporation_mm = e_mm;
    out->ks = ks;
    out->kr = kr;
}

int soil_hour_split(const soil_params *p, soil_state *s, double rain_mm,
                    double eto_e_mm, double eto_t_mm, double cover_frac, soil_flux *out)
{
    if (out == NULL)
        return -1;
    if (s == NULL || soil_params_check(p) != 0 || !state_ok(p, s) ||
        !inputs_ok(rain_mm, eto_e_mm, cover_frac) || !isfinite(eto_t_mm)) {
        flux_nan(out);
        return -1;
    }
    water_in(p, s, rain_mm, out);
    water_out(p, s, eto_e_mm > 0.0 ? eto_e_mm : 0.0, eto_t_mm > 0.0 ? eto_t_mm : 0.0,
              cover_frac, out);
    return 0;
}

int soil_hour(const soil_params *p, soil_state *s, double rain_mm,
              double eto_mm, double cover_frac, soil_flux *out)
{
    return soil_hour_split(p, s, rain_mm, eto_mm, eto_mm, cover_frac, out);
}
