/* rgtest.h - shared helpers for the cmocka test programs.
 *
 * Debian's cmocka 1.1.5 has no assert_double_equal and compares floats in
 * single precision, so checks against published values use assert_close(),
 * which prints both numbers and the tolerance when it fails.
 */
#ifndef RGTEST_H
#define RGTEST_H

#include <math.h>
#include <setjmp.h>
#include <stdarg.h>
#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <cmocka.h>

/* Fails the current test unless |actual - expected| <= tol. */
#define assert_close(actual, expected, tol) \
    rgtest_close((actual), (expected), (tol), #actual, __FILE__, __LINE__)

static inline void rgtest_close(double actual, double expected, double tol,
                                const char *expr, const char *file, int line)
{
    if (!(fabs(actual - expected) <= tol)) {
        print_error("%s = %.10g, expected %.10g +/- %.3g\n", expr, actual,
                    expected, tol);
        _fail(file, line);
    }
}

#endif
