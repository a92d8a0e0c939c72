#!/bin/sh
# Re-planning checks through the command line (tests/replan/replan.py):
# needs /usr/bin/python3, which CI installs; skipped with a message without it.
if [ ! -x /usr/bin/python3 ]; then
    echo "replan: skipped: /usr/bin/python3 not found (apt-get install python3)"
    exit 0
fi
exec /usr/bin/python3 "$(dirname "$0")/../tests/replan/replan.py" "$1"
