/* omout.h - the O&M outputs of a plan (output stage): mowing jobs and the
 * animal-presence schedule, as CSV and as iCalendar (RFC 5545) files.
 *
 * om_build() reads a verified plan (the plan, its problem, pv_simulate's
 * cover) and, when given, the site (O&M block names, species, maintenance
 * windows with their reasons) and lists:
 *   - mowing jobs: one per paddock and week the plan mows, with the cover
 *     the paddock would reach, its ceiling, and why grazing does not hold
 *     it, in plain words;
 *   - stays: which mob is in which paddock from which day to which day
 *     (inclusive), consecutive days merged across weeks.
 * The writers put each list in a CSV file or an iCalendar file (written
 * with libical), always through textfile_begin/commit (temp file +
 * rename).  Same input, same bytes: event UIDs and DTSTAMP are derived
 * from the site name, ids and the plan start, never from a clock.
 * docs/om-outputs.md describes the files.
 */
#ifndef OMOUT_H
#define OMOUT_H

#include <stdint.h>

#include "diag.h"
#include "plan.h"
#include "planverify.h"
#include "site.h"

#define OM_WHY_LEN 512

typedef struct om_stay {
    int mob, paddock;          /* indices into the problem's mobs and paddocks */
    int64_t from_day, to_day;  /* inclusive day numbers (tcal.h) */
} om_stay;

typedef struct om_job {
    int paddock, week;         /* the paddock is mowed at the end of this week */
    double cover_kgdm_ha;      /* cover the week would end with unmowed */
    char why[OM_WHY_LEN];      /* plain words: over the ceiling and why no mob
                                  holds it ("resting until ...", "closed for
                                  maintenance ...", "mobs fully used elsewhere") */
} om_job;

typedef struct om_schedule {
    const plan_problem *pb;
    const plan *pl;
    const site *s;             /* NULL when not given: no blocks, no species */
    int n_stays, n_jobs;
    om_stay *stays;            /* by paddock, then first day, then mob */
    om_job *jobs;              /* by week, then paddock */
    int n_clash_days;          /* mob-days the layout (plandays.h) could not keep
                                  off closed days; the caller warns when > 0 */
} om_schedule;

/* Builds the mowing jobs and stays of pl (v from pv_simulate(pb, pl));
 * s may be NULL.  Returns 0, or -1 (out of memory or bad arguments,
 * with *out zeroed). */
int om_build(const plan_problem *pb, const plan *pl, const pv_result *v, const site *s,
             om_schedule *out);

/* Releases what om_build allocated and zeroes *o (NULL is allowed). */
void om_free(om_schedule *o);

/* The iCalendar text of the mowing jobs and of the presence schedule
 * (CRLF lines, RFC 5545), malloc'd (caller frees), or NULL when out of
 * memory.  A list with no entries gives one all-day event saying so over
 * the plan's weeks (RFC 5545 asks for at least one component). */
char *om_mowing_ics(const om_schedule *o);
char *om_presence_ics(const om_schedule *o);

/* Write the lists to PATH atomically.  Return 0, or -1 with one line in
 * err. */
int om_write_mowing_csv(const om_schedule *o, const char *path, rg_err *err);
int om_write_presence_csv(const om_schedule *o, const char *path, rg_err *err);
int om_write_mowing_ics(const om_schedule *o, const char *path, rg_err *err);
int om_write_presence_ics(const om_schedule *o, const char *path, rg_err *err);

#endif
