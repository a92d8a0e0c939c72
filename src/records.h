/* records.h - pasture walk, grazing and maintenance records (input stage).
 *
 * Three CSV files a farm keeps between plans (docs/records.md):
 *   walk records    paddock,date,height_cm,cover_kgdm_ha,method[,note]
 *   grazing records mob,paddock,from,to
 *   maintenance     paddock,from,to,reason[,keep_off_days]
 * Each is read whole with libcsv, checked against the site (ids, dates, the
 * plan start, plausible ranges) and kept in file order.  A problem stops
 * the read with one line "FILE:LINE:COL: expected ..., found ..." in the
 * rg_err and -1 (the command exits 2).  Walk heights become cover on
 * reading: sward-stick and visual heights by the paddock's sward
 * height-mass relation (sward.h), rising-plate heights by a linear plate
 * equation whose coefficients a farm may override.  The query helpers give
 * the planner each paddock's latest measurement, its last grazing day and
 * the grazing days per mob over a span; the writers put walk and grazing
 * records back as CSV (atomically, textfile.h) so that parse -> write ->
 * parse gives the same records.
 */
#ifndef RECORDS_H
#define RECORDS_H

#include <stddef.h>
#include <stdint.h>

#include "diag.h"
#include "site.h"

#define REC_NOTE_LEN 160    /* walk note, bytes with the NUL */
#define REC_REASON_LEN 80   /* maintenance reason, bytes with the NUL */

/* Plausible ranges of a walk record (common practice, no source): they
 * catch unit and typing mistakes, not unusual swards. */
#define REC_HEIGHT_MAX_CM 100.0
#define REC_COVER_MAX_KGDM_HA 15000.0
#define REC_KEEP_OFF_MAX_DAYS 365

enum rec_method { REC_STICK, REC_PLATE, REC_VISUAL, REC_NMETHODS };

/* Rising plate meter: cover = a x compressed height + b. */
typedef struct rec_plate {
    double kgdm_ha_per_cm;  /* a, kg DM/ha per cm of compressed height */
    double base_kgdm_ha;    /* b, kg DM/ha at zero plate height */
} rec_plate;

/* The default plate equation, cover = 125 x height (cm) + 640 (source in
 * records.c and docs/records.md). */
rec_plate rec_plate_default(void);

/* The site's plate equation ($.plate_meter) when it gives one, else the
 * default. */
rec_plate rec_plate_of(const site *s);

/* Cover (kg DM/ha) from a mean compressed plate height (cm). */
double rec_plate_cover_kgdm_ha(const rec_plate *p, double plate_height_cm);

/* The method's word in the CSV ("stick", "plate", "visual"). */
const char *rec_method_name(int method);

/* ---- pasture walk records ---------------------------------------------- */

typedef struct rec_walk {
    int paddock;            /* index into site.paddocks */
    int64_t day;            /* day number (tcal.h) of the walk */
    int method;             /* enum rec_method */
    double height_cm;       /* as measured, or NAN when cover was given */
    double cover_kgdm_ha;   /* as given, or converted from height_cm */
    char note[REC_NOTE_LEN];
    int line;               /* line in the file it came from */
} rec_walk;

typedef struct rec_walks {
    int n;
    rec_walk *w;            /* in file order */
    rec_plate plate;        /* the plate equation used */
} rec_walks;

/* Reads walk records from text (name is used in messages).  plate may be
 * NULL for rec_plate_default(); dates after start_day are refused.
 * Returns 0, or -1 with one message line (out is then empty). */
int rec_walk_parse(const site *s, const rec_plate *plate, int64_t start_day,
                   const char *name, const char *text, size_t len,
                   rec_walks *out, rg_err *err);

/* The same from a file. */
int rec_walk_load(const site *s, const rec_plate *plate, int64_t start_day,
                  const char *path, rec_walks *out, rg_err *err);

/* Writes the records as CSV (header, file order, values as given). */
int rec_walk_write(const site *s, const rec_walks *w, const char *path,
                   rg_err *err);

/* The latest record of paddock p on or before day, or NULL. */
const rec_walk *rec_walk_latest(const rec_walks *w, int paddock, int64_t day);

void rec_walk_free(rec_walks *w);

/* ---- grazing records ---------------------------------------------------- */

typedef struct rec_graze {
    int mob;                /* index into site.mobs */
    int paddock;            /* index into site.paddocks */
    int64_t from_day, to_day; /* inclusive */
    int line;
} rec_graze;

typedef struct rec_grazes {
    int n;
    rec_graze *g;           /* in file order */
} rec_grazes;

/* Reads grazing records; every record must end before start_day and no
 * two records of one mob may share a day.  Returns 0 or -1. */
int rec_graze_parse(const site *s, int64_t start_day, const char *name,
                    const char *text, size_t len, rec_grazes *out, rg_err *err);

int rec_graze_load(const site *s, int64_t start_day, const char *path,
                   rec_grazes *out, rg_err *err);

int rec_graze_write(const site *s, const rec_grazes *g, const char *path,
                    rg_err *err);

/* The last day before `day` on which any mob grazed paddock p, or
 * INT64_MIN when none did. */
int64_t rec_graze_last_day(const rec_grazes *g, int paddock, int64_t day);

/* Days of [from_day, to_day] that each mob spent on paddock p, into
 * days_per_mob[0..n_mobs-1].  Returns the mob-days in total. */
int rec_graze_days(const rec_grazes *g, int paddock, int64_t from_day,
                   int64_t to_day, int n_mobs, int *days_per_mob);

/* Dry matter the mobs of s ate on paddock p over [from_day, to_day], kg DM
 * (days x head x intake_kgdm_d per mob). */
double rec_graze_intake_kgdm(const site *s, const rec_grazes *g, int paddock,
                             int64_t from_day, int64_t to_day);

void rec_graze_free(rec_grazes *g);

/* ---- maintenance windows ------------------------------------------------ */

typedef struct rec_maint {
    int paddock;            /* index into site.paddocks */
    int64_t from_day, to_day; /* the work itself, inclusive */
    int keep_off_days;      /* stock stay out this many days after to_day */
    char reason[REC_REASON_LEN];
    int line;               /* CSV line: rows of one line came from one name */
} rec_maint;

typedef struct rec_maints {
    int n;
    rec_maint *m;           /* file order; a block expands in paddock order */
} rec_maints;

/* Reads maintenance windows; a name is a paddock id or a block (all its
 * paddocks).  Returns 0 or -1. */
int rec_maint_parse(const site *s, const char *name, const char *text,
                    size_t len, rec_maints *out, rg_err *err);

int rec_maint_load(const site *s, const char *path, rec_maints *out,
                   rg_err *err);

/* Appends one site_window per CSV line to s->windows: its paddocks, from
 * from_day to to_day with keep_off_days (stock stay out for the work and
 * the keep-off after it), and the reason (with the keep-off noted).  site_free() frees
 * them with the rest.  Returns 0, or -1 when out of memory (s unchanged). */
int rec_maint_merge(const rec_maints *m, site *s, rg_err *err);

void rec_maint_free(rec_maints *m);

#endif
