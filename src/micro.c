/* micro.c - the strip microclimate engine: weather + array -> what each
 * ground strip across the row experiences, hour by hour.
 *
 * For each hour h of the series (timestamps mark the start of the hour, so
 * the sun is taken at h:30):
 *   1. sun position: sun_series() (NREL SPA, Reda & Andreas 2004);
 *   2. beam and diffuse: from the file when it has both, else Erbs et al.
 *      (1982) via irr_split();
 *   3. tracker angle: trk_angle_deg() (Marion & Dobos 2013 ideal angle,
 *      Anderson & Mikofski 2020 backtracking, limit, night, wind stow);
 *   4. light per strip: beam where strip_beam() finds no panel between the
 *      strip and the sun, plus diffuse times the strip's sky view factor
 *      (isotropic sky; the point view factor averaged over 4 points per
 *      strip, tabulated over the rotation angle: strips.c);
 *   5. rain per strip: strip_rain() sends what falls on a panel to its lower
 *      edge's drip band (water conserved exactly per pitch);
 *   6. leaves: the top leaf of the sward in each strip, by the energy
 *      balance of Campbell & Norman (1998) ch. 14 (leaf_solve()), with the
 *      absorbed radiation set out in absorbed_w_m2() and a Jarvis (1976)
 *      stomatal conductance; daylight hours only (NaN at night).
 * The open-field reference runs steps 6 with the full sky and sun.
 * Assumptions and what is left out are listed in docs/model.md.
 */
#include "micro.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "irrad.h"
#include "leaf.h"
#include "psychro.h"
#include "tcal.h"

#define DEG (3.14159265358979323846 / 180.0)
#define SIGMA_W_M2_K4 5.670374419e-8 /* Stefan-Boltzmann constant (CODATA 2018) */
#define T0_K 273.15
#define DNAN ((double)NAN)

/* Albedo of a grass sward, 0.23 (Allen et al. 1998, FAO-56 eq. 38). */
#define SWARD_ALBEDO 0.23
/* The sward as one "big leaf": height of the FAO-56 reference grass,
 * 0.12 m, and its leaf area index 24 h = 2.88 with half of it sunlit and
 * active (FAO-56, the text with eq. 5: LAI = 24 h, LAI_active = 0.5 LAI). */
#define SWARD_HEIGHT_M 0.12
#define SWARD_LAI_ACTIVE (0.5 * 24.0 * SWARD_HEIGHT_M)
/* Smallest wind speed used, 0.5 m/s, as FAO-56 advises for u2 (p. 56;
 * from memory): calm air still mixes by free convection. */
#define WIND_MIN_M_S 0.5
#define R_J_MOL_K 8.314462618       /* molar gas constant (CODATA 2018) */
/* Panel temperature rise over air per W/m2 of sun on the plane, the Ross
 * coefficient, 0.02-0.04 K m2/W (Ross 1976; from memory).  GHI stands in
 * for the sun on the module plane, which a tracker raises: the panels'
 * longwave is a little understated. */
#define ROSS_K_M2_W 0.03
/* Emissivity of the glass/backsheet of a module (from memory: 0.85-0.95). */
#define PANEL_EMISSIVITY 0.9

/* The axis direction used: a horizontal axis points whichever of its two
 * ways puts the sunrise (east) side at Aa - 90, i.e. Aa in [90, 270). */
static double axis_azimuth(const site_array *a)
{
    double aa = fmod(a->axis_azimuth_deg, 360.0);
    if (a->axis_tilt_deg == 0 && (aa < 90.0 || aa >= 270.0))
        aa = fmod(aa + 180.0, 360.0);
    return aa;
}

int mc_config_from_site(const site *s, mc_config *c, rg_err *err)
{
    const site_array *a = &s->array;
    memset(c, 0, sizeof *c);
    c->geom = (strip_geom){
        .pitch_m = a->pitch_m, .chord_m = a->chord_m, .hub_m = a->hub_height_m,
        .n_strips = (int)lround(a->pitch_m / a->strip_width_m),
        .n_rows_each_side = STRIP_ROWS_ENDLESS, .drip_width_m = a->drip_width_m,
        .flat_deg = 2.0, /* a panel within 2 deg of flat sheds both ways (common practice, no source) */
    };
    c->trk = (trk_config){
        .axis_azimuth_deg = axis_azimuth(a), .axis_tilt_deg = a->axis_tilt_deg,
        .gcr = a->chord_m / a->pitch_m, .cross_axis_slope_deg = a->cross_axis_slope_deg,
        .max_angle_deg = a->max_rotation_deg, .backtrack = a->backtracking,
        .night_angle_deg = a->night_angle_deg, .stow_angle_deg = a->stow_angle_deg,
        .stow_wind_m_s = a->stow_wind_m_s,
    };
    c->sun = (sun_site){
        .latitude_deg = s->loc.latitude_deg, .longitude_deg = s->loc.longitude_deg,
        .elevation_m = s->loc.elevation_m,
        .pressure_hpa = 10.0 * psy_pressure_kpa(s->loc.elevation_m),
        .temperature_c = 10.0, /* annual mean for refraction; 0.01 deg matters not here */
        .atmos_refract_deg = 0.5667, /* Reda & Andreas 2004, A.2 */
    };
    c->utc_offset_h = s->loc.utc_offset_h;
    char why[160];
    if (strip_geom_check(&c->geom, why, sizeof why) < 0)
        return rg_fail(err, "%s: $.array: %s", s->path, why);
    const char *terr = trk_config_check(&c->trk);
    if (terr)
        return rg_fail(err, "%s: $.array: %s", s->path, terr);
    /* 4 sample points per strip: the table agrees with the direct view
     * factor within 0.002 (tests/test_strips.c) */
    c->sky = strip_sky_table_build(&c->geom, 4);
    if (!c->sky)
        return rg_fail(err, "out of memory for the sky view table");
    return 0;
}

void mc_config_free(mc_config *c)
{
    strip_sky_table_free(c->sky);
    c->sky = NULL;
}

/* ---- result storage ----------------------------------------------------- */

/* The hourly arrays. */
static int alloc_result(mc_result *r, int n_strips, size_t n_hours)
{
    memset(r, 0, sizeof *r);
    r->n_strips = n_strips;
    r->n_hours = n_hours;
    size_t nh = n_hours ? n_hours : 1;
    double **hourly[] = {&r->zenith_deg, &r->azimuth_deg, &r->hour_angle_deg, &r->tracker_deg,
                         &r->ghi_w_m2, &r->rain_mm, &r->t_air_c, &r->open_leaf_c, &r->open_vpd_kpa,
                         &r->dhi_w_m2};
    int ok = (r->offset_m = calloc((size_t)n_strips, sizeof(double))) != NULL;
    for (size_t k = 0; k < sizeof hourly / sizeof hourly[0]; k++)
        ok &= (*hourly[k] = calloc(nh, sizeof(double))) != NULL;
    ok &= (r->lit_row = malloc(nh * sizeof *r->lit_row)) != NULL;
    ok &= (r->rain_row = malloc(nh * sizeof *r->rain_row)) != NULL;
    if (!ok)
        mc_free(r);
    return ok ? 0 : -1;
}

/* Numbers the daylight hours (the sun above the horizon and GHI > 0) and
 * the rainy ones, and allocates their rows, which one_hour() fills whole
 * (so no zeroing). */
static int alloc_rows(mc_result *r, const wx_series *w, size_t from)
{
    size_t n_lit = 0, n_rain = 0;
    for (size_t k = 0; k < r->n_hours; k++) {
        int lit = r->zenith_deg[k] < 90.0 && w->v[WX_GHI][from + k] > 0;
        r->lit_row[k] = lit ? (int32_t)n_lit++ : -1;
        r->rain_row[k] = w->v[WX_RAIN][from + k] > 0 ? (int32_t)n_rain++ : -1;
    }
    r->n_lit = n_lit;
    r->n_rain = n_rain;
    size_t cells = (n_lit ? n_lit : 1) * (size_t)r->n_strips;
    double **lit_arrays[] = {&r->sw_w_m2, &r->leaf_c, &r->vpd_kpa};
    int ok = 1;
    for (size_t k = 0; k < sizeof lit_arrays / sizeof lit_arrays[0]; k++)
        ok &= (*lit_arrays[k] = malloc(cells * sizeof(double))) != NULL;
    cells = (n_rain ? n_rain : 1) * (size_t)r->n_strips;
    ok &= (r->rain_strip_mm = malloc(cells * sizeof(double))) != NULL;
    return ok ? 0 : -1;
}

void mc_free(mc_result *r)
{
    double *all[] = {r->offset_m, r->zenith_deg, r->azimuth_deg, r->hour_angle_deg,
                     r->tracker_deg, r->ghi_w_m2, r->rain_mm, r->t_air_c, r->open_leaf_c,
                     r->open_vpd_kpa, r->sw_w_m2, r->rain_strip_mm, r->leaf_c, r->vpd_kpa,
                     r->dhi_w_m2};
    for (size_t k = 0; k < sizeof all / sizeof all[0]; k++)
        free(all[k]);
    free(r->lit_row);
    free(r->rain_row);
    strip_sky_table_free(r->sky);
    memset(r, 0, sizeof *r);
}

/* ---- leaves ------------------------------------------------------------- */

/* Air state of one hour shared by every leaf in it. */
typedef struct air_hour {
    double t_c, ea_kpa, vpd_kpa, p_kpa;
    double g_a_mol_m2_s;     /* sward aerodynamic conductance */
    double sky_lw_w_m2;      /* longwave from the sky */
    double panel_lw_w_m2;    /* longwave from a panel underside */
} air_hour;

/* Clear-sky emissivity of Brutsaert (1975), Water Resour. Res. 11:742-744,
 * eq. 11: 1.24 (ea/Ta)^(1/7), ea in hPa, Ta in K; raised towards 1 by the
 * cloud fraction (Crawford & Duchon 1999 form eps = c + (1 - c) eps_clear;
 * from memory). */
static double sky_emissivity(double t_c, double ea_kpa, double cloud)
{
    double clear = 1.24 * pow(10.0 * ea_kpa / (t_c + T0_K), 1.0 / 7.0);
    return cloud + (1.0 - cloud) * clear;
}

/* Aerodynamic conductance of the sward, mol/m2/s, from FAO-56 eq. 4
 * (Allen et al. 1998): r_a = ln((z_m - d)/z_om) ln((z_h - d)/z_oh) /
 * (k^2 u_z), with wind and humidity at z = 2 m, d = 2/3 h, z_om = 0.123 h,
 * z_oh = 0.1 z_om, k = 0.41 (r_a = 208/u2 s/m for h = 0.12 m), turned
 * into molar units by the air's molar density p / (R T). */
static double sward_g_a_mol_m2_s(double u2_m_s, double p_kpa, double t_c)
{
    const double h = SWARD_HEIGHT_M, d = 2.0 / 3.0 * h, zom = 0.123 * h, zoh = 0.1 * zom;
    double u = u2_m_s > WIND_MIN_M_S ? u2_m_s : WIND_MIN_M_S;
    double ra_s_m = log((2.0 - d) / zom) * log((2.0 - d) / zoh) / (0.41 * 0.41 * u);
    return 1000.0 * p_kpa / (R_J_MOL_K * (t_c + T0_K)) / ra_s_m;
}

/* Cloud fraction from the clearness index: 0 at kt >= 0.75, 1 at kt <= 0.25,
 * linear between (common practice, no source). */
static double cloud_fraction(double kt)
{
    double c = (0.75 - kt) / 0.5;
    return c < 0 ? 0 : c > 1 ? 1 : c;
}

static void air_state(const wx_series *w, size_t h, double p_kpa, double ghi, double cloud,
                      air_hour *a)
{
    a->t_c = w->v[WX_TEMP][h];
    a->ea_kpa = psy_ea_rh_kpa(a->t_c, w->v[WX_RH][h]);
    a->vpd_kpa = psy_vpd_kpa(psy_e0_kpa(a->t_c), a->ea_kpa);
    a->p_kpa = w->v[WX_PRESSURE] ? w->v[WX_PRESSURE][h] / 10.0 : p_kpa;
    a->g_a_mol_m2_s = sward_g_a_mol_m2_s(w->v[WX_WIND][h], a->p_kpa, a->t_c);
    double tk4 = pow(a->t_c + T0_K, 4);
    a->sky_lw_w_m2 = sky_emissivity(a->t_c, a->ea_kpa, cloud) * SIGMA_W_M2_K4 * tk4;
    double t_panel_k = a->t_c + T0_K + ROSS_K_M2_W * ghi;
    a->panel_lw_w_m2 = PANEL_EMISSIVITY * SIGMA_W_M2_K4 * pow(t_panel_k, 4);
}

/* Radiation absorbed by the sward surface per unit ground area: shortwave
 * less the sward's albedo, and longwave from the sky (share vf of the
 * view) and from the panel undersides (share 1 - vf). */
static double absorbed_w_m2(const air_hour *a, double sw_w_m2, double vf)
{
    double lw_down = vf * a->sky_lw_w_m2 + (1.0 - vf) * a->panel_lw_w_m2;
    return (1.0 - SWARD_ALBEDO) * sw_w_m2 + LEAF_EMISSIVITY * lw_down;
}

/* Sward-surface ("leaf") temperatures and leaf-to-air VPDs of n strips in
 * one hour, by the leaf energy balance applied to the sward as one big
 * leaf: one surface absorbing and emitting, the aerodynamic conductance of
 * FAO-56 eq. 4 for heat and vapour, and a canopy stomatal conductance of
 * the active leaf area times the Jarvis conductance of a leaf's two faces.
 * NaN where the balance has no solution in range (not expected for checked
 * weather).  rabs and gs are scratch space of n values. */
static void leaves(const air_hour *a, const leaf_jarvis *jv, int n,
                   const double *sw_w_m2, const double *vf, double *rabs, double *gs,
                   double *t_c, double *vpd)
{
    for (int i = 0; i < n; i++) {
        rabs[i] = absorbed_w_m2(a, sw_w_m2[i], vf[i]);
        double g_face = leaf_gs_jarvis(irr_par_umol(irr_par_w_m2(sw_w_m2[i])), a->vpd_kpa, jv);
        gs[i] = 2.0 * g_face * SWARD_LAI_ACTIVE;
    }
    leaf_in air = {
        .t_air_c = a->t_c, .ea_kpa = a->ea_kpa, .pressure_kpa = a->p_kpa,
        .wind_m_s = WIND_MIN_M_S, .leaf_width_m = 0.0, /* unused: g_b given */
        .emissivity = LEAF_EMISSIVITY, .g_b_mol_m2_s = a->g_a_mol_m2_s,
    };
    leaf_solve_row(&air, n, rabs, gs, t_c, vpd);
}

/* ---- the hourly loop ---------------------------------------------------- */

typedef struct run_ctx {
    const mc_config *c;
    const wx_series *w;
    leaf_jarvis jv;
    double p_kpa;
    double cloud;            /* last daytime cloud fraction, held at night */
    double *lit, *vf, *rabs, *gs; /* scratch [n_strips + 1] */
} run_ctx;

/* Beam and diffuse on the horizontal for hour h at zenith z. */
static void split(const run_ctx *x, size_t h, double z, int doy, double *dni, double *dhi,
                  double *kt)
{
    const wx_series *w = x->w;
    double ghi = w->v[WX_GHI][h];
    if (w->v[WX_DNI] && w->v[WX_DHI]) {
        *dni = w->v[WX_DNI][h];
        *dhi = w->v[WX_DHI][h];
        double i0 = irr_extra_normal_w_m2(doy) * cos(z * DEG);
        *kt = i0 > 0 ? ghi / i0 : 0;
        return;
    }
    if (irr_split(ghi, z, doy, dni, dhi, kt) < 0)
        *dni = 0, *dhi = ghi > 0 ? ghi : 0, *kt = 0;
}

/* Hour k of the run (h of the series); the sun is already in r. */
static void one_hour(run_ctx *x, size_t k, size_t h, mc_result *r)
{
    const mc_config *c = x->c;
    const wx_series *w = x->w;
    int n = r->n_strips;
    double z = r->zenith_deg[k], az = r->azimuth_deg[k];
    double ghi = w->v[WX_GHI][h], rain = w->v[WX_RAIN][h];
    int doy = tcal_day_of_year(tcal_hour_day(r->t0_h + (int64_t)k));
    double rot = trk_angle_deg(&c->trk, z, az, w->v[WX_WIND][h]);
    r->tracker_deg[k] = rot;
    r->ghi_w_m2[k] = 0; /* set below for daylight hours */
    r->rain_mm[k] = rain;
    r->t_air_c[k] = w->v[WX_TEMP][h];
    ptrdiff_t wet = mc_rain_at(r, k); /* -1: no rain this hour */
    if (wet >= 0)
        strip_rain(&c->geom, rot, rain, r->rain_strip_mm + wet);
    ptrdiff_t at = mc_lit_at(r, k);
    if (at < 0) { /* night: nothing stored for the strips */
        r->open_leaf_c[k] = r->open_vpd_kpa[k] = DNAN;
        return;
    }
    double *sw = r->sw_w_m2 + at;
    double *lc = r->leaf_c + at, *lv = r->vpd_kpa + at;
    double dni, dhi, kt;
    split(x, h, z, doy, &dni, &dhi, &kt);
    x->cloud = cloud_fraction(kt);
    double theta = trk_ideal_deg(z, az, c->trk.axis_azimuth_deg, c->trk.axis_tilt_deg);
    strip_beam(&c->geom, rot, theta, x->lit);
    strip_sky_table_lookup(c->sky, rot, x->vf);
    double beam_h = dni * cos(z * DEG);
    /* the open field gets beam + diffuse as the strips do (equal to GHI
     * when the split is Erbs'; the file's own when it gives DNI and DHI) */
    double open_sw = beam_h + dhi;
    r->ghi_w_m2[k] = open_sw;
    r->dhi_w_m2[k] = dhi;
    air_hour a;
    air_state(w, h, x->p_kpa, ghi, x->cloud, &a);
    for (int i = 0; i < n; i++) {
        double sky = x->vf[i] * dhi; /* as mc_sky_w_m2() gives it */
        sw[i] = x->lit[i] * beam_h + sky;
    }
    leaves(&a, &x->jv, n, sw, x->vf, x->rabs, x->gs, lc, lv);
    double open_vf = 1.0;
    leaves(&a, &x->jv, 1, &open_sw, &open_vf, x->rabs, x->gs, &r->open_leaf_c[k],
           &r->open_vpd_kpa[k]);
}

/* Hours of sun positions made at a time: the run's series is made in
 * pieces (sun_series_from) straight into r, never held whole (a year of
 * sun_position is 0.5 MB).  Each piece costs two more days of the SPA's
 * geocentric step (sun.c), so pieces are a month long. */
#define SUN_PIECE_H (31 * 24)

/* The sun of every hour of r, at mid-hour, into zenith_deg, azimuth_deg
 * and hour_angle_deg. */
static int sun_hours(const mc_config *c, mc_result *r, rg_err *err)
{
    int y, m, d;
    int64_t day = tcal_hour_day(r->t0_h);
    tcal_civil(day, &y, &m, &d);
    sun_site sp_site = c->sun;
    sp_site.delta_t_s = sun_delta_t_s(y + (m - 0.5) / 12.0);
    sun_position *sp = malloc(SUN_PIECE_H * sizeof *sp);
    if (!sp)
        return rg_fail(err, "out of memory for the microclimate run");
    for (size_t k0 = 0; k0 < r->n_hours; k0 += SUN_PIECE_H) {
        int len = r->n_hours - k0 < SUN_PIECE_H ? (int)(r->n_hours - k0) : SUN_PIECE_H;
        if (sun_series_from(&sp_site, y, m, d, (int)(r->t0_h - day * 24), 30.0, (int)k0, len,
                            c->utc_offset_h, sp) < 0) {
            free(sp);
            return rg_fail(err, "sun position: the date %04d-%02d-%02d or the site is outside the algorithm's range", y, m, d);
        }
        for (int j = 0; j < len; j++) {
            r->zenith_deg[k0 + (size_t)j] = sp[j].zenith_deg;
            r->azimuth_deg[k0 + (size_t)j] = sp[j].azimuth_deg;
            r->hour_angle_deg[k0 + (size_t)j] = sp[j].hour_angle_deg;
        }
    }
    free(sp);
    return 0;
}

int mc_run(const mc_config *c, const wx_series *w, size_t from, size_t n,
           mc_result *out, rg_err *err)
{
    int ns = c->geom.n_strips;
    if (from > w->n || n > w->n - from || n > (size_t)INT32_MAX)
        return rg_fail(err, "%s: hours %zu..%zu lie outside the series", w->path, from, from + n);
    if (alloc_result(out, ns, n) < 0)
        return rg_fail(err, "out of memory for %zu hours x %d strips", n, ns);
    out->t0_h = w->t0_h + (int64_t)from;
    out->sky = strip_sky_table_ref(c->sky);
    double width = c->geom.pitch_m / ns;
    for (int i = 0; i < ns; i++)
        out->offset_m[i] = -c->geom.pitch_m / 2 + (i + 0.5) * width;
    run_ctx x = {.c = c, .w = w, .jv = leaf_jarvis_grass(), .cloud = 0.3,
                 .p_kpa = psy_pressure_kpa(c->sun.elevation_m)};
    x.lit = malloc((size_t)ns * sizeof(double));
    x.vf = malloc((size_t)ns * sizeof(double));
    x.rabs = malloc((size_t)ns * sizeof(double));
    x.gs = malloc((size_t)ns * sizeof(double));
    int rc = 0;
    if (!x.lit || !x.vf || !x.rabs || !x.gs)
        rc = rg_fail(err, "out of memory for the microclimate run");
    else
        rc = sun_hours(c, out, err);
    if (rc == 0 && alloc_rows(out, w, from) < 0)
        rc = rg_fail(err, "out of memory for %zu hours x %d strips", n, ns);
    for (size_t k = 0; rc == 0 && k < n; k++)
        one_hour(&x, k, from + k, out);
    free(x.lit);
    free(x.vf);
    free(x.rabs);
    free(x.gs);
    if (rc < 0)
        mc_free(out);
    return rc;
}

void mc_sky_w_m2(const mc_result *r, size_t h, double *sky_w_m2)
{
    int n = r->n_strips;
    if (mc_lit_at(r, h) < 0) {
        for (int i = 0; i < n; i++)
            sky_w_m2[i] = 0.0;
        return;
    }
    strip_sky_table_lookup(r->sky, r->tracker_deg[h], sky_w_m2);
    double dhi = r->dhi_w_m2[h];
    for (int i = 0; i < n; i++)
        sky_w_m2[i] *= dhi;
}

/* ---- summary ------------------------------------------------------------ */

const char *mc_side_name(int side)
{
    static const char *const names[] = {"under", "am-edge", "pm-edge", "open"};
    return side >= 0 && side <= MC_OPEN ? names[side] : "?";
}

typedef struct sums {
    double light, light_am, rain, leaf_w, leaf_t, leaf_v;
} sums;

static void add_hour(sums *s, double sw, double rain, double ha, double t, double v)
{
    s->light += sw;
    if (ha < 0)
        s->light_am += sw;
    s->rain += rain;
    if (sw > 0 && isfinite(t)) {
        s->leaf_w += sw;
        s->leaf_t += sw * t;
        s->leaf_v += sw * v;
    }
}

static void finish_row(const sums *s, const sums *open, mc_strip_summary *row)
{
    row->light_share = open->light > 0 ? s->light / open->light : DNAN;
    row->light_am_share = s->light > 0 ? s->light_am / s->light : DNAN;
    row->rain_share = open->rain > 0 ? s->rain / open->rain : DNAN;
    row->leaf_temp_c = s->leaf_w > 0 ? s->leaf_t / s->leaf_w : DNAN;
    row->leaf_vpd_kpa = s->leaf_w > 0 ? s->leaf_v / s->leaf_w : DNAN;
}

/* Geometric zone of a strip centre x: under the panel's narrowest shadow
 * of rain, within a drip band's reach of either lower-edge position, or
 * open inter-row ground. */
static int zone(const mc_config *c, double x)
{
    double half = c->geom.chord_m / 2, hw = c->geom.drip_width_m / 2;
    double edge_min = half * cos(c->trk.max_angle_deg * DEG);
    double ax = fabs(x);
    if (ax < edge_min - hw)
        return MC_UNDER;
    if (ax <= half + hw)
        return x > 0 ? MC_AM_EDGE : MC_PM_EDGE; /* provisional, see below */
    return MC_OPEN;
}

int mc_summarise(const mc_config *c, const mc_result *r, int n, mc_strip_summary *rows)
{
    int ns = c->geom.n_strips;
    sums *s = calloc((size_t)ns + 1, sizeof *s);
    if (!s)
        return -1;
    for (int j = 0; j < n; j++)
        for (size_t k = 0; k < r[j].n_hours; k++) {
            ptrdiff_t at = mc_lit_at(&r[j], k), wet = mc_rain_at(&r[j], k);
            double ha = r[j].hour_angle_deg[k];
            for (int i = 0; i < ns; i++) {
                double rain = wet < 0 ? 0.0 : r[j].rain_strip_mm[wet + i];
                if (at < 0)
                    add_hour(&s[i], 0.0, rain, ha, DNAN, DNAN);
                else
                    add_hour(&s[i], r[j].sw_w_m2[at + i], rain, ha, r[j].leaf_c[at + i],
                             r[j].vpd_kpa[at + i]);
            }
            add_hour(&s[ns], r[j].ghi_w_m2[k], r[j].rain_mm[k], ha, r[j].open_leaf_c[k],
                     r[j].open_vpd_kpa[k]);
        }
    double am_pos = 0, am_neg = 0;
    for (int i = 0; i <= ns; i++) {
        rows[i].strip = i < ns ? i : -1;
        rows[i].offset_m = i < ns ? -c->geom.pitch_m / 2 + (i + 0.5) * c->geom.pitch_m / ns : DNAN;
        rows[i].side = i < ns ? zone(c, rows[i].offset_m) : MC_OPEN;
        finish_row(&s[i], &s[ns], &rows[i]);
        if (i < ns && rows[i].side == MC_AM_EDGE)
            am_pos += s[i].light_am / (s[i].light > 0 ? s[i].light : 1);
        if (i < ns && rows[i].side == MC_PM_EDGE)
            am_neg += s[i].light_am / (s[i].light > 0 ? s[i].light : 1);
    }
    /* which edge is lit in the morning is read from the computed light, not
     * assumed from the compass: swap the labels when the -x edge is */
    if (am_neg > am_pos)
        for (int i = 0; i < ns; i++)
            if (rows[i].side == MC_AM_EDGE || rows[i].side == MC_PM_EDGE)
                rows[i].side = rows[i].side == MC_AM_EDGE ? MC_PM_EDGE : MC_AM_EDGE;
    free(s);
    return 0;
}
