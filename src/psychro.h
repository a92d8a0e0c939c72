/* psychro.h - air humidity and pressure relations of FAO-56 chapter 3.
 *
 * The whole interface of psychro.c. Every function is pure (no state, no
 * allocation) and returns NaN when an input is out of its documented range
 * or is not a finite number, so a bad value shows up in the output instead
 * of being silently clamped.
 *
 * Reference: Allen, R.G., Pereira, L.S., Raes, D. & Smith, M. (1998) Crop
 * evapotranspiration. FAO Irrigation and Drainage Paper 56, chapter 3.
 *
 * GPL-3.0-or-later.
 */
#ifndef PSYCHRO_H
#define PSYCHRO_H

/* Latent heat of vaporisation used throughout FAO-56 (eq. 8 text), MJ/kg. */
#define PSY_LATENT_HEAT_MJ_KG 2.45
/* Specific heat of moist air at constant pressure (FAO-56 eq. 8 text),
 * MJ/kg/C. */
#define PSY_CP_MJ_KG_C 1.013e-3
/* Ratio of molecular weights water vapour / dry air (FAO-56 eq. 8 text). */
#define PSY_EPSILON 0.622

/* Atmospheric pressure (kPa) at elevation z_m metres above sea level
 * (FAO-56 eq. 7). NaN unless -500 <= z_m <= 9000. */
double psy_pressure_kpa(double z_m);

/* Psychrometric constant (kPa/C) at pressure p_kpa (FAO-56 eq. 8).
 * NaN unless 0 < p_kpa <= 120. */
double psy_gamma_kpa_c(double p_kpa);

/* Saturation vapour pressure over water (kPa) at t_c degrees C
 * (FAO-56 eq. 11). NaN unless -100 <= t_c <= 100. */
double psy_e0_kpa(double t_c);

/* Mean saturation vapour pressure (kPa) of a day from its maximum and
 * minimum temperatures (FAO-56 eq. 12). NaN if either is out of the range
 * of psy_e0_kpa or tmin_c > tmax_c. */
double psy_es_mean_kpa(double tmax_c, double tmin_c);

/* Slope of the saturation vapour pressure curve (kPa/C) at t_c
 * (FAO-56 eq. 13). NaN unless -100 <= t_c <= 100. */
double psy_slope_kpa_c(double t_c);

/* Actual vapour pressure (kPa) from the dew point (FAO-56 eq. 14).
 * NaN unless -100 <= tdew_c <= 100. */
double psy_ea_dew_kpa(double tdew_c);

/* Dew point (C) of air whose actual vapour pressure is ea_kpa: the
 * algebraic inverse of FAO-56 eq. 14 (eq. 11 solved for T). NaN unless
 * ea_kpa > 0 and the result lies in -100..100 C. */
double psy_dew_point_c(double ea_kpa);

/* Actual vapour pressure (kPa) from RH at one temperature: FAO-56 eq. 10
 * solved for ea, the form used for hourly data (FAO-56 ch. 4, eq. 54).
 * NaN unless 0 <= rh_pct <= 100 and t_c is in range for psy_e0_kpa. */
double psy_ea_rh_kpa(double t_c, double rh_pct);

/* Actual vapour pressure (kPa) of a day from RHmax and RHmin
 * (FAO-56 eq. 17). NaN if an RH is outside 0..100, rhmin > rhmax,
 * tmin > tmax, or a temperature is out of range. */
double psy_ea_rh_minmax_kpa(double tmin_c, double tmax_c,
                            double rhmin_pct, double rhmax_pct);

/* Actual vapour pressure (kPa) of a day from mean RH (FAO-56 eq. 19).
 * NaN if rhmean_pct is outside 0..100, tmin > tmax, or a temperature is
 * out of range. */
double psy_ea_rh_mean_kpa(double tmin_c, double tmax_c, double rhmean_pct);

/* Vapour pressure deficit es - ea (kPa) (FAO-56 ch. 3, "vapour pressure
 * deficit"). A negative result (supersaturated air) is returned as is.
 * NaN if either pressure is negative or not finite. */
double psy_vpd_kpa(double es_kpa, double ea_kpa);

#endif
