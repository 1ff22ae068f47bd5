/* Empty counterparts of the library's entry points (see bench_stubs.h). */
#include "bench_stubs.h"

int stub_p_ip(const char *s, int *out) { (void)s; (void)out; return 0; }
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
unsigned long stub_v_ul(void) { return 0ul; }
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
