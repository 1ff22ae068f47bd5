/* SPDX-License-Identifier: MIT */
/* Command-line handling shared by the example programs (example_cli.h). */
#include "example_cli.h"

#include <natremia.h>

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* "-5" or "-.5" is a (negative) value, not an option: the library then
 * judges its range. */
static int looks_like_number(const char *text)
{
    char *end;
    (void)strtod(text, &end);
    return end != text && *end == '\0';
}

int cli_usage_error(const cli *c, const char *message)
{
    fprintf(stderr, "%s: %s\n(%s --help shows the usage)\n", c->program,
            message, c->program);
    return CLI_EXIT_USAGE;
}

int cli_start(cli *c, const char *program, const char *usage, int argc,
              char **argv)
{
    int i, kept = 0, options_end = 0;
    c->program = program;
    c->usage = usage;
    for (i = 1; i < argc && strcmp(argv[i], "--") != 0; ++i) {
        if (strcmp(argv[i], "--help") == 0 || strcmp(argv[i], "-h") == 0) {
            fputs(usage, stdout);
            return 0;
        }
    }
    /* Keep the operands, in order, at the front of argv[1..]. */
    for (i = 1; i < argc; ++i) {
        char *a = argv[i];
        if (!options_end && strcmp(a, "--") == 0) {
            options_end = 1;
            continue;
        }
        if (!options_end && a[0] == '-' && a[1] != '\0' && !looks_like_number(a)) {
            char message[160];
            snprintf(message, sizeof message, "unknown option '%s'", a);
            return cli_usage_error(c, message);
        }
        argv[1 + kept++] = a;
    }
    c->argc = kept;
    c->argv = argv + 1;
    return -1;
}

int cli_number(const cli *c, const char *name, const char *text, double *out)
{
    if (!looks_like_number(text)) {
        fprintf(stderr, "%s: %s '%s' is not a number\n", c->program, name, text);
        return 0;
    }
    *out = strtod(text, NULL);
    return 1;
}

int cli_bad_choice(const cli *c, const char *name, const char *text,
                   const char *choices)
{
    char message[256];
    snprintf(message, sizeof message, "%s '%s' is not one of: %s", name, text, choices);
    return cli_usage_error(c, message);
}

int cli_refused(const cli *c, const char *name, const char *text, int status)
{
    fprintf(stderr, "%s: %s %s refused: %s\n", c->program, name, text,
            ntr_status_message(status));
    return CLI_EXIT_REFUSED;
}
