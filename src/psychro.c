/* psychro.c - air humidity and pressure relations of FAO-56 chapter 3.
 *
 * The microclimate stage needs, for every hour and strip, the saturation
 * vapour pressure and its slope, the actual vapour pressure from whatever
 * humidity the weather file gives (RH or dew point), the vapour pressure
 * deficit, and the air pressure and psychrometric constant of the site.
 * Each of those is one function below, written from the equation of
 * FAO-56 whose number it names. leaf.c uses psy_e0_kpa and psy_slope_kpa_c
 * for the leaf energy balance.
 *
 * Range checks: every function returns NaN for inputs outside the range
 * documented in psychro.h (and for NaN/inf), never a clamped value.
 *
 * Reference: Allen, R.G., Pereira, L.S., Raes, D. & Smith, M. (1998) Crop
 * evapotranspiration - guidelines for computing crop water requirements.
 * FAO Irrigation and Drainage Paper 56, Rome. Chapter 3 (eqs. 7, 8, 11-14, 17, 19 and the hourly form of eq. 10),
 * chapter 4 (eq. 54), Annex 2 (Tables 2.2-2.4).
 *
 * GPL-3.0-or-later.
 */
#include <math.h>

#include "psychro.h"

/* Temperature range accepted by the Tetens-type eq. 11, C. FAO-56 gives no
 * range; the bounds keep T + 237.3 well away from zero and cover every leaf
 * temperature leaf.c can produce. */
#define T_MIN_C (-100.0)
#define T_MAX_C 100.0

static int t_ok(double t_c)
{
    return isfinite(t_c) && t_c >= T_MIN_C && t_c <= T_MAX_C;
}

static int rh_ok(double rh_pct)
{
    return isfinite(rh_pct) && rh_pct >= 0.0 && rh_pct <= 100.0;
}

/* FAO-56 eq. 7: P = 101.3 ((293 - 0.0065 z) / 293)^5.26. */
double psy_pressure_kpa(double z_m)
{
    if (!isfinite(z_m) || z_m < -500.0 || z_m > 9000.0)
        return (double)NAN;
    return 101.3 * pow((293.0 - 0.0065 * z_m) / 293.0, 5.26);
}

/* FAO-56 eq. 8: gamma = cp P / (epsilon lambda). */
double psy_gamma_kpa_c(double p_kpa)
{
    if (!isfinite(p_kpa) || p_kpa <= 0.0 || p_kpa > 120.0)
        return (double)NAN;
    return PSY_CP_MJ_KG_C * p_kpa / (PSY_EPSILON * PSY_LATENT_HEAT_MJ_KG);
}

/* FAO-56 eq. 11: e0(T) = 0.6108 exp(17.27 T / (T + 237.3)). */
double psy_e0_kpa(double t_c)
{
    if (!t_ok(t_c))
        return (double)NAN;
    return 0.6108 * exp(17.27 * t_c / (t_c + 237.3));
}

/* FAO-56 eq. 12: es = (e0(Tmax) + e0(Tmin)) / 2. */
double psy_es_mean_kpa(double tmax_c, double tmin_c)
{
    if (!t_ok(tmax_c) || !t_ok(tmin_c) || tmin_c > tmax_c)
        return (double)NAN;
    return 0.5 * (psy_e0_kpa(tmax_c) + psy_e0_kpa(tmin_c));
}

/* FAO-56 eq. 13: Delta = 4098 e0(T) / (T + 237.3)^2. */
double psy_slope_kpa_c(double t_c)
{
    if (!t_ok(t_c))
        return (double)NAN;
    double d = t_c + 237.3;
    return 4098.0 * psy_e0_kpa(t_c) / (d * d);
}

/* FAO-56 eq. 14: ea = e0(Tdew). */
double psy_ea_dew_kpa(double tdew_c)
{
    return psy_e0_kpa(tdew_c);
}

/* Algebraic inverse of FAO-56 eq. 14 (with eq. 11): with
 * x = ln(ea / 0.6108), Tdew = 237.3 x / (17.27 - x). */
double psy_dew_point_c(double ea_kpa)
{
    if (!isfinite(ea_kpa) || ea_kpa <= 0.0)
        return (double)NAN;
    double x = log(ea_kpa / 0.6108);
    if (x >= 17.27)
        return (double)NAN;
    double t = 237.3 * x / (17.27 - x);
    return t_ok(t) ? t : (double)NAN;
}

/* FAO-56 eq. 10 solved for ea (hourly form, eq. 54): ea = e0(T) RH / 100. */
double psy_ea_rh_kpa(double t_c, double rh_pct)
{
    if (!t_ok(t_c) || !rh_ok(rh_pct))
        return (double)NAN;
    return psy_e0_kpa(t_c) * rh_pct / 100.0;
}

/* FAO-56 eq. 17:
 * ea = (e0(Tmin) RHmax/100 + e0(Tmax) RHmin/100) / 2. */
double psy_ea_rh_minmax_kpa(double tmin_c, double tmax_c,
                            double rhmin_pct, double rhmax_pct)
{
    if (!t_ok(tmin_c) || !t_ok(tmax_c) || tmin_c > tmax_c)
        return (double)NAN;
    if (!rh_ok(rhmin_pct) || !rh_ok(rhmax_pct) || rhmin_pct > rhmax_pct)
        return (double)NAN;
    return 0.5 * (psy_e0_kpa(tmin_c) * rhmax_pct / 100.0 +
                  psy_e0_kpa(tmax_c) * rhmin_pct / 100.0);
}

/* FAO-56 eq. 19: ea = RHmean/100 (e0(Tmax) + e0(Tmin)) / 2. */
double psy_ea_rh_mean_kpa(double tmin_c, double tmax_c, double rhmean_pct)
{
    if (!rh_ok(rhmean_pct))
        return (double)NAN;
    return rhmean_pct / 100.0 * psy_es_mean_kpa(tmax_c, tmin_c);
}

/* FAO-56 ch. 3: vapour pressure deficit = es - ea. */
double psy_vpd_kpa(double es_kpa, double ea_kpa)
{
    if (!isfinite(es_kpa) || !isfinite(ea_kpa) || es_kpa < 0.0 ||
        ea_kpa < 0.0)
        return (double)NAN;
    return es_kpa - ea_kpa;
}
