/* growth.c - forage growth of one ground strip, hour by hour.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * What it is for: the paddock forecast needs, for every strip across a
 * tracker row, how much herbage grows and dies each hour from the light,
 * leaf temperature and leaf VPD the microclimate stage gives that strip
 * and the water stress the soil-water stage gives it.  This file turns
 * those into kg DM/ha and keeps the strip's green cover (gr_state).
 *
 * How the pieces fit (one published method per function):
 *   gr_temp_beta      Yin et al. (1995) Beta function, leaf temperature;
 *   gr_vpd_mod        3-PG VPD modifier (Landsberg & Waring 1997);
 *   gr_intercepted    Beer's law interception (Monsi & Saeki 1953);
 *   gr_gross_kgdm_ha  radiation use efficiency (Monteith 1977) times the
 *                     modifiers;
 *   gr_dormant        the winter dormancy rule (stated, no source), reading
 *                     the running 7-day mean air temperature kept in
 *                     gr_state by push_t_air();
 *   gr_hour           one explicit hourly step of the green pool:
 *                     green += gross - senescence, floored;
 *   gr_state_init, gr_cut, gr_cover_kgdm_ha  the state's life cycle.
 * Ks (FAO-56 eq. 84) comes from soil.c and is used as given.
 *
 * References:
 *   Yin, X., Kropff, M.J., McLaren, G. & Visperas, R.M. (1995) A nonlinear
 *     model for crop development as a function of temperature. Agric. For.
 *     Meteorol. 77:1-16.
 *   Yan, W. & Hunt, L.A. (1999) An equation for modelling the temperature
 *     response of plants using only the cardinal temperatures. Ann. Bot.
 *     84:607-614 (the same form with Tmin = 0).
 *   Landsberg, J.J. & Waring, R.H. (1997) A generalised model of forest
 *     productivity using simplified concepts of radiation-use efficiency,
 *     carbon balance and partitioning. For. Ecol. Manage. 95:209-228.
 *   Monsi, M. & Saeki, T. (1953) Uber den Lichtfaktor in den
 *     Pflanzengesellschaften und seine Bedeutung fur die Stoffproduktion.
 *     Jpn. J. Bot. 14:22-52.
 *   Monteith, J.L. (1977) Climate and the efficiency of crop production in
 *     Britain. Phil. Trans. R. Soc. Lond. B 281:277-294.
 *   Allen, R.G. et al. (1998) FAO Irrigation and Drainage Paper 56, eq. 84
 *     (Ks; computed in soil.c).
 */
#include "growth.h"

#include <math.h>
#include <stddef.h>
#include <string.h>

#include "irrad.h"

#define GR_NAN ((double)NAN)     /* NAN is a float; spare -Wdouble-promotion */
#define GR_S_PER_H 3600.0        /* seconds per hour, definition */
#define GR_J_PER_MJ 1e6          /* definition */
#define GR_MBAR_PER_KPA 10.0     /* 1 kPa = 10 hPa = 10 mbar, definition */
#define GR_KGHA_PER_GM2 10.0     /* 1 g m-2 = 10 kg ha-1, definition */
#define GR_H_PER_DAY 24.0        /* definition */

/* ---- Published modifiers ----------------------------------------------- */

/* Yin et al. (1995) Beta function, r = exp(mu) (T - Tb)^alpha (Tc - T)^beta
 * (the paper's model equation; equation number not checked here).  Its
 * peak lies where alpha/(T - Tb) = beta/(Tc - T), i.e. at
 * To = (alpha Tc + beta Tb)/(alpha + beta).  Taking beta = 1 and
 * alpha = a = (To - Tb)/(Tc - To) puts the peak at the given To; dividing
 * by the value there gives f(To) = 1:
 *   f = ((T - Tb)/(To - Tb))^a ((Tc - T)/(Tc - To)).
 * With Tb = 0 this is the Yan & Hunt (1999) equation (from memory;
 * equation number not checked). */
double gr_temp_beta(double t_c, double t_min_c, double t_opt_c,
                    double t_max_c)
{
    if (isnan(t_c) || !(t_min_c < t_opt_c && t_opt_c < t_max_c) ||
        !isfinite(t_min_c) || !isfinite(t_max_c))
        return GR_NAN;
    if (t_c <= t_min_c || t_c >= t_max_c)
        return 0.0;
    double a = (t_opt_c - t_min_c) / (t_max_c - t_opt_c);
    double rise = (t_c - t_min_c) / (t_opt_c - t_min_c);
    double fall = (t_max_c - t_c) / (t_max_c - t_opt_c);
    return pow(rise, a) * fall;
}

/* Landsberg & Waring (1997), 3-PG: the vapour pressure deficit modifier
 * f_D = exp(-k_D D), D in mbar (equation number not checked here). */
double gr_vpd_mod(double vpd_kpa, double k_per_mbar)
{
    if (isnan(vpd_kpa) || !(k_per_mbar >= 0.0) || !isfinite(k_per_mbar))
        return GR_NAN;
    double d_mbar = vpd_kpa > 0.0 ? vpd_kpa * GR_MBAR_PER_KPA : 0.0;
    return exp(-k_per_mbar * d_mbar);
}

/* Beer's law for a canopy (Monsi & Saeki 1953): transmitted share
 * exp(-k LAI), so the intercepted share is 1 - exp(-k LAI). */
double gr_intercepted(double lai, double k)
{
    if (!(lai >= 0.0) || !(k > 0.0) || !isfinite(k))
        return GR_NAN;
    return -expm1(-k * lai);
}

/* Monteith (1977): dry matter grown = RUE x intercepted radiation; here
 * PAR, with the modifiers multiplied onto RUE (the product of modifiers is
 * this project's choice; common practice, no source). */
double gr_gross_kgdm_ha(double rue_g_per_mj_par, double par_mj_m2,
                        double intercepted_frac, double f_temp,
                        double f_vpd, double ks)
{
    if (!(rue_g_per_mj_par >= 0.0) || !(par_mj_m2 >= 0.0) ||
        !(intercepted_frac >= 0.0) || !(f_temp >= 0.0) ||
        !(f_vpd >= 0.0) || !(ks >= 0.0))
        return GR_NAN;
    double g_m2 = rue_g_per_mj_par * par_mj_m2 * intercepted_frac * f_temp *
                  f_vpd * ks;
    return g_m2 * GR_KGHA_PER_GM2;
}

/* ---- Running mean air temperature and the dormancy rule --------------- */

static double ring_sum(const gr_state *st)
{
    double sum = 0.0;
    for (int i = 0; i < st->t_air_n; i++)
        sum += st->t_air_c[i];
    return sum;
}

/* Adds one hour to the ring; the sum is rebuilt from the ring each time
 * the ring wraps, so adding and subtracting cannot drift for long. */
static void push_t_air(gr_state *st, double t_air_c)
{
    if (st->t_air_n == GR_T_AIR_HOURS)
        st->t_air_sum_c -= st->t_air_c[st->t_air_next];
    else
        st->t_air_n++;
    st->t_air_c[st->t_air_next] = t_air_c;
    st->t_air_sum_c += t_air_c;
    st->t_air_next = (st->t_air_next + 1) % GR_T_AIR_HOURS;
    if (st->t_air_next == 0)
        st->t_air_sum_c = ring_sum(st);
}

double gr_t_air_7d_c(const gr_state *st)
{
    if (!st || st->t_air_n <= 0)
        return GR_NAN;
    return st->t_air_sum_c / st->t_air_n;
}

/* Dormancy: running 7-day mean air temperature below t_min_c + 2 C
 * (common practice, no source). */
int gr_dormant(const sward_params *s, const gr_state *st)
{
    if (!s)
        return 0;
    double t7_c = gr_t_air_7d_c(st);
    return t7_c < s->t_min_c + GR_DORMANCY_MARGIN_C; /* false for NaN */
}

/* ---- The state ---------------------------------------------------------- */

int gr_state_init(const sward_params *s, double cover_kgdm_ha, gr_state *st)
{
    if (!st)
        return -1;
    memset(st, 0, sizeof *st);
    if (!s || !isfinite(cover_kgdm_ha) || cover_kgdm_ha < 0.0 ||
        !isfinite(s->base_cover_kgdm_ha) || s->base_cover_kgdm_ha < 0.0)
        return -1;
    double green = cover_kgdm_ha - s->base_cover_kgdm_ha;
    st->base_kgdm_ha = s->base_cover_kgdm_ha;
    st->green_kgdm_ha = green > GR_GREEN_FLOOR_KGDM_HA ? green : GR_GREEN_FLOOR_KGDM_HA;
    return 0;
}

double gr_cover_kgdm_ha(const gr_state *st)
{
    return st ? st->base_kgdm_ha + st->green_kgdm_ha : GR_NAN;
}

double gr_cut(gr_state *st, double to_cover_kgdm_ha)
{
    if (!st || isnan(to_cover_kgdm_ha))
        return GR_NAN;
    double green_to = to_cover_kgdm_ha - st->base_kgdm_ha;
    if (green_to < GR_GREEN_FLOOR_KGDM_HA)
        green_to = GR_GREEN_FLOOR_KGDM_HA;
    if (st->green_kgdm_ha <= green_to)
        return 0.0;
    double removed = st->green_kgdm_ha - green_to;
    st->green_kgdm_ha = green_to;
    return removed;
}

/* ---- One hour ----------------------------------------------------------- */

static void flux_nan(gr_flux *out)
{
    out->par_mj_m2 = out->lai = out->intercepted_frac = GR_NAN;
    out->f_temp = out->f_vpd = out->ks = out->t_air_7d_c = GR_NAN;
    out->gross_kgdm_ha = out->senescence_kgdm_ha = GR_NAN;
    out->dormant = 0;
}

/* PAR over the hour, MJ m-2, from hourly mean shortwave in W m-2. */
static double par_hour_mj_m2(double sw_w_m2)
{
    double sw = sw_w_m2 > 0.0 ? sw_w_m2 : 0.0;
    return sw * IRR_PAR_FRACTION * GR_S_PER_H / GR_J_PER_MJ;
}

/* Everything of the hour that does not touch the state; -1 when an input
 * makes the hour impossible to compute. */
static int hour_terms(const sward_params *s, const gr_state *st,
                      double sw_w_m2, double t_leaf_c, double vpd_leaf_kpa,
                      double ks, double t_air_c, gr_flux *f)
{
    if (!isfinite(sw_w_m2) || !isfinite(t_air_c) || !(ks >= 0.0 && ks <= 1.0) ||
        !(s->senescence_per_day >= 0.0) || !isfinite(s->senescence_per_day))
        return -1;
    int lit = sw_w_m2 > 0.0;
    f->par_mj_m2 = par_hour_mj_m2(sw_w_m2);
    f->lai = s->leaf_area_per_cover_m2_per_kgdm_ha * st->green_kgdm_ha;
    f->intercepted_frac = gr_intercepted(f->lai, s->light_extinction_k);
    f->f_temp = gr_temp_beta(t_leaf_c, s->t_min_c, s->t_opt_c, s->t_max_c);
    f->f_vpd = gr_vpd_mod(vpd_leaf_kpa, s->vpd_coeff_per_mbar);
    f->ks = ks;
    if (isnan(f->intercepted_frac))
        return -1;
    if (!lit)
        return 0;
    f->gross_kgdm_ha = gr_gross_kgdm_ha(s->rue_g_per_mj_par, f->par_mj_m2,
                                        f->intercepted_frac, f->f_temp,
                                        f->f_vpd, ks);
    return isnan(f->gross_kgdm_ha) ? -1 : 0;
}

/* Senescence this hour, limited so green + gross - senescence stays at or
 * above the floor (green itself is at or above it). */
static double senescence_hour(const sward_params *s, const gr_state *st,
                              int dormant, double gross_kgdm_ha)
{
    double rate_per_h = s->senescence_per_day / GR_H_PER_DAY;
    if (dormant)
        rate_per_h *= GR_DORMANT_SENESCENCE_FACTOR;
    double sen = rate_per_h * st->green_kgdm_ha;
    double room = st->green_kgdm_ha + gross_kgdm_ha - GR_GREEN_FLOOR_KGDM_HA;
    if (room < 0.0)
        room = 0.0;
    return sen < room ? sen : room;
}

int gr_hour(const sward_params *s, gr_state *st, double sw_w_m2,
            double t_leaf_c, double vpd_leaf_kpa, double ks, double t_air_c,
            gr_flux *out)
{
    if (!out)
        return -1;
    flux_nan(out);
    gr_flux f;
    flux_nan(&f);
    f.gross_kgdm_ha = 0.0;
    if (!s || !st ||
        hour_terms(s, st, sw_w_m2, t_leaf_c, vpd_leaf_kpa, ks, t_air_c, &f) < 0)
        return -1;
    push_t_air(st, t_air_c);
    f.t_air_7d_c = gr_t_air_7d_c(st);
    f.dormant = gr_dormant(s, st);
    if (f.dormant)
        f.gross_kgdm_ha = 0.0;
    f.senescence_kgdm_ha = senescence_hour(s, st, f.dormant, f.gross_kgdm_ha);
    st->green_kgdm_ha += f.gross_kgdm_ha - f.senescence_kgdm_ha;
    if (st->green_kgdm_ha < GR_GREEN_FLOOR_KGDM_HA) /* rounding only */
        st->green_kgdm_ha = GR_GREEN_FLOOR_KGDM_HA;
    st->senesced_kgdm_ha += f.senescence_kgdm_ha;
    *out = f;
    return 0;
}
