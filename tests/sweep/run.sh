#!/bin/sh
# run.sh SUNPOS_BINARY - the sun-position sweep against PyEphem.
#
# Runs tests/sweep/sweep.py with /usr/bin/python3 (the interpreter that
# Debian's python3-ephem installs into) on the sunpos binary built from
# tests/sweep/sunpos.c and src/sun.c, and exits with its status.  Where
# that python cannot import ephem, says so and exits 0.
#
# GPL-3.0-or-later.
if [ $# -ne 1 ]; then
    echo "usage: sh tests/sweep/run.sh SUNPOS_BINARY" >&2
    exit 2
fi
if ! /usr/bin/python3 -c 'import ephem' >/dev/null 2>&1; then
    echo 'sun sweep: skipped (python3-ephem not installed; apt-get install python3-ephem)'
    exit 0
fi
exec /usr/bin/python3 "$(dirname "$0")/sweep.py" "$1"
