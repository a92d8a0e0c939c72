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
 *   Y (g DM per mol of CO2 fixed) x canopy gross photosynthesis (mol CO2
 *   m-2 over the hour) x f(T_leaf) x f(VPD_leaf) x Ks x 10 (g m-2 ->
 *   kg ha-1), zero while the sward is dormant.
 * The canopy gross photosynthesis is that of two big leaves, the sunlit
 * and the shaded leaves of de Pury & Farquhar (1997): the light the strip
 * gets is split into beam and sky (diffuse) light, each big leaf absorbs
 * its share (gr_sunlit_shaded), and each responds to it by the
 * non-rectangular hyperbola of leaf photosynthesis (Thornley & Johnson
 * 1990; gr_leaf_nrh) with a light-saturated rate proportional to its leaf
 * area (gr_canopy_gross_umol).  So growth saturates in strong light and
 * uses diffuse light (which reaches the shaded leaves) better than beam
 * light: an hour at half light loses less than half its growth.
 * Each factor is one public function below, named after its source.
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

/* de Pury & Farquhar (1997), Table 2 (from memory, not checked against the
 * table): leaf scattering coefficient for PAR, canopy reflection
 * coefficient for diffuse PAR, and the extinction coefficient of diffuse
 * and scattered diffuse PAR (for a spherical leaf angle distribution). */
#define GR_DPF_SIGMA 0.15
#define GR_DPF_RHO_CD 0.036
#define GR_DPF_KD_SCAT 0.78
/* Below this solar elevation the beam is treated as sky light: kb =
 * G / sin(elevation) diverges at the horizon (this project's choice; the
 * beam there is weak and the hour's share of growth small). */
#define GR_DPF_MIN_ELEV_DEG 3.0

/* The state of one strip's sward.  Only gr_state_init(), gr_hour() and
 * gr_cut() should write it.
 *   cover (what a sward stick measures, kg DM/ha) = base + green;
 *   green grows and senesces; it stays >= GR_GREEN_FLOOR_KGDM_HA;
 *   there is no hard ceiling: green levels off where senescence balances
 *   growth, green = daily gross growth / senescence_per_day (e.g. 190 / 0.02
 *   = 9,500 kg DM/ha for a sward growing 190 kg DM/ha a day);
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
/* The sun-dependent canopy optics of de Pury & Farquhar (1997) for one
 * hour and one leaf projection G (gr_dpf_optics): the same for every strip
 * of that hour, so a caller with many strips makes them once. */
typedef struct gr_optics {
    double g_leaf;             /* the G it was made for */
    double kb, kb_scat;        /* beam extinction, black leaves and with scattering */
    double kd_scat;            /* diffuse and scattered diffuse extinction */
    double rho_cb;             /* canopy reflection coefficient for beam */
    int beam_as_sky;           /* 1 below GR_DPF_MIN_ELEV_DEG */
} gr_optics;

/* Light on a strip's ground in one hour (gr_hour). */
typedef struct gr_light {
    double sw_w_m2;            /* shortwave, beam + sky, hourly mean, W m-2 */
    double sky_w_m2;           /* its diffuse (sky) part, W m-2, 0..sw_w_m2 */
    double sun_elev_deg;       /* solar elevation at mid-hour, degrees */
    const gr_optics *optics;   /* NULL, or gr_dpf_optics(sun_elev_deg, the
                                  sward's light_extinction_k): a shortcut */
    double intercepted_frac;   /* 0, or gr_intercepted(the green LAI at the
                                  start of the hour, the sward's
                                  light_extinction_k) already made by the
                                  caller (pasture.c makes it first, as the
                                  soil's ground cover): a shortcut; 0 (also
                                  what an initializer leaves) makes gr_hour
                                  compute it */
} gr_light;

/* Light absorbed by the sunlit and the shaded leaves of a canopy, per m2 of
 * ground (gr_sunlit_shaded). */
typedef struct gr_sunshade {
    double lai_sun, lai_shade; /* leaf area of each, m2 m-2 */
    double abs_sun, abs_shade; /* absorbed PAR of each, in the unit given */
    double abs_total;          /* abs_sun + abs_shade */
    double kb, kb_scat;        /* beam extinction coefficient, black leaves
                                  (kb) and with scattering (kb'), - */
    double rho_cb;             /* canopy reflection coefficient for beam, - */
} gr_sunshade;

typedef struct gr_flux {
    double par_mj_m2;          /* PAR reaching the strip's ground, MJ m-2 */
    double par_sky_mj_m2;      /* its diffuse part, MJ m-2 */
    double canopy_umol_m2_s;   /* canopy gross photosynthesis before the
                                  modifiers, umol CO2 m-2 s-1 (0 in the dark) */
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

/* Largest stomatal resistance of a canopy in the dark, s/m: the Noah
 * land-surface model's RSMAX (WRF run/VEGPARM.TBL, 5000 s/m), the value
 * Noilhan & Planton (1989) use (from memory for the paper). */
#define GR_RS_MAX_S_M 5000.0

/* Radiation factor F1 of a canopy's stomatal (surface) conductance,
 * Noilhan & Planton (1989), as the Noah and ISBA land-surface schemes
 * use it: f = 0.55 (Rg / R_GL) (2 / LAI), F1 = (f + rs_min / rs_max) /
 * (1 + f), rs_max = GR_RS_MAX_S_M.  The conductance is F1 times its
 * full-light value, so the surface resistance is rs_min / (LAI F1 ...).
 * In (0, 1]: rs_min / rs_max in the dark, -> 1 in strong light; 1 when
 * lai is 0 (no leaves, nothing to close).  rg_w_m2 is the solar
 * radiation reaching the canopy, rgl_w_m2 the radiation at which
 * stomata are half way open (R_GL), rs_min_s_m the sward's least
 * stomatal resistance.  NaN when rg_w_m2 or lai is negative or NaN,
 * rgl_w_m2 is not positive, or rs_min_s_m is outside (0, rs_max). */
double gr_stomata_light_f1(double rg_w_m2, double lai, double rgl_w_m2,
                           double rs_min_s_m);

/* Share of incident light a canopy intercepts, Beer's law (Monsi & Saeki
 * 1953): 1 - exp(-k LAI), in [0, 1].  NaN when either argument is NaN,
 * lai is negative or k is not positive and finite. */
double gr_intercepted(double lai, double k);

/* de Pury & Farquhar (1997) sunlit/shaded big leaves: the PAR a canopy of
 * leaf area lai absorbs from beam light par_beam and sky light par_sky
 * (both on the horizontal, same unit, e.g. umol m-2 s-1), split between its
 * sunlit and shaded leaves, with the sun at elevation sun_elev_deg.
 * g_leaf is the leaf projection G (0.5 for a spherical leaf angle
 * distribution; the sward's light_extinction_k): kb = G / sin(elevation).
 * Leaf scattering sigma 0.15, canopy reflection for diffuse PAR 0.036 and
 * the diffuse extinction coefficient kd' = 0.78 (scaled by G / 0.5) are the
 * paper's PAR values (GR_DPF_*).  Below GR_DPF_MIN_ELEV_DEG the beam is
 * treated as sky light (kb would diverge).  Fills *out and returns 0; -1
 * (out NaN) for a NaN, negative or infinite input or g_leaf <= 0. */
int gr_sunlit_shaded(double par_beam, double par_sky, double lai,
                     double sun_elev_deg, double g_leaf, gr_sunshade *out);

/* The sun-dependent part of gr_sunlit_shaded: kb, kb', kd', rho_cb for
 * solar elevation sun_elev_deg and leaf projection g_leaf.  Returns 0, or
 * -1 (out NaN) for a non-finite elevation or g_leaf not positive and
 * finite. */
int gr_dpf_optics(double sun_elev_deg, double g_leaf, gr_optics *out);

/* gr_sunlit_shaded with the optics made beforehand (same checks on the
 * light and leaf area; -1 for a NULL or NaN optics). */
int gr_sunlit_shaded_optics(double par_beam, double par_sky, double lai,
                            const gr_optics *o, gr_sunshade *out);

/* Non-rectangular hyperbola of leaf photosynthesis (Thornley & Johnson
 * 1990): the smaller root P of theta P^2 - (alpha I + pmax) P +
 * alpha I pmax = 0, for absorbed PAR i_umol (umol photons m-2 s-1),
 * quantum yield alpha (mol CO2 per mol photons absorbed), light-saturated
 * gross rate pmax (umol CO2 m-2 s-1) and curvature theta in [0, 1]
 * (0: rectangular hyperbola; 1: Blackman, min(alpha I, pmax)).  Returns
 * umol CO2 m-2 s-1, 0 when i_umol or pmax is 0; NaN for a NaN, negative or
 * infinite argument or theta outside [0, 1]. */
double gr_leaf_nrh(double i_umol, double alpha, double pmax, double theta);

/* Canopy gross photosynthesis, umol CO2 m-2 (ground) s-1: each big leaf of
 * ss (gr_sunlit_shaded, absorbed PAR in umol m-2 s-1) on its own
 * non-rectangular hyperbola, with a light-saturated rate pmax_leaf_umol
 * per m2 of leaf times its leaf area (uniform leaf capacity; de Pury &
 * Farquhar 1997 scale capacity this way, with a nitrogen profile this
 * project leaves out).  NaN for NULL or a bad leaf parameter. */
double gr_canopy_gross_umol(const gr_sunshade *ss, double alpha,
                            double pmax_leaf_umol, double theta);

/* Gross growth this hour, kg DM/ha: canopy gross photosynthesis
 * canopy_umol_m2_s over 3600 s, times dm_per_co2_g_per_mol (dry matter
 * per mol of CO2 fixed, net of respiration), times the product of the
 * modifiers, times 10 (1 g m-2 = 10 kg ha-1).  NaN when any argument is
 * NaN or negative. */
double gr_gross_kgdm_ha(double dm_per_co2_g_per_mol, double canopy_umol_m2_s,
                        double f_temp, double f_vpd, double ks);

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
 *   light         shortwave on the strip's ground, hourly mean, and its
 *                 sky part (mc_result.sw_w_m2, mc_sky_w_m2()), with the solar
 *                 elevation; sw_w_m2 <= 0 is dark;
 *   t_leaf_c      top-leaf temperature (mc_result.leaf_c);
 *   vpd_leaf_kpa  leaf-to-air VPD (mc_result.vpd_kpa);
 *   ks            FAO-56 water stress coefficient, 0..1, from soil.c;
 *   t_air_c       air temperature this hour, for the dormancy rule.
 * In a dark hour growth is 0 and t_leaf_c / vpd_leaf_kpa may be NaN, as
 * micro.c gives them at night.  Senescence runs every hour:
 * senescence_per_day / 24 of the green cover (times
 * GR_DORMANT_SENESCENCE_FACTOR when dormant), stopping at the floor.
 * Fills *out and returns 0.  Returns -1, leaving *st unchanged and every
 * number in *out NaN, on bad input: a NULL pointer (out then untouched if
 * it is the NULL one), sw_w_m2, sky_w_m2, sun_elev_deg or t_air_c not
 * finite, ks outside [0, 1] or NaN, or - in a lit hour - a NaN leaf
 * temperature or VPD, or sward parameters that make a modifier NaN (see
 * gr_temp_beta, gr_vpd_mod, gr_intercepted, gr_leaf_nrh).  A sky part
 * below 0 or above sw_w_m2 is clamped into [0, sw_w_m2].  light->optics,
 * when given, must have been made for the sward's light_extinction_k
 * (else -1); light->intercepted_frac, when given, is taken as it is.  The canopy is not computed when the modifiers' product is 0
 * (growth is 0 then anyway). */
int gr_hour(const sward_params *s, gr_state *st, const gr_light *light,
            double t_leaf_c, double vpd_leaf_kpa, double ks, double t_air_c,
            gr_flux *out);

#endif
