/* growth.h - forage growth of one ground strip, hour by hour: interface.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * One strip of pasture between (or under) tracker rows is a pool of green
 * herbage (gr_state) that grows from the light reaching its ground and
 * loses a fixed share of itself to senescence every day.  Each hour the
 * caller hands gr_hour() what the microclimate stage (micro.h, mc_result)
 * and the soil-water stage (soil.c) computed for that strip:
 *   shortwave on the ground (W m-2, hourly mean), top-leaf temperature and
 *   leaf-to-air VPD (NaN at night is accepted), the FAO-56 water stress
 *   coefficient Ks (eq. 84, computed in soil.c; not recomputed here) and
 *   the air temperature (for the winter dormancy rule).
 *
 * Gross growth this hour (kg DM/ha) =
 *   RUE (g DM / MJ PAR) x PAR on the ground (MJ m-2) x intercepted share
 *   x f(T_leaf) x f(VPD_leaf) x Ks x 10 (g m-2 -> kg ha-1),
 * zero while the sward is dormant.  Each factor is one public function
 * below, named after its source.
 *
 * Units are in the names: _kgdm_ha is kg dry matter per hectare, _mj_m2 is
 * MJ m-2 over the hour, _w_m2 is W m-2, _c is deg C, _kpa kPa, _mbar hPa.
 */
#ifndef GROWTH_H
#define GROWTH_H

#include "sward.h"

/* Green cover never falls below this, kg DM/ha above the sward's base
 * cover: close grazing or a long dark spell leaves tiller bases with a
 * little green leaf (of the order of 100 kg green DM/ha, LAI about
 * 0.1-0.2; from memory) from which the sward regrows.  Without a floor a
 * sward at zero cover would intercept no light (Beer's law) and never
 * regrow.  Senescence stops at the floor and gr_cut() cuts no lower. */
#define GR_GREEN_FLOOR_KGDM_HA 100.0

/* Hours in the running mean of air temperature that the dormancy rule
 * reads: 7 days (the rule in gr_dormant(); common practice, no source). */
#define GR_T_AIR_HOURS 168

/* Winter dormancy: growth stops while the running 7-day mean air
 * temperature is below t_min_c + GR_DORMANCY_MARGIN_C (common practice,
 * no source), and senescence then runs at GR_DORMANT_SENESCENCE_FACTOR of
 * its usual rate (common practice, no source; a placeholder to calibrate:
 * cold slows leaf turnover). */
#define GR_DORMANCY_MARGIN_C 2.0
#define GR_DORMANT_SENESCENCE_FACTOR 0.5

/* The state of one strip's sward.  Only gr_state_init(), gr_hour() and
 * gr_cut() should write it.
 *   cover (what a sward stick measures, kg DM/ha) = base + green;
 *   green grows and senesces; it stays >= GR_GREEN_FLOOR_KGDM_HA;
 *   there is no hard ceiling: green levels off where senescence balances
 *   growth, green = daily gross growth / senescence_per_day (e.g. 190 / 0.02
 *   = 9,500 kg DM/ha at full interception);
 *   senesced material leaves the cover; senesced_kgdm_ha only counts it
 *   (litter decay and its grazing are not modelled). */
typedef struct gr_state {
    double base_kgdm_ha;      /* stubble below the green pool: the sward's
                               * base_cover_kgdm_ha, copied at init */
    double green_kgdm_ha;     /* green cover above the base, kg DM/ha */
    double senesced_kgdm_ha;  /* senescence summed since init, kg DM/ha */
    /* running mean of air temperature for the dormancy rule */
    double t_air_c[GR_T_AIR_HOURS]; /* the last hours, a ring */
    double t_air_sum_c;       /* sum of the held hours, deg C h */
    int t_air_n;              /* hours held, 0..GR_T_AIR_HOURS */
    int t_air_next;           /* ring index the next hour goes to */
} gr_state;

/* What happened in one hour (gr_hour). */
typedef struct gr_flux {
    double par_mj_m2;          /* PAR reaching the strip's ground, MJ m-2 */
    double lai;                /* green LAI at the start of the hour, m2 m-2 */
    double intercepted_frac;   /* share of that PAR the green leaves catch */
    double f_temp;             /* temperature modifier (NaN: dark, no leaf T) */
    double f_vpd;              /* VPD modifier (NaN: dark, no leaf VPD) */
    double ks;                 /* soil water modifier, as given */
    double t_air_7d_c;         /* running mean air temperature incl. this hour */
    int dormant;               /* 1 when the dormancy rule held this hour */
    double gross_kgdm_ha;      /* growth this hour, kg DM/ha */
    double senescence_kgdm_ha; /* green lost to senescence this hour, kg DM/ha */
} gr_flux;

/* Temperature modifier, 0..1: the Beta function of Yin et al. (1995),
 * r = exp(mu) (T - Tb)^alpha (Tc - T)^beta, with beta = 1 and alpha set so
 * its peak falls at t_opt_c, scaled to 1 there:
 *   f = ((T - Tmin)/(Topt - Tmin))^a ((Tmax - T)/(Tmax - Topt)),
 *   a = (Topt - Tmin)/(Tmax - Topt).
 * 0 at or outside [t_min_c, t_max_c].  NaN when any argument is NaN or
 * the cardinal temperatures are not t_min_c < t_opt_c < t_max_c. */
double gr_temp_beta(double t_c, double t_min_c, double t_opt_c,
                    double t_max_c);

/* VPD modifier, 0..1, of 3-PG (Landsberg & Waring 1997):
 * f = exp(-k D) with D in mbar (1 kPa = 10 mbar).  A negative deficit
 * (dew on the leaf) is taken as 0, giving 1.  NaN when either argument is
 * NaN, or k_per_mbar is negative or infinite. */
double gr_vpd_mod(double vpd_kpa, double k_per_mbar);

/* Share of incident light a canopy intercepts, Beer's law (Monsi & Saeki
 * 1953): 1 - exp(-k LAI), in [0, 1].  NaN when either argument is NaN,
 * lai is negative or k is not positive and finite. */
double gr_intercepted(double lai, double k);

/* Gross growth, kg DM/ha, from radiation use efficiency (Monteith 1977):
 * RUE x intercepted PAR, times the product of the modifiers, times 10
 * (1 g m-2 = 10 kg ha-1).  NaN when any argument is NaN or negative. */
double gr_gross_kgdm_ha(double rue_g_per_mj_par, double par_mj_m2,
                        double intercepted_frac, double f_temp,
                        double f_vpd, double ks);

/* Running mean of the air temperature of the last (up to) GR_T_AIR_HOURS
 * hours gr_hour() has seen, deg C; NaN before the first hour or when st is
 * NULL. */
double gr_t_air_7d_c(const gr_state *st);

/* The winter dormancy rule: 1 while the running 7-day mean air
 * temperature (gr_t_air_7d_c) is below s->t_min_c + GR_DORMANCY_MARGIN_C,
 * else 0.  Before any hour has been seen (no mean yet) it is 0, as it is
 * for a NULL argument. */
int gr_dormant(const sward_params *s, const gr_state *st);

/* Starts a strip at cover_kgdm_ha (base + green, kg DM/ha).  Green is set
 * to cover minus the sward's base cover, raised to GR_GREEN_FLOOR_KGDM_HA
 * if lower (so the state's cover may be above the one asked for); the
 * running mean starts empty.  Returns 0, or -1 (st zeroed when not NULL)
 * for a NULL pointer, a cover that is negative or not finite, or a base
 * cover that is negative or not finite. */
int gr_state_init(const sward_params *s, double cover_kgdm_ha, gr_state *st);

/* Cover of the strip, base + green, kg DM/ha; NaN for NULL. */
double gr_cover_kgdm_ha(const gr_state *st);

/* Grazes or mows the strip down to residual cover to_cover_kgdm_ha
 * (base + green), never below base + GR_GREEN_FLOOR_KGDM_HA; returns the
 * green mass removed, kg DM/ha (0 when the cover is already at or below
 * the residual).  NaN, with the state unchanged, for a NULL state or a NaN
 * residual. */
double gr_cut(gr_state *st, double to_cover_kgdm_ha);

/* Advances the strip by one hour (explicit step: light interception and
 * senescence use the green cover at the start of the hour):
 *   sw_w_m2       shortwave on the strip's ground, hourly mean, W m-2
 *                 (mc_result.sw_w_m2); negative is taken as 0 (dark);
 *   t_leaf_c      top-leaf temperature (mc_result.leaf_c);
 *   vpd_leaf_kpa  leaf-to-air VPD (mc_result.vpd_kpa);
 *   ks            FAO-56 water stress coefficient, 0..1, from soil.c;
 *   t_air_c       air temperature this hour, for the dormancy rule.
 * In a dark hour (sw_w_m2 <= 0) growth is 0 and t_leaf_c / vpd_leaf_kpa
 * may be NaN, as micro.c gives them at night.  Senescence runs every hour:
 * senescence_per_day / 24 of the green cover (times
 * GR_DORMANT_SENESCENCE_FACTOR when dormant), stopping at the floor.
 * Fills *out and returns 0.  Returns -1, leaving *st unchanged and every
 * number in *out NaN, on bad input: a NULL pointer (out then untouched if
 * it is the NULL one), sw_w_m2 or t_air_c not finite, ks outside [0, 1]
 * or NaN, or - in a lit hour - a NaN leaf temperature or VPD, or sward
 * parameters that make a modifier NaN (see gr_temp_beta, gr_vpd_mod,
 * gr_intercepted). */
int gr_hour(const sward_params *s, gr_state *st, double sw_w_m2,
            double t_leaf_c, double vpd_leaf_kpa, double ks, double t_air_c,
            gr_flux *out);

#endif
