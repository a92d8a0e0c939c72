#!/bin/sh
# Finds the Debian packages rowgraze needs to build and test; installs the
# missing ones when run as root with apt-get, otherwise prints the exact
# command and stops.  Called first by `make demo` and `make check`.
set -u
need="gcc make libglpk-dev libcjson-dev libcsv-dev libcmocka-dev libical-dev"
missing=""
for p in $need; do
    if ! dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed"; then
        missing="$missing $p"
    fi
done
[ -z "$missing" ] && exit 0
if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null 2>&1; then
    echo "rowgraze: installing build dependencies:$missing" >&2
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >&2 && apt-get install -y -qq --no-install-recommends $missing >&2 && exit 0
    echo "rowgraze: error: apt-get could not install:$missing" >&2
    exit 1
fi
echo "rowgraze: error: missing build dependencies:$missing" >&2
echo "Install them with:  sudo apt-get install$missing" >&2
exit 1
