/* fuzz_weather.c - libFuzzer harness for the weather CSV reader.
 * Build and run (clang): make fuzz && build-fuzz/fuzz_weather -max_total_time=60 fuzz/corpus/weather
 * Any input must give 0 or -1 with a one-line message; never a crash or leak. */
#include <stddef.h>
#include <stdint.h>
#include <string.h>

#include "diag.h"
#include "weather.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);
int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    static const char *const h[WX_NCOLS] = {"time", "ghi_w_m2", "temp_c", "rh_pct", "rain_mm",
                                            "wind_m_s", "dni_w_m2", "dhi_w_m2", "pressure_hpa"};
    site_weather cfg;
    memset(&cfg, 0, sizeof cfg);
    for (int k = 0; k < WX_NCOLS; k++)
        strcpy(cfg.header[k], h[k]);
    cfg.max_fill_h = (int)(size % 4);
    wx_series w;
    rg_err e = {{0}};
    rg_warn_quiet(1);
    if (wx_parse(&cfg, "fuzz.csv", (const char *)data, size, &w, &e) == 0)
        wx_series_free(&w);
    else if (!e.msg[0] || strchr(e.msg, '\n'))
        __builtin_trap();
    return 0;
}
