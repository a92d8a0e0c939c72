/* sun.c - the sun's position for a site: NREL's Solar Position Algorithm.
 *
 * What it is for: rowgraze needs the sun's topocentric zenith and azimuth
 * every hour of a year to set the trackers and to split light across the
 * strips of a row.  This file turns a date, a time and a site into that.
 *
 * How the pieces fit:
 *   time        sun_julian_day() (eq. 4), sun_delta_t_s() (Espenak & Meeus);
 *   geocentric  geocentric() runs steps 3.1-3.10: the Earth's heliocentric
 *               L, B, R from the periodic terms of Table A4.2 (earth_sum),
 *               nutation from Table A4.3 (nutation), obliquity, aberration,
 *               apparent longitude, sidereal time, right ascension and
 *               declination.  This is where nearly all the time goes
 *               (about 200 cosines and 130 sines and cosines per call).
 *   local       topocentric() runs steps 3.11-3.16 for one site: hour
 *               angle, parallax, elevation, refraction, zenith, azimuth and
 *               incidence.  A few dozen operations.
 *   sun_spa()   = geocentric() + topocentric() for one instant.
 *   sun_series() calls geocentric() once per day, at 0 h TT, and keeps the
 *               values of the day before, the day and the day after; for
 *               each hour it interpolates alpha, delta, R and the nutation
 *               term of the sidereal time (delta psi cos epsilon) with the
 *               three-point formula of the report's eq. A9-A10, computes the
 *               mean sidereal time (eq. 28, a polynomial) exactly, and runs
 *               topocentric().  The interpolation adds at most about
 *               0.00003 deg (tests/test_sun.c holds it to 0.001 deg over a
 *               whole year).  Costs on one 2-core x86-64 machine, -O2: about
 *               4.5 us per position for sun_spa(), 0.5 us for sun_series()
 *               (4-5 ms for a year of hours).
 *
 * References:
 *   Reda, I. & Andreas, A. (2004, revised 2008) Solar Position Algorithm for
 *   Solar Radiation Applications. NREL/TP-560-34302 (Solar Energy
 *   76:577-589).  Tables A4.2 and A4.3 below are transcribed from it; its
 *   worked example (Table A5.1) is reproduced to every printed digit
 *   (tests/test_sun.c), including the partial sums L0-L5, B0-B1 and R0-R4
 *   that check each series of Table A4.2 on its own; the exceptions are H,
 *   2e-6 deg from the printed value, and H', where the table contradicts
 *   its own H and alpha' (see the test).
 *   Espenak, F. & Meeus, J. (2006) Five Millennium Canon of Solar Eclipses,
 *   NASA/TP-2006-214141: polynomial expressions for Delta T.
 *   Morrison, L. & Stephenson, F.R. (2004) J. Hist. Astron. 35:327-336: the
 *   long-term parabola for Delta T.
 *
 * Accuracy reached: the report states +-0.0003 deg for -2000..6000.  Against
 * PyEphem 4.1 (libastro) with refraction off, tests/sweep finds at most
 * 0.00012 deg in zenith and 0.0006 deg in azimuth (the latter with the sun
 * near the zenith) over 4000 sun-up hours of 2025 at three sites.
 *
 * GPL-3.0-or-later.
 */
#include <limits.h>
#include <math.h>
#include <stddef.h>

#include "sun.h"

#define PI 3.14159265358979323846
#define COUNT(a) ((int)(sizeof(a) / sizeof((a)[0])))

/* Radius of the sun's disc, deg, used with the refraction at the horizon to
 * decide when the sun is up (report A.2: 0.26667 + 0.5667 = 0.8333). */
#define SUN_RADIUS_DEG 0.26667

/* ---------------------------------------------------------------------
 * Table A4.2: Earth periodic terms, A (1e-8 rad), B (rad), C (rad per
 * Julian ephemeris millennium).  Two rows per line, row numbers as in the
 * report.
 * ------------------------------------------------------------------- */
typedef struct earth_term {
    double a, b, c;
} earth_term;

static const earth_term L0[] = {
    /*  0 */ {175347046, 0, 0}, {3341656, 4.6692568, 6283.07585},
    /*  2 */ {34894, 4.6261, 12566.1517}, {3497, 2.7441, 5753.3849},
    /*  4 */ {3418, 2.8289, 3.5231}, {3136, 3.6277, 77713.7715},
    /*  6 */ {2676, 4.4181, 7860.4194}, {2343, 6.1352, 3930.2097},
    /*  8 */ {1324, 0.7425, 11506.7698}, {1273, 2.0371, 529.691},
    /* 10 */ {1199, 1.1096, 1577.3435}, {990, 5.233, 5884.927},
    /* 12 */ {902, 2.045, 26.298}, {857, 3.508, 398.149},
    /* 14 */ {780, 1.179, 5223.694}, {753, 2.533, 5507.553},
    /* 16 */ {505, 4.583, 18849.228}, {492, 4.205, 775.523},
    /* 18 */ {357, 2.92, 0.067}, {317, 5.849, 11790.629},
    /* 20 */ {284, 1.899, 796.298}, {271, 0.315, 10977.079},
    /* 22 */ {243, 0.345, 5486.778}, {206, 4.806, 2544.314},
    /* 24 */ {205, 1.869, 5573.143}, {202, 2.458, 6069.777},
    /* 26 */ {156, 0.833, 213.299}, {132, 3.411, 2942.463},
    /* 28 */ {126, 1.083, 20.775}, {115, 0.645, 0.98},
    /* 30 */ {103, 0.636, 4694.003}, {102, 0.976, 15720.839},
    /* 32 */ {102, 4.267, 7.114}, {99, 6.21, 2146.17},
    /* 34 */ {98, 0.68, 155.42}, {86, 5.98, 161000.69},
    /* 36 */ {85, 1.3, 6275.96}, {85, 3.67, 71430.7},
    /* 38 */ {80, 1.81, 17260.15}, {79, 3.04, 12036.46},
    /* 40 */ {75, 1.76, 5088.63}, {74, 3.5, 3154.69},
    /* 42 */ {74, 4.68, 801.82}, {70, 0.83, 9437.76},
    /* 44 */ {62, 3.98, 8827.39}, {61, 1.82, 7084.9},
    /* 46 */ {57, 2.78, 6286.6}, {56, 4.39, 14143.5},
    /* 48 */ {56, 3.47, 6279.55}, {52, 0.19, 12139.55},
    /* 50 */ {52, 1.33, 1748.02}, {51, 0.28, 5856.48},
    /* 52 */ {49, 0.49, 1194.45}, {41, 5.37, 8429.24},
    /* 54 */ {41, 2.4, 19651.05}, {39, 6.17, 10447.39},
    /* 56 */ {37, 6.04, 10213.29}, {37, 2.57, 1059.38},
    /* 58 */ {36, 1.71, 2352.87}, {36, 1.78, 6812.77},
    /* 60 */ {33, 0.59, 17789.85}, {30, 0.44, 83996.85},
    /* 62 */ {30, 2.74, 1349.87}, {25, 3.16, 4690.48},
};

static const earth_term L1[] = {
    /*  0 */ {628331966747, 0, 0}, {206059, 2.678235, 6283.07585},
    /*  2 */ {4303, 2.6351, 12566.1517}, {425, 1.59, 3.523},
    /*  4 */ {119, 5.796, 26.298}, {109, 2.966, 1577.344},
    /*  6 */ {93, 2.59, 18849.23}, {72, 1.14, 529.69},
    /*  8 */ {68, 1.87, 398.15}, {67, 4.41, 5507.55},
    /* 10 */ {59, 2.89, 5223.69}, {56, 2.17, 155.42},
    /* 12 */ {45, 0.4, 796.3}, {36, 0.47, 775.52},
    /* 14 */ {29, 2.65, 7.11}, {21, 5.34, 0.98},
    /* 16 */ {19, 1.85, 5486.78}, {19, 4.97, 213.3},
    /* 18 */ {17, 2.99, 6275.96}, {16, 0.03, 2544.31},
    /* 20 */ {16, 1.43, 2146.17}, {15, 1.21, 10977.08},
    /* 22 */ {12, 2.83, 1748.02}, {12, 3.26, 5088.63},
    /* 24 */ {12, 5.27, 1194.45}, {12, 2.08, 4694},
    /* 26 */ {11, 0.77, 553.57}, {10, 1.3, 6286.6},
    /* 28 */ {10, 4.24, 1349.87}, {9, 2.7, 242.73},
    /* 30 */ {9, 5.64, 951.72}, {8, 5.3, 2352.87},
    /* 32 */ {6, 2.65, 9437.76}, {6, 4.67, 4690.48},
};

static const earth_term L2[] = {
    /*  0 */ {52919, 0, 0}, {8720, 1.0721, 6283.0758},
    /*  2 */ {309, 0.867, 12566.152}, {27, 0.05, 3.52},
    /*  4 */ {16, 5.19, 26.3}, {16, 3.68, 155.42},
    /*  6 */ {10, 0.76, 18849.23}, {9, 2.06, 77713.77},
    /*  8 */ {7, 0.83, 775.52}, {5, 4.66, 1577.34},
    /* 10 */ {4, 1.03, 7.11}, {4, 3.44, 5573.14},
    /* 12 */ {3, 5.14, 796.3}, {3, 6.05, 5507.55},
    /* 14 */ {3, 1.19, 242.73}, {3, 6.12, 529.69},
    /* 16 */ {3, 0.31, 398.15}, {3, 2.28, 553.57},
    /* 18 */ {2, 4.38, 5223.69}, {2, 3.75, 0.98},
};

static const earth_term L3[] = {
    /*  0 */ {289, 5.844, 6283.076}, {35, 0, 0},
    /*  2 */ {17, 5.49, 12566.15}, {3, 5.2, 155.42},
    /*  4 */ {1, 4.72, 3.52}, {1, 5.3, 18849.23},
    /*  6 */ {1, 5.97, 242.73},
};

static const earth_term L4[] = {
    /*  0 */ {114, 3.142, 0}, {8, 4.13, 6283.08},
    /*  2 */ {1, 3.84, 12566.15},
};

static const earth_term L5[] = {
    /*  0 */ {1, 3.14, 0},
};

static const earth_term B0[] = {
    /*  0 */ {280, 3.199, 84334.662}, {102, 5.422, 5507.553},
    /*  2 */ {80, 3.88, 5223.69}, {44, 3.7, 2352.87},
    /*  4 */ {32, 4, 1577.34},
};

static const earth_term B1[] = {
    /*  0 */ {9, 3.9, 5507.55}, {6, 1.73, 5223.69},
};

static const earth_term R0[] = {
    /*  0 */ {100013989, 0, 0}, {1670700, 3.0984635, 6283.07585},
    /*  2 */ {13956, 3.05525, 12566.1517}, {3084, 5.1985, 77713.7715},
    /*  4 */ {1628, 1.1739, 5753.3849}, {1576, 2.8469, 7860.4194},
    /*  6 */ {925, 5.453, 11506.77}, {542, 4.564, 3930.21},
    /*  8 */ {472, 3.661, 5884.927}, {346, 0.964, 5507.553},
    /* 10 */ {329, 5.9, 5223.694}, {307, 0.299, 5573.143},
    /* 12 */ {243, 4.273, 11790.629}, {212, 5.847, 1577.344},
    /* 14 */ {186, 5.022, 10977.079}, {175, 3.012, 18849.228},
    /* 16 */ {110, 5.055, 5486.778}, {98, 0.89, 6069.78},
    /* 18 */ {86, 5.69, 15720.84}, {86, 1.27, 161000.69},
    /* 20 */ {65, 0.27, 17260.15}, {63, 0.92, 529.69},
    /* 22 */ {57, 2.01, 83996.85}, {56, 5.24, 71430.7},
    /* 24 */ {49, 3.25, 2544.31}, {47, 2.58, 775.52},
    /* 26 */ {45, 5.54, 9437.76}, {43, 6.01, 6275.96},
    /* 28 */ {39, 5.36, 4694}, {38, 2.39, 8827.39},
    /* 30 */ {37, 0.83, 19651.05}, {37, 4.9, 12139.55},
    /* 32 */ {36, 1.67, 12036.46}, {35, 1.84, 2942.46},
    /* 34 */ {33, 0.24, 7084.9}, {32, 0.18, 5088.63},
    /* 36 */ {32, 1.78, 398.15}, {28, 1.21, 6286.6},
    /* 38 */ {28, 1.9, 6279.55}, {26, 4.59, 10447.39},
};

static const earth_term R1[] = {
    /*  0 */ {103019, 1.10749, 6283.07585}, {1721, 1.0644, 12566.1517},
    /*  2 */ {702, 3.142, 0}, {32, 1.02, 18849.23},
    /*  4 */ {31, 2.84, 5507.55}, {25, 1.32, 5223.69},
    /*  6 */ {18, 1.42, 1577.34}, {10, 5.91, 10977.08},
    /*  8 */ {9, 1.42, 6275.96}, {9, 0.27, 5486.78},
};

static const earth_term R2[] = {
    /*  0 */ {4359, 5.7846, 6283.0758}, {124, 5.579, 12566.152},
    /*  2 */ {12, 3.14, 0}, {9, 3.63, 77713.77},
    /*  4 */ {6, 1.87, 5573.14}, {3, 5.47, 18849.23},
};

static const earth_term R3[] = {
    /*  0 */ {145, 4.273, 6283.076}, {7, 3.92, 12566.15},
};

static const earth_term R4[] = {
    /*  0 */ {4, 2.56, 6283.08},
};

/* Row counts as printed in Table A4.2 (rows 0..n-1). */
_Static_assert(COUNT(L0) == 64 && COUNT(L1) == 34 && COUNT(L2) == 20 &&
                   COUNT(L3) == 7 && COUNT(L4) == 3 && COUNT(L5) == 1,
               "Table A4.2 L rows");
_Static_assert(COUNT(B0) == 5 && COUNT(B1) == 2, "Table A4.2 B rows");
_Static_assert(COUNT(R0) == 40 && COUNT(R1) == 10 && COUNT(R2) == 6 &&
                   COUNT(R3) == 2 && COUNT(R4) == 1,
               "Table A4.2 R rows");

typedef struct earth_series {
    const earth_term *t;
    int n;
} earth_series;

static const earth_series L_SERIES[] = {
    {L0, COUNT(L0)}, {L1, COUNT(L1)}, {L2, COUNT(L2)},
    {L3, COUNT(L3)}, {L4, COUNT(L4)}, {L5, COUNT(L5)},
};
static const earth_series B_SERIES[] = {{B0, COUNT(B0)}, {B1, COUNT(B1)}};
static const earth_series R_SERIES[] = {
    {R0, COUNT(R0)}, {R1, COUNT(R1)}, {R2, COUNT(R2)},
    {R3, COUNT(R3)}, {R4, COUNT(R4)},
};

/* ---------------------------------------------------------------------
 * Table A4.3: periodic terms for the nutation in longitude and obliquity.
 * Y0..Y4 multiply X0..X4 (eq. 15-19); a, b give delta psi and c, d give
 * delta epsilon in 0.0001 arcsec (eq. 20-21).  Blank cells are 0.
 * ------------------------------------------------------------------- */
typedef struct nutation_term {
    signed char y[5];
    double a, b, c, d;
} nutation_term;

static const nutation_term NUTATION[] = {
    {{0, 0, 0, 0, 1}, -171996, -174.2, 92025, 8.9},
    {{-2, 0, 0, 2, 2}, -13187, -1.6, 5736, -3.1},
    {{0, 0, 0, 2, 2}, -2274, -0.2, 977, -0.5},
    {{0, 0, 0, 0, 2}, 2062, 0.2, -895, 0.5},
    {{0, 1, 0, 0, 0}, 1426, -3.4, 54, -0.1},
    {{0, 0, 1, 0, 0}, 712, 0.1, -7, 0},
    {{-2, 1, 0, 2, 2}, -517, 1.2, 224, -0.6},
    {{0, 0, 0, 2, 1}, -386, -0.4, 200, 0},
    {{0, 0, 1, 2, 2}, -301, 0, 129, -0.1},
    {{-2, -1, 0, 2, 2}, 217, -0.5, -95, 0.3},
    {{-2, 0, 1, 0, 0}, -158, 0, 0, 0},
    {{-2, 0, 0, 2, 1}, 129, 0.1, -70, 0},
    {{0, 0, -1, 2, 2}, 123, 0, -53, 0},
    {{2, 0, 0, 0, 0}, 63, 0, 0, 0},
    {{0, 0, 1, 0, 1}, 63, 0.1, -33, 0},
    {{2, 0, -1, 2, 2}, -59, 0, 26, 0},
    {{0, 0, -1, 0, 1}, -58, -0.1, 32, 0},
    {{0, 0, 1, 2, 1}, -51, 0, 27, 0},
    {{-2, 0, 2, 0, 0}, 48, 0, 0, 0},
    {{0, 0, -2, 2, 1}, 46, 0, -24, 0},
    {{2, 0, 0, 2, 2}, -38, 0, 16, 0},
    {{0, 0, 2, 2, 2}, -31, 0, 13, 0},
    {{0, 0, 2, 0, 0}, 29, 0, 0, 0},
    {{-2, 0, 1, 2, 2}, 29, 0, -12, 0},
    {{0, 0, 0, 2, 0}, 26, 0, 0, 0},
    {{-2, 0, 0, 2, 0}, -22, 0, 0, 0},
    {{0, 0, -1, 2, 1}, 21, 0, -10, 0},
    {{0, 2, 0, 0, 0}, 17, -0.1, 0, 0},
    {{2, 0, -1, 0, 1}, 16, 0, -8, 0},
    {{-2, 2, 0, 2, 2}, -16, 0.1, 7, 0},
    {{0, 1, 0, 0, 1}, -15, 0, 9, 0},
    {{-2, 0, 1, 0, 1}, -13, 0, 7, 0},
    {{0, -1, 0, 0, 1}, -12, 0, 6, 0},
    {{0, 0, 2, -2, 0}, 11, 0, 0, 0},
    {{2, 0, -1, 2, 1}, -10, 0, 5, 0},
    {{2, 0, 1, 2, 2}, -8, 0, 3, 0},
    {{0, 1, 0, 2, 2}, 7, 0, -3, 0},
    {{-2, 1, 1, 0, 0}, -7, 0, 0, 0},
    {{0, -1, 0, 2, 2}, -7, 0, 3, 0},
    {{2, 0, 0, 2, 1}, -7, 0, 3, 0},
    {{2, 0, 1, 0, 0}, 6, 0, 0, 0},
    {{-2, 0, 2, 2, 2}, 6, 0, -3, 0},
    {{-2, 0, 1, 2, 1}, 6, 0, -3, 0},
    {{2, 0, -2, 0, 1}, -6, 0, 3, 0},
    {{2, 0, 0, 0, 1}, -6, 0, 3, 0},
    {{0, -1, 1, 0, 0}, 5, 0, 0, 0},
    {{-2, -1, 0, 2, 1}, -5, 0, 3, 0},
    {{-2, 0, 0, 0, 1}, -5, 0, 3, 0},
    {{0, 0, 2, 2, 1}, -5, 0, 3, 0},
    {{-2, 0, 2, 0, 1}, 4, 0, 0, 0},
    {{-2, 1, 0, 2, 1}, 4, 0, 0, 0},
    {{0, 0, 1, -2, 0}, 4, 0, 0, 0},
    {{-1, 0, 1, 0, 0}, -4, 0, 0, 0},
    {{-2, 1, 0, 0, 0}, -4, 0, 0, 0},
    {{1, 0, 0, 0, 0}, -4, 0, 0, 0},
    {{0, 0, 1, 2, 0}, 3, 0, 0, 0},
    {{0, 0, -2, 2, 2}, -3, 0, 0, 0},
    {{-1, -1, 1, 0, 0}, -3, 0, 0, 0},
    {{0, 1, 1, 0, 0}, -3, 0, 0, 0},
    {{0, -1, 1, 2, 2}, -3, 0, 0, 0},
    {{2, -1, -1, 2, 2}, -3, 0, 0, 0},
    {{0, 0, 3, 2, 2}, -3, 0, 0, 0},
    {{2, -1, 0, 2, 2}, -3, 0, 0, 0},
};

/* Step 3.4.7: "n equals 63 rows in the table". */
_Static_assert(COUNT(NUTATION) == 63, "Table A4.3 rows");

/* ---------------------------------------------------------------------
 * Small helpers.
 * ------------------------------------------------------------------- */
static double rad(double deg) { return deg * (PI / 180.0); }
static double deg(double r) { return r * (180.0 / PI); }

/* Angle reduced to [0, 360) (step 3.2.6). */
static double limit_deg(double x)
{
    double f = fmod(x, 360.0);
    if (f < 0.0)
        f += 360.0;
    if (f >= 360.0) /* -1e-15 + 360 rounds to 360 */
        f = 0.0;
    return f;
}

/* Difference b - a of two angles, reduced to [-180, 180). */
static double diff_deg(double b, double a)
{
    return limit_deg(b - a + 180.0) - 180.0;
}

static int in_range(double x, double lo, double hi)
{
    return x >= lo && x <= hi; /* false for NaN */
}

/* ---------------------------------------------------------------------
 * Time.
 * ------------------------------------------------------------------- */

/* Julian day, Reda & Andreas (2008) eq. 4, with the local-time correction
 * of step 3.1.1 (subtract tz/24).
 * The Gregorian term B is chosen by the calendar date (on or after
 * 15 Oct 1582); the report's "JD > 2299160" test says the same except in
 * the afternoon of 4 Oct 1582. */
static double julian_day_tz(int year, int month, double day, double tz_h)
{
    int gregorian = year > 1582 || (year == 1582 && month > 10) ||
                    (year == 1582 && month == 10 && day >= 15.0);
    double y = year, m = month, b = 0.0;
    if (month < 3) {
        y -= 1.0;
        m += 12.0;
    }
    if (gregorian) {
        double a = trunc(y / 100.0);
        b = 2.0 - a + trunc(a / 4.0);
    }
    return trunc(365.25 * (y + 4716.0)) + trunc(30.6001 * (m + 1.0)) + day +
           b - 1524.5 - tz_h / 24.0;
}

double sun_julian_day(int year, int month, double day)
{
    return julian_day_tz(year, month, day, 0.0);
}

double sun_delta_t_s(double y)
{
    double t, u;
    if (!isfinite(y))
        return (double)NAN;
    /* Espenak & Meeus (2006), "Polynomial expressions for Delta T". */
    if (y >= 1900.0 && y < 1920.0) {
        t = y - 1900.0;
        return -2.79 + t * (1.494119 + t * (-0.0598939 +
                                            t * (0.0061966 - t * 0.000197)));
    }
    if (y >= 1920.0 && y < 1941.0) {
        t = y - 1920.0;
        return 21.20 + t * (0.84493 + t * (-0.076100 + t * 0.0020936));
    }
    if (y >= 1941.0 && y < 1961.0) {
        t = y - 1950.0;
        return 29.07 + t * (0.407 + t * (-1.0 / 233.0 + t / 2547.0));
    }
    if (y >= 1961.0 && y < 1986.0) {
        t = y - 1975.0;
        return 45.45 + t * (1.067 + t * (-1.0 / 260.0 - t / 718.0));
    }
    if (y >= 1986.0 && y < 2005.0) {
        t = y - 2000.0;
        return 63.86 +
               t * (0.3345 +
                    t * (-0.060374 +
                         t * (0.0017275 +
                              t * (0.000651814 + t * 0.00002373599))));
    }
    if (y >= 2005.0 && y < 2050.0) {
        t = y - 2000.0;
        return 62.92 + t * (0.32217 + t * 0.005589);
    }
    u = (y - 1820.0) / 100.0;
    if (y >= 2050.0 && y < 2150.0)
        return -20.0 + 32.0 * u * u - 0.5628 * (2150.0 - y);
    /* Morrison & Stephenson (2004), used by Espenak & Meeus outside. */
    return -20.0 + 32.0 * u * u;
}

/* ---------------------------------------------------------------------
 * Geocentric part, steps 3.2-3.10.
 * ------------------------------------------------------------------- */

/* Reda & Andreas (2008) eq. 9-10: sum of A cos(B + C JME) over one series
 * of Table A4.2. */
static double series_sum(const earth_series *s, double jme)
{
    double sum = 0.0;
    for (int i = 0; i < s->n; i++)
        sum += s->t[i].a * cos(s->t[i].b + s->t[i].c * jme);
    return sum;
}

/* Reda & Andreas (2008) eq. 11 (and steps 3.2.7-3.2.8 for B and R): the n
 * series sums, stored in
 * sums[], weighted by powers of JME and divided by 1e8; radians for L and
 * B, AU for R.  Evaluated in Horner form. */
static double earth_sum(const earth_series *s, int n, double jme,
                        double *sums)
{
    double v = 0.0;
    for (int i = n - 1; i >= 0; i--) {
        sums[i] = series_sum(&s[i], jme);
        v = v * jme + sums[i];
    }
    return v / 1.0e8;
}

/* Reda & Andreas (2008) steps 3.4.1-3.4.8, eq. 15-23: nutation in
 * longitude and obliquity, deg. */
static void nutation(double jce, double *dpsi_deg, double *deps_deg)
{
    double jce2 = jce * jce, jce3 = jce2 * jce;
    double x[5], sum_psi = 0.0, sum_eps = 0.0;
    x[0] = 297.85036 + 445267.111480 * jce - 0.0019142 * jce2 +
           jce3 / 189474.0;                                   /* eq. 15 */
    x[1] = 357.52772 + 35999.050340 * jce - 0.0001603 * jce2 -
           jce3 / 300000.0;                                   /* eq. 16 */
    x[2] = 134.96298 + 477198.867398 * jce + 0.0086972 * jce2 +
           jce3 / 56250.0;                                    /* eq. 17 */
    x[3] = 93.27191 + 483202.017538 * jce - 0.0036825 * jce2 +
           jce3 / 327270.0;                                   /* eq. 18 */
    x[4] = 125.04452 - 1934.136261 * jce + 0.0020708 * jce2 +
           jce3 / 450000.0;                                   /* eq. 19 */
    for (int i = 0; i < COUNT(NUTATION); i++) {
        const nutation_term *t = &NUTATION[i];
        double arg = 0.0;
        for (int j = 0; j < 5; j++)
            arg += x[j] * t->y[j];
        arg = rad(arg);
        sum_psi += (t->a + t->b * jce) * sin(arg);            /* eq. 20 */
        sum_eps += (t->c + t->d * jce) * cos(arg);            /* eq. 21 */
    }
    *dpsi_deg = sum_psi / 36000000.0;                         /* eq. 22 */
    *deps_deg = sum_eps / 36000000.0;                         /* eq. 23 */
}

/* Reda & Andreas (2008) eq. 24: mean obliquity of the ecliptic, arcsec,
 * with U = JME / 10. */
static double mean_obliquity_arcsec(double jme)
{
    static const double c[] = {84381.448, -4680.93, -1.55, 1999.25, -51.38,
                               -249.67,   -39.05,   7.12,  27.87,   5.79,
                               2.45};
    double u = jme / 10.0, v = 0.0;
    for (int i = COUNT(c) - 1; i >= 0; i--)
        v = v * u + c[i];
    return v;
}

/* Reda & Andreas (2008) eq. 28: mean sidereal time at Greenwich, deg,
 * [0, 360). */
static double mean_sidereal_deg(double jd)
{
    double jc = (jd - 2451545.0) / 36525.0;                   /* eq. 6 */
    return limit_deg(280.46061837 + 360.98564736629 * (jd - 2451545.0) +
                     jc * jc * (0.000387933 - jc / 38710000.0));
}

/* Reda & Andreas (2008) steps 3.1.2-3.10, eq. 5-31, for Julian day jd (UT)
 * and Delta T delta_t_s. */
static void geocentric(double jd, double delta_t_s, sun_geocentric *g)
{
    double jde = jd + delta_t_s / 86400.0;                    /* eq. 5 */
    double jce = (jde - 2451545.0) / 36525.0;                 /* eq. 7 */
    double jme = jce / 10.0;                                  /* eq. 8 */
    double dpsi, deps, eps, lam, beta, dtau;

    g->jd = jd;
    g->jde = jde;
    g->helio_lon_deg = limit_deg(deg(earth_sum(L_SERIES, 6, jme, g->l_sum)));
    g->helio_lat_deg = deg(earth_sum(B_SERIES, 2, jme, g->b_sum));
    g->radius_au = earth_sum(R_SERIES, 5, jme, g->r_sum);
    g->geo_lon_deg = limit_deg(g->helio_lon_deg + 180.0);    /* eq. 13 */
    g->geo_lat_deg = -g->helio_lat_deg;                       /* eq. 14 */

    nutation(jce, &dpsi, &deps);
    g->nutation_lon_deg = dpsi;
    g->nutation_obl_deg = deps;
    eps = mean_obliquity_arcsec(jme) / 3600.0 + deps;         /* eq. 25 */
    g->obliquity_deg = eps;

    dtau = -20.4898 / (3600.0 * g->radius_au);                /* eq. 26 */
    g->apparent_lon_deg = limit_deg(g->geo_lon_deg + dpsi + dtau); /* 27 */
    g->sidereal_deg = limit_deg(mean_sidereal_deg(jd) +
                                dpsi * cos(rad(eps)));        /* eq. 29 */

    lam = rad(g->apparent_lon_deg);
    beta = rad(g->geo_lat_deg);
    eps = rad(eps);
    g->right_ascension_deg = limit_deg(deg(atan2(
        sin(lam) * cos(eps) - tan(beta) * sin(eps), cos(lam)))); /* eq. 30 */
    g->declination_deg = deg(asin(sin(beta) * cos(eps) +
                                  cos(beta) * sin(eps) * sin(lam))); /* 31 */
}

int sun_geocentric_at(double jd, double delta_t_s, sun_geocentric *out)
{
    if (out == NULL || !isfinite(jd) || !isfinite(delta_t_s))
        return -1;
    geocentric(jd, delta_t_s, out);
    return 0;
}

/* ---------------------------------------------------------------------
 * Local part, steps 3.11-3.16.
 * ------------------------------------------------------------------- */

/* What topocentric() needs about a site, worked out once per site. */
struct local_site {
    const sun_site *s;
    double sin_lat, cos_lat;
    double x, y;          /* rho cos phi', rho sin phi' (eq. 34-36) */
    double refr_scale;    /* (P / 1010) (283 / (273 + T)) of eq. 42 */
    double up_limit_deg;  /* refraction applies when e0 >= this */
    double sin_slope, cos_slope;
};

static void local_init(const sun_site *s, struct local_site *l)
{
    double lat = rad(s->latitude_deg);
    double u = atan(0.99664719 * tan(lat));                   /* eq. 34 */
    double e = s->elevation_m / 6378140.0;
    l->s = s;
    l->sin_lat = sin(lat);
    l->cos_lat = cos(lat);
    l->x = cos(u) + e * l->cos_lat;                           /* eq. 35 */
    l->y = 0.99664719 * sin(u) + e * l->sin_lat;              /* eq. 36 */
    l->refr_scale = s->pressure_hpa > 0.0
                        ? (s->pressure_hpa / 1010.0) *
                              (283.0 / (273.0 + s->temperature_c))
                        : 0.0;
    l->up_limit_deg = -(SUN_RADIUS_DEG + s->atmos_refract_deg);
    l->sin_slope = sin(rad(s->slope_deg));
    l->cos_slope = cos(rad(s->slope_deg));
}

/* Reda & Andreas (2008) eq. 42: refraction correction, deg, for a
 * topocentric elevation e0 (deg) without refraction.  The report sets it to
 * 0 "when the sun is below the horizon"; the sun counts as up while its
 * upper limb, lifted by the refraction at the horizon, is above it (report
 * A.2: e0 >= -(0.26667 + atmos_refract_deg)).  Zero when the pressure is
 * <= 0. */
static double refraction_deg(const struct local_site *l, double e0)
{
    if (l->refr_scale <= 0.0 || e0 < l->up_limit_deg)
        return 0.0;
    return l->refr_scale * 1.02 /
           (60.0 * tan(rad(e0 + 10.3 / (e0 + 5.11))));
}

/* Reda & Andreas (2008) steps 3.11-3.16, eq. 32-47, for geocentric alpha,
 * delta (deg), apparent sidereal time nu (deg) and radius vector r_au. */
static void topocentric(const struct local_site *l, double alpha_deg,
                        double delta_deg, double nu_deg, double r_au,
                        sun_position *p)
{
    const sun_site *s = l->s;
    double h = rad(limit_deg(nu_deg + s->longitude_deg - alpha_deg)); /* 32 */
    double xi = rad(8.794 / (3600.0 * r_au));                 /* eq. 33 */
    double delta = rad(delta_deg);
    double sin_xi = sin(xi), cos_delta = cos(delta);
    double den = cos_delta - l->x * sin_xi * cos(h);
    double dalpha = atan2(-l->x * sin_xi * sin(h), den);      /* eq. 37 */
    double delta_p = atan2((sin(delta) - l->y * sin_xi) * cos(dalpha),
                           den);                              /* eq. 39 */
    double h_p = h - dalpha;                                  /* eq. 40 */
    double sin_hp = sin(h_p), cos_hp = cos(h_p);
    double e0 = deg(asin(l->sin_lat * sin(delta_p) +
                         l->cos_lat * cos(delta_p) * cos_hp)); /* eq. 41 */
    double e = e0 + refraction_deg(l, e0);                    /* eq. 43 */
    double zen = 90.0 - e;                                    /* eq. 44 */
    double gamma = limit_deg(deg(atan2(
        sin_hp, cos_hp * l->sin_lat - tan(delta_p) * l->cos_lat))); /* 45 */
    double zr = rad(zen), cos_i;
    double hour = limit_deg(deg(h_p));

    /* Eq. 47; rounding can push the cosine a hair past +-1. */
    cos_i = cos(zr) * l->cos_slope +
            l->sin_slope * sin(zr) * cos(rad(gamma - s->azm_rotation_deg));
    cos_i = cos_i > 1.0 ? 1.0 : (cos_i < -1.0 ? -1.0 : cos_i);

    p->zenith_deg = zen;
    p->zenith_norefr_deg = 90.0 - e0;
    p->azimuth_deg = limit_deg(gamma + 180.0);                /* eq. 46 */
    p->incidence_deg = deg(acos(cos_i));
    p->declination_deg = deg(delta_p);
    p->hour_angle_deg = hour > 180.0 ? hour - 360.0 : hour;
}

/* ---------------------------------------------------------------------
 * Input checks.
 * ------------------------------------------------------------------- */

static int days_in_month(int year, int month)
{
    static const int days[12] = {31, 28, 31, 30, 31, 30,
                                 31, 31, 30, 31, 30, 31};
    int leap = year > 1582 ? (year % 4 == 0 && (year % 100 != 0 ||
                                                year % 400 == 0))
                           : year % 4 == 0; /* Julian calendar */
    return days[month - 1] + (month == 2 && leap);
}

static int valid_date(int year, int month, int day)
{
    if (year < -2000 || year > 6000 || month < 1 || month > 12)
        return 0;
    if (day < 1 || day > days_in_month(year, month))
        return 0;
    /* 5-14 Oct 1582 do not exist: the Gregorian reform skipped them. */
    return !(year == 1582 && month == 10 && day > 4 && day < 15);
}

/* The ranges listed in sun.h.  The years -2000..6000 and |delta UT1| < 1 s
 * are the report's (abstract; text of eq. 3); latitude and longitude are
 * the angles' own ranges; the others are common practice, no source, kept
 * where the equations stay sound: eq. 42 needs 273 + T > 0, and keeps its
 * tangent inside (0, 90) deg only while atmos_refract_deg is small. */
static int valid_site(const sun_site *s)
{
    return s != NULL && in_range(s->latitude_deg, -90.0, 90.0) &&
           in_range(s->longitude_deg, -180.0, 180.0) &&
           in_range(s->elevation_m, -1000.0, 10000.0) &&
           in_range(s->pressure_hpa, -HUGE_VAL, 2000.0) &&
           in_range(s->temperature_c, -100.0, 100.0) &&
           in_range(s->slope_deg, -360.0, 360.0) &&
           in_range(s->azm_rotation_deg, -360.0, 360.0) &&
           in_range(s->atmos_refract_deg, 0.0, 2.0) &&
           s->delta_ut1_s > -1.0 && s->delta_ut1_s < 1.0 &&
           in_range(s->delta_t_s, -86400.0, 86400.0);
}

/* ---------------------------------------------------------------------
 * Public entry points.
 * ------------------------------------------------------------------- */

int sun_spa(const sun_input *in, sun_position *out)
{
    sun_geocentric g;
    struct local_site l;
    double day, jd;

    if (in == NULL || out == NULL || !valid_site(&in->site) ||
        !valid_date(in->year, in->month, in->day) || in->hour < 0 ||
        in->hour > 23 || in->minute < 0 || in->minute > 59 ||
        !in_range(in->second, 0.0, 60.0) ||
        !in_range(in->timezone_h, -18.0, 18.0))
        return -1;

    /* Step 3.1.1: D carries the time; UT = UTC + delta UT1 (eq. 3). */
    day = in->day + (in->hour + (in->minute + (in->second +
                                               in->site.delta_ut1_s) /
                                                  60.0) /
                                    60.0) /
                        24.0;
    jd = julian_day_tz(in->year, in->month, day, in->timezone_h);
    geocentric(jd, in->site.delta_t_s, &g);
    local_init(&in->site, &l);
    topocentric(&l, g.right_ascension_deg, g.declination_deg, g.sidereal_deg,
                g.radius_au, out);
    out->jd = jd;
    return 0;
}

/* What sun_series() keeps of one day at 0 h TT. */
typedef struct day_values {
    double alpha_deg, delta_deg, r_au, eqeq_deg;
} day_values;

static void day_at(long day_index, double delta_t_s, day_values *v)
{
    sun_geocentric g;
    double jde = (double)day_index + 0.5; /* 0 h TT */
    geocentric(jde - delta_t_s / 86400.0, delta_t_s, &g);
    v->alpha_deg = g.right_ascension_deg;
    v->delta_deg = g.declination_deg;
    v->r_au = g.radius_au;
    v->eqeq_deg = g.nutation_lon_deg * cos(rad(g.obliquity_deg)); /* 29 */
}

/* Reda & Andreas (2008) eq. A9-A10: value at fraction n of the day from the
 * values of the day before (m), the day (z) and the day after (p). */
static double interp3(double m, double z, double p, double n)
{
    double a = z - m, b = p - z, c = b - a;
    return z + n * (a + b + c * n) / 2.0;
}

int sun_series(const sun_site *site, int year, int month, int day, int hour0,
               double minute_offset, int n_hours, double timezone_h,
               sun_position *out)
{
    return sun_series_from(site, year, month, day, hour0, minute_offset, 0,
                           n_hours, timezone_h, out);
}

int sun_series_from(const sun_site *site, int year, int month, int day,
                    int hour0, double minute_offset, int first, int n_hours,
                    double timezone_h, sun_position *out)
{
    struct local_site l;
    day_values w[3];
    long cur = 0;
    int have = 0;
    double jd0, dt;

    if (!valid_site(site) || !valid_date(year, month, day) || hour0 < 0 ||
        hour0 > 23 || !(minute_offset >= 0.0 && minute_offset < 60.0) ||
        !in_range(timezone_h, -18.0, 18.0) || n_hours < 0 || first < 0 ||
        n_hours > INT_MAX - first || (out == NULL && n_hours > 0))
        return -1;
    jd0 = julian_day_tz(year, month,
                        day + (hour0 + (minute_offset +
                                        site->delta_ut1_s / 60.0) /
                                           60.0) /
                                  24.0,
                        timezone_h);
    if (n_hours > 0 && jd0 + (first + n_hours - 1) / 24.0 >=
                           julian_day_tz(6001, 1, 1.0, timezone_h))
        return -1;

    dt = site->delta_t_s;
    local_init(site, &l);
    for (int k = first; k < first + n_hours; k++) {
        double jd = jd0 + k / 24.0;
        double jde = jd + dt / 86400.0;
        long d = (long)floor(jde - 0.5);
        double n = jde - ((double)d + 0.5);
        double alpha, delta, r, nu;

        if (!have || d != cur) {
            if (have && d == cur + 1) {
                w[0] = w[1];
                w[1] = w[2];
                day_at(d + 1, dt, &w[2]);
            } else {
                day_at(d - 1, dt, &w[0]);
                day_at(d, dt, &w[1]);
                day_at(d + 1, dt, &w[2]);
            }
            cur = d;
            have = 1;
        }
        /* Right ascension wraps at 360: interpolate the unwrapped values. */
        alpha = limit_deg(interp3(
            w[1].alpha_deg + diff_deg(w[0].alpha_deg, w[1].alpha_deg),
            w[1].alpha_deg,
            w[1].alpha_deg + diff_deg(w[2].alpha_deg, w[1].alpha_deg), n));
        delta = interp3(w[0].delta_deg, w[1].delta_deg, w[2].delta_deg, n);
        r = interp3(w[0].r_au, w[1].r_au, w[2].r_au, n);
        nu = mean_sidereal_deg(jd) +
             interp3(w[0].eqeq_deg, w[1].eqeq_deg, w[2].eqeq_deg, n);
        topocentric(&l, alpha, delta, nu, r, &out[k - first]);
        out[k - first].jd = jd;
    }
    return 0;
}
