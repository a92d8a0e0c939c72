#!/bin/sh
# Runs the benchmarks and prints their figures (never fails on time).
set -eu
B=${1:-build}
"$B/bench_micro" examples/demo/site.json
# the planner: PLAN_SECONDS per instance (default 10; the targets
# use 60), with coinor-cbc alongside when installed
"$B/bench_plan" "${PLAN_SECONDS:-10}"
