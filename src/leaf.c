/* leaf.c - leaf temperature and leaf-to-air VPD from a leaf energy balance.
 *
 * For each hour and strip the microclimate stage knows the air (t_air_c,
 * ea_kpa, pressure_kpa), the wind at leaf height and the radiation the
 * leaves absorb. This file turns those into a leaf temperature, the
 * leaf-to-air vapour pressure deficit that drives transpiration, and the
 * terms of the balance.
 *
 * How the pieces fit:
 *   leaf_g_ha / leaf_g_va / leaf_g_r   conductances (C&N ch. 7 and 12)
 *   g_leaf_vapour                      stomata in series with boundary layer
 *   t_linear_c                         C&N eq. 14.6, the first guess
 *   residual / residual_slope          C&N eq. 14.1 and its derivative
 *   leaf_solve                         Newton on eq. 14.1 from eq. 14.6
 *   leaf_gs_jarvis                     stomatal conductance from light/VPD
 *
 * The balance f(T) = Rabs - eps sigma T^4 - cp g_Ha (T - Ta)
 *                    - lambda g_v (es(T) - ea) / pa
 * is strictly decreasing in T (every loss term increases with T) and
 * concave (T^4 and es(T) are convex), so it has one root and Newton's
 * method converges to it from any start: after the first step every iterate
 * lies at or above the root and falls monotonically towards it. The
 * iterate is kept inside the -100..100 C range of psy_e0_kpa; if the root
 * lies outside, leaf_solve says so.
 *
 * Saturation vapour pressure and its slope come from psychro.c (FAO-56
 * eqs. 11 and 13) so the whole program uses one humidity formula; C&N use
 * the similar Tetens form with other constants (their eq. 3.8).
 *
 * References: Campbell, G.S. & Norman, J.M. (1998) An Introduction to
 * Environmental Biophysics, 2nd ed., Springer: ch. 7 (boundary-layer
 * conductances), ch. 12 (radiative conductance), ch. 14 (eqs. 14.1 and
 * 14.6). Jarvis, P.G. (1976) The interpretation of the variations in leaf
 * water potential and stomatal conductance found in canopies in the field.
 * Phil. Trans. R. Soc. Lond. B 273:593-610.
 *
 * GPL-3.0-or-later.
 */
#include <math.h>

#include "leaf.h"
#include "psychro.h"

/* Stefan-Boltzmann constant, W/m2/K4 (CODATA 2018). */
#define SIGMA_W_M2_K4 5.670374419e-8
/* 0 C in kelvin (SI definition). */
#define KELVIN 273.15
/* Molar specific heat of air, J/mol/C (C&N 1998 ch. 3 and Table A.1 use
 * 29.3; from memory). */
#define CP_J_MOL_C 29.3
/* Molar mass of water, kg/mol (from standard atomic weights). */
#define MW_KG_MOL 0.018015
/* Latent heat, J/mol: FAO-56's 2.45 MJ/kg times MW_KG_MOL = 44.1 kJ/mol,
 * within 0.3 % of C&N's 44 kJ/mol (from memory). */
#define LAMBDA_J_MOL (PSY_LATENT_HEAT_MJ_KG * 1.0e6 * MW_KG_MOL)
/* Outdoor boundary-layer conductances are about 1.4 times those of the
 * wind-tunnel formulas (C&N 1998 ch. 7). */
#define OUTDOOR_FACTOR 1.4
/* Characteristic dimension of a leaf as a fraction of its width (C&N 1998
 * ch. 7). */
#define D_PER_WIDTH 0.72
/* Range the leaf temperature must stay in: that of psy_e0_kpa. */
#define TL_LO_C (-100.0)
#define TL_HI_C 100.0
/* Newton stops when a step is below this (C) or after MAX_ITER steps. */
#define STEP_TOL_C 1e-9
/* leaf_solve_row stops at a step below 1e-4 C: Newton converges
 * quadratically here, so the leaf temperature is then within 1e-8 C of
 * leaf_solve's (tested), at one step fewer per leaf. */
#define ROW_STEP_TOL_C 1e-4
#define MAX_ITER 60

typedef struct cond {
    double g_ha, g_va, g_r, g_v;   /* mol/m2/s */
} cond;

static int in_range(double x, double lo, double hi)
{
    return isfinite(x) && x >= lo && x <= hi;
}

static int input_ok(const leaf_in *in)
{
    if (!in_range(in->t_air_c, -40.0, 60.0) ||
        !in_range(in->pressure_kpa, 50.0, 110.0) ||
        !in_range(in->wind_m_s, 0.0, 50.0) ||
        !in_range(in->rabs_w_m2, 0.0, 1500.0) ||
        !in_range(in->g_s_mol_m2_s, 0.0, 2.0) ||
        (in->g_b_mol_m2_s <= 0.0 && !in_range(in->leaf_width_m, 0.001, 1.0)) ||
        !in_range(in->emissivity, 0.5, 1.0) ||
        !in_range(in->g_b_mol_m2_s, 0.0, 20.0))
        return 0;
    /* Up to 10 % supersaturation is let through so rounding in weather
     * data at RH = 100 % is not refused (common practice, no source). */
    return in_range(in->ea_kpa, 0.0, 1.1 * psy_e0_kpa(in->t_air_c));
}

/* C&N 1998 ch. 7, forced convection over a flat plate outdoors, with
 * d = 0.72 x width: g = 1.4 coef sqrt(u / d). */
static double g_forced(double coef, double wind_m_s, double leaf_width_m)
{
    if (!isfinite(wind_m_s) || !isfinite(leaf_width_m) || wind_m_s < 0.0 ||
        leaf_width_m <= 0.0)
        return (double)NAN;
    double u = wind_m_s < LEAF_WIND_MIN_M_S ? LEAF_WIND_MIN_M_S : wind_m_s;
    return OUTDOOR_FACTOR * coef * sqrt(u / (D_PER_WIDTH * leaf_width_m));
}

/* C&N 1998 ch. 7: heat, g_Ha = 1.4 x 0.135 sqrt(u / d). */
double leaf_g_ha_mol_m2_s(double wind_m_s, double leaf_width_m)
{
    return g_forced(0.135, wind_m_s, leaf_width_m);
}

/* C&N 1998 ch. 7: vapour, g_va = 1.4 x 0.147 sqrt(u / d). */
double leaf_g_va_mol_m2_s(double wind_m_s, double leaf_width_m)
{
    return g_forced(0.147, wind_m_s, leaf_width_m);
}

/* C&N 1998 ch. 12: radiative conductance g_r = 4 eps sigma Ta^3 / cp. */
double leaf_g_r_mol_m2_s(double t_air_c, double emissivity)
{
    if (!isfinite(t_air_c) || !isfinite(emissivity) || t_air_c < -KELVIN ||
        emissivity < 0.0 || emissivity > 1.0)
        return (double)NAN;
    double tk = t_air_c + KELVIN;
    return 4.0 * emissivity * SIGMA_W_M2_K4 * tk * tk * tk / CP_J_MOL_C;
}

/* C&N 1998 ch. 14: stomatal and boundary-layer conductances in series on
 * each face, the two faces in parallel, averaged over the faces:
 * g_v = 0.5 g_s g_va/(g_s + g_va) + 0.5 g_s g_va/(g_s + g_va) with both
 * faces alike. A dry leaf (g_s = 0) exchanges no vapour. */
static double g_leaf_vapour(double g_s, double g_va)
{
    if (g_s <= 0.0)
        return 0.0;
    return g_s * g_va / (g_s + g_va);
}

static cond conductances(const leaf_in *in)
{
    cond c;
    int given = in->g_b_mol_m2_s > 0.0;
    c.g_ha = given ? in->g_b_mol_m2_s : leaf_g_ha_mol_m2_s(in->wind_m_s, in->leaf_width_m);
    c.g_va = given ? in->g_b_mol_m2_s : leaf_g_va_mol_m2_s(in->wind_m_s, in->leaf_width_m);
    c.g_r = leaf_g_r_mol_m2_s(in->t_air_c, in->emissivity);
    c.g_v = g_leaf_vapour(in->g_s_mol_m2_s, c.g_va);
    return c;
}

static double emitted_w_m2(double emissivity, double t_c)
{
    double tk = t_c + KELVIN;
    return emissivity * SIGMA_W_M2_K4 * tk * tk * tk * tk;
}

/* C&N 1998 eq. 14.6, with G standing for their gamma-star:
 *   T_L = T_a + G / (s + G) [R_ni / (cp g_Hr) - D / (p_a G)]
 * where R_ni = R_abs - eps sigma Ta^4 (isothermal net radiation),
 * g_Hr = g_Ha + g_r, G = gamma g_Hr / g_v, gamma = cp / lambda,
 * s = Delta / p_a and D = es(Ta) - ea. For a dry leaf (g_v = 0) G is
 * infinite and the limit is T_L = T_a + R_ni / (cp g_Hr).  delta_kpa_c
 * and es_kpa are Delta and es at the air temperature. */
static double t_linear_at(const leaf_in *in, const cond *c, double delta_kpa_c,
                          double es_kpa)
{
    double ta = in->t_air_c;
    double rni = in->rabs_w_m2 - emitted_w_m2(in->emissivity, ta);
    double g_hr = c->g_ha + c->g_r;
    if (c->g_v <= 0.0)
        return ta + rni / (CP_J_MOL_C * g_hr);
    double gamma = CP_J_MOL_C / LAMBDA_J_MOL;
    double gstar = gamma * g_hr / c->g_v;
    double s = delta_kpa_c / in->pressure_kpa;
    double d_kpa = es_kpa - in->ea_kpa;
    return ta + gstar / (s + gstar) *
                    (rni / (CP_J_MOL_C * g_hr) -
                     d_kpa / (in->pressure_kpa * gstar));
}

static double t_linear_c(const leaf_in *in, const cond *c)
{
    return t_linear_at(in, c, psy_slope_kpa_c(in->t_air_c), psy_e0_kpa(in->t_air_c));
}

/* C&N 1998 eq. 14.1, absorbed minus emitted, sensible and latent, W/m2. */
static double residual(const leaf_in *in, const cond *c, double tl)
{
    double sensible = CP_J_MOL_C * c->g_ha * (tl - in->t_air_c);
    double latent = LAMBDA_J_MOL * c->g_v *
                    (psy_e0_kpa(tl) - in->ea_kpa) / in->pressure_kpa;
    return in->rabs_w_m2 - emitted_w_m2(in->emissivity, tl) - sensible -
           latent;
}

/* d residual / d T_L, W/m2/C; always negative (g_ha > 0). */
static double residual_slope(const leaf_in *in, const cond *c, double tl)
{
    double tk = tl + KELVIN;
    return -4.0 * in->emissivity * SIGMA_W_M2_K4 * tk * tk * tk -
           CP_J_MOL_C * c->g_ha -
           LAMBDA_J_MOL * c->g_v * psy_slope_kpa_c(tl) / in->pressure_kpa;
}

double leaf_residual_w_m2(const leaf_in *in, double t_leaf_c)
{
    if (!input_ok(in) || !in_range(t_leaf_c, TL_LO_C, TL_HI_C))
        return (double)NAN;
    cond c = conductances(in);
    return residual(in, &c, t_leaf_c);
}

static void fill_nan(leaf_out *out)
{
    double n = (double)NAN;
    out->t_leaf_c = out->t_leaf_linear_c = out->vpd_leaf_kpa = n;
    out->emitted_w_m2 = out->sensible_w_m2 = out->latent_w_m2 = n;
    out->transp_mol_m2_s = n;
    out->g_ha_mol_m2_s = out->g_va_mol_m2_s = n;
    out->g_r_mol_m2_s = out->g_v_mol_m2_s = n;
    out->iterations = 0;
}

/* Newton on eq. 14.1 from t0, kept inside TL_LO_C..TL_HI_C. Returns
 * LEAF_OK with the root in *tl and the step count in *iters, or
 * LEAF_ERANGE when the root lies outside the range (an iterate pinned at a
 * bound still wants to go past it) or no convergence in MAX_ITER steps. */
static int newton(const leaf_in *in, const cond *c, double t0, double *tl,
                  int *iters)
{
    double t = t0 < TL_LO_C ? TL_LO_C : (t0 > TL_HI_C ? TL_HI_C : t0);
    for (int i = 1; i <= MAX_ITER; i++) {
        double tn = t - residual(in, c, t) / residual_slope(in, c, t);
        if (tn > TL_HI_C) {
            if (t == TL_HI_C)
                return LEAF_ERANGE;
            tn = TL_HI_C;
        } else if (tn < TL_LO_C) {
            if (t == TL_LO_C)
                return LEAF_ERANGE;
            tn = TL_LO_C;
        }
        if (fabs(tn - t) <= STEP_TOL_C) {
            *tl = tn;
            *iters = i;
            return LEAF_OK;
        }
        t = tn;
    }
    return LEAF_ERANGE;
}

int leaf_solve(const leaf_in *in, leaf_out *out)
{
    fill_nan(out);
    if (!input_ok(in))
        return LEAF_EINPUT;
    cond c = conductances(in);
    double t_lin = t_linear_c(in, &c);
    double tl = 0.0;
    int iters = 0;
    int rc = newton(in, &c, t_lin, &tl, &iters);
    if (rc != LEAF_OK)
        return rc;
    double vpd = psy_e0_kpa(tl) - in->ea_kpa;
    out->t_leaf_c = tl;
    out->t_leaf_linear_c = t_lin;
    out->vpd_leaf_kpa = vpd;
    out->emitted_w_m2 = emitted_w_m2(in->emissivity, tl);
    out->sensible_w_m2 = CP_J_MOL_C * c.g_ha * (tl - in->t_air_c);
    out->transp_mol_m2_s = c.g_v * vpd / in->pressure_kpa;
    out->latent_w_m2 = LAMBDA_J_MOL * out->transp_mol_m2_s;
    out->g_ha_mol_m2_s = c.g_ha;
    out->g_va_mol_m2_s = c.g_va;
    out->g_r_mol_m2_s = c.g_r;
    out->g_v_mol_m2_s = c.g_v;
    out->iterations = iters;
    return LEAF_OK;
}

/* Residual and slope of eq. 14.1 at tl from one exponential: the slope of
 * the saturation curve is FAO-56 eq. 13, 4098 e0(T) / (T + 237.3)^2, with
 * e0 from eq. 11 already in hand.  Same values as residual() and
 * residual_slope(); this is the inner loop of leaf_solve_row(). */
static void residual_and_slope(const leaf_in *in, const cond *c, double tl,
                               double *r, double *dr)
{
    double e0 = psy_e0_kpa(tl), tk = tl + KELVIN, tk3 = tk * tk * tk;
    double slope = 4098.0 * e0 / ((tl + 237.3) * (tl + 237.3));
    double lat = LAMBDA_J_MOL * c->g_v / in->pressure_kpa;
    *r = in->rabs_w_m2 - in->emissivity * SIGMA_W_M2_K4 * tk3 * tk -
         CP_J_MOL_C * c->g_ha * (tl - in->t_air_c) - lat * (e0 - in->ea_kpa);
    *dr = -4.0 * in->emissivity * SIGMA_W_M2_K4 * tk3 - CP_J_MOL_C * c->g_ha -
          lat * slope;
}

int leaf_solve_row(const leaf_in *base, int n, const double *rabs_w_m2,
                   const double *g_s_mol_m2_s, double *t_leaf_c,
                   double *vpd_leaf_kpa)
{
    int failed = 0;
    leaf_in in = *base;
    in.rabs_w_m2 = 0.0;
    in.g_s_mol_m2_s = 0.0;
    int air_ok = input_ok(&in);
    cond c = conductances(&in);
    double delta_a = psy_slope_kpa_c(in.t_air_c), es_a = psy_e0_kpa(in.t_air_c);
    for (int i = 0; i < n; i++) {
        in.rabs_w_m2 = rabs_w_m2[i];
        in.g_s_mol_m2_s = g_s_mol_m2_s[i];
        t_leaf_c[i] = vpd_leaf_kpa[i] = (double)NAN;
        if (!air_ok || !in_range(in.rabs_w_m2, 0.0, 1500.0) ||
            !in_range(in.g_s_mol_m2_s, 0.0, 2.0)) {
            failed++;
            continue;
        }
        c.g_v = g_leaf_vapour(in.g_s_mol_m2_s, c.g_va);
        /* start from the previous leaf's answer when there is one (the
         * strips of a row differ little, so Newton needs fewer steps),
         * else from eq. 14.6; the root is the same either way, since the
         * residual is strictly decreasing in T_L */
        double t = i > 0 && isfinite(t_leaf_c[i - 1]) ? t_leaf_c[i - 1]
                                                      : t_linear_at(&in, &c, delta_a, es_a);
        t = t < TL_LO_C ? TL_LO_C : (t > TL_HI_C ? TL_HI_C : t);
        int ok = 0;
        for (int k = 0; k < MAX_ITER && !ok; k++) {
            double r, dr;
            residual_and_slope(&in, &c, t, &r, &dr);
            double tn = t - r / dr;
            ok = fabs(tn - t) <= ROW_STEP_TOL_C && tn >= TL_LO_C && tn <= TL_HI_C;
            t = tn < TL_LO_C ? TL_LO_C : (tn > TL_HI_C ? TL_HI_C : tn);
        }
        if (!ok) {
            failed++;
            continue;
        }
        t_leaf_c[i] = t;
        vpd_leaf_kpa[i] = psy_e0_kpa(t) - in.ea_kpa;
    }
    return failed;
}

/* Defaults for a temperate pasture grass leaf, per face:
 *  g_max 0.2 mol/m2/s: about 0.4 for the whole leaf, the order of maximum
 *        leaf conductances of grasses and herbs (Koerner, Scheel & Bauer
 *        1979, Photosynthetica 13:45-82; from memory), halved per face.
 *  g_min 0.005 mol/m2/s: residual (cuticular and leaky-stomata)
 *        conductance of a few mmol/m2/s (from memory).
 *  par_half 200 umol/m2/s: light response half-saturated at about a
 *        tenth of full sun (from memory).
 *  vpd_close 4 kPa: stomata nearly shut in very dry air (from memory). */
leaf_jarvis leaf_jarvis_grass(void)
{
    leaf_jarvis p;
    p.g_max_mol_m2_s = 0.2;
    p.g_min_mol_m2_s = 0.005;
    p.par_half_umol = 200.0;
    p.vpd_close_kpa = 4.0;
    return p;
}

static int jarvis_ok(const leaf_jarvis *p)
{
    return isfinite(p->g_max_mol_m2_s) && isfinite(p->g_min_mol_m2_s) &&
           isfinite(p->par_half_umol) && isfinite(p->vpd_close_kpa) &&
           p->g_min_mol_m2_s >= 0.0 &&
           p->g_max_mol_m2_s >= p->g_min_mol_m2_s &&
           p->par_half_umol > 0.0 && p->vpd_close_kpa > 0.0;
}

/* Jarvis (1976) multiplicative model: each factor scales the conductance
 * between g_min and g_max independently. Light: rectangular hyperbola
 * f = Q / (Q + Q_half); VPD: linear decline f = 1 - D / D_close, floored
 * at 0. Jarvis (1976) fitted a hyperbola to light and a linear decline
 * to VPD (from memory). */
double leaf_gs_jarvis(double par_umol_m2_s, double vpd_kpa,
                      const leaf_jarvis *p)
{
    if (!isfinite(par_umol_m2_s) || !isfinite(vpd_kpa) ||
        par_umol_m2_s < 0.0 || !jarvis_ok(p))
        return (double)NAN;
    double d = vpd_kpa < 0.0 ? 0.0 : vpd_kpa;
    double f_light = par_umol_m2_s / (par_umol_m2_s + p->par_half_umol);
    double f_vpd = 1.0 - d / p->vpd_close_kpa;
    if (f_vpd < 0.0)
        f_vpd = 0.0;
    return p->g_min_mol_m2_s +
           (p->g_max_mol_m2_s - p->g_min_mol_m2_s) * f_light * f_vpd;
}
