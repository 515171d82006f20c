#!/usr/bin/env bash
# Reading in the command a user runs (docs/performance.md, "Reading"): the seconds from the start of
# `netadjust adjust NET --date 2026-12-01 --json OUT.json --report OUT.txt` to the moment the project has been read
# (process start, the project file, its CSV observation files and the network's checks). The progress clock on
# standard error starts when reading ends, so the reading time is the wall time at which the first progress line
# arrives less the clock time that line shows (shown to 0.1 s: the figure is good to about 0.05 s). The run is
# stopped at that line; nothing is kept. Runs RUNS times (default 3) per network with each given program, one after
# the other, and prints the time, the observation rows read per second and the 1-minute load average.
# Usage: benchmarks/command-reading.sh NET.yaml [RUNS] PROGRAM [PROGRAM ...]
#   PROGRAM: a published netadjust (e.g. the NetAdjust.Cli of `dotnet publish src/NetAdjust.Cli -c Release -r
#   linux-x64 -o DIR`); NET: a network of `netadjust simulate --kind plane --points N --seed 1 --out NET.yaml` (its
#   rows are counted in NET-observations.csv) or of `benchmarks/gnss-network.py SIDE 5 NET.yaml` (rows in
#   NET-baselines.csv, one row a baseline). A network read and set up within a second prints no progress line:
#   use one of 100,000 points (or 40,000 GNSS points) or more.
set -euo pipefail
net="$1"; shift
runs=3
if [[ "${1:-}" =~ ^[0-9]+$ ]]; then runs="$1"; shift; fi
[ "$#" -gt 0 ] || { echo "usage: $0 NET.yaml [RUNS] PROGRAM [PROGRAM ...]" >&2; exit 2; }
csv="${net%.yaml}-observations.csv"
[ -f "$csv" ] || csv="${net%.yaml}-baselines.csv"
rows=$(($(grep -vc "^#" "$csv") - 1))
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
printf '| program | reading (s) | rows/s | load |\n| --- | ---: | ---: | ---: |\n'
for ((r = 0; r < runs; r++)); do
    for program in "$@"; do
        load="$(cut -d' ' -f1 /proc/loadavg)"
        # the first progress line on standard error, read through a named pipe as it arrives (no polling)
        rm -f "$work/progress"; mkfifo "$work/progress"
        start="$(date +%s.%N)"
        "$program" adjust "$net" --date 2026-12-01 --json "$work/out.json" --report "$work/out.txt" \
            2> "$work/progress" > /dev/null &
        pid=$!
        line=""
        # (warnings about the project come before the progress)
        while IFS= read -r line; do [[ "$line" == netadjust:* ]] && break; done < "$work/progress" || true
        now="$(date +%s.%N)"
        kill "$pid" 2> /dev/null || true
        wait "$pid" 2> /dev/null || true
        # netadjust:   22.4 s  Gauss-Newton iteration 1
        clock="$(awk '{ print $2 }' <<< "$line")"
        if [[ ! "$clock" =~ ^[0-9]+\.[0-9]$ ]]; then
            echo "$program: no progress line (the run ended within a second, or failed): $line" >&2
            exit 1
        fi
        awk -v p="$program" -v s="$start" -v n="$now" -v c="$clock" -v rows="$rows" -v l="$load" \
            'BEGIN { t = n - s - c; printf "| %s | %.2f | %.0f | %s |\n", p, t, rows / t, l }'
    done
done
