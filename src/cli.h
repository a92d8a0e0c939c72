/* cli.h - what every subcommand shares: the models directory and option
 * handling conventions.
 *
 * Each command is a function `int cmd_NAME(int argc, char **argv)` that
 * parses its own options with getopt_long, prints results on stdout and
 * diagnostics on stderr, and returns an exit code from diag.h.
 */
#ifndef CLI_H
#define CLI_H

#include <stdio.h>

/* The models directory: --models, else $ROWGRAZE_MODELS, else the one
 * compiled in (the source tree's models/). */
const char *cli_models_dir(const char *option);

/* Prints "rowgraze: error: MSG" and returns RG_EXIT_INPUT. */
int cli_input_error(const char *msg);

/* Prints a usage error with a hint to run --help; returns RG_EXIT_INPUT. */
int cli_usage_error(const char *cmd, const char *fmt, ...)
    __attribute__((format(printf, 2, 3)));

int cmd_check(int argc, char **argv);
int cmd_strips(int argc, char **argv);
int cmd_growth(int argc, char **argv);
int cmd_plan(int argc, char **argv);

#endif
