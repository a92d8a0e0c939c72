#!/bin/sh
# Runs rowgraze on the invented demo farm (examples/demo): validates it,
# shows what the pasture experiences across one tracker row, and forecasts
# each paddock's growth by week, plans the rotation and writes it as an
# HTML report (build/demo/plan.html, or $2), then re-plans a month later
# from (invented) walk and grazing records and writes the O&M files.
set -eu
bin=$1
report=${2:-build/demo/plan.html}
site=examples/demo/site.json
echo "== rowgraze check $site   (INVENTED farm, SYNTHETIC weather)"
"$bin" check "$site"
echo
echo "== rowgraze strips $site --from 2024-01-01 --to 2024-12-31"
echo "   (one 6 m row pitch, strip by strip; 'ref' is open ground outside the array)"
"$bin" strips "$site" --from 2024-01-01 --to 2024-12-31
echo
echo "== rowgraze growth $site --from 2025-04-01 --to 2025-09-30"
echo "   (the growing season, every weather year; kg DM/ha/day)"
"$bin" growth "$site" --from 2025-04-01 --to 2025-09-30
echo
echo "== rowgraze plan $site --start 2025-04-07 --weeks 12 --time-limit 5"
echo "   (the rotation calendar; the solver stops after 5 s and says how far it is from proven)"
"$bin" plan "$site" --start 2025-04-07 --weeks 12 --time-limit 5
echo
echo "== rowgraze report $site --start 2025-04-07 --weeks 12 --time-limit 5 --out $report"
mkdir -p "$(dirname "$report")"
"$bin" report "$site" --start 2025-04-07 --weeks 12 --time-limit 5 --out "$report"
echo "the demo report: $report"
echo
echo "== rowgraze walk-sheet $site --date 2024-06-03 (the sheet for the June pasture walk)"
"$bin" walk-sheet "$site" --date 2024-06-03 --walk examples/demo/walk-2024-06.csv \
    --grazed examples/demo/grazed-2024-06.csv
echo
out=${DEMO_OUT:-build/demo}
mkdir -p "$out"
echo "== re-plan from the walk: rowgraze plan $site --start 2024-06-03 --weeks 8"
echo "   --walk/--grazed/--maintenance examples/demo/*.csv --keep (May's plan) --om-dir $out/om"
"$bin" plan "$site" --start 2024-05-27 --weeks 9 --time-limit 5 --format json --out "$out/plan-may.json"
"$bin" plan "$site" --start 2024-06-03 --weeks 8 \
    --walk examples/demo/walk-2024-06.csv --grazed examples/demo/grazed-2024-06.csv \
    --maintenance examples/demo/maintenance.csv --keep "$out/plan-may.json" --keep-weeks 1 \
    --om-dir "$out/om"
echo
echo "O&M files (mowing jobs and animal presence, CSV and iCalendar): $out/om/"
ls "$out/om"
echo
echo "The demo report (open it in a browser, or print it): $report"
