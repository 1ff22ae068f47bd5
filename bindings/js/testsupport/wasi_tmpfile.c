/* SPDX-License-Identifier: MIT */
/* WASI has no tmpfile(); the reference-vector program needs it only for
 * its --check mode, which the WebAssembly run does not use (it prints the
 * vectors and the JavaScript test compares them). */
#include <stdio.h>

FILE *refvectors_wasi_tmpfile(void)
{
    return NULL;
}
