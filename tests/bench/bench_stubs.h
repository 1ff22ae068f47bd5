/* SPDX-License-Identifier: MIT */
/* Do-nothing functions with the same signatures as the library's entry
 * points. They live in their own translation unit (bench_stubs.c) so the
 * compiler cannot inline them: a loop calling one of them costs exactly what
 * the same loop calling the library costs, minus the library's own work.
 * That difference is what bench_scalar reports. */
#ifndef BENCH_STUBS_H
#define BENCH_STUBS_H

#include <stddef.h>

int stub_p_ip(const char *s, int *out);
int stub_p_ippp(const char *s, int *out1, int *out2, int *out3);
int stub_didd_p(double a, int b, double c, double d, double *out);
int stub_idiid_p(int a, double b, int c, int d, double *out);
int stub_ddddi_p(double a, double b, double c, double d, int e, double *out);
int stub_dd_p(double a, double b, double *out);
int stub_ddi_p(double a, double b, int c, double *out);
int stub_ddd_p(double a, double b, double c, double *out);
int stub_idd_p(int a, double b, double c, double *out);
int stub_iddd_p(int a, double b, double c, double d, double *out);
int stub_i_pp(int a, double *out1, double *out2);
int stub_dddd_p(double a, double b, double c, double d, double *out);
int stub_ddddd_p(double a, double b, double c, double d, double e, double *out);
int stub_d_ip(double a, int *out);
const char *stub_i_str(int a);
const char *stub_v_str(void);
unsigned long stub_v_ul(void);
int stub_i_vp(int a, void *out);
int stub_pz_pp(const void *a, size_t n, const void *b, void *out);
int stub_pdd_p(void *state, double a, double b, void *out);
int stub_dddi_pp(double a, double b, double c, int d, int *out1,
                 unsigned int *out2);
int stub_dddddi_pp(double a, double b, double c, double d, double e, int f,
                   int *out1, unsigned int *out2);
int stub_v_p(void *out);
int stub_pp(const void *in, void *out);
int stub_diiii_ppp(double a, int b, int c, int d, int e, int *out1,
                   unsigned int *out2, unsigned int *out3);
int stub_d9_pp(double a, double b, double c, double d, double e, double f,
               double g, double h, double i, double *out1, double *out2);
int stub_ddpz_pp(double a, double b, const void *p, size_t n, double *out1,
                 double *out2);
int stub_ddpzdd_pzp(double a, double b, const void *p, size_t n, double c,
                    double d, void *out, size_t cap, size_t *count);
int stub_pzdpzddp_p(const void *h, size_t nh, double a, const void *f,
                    size_t nf, double b, double c, const void *lim, void *out);

/* Solute area (lib/solute.c). */
int stub_id_p(int a, double b, double *out);
int stub_d6_p(double a, double b, double c, double d, double e, double f,
              double *out);
int stub_id7_p(int a, double b, double c, double d, double e, double f,
               double g, double h, double *out);
int stub_d7_vp(double a, double b, double c, double d, double e, double f,
               double g, void *out);

/* 1.1 functions of feedback, therapy and course areas (issue 16). */
int stub_ddd_ip(double a, double b, double c, int *out);
int stub_d6_pp(double a, double b, double c, double d, double e, double f,
               double *out1, double *out2);
int stub_d7_pp(double a, double b, double c, double d, double e, double f,
               double g, double *out1, double *out2);
int stub_ii_vp(int a, int b, void *out);

#endif
