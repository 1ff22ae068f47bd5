/* SPDX-License-Identifier: MIT */
/* The bounded JSON reader (json_lite.h). */
#include "json_lite.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

typedef struct jl_cursor {
    jl_doc *d;
    size_t pos, len;
} jl_cursor;

static int fail(jl_cursor *c, const char *why)
{
    if (c->d->error == NULL) {
        c->d->error = why;
        c->d->error_at = c->pos;
    }
    return -1;
}

static void skip_space(jl_cursor *c)
{
    while (c->pos < c->len) {
        char ch = c->d->text[c->pos];
        if (ch != ' ' && ch != '\t' && ch != '\r' && ch != '\n') break;
        c->pos++;
    }
}

static long new_node(jl_cursor *c, int type)
{
    jl_node *n;
    if (c->d->count == c->d->cap) return fail(c, "too many values in one line");
    n = &c->d->node[c->d->count];
    n->type = type;
    n->start = c->pos;
    n->len = 0;
    n->child = -1;
    n->next = -1;
    return (long)c->d->count++;
}

static int is_hex(char ch)
{
    return (ch >= '0' && ch <= '9') || (ch >= 'a' && ch <= 'f') || (ch >= 'A' && ch <= 'F');
}

/* A string token starting at the opening quote; checks escapes only. */
static long parse_string(jl_cursor *c)
{
    const char *t = c->d->text;
    long id;
    c->pos++; /* the opening quote */
    if ((id = new_node(c, JL_STRING)) < 0) return -1;
    while (c->pos < c->len && t[c->pos] != '"') {
        unsigned char ch = (unsigned char)t[c->pos];
        if (ch < 0x20) return fail(c, "a control character inside a string");
        if (ch == '\\') {
            char e = c->pos + 1 < c->len ? t[c->pos + 1] : '\0';
            if (e == 'u') {
                size_t k;
                for (k = 2; k < 6; ++k)
                    if (c->pos + k >= c->len || !is_hex(t[c->pos + k]))
                        return fail(c, "\\u needs four hexadecimal digits");
                c->pos += 6;
                continue;
            }
            if (strchr("\"\\/bfnrt", e) == NULL || e == '\0') return fail(c, "an unknown escape in a string");
            c->pos += 2;
            continue;
        }
        c->pos++;
    }
    if (c->pos >= c->len) return fail(c, "a string without its closing quote");
    c->d->node[id].len = c->pos - c->d->node[id].start;
    c->pos++;
    return id;
}

static int digit_at(const jl_cursor *c, size_t pos)
{
    return pos < c->len && c->d->text[pos] >= '0' && c->d->text[pos] <= '9';
}

static long parse_number(jl_cursor *c)
{
    long id = new_node(c, JL_NUMBER);
    if (id < 0) return -1;
    if (c->pos < c->len && c->d->text[c->pos] == '-') c->pos++;
    if (!digit_at(c, c->pos)) return fail(c, "not a JSON value");
    if (c->d->text[c->pos] == '0') c->pos++;
    else while (digit_at(c, c->pos)) c->pos++;
    if (c->pos < c->len && c->d->text[c->pos] == '.') {
        c->pos++;
        if (!digit_at(c, c->pos)) return fail(c, "no digit after a decimal point");
        while (digit_at(c, c->pos)) c->pos++;
    }
    if (c->pos < c->len && (c->d->text[c->pos] == 'e' || c->d->text[c->pos] == 'E')) {
        c->pos++;
        if (c->pos < c->len && (c->d->text[c->pos] == '+' || c->d->text[c->pos] == '-')) c->pos++;
        if (!digit_at(c, c->pos)) return fail(c, "no digit in an exponent");
        while (digit_at(c, c->pos)) c->pos++;
    }
    c->d->node[id].len = c->pos - c->d->node[id].start;
    return id;
}

static long parse_word(jl_cursor *c, const char *word, int type)
{
    size_t n = strlen(word);
    long id;
    if (c->len - c->pos < n || memcmp(c->d->text + c->pos, word, n) != 0)
        return fail(c, "not a JSON value");
    if ((id = new_node(c, type)) < 0) return -1;
    c->pos += n;
    c->d->node[id].len = n;
    return id;
}

static long parse_value(jl_cursor *c, int depth);

/* Link child after *last (or as parent's first child). */
static void append(jl_doc *d, long parent, long *last, long child)
{
    if (*last < 0) d->node[parent].child = child;
    else d->node[*last].next = child;
    *last = child;
}

static long parse_container(jl_cursor *c, int depth, int type)
{
    char close = type == JL_OBJECT ? '}' : ']';
    long id, last = -1;
    if (depth >= JL_MAX_DEPTH) return fail(c, "nested too deeply");
    if ((id = new_node(c, type)) < 0) return -1;
    c->pos++;
    skip_space(c);
    if (c->pos < c->len && c->d->text[c->pos] == close) {
        c->pos++;
        return id;
    }
    for (;;) {
        long item;
        skip_space(c);
        if (type == JL_OBJECT) {
            long value;
            if (c->pos >= c->len || c->d->text[c->pos] != '"') return fail(c, "a member name must be a string");
            if ((item = parse_string(c)) < 0) return -1;
            skip_space(c);
            if (c->pos >= c->len || c->d->text[c->pos] != ':') return fail(c, "':' expected after a member name");
            c->pos++;
            if ((value = parse_value(c, depth + 1)) < 0) return -1;
            c->d->node[item].child = value;
        } else if ((item = parse_value(c, depth + 1)) < 0) {
            return -1;
        }
        append(c->d, id, &last, item);
        skip_space(c);
        if (c->pos < c->len && c->d->text[c->pos] == ',') {
            c->pos++;
            continue;
        }
        if (c->pos < c->len && c->d->text[c->pos] == close) {
            c->pos++;
            return id;
        }
        return fail(c, type == JL_OBJECT ? "',' or '}' expected" : "',' or ']' expected");
    }
}

static long parse_value(jl_cursor *c, int depth)
{
    char ch;
    skip_space(c);
    if (c->pos >= c->len) return fail(c, "a value expected, the line ended");
    ch = c->d->text[c->pos];
    switch (ch) {
    case '{': return parse_container(c, depth, JL_OBJECT);
    case '[': return parse_container(c, depth, JL_ARRAY);
    case '"': return parse_string(c);
    case 't': return parse_word(c, "true", JL_TRUE);
    case 'f': return parse_word(c, "false", JL_FALSE);
    case 'n': return parse_word(c, "null", JL_NULL);
    default: return parse_number(c);
    }
}

int jl_parse(jl_doc *d, const char *text, size_t len)
{
    jl_cursor c;
    d->text = text;
    d->count = 0;
    d->error = NULL;
    d->error_at = 0;
    c.d = d;
    c.pos = 0;
    c.len = len;
    if (parse_value(&c, 0) < 0) return -1;
    skip_space(&c);
    if (c.pos != len) return fail(&c, "text after the JSON value");
    return 0;
}

/* Whether string node k holds exactly the ASCII text key. Member names
 * with escapes are decoded first, so "\u0063ode" still reads as "code". */
static int key_is(const jl_doc *d, long k, const char *key)
{
    char buf[64];
    const jl_node *n = &d->node[k];
    if (memchr(d->text + n->start, '\\', n->len) == NULL)
        return n->len == strlen(key) && memcmp(d->text + n->start, key, n->len) == 0;
    return jl_string(d, k, buf, sizeof buf) == 0 && strcmp(buf, key) == 0;
}

long jl_member(const jl_doc *d, long obj, const char *key)
{
    long k, found = -1;
    if (obj < 0 || d->node[obj].type != JL_OBJECT) return -1;
    for (k = d->node[obj].child; k >= 0; k = d->node[k].next) {
        if (!key_is(d, k, key)) continue;
        if (found >= 0) return -2;
        found = d->node[k].child;
    }
    return found;
}

long jl_path(const jl_doc *d, long obj, const char *path)
{
    char part[64];
    while (obj >= 0 && *path != '\0') {
        size_t n = strcspn(path, ".");
        if (n >= sizeof part) return -1;
        memcpy(part, path, n);
        part[n] = '\0';
        obj = jl_member(d, obj, part);
        path += n + (path[n] == '.');
    }
    return obj;
}

static int hex_value(char ch)
{
    if (ch >= '0' && ch <= '9') return ch - '0';
    if (ch >= 'a' && ch <= 'f') return ch - 'a' + 10;
    return ch - 'A' + 10;
}

static unsigned long hex4(const char *s)
{
    return (unsigned long)(hex_value(s[0]) << 12 | hex_value(s[1]) << 8 |
                           hex_value(s[2]) << 4 | hex_value(s[3]));
}

/* Append code point cp as UTF-8; -1 when it does not fit. */
static int put_utf8(char *buf, size_t cap, size_t *n, unsigned long cp)
{
    unsigned char b[4];
    size_t k, len;
    if (cp < 0x80) { b[0] = (unsigned char)cp; len = 1; }
    else if (cp < 0x800) { b[0] = (unsigned char)(0xC0 | cp >> 6); b[1] = (unsigned char)(0x80 | (cp & 0x3F)); len = 2; }
    else if (cp < 0x10000) {
        b[0] = (unsigned char)(0xE0 | cp >> 12); b[1] = (unsigned char)(0x80 | ((cp >> 6) & 0x3F));
        b[2] = (unsigned char)(0x80 | (cp & 0x3F)); len = 3;
    } else {
        b[0] = (unsigned char)(0xF0 | cp >> 18); b[1] = (unsigned char)(0x80 | ((cp >> 12) & 0x3F));
        b[2] = (unsigned char)(0x80 | ((cp >> 6) & 0x3F)); b[3] = (unsigned char)(0x80 | (cp & 0x3F)); len = 4;
    }
    if (*n + len >= cap) return -1;
    for (k = 0; k < len; ++k) buf[(*n)++] = (char)b[k];
    return 0;
}

int jl_string(const jl_doc *d, long node, char *buf, size_t cap)
{
    const char *s, *end;
    size_t n = 0;
    if (node < 0 || d->node[node].type != JL_STRING || cap == 0) return -1;
    s = d->text + d->node[node].start;
    end = s + d->node[node].len;
    while (s < end) {
        unsigned long cp;
        if (*s != '\\') {
            if (n + 1 >= cap) return -1;
            buf[n++] = *s++;
            continue;
        }
        switch (s[1]) {
        case 'b': cp = '\b'; break;
        case 'f': cp = '\f'; break;
        case 'n': cp = '\n'; break;
        case 'r': cp = '\r'; break;
        case 't': cp = '\t'; break;
        case 'u':
            cp = hex4(s + 2);
            if (cp >= 0xDC00 && cp <= 0xDFFF) return -1;
            if (cp >= 0xD800 && cp <= 0xDBFF) { /* a pair: high then low */
                unsigned long low;
                if (end - s < 12 || s[6] != '\\' || s[7] != 'u') return -1;
                low = hex4(s + 8);
                if (low < 0xDC00 || low > 0xDFFF) return -1;
                cp = 0x10000 + ((cp - 0xD800) << 10) + (low - 0xDC00);
                s += 6;
            }
            if (cp == 0) return -1;
            s += 6;
            if (put_utf8(buf, cap, &n, cp) != 0) return -1;
            continue;
        default: cp = (unsigned char)s[1]; break; /* " \ / */
        }
        s += 2;
        if (n + 1 >= cap) return -1;
        buf[n++] = (char)cp;
    }
    buf[n] = '\0';
    return 0;
}

int jl_number(const jl_doc *d, long node, double *out)
{
    char buf[64];
    double v;
    const jl_node *n;
    if (node < 0 || d->node[node].type != JL_NUMBER) return -1;
    n = &d->node[node];
    if (n->len >= sizeof buf) return -1;
    memcpy(buf, d->text + n->start, n->len);
    buf[n->len] = '\0';
    v = strtod(buf, NULL); /* the grammar was checked; "C" locale */
    if (!isfinite(v)) return -1;
    *out = v;
    return 0;
}
