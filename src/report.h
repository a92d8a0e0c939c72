/* report.h - the grazing-plan report: one self-contained HTML file (output
 * stage).
 *
 * rpt_write() turns what the other stages computed (the site, the strip
 * summary across one tracker row, the paddock growth forecast and a
 * verified planning run) into a document a client can read and keep:
 * inline CSS and inline SVG only, nothing fetched, no executable script,
 * print rules for A4 and Letter.  The plan's numbers are also written in a
 * non-executable JSON block (<script type="application/json"
 * id="rowgraze-plan">) with the field names of `rowgraze plan --format
 * json`, in metric units, so tests can compare the two.  Every number is
 * printed with a fixed format (same input, same bytes); every text from the
 * site file is escaped for HTML.  docs/report.md describes each section.
 */
#ifndef REPORT_H
#define REPORT_H

#include <stdio.h>

#include "forecast.h"
#include "micro.h"
#include "planrun.h"
#include "site.h"

/* What the row cross-section figure draws: the per-strip summary of the
 * plan's season (mc_summarise over the season's hours of every weather
 * year) and each strip's season growth. */
typedef struct rpt_strips {
    int n;                        /* strips across the pitch */
    const mc_strip_summary *rows; /* [n + 1]: the strips, then open ground */
    const double *growth_kgdm_ha; /* [n + 1] season growth, mean over the years */
    double open_rain_mm;          /* open-ground rain over the season, mean over the years */
    double tilt_deg;              /* rotation the panel is drawn at (0 = flat) */
    int n_years;                  /* weather years summarised */
    const char *soil_id, *sward_id; /* of the paddock the growth bars use */
} rpt_strips;

typedef struct rpt_input {
    const site *s;                /* the site (s->plan holds start, weeks, percentile) */
    int units;                    /* enum site_units */
    const rpt_strips *strips;
    const fc_table *fc;           /* the forecast over the plan's weeks */
    const pr_run *run;            /* the verified plan and baseline */
    double time_limit_s, gap_pct; /* the solver settings asked for */
} rpt_input;

/* Writes the whole report to fp.  Returns 0, or -1 when a write failed
 * (ferror(fp)). */
int rpt_write(FILE *fp, const rpt_input *in);

/* Writes text with &, <, >, " and ' escaped as HTML character references
 * (HTML Living Standard, 13.1.4 "Character references"); control
 * characters other than tab and newline become U+FFFD. */
void rpt_escape(FILE *fp, const char *text);

/* Formats x with `decimals` decimals and, when group is 1, a narrow
 * no-break space (U+202F, the SI digit group separator that never breaks a
 * line) every three digits of the whole part; never "-0".
 * Writes into buf (cap bytes) and returns buf; "n/a" when x is not finite. */
char *rpt_num(char *buf, size_t cap, double x, int decimals, int group);

#endif
