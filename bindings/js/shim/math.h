/* SPDX-License-Identifier: MIT */
/* The part of <math.h> that lib/ uses, for the freestanding wasm32 build
 * (bindings/js/build.sh). WebAssembly has f64.sqrt and f64.ceil as
 * instructions, both exact as IEEE 754 requires, so clang lowers these
 * to them and the results equal the C library's bit for bit. */
#ifndef NTRJS_MATH_H
#define NTRJS_MATH_H

#define HUGE_VAL (__builtin_huge_val())
#define NAN (__builtin_nanf(""))
#define isfinite(x) __builtin_isfinite(x)
#define isnan(x) __builtin_isnan(x)

double sqrt(double x);
double ceil(double x);

#endif
