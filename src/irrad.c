/* irrad.c - sunlight above the rows, from a weather file's global
 * horizontal irradiance.
 *
 * How the pieces fit: irr_extra_normal_w_m2 gives the sunlight at the top
 * of the atmosphere for the day; irr_split compares the measured global
 * horizontal irradiance with it (the clearness index kt), asks
 * irr_erbs_kd what share of it is diffuse, and gives the beam and diffuse
 * parts that the per-strip light model needs; irr_par_w_m2 and
 * irr_par_umol turn shortwave into the photosynthetically active part used
 * by growth.
 *
 * References:
 *   Spencer, J.W. (1971) Fourier series representation of the position of
 *     the sun. Search 2(5):172; as given by Iqbal, M. (1983) An Introduction
 *     to Solar Radiation, eq. 1.2.1, and by Duffie, J.A. & Beckman, W.A.
 *     (2013) Solar Engineering of Thermal Processes, 4th ed., eq. 1.4.1b.
 *   Erbs, D.G., Klein, S.A. & Duffie, J.A. (1982) Estimation of the diffuse
 *     radiation fraction for hourly, daily and monthly-average global
 *     radiation. Solar Energy 28(4):293-302.
 *   Kopp & Lean (2011), Szeicz (1974), McCree (1972): constants in irrad.h.
 */
#include "irrad.h"

#include <math.h>
#include <stddef.h>

#define IRR_PI 3.14159265358979323846
/* NAN is a float; the cast keeps -Wdouble-promotion quiet. */
#define IRR_NAN ((double)NAN)

/* Spencer (1971) Earth-Sun distance factor (r0/r)^2, as Duffie & Beckman
 * (2013) eq. 1.4.1b with day angle B = 2 pi (n - 1) / 365 (their eq. 1.4.2):
 *   1.000110 + 0.034221 cos B + 0.001280 sin B
 *            + 0.000719 cos 2B + 0.000077 sin 2B. */
double irr_extra_normal_w_m2(int day_of_year)
{
    double b;

    if (day_of_year < 1 || day_of_year > 366)
        return IRR_NAN;
    b = 2.0 * IRR_PI * (day_of_year - 1) / 365.0;
    return IRR_SOLAR_CONSTANT_W_M2 *
           (1.000110 + 0.034221 * cos(b) + 0.001280 * sin(b) +
            0.000719 * cos(2.0 * b) + 0.000077 * sin(2.0 * b));
}

/* Erbs, Klein & Duffie (1982), hourly correlation (their eq. 1):
 *   Kd = 1 - 0.09 kt                                     kt <= 0.22
 *   Kd = 0.9511 - 0.1604 kt + 4.388 kt^2 - 16.638 kt^3 + 12.336 kt^4
 *                                                 0.22 < kt <= 0.80
 *   Kd = 0.165                                           kt >  0.80
 * (equation number from memory). */
double irr_erbs_kd(double kt)
{
    if (isnan(kt))
        return IRR_NAN;
    if (kt < 0.0)
        kt = 0.0;
    if (kt > 1.0)
        kt = 1.0;
    if (kt <= 0.22)
        return 1.0 - 0.09 * kt;
    if (kt <= 0.80)
        return 0.9511 +
               kt * (-0.1604 + kt * (4.388 + kt * (-16.638 + kt * 12.336)));
    return 0.165;
}

static double clamp01(double v)
{
    return v < 0.0 ? 0.0 : (v > 1.0 ? 1.0 : v);
}

static void set3(double *a, double *b, double *c, double v)
{
    if (a != NULL)
        *a = v;
    if (b != NULL)
        *b = v;
    if (c != NULL)
        *c = v;
}

int irr_split(double ghi_w_m2, double zenith_deg, int day_of_year,
              double *dni_w_m2, double *dhi_w_m2, double *kt)
{
    double i0 = irr_extra_normal_w_m2(day_of_year), cosz, dni;

    if (dni_w_m2 == NULL || dhi_w_m2 == NULL || kt == NULL ||
        !isfinite(ghi_w_m2) || !(zenith_deg >= 0.0 && zenith_deg <= 180.0) ||
        isnan(i0)) {
        set3(dni_w_m2, dhi_w_m2, kt, IRR_NAN);
        return -1;
    }
    if (ghi_w_m2 <= 0.0) {
        set3(dni_w_m2, dhi_w_m2, kt, 0.0);
        return 0;
    }
    if (zenith_deg >= IRR_ALL_DIFFUSE_ZENITH_DEG) {
        cosz = cos(IRR_ALL_DIFFUSE_ZENITH_DEG * (IRR_PI / 180.0));
        *kt = clamp01(ghi_w_m2 / (i0 * cosz));
        *dni_w_m2 = 0.0;
        *dhi_w_m2 = ghi_w_m2;
        return 0;
    }
    cosz = cos(zenith_deg * (IRR_PI / 180.0));
    *kt = clamp01(ghi_w_m2 / (i0 * cosz));
    *dhi_w_m2 = irr_erbs_kd(*kt) * ghi_w_m2;
    dni = (ghi_w_m2 - *dhi_w_m2) / cosz;
    if (dni > i0) {
        dni = i0;
        *dhi_w_m2 = ghi_w_m2 - dni * cosz;
    }
    *dni_w_m2 = dni;
    return 0;
}

double irr_par_w_m2(double shortwave_w_m2)
{
    if (isnan(shortwave_w_m2))
        return IRR_NAN;
    return shortwave_w_m2 > 0.0 ? IRR_PAR_FRACTION * shortwave_w_m2 : 0.0;
}

double irr_par_umol(double par_w_m2)
{
    if (isnan(par_w_m2))
        return IRR_NAN;
    return par_w_m2 > 0.0 ? IRR_PAR_UMOL_PER_J * par_w_m2 : 0.0;
}
