/* SPDX-License-Identifier: MIT */
/* Start-up for running a test program on an emulated Cortex-M4
 * (qemu-system-arm -M mps2-an386 -semihosting), used by tests/cross.sh.
 *
 * The vector table goes to address 0 (the linker is told
 * --section-start=.vectors=0): the initial stack pointer at the top of the
 * board's first 4 MB of RAM, and the reset handler. The reset handler turns
 * on the floating-point unit (the hard-float calling convention passes
 * doubles in its registers) and enters newlib's semihosting start-up
 * (rdimon), which sets up the C library, calls main() and reports its exit
 * status to the host. */
extern void _start(void);

static void ntr_m4_reset(void)
{
    /* CPACR: full access to coprocessors 10 and 11 (the FPU). */
    *(volatile unsigned int *)0xE000ED88u |= 0xFu << 20;
    __asm__ volatile("dsb\n\tisb" ::: "memory");
    _start();
}

__attribute__((section(".vectors"), used)) void (*const ntr_m4_vectors[2])(void) = {
    (void (*)(void))0x00400000u, ntr_m4_reset};
