"""Simulates the invented Harrowgate viaduct control check (seeded), writing ../harrowgate-control.yaml:
a braced network of six new stations tied to four control marks, one of which (HV03) was disturbed by
5 cm (3 cm east, 4 cm north) after its coordinates were published. Demo of `netadjust adjust --sequence`.
Throw-away helper kept for reproducibility; the tests do not depend on it. Run: python3 simulate_control_check.py"""
import math, random

random.seed(20261202)
truth = {  # invented local grid, metres
    "HV01": (5000.000, 8000.000), "HV02": (5620.450, 8035.180), "HV03": (5655.300, 8590.720), "HV04": (4985.610, 8610.040),
    "T1": (5210.330, 8140.250), "T2": (5430.870, 8120.610), "T3": (5515.420, 8330.090),
    "T4": (5390.150, 8480.770), "T5": (5170.640, 8455.320), "T6": (5105.980, 8290.410),
}
published = dict(truth)
published["HV03"] = (truth["HV03"][0] + 0.030, truth["HV03"][1] + 0.040)  # the mark moved after publication
control = ["HV01", "HV02", "HV03", "HV04"]
stations = ["T1", "T2", "T3", "T4", "T5", "T6"]
sights = {
    "T1": ["HV01", "T2", "T6", "T5", "HV02"], "T2": ["T1", "HV02", "T3", "T4"], "T3": ["T2", "HV02", "HV03", "T4"],
    "T4": ["T3", "HV03", "HV04", "T5"], "T5": ["T4", "HV04", "T6", "T1"], "T6": ["T5", "HV01", "T1", "HV04"],
}
SIG_DIR = 1.0  # arcsec, mean of sets

def az(a, b):
    (ea, na), (eb, nb) = truth[a], truth[b]
    return math.atan2(eb - ea, nb - na) % (2 * math.pi)

def dist(a, b):
    (ea, na), (eb, nb) = truth[a], truth[b]
    return math.hypot(eb - ea, nb - na)

def sig_dist(d): return math.hypot(0.001, 1.5e-6 * d, 0.001)

def dms(rad):
    s = round(math.degrees(rad % (2 * math.pi)) * 3600, 1)
    d, rem = divmod(s, 3600); m, sec = divmod(rem, 60)
    return f"{int(d)}-{int(m):02d}-{sec:04.1f}"

out = []
w = out.append
w("# NetAdjust demo project: Harrowgate viaduct, control check before stake-out (invented site).")
w("# Six new stations braced to four published control marks. One mark (HV03) was disturbed after publication:")
w("# run `netadjust adjust data/harrowgate-control.yaml --sequence` to see the control test fail and HV03 stand out.")
w("# Values simulated from a chosen truth with realistic noise: data/tools/simulate_control_check.py.")
w("project: Harrowgate viaduct control check (demo)")
w("units: {length: m, angle: dms, angle_sd: arcsec}")
w(f"default_sd: {{direction: {SIG_DIR}}}")
w("points:")
for c in control:
    e, n = published[c]
    w(f"  - {{id: {c}, e: {e:.3f}, n: {n:.3f}, fix: en}}   # published control")
for s in stations:
    w(f"  - {{id: {s}}}   # new station: approximate coordinates computed by the program")
w("setups:")
for s in stations:
    zero = random.uniform(0, 2 * math.pi)
    w(f"  - at: {s}")
    w("    directions:")
    for t in sights[s]:
        w(f"      - {{to: {t}, value: {dms(az(s, t) - zero + random.gauss(0, SIG_DIR / 206264.806))}}}")
    w("    distances:")
    for t in sights[s]:
        if t in control or stations.index(t) > stations.index(s):
            d = dist(s, t)
            w(f"      - {{to: {t}, value: {d + random.gauss(0, sig_dist(d)):.4f}, sd: {sig_dist(d):.4f}}}")
open("../harrowgate-control.yaml", "w").write("\n".join(out) + "\n")
