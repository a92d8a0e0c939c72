/* weather.c - hourly weather CSV reader (libcsv) with checks and gap fill.
 *
 * libcsv calls field() for each cell and row_end() at each record end.  The
 * first record is the header, which maps our columns to positions; each
 * later record is checked cell by cell and appended.  The first problem
 * stops the read: the context keeps the message and ignores what follows.
 */
#include "weather.h"

#include <csv.h>
#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "tcal.h"
#include "textfile.h"
#include "wxdaily.h"

/* Accepted range of each column after unit conversion.  Generous physical
 * bounds, not climate limits: they catch unit mix-ups and broken loggers. */
static const double col_lo[WX_NCOLS] = {0, -20, -60, 0, 0, 0, -20, -20, 500};
static const double col_hi[WX_NCOLS] = {0, 1500, 60, 100, 300, 75, 1400, 1000, 1100};
static const int col_required[WX_NCOLS] = {1, 1, 1, 1, 1, 1, 0, 0, 0};

typedef struct parse_ctx {
    const site_weather *cfg;
    const char *name;
    rg_err *err;
    int failed;
    size_t line;            /* current record, 1 = header */
    size_t line_offset;     /* comment lines before the header */
    int field;              /* index of the next field in the record */
    int pos[WX_NCOLS];      /* field index of each column, -1 if absent */
    int n_header;           /* fields in the header */
    double row[WX_NCOLS];
    int have_prev;
    int64_t prev_h;
    wx_series *out;
    size_t cap;
} parse_ctx;

static int fail(parse_ctx *c, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
static int fail(parse_ctx *c, const char *fmt, ...)
{
    if (c->failed)
        return -1;
    char msg[600];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    c->failed = 1;
    return rg_fail(c->err, "%s: line %zu: %s", c->name, c->line + c->line_offset, msg);
}

static int grow(parse_ctx *c, size_t need)
{
    if (need <= c->cap)
        return 0;
    size_t cap = c->cap ? c->cap * 2 : 9000;
    while (cap < need)
        cap *= 2;
    for (int k = 1; k < WX_NCOLS; k++) {
        if (c->pos[k] < 0)
            continue;
        double *nv = realloc(c->out->v[k], cap * sizeof *nv);
        if (!nv)
            return fail(c, "out of memory");
        c->out->v[k] = nv;
    }
    c->cap = cap;
    return 0;
}

/* ---- header ------------------------------------------------------------ */

static void header_field(parse_ctx *c, const char *s)
{
    for (int k = 0; k < WX_NCOLS; k++)
        if (strcmp(s, c->cfg->header[k]) == 0) {
            if (c->pos[k] >= 0)
                fail(c, "column %d: expected each column name once, found \"%s\" again", c->field + 1, s);
            c->pos[k] = c->field;
        }
}

static void header_end(parse_ctx *c)
{
    static const char *const key[WX_NCOLS] = {"time", "ghi", "temp", "rh", "rain",
                                              "wind", "dni", "dhi", "pressure"};
    c->n_header = c->field;
    for (int k = 0; k < WX_NCOLS; k++)
        if (col_required[k] && c->pos[k] < 0) {
            fail(c, "expected a column named \"%s\" in the header (or map another name with $.weather.columns.%s)",
                 c->cfg->header[k], key[k]);
            return;
        }
}

/* ---- values ------------------------------------------------------------ */

static double to_units(const site_weather *cfg, int k, double x)
{
    static const double wind_factor[3] = {1.0, 1.0 / 3.6, 0.44704};
    switch (k) {
    case WX_TEMP: return cfg->temp_f ? (x - 32.0) * 5.0 / 9.0 : x;
    case WX_RAIN: return cfg->rain_in ? x * 25.4 : x;
    case WX_WIND: return x * wind_factor[cfg->wind_unit];
    case WX_PRESSURE: return cfg->pressure_kpa ? x * 10.0 : x;
    default: return x;
    }
}

static void value_field(parse_ctx *c, int k, const char *s)
{
    int col = c->field + 1;
    if (k == WX_TIME) {
        int64_t h;
        if (tcal_parse_hour(s, &h) < 0)
            fail(c, "column %d (%s): expected a timestamp YYYY-MM-DDTHH:00, found \"%.40s\"",
                 col, c->cfg->header[k], s);
        c->row[k] = (double)h;
        return;
    }
    if (!s[0]) {
        fail(c, "column %d (%s): expected a number, found an empty cell", col, c->cfg->header[k]);
        return;
    }
    char *end;
    errno = 0;
    double x = strtod(s, &end);
    if (*end || errno == ERANGE || !isfinite(x)) {
        fail(c, "column %d (%s): expected a number, found \"%.40s\"", col, c->cfg->header[k], s);
        return;
    }
    x = to_units(c->cfg, k, x);
    if (x < col_lo[k] || x > col_hi[k]) {
        fail(c, "column %d (%s): expected a value from %g to %g (after unit conversion), found %g",
             col, c->cfg->header[k], col_lo[k], col_hi[k], x);
        return;
    }
    /* small negative irradiance is a pyranometer's night offset */
    c->row[k] = (k == WX_GHI || k == WX_DNI || k == WX_DHI) && x < 0 ? 0 : x;
}

static void on_field(void *data, size_t len, void *vctx)
{
    parse_ctx *c = vctx;
    if (c->failed)
        return;
    char buf[128];
    size_t n = len < sizeof buf - 1 ? len : sizeof buf - 1;
    memcpy(buf, data ? data : "", data ? n : 0);
    buf[data ? n : 0] = '\0';
    if (c->line == 1) {
        header_field(c, buf);
    } else {
        for (int k = 0; k < WX_NCOLS; k++)
            if (c->pos[k] == c->field)
                value_field(c, k, buf);
    }
    c->field++;
}

/* Appends hour h with the values in row (all present columns). */
static void append(parse_ctx *c, int64_t h, const double *row)
{
    wx_series *o = c->out;
    if (grow(c, o->n + 1) < 0)
        return;
    if (o->n == 0)
        o->t0_h = h;
    for (int k = 1; k < WX_NCOLS; k++)
        if (c->pos[k] >= 0)
            o->v[k][o->n] = row[k];
    o->n++;
}

/* Fills hours between the previous row and this one by linear interpolation
 * (rain: none, since a rain total cannot be guessed). */
static void fill_gap(parse_ctx *c, int64_t gap)
{
    wx_series *o = c->out;
    size_t last = o->n - 1;
    double prev[WX_NCOLS];
    for (int k = 1; k < WX_NCOLS; k++)
        prev[k] = c->pos[k] >= 0 ? o->v[k][last] : 0;
    for (int64_t g = 1; g <= gap; g++) {
        double f = (double)g / (double)(gap + 1), row[WX_NCOLS];
        for (int k = 1; k < WX_NCOLS; k++)
            row[k] = k == WX_RAIN ? 0 : prev[k] + f * (c->row[k] - prev[k]);
        append(c, c->prev_h + g, row);
    }
    o->n_filled += (size_t)gap;
}

static void check_time(parse_ctx *c, int64_t h)
{
    char a[17], b[17];
    tcal_format_hour(c->prev_h, a);
    tcal_format_hour(h, b);
    if (h == c->prev_h) {
        fail(c, "column %d (%s): expected a new hour, found %s twice", c->pos[WX_TIME] + 1,
             c->cfg->header[WX_TIME], b);
    } else if (h < c->prev_h) {
        fail(c, "column %d (%s): expected times in increasing order, found %s after %s",
             c->pos[WX_TIME] + 1, c->cfg->header[WX_TIME], b, a);
    } else if (h - c->prev_h - 1 > c->cfg->max_fill_h) {
        fail(c, "expected consecutive hours, found a gap of %lld hours after %s (fill it, or raise $.weather.fill_gaps_up_to_h, now %d)",
             (long long)(h - c->prev_h - 1), a, c->cfg->max_fill_h);
    } else if (h - c->prev_h > 1) {
        rg_warn("%s: line %zu: filled %lld missing hours after %s by interpolation (no rain assumed)",
                c->name, c->line + c->line_offset, (long long)(h - c->prev_h - 1), a);
        fill_gap(c, h - c->prev_h - 1);
    }
}

static void value_end(parse_ctx *c)
{
    if (c->field != c->n_header) {
        fail(c, "expected %d fields as in the header, found %d", c->n_header, c->field);
        return;
    }
    int64_t h = (int64_t)c->row[WX_TIME];
    if (c->have_prev)
        check_time(c, h);
    if (c->failed)
        return;
    append(c, h, c->row);
    c->prev_h = h;
    c->have_prev = 1;
}

static void on_row(int term, void *vctx)
{
    (void)term;
    parse_ctx *c = vctx;
    if (c->failed)
        return;
    if (c->line == 1)
        header_end(c);
    else
        value_end(c);
    c->line++;
    c->field = 0;
}

/* ---- daily files -------------------------------------------------------- */

/* Daily columns: fixed headers (docs/inputs.md); the first five are
 * required.  Values go through the same unit conversions as hourly ones. */
enum { D_DATE, D_TMIN, D_TMAX, D_RAIN, D_WIND, D_RS, D_RH, D_TDEW, D_NCOLS };
static const char *const d_header[D_NCOLS] = {"date", "tmin_c", "tmax_c", "rain_mm",
                                              "wind_m_s", "rs_mj_m2_d", "rh_mean_pct", "tdew_c"};
static const double d_lo[D_NCOLS] = {0, -60, -60, 0, 0, 0, 0, -60};
static const double d_hi[D_NCOLS] = {0, 60, 60, 500, 75, 50, 100, 50};
static const int d_unit[D_NCOLS] = {0, WX_TEMP, WX_TEMP, WX_RAIN, WX_WIND, 0, 0, WX_TEMP};

typedef struct daily_ctx {
    parse_ctx p;              /* messages, line counting, failure flag */
    int dpos[D_NCOLS];
    double row[D_NCOLS];
    int64_t first_day, prev_day;
    wxd_day *days;
    size_t n, cap;
} daily_ctx;

static void daily_header(daily_ctx *d, const char *s)
{
    for (int k = 0; k < D_NCOLS; k++)
        if (strcmp(s, d_header[k]) == 0)
            d->dpos[k] = d->p.field;
}

static void daily_value(daily_ctx *d, int k, const char *s)
{
    parse_ctx *c = &d->p;
    int col = c->field + 1;
    if (k == D_DATE) {
        int64_t day;
        if (tcal_parse_date(s, &day) < 0)
            fail(c, "column %d (date): expected a date YYYY-MM-DD, found \"%.40s\"", col, s);
        d->row[k] = (double)day;
        return;
    }
    char *end;
    errno = 0;
    double x = s[0] ? strtod(s, &end) : 0;
    if (!s[0] || *end || errno == ERANGE || !isfinite(x)) {
        fail(c, "column %d (%s): expected a number, found \"%.40s\"", col, d_header[k], s);
        return;
    }
    if (d_unit[k])
        x = to_units(c->cfg, d_unit[k], x);
    if (x < d_lo[k] || x > d_hi[k])
        fail(c, "column %d (%s): expected a value from %g to %g (after unit conversion), found %g",
             col, d_header[k], d_lo[k], d_hi[k], x);
    d->row[k] = x;
}

static void daily_field(void *data, size_t len, void *vctx)
{
    daily_ctx *d = vctx;
    parse_ctx *c = &d->p;
    if (c->failed)
        return;
    char buf[128];
    size_t n = len < sizeof buf - 1 ? len : sizeof buf - 1;
    memcpy(buf, data ? data : "", data ? n : 0);
    buf[data ? n : 0] = '\0';
    if (c->line == 1)
        daily_header(d, buf);
    else
        for (int k = 0; k < D_NCOLS; k++)
            if (d->dpos[k] == c->field)
                daily_value(d, k, buf);
    c->field++;
}

static void daily_append(daily_ctx *d)
{
    parse_ctx *c = &d->p;
    int64_t day = (int64_t)d->row[D_DATE];
    if (d->n > 0 && day != d->prev_day + 1) {
        char a[11], b[11];
        tcal_format_date(d->prev_day, a);
        tcal_format_date(day, b);
        fail(c, "column %d (date): expected the day after %s, found %s (daily files need every day, in order)",
             d->dpos[D_DATE] + 1, a, b);
        return;
    }
    if (d->n == d->cap) {
        size_t cap = d->cap ? d->cap * 2 : 400;
        wxd_day *nd = realloc(d->days, cap * sizeof *nd);
        if (!nd) {
            fail(c, "out of memory");
            return;
        }
        d->days = nd;
        d->cap = cap;
    }
    double nan = (double)NAN;
    d->days[d->n++] = (wxd_day){
        .tmin_c = d->row[D_TMIN], .tmax_c = d->row[D_TMAX], .rain_mm = d->row[D_RAIN],
        .wind_m_s = d->row[D_WIND], .rs_mj_m2_d = d->dpos[D_RS] >= 0 ? d->row[D_RS] : nan,
        .rh_mean_pct = d->dpos[D_RH] >= 0 ? d->row[D_RH] : nan,
        .tdew_c = d->dpos[D_TDEW] >= 0 ? d->row[D_TDEW] : nan};
    if (d->n == 1)
        d->first_day = day;
    d->prev_day = day;
}

static void daily_row(int term, void *vctx)
{
    (void)term;
    daily_ctx *d = vctx;
    parse_ctx *c = &d->p;
    if (c->failed)
        return;
    if (c->line == 1) {
        c->n_header = c->field;
        for (int k = 0; k <= D_WIND && !c->failed; k++)
            if (d->dpos[k] < 0)
                fail(c, "expected a column named \"%s\" in the header of a daily file", d_header[k]);
    } else if (c->field != c->n_header) {
        fail(c, "expected %d fields as in the header, found %d", c->n_header, c->field);
    } else {
        daily_append(d);
    }
    c->line++;
    c->field = 0;
}

/* Skips a byte-order mark and leading '#' lines; returns the offset and
 * counts the lines skipped. */
static size_t preamble(const char *text, size_t len, size_t *lines)
{
    size_t skip = 0;
    *lines = 0;
    if (len >= 3 && memcmp(text, "\xEF\xBB\xBF", 3) == 0)
        skip = 3; /* a UTF-8 byte-order mark, as some spreadsheets write */
    while (skip < len && text[skip] == '#') {
        const char *nl = memchr(text + skip, '\n', len - skip);
        skip = nl ? (size_t)(nl - text) + 1 : len;
        (*lines)++;
    }
    return skip;
}

int wx_parse_daily(const site_weather *cfg, const char *name, const char *text,
                   size_t len, wx_series *out, rg_err *err)
{
    memset(out, 0, sizeof *out);
    size_t lines, skip = preamble(text, len, &lines);
    daily_ctx d = {.p = {.cfg = cfg, .name = name, .err = err, .line = 1, .line_offset = lines}};
    for (int k = 0; k < D_NCOLS; k++)
        d.dpos[k] = -1;
    struct csv_parser p;
    if (csv_init(&p, CSV_STRICT | CSV_STRICT_FINI | CSV_APPEND_NULL) != 0)
        return rg_fail(err, "%s: cannot start the CSV parser", name);
    if (csv_parse(&p, text + skip, len - skip, daily_field, daily_row, &d) != len - skip && !d.p.failed)
        fail(&d.p, "expected well-formed CSV, found %s", csv_strerror(csv_error(&p)));
    if (!d.p.failed && csv_fini(&p, daily_field, daily_row, &d) != 0)
        fail(&d.p, "expected well-formed CSV, found %s", csv_strerror(csv_error(&p)));
    csv_free(&p);
    if (!d.p.failed && d.p.line == 1)
        fail(&d.p, "expected a header line, found an empty file");
    else if (!d.p.failed && d.n < 2)
        rg_fail(err, "%s: expected at least 2 daily rows, found %zu", name, d.n), d.p.failed = 1;
    int rc = -1;
    if (!d.p.failed) {
        rg_err inner;
        rc = wxd_to_hourly(&cfg->loc, d.first_day, d.days, d.n, cfg->rain_rule, out, &inner);
        if (rc < 0)
            rg_fail(err, "%s: %s", name, inner.msg);
        else
            snprintf(out->path, sizeof out->path, "%s", name);
    }
    free(d.days);
    return rc;
}

/* ---- files ------------------------------------------------------------- */

int wx_parse(const site_weather *cfg, const char *name, const char *text,
             size_t len, wx_series *out, rg_err *err)
{
    memset(out, 0, sizeof *out);
    snprintf(out->path, sizeof out->path, "%s", name);
    /* leading lines starting with '#' describe the file (e.g. "synthetic
     * data"); they are skipped, and line numbers still count them */
    size_t lines, skip = preamble(text, len, &lines);
    parse_ctx c = {.cfg = cfg, .name = name, .err = err, .line = 1, .line_offset = lines, .out = out};
    for (int k = 0; k < WX_NCOLS; k++)
        c.pos[k] = -1;
    struct csv_parser p;
    if (csv_init(&p, CSV_STRICT | CSV_STRICT_FINI | CSV_APPEND_NULL) != 0)
        return rg_fail(err, "%s: cannot start the CSV parser", name);
    if (csv_parse(&p, text + skip, len - skip, on_field, on_row, &c) != len - skip && !c.failed)
        fail(&c, "expected well-formed CSV, found %s", csv_strerror(csv_error(&p)));
    if (!c.failed && csv_fini(&p, on_field, on_row, &c) != 0)
        fail(&c, "expected well-formed CSV, found %s", csv_strerror(csv_error(&p)));
    csv_free(&p);
    if (!c.failed && c.line == 1)
        fail(&c, "expected a header line, found an empty file");
    else if (!c.failed && out->n < 24)
        rg_fail(err, "%s: expected at least 24 hourly rows, found %zu", name, out->n), c.failed = 1;
    if (c.failed) {
        wx_series_free(out);
        return -1;
    }
    return 0;
}

static int load_one(const site_weather *cfg, const char *path, wx_series *out, rg_err *err)
{
    size_t len = 0;
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    int rc = cfg->daily ? wx_parse_daily(cfg, path, text, len, out, err)
                        : wx_parse(cfg, path, text, len, out, err);
    free(text);
    return rc;
}

static int by_start(const void *a, const void *b)
{
    const wx_series *x = a, *y = b;
    return (x->t0_h > y->t0_h) - (x->t0_h < y->t0_h);
}

int wx_load(const site_weather *cfg, wx_set *out, rg_err *err)
{
    out->n = 0;
    out->s = calloc((size_t)cfg->n_files, sizeof *out->s);
    if (!out->s)
        return rg_fail(err, "out of memory");
    for (int i = 0; i < cfg->n_files; i++) {
        if (load_one(cfg, cfg->files[i], &out->s[i], err) < 0) {
            wx_free(out);
            return -1;
        }
        out->n++;
    }
    qsort(out->s, (size_t)out->n, sizeof *out->s, by_start);
    for (int i = 1; i < out->n; i++) {
        const wx_series *a = &out->s[i - 1], *b = &out->s[i];
        if (b->t0_h < a->t0_h + (int64_t)a->n) {
            char t[17];
            tcal_format_hour(b->t0_h, t);
            rg_fail(err, "%s: expected hours not covered by another weather file, found %s, which %s also covers",
                    b->path, t, a->path);
            wx_free(out);
            return -1;
        }
    }
    return 0;
}

/* Whether b follows a hour for hour with the same columns. */
static int joins(const wx_series *a, const wx_series *b)
{
    if (b->t0_h != a->t0_h + (int64_t)a->n)
        return 0;
    for (int k = 0; k < WX_NCOLS; k++)
        if ((a->v[k] == NULL) != (b->v[k] == NULL))
            return 0;
    return 1;
}

/* Series in[first..last] laid end to end in *out. */
static int join_run(const wx_set *in, int first, int last, wx_series *out)
{
    memset(out, 0, sizeof *out);
    snprintf(out->path, sizeof out->path, "%s", in->s[first].path);
    out->t0_h = in->s[first].t0_h;
    for (int i = first; i <= last; i++) {
        out->n += in->s[i].n;
        out->n_filled += in->s[i].n_filled;
    }
    for (int k = 0; k < WX_NCOLS; k++) {
        if (!in->s[first].v[k])
            continue;
        out->v[k] = malloc(out->n * sizeof *out->v[k]);
        if (!out->v[k]) {
            wx_series_free(out);
            return -1;
        }
        size_t at = 0;
        for (int i = first; i <= last; i++) {
            memcpy(out->v[k] + at, in->s[i].v[k], in->s[i].n * sizeof *out->v[k]);
            at += in->s[i].n;
        }
    }
    return 0;
}

int wx_join(const wx_set *in, wx_set *out, rg_err *err)
{
    out->n = 0;
    out->s = calloc(in->n > 0 ? (size_t)in->n : 1, sizeof *out->s);
    if (!out->s)
        return rg_fail(err, "out of memory");
    for (int first = 0; first < in->n;) {
        int last = first;
        while (last + 1 < in->n && joins(&in->s[last], &in->s[last + 1]))
            last++;
        if (join_run(in, first, last, &out->s[out->n]) < 0) {
            wx_free(out);
            return rg_fail(err, "out of memory");
        }
        out->n++;
        first = last + 1;
    }
    return 0;
}

void wx_series_free(wx_series *s)
{
    for (int k = 0; k < WX_NCOLS; k++)
        free(s->v[k]);
    memset(s->v, 0, sizeof s->v);
    s->n = 0;
}

void wx_free(wx_set *w)
{
    for (int i = 0; w->s && i < w->n; i++)
        wx_series_free(&w->s[i]);
    free(w->s);
    w->s = NULL;
    w->n = 0;
}
