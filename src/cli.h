/* cli.h - what every subcommand shares: the models directory and option
 * handling conventions.
 *
 * Each command is a function `int cmd_NAME(int argc, char **argv)` that
 * parses its own options with getopt_long, prints results on stdout and
 * diagnostics on stderr, and returns an exit code from diag.h.
 */
#ifndef CLI_H
#define CLI_H

#include <stdint.h>
#include <stdio.h>

#include "diag.h"
#include "site.h"
#include "textfile.h"
#include "weather.h"

/* Output formats every command that prints results offers. */
enum cli_fmt { CLI_TABLE, CLI_CSV, CLI_JSON };

/* Reads a date option's argument (YYYY-MM-DD) into a day number (tcal.h);
 * on a bad one prints the usage error and returns -1. */
int cli_date(const char *cmd, const char *opt, const char *arg, int64_t *day);

/* Reads a numeric option's argument into *out: a number from lo to hi (a
 * whole one when whole is set).  On a bad one prints the usage error
 * "CMD: OPT: expected a number from LO to HI, found "ARG"" and returns -1. */
int cli_number(const char *cmd, const char *opt, const char *arg, double lo, double hi, int whole,
               double *out);

/* Reads --format's argument into *fmt; on a bad one prints the usage error
 * and returns -1. */
int cli_format(const char *cmd, const char *arg, int *fmt);

/* Loads the site file and every weather file it names.  On failure prints
 * the one error line and returns RG_EXIT_INPUT, with nothing left to free;
 * else RG_EXIT_OK (free with cli_unload). */
int cli_load(const char *path, const char *models, site *s, wx_set *wx);
void cli_unload(site *s, wx_set *wx);

/* Prints "rowgraze: error: MSG" when rc is not RG_EXIT_OK; returns rc. */
int cli_finish(int rc, const rg_err *err);

/* Where results go: stdout, or (path not NULL) a temporary file renamed
 * over path by cli_out_end when everything was written.  cli_out_begin
 * returns NULL (message in err) when the file cannot be opened. */
FILE *cli_out_begin(const char *path, textfile_out *out, rg_err *err);
int cli_out_end(const char *path, textfile_out *out, rg_err *err);
/* Gives up an output begun with cli_out_begin: a file target is left as
 * it was (stdout cannot be taken back). */
void cli_out_abort(const char *path, textfile_out *out);

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
int cmd_walksheet(int argc, char **argv);
int cmd_report(int argc, char **argv);
int cmd_compare(int argc, char **argv);
int cmd_capacity(int argc, char **argv);

#endif
