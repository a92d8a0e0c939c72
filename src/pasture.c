/* pasture.c - the hourly soil water and growth loop over the strips (growth
 * stage).  See pasture.h for what it computes and the assumptions.
 *
 * Per hour: the open field's FAO-56 hourly ETo (et_hour_mm_h) gives the
 * air's terms once; each strip's ETo reuses them with its own sun
 * (et_hour_shaded_mm_h).  Each strip's rain is spread (spread_rain, only
 * when the soil names no texture) and its excess over the infiltration
 * capacity runs on to strips that still take water (run_on).  Then per
 * strip: green cover -> fraction of ground covered (Beer's law on the
 * green LAI) -> soil_hour_split (rain; the strip's ETo for the soil's
 * evaporation; for the sward's transpiration the same with the stomata
 * partly shut in shade, transpiration_eto; cover) -> Ks -> gr_hour (beam
 * and sky light with the sun's elevation, leaf temperature and VPD, Ks).
 * When the soil names its texture, soil water then flows sideways between
 * the strips (lateral_hour, lateral.h).  At each midnight the day's
 * growth and senescence are stored, a day ending with Ks < 1 counts as a
 * water stress day, and every rest_days days the sward is grazed back to
 * the residual.
 */
#include "pasture.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "et.h"
#include "growth.h"
#include "tcal.h"

#define MJ_PER_WH (3600.0 / 1e6) /* W/m2 for an hour -> MJ/m2 */

int ps_config_make(const site *s, int soil, int sward, ps_config *c, rg_err *err)
{
    memset(c, 0, sizeof *c);
    const site_soil *so = &s->soils[soil];
    c->sward = s->swards[sward].p;
    if (soil_params_make(so->water_held_mm_per_m, so->rooting_depth_m, so->infiltration_mm_h,
                         c->sward.depletion_p, &c->soil) < 0)
        return rg_fail(err, "%s: soil \"%s\": parameters the water balance cannot use", s->path, so->id);
    /* the sward's own FAO-56 mid-season Kc stands for a full green cover */
    c->soil.kcb_full = c->sward.kc_mid - 0.05; /* Kcb ~ Kc - 0.05 for grass (FAO-56 ch. 7, from memory) */
    if (soil_params_check(&c->soil) < 0)
        return rg_fail(err, "%s: soil \"%s\": parameters the water balance cannot use", s->path, so->id);
    c->residual_kgdm_ha = sward_cover_kgdm_ha(&c->sward, s->rules.residual_height_cm);
    c->rest_days = s->rules.min_rest_days > 0 ? s->rules.min_rest_days : 1;
    c->lat_deg = s->loc.latitude_deg;
    c->lon_east_deg = s->loc.longitude_deg;
    c->zone_east_deg = 15.0 * s->loc.utc_offset_h;
    c->elev_m = s->loc.elevation_m;
    c->pitch_m = s->array.pitch_m;
    /* Sideways flow of soil water between the strips (lateral.h) when the
     * soil names its texture class. */
    c->lateral = so->texture[0] != 0;
    if (c->lateral && lf_soil_make(tex_find(so->texture), so->rooting_depth_m, c->soil.taw_mm, &c->lat) < 0)
        return rg_fail(err, "%s: soil \"%s\": texture %s cannot hold the water the soil says it holds",
                       s->path, so->id, so->texture);
    /* Without it, a cruder stand-in: water reaching the ground under a drip
     * line does not stay in a 0.1 m column (it splashes, spreads sideways
     * in the soil, and roots reach sideways for it), so each strip's rain
     * is shared over +/- 0.3 m with a triangular weight before the
     * infiltration test (common practice, no source).  With sideways flow
     * the soil does this itself and the rain lands where it drips. */
    c->spread_m = c->lateral ? 0.0 : 0.3;
    return 0;
}

void ps_free(ps_result *r)
{
    free(r->growth);
    free(r->senescence);
    free(r->stress_days);
    free(r->water);
    memset(r, 0, sizeof *r);
}

double ps_total_kgdm_ha(const ps_result *r, int col, size_t d0, size_t d1)
{
    double sum = 0;
    for (size_t d = d0; d < d1 && d < r->n_days; d++)
        sum += r->growth[d * (size_t)r->n_cols + (size_t)col];
    return sum;
}

/* ---- one column (a strip or the open ground) ---------------------------- */

typedef struct column {
    soil_state soil;
    gr_state grass;
    double day_gross, day_sen;  /* growth and senescence so far today */
} column;

/* The reference ET the sward of a strip transpires against: the strip's
 * own (et_hour_shaded_mm_h) with the surface resistance raised as far as
 * the strip's stomata close for want of light, relative to the same sward
 * in the open field's sun (gr_stomata_light_f1, Noilhan & Planton 1989):
 * r_s x F1(open sun) / F1(strip sun).  The open field itself, and any
 * strip in full sun, keep the FAO-56 reference; at night both are dark
 * and the factor is 1.  Only transpiration takes it: the soil between
 * the tillers has no stomata. */
static double transpiration_eto(const ps_config *c, double lai, const struct et_terms *terms,
                                double u2, double sw_w_m2, double ghi_w_m2, double eto)
{
    if (sw_w_m2 >= ghi_w_m2)
        return eto;
    double f1_open = gr_stomata_light_f1(ghi_w_m2, lai, c->sward.stomata_light_w_m2,
                                         c->sward.stomata_rs_min_s_m);
    double f1_strip = gr_stomata_light_f1(sw_w_m2, lai, c->sward.stomata_light_w_m2,
                                          c->sward.stomata_rs_min_s_m);
    if (!(f1_strip > 0.0) || !(f1_open > 0.0))
        return (double)NAN;
    return et_hour_shaded_rs_mm_h(terms, u2, sw_w_m2 * MJ_PER_WH, f1_open / f1_strip);
}

/* The sun a column gets this hour, for its transpiration: the strip's
 * and the open field's shortwave (W/m2) and the hour's air terms. */
typedef struct column_sun {
    const struct et_terms *terms;
    double u2_m_s, sw_w_m2, ghi_w_m2;
} column_sun;

/* Advances one column by one hour; -1 on a refused value. */
static int column_hour(const ps_config *c, column *col, ps_water *wb, gr_light *light,
                       double rain, double eto, const column_sun *sun, double leaf_c,
                       double vpd, double t_air)
{
    double lai = col->grass.green_kgdm_ha * c->sward.leaf_area_per_cover_m2_per_kgdm_ha;
    double cover = gr_intercepted(lai, c->sward.light_extinction_k);
    light->intercepted_frac = cover; /* gr_hour's own, made once */
    double eto_t = transpiration_eto(c, lai, sun->terms, sun->u2_m_s, sun->sw_w_m2,
                                     sun->ghi_w_m2, eto);
    soil_flux sf;
    gr_flux gf;
    if (soil_hour_split(&c->soil, &col->soil, rain, eto, eto_t, cover, &sf) < 0 ||
        gr_hour(&c->sward, &col->grass, light, leaf_c, vpd, sf.ks, t_air, &gf) < 0)
        return -1;
    wb->rain += sf.rain_mm;
    wb->runoff += sf.runoff_mm;
    wb->evaporation += sf.evaporation_mm;
    wb->transpiration += sf.transpiration_mm;
    wb->drainage += sf.drainage_mm;
    col->day_gross += gf.gross_kgdm_ha;
    col->day_sen += gf.senescence_kgdm_ha;
    return 0;
}

/* ---- the run ------------------------------------------------------------ */

typedef struct run {
    const ps_config *c;
    const mc_result *m;
    const wx_series *w;
    size_t w0;                 /* index in w of m's first hour */
    column *cols;
    double rs_rso_dark;        /* last daylight Rs/Rso, for night hours */
    int half;                  /* spread reaches this many strips each way */
    double *weight;            /* [0..half] triangular weights, sum over -half..half = 1 */
    double *rain;              /* scratch [n_strips] */
    soil_state *soil;          /* scratch [n_strips], for lf_step */
    double *moved;             /* scratch [3 n_strips], for lf_step */
    double *sky;               /* scratch [n_strips]: the strips' sky light */
} run;

/* Triangular weights w(k) proportional to (half + 1 - |k|), k = -half..half,
 * normalised so they add up to 1: spreading then conserves water exactly. */
static int spread_weights(run *x, int n)
{
    double w_strip = x->c->pitch_m / n;
    x->half = (int)floor(x->c->spread_m / w_strip);
    if (2 * x->half + 1 > n)
        x->half = (n - 1) / 2;
    x->weight = malloc(((size_t)x->half + 1) * sizeof *x->weight);
    x->rain = malloc((size_t)n * sizeof *x->rain);
    x->sky = malloc((size_t)n * sizeof *x->sky);
    if (!x->weight || !x->rain || !x->sky)
        return -1;
    double sum = 0;
    for (int k = -x->half; k <= x->half; k++)
        sum += x->half + 1 - abs(k);
    for (int k = 0; k <= x->half; k++)
        x->weight[k] = (x->half + 1 - k) / sum;
    return 0;
}

/* Shares each strip's rain over its neighbours (periodic across pitches,
 * since the next row's drip lands the same way). */
static void spread_rain(const run *x, const double *in, int n, double *out)
{
    for (int i = 0; i < n; i++)
        out[i] = 0;
    for (int j = 0; j < n; j++) {
        if (in[j] == 0)
            continue;
        for (int k = -x->half; k <= x->half; k++)
            out[((j + k) % n + n) % n] += in[j] * x->weight[abs(k)];
    }
}

/* Run-on: rain beyond what a strip's soil takes in this hour (its
 * infiltration capacity) does not leave level ground between the rows; it
 * flows sideways over the surface, half each way, and soaks in at the
 * nearest strips that still take water (a drip line's excess reaches the
 * dry ground under the panel and the inter-row).  What the whole pitch
 * cannot take runs off, left on its own strip for soil_hour to count.
 * Water is conserved exactly.  Assumes level ground and no crust (common
 * practice, no source; the run-off/run-on view of dryland patches, e.g.
 * Ludwig et al. 2005, Ecology 86:288-297). */
static void run_on(const run *x, double *rain, int n)
{
    double cap = x->c->soil.infiltration_mm_h;
    for (int i = 0; i < n; i++) {
        if (!(rain[i] > cap))
            continue;
        double back = 0;
        for (int side = -1; side <= 1; side += 2) {
            double e = (rain[i] - cap) / 2;
            for (int d = 1; d <= n / 2 && e > 0; d++) {
                int j = ((i + side * d) % n + n) % n;
                double room = cap - rain[j];
                if (room <= 0)
                    continue;
                double take = e < room ? e : room;
                rain[j] += take;
                e -= take;
            }
            back += e;
        }
        rain[i] = cap + back;
    }
}

/* The open field's ETo terms for hour k; returns its ETo (mm). */
static double open_eto(run *x, size_t k, struct et_terms *terms)
{
    const mc_result *m = x->m;
    int64_t hour = m->t0_h + (int64_t)k;
    int64_t day = tcal_hour_day(hour);
    struct et_hour in = {
        .lat_deg = x->c->lat_deg, .lon_east_deg = x->c->lon_east_deg,
        .zone_east_deg = x->c->zone_east_deg, .elev_m = x->c->elev_m,
        .doy = tcal_day_of_year(day), .t_mid_h = (double)(hour - day * 24) + 0.5,
        .t_c = x->w->v[WX_TEMP][x->w0 + k], .rh_pct = x->w->v[WX_RH][x->w0 + k],
        .u2_m_s = x->w->v[WX_WIND][x->w0 + k], .rs_mj_m2_h = m->ghi_w_m2[k] * MJ_PER_WH,
        .rs_rso_dark = x->rs_rso_dark,
    };
    double eto = et_hour_mm_h(&in, terms);
    if (isfinite(eto) && terms->ra_mj_m2 > 0 && terms->rso_mj_m2 > 0.1)
        x->rs_rso_dark = terms->rs_rso; /* FAO-56: hold the ratio from before sunset */
    return eto;
}

/* An hour of sideways soil water flow between the strips (lateral.h),
 * after the hour's rain and evapotranspiration. */
static int lateral_hour(run *x, int n, ps_result *r)
{
    for (int i = 0; i < n; i++)
        x->soil[i] = x->cols[i].soil;
    if (lf_step(&x->c->lat, x->soil, n, x->c->pitch_m / n, 3600.0, x->moved, x->moved + n) < 0)
        return -1;
    for (int i = 0; i < n; i++) {
        x->cols[i].soil = x->soil[i];
        r->water[i].lateral_in += x->moved[i];
    }
    return 0;
}

static int one_hour(run *x, size_t k, ps_result *r)
{
    const mc_result *m = x->m;
    int n = m->n_strips;
    struct et_terms terms;
    double eto_open = open_eto(x, k, &terms);
    if (!isfinite(eto_open))
        return -1;
    double u2 = x->w->v[WX_WIND][x->w0 + k], t_air = m->t_air_c[k];
    ptrdiff_t wet = mc_rain_at(m, k); /* -1: a dry hour */
    if (wet >= 0) {
        spread_rain(x, m->rain_strip_mm + wet, n, x->rain);
        run_on(x, x->rain, n);
    } else
        for (int i = 0; i < n; i++)
            x->rain[i] = 0;
    double elev = 90.0 - m->zenith_deg[k];
    gr_optics optics; /* the sun's part of the canopy optics, once per hour */
    if (gr_dpf_optics(elev, x->c->sward.light_extinction_k, &optics) < 0)
        return -1;
    ptrdiff_t lit = mc_lit_at(m, k); /* -1 at night: no light, no leaf T or VPD */
    mc_sky_w_m2(m, k, x->sky);
    for (int i = 0; i < n; i++) {
        double sw = lit < 0 ? 0.0 : m->sw_w_m2[lit + i];
        double eto = sw == m->ghi_w_m2[k] ? eto_open
                                           : et_hour_shaded_mm_h(&terms, u2, sw * MJ_PER_WH);
        gr_light light = {.sw_w_m2 = sw, .sky_w_m2 = x->sky[i], .sun_elev_deg = elev,
                          .optics = &optics};
        column_sun sun = {.terms = &terms, .u2_m_s = u2, .sw_w_m2 = sw, .ghi_w_m2 = m->ghi_w_m2[k]};
        if (column_hour(x->c, &x->cols[i], &r->water[i], &light, x->rain[i], eto, &sun,
                        lit < 0 ? (double)NAN : m->leaf_c[lit + i],
                        lit < 0 ? (double)NAN : m->vpd_kpa[lit + i], t_air) < 0)
            return -1;
    }
    if (x->c->lateral && lateral_hour(x, n, r) < 0)
        return -1;
    gr_light open = {.sw_w_m2 = m->ghi_w_m2[k], .sky_w_m2 = m->dhi_w_m2[k], .sun_elev_deg = elev,
                     .optics = &optics};
    column_sun sun = {.terms = &terms, .u2_m_s = u2, .sw_w_m2 = m->ghi_w_m2[k],
                      .ghi_w_m2 = m->ghi_w_m2[k]};
    return column_hour(x->c, &x->cols[n], &r->water[n], &open, m->rain_mm[k], eto_open, &sun,
                       m->open_leaf_c[k], m->open_vpd_kpa[k], t_air);
}

/* Midnight: store the day, count stress, graze back every rest period. */
static void end_of_day(run *x, size_t d, ps_result *r)
{
    for (int i = 0; i < r->n_cols; i++) {
        column *col = &x->cols[i];
        r->growth[d * (size_t)r->n_cols + (size_t)i] = col->day_gross;
        r->senescence[d * (size_t)r->n_cols + (size_t)i] = col->day_sen;
        col->day_gross = col->day_sen = 0;
        if (soil_ks(&x->c->soil, &col->soil) < 1.0)
            r->stress_days[i]++;
        if ((d + 1) % (size_t)x->c->rest_days == 0)
            gr_cut(&col->grass, x->c->residual_kgdm_ha);
    }
}

static int alloc_result(ps_result *r, int n_cols, size_t n_days)
{
    memset(r, 0, sizeof *r);
    r->n_cols = n_cols;
    r->n_days = n_days;
    r->growth = calloc(n_days ? n_days * (size_t)n_cols : 1, sizeof *r->growth);
    r->senescence = calloc(n_days ? n_days * (size_t)n_cols : 1, sizeof *r->senescence);
    r->stress_days = calloc((size_t)n_cols, sizeof *r->stress_days);
    r->water = calloc((size_t)n_cols, sizeof *r->water);
    if (r->growth && r->senescence && r->stress_days && r->water)
        return 0;
    ps_free(r);
    return -1;
}

int ps_run(const ps_config *c, const mc_result *m, const wx_series *w, ps_result *out,
           rg_err *err)
{
    if (m->t0_h % 24 != 0 || m->n_hours % 24 != 0 || m->t0_h < w->t0_h ||
        m->t0_h + (int64_t)m->n_hours > w->t0_h + (int64_t)w->n)
        return rg_fail(err, "%s: growth needs whole days of weather", w->path);
    int n_cols = m->n_strips + 1;
    if (alloc_result(out, n_cols, m->n_hours / 24) < 0)
        return rg_fail(err, "out of memory for the growth run");
    out->day0 = tcal_hour_day(m->t0_h);
    /* Rs/Rso for night hours before the first sunset seen: 0.8, a mostly
     * clear sky (common practice, no source); after that FAO-56's rule,
     * the ratio from the hours before sunset, takes over */
    run x = {.c = c, .m = m, .w = w, .w0 = (size_t)(m->t0_h - w->t0_h), .rs_rso_dark = 0.8};
    x.cols = calloc((size_t)n_cols, sizeof *x.cols);
    x.soil = calloc((size_t)n_cols, sizeof *x.soil);
    x.moved = calloc(3 * (size_t)n_cols, sizeof *x.moved);
    if (!x.cols || !x.soil || !x.moved || spread_weights(&x, m->n_strips) < 0) {
        free(x.cols);
        free(x.soil);
        free(x.moved);
        free(x.weight);
        free(x.rain);
        free(x.sky);
        ps_free(out);
        return rg_fail(err, "out of memory for the growth run");
    }
    int rc = 0;
    for (int i = 0; i < n_cols && rc == 0; i++) {
        /* start at field capacity with a wet surface, the sward at its residual */
        rc = gr_state_init(&c->sward, c->residual_kgdm_ha, &x.cols[i].grass);
        out->water[i].storage_start = soil_storage_mm(&c->soil, &x.cols[i].soil);
    }
    for (size_t k = 0; rc == 0 && k < m->n_hours; k++) {
        rc = one_hour(&x, k, out);
        if (rc == 0 && (k + 1) % 24 == 0)
            end_of_day(&x, k / 24, out);
    }
    for (int i = 0; i < n_cols; i++)
        out->water[i].storage_end = soil_storage_mm(&c->soil, &x.cols[i].soil);
    free(x.cols);
    free(x.soil);
    free(x.moved);
    free(x.weight);
    free(x.rain);
    free(x.sky);
    if (rc < 0) {
        ps_free(out);
        return rg_fail(err, "%s: the soil water or growth step refused a value (a bug: please report it with the site file)",
                       w->path);
    }
    return 0;
}
