#!/bin/sh
# Runs rowgraze on the invented demo farm (examples/demo): validates it,
# shows what the pasture experiences across one tracker row, and forecasts
# each paddock's growth by week.  The planner joins here when it lands.
set -eu
bin=$1
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
