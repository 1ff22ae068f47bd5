/* SPDX-License-Identifier: MIT */
/* What the compiler needs beside lib/ in the freestanding wasm32 build,
 * and the few helpers the JavaScript module calls (bindings/js).
 *
 * The library allocates nothing; the module needs room in linear memory
 * for the arguments it passes by pointer. ntrjs_alloc() hands it out from
 * one static arena, and ntrjs_release() gives back everything above a mark,
 * so each call of a method frees what it took. */
#include <stddef.h>
#include <math.h>

#include "natremia.h"

#define NTRJS_EXPORT(name) __attribute__((export_name(#name)))

void *memset(void *dst, int c, size_t n);
void *memcpy(void *dst, const void *src, size_t n);
void *memmove(void *dst, const void *src, size_t n);
int memcmp(const void *a, const void *b, size_t n);

void *memset(void *dst, int c, size_t n)
{
    unsigned char *d = dst;
    while (n-- > 0) {
        *d++ = (unsigned char)c;
    }
    return dst;
}

void *memcpy(void *dst, const void *src, size_t n)
{
    unsigned char *d = dst;
    const unsigned char *s = src;
    while (n-- > 0) {
        *d++ = *s++;
    }
    return dst;
}

void *memmove(void *dst, const void *src, size_t n)
{
    unsigned char *d = dst;
    const unsigned char *s = src;
    if (d < s) {
        while (n-- > 0) {
            *d++ = *s++;
        }
    } else {
        while (n-- > 0) {
            d[n] = s[n];
        }
    }
    return dst;
}

int memcmp(const void *a, const void *b, size_t n)
{
    const unsigned char *x = a;
    const unsigned char *y = b;
    for (; n > 0; n--, x++, y++) {
        if (*x != *y) {
            return *x < *y ? -1 : 1;
        }
    }
    return 0;
}

/* Only reached if clang emits a call instead of the instruction. */
double sqrt(double x)
{
    return __builtin_sqrt(x);
}

double ceil(double x)
{
    return __builtin_ceil(x);
}

/* ---- the argument arena ------------------------------------------------ */

#define NTRJS_ARENA_BYTES (8u * 1024u * 1024u)

static unsigned char arena[NTRJS_ARENA_BYTES] __attribute__((aligned(16)));
static size_t arena_top;

NTRJS_EXPORT(ntrjs_alloc) void *ntrjs_alloc(size_t bytes);
NTRJS_EXPORT(ntrjs_mark) size_t ntrjs_mark(void);
NTRJS_EXPORT(ntrjs_release) void ntrjs_release(size_t mark);
NTRJS_EXPORT(ntrjs_sizeof) size_t ntrjs_sizeof(int which);

/* 16-byte aligned, zeroed; NULL when the arena is full. */
void *ntrjs_alloc(size_t bytes)
{
    size_t start = (arena_top + 15u) & ~(size_t)15u;
    if (start > NTRJS_ARENA_BYTES || bytes > NTRJS_ARENA_BYTES - start) {
        return NULL;
    }
    arena_top = start + bytes;
    return memset(arena + start, 0, bytes);
}

size_t ntrjs_mark(void)
{
    return arena_top;
}

void ntrjs_release(size_t mark)
{
    if (mark <= arena_top) {
        arena_top = mark;
    }
}

/* Sizes of the public structs as this compiler lays them out, for the
 * module's test to compare with the layouts it computes from the header. */
size_t ntrjs_sizeof(int which)
{
    switch (which) {
    case 0: return sizeof(ntr_outlook);
    case 1: return sizeof(ntr_finding_value);
    case 2: return sizeof(ntr_siad_findings);
    case 3: return sizeof(ntr_siad_result);
    case 4: return sizeof(struct ntr_method_info);
    case 5: return sizeof(ntr_sample);
    case 6: return sizeof(ntr_limits);
    case 7: return sizeof(ntr_correction);
    case 8: return sizeof(ntr_watch);
    case 9: return sizeof(ntr_course_limits);
    case 10: return sizeof(ntr_course_report);
    case 11: return sizeof(ntr_course_watch_ring);
    case 12: return sizeof(ntr_course_watch);
    case 13: return sizeof(ntr_flow);
    case 14: return sizeof(ntr_timed_flow);
    case 15: return sizeof(ntr_plan_result);
    case 16: return sizeof(ntr_course_plan_result);
    case 17: return sizeof(ntr_urine_interval);
    case 18: return sizeof(ntr_urine_feedback_result);
    case 19: return sizeof(ntr_fit);
    case 20: return sizeof(ntr_vaptan_watch);
    default: return 0;
    }
}
