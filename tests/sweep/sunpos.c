/* sunpos.c - geometric sun positions for the sweep against PyEphem.
 *
 * Reads lines "YYYY-MM-DDTHH:MM:SS lat lon elev" (UTC, degrees north and
 * east, metres) on stdin and writes "zenith azimuth" (degrees, azimuth
 * clockwise from north) for each: sun_spa() with refraction off
 * (pressure 0), delta UT1 = 0 and Delta T from sun_delta_t_s() for the
 * middle of the month.  tests/sweep/sweep.py drives it.  Exits 1 with a
 * message naming the line on the first line it cannot read or compute.
 *
 * GPL-3.0-or-later.
 */
#include <stdio.h>
#include <string.h>

#include "sun.h"

/* Parses one input line into *in; 0 on success. */
static int parse_line(const char *line, sun_input *in)
{
    char tail;
    memset(in, 0, sizeof *in);
    if (sscanf(line, "%d-%d-%dT%d:%d:%lf %lf %lf %lf %c", &in->year,
               &in->month, &in->day, &in->hour, &in->minute, &in->second,
               &in->site.latitude_deg, &in->site.longitude_deg,
               &in->site.elevation_m, &tail) != 9)
        return -1;
    in->timezone_h = 0.0;
    in->site.pressure_hpa = 0.0; /* geometric: no refraction */
    in->site.temperature_c = 10.0;
    in->site.atmos_refract_deg = 0.5667;
    in->site.delta_ut1_s = 0.0;
    in->site.delta_t_s = sun_delta_t_s(in->year + (in->month - 0.5) / 12.0);
    return 0;
}

int main(void)
{
    char line[256];
    long n = 0;
    while (fgets(line, sizeof line, stdin) != NULL) {
        sun_input in;
        sun_position p;
        n++;
        if (parse_line(line, &in) != 0 || sun_spa(&in, &p) != 0) {
            fprintf(stderr, "sunpos: line %ld: cannot use \"%.*s\"\n", n,
                    (int)strcspn(line, "\n"), line);
            return 1;
        }
        printf("%.6f %.6f\n", p.zenith_deg, p.azimuth_deg);
    }
    return 0;
}
