#!/bin/sh
# Runs the benchmarks and prints their figures (never fails on time).
set -eu
B=${1:-build}
"$B/bench_micro" examples/demo/site.json
