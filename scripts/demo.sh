#!/bin/sh
# Runs rowgraze on the invented demo farm (examples/demo): validates it,
# then shows what the pasture experiences across one tracker row in the
# last year of its synthetic weather.  Later stages (growth, plan) join
# here as they land.
set -eu
bin=$1
site=examples/demo/site.json
echo "== rowgraze check $site   (INVENTED farm, SYNTHETIC weather)"
"$bin" check "$site"
echo
echo "== rowgraze strips $site --from 2025-01-01 --to 2025-12-31"
echo "   (one 6 m row pitch, strip by strip; 'ref' is open ground outside the array)"
"$bin" strips "$site" --from 2025-01-01 --to 2025-12-31
