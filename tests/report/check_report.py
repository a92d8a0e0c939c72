#!/usr/bin/env python3
"""Checks one `rowgraze report` HTML file against `rowgraze plan --format json`
for the same input (tests/report/run.sh runs both).

usage: check_report.py REPORT.html PLAN.json UNITS GAP_PCT [ID ...]

Checks, each failure printed as one line:
- every section, in order, and every figure with a non-empty drawing;
- nothing is fetched (no src=, no external href, no url(http), no @import,
  no <link>, no executable <script>);
- the cautions name every topic of issue 7, item 2;
- the plan solved within the gap asked (so both runs stop at the same plan);
- the data block's numbers equal plan --format json's: start, weeks, status,
  plan and baseline totals, and every week's visits, supplement and mowing;
- the visible comparison table shows the same totals (in UNITS) and the
  visible calendar (table and chart) the same visits and days;
- each ID given appears in the visible text and never unescaped in the HTML.
"""
import html.parser
import json
import re
import sys

SECTIONS = ["job", "site", "row", "forecast", "cover", "calendar", "feed", "mowing",
            "compare", "assumptions", "cautions"]
FIGURES = ["fig-row", "fig-forecast", "fig-cover", "fig-calendar", "fig-feed", "fig-compare"]
DRAWING = {"rect", "line", "path", "polyline", "polygon", "circle"}
# Issue 7, item 2: the cautions' topics, as the report words them.
CAUTIONS = ["live whenever light falls on them", "chew cables", "cables protected",
            "contact with equipment", "only qualified\npeople open enclosures",
            "Heat stress", "Water needs rise sharply in heat", "shade",
            "Fire risk from dry vegetation", "Toxic plants", "herbicide keep-off",
            "local codes", "safety rules", "licensed professionals", "electricians",
            "veterinarians", "agronomists"]
# NIST SP 811 (2008) B.8: exact factors; 1 short ton = 2000 lb.
LB_KG = 0.45359237
AC_M2 = 4046.8564224


class Page(html.parser.HTMLParser):
    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.sections, self.figures, self.scripts = [], {}, []
        self.visits, self.cells, self.cmp = [], [], {}
        self.text = []
        self._fig = None
        self._script = None
        self._visit = None
        self._cmp = None
        self.sups = []          # (data-supplement-t, visible text) per calendar row
        self._sup = None

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == "section":
            self.sections.append(a.get("id"))
        if tag == "figure":
            self._fig = a.get("id")
            self.figures[self._fig] = 0
        if self._fig and tag in DRAWING:
            self.figures[self._fig] += 1
        if tag == "script":
            self._script = [a.get("type"), a.get("id"), ""]
        if tag == "span" and a.get("class") == "visit":
            self._visit = [a, ""]
        if tag == "g" and a.get("class") == "cal-cell":
            self.cells.append((int(a["data-week"]), a["data-mob"], a["data-paddock"], int(a["data-days"])))
        if tag == "tr" and "data-key" in a:
            self._cmp = [a["data-key"], []]
        if tag == "td" and "data-supplement-t" in a:
            self._sup = [a["data-supplement-t"], ""]
        if tag == "td" and self._cmp is not None:
            self._cmp[1].append("")

    def handle_endtag(self, tag):
        if tag == "figure":
            self._fig = None
        if tag == "script" and self._script:
            self.scripts.append(tuple(self._script))
            self._script = None
        if tag == "span" and self._visit:
            self.visits.append(self._visit)
            self._visit = None
        if tag == "td" and self._sup:
            self.sups.append(tuple(self._sup))
            self._sup = None
        if tag == "tr" and self._cmp:
            self.cmp[self._cmp[0]] = self._cmp[1]
            self._cmp = None

    def handle_data(self, data):
        if self._script:
            self._script[2] += data
            return
        self.text.append(data)
        if self._visit:
            self._visit[1] += data
        if self._sup:
            self._sup[1] += data
        if self._cmp and self._cmp[1]:
            self._cmp[1][-1] += data


def number(text):
    """A visible number: narrow no-break spaces (U+202F) group digits."""
    t = text.replace("\u202f", "").replace("\u00a0", " ").replace("\u2212", "-").strip()
    m = re.match(r"-?[0-9]+(\.[0-9]+)?", t)
    if not m:
        raise ValueError("not a number: %r" % text)
    return float(m.group(0))


def main():
    path, plan_path, units, gap_pct = sys.argv[1], sys.argv[2], sys.argv[3], float(sys.argv[4])
    ids = sys.argv[5:]
    raw = open(path, encoding="utf-8").read()
    plan = json.load(open(plan_path, encoding="utf-8"))
    page = Page()
    page.feed(raw)
    text = "".join(page.text)
    bad = []

    def check(ok, what):
        if not ok:
            bad.append(what)

    # sections and figures
    check(page.sections == SECTIONS, "sections %s, expected %s" % (page.sections, SECTIONS))
    for f in FIGURES:
        check(page.figures.get(f, 0) > 0, "figure %s missing or without drawing elements" % f)
    # nothing fetched, nothing executable
    for pat in [r"\ssrc\s*=", r"href\s*=\s*[\"']?(https?:|//)", r"url\(\s*[\"']?(https?:|//)", r"@import", r"<link\b"]:
        check(not re.search(pat, raw, re.I), "external reference matching %s" % pat)
    check(all(s[0] == "application/json" for s in page.scripts), "a script that is not application/json")
    # cautions
    caution = raw[raw.find('<section id="cautions">'):]
    caution_text = re.sub(r"<[^>]+>", "", caution)
    for topic in CAUTIONS:
        check(topic.replace("\n", " ") in caution_text.replace("\n", " "), "cautions lack: %s" % topic)
    # the solver stopped on the gap, not the clock
    check(plan["gap"] is not None and plan["gap"] <= gap_pct / 100 + 1e-9,
          "plan gap %s above the %s %% asked: the runs may differ" % (plan["gap"], gap_pct))
    # the data block against plan --format json
    blocks = [s for s in page.scripts if s[1] == "rowgraze-plan"]
    check(len(blocks) == 1, "one data block expected, found %d" % len(blocks))
    data = json.loads(blocks[0][2]) if blocks else {}
    for k in ["start", "weeks", "status", "plan", "baseline"]:
        check(data.get(k) == plan[k], "data %s = %s, plan json %s" % (k, data.get(k), plan[k]))
    check(len(data.get("calendar", [])) == len(plan["calendar"]), "calendar lengths differ")
    want = set()
    for dw, pw in zip(data.get("calendar", []), plan["calendar"]):
        visits = [(g["mob"], g["paddock"], g["days"]) for g in pw["grazing"]]
        check([(g["mob"], g["paddock"], g["days"]) for g in dw["grazing"]] == visits,
              "week %d visits differ" % pw["week"])
        check(dw["supplement_t"] == pw["supplement_t"] and dw["mow"] == pw["mow"],
              "week %d supplement or mowing differ" % pw["week"])
        want |= {(pw["week"],) + v for v in visits}
    # the visible calendar: table spans and chart cells
    seen = set()
    for a, label in page.visits:
        w, d = int(a["data-week"]), int(a["data-days"])
        seen.add((w, a["data-mob"], a["data-paddock"], d))
        m = re.search(r"\u00b7\s*([0-9]+)\u00a0d", label)
        check(label.startswith(a["data-paddock"]) and m and int(m.group(1)) == d,
              "visible visit %r does not show %s for %d days" % (label, a["data-paddock"], d))
    check(seen == want, "calendar table visits %s, plan json %s" % (sorted(seen ^ want), ""))
    check(set(page.cells) == want, "calendar chart cells differ from plan json: %s" % sorted(set(page.cells) ^ want))
    # the calendar table's supplement, week by week and mob by mob
    want_sup = ["%.3f" % s for w in plan["calendar"] for s in w["supplement_t"]]
    check([s[0] for s in page.sups] == want_sup, "calendar table supplement %s, plan json %s"
          % ([s[0] for s in page.sups], want_sup))
    for attr, shown in page.sups:
        conv = float(attr) * 1000 / LB_KG / 2000 if units == "us" else float(attr)
        check(abs(number(shown) - round(conv, 2)) <= 0.0101, "calendar supplement shown %s for %s t" % (shown, attr))
    # the visible comparison table, in the units shown
    mass = (lambda t: t * 1000 / LB_KG / 2000) if units == "us" else (lambda t: t)
    area = (lambda ha: ha * 10000 / AC_M2) if units == "us" else (lambda ha: ha)
    rows = {"supplement": ("supplement_t", mass, 2), "mowed": ("mowed_ha", area, 2),
            "moves": ("moves", lambda x: x, 0), "shortfall": ("terminal_shortfall_t", mass, 2),
            "cost": ("cost", lambda x: x, 2)}
    for key, (field, conv, dec) in rows.items():
        cells = page.cmp.get(key)
        check(cells is not None and len(cells) >= 2, "comparison row %s missing" % key)
        if not cells:
            continue
        for k, who in enumerate(["plan", "baseline"]):
            shown, exp = number(cells[k]), round(conv(plan[who][field]), dec)
            # rounding twice (json, then the table) may move the last digit by one
            check(abs(shown - exp) <= 1.01 * 10 ** -dec, "%s %s shown %s, plan json gives %s" % (who, key, shown, exp))
    # ids escaped
    for i in ids:
        check(i in text, "id %r not in the visible text" % i)
        if any(ch in i for ch in "<>&"):
            check(i not in raw, "id %r appears unescaped in the HTML" % i)
    for b in bad:
        print("[  FAILED  ] report %s: %s" % (path, b))
    print("report %s: %d checks failed (%d visits, %d figures)" % (path, len(bad), len(want), len(page.figures)))
    return 1 if bad else 0


if __name__ == "__main__":
    sys.exit(main())
