/* cli.c - helpers shared by the subcommands (models directory, errors). */
#include "cli.h"

#include <stdarg.h>
#include <stdlib.h>

#include "diag.h"

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
