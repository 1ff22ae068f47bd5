/* SPDX-License-Identifier: MIT */
/* Empty counterparts of the library's entry points (see bench_stubs.h). */
#include "bench_stubs.h"

int stub_p_ip(const char *s, int *out) { (void)s; (void)out; return 0; }
int stub_p_ippp(const char *s, int *out1, int *out2, int *out3)
{
    (void)s; (void)out1; (void)out2; (void)out3;
    return 0;
}
int stub_didd_p(double a, int b, double c, double d, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)out;
    return 0;
}
int stub_idiid_p(int a, double b, int c, int d, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)out;
    return 0;
}
int stub_ddddi_p(double a, double b, double c, double d, int e, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)out;
    return 0;
}
int stub_dd_p(double a, double b, double *out)
{
    (void)a; (void)b; (void)out;
    return 0;
}
int stub_ddi_p(double a, double b, int c, double *out)
{
    (void)a; (void)b; (void)c; (void)out;
    return 0;
}
int stub_ddd_p(double a, double b, double c, double *out)
{
    (void)a; (void)b; (void)c; (void)out;
    return 0;
}
int stub_idd_p(int a, double b, double c, double *out)
{
    (void)a; (void)b; (void)c; (void)out;
    return 0;
}
int stub_iddd_p(int a, double b, double c, double d, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)out;
    return 0;
}
int stub_i_pp(int a, double *out1, double *out2)
{
    (void)a; (void)out1; (void)out2;
    return 0;
}
int stub_dddd_p(double a, double b, double c, double d, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)out;
    return 0;
}
int stub_ddddd_p(double a, double b, double c, double d, double e, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)out;
    return 0;
}
int stub_d_ip(double a, int *out) { (void)a; (void)out; return 0; }
const char *stub_i_str(int a) { (void)a; return ""; }
const char *stub_v_str(void) { return ""; }
unsigned long stub_v_ul(void) { return 1ul; }
int stub_i_vp(int a, void *out) { (void)a; (void)out; return 0; }
int stub_pz_pp(const void *a, size_t n, const void *b, void *out)
{
    (void)a; (void)n; (void)b; (void)out;
    return 0;
}
int stub_pdd_p(void *state, double a, double b, void *out)
{
    (void)state; (void)a; (void)b; (void)out;
    return 0;
}
int stub_dddi_pp(double a, double b, double c, int d, int *out1,
                 unsigned int *out2)
{
    (void)a; (void)b; (void)c; (void)d; (void)out1; (void)out2;
    return 0;
}
int stub_dddddi_pp(double a, double b, double c, double d, double e, int f,
                   int *out1, unsigned int *out2)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f; (void)out1; (void)out2;
    return 0;
}
int stub_v_p(void *out) { (void)out; return 0; }
int stub_pp(const void *in, void *out) { (void)in; (void)out; return 0; }
int stub_diiii_ppp(double a, int b, int c, int d, int e, int *out1,
                   unsigned int *out2, unsigned int *out3)
{
    (void)a; (void)b; (void)c; (void)d; (void)e;
    (void)out1; (void)out2; (void)out3;
    return 0;
}
int stub_d9_pp(double a, double b, double c, double d, double e, double f,
               double g, double h, double i, double *out1, double *out2)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f; (void)g; (void)h;
    (void)i; (void)out1; (void)out2;
    return 0;
}
int stub_ddpz_pp(double a, double b, const void *p, size_t n, double *out1,
                 double *out2)
{
    (void)a; (void)b; (void)p; (void)n; (void)out1; (void)out2;
    return 0;
}
int stub_ddpzdd_pzp(double a, double b, const void *p, size_t n, double c,
                    double d, void *out, size_t cap, size_t *count)
{
    (void)a; (void)b; (void)p; (void)n; (void)c; (void)d; (void)out;
    (void)cap; (void)count;
    return 0;
}
int stub_pzdpzddp_p(const void *h, size_t nh, double a, const void *f,
                    size_t nf, double b, double c, const void *lim, void *out)
{
    (void)h; (void)nh; (void)a; (void)f; (void)nf; (void)b; (void)c;
    (void)lim; (void)out;
    return 0;
}

/* Solute area (lib/solute.c). */
int stub_id_p(int a, double b, double *out)
{
    (void)a; (void)b; (void)out;
    return 0;
}
int stub_d6_p(double a, double b, double c, double d, double e, double f,
              double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f; (void)out;
    return 0;
}
int stub_id7_p(int a, double b, double c, double d, double e, double f,
               double g, double h, double *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f; (void)g; (void)h;
    (void)out;
    return 0;
}
int stub_d7_vp(double a, double b, double c, double d, double e, double f,
               double g, void *out)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f; (void)g; (void)out;
    return 0;
}

int stub_ddd_ip(double a, double b, double c, int *out)
{
    (void)a; (void)b; (void)c; (void)out;
    return 0;
}
int stub_d6_pp(double a, double b, double c, double d, double e, double f,
               double *out1, double *out2)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f;
    (void)out1; (void)out2;
    return 0;
}
int stub_d7_pp(double a, double b, double c, double d, double e, double f,
               double g, double *out1, double *out2)
{
    (void)a; (void)b; (void)c; (void)d; (void)e; (void)f; (void)g;
    (void)out1; (void)out2;
    return 0;
}
int stub_ii_vp(int a, int b, void *out)
{
    (void)a; (void)b; (void)out;
    return 0;
}
