#!/usr/bin/python3
"""Seeded generator of the demo farm's synthetic hourly weather.

INVENTED DATA. The demo farm "Juniper Bench" does not exist, and nothing
here was measured anywhere. The generator makes weather that looks like a
semi-arid continental grassland where most summer rain falls in short
afternoon thunderstorms, so that the demo shows what rowgraze does on such
a site. Regenerate with:

    /usr/bin/python3 examples/demo/make_weather.py examples/demo/weather

Same seed, same files, byte for byte (Python's random.Random is a
documented Mersenne Twister; only its random() and gauss() are used).

How each variable is made (all choices are ours, picked to look plausible;
none is a published climate):
- temperature: a seasonal sine (daily mean -4 C in mid-January to 21 C in
  mid-July) plus a day-to-day AR(1) anomaly; each day's hours follow a
  sine from the minimum at sunrise to the maximum at 15:00, with a
  half-range of 6-9 C, less on cloudy days;
- humidity: a dew point that follows the season (-10 C in winter to 8 C
  in summer) with its own anomaly, so mornings are humid and afternoons
  dry; relative humidity comes from the Magnus formula;
- sun: a simple clear-sky curve on the solar elevation (declination and
  equation of time by Spencer's series), cut by a daily cloud factor and
  by storms;
- rain: from May to September, storm days (probability up to 0.26 in
  late June) bring one storm starting between 13:00 and 19:00 local time,
  lasting 1-3 hours, with an exponential total (mean 9 mm); in every
  month, frontal days bring rain (or melt-equivalent snow) spread over any
  hours of the day, wettest in spring (mean up to 6 mm a day in May);
- wind: a diurnal cycle (calm nights, breezy afternoons), gusty in storms;
- pressure: station pressure for 1150 m with slow weather swings.
"""
import math
import os
import random
import sys

SEED = 20261202
LAT, LON, TZ = 44.9, -104.6, -7.0      # invented site, local standard time
YEARS = (2023, 2024, 2025)


def sun_elevation_deg(doy, hour_mid):
    """Solar elevation from Spencer's (1971) series for declination and the
    equation of time; accurate to a fraction of a degree, enough here."""
    g = 2 * math.pi * (doy - 1) / 365.0
    decl = (0.006918 - 0.399912 * math.cos(g) + 0.070257 * math.sin(g)
            - 0.006758 * math.cos(2 * g) + 0.000907 * math.sin(2 * g)
            - 0.002697 * math.cos(3 * g) + 0.00148 * math.sin(3 * g))
    eot_min = 229.18 * (0.000075 + 0.001868 * math.cos(g) - 0.032077 * math.sin(g)
                        - 0.014615 * math.cos(2 * g) - 0.040849 * math.sin(2 * g))
    solar_time = hour_mid + (4 * (LON - 15 * TZ) + eot_min) / 60.0
    ha = math.radians(15 * (solar_time - 12))
    lat = math.radians(LAT)
    s = math.sin(lat) * math.sin(decl) + math.cos(lat) * math.cos(decl) * math.cos(ha)
    return math.degrees(math.asin(max(-1.0, min(1.0, s))))


def clear_sky_ghi(elev_deg):
    if elev_deg <= 0:
        return 0.0
    cz = math.sin(math.radians(elev_deg))
    return 1098.0 * cz * math.exp(-0.057 / cz)   # Haurwitz-type shape


def magnus_es(t):
    return 6.112 * math.exp(17.62 * t / (243.12 + t))


def day_plan(rng, doy, state):
    """Daily values: temperature, dew point, clouds, rain hours."""
    season = math.cos(2 * math.pi * (doy - 197) / 365.0)      # +1 mid-July
    state['ta'] = 0.75 * state['ta'] + rng.gauss(0, 2.6)
    state['td'] = 0.7 * state['td'] + rng.gauss(0, 2.0)
    tmean = 8.5 + 12.5 * season + state['ta']
    summer = max(0.0, season)
    wet = max(0.0, math.cos(2 * math.pi * (doy - 170) / 365.0))   # storms peak late June
    spring = max(0.0, math.cos(2 * math.pi * (doy - 130) / 365.0))  # fronts peak mid-May
    storm_p = 0.26 * wet ** 1.5 if 5 <= month_of(doy) <= 9 else 0.0
    front_p = 0.08 + 0.08 * spring
    cloud = min(1.0, max(0.0, rng.random() * 0.5 + (0.35 if rng.random() < front_p else 0)))
    rain = [0.0] * 24
    if rng.random() < storm_p:
        start = 13 + int(rng.random() * 7)
        dur = 1 + int(rng.random() * 3)
        total = -9.0 * math.log(1 - rng.random())
        for h in range(start, min(24, start + dur)):
            rain[h] += total / dur
    if rng.random() < front_p * 0.6:
        total = -(2.5 + 3.5 * spring) * math.log(1 - rng.random())
        hours = [int(rng.random() * 24) for _ in range(1 + int(rng.random() * 5))]
        for h in hours:
            rain[h] += total / len(hours)
    half_range = (6.0 + 3.0 * summer) * (1 - 0.5 * cloud)
    td = min(tmean - half_range - 0.5, -2.0 + 10.0 * summer + state['td'] - 6 * (1 - summer))
    return tmean, half_range, td, cloud, rain


def month_of(doy):
    return min(12, 1 + int((doy - 1) / 30.5))


def write_year(rng, year, outdir, state):
    days = 366 if (year % 4 == 0 and year % 100 != 0) or year % 400 == 0 else 365
    path = os.path.join(outdir, "synthetic-%d.csv" % year)
    month_len = [31, 29 if days == 366 else 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]
    with open(path, "w", newline="\n") as f:
        f.write("# SYNTHETIC weather for the invented demo farm 'Juniper Bench'; "
                "made by examples/demo/make_weather.py (seed %d); not measured anywhere.\n" % SEED)
        f.write("time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s,pressure_hpa\n")
        doy = 0
        for m in range(12):
            for d in range(month_len[m]):
                doy += 1
                tmean, half, td, cloud, rain = day_plan(rng, doy, state)
                state['p'] = 0.9 * state['p'] + rng.gauss(0, 1.5)
                for h in range(24):
                    phase = math.cos(2 * math.pi * (h + 0.5 - 15) / 24.0)
                    storm = rain[h] > 1.0 and h >= 12
                    t = tmean + half * phase - (4.0 if storm else 0.0)
                    tdh = min(td + (1.5 if rain[h] > 0 else 0.0), t)
                    rh = 100.0 * magnus_es(tdh) / magnus_es(t)
                    elev = sun_elevation_deg(doy, h + 0.5)
                    sky = 1 - 0.7 * cloud - (0.55 if storm else 0.0)
                    ghi = clear_sky_ghi(elev) * max(0.08, sky) * (0.97 + 0.06 * rng.random())
                    wind = 1.5 + 2.5 * max(0.0, phase) + rng.random() * 1.5 + (7 * rng.random() if storm else 0)
                    f.write("%04d-%02d-%02dT%02d:00,%.0f,%.1f,%.0f,%.1f,%.1f,%.1f\n" % (
                        year, m + 1, d + 1, h, ghi, t, min(100.0, rh), rain[h], wind,
                        886.0 + state['p']))
    return path


def main():
    outdir = sys.argv[1] if len(sys.argv) > 1 else "weather"
    os.makedirs(outdir, exist_ok=True)
    rng = random.Random(SEED)
    state = {'ta': 0.0, 'td': 0.0, 'p': 0.0}
    for y in YEARS:
        print(write_year(rng, y, outdir, state))


if __name__ == "__main__":
    main()
