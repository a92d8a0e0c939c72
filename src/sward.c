/* sward.c - reads and checks sward parameter sets from models/swards/.
 *
 * File layout (documented in docs/inputs.md):
 *   { "title": "...", "parameters": { "NAME": { "value": V, "min": A,
 *     "max": B, "source": "..." }, ... } }
 * Every parameter in the table below is required; each must lie in its own
 * [min, max] and name a source (or say "from memory").
 */
#include "sward.h"

#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "jsonin.h"
#include "textfile.h"

typedef struct {
    const char *key;
    size_t offset;
    double lo, hi; /* physical bounds, wider than any published range */
} param_row;

#define ROW(f, lo, hi) {#f, offsetof(sward_params, f), lo, hi}
static const param_row params[] = {
    ROW(leaf_quantum_yield_mol_per_mol, 0.01, 0.125),
    ROW(leaf_pmax_umol_m2_s, 1, 100),
    ROW(leaf_curvature, 0, 1),
    ROW(dm_per_co2_g_per_mol, 1, 30),
    ROW(light_extinction_k, 0.1, 1.5),
    ROW(leaf_area_per_cover_m2_per_kgdm_ha, 1e-4, 0.01),
    ROW(t_min_c, -10, 20),
    ROW(t_opt_c, 5, 45),
    ROW(t_max_c, 20, 55),
    ROW(vpd_coeff_per_mbar, 0, 0.2),
    ROW(depletion_p, 0.1, 0.9),
    ROW(kc_mid, 0.3, 1.5),
    ROW(senescence_per_day, 0, 0.2),
    ROW(stomata_light_w_m2, 10, 1000),
    ROW(stomata_rs_min_s_m, 10, 1000),
    ROW(height_mass_kgdm_ha_per_cm, 10, 500),
    ROW(base_cover_kgdm_ha, 0, 3000),
};
#undef ROW
#define N_PARAMS (sizeof params / sizeof params[0])

static int valid_name(const char *name)
{
    if (!name[0] || strlen(name) > 60)
        return 0;
    for (const char *p = name; *p; p++)
        if (!((*p >= 'a' && *p <= 'z') || (*p >= '0' && *p <= '9') || *p == '-'))
            return 0;
    return 1;
}

static int read_param(ji_ctx *c, const cJSON *set, const param_row *row,
                      sward_params *out)
{
    static const char *const keys[] = {"value", "min", "max", "source", "note", NULL};
    char path[128];
    snprintf(path, sizeof path, "$.parameters.%s", row->key);
    if (ji_require(c, set, "$.parameters", row->key) < 0)
        return -1;
    const cJSON *p = ji_get(set, row->key);
    double v = 0, lo = 0, hi = 0;
    char source[8];
    if (ji_keys(c, p, path, keys) < 0 ||
        ji_number(c, p, path, "min", 1, JI_RANGE, row->lo, row->hi, &lo) < 0 ||
        ji_number(c, p, path, "max", 1, JI_RANGE, lo, row->hi, &hi) < 0 ||
        ji_number(c, p, path, "value", 1, JI_RANGE, lo, hi, &v) < 0)
        return -1;
    /* the source text itself is documentation; require that it exists */
    const cJSON *s = ji_get(p, "source");
    if (!cJSON_IsString(s) || !s->valuestring[0])
        return ji_string(c, p, path, "source", 1, source, sizeof source);
    *(double *)((char *)out + row->offset) = v;
    return 0;
}

static int read_set(ji_ctx *c, const cJSON *doc, sward_params *out)
{
    static const char *const top[] = {"title", "description", "parameters", NULL};
    const char *pkeys[N_PARAMS + 1];
    for (size_t i = 0; i < N_PARAMS; i++)
        pkeys[i] = params[i].key;
    pkeys[N_PARAMS] = NULL;
    if (ji_keys(c, doc, "$", top) < 0 ||
        ji_string(c, doc, "$", "title", 1, out->title, sizeof out->title) < 0 ||
        ji_require(c, doc, "$", "parameters") < 0)
        return -1;
    const cJSON *set = ji_get(doc, "parameters");
    if (ji_keys(c, set, "$.parameters", pkeys) < 0)
        return -1;
    for (size_t i = 0; i < N_PARAMS; i++)
        if (read_param(c, set, &params[i], out) < 0)
            return -1;
    if (!(out->t_min_c < out->t_opt_c && out->t_opt_c < out->t_max_c))
        return rg_fail(c->err, "%s: $.parameters: expected t_min_c < t_opt_c < t_max_c, found %g, %g, %g",
                       c->file, out->t_min_c, out->t_opt_c, out->t_max_c);
    return 0;
}

int sward_load(const char *models_dir, const char *name, sward_params *out,
               rg_err *err)
{
    memset(out, 0, sizeof *out);
    if (!valid_name(name))
        return rg_fail(err, "sward parameter set \"%s\": expected a name of lower-case letters, digits and '-'", name);
    char path[4096];
    snprintf(path, sizeof path, "%s/swards/%s.json", models_dir, name);
    size_t len = 0;
    char *text = textfile_read(path, &len, err);
    if (!text)
        return -1;
    ji_ctx c = {path, err};
    cJSON *doc = ji_parse(&c, text, len);
    free(text);
    if (!doc)
        return -1;
    snprintf(out->name, sizeof out->name, "%s", name);
    int rc = read_set(&c, doc, out);
    cJSON_Delete(doc);
    return rc;
}

double sward_height_cm(const sward_params *s, double cover_kgdm_ha)
{
    double h = (cover_kgdm_ha - s->base_cover_kgdm_ha) / s->height_mass_kgdm_ha_per_cm;
    return h > 0 ? h : 0;
}

double sward_cover_kgdm_ha(const sward_params *s, double height_cm)
{
    return s->base_cover_kgdm_ha + s->height_mass_kgdm_ha_per_cm * height_cm;
}
