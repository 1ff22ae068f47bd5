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

#define NTRC_MAX_NUM 12
#define NTRC_MAX_ENUM 4
#define NTRC_MAX_OUT_D 8
#define NTRC_MAX_OUT_I 4
#define NTRC_MAX_SERIES 64
#define NTRC_MAX_VALID 12

/* Bit in ntrc_case.out_null for double output i and int output j. */
#define NTRC_NULL_D(i) (1u << (i))
#define NTRC_NULL_I(j) (1u << (16 + (j)))
/* Extra pointer inputs (series, strings) have NULL bits too. */
#define NTRC_NULL_IN(k) (1u << (24 + (k)))

/* One call: the arguments and the storage the outputs point to. */
typedef struct ntrc_case {
    double num[NTRC_MAX_NUM];
    int en[NTRC_MAX_ENUM];
    unsigned int out_null; /* NTRC_NULL_* bits: pass NULL instead */
    double out_d[NTRC_MAX_OUT_D];
    int out_i[NTRC_MAX_OUT_I];
    /* Series inputs for functions that take arrays. */
    size_t n;
    double series_a[NTRC_MAX_SERIES];
    double series_b[NTRC_MAX_SERIES];
    double series_c[NTRC_MAX_SERIES];
    /* Caller buffer for functions that write arrays. */
    size_t capacity;
    double buf[NTRC_MAX_SERIES];
} ntrc_case;

typedef struct ntrc_num {
    const char *name;
    double lo;
    double hi;
} ntrc_num;

typedef struct ntrc_enum {
    const char *name;
    int error;                      /* status for a value not in valid[] */
    int n_valid;
    int valid[NTRC_MAX_VALID];
} ntrc_enum;

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
    double base_num[NTRC_MAX_NUM]; /* a valid call that returns NTR_OK */
    int base_en[NTRC_MAX_ENUM];
    int (*call)(ntrc_case *c);
    /* Optional: the status the checks must give, when the generic model
     * (NULL, enumerators, numbers in order) is not the whole story (unit
     * compatibility, series order, capacity). Return -1 to defer to the
     * generic model. */
    int (*predict)(const struct ntrc_fn *f, const ntrc_case *c);
    /* Optional: fill c's series/capacity for a baseline call. */
    void (*base_series)(ntrc_case *c);
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

#endif
