#!/usr/bin/python3
"""Re-planning checks on the invented demo farm, through the command line.

Run by `make check` (scripts/check_replan.sh).  Each check names what it
holds the program to; all figures come from the program's own outputs and
the rules of docs/planner.md, docs/records.md and docs/om-outputs.md:

1. A re-plan whose walk records equal the covers the plan started from
   reproduces the plan (same moves, same cost).
2. --keep of a plan at its own start, every week held, changes nothing and
   lists no change.
3. The rest rule holds across the plan start: a paddock grazed until three
   days before the start (P14 in the demo's grazing records) is not grazed
   before its rest ends, and no paddock is grazed before the day after its
   last recorded grazing plus the minimum rest.
4. Maintenance windows (the site's, the CSV's and the keep-off after a
   spray) hold no animals on any day, by the presence schedule.
5. Paddocks the walk did not measure are marked estimated.
"""
import csv
import datetime
import json
import os
import subprocess
import sys
import tempfile

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
DEMO = os.path.join(ROOT, "examples", "demo")
START = "2024-06-03"
WEEKS = "2"        # short enough to be solved to proven optimality, so two runs compare
LONG_WEEKS = "8"   # long enough to reach the rests and windows of the demo's records
failures = []


def run(binary, *args):
    p = subprocess.run([binary] + list(args), capture_output=True, text=True,
                       env=dict(os.environ, ROWGRAZE_MODELS=os.path.join(ROOT, "models")))
    if p.returncode != 0:
        sys.exit("rowgraze %s failed (%d): %s" % (" ".join(args), p.returncode, p.stderr.strip()))
    return p.stdout


def check(cond, what):
    print("%s %s" % ("ok  " if cond else "FAIL", what))
    if not cond:
        failures.append(what)


def day(s):
    return datetime.date.fromisoformat(s)


def plan_json(binary, site, *extra, weeks=WEEKS):
    exact = weeks == WEEKS
    return json.loads(run(binary, "plan", site, "--start", START, "--weeks", weeks,
                          "--time-limit", "120" if exact else "5", "--gap", "0" if exact else "1",
                          "--format", "json", *extra))


def main():
    binary = os.path.abspath(sys.argv[1])
    tmp = tempfile.mkdtemp(prefix="rg-replan-")
    with open(os.path.join(DEMO, "site.json")) as f:
        site = json.load(f)
    site["weather"]["files"] = [os.path.join(DEMO, p) for p in site["weather"]["files"]]
    covers = {}
    for i, p in enumerate(site["paddocks"]):
        covers[p["id"]] = 1500 + 40 * i
        p["start_cover_kgdm_ha"] = covers[p["id"]]
    site_path = os.path.join(tmp, "site.json")
    with open(site_path, "w") as f:
        json.dump(site, f)

    # 1. walk records equal to the start covers
    a = plan_json(binary, site_path)
    walk = os.path.join(tmp, "walk.csv")
    with open(walk, "w") as f:
        f.write("paddock,date,height_cm,cover_kgdm_ha,method\n")
        for pid, c in covers.items():
            f.write("%s,%s,,%d,visual\n" % (pid, START, c))
    b = plan_json(binary, site_path, "--walk", walk)
    check(a["status"] == "optimal", "1. the plan is proven optimal, so a re-plan can be compared (status %s)" % a["status"])
    check(a["calendar"] == b["calendar"], "1. walk records equal to the start covers give the same moves")
    check(a["objective"] == b["objective"], "1. ... and the same cost (%.2f, %.2f)" % (a["objective"], b["objective"]))
    check(all(p["start_cover"] == "measured" for p in b["paddocks"]), "1. every walked paddock is marked measured")

    # 2. --keep of the same plan, every week
    prev = os.path.join(tmp, "prev.json")
    with open(prev, "w") as f:
        json.dump(a, f)
    c = plan_json(binary, site_path, "--keep", prev, "--keep-weeks", WEEKS)
    check(c["kept_weeks"] == int(WEEKS), "2. every week of the earlier plan held (%d)" % c["kept_weeks"])
    check(c["calendar"] == a["calendar"] and c["changes"] == [], "2. nothing changed, no change listed")

    # 3-5. the demo's own records
    om = os.path.join(tmp, "om")
    d = plan_json(os.path.abspath(binary), os.path.join(DEMO, "site.json"),
                  "--walk", os.path.join(DEMO, "walk-2024-06.csv"),
                  "--grazed", os.path.join(DEMO, "grazed-2024-06.csv"),
                  "--maintenance", os.path.join(DEMO, "maintenance.csv"), "--om-dir", om, weeks=LONG_WEEKS)
    with open(os.path.join(om, "presence.csv")) as f:
        stays = list(csv.DictReader(f))
    rest = json.load(open(os.path.join(DEMO, "site.json")))["rules"]["min_rest_days"]
    last = {}
    with open(os.path.join(DEMO, "grazed-2024-06.csv")) as f:
        for r in csv.DictReader(line for line in f if not line.startswith("#")):
            last[r["paddock"]] = max(last.get(r["paddock"], day(r["to"])), day(r["to"]))
    check(last.get("P14") == day(START) - datetime.timedelta(days=4),
          "3. the demo's records graze P14 until three days before the start (%s)" % last.get("P14"))
    early = [s for s in stays if s["paddock"] in last and
             day(s["from"]) <= last[s["paddock"]] + datetime.timedelta(days=rest)]
    check(not early, "3. no paddock grazed before its rest of %d days ends (%d stays checked; early: %s)"
          % (rest, len(stays), early))
    site = json.load(open(os.path.join(DEMO, "site.json")))
    blocks = {}
    for p in site["paddocks"]:
        blocks.setdefault(p.get("block", ""), []).append(p["id"])
    windows = []
    for w in site.get("maintenance", []):
        for name in w["paddocks"]:
            for pid in blocks.get(name, [name]):
                windows.append((pid, day(w["from"]), day(w["to"]) + datetime.timedelta(days=w.get("keep_off_days", 0))))
    with open(os.path.join(DEMO, "maintenance.csv")) as f:
        for r in csv.DictReader(line for line in f if not line.startswith("#")):
            keep = int(r.get("keep_off_days") or 0)
            for pid in blocks.get(r["paddock"], [r["paddock"]]):
                windows.append((pid, day(r["from"]), day(r["to"]) + datetime.timedelta(days=keep)))
    clash = [(s, w) for s in stays for w in windows
             if s["paddock"] == w[0] and day(s["from"]) <= w[2] and day(s["to"]) >= w[1]]
    check(not clash, "4. no animals in %d maintenance and keep-off windows (clashes: %s)" % (len(windows), clash))
    walked = set()
    with open(os.path.join(DEMO, "walk-2024-06.csv")) as f:
        for r in csv.DictReader(line for line in f if not line.startswith("#")):
            walked.add(r["paddock"])
    marks = {p["paddock"]: p["start_cover"] for p in d["paddocks"]}
    check(all((marks[p] == "estimated") == (p not in walked) for p in marks),
          "5. unwalked paddocks (%s) are marked estimated, the rest carried forward"
          % ", ".join(sorted(p for p in marks if p not in walked)))
    check(len(stays) >= 4, "3-4. the long plan grazes (%d stays), so the checks above bite" % len(stays))
    if failures:
        sys.exit("replan: %d checks failed" % len(failures))
    print("replan: all checks passed")


if __name__ == "__main__":
    main()
