/* sward.h - named sward parameter sets (models/swards/NAME.json).
 *
 * A sward parameter set describes how a pasture type grows and how its
 * height relates to its mass.  Each number in the file carries the range it
 * must stay in and its source, so calibration can never silently leave the
 * published range: sward_load() refuses a value outside its own range.
 * The table of known parameters lives in sward.c; adding a parameter means
 * one row there, one field here and one entry in every set under models/.
 */
#ifndef SWARD_H
#define SWARD_H

#include "diag.h"

typedef struct sward_params {
    char name[64];                     /* file stem, e.g. "cool-season-grass" */
    char title[128];                   /* one-line description */
    double leaf_quantum_yield_mol_per_mol; /* leaf photosynthesis: initial slope, mol CO2 / mol absorbed photons */
    double leaf_pmax_umol_m2_s;        /* leaf light-saturated gross photosynthesis, umol CO2 m-2 s-1 */
    double leaf_curvature;             /* curvature theta of the non-rectangular hyperbola, - */
    double dm_per_co2_g_per_mol;       /* dry matter grown per mol of gross CO2 fixed, net of respiration */
    double light_extinction_k;         /* Beer's law canopy extinction coefficient; the leaf projection G
                                          of the sunlit/shaded model, - */
    double leaf_area_per_cover_m2_per_kgdm_ha; /* LAI per kg DM/ha of green cover, m2/m2 */
    double t_min_c, t_opt_c, t_max_c;  /* cardinal temperatures of growth, deg C */
    double vpd_coeff_per_mbar;         /* 3-PG VPD modifier slope k, 1/mbar */
    double depletion_p;                /* FAO-56 soil water depletion fraction p, - */
    double kc_mid;                     /* FAO-56 mid-season crop coefficient, - */
    double senescence_per_day;         /* fraction of green cover lost per day, 1/d */
    double stomata_light_w_m2;         /* solar radiation at which the radiation factor of the
                                          stomatal conductance is about half way (R_GL), W m-2 */
    double stomata_rs_min_s_m;         /* least stomatal resistance of a leaf, s/m */
    double height_mass_kgdm_ha_per_cm; /* cover added per cm of sward height */
    double base_cover_kgdm_ha;         /* cover at zero measurable height (stubble) */
} sward_params;

/* Loads models_dir/swards/NAME.json.  name may hold only a-z, 0-9 and '-'.
 * Returns 0, or -1 with a message naming the file and JSON path. */
int sward_load(const char *models_dir, const char *name, sward_params *out,
               rg_err *err);

/* Height (cm) of a sward of the given cover; 0 at or below the base cover. */
double sward_height_cm(const sward_params *s, double cover_kgdm_ha);

/* Cover (kg DM/ha) of a sward of the given height. */
double sward_cover_kgdm_ha(const sward_params *s, double height_cm);

#endif
