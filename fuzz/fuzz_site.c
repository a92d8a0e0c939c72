/* fuzz_site.c - libFuzzer harness for the site-file reader.
 * Build and run (clang): make fuzz && build-fuzz/fuzz_site -max_total_time=60 fuzz/corpus/site
 * Any input must give 0 or -1 with a message; never a crash or a leak. */
#include <stddef.h>
#include <stdint.h>
#include <string.h>

#include "diag.h"
#include "site.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);
int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    site s;
    rg_err e = {{0}};
    rg_warn_quiet(1);
    if (site_parse("fuzz.json", (const char *)data, size, "models", &s, &e) == 0)
        site_free(&s);
    else if (!e.msg[0] || strchr(e.msg, '\n'))
        __builtin_trap(); /* an error must be one non-empty line */
    return 0;
}
