/* cli.c - helpers shared by the subcommands (models directory, errors). */
#include "cli.h"

#include <stdarg.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "diag.h"
#include "tcal.h"

#ifndef RG_MODELS_DIR
#define RG_MODELS_DIR "models"
#endif

const char *cli_models_dir(const char *option)
{
    if (option && option[0])
        return option;
    const char *env = getenv("ROWGRAZE_MODELS");
    if (env && env[0])
        return env;
    return RG_MODELS_DIR;
}

int cli_input_error(const char *msg)
{
    fprintf(stderr, "rowgraze: error: %s\n", msg);
    return RG_EXIT_INPUT;
}

int cli_usage_error(const char *cmd, const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    fputs("rowgraze: error: ", stderr);
    vfprintf(stderr, fmt, ap);
    fprintf(stderr, "\nTry 'rowgraze %s --help'.\n", cmd ? cmd : "");
    va_end(ap);
    return RG_EXIT_INPUT;
}

int cli_date(const char *cmd, const char *opt, const char *arg, int64_t *day)
{
    if (tcal_parse_date(arg, day) == 0)
        return 0;
    cli_usage_error(cmd, "%s: %s: expected a date YYYY-MM-DD, found \"%s\"", cmd, opt, arg);
    return -1;
}

int cli_format(const char *cmd, const char *arg, int *fmt)
{
    static const char *const names[] = {"table", "csv", "json"};
    for (int k = 0; k < 3; k++)
        if (strcmp(arg, names[k]) == 0) {
            *fmt = k;
            return 0;
        }
    cli_usage_error(cmd, "%s: --format: expected table, csv or json, found \"%s\"", cmd, arg);
    return -1;
}

int cli_load(const char *path, const char *models, site *s, wx_set *wx)
{
    rg_err err = {{0}};
    if (site_load(path, cli_models_dir(models), s, &err) < 0)
        return cli_input_error(err.msg);
    if (wx_load(&s->weather, wx, &err) < 0) {
        site_free(s);
        return cli_input_error(err.msg);
    }
    return RG_EXIT_OK;
}

void cli_unload(site *s, wx_set *wx)
{
    wx_free(wx);
    site_free(s);
}

int cli_finish(int rc, const rg_err *err)
{
    if (rc != RG_EXIT_OK)
        fprintf(stderr, "rowgraze: error: %s\n", err->msg);
    return rc;
}

FILE *cli_out_begin(const char *path, textfile_out *out, rg_err *err)
{
    if (!path)
        return stdout;
    return textfile_begin(out, path, err) < 0 ? NULL : out->fp;
}

int cli_out_end(const char *path, textfile_out *out, rg_err *err)
{
    if (!path)
        return fflush(stdout) == 0 ? RG_EXIT_OK : (rg_fail(err, "cannot write to standard output"), RG_EXIT_RUNTIME);
    return textfile_commit(out, err) < 0 ? RG_EXIT_RUNTIME : RG_EXIT_OK;
}

void cli_out_abort(const char *path, textfile_out *out)
{
    if (path)
        textfile_abort(out);
}

int cli_number(const char *cmd, const char *opt, const char *arg, double lo, double hi, int whole,
               double *out)
{
    char *end;
    double x = strtod(arg, &end);
    if (end == arg || *end || !(x >= lo && x <= hi) || (whole && x != floor(x)))
        return cli_usage_error(cmd, "%s: %s: expected %s from %.15g to %.15g, found \"%s\"", cmd, opt,
                               whole ? "a whole number" : "a number", lo, hi, arg), -1;
    *out = x;
    return 0;
}
