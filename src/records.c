/* records.c - pasture walk, grazing and maintenance records: read, check,
 * query, write (docs/records.md).
 *
 * One small CSV driver (libcsv) serves the three files: it skips a UTF-8
 * byte-order mark and leading '#' lines, maps the header's column names to
 * positions, counts physical lines (blank lines, CRLF and newlines inside
 * quoted cells included) and hands each record's cells to a per-file
 * handler.  The first problem stops the read with one message line.
 */
#include "records.h"

#include <csv.h>
#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "tcal.h"
#include "textfile.h"

/* ---- plate equation ----------------------------------------------------- */

/* Default rising-plate equation, cover (kg DM/ha) = 125 x compressed
 * height (cm) + 640: DairyCo (UK dairy levy board, now AHDB Dairy), "Using
 * a plate meter", web page, "the method generally used in the UK", with
 * the worked example 6.68 cm -> 1475 kg DM/ha.  It was fitted to leafy
 * ryegrass dairy swards; other swards differ, so a farm should override it
 * from its own cuts. */
rec_plate rec_plate_default(void)
{
    return (rec_plate){.kgdm_ha_per_cm = 125.0, .base_kgdm_ha = 640.0};
}

rec_plate rec_plate_of(const site *s)
{
    if (!s->has_plate)
        return rec_plate_default();
    return (rec_plate){.kgdm_ha_per_cm = s->plate_kgdm_ha_per_cm, .base_kgdm_ha = s->plate_base_kgdm_ha};
}

double rec_plate_cover_kgdm_ha(const rec_plate *p, double plate_height_cm)
{
    return p->kgdm_ha_per_cm * plate_height_cm + p->base_kgdm_ha;
}

static const char *const method_names[REC_NMETHODS] = {"stick", "plate", "visual"};

const char *rec_method_name(int method)
{
    return method >= 0 && method < REC_NMETHODS ? method_names[method] : "?";
}

/* ---- the CSV driver ----------------------------------------------------- */

#define MAX_COLS 6      /* columns of the widest file */
#define MAX_FIELDS 32   /* fields a header may have */
#define CELL_LEN 256

typedef struct reader reader;
typedef void (*row_fn)(reader *r);

struct reader {
    const char *name;
    rg_err *err;
    int failed;
    long line;              /* physical line where the current record starts */
    long extra_nl;          /* newlines inside quoted cells of the record */
    int prev_term;          /* what ended the previous row */
    int have_header;
    int field;              /* index of the next field in the record */
    const char *const *cols; /* column names, n_cols of them */
    int n_cols;
    unsigned required;      /* bit k: column k must be in the header */
    int pos[MAX_COLS];      /* field index of each column, -1 if absent */
    int col_of[MAX_FIELDS]; /* column of each field */
    int n_header;
    char cell[MAX_COLS][CELL_LEN]; /* this record's cells ("" if absent) */
    row_fn row;
    void *user;
    const site *s;
};

static int rfail(reader *r, int col, const char *fmt, ...) __attribute__((format(printf, 3, 4)));
static int rfail(reader *r, int col, const char *fmt, ...)
{
    if (r->failed)
        return -1;
    char msg[640];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    r->failed = 1;
    return rg_fail(r->err, "%s:%ld:%d: %s", r->name, r->line, col, msg);
}

/* 1-based column number of column k in the file. */
static int colno(const reader *r, int k)
{
    return r->pos[k] >= 0 ? r->pos[k] + 1 : r->n_header + 1;
}

static void header_field(reader *r, const char *s)
{
    int col = r->field + 1;
    if (r->field >= MAX_FIELDS) {
        rfail(r, col, "expected at most %d columns, found more", MAX_FIELDS);
        return;
    }
    for (int k = 0; k < r->n_cols; k++)
        if (strcmp(s, r->cols[k]) == 0) {
            if (r->pos[k] >= 0)
                rfail(r, col, "expected each column name once, found \"%s\" again", s);
            r->pos[k] = r->field;
            r->col_of[r->field] = k;
            return;
        }
    const char *near = rg_suggest(s, r->cols, (size_t)r->n_cols);
    char list[160] = "";
    for (int k = 0; k < r->n_cols; k++)
        snprintf(list + strlen(list), sizeof list - strlen(list), "%s%s", k ? ", " : "", r->cols[k]);
    rfail(r, col, "expected a column named one of %s, found \"%.40s\"%s%s%s", list, s,
          near ? " (did you mean \"" : "", near ? near : "", near ? "\"?)" : "");
}

static void header_end(reader *r)
{
    r->n_header = r->field;
    for (int k = 0; k < r->n_cols; k++)
        if ((r->required >> k & 1u) && r->pos[k] < 0) {
            rfail(r, r->n_header + 1, "expected a column named \"%s\" in the header, found none",
                  r->cols[k]);
            return;
        }
}

static void on_field(void *data, size_t len, void *vr)
{
    reader *r = vr;
    if (r->failed)
        return;
    const char *d = data ? data : "";
    for (size_t i = 0; i < len; i++)
        r->extra_nl += d[i] == '\n';
    char buf[CELL_LEN];
    size_t n = len < sizeof buf - 1 ? len : sizeof buf - 1;
    memcpy(buf, d, n);
    buf[n] = '\0';
    if (!r->have_header) {
        header_field(r, buf);
    } else if (r->field < r->n_header && r->col_of[r->field] >= 0) {
        if (len >= CELL_LEN)
            rfail(r, r->field + 1, "expected a cell of at most %d bytes, found %zu bytes",
                  CELL_LEN - 1, len);
        memcpy(r->cell[r->col_of[r->field]], buf, n + 1);
    }
    r->field++;
}

static void on_row(int term, void *vr)
{
    reader *r = vr;
    if (r->failed)
        return;
    if (r->field == 0) {
        /* an empty line, or the LF of a CRLF (CSV_REPALL_NL reports both) */
        if (!(term == '\n' && r->prev_term == '\r'))
            r->line++;
        r->prev_term = term;
        return;
    }
    if (!r->have_header) {
        header_end(r);
        r->have_header = 1;
    } else if (r->field != r->n_header) {
        rfail(r, (r->field < r->n_header ? r->field : r->n_header) + 1,
              "expected %d fields as in the header, found %d", r->n_header, r->field);
    } else {
        r->row(r);
    }
    r->line += 1 + r->extra_nl;
    r->extra_nl = 0;
    r->field = 0;
    r->prev_term = term;
    memset(r->cell, 0, sizeof r->cell);
}

/* Skips a UTF-8 byte-order mark and leading '#' lines; counts the lines. */
static size_t preamble(const char *text, size_t len, long *lines)
{
    size_t skip = 0;
    *lines = 0;
    if (len >= 3 && memcmp(text, "\xEF\xBB\xBF", 3) == 0)
        skip = 3;
    while (skip < len && text[skip] == '#') {
        const char *nl = memchr(text + skip, '\n', len - skip);
        skip = nl ? (size_t)(nl - text) + 1 : len;
        (*lines)++;
    }
    return skip;
}

static int read_csv(reader *r, const char *text, size_t len)
{
    long lines;
    size_t skip = preamble(text, len, &lines);
    r->line = lines + 1;
    for (int k = 0; k < MAX_COLS; k++)
        r->pos[k] = -1;
    for (int f = 0; f < MAX_FIELDS; f++)
        r->col_of[f] = -1;
    struct csv_parser p;
    if (csv_init(&p, CSV_STRICT | CSV_STRICT_FINI | CSV_APPEND_NULL | CSV_REPALL_NL) != 0)
        return rg_fail(r->err, "%s:1:1: cannot start the CSV parser", r->name);
    if (csv_parse(&p, text + skip, len - skip, on_field, on_row, r) != len - skip && !r->failed)
        rfail(r, r->field + 1, "expected well-formed CSV, found %s", csv_strerror(csv_error(&p)));
    if (!r->failed && csv_fini(&p, on_field, on_row, r) != 0)
        rfail(r, r->field + 1, "expected well-formed CSV, found %s", csv_strerror(csv_error(&p)));
    csv_free(&p);
    if (!r->failed && !r->have_header)
        rfail(r, 1, "expected a header line, found an empty file");
    return r->failed ? -1 : 0;
}

/* ---- cells -------------------------------------------------------------- */

/* Grows an array of n items of size sz to hold one more. */
static void *grow(void *a, int n, int *cap, size_t sz)
{
    if (n < *cap)
        return a;
    int c = *cap ? *cap * 2 : 32;
    void *na = realloc(a, (size_t)c * sz);
    if (na)
        *cap = c;
    return na;
}

/* A decimal number (digits, sign, point, exponent only: no "nan", "inf"
 * or hex).  Returns 0, or -1 after the message. */
static int cell_number(reader *r, int k, double *x)
{
    const char *s = r->cell[k];
    int ok = s[0] != '\0';
    for (const char *q = s; *q; q++)
        if (!strchr("0123456789+-.eE", *q))
            ok = 0;
    char *end = NULL;
    errno = 0;
    double v = ok ? strtod(s, &end) : 0;
    if (!ok || *end || errno == ERANGE || !isfinite(v))
        return rfail(r, colno(r, k), "expected a number in %s, found \"%.40s\"", r->cols[k], s);
    *x = v;
    return 0;
}

static int cell_date(reader *r, int k, int64_t *day)
{
    if (tcal_parse_date(r->cell[k], day) < 0)
        return rfail(r, colno(r, k), "expected a date YYYY-MM-DD in %s, found \"%.40s\"",
                     r->cols[k], r->cell[k]);
    return 0;
}

/* Looks word up among n names (stride bytes apart from first); returns the
 * index, or -1 after a message with the nearest name. */
static int cell_id(reader *r, int k, const char *what, const char *first, size_t stride, int n)
{
    const char *word = r->cell[k];
    for (int i = 0; i < n; i++)
        if (strcmp(first + (size_t)i * stride, word) == 0)
            return i;
    const char **c = malloc((n > 0 ? (size_t)n : 1) * sizeof *c);
    if (!c)
        return rfail(r, colno(r, k), "expected memory, found none left");
    for (int i = 0; i < n; i++)
        c[i] = first + (size_t)i * stride;
    const char *near = rg_suggest(word, c, (size_t)n);
    rfail(r, colno(r, k), "expected a %s id of the site file, found \"%.48s\"%s%s%s", what, word,
          near ? " (did you mean \"" : "", near ? near : "", near ? "\"?)" : "");
    free(c);
    return -1;
}

static int cell_paddock(reader *r, int k)
{
    const site *s = r->s;
    if (s->n_paddocks == 0)
        return rfail(r, colno(r, k), "expected a paddock id, found \"%.48s\" (the site has none)", r->cell[k]);
    return cell_id(r, k, "paddock", s->paddocks[0].id, sizeof s->paddocks[0], s->n_paddocks);
}

static int cell_mob(reader *r, int k)
{
    const site *s = r->s;
    if (s->n_mobs == 0)
        return rfail(r, colno(r, k), "expected a mob id, found \"%.48s\" (the site has none)", r->cell[k]);
    return cell_id(r, k, "mob", s->mobs[0].id, sizeof s->mobs[0], s->n_mobs);
}

/* ---- writing ------------------------------------------------------------ */

/* A cell, quoted (libcsv) only when it holds a comma, quote, newline or
 * leading/trailing blank that a reader would otherwise change. */
static void put_cell(FILE *fp, const char *s)
{
    size_t n = strlen(s);
    int quote = n && (s[0] == ' ' || s[0] == '\t' || s[n - 1] == ' ' || s[n - 1] == '\t' || s[0] == '#');
    for (const char *q = s; *q && !quote; q++)
        quote = *q == ',' || *q == '"' || *q == '\n' || *q == '\r';
    if (quote)
        csv_fwrite(fp, s, n);
    else
        fputs(s, fp);
}

/* The shortest %g form that reads back as exactly x. */
static void put_number(FILE *fp, double x)
{
    char buf[40];
    for (int prec = 1; prec <= 17; prec++) {
        snprintf(buf, sizeof buf, "%.*g", prec, x);
        if (strtod(buf, NULL) == x)
            break;
    }
    fputs(buf, fp);
}

static void put_date(FILE *fp, int64_t day)
{
    char d[11];
    tcal_format_date(day, d);
    fputs(d, fp);
}

/* ---- walk records ------------------------------------------------------- */

enum { W_PADDOCK, W_DATE, W_HEIGHT, W_COVER, W_METHOD, W_NOTE, W_NCOLS };
static const char *const walk_cols[W_NCOLS] = {"paddock", "date", "height_cm",
                                               "cover_kgdm_ha", "method", "note"};

typedef struct walk_ctx {
    rec_walks *out;
    int cap;
    int64_t start_day;
} walk_ctx;

static int walk_method(reader *r)
{
    const char *m = r->cell[W_METHOD];
    for (int i = 0; i < REC_NMETHODS; i++)
        if (strcmp(m, method_names[i]) == 0)
            return i;
    const char *near = rg_suggest(m, method_names, REC_NMETHODS);
    return rfail(r, colno(r, W_METHOD), "expected a method stick, plate or visual, found \"%.40s\"%s%s%s",
                 m, near ? " (did you mean \"" : "", near ? near : "", near ? "\"?)" : "");
}

/* Height or cover, exactly one of them, in range; cover from height by the
 * method's relation. */
static int walk_value(reader *r, const rec_walks *out, rec_walk *w)
{
    int has_h = r->cell[W_HEIGHT][0] != '\0', has_c = r->cell[W_COVER][0] != '\0';
    if (has_h == has_c)
        return has_h ? rfail(r, colno(r, W_COVER), "expected height_cm or cover_kgdm_ha, not both, found \"%.20s\" and \"%.20s\"",
                             r->cell[W_HEIGHT], r->cell[W_COVER])
                     : rfail(r, colno(r, W_HEIGHT), "expected a height in height_cm or a cover in cover_kgdm_ha, found both empty");
    w->height_cm = (double)NAN;
    if (has_c) {
        if (cell_number(r, W_COVER, &w->cover_kgdm_ha) < 0)
            return -1;
        if (w->cover_kgdm_ha < 0 || w->cover_kgdm_ha > REC_COVER_MAX_KGDM_HA)
            return rfail(r, colno(r, W_COVER), "expected a cover from 0 to %g kg DM/ha, found %g",
                         REC_COVER_MAX_KGDM_HA, w->cover_kgdm_ha);
        return 0;
    }
    if (cell_number(r, W_HEIGHT, &w->height_cm) < 0)
        return -1;
    if (w->height_cm < 0 || w->height_cm > REC_HEIGHT_MAX_CM)
        return rfail(r, colno(r, W_HEIGHT), "expected a height from 0 to %g cm, found %g",
                     REC_HEIGHT_MAX_CM, w->height_cm);
    const site *s = r->s;
    w->cover_kgdm_ha = w->method == REC_PLATE
                           ? rec_plate_cover_kgdm_ha(&out->plate, w->height_cm)
                           : sward_cover_kgdm_ha(&s->swards[s->paddocks[w->paddock].sward].p, w->height_cm);
    return 0;
}

static void walk_row(reader *r)
{
    walk_ctx *c = r->user;
    rec_walk w = {.line = (int)r->line};
    if ((w.paddock = cell_paddock(r, W_PADDOCK)) < 0 || cell_date(r, W_DATE, &w.day) < 0)
        return;
    if (w.day > c->start_day) {
        char a[11], b[11];
        tcal_format_date(c->start_day, a);
        tcal_format_date(w.day, b);
        rfail(r, colno(r, W_DATE), "expected a date on or before the plan start %s, found %s", a, b);
        return;
    }
    if ((w.method = walk_method(r)) < 0 || walk_value(r, c->out, &w) < 0)
        return;
    if (strlen(r->cell[W_NOTE]) >= REC_NOTE_LEN) {
        rfail(r, colno(r, W_NOTE), "expected a note of at most %d bytes, found %zu bytes",
              REC_NOTE_LEN - 1, strlen(r->cell[W_NOTE]));
        return;
    }
    memcpy(w.note, r->cell[W_NOTE], strlen(r->cell[W_NOTE]) + 1);
    rec_walk *nw = grow(c->out->w, c->out->n, &c->cap, sizeof *nw);
    if (!nw) {
        rfail(r, 1, "expected memory, found none left");
        return;
    }
    c->out->w = nw;
    c->out->w[c->out->n++] = w;
}

static int by_paddock_day(const void *a, const void *b)
{
    const rec_walk *x = a, *y = b;
    if (x->paddock != y->paddock)
        return x->paddock < y->paddock ? -1 : 1;
    if (x->day != y->day)
        return x->day < y->day ? -1 : 1;
    return (x->line > y->line) - (x->line < y->line);
}

/* One record per paddock and day, checked after reading (sorted, so a
 * long file stays n log n): the earliest line repeating a paddock and day
 * is reported, naming the first. */
static int walk_duplicates(reader *r, const rec_walks *w)
{
    if (w->n < 2)
        return 0;
    rec_walk *t = malloc((size_t)w->n * sizeof *t);
    if (!t)
        return rfail(r, 1, "expected memory, found none left");
    memcpy(t, w->w, (size_t)w->n * sizeof *t);
    qsort(t, (size_t)w->n, sizeof *t, by_paddock_day);
    int first = -1, second = -1;
    for (int i = 1; i < w->n; i++)
        if (t[i].paddock == t[i - 1].paddock && t[i].day == t[i - 1].day &&
            (second < 0 || t[i].line < t[second].line)) {
            second = i;
            first = i - 1;
            while (first > 0 && t[first - 1].paddock == t[i].paddock && t[first - 1].day == t[i].day)
                first--;
        }
    int rc = 0;
    if (second >= 0) {
        char d[11];
        tcal_format_date(t[second].day, d);
        r->line = t[second].line;
        rc = rfail(r, colno(r, W_DATE), "expected one record per paddock and day, found a second one for %s on %s (the first is on line %d)",
                   r->s->paddocks[t[second].paddock].id, d, t[first].line);
    }
    free(t);
    return rc;
}

int rec_walk_parse(const site *s, const rec_plate *plate, int64_t start_day,
                   const char *name, const char *text, size_t len,
                   rec_walks *out, rg_err *err)
{
    memset(out, 0, sizeof *out);
    out->plate = plate ? *plate : rec_plate_default();
    if (!(out->plate.kgdm_ha_per_cm > 0) || !(out->plate.base_kgdm_ha >= 0) ||
        !isfinite(out->plate.kgdm_ha_per_cm) || !isfinite(out->plate.base_kgdm_ha))
        return rg_fail(err, "%s: expected a plate equation with a > 0 and b >= 0, found a = %g, b = %g",
                       name, out->plate.kgdm_ha_per_cm, out->plate.base_kgdm_ha);
    walk_ctx c = {.out = out, .start_day = start_day};
    reader r = {.name = name, .err = err, .cols = walk_cols, .n_cols = W_NCOLS,
                .required = 0x1f, .row = walk_row, .user = &c, .s = s};
    if (read_csv(&r, text, len) < 0 || walk_duplicates(&r, out) < 0) {
        rec_walk_free(out);
        return -1;
    }
    return 0;
}

int rec_walk_load(const site *s, const rec_plate *plate, int64_t start_day,
                  const char *path, rec_walks *out, rg_err *err)
{
    size_t len = 0;
    memset(out, 0, sizeof *out);
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    int rc = rec_walk_parse(s, plate, start_day, path, text, len, out, err);
    free(text);
    return rc;
}

int rec_walk_write(const site *s, const rec_walks *w, const char *path, rg_err *err)
{
    textfile_out o;
    if (textfile_begin(&o, path, err) < 0)
        return -1;
    fputs("paddock,date,height_cm,cover_kgdm_ha,method,note\n", o.fp);
    for (int i = 0; i < w->n; i++) {
        const rec_walk *x = &w->w[i];
        put_cell(o.fp, s->paddocks[x->paddock].id);
        fputc(',', o.fp);
        put_date(o.fp, x->day);
        fputc(',', o.fp);
        if (!isnan(x->height_cm))
            put_number(o.fp, x->height_cm);
        fputc(',', o.fp);
        if (isnan(x->height_cm))
            put_number(o.fp, x->cover_kgdm_ha);
        fprintf(o.fp, ",%s,", method_names[x->method]);
        put_cell(o.fp, x->note);
        fputc('\n', o.fp);
    }
    return textfile_commit(&o, err);
}

const rec_walk *rec_walk_latest(const rec_walks *w, int paddock, int64_t day)
{
    const rec_walk *best = NULL;
    for (int i = 0; i < w->n; i++) {
        const rec_walk *x = &w->w[i];
        if (x->paddock == paddock && x->day <= day && (!best || x->day >= best->day))
            best = x;
    }
    return best;
}

void rec_walk_free(rec_walks *w)
{
    free(w->w);
    w->w = NULL;
    w->n = 0;
}

/* ---- grazing records ---------------------------------------------------- */

enum { G_MOB, G_PADDOCK, G_FROM, G_TO, G_NCOLS };
static const char *const graze_cols[G_NCOLS] = {"mob", "paddock", "from", "to"};

typedef struct graze_ctx {
    rec_grazes *out;
    int cap;
    int64_t start_day;
} graze_ctx;

static int by_mob_from(const void *a, const void *b)
{
    const rec_graze *x = a, *y = b;
    if (x->mob != y->mob)
        return x->mob < y->mob ? -1 : 1;
    if (x->from_day != y->from_day)
        return x->from_day < y->from_day ? -1 : 1;
    return (x->line > y->line) - (x->line < y->line);
}

/* No two records of one mob share a day, checked after reading (sorted by
 * mob and first day, each record compared with the furthest-reaching one
 * before it).  Of the overlaps found, the one whose later line comes first
 * is reported, on that line, naming the other. */
static int graze_overlaps(reader *r, const rec_grazes *g)
{
    if (g->n < 2)
        return 0;
    rec_graze *t = malloc((size_t)g->n * sizeof *t);
    if (!t)
        return rfail(r, 1, "expected memory, found none left");
    memcpy(t, g->g, (size_t)g->n * sizeof *t);
    qsort(t, (size_t)g->n, sizeof *t, by_mob_from);
    const rec_graze *at = NULL, *other = NULL;
    int reach = 0;
    for (int i = 1; i < g->n; i++) {
        if (t[i].mob != t[i - 1].mob) {
            reach = i;
            continue;
        }
        if (t[i].from_day <= t[reach].to_day) {
            const rec_graze *late = t[i].line > t[reach].line ? &t[i] : &t[reach];
            if (!at || late->line < at->line) {
                at = late;
                other = late == &t[i] ? &t[reach] : &t[i];
            }
        }
        if (t[i].to_day > t[reach].to_day)
            reach = i;
    }
    int rc = 0;
    if (at) {
        char a[11], b[11], c[11], d[11];
        tcal_format_date(other->from_day, a);
        tcal_format_date(other->to_day, b);
        tcal_format_date(at->from_day, c);
        tcal_format_date(at->to_day, d);
        r->line = at->line;
        rc = rfail(r, colno(r, G_FROM), "expected no overlap with mob %s's record on line %d (%s to %s), found %s to %s",
                   r->s->mobs[at->mob].id, other->line, a, b, c, d);
    }
    free(t);
    return rc;
}

static void graze_row(reader *r)
{
    graze_ctx *c = r->user;
    rec_graze g = {.line = (int)r->line};
    if ((g.mob = cell_mob(r, G_MOB)) < 0 || (g.paddock = cell_paddock(r, G_PADDOCK)) < 0 ||
        cell_date(r, G_FROM, &g.from_day) < 0 || cell_date(r, G_TO, &g.to_day) < 0)
        return;
    char a[11], b[11];
    if (g.to_day < g.from_day) {
        tcal_format_date(g.from_day, a);
        tcal_format_date(g.to_day, b);
        rfail(r, colno(r, G_TO), "expected a date on or after from (%s), found %s", a, b);
        return;
    }
    if (g.to_day >= c->start_day) {
        tcal_format_date(c->start_day, a);
        tcal_format_date(g.to_day, b);
        rfail(r, colno(r, G_TO), "expected a date before the plan start %s (records are what was grazed), found %s", a, b);
        return;
    }
    rec_graze *ng = grow(c->out->g, c->out->n, &c->cap, sizeof *ng);
    if (!ng) {
        rfail(r, 1, "expected memory, found none left");
        return;
    }
    c->out->g = ng;
    c->out->g[c->out->n++] = g;
}

int rec_graze_parse(const site *s, int64_t start_day, const char *name,
                    const char *text, size_t len, rec_grazes *out, rg_err *err)
{
    memset(out, 0, sizeof *out);
    graze_ctx c = {.out = out, .start_day = start_day};
    reader r = {.name = name, .err = err, .cols = graze_cols, .n_cols = G_NCOLS,
                .required = 0xf, .row = graze_row, .user = &c, .s = s};
    if (read_csv(&r, text, len) < 0 || graze_overlaps(&r, out) < 0) {
        rec_graze_free(out);
        return -1;
    }
    return 0;
}

int rec_graze_load(const site *s, int64_t start_day, const char *path,
                   rec_grazes *out, rg_err *err)
{
    size_t len = 0;
    memset(out, 0, sizeof *out);
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    int rc = rec_graze_parse(s, start_day, path, text, len, out, err);
    free(text);
    return rc;
}

int rec_graze_write(const site *s, const rec_grazes *g, const char *path, rg_err *err)
{
    textfile_out o;
    if (textfile_begin(&o, path, err) < 0)
        return -1;
    fputs("mob,paddock,from,to\n", o.fp);
    for (int i = 0; i < g->n; i++) {
        const rec_graze *x = &g->g[i];
        put_cell(o.fp, s->mobs[x->mob].id);
        fputc(',', o.fp);
        put_cell(o.fp, s->paddocks[x->paddock].id);
        fputc(',', o.fp);
        put_date(o.fp, x->from_day);
        fputc(',', o.fp);
        put_date(o.fp, x->to_day);
        fputc('\n', o.fp);
    }
    return textfile_commit(&o, err);
}

int64_t rec_graze_last_day(const rec_grazes *g, int paddock, int64_t day)
{
    int64_t last = INT64_MIN;
    for (int i = 0; i < g->n; i++) {
        const rec_graze *x = &g->g[i];
        if (x->paddock != paddock || x->from_day >= day)
            continue;
        int64_t end = x->to_day < day ? x->to_day : day - 1;
        if (end > last)
            last = end;
    }
    return last;
}

int rec_graze_days(const rec_grazes *g, int paddock, int64_t from_day,
                   int64_t to_day, int n_mobs, int *days_per_mob)
{
    int total = 0;
    for (int m = 0; m < n_mobs; m++)
        days_per_mob[m] = 0;
    for (int i = 0; i < g->n; i++) {
        const rec_graze *x = &g->g[i];
        int64_t a = x->from_day > from_day ? x->from_day : from_day;
        int64_t b = x->to_day < to_day ? x->to_day : to_day;
        if (x->paddock != paddock || b < a || x->mob < 0 || x->mob >= n_mobs)
            continue;
        days_per_mob[x->mob] += (int)(b - a + 1);
        total += (int)(b - a + 1);
    }
    return total;
}

double rec_graze_intake_kgdm(const site *s, const rec_grazes *g, int paddock,
                             int64_t from_day, int64_t to_day)
{
    double kg = 0;
    for (int i = 0; i < g->n; i++) {
        const rec_graze *x = &g->g[i];
        int64_t a = x->from_day > from_day ? x->from_day : from_day;
        int64_t b = x->to_day < to_day ? x->to_day : to_day;
        if (x->paddock != paddock || b < a)
            continue;
        const site_mob *m = &s->mobs[x->mob];
        kg += (double)(b - a + 1) * m->head * m->intake_kgdm_d;
    }
    return kg;
}

void rec_graze_free(rec_grazes *g)
{
    free(g->g);
    g->g = NULL;
    g->n = 0;
}

/* ---- maintenance windows ------------------------------------------------ */

enum { M_PADDOCK, M_FROM, M_TO, M_REASON, M_KEEP, M_NCOLS };
static const char *const maint_cols[M_NCOLS] = {"paddock", "from", "to", "reason", "keep_off_days"};

typedef struct maint_ctx {
    rec_maints *out;
    int cap;
} maint_ctx;

/* keep_off_days: empty (0) or a whole number of days, 0..365. */
static int maint_keep(reader *r, int *days)
{
    const char *s = r->cell[M_KEEP];
    *days = 0;
    if (!s[0])
        return 0;
    long v = 0;
    int ok = strlen(s) <= 4;
    for (const char *q = s; *q && ok; q++) {
        ok = *q >= '0' && *q <= '9';
        v = v * 10 + (*q - '0');
    }
    if (!ok || v > REC_KEEP_OFF_MAX_DAYS)
        return rfail(r, colno(r, M_KEEP), "expected a whole number of days from 0 to %d in keep_off_days, found \"%.20s\"",
                     REC_KEEP_OFF_MAX_DAYS, s);
    *days = (int)v;
    return 0;
}

/* The unknown-name message: nearest paddock id or block name. */
static void maint_unknown(reader *r)
{
    const site *s = r->s;
    const char **c = malloc((s->n_paddocks > 0 ? 2 * (size_t)s->n_paddocks + 1 : 1) * sizeof *c);
    if (!c) {
        rfail(r, colno(r, M_PADDOCK), "expected memory, found none left");
        return;
    }
    size_t n = 0;
    for (int k = 0; k < s->n_paddocks; k++) {
        c[n++] = s->paddocks[k].id;
        if (s->paddocks[k].block[0])
            c[n++] = s->paddocks[k].block;
    }
    const char *near = rg_suggest(r->cell[M_PADDOCK], c, n);
    rfail(r, colno(r, M_PADDOCK), "expected a paddock id or block name of the site file, found \"%.48s\"%s%s%s",
          r->cell[M_PADDOCK], near ? " (did you mean \"" : "", near ? near : "", near ? "\"?)" : "");
    free(c);
}

/* Appends one entry per paddock the name covers (a paddock id, or every
 * paddock of a block). */
static void maint_expand(reader *r, maint_ctx *c, const rec_maint *proto)
{
    const site *s = r->s;
    const char *name = r->cell[M_PADDOCK];
    int hits = 0;
    for (int k = 0; k < s->n_paddocks; k++) {
        if (strcmp(s->paddocks[k].id, name) != 0 && strcmp(s->paddocks[k].block, name) != 0)
            continue;
        rec_maint *nm = grow(c->out->m, c->out->n, &c->cap, sizeof *nm);
        if (!nm) {
            rfail(r, 1, "expected memory, found none left");
            return;
        }
        c->out->m = nm;
        c->out->m[c->out->n] = *proto;
        c->out->m[c->out->n++].paddock = k;
        hits++;
    }
    if (!hits)
        maint_unknown(r);
}

static void maint_row(reader *r)
{
    maint_ctx *c = r->user;
    rec_maint m = {.line = (int)r->line};
    if (!r->cell[M_PADDOCK][0]) {
        rfail(r, colno(r, M_PADDOCK), "expected a paddock id or block name, found an empty cell");
        return;
    }
    if (cell_date(r, M_FROM, &m.from_day) < 0 || cell_date(r, M_TO, &m.to_day) < 0)
        return;
    if (m.to_day < m.from_day) {
        char a[11], b[11];
        tcal_format_date(m.from_day, a);
        tcal_format_date(m.to_day, b);
        rfail(r, colno(r, M_TO), "expected a date on or after from (%s), found %s", a, b);
        return;
    }
    size_t n = strlen(r->cell[M_REASON]);
    if (n == 0 || n >= REC_REASON_LEN) {
        rfail(r, colno(r, M_REASON), "expected a reason of 1 to %d bytes, found %zu bytes",
              REC_REASON_LEN - 1, n);
        return;
    }
    memcpy(m.reason, r->cell[M_REASON], n + 1);
    if (maint_keep(r, &m.keep_off_days) < 0)
        return;
    maint_expand(r, c, &m);
}

int rec_maint_parse(const site *s, const char *name, const char *text,
                    size_t len, rec_maints *out, rg_err *err)
{
    memset(out, 0, sizeof *out);
    maint_ctx c = {.out = out};
    reader r = {.name = name, .err = err, .cols = maint_cols, .n_cols = M_NCOLS,
                .required = 0xf, .row = maint_row, .user = &c, .s = s};
    if (read_csv(&r, text, len) < 0) {
        rec_maint_free(out);
        return -1;
    }
    return 0;
}

int rec_maint_load(const site *s, const char *path, rec_maints *out, rg_err *err)
{
    size_t len = 0;
    memset(out, 0, sizeof *out);
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    int rc = rec_maint_parse(s, path, text, len, out, err);
    free(text);
    return rc;
}

/* Fills window w from the n entries starting at e (one CSV line). */
static int window_from(site_window *w, const rec_maint *e, int n)
{
    memset(w, 0, sizeof *w);
    w->paddocks = malloc((size_t)n * sizeof *w->paddocks);
    if (!w->paddocks)
        return -1;
    for (int j = 0; j < n; j++)
        w->paddocks[j] = e[j].paddock;
    w->n_paddocks = n;
    w->from_day = e->from_day;
    w->to_day = e->to_day;
    w->keep_off_days = e->keep_off_days; /* planbuild.c keeps stock out for it too */
    char extra[64] = "", d[11];
    if (e->keep_off_days > 0) {
        tcal_format_date(e->to_day, d);
        snprintf(extra, sizeof extra, " (stock kept off %d days after %s)", e->keep_off_days, d);
    }
    /* REC_REASON_LEN leaves room for the note: both fit in site_window.reason */
    size_t a = strlen(e->reason), b = strlen(extra);
    if (a + b >= sizeof w->reason)
        b = sizeof w->reason - 1 - (a < sizeof w->reason - 1 ? a : sizeof w->reason - 1);
    if (a > sizeof w->reason - 1)
        a = sizeof w->reason - 1;
    memcpy(w->reason, e->reason, a);
    memcpy(w->reason + a, extra, b);
    w->reason[a + b] = '\0';
    return 0;
}

int rec_maint_merge(const rec_maints *m, site *s, rg_err *err)
{
    int groups = 0;
    for (int i = 0; i < m->n; i++)
        groups += i == 0 || m->m[i].line != m->m[i - 1].line;
    if (groups == 0)
        return 0;
    site_window *nw = malloc((size_t)(s->n_windows + groups) * sizeof *nw);
    if (!nw)
        return rg_fail(err, "out of memory");
    if (s->n_windows)
        memcpy(nw, s->windows, (size_t)s->n_windows * sizeof *nw);
    int n = s->n_windows;
    for (int i = 0; i < m->n;) {
        int j = i;
        while (j < m->n && m->m[j].line == m->m[i].line)
            j++;
        if (window_from(&nw[n], &m->m[i], j - i) < 0) {
            for (int k = s->n_windows; k < n; k++)
                free(nw[k].paddocks);
            free(nw);
            return rg_fail(err, "out of memory");
        }
        n++;
        i = j;
    }
    free(s->windows);
    s->windows = nw;
    s->n_windows = n;
    return 0;
}

void rec_maint_free(rec_maints *m)
{
    free(m->m);
    m->m = NULL;
    m->n = 0;
}
