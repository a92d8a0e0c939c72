#!/bin/sh
# Runs the bad-input table tests/cli/cases.tsv against the rowgraze binary.
# Each row: name, arguments (run from tests/cli), expected exit code, and a
# fragment that stderr (stdout or stderr when the exit is 0) must contain.  On exit 2 the error must be a single
# line (plus the 'Try --help' hint for usage errors) and stdout must be
# empty.  Prints "cli: N passed, M failed" and fails if any failed.
set -u
bin=$(cd "$(dirname "$1")" && pwd)/$(basename "$1")
here=$(cd "$(dirname "$0")" && pwd)
cd "$here" || exit 1
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
pass=0 fail=0
tab=$(printf '\t')
while IFS="$tab" read -r name args code frag; do
    case "$name" in '#'*|'') continue ;; esac
    # shellcheck disable=SC2086
    ROWGRAZE_MODELS=../../models "$bin" $args >"$tmp/out" 2>"$tmp/err"
    rc=$?
    why=""
    if [ "$rc" != "$code" ]; then
        why="exit $rc, expected $code"
    elif [ "$code" = 0 ] && ! cat "$tmp/out" "$tmp/err" | grep -qF -- "$frag"; then
        why="output lacks: $frag"
    elif [ "$code" != 0 ] && ! grep -qF -- "$frag" "$tmp/err"; then
        why="stderr lacks: $frag"
    elif [ "$code" = 2 ]; then
        lines=$(wc -l <"$tmp/err")
        case "$name" in usage-*) max=2 ;; *) max=1 ;; esac
        [ "$lines" -le "$max" ] || why="$lines lines on stderr, expected $max"
        [ -s "$tmp/out" ] && why="output on stdout after an error"
    fi
    if [ -z "$why" ]; then
        pass=$((pass + 1))
    else
        fail=$((fail + 1))
        echo "[  FAILED  ] cli case $name: $why"
        sed 's/^/    stderr: /' "$tmp/err" | head -3
    fi
done <cases.tsv
echo "cli: $pass passed, $fail failed"
[ "$fail" -eq 0 ]
