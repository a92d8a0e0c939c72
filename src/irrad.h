/* irrad.h - sunlight above the rows: extraterrestrial irradiance, the split
 * of measured global horizontal irradiance into beam and diffuse parts, and
 * the photosynthetically active share of it.
 *
 * The whole interface of irrad.c.  Units are in the names: w_m2 is W m-2,
 * umol is umol m-2 s-1 of photons.  Sun angles follow the project's
 * convention (zenith_deg from vertical).
 */
#ifndef RG_IRRAD_H
#define RG_IRRAD_H

/* Solar constant, W m-2: Kopp, G. & Lean, J.L. (2011) A new, lower value of
 * total solar irradiance. Geophys. Res. Lett. 38:L01706, measured
 * 1360.8 +- 0.5 W m-2 at solar minimum (from memory), rounded. */
#define IRR_SOLAR_CONSTANT_W_M2 1361.0

/* Above this zenith the split calls all light diffuse: cos z is so small that
 * GHI / cos z magnifies measurement error and horizon shading into beam
 * values that cannot be trusted (common practice, no source). */
#define IRR_ALL_DIFFUSE_ZENITH_DEG 87.0

/* Share of global shortwave that is photosynthetically active (400-700 nm),
 * about one half for daylight in both clear and cloudy skies (Szeicz, G.
 * 1974, Solar radiation for plant growth, J. Appl. Ecol. 11:617-636; from
 * memory). */
#define IRR_PAR_FRACTION 0.50

/* Photon flux per unit of PAR energy for daylight, umol J-1 (McCree, K.J.
 * 1972, Test of current definitions of photosynthetically active
 * radiation against leaf photosynthesis data, Agric. Meteorol. 10:443-453;
 * from memory). */
#define IRR_PAR_UMOL_PER_J 4.57

/* Extraterrestrial irradiance on a plane normal to the sun, W m-2, on
 * day_of_year (1 = 1 January; 366 allowed for leap years): the solar
 * constant times the Spencer (1971) series for the Earth-Sun distance
 * factor.  NaN when day_of_year is outside 1..366. */
double irr_extra_normal_w_m2(int day_of_year);

/* Erbs, Klein & Duffie (1982) hourly diffuse fraction Kd = DHI / GHI for
 * clearness index kt.  kt below 0 is taken as 0 and above 1 as 1; NaN
 * gives NaN.  The result lies in [0.16, 1]. */
double irr_erbs_kd(double kt);

/* Splits global horizontal irradiance ghi_w_m2 with the sun at zenith_deg
 * on day_of_year into beam normal *dni_w_m2 and diffuse horizontal
 * *dhi_w_m2, and reports the clearness index *kt in [0, 1]:
 *   kt  = GHI / (I0 cos z), clamped to [0, 1];
 *   DHI = Kd(kt) GHI   (irr_erbs_kd);
 *   DNI = (GHI - DHI) / cos z, capped at I0, DHI then taking the rest;
 * so DHI + DNI cos z = GHI, 0 <= DHI <= GHI and 0 <= DNI <= I0.
 * Special cases: GHI <= 0 (night, sensor offset) gives all three 0; zenith
 * >= IRR_ALL_DIFFUSE_ZENITH_DEG (twilight included) gives DNI 0, DHI = GHI,
 * and kt computed with cos z held at cos(IRR_ALL_DIFFUSE_ZENITH_DEG).
 * Returns 0; on bad input (non-finite GHI or zenith, zenith outside
 * [0, 180], day outside 1..366, a NULL output) returns -1 and sets the
 * outputs it can to NaN. */
int irr_split(double ghi_w_m2, double zenith_deg, int day_of_year,
              double *dni_w_m2, double *dhi_w_m2, double *kt);

/* Photosynthetically active radiation, W m-2, in global shortwave
 * shortwave_w_m2 (times IRR_PAR_FRACTION).  Negative input gives 0; NaN
 * gives NaN. */
double irr_par_w_m2(double shortwave_w_m2);

/* PAR energy par_w_m2 as photon flux, umol m-2 s-1 (times
 * IRR_PAR_UMOL_PER_J).  Negative input gives 0; NaN gives NaN. */
double irr_par_umol(double par_w_m2);

#endif
