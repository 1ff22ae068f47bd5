/* SPDX-License-Identifier: MIT */
/* Command-line handling shared by the example programs (example code, not
 * part of the library).
 *
 * The conventions every example follows:
 *   --help or -h      prints the usage on standard output, exit 0;
 *   any other word starting with "-" that is not a number is an unknown
 *                     option: refused with its name, exit 2 (it never
 *                     becomes a value or a file name); "--" ends the
 *                     options, for a file name that starts with "-";
 *   a value that is not a number, or a name not in the list, is refused
 *                     with the argument's name and text, exit 2;
 *   a value the library refuses (out of range, say) is refused with the
 *                     argument's name and the library's message, exit 1. */
#ifndef NTR_EXAMPLE_CLI_H
#define NTR_EXAMPLE_CLI_H

#define CLI_EXIT_USAGE 2
#define CLI_EXIT_REFUSED 1

typedef struct cli {
    const char *program; /* name in messages */
    const char *usage;   /* full usage text, ending with a newline */
    int argc;            /* the operands left after the options */
    char **argv;         /* argv[0..argc-1]: the operands */
} cli;

/* Read the options. Returns -1 to go on (cli->argc/argv hold the
 * operands), or the exit status the program should return at once: 0
 * after --help, CLI_EXIT_USAGE after an unknown option. */
int cli_start(cli *c, const char *program, const char *usage, int argc,
              char **argv);

/* Refuse the command line: the message, then a pointer to --help, on
 * standard error. Returns CLI_EXIT_USAGE. */
int cli_usage_error(const cli *c, const char *message);

/* The whole text as a number; on failure print "NAME 'TEXT' is not a
 * number" and return 0, else 1. */
int cli_number(const cli *c, const char *name, const char *text, double *out);

/* A word not in the list: print "NAME 'TEXT' is not one of: CHOICES"
 * and a pointer to --help. Returns CLI_EXIT_USAGE. */
int cli_bad_choice(const cli *c, const char *name, const char *text,
                   const char *choices);

/* Name a refused argument with the library's message for status.
 * Returns CLI_EXIT_REFUSED. */
int cli_refused(const cli *c, const char *name, const char *text, int status);

#endif
