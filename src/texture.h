/* texture.h - soil texture classes and their hydraulic parameters (input
 * stage): interface.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * A site file may name each soil's texture class; the class gives the
 * parameters of Clapp & Hornberger's (1978) retention and conductivity
 * curves (their Table 2), which the growth stage uses for the sideways
 * flow of soil water between strips (lateral.h).  Retention curve, their
 * eq. 1: psi(theta) = psi_s (theta / theta_s)^-b.
 */
#ifndef TEXTURE_H
#define TEXTURE_H

/* One texture class of Clapp & Hornberger (1978), Table 2. */
typedef struct tex_class {
    const char *name;      /* "sand", "loamy-sand", ..., "clay" */
    double b;              /* exponent of the retention curve, - */
    double psi_s_cm;       /* saturated (air-entry) suction, cm of water */
    double k_s_cm_s;       /* saturated hydraulic conductivity, cm/s */
    double theta_s;        /* water content at saturation (porosity), m3/m3 */
} tex_class;

/* Field capacity is the water content at this suction: 330 cm of water,
 * -33 kPa (common practice, no source). */
#define TEX_FC_SUCTION_CM 330.0

/* The texture class called name (a-z and '-', e.g. "sandy-loam"), or NULL. */
const tex_class *tex_find(const char *name);

/* The names of all classes, comma-separated, for messages. */
const char *tex_names(void);

/* Water content at suction psi_cm (cm of water, > 0), Clapp & Hornberger
 * (1978) eq. 1 solved for theta: theta_s (psi_s / psi)^(1/b), and theta_s
 * when psi <= psi_s.  NaN for a NULL class or psi_cm not > 0. */
double tex_theta_at_suction(const tex_class *t, double psi_cm);

#endif
