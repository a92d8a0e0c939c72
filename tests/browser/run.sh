#!/bin/sh
# Browser test of the demo report (issue 7): renders it in headless
# Chromium and checks that
#   1. the page logs no console message (the detector is first shown to
#      catch one on a probe page);
#   2. every figure is present and draws something: a copy of the report
#      with a measuring script added (the report itself has no script)
#      counts each figure's drawn elements with a non-empty box, and checks
#      that nothing is wider than the page at A4's printable width;
#   3. the page prints to PDF on A4 and on Letter: each file starts with
#      %PDF, has the paper's size and at least 2 pages;
# and saves a screenshot (1280 x 2400) with the report and PDFs under the
# output directory.  Skipped with a message when Chromium is absent.
#
# usage: tests/browser/run.sh ROWGRAZE [OUTDIR]   (default OUTDIR build/browser)
set -u
bin=$(cd "$(dirname "$1")" && pwd)/$(basename "$1")
here=$(cd "$(dirname "$0")" && pwd)
root=$(cd "$here/../.." && pwd)
out=${2:-$root/build/browser}
chromium=${CHROMIUM:-}
if [ -z "$chromium" ]; then
    for c in chromium chromium-browser; do
        if command -v "$c" >/dev/null 2>&1; then chromium=$(command -v "$c"); break; fi
    done
fi
if [ -z "$chromium" ]; then
    echo "browser: SKIPPED: Chromium is not installed (Debian: apt-get install chromium); set CHROMIUM=path to use another"
    exit 0
fi
if ! command -v python3 >/dev/null 2>&1; then
    echo "browser: SKIPPED: python3 is not installed"
    exit 0
fi
mkdir -p "$out"
out=$(cd "$out" && pwd)
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
pass=0 fail=0
ok() { pass=$((pass + 1)); echo "browser: ok: $1"; }
ko() { fail=$((fail + 1)); echo "[  FAILED  ] browser: $1"; }

# One headless run: a fresh profile each time, no background networking.
chrome() {
    prof=$(mktemp -d "$tmp/profile.XXXXXX")
    timeout 120 "$chromium" --headless --no-sandbox --disable-gpu --user-data-dir="$prof" \
        --disable-background-networking --no-first-run --no-default-browser-check \
        --disable-extensions --disable-sync --disable-component-update --hide-scrollbars \
        --enable-logging=stderr --v=0 "$@"
}

report="$out/demo-report.html"
if ! ROWGRAZE_MODELS="$root/models" "$bin" report "$root/examples/demo/site.json" --start 2025-04-07 \
    --weeks 12 --time-limit 5 --gap 5 --out "$report" 2>"$tmp/err"; then
    ko "rowgraze report failed: $(head -1 "$tmp/err")"
    echo "browser: $pass passed, $fail failed"
    exit 1
fi

# 1. console messages.  The probe page shows the detector works.
printf '<!DOCTYPE html><title>probe</title><script>console.error("rowgraze-probe")</script>\n' >"$tmp/probe.html"
chrome --dump-dom "file://$tmp/probe.html" >/dev/null 2>"$tmp/probe.log"
if grep -q ':CONSOLE.*rowgraze-probe' "$tmp/probe.log"; then ok "the console detector sees a probe's error"
else ko "the console detector missed the probe's console.error: the check below would prove nothing"; fi
chrome --dump-dom "file://$report" >"$tmp/report.dom" 2>"$tmp/report.log"
if grep -q ':CONSOLE' "$tmp/report.log"; then
    ko "console messages: $(grep ':CONSOLE' "$tmp/report.log" | head -3)"
elif ! grep -q 'id="fig-row"' "$tmp/report.dom"; then
    ko "the dumped DOM lacks the report"
else ok "no console messages"; fi

# 2. figures drawn, nothing wider than A4's printable width (186 mm = 703 px)
python3 - "$report" "$tmp/measure.html" <<'PY'
import sys
t = open(sys.argv[1], encoding="utf-8").read()
probe = """<script>
addEventListener('load', function () {
  var out = [];
  document.querySelectorAll('figure').forEach(function (f) {
    var svg = f.querySelector('svg'), n = 0, r = svg ? svg.getBoundingClientRect() : {width: 0, height: 0};
    if (svg) svg.querySelectorAll('rect,line,path,polyline,polygon,circle').forEach(function (e) {
      var b = e.getBBox(); if (b.width > 0 || b.height > 0) n++; });
    out.push(f.id + ' ' + n + ' ' + Math.round(r.width) + ' ' + Math.round(r.height));
  });
  var wide = [];
  document.querySelectorAll('body *').forEach(function (e) {
    var r = e.getBoundingClientRect(); if (r.right > window.innerWidth + 1) wide.push(e.tagName + '#' + e.id + '.' + e.className);
  });
  out.push('overflow ' + wide.length + ' ' + wide.slice(0, 3).join(','));
  var pre = document.createElement('pre'); pre.id = 'probe'; pre.textContent = out.join('\\n');
  document.body.appendChild(pre);
});
</script>
"""
open(sys.argv[2], "w", encoding="utf-8").write(t.replace("</body>", probe + "</body>", 1))
PY
chrome --window-size=703,1000 --virtual-time-budget=5000 --dump-dom "file://$tmp/measure.html" \
    >"$tmp/measure.dom" 2>"$tmp/measure.log"
python3 - "$tmp/measure.dom" >"$tmp/measure.txt" <<'PY'
import html, re, sys
d = open(sys.argv[1], encoding="utf-8").read()
m = re.search(r'<pre id="probe">(.*?)</pre>', d, re.S)
print(html.unescape(m.group(1)) if m else "no-probe")
PY
for f in fig-row fig-forecast fig-cover fig-calendar fig-feed fig-compare; do
    line=$(grep "^$f " "$tmp/measure.txt")
    set -- $line
    if [ $# -eq 4 ] && [ "$2" -gt 0 ] && [ "$3" -gt 100 ] && [ "$4" -gt 50 ]; then
        ok "$f: $2 drawn elements, ${3}x${4} px"
    else ko "$f: missing or empty (${line:-absent})"; fi
done
if grep -q '^overflow 0 ' "$tmp/measure.txt"; then ok "nothing wider than the A4 printable width"
else ko "wider than the page at 703 px: $(grep '^overflow' "$tmp/measure.txt")"; fi

# 3. PDF on A4 and Letter
for paper in A4 letter; do
    python3 - "$report" "$tmp/$paper.html" "$paper" <<'PY'
import sys
t = open(sys.argv[1], encoding="utf-8").read()
open(sys.argv[2], "w", encoding="utf-8").write(t.replace("</style>", "@page{size:%s}</style>" % sys.argv[3], 1))
PY
    pdf="$out/demo-report-$paper.pdf"
    rm -f "$pdf"
    chrome --no-pdf-header-footer --print-to-pdf="$pdf" "file://$tmp/$paper.html" >/dev/null 2>"$tmp/pdf.log"
    res=$(python3 - "$pdf" "$paper" <<'PY'
import re, sys
try:
    b = open(sys.argv[1], "rb").read()
except OSError:
    print("no-file"); sys.exit()
pages = len(re.findall(rb"/Type\s*/Page(?![s\w])", b))
box = re.search(rb"/MediaBox\s*\[\s*0\s+0\s+([0-9.]+)\s+([0-9.]+)\s*\]", b)
w, h = (float(box.group(1)), float(box.group(2))) if box else (0, 0)
# ISO 216 A4 210 x 297 mm = 595.3 x 841.9 pt; ANSI Letter 8.5 x 11 in = 612 x 792 pt
want = (595.3, 841.9) if sys.argv[2] == "A4" else (612.0, 792.0)
size_ok = abs(w - want[0]) < 1.5 and abs(h - want[1]) < 1.5
print("%s %d %s %.1fx%.1f" % ("pdf" if b[:5] == b"%PDF-" else "not-pdf", pages, "size-ok" if size_ok else "size-bad", w, h))
PY
)
    set -- $res
    if [ "$1" = pdf ] && [ "${2:-0}" -ge 2 ] && [ "${3:-}" = size-ok ]; then ok "PDF on $paper: $2 pages, $4 pt"
    else ko "PDF on $paper: $res"; fi
done

# the screenshot, for people to look at
png="$out/demo-report.png"
rm -f "$png"
chrome --window-size=1280,2400 --screenshot="$png" "file://$report" >/dev/null 2>"$tmp/shot.log"
if [ -s "$png" ] && [ "$(head -c 8 "$png" | od -An -tx1 | tr -d ' \n')" = 89504e470d0a1a0a ]; then
    ok "screenshot $png"
else ko "no screenshot"; fi

echo "browser: $pass passed, $fail failed (output in $out)"
[ "$fail" -eq 0 ]
