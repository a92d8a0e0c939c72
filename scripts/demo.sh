#!/bin/sh
# Runs rowgraze on the invented demo farm (examples/demo).  Later stages
# (strips, growth, plan) join here as they land.
set -eu
bin=$1
site=examples/demo/site.json
echo "== rowgraze check $site   (invented farm, synthetic weather)"
"$bin" check "$site"
