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
 *   gr_sunlit_shaded  light absorbed by sunlit and shaded leaves (de Pury
 *                     & Farquhar 1997);
 *   gr_leaf_nrh       the non-rectangular hyperbola of leaf photosynthesis
 *                     (Thornley & Johnson 1990);
 *   gr_canopy_gross_umol  the two big leaves summed (de Pury & Farquhar
 *                     1997);
 *   gr_gross_kgdm_ha  dry matter from the CO2 fixed, times the modifiers;
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
 *   de Pury, D.G.G. & Farquhar, G.D. (1997) Simple scaling of
 *     photosynthesis from leaves to canopies without the errors of big-leaf
 *     models. Plant Cell Environ. 20:537-557.
 *   Thornley, J.H.M. & Johnson, I.R. (1990) Plant and Crop Modelling: a
 *     mathematical approach to plant and crop physiology. Clarendon Press,
 *     Oxford.
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

/* Noilhan, J. & Planton, S. (1989) A simple parameterization of land
 * surface processes for meteorological models. Monthly Weather Review
 * 117:536-549: the radiation factor F1 of the surface resistance
 * Rs = (Rs_min / LAI) F1^-1 F2^-1 F3^-1 F4^-1, with
 *   f  = 0.55 (Rg / R_GL) (2 / LAI)                 (radiation, per leaf)
 *   F1 = (f + Rs_min / Rs_max) / (1 + f)            (written here as the
 *        conductance factor, the inverse of N&P's resistance factor)
 * (equation numbers not checked here; the form was checked against the
 * ISBA code of a public land-surface model, and Rs_max = 5000 s/m is the
 * Noah land-surface model's table value, WRF run/VEGPARM.TBL). */
double gr_stomata_light_f1(double rg_w_m2, double lai, double rgl_w_m2,
                           double rs_min_s_m)
{
    if (!(rg_w_m2 >= 0.0) || !isfinite(rg_w_m2) || !(lai >= 0.0) || !isfinite(lai) ||
        !(rgl_w_m2 > 0.0) || !isfinite(rgl_w_m2) || !(rs_min_s_m > 0.0) ||
        !(rs_min_s_m < GR_RS_MAX_S_M))
        return GR_NAN;
    if (lai == 0.0)
        return 1.0;
    double f = 0.55 * (rg_w_m2 / rgl_w_m2) * (2.0 / lai);
    return (f + rs_min_s_m / GR_RS_MAX_S_M) / (1.0 + f);
}

/* Beer's law for a canopy (Monsi & Saeki 1953): transmitted share
 * exp(-k LAI), so the intercepted share is 1 - exp(-k LAI). */
double gr_intercepted(double lai, double k)
{
    if (!(lai >= 0.0) || !(k > 0.0) || !isfinite(k))
        return GR_NAN;
    return -expm1(-k * lai);
}

/* ---- Canopy photosynthesis ---------------------------------------------- */

static int bad(double x)
{
    return !(x >= 0.0) || !isfinite(x);
}

/* de Pury, D.G.G. & Farquhar, G.D. (1997) Simple scaling of photosynthesis
 * from leaves to canopies without the errors of big-leaf models. Plant
 * Cell Environ. 20:537-557, the radiation part of the Appendix (equation
 * numbers from memory, not checked against the paper: A3-A5 for kb', rho_h
 * and rho_cb, 13 for the absorbed total I_c, 20 for the sunlit leaves'
 * I_c,sun, and the shaded leaves as I_c - I_c,sun):
 *   kb     = G / sin(beta)                 beam, black leaves
 *   kb'    = kb sqrt(1 - sigma)             beam and scattered beam
 *   rho_h  = (1 - sqrt(1 - sigma)) / (1 + sqrt(1 - sigma))
 *   rho_cb = 1 - exp(-2 rho_h kb / (1 + kb))
 *   I_c    = (1 - rho_cb) I_b (1 - exp(-kb' L)) + (1 - rho_cd) I_d (1 - exp(-kd' L))
 *   I_sun  = I_b (1 - sigma)(1 - exp(-kb L))
 *          + (1 - rho_cd) I_d kd'/(kd' + kb) (1 - exp(-(kd' + kb) L))
 *          + I_b [ (1 - rho_cb) kb'/(kb' + kb) (1 - exp(-(kb' + kb) L))
 *                  - (1 - sigma)(1 - exp(-2 kb L)) / 2 ]
 *   I_shade = I_c - I_sun;  L_sun = (1 - exp(-kb L)) / kb;  L_shade = L - L_sun.
 * The paper's kb = 0.5 / sin(beta) is the spherical leaf angle
 * distribution; here 0.5 is the sward's G and kd' is scaled by G / 0.5
 * (this project's choice, exact for G = 0.5). */
int gr_dpf_optics(double sun_elev_deg, double g_leaf, gr_optics *out)
{
    const double deg = 3.14159265358979323846 / 180.0;
    out->g_leaf = out->kb = out->kb_scat = out->kd_scat = out->rho_cb = GR_NAN;
    out->beam_as_sky = 0;
    if (!isfinite(sun_elev_deg) || !(g_leaf > 0.0) || !isfinite(g_leaf))
        return -1;
    if (sun_elev_deg < GR_DPF_MIN_ELEV_DEG) {
        out->beam_as_sky = 1;
        sun_elev_deg = GR_DPF_MIN_ELEV_DEG;
    }
    double sq = sqrt(1.0 - GR_DPF_SIGMA);
    double rho_h = (1.0 - sq) / (1.0 + sq);
    out->g_leaf = g_leaf;
    out->kb = g_leaf / sin(sun_elev_deg * deg);
    out->kb_scat = out->kb * sq;
    out->kd_scat = GR_DPF_KD_SCAT * g_leaf / 0.5;
    out->rho_cb = -expm1(-2.0 * rho_h * out->kb / (1.0 + out->kb));
    return 0;
}

int gr_sunlit_shaded(double par_beam, double par_sky, double lai,
                     double sun_elev_deg, double g_leaf, gr_sunshade *out)
{
    gr_optics o;
    if (gr_dpf_optics(sun_elev_deg, g_leaf, &o) < 0) {
        out->lai_sun = out->lai_shade = out->abs_sun = out->abs_shade = GR_NAN;
        out->abs_total = out->kb = out->kb_scat = out->rho_cb = GR_NAN;
        return -1;
    }
    return gr_sunlit_shaded_optics(par_beam, par_sky, lai, &o, out);
}

int gr_sunlit_shaded_optics(double par_beam, double par_sky, double lai,
                            const gr_optics *o, gr_sunshade *out)
{
    out->lai_sun = out->lai_shade = out->abs_sun = out->abs_shade = GR_NAN;
    out->abs_total = out->kb = out->kb_scat = out->rho_cb = GR_NAN;
    if (!o || isnan(o->kb) || bad(par_beam) || bad(par_sky) || bad(lai))
        return -1;
    if (o->beam_as_sky) {
        par_sky += par_beam;
        par_beam = 0.0;
    }
    double kb = o->kb, kbs = o->kb_scat, kds = o->kd_scat, rho_cb = o->rho_cb;
    /* three exponentials serve all five terms: e^-(a+b)L = e^-aL e^-bL */
    double eb = exp(-kb * lai), ebs = exp(-kbs * lai), eds = exp(-kds * lai);
    double tb = 1.0 - eb; /* 1 - exp(-kb L) */
    double total = (1.0 - rho_cb) * par_beam * (1.0 - ebs) +
                   (1.0 - GR_DPF_RHO_CD) * par_sky * (1.0 - eds);
    double sun = par_beam * (1.0 - GR_DPF_SIGMA) * tb +
                 (1.0 - GR_DPF_RHO_CD) * par_sky * kds / (kds + kb) * (1.0 - eds * eb) +
                 par_beam * ((1.0 - rho_cb) * kbs / (kbs + kb) * (1.0 - ebs * eb) -
                             (1.0 - GR_DPF_SIGMA) * (1.0 - eb * eb) / 2.0);
    if (sun < 0.0) /* rounding only */
        sun = 0.0;
    if (sun > total)
        sun = total;
    out->kb = kb;
    out->kb_scat = kbs;
    out->rho_cb = rho_cb;
    out->lai_sun = tb / kb;
    out->lai_shade = lai - out->lai_sun;
    if (out->lai_shade < 0.0)
        out->lai_shade = 0.0;
    out->abs_sun = sun;
    out->abs_shade = total - sun;
    out->abs_total = total;
    return 0;
}

/* Thornley, J.H.M. & Johnson, I.R. (1990) Plant and Crop Modelling.
 * Clarendon Press, Oxford: the non-rectangular hyperbola of leaf
 * photosynthesis (ch. 9; equation number from memory, not checked),
 *   theta P^2 - (alpha I + Pmax) P + alpha I Pmax = 0,
 * its smaller root.  Written as 2 c / (b + sqrt(b^2 - 4 theta c)), with
 * b = alpha I + Pmax and c = alpha I Pmax, which is the same root, stays
 * exact for theta = 0 and loses no digits to cancellation. */
double gr_leaf_nrh(double i_umol, double alpha, double pmax, double theta)
{
    if (bad(i_umol) || bad(alpha) || bad(pmax) || !(theta >= 0.0 && theta <= 1.0))
        return GR_NAN;
    double ai = alpha * i_umol, b = ai + pmax, c = ai * pmax;
    if (c <= 0.0)
        return 0.0;
    double disc = b * b - 4.0 * theta * c;
    return 2.0 * c / (b + sqrt(disc > 0.0 ? disc : 0.0));
}

/* de Pury & Farquhar (1997): canopy photosynthesis as the sum of the
 * sunlit and the shaded big leaf, each with the capacity of its own leaf
 * area; each on the hyperbola of gr_leaf_nrh. */
double gr_canopy_gross_umol(const gr_sunshade *ss, double alpha,
                            double pmax_leaf_umol, double theta)
{
    if (!ss)
        return GR_NAN;
    return gr_leaf_nrh(ss->abs_sun, alpha, pmax_leaf_umol * ss->lai_sun, theta) +
           gr_leaf_nrh(ss->abs_shade, alpha, pmax_leaf_umol * ss->lai_shade, theta);
}

/* Dry matter from the CO2 fixed (the carbon balance of Thornley & Johnson
 * 1990 collapsed into one yield Y net of respiration; from memory), with
 * the modifiers multiplied on.  The modifiers scale the whole canopy rate,
 * the role 3-PG gives its VPD modifier (on the canopy quantum efficiency,
 * Landsberg & Waring 1997); the product of modifiers is this project's
 * choice (common practice, no source). */
double gr_gross_kgdm_ha(double dm_per_co2_g_per_mol, double canopy_umol_m2_s,
                        double f_temp, double f_vpd, double ks)
{
    if (!(dm_per_co2_g_per_mol >= 0.0) || !(canopy_umol_m2_s >= 0.0) ||
        !(f_temp >= 0.0) || !(f_vpd >= 0.0) || !(ks >= 0.0))
        return GR_NAN;
    double mol_m2 = canopy_umol_m2_s * GR_S_PER_H * 1e-6;
    return dm_per_co2_g_per_mol * mol_m2 * f_temp * f_vpd * ks * GR_KGHA_PER_GM2;
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
    out->par_mj_m2 = out->par_sky_mj_m2 = out->canopy_umol_m2_s = GR_NAN;
    out->lai = out->intercepted_frac = GR_NAN;
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

/* Canopy gross photosynthesis of a lit hour, umol CO2 m-2 s-1: PAR photon
 * flux split into beam and sky, absorbed by sunlit and shaded leaves. */
static double canopy_hour(const sward_params *s, const gr_light *l, double sky_w_m2,
                          double lai)
{
    double par_umol = irr_par_umol(irr_par_w_m2(l->sw_w_m2));
    double sky_umol = irr_par_umol(irr_par_w_m2(sky_w_m2));
    double beam_umol = par_umol - sky_umol;
    gr_sunshade ss;
    gr_optics own;
    const gr_optics *o = l->optics;
    if (!o) {
        if (gr_dpf_optics(l->sun_elev_deg, s->light_extinction_k, &own) < 0)
            return GR_NAN;
        o = &own;
    } else if (o->g_leaf != s->light_extinction_k) {
        return GR_NAN;
    }
    if (gr_sunlit_shaded_optics(beam_umol > 0.0 ? beam_umol : 0.0, sky_umol, lai, o, &ss) < 0)
        return GR_NAN;
    return gr_canopy_gross_umol(&ss, s->leaf_quantum_yield_mol_per_mol,
                                s->leaf_pmax_umol_m2_s, s->leaf_curvature);
}

/* Everything of the hour that does not touch the state; -1 when an input
 * makes the hour impossible to compute. */
static int hour_terms(const sward_params *s, const gr_state *st,
                      const gr_light *l, double t_leaf_c, double vpd_leaf_kpa,
                      double ks, double t_air_c, gr_flux *f)
{
    double k = s->light_extinction_k;
    if (!isfinite(l->sw_w_m2) || !isfinite(l->sky_w_m2) || !isfinite(l->sun_elev_deg) ||
        !isfinite(t_air_c) || !(ks >= 0.0 && ks <= 1.0) ||
        !(s->senescence_per_day >= 0.0) || !isfinite(s->senescence_per_day))
        return -1;
    int lit = l->sw_w_m2 > 0.0;
    double sky = l->sky_w_m2 < 0.0 ? 0.0 : l->sky_w_m2;
    if (sky > l->sw_w_m2)
        sky = lit ? l->sw_w_m2 : 0.0;
    f->par_mj_m2 = par_hour_mj_m2(l->sw_w_m2);
    f->par_sky_mj_m2 = par_hour_mj_m2(sky);
    f->lai = s->leaf_area_per_cover_m2_per_kgdm_ha * st->green_kgdm_ha;
    if (!(f->lai >= 0.0) || !(k > 0.0) || !isfinite(k)) /* gr_intercepted: NaN */
        return -1;
    f->intercepted_frac = l->intercepted_frac > 0.0 ? l->intercepted_frac
                                                    : gr_intercepted(f->lai, k);
    f->f_temp = gr_temp_beta(t_leaf_c, s->t_min_c, s->t_opt_c, s->t_max_c);
    f->f_vpd = gr_vpd_mod(vpd_leaf_kpa, s->vpd_coeff_per_mbar);
    f->ks = ks;
    f->canopy_umol_m2_s = 0.0;
    if (!lit)
        return 0;
    if (!(f->f_temp * f->f_vpd * ks > 0.0)) { /* no growth; NaN passes on */
        f->gross_kgdm_ha = gr_gross_kgdm_ha(s->dm_per_co2_g_per_mol, 0.0, f->f_temp,
                                            f->f_vpd, ks);
        return isnan(f->gross_kgdm_ha) ? -1 : 0;
    }
    f->canopy_umol_m2_s = canopy_hour(s, l, sky, f->lai);
    f->gross_kgdm_ha = gr_gross_kgdm_ha(s->dm_per_co2_g_per_mol, f->canopy_umol_m2_s,
                                        f->f_temp, f->f_vpd, ks);
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

int gr_hour(const sward_params *s, gr_state *st, const gr_light *light,
            double t_leaf_c, double vpd_leaf_kpa, double ks, double t_air_c,
            gr_flux *out)
{
    if (!out)
        return -1;
    gr_flux f;
    flux_nan(&f);
    f.gross_kgdm_ha = 0.0;
    if (!s || !st || !light ||
        hour_terms(s, st, light, t_leaf_c, vpd_leaf_kpa, ks, t_air_c, &f) < 0) {
        flux_nan(out);
        return -1;
    }
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
