/* units.h - output units: hectares and kg DM, or acres and lb DM (output stage).
 *
 * Every computation runs in SI units (ha, kg, t, cm); these functions only
 * convert numbers on their way out and name their units, so a table, CSV,
 * JSON or report says which it used.  The conversion factors are exact
 * by definition (NIST Special Publication 811, 2008, Appendix B.8:
 * 1 lb = 0.45359237 kg, 1 in = 2.54 cm, 1 acre (US survey) = 4046.873 m2;
 * we use the international acre of 4046.8564224 m2, B.8 "acre"), and
 * 1 short ton = 2000 lb.
 */
#ifndef UNITS_H
#define UNITS_H

#include "site.h"

#define UN_M2_PER_ACRE 4046.8564224 /* NIST SP 811 (2008) B.8, international acre */
#define UN_KG_PER_LB 0.45359237     /* NIST SP 811 (2008) B.8, exact */
#define UN_CM_PER_IN 2.54           /* NIST SP 811 (2008) B.8, exact */
#define UN_M_PER_FT 0.3048          /* NIST SP 811 (2008) B.8, exact */

/* units is enum site_units (SITE_UNITS_METRIC or SITE_UNITS_US). */
double un_area(int units, double ha);           /* ha -> ha or ac */
double un_cover(int units, double kgdm_ha);     /* kg DM/ha -> kg DM/ha or lb DM/ac */
double un_mass(int units, double t);            /* t DM -> t DM or short tons DM */
double un_height(int units, double cm);         /* cm -> cm or in */
double un_per_area_cost(int units, double per_ha); /* money per ha -> per ha or per ac */
double un_length(int units, double m);          /* m -> m or ft */
double un_weight(int units, double kg);         /* kg -> kg or lb (liveweight, intake) */
double un_depth(int units, double mm);          /* mm -> mm or in (rain) */
double un_temp(int units, double c);            /* deg C -> deg C or deg F */

const char *un_area_name(int units);   /* "ha" or "ac" */
const char *un_cover_name(int units);  /* "kg DM/ha" or "lb DM/ac" */
const char *un_mass_name(int units);   /* "t DM" or "tons DM" (short tons) */
const char *un_height_name(int units); /* "cm" or "in" */
const char *un_length_name(int units); /* "m" or "ft" */
const char *un_weight_name(int units); /* "kg" or "lb" */
const char *un_depth_name(int units);  /* "mm" or "in" */
const char *un_temp_name(int units);   /* "°C" or "°F" (UTF-8) */
/* The same names as CSV/JSON field suffixes: "ha"/"ac", "kgdm_ha"/"lbdm_ac",
 * "t"/"ston", "cm"/"in". */
const char *un_area_key(int units);
const char *un_cover_key(int units);
const char *un_mass_key(int units);
const char *un_height_key(int units);

/* Reads "metric" or "us" into *units; returns 0, or -1 on anything else. */
int un_parse(const char *text, int *units);

#endif
