/* test_tcal.c - calendar arithmetic against the POSIX definition. */
#include <string.h>

#include "rgtest.h"
#include "tcal.h"

/* Days since the epoch per "Seconds Since the Epoch", IEEE Std 1003.1-2017
 * (POSIX) XBD 4.16, divided by 86400; yday is 0-based, year since 1900. */
static long long posix_days(int year, int yday)
{
    long long y = year - 1900;
    return yday + (y - 70) * 365 + (y - 69) / 4 - (y - 1) / 100 + (y + 299) / 400;
}

/* Every date from 1970 to 2200 matches the POSIX formula, and converting
 * back gives the same civil date (IEEE Std 1003.1-2017, XBD 4.16). */
static void test_days_match_posix(void **state)
{
    (void)state;
    for (int y = 1970; y <= 2200; y++) {
        int64_t jan1 = tcal_days(y, 1, 1);
        assert_int_equal(jan1, posix_days(y, 0));
        int n = (y % 4 == 0 && y % 100 != 0) || y % 400 == 0 ? 366 : 365;
        for (int yd = 0; yd < n; yd++) {
            int yy, mm, dd;
            tcal_civil(jan1 + yd, &yy, &mm, &dd);
            assert_int_equal(yy, y);
            assert_int_equal(tcal_days(yy, mm, dd), jan1 + yd);
            assert_int_equal(tcal_day_of_year(jan1 + yd), yd + 1);
        }
        assert_int_equal(tcal_days(y + 1, 1, 1), jan1 + n);
    }
    /* 2000-01-01T00:00:00Z is 946684800 s after the epoch (POSIX) */
    assert_int_equal(tcal_days(2000, 1, 1) * 86400, 946684800LL);
}

/* Before the epoch the arithmetic still holds (1900 is not a leap year,
 * Gregorian rule). */
static void test_days_before_epoch(void **state)
{
    (void)state;
    assert_int_equal(tcal_days(1969, 12, 31), -1);
    assert_int_equal(tcal_days(1900, 3, 1) - tcal_days(1900, 2, 28), 1);
    assert_int_equal(tcal_hour_day(-1), -1);
    assert_int_equal(tcal_hour_day(-24), -1);
    assert_int_equal(tcal_hour_day(-25), -2);
}

/* Parsing accepts exactly the documented forms and refuses the rest. */
static void test_parse(void **state)
{
    (void)state;
    int64_t d, h;
    assert_int_equal(tcal_parse_date("2024-02-29", &d), 0);
    assert_int_equal(d, tcal_days(2024, 2, 29));
    assert_int_equal(tcal_parse_date("2023-02-29", &d), -1);
    assert_int_equal(tcal_parse_date("2023-2-01", &d), -1);
    assert_int_equal(tcal_parse_date("2023-02-01x", &d), -1);
    assert_int_equal(tcal_parse_hour("2025-06-01T13:00", &h), 0);
    assert_int_equal(h, tcal_days(2025, 6, 1) * 24 + 13);
    assert_int_equal(tcal_parse_hour("2025-06-01 13:00:00", &h), 0);
    assert_int_equal(tcal_parse_hour("2025-06-01T13:30", &h), -1);
    assert_int_equal(tcal_parse_hour("2025-06-01T24:00", &h), -1);
    assert_int_equal(tcal_parse_hour("2025-06-01T13:00Z", &h), -1);
    assert_int_equal(tcal_parse_hour("", &h), -1);
}

/* Formatting round-trips with parsing. */
static void test_format(void **state)
{
    (void)state;
    char buf[17];
    tcal_format_hour(tcal_days(2025, 12, 31) * 24 + 23, buf);
    assert_string_equal(buf, "2025-12-31T23:00");
    tcal_format_date(tcal_days(1999, 1, 9), buf);
    assert_string_equal(buf, "1999-01-09");
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_days_match_posix),
        cmocka_unit_test(test_days_before_epoch),
        cmocka_unit_test(test_parse),
        cmocka_unit_test(test_format),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
