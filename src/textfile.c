/* textfile.c - whole-file reads, atomic writes, path joining. */
#include "textfile.h"

#include <errno.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#define MAX_INPUT_BYTES (64L * 1024 * 1024)

char *textfile_read(const char *path, size_t *len, rg_err *err)
{
    FILE *fp = fopen(path, "rb");
    if (!fp)
        return rg_fail(err, "%s: cannot open: %s", path, strerror(errno)), NULL;
    char *buf = NULL;
    size_t n = 0, cap = 0;
    for (;;) {
        if (cap - n < 65536) {
            cap = cap ? cap * 2 : 65536;
            if (cap > (size_t)MAX_INPUT_BYTES + 65536) {
                rg_fail(err, "%s: expected a file under 64 MiB, found a larger one", path);
                break;
            }
            char *nb = realloc(buf, cap + 1);
            if (!nb) {
                rg_fail(err, "%s: out of memory reading the file", path);
                break;
            }
            buf = nb;
        }
        size_t got = fread(buf + n, 1, cap - n, fp);
        n += got;
        if (got == 0) {
            if (ferror(fp)) {
                rg_fail(err, "%s: read error: %s", path, strerror(errno));
                break;
            }
            fclose(fp);
            buf[n] = '\0';
            *len = n;
            return buf;
        }
    }
    fclose(fp);
    free(buf);
    return NULL;
}

int textfile_begin(textfile_out *o, const char *path, rg_err *err)
{
    if (strlen(path) >= sizeof o->path)
        return rg_fail(err, "%s: path too long", path);
    snprintf(o->path, sizeof o->path, "%s", path);
    snprintf(o->tmp, sizeof o->tmp, "%s.tmp-%ld", path, (long)getpid());
    o->fp = fopen(o->tmp, "wb");
    if (!o->fp)
        return rg_fail(err, "%s: cannot write: %s", o->path, strerror(errno));
    return 0;
}

int textfile_commit(textfile_out *o, rg_err *err)
{
    int bad = ferror(o->fp) != 0;
    bad |= fclose(o->fp) != 0;
    o->fp = NULL;
    if (bad) {
        remove(o->tmp);
        return rg_fail(err, "%s: write failed (disk full?)", o->path);
    }
    if (rename(o->tmp, o->path) != 0) {
        int e = errno;
        remove(o->tmp);
        return rg_fail(err, "%s: cannot rename into place: %s", o->path, strerror(e));
    }
    return 0;
}

void textfile_dirname(const char *path, char *out, size_t cap)
{
    const char *slash = strrchr(path, '/');
    if (!slash) {
        snprintf(out, cap, ".");
        return;
    }
    size_t n = (size_t)(slash - path);
    if (n == 0)
        n = 1; /* "/file" -> "/" */
    snprintf(out, cap, "%.*s", (int)n, path);
}

void textfile_join(const char *base, const char *rel, char *out, size_t cap)
{
    if (rel[0] == '/' || strcmp(base, ".") == 0)
        snprintf(out, cap, "%s", rel);
    else
        snprintf(out, cap, "%s/%s", base, rel);
}

void textfile_abort(textfile_out *o)
{
    if (!o->fp)
        return;
    fclose(o->fp);
    o->fp = NULL;
    remove(o->tmp);
}
