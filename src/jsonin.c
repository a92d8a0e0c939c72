/* jsonin.c - typed JSON reads with JSON-path error messages.
 *
 * The site file (site.c) and the sward parameter sets (sward.c) read their
 * documents through these helpers, so every input error names the file and
 * the JSON path and says what was expected and what was found.
 */
#include "jsonin.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

cJSON *ji_parse(ji_ctx *c, const char *text, size_t len)
{
    const char *end = NULL;
    cJSON *doc = cJSON_ParseWithLengthOpts(text, len, &end, 0);
    if (doc) {
        /* cJSON stops after the first value; anything but space after it
         * is an error (e.g. two documents glued together). */
        size_t off = (size_t)(end - text);
        while (off < len && strchr(" \t\r\n", text[off]))
            off++;
        if (off == len)
            return doc;
        cJSON_Delete(doc);
        end = text + off;
    }
    size_t off = end ? (size_t)(end - text) : 0;
    if (off > len)
        off = len;
    int line = 1, col = 1;
    for (size_t i = 0; i < off; i++) {
        if (text[i] == '\n') {
            line++;
            col = 1;
        } else {
            col++;
        }
    }
    size_t rest = off;
    while (rest < len && strchr(" \t\r\n", text[rest]))
        rest++;
    if (rest >= len)
        rg_fail(c->err, "%s: line %d, column %d: expected more JSON, found the end of the file (truncated?)",
                c->file, line, col);
    else
        rg_fail(c->err, "%s: line %d, column %d: expected valid JSON, found '%c'",
                c->file, line, col, text[off] >= 32 && text[off] < 127 ? text[off] : '?');
    return NULL;
}

void ji_describe(const cJSON *v, char *buf, size_t cap)
{
    if (!v)
        snprintf(buf, cap, "nothing");
    else if (cJSON_IsNumber(v))
        snprintf(buf, cap, "the number %.10g", v->valuedouble);
    else if (cJSON_IsString(v))
        snprintf(buf, cap, "the string \"%.40s\"", v->valuestring);
    else if (cJSON_IsBool(v))
        snprintf(buf, cap, "%s", cJSON_IsTrue(v) ? "true" : "false");
    else if (cJSON_IsNull(v))
        snprintf(buf, cap, "null");
    else if (cJSON_IsArray(v))
        snprintf(buf, cap, "an array");
    else if (cJSON_IsObject(v))
        snprintf(buf, cap, "an object");
    else
        snprintf(buf, cap, "an invalid value");
}

static int expected(ji_ctx *c, const char *path, const char *key,
                    const char *what, const cJSON *v)
{
    char found[96];
    ji_describe(v, found, sizeof found);
    if (key)
        return rg_fail(c->err, "%s: %s.%s: expected %s, found %s", c->file,
                       path, key, what, found);
    return rg_fail(c->err, "%s: %s: expected %s, found %s", c->file, path,
                   what, found);
}

int ji_keys(ji_ctx *c, const cJSON *obj, const char *path,
            const char *const *allowed)
{
    if (!cJSON_IsObject(obj))
        return expected(c, path, NULL, "an object", obj);
    size_t n = 0;
    while (allowed[n])
        n++;
    for (const cJSON *k = obj->child; k; k = k->next) {
        for (const cJSON *j = obj->child; j != k; j = j->next)
            if (strcmp(j->string, k->string) == 0)
                return rg_fail(c->err, "%s: %s.%s: expected each key once, found it twice",
                               c->file, path, k->string);
        size_t i = 0;
        while (i < n && strcmp(allowed[i], k->string) != 0)
            i++;
        if (i < n)
            continue;
        const char *near = rg_suggest(k->string, allowed, n);
        if (near)
            rg_warn("%s: %s.%s: unknown key, ignored; did you mean '%s'?",
                    c->file, path, k->string, near);
        else
            rg_warn("%s: %s.%s: unknown key, ignored", c->file, path,
                    k->string);
    }
    return 0;
}

const cJSON *ji_get(const cJSON *obj, const char *key)
{
    return cJSON_GetObjectItemCaseSensitive(obj, key);
}

int ji_require(ji_ctx *c, const cJSON *obj, const char *path, const char *key)
{
    if (ji_get(obj, key))
        return 0;
    return rg_fail(c->err, "%s: %s: missing required key \"%s\"", c->file,
                   path, key);
}

static void range_text(int flags, double lo, double hi, char *buf, size_t cap)
{
    const char *kind = (flags & JI_INT) ? "a whole number" : "a number";
    if (flags & JI_RANGE)
        snprintf(buf, cap, "%s from %.10g to %.10g", kind, lo, hi);
    else if (flags & JI_POS)
        snprintf(buf, cap, "%s greater than 0", kind);
    else if (flags & JI_NONNEG)
        snprintf(buf, cap, "%s of 0 or more", kind);
    else
        snprintf(buf, cap, "%s", kind);
}

int ji_number(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
              int required, int flags, double lo, double hi, double *out)
{
    const cJSON *v = ji_get(obj, key);
    if (!v)
        return required ? ji_require(c, obj, path, key) : 0;
    char want[96];
    range_text(flags, lo, hi, want, sizeof want);
    if (!cJSON_IsNumber(v) || !isfinite(v->valuedouble))
        return expected(c, path, key, want, v);
    double x = v->valuedouble;
    int bad = ((flags & JI_POS) && !(x > 0)) || ((flags & JI_NONNEG) && x < 0) ||
              ((flags & JI_RANGE) && (x < lo || x > hi)) ||
              ((flags & JI_INT) && x != floor(x));
    if (bad)
        return expected(c, path, key, want, v);
    *out = x;
    return 0;
}

int ji_int(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
           int required, int lo, int hi, int *out)
{
    double x = 0;
    if (!ji_get(obj, key))
        return required ? ji_require(c, obj, path, key) : 0;
    if (ji_number(c, obj, path, key, required, JI_INT | JI_RANGE, lo, hi, &x) < 0)
        return -1;
    *out = (int)x;
    return 0;
}

int ji_bool(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
            int required, int *out)
{
    const cJSON *v = ji_get(obj, key);
    if (!v)
        return required ? ji_require(c, obj, path, key) : 0;
    if (!cJSON_IsBool(v))
        return expected(c, path, key, "true or false", v);
    *out = cJSON_IsTrue(v) ? 1 : 0;
    return 0;
}

int ji_string(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
              int required, char *out, size_t cap)
{
    const cJSON *v = ji_get(obj, key);
    if (!v)
        return required ? ji_require(c, obj, path, key) : 0;
    if (!cJSON_IsString(v) || v->valuestring[0] == '\0')
        return expected(c, path, key, "a non-empty string", v);
    size_t len = strlen(v->valuestring);
    if (len >= cap) {
        char want[64];
        snprintf(want, sizeof want, "a string of at most %zu characters", cap - 1);
        return expected(c, path, key, want, v);
    }
    memcpy(out, v->valuestring, len + 1);
    return 0;
}

int ji_array(ji_ctx *c, const cJSON *obj, const char *path, const char *key,
             int required, const cJSON **arr, int *n)
{
    const cJSON *v = ji_get(obj, key);
    *arr = NULL;
    *n = 0;
    if (!v)
        return required ? ji_require(c, obj, path, key) : 0;
    if (!cJSON_IsArray(v))
        return expected(c, path, key, "an array", v);
    *arr = v;
    *n = cJSON_GetArraySize(v);
    return 0;
}
