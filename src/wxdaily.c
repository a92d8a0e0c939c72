/* wxdaily.c - daily weather made hourly (see wxdaily.h for what and why).
 *
 * How the pieces fit:
 *   wxd_sun_at()       the day's sun by FAO-56 (declination eq. 24, sunset
 *                      hour angle eq. 25, day length eq. 34, solar time
 *                      eq. 31-33): solar noon, sunrise, sunset;
 *   wxd_pl_temp_c()    Parton & Logan's daytime sine (pl_day_c) and night
 *                      exponential (pl_night_c), the latter rescaled
 *                      (night_to_min_c) so that it lands on the next
 *                      minimum;
 *   day_ea_kpa()       the day's vapour pressure (FAO-56 eq. 14, 19, 48);
 *   day_rs_mj_m2_d()   the day's radiation, given or by Hargreaves
 *                      (wxd_hargreaves_rs_mj_m2_d, FAO-56 eq. 50 and 21);
 *   fill_ghi()         shares it by wxd_cpr_hours() (Collares-Pereira &
 *                      Rabl 1979), renormalised to the day's total;
 *   fill_rain()        shares the rain by the rule;
 *   wxd_to_hourly()    run_days(): checks each day (check_values,
 *                      check_sun) and fills its 24 rows (fill_day).
 * The days before the first and after the last are stand-ins for the night
 * edges only: a day like the first, a night to the last day's minimum.
 *
 * GPL-3.0-or-later.
 */
#include "wxdaily.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "et.h"
#include "psychro.h"
#include "tcal.h"

#define PI 3.14159265358979323846
#define DNAN ((double)NAN)

/* Shortest day and night the Parton & Logan curve is run with, h: it needs
 * a sunset and a sunrise (common practice, no source). */
#define MIN_PHASE_H 1.0
/* Accepted ranges of the daily values: the same physical bounds weather.c
 * puts on hourly rows (temperature -60..60 C, wind 0..75 m/s), and at most
 * 900 mm of rain a day, the most a 3-hour rule can place without passing
 * weather.c's 300 mm/h (common practice, no source). */
#define T_LO_C (-60.0)
#define T_HI_C 60.0
#define WIND_HI_M_S 75.0
#define RAIN_HI_MM 900.0
/* Length of the afternoon and morning rain windows, h (their times are in
 * enum wxd_rain_rule; common practice, no source). */
#define RAIN_WINDOW_H 3.0
#define MJ_H_TO_W_M2 (1e6 / 3600.0)

/* ---- the sun (FAO-56) ---------------------------------------------------- */

/* x wrapped into [-180, 180). */
static double wrap180(double x)
{
    return x - 360.0 * floor((x + 180.0) / 360.0);
}

/* Seasonal correction for solar time Sc, hours: FAO-56 eq. 32 with b from
 * eq. 33 (Allen et al. 1998). */
static double season_corr_h(int doy)
{
    double b = 2.0 * PI * (doy - 81) / 364.0;
    return 0.1645 * sin(2.0 * b) - 0.1255 * cos(b) - 0.025 * sin(b);
}

/* Allen et al. (1998) FAO-56: declination eq. 24, sunset hour angle eq. 25,
 * daylight hours eq. 34, and solar noon as the clock time t where eq. 31's
 * hour angle omega = pi/12 [(t + 0.06667 (Lz - Lm) + Sc) - 12] is zero
 * (Lz, Lm degrees west; here Lz - Lm = lon - zone, both east-positive). */
int wxd_sun_at(const site_location *loc, int64_t day, wxd_sun *out)
{
    if (!(fabs(loc->latitude_deg) <= 90.0) || !(fabs(loc->longitude_deg) <= 180.0) ||
        !(fabs(loc->utc_offset_h) <= 18.0))
        return -1;
    wxd_sun s;
    s.doy = tcal_day_of_year(day);
    s.decl_rad = et_declination_rad(s.doy);
    s.sunset_angle_rad = et_sunset_angle_rad(loc->latitude_deg * PI / 180.0, s.decl_rad);
    s.daylength_h = 24.0 / PI * s.sunset_angle_rad;
    double lz_minus_lm = wrap180(loc->longitude_deg - 15.0 * loc->utc_offset_h);
    s.noon_h = 12.0 - lz_minus_lm / 15.0 - season_corr_h(s.doy);
    s.sunrise_h = s.noon_h - s.daylength_h / 2.0;
    s.sunset_h = s.noon_h + s.daylength_h / 2.0;
    *out = s;
    return 0;
}

/* ---- radiation ----------------------------------------------------------- */

/* Hargreaves' radiation formula, Allen et al. (1998) FAO-56 eq. 50:
 * Rs = kRs sqrt(Tmax - Tmin) Ra. */
double wxd_hargreaves_rs_mj_m2_d(double tmax_c, double tmin_c,
                                 double ra_mj_m2_d, double krs)
{
    if (!(tmax_c >= tmin_c) || !(ra_mj_m2_d >= 0.0) || !(krs > 0.0) || isinf(tmax_c) ||
        isinf(tmin_c) || isinf(ra_mj_m2_d) || isinf(krs))
        return DNAN;
    return krs * sqrt(tmax_c - tmin_c) * ra_mj_m2_d;
}

/* Collares-Pereira, M. & Rabl, A. (1979) The average distribution of solar
 * radiation - correlations between diffuse and hemispherical and between
 * daily and hourly insolation values. Solar Energy 22:155-164; in the form
 * of Duffie & Beckman, Solar Engineering of Thermal Processes, eq. 2.13.2
 * (equation number as the brief gives it, not checked against the book):
 *   rt = (pi/24) (a + b cos w) (cos w - cos ws) / (sin ws - ws cos ws),
 *   a = 0.409 + 0.5016 sin(ws - 60 deg), b = 0.6609 - 0.4767 sin(ws - 60 deg)
 * (coefficients confirmed against a public calculator page of the same
 * formula), at each hour's middle w = pi/12 (k + 0.5 - noon).  The paper
 * fitted long-term mean days; using it for single days is common practice,
 * no source. */
int wxd_cpr_hours(double ws_rad, double noon_h, double rt[24])
{
    if (!(ws_rad > 0.0 && ws_rad <= PI) || !isfinite(noon_h))
        return -1;
    double s = sin(ws_rad - PI / 3.0), cws = cos(ws_rad);
    double a = 0.409 + 0.5016 * s, b = 0.6609 - 0.4767 * s;
    double scale = PI / 24.0 / (sin(ws_rad) - ws_rad * cws);
    for (int k = 0; k < 24; k++) {
        double w = PI / 12.0 * (k + 0.5 - noon_h);
        double cw = cos(w);
        rt[k] = fabs(w) < ws_rad ? scale * (a + b * cw) * (cw - cws) : 0.0;
    }
    return 0;
}

/* ---- air temperature ----------------------------------------------------- */

double wxd_pl_tmin_time_h(const wxd_tcurve *c)
{
    return c->sunrise_h + WXD_PL_C_H;
}

double wxd_pl_tmax_time_h(const wxd_tcurve *c)
{
    return wxd_pl_tmin_time_h(c) + (c->sunset_h - c->sunrise_h + 2.0 * WXD_PL_A_H) / 2.0;
}

/* Parton, W.J. & Logan, J.A. (1981) A model for diurnal variation in soil
 * and air temperature. Agric. Meteorol. 23:205-216, daytime equation
 * (equation number not confirmed; form from memory):
 *   T = (Tx - Tn) sin(pi m / (Y + 2a)) + Tn,
 * m hours after the minimum (at sunrise + c), Y the day length. */
static double pl_day_c(const wxd_tcurve *c, double t_h)
{
    double m = t_h - wxd_pl_tmin_time_h(c), y = c->sunset_h - c->sunrise_h;
    return (c->tmax_c - c->tmin_c) * sin(PI * m / (y + 2.0 * WXD_PL_A_H)) + c->tmin_c;
}

/* Parton & Logan (1981), nighttime equation (number not confirmed; form
 * from memory): T = Tn + (Tsn - Tn) exp(-b n / Z), n hours after sunset,
 * Z the night length 24 - Y, Tsn the temperature at sunset, here with the
 * next morning's minimum as Tn. */
static double pl_night_c(double tn_c, double tsn_c, double n_h, double z_h)
{
    return tn_c + (tsn_c - tn_c) * exp(-WXD_PL_B * n_h / z_h);
}

/* Our change to pl_night_c (no source): the published exponential is still
 * (Tsn - Tn) exp(-b Zn/Z) above Tn when the next minimum comes, Zn hours
 * after sunset, a jump of about a tenth of the evening's fall.  Subtracting
 * that residual and rescaling, T = Tn + (Tsn - Tn) (E(n) - E(Zn)) /
 * (1 - E(Zn)) with E(x) = exp(-b x / Z), keeps the shape and makes the
 * curve continuous at the minimum, which reaches Tn exactly. */
static double night_to_min_c(const wxd_tcurve *c, double t_h)
{
    double z = 24.0 - (c->sunset_h - c->sunrise_h);
    double zn = c->sunrise_next_h + WXD_PL_C_H - c->sunset_h;
    double tsn = pl_day_c(c, c->sunset_h);
    double e_end = pl_night_c(0.0, 1.0, zn, z);
    double e_now = pl_night_c(0.0, 1.0, t_h - c->sunset_h, z);
    return c->tmin_next_c + (tsn - c->tmin_next_c) * (e_now - e_end) / (1.0 - e_end);
}

double wxd_pl_temp_c(const wxd_tcurve *c, double t_h)
{
    if (!(t_h >= wxd_pl_tmin_time_h(c) && t_h <= c->sunrise_next_h + WXD_PL_C_H))
        return DNAN;
    return t_h <= c->sunset_h ? pl_day_c(c, t_h) : night_to_min_c(c, t_h);
}

/* ---- one day's inputs ---------------------------------------------------- */

static int out_of(double x, double lo, double hi)
{
    return !(x >= lo && x <= hi);
}

/* The day's actual vapour pressure, kPa, Allen et al. (1998) FAO-56: from
 * the dew point (eq. 14), else from mean RH (eq. 19), else with the dew
 * point taken as Tmin (eq. 48, "ea = e0(Tmin)", the assumption FAO-56
 * ch. 3 makes when humidity data are missing). */
static double day_ea_kpa(const wxd_day *d)
{
    if (!isnan(d->tdew_c))
        return psy_ea_dew_kpa(d->tdew_c);
    if (!isnan(d->rh_mean_pct))
        return psy_ea_rh_mean_kpa(d->tmin_c, d->tmax_c, d->rh_mean_pct);
    return psy_e0_kpa(d->tmin_c);
}

/* The day's global radiation, MJ m-2 d-1: as given, else Hargreaves
 * (eq. 50, interior kRs) with Ra of eq. 21, capped at the clear-sky Rso of
 * eq. 37 (the cap is common practice, no source: a clear sky is the most
 * a day can get). */
static double day_rs_mj_m2_d(const wxd_day *d, const site_location *loc, int doy)
{
    if (!isnan(d->rs_mj_m2_d))
        return d->rs_mj_m2_d;
    double ra = et_ra_day_mj_m2_d(loc->latitude_deg, doy);
    double rs = wxd_hargreaves_rs_mj_m2_d(d->tmax_c, d->tmin_c, ra, WXD_KRS_INTERIOR);
    double rso = et_rso_mj_m2(ra, loc->elevation_m);
    return rs < rso ? rs : rso;
}

static int day_fail(rg_err *err, int64_t day, const char *what, double got)
{
    char date[16];
    tcal_format_date(day, date);
    return rg_fail(err, "daily weather %s: expected %s, found %g", date, what, got);
}

/* Checks one day's values (s is its sun).  Returns 0, or -1 with a
 * message. */
static int check_values(const wxd_day *d, const wxd_sun *s, const site_location *loc,
                        int64_t day, rg_err *err)
{
    if (out_of(d->tmin_c, T_LO_C, T_HI_C))
        return day_fail(err, day, "tmin_c in -60..60", d->tmin_c);
    if (out_of(d->tmax_c, d->tmin_c, T_HI_C))
        return day_fail(err, day, "tmax_c in tmin_c..60", d->tmax_c);
    if (out_of(d->rain_mm, 0.0, RAIN_HI_MM))
        return day_fail(err, day, "rain_mm in 0..900", d->rain_mm);
    if (out_of(d->wind_m_s, 0.0, WIND_HI_M_S))
        return day_fail(err, day, "wind_m_s in 0..75", d->wind_m_s);
    if (!isnan(d->rh_mean_pct) && out_of(d->rh_mean_pct, 0.0, 100.0))
        return day_fail(err, day, "rh_mean_pct in 0..100", d->rh_mean_pct);
    if (!isnan(d->tdew_c) && out_of(d->tdew_c, T_LO_C, T_HI_C))
        return day_fail(err, day, "tdew_c in -60..60", d->tdew_c);
    double ra = et_ra_day_mj_m2_d(loc->latitude_deg, s->doy);
    if (!isnan(d->rs_mj_m2_d) && out_of(d->rs_mj_m2_d, 0.0, ra))
        return day_fail(err, day, "rs_mj_m2_d no more than the extraterrestrial Ra (FAO-56 eq. 21)",
                        d->rs_mj_m2_d);
    return 0;
}

/* Checks that day has both a day and a night long enough for the
 * temperature curve. */
static int check_sun(const wxd_sun *s, int64_t day, rg_err *err)
{
    if (out_of(s->daylength_h, MIN_PHASE_H, 24.0 - MIN_PHASE_H))
        return day_fail(err, day, "a day length of 1-23 h (no polar day or night)", s->daylength_h);
    return 0;
}

/* ---- the hours of one day ------------------------------------------------ */

static wxd_tcurve make_curve(const wxd_day *d, const wxd_day *next, const wxd_sun *s,
                             const wxd_sun *s_next)
{
    return (wxd_tcurve){.tmin_c = d->tmin_c, .tmax_c = d->tmax_c, .tmin_next_c = next->tmin_c,
                        .sunrise_h = s->sunrise_h, .sunset_h = s->sunset_h,
                        .sunrise_next_h = 24.0 + s_next->sunrise_h};
}

/* Temperature at each mid-hour (the night before the minimum belongs to the
 * previous day's curve) and RH with the day's vapour pressure, capped. */
static void fill_temp_rh(const wxd_tcurve *prev, const wxd_tcurve *cur, double ea_kpa,
                         double *t_c, double *rh_pct)
{
    double t_min_h = wxd_pl_tmin_time_h(cur);
    for (int k = 0; k < 24; k++) {
        double t_h = k + 0.5;
        t_c[k] = t_h < t_min_h ? wxd_pl_temp_c(prev, t_h + 24.0) : wxd_pl_temp_c(cur, t_h);
        double rh = 100.0 * ea_kpa / psy_e0_kpa(t_c[k]);
        rh_pct[k] = rh < 100.0 ? rh : 100.0;
    }
}

/* GHI of each hour, W/m2: rs shared in proportion to the Collares-Pereira
 * & Rabl ratio at mid-hour, renormalised so the hours sum to rs.  Returns
 * -1 when rs > 0 but the ratio is 0 at every hour. */
static int fill_ghi(const wxd_sun *s, double rs_mj_m2_d, double *ghi_w_m2)
{
    double w[24], sum = 0.0;
    wxd_cpr_hours(s->sunset_angle_rad, s->noon_h, w);
    for (int k = 0; k < 24; k++)
        sum += w[k];
    if (!(sum > 0.0) && rs_mj_m2_d > 0.0)
        return -1;
    for (int k = 0; k < 24; k++)
        ghi_w_m2[k] = sum > 0.0 ? rs_mj_m2_d * w[k] / sum * MJ_H_TO_W_M2 : 0.0;
    return 0;
}

/* Rain of each hour: even over the day, or over a 3-hour window starting
 * start_solar_h of solar time, each clock hour taking its overlap with the
 * window (a window that would leave the day is moved inside it). */
static void fill_rain(const wxd_sun *s, double rain_mm, int rule, double *rain_h_mm)
{
    if (rule == WXD_RAIN_SPREAD) {
        for (int k = 0; k < 24; k++)
            rain_h_mm[k] = rain_mm / 24.0;
        return;
    }
    double start = s->noon_h + (rule == WXD_RAIN_AFTERNOON ? 3.0 : -6.0);
    start = fmin(fmax(start, 0.0), 24.0 - RAIN_WINDOW_H);
    for (int k = 0; k < 24; k++) {
        double lap = fmin(k + 1.0, start + RAIN_WINDOW_H) - fmax((double)k, start);
        rain_h_mm[k] = lap > 0.0 ? rain_mm * lap / RAIN_WINDOW_H : 0.0;
    }
}

/* ---- the series ---------------------------------------------------------- */

static const int out_cols[] = {WX_GHI, WX_TEMP, WX_RH, WX_RAIN, WX_WIND};
#define N_OUT_COLS ((int)(sizeof out_cols / sizeof out_cols[0]))

static int alloc_series(wx_series *out, size_t n_hours)
{
    memset(out, 0, sizeof *out);
    for (int j = 0; j < N_OUT_COLS; j++) {
        out->v[out_cols[j]] = malloc((n_hours ? n_hours : 1) * sizeof(double));
        if (!out->v[out_cols[j]]) {
            wx_series_free(out);
            return -1;
        }
    }
    return 0;
}

/* What the day loop carries from one day to the next. */
typedef struct run_ctx {
    const site_location *loc;
    int rule;
    wx_series *out;
    rg_err *err;
    wxd_sun s_cur, s_next;
    wxd_tcurve prev;        /* the curve of the day before */
} run_ctx;

/* Fills the 24 rows of day number day (row offset row) from its values,
 * its curve and its sun. */
static int fill_day(run_ctx *x, int64_t day, const wxd_day *d, const wxd_tcurve *cur, size_t row)
{
    wx_series *o = x->out;
    const wxd_sun *s = &x->s_cur;
    fill_temp_rh(&x->prev, cur, day_ea_kpa(d), o->v[WX_TEMP] + row, o->v[WX_RH] + row);
    double rs = day_rs_mj_m2_d(d, x->loc, s->doy);
    if (fill_ghi(s, rs, o->v[WX_GHI] + row) < 0)
        return day_fail(x->err, day, "no radiation on a day when the sun is up at no hour's middle, "
                                     "rs_mj_m2_d", rs);
    fill_rain(s, d->rain_mm, x->rule, o->v[WX_RAIN] + row);
    for (int k = 0; k < 24; k++)
        o->v[WX_WIND][row + (size_t)k] = d->wind_m_s;
    return 0;
}

/* Runs the days in order; the first day's previous night is that of a day
 * like the first, the last day's night falls to its own minimum. */
static int run_days(run_ctx *x, int64_t first_day, const wxd_day *days, size_t n_days)
{
    wxd_sun s_prev;
    wxd_sun_at(x->loc, first_day - 1, &s_prev);
    if (check_sun(&s_prev, first_day - 1, x->err) < 0 || check_sun(&x->s_cur, first_day, x->err) < 0)
        return -1;
    x->prev = make_curve(&days[0], &days[0], &s_prev, &x->s_cur);
    for (size_t i = 0; i < n_days; i++) {
        int64_t day = first_day + (int64_t)i;
        const wxd_day *next = i + 1 < n_days ? &days[i + 1] : &days[i];
        wxd_sun_at(x->loc, day + 1, &x->s_next);
        if (check_values(&days[i], &x->s_cur, x->loc, day, x->err) < 0 ||
            check_sun(&x->s_next, day + 1, x->err) < 0)
            return -1;
        wxd_tcurve cur = make_curve(&days[i], next, &x->s_cur, &x->s_next);
        if (fill_day(x, day, &days[i], &cur, 24 * i) < 0)
            return -1;
        x->prev = cur;
        x->s_cur = x->s_next;
    }
    return 0;
}

int wxd_to_hourly(const site_location *loc, int64_t first_day, const wxd_day *days,
                  size_t n_days, int rain_rule, wx_series *out, rg_err *err)
{
    run_ctx x = {.loc = loc, .rule = rain_rule, .out = out, .err = err};
    memset(out, 0, sizeof *out);
    if (rain_rule != WXD_RAIN_SPREAD && rain_rule != WXD_RAIN_AFTERNOON &&
        rain_rule != WXD_RAIN_MORNING)
        return rg_fail(err, "daily weather: unknown rain rule %d", rain_rule);
    if (wxd_sun_at(loc, first_day, &x.s_cur) < 0)
        return rg_fail(err, "daily weather: the site's latitude, longitude or UTC offset is out of range");
    if (n_days > SIZE_MAX / 24 / sizeof(double) || (n_days > 0 && !days))
        return rg_fail(err, "daily weather: expected an array of days, found none for %zu days",
                       n_days);
    if (alloc_series(out, 24 * n_days) < 0)
        return rg_fail(err, "out of memory for %zu days of hourly weather", n_days);
    out->t0_h = first_day * 24;
    out->n = 24 * n_days;
    if (n_days > 0 && run_days(&x, first_day, days, n_days) < 0) {
        wx_series_free(out);
        return -1;
    }
    return 0;
}
