/* omout.c - the O&M outputs of a plan (output stage): mowing jobs with the
 * reason in plain words, the animal-presence schedule per paddock, each as
 * CSV and as an iCalendar file (RFC 5545) written with libical.
 *
 * How it fits: a command (cmd_plan.c) solves and verifies a plan, then
 * hands the plan, its problem, the verifier's cover and the site to
 * om_build(); the writers go through textfile.c (temp file + rename).
 * Reading choices, written out in docs/om-outputs.md:
 *   - a mob's days in a week are laid out as the calendar lays them out
 *     (plandays.h: each visit on days its paddock is free, weeks in order,
 *     the paddock of the week before first);
 *   - the cover a mowed paddock would reach is the verifier's x' (the
 *     balance row of docs/planner.md before mowing);
 *   - iCalendar events are all-day (VALUE=DATE, DTEND the day after the
 *     last day, RFC 5545 3.6.1); UIDs are built from the site name, the
 *     kind, the ids and the first date, so a re-plan keeps the UID of an
 *     unchanged event; DTSTAMP is the plan's first day at 00:00 UTC (no
 *     clock: the same plan gives the same bytes).
 */
#include "omout.h"

#include <libical/ical.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "plandays.h"
#include "tcal.h"
#include "textfile.h"

#define OM_PRODID "-//rowgraze//rowgraze grazing plan//EN"
#define OM_UID_DOMAIN "rowgraze.invalid" /* RFC 2606: never a real host */

static const char *const month_abbr[12] = {"Jan", "Feb", "Mar", "Apr", "May", "Jun",
                                           "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"};
static const char *const day_abbr[7] = {"Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"};

static int days_of(const plan_problem *pb, const plan *pl, int m, int p, int t)
{
    return pl->days[((size_t)m * (size_t)pb->n_paddocks + (size_t)p) * (size_t)pb->n_weeks +
                    (size_t)t];
}

static int site_index(const om_schedule *o, int p)
{
    return o->s ? site_find_paddock(o->s, o->pb->pd[p].id) : -1;
}

static const char *block_of(const om_schedule *o, int p)
{
    int i = site_index(o, p);
    return i >= 0 ? o->s->paddocks[i].block : "";
}

/* "14 Jun 2026" */
static void long_date(int64_t day, char *buf, size_t cap)
{
    int y, mo, d;
    tcal_civil(day, &y, &mo, &d);
    snprintf(buf, cap, "%d %s %d", d, month_abbr[mo - 1], y);
}

/* Weekday (0 = Monday) of a day number: 1970-01-01 was a Thursday. */
static int weekday(int64_t day)
{
    return (int)(((day % 7) + 7 + 3) % 7);
}

/* "2850" -> "2,850" (whole kg; covers are never negative here). */
static void kg_text(double kg, char *buf, size_t cap)
{
    char raw[32];
    snprintf(raw, sizeof raw, "%.0f", kg < 0 ? 0.0 : kg);
    size_t n = strlen(raw), j = 0;
    for (size_t i = 0; i < n && j + 2 < cap; i++) {
        buf[j++] = raw[i];
        if ((n - i - 1) % 3 == 0 && i + 1 < n)
            buf[j++] = ',';
    }
    buf[j] = '\0';
}

/* ---- stays -------------------------------------------------------------- */

static int stay_cmp_merge(const void *a, const void *b)
{
    const om_stay *x = a, *y = b;
    if (x->paddock != y->paddock)
        return x->paddock < y->paddock ? -1 : 1;
    if (x->mob != y->mob)
        return x->mob < y->mob ? -1 : 1;
    return x->from_day < y->from_day ? -1 : x->from_day > y->from_day;
}

static int stay_cmp_out(const void *a, const void *b)
{
    const om_stay *x = a, *y = b;
    if (x->paddock != y->paddock)
        return x->paddock < y->paddock ? -1 : 1;
    if (x->from_day != y->from_day)
        return x->from_day < y->from_day ? -1 : 1;
    return (x->mob > y->mob) - (x->mob < y->mob);
}

/* One stay per mob, paddock and week, then merged where one ends the day
 * before the next begins. */
static int build_stays(om_schedule *o)
{
    const plan_problem *pb = o->pb;
    size_t cap = (size_t)pb->n_mobs * (size_t)pb->n_paddocks * (size_t)pb->n_weeks + 1;
    int *first = malloc(sizeof *first * (size_t)pb->n_paddocks);
    o->stays = malloc(sizeof *o->stays * cap);
    if (!first || !o->stays) {
        free(first);
        return -1;
    }
    int n = 0;
    for (int m = 0; m < pb->n_mobs; m++)
        for (int t = 0, prev = -1; t < pb->n_weeks; t++) {
            int clash = pday_place(pb, o->pl, m, t, prev, first);
            if (clash < 0) {
                free(first);
                return -1;
            }
            prev = pday_last_of(pb, o->pl, m, t, first);
            o->n_clash_days += clash;
            for (int p = 0; p < pb->n_paddocks; p++)
                if (first[p] >= 0) {
                    int64_t d0 = pb->start_day + 7 * (int64_t)t + first[p];
                    o->stays[n++] = (om_stay){m, p, d0, d0 + days_of(pb, o->pl, m, p, t) - 1};
                }
        }
    free(first);
    qsort(o->stays, (size_t)n, sizeof *o->stays, stay_cmp_merge);
    int k = 0;
    for (int i = 0; i < n; i++) {
        om_stay *prev = k ? &o->stays[k - 1] : NULL;
        if (prev && prev->mob == o->stays[i].mob && prev->paddock == o->stays[i].paddock &&
            prev->to_day + 1 == o->stays[i].from_day)
            prev->to_day = o->stays[i].to_day;
        else
            o->stays[k++] = o->stays[i];
    }
    o->n_stays = k;
    qsort(o->stays, (size_t)k, sizeof *o->stays, stay_cmp_out);
    return 0;
}

/* ---- mowing jobs -------------------------------------------------------- */

/* x' of docs/planner.md (bal before mowing), kg DM/ha: the cover paddock p
 * would end week t with if it were not mowed. */
static double cover_unmowed_kg(const om_schedule *o, const pv_result *v, int p, int t)
{
    const plan_problem *pb = o->pb;
    const plan_paddock *q = &pb->pd[p];
    double x = v->cover_t_ha[(size_t)p * (size_t)(pb->n_weeks + 1) + (size_t)t], eaten = 0;
    for (int m = 0; m < pb->n_mobs; m++)
        eaten += pb->mob[m].demand_t_d * (double)days_of(pb, o->pl, m, p, t);
    double xp = (1.0 - 7.0 * q->senescence_per_day) * x +
                7.0 * pb->growth_t_ha_d[(size_t)p * (size_t)pb->n_weeks + (size_t)t] -
                eaten / q->area_ha;
    return 1000.0 * xp;
}

static int grazed(const om_schedule *o, int p, int t)
{
    for (int m = 0; m < o->pb->n_mobs; m++)
        if (days_of(o->pb, o->pl, m, p, t) > 0)
            return 1;
    return 0;
}

/* The window that closes paddock p on the first day of week t, or NULL. */
static const site_window *closing_window(const om_schedule *o, int p, int t)
{
    int sp = site_index(o, p);
    int64_t d0 = o->pb->start_day + 7 * (int64_t)t;
    for (int k = 0; sp >= 0 && k < o->s->n_windows; k++) {
        const site_window *w = &o->s->windows[k];
        if (w->to_day < d0 || w->from_day > d0 + 6)
            continue;
        for (int j = 0; j < w->n_paddocks; j++)
            if (w->paddocks[j] == sp)
                return w;
    }
    return NULL;
}

static void why_closed(const om_schedule *o, int p, int t, char *buf, size_t cap)
{
    const site_window *w = closing_window(o, p, t);
    char until[24];
    if (!w) {
        snprintf(buf, cap, "closed for maintenance");
        return;
    }
    long_date(w->to_day, until, sizeof until);
    if (w->reason[0])
        snprintf(buf, cap, "closed for maintenance: %s, until %s", w->reason, until);
    else
        snprintf(buf, cap, "closed for maintenance until %s", until);
}

/* Weeks running to week u (inclusive) in which p is grazed. */
static int spell_to(const om_schedule *o, int p, int u)
{
    int n = 0;
    while (u - n >= 0 && grazed(o, p, u - n))
        n++;
    return n;
}

/* 1 and the reason when p may not be grazed in week t after a spell: the
 * spell already lasted the longest allowed, or the paddock is resting. */
static int why_resting(const om_schedule *o, int p, int t, char *buf, size_t cap)
{
    const plan_problem *pb = o->pb;
    int u = t - 1;
    while (u >= 0 && !grazed(o, p, u))
        u--;
    if (u < 0)
        return 0;
    if (t == u + 1 && spell_to(o, p, u) < pb->spell_weeks)
        return 0; /* the spell could have gone on */
    if (t - u > pb->rest_weeks && t != u + 1)
        return 0;
    char until[24];
    long_date(pb->start_day + 7 * (int64_t)(u + pb->rest_weeks + 1) - 1, until, sizeof until);
    if (pb->rest_weeks == 0)
        snprintf(buf, cap, "grazed the longest spell allowed (%d week%s)", pb->spell_weeks,
                 pb->spell_weeks == 1 ? "" : "s");
    else
        snprintf(buf, cap, "resting until %s", until);
    return 1;
}

/* What mob m could still give paddock p in week t: grazing days left
 * (0 when it cannot go there at all). */
static int mob_days_free(const om_schedule *o, int m, int p, int t)
{
    const plan_problem *pb = o->pb;
    int sum = 0, n_used = 0;
    for (int q = 0; q < pb->n_paddocks; q++) {
        int d = days_of(pb, o->pl, m, q, t);
        sum += d;
        n_used += d > 0;
    }
    if (n_used >= pb->max_paddocks_per_week || sum >= 7)
        return 0;
    int lim = pb->open_days[(size_t)p * (size_t)pb->n_weeks + (size_t)t];
    int dmax = plan_days_max(pb);
    lim = lim < dmax ? lim : dmax;
    return lim < 7 - sum ? lim : 7 - sum;
}

/* Why no mob holds p under its ceiling in week t (the plan does not graze
 * it or grazes it too little); the first reason that applies.  Returns 1
 * when the reason is a sentence of its own (a mob is there, or mowing is
 * the cheaper choice), 0 when it says why no mob can get there in time. */
static int why_no_mob(const om_schedule *o, int p, int t, double over_kg, char *buf, size_t cap)
{
    const plan_problem *pb = o->pb;
    if (pb->open_days[(size_t)p * (size_t)pb->n_weeks + (size_t)t] == 0) {
        why_closed(o, p, t, buf, cap);
        return 0;
    }
    for (int m = 0; m < pb->n_mobs; m++) {
        int d = days_of(pb, o->pl, m, p, t);
        if (d > 0) {
            snprintf(buf, cap, "mob %s grazes it %d day%s this week but cannot eat it down in time",
                     pb->mob[m].id, d, d == 1 ? "" : "s");
            return 1;
        }
    }
    if (why_resting(o, p, t, buf, cap))
        return 0;
    int free_mobs = 0, cattle_only = 0;
    double best_kg = 0;
    for (int m = 0; m < pb->n_mobs; m++) {
        int d = mob_days_free(o, m, p, t);
        if (d <= 0)
            continue;
        if (pb->mob[m].is_cattle && pb->pd[p].cattle_barred) {
            cattle_only++;
            continue;
        }
        free_mobs++;
        double kg = 1000.0 * pb->mob[m].demand_t_d * d / pb->pd[p].area_ha;
        best_kg = kg > best_kg ? kg : best_kg;
    }
    if (pb->n_mobs == 0)
        snprintf(buf, cap, "no mobs in the plan");
    else if (free_mobs == 0 && cattle_only > 0)
        snprintf(buf, cap, "only cattle are free and the panels are too low for cattle");
    else if (free_mobs == 0)
        snprintf(buf, cap, "mobs fully used elsewhere");
    else if (best_kg < over_kg) {
        char a[32], b[32];
        kg_text(best_kg, a, sizeof a);
        kg_text(over_kg, b, sizeof b);
        snprintf(buf, cap, "the free mobs could take off %s kg DM/ha at most, %s are needed", a, b);
    } else {
        snprintf(buf, cap, "a mob could get there, but mowing costs less than moving it (the plan's costs)");
        return 1;
    }
    return 0;
}

static void job_why(const om_schedule *o, int p, int t, double x_kg, char *buf, size_t cap)
{
    const plan_paddock *q = &o->pb->pd[p];
    double ceil_kg = 1000.0 * q->ceiling_t_ha;
    char a[32], b[32], reason[256];
    kg_text(x_kg, a, sizeof a);
    kg_text(ceil_kg, b, sizeof b);
    int alone = why_no_mob(o, p, t, x_kg - ceil_kg, reason, sizeof reason);
    char head[160];
    if (x_kg > ceil_kg)
        snprintf(head, sizeof head, "cover would reach %s kg DM/ha, over the %s ceiling", a, b);
    else
        snprintf(head, sizeof head, "cover %s kg DM/ha, under the %s ceiling now but mowed this "
                                    "week to stay under it in the weeks after", a, b);
    if (alone)
        snprintf(buf, cap, "%s; %s", head, reason);
    else
        snprintf(buf, cap, "%s; no mob can graze it in time (%s)", head, reason);
}

static int build_jobs(om_schedule *o, const pv_result *v)
{
    const plan_problem *pb = o->pb;
    o->jobs = malloc(sizeof *o->jobs * ((size_t)pb->n_paddocks * (size_t)pb->n_weeks + 1));
    if (!o->jobs)
        return -1;
    for (int t = 0; t < pb->n_weeks; t++)
        for (int p = 0; p < pb->n_paddocks; p++) {
            if (!o->pl->mow[(size_t)p * (size_t)pb->n_weeks + (size_t)t])
                continue;
            om_job *j = &o->jobs[o->n_jobs++];
            j->paddock = p;
            j->week = t;
            j->cover_kgdm_ha = cover_unmowed_kg(o, v, p, t);
            job_why(o, p, t, j->cover_kgdm_ha, j->why, sizeof j->why);
        }
    return 0;
}

int om_build(const plan_problem *pb, const plan *pl, const pv_result *v, const site *s,
             om_schedule *out)
{
    if (!out)
        return -1;
    memset(out, 0, sizeof *out);
    if (!pv_problem_valid(pb) || !pl || !v || !v->cover_t_ha || pl->n_paddocks != pb->n_paddocks ||
        pl->n_mobs != pb->n_mobs || pl->n_weeks != pb->n_weeks || !pl->days || !pl->mow)
        return -1;
    *out = (om_schedule){.pb = pb, .pl = pl, .s = s};
    if (build_stays(out) < 0 || build_jobs(out, v) < 0) {
        om_free(out);
        return -1;
    }
    return 0;
}

void om_free(om_schedule *o)
{
    if (!o)
        return;
    free(o->stays);
    free(o->jobs);
    memset(o, 0, sizeof *o);
}

/* ---- CSV ---------------------------------------------------------------- */

/* One CSV field (RFC 4180): quoted when it holds a comma, quote or line
 * break, quotes doubled. */
static void csv_field(FILE *fp, const char *text, int last)
{
    if (strpbrk(text, ",\"\r\n")) {
        fputc('"', fp);
        for (const char *c = text; *c; c++) {
            if (*c == '"')
                fputc('"', fp);
            fputc(*c, fp);
        }
        fputc('"', fp);
    } else
        fputs(text, fp);
    fputc(last ? '\n' : ',', fp);
}

static void mowing_csv(FILE *fp, const om_schedule *o)
{
    const plan_problem *pb = o->pb;
    fputs("paddock,block,week,week_start,week_end,area_ha,cover_before_kgdm_ha,ceiling_kgdm_ha,"
          "residual_kgdm_ha,why\n", fp);
    for (int i = 0; i < o->n_jobs; i++) {
        const om_job *j = &o->jobs[i];
        const plan_paddock *q = &pb->pd[j->paddock];
        char a[11], b[11];
        int64_t d0 = pb->start_day + 7 * (int64_t)j->week;
        tcal_format_date(d0, a);
        tcal_format_date(d0 + 6, b);
        csv_field(fp, q->id, 0);
        csv_field(fp, block_of(o, j->paddock), 0);
        fprintf(fp, "%d,%s,%s,%.2f,%.0f,%.0f,%.0f,", j->week + 1, a, b, q->area_ha,
                j->cover_kgdm_ha, 1000.0 * q->ceiling_t_ha, 1000.0 * q->residual_t_ha);
        csv_field(fp, j->why, 1);
    }
}

static void presence_csv(FILE *fp, const om_schedule *o)
{
    const plan_problem *pb = o->pb;
    fputs("paddock,block,mob,head,from,to\n", fp);
    for (int i = 0; i < o->n_stays; i++) {
        const om_stay *st = &o->stays[i];
        char a[11], b[11];
        tcal_format_date(st->from_day, a);
        tcal_format_date(st->to_day, b);
        csv_field(fp, pb->pd[st->paddock].id, 0);
        csv_field(fp, block_of(o, st->paddock), 0);
        csv_field(fp, pb->mob[st->mob].id, 0);
        fprintf(fp, "%d,%s,%s\n", pb->mob[st->mob].head, a, b);
    }
}

typedef void (*om_writer)(FILE *fp, const om_schedule *o);

static int write_csv(const om_schedule *o, const char *path, om_writer w, rg_err *err)
{
    textfile_out out;
    if (textfile_begin(&out, path, err) < 0)
        return -1;
    w(out.fp, o);
    return textfile_commit(&out, err);
}

int om_write_mowing_csv(const om_schedule *o, const char *path, rg_err *err)
{
    return write_csv(o, path, mowing_csv, err);
}

int om_write_presence_csv(const om_schedule *o, const char *path, rg_err *err)
{
    return write_csv(o, path, presence_csv, err);
}

/* ---- iCalendar ---------------------------------------------------------- */

/* Appends text to buf, letters and digits as they are, every other byte as
 * "_XX" (hex): different ids never give the same UID part, and a UID
 * holds no character a calendar program might mishandle. */
static void uid_part(char *buf, size_t cap, const char *text)
{
    size_t j = strlen(buf);
    for (const unsigned char *c = (const unsigned char *)text; *c && j + 4 < cap; c++) {
        if ((*c >= 'a' && *c <= 'z') || (*c >= 'A' && *c <= 'Z') || (*c >= '0' && *c <= '9'))
            buf[j++] = (char)*c;
        else
            j += (size_t)snprintf(buf + j, cap - j, "_%02X", *c);
    }
    buf[j] = '\0';
}

/* kind-site-paddock-mob-YYYYMMDD@rowgraze.invalid */
static void make_uid(const om_schedule *o, const char *kind, const char *paddock,
                     const char *mob, int64_t day, char *buf, size_t cap)
{
    int y, mo, d;
    tcal_civil(day, &y, &mo, &d);
    snprintf(buf, cap, "%s-", kind);
    uid_part(buf, cap, o->s ? o->s->name : "");
    size_t n = strlen(buf);
    snprintf(buf + n, cap - n, "-");
    uid_part(buf, cap, paddock);
    n = strlen(buf);
    snprintf(buf + n, cap - n, "-");
    uid_part(buf, cap, mob);
    n = strlen(buf);
    snprintf(buf + n, cap - n, "-%04d%02d%02d@%s", y, mo, d, OM_UID_DOMAIN);
}

static struct icaltimetype ical_date(int64_t day)
{
    struct icaltimetype t = icaltime_null_date();
    tcal_civil(day, &t.year, &t.month, &t.day);
    return t;
}

static icalcomponent *new_calendar(void)
{
    icalcomponent *cal = icalcomponent_new_vcalendar();
    if (!cal)
        return NULL;
    icalcomponent_add_property(cal, icalproperty_new_prodid(OM_PRODID));
    icalcomponent_add_property(cal, icalproperty_new_version("2.0"));
    icalcomponent_add_property(cal, icalproperty_new_calscale("GREGORIAN"));
    return cal;
}

/* An all-day event from day `from` to `to` inclusive (DTEND is the day
 * after, RFC 5545 3.6.1); TRANSPARENT, so it never blocks anyone's time. */
static void add_event(icalcomponent *cal, const om_schedule *o, const char *uid, int64_t from,
                      int64_t to, const char *summary, const char *description)
{
    struct icaltimetype stamp = icaltime_null_time();
    tcal_civil(o->pb->start_day, &stamp.year, &stamp.month, &stamp.day);
    stamp.zone = icaltimezone_get_utc_timezone();
    icalcomponent *ev = icalcomponent_new_vevent();
    icalcomponent_add_property(ev, icalproperty_new_uid(uid));
    icalcomponent_add_property(ev, icalproperty_new_dtstamp(stamp));
    icalcomponent_add_property(ev, icalproperty_new_dtstart(ical_date(from)));
    icalcomponent_add_property(ev, icalproperty_new_dtend(ical_date(to + 1)));
    icalcomponent_add_property(ev, icalproperty_new_summary(summary));
    icalcomponent_add_property(ev, icalproperty_new_description(description));
    icalcomponent_add_property(ev, icalproperty_new_transp(ICAL_TRANSP_TRANSPARENT));
    icalcomponent_add_component(cal, ev);
}

#define OM_PV_CAUTION                                                                   \
    "\nCaution: animals near live PV equipment: only qualified people open enclosures, " \
    "and everyone follows the site's safety rules."

/* 1 when paddock p has PV equipment in it: part of it lies under the array
 * (site_paddock.array_share > 0), or the site is not known. */
static int near_pv(const om_schedule *o, int p)
{
    int i = site_index(o, p);
    return i < 0 || o->s->paddocks[i].array_share > 0;
}

/* " (block B2)" or "" */
static void block_text(const om_schedule *o, int p, char *buf, size_t cap)
{
    const char *b = block_of(o, p);
    if (b[0])
        snprintf(buf, cap, " (block %s)", b);
    else
        buf[0] = '\0';
}

/* "420 sheep" / "60 cattle" / "300 head" (no site: the species unknown). */
static void head_text(const om_schedule *o, int m, char *buf, size_t cap)
{
    const plan_mob *mb = &o->pb->mob[m];
    const char *what = mb->is_cattle ? "cattle" : "head";
    for (int i = 0; o->s && i < o->s->n_mobs; i++)
        if (strcmp(o->s->mobs[i].id, mb->id) == 0)
            what = o->s->mobs[i].species == SPECIES_SHEEP    ? "sheep"
                   : o->s->mobs[i].species == SPECIES_GOATS ? "goats"
                                                            : "cattle";
    snprintf(buf, cap, "%d %s", mb->head, what);
}

static char *finish_calendar(icalcomponent *cal)
{
    char *text = icalcomponent_as_ical_string_r(cal);
    icalcomponent_free(cal);
    return text;
}

static void empty_event(icalcomponent *cal, const om_schedule *o, const char *kind,
                        const char *summary, const char *description)
{
    char uid[512];
    make_uid(o, kind, "", "", o->pb->start_day, uid, sizeof uid);
    add_event(cal, o, uid, o->pb->start_day, o->pb->start_day + 7 * (int64_t)o->pb->n_weeks - 1,
              summary, description);
}

char *om_mowing_ics(const om_schedule *o)
{
    icalcomponent *cal = new_calendar();
    if (!cal)
        return NULL;
    const plan_problem *pb = o->pb;
    for (int i = 0; i < o->n_jobs; i++) {
        const om_job *j = &o->jobs[i];
        const plan_paddock *q = &pb->pd[j->paddock];
        int64_t d0 = pb->start_day + 7 * (int64_t)j->week;
        char uid[512], blk[80], res[32], a[24], b[24], summary[256], desc[1536];
        make_uid(o, "mow", q->id, "", d0, uid, sizeof uid);
        block_text(o, j->paddock, blk, sizeof blk);
        kg_text(1000.0 * q->residual_t_ha, res, sizeof res);
        long_date(d0, a, sizeof a);
        long_date(d0 + 6, b, sizeof b);
        snprintf(summary, sizeof summary, "Mow paddock %s%s: %.1f ha, cover over the ceiling",
                 q->id, blk, q->area_ha);
        snprintf(desc, sizeof desc,
                 "Mow paddock %s%s, %.1f ha, during the week %s %s to %s %s, down to the "
                 "residual of %s kg DM/ha, after any stock have left the paddock.\n"
                 "Why: %s.\n"
                 "Caution: mowing under and between live PV arrays: keep clear of modules, "
                 "cables and tracker drives, watch for thrown stones, and follow the site's "
                 "safety rules and local codes.",
                 q->id, blk, q->area_ha, day_abbr[weekday(d0)], a, day_abbr[weekday(d0 + 6)], b,
                 res, j->why);
        add_event(cal, o, uid, d0, d0 + 6, summary, desc);
    }
    if (o->n_jobs == 0)
        empty_event(cal, o, "mow-none", "No mowing jobs in this plan",
                    "Grazing holds every paddock under its vegetation ceiling in these weeks.");
    return finish_calendar(cal);
}

char *om_presence_ics(const om_schedule *o)
{
    icalcomponent *cal = new_calendar();
    if (!cal)
        return NULL;
    const plan_problem *pb = o->pb;
    for (int i = 0; i < o->n_stays; i++) {
        const om_stay *st = &o->stays[i];
        const char *pid = pb->pd[st->paddock].id, *mid = pb->mob[st->mob].id;
        char uid[512], blk[80], head[64], a[24], b[24], summary[256], desc[1536];
        make_uid(o, "stock", pid, mid, st->from_day, uid, sizeof uid);
        block_text(o, st->paddock, blk, sizeof blk);
        head_text(o, st->mob, head, sizeof head);
        long_date(st->from_day, a, sizeof a);
        long_date(st->to_day, b, sizeof b);
        snprintf(summary, sizeof summary,
                 "Mob %s in paddock %s%s - keep gates shut, no vehicle work", mid, pid, blk);
        snprintf(desc, sizeof desc,
                 "Mob %s, %s, grazes paddock %s%s from %s %s to %s %s inclusive.\n"
                 "Keep gates shut and vehicles out of the paddock while stock are in; "
                 "arrange any work there with the grazier first.%s",
                 mid, head, pid, blk, day_abbr[weekday(st->from_day)], a,
                 day_abbr[weekday(st->to_day)], b, near_pv(o, st->paddock) ? OM_PV_CAUTION : "");
        add_event(cal, o, uid, st->from_day, st->to_day, summary, desc);
    }
    if (o->n_stays == 0)
        empty_event(cal, o, "stock-none", "No stock in any paddock in this plan",
                    "The plan keeps every mob off these paddocks in these weeks.");
    return finish_calendar(cal);
}

static int write_ics(const om_schedule *o, const char *path, char *(*make)(const om_schedule *),
                     rg_err *err)
{
    char *text = make(o);
    if (!text)
        return rg_fail(err, "%s: out of memory while building the calendar", path);
    textfile_out out;
    if (textfile_begin(&out, path, err) < 0) {
        free(text);
        return -1;
    }
    fputs(text, out.fp);
    free(text);
    return textfile_commit(&out, err);
}

int om_write_mowing_ics(const om_schedule *o, const char *path, rg_err *err)
{
    return write_ics(o, path, om_mowing_ics, err);
}

int om_write_presence_ics(const om_schedule *o, const char *path, rg_err *err)
{
    return write_ics(o, path, om_presence_ics, err);
}
