/* SPDX-License-Identifier: MIT */
/* A small, bounded JSON reader for one line of NDJSON: the whole text is
 * checked against the JSON grammar (RFC 8259) into a fixed array of nodes;
 * nothing is decoded until asked. Nesting deeper than JL_MAX_DEPTH or more
 * than the node array holds is refused, so a hostile line costs bounded
 * memory and stack. */
#ifndef NC_JSON_LITE_H
#define NC_JSON_LITE_H

#include <stddef.h>

#define JL_MAX_DEPTH 32

#define JL_OBJECT 1
#define JL_ARRAY 2
#define JL_STRING 3
#define JL_NUMBER 4
#define JL_TRUE 5
#define JL_FALSE 6
#define JL_NULL 7

/* An object's children are its keys (JL_STRING), each key's child its
 * value; an array's children are its values. Indices; -1 for none. */
typedef struct jl_node {
    int type;
    size_t start, len; /* the token's text (a string: inside the quotes) */
    long child, next;
} jl_node;

typedef struct jl_doc {
    const char *text;
    jl_node *node;
    size_t count, cap;
    size_t error_at;   /* byte offset of a syntax error */
    const char *error; /* its reason, static */
} jl_doc;

/* Parse text[0..len); 0 on success, -1 with error/error_at set. The
 * caller provides node[cap]. */
int jl_parse(jl_doc *d, const char *text, size_t len);

/* The value of member key of object obj: its index, -1 when absent or obj
 * is not an object, -2 when the key appears more than once. */
long jl_member(const jl_doc *d, long obj, const char *key);

/* Follow "a.b.c" from obj; as jl_member. */
long jl_path(const jl_doc *d, long obj, const char *path);

/* A string's value, decoded to UTF-8, NUL-terminated, in buf[cap]; 0, or
 * -1 (not a string, a lone surrogate, an embedded NUL, or too long). */
int jl_string(const jl_doc *d, long node, char *buf, size_t cap);

/* A number's value; 0, or -1 (not a number, or not finite as a double). */
int jl_number(const jl_doc *d, long node, double *out);

#endif
