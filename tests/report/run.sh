#!/bin/sh
# Report tests: `rowgraze report` against `rowgraze plan --format json` for
# the same input, on the small test site (ids with HTML's special
# characters; metric and US units) and on the demo.  check_report.py does
# the comparing; this script also checks that the same input gives the same
# bytes and that a bad --units is a usage error.  Prints
# "report: N passed, M failed" and fails if any failed.
set -u
bin=$(cd "$(dirname "$1")" && pwd)/$(basename "$1")
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
if ! command -v python3 >/dev/null 2>&1; then
    echo "report: SKIPPED: python3 is not installed (apt-get install python3)"
    exit 0
fi
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
export ROWGRAZE_MODELS="$root/models"
pass=0 fail=0
ok() { pass=$((pass + 1)); }
ko() { fail=$((fail + 1)); echo "[  FAILED  ] report: $1"; }

# one site: plan json, the report, the comparison.  $1 name, $2 site, $3 units,
# $4 gap %, $5 time limit, then extra options and ids after --
case_run() {
    name=$1 site=$2 units=$3 gap=$4 tl=$5
    shift 5
    opts="" ids=""
    while [ $# -gt 0 ] && [ "$1" != "--" ]; do opts="$opts $1"; shift; done
    [ $# -gt 0 ] && shift
    # shellcheck disable=SC2086
    if ! "$bin" plan "$site" $opts --time-limit "$tl" --gap "$gap" --format json >"$tmp/$name.json" 2>"$tmp/err"; then
        ko "$name: plan failed: $(head -1 "$tmp/err")"; return
    fi
    # shellcheck disable=SC2086
    if ! "$bin" report "$site" $opts --time-limit "$tl" --gap "$gap" --units "$units" --out "$tmp/$name.html" 2>"$tmp/err"; then
        ko "$name: report failed: $(head -1 "$tmp/err")"; return
    fi
    if python3 "$here/check_report.py" "$tmp/$name.html" "$tmp/$name.json" "$units" "$gap" "$@"; then ok; else ko "$name: see above"; fi
}

small="$here/data/small.json"
case_run small-metric "$small" metric 1 10 -- "A<1>" "B&2" "C'3" "ewes<b>" "<i>north</i>" "grass&clover" \
    'Small <test> site & "friends" (invented)'
case_run small-us "$small" us 1 10 -- "A<1>" "B&2" "ewes<b>"
# the demo over 2 weeks: short enough to be proven optimal (gap 0), so the
# plan and the report solve the same way whatever the machine's load
case_run demo "$root/examples/demo/site.json" metric 0 60 --start 2025-04-07 --weeks 2 --

# same input, same bytes
if "$bin" report "$small" --time-limit 10 --gap 1 --units metric --out "$tmp/again.html" 2>/dev/null &&
    cmp -s "$tmp/again.html" "$tmp/small-metric.html"; then ok; else ko "the same input gave different bytes"; fi
# US units: the names show, and the metric names of cover do not
if grep -q "lb DM/ac" "$tmp/small-us.html" && ! grep -q "kg DM/ha" "$tmp/small-us.html"; then ok
else ko "US report: expected lb DM/ac and no kg DM/ha"; fi
# a bad --units is a usage error with one line; no file is left
"$bin" report "$small" --units imperial --out "$tmp/bad.html" >/dev/null 2>"$tmp/err"
rc=$?
if [ "$rc" = 2 ] && grep -q 'report: --units: expected metric or us, found "imperial"' "$tmp/err" &&
    [ ! -e "$tmp/bad.html" ]; then ok; else ko "--units imperial: exit $rc, $(head -1 "$tmp/err")"; fi
# --out is required
"$bin" report "$small" >/dev/null 2>"$tmp/err"
rc=$?
if [ "$rc" = 2 ] && grep -q "report: --out: expected the HTML file to write" "$tmp/err"; then ok
else ko "no --out: exit $rc"; fi

echo "report: $pass passed, $fail failed"
[ "$fail" -eq 0 ]
