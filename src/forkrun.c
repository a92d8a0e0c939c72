/* forkrun.c - independent tasks in child processes (see forkrun.h). */
#include "forkrun.h"

#include <errno.h>
#include <stdlib.h>
#include <string.h>
#include <sys/types.h>
#include <sys/wait.h>
#include <unistd.h>

typedef struct fr_child {
    pid_t pid;               /* 0: not started in a child */
    int fd;
} fr_child;

int fr_jobs(int want)
{
    if (want > 0)
        return want;
    long n = sysconf(_SC_NPROCESSORS_ONLN);
    return n < 1 ? 1 : n > 64 ? 64 : (int)n;
}

/* Task i here, into a memory stream. */
static void run_here(fr_task task, void *ctx, int i, fr_result *r)
{
    memset(r, 0, sizeof *r);
    FILE *out = open_memstream(&r->data, &r->len);
    if (!out)
        return;
    task(ctx, i, out);
    r->ok = !ferror(out);
    if (fclose(out) != 0)
        r->ok = 0;
}

/* Starts task i in a child writing to a pipe; -1 when no child could be made. */
static int spawn(fr_task task, fr_release release, void *ctx, int i, fr_child *ch)
{
    int fd[2];
    if (pipe(fd) < 0)
        return -1;
    fflush(stdout);
    fflush(stderr);
    pid_t pid = fork();
    if (pid < 0) {
        close(fd[0]);
        close(fd[1]);
        return -1;
    }
    if (pid == 0) {
        close(fd[0]);
        FILE *out = fdopen(fd[1], "w");
        int ok = out != NULL;
        if (out) {
            task(ctx, i, out);
            ok = !ferror(out) && fclose(out) == 0;
        }
        if (release)
            release(ctx);
        _exit(ok ? 0 : 1);
    }
    close(fd[1]);
    ch->pid = pid;
    ch->fd = fd[0];
    return 0;
}

/* Reads child ch's bytes to the end, then waits for it. */
static void collect(fr_child *ch, fr_result *r)
{
    memset(r, 0, sizeof *r);
    size_t cap = 0;
    int ok = 1;
    for (;;) {
        if (r->len == cap) {
            char *p = realloc(r->data, cap ? 2 * cap : 4096);
            if (!p) {
                ok = 0;
                break;
            }
            r->data = p;
            cap = cap ? 2 * cap : 4096;
        }
        ssize_t k = read(ch->fd, r->data + r->len, cap - r->len);
        if (k < 0 && errno == EINTR)
            continue;
        if (k < 0)
            ok = 0;
        if (k <= 0)
            break;
        r->len += (size_t)k;
    }
    close(ch->fd);
    int st = 0;
    while (waitpid(ch->pid, &st, 0) < 0 && errno == EINTR)
        ;
    r->ok = ok && WIFEXITED(st) && WEXITSTATUS(st) == 0;
}

void fr_run(int n, int jobs, fr_task task, fr_release release, void *ctx, fr_result *res)
{
    fr_child *ch = jobs > 1 && n > 1 ? calloc((size_t)n, sizeof *ch) : NULL;
    if (!ch) {
        for (int i = 0; i < n; i++)
            run_here(task, ctx, i, &res[i]);
        return;
    }
    int next = 0;
    for (; next < n && next < jobs; next++)
        if (spawn(task, release, ctx, next, &ch[next]) < 0)
            ch[next].pid = 0;
    for (int i = 0; i < n; i++) {
        if (ch[i].pid > 0)
            collect(&ch[i], &res[i]);
        else
            run_here(task, ctx, i, &res[i]);
        if (next < n) {
            if (spawn(task, release, ctx, next, &ch[next]) < 0)
                ch[next].pid = 0;
            next++;
        }
    }
    free(ch);
}
