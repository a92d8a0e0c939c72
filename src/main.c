/* main.c - rowgraze's entry point: argv -> subcommand -> exit code.
 *
 * Exit codes: 0 success, 1 runtime failure, 2 bad input or usage.
 * Results go to stdout, diagnostics to stderr.
 */
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "diag.h"

#ifndef RG_VERSION
#define RG_VERSION "0.0.0"
#endif

typedef struct command {
    const char *name;
    int (*run)(int argc, char **argv);
    const char *summary;
} command;

static const command commands[] = {
    {"check", cmd_check, "validate a site file and its weather; print a summary"},
    {"strips", cmd_strips, "light, rain, leaf temperature and VPD across a tracker row"},
    {"growth", cmd_growth, "forecast growth of every paddock by week"},
    {"plan", cmd_plan, "plan the rotation week by week (GLPK) and print the calendar"},
    {"report", cmd_report, "write the plan as one self-contained HTML report (print-ready)"},
    {"walk-sheet", cmd_walksheet, "the sheet for a pasture walk: last and predicted cover"},
    {"compare", cmd_compare, "plan several scenarios (--set PATH=V1,V2,...) and compare them"},
    {"capacity", cmd_capacity, "the most head the site carries within supplement/mowing limits"},
};
#define N_COMMANDS (sizeof commands / sizeof commands[0])

static void usage(FILE *out)
{
    fputs("usage: rowgraze COMMAND [OPTIONS] SITE.json\n"
          "       rowgraze --help | --version\n\n"
          "Plans grazing of pasture under single-axis solar trackers.\n\n"
          "Commands:\n", out);
    for (size_t i = 0; i < N_COMMANDS; i++)
        fprintf(out, "  %-11s %s\n", commands[i].name, commands[i].summary);
    fputs("\nRun 'rowgraze COMMAND --help' for a command's options.\n"
          "Exit status: 0 ok, 1 runtime failure, 2 bad input or usage.\n", out);
}

int main(int argc, char **argv)
{
    if (argc < 2) {
        usage(stderr);
        return RG_EXIT_INPUT;
    }
    const char *cmd = argv[1];
    if (strcmp(cmd, "--help") == 0 || strcmp(cmd, "-h") == 0 || strcmp(cmd, "help") == 0) {
        usage(stdout);
        return RG_EXIT_OK;
    }
    if (strcmp(cmd, "--version") == 0) {
        printf("rowgraze %s\n", RG_VERSION);
        return RG_EXIT_OK;
    }
    for (size_t i = 0; i < N_COMMANDS; i++)
        if (strcmp(cmd, commands[i].name) == 0)
            return commands[i].run(argc - 1, argv + 1);
    const char *names[N_COMMANDS];
    for (size_t i = 0; i < N_COMMANDS; i++)
        names[i] = commands[i].name;
    const char *near = rg_suggest(cmd, names, N_COMMANDS);
    fprintf(stderr, "rowgraze: error: unknown command '%s'%s%s%s\n", cmd,
            near ? "; did you mean '" : "", near ? near : "", near ? "'?" : "");
    fputs("Try 'rowgraze --help'.\n", stderr);
    return RG_EXIT_INPUT;
}
