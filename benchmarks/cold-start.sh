#!/usr/bin/env bash
# Cold start of the command, measured from the shell: publishes netadjust for this machine's runtime three ways (plain
# JIT, ReadyToRun, and the csproj's default when a runtime is named: native on linux-x64, ReadyToRun elsewhere), packs
# the tool and installs it with `dotnet tool install` into a temporary path (on linux-x64 the install takes the native
# package), then runs the small traverse of data/ RUNS times with each (default 10) and prints the median wall time and
# the mean user + system CPU time, with the load average. Usage: benchmarks/cold-start.sh [RUNS]   (from the
# repository root; needs GNU time at /usr/bin/time)
set -euo pipefail
runs="${1:-10}"
rid="$(dotnet --info | sed -n 's/^ *RID: *//p' | head -1)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
dotnet publish src/NetAdjust.Cli -c Release -r "$rid" --self-contained false -p:PublishAot=false \
    -p:PublishReadyToRun=false -o "$work/jit" >/dev/null
dotnet publish src/NetAdjust.Cli -c Release -r "$rid" --self-contained false -p:PublishAot=false \
    -p:PublishReadyToRun=true -o "$work/r2r" >/dev/null
dotnet publish src/NetAdjust.Cli -c Release -r "$rid" -o "$work/default" >/dev/null
version=$(dotnet msbuild src/NetAdjust.Cli -getProperty:Version)
dotnet pack src/NetAdjust.Cli -c Release -o "$work/feed" >/dev/null
for r in any "$rid"; do dotnet pack src/NetAdjust.Cli -c Release -r "$r" -o "$work/feed" >/dev/null; done
NUGET_PACKAGES="$work/nuget" dotnet tool install NetAdjust.Tool --version "$version" --tool-path "$work/installed" \
    --add-source "$work/feed" >/dev/null
for build in jit r2r default installed; do
    command="$work/$build/NetAdjust.Cli"
    [ "$build" = installed ] && command="$work/installed/netadjust"
    : > "$work/$build.times"
    for ((i = 0; i < runs; i++)); do
        /usr/bin/time -f "%e %U %S" -a -o "$work/$build.times" \
            "$command" adjust data/brackenmoor.yaml --date 2026-12-01 --quiet >/dev/null
    done
    median="$(cut -d' ' -f1 "$work/$build.times" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}')"
    cpu="$(awk '{s += $2 + $3} END {printf "%.2f", s / NR}' "$work/$build.times")"
    echo "$build ($rid): median wall ${median} s, mean user+sys ${cpu} s over $runs runs;" \
        "load $(cut -d' ' -f1 /proc/loadavg)"
done
