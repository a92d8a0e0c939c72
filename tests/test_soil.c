/* test_soil.c - checks of src/soil.c, the hourly FAO-56 dual-Kc soil water
 * balance of one strip.
 *
 * Part of rowgraze. GPL-3.0-or-later.
 *
 * Sources. "FAO-56" is Allen, R.G., Pereira, L.S., Raes, D. & Smith, M.
 * (1998) Crop evapotranspiration, FAO Irrigation and Drainage Paper 56.
 * Its text was NOT reachable from this workplace's reference search, so no
 * printed figure of the book is used: every expected value below is a HAND
 * CHECK, worked out from the FAO-56 equation named beside it (equations
 * from memory), with the working shown in the comment. The inputs of the
 * Example 35 checks (theta_FC 0.23, theta_WP 0.10, Ze 0.10 m, REW 8 mm,
 * ETo 4.5 mm/d, Kc_max 1.20, bare soil) are from memory of that example;
 * the results are recomputed here, not read from the book.
 *
 * Other checks are physical properties (water conservation, limits) or
 * rowgraze's own stated rules (soil.h/soil.c), and say so. The one-year
 * weather in test_year_mass_balance is INVENTED (fixed-seed generator).
 */
#include "rgtest.h"

#include <stdint.h>

#include "soil.h"

#define EXACT 1e-12      /* arithmetic that should be exact to rounding */
#define BALANCE 1e-9     /* mass-balance tolerance of the brief, mm */
#define SOIL_TEST_PI 3.14159265358979323846

/* A loam strip from soil_params_make: 130 mm/m x 0.6 m, p 0.6,
 * infiltration 20 mm/h (invented test soil; defaults documented in soil.h).
 */
static soil_params loam(void)
{
    soil_params p;
    assert_int_equal(soil_params_make(130.0, 0.6, 20.0, 0.6, &p), 0);
    return p;
}

/* Storage-based closure of one hour: rain - losses - storage change. */
static double hour_residual(const soil_params *p, double s0_mm,
                            const soil_state *s, const soil_flux *f)
{
    double ds_mm = soil_storage_mm(p, s) - s0_mm;
    return f->rain_mm - (f->runoff_mm + f->evaporation_mm +
                         f->transpiration_mm + f->drainage_mm + ds_mm);
}

/* TAW = 1000 (thetaFC - thetaWP) Zr (FAO-56 eq. 82): 130 mm/m x 0.6 m =
 * 78 mm, hand check. soil_params_make's TEW = 1000 (0.25 - 0.5 x 0.12) x
 * 0.10 = 19 mm (eq. 73, hand check with the loam midpoints of Table 19,
 * from memory), REW 9 mm, Kcb 0.90, Kc_max 1.20 as soil.h documents. */
static void test_params_make_eq82_eq73(void **state)
{
    (void)state;
    soil_params p = loam();
    assert_close(p.taw_mm, 78.0, EXACT);           /* eq. 82, hand */
    assert_close(p.tew_mm, 19.0, EXACT);           /* eq. 73, hand */
    assert_close(p.rew_mm, 9.0, 0.0);              /* soil.h default */
    assert_close(p.kcb_full, 0.90, 0.0);           /* soil.h default */
    assert_close(p.kc_max, 1.20, 0.0);             /* eq. 72 at u2 2, RH 45 */
    assert_close(p.p, 0.6, 0.0);                   /* passed in */
    assert_int_equal(soil_params_check(&p), 0);    /* soil.h rule */
    assert_close(soil_taw_mm(100.0, 1.2), 120.0, EXACT); /* eq. 82, hand */
}

/* TEW of FAO-56 Example 35's soil (inputs from memory): thetaFC 0.23,
 * thetaWP 0.10, Ze 0.10 m -> 1000 (0.23 - 0.05) 0.10 = 18 mm (eq. 73, hand
 * check). */
static void test_tew_eq73(void **state)
{
    (void)state;
    assert_close(soil_tew_mm(0.23, 0.10, 0.10), 18.0, EXACT); /* eq. 73 */
    assert_close(soil_tew_mm(0.23, 0.10, 0.15), 27.0, EXACT); /* eq. 73 */
}

/* Ks, FAO-56 eq. 83-84, hand check: TAW 120 mm, p 0.6 -> RAW 72 mm;
 * Dr 96 -> (120 - 96) / (0.4 x 120) = 0.5; Dr 108 -> 12/48 = 0.25;
 * Dr <= 72 -> 1; Dr = TAW -> 0. */
static void test_ks_eq84(void **state)
{
    (void)state;
    soil_params p = loam();
    p.taw_mm = 120.0;
    p.p = 0.6;
    soil_state s = {96.0, 0.0};
    assert_close(soil_ks(&p, &s), 0.5, EXACT);     /* eq. 84, hand */
    s.dr_mm = 108.0;
    assert_close(soil_ks(&p, &s), 0.25, EXACT);    /* eq. 84, hand */
    s.dr_mm = 72.0;
    assert_close(soil_ks(&p, &s), 1.0, 0.0);       /* eq. 84, Dr = RAW */
    s.dr_mm = 10.0;
    assert_close(soil_ks(&p, &s), 1.0, 0.0);       /* eq. 84, Dr < RAW */
    s.dr_mm = 120.0;
    assert_close(soil_ks(&p, &s), 0.0, 0.0);       /* eq. 84, Dr = TAW */
}

/* The same Ks inside soil_hour: full cover (few = 0, no evaporation, eq.
 * 75), Kcb 0.90, ETo 0.5 mm, Dr 96 -> T = Ks Kcb ETo = 0.5 x 0.9 x 0.5 =
 * 0.225 mm (FAO-56 ch. 8 ETc adj = (Ks Kcb + Ke) ETo, hand check). */
static void test_ks_in_hour(void **state)
{
    (void)state;
    soil_params p = loam();
    p.taw_mm = 120.0;
    soil_state s = {96.0, 0.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.5, 1.0, &f), 0);
    assert_close(f.ks, 0.5, EXACT);                /* eq. 84, hand */
    assert_close(f.transpiration_mm, 0.225, EXACT); /* Ks Kcb ETo, hand */
    assert_close(f.evaporation_mm, 0.0, 0.0);      /* eq. 75, few = 0 */
    assert_close(s.dr_mm, 96.225, EXACT);          /* eq. 85, hand */
}

/* Kr, FAO-56 eq. 74, hand check with TEW 18, REW 8: De 5 and 8 -> 1
 * (stage 1); De 10.8 -> 7.2/10 = 0.72; De 18 and beyond -> 0. */
static void test_kr_eq74(void **state)
{
    (void)state;
    assert_close(soil_kr(18.0, 8.0, 5.0), 1.0, 0.0);     /* eq. 74 */
    assert_close(soil_kr(18.0, 8.0, 8.0), 1.0, 0.0);     /* eq. 74 */
    assert_close(soil_kr(18.0, 8.0, 10.8), 0.72, EXACT); /* eq. 74, hand */
    assert_close(soil_kr(18.0, 8.0, 18.0), 0.0, 0.0);    /* eq. 74 */
    assert_close(soil_kr(18.0, 8.0, 25.0), 0.0, 0.0);    /* eq. 74 */
}

/* Ke, FAO-56 eq. 71 with eq. 75 (few = 1 - fc), hand checks at
 * Kc_max 1.2: Kr 1, Kcb 0.45, fc 0.5 -> min(0.75, 0.6) = 0.6 (few limit);
 * Kr 0.5, same -> min(0.375, 0.6) = 0.375; Kr 1, Kcb 0.18, fc 0.2 ->
 * min(1.02, 0.96) = 0.96; fc 1 -> 0. */
static void test_ke_eq71_eq75(void **state)
{
    (void)state;
    assert_close(soil_ke(1.0, 0.45, 1.2, 0.5), 0.6, EXACT);   /* eq. 71/75 */
    assert_close(soil_ke(0.5, 0.45, 1.2, 0.5), 0.375, EXACT); /* eq. 71 */
    assert_close(soil_ke(1.0, 0.18, 1.2, 0.2), 0.96, EXACT);  /* eq. 71/75 */
    assert_close(soil_ke(1.0, 0.90, 1.2, 1.0), 0.0, 0.0);     /* eq. 75 */
    assert_close(soil_ke(1.0, 0.0, 1.2, 0.0), 1.2, EXACT);    /* eq. 71 */
}

/* FAO-56 Example 35 setting (inputs from memory: bare soil, TEW 18, REW 8,
 * ETo 4.5 mm/d, Kc_max 1.2, wetted on day 0), stepped DAILY with eq. 71,
 * 74 and 77 (few = 1) through soil_kr/soil_ke. Hand check:
 *   day 1: Kr 1, E = 1.2 x 4.5 = 5.4, De 5.4;  day 2: Kr 1, E 5.4, De 10.8;
 *   day 3: Kr = 7.2/10 = 0.72, E = 3.888, De 14.688;
 *   day 4: Kr = 0.3312, E = 1.78848, De 16.47648;
 *   day 5: Kr = 0.152352, E = 0.8227008, De 17.2991808.
 * (Not compared with the book's printed table, which was unreachable.) */
static void test_example35_daily_hand(void **state)
{
    (void)state;
    const double de_expect[5] = {5.4, 10.8, 14.688, 16.47648, 17.2991808};
    double de_mm = 0.0;
    for (int day = 0; day < 5; day++) {
        double kr = soil_kr(18.0, 8.0, de_mm);
        double e_mm = soil_ke(kr, 0.0, 1.2, 0.0) * 4.5;
        de_mm += e_mm;                                   /* eq. 77 */
        assert_close(de_mm, de_expect[day], 1e-9);       /* hand, above */
    }
}

/* The same setting stepped HOURLY by soil_hour (ETo 4.5/24 = 0.1875 mm
 * each hour, bare soil, deep root zone). Hand check from eq. 71, 74, 77:
 * stage 1 gives E = 1.2 x 0.1875 = 0.225 mm/h while De <= REW at the
 * start of the hour, i.e. hours 0..35 (De = 0.225 k <= 7.875), so
 * De = 36 x 0.225 = 8.1 mm after 36 h. In stage 2, E = 0.225 (18 - De)/10,
 * so 18 - De shrinks by the factor 0.9775 each hour:
 * De(120 h) = 18 - 9.9 x 0.9775^84. With fc = 0 there is no transpiration
 * and the root zone loses exactly what the surface layer loses. */
static void test_example35_hourly_hand(void **state)
{
    (void)state;
    soil_params p = loam();
    p.taw_mm = 200.0;
    p.tew_mm = 18.0;
    p.rew_mm = 8.0;
    p.kc_max = 1.2;
    soil_state s = {0.0, 0.0};
    soil_flux f;
    double e_sum_mm = 0.0;
    for (int h = 0; h < 120; h++) {
        assert_int_equal(soil_hour(&p, &s, 0.0, 0.1875, 0.0, &f), 0);
        e_sum_mm += f.evaporation_mm;
        assert_close(f.transpiration_mm, 0.0, 0.0);  /* Kcb = 0 x 0.9 */
        if (h < 36)
            assert_close(f.evaporation_mm, 0.225, EXACT); /* stage 1 */
        if (h == 35)
            assert_close(s.de_mm, 8.1, 1e-12);       /* hand, above */
    }
    assert_close(s.de_mm, 18.0 - 9.9 * pow(0.9775, 84.0), 1e-9); /* hand */
    assert_close(e_sum_mm, s.de_mm, 1e-9);           /* eq. 77, few = 1 */
    assert_close(s.dr_mm, s.de_mm, 1e-9);            /* eq. 85, T = 0 */
}

/* No rain, steady ETo: depletion only grows, Ks falls towards 0 at
 * Dr = TAW and never below, Dr never passes TAW (FAO-56 eq. 84-85). While
 * Dr <= RAW, transpiration is exactly Kcb ETo = 0.9 x 0.9 x ETo (Ks = 1,
 * eq. 84; Kcb = fc Kcb_full, soil.c rule). */
static void test_dry_down_limits(void **state)
{
    (void)state;
    soil_params p = loam();          /* TAW 78, p 0.6 -> RAW 46.8 */
    soil_state s = {0.0, 0.0};
    soil_flux f;
    double dr_prev = 0.0, ks_prev = 1.0;
    int n_unstressed = 0;
    for (int h = 0; h < 24 * 300; h++) {
        int hod = h % 24;
        double eto_mm = (hod >= 6 && hod < 18) ? 0.3 : -0.01;
        double raw_mm = p.p * p.taw_mm;
        int unstressed = s.dr_mm <= raw_mm;
        assert_int_equal(soil_hour(&p, &s, 0.0, eto_mm, 0.9, &f), 0);
        assert_true(s.dr_mm >= dr_prev);            /* no input, eq. 85 */
        assert_true(s.dr_mm <= p.taw_mm);           /* eq. 84 limit */
        assert_true(f.ks <= ks_prev && f.ks >= 0.0); /* eq. 84 */
        if (unstressed && eto_mm > 0.0) {
            assert_close(f.transpiration_mm, 0.81 * eto_mm, EXACT);
            n_unstressed++;
        }
        dr_prev = s.dr_mm;
        ks_prev = f.ks;
    }
    assert_true(n_unstressed > 100);                /* the check ran */
    assert_true(soil_ks(&p, &s) < 0.01);            /* eq. 84, near TAW */
    /* At Dr = TAW nothing more leaves, even with a wet surface. */
    s.dr_mm = p.taw_mm;
    s.de_mm = 0.0;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.8, 0.5, &f), 0);
    assert_close(f.ks, 0.0, 0.0);                   /* eq. 84, Dr = TAW */
    assert_close(f.transpiration_mm, 0.0, 0.0);     /* Ks = 0 */
    assert_close(f.evaporation_mm, 0.0, 0.0);       /* soil.c TAW cap */
    assert_close(s.dr_mm, p.taw_mm, 0.0);
}

/* A very thin soil (TAW 1 mm, p 0.9, Dr 0.95 -> Ks = 0.05/0.1 = 0.5 by
 * eq. 84) under high demand: Ks Kcb ETo = 0.5 x 0.9 x 0.5 = 0.225 mm
 * would overdraw the 0.05 mm left, so transpiration stops at TAW (the
 * limit of eq. 84-85: Dr <= TAW) and nothing is left to evaporate. */
static void test_thin_soil_cap(void **state)
{
    (void)state;
    soil_params p = loam();
    p.taw_mm = 1.0;
    p.p = 0.9;
    soil_state s = {0.95, 0.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.5, 1.0, &f), 0);
    assert_close(f.ks, 0.5, EXACT);                 /* eq. 84, hand */
    assert_close(f.transpiration_mm, 0.05, EXACT);  /* TAW - Dr */
    assert_close(s.dr_mm, 1.0, 0.0);                /* Dr <= TAW */
}

/* Heavy rain: 60 mm in an hour on a soil taking 20 mm/h runs off 40 mm
 * (soil.c infiltration-excess rule, common practice, no source); the
 * 20 mm infiltrated fill the 10 mm depletion and 10 mm drain below the
 * root zone (FAO-56 eq. 88, hand check); both layers end at field
 * capacity. ETo 0 so nothing else moves. */
static void test_heavy_rain_runoff_drainage(void **state)
{
    (void)state;
    soil_params p = loam();
    soil_state s = {10.0, 5.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 60.0, 0.0, 0.7, &f), 0);
    assert_close(f.runoff_mm, 40.0, EXACT);         /* 60 - 20, rule */
    assert_close(f.infiltrated_mm, 20.0, EXACT);
    assert_close(f.drainage_mm, 10.0, EXACT);       /* eq. 88, hand */
    assert_close(s.dr_mm, 0.0, 0.0);                /* eq. 85 floor */
    assert_close(s.de_mm, 0.0, 0.0);                /* eq. 77/79 */
}

/* A 2 mm rain on a dry surface over a half-depleted root zone wets only:
 * De 19 -> 17 (eq. 77), Dr 40 -> 38 (eq. 85), no drainage (eq. 88, Dr
 * stays > 0), no runoff (below 20 mm/h). Hand check. */
static void test_small_rain_wets_surface(void **state)
{
    (void)state;
    soil_params p = loam();
    soil_state s = {40.0, 19.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 2.0, 0.0, 0.3, &f), 0);
    assert_close(s.de_mm, 17.0, EXACT);             /* eq. 77, hand */
    assert_close(s.dr_mm, 38.0, EXACT);             /* eq. 85, hand */
    assert_close(f.drainage_mm, 0.0, 0.0);          /* eq. 88 */
    assert_close(f.runoff_mm, 0.0, 0.0);            /* rule */
}

/* Invented fair-weather day: ETo 5 mm/day as a half-sine from 06 to 18 h,
 * small dew (-0.01 mm/h) at night. */
static double eto_fair_mm(int hour_of_day)
{
    if (hour_of_day < 6 || hour_of_day >= 18)
        return -0.01;
    double x = (hour_of_day + 0.5 - 6.0) / 12.0;
    return 5.0 * (SOIL_TEST_PI / 24.0) * sin(SOIL_TEST_PI * x);
}

/* Runs 40 days from a dry surface (De = TEW) and Dr 40 mm, cover 0.3,
 * with rain_mm falling at 07:00 every every_days days, n_rains times.
 * Returns total evaporation. */
static double evaporation_after(int n_rains, int every_days, double rain_mm)
{
    soil_params p = loam();
    soil_state s = {40.0, p.tew_mm};
    soil_flux f;
    double e_sum_mm = 0.0;
    for (int h = 0; h < 24 * 40; h++) {
        int day = h / 24, hod = h % 24;
        double r_mm = 0.0;
        if (hod == 7 && day % every_days == 0 && day / every_days < n_rains)
            r_mm = rain_mm;
        assert_int_equal(soil_hour(&p, &s, r_mm, eto_fair_mm(hod), 0.3, &f),
                         0);
        e_sum_mm += f.evaporation_mm;
    }
    return e_sum_mm;
}

/* Ten 2 mm rains (one every 2 days) lose a larger share of their water to
 * soil evaporation than one 20 mm rain, with the same ETo afterwards (40
 * days in all). The semi-arid rule that small rains are mostly lost to
 * evaporation: common practice, no source.
 * Hand check of the shares (FAO-56 eq. 75, 77): after 40 days every
 * wetting has dried out again (De back to TEW), so each loses few x (the
 * water it put into the evaporation layer), few = 1 - 0.3 = 0.7. The
 * small rains put in all 20 mm -> 0.7; the 20 mm rain fills the 19 mm
 * layer (De 19 -> 0) and 1 mm passes below it -> 0.7 x 19/20 = 0.665; a
 * 40 mm rain -> 0.7 x 19/40 = 0.3325. So in this model the gap comes only
 * from water passing below the layer, and grows with the rain's size. */
static void test_small_rains_lose_more(void **state)
{
    (void)state;
    double share_small = evaporation_after(10, 2, 2.0) / 20.0;
    double share_big = evaporation_after(1, 1, 20.0) / 20.0;
    double share_big40 = evaporation_after(1, 1, 40.0) / 40.0;
    print_message("evaporated share: ten 2 mm %.4f, one 20 mm %.4f, "
                  "one 40 mm %.4f\n", share_small, share_big, share_big40);
    assert_true(share_small > share_big);           /* common practice */
    assert_true(share_big > share_big40);           /* common practice */
    assert_close(share_small, 0.7, 1e-3);           /* hand, eq. 75/77 */
    assert_close(share_big, 0.665, 1e-3);           /* hand, eq. 75/77 */
    assert_close(share_big40, 0.3325, 1e-3);        /* hand, eq. 75/77 */
}

/* Full cover leaves no exposed soil: E = 0 even on a wet surface (few =
 * 1 - fc = 0, FAO-56 eq. 75). Bare soil has no transpiration (Kcb =
 * fc Kcb_full = 0, soil.c rule) and a wet bare surface evaporates at
 * Kc_max ETo = 1.2 x 0.5 = 0.6 mm (eq. 71, Kr = 1, hand). */
static void test_cover_extremes(void **state)
{
    (void)state;
    soil_params p = loam();
    soil_state s = {5.0, 0.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.5, 1.0, &f), 0);
    assert_close(f.evaporation_mm, 0.0, 0.0);       /* eq. 75 */
    assert_close(f.transpiration_mm, 0.45, EXACT);  /* 1 x 0.9 x 0.5 */
    s.dr_mm = 5.0;
    s.de_mm = 0.0;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.5, 0.0, &f), 0);
    assert_close(f.transpiration_mm, 0.0, 0.0);     /* Kcb = 0 */
    assert_close(f.evaporation_mm, 0.6, EXACT);     /* eq. 71, hand */
}

/* The exposed fraction dries faster than the strip average: with fc 0.5,
 * a wet surface (Kr 1), Kcb 0.45, Kc_max 1.2: Ke = min(0.75, 0.6) = 0.6
 * (eq. 71/75), E = 0.6 x 0.5 = 0.3 mm over the strip, and the exposed
 * layer's depletion grows by E/few = 0.3/0.5 = 0.6 mm (FAO-56 eq. 77),
 * while the root zone loses 0.3 mm of E plus T = 0.45 x 0.5 = 0.225 mm
 * (eq. 85). Hand check. */
static void test_exposed_layer_eq77(void **state)
{
    (void)state;
    soil_params p = loam();
    soil_state s = {5.0, 0.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.5, 0.5, &f), 0);
    assert_close(f.evaporation_mm, 0.3, EXACT);     /* eq. 71/75, hand */
    assert_close(s.de_mm, 0.6, EXACT);              /* eq. 77, hand */
    assert_close(f.transpiration_mm, 0.225, EXACT); /* Ks Kcb ETo, hand */
    assert_close(s.dr_mm, 5.525, EXACT);            /* eq. 85, hand */
}

/* Eq. 72's floor Kc_max >= Kcb + 0.05: a dense sward with Kcb_full 1.3
 * at fc 0.95 has Kcb 1.235 > 1.2, so Kc_max = 1.285 and a wet surface
 * still gives Ke = min(1 x 0.05, 0.05 x 1.285) = 0.05 (FAO-56 eq. 71, 72,
 * 75); E = 0.05 x 0.4 = 0.02 mm. Hand check. */
static void test_kc_max_floor_eq72(void **state)
{
    (void)state;
    soil_params p = loam();
    p.kcb_full = 1.3;
    soil_state s = {5.0, 0.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.4, 0.95, &f), 0);
    assert_close(f.evaporation_mm, 0.02, EXACT);    /* eq. 71/72, hand */
}

/* Night ETo below 0 (dew, allowed by et.h) is taken as 0: nothing leaves
 * and nothing enters (rule stated in soil.h). */
static void test_negative_eto(void **state)
{
    (void)state;
    soil_params p = loam();
    soil_state s = {20.0, 3.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, 0.0, -0.03, 0.5, &f), 0);
    assert_close(f.evaporation_mm, 0.0, 0.0);       /* soil.h rule */
    assert_close(f.transpiration_mm, 0.0, 0.0);     /* soil.h rule */
    assert_close(s.dr_mm, 20.0, 0.0);
    assert_close(s.de_mm, 3.0, 0.0);
}

/* 64-bit linear congruential generator, Knuth's MMIX constants (from
 * memory); deterministic, used only to invent test weather. */
static double lcg_uniform(uint64_t *x)
{
    *x = *x * 6364136223846793005ULL + 1442695040888963407ULL;
    return (double)(*x >> 11) * (1.0 / 9007199254740992.0);
}

/* One INVENTED year of hourly weather and cover, same every run: seasonal
 * ETo (1-6 mm/day, half-sine by day, -0.01 mm/h dew at night), rain in
 * about 3-6 % of hours with exponential amounts (mean 4 mm), and cover
 * 0.35-0.95 with a grazing dip every 30 days. */
static void invented_hour(int h, uint64_t *rng, double *rain_mm,
                          double *eto_mm, double *cover)
{
    int day = h / 24, hod = h % 24;
    double season = 0.5 - 0.5 * cos(2.0 * SOIL_TEST_PI * (day - 15) / 365.0);
    double eto_day_mm = 1.0 + 5.0 * season;
    *eto_mm = eto_fair_mm(hod) / 5.0 * eto_day_mm;
    if (*eto_mm < 0.0)
        *eto_mm = -0.01;
    double u = lcg_uniform(rng), v = lcg_uniform(rng);
    *rain_mm = u < 0.06 - 0.03 * season ? -4.0 * log(1.0 - v) : 0.0;
    *cover = 0.35 + 0.6 * season * (day % 30 < 5 ? 0.5 : 1.0);
}

/* Water balance closes every hour and over the year to 1e-9 mm:
 * rain = runoff + E + T + drainage + storage change (conservation of
 * mass; the brief's tolerance). Depletions stay in their ranges (soil.h).
 * The invented year must produce runoff, drainage and stress, so every
 * branch of the balance is exercised. */
static void test_year_mass_balance(void **state)
{
    (void)state;
    soil_params p;
    assert_int_equal(soil_params_make(130.0, 0.6, 12.0, 0.6, &p), 0);
    soil_state s = {30.0, 10.0};
    soil_flux f;
    uint64_t rng = 20261202u;
    double s_start = soil_storage_mm(&p, &s);
    double rain = 0, ro = 0, e = 0, t = 0, dp = 0, ks_min = 1.0;
    for (int h = 0; h < 8760; h++) {
        double r_mm, eto_mm, cover;
        invented_hour(h, &rng, &r_mm, &eto_mm, &cover);
        double s0 = soil_storage_mm(&p, &s);
        assert_int_equal(soil_hour(&p, &s, r_mm, eto_mm, cover, &f), 0);
        assert_close(hour_residual(&p, s0, &s, &f), 0.0, BALANCE);
        assert_true(s.dr_mm >= 0.0 && s.dr_mm <= p.taw_mm);
        assert_true(s.de_mm >= 0.0 && s.de_mm <= p.tew_mm);
        rain += f.rain_mm;
        ro += f.runoff_mm;
        e += f.evaporation_mm;
        t += f.transpiration_mm;
        dp += f.drainage_mm;
        if (f.ks < ks_min)
            ks_min = f.ks;
    }
    double ds = soil_storage_mm(&p, &s) - s_start;
    print_message("year: rain %.1f runoff %.1f E %.1f T %.1f drain %.1f "
                  "dS %.2f min Ks %.3f\n", rain, ro, e, t, dp, ds, ks_min);
    assert_close(rain - (ro + e + t + dp + ds), 0.0, BALANCE); /* mass */
    assert_true(ro > 0.0 && dp > 0.0 && e > 0.0 && t > 0.0); /* exercised */
    assert_true(ks_min < 1.0);                      /* stress reached */
}

/* soil_hour_split (soil.h): with both reference ETs equal it is
 * soil_hour() to the bit; the transpiration follows its own ETo and the
 * evaporation the other; over the invented year the balance still closes
 * (conservation of mass) with transpiration at 60 % of the reference. */
static void test_split_eto(void **state)
{
    (void)state;
    soil_params p;
    assert_int_equal(soil_params_make(130.0, 0.6, 12.0, 0.6, &p), 0);
    soil_state a = {30.0, 2.0}, b = a, c = a;
    soil_flux fa, fb, fc;
    assert_int_equal(soil_hour(&p, &a, 0.0, 0.5, 0.7, &fa), 0);
    assert_int_equal(soil_hour_split(&p, &b, 0.0, 0.5, 0.5, 0.7, &fb), 0);
    assert_true(fa.transpiration_mm == fb.transpiration_mm && fa.evaporation_mm == fb.evaporation_mm);
    assert_true(a.dr_mm == b.dr_mm && a.de_mm == b.de_mm);
    assert_int_equal(soil_hour_split(&p, &c, 0.0, 0.5, 0.0, 0.7, &fc), 0);
    assert_close(fc.transpiration_mm, 0.0, 0.0);
    assert_close(fc.evaporation_mm, fa.evaporation_mm, 1e-12);
    assert_true(fa.transpiration_mm > 0.0);
    assert_int_equal(soil_hour_split(&p, &c, 0.0, 0.5, (double)NAN, 0.7, &fc), -1);

    soil_state s = {30.0, 10.0};
    uint64_t rng = 20261202u;
    double s_start = soil_storage_mm(&p, &s), bal = 0, t = 0;
    for (int h = 0; h < 8760; h++) {
        double r_mm, eto_mm, cover;
        invented_hour(h, &rng, &r_mm, &eto_mm, &cover);
        double s0 = soil_storage_mm(&p, &s);
        soil_flux f;
        assert_int_equal(soil_hour_split(&p, &s, r_mm, eto_mm, 0.6 * eto_mm, cover, &f), 0);
        assert_close(hour_residual(&p, s0, &s, &f), 0.0, BALANCE);
        bal += f.rain_mm - f.runoff_mm - f.evaporation_mm - f.transpiration_mm - f.drainage_mm;
        t += f.transpiration_mm;
    }
    assert_close(bal, soil_storage_mm(&p, &s) - s_start, BALANCE);
    assert_true(t > 0.0);
}

/* Bad input is refused as soil.h says: -1, state unchanged, flux NaN. */
static void test_bad_input(void **state)
{
    (void)state;
    soil_params p = loam(), q;
    soil_state s = {20.0, 3.0};
    soil_flux f;
    assert_int_equal(soil_hour(&p, &s, (double)NAN, 0.1, 0.5, &f), -1);
    assert_true(isnan(f.evaporation_mm) && isnan(f.rain_mm));
    assert_close(s.dr_mm, 20.0, 0.0);
    assert_close(s.de_mm, 3.0, 0.0);
    assert_int_equal(soil_hour(&p, &s, -1.0, 0.1, 0.5, &f), -1);
    assert_int_equal(soil_hour(&p, &s, (double)INFINITY, 0.1, 0.5, &f), -1);
    assert_int_equal(soil_hour(&p, &s, 0.0, (double)NAN, 0.5, &f), -1);
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.1, 1.5, &f), -1);
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.1, -0.1, &f), -1);
    assert_int_equal(soil_hour(NULL, &s, 0.0, 0.1, 0.5, &f), -1);
    assert_int_equal(soil_hour(&p, NULL, 0.0, 0.1, 0.5, &f), -1);
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.1, 0.5, NULL), -1);
    s.dr_mm = p.taw_mm + 1.0;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.1, 0.5, &f), -1);
    s.dr_mm = 20.0;
    s.de_mm = -1.0;
    assert_int_equal(soil_hour(&p, &s, 0.0, 0.1, 0.5, &f), -1);
    s.de_mm = 3.0;
    q = p;
    q.rew_mm = q.tew_mm;                            /* eq. 74 needs < */
    assert_int_equal(soil_params_check(&q), -1);
    assert_int_equal(soil_hour(&q, &s, 0.0, 0.1, 0.5, &f), -1);
    q = p;
    q.p = 1.0;                                      /* eq. 84 divides */
    assert_int_equal(soil_params_check(&q), -1);
    assert_true(isnan(soil_ks(&q, &s)));
    assert_int_equal(soil_params_make(0.0, 0.6, 20.0, 0.6, &q), -1);
    assert_int_equal(soil_params_make(130.0, 0.0, 20.0, 0.6, &q), -1);
    assert_int_equal(soil_params_make(130.0, 0.6, 0.0, 0.6, &q), -1);
    assert_int_equal(soil_params_make(130.0, 0.6, 20.0, 1.0, &q), -1);
    assert_int_equal(soil_params_make(130.0, 0.6, 20.0, 0.6, NULL), -1);
    assert_int_equal(soil_params_make(130.0, 0.6, (double)INFINITY, 0.6, &q),
                     0);                            /* never runs off */
    assert_true(isnan(soil_kr(8.0, 8.0, 1.0)));
    assert_true(isnan(soil_ke(1.5, 0.5, 1.2, 0.5)));
    assert_true(isnan(soil_tew_mm(0.10, 0.23, 0.1)));
    assert_true(isnan(soil_taw_mm((double)NAN, 1.0)));
    assert_true(isnan(soil_storage_mm(NULL, &s)));
}

int main(void)
{
    const struct CMUnitTest tests[] = {
        cmocka_unit_test(test_params_make_eq82_eq73),
        cmocka_unit_test(test_tew_eq73),
        cmocka_unit_test(test_ks_eq84),
        cmocka_unit_test(test_ks_in_hour),
        cmocka_unit_test(test_kr_eq74),
        cmocka_unit_test(test_ke_eq71_eq75),
        cmocka_unit_test(test_example35_daily_hand),
        cmocka_unit_test(test_example35_hourly_hand),
        cmocka_unit_test(test_dry_down_limits),
        cmocka_unit_test(test_thin_soil_cap),
        cmocka_unit_test(test_heavy_rain_runoff_drainage),
        cmocka_unit_test(test_small_rain_wets_surface),
        cmocka_unit_test(test_small_rains_lose_more),
        cmocka_unit_test(test_cover_extremes),
        cmocka_unit_test(test_exposed_layer_eq77),
        cmocka_unit_test(test_kc_max_floor_eq72),
        cmocka_unit_test(test_negative_eto),
        cmocka_unit_test(test_year_mass_balance),
        cmocka_unit_test(test_split_eto),
        cmocka_unit_test(test_bad_input),
    };
    return cmocka_run_group_tests(tests, NULL, NULL);
}
