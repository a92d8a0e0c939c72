/* sun.h - where the sun is, seen from a site: NREL's Solar Position
 * Algorithm (SPA).
 *
 * The whole interface of sun.c.  sun_spa() computes one position from a
 * local standard date and time; sun_series() computes n consecutive hourly
 * positions far faster by doing the expensive geocentric part once per day
 * and interpolating it (see sun.c for the method and its accuracy).
 * sun_geocentric_at() exposes the geocentric intermediate values of the
 * paper so that they can be checked against its worked example, and
 * sun_julian_day() / sun_delta_t_s() are the time helpers both use.
 *
 * Conventions:
 *   longitude_deg  east positive; latitude_deg north positive (geodetic);
 *   azimuth_deg    clockwise from north (eastward, 90 = east), [0, 360);
 *   zenith_deg     from the vertical, 0..180;
 *   timezone_h     hours east of Greenwich of the local standard time
 *                  (e.g. -7 for a site on UTC-7); local time = UT + timezone_h.
 *
 * Reference: Reda, I. & Andreas, A. (2004, revised 2008) Solar Position
 * Algorithm for Solar Radiation Applications. NREL/TP-560-34302; also
 * Solar Energy 76:577-589.  Equation numbers below are the report's.
 *
 * GPL-3.0-or-later.
 */
#ifndef SUN_H
#define SUN_H

/* Everything about a site that stays fixed from one instant to the next.
 * The valid ranges are checked by sun_spa() and sun_series(). */
typedef struct sun_site {
    double latitude_deg;      /* [-90, 90], north positive */
    double longitude_deg;     /* [-180, 180], east positive */
    double elevation_m;       /* above sea level, [-1000, 10000] */
    double pressure_hpa;      /* annual mean local pressure, <= 2000;
                                 <= 0 turns refraction off (geometric
                                 zenith), otherwise eq. 42 uses it */
    double temperature_c;     /* annual mean local temperature, [-100, 100] */
    double slope_deg;         /* surface tilt from horizontal, [-360, 360] */
    double azm_rotation_deg;  /* surface azimuth rotation from south, west
                                 positive (eq. 47's gamma), [-360, 360] */
    double atmos_refract_deg; /* refraction at sunrise/sunset, 0.5667
                                 typical (report A.2), [0, 2] */
    double delta_ut1_s;       /* UT1 - UTC (eq. 3), (-1, 1) */
    double delta_t_s;         /* TT - UT1 (eq. 2), [-86400, 86400]; use
                                 sun_delta_t_s() when none is known */
} sun_site;

/* One instant in local standard time, and the site. */
typedef struct sun_input {
    int year;                 /* [-2000, 6000], the report's stated range */
    int month;                /* [1, 12] */
    int day;                  /* [1, days in that month]; Julian calendar
                                 before 15 Oct 1582, Gregorian after */
    int hour;                 /* [0, 23] */
    int minute;               /* [0, 59] */
    double second;            /* [0, 60] */
    double timezone_h;        /* [-18, 18] */
    sun_site site;
} sun_input;

/* The sun at one instant. */
typedef struct sun_position {
    double jd;                /* Julian day, UT (eq. 4) */
    double zenith_deg;        /* topocentric, with refraction (eq. 44) */
    double azimuth_deg;       /* topocentric, eastward from north (eq. 46) */
    double zenith_norefr_deg; /* topocentric, without refraction (90 - e0) */
    double incidence_deg;     /* on the site's surface (eq. 47), 0..180 */
    double declination_deg;   /* topocentric delta' (eq. 39) */
    double hour_angle_deg;    /* topocentric H' (eq. 40), westward from the
                                 meridian, in (-180, 180]: negative in the
                                 morning, 0 at transit */
} sun_position;

/* The geocentric values of the report's steps 3.1-3.10 at one instant. */
typedef struct sun_geocentric {
    double jd;                /* Julian day, UT */
    double jde;               /* Julian ephemeris day, TT (eq. 5) */
    double l_sum[6];          /* L0..L5 (eq. 10), 1e-8 rad */
    double b_sum[2];          /* B0, B1, 1e-8 rad */
    double r_sum[5];          /* R0..R4, 1e-8 AU */
    double helio_lon_deg;     /* L, [0, 360) (eq. 11-12) */
    double helio_lat_deg;     /* B (step 3.2.7) */
    double radius_au;         /* R (step 3.2.8) */
    double geo_lon_deg;       /* Theta, [0, 360) (eq. 13) */
    double geo_lat_deg;       /* beta (eq. 14) */
    double nutation_lon_deg;  /* delta psi (eq. 22) */
    double nutation_obl_deg;  /* delta epsilon (eq. 23) */
    double obliquity_deg;     /* epsilon, true obliquity (eq. 25) */
    double apparent_lon_deg;  /* lambda, [0, 360) (eq. 27) */
    double sidereal_deg;      /* nu, apparent sidereal time at Greenwich,
                                 [0, 360) (eq. 29) */
    double right_ascension_deg; /* alpha, [0, 360) (eq. 30) */
    double declination_deg;   /* delta (eq. 31) */
} sun_geocentric;

/* Julian day (eq. 4) of a calendar date; day carries the time of day as a
 * fraction (2.5 = the 2nd at 12:00) and is in the time scale wanted (UT for
 * JD).  The Julian calendar is used up to 4 Oct 1582, the Gregorian after.
 * No range check: the formula holds for any year after -4716. */
double sun_julian_day(int year, int month, double day);

/* Delta T = TT - UT in seconds for a decimal year (year + (month - 0.5) / 12
 * for mid-month), from the polynomial expressions of Espenak & Meeus (2006)
 * for 1900-2150 and the long-term parabola of Morrison & Stephenson (2004)
 * outside them (before 1900 that parabola is some seconds off; the pieces
 * for earlier years are not carried).  Good to about 2 s over 1950-2025,
 * which moves the sun by well under 0.001 deg.  Returns NaN for a
 * non-finite year. */
double sun_delta_t_s(double decimal_year);

/* Geocentric sun (steps 3.1-3.10) at Julian day jd (UT) with Delta T
 * delta_t_s.  Fills *out and returns 0; returns -1 and leaves *out alone if
 * out is NULL or either number is not finite. */
int sun_geocentric_at(double jd, double delta_t_s, sun_geocentric *out);

/* Full SPA for one instant: fills *out and returns 0.  Returns -1, leaving
 * *out untouched, if in or out is NULL or any field of *in lies outside the
 * range documented above (this includes NaN and infinities and dates such
 * as 30 February). */
int sun_spa(const sun_input *in, sun_position *out);

/* n_hours positions one hour apart, the first at local standard time
 * year-month-day hour0:00 plus minute_offset minutes (e.g. 30 for the
 * middle of each hour), in zone timezone_h; out[k] is hour0 + k.  Days,
 * months and years roll over as the hours run on.  Each result agrees with
 * sun_spa() for the same instant within 0.001 deg (see sun.c).  Returns 0,
 * or -1 with out untouched if site fails sun_spa()'s checks, the start date
 * or timezone is invalid, hour0 is outside [0, 23], minute_offset outside
 * [0, 60), n_hours < 0, out is NULL while n_hours > 0, or the last hour
 * falls after the year 6000.  n_hours == 0 returns 0 and writes nothing. */
int sun_series(const sun_site *site, int year, int month, int day, int hour0,
               double minute_offset, int n_hours, double timezone_h,
               sun_position *out);

/* Hours first .. first + n_hours - 1 of the series sun_series() would give
 * from the same start, into out[0 .. n_hours - 1]: the same numbers to the
 * bit, so a long series can be made in pieces without holding it whole.
 * Same checks, and -1 as well for first < 0. */
int sun_series_from(const sun_site *site, int year, int month, int day,
                    int hour0, double minute_offset, int first, int n_hours,
                    double timezone_h, sun_position *out);

#endif
