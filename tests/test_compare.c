/* test_compare.c - `rowgraze compare` and its settings (scenario.c).
 *
 * "Scenarios are independent": each scenario of a parallel compare run
 * (one child process per scenario) must give the plan it gives alone, run
 * in this process.  Checked on the small test site of the bad-input table
 * (tests/cli/cases/daily-ok.json, invented) over 1 week, where every
 * scenario solves to proven optimality, so the plans cannot depend on
 * timing (docs/compare.md, "Same input, same output"); the test asserts
 * that premise too.  The settings' messages and effects are checked on the
 * same site. */
#include <cjson/cJSON.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "cli.h"
#include "rgtest.h"
#include "scenario.h"
#include "textfile.h"

#define SITE "tests/cli/cases/daily-ok.json"

static char tmpdir[64];

static int setup(void **state)
{
    (void)state;
    snprintf(tmpdir, sizeof tmpdir, "/tmp/rg-compare-XXXXXX");
    return mkdtemp(tmpdir) ? 0 : -1;
}

static int teardown(void **state)
{
    (void)state;
    char cmd[128];
    snprintf(cmd, sizeof cmd, "rm -rf '%s'", tmpdir);
    return system(cmd) == 0 ? 0 : -1;
}

/* Runs compare with the given --set and --jobs into tmpdir/name; returns
 * the parsed JSON (caller frees). */
static cJSON *run_compare(const char *set, const char *jobs, const char *name)
{
    char out[128];
    snprintf(out, sizeof out, "%s/%s", tmpdir, name);
    const char *src[] = {"compare", "--start", "2025-07-01", "--weeks", "1", "--set", set,
                         "--jobs", jobs, "--format", "json", "--out", out, SITE};
    enum { N = sizeof src / sizeof src[0] };
    char args[N][160], *argv[N + 1];
    for (int i = 0; i < N; i++) {
        snprintf(args[i], sizeof args[i], "%s", src[i]);
        argv[i] = args[i];
    }
    argv[N] = NULL;
    int argc = N;
    assert_int_equal(cmd_compare(argc, argv), 0);
    size_t len;
    char *text = textfile_read(out, &len, NULL);
    assert_non_null(text);
    cJSON *j = cJSON_Parse(text);
    free(text);
    assert_non_null(j);
    return j;
}

static cJSON *scenario(cJSON *doc, int i)
{
    cJSON *s = cJSON_GetArrayItem(cJSON_GetObjectItem(doc, "scenarios"), i);
    assert_non_null(s);
    return s;
}

/* The plan totals of scenario k of a 3-scenario parallel run equal those
 * of the same scenario alone (and serially), field by field, as printed. */
static void test_scenarios_independent(void **state)
{
    (void)state;
    static const char *const heads[] = {"50", "200", "400"};
    cJSON *all = run_compare("mobs.ewes.head=50,200,400", "3", "all.json");
    for (int k = 0; k < 3; k++) {
        char set[64], name[32];
        snprintf(set, sizeof set, "mobs.ewes.head=%s", heads[k]);
        snprintf(name, sizeof name, "alone%d.json", k);
        cJSON *one = run_compare(set, "1", name);
        cJSON *a = scenario(all, k), *b = scenario(one, 0);
        assert_string_equal(cJSON_GetObjectItem(a, "status")->valuestring, "optimal");
        char *pa = cJSON_PrintUnformatted(cJSON_GetObjectItem(a, "plan"));
        char *pb = cJSON_PrintUnformatted(cJSON_GetObjectItem(b, "plan"));
        assert_string_equal(pa, pb);
        assert_close(cJSON_GetObjectItem(a, "objective")->valuedouble,
                     cJSON_GetObjectItem(b, "objective")->valuedouble, 0.0);
        free(pa);
        free(pb);
        cJSON_Delete(one);
    }
    /* the scenarios differ: more head, less cover left at the end */
    double c0 = cJSON_GetObjectItem(cJSON_GetObjectItem(scenario(all, 0), "plan"), "end_cover_kgdm_ha")->valuedouble;
    double c2 = cJSON_GetObjectItem(cJSON_GetObjectItem(scenario(all, 2), "plan"), "end_cover_kgdm_ha")->valuedouble;
    assert_true(c2 < c0);
    cJSON_Delete(all);
}

static void load(site *s, wx_set *wx)
{
    rg_warn_quiet(1);
    assert_int_equal(cli_load(SITE, "models", s, wx), 0);
    rg_warn_quiet(0);
}

/* Each bad path or value is refused with one line naming it; the site is
 * left as it was. */
static void test_bad_settings(void **state)
{
    (void)state;
    static const char *const cases[][3] = {
        {"mobs.ewes.heads", "1", "--set mobs.ewes.heads: unknown setting \"heads\" in mobs; expected one of head,"},
        {"mobs.ewse.head", "1", "has no mob \"ewse\" (did you mean \"ewes\"?)"},
        {"mobs.ewes.head", "0", "--set mobs.ewes.head=0: expected a whole number from 1 to 1000000, found \"0\""},
        {"mobs.ewes.head", "12.5", "expected a whole number from 1 to 1000000"},
        {"rules.min_rest_days", "400", "expected a whole number from 0 to 365"},
        {"rules.share_paddocks", "yes", "expected true or false, found \"yes\""},
        {"plan.percentile", "75", "expected 10, 50 or 90, found \"75\""},
        {"plan.start", "2025-02-30", "expected a date YYYY-MM-DD"},
        {"costs.per_move", "-1", "expected a number of at least 0"},
        {"paddocks.A.area_ha", "0", "expected a number from 0 (excluded) to 10000"},
        {"weather.files", "x", "unknown setting; expected mobs.ID.KEY"},
        {"rules", "1", "unknown setting; expected mobs.ID.KEY"},
        {"costs.a.b", "1", "expected costs.KEY, found 3 parts"},
    };
    site s;
    wx_set wx;
    load(&s, &wx);
    for (size_t i = 0; i < sizeof cases / sizeof cases[0]; i++) {
        rg_err err = {{0}};
        int head = s.mobs[0].head;
        assert_int_equal(scn_apply(&s, cases[i][0], cases[i][1], &err), -1);
        if (!strstr(err.msg, cases[i][2]))
            fail_msg("%s=%s: got \"%s\"", cases[i][0], cases[i][1], err.msg);
        assert_null(strchr(err.msg, '\n'));
        assert_int_equal(s.mobs[0].head, head);
    }
    scn_axis ax;
    rg_err err = {{0}};
    assert_int_equal(scn_parse_axis("mobs.ewes.head", &ax, &err), -1);
    assert_non_null(strstr(err.msg, "expected PATH=V1,V2,..."));
    assert_int_equal(scn_parse_axis("rules.min_rest_days=28,,35", &ax, &err), -1);
    assert_non_null(strstr(err.msg, "found an empty one"));
    assert_int_equal(scn_parse_axis("rules.min_rest_days=28,35", &ax, &err), 0);
    assert_int_equal(ax.n_values, 2);
    assert_string_equal(ax.values[1], "35");
    cli_unload(&s, &wx);
}

/* Effects: a mob's intake follows its liveweight when given as a share of
 * it (base.json: 65 kg at 2.5 %: 1.625 kg; 80 kg: 2.0 kg); a fixed ceiling
 * below the residual is refused for the whole scenario; save and restore
 * put the site back. */
static void test_settings_effects(void **state)
{
    (void)state;
    site s;
    wx_set wx;
    load(&s, &wx);
    scn_saved sv;
    assert_int_equal(scn_save(&s, &sv), 0);
    rg_err err = {{0}};
    assert_close(s.mobs[0].intake_kgdm_d, 1.625, 1e-12);
    assert_int_equal(scn_apply(&s, "mobs.ewes.liveweight_kg", "80", &err), 0);
    assert_close(s.mobs[0].intake_kgdm_d, 2.0, 1e-12);
    assert_int_equal(scn_apply(&s, "mobs.ewes.intake_kgdm_d", "1.5", &err), 0);
    assert_close(s.mobs[0].intake_kgdm_d, 1.5, 1e-12);
    assert_int_equal(scn_apply(&s, "rules.ceiling_height_cm", "4", &err), 0);
    assert_int_equal(scn_check(&s, "x", &err), -1);
    assert_non_null(strstr(err.msg, "above the residual height"));
    assert_int_equal(scn_apply(&s, "plan.start", "2025-07-01", &err), 0);
    assert_int_equal(scn_apply(&s, "rules.share_paddocks", "true", &err), 0);
    assert_int_equal(s.rules.share_paddocks, 1);
    scn_restore(&s, &sv);
    assert_close(s.mobs[0].intake_kgdm_d, 1.625, 1e-12);
    assert_int_equal(s.rules.share_paddocks, 0);
    assert_int_equal(scn_check(&s, "x", &err), 0);
    scn_saved_free(&sv);
    cli_unload(&s, &wx);
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_scenarios_independent),
        cmocka_unit_test(test_bad_settings),
        cmocka_unit_test(test_settings_effects),
    };
    return cmocka_run_group_tests(tests, setup, teardown);
}
