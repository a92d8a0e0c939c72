/* test_report.c - the report writer's text rules: HTML escaping and number
 * formatting.  The whole report is checked against `rowgraze plan --format
 * json` by tests/report/run.sh and in a browser by tests/browser/run.sh.
 */
#include "rgtest.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "report.h"

static char *escaped(const char *in)
{
    char *buf = NULL;
    size_t len = 0;
    FILE *fp = open_memstream(&buf, &len);
    assert_non_null(fp);
    rpt_escape(fp, in);
    fclose(fp);
    return buf;
}

/* The five characters that can end text or an attribute value become
 * character references (HTML Living Standard, 13.1.4 and 13.5 "Named
 * character references": &amp; &lt; &gt; &quot;, and the numeric &#39;);
 * control characters, which HTML forbids in text, become U+FFFD; UTF-8
 * passes through unchanged. */
static void test_escape(void **state)
{
    (void)state;
    char *s = escaped("A<1> & B\"2' \x01x \xc3\xa9");
    assert_string_equal(s, "A&lt;1&gt; &amp; B&quot;2&#39; \xef\xbf\xbdx \xc3\xa9");
    free(s);
    s = escaped("tab\tand\nline");
    assert_string_equal(s, "tab\tand\nline");
    free(s);
    s = escaped("</script><script>");
    assert_null(strchr(s, '<'));
    free(s);
}

/* Digits are grouped in threes by a space, never a comma or point (SI
 * Brochure, 9th edition, BIPM 2019, section 5.4.4); the space is U+202F
 * NARROW NO-BREAK SPACE so a number never breaks across lines.  Common
 * practice, no source: no "-0" for a value that rounds to zero. */
static void test_num(void **state)
{
    (void)state;
    char b[64];
    assert_string_equal(rpt_num(b, sizeof b, 26682.28, 2, 1), "26\xe2\x80\xaf" "682.28");
    assert_string_equal(rpt_num(b, sizeof b, 999.0, 0, 1), "999");
    assert_string_equal(rpt_num(b, sizeof b, 1000.0, 0, 1), "1\xe2\x80\xaf" "000");
    assert_string_equal(rpt_num(b, sizeof b, -1234567.0, 0, 1), "-1\xe2\x80\xaf" "234\xe2\x80\xaf" "567");
    assert_string_equal(rpt_num(b, sizeof b, 1234567.25, 1, 0), "1234567.2");
    assert_string_equal(rpt_num(b, sizeof b, -0.001, 2, 1), "0.00");
    assert_string_equal(rpt_num(b, sizeof b, -0.0, 0, 0), "0");
    assert_string_equal(rpt_num(b, sizeof b, (double)NAN, 1, 1), "n/a");
    assert_string_equal(rpt_num(b, sizeof b, (double)INFINITY, 1, 1), "n/a");
    /* a short buffer truncates, never overflows */
    char s[6];
    rpt_num(s, sizeof s, 123456789.0, 0, 1);
    assert_true(strlen(s) < sizeof s);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_escape),
        cmocka_unit_test(test_num),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
