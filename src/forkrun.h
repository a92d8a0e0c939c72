/* forkrun.h - independent tasks in child processes, results in order
 * (output stage: `compare` and `capacity` plan their cases side by side).
 *
 * Each task writes its result as bytes to a stream; in a child process the
 * stream is a pipe to the parent, which collects the results in task order.
 * A task cannot see another's work (each child starts from the parent's
 * state at the fork), so a result is the one the task gives when run alone;
 * with one job the tasks run here, in turn, through the same stream.
 */
#ifndef FORKRUN_H
#define FORKRUN_H

#include <stddef.h>
#include <stdio.h>

/* Runs task i, writing its result to out. */
typedef void (*fr_task)(void *ctx, int i, FILE *out);

/* Releases what a child holds before it ends (so leak checkers see none);
 * may be NULL. */
typedef void (*fr_release)(void *ctx);

typedef struct fr_result {
    char *data;              /* the bytes task i wrote (malloc'd; the caller frees) */
    size_t len;
    int ok;                  /* 0: its child ended without a complete result */
} fr_result;

/* Runs tasks 0..n-1, at most jobs at once in child processes (jobs <= 1 or
 * n == 1: here, one after another; a child that cannot be started also
 * runs here).  res has n entries. */
void fr_run(int n, int jobs, fr_task task, fr_release release, void *ctx, fr_result *res);

/* Jobs to use: want when > 0, else the online cores (1..64). */
int fr_jobs(int want);

#endif
