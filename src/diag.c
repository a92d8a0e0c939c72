/* diag.c - error buffer, warnings and "did you mean" suggestions. */
#include "diag.h"

#include <stdarg.h>
#include <stdio.h>
#include <string.h>

static int warn_quiet;

/* Input text quoted in a message may hold control characters (a newline
 * inside a JSON string or a CSV cell); they become '?' so that every
 * message stays one line. */
static void one_line(char *s)
{
    for (; *s; s++)
        if ((unsigned char)*s < 32 || *s == 127)
            *s = '?';
}

int rg_fail(rg_err *e, const char *fmt, ...)
{
    if (e) {
        va_list ap;
        va_start(ap, fmt);
        vsnprintf(e->msg, sizeof e->msg, fmt, ap);
        va_end(ap);
        one_line(e->msg);
    }
    return -1;
}

void rg_warn(const char *fmt, ...)
{
    if (warn_quiet)
        return;
    char msg[768];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    one_line(msg);
    fprintf(stderr, "rowgraze: warning: %s\n", msg);
}

void rg_warn_quiet(int quiet) { warn_quiet = quiet; }

/* Levenshtein distance, capped at 64 characters per word (longer words are
 * compared on their first 64). */
static size_t edit_distance(const char *a, const char *b)
{
    size_t la = strlen(a), lb = strlen(b);
    if (la > 64) la = 64;
    if (lb > 64) lb = 64;
    size_t row[65];
    for (size_t j = 0; j <= lb; j++)
        row[j] = j;
    for (size_t i = 1; i <= la; i++) {
        size_t diag = row[0];
        row[0] = i;
        for (size_t j = 1; j <= lb; j++) {
            size_t up = row[j];
            size_t cost = a[i - 1] == b[j - 1] ? 0 : 1;
            size_t best = diag + cost;
            if (row[j] + 1 < best) best = row[j] + 1;
            if (row[j - 1] + 1 < best) best = row[j - 1] + 1;
            row[j] = best;
            diag = up;
        }
    }
    return row[lb];
}

const char *rg_suggest(const char *word, const char *const *cands, size_t n)
{
    size_t limit = (strlen(word) + 2) / 3;
    if (limit < 1) limit = 1;
    const char *best = NULL;
    size_t best_d = limit + 1;
    for (size_t i = 0; i < n; i++) {
        size_t d = edit_distance(word, cands[i]);
        /* a key that only lacks or gains a unit suffix is a likely slip */
        size_t lw = strlen(word), lc = strlen(cands[i]);
        if (d > limit && lc > lw && strncmp(word, cands[i], lw) == 0 && cands[i][lw] == '_')
            d = limit;
        if (d < best_d) {
            best_d = d;
            best = cands[i];
        }
    }
    return best;
}
