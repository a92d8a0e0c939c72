#!/usr/bin/python3
"""Writes the bad-input cases under tests/cli/ from the table below.

Each case is a site file (a variant of data/base.json) or a weather file,
plus one row in cases.tsv: name, arguments, expected exit code, and a
fragment that the one line on stderr must contain.  run.sh reads only
cases.tsv and the files; rerun this script after editing the table:

    /usr/bin/python3 tests/cli/make_cases.py
"""
import copy
import json
import os

HERE = os.path.dirname(os.path.abspath(__file__))


def hours(n, start_day=1, rows=None):
    out = ["time,ghi_w_m2,temp_c,rh_pct,rain_mm,wind_m_s"]
    for i in range(n):
        d, h = start_day + i // 24, i % 24
        out.append("2025-06-%02dT%02d:00,%d,%.1f,%d,%.1f,%.1f" % (
            d, h, max(0, 800 - abs(h - 12) * 130), 15 + 8 * (h > 8 and h < 20), 60, 0.0, 3.0))
    if rows:  # replace (or, with None, delete) lines by index, header = 0
        for idx in sorted(rows, reverse=True):
            if rows[idx] is None:
                del out[idx]
            else:
                out[idx] = rows[idx]
    return "\n".join(out) + "\n"


BASE = {
    "name": "test site (invented)",
    "location": {"latitude_deg": 40.0, "longitude_deg": -100.0, "elevation_m": 600, "utc_offset_h": -6},
    "array": {"axis_azimuth_deg": 180, "pitch_m": 6.0, "chord_m": 2.0, "hub_height_m": 1.5,
              "max_rotation_deg": 55},
    "soils": [{"id": "loam", "water_held_mm_per_m": 150, "rooting_depth_m": 0.6, "infiltration_mm_h": 10}],
    "swards": [{"id": "grass", "params": "cool-season-grass"}],
    "paddocks": [{"id": "A", "area_ha": 2.0, "array_share": 0.9, "soil": "loam", "sward": "grass"},
                 {"id": "B", "block": "north", "area_ha": 3.0, "array_share": 0.5, "soil": "loam", "sward": "grass"}],
    "mobs": [{"id": "ewes", "species": "sheep", "head": 100, "liveweight_kg": 65, "intake_pct_lw": 2.5}],
    "rules": {"residual_height_cm": 5, "min_rest_days": 30, "max_days_per_visit": 4},
    "costs": {"supplement_per_t_dm": 250, "mowing_per_ha": 50, "per_move": 20},
    "maintenance": [{"paddocks": ["A"], "from": "2025-06-02", "to": "2025-06-03"}],
    "weather": {"files": ["ok.csv"]},
}


def setp(doc, path, value):
    """Sets doc[path] where path is like 'array.pitch_m' or 'paddocks.1.id';
    value None deletes the key."""
    keys = path.split(".")
    for k in keys[:-1]:
        doc = doc[int(k)] if isinstance(doc, list) else doc[k]
    last = keys[-1]
    if isinstance(doc, list):
        doc[int(last)] = value
    elif value is None:
        del doc[last]
    else:
        doc[last] = value


# name, {path: value} edits of the base site, exit code, message fragment
SITE_CASES = [
    ("plate-ok", {"plate_meter": {"kgdm_ha_per_cm": 100, "base_kgdm_ha": 500, "source": "farm cuts 2024 (invented)"}}, 0, "everything it names are valid"),
    ("plate-negative", {"plate_meter": {"kgdm_ha_per_cm": -5, "base_kgdm_ha": 500, "source": "x"}}, 2, "$.plate_meter.kgdm_ha_per_cm: expected a number from 0 to 1000"),
    ("plate-no-source", {"plate_meter": {"kgdm_ha_per_cm": 100, "base_kgdm_ha": 500}}, 2, '$.plate_meter: missing required key "source"'),
    ("units-bad", {"units": "imperial"}, 2, '$.units: expected "metric" or "us", found "imperial"'),
    ("missing-location", {"location": None}, 2, '$: missing required key "location"'),
    ("missing-pitch", {"array.pitch_m": None}, 2, '$.array: missing required key "pitch_m"'),
    ("latitude-out-of-range", {"location.latitude_deg": 95}, 2, "$.location.latitude_deg: expected a number from -90 to 90, found the number 95"),
    ("longitude-out-of-range", {"location.longitude_deg": -181}, 2, "$.location.longitude_deg: expected a number from -180 to 180"),
    ("latitude-is-string", {"location.latitude_deg": "40N"}, 2, '$.location.latitude_deg: expected a number from -90 to 90, found the string "40N"'),
    ("pitch-not-above-chord", {"array.pitch_m": 2.0}, 2, "$.array.pitch_m: expected a row pitch larger than chord_m (2 m), found 2 m"),
    ("edge-hits-ground", {"array.hub_height_m": 0.9}, 2, "$.array.hub_height_m: expected a hub more than half the chord (1 m) above the ground, so that a panel edge clears it at any angle, found 0.9 m"),
    ("negative-area", {"paddocks.0.area_ha": -2}, 2, "$.paddocks[0].area_ha: expected a number greater than 0, found the number -2"),
    ("zero-area", {"paddocks.1.area_ha": 0}, 2, "$.paddocks[1].area_ha: expected a number greater than 0, found the number 0"),
    ("zero-head", {"mobs.0.head": 0}, 2, "$.mobs[0].head: expected a whole number from 1 to 1000000, found the number 0"),
    ("fractional-head", {"mobs.0.head": 10.5}, 2, "$.mobs[0].head: expected a whole number"),
    ("unknown-soil", {"paddocks.1.soil": "lome"}, 2, '$.paddocks[1].soil: expected the id of a soil in $.soils, found "lome" (did you mean "loam"?)'),
    ("unknown-texture", {"soils.0.texture": "loamy"}, 2, '$.soils[0].texture: expected one of sand, loamy-sand, sandy-loam, silt-loam, loam, sandy-clay-loam, silty-clay-loam, clay-loam, sandy-clay, silty-clay, clay, found "loamy"'),
    ("texture-holds-less", {"soils.0.texture": "sand", "soils.0.water_held_mm_per_m": 200}, 2, "$.soils[0].water_held_mm_per_m: expected less than the 175 mm/m a sand holds at field capacity, found 200"),
    ("unknown-sward", {"paddocks.0.sward": "clover"}, 2, '$.paddocks[0].sward: expected the id of a sward in $.swards, found "clover", which is not defined'),
    ("unknown-sward-set", {"swards.0.params": "no-such-set"}, 2, "$.swards[0].params: ../../models/swards/no-such-set.json: cannot open"),
    ("duplicate-paddock", {"paddocks.1.id": "A"}, 2, '$.paddocks[1].id: expected a unique id, found "A" again'),
    ("id-with-comma", {"paddocks.1.id": "B,2"}, 2, '$.paddocks[1].id: expected an id without quotes, backslashes, commas or control characters, found "B,2"'),
    ("window-ends-before-start", {"maintenance.0.to": "2025-06-01"}, 2, '$.maintenance[0].to: expected a date on or after "from" (2025-06-02), found 2025-06-01'),
    ("window-bad-date", {"maintenance.0.from": "2025-02-30"}, 2, '$.maintenance[0].from: expected a date YYYY-MM-DD, found "2025-02-30"'),
    ("window-unknown-paddock", {"maintenance.0.paddocks": ["Z"]}, 2, '$.maintenance[0].paddocks[0]: expected a paddock id or block name, found "Z"'),
    ("both-intakes", {"mobs.0.intake_kgdm_d": 1.6}, 2, '$.mobs[0]: expected exactly one of "intake_pct_lw" and "intake_kgdm_d", found both'),
    ("bad-species", {"mobs.0.species": "alpaca"}, 2, '$.mobs[0].species: expected "sheep", "cattle" or "goats", found "alpaca"'),
    ("share-over-one", {"paddocks.0.array_share": 1.2}, 2, "$.paddocks[0].array_share: expected a number from 0 to 1"),
    ("rest-days-wrong-type", {"rules.min_rest_days": "35"}, 2, '$.rules.min_rest_days: expected a whole number from 0 to 365, found the string "35"'),
    ("ceiling-below-residual", {"rules.ceiling_height_cm": 4}, 2, "$.rules.ceiling_height_cm: expected a vegetation ceiling above the residual height (5 cm), found 4.0 cm"),
    ("margin-too-large", {"rules.ceiling_margin_cm": 66}, 2, "$.rules.ceiling_margin_cm: expected a vegetation ceiling above the residual height (5 cm), found 2.1 cm (the lowest panel edge less this margin)"),
    ("ceiling-above-edge-warns", {"rules.ceiling_height_cm": 90}, 0, "$.rules.ceiling_height_cm: 90 cm is above the lowest panel edge (68 cm at full rotation)"),
    ("columns-same-header", {"weather.columns": {"temp": "rh_pct"}}, 2, '$.weather.columns.rh: expected a header no other column uses, found "rh_pct", also used for temp'),
    ("empty-paddocks", {"paddocks": []}, 2, "$.paddocks: expected at least one paddock, found an empty list"),
    ("bad-units", {"weather.units": {"temp": "K"}}, 2, '$.weather.units.temp: expected "C" or "F", found "K"'),
    ("missing-weather-file", {"weather.files": ["nope.csv"]}, 2, "nope.csv: cannot open: No such file or directory"),
    ("weather-not-array", {"weather.files": "ok.csv"}, 2, '$.weather.files: expected an array, found the string'),
    ("unknown-key-warns", {"array.pitch": 6.0}, 0, "$.array.pitch: unknown key, ignored; did you mean 'pitch_m'?"),
    ("huge-number", {"array.pitch_m": 1e999}, 2, "$.array.pitch_m: expected a number from 0.5 to 50"),
]

# name, weather text, exit code, fragment (the site is the base with this file)
WEATHER_CASES = [
    ("wx-duplicate-time", hours(48, rows={6: "2025-06-01T04:00,0,15.0,60,0.0,3.0"}), 2, "line 7: column 1 (time): expected a new hour, found 2025-06-01T04:00 twice"),
    ("wx-backwards-time", hours(48, rows={6: "2025-06-01T02:00,0,15.0,60,0.0,3.0"}), 2, "line 7: column 1 (time): expected times in increasing order, found 2025-06-01T02:00 after 2025-06-01T04:00"),
    ("wx-long-gap", hours(48, rows={6: "2025-06-01T11:00,0,15.0,60,0.0,3.0"}), 2, "line 7: expected consecutive hours, found a gap of 6 hours after 2025-06-01T04:00"),
    ("wx-empty-cell", hours(48, rows={3: "2025-06-01T02:00,0,,60,0.0,3.0"}), 2, "line 4: column 3 (temp_c): expected a number, found an empty cell"),
    ("wx-text-cell", hours(48, rows={3: "2025-06-01T02:00,0,warm,60,0.0,3.0"}), 2, 'line 4: column 3 (temp_c): expected a number, found "warm"'),
    ("wx-nan", hours(48, rows={3: "2025-06-01T02:00,NaN,15,60,0.0,3.0"}), 2, 'line 4: column 2 (ghi_w_m2): expected a number, found "NaN"'),
    ("wx-inf", hours(48, rows={3: "2025-06-01T02:00,0,inf,60,0.0,3.0"}), 2, 'line 4: column 3 (temp_c): expected a number, found "inf"'),
    ("wx-rh-over-100", hours(48, rows={5: "2025-06-01T04:00,0,15,104,0.0,3.0"}), 2, "line 6: column 4 (rh_pct): expected a value from 0 to 100 (after unit conversion), found 104"),
    ("wx-negative-rain", hours(48, rows={5: "2025-06-01T04:00,0,15,60,-1.5,3.0"}), 2, "line 6: column 5 (rain_mm): expected a value from 0 to 300 (after unit conversion), found -1.5"),
    ("wx-missing-column", "time,ghi_w_m2,temp_c,rh_pct,wind_m_s\n2025-06-01T00:00,0,15,60,3\n", 2, 'line 1: expected a column named "rain_mm" in the header'),
    ("wx-short-row", hours(48, rows={8: "2025-06-01T07:00,100,15,60"}), 2, "line 9: expected 6 fields as in the header, found 4"),
    ("wx-bad-timestamp", hours(48, rows={2: "2025-06-01 1:00,0,15,60,0.0,3.0"}), 2, 'line 3: column 1 (time): expected a timestamp YYYY-MM-DDTHH:00, found "2025-06-01 1:00"'),
    ("wx-empty-file", "", 2, "expected a header line, found an empty file"),
    ("wx-too-short", hours(10), 2, "expected at least 24 hourly rows, found 10"),
    ("wx-bad-quote", hours(48, rows={48: '2025-06-02T23:00,0,15,60,0.0,"3.0'}), 2, "expected well-formed CSV"),
    ("wx-quote-in-cell", hours(48, rows={4: '2025-06-01T03:00,"0,\n15",60,0.0,3.0'}), 2, 'column 2 (ghi_w_m2): expected a number, found "0,?15"'),
    ("wx-short-gap-filled", hours(48, rows={6: None}), 0, "filled 1 missing hours after 2025-06-01T04:00 by interpolation"),
]


def main():
    data = os.path.join(HERE, "data")
    cases = os.path.join(HERE, "cases")
    os.makedirs(data, exist_ok=True)
    os.makedirs(cases, exist_ok=True)
    with open(os.path.join(data, "ok.csv"), "w") as f:
        f.write(hours(48))
    base = copy.deepcopy(BASE)
    with open(os.path.join(data, "base.json"), "w") as f:
        json.dump(base, f, indent=1)
        f.write("\n")
    rows = [("ok-base", "check data/base.json", 0, "everything it names are valid")]
    for name, edits, code, frag in SITE_CASES:
        doc = copy.deepcopy(BASE)
        for path, value in edits.items():
            setp(doc, path, value)
        doc.setdefault("weather", {}).setdefault("files", ["ok.csv"])
        text = json.dumps(doc, indent=1).replace("Infinity", "1e999")
        if isinstance(doc["weather"]["files"], list):
            doc["weather"]["files"] = ["../data/" + p for p in doc["weather"]["files"]]
        elif isinstance(doc["weather"]["files"], str):
            doc["weather"]["files"] = "../data/" + doc["weather"]["files"]
        text = json.dumps(doc, indent=1).replace("Infinity", "1e999")
        with open(os.path.join(cases, name + ".json"), "w") as f:
            f.write(text + "\n")
        rows.append((name, "check cases/%s.json" % name, code, frag))
    for name, text, code, frag in WEATHER_CASES:
        with open(os.path.join(cases, name + ".csv"), "w") as f:
            f.write(text)
        doc = copy.deepcopy(BASE)
        doc["weather"]["files"] = [name + ".csv"]
        with open(os.path.join(cases, name + ".json"), "w") as f:
            json.dump(doc, f, indent=1)
            f.write("\n")
        rows.append((name, "check cases/%s.json" % name, code, frag))
    # JSON syntax errors, written by hand
    good = json.dumps(BASE, indent=1)
    with open(os.path.join(cases, "json-truncated.json"), "w") as f:
        f.write(good[: len(good) // 2])
    rows.append(("json-truncated", "check cases/json-truncated.json", 2, "expected more JSON, found the end of the file (truncated?)"))
    with open(os.path.join(cases, "json-trailing-comma.json"), "w") as f:
        f.write('{\n "name": "x",\n "location": {"latitude_deg": 40,}\n}\n')
    rows.append(("json-trailing-comma", "check cases/json-trailing-comma.json", 2, "json-trailing-comma.json: line 3, column"))
    with open(os.path.join(cases, "json-not-object.json"), "w") as f:
        f.write("[1, 2, 3]\n")
    rows.append(("json-not-object", "check cases/json-not-object.json", 2, "$: expected an object, found an array"))
    with open(os.path.join(cases, "json-duplicate-key.json"), "w") as f:
        f.write(good.replace('"name": "test site (invented)"', '"name": "a", "name": "b"', 1))
    rows.append(("json-duplicate-key", "check cases/json-duplicate-key.json", 2, "$.name: expected each key once, found it twice"))
    # usage errors
    rows.append(("usage-no-file", "check", 2, "check: expected one site file, found 0 arguments"))
    rows.append(("usage-unknown-command", "chekc data/base.json", 2, "unknown command 'chekc'; did you mean 'check'?"))
    rows.append(("usage-missing-site", "check cases/does-not-exist.json", 2, "does-not-exist.json: cannot open: No such file or directory"))
    # daily weather files, made hourly
    def daily(rows=None):
        out = ["# SYNTHETIC daily weather for tests (invented)",
               "date,tmin_c,tmax_c,rain_mm,wind_m_s,rh_mean_pct"]
        for d in range(10):
            out.append("2025-07-%02d,%d,%d,%.1f,3.0,45" % (d + 1, 12 + d % 3, 28 + d % 4, 6.0 if d % 4 == 0 else 0.0))
        for idx in sorted(rows or {}, reverse=True):
            if rows[idx] is None:
                del out[idx]
            else:
                out[idx] = rows[idx]
        return "\n".join(out) + "\n"
    for name, text, code, frag, extra in [
        ("daily-ok", daily(), 0, "strip,offset_m,side,light_share", {}),
        ("daily-gap", daily({5: None}), 2, "line 6: column 1 (date): expected the day after 2025-07-03, found 2025-07-05", {}),
        ("daily-tmin-above-tmax", daily({3: "2025-07-02,30,20,0,3.0,45"}), 2, "daily weather 2025-07-02: expected tmax_c in tmin_c..60, found 20", {}),
        ("daily-missing-column", "date,tmin_c,tmax_c,wind_m_s\n2025-07-01,10,20,3\n", 2, 'line 1: expected a column named "rain_mm" in the header of a daily file', {}),
        ("daily-with-column-map", daily(), 2, "$.weather.columns: expected no column map with daily files", {"columns": {"time": "t"}}),
    ]:
        with open(os.path.join(cases, name + ".csv"), "w") as f:
            f.write(text)
        doc = copy.deepcopy(BASE)
        doc["weather"] = dict({"files": [name + ".csv"], "step": "daily", "rain_timing": "afternoon"}, **extra)
        with open(os.path.join(cases, name + ".json"), "w") as f:
            json.dump(doc, f, indent=1)
            f.write("\n")
        rows.append((name, "strips --format csv cases/%s.json" % name, code, frag))
    rows.append(("bad-step", "check cases/bad-step.json", 2, '$.weather.step: expected "hourly" or "daily", found "weekly"'))
    doc = copy.deepcopy(BASE)
    doc["weather"]["step"] = "weekly"
    doc["weather"]["files"] = ["../data/ok.csv"]
    with open(os.path.join(cases, "bad-step.json"), "w") as f:
        json.dump(doc, f, indent=1)
        f.write("\n")
    # the strips command
    rows.append(("usage-unknown-option", "check --verbose data/base.json", 2, "check: unknown option or missing value: '--verbose'"))
    rows.append(("strips-ok", "strips data/base.json --format csv", 0, "strip,offset_m,side,light_share"))
    rows.append(("usage-strips-format", "strips --format xml data/base.json", 2, 'strips: --format: expected table, csv or json, found "xml"'))
    rows.append(("usage-strips-date", "strips --from 2025-13-01 data/base.json", 2, 'strips: --from: expected a date YYYY-MM-DD, found "2025-13-01"'))
    rows.append(("usage-strips-order", "strips --from 2025-06-02 --to 2025-06-01 data/base.json", 2, "strips: --to: expected a date on or after --from"))
    rows.append(("strips-no-hours", "strips --from 2030-01-01 data/base.json", 2, "data/base.json: no weather hours fall between --from and --to"))
    rows.append(("strips-bad-site", "strips cases/pitch-not-above-chord.json", 2, "$.array.pitch_m: expected a row pitch larger than chord_m"))
    # the plan command (base.json's weather covers 2025-06-01..06-02 only)
    rows.append(("usage-plan-start", "plan --start 2025-06-31 data/base.json", 2, 'plan: --start: expected a date YYYY-MM-DD, found "2025-06-31"'))
    rows.append(("usage-plan-weeks", "plan --start 2025-06-01 --weeks 60 data/base.json", 2, 'plan: --weeks: expected a number from 1 to 52, found "60"'))
    rows.append(("usage-plan-percentile", "plan --start 2025-06-01 --percentile 75 data/base.json", 2, 'plan: --percentile: expected 10, 50 or 90, found "75"'))
    rows.append(("usage-plan-strategy", "plan --start 2025-06-01 --strategy fast data/base.json", 2, 'plan: --strategy: expected auto, compact, decomposition or rolling, found "fast"'))
    rows.append(("plan-no-start", "plan data/base.json", 2, "data/base.json: no plan start: give --start DATE or $.plan.start"))
    rows.append(("plan-crosses-year", "plan --start 2025-12-01 --weeks 8 data/base.json", 2, "no weather file, or files that follow one another, covers the whole season 12-01 to 01-25"))
    rows.append(("growth-over-new-year-one-file", "growth --from 2025-11-01 --to 2026-02-28 data/base.json", 2, "no weather file, or files that follow one another, covers the whole season 11-01 to 02-28"))
    rows.append(("plan-over-new-year", "plan --start 2024-11-04 --weeks 12 --format csv --time-limit 5 ../../examples/demo/site.json", 0, "12,2025-01-20,"))
    rows.append(("out-unwritable", "strips --out /nonexistent-dir/x.csv data/base.json", 1, "/nonexistent-dir/x.csv: cannot write: No such file or directory"))
    rows.append(("plan-ok", "plan --start 2025-07-01 --weeks 1 --format csv cases/daily-ok.json", 0, "week,week_start,kind,mob,paddock,days"))
    rows.append(("plan-rolling-ok", "plan --start 2025-07-01 --weeks 1 --format json --strategy rolling cases/daily-ok.json", 0, '"strategy": "rolling"'))
    rows.append(("plan-no-weather", "plan --start 2025-06-01 --weeks 2 data/base.json", 2, "no weather year covers the whole season 06-01 to 06-14"))
    # re-planning records (docs/records.md): each bad record is one line, exit 2
    records = {
        "walk-unknown-paddock.csv": "paddock,date,height_cm,cover_kgdm_ha,method\nZ,2025-05-28,12,,stick\n",
        "walk-future.csv": "paddock,date,height_cm,cover_kgdm_ha,method\nA,2025-06-09,12,,stick\n",
        "walk-height.csv": "paddock,date,height_cm,cover_kgdm_ha,method\nA,2025-05-28,150,,stick\n",
        "walk-both.csv": "paddock,date,height_cm,cover_kgdm_ha,method\nA,2025-05-28,12,1500,stick\n",
        "grazed-overlap.csv": "mob,paddock,from,to\newes,A,2025-05-01,2025-05-05\newes,B,2025-05-04,2025-05-08\n",
        "grazed-unknown-mob.csv": "mob,paddock,from,to\nrams,A,2025-05-01,2025-05-05\n",
        "maint-unknown.csv": "paddock,from,to,reason\nnowhere,2025-06-02,2025-06-03,fence\n",
        "keep-bad.json": '{"start": "2025-06-01", "weeks": 1, "calendar": [{"grazing": [{"mob": "ewes", "paddock": "A", "days": 9}]}], "paddocks": []}\n',
    }
    for name, text in records.items():
        with open(os.path.join(cases, name), "w") as f:
            f.write(text)
    plan = "plan --start 2025-06-02 --weeks 1 "
    rows.append(("walk-unknown-paddock", plan + "--walk cases/walk-unknown-paddock.csv data/base.json", 2, "cases/walk-unknown-paddock.csv:2:1:"))
    rows.append(("walk-future", plan + "--walk cases/walk-future.csv data/base.json", 2, "cases/walk-future.csv:2:2:"))
    rows.append(("walk-height", plan + "--walk cases/walk-height.csv data/base.json", 2, "cases/walk-height.csv:2:3:"))
    rows.append(("walk-both", plan + "--walk cases/walk-both.csv data/base.json", 2, "cases/walk-both.csv:2:"))
    rows.append(("grazed-overlap", plan + "--grazed cases/grazed-overlap.csv data/base.json", 2, "cases/grazed-overlap.csv:3:"))
    rows.append(("grazed-unknown-mob", plan + "--grazed cases/grazed-unknown-mob.csv data/base.json", 2, "cases/grazed-unknown-mob.csv:2:1:"))
    rows.append(("maint-unknown", plan + "--maintenance cases/maint-unknown.csv data/base.json", 2, "cases/maint-unknown.csv:2:1:"))
    rows.append(("keep-bad", plan + "--keep cases/keep-bad.json data/base.json", 2, "$.calendar[0].grazing[0].days"))
    rows.append(("walk-missing", plan + "--walk cases/no-such-walk.csv data/base.json", 2, "cases/no-such-walk.csv"))
    rows.append(("usage-walk-sheet-format", "walk-sheet --format json data/base.json", 2, 'walk-sheet: --format: expected table or csv, found "json"'))
    rows.append(("walk-sheet-no-date", "walk-sheet data/base.json", 2, "data/base.json: no walk date: give --date DATE or $.plan.start"))
    rows.append(("walk-sheet-ok", "walk-sheet --date 2025-06-02 --format csv data/base.json", 0, "paddock,date,height_cm,cover_kgdm_ha,method,note"))
    # the report command
    rows.append(("usage-report-units", "report --units imperial --out x.html data/base.json", 2, 'report: --units: expected metric or us, found "imperial"'))
    rows.append(("usage-report-no-out", "report data/base.json", 2, "report: --out: expected the HTML file to write, found none"))
    rows.append(("usage-report-weeks", "report --weeks 2.5 --out x.html data/base.json", 2, 'report: --weeks: expected a whole number, found "2.5"'))
    rows.append(("report-no-start", "report --out x.html data/base.json", 2, "data/base.json: no plan start: give --start DATE or $.plan.start"))
    rows.append(("report-unwritable", "report --start 2025-07-01 --weeks 1 --out /nonexistent-dir/x.html cases/daily-ok.json", 1, "/nonexistent-dir/x.html: cannot write: No such file or directory"))
    # the compare command (settings: docs/compare.md)
    cmp = "compare --start 2025-07-01 --weeks 1 "
    rows.append(("compare-ok", cmp + "--set mobs.ewes.head=50,100 --set rules.min_rest_days=7,14 --format csv cases/daily-ok.json", 0, "scenario,site,settings,weeks,percentile,status,supplement_t"))
    rows.append(("compare-unknown-key", cmp + "--set mobs.ewes.heads=1 cases/daily-ok.json", 2, '--set mobs.ewes.heads: unknown setting "heads" in mobs; expected one of head, liveweight_kg'))
    rows.append(("compare-unknown-mob", cmp + "--set mobs.ewse.head=1 cases/daily-ok.json", 2, '--set mobs.ewse.head: cases/daily-ok.json has no mob "ewse" (did you mean "ewes"?)'))
    rows.append(("compare-unknown-section", cmp + "--set array.pitch_m=5 cases/daily-ok.json", 2, "--set array.pitch_m: unknown setting; expected mobs.ID.KEY, paddocks.ID.KEY, rules.KEY, costs.KEY or plan.KEY"))
    rows.append(("compare-bad-head", cmp + "--set mobs.ewes.head=300,0 cases/daily-ok.json", 2, '--set mobs.ewes.head=0: expected a whole number from 1 to 1000000, found "0"'))
    rows.append(("compare-bad-rest", cmp + "--set rules.min_rest_days=28.5 cases/daily-ok.json", 2, '--set rules.min_rest_days=28.5: expected a whole number from 0 to 365, found "28.5"'))
    rows.append(("compare-bad-percentile", cmp + "--set plan.percentile=10,75 cases/daily-ok.json", 2, '--set plan.percentile=75: expected 10, 50 or 90, found "75"'))
    rows.append(("compare-no-equals", cmp + "--set mobs.ewes.head cases/daily-ok.json", 2, '--set: expected PATH=V1,V2,... (e.g. mobs.ewes.head=300,400), found "mobs.ewes.head"'))
    rows.append(("compare-empty-value", cmp + "--set costs.per_move=20,,30 cases/daily-ok.json", 2, "--set costs.per_move: expected a value between the commas, found an empty one"))
    rows.append(("compare-ceiling-below-residual", cmp + "--set rules.ceiling_height_cm=4 cases/daily-ok.json", 2, "scenario rules.ceiling_height_cm=4: expected a vegetation ceiling (4.0 cm) above the residual height (5.0 cm)"))
    rows.append(("usage-compare-twice", cmp + "--set costs.per_move=1 --set costs.per_move=2 cases/daily-ok.json", 2, "compare: --set costs.per_move: expected each path once, found it twice"))
    rows.append(("usage-compare-no-site", "compare --set costs.per_move=1", 2, "compare: expected 1 to 8 site files, found 0"))
    rows.append(("compare-no-weather", "compare --start 2025-06-01 --weeks 2 --set mobs.ewes.head=50 data/base.json", 2, "scenario 1 (mobs.ewes.head=50): "))
    # the capacity command (docs/capacity.md)
    cap = "capacity --start 2025-07-01 --weeks 1 "
    rows.append(("capacity-ok", cap + "--max-supplement 0 --percentile 50 --format csv cases/daily-ok.json", 0, "percentile,head,verdict,supplement_t,mowed_ha,bound_supplement_t,capacity"))
    rows.append(("capacity-all-json", cap + "--max-supplement 0.5 --max-shortfall 100 --format json cases/daily-ok.json", 0, '"percentile": 90, "capacity_head": '))
    rows.append(("usage-capacity-no-limit", cap + "cases/daily-ok.json", 2, "capacity: expected --max-supplement T or --max-mowing HA"))
    rows.append(("usage-capacity-negative", cap + "--max-supplement -1 cases/daily-ok.json", 2, 'capacity: --max-supplement: expected a number from 0 to 1000000000, found "-1"'))
    rows.append(("usage-capacity-percentile", cap + "--max-mowing 0 --percentile 75 cases/daily-ok.json", 2, 'capacity: --percentile: expected 10, 50, 90 or all, found "75"'))
    rows.append(("capacity-unknown-mob", cap + "--max-supplement 0 --mob ewse cases/daily-ok.json", 2, 'capacity: --mob: cases/daily-ok.json has no mob "ewse" (did you mean "ewes"?)'))
    rows.append(("capacity-no-start", "capacity --max-supplement 0 data/base.json", 2, "data/base.json: no plan start: give --start DATE or $.plan.start"))
    with open(os.path.join(HERE, "cases.tsv"), "w") as f:
        f.write("# name\targuments (run in tests/cli)\texit\tstderr must contain\n")
        for r in rows:
            f.write("%s\t%s\t%d\t%s\n" % r)
    print("%d cases" % len(rows))


if __name__ == "__main__":
    main()
