/* diag.h - error and warning messages for every stage.
 *
 * Functions that can fail on bad input take an `rg_err *` and, on failure,
 * write one line into it (file, location, what was expected, what was found)
 * and return -1. Only main.c prints errors; modules never exit.  Warnings
 * (unknown keys, filled weather gaps) go straight to stderr, since they do
 * not stop the run.
 */
#ifndef DIAG_H
#define DIAG_H

#include <stddef.h>

#define RG_EXIT_OK 0
#define RG_EXIT_RUNTIME 1
#define RG_EXIT_INPUT 2

typedef struct rg_err {
    char msg[768]; /* one line, no trailing newline; "" when no error */
} rg_err;

/* Formats a message into e (which may be NULL) and returns -1. */
int rg_fail(rg_err *e, const char *fmt, ...)
    __attribute__((format(printf, 2, 3)));

/* Prints "rowgraze: warning: ..." and a newline to stderr. */
void rg_warn(const char *fmt, ...) __attribute__((format(printf, 1, 2)));

/* Silences (quiet != 0) or restores warnings; used by tests and fuzzers. */
void rg_warn_quiet(int quiet);

/* The candidate closest to word by edit distance, or NULL when none is
 * within a distance a typo would explain (about a third of the word). */
const char *rg_suggest(const char *word, const char *const *cands, size_t n);

#endif
