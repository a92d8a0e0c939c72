/* lateral.h - sideways soil water flow between neighbouring strips across a
 * row pitch (growth stage): interface.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * The drip lines wet a band a few decimetres wide while the ground under
 * the panel stays dry; in the soil, water then moves from the wet strips
 * to the dry ones.  Each strip's root zone is one FAO-56 bucket (soil.h);
 * this module moves water between neighbouring buckets by Darcy's law in
 * its diffusion form, J = -D(theta) d theta / dx, with the soil water
 * diffusivity of Clapp & Hornberger (1978) for the soil's texture class:
 *   psi(theta) = psi_s (theta / theta_s)^-b          (their eq. 1)
 *   K(theta)   = K_s (theta / theta_s)^(2b + 3)      (their eq. 2)
 *   D(theta)   = K dpsi/dtheta = b K_s psi_s / theta_s (theta / theta_s)^(b + 2)
 * with b, psi_s, K_s, theta_s from their Table 2 (texture.h).  A strip's water content
 * is theta = theta_fc - Dr / (1000 Zr): field capacity at 330 cm suction
 * (-33 kPa, common practice, no source) less its root-zone depletion.
 * Flow is across the row only (along the row every strip is alike), over
 * the depth of the root zone, periodic across pitches (the next row's
 * strips are the same), and stepped explicitly with enough sub-steps to be
 * stable; water is conserved exactly and no strip is taken below wilting
 * point or above field capacity.
 */
#ifndef LATERAL_H
#define LATERAL_H

#include "soil.h"
#include "texture.h"

/* Soil water diffusivity D(theta), m2/s, Clapp & Hornberger (1978) eq. 1
 * and 2: b K_s psi_s / theta_s (theta / theta_s)^(b + 2).  NaN for a NULL
 * texture or theta outside [0, theta_s]. */
double lf_diffusivity_m2_s(const tex_class *t, double theta);

/* A table of D against depletion for one soil, made once per run. */
#define LF_TABLE_N 128
typedef struct lf_soil {
    double taw_mm;                 /* as the buckets' soil_params */
    double d_m2_s[LF_TABLE_N + 1]; /* D at depletion taw_mm x j / LF_TABLE_N */
    double d_max_m2_s;             /* the largest (at field capacity) */
} lf_soil;

/* Fills *out for a root zone of depth rooting_depth_m holding taw_mm
 * between field capacity and wilting point, of texture t.  Returns 0, or
 * -1 when an argument is NULL, not finite or not positive, or the
 * texture's field capacity is below the water the root zone must hold
 * (taw_mm / (1000 rooting_depth_m) > theta_fc). */
int lf_soil_make(const tex_class *t, double rooting_depth_m, double taw_mm,
                 lf_soil *out);

/* Moves water between the n strips of one pitch (each width_m wide, in
 * order across the row, strip n-1 next to strip 0 of the next pitch) for
 * dt_s seconds.  s[i].dr_mm changes; s[i].de_mm does not.  moved_mm[i]
 * (may be NULL) gets the water that came in (+) or left (-), in mm over
 * strip i; the moved_mm add up to 0 (to rounding).  scratch holds 2n
 * doubles.  Returns the number of sub-steps used, or -1 for a bad
 * argument. */
int lf_step(const lf_soil *ls, soil_state *s, int n, double width_m, double dt_s,
            double *moved_mm, double *scratch);

#endif
