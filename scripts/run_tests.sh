#!/bin/sh
# Runs each cmocka test program given as an argument, keeps their output
# (cmocka's own summary lines included), and fails if any program failed.
set -u
failed=0 ran=0
for t in "$@"; do
    ran=$((ran + 1))
    echo "== $(basename "$t")"
    if ! "$t"; then
        failed=$((failed + 1))
        echo "[  FAILED  ] test program $(basename "$t")"
    fi
done
echo "programs: $((ran - failed)) passed, $failed failed"
[ "$failed" -eq 0 ]
