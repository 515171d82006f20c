#!/usr/bin/env bash
# End-to-end figures of the command a user runs (docs/performance.md, "The command a user runs"): publishes netadjust
# for this machine's runtime (native on linux-x64, as `dotnet tool install` installs it there), makes the seeded plane
# networks of `netadjust simulate --kind plane --points N --seed 1` in WORK (kept between calls: they are large), and
# times `netadjust adjust NET --date 2026-12-01 --json OUT.json --report OUT.txt --quiet` with GNU time: wall, user
# and system CPU seconds and peak resident memory, with the 1-minute load average before and after each run.
# Usage: benchmarks/command-scaling.sh WORK N [N ...]   (from the repository root; e.g. /tmp/nets 10000 100000)
set -euo pipefail
work="$1"; shift
mkdir -p "$work"
rid="$(dotnet --info | sed -n 's/^ *RID: *//p' | head -1)"
dotnet publish src/NetAdjust.Cli -c Release -r "$rid" -o "$work/publish" >/dev/null
cmd="$work/publish/NetAdjust.Cli"
printf '| points | observations | wall (s) | CPU user + sys (s) | peak memory (GiB) | load before / after |\n'
printf '| ---: | ---: | ---: | ---: | ---: | --- |\n'
for n in "$@"; do
    net="$work/net$n.yaml"
    [ -f "$net" ] || "$cmd" simulate --kind plane --points "$n" --seed 1 --out "$net" >/dev/null
    obs=$(($(grep -vc "^#" "$work/net$n-observations.csv") - 1))
    before="$(cut -d' ' -f1 /proc/loadavg)"
    /usr/bin/time -f "%e %U %S %M" -o "$work/time$n" "$cmd" adjust "$net" --date 2026-12-01 \
        --json "$work/out$n.json" --report "$work/out$n.txt" --quiet
    after="$(cut -d' ' -f1 /proc/loadavg)"
    read -r wall user sys kb < "$work/time$n"
    awk -v n="$n" -v o="$obs" -v w="$wall" -v u="$user" -v s="$sys" -v k="$kb" -v b="$before" -v a="$after" \
        'BEGIN { printf "| %d | %d | %.2f | %.2f | %.2f | %s / %s |\n", n, o, w, u + s, k / 1048576, b, a }'
done
