#!/usr/bin/python3
"""sweep.py - rowgraze's sun positions against PyEphem over a year.

Usage: /usr/bin/python3 tests/sweep/sweep.py SUNPOS_BINARY

For three sites (one northern, one on the equator, one southern) it takes a
fixed grid of UTC instants through 2025, one every 197 minutes (an odd step,
so every time of day is visited), asks PyEphem for the sun's apparent
topocentric position with refraction off (observer.pressure = 0, so
PyEphem's alt/az are geometric), keeps the instants with the sun up
(zenith < 90 deg), and runs SUNPOS_BINARY (tests/sweep/sunpos.c) on the
same instants and sites.  A case fails if the zeniths differ by more than
TOL_DEG, or the azimuths (wrapped at 360) do where the zenith lies in
(0.5, 89.5) deg; near the zenith the azimuth is ill-defined and at the
horizon both sides are compared on zenith only.

Both sides use UTC as UT1.  PyEphem's Delta T differs from sunpos's
polynomial by a few seconds, which moves the sun by about 0.00005 deg.

Prints the largest differences, then the closing line
'sweep: N passed, M failed'; exits 1 if any case failed, a site had
fewer than MIN_CASES sun-up cases, or sunpos did not answer every line.

GPL-3.0-or-later.
"""
import datetime
import math
import subprocess
import sys

import ephem

YEAR = 2025
STEP = datetime.timedelta(minutes=197)
TOL_DEG = 0.02          # tolerance asked of the module: common practice
MIN_CASES = 1000        # sun-up cases wanted per site
SITES = (               # name, latitude N, longitude E, elevation m
    ("Portland", 45.5, -122.6, 50.0),
    ("Nairobi", 0.0, 36.8, 1700.0),
    ("Cape Town", -33.9, 18.4, 10.0),
)


def instants():
    """The fixed UTC grid over YEAR."""
    t = datetime.datetime(YEAR, 1, 1, 0, 0, 0)
    while t.year == YEAR:
        yield t
        t += STEP


def ephem_cases(lat, lon, elev):
    """(instant, zenith, azimuth) from PyEphem for the sun-up instants."""
    obs = ephem.Observer()
    obs.lat = math.radians(lat)
    obs.lon = math.radians(lon)
    obs.elevation = elev
    obs.pressure = 0.0      # no refraction: geometric alt/az
    obs.temp = 10.0
    sun = ephem.Sun()
    cases = []
    for t in instants():
        obs.date = ephem.Date(t)
        obs.epoch = obs.date
        sun.compute(obs)
        zenith = 90.0 - math.degrees(float(sun.alt))
        if zenith < 90.0:
            cases.append((t, zenith, math.degrees(float(sun.az)) % 360.0))
    return cases


def run_sunpos(binary, lines):
    """Runs sunpos on the input lines; list of (zenith, azimuth)."""
    proc = subprocess.run([binary], input="".join(lines), text=True,
                          capture_output=True, check=False)
    if proc.returncode != 0:
        sys.stderr.write(proc.stderr)
        raise SystemExit("sun sweep: %s exited with %d" %
                         (binary, proc.returncode))
    out = [tuple(float(v) for v in row.split())
           for row in proc.stdout.splitlines()]
    if len(out) != len(lines):
        raise SystemExit("sun sweep: %d answers for %d lines" %
                         (len(out), len(lines)))
    return out


def az_gap(a, b):
    """Smallest difference between two azimuths, deg."""
    d = abs(a - b) % 360.0
    return 360.0 - d if d > 180.0 else d


def main():
    if len(sys.argv) != 2:
        raise SystemExit("usage: sweep.py SUNPOS_BINARY")
    binary = sys.argv[1]
    passed = failed = 0
    worst_z = (0.0, None)
    worst_a = (0.0, None)
    short = False
    for name, lat, lon, elev in SITES:
        cases = ephem_cases(lat, lon, elev)
        if len(cases) < MIN_CASES:
            print("%s: only %d sun-up cases (want %d)" %
                  (name, len(cases), MIN_CASES))
            short = True
        lines = ["%s %.4f %.4f %.1f\n" % (t.strftime("%Y-%m-%dT%H:%M:%S"),
                                          lat, lon, elev)
                 for t, _, _ in cases]
        site_z = site_a = 0.0
        for (t, ze, ae), (zc, ac) in zip(cases, run_sunpos(binary, lines)):
            dz = abs(zc - ze)
            da = az_gap(ac, ae) if 0.5 < ze < 89.5 else 0.0
            where = "%s %s" % (name, t.isoformat())
            if dz > worst_z[0]:
                worst_z = (dz, where)
            if da > worst_a[0]:
                worst_a = (da, where)
            site_z, site_a = max(site_z, dz), max(site_a, da)
            if dz > TOL_DEG or da > TOL_DEG:
                failed += 1
                print("FAIL %s: zenith %.5f vs ephem %.5f, azimuth %.5f vs "
                      "ephem %.5f" % (where, zc, ze, ac, ae))
            else:
                passed += 1
        print("%-10s %5d cases, max |dzenith| %.5f deg, max |dazimuth| "
              "%.5f deg" % (name, len(cases), site_z, site_a))
    print("max |dzenith| = %.5f deg (%s)" % worst_z)
    print("max |dazimuth| = %.5f deg (%s)" % worst_a)
    print("sweep: %d passed, %d failed" % (passed, failed))
    return 1 if failed or short else 0


if __name__ == "__main__":
    sys.exit(main())
