#!/usr/bin/env python3
"""Simulates data/harrowfield-blunder.yaml: an invented braced network (two held control points, four new
stations) observed with directions and distances, with realistic noise and ONE planted blunder (+40 mm on the
distance H3-H4) for trying the blunder hunt (`netadjust adjust data/harrowfield-blunder.yaml --snoop`).
Deterministic: fixed seed. Standard library only."""
import math, random

random.seed(20261201)
truth = {"HQ1": (5120.000, 8040.000), "HQ2": (5705.318, 8412.907),
         "H1": (5233.417, 8391.226), "H2": (5488.903, 8127.551), "H3": (5391.264, 8608.772), "H4": (5802.640, 8690.115)}
approx = {k: (round(e + random.uniform(-0.3, 0.3), 1), round(n + random.uniform(-0.3, 0.3), 1)) for k, (e, n) in truth.items()}
SD_DIR, SD_DIST = 2.0, 0.003
BLUNDER = ("H3", "H4", 0.040)

def dms(rad):
    deg = math.degrees(rad) % 360.0
    s = round(deg * 3600.0, 1)
    d, rem = divmod(s, 3600.0)
    m, sec = divmod(rem, 60.0)
    return f"{int(d)}-{int(m):02d}-{sec:04.1f}"

stations = ["HQ1", "HQ2", "H1", "H2", "H3", "H4"]
sights = {"HQ1": ["HQ2", "H1", "H2"], "HQ2": ["HQ1", "H2", "H4"], "H1": ["HQ1", "H2", "H3"],
          "H2": ["HQ1", "HQ2", "H1", "H3", "H4"], "H3": ["H1", "H2", "H4"], "H4": ["HQ2", "H2", "H3"]}
lines = ["# NetAdjust demo: Harrowfield quarry extension, new control (invented site and data).",
         "# Simulated by data/tools/simulate_blunder_demo.py from a chosen truth with 2\" directions and 3 mm",
         "# distances, and ONE planted blunder for the blunder hunt: try",
         "#   dotnet run --project src/NetAdjust.Cli -- adjust data/harrowfield-blunder.yaml --snoop",
         "project: Harrowfield quarry extension control (blunder-hunt demo)",
         "units: {length: m, angle: dms, angle_sd: arcsec}",
         "default_sd: {direction: 2.0, distance: 3 mm}",
         "statistics:",
         "  relative_pairs:",
         "    - [H1, H4]",
         "points:"]
for k in stations:
    e, n = truth[k] if k.startswith("HQ") else approx[k]
    fix = ", fix: en" if k.startswith("HQ") else ""
    lines.append(f"  - {{id: {k}, e: {e:.3f}, n: {n:.3f}{fix}}}")
lines.append("setups:")
done = set()
for s in stations:
    lines.append(f"  - at: {s}")
    orient = random.uniform(0, 2 * math.pi)
    lines.append("    directions:")
    for t in sights[s]:
        az = math.atan2(truth[t][0] - truth[s][0], truth[t][1] - truth[s][1])
        r = az - orient + math.radians(random.gauss(0, SD_DIR) / 3600.0)
        lines.append(f"      - {{to: {t}, value: {dms(r)}}}")
    dl = []
    for t in sights[s]:
        key = tuple(sorted((s, t)))
        if key in done or key == ("HQ1", "HQ2"):
            continue
        done.add(key)
        d = math.dist(truth[s], truth[t]) + random.gauss(0, SD_DIST)
        if (s, t) == BLUNDER[:2]:
            d += BLUNDER[2]
        dl.append(f"      - {{to: {t}, value: {d:.4f}}}")
    if dl:
        lines.append("    distances:")
        lines.extend(dl)
open("data/harrowfield-blunder.yaml", "w").write("\n".join(lines) + "\n")
