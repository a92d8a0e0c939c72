/* texture.c - soil texture classes (input stage).  See texture.h. */
#include "texture.h"

#include <math.h>
#include <stddef.h>
#include <string.h>

/* Clapp, R.B. & Hornberger, G.M. (1978) Empirical equations for some soil
 * hydraulic properties.  Water Resources Research 14(4):601-604, Table 2
 * (b, psi_s in cm, K_s in cm/s, theta_s); checked against a public
 * transcription of the table. */
static const tex_class textures[] = {
    {"sand", 4.05, 12.1, 1.76e-2, 0.395},
    {"loamy-sand", 4.38, 9.0, 1.563e-2, 0.410},
    {"sandy-loam", 4.90, 21.8, 3.41e-3, 0.435},
    {"silt-loam", 5.30, 78.6, 7.2e-4, 0.485},
    {"loam", 5.39, 47.8, 6.95e-4, 0.451},
    {"sandy-clay-loam", 7.12, 29.9, 6.3e-4, 0.420},
    {"silty-clay-loam", 7.75, 35.6, 1.7e-4, 0.477},
    {"clay-loam", 8.52, 63.0, 2.45e-4, 0.476},
    {"sandy-clay", 10.4, 15.3, 2.16e-4, 0.426},
    {"silty-clay", 10.4, 49.0, 1.03e-4, 0.492},
    {"clay", 11.4, 40.5, 1.28e-4, 0.482},
};
#define N_TEXTURES (sizeof textures / sizeof textures[0])

const tex_class *tex_find(const char *name)
{
    if (!name)
        return NULL;
    for (size_t i = 0; i < N_TEXTURES; i++)
        if (strcmp(textures[i].name, name) == 0)
            return &textures[i];
    return NULL;
}

const char *tex_names(void)
{
    return "sand, loamy-sand, sandy-loam, silt-loam, loam, sandy-clay-loam, "
           "silty-clay-loam, clay-loam, sandy-clay, silty-clay, clay";
}

double tex_theta_at_suction(const tex_class *t, double psi_cm)
{
    if (!t || !(psi_cm > 0.0))
        return (double)NAN;
    if (psi_cm <= t->psi_s_cm)
        return t->theta_s;
    return t->theta_s * pow(t->psi_s_cm / psi_cm, 1.0 / t->b); /* eq. 1 */
}
