#!/usr/bin/env bash
# Cold start of the command, measured from the shell: publishes netadjust twice for this machine's runtime (plain
# JIT and ReadyToRun, the csproj's default when a runtime is named), then runs the small traverse of data/ RUNS times
# with each (default 10) and prints wall, user and system time of every run and the median wall time, with the load
# average. Usage: benchmarks/cold-start.sh [RUNS]   (from the repository root; needs GNU time at /usr/bin/time)
set -euo pipefail
runs="${1:-10}"
rid="$(dotnet --info | sed -n 's/^ *RID: *//p' | head -1)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
dotnet publish src/NetAdjust.Cli -c Release -r "$rid" --self-contained false -p:PublishReadyToRun=false \
    -o "$work/jit" >/dev/null
dotnet publish src/NetAdjust.Cli -c Release -r "$rid" --self-contained false -o "$work/r2r" >/dev/null
for build in jit r2r; do
    : > "$work/$build.times"
    for ((i = 0; i < runs; i++)); do
        /usr/bin/time -f "%e %U %S" -a -o "$work/$build.times" \
            "$work/$build/NetAdjust.Cli" adjust data/brackenmoor.yaml --date 2026-12-01 --quiet >/dev/null
    done
    median="$(cut -d' ' -f1 "$work/$build.times" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}')"
    cpu="$(awk '{s += $2 + $3} END {printf "%.2f", s / NR}' "$work/$build.times")"
    echo "$build ($rid): median wall ${median} s, mean user+sys ${cpu} s over $runs runs;" \
        "load $(cut -d' ' -f1 /proc/loadavg)"
done
