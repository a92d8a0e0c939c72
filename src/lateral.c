/* lateral.c - sideways soil water flow between strips (growth stage).
 * See lateral.h for the method and its source.
 *
 * How the pieces fit: a texture class (texture.h) gives Clapp &
 * Hornberger's Table 2 parameters; lf_soil_make turns it into a table of the
 * diffusivity against a bucket's depletion (so the hourly loop makes no
 * pow() calls); lf_step then diffuses the depletions of one pitch's
 * buckets with an explicit finite-volume scheme.  In depletion form the
 * flux between strips i and i+1 of width w over the root depth Zr,
 *   J = -D (theta_(i+1) - theta_i) / w,   theta = theta_fc - Dr / (1000 Zr),
 * moves J Zr dt / w m of water, i.e. D dt / w^2 (Dr_(i+1) - Dr_i) mm: the
 * root depth cancels.  With r = D dt / w^2 <= 1/2 per sub-step the scheme
 * is monotone, so depletions stay within [0, TAW].
 */
#include "lateral.h"

#include <math.h>
#include <stddef.h>
#include <string.h>

/* Largest r = D dt / w^2 of one sub-step: below the explicit scheme's
 * stability limit of 1/2 with room for rounding. */
#define LF_R_MAX 0.45

double lf_diffusivity_m2_s(const tex_class *t, double theta)
{
    if (!t || !(theta >= 0.0 && theta <= t->theta_s))
        return (double)NAN;
    /* D = K dpsi/dtheta with eq. 1 and 2; psi_s in m, K_s in m/s */
    double d_sat = t->b * (t->k_s_cm_s / 100.0) * (t->psi_s_cm / 100.0) / t->theta_s;
    return d_sat * pow(theta / t->theta_s, t->b + 2.0);
}

int lf_soil_make(const tex_class *t, double rooting_depth_m, double taw_mm, lf_soil *out)
{
    if (!t || !out || !(rooting_depth_m > 0.0) || !isfinite(rooting_depth_m) ||
        !(taw_mm > 0.0) || !isfinite(taw_mm))
        return -1;
    double theta_fc = tex_theta_at_suction(t, TEX_FC_SUCTION_CM);
    double range = taw_mm / (1000.0 * rooting_depth_m); /* theta_fc - theta_wp */
    if (!(range < theta_fc))
        return -1;
    out->taw_mm = taw_mm;
    for (int j = 0; j <= LF_TABLE_N; j++)
        out->d_m2_s[j] = lf_diffusivity_m2_s(t, theta_fc - range * j / LF_TABLE_N);
    out->d_max_m2_s = out->d_m2_s[0];
    return 0;
}

/* D at the mean depletion of two neighbours, from the table (linear). */
static double d_between(const lf_soil *ls, double dr_a, double dr_b)
{
    double x = (dr_a + dr_b) / 2.0 / ls->taw_mm * LF_TABLE_N;
    if (x <= 0.0)
        return ls->d_m2_s[0];
    if (x >= LF_TABLE_N)
        return ls->d_m2_s[LF_TABLE_N];
    int j = (int)x;
    double f = x - j;
    return ls->d_m2_s[j] + f * (ls->d_m2_s[j + 1] - ls->d_m2_s[j]);
}

int lf_step(const lf_soil *ls, soil_state *s, int n, double width_m, double dt_s,
            double *moved_mm, double *scratch)
{
    if (!ls || !s || !scratch || n < 2 || !(width_m > 0.0) || !(dt_s >= 0.0))
        return -1;
    double r_top = ls->d_max_m2_s * dt_s / (width_m * width_m);
    int n_sub = r_top > LF_R_MAX ? (int)ceil(r_top / LF_R_MAX) : 1;
    double k = dt_s / n_sub / (width_m * width_m); /* r = D k */
    double *flux = scratch, *start = scratch + n;
    for (int i = 0; i < n; i++)
        start[i] = s[i].dr_mm;
    for (int step = 0; step < n_sub; step++) {
        /* flux[i]: mm moved from strip i+1 to strip i this sub-step
         * (positive when i+1 is wetter, i.e. has the smaller depletion) */
        for (int i = 0; i < n; i++) {
            int e = i + 1 < n ? i + 1 : 0;
            double diff = s[i].dr_mm - s[e].dr_mm;
            flux[i] = diff == 0.0 ? 0.0 : d_between(ls, s[i].dr_mm, s[e].dr_mm) * k * diff;
        }
        for (int i = 0; i < n; i++) {
            int w = i > 0 ? i - 1 : n - 1;
            s[i].dr_mm -= flux[i] - flux[w];
            if (s[i].dr_mm < 0.0) /* rounding only: the scheme is monotone */
                s[i].dr_mm = 0.0;
            else if (s[i].dr_mm > ls->taw_mm)
                s[i].dr_mm = ls->taw_mm;
        }
    }
    if (moved_mm)
        for (int i = 0; i < n; i++)
            moved_mm[i] = start[i] - s[i].dr_mm;
    return n_sub;
}
