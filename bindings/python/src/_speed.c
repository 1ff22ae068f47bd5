/* SPDX-License-Identifier: MIT */
/* natremia._speed: an optional accelerator for the scalar calls of the
 * Python binding. It does no arithmetic and no checks of its own: it calls
 * the C function whose address the binding found in the loaded
 * libnatremia (by ctypes), so NATREMIA_LIBRARY and the loader order keep
 * deciding which library runs. One callable per C function, made once at
 * import (bind); a call converts plain float/int arguments straight to C
 * and returns
 *   - the result (a float, or an int for integer outputs) on NTR_OK;
 *   - the status (an int) on any other status, so the binding can redo the
 *     call on its general path and raise a NatremiaError naming the input;
 *   - None when an argument is not an exact float or int (numpy scalars,
 *     bools, strings, None ...): the general path then decides.
 * Without this module (no Python headers at build time) the binding uses
 * ctypes only, with the same results. */
#define PY_SSIZE_T_CLEAN
#include <Python.h>
#include <limits.h>

/* Signatures: D = double input, I = int input; the output is a double
 * unless the name ends in _OI (an int). */
enum sig {
    SIG_D1 = 1, SIG_D2, SIG_D3, SIG_D4, SIG_D5, SIG_D6,
    SIG_I_D1, SIG_I_D2, SIG_I_D3, SIG_D2_I, SIG_D4_I, SIG_D1_OI
};

typedef int (*f_d1)(double, double *);
typedef int (*f_d2)(double, double, double *);
typedef int (*f_d3)(double, double, double, double *);
typedef int (*f_d4)(double, double, double, double, double *);
typedef int (*f_d5)(double, double, double, double, double, double *);
typedef int (*f_d6)(double, double, double, double, double, double, double *);
typedef int (*f_i_d1)(int, double, double *);
typedef int (*f_i_d2)(int, double, double, double *);
typedef int (*f_i_d3)(int, double, double, double, double *);
typedef int (*f_d2_i)(double, double, int, double *);
typedef int (*f_d4_i)(double, double, double, double, int, double *);
typedef int (*f_d1_oi)(double, int *);

typedef struct {
    void *fn;
    int sig;
    int n_args;
} bound;

static const char *const capsule_name = NULL;

/* Exact float or exact int to double; 0 when the general path must decide. */
static int to_double(PyObject *o, double *x)
{
    if (PyFloat_CheckExact(o)) {
        *x = PyFloat_AS_DOUBLE(o);
        return 1;
    }
    if (PyLong_CheckExact(o)) {
        *x = PyLong_AsDouble(o);
        if (*x == -1.0 && PyErr_Occurred()) {
            PyErr_Clear();
            return 0;
        }
        return 1;
    }
    return 0;
}

/* Exact int within C int to int; 0 otherwise (floats such as 1.9 and
 * bools go to the general path, which refuses them). */
static int to_int(PyObject *o, int *v)
{
    long l;
    if (!PyLong_CheckExact(o)) {
        return 0;
    }
    l = PyLong_AsLong(o);
    if (l == -1 && PyErr_Occurred()) {
        PyErr_Clear();
        return 0;
    }
    if (l < INT_MIN || l > INT_MAX) {
        return 0;
    }
    *v = (int)l;
    return 1;
}

static PyObject *call(PyObject *self, PyObject *const *args, Py_ssize_t nargs)
{
    const bound *b = (const bound *)PyCapsule_GetPointer(self, capsule_name);
    double d[6];
    double out = 0.0;
    int iv = 0, iout = 0, status, k, first_d = 0, n_d;
    if (b == NULL) {
        return NULL;
    }
    if (nargs != b->n_args) {
        PyErr_Format(PyExc_TypeError, "expected %d arguments", b->n_args);
        return NULL;
    }
    /* The int input, where the signature has one. */
    if (b->sig == SIG_I_D1 || b->sig == SIG_I_D2 || b->sig == SIG_I_D3) {
        if (!to_int(args[0], &iv)) {
            Py_RETURN_NONE;
        }
        first_d = 1;
    } else if (b->sig == SIG_D2_I || b->sig == SIG_D4_I) {
        if (!to_int(args[nargs - 1], &iv)) {
            Py_RETURN_NONE;
        }
    }
    n_d = b->n_args - ((b->sig >= SIG_I_D1 && b->sig <= SIG_D4_I) ? 1 : 0);
    for (k = 0; k < n_d; k++) {
        if (!to_double(args[first_d + k], &d[k])) {
            Py_RETURN_NONE;
        }
    }
    switch (b->sig) {
    case SIG_D1: status = ((f_d1)b->fn)(d[0], &out); break;
    case SIG_D2: status = ((f_d2)b->fn)(d[0], d[1], &out); break;
    case SIG_D3: status = ((f_d3)b->fn)(d[0], d[1], d[2], &out); break;
    case SIG_D4: status = ((f_d4)b->fn)(d[0], d[1], d[2], d[3], &out); break;
    case SIG_D5: status = ((f_d5)b->fn)(d[0], d[1], d[2], d[3], d[4], &out); break;
    case SIG_D6: status = ((f_d6)b->fn)(d[0], d[1], d[2], d[3], d[4], d[5], &out); break;
    case SIG_I_D1: status = ((f_i_d1)b->fn)(iv, d[0], &out); break;
    case SIG_I_D2: status = ((f_i_d2)b->fn)(iv, d[0], d[1], &out); break;
    case SIG_I_D3: status = ((f_i_d3)b->fn)(iv, d[0], d[1], d[2], &out); break;
    case SIG_D2_I: status = ((f_d2_i)b->fn)(d[0], d[1], iv, &out); break;
    case SIG_D4_I: status = ((f_d4_i)b->fn)(d[0], d[1], d[2], d[3], iv, &out); break;
    case SIG_D1_OI: status = ((f_d1_oi)b->fn)(d[0], &iout); break;
    default:
        PyErr_SetString(PyExc_SystemError, "natremia._speed: bad signature");
        return NULL;
    }
    if (status != 0) {
        return PyLong_FromLong(status);
    }
    if (b->sig == SIG_D1_OI) {
        return PyLong_FromLong(iout);
    }
    return PyFloat_FromDouble(out);
}

static PyMethodDef call_def = {"natremia_call", (PyCFunction)(void (*)(void))call,
                               METH_FASTCALL, "Call one bound natremia function."};

static void free_bound(PyObject *capsule)
{
    PyMem_Free(PyCapsule_GetPointer(capsule, capsule_name));
}

static int arg_count(int sig)
{
    switch (sig) {
    case SIG_D1: case SIG_D1_OI: return 1;
    case SIG_D2: case SIG_I_D1: return 2;
    case SIG_D3: case SIG_I_D2: case SIG_D2_I: return 3;
    case SIG_D4: case SIG_I_D3: return 4;
    case SIG_D5: case SIG_D4_I: return 5;
    case SIG_D6: return 6;
    default: return -1;
    }
}

/* bind(address, signature) -> a callable for that C function. */
static PyObject *bind(PyObject *module, PyObject *args)
{
    PyObject *address, *capsule, *fn;
    int sig;
    bound *b;
    (void)module;
    if (!PyArg_ParseTuple(args, "Oi", &address, &sig)) {
        return NULL;
    }
    if (arg_count(sig) < 0) {
        PyErr_SetString(PyExc_ValueError, "unknown signature");
        return NULL;
    }
    b = (bound *)PyMem_Malloc(sizeof *b);
    if (b == NULL) {
        return PyErr_NoMemory();
    }
    b->fn = PyLong_AsVoidPtr(address);
    if (b->fn == NULL) {
        PyMem_Free(b);
        if (!PyErr_Occurred()) {
            PyErr_SetString(PyExc_ValueError, "NULL function address");
        }
        return NULL;
    }
    b->sig = sig;
    b->n_args = arg_count(sig);
    capsule = PyCapsule_New(b, capsule_name, free_bound);
    if (capsule == NULL) {
        PyMem_Free(b);
        return NULL;
    }
    fn = PyCFunction_New(&call_def, capsule);
    Py_DECREF(capsule);
    return fn;
}

static PyMethodDef methods[] = {
    {"bind", bind, METH_VARARGS, "bind(address, signature) -> callable"},
    {NULL, NULL, 0, NULL},
};

static struct PyModuleDef module_def = {
    PyModuleDef_HEAD_INIT, "natremia._speed",
    "Optional accelerator of natremia's scalar calls (see _speed.c).", -1, methods,
    NULL, NULL, NULL, NULL,
};

PyMODINIT_FUNC PyInit__speed(void)
{
    PyObject *m = PyModule_Create(&module_def);
    if (m == NULL) {
        return NULL;
    }
#define ADD(name) PyModule_AddIntConstant(m, #name, name)
    if (ADD(SIG_D1) || ADD(SIG_D2) || ADD(SIG_D3) || ADD(SIG_D4) || ADD(SIG_D5) ||
        ADD(SIG_D6) || ADD(SIG_I_D1) || ADD(SIG_I_D2) || ADD(SIG_I_D3) || ADD(SIG_D2_I) ||
        ADD(SIG_D4_I) || ADD(SIG_D1_OI)) {
        Py_DECREF(m);
        return NULL;
    }
#undef ADD
    return m;
}
