/* test_records.c - walk, grazing and maintenance records: reading, the
 * height-to-cover conversions, one-line errors, round trips, block
 * expansion and the queries the planner uses.  The site is the invented
 * demo farm (examples/demo/site.json). */
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "records.h"
#include "rgtest.h"
#include "site.h"
#include "tcal.h"
#include "textfile.h"

#define DEMO "examples/demo/"

static site demo;
static int64_t start; /* 2024-06-03, the demo re-plan */

static int setup(void **state)
{
    (void)state;
    rg_err e = {{0}};
    if (site_load(DEMO "site.json", "models", &demo, &e) < 0) {
        print_error("%s\n", e.msg);
        return -1;
    }
    start = tcal_days(2024, 6, 3);
    return 0;
}

static int teardown(void **state)
{
    (void)state;
    site_free(&demo);
    return 0;
}

static int pad(const char *id)
{
    return site_find_paddock(&demo, id);
}

/* The demo files read cleanly; stick heights become cover by the sward's
 * height-mass relation, 110 kg DM/ha per cm above a base of 0
 * (models/swards/cool-season-grass.json, University of Maine Cooperative
 * Extension pasture course, Lesson 1 Appendix D): 19 cm -> 2090; plate
 * heights by the default plate equation 125 x h + 640 (DairyCo, "Using a
 * plate meter"): 11 cm -> 2015; a given cover is kept as given. */
static void test_demo_files(void **state)
{
    (void)state;
    rg_err e = {{0}};
    rec_walks w;
    assert_int_equal(rec_walk_load(&demo, NULL, start, DEMO "walk-2024-06.csv", &w, &e), 0);
    assert_int_equal(w.n, 16);
    assert_int_equal(w.w[0].paddock, pad("P01"));
    assert_int_equal(w.w[0].line, 4); /* two '#' lines, then the header */
    assert_int_equal(w.w[0].method, REC_STICK);
    assert_close(w.w[0].cover_kgdm_ha, 2090, 1e-9);
    assert_string_equal(w.w[0].note, "not grazed since April; seed heads starting");
    assert_int_equal(w.w[4].method, REC_PLATE);
    assert_close(w.w[4].cover_kgdm_ha, 2015, 1e-9);
    assert_true(isnan(w.w[6].height_cm));
    assert_close(w.w[6].cover_kgdm_ha, 1350, 0);
    rec_walk_free(&w);

    rec_grazes g;
    assert_int_equal(rec_graze_load(&demo, start, DEMO "grazed-2024-06.csv", &g, &e), 0);
    assert_int_equal(g.n, 11);
    assert_int_equal(g.g[10].paddock, pad("P15"));
    assert_int_equal(g.g[10].to_day, tcal_days(2024, 6, 2));
    rec_graze_free(&g);

    rec_maints m;
    assert_int_equal(rec_maint_load(&demo, DEMO "maintenance.csv", &m, &e), 0);
    assert_int_equal(m.n, 6); /* B2 = 4 paddocks, P03, O1 */
    rec_maint_free(&m);
}

/* The default plate equation reproduces the published worked example:
 * 6.68 cm x 125 + 640 = 1475 kg DM/ha (DairyCo, "Using a plate meter",
 * the UK's usual equation; rounded to 1 kg).  A farm's own coefficients
 * replace it when given. */
static void test_plate(void **state)
{
    (void)state;
    rec_plate p = rec_plate_default();
    assert_close(rec_plate_cover_kgdm_ha(&p, 6.68), 1475, 0.5);
    rec_plate own = {.kgdm_ha_per_cm = 150, .base_kgdm_ha = 300};
    const char *t = "paddock,date,height_cm,cover_kgdm_ha,method\nP01,2024-05-01,10,,plate\n"
                    "P02,2024-05-01,10,,stick\n";
    rec_walks w;
    rg_err e = {{0}};
    assert_int_equal(rec_walk_parse(&demo, &own, start, "mem", t, strlen(t), &w, &e), 0);
    assert_close(w.w[0].cover_kgdm_ha, 1800, 1e-9); /* 150 x 10 + 300 */
    assert_close(w.w[1].cover_kgdm_ha, 1100, 1e-9); /* the stick ignores the plate */
    rec_walk_free(&w);
    rec_plate bad = {.kgdm_ha_per_cm = 0, .base_kgdm_ha = 300};
    assert_int_equal(rec_walk_parse(&demo, &bad, start, "mem", t, strlen(t), &w, &e), -1);
    assert_non_null(strstr(e.msg, "expected a plate equation with a > 0"));
}

typedef struct bad_case {
    int kind; /* 0 walk, 1 grazing, 2 maintenance */
    const char *text;
    const char *msg; /* the whole expected message */
} bad_case;

#define WH "paddock,date,height_cm,cover_kgdm_ha,method,note\n"
#define GH "mob,paddock,from,to\n"
#define MH "paddock,from,to,reason,keep_off_days\n"

static const bad_case bad[] = {
    {0, WH "P1,2024-05-01,10,,stick,\n",
     "mem:2:1: expected a paddock id of the site file, found \"P1\" (did you mean \"P01\"?)"},
    {0, WH "P01,2024-02-30,10,,stick,\n",
     "mem:2:2: expected a date YYYY-MM-DD in date, found \"2024-02-30\""},
    {0, WH "P01,2024-06-04,10,,stick,\n",
     "mem:2:2: expected a date on or before the plan start 2024-06-03, found 2024-06-04"},
    {0, WH "P01,2024-05-01,140,,stick,\n",
     "mem:2:3: expected a height from 0 to 100 cm, found 140"},
    {0, WH "P01,2024-05-01,-1,,stick,\n",
     "mem:2:3: expected a height from 0 to 100 cm, found -1"},
    {0, WH "P01,2024-05-01,,20000,visual,\n",
     "mem:2:4: expected a cover from 0 to 15000 kg DM/ha, found 20000"},
    {0, WH "P01,2024-05-01,8,900,stick,\n",
     "mem:2:4: expected height_cm or cover_kgdm_ha, not both, found \"8\" and \"900\""},
    {0, WH "P01,2024-05-01,,,stick,\n",
     "mem:2:3: expected a height in height_cm or a cover in cover_kgdm_ha, found both empty"},
    {0, WH "P01,2024-05-01,8,,stik,\n",
     "mem:2:5: expected a method stick, plate or visual, found \"stik\" (did you mean \"stick\"?)"},
    {0, WH "P01,2024-05-01,8cm,,stick,\n",
     "mem:2:3: expected a number in height_cm, found \"8cm\""},
    {0, WH "P01,2024-05-01,nan,,stick,\n",
     "mem:2:3: expected a number in height_cm, found \"nan\""},
    {0, WH "P01,2024-05-01,8,,stick,\nP01,2024-05-01,9,,plate,\n",
     "mem:3:2: expected one record per paddock and day, found a second one for P01 on 2024-05-01 (the first is on line 2)"},
    /* the earliest line that repeats a paddock and day is the one reported */
    {0, WH "P01,2024-05-01,8,,stick,\nP02,2024-05-01,8,,stick,\nP02,2024-05-01,9,,plate,\nP01,2024-05-01,9,,plate,\n",
     "mem:4:2: expected one record per paddock and day, found a second one for P02 on 2024-05-01 (the first is on line 3)"},
    {0, "paddock,date,heigth_cm,cover_kgdm_ha,method\n",
     "mem:1:3: expected a column named one of paddock, date, height_cm, cover_kgdm_ha, method, note, found \"heigth_cm\" (did you mean \"height_cm\"?)"},
    {0, "paddock,date,cover_kgdm_ha,method\n",
     "mem:1:5: expected a column named \"height_cm\" in the header, found none"},
    {0, WH "P01,2024-05-01,8,,stick\n", "mem:2:6: expected 6 fields as in the header, found 5"},
    {0, "", "mem:1:1: expected a header line, found an empty file"},
    /* a byte-order mark and '#' lines: line numbers still count them */
    {0, "\xEF\xBB\xBF# one\n# two\n" WH "P01,2024-05-01,8,,stick,\nP01,2024-05-02,8,,stik,\n",
     "mem:5:5: expected a method stick, plate or visual, found \"stik\" (did you mean \"stick\"?)"},
    /* CRLF, a blank line and a newline inside a quoted note */
    {0, WH "\r\nP01,2024-05-01,8,,stick,\"two\nlines\"\r\nP02,2024-07-01,8,,stick,\r\n",
     "mem:5:2: expected a date on or before the plan start 2024-06-03, found 2024-07-01"},
    {0, WH "P01,2024-05-01,8,,stick,\"open quote\n",
     "mem:2:6: expected well-formed CSV, found error parsing data while strict checking enabled"},
    {1, GH "ewe,P01,2024-05-01,2024-05-02\n",
     "mem:2:1: expected a mob id of the site file, found \"ewe\" (did you mean \"ewes\"?)"},
    {1, GH "ewes,P99,2024-05-01,2024-05-02\n",
     "mem:2:2: expected a paddock id of the site file, found \"P99\" (did you mean \"P09\"?)"},
    {1, GH "ewes,P01,2024-05-03,2024-05-02\n",
     "mem:2:4: expected a date on or after from (2024-05-03), found 2024-05-02"},
    {1, GH "ewes,P01,2024-06-01,2024-06-03\n",
     "mem:2:4: expected a date before the plan start 2024-06-03 (records are what was grazed), found 2024-06-03"},
    {1, GH "ewes,P01,2024-05-01,2024-05-04\newes,P02,2024-05-05,2024-05-06\newes,P03,2024-05-04,2024-05-05\n",
     "mem:4:3: expected no overlap with mob ewes's record on line 2 (2024-05-01 to 2024-05-04), found 2024-05-04 to 2024-05-05"},
    /* a stay inside a longer one, listed after a record in between */
    {1, GH "ewes,P01,2024-05-01,2024-05-10\newes,P02,2024-05-12,2024-05-13\newes,P03,2024-05-03,2024-05-04\n",
     "mem:4:3: expected no overlap with mob ewes's record on line 2 (2024-05-01 to 2024-05-10), found 2024-05-03 to 2024-05-04"},
    /* the same stay entered twice */
    {1, GH "ewes,P01,2024-05-01,2024-05-02\newes,P01,2024-05-01,2024-05-02\n",
     "mem:3:3: expected no overlap with mob ewes's record on line 2 (2024-05-01 to 2024-05-02), found 2024-05-01 to 2024-05-02"},
    {1, GH "ewes,P01,2024-05-01,not-a-date\n",
     "mem:2:4: expected a date YYYY-MM-DD in to, found \"not-a-date\""},
    {2, MH "B9,2024-06-01,2024-06-02,mowing,\n",
     "mem:2:1: expected a paddock id or block name of the site file, found \"B9\" (did you mean \"B1\"?)"},
    {2, MH "B1,2024-06-02,2024-06-01,mowing,\n",
     "mem:2:3: expected a date on or after from (2024-06-02), found 2024-06-01"},
    {2, MH "B1,2024-06-01,2024-06-02,,\n",
     "mem:2:4: expected a reason of 1 to 79 bytes, found 0 bytes"},
    {2, MH "B1,2024-06-01,2024-06-02,spray,-3\n",
     "mem:2:5: expected a whole number of days from 0 to 365 in keep_off_days, found \"-3\""},
    {2, MH "B1,2024-06-01,2024-06-02,spray,400\n",
     "mem:2:5: expected a whole number of days from 0 to 365 in keep_off_days, found \"400\""},
};

static int parse_kind(int kind, const char *text, rg_err *e)
{
    size_t len = strlen(text);
    if (kind == 0) {
        rec_walks w;
        int rc = rec_walk_parse(&demo, NULL, start, "mem", text, len, &w, e);
        rec_walk_free(&w);
        return rc;
    }
    if (kind == 1) {
        rec_grazes g;
        int rc = rec_graze_parse(&demo, start, "mem", text, len, &g, e);
        rec_graze_free(&g);
        return rc;
    }
    rec_maints m;
    int rc = rec_maint_parse(&demo, "mem", text, len, &m, e);
    rec_maint_free(&m);
    return rc;
}

/* Each bad record stops the read with exactly the expected one line:
 * file:line:column, what was expected, what was found (docs/records.md).
 * The expected lines are this project's own specification. */
static void test_bad_records(void **state)
{
    (void)state;
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        rg_err e = {{0}};
        int rc = parse_kind(bad[i].kind, bad[i].text, &e);
        if (rc != -1 || strcmp(e.msg, bad[i].msg) != 0)
            print_error("case %zu: rc %d, message\n  %s\nexpected\n  %s\n", i, rc, e.msg, bad[i].msg);
        assert_int_equal(rc, -1);
        assert_string_equal(e.msg, bad[i].msg);
        assert_null(strchr(e.msg, '\n'));
    }
}

static char tmpdir[64];

static void tmp_path(char *out, size_t cap, const char *name)
{
    if (!tmpdir[0]) {
        strcpy(tmpdir, "/tmp/test_records.XXXXXX");
        assert_non_null(mkdtemp(tmpdir));
    }
    snprintf(out, cap, "%s/%s", tmpdir, name);
}

static char *slurp(const char *path)
{
    size_t len;
    rg_err e = {{0}};
    char *t = textfile_read(path, &len, &e);
    assert_non_null(t);
    return t;
}

static void same_walks(const rec_walks *a, const rec_walks *b)
{
    assert_int_equal(a->n, b->n);
    for (int i = 0; i < a->n; i++) {
        const rec_walk *x = &a->w[i], *y = &b->w[i];
        assert_int_equal(x->paddock, y->paddock);
        assert_int_equal(x->day, y->day);
        assert_int_equal(x->method, y->method);
        assert_int_equal(isnan(x->height_cm), isnan(y->height_cm));
        if (!isnan(x->height_cm))
            assert_true(x->height_cm == y->height_cm);
        assert_true(x->cover_kgdm_ha == y->cover_kgdm_ha);
        assert_string_equal(x->note, y->note);
    }
}

/* parse -> write -> parse gives the same walk records (every field, exact
 * doubles, notes with commas, quotes and a leading blank), and writing the
 * re-read records again gives the same bytes. */
static void test_walk_round_trip(void **state)
{
    (void)state;
    const char *t = "# comment\n" WH
                    "P01,2024-05-01,12.3,,stick,\"ruler, \"\"rough\"\"\"\n"
                    "P02,2024-05-02,,1234.5678901234,visual,\" leading blank\"\n"
                    "O2,2024-05-03,0.1,,plate,\n";
    rg_err e = {{0}};
    rec_walks a, b, c;
    char p1[128], p2[128];
    tmp_path(p1, sizeof p1, "walk1.csv");
    tmp_path(p2, sizeof p2, "walk2.csv");
    assert_int_equal(rec_walk_parse(&demo, NULL, start, "mem", t, strlen(t), &a, &e), 0);
    assert_string_equal(a.w[0].note, "ruler, \"rough\"");
    assert_int_equal(rec_walk_write(&demo, &a, p1, &e), 0);
    assert_int_equal(rec_walk_load(&demo, NULL, start, p1, &b, &e), 0);
    same_walks(&a, &b);
    assert_int_equal(rec_walk_write(&demo, &b, p2, &e), 0);
    char *x = slurp(p1), *y = slurp(p2);
    assert_string_equal(x, y);
    free(x);
    free(y);
    /* the demo file too */
    rec_walk_free(&a);
    rec_walk_free(&b);
    assert_int_equal(rec_walk_load(&demo, NULL, start, DEMO "walk-2024-06.csv", &a, &e), 0);
    assert_int_equal(rec_walk_write(&demo, &a, p1, &e), 0);
    assert_int_equal(rec_walk_load(&demo, NULL, start, p1, &c, &e), 0);
    same_walks(&a, &c);
    rec_walk_free(&a);
    rec_walk_free(&c);
    unlink(p1);
    unlink(p2);
}

/* parse -> write -> parse gives the same grazing records. */
static void test_graze_round_trip(void **state)
{
    (void)state;
    rg_err e = {{0}};
    rec_grazes a, b;
    char p1[128];
    tmp_path(p1, sizeof p1, "grazed.csv");
    assert_int_equal(rec_graze_load(&demo, start, DEMO "grazed-2024-06.csv", &a, &e), 0);
    assert_int_equal(rec_graze_write(&demo, &a, p1, &e), 0);
    assert_int_equal(rec_graze_load(&demo, start, p1, &b, &e), 0);
    assert_int_equal(a.n, b.n);
    for (int i = 0; i < a.n; i++) {
        assert_int_equal(a.g[i].mob, b.g[i].mob);
        assert_int_equal(a.g[i].paddock, b.g[i].paddock);
        assert_int_equal(a.g[i].from_day, b.g[i].from_day);
        assert_int_equal(a.g[i].to_day, b.g[i].to_day);
    }
    rec_graze_free(&a);
    rec_graze_free(&b);
    unlink(p1);
    rmdir(tmpdir);
}

/* A block name expands to its paddocks (B2 = P05..P08 in the demo site);
 * merging appends one site window per CSV line, the keep-off days added
 * after the work (2024-06-10 + 14 days = 2024-06-24). */
static void test_maint_blocks_merge(void **state)
{
    (void)state;
    rg_err e = {{0}};
    rec_maints m;
    assert_int_equal(rec_maint_load(&demo, DEMO "maintenance.csv", &m, &e), 0);
    for (int i = 0; i < 4; i++) {
        assert_int_equal(m.m[i].paddock, pad("P05") + i);
        assert_int_equal(m.m[i].line, m.m[0].line);
        assert_int_equal(m.m[i].keep_off_days, 0);
        assert_string_equal(m.m[i].reason, "inverter service");
    }
    assert_int_equal(m.m[4].paddock, pad("P03"));
    assert_int_equal(m.m[4].keep_off_days, 14);

    site s;
    assert_int_equal(site_load(DEMO "site.json", "models", &s, &e), 0);
    int before = s.n_windows;
    assert_int_equal(rec_maint_merge(&m, &s, &e), 0);
    assert_int_equal(s.n_windows, before + 3);
    const site_window *b2 = &s.windows[before], *p3 = &s.windows[before + 1];
    assert_int_equal(b2->n_paddocks, 4);
    assert_int_equal(b2->paddocks[3], pad("P08"));
    assert_int_equal(b2->from_day, tcal_days(2024, 6, 17));
    assert_int_equal(b2->to_day, tcal_days(2024, 6, 19));
    assert_int_equal(p3->to_day, tcal_days(2024, 6, 10));
    assert_int_equal(p3->keep_off_days, 14); /* stock out to 2024-06-24 (planbuild.c) */
    assert_string_equal(p3->reason, "herbicide spot spray of thistles (stock kept off 14 days after 2024-06-10)");
    assert_string_equal(s.windows[0].reason, "inverter service"); /* the site's own, kept */
    site_free(&s);
    rec_maint_free(&m);
}

/* Queries on the demo records: the latest walk on or before a day; the
 * last grazing day before a day (a record running into the day is cut at
 * the day before); grazing days per mob in a span; intake = days x head x
 * intake, with the demo's 380 ewes x 2.2 % of 68 kg = 1.496 kg DM/head/day
 * (examples/demo/site.json, invented): 3 days on P14 = 1705.44 kg DM. */
static void test_queries(void **state)
{
    (void)state;
    rg_err e = {{0}};
    rec_walks w;
    rec_grazes g;
    assert_int_equal(rec_walk_load(&demo, NULL, start, DEMO "walk-2024-06.csv", &w, &e), 0);
    assert_int_equal(rec_graze_load(&demo, start, DEMO "grazed-2024-06.csv", &g, &e), 0);

    const rec_walk *r = rec_walk_latest(&w, pad("P01"), start);
    assert_non_null(r);
    assert_int_equal(r->day, tcal_days(2024, 5, 27));
    assert_int_equal(r->method, REC_STICK);
    assert_close(r->cover_kgdm_ha, 2090, 1e-9);
    assert_null(rec_walk_latest(&w, pad("P01"), tcal_days(2024, 5, 26)));
    assert_null(rec_walk_latest(&w, pad("P14"), start)); /* not walked */

    /* the later day wins, whatever the file order */
    const char *t = WH "P01,2024-05-20,10,,stick,\nP01,2024-05-10,5,,stick,\nP01,2024-05-15,7,,plate,\n";
    rec_walks w2;
    assert_int_equal(rec_walk_parse(&demo, NULL, start, "mem", t, strlen(t), &w2, &e), 0);
    assert_int_equal(rec_walk_latest(&w2, pad("P01"), start)->day, tcal_days(2024, 5, 20));
    assert_int_equal(rec_walk_latest(&w2, pad("P01"), tcal_days(2024, 5, 19))->method, REC_PLATE);
    rec_walk_free(&w2);

    assert_int_equal(rec_graze_last_day(&g, pad("P14"), start), tcal_days(2024, 5, 30));
    assert_int_equal(rec_graze_last_day(&g, pad("P15"), start), tcal_days(2024, 6, 2));
    assert_int_equal(rec_graze_last_day(&g, pad("P15"), tcal_days(2024, 6, 1)), tcal_days(2024, 5, 31));
    assert_int_equal(rec_graze_last_day(&g, pad("P15"), tcal_days(2024, 5, 31)), INT64_MIN);
    assert_int_equal(rec_graze_last_day(&g, pad("P01"), start), INT64_MIN);

    int days[1];
    assert_int_equal(rec_graze_days(&g, pad("P15"), tcal_days(2024, 6, 1), tcal_days(2024, 6, 30), 1, days), 2);
    assert_int_equal(days[0], 2);
    assert_int_equal(rec_graze_days(&g, pad("P05"), tcal_days(2024, 4, 1), tcal_days(2024, 5, 2), 1, days), 2);
    assert_int_equal(rec_graze_days(&g, pad("P01"), tcal_days(2024, 4, 1), start, 1, days), 0);
    assert_close(rec_graze_intake_kgdm(&demo, &g, pad("P14"), tcal_days(2024, 5, 1), start), 1705.44, 1e-6);
    rec_walk_free(&w);
    rec_graze_free(&g);
}

/* Overlaps are per mob: two mobs may share days (the site's share rule is
 * the planner's), and grazing days are counted per mob.  The site is the
 * demo with a second, invented mob of 50 wethers added. */
static void test_two_mobs(void **state)
{
    (void)state;
    rg_err e = {{0}};
    size_t len;
    char *text = textfile_read(DEMO "site.json", &len, &e);
    assert_non_null(text);
    const char *key = "\"mobs\": [";
    char *at = strstr(text, key);
    assert_non_null(at);
    const char *add = "{\"id\": \"wethers\", \"species\": \"sheep\", \"head\": 50, "
                      "\"liveweight_kg\": 60, \"intake_pct_lw\": 2.5},";
    size_t cut = (size_t)(at - text) + strlen(key);
    char *two = malloc(len + strlen(add) + 1);
    assert_non_null(two);
    memcpy(two, text, cut);
    strcpy(two + cut, add);
    strcat(two, text + cut);
    site s;
    assert_int_equal(site_parse(DEMO "site.json", two, strlen(two), "models", &s, &e), 0);
    free(text);
    free(two);
    assert_int_equal(s.n_mobs, 2);
    const char *t = GH "ewes,P01,2024-05-01,2024-05-04\nwethers,P01,2024-05-03,2024-05-05\n"
                    "wethers,P02,2024-05-07,2024-05-08\n";
    rec_grazes g;
    assert_int_equal(rec_graze_parse(&s, start, "mem", t, strlen(t), &g, &e), 0);
    int days[2];
    int p01 = site_find_paddock(&s, "P01");
    assert_int_equal(rec_graze_days(&g, p01, tcal_days(2024, 5, 1), tcal_days(2024, 5, 31), 2, days), 7);
    assert_int_equal(days[0], 3); /* wethers are mob 0, ewes mob 1 */
    assert_int_equal(days[1], 4);
    assert_int_equal(rec_graze_last_day(&g, p01, start), tcal_days(2024, 5, 5));
    rec_graze_free(&g);
    const char *u = GH "wethers,P01,2024-05-03,2024-05-06\newes,P01,2024-05-01,2024-05-04\n"
                    "wethers,P02,2024-05-06,2024-05-08\n";
    assert_int_equal(rec_graze_parse(&s, start, "mem", u, strlen(u), &g, &e), -1);
    assert_string_equal(e.msg, "mem:4:3: expected no overlap with mob wethers's record on line 2 (2024-05-03 to 2024-05-06), found 2024-05-06 to 2024-05-08");
    site_free(&s);
}

/* The site's own plate equation ($.plate_meter) replaces the default:
 * a = 100, b = 500 gives 10 cm -> 1500 kg DM/ha (arithmetic); without it
 * the default 125 x 10 + 640 = 1890. */
static void test_plate_of_site(void **state)
{
    (void)state;
    site s;
    memset(&s, 0, sizeof s);
    rec_plate p = rec_plate_of(&s);
    assert_close(rec_plate_cover_kgdm_ha(&p, 10), 1890, 1e-9);
    s.has_plate = 1;
    s.plate_kgdm_ha_per_cm = 100;
    s.plate_base_kgdm_ha = 500;
    p = rec_plate_of(&s);
    assert_close(rec_plate_cover_kgdm_ha(&p, 10), 1500, 1e-9);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_plate_of_site),
        cmocka_unit_test(test_demo_files),
        cmocka_unit_test(test_plate),
        cmocka_unit_test(test_bad_records),
        cmocka_unit_test(test_walk_round_trip),
        cmocka_unit_test(test_graze_round_trip),
        cmocka_unit_test(test_maint_blocks_merge),
        cmocka_unit_test(test_queries),
        cmocka_unit_test(test_two_mobs),
    };
    return cmocka_run_group_tests(tests, setup, teardown);
}
