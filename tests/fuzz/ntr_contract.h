/* SPDX-License-Identifier: MIT */
/* The calling contract of every public function, as data.
 *
 * One table describes each computing function of include/natremia.h: its
 * enumerator and numeric inputs with their documented ranges, its outputs,
 * the statuses its documentation allows, a valid baseline call and a check
 * that a successful result is finite and within documented bounds. Three
 * programs share it:
 *   - tests/fuzz/fuzz_natremia.c (libFuzzer) decodes raw bytes into calls;
 *   - tests/test_badinput.c walks every function through a bad-input matrix;
 *   - tests/refvectors/refvectors.c prints results on a fixed input set.
 *
 * The model of the checking order is the one the header states: NULL
 * pointers, then unknown enumerators, then numeric inputs in argument order
 * (for each: NaN/infinity gives NTR_ERR_NONFINITE, out of range
 * NTR_ERR_RANGE), then whether the formula is defined (NTR_ERR_DOMAIN). The
 * model predicts every status but the last exactly, so a function that
 * checks in another order, or reports the wrong code, is caught.
 *
 * When a public function is added to the header, add its entry to the table
 * in ntr_contract.c; tests/test_badinput.c fails if an NTR_API name in the
 * header has no entry.
 */
#ifndef NTR_CONTRACT_H
#define NTR_CONTRACT_H

#include <stddef.h>

#include "natremia.h"

#define NTRC_MAX_NUM 12
#define NTRC_MAX_ENUM 20
#define NTRC_MAX_OUT_D 8
#define NTRC_MAX_OUT_I 4
#define NTRC_MAX_SERIES 64
#define NTRC_MAX_FLOWS 8
#define NTRC_MAX_VALID 12

/* Bit in ntrc_case.out_null for double output i and int output j. */
#define NTRC_NULL_D(i) (1u << (i))
#define NTRC_NULL_I(j) (1u << (16 + (j)))
/* Pointer inputs and struct/series outputs have NULL bits too; which
 * pointer each k means is up to the entry's call function. */
#define NTRC_NULL_IN(k) (1u << (24 + (k)))

/* Everything a function may write. It is filled with one byte pattern
 * before each call, so "untouched" means every byte still holds it. */
typedef struct ntrc_outs {
    double d[NTRC_MAX_OUT_D];
    int i[NTRC_MAX_OUT_I]; /* also holds unsigned int outputs */
    size_t z[2];
    ntr_sample samples[NTRC_MAX_SERIES];
    union {
        ntr_limits lim;
        ntr_correction corr;
        ntr_plan_result plan;
        struct ntr_method_info info;
        ntr_siad_findings findings;
        ntr_siad_result siad;
        ntr_watch watch;
        ntr_course_limits clim;
        ntr_course_report course;
        ntr_course_watch cwatch;
        ntr_outlook outlook;
        struct {
            ntr_correction out[8];
            int status[8];
        } groups;
        ntr_course_plan_result course_plan;
        ntr_urine_feedback_result feedback;
        ntr_fit fit;
        ntr_timed_flow tflow;
        ntr_vaptan_watch vaptan;
        struct {
            /* reports at a stride of up to sizeof + 64 bytes */
            unsigned char out[8 * (sizeof(ntr_course_report) + 64)];
            int status[8];
        } course_groups;
    } s;
} ntrc_outs;

/* One call: the arguments and the storage the outputs point to. */
typedef struct ntrc_case {
    double num[NTRC_MAX_NUM];
    int en[NTRC_MAX_ENUM];
    unsigned int out_null; /* NTRC_NULL_* bits: pass NULL instead */
    /* Series and struct inputs for the functions that take them. */
    size_t n;               /* samples / flows in use */
    size_t n2;              /* timed flows in use */
    size_t capacity;        /* output series capacity */
    size_t groups;          /* groups of ntr_batch_correction_assess */
    size_t offsets[9];      /* their CSR offsets into samples[] */
    ntr_sample samples[NTRC_MAX_SERIES];
    ntr_flow flows[NTRC_MAX_FLOWS];
    ntr_timed_flow tflows[NTRC_MAX_FLOWS];
    ntr_urine_interval urine[NTRC_MAX_FLOWS]; /* measured urine of ntr_urine_feedback */
    size_t n3;              /* intervals in use */
    ntr_siad_findings findings;
    ntr_watch watch;        /* input state of ntr_watch_push/result */
    ntr_watch watch_clean;  /* the same before any deliberate damage */
    ntr_course_watch cwatch;       /* input state of ntr_course_watch_push/result */
    ntr_course_watch cwatch_clean; /* the same before any deliberate damage */
    ntrc_outs out;
} ntrc_case;

typedef struct ntrc_num {
    const char *name;
    double lo;
    double hi;
    int lo_open; /* 1: lo itself is out of range ("above lo") */
} ntrc_num;

typedef struct ntrc_enum {
    const char *name;
    int error;                      /* status for a value not in valid[] */
    int n_valid;
    int valid[NTRC_MAX_VALID];
} ntrc_enum;

/* Where the fuzzer's numbers come from: number() returns a value for an
 * input documented as lo..hi (mostly inside, sometimes not), byte() any
 * byte. */
typedef struct ntrc_source {
    double (*number)(struct ntrc_source *src, double lo, double hi);
    unsigned int (*byte)(struct ntrc_source *src);
    void *ctx;
} ntrc_source;

/* Kinds of bad-input case, for the counts test_badinput.c prints. */
enum { NTRC_KIND_NULL, NTRC_KIND_ENUM, NTRC_KIND_NUMBER, NTRC_KIND_ORDER,
       NTRC_KIND_SERIES, NTRC_KIND_SWEEP, NTRC_KIND_OTHER, NTRC_KIND_BATCH };

typedef struct ntrc_fn {
    const char *name;
    int n_enum;
    ntrc_enum en[NTRC_MAX_ENUM];
    int n_num;
    ntrc_num num[NTRC_MAX_NUM];
    int n_out_d;
    int n_out_i;
    int n_in_ptr;        /* pointer inputs that may be NULL (NTRC_NULL_IN) */
    unsigned int statuses; /* documented statuses, bit (1u << status) */
    /* Statuses the function may give when every check the model knows
     * passes: NTR_ERR_DOMAIN by default (0 here), or others such as
     * NTR_ERR_CAPACITY or NTR_ERR_RANGE (end of an iteration). */
    unsigned int may_fail;
    double base_num[NTRC_MAX_NUM]; /* a valid call that returns NTR_OK */
    int base_en[NTRC_MAX_ENUM];
    int (*call)(ntrc_case *c);
    /* Optional: the status the checks must give, when the generic model
     * (NULL, enumerators, numbers in order) is not the whole story (unit
     * compatibility, series order, capacity). Return -1 to defer to the
     * generic model. */
    int (*predict)(const struct ntrc_fn *f, const ntrc_case *c);
    /* Optional: fill c's series, flows or structs for a baseline call
     * from its numbers (called after num/en are set). */
    void (*base_series)(ntrc_case *c);
    /* Optional: fill them from a source of numbers (the fuzzer). */
    void (*fuzz_series)(ntrc_case *c, struct ntrc_source *src);
    /* Optional: called after the outputs are sentinel-filled and before
     * the call, to set what the caller must set in an output struct
     * (struct_size). */
    void (*prepare_out)(ntrc_case *c);
    /* Optional: judge an error status beyond "outputs untouched" (which is
     * then not checked generically); NULL when it holds. */
    const char *(*check_err)(const ntrc_case *c, const ntrc_outs *before, int status);
    /* 1 when a successful call may change its input state (ntr_watch). */
    int mutates_input;
    /* Optional: the result values to print as reference vectors (struct
     * outputs); by default the double then the int outputs. */
    int (*results)(const ntrc_case *c, double *vals, int max);
    /* Optional: bad-input cases beyond the generic matrix (n = 0,
     * unsorted series, too-small buffers, bad struct members). */
    void (*extra_cases)(const struct ntrc_fn *f,
                        void (*judge)(const struct ntrc_fn *f, ntrc_case *c, int kind));
    /* NULL when the successful result c meets the documented bounds,
     * otherwise a short description of the breach. */
    const char *(*check_ok)(const ntrc_case *c);
} ntrc_fn;

extern const ntrc_fn ntrc_functions[];
extern const size_t ntrc_n_functions;

/* Public functions with no status (messages and version) are exercised by
 * each program directly; their names are listed here for the header scan. */
extern const char *const ntrc_statusless[];
extern const size_t ntrc_n_statusless;

/* Set up c as f's valid baseline call, with outputs sentinel-filled. */
void ntrc_baseline(const ntrc_fn *f, ntrc_case *c);

/* A setup call that cannot fail (a preset that exists, limits from a
 * preset): aborts when it returns anything but NTR_OK, as the contract's
 * premise is then broken. The header's NTR_MUST_CHECK asks for a status to
 * be looked at; this is how the harness looks at it. */
void ntrc_setup_ok(int status);

/* Fill every output with the sentinel bit pattern. */
void ntrc_fill_sentinel(ntrc_case *c);

/* The status the checks must return for c, or NTR_OK when every check
 * passes (the function may then return NTR_OK or, where documented,
 * NTR_ERR_DOMAIN). */
int ntrc_predict(const ntrc_fn *f, const ntrc_case *c);

/* Run c through f and judge the result against the contract. Returns NULL
 * when the contract holds, else a description (static storage). *status
 * receives what the function returned. */
const char *ntrc_run_and_judge(const ntrc_fn *f, ntrc_case *c, int *status);

/* Whether a value is one of f's valid choices for enumerator i. */
int ntrc_enum_is_valid(const ntrc_fn *f, int i, int value);

/* Nonzero when output storage still holds the sentinel everywhere. */
int ntrc_outputs_untouched(const ntrc_case *c);

/* ---- batch entry points ----------------------------------------------- */

#define NTRC_MAX_ROWS 24
#define NTRC_MAX_COLS 6

/* One batch call: columns of row inputs, a per-row enumerator (sex), and
 * the row outputs. */
typedef struct ntrc_batch_case {
    size_t n;
    double col[NTRC_MAX_COLS][NTRC_MAX_ROWS];
    int row_en[NTRC_MAX_ROWS];
    int call_en;           /* enumerator passed once (formula, method) */
    unsigned int null_mask; /* bit k < NTRC_MAX_COLS: column k NULL;
                               bit 8 row_en, 9 out, 10 status, 11 failed */
    int in_place;          /* 1 + k: out is column k itself */
    double out[NTRC_MAX_ROWS];
    int out_i[NTRC_MAX_ROWS];
    int status[NTRC_MAX_ROWS];
    size_t failed;
} ntrc_batch_case;

typedef struct ntrc_batch_fn {
    const char *name;
    const char *scalar;    /* the table entry it must agree with */
    int n_cols;            /* double input columns, in scalar num order */
    int row_enum;          /* 1: the scalar's en[0] is a per-row array */
    int call_enum;         /* 1: the scalar's en[0] is one argument */
    int int_out;           /* 1: the output is int (advice), else double */
    int (*call)(ntrc_batch_case *b);
} ntrc_batch_fn;

extern const ntrc_batch_fn ntrc_batch_functions[];
extern const size_t ntrc_n_batch_functions;

/* The scalar entry named, or NULL. */
const ntrc_fn *ntrc_find(const char *name);

/* Run a batch call and judge it against the batch contract and the scalar
 * function row by row. NULL when it holds. */
const char *ntrc_batch_run_and_judge(const ntrc_batch_fn *bf, ntrc_batch_case *b, int *status);

/* ---- ntr_watch: streaming equals the whole-series assessment ----------- */

/* Push the samples one by one into a watcher with limits lim (pushes that
 * are rejected are judged too and leave the state alone); after each
 * accepted push compare with ntr_correction_assess over the accepted ones.
 * NULL when the contract holds. *accepted receives the count. */
const char *ntrc_watch_replay(const ntr_limits *lim, const ntr_sample *s, size_t n,
                              size_t *accepted);

#endif
