/* test_omout.c - the O&M outputs: mowing jobs and the presence schedule as
 * CSV (RFC 4180 quoting) and as iCalendar (RFC 5545), the .ics parsed back
 * with libical.  Small plans are made by hand (invented for the tests); the
 * covers they reach are worked out by hand in the comments with the
 * balance row of docs/planner.md, x' = (1 - 7 s) x + 7 G - I d / A.
 * One test solves a constructed problem with the MILP (planmilp.c) to see
 * that grazing that cannot hold a paddock gives exactly one mowing job. */
#include <libical/ical.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "omout.h"
#include "planmilp.h"
#include "planverify.h"
#include "rgtest.h"
#include "tcal.h"
#include "textfile.h"

/* 2026-06-01 is a Monday (day 20605 since 1970-01-01). */
static int64_t start(void)
{
    return tcal_days(2026, 6, 1);
}

/* P paddocks of 1 ha, cover 2.0, residual 1.0, ceiling 3.0 t DM/ha, growth
 * 0.05 t/ha/day, no senescence, open all week; M mobs of 100 head eating
 * 0.1 t DM/day; D = 7, spells up to 2 weeks, no rest, 2 paddocks a week,
 * no sharing; ids "p0".., "m0".. */
static void mk(plan_problem *pb, int P, int M, int T)
{
    memset(pb, 0, sizeof *pb);
    pb->n_paddocks = P;
    pb->n_mobs = M;
    pb->n_weeks = T;
    pb->start_day = start();
    pb->pd = calloc((size_t)P, sizeof *pb->pd);
    pb->mob = calloc((size_t)M + 1, sizeof *pb->mob);
    pb->growth_t_ha_d = calloc((size_t)(P * T), sizeof *pb->growth_t_ha_d);
    pb->open_days = calloc((size_t)(P * T), sizeof *pb->open_days);
    assert_true(pb->pd && pb->mob && pb->growth_t_ha_d && pb->open_days);
    for (int p = 0; p < P; p++) {
        snprintf(pb->pd[p].id, sizeof pb->pd[p].id, "p%d", p);
        pb->pd[p].area_ha = 1.0;
        pb->pd[p].cover0_t_ha = 2.0;
        pb->pd[p].residual_t_ha = 1.0;
        pb->pd[p].ceiling_t_ha = 3.0;
        for (int t = 0; t < T; t++) {
            pb->open_days[p * T + t] = 7;
            pb->growth_t_ha_d[p * T + t] = 0.05;
        }
    }
    for (int m = 0; m < M; m++) {
        snprintf(pb->mob[m].id, sizeof pb->mob[m].id, "m%d", m);
        pb->mob[m].head = 100;
        pb->mob[m].demand_t_d = 0.1;
    }
    pb->max_days_per_visit = 7;
    pb->spell_weeks = 2;
    pb->max_paddocks_per_week = 2;
    pb->cost_supplement_per_t = 300;
    pb->cost_mowing_per_ha = 60;
    pb->cost_per_move = 25;
    pb->penalty_terminal_per_t = 300;
}

static int *D(plan *pl, int m, int p, int t)
{
    return &pl->days[(m * pl->n_paddocks + p) * pl->n_weeks + t];
}

static void feed_rest(const plan_problem *pb, plan *pl)
{
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0; t < pb->n_weeks; t++) {
            int sum = 0;
            for (int p = 0; p < pb->n_paddocks; p++)
                sum += *D(pl, m, p, t);
            pl->supplement_t[m * pb->n_weeks + t] = pb->mob[m].demand_t_d * (7 - sum);
        }
}

/* A hand-made site holding only what omout.c reads: name, paddock ids,
 * blocks, array shares, mobs' species, maintenance windows. */
typedef struct mini_site {
    site s;
    site_paddock pd[4];
    site_mob mob[2];
    site_window win[1];
    int win_pd[1];
} mini_site;

static void mk_site(mini_site *ms, const plan_problem *pb)
{
    memset(ms, 0, sizeof *ms);
    snprintf(ms->s.name, sizeof ms->s.name, "Test Bench");
    ms->s.n_paddocks = pb->n_paddocks;
    ms->s.paddocks = ms->pd;
    for (int p = 0; p < pb->n_paddocks; p++) {
        snprintf(ms->pd[p].id, sizeof ms->pd[p].id, "%s", pb->pd[p].id);
        snprintf(ms->pd[p].block, sizeof ms->pd[p].block, "B%d", 1 + p / 2);
        ms->pd[p].area_ha = pb->pd[p].area_ha;
        ms->pd[p].array_share = 0.6;
    }
    ms->s.n_mobs = pb->n_mobs;
    ms->s.mobs = ms->mob;
    for (int m = 0; m < pb->n_mobs; m++) {
        snprintf(ms->mob[m].id, sizeof ms->mob[m].id, "%s", pb->mob[m].id);
        ms->mob[m].species = SPECIES_SHEEP;
        ms->mob[m].head = pb->mob[m].head;
    }
}

/* Closes paddock p from day a to day b of the plan (inclusive). */
static void close_paddock(mini_site *ms, int p, int a, int b, const char *why)
{
    ms->win_pd[0] = p;
    ms->win[0] = (site_window){.from_day = start() + a, .to_day = start() + b, .n_paddocks = 1,
                               .paddocks = ms->win_pd};
    snprintf(ms->win[0].reason, sizeof ms->win[0].reason, "%s", why);
    ms->s.n_windows = 1;
    ms->s.windows = ms->win;
}

static char *slurp(const char *path)
{
    size_t len;
    rg_err err = {{0}};
    char *t = textfile_read(path, &len, &err);
    if (!t)
        print_error("%s\n", err.msg);
    assert_non_null(t);
    return t;
}

static void tmp_path(char *buf, size_t cap, const char *name)
{
    snprintf(buf, cap, "/tmp/test_omout-%ld-%s", (long)getpid(), name);
}

/* ---- layout --------------------------------------------------------------- */

/* ---- presence ------------------------------------------------------------- */

/* One mob, 3 weeks from Mon 2026-06-01: p0 7 days, then p0 3 + p1 4, then
 * p1 7.  Merged across weeks: p0 1-10 Jun, p1 11-21 Jun.  By hand the
 * plan is legal (pv_simulate 0): p0 2.0 -> 1.65 -> 1.7 -> 2.05,
 * p1 2.0 -> 2.35 -> 2.3 -> 1.95, all between residual 1 and ceiling 3. */
static void build_two_stays(plan_problem *pb, plan *pl, pv_result *v)
{
    mk(pb, 2, 1, 3);
    assert_int_equal(plan_alloc(pb, pl), 0);
    *D(pl, 0, 0, 0) = 7;
    *D(pl, 0, 0, 1) = 3;
    *D(pl, 0, 1, 1) = 4;
    *D(pl, 0, 1, 2) = 7;
    feed_rest(pb, pl);
    assert_int_equal(pv_simulate(pb, pl, v), 0);
    assert_close(v->cover_t_ha[3], 2.05, 1e-12);
    assert_close(v->cover_t_ha[7], 1.95, 1e-12);
}

/* The CSV, exactly: one row per merged stay, sorted by paddock. */
static void test_presence_csv(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    build_two_stays(&pb, &pl, &v);
    mini_site ms;
    mk_site(&ms, &pb);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, &ms.s, &o), 0);
    assert_int_equal(o.n_stays, 2);
    assert_int_equal(o.n_jobs, 0);
    assert_int_equal(o.n_clash_days, 0);
    char path[256];
    tmp_path(path, sizeof path, "presence.csv");
    rg_err err = {{0}};
    assert_int_equal(om_write_presence_csv(&o, path, &err), 0);
    char *t = slurp(path);
    assert_string_equal(t, "paddock,block,mob,head,from,to\n"
                           "p0,B1,m0,100,2026-06-01,2026-06-10\n"
                           "p1,B1,m0,100,2026-06-11,2026-06-21\n");
    free(t);
    unlink(path);
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Counts the VEVENTs of an iCalendar text parsed with libical and checks
 * what RFC 5545 3.6.1 asks of each (UID, DTSTAMP; all-day DTSTART as a
 * DATE, DTEND after it) and that the UIDs differ; returns the count. */
static int check_ics(const char *text, int64_t stamp_day)
{
    icalcomponent *cal = icalparser_parse_string(text);
    assert_non_null(cal);
    assert_int_equal(icalcomponent_isa(cal), ICAL_VCALENDAR_COMPONENT);
    icalproperty *ver = icalcomponent_get_first_property(cal, ICAL_VERSION_PROPERTY);
    assert_non_null(ver);
    assert_string_equal(icalproperty_get_version(ver), "2.0");
    assert_non_null(icalcomponent_get_first_property(cal, ICAL_PRODID_PROPERTY));
    char uids[16][512];
    int n = 0;
    int y, mo, d;
    tcal_civil(stamp_day, &y, &mo, &d);
    for (icalcomponent *ev = icalcomponent_get_first_component(cal, ICAL_VEVENT_COMPONENT); ev;
         ev = icalcomponent_get_next_component(cal, ICAL_VEVENT_COMPONENT)) {
        struct icaltimetype a = icalcomponent_get_dtstart(ev), b = icalcomponent_get_dtend(ev);
        assert_true(a.is_date && b.is_date);
        assert_true(icaltime_compare(a, b) < 0);
        struct icaltimetype st = icalcomponent_get_dtstamp(ev);
        assert_true(icaltime_is_utc(st));
        assert_int_equal(st.year * 10000 + st.month * 100 + st.day, y * 10000 + mo * 100 + d);
        const char *uid = icalcomponent_get_uid(ev);
        assert_non_null(uid);
        assert_true(n < 16);
        for (int i = 0; i < n; i++)
            assert_string_not_equal(uids[i], uid);
        snprintf(uids[n++], sizeof uids[0], "%s", uid);
    }
    icalcomponent_free(cal);
    return n;
}

/* The presence calendar: two events (1-10 Jun and 11-21 Jun, so DTEND
 * 11 Jun and 22 Jun: RFC 5545 3.6.1, DTEND is exclusive), the summary in
 * trade words, the PV caution in the description, and the same bytes from
 * two builds and from the file written. */
static void test_presence_ics(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    build_two_stays(&pb, &pl, &v);
    mini_site ms;
    mk_site(&ms, &pb);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, &ms.s, &o), 0);
    char *a = om_presence_ics(&o), *b = om_presence_ics(&o);
    assert_non_null(a);
    assert_non_null(b);
    assert_string_equal(a, b);
    assert_non_null(strstr(a, "\r\nEND:VCALENDAR\r\n")); /* CRLF lines, RFC 5545 3.1 */
    assert_int_equal(check_ics(a, start()), 2);
    icalcomponent *cal = icalparser_parse_string(a);
    icalcomponent *ev = icalcomponent_get_first_component(cal, ICAL_VEVENT_COMPONENT);
    assert_string_equal(icalcomponent_get_summary(ev),
                        "Mob m0 in paddock p0 (block B1) - keep gates shut, no vehicle work");
    struct icaltimetype s0 = icalcomponent_get_dtstart(ev), e0 = icalcomponent_get_dtend(ev);
    assert_int_equal(s0.year * 10000 + s0.month * 100 + s0.day, 20260601);
    assert_int_equal(e0.year * 10000 + e0.month * 100 + e0.day, 20260611);
    const char *desc = icalcomponent_get_description(ev);
    assert_non_null(strstr(desc, "100 sheep"));
    assert_non_null(strstr(desc, "from Mon 1 Jun 2026 to Wed 10 Jun 2026 inclusive"));
    assert_non_null(strstr(desc, "only qualified people open enclosures"));
    ev = icalcomponent_get_next_component(cal, ICAL_VEVENT_COMPONENT);
    s0 = icalcomponent_get_dtstart(ev);
    e0 = icalcomponent_get_dtend(ev);
    assert_int_equal(s0.year * 10000 + s0.month * 100 + s0.day, 20260611);
    assert_int_equal(e0.year * 10000 + e0.month * 100 + e0.day, 20260622);
    icalcomponent_free(cal);
    char path[256];
    tmp_path(path, sizeof path, "presence.ics");
    rg_err err = {{0}};
    assert_int_equal(om_write_presence_ics(&o, path, &err), 0);
    char *f = slurp(path);
    assert_string_equal(f, a);
    free(f);
    unlink(path);
    free(a);
    free(b);
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Ids that differ only in punctuation ("a-b", "a_2Db") and a mob id with a
 * comma and a quote: distinct UIDs, the CSV field quoted and its quote
 * doubled (RFC 4180 2.6, 2.7), the summary's comma escaped in the .ics and
 * read back whole by libical (RFC 5545 3.3.11). */
static void test_ids_quoting_and_uids(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    mk(&pb, 2, 1, 1);
    snprintf(pb.pd[0].id, sizeof pb.pd[0].id, "a-b");
    snprintf(pb.pd[1].id, sizeof pb.pd[1].id, "a_2Db");
    snprintf(pb.mob[0].id, sizeof pb.mob[0].id, "ewes, \"old\"");
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 3;
    *D(&pl, 0, 1, 0) = 4;
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    char path[256];
    tmp_path(path, sizeof path, "quote.csv");
    rg_err err = {{0}};
    assert_int_equal(om_write_presence_csv(&o, path, &err), 0);
    char *t = slurp(path);
    assert_string_equal(t, "paddock,block,mob,head,from,to\n"
                           "a-b,,\"ewes, \"\"old\"\"\",100,2026-06-01,2026-06-03\n"
                           "a_2Db,,\"ewes, \"\"old\"\"\",100,2026-06-04,2026-06-07\n");
    free(t);
    unlink(path);
    char *ics = om_presence_ics(&o);
    assert_non_null(strstr(ics, "SUMMARY:Mob ewes\\, \"old\" in paddock a-b - keep gates shut\\, no"));
    assert_int_equal(check_ics(ics, start()), 2);
    icalcomponent *cal = icalparser_parse_string(ics);
    icalcomponent *ev = icalcomponent_get_first_component(cal, ICAL_VEVENT_COMPONENT);
    assert_string_equal(icalcomponent_get_summary(ev),
                        "Mob ewes, \"old\" in paddock a-b - keep gates shut, no vehicle work");
    /* no site: the caution stays (the paddock may hold PV equipment) */
    assert_non_null(strstr(icalcomponent_get_description(ev), "live PV equipment"));
    icalcomponent_free(cal);
    free(ics);
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* ---- mowing --------------------------------------------------------------- */

/* Two paddocks, one mob, 2 weeks.  p1 starts at 2.6 t DM/ha and grows 0.1
 * t/ha/day; a window closes it all of week 0, so no mob may enter:
 * x' = 2.6 + 0.7 = 3.3 > 3.0, and the only legal plan mows it in week 0
 * (to the residual 1.0; week 1 then ends at 1.7, under the ceiling).  p0
 * (2.0, growth 0.05) carries the mob.  The MILP (GLPK) solves it; the
 * verifier passes it; om_build lists exactly one job: p1, week 1 of the
 * plan (1-7 Jun), cover 3,300 over 3,000, closed for maintenance. */
static void test_milp_one_mowing_job(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    mk(&pb, 2, 1, 2);
    pb.pd[1].cover0_t_ha = 2.6;
    pb.growth_t_ha_d[1 * 2 + 0] = pb.growth_t_ha_d[1 * 2 + 1] = 0.1;
    pb.open_days[1 * 2 + 0] = 0;
    mini_site ms;
    mk_site(&ms, &pb);
    close_paddock(&ms, 1, 0, 6, "inverter service");
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    pm_options po = {.time_limit_s = 20, .gap = 0, .strategy = PM_DIRECT};
    pm_result res;
    assert_int_equal(pm_solve(&pb, &po, &pl, &res), 0);
    assert_int_equal(res.status, PM_OPTIMAL);
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, &ms.s, &o), 0);
    assert_int_equal(o.n_jobs, 1);
    assert_int_equal(o.jobs[0].paddock, 1);
    assert_int_equal(o.jobs[0].week, 0);
    assert_close(o.jobs[0].cover_kgdm_ha, 3300.0, 1e-6);
    assert_string_equal(o.jobs[0].why,
                        "cover would reach 3,300 kg DM/ha, over the 3,000 ceiling; no mob can graze "
                        "it in time (closed for maintenance: inverter service, until 7 Jun 2026)");
    char path[256];
    tmp_path(path, sizeof path, "mow.csv");
    rg_err err = {{0}};
    assert_int_equal(om_write_mowing_csv(&o, path, &err), 0);
    char *t = slurp(path);
    assert_string_equal(t, "paddock,block,week,week_start,week_end,area_ha,cover_before_kgdm_ha,"
                           "ceiling_kgdm_ha,residual_kgdm_ha,why\n"
                           "p1,B1,1,2026-06-01,2026-06-07,1.00,3300,3000,1000,\"cover would reach "
                           "3,300 kg DM/ha, over the 3,000 ceiling; no mob can graze it in time "
                           "(closed for maintenance: inverter service, until 7 Jun 2026)\"\n");
    free(t);
    unlink(path);
    char *ics = om_mowing_ics(&o);
    assert_int_equal(check_ics(ics, start()), 1);
    icalcomponent *cal = icalparser_parse_string(ics);
    icalcomponent *ev = icalcomponent_get_first_component(cal, ICAL_VEVENT_COMPONENT);
    assert_string_equal(icalcomponent_get_summary(ev),
                        "Mow paddock p1 (block B1): 1.0 ha, cover over the ceiling");
    struct icaltimetype a = icalcomponent_get_dtstart(ev), b = icalcomponent_get_dtend(ev);
    assert_int_equal(a.year * 10000 + a.month * 100 + a.day, 20260601);
    assert_int_equal(b.year * 10000 + b.month * 100 + b.day, 20260608);
    assert_non_null(strstr(icalcomponent_get_description(ev), "down to the residual of 1,000 kg DM/ha"));
    icalcomponent_free(cal);
    free(ics);
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* The reasons, by hand.  Rest 2 weeks, 3 weeks, one mob.  p1 starts at 2.9
 * and grows 0.1 t/ha/day: grazed all of week 0 (2.9 + 0.7 - 0.7 = 2.9),
 * resting in weeks 1-2 (the spell ended in week 0: may graze again from
 * week 3, so resting until Sun 21 Jun); week 1 would reach 3.6 -> mowed.
 * Spells last one week at most, so the spell could not go on into week 1.
 * p0 (2.0, growth 0.05) holds the mob in week 1.  A second plan: p1 never
 * grazed, the mob 7 days in p0 in week 0: "mobs fully used elsewhere";
 * a third: the mob 3 days in p1 in week 0, still over the ceiling. */
static void test_reasons(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    mk(&pb, 2, 1, 3);
    pb.rest_weeks = 2;
    pb.spell_weeks = 1;
    pb.pd[1].cover0_t_ha = 2.9;
    for (int t = 0; t < 3; t++)
        pb.growth_t_ha_d[1 * 3 + t] = 0.1;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 1, 0) = 7;
    *D(&pl, 0, 0, 1) = 7;
    pl.mow[1 * 3 + 1] = 1;
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    assert_int_equal(o.n_jobs, 1);
    assert_int_equal(o.jobs[0].week, 1);
    assert_close(o.jobs[0].cover_kgdm_ha, 3600.0, 1e-6);
    assert_string_equal(o.jobs[0].why, "cover would reach 3,600 kg DM/ha, over the 3,000 ceiling; "
                                       "no mob can graze it in time (resting until 21 Jun 2026)");
    om_free(&o);
    pv_free(&v);
    /* p1 never grazed: 2.9 + 0.7 = 3.6 in week 0, mowed; the mob eats p0 */
    memset(pl.days, 0, sizeof *pl.days * 6);
    memset(pl.mow, 0, 6);
    *D(&pl, 0, 0, 0) = 7;
    pl.mow[1 * 3 + 0] = 1;
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    assert_int_equal(o.n_jobs, 1);
    assert_int_equal(o.jobs[0].week, 0);
    assert_non_null(strstr(o.jobs[0].why, "(mobs fully used elsewhere)"));
    om_free(&o);
    pv_free(&v);
    /* the mob in p1 3 days of week 0: 2.9 + 0.7 - 0.3 = 3.3, still mowed */
    *D(&pl, 0, 0, 0) = 4;
    *D(&pl, 0, 1, 0) = 3;
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    assert_int_equal(o.n_jobs, 1);
    assert_string_equal(o.jobs[0].why, "cover would reach 3,300 kg DM/ha, over the 3,000 ceiling; "
                                       "mob m0 grazes it 3 days this week but cannot eat it down in time");
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* Free mobs that cannot hold it.  One mob, p1 at 2.9 growing 0.1 t/ha/day,
 * never grazed: x' = 3.6, 600 kg DM/ha over the ceiling, mowed in week 0.
 * The mob spends 3 days in p0 and has 4 days free: 4 x 0.1 t / 1 ha = 400
 * kg DM/ha at most, short of 600.  The same mob as cattle, with p1 too low
 * for cattle: only cattle are free. */
static void test_reasons_free_mobs(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    mk(&pb, 2, 1, 1);
    pb.pd[1].cover0_t_ha = 2.9;
    pb.growth_t_ha_d[1] = 0.1;
    assert_int_equal(plan_alloc(&pb, &pl), 0);
    *D(&pl, 0, 0, 0) = 3;
    pl.mow[1] = 1;
    feed_rest(&pb, &pl);
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    assert_int_equal(o.n_jobs, 1);
    assert_string_equal(o.jobs[0].why, "cover would reach 3,600 kg DM/ha, over the 3,000 ceiling; "
                                       "no mob can graze it in time (the free mobs could take off "
                                       "400 kg DM/ha at most, 600 are needed)");
    om_free(&o);
    pv_free(&v);
    pb.mob[0].is_cattle = 1;
    pb.pd[1].cattle_barred = 1;
    assert_int_equal(pv_simulate(&pb, &pl, &v), 0);
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    assert_non_null(strstr(o.jobs[0].why, "(only cattle are free and the panels are too low for cattle)"));
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* No jobs: the mowing calendar still holds one component (RFC 5545 3.4,
 * icalbody needs 1*component): an event over the plan's weeks saying so. */
static void test_no_jobs_calendar(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    build_two_stays(&pb, &pl, &v);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    char *ics = om_mowing_ics(&o);
    assert_int_equal(check_ics(ics, start()), 1);
    assert_non_null(strstr(ics, "SUMMARY:No mowing jobs in this plan"));
    assert_non_null(strstr(ics, "DTEND;VALUE=DATE:20260622"));
    free(ics);
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

/* A file that cannot be written: -1 and one line naming the path, for
 * each writer; no file and no temporary file left behind (textfile.h). */
static void test_write_failure(void **state)
{
    (void)state;
    plan_problem pb;
    plan pl;
    pv_result v;
    build_two_stays(&pb, &pl, &v);
    om_schedule o;
    assert_int_equal(om_build(&pb, &pl, &v, NULL, &o), 0);
    const char *bad = "/nonexistent-dir-of-test-omout/x.out";
    int (*w[4])(const om_schedule *, const char *, rg_err *) = {
        om_write_mowing_csv, om_write_presence_csv, om_write_mowing_ics, om_write_presence_ics};
    for (int i = 0; i < 4; i++) {
        rg_err err = {{0}};
        assert_int_equal(w[i](&o, bad, &err), -1);
        assert_non_null(strstr(err.msg, bad));
        assert_null(strchr(err.msg, '\n'));
        assert_int_not_equal(access(bad, F_OK), 0);
    }
    om_free(&o);
    pv_free(&v);
    plan_free(&pl);
    plan_problem_free(&pb);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_presence_csv),
        cmocka_unit_test(test_presence_ics),
        cmocka_unit_test(test_ids_quoting_and_uids),
        cmocka_unit_test(test_milp_one_mowing_job),
        cmocka_unit_test(test_reasons),
        cmocka_unit_test(test_reasons_free_mobs),
        cmocka_unit_test(test_no_jobs_calendar),
        cmocka_unit_test(test_write_failure),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
