/* textfile.h - whole-file reads and atomic writes.
 *
 * Inputs are read whole (site files are small; weather files are read by
 * weather.c in blocks).  Outputs go to "PATH.tmp-PID" and are renamed over
 * PATH only when complete, so a failed run never leaves a partial file.
 */
#ifndef TEXTFILE_H
#define TEXTFILE_H

#include <stddef.h>
#include <stdio.h>

#include "diag.h"

/* Reads a whole file (at most 64 MiB) and NUL-terminates it.  Returns a
 * malloc'd buffer (caller frees) and its length, or NULL with a message. */
char *textfile_read(const char *path, size_t *len, rg_err *err);

/* An output file being written. */
typedef struct textfile_out {
    FILE *fp;
    char path[4096];
    char tmp[4200];
} textfile_out;

/* Opens PATH's temporary sibling for writing.  Returns 0 or -1. */
int textfile_begin(textfile_out *o, const char *path, rg_err *err);

/* Flushes, closes and renames over the target.  Returns 0, or -1 (and
 * removes the temporary file) when any write failed. */
int textfile_commit(textfile_out *o, rg_err *err);

/* Closes and removes the temporary file: the target is left as it was. */
void textfile_abort(textfile_out *o);

/* dir of path (up to the last '/'), or "." when path has none. */
void textfile_dirname(const char *path, char *out, size_t cap);

/* base joined with rel, unless rel is absolute. */
void textfile_join(const char *base, const char *rel, char *out, size_t cap);

#endif
