/* jsonin.h - typed, located reads from a parsed JSON document (cJSON).
 *
 * Every reader takes the object, the JSON path of that object ("$.array")
 * and a key, checks type and range, and on failure writes one error line
 * "FILE: $.path.key: expected ..., found ..." and returns -1.  A missing
 * optional key leaves *out untouched and returns 0, so callers set defaults
 * first.  ji_keys() warns about unknown keys (with a suggestion) and rejects
 * duplicate keys, which cJSON would otherwise silently shadow.
 */
#ifndef JSONIN_H
#define JSONIN_H

#include <cjson/cJSON.h>
#include <stddef.h>

#include "diag.h"

typedef struct ji_ctx {
    const char *file; /* shown at the start of every message */
    rg_err *err;
} ji_ctx;

/* Range flags for ji_number. */
enum {
    JI_ANY = 0,
    JI_POS = 1,    /* > 0 */
    JI_NONNEG = 2, /* >= 0 */
    JI_RANGE = 4,  /* lo <= x <= hi */
    JI_INT = 8     /* a whole number */
};

/* Parses text; on a syntax error reports the line and column. Returns the
 * document (free with cJSON_Delete) or NULL. */
cJSON *ji_parse(ji_ctx *c, const char *text, size_t len);

/* Checks that obj is an object; warns about keys not in allowed (NULL-
 * terminated list); fails on a duplicate key. */
int ji_keys(ji_ctx *c, const cJSON *obj, const char *path,
            const char *const *allowed);

/* The member key of obj (NULL when absent). */
const cJSON *ji_get(const cJSON *obj, const char *key);

/* Fails with "missing required key" unless key is present. */
int ji_require(ji_ctx *c, const cJSON *obj, const char *path, const char *key);

int ji_number(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
              int required, int flags, double lo, double hi, double *out);
int ji_int(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
           int required, int lo, int hi, int *out);
int ji_bool(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
            int required, int *out);
/* Copies a non-empty string of at most cap-1 bytes into out. */
int ji_string(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
              int required, char *out, size_t cap);
/* Returns the array member (NULL with -1 on error, NULL with 0 when absent
 * and optional); *n receives its length. */
int ji_array(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
             int required, const cJSON **arr, int *n);

/* A short description of a JSON value's type and value for messages
 * ("the string \"abc\"", "the number -2", "an object"). */
void ji_describe(const cJSON *v, char *buf, size_t cap);

#endif
