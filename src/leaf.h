/* leaf.h - leaf temperature and leaf-to-air VPD from a leaf energy balance.
 *
 * The whole interface of leaf.c. Flux densities are per unit leaf surface
 * averaged over the two faces (so each face emits eps sigma T^4), the
 * convention of Campbell & Norman (1998) eq. 14.1. Conductances are in
 * mol/m2/s on the same basis.
 *
 * References: Campbell, G.S. & Norman, J.M. (1998) An Introduction to
 * Environmental Biophysics, 2nd ed., Springer, chapters 7, 12 and 14;
 * Jarvis, P.G. (1976) Phil. Trans. R. Soc. Lond. B 273:593-610.
 *
 * GPL-3.0-or-later.
 */
#ifndef LEAF_H
#define LEAF_H

/* Leaf thermal emissivity: typical leaf value (Campbell & Norman 1998,
 * ch. 11 table of emissivities, 0.94-0.99 for leaves; from memory). */
#define LEAF_EMISSIVITY 0.97

/* Wind below this (m/s) is raised to it. The forced-convection conductance
 * (C&N 1998 ch. 7) falls to zero with the wind, but a still leaf still
 * loses heat by free convection, which is not modelled here. At 0.1 m/s a
 * 5 cm leaf keeps g_Ha = 0.31 mol/m2/s, the order of C&N's free-convection
 * value 0.05 (dT/d)^0.25 = 0.17-0.2 mol/m2/s for a leaf 5-10 C above air
 * (C&N ch. 7, from memory). The floor itself: common practice, no source. */
#define LEAF_WIND_MIN_M_S 0.1

/* Conditions of one leaf (or one strip's representative leaf). */
typedef struct leaf_in {
    double t_air_c;        /* air temperature, C: -40..60 */
    double ea_kpa;         /* actual vapour pressure, kPa: 0..1.1 es(Ta) */
    double pressure_kpa;   /* air pressure, kPa: 50..110 */
    double wind_m_s;       /* wind at leaf height, m/s: 0..50 */
    double rabs_w_m2;      /* absorbed short + long wave, mean of the two
                              faces, W/m2: 0..1500 */
    double g_s_mol_m2_s;   /* stomatal conductance to vapour of EACH face
                              (amphistomatous leaf), mol/m2/s: 0..2;
                              0 = dry leaf, no vapour exchange */
    double leaf_width_m;   /* leaf width, m: 0.001..1 (ignored when
                              g_b_mol_m2_s is given) */
    double emissivity;     /* thermal emissivity: 0.5..1 */
    double g_b_mol_m2_s;   /* 0: boundary layer from wind and leaf width
                              (C&N ch. 7); > 0 (up to 20): this conductance
                              for both heat and vapour instead, e.g. a
                              canopy's aerodynamic conductance when the
                              balance is applied to a whole sward as one
                              "big leaf" */
} leaf_in;

/* Solution of the balance and its terms (W/m2, mean of the two faces). */
typedef struct leaf_out {
    double t_leaf_c;        /* root of the full balance (C&N eq. 14.1) */
    double t_leaf_linear_c; /* linearised estimate (C&N eq. 14.6) */
    double vpd_leaf_kpa;    /* es(T_leaf) - ea */
    double emitted_w_m2;    /* eps sigma T_leaf^4 */
    double sensible_w_m2;   /* cp g_Ha (T_leaf - T_air) */
    double latent_w_m2;     /* lambda g_v (es(T_leaf) - ea) / pa */
    double transp_mol_m2_s; /* g_v (es(T_leaf) - ea) / pa */
    double g_ha_mol_m2_s;   /* boundary-layer conductance for heat */
    double g_va_mol_m2_s;   /* boundary-layer conductance for vapour */
    double g_r_mol_m2_s;    /* radiative conductance */
    double g_v_mol_m2_s;    /* total leaf conductance for vapour */
    int iterations;         /* Newton steps taken */
} leaf_out;

/* Return codes of leaf_solve. */
enum {
    LEAF_OK = 0,
    LEAF_EINPUT = -1,  /* an input is outside its range or not finite */
    LEAF_ERANGE = -2   /* the leaf would be outside -100..100 C */
};

/* Jarvis-type stomatal response parameters (per face). */
typedef struct leaf_jarvis {
    double g_max_mol_m2_s;  /* conductance in full light, low VPD */
    double g_min_mol_m2_s;  /* residual (dark, closed) conductance */
    double par_half_umol;   /* PAR giving half the light response,
                               umol/m2/s */
    double vpd_close_kpa;   /* VPD at which the VPD term reaches 0 */
} leaf_jarvis;

/* Solves the leaf energy balance (C&N 1998 eq. 14.1) for the leaf
 * temperature: eq. 14.6 gives the first guess, Newton's method on the full
 * non-linear balance refines it. Fills *out and returns LEAF_OK; on an
 * input outside the ranges in leaf_in returns LEAF_EINPUT, and when the
 * leaf temperature would leave -100..100 C returns LEAF_ERANGE; in both
 * cases every double in *out is NaN. */
int leaf_solve(const leaf_in *in, leaf_out *out);

/* Residual of the full balance (C&N 1998 eq. 14.1), W/m2, for the leaf in
 * *in at temperature t_leaf_c: absorbed minus emitted, sensible and latent
 * loss. Zero at the solution. NaN on input leaf_solve would refuse or
 * t_leaf_c outside -100..100. */
double leaf_residual_w_m2(const leaf_in *in, double t_leaf_c);

/* Solves n leaves that share the air of *base (temperature, vapour
 * pressure, pressure, wind, leaf width, emissivity) and differ only in
 * absorbed radiation rabs_w_m2[i] and stomatal conductance g_s_mol_m2_s[i]
 * (base's own values of those two are ignored): the strips of one hour.
 * Same answers as leaf_solve() for each leaf (same equations, to within
 * 1e-8 C), with the shared terms computed once and each leaf's Newton
 * iteration started from its neighbour's answer.  Writes t_leaf_c[i] and
 * vpd_leaf_kpa[i]; where leaf_solve() would fail both are NaN.  Returns the
 * number of leaves that failed. */
int leaf_solve_row(const leaf_in *base, int n, const double *rabs_w_m2,
                   const double *g_s_mol_m2_s, double *t_leaf_c,
                   double *vpd_leaf_kpa);

/* Boundary-layer conductance for heat of a flat leaf outdoors, mol/m2/s
 * (C&N 1998 ch. 7: 1.4 x 0.135 sqrt(u/d), d = 0.72 width). Wind below
 * LEAF_WIND_MIN_M_S is raised to it. NaN if wind < 0, width <= 0 or either
 * is not finite. */
double leaf_g_ha_mol_m2_s(double wind_m_s, double leaf_width_m);

/* Boundary-layer conductance for water vapour, mol/m2/s (C&N 1998 ch. 7:
 * 1.4 x 0.147 sqrt(u/d)); same wind floor and refusals as above. */
double leaf_g_va_mol_m2_s(double wind_m_s, double leaf_width_m);

/* Radiative conductance 4 eps sigma Ta^3 / cp, mol/m2/s (C&N 1998
 * ch. 12). NaN if t_air_c < -273.15, emissivity outside 0..1, or either
 * is not finite. */
double leaf_g_r_mol_m2_s(double t_air_c, double emissivity);

/* Default Jarvis parameters for a temperate pasture grass leaf; each value
 * and its source is given in leaf.c. */
leaf_jarvis leaf_jarvis_grass(void);

/* Stomatal conductance of each face, mol/m2/s, from PAR on the leaf
 * (umol/m2/s) and air VPD (kPa), Jarvis (1976) multiplicative form:
 * g = g_min + (g_max - g_min) f(PAR) f(VPD). Negative VPD (saturated air)
 * counts as 0. NaN if par < 0, an input is not finite, or the parameters
 * break 0 <= g_min <= g_max, par_half > 0, vpd_close > 0. */
double leaf_gs_jarvis(double par_umol_m2_s, double vpd_kpa,
                      const leaf_jarvis *p);

#endif
