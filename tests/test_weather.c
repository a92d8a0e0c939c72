/* test_weather.c - the weather CSV reader: columns, units, gaps. */
#include <stdlib.h>
#include <string.h>

#include "rgtest.h"
#include "site.h"
#include "tcal.h"
#include "weather.h"

static site_weather default_cfg(void)
{
    static const char *const h[WX_NCOLS] = {"time", "ghi_w_m2", "temp_c", "rh_pct", "rain_mm",
                                            "wind_m_s", "dni_w_m2", "dhi_w_m2", "pressure_hpa"};
    site_weather c;
    memset(&c, 0, sizeof c);
    for (int k = 0; k < WX_NCOLS; k++)
        strcpy(c.header[k], h[k]);
    c.max_fill_h = 3;
    return c;
}

/* Builds n hourly rows from 2025-01-01T00:00 with a ramp in temperature
 * (t = hour index) and rain 1 mm every hour; skip_from/skip_n drop rows. */
static char *rows(const char *header, int n, int skip_from, int skip_n)
{
    static char buf[1 << 16];
    int off = snprintf(buf, sizeof buf, "%s\n", header);
    for (int i = 0; i < n; i++) {
        if (i >= skip_from && i < skip_from + skip_n)
            continue;
        char t[17];
        tcal_format_hour(tcal_days(2025, 1, 1) * 24 + i, t);
        off += snprintf(buf + off, sizeof buf - (size_t)off, "%s,%d,%d,50,1,2\n", t, i * 10, i);
    }
    return buf;
}

/* Columns land where the header says, in any order, and extra columns are
 * ignored. */
static void test_columns_any_order(void **state)
{
    (void)state;
    site_weather cfg = default_cfg();
    const char *text = "# a comment line\nrain_mm,time,wind_m_s,extra,rh_pct,temp_c,ghi_w_m2\n"
                       "0.5,2025-01-01T00:00,3,x,40,10,0\n";
    char big[8192];
    int off = snprintf(big, sizeof big, "%s", text);
    for (int i = 1; i < 30; i++)
        off += snprintf(big + off, sizeof big - (size_t)off, "0,2025-01-%02dT%02d:00,3,x,40,10,%d\n",
                        1 + i / 24, i % 24, i);
    wx_series w;
    rg_err e = {{0}};
    assert_int_equal(wx_parse(&cfg, "mem", big, strlen(big), &w, &e), 0);
    assert_int_equal(w.n, 30);
    assert_int_equal(w.t0_h, tcal_days(2025, 1, 1) * 24);
    assert_close(w.v[WX_RAIN][0], 0.5, 0);
    assert_close(w.v[WX_GHI][29], 29, 0);
    assert_null(w.v[WX_DNI]);
    wx_series_free(&w);
}

/* Unit conversions use exact definitions: 1 in = 25.4 mm and 1 mph =
 * 0.44704 m/s (international yard and pound agreement, 1959); deg F to
 * deg C by (F - 32) x 5/9; 1 kPa = 10 hPa. */
static void test_units(void **state)
{
    (void)state;
    site_weather cfg = default_cfg();
    cfg.temp_f = 1;
    cfg.rain_in = 1;
    cfg.wind_unit = 2;
    char text[4096];
    int off = snprintf(text, sizeof text, "time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s\n");
    for (int i = 0; i < 24; i++)
        off += snprintf(text + off, sizeof text - (size_t)off, "2025-03-01T%02d:00,0,86,50,0.5,10\n", i);
    wx_series w;
    rg_err e = {{0}};
    assert_int_equal(wx_parse(&cfg, "mem", text, strlen(text), &w, &e), 0);
    assert_close(w.v[WX_TEMP][0], 30.0, 1e-12);
    assert_close(w.v[WX_RAIN][0], 12.7, 1e-12);
    assert_close(w.v[WX_WIND][0], 4.4704, 1e-12);
    wx_series_free(&w);
}

/* A 2-hour gap is filled by linear interpolation with no rain, counted,
 * and the series stays hourly; the rain total is what the file holds
 * (mass balance of the input: filling never invents water). */
static void test_gap_fill(void **state)
{
    (void)state;
    site_weather cfg = default_cfg();
    rg_warn_quiet(1);
    const char *text = rows("time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s", 40, 10, 2);
    wx_series w;
    rg_err e = {{0}};
    assert_int_equal(wx_parse(&cfg, "mem", text, strlen(text), &w, &e), 0);
    rg_warn_quiet(0);
    assert_int_equal(w.n, 40);
    assert_int_equal(w.n_filled, 2);
    assert_close(w.v[WX_TEMP][10], 10, 1e-12); /* between 9 and 12 */
    assert_close(w.v[WX_TEMP][11], 11, 1e-12);
    double rain = 0;
    for (size_t h = 0; h < w.n; h++)
        rain += w.v[WX_RAIN][h];
    assert_close(rain, 38, 1e-12);
    wx_series_free(&w);
}

/* A gap longer than the limit is refused with the line and the hour. */
static void test_gap_too_long(void **state)
{
    (void)state;
    site_weather cfg = default_cfg();
    const char *text = rows("time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s", 40, 10, 4);
    wx_series w;
    rg_err e = {{0}};
    assert_int_equal(wx_parse(&cfg, "mem", text, strlen(text), &w, &e), -1);
    assert_non_null(strstr(e.msg, "mem: line 12: expected consecutive hours, found a gap of 4 hours after 2025-01-01T09:00"));
}

/* Output is the same for the same input (parsing is deterministic). */
static void test_repeatable(void **state)
{
    (void)state;
    site_weather cfg = default_cfg();
    const char *text = rows("time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s", 48, -1, 0);
    wx_series a, b;
    rg_err e = {{0}};
    assert_int_equal(wx_parse(&cfg, "mem", text, strlen(text), &a, &e), 0);
    assert_int_equal(wx_parse(&cfg, "mem", text, strlen(text), &b, &e), 0);
    for (int k = 1; k < WX_NCOLS; k++)
        if (a.v[k])
            assert_memory_equal(a.v[k], b.v[k], a.n * sizeof(double));
    wx_series_free(&a);
    wx_series_free(&b);
}

/* wx_join: series that follow one another hour for hour with the same
 * columns become one, values in order; a gap, or a different set of
 * columns, keeps them apart. */
static void test_join(void **state)
{
    (void)state;
    site_weather cfg = default_cfg();
    const char *hdr = "time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s";
    wx_series in[4];
    rg_err e = {{0}};
    char *t = rows(hdr, 48, -1, 0);
    assert_int_equal(wx_parse(&cfg, "a", t, strlen(t), &in[0], &e), 0);
    assert_int_equal(wx_parse(&cfg, "b", t, strlen(t), &in[1], &e), 0);
    assert_int_equal(wx_parse(&cfg, "c", t, strlen(t), &in[2], &e), 0);
    assert_int_equal(wx_parse(&cfg, "d", t, strlen(t), &in[3], &e), 0);
    in[1].t0_h += 24;                 /* b: hours 24-47 of a's clock, cut to 24 */
    in[1].n = 24;
    in[0].n = 24;                     /* a: hours 0-23 */
    in[2].t0_h += 48;                 /* c: hours 48-95, follows b */
    in[3].t0_h += 200;                /* d: after a gap */
    for (int i = 0; i < 24; i++)
        in[1].v[WX_TEMP][i] = 100 + i; /* mark b's hours */
    wx_set set = {4, in}, out;
    assert_int_equal(wx_join(&set, &out, &e), 0);
    assert_int_equal(out.n, 2);
    assert_int_equal(out.s[0].t0_h, in[0].t0_h);
    assert_int_equal(out.s[0].n, 24 + 24 + 48);
    assert_string_equal(out.s[0].path, "a");
    assert_close(out.s[0].v[WX_TEMP][23], 23, 0);
    assert_close(out.s[0].v[WX_TEMP][24], 100, 0);
    assert_close(out.s[0].v[WX_TEMP][47], 123, 0);
    assert_close(out.s[0].v[WX_TEMP][48], 0, 0);
    assert_close(out.s[0].v[WX_TEMP][95], 47, 0);
    assert_null(out.s[0].v[WX_DNI]);
    assert_int_equal(out.s[1].t0_h, in[3].t0_h);
    assert_int_equal(out.s[1].n, 48);
    wx_free(&out);

    /* c with a pressure column b lacks: not joined */
    in[2].v[WX_PRESSURE] = calloc(in[2].n, sizeof(double));
    assert_int_equal(wx_join(&set, &out, &e), 0);
    assert_int_equal(out.n, 3);
    wx_free(&out);
    in[0].n = in[1].n = 48;
    for (int i = 0; i < 4; i++)
        wx_series_free(&in[i]);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_columns_any_order),
        cmocka_unit_test(test_units),
        cmocka_unit_test(test_gap_fill),
        cmocka_unit_test(test_gap_too_long),
        cmocka_unit_test(test_repeatable),
        cmocka_unit_test(test_join),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
