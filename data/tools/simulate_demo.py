"""Simulates the invented Brackenmoor demo survey from a chosen truth (seeded), writing
../brackenmoor.yaml and ../brackenmoor-levels.csv. Throw-away helper kept for reproducibility;
the project's tests do not depend on it. Run: python3 simulate_demo.py"""
import math, random

random.seed(20261201)
truth = {  # invented site: Brackenmoor water treatment works (E, N in metres, local grid)
    "BK01": (2150.000, 5320.000), "BK02": (2480.512, 5790.233),
    "S1": (2331.840, 5265.118), "S2": (2512.406, 5331.572), "S3": (2598.771, 5497.040),
    "S4": (2470.225, 5622.914), "S5": (2287.390, 5598.481), "S6": (2158.652, 5471.306),
}
loop = ["BK01", "S1", "S2", "S3", "S4", "S5", "S6"]

def az(a, b):
    (ea, na), (eb, nb) = truth[a], truth[b]
    t = math.atan2(eb - ea, nb - na)
    return t % (2 * math.pi)

def dist(a, b):
    (ea, na), (eb, nb) = truth[a], truth[b]
    return math.hypot(eb - ea, nb - na)

def dms(rad):
    s = round(math.degrees(rad % (2 * math.pi)) * 3600, 1)
    d, rem = divmod(s, 3600); m, sec = divmod(rem, 60)
    return f"{int(d)}-{int(m):02d}-{sec:04.1f}"

SIG_DIR = 2.0  # arcsec, mean of two sets
def sig_dist(d): return math.hypot(0.002, 2e-6 * d, 0.0015)  # EDM 2 mm + 2 ppm, centering 1.5 mm

lines = []
w = lines.append
w("# NetAdjust demo project: Brackenmoor water treatment works, control resurvey (invented site).")
w("# A closed traverse of seven stations from control BK01, oriented on BK02, and a level loop")
w("# (levelling/CSV). Values were simulated from a chosen truth with realistic noise: data/tools/simulate_demo.py.")
w("project: Brackenmoor WTW control resurvey (demo)")
w("units:")
w("  length: m        # m | ft | usft")
w("  angle: dms       # dms | deg | gon")
w("  angle_sd: arcsec # arcsec | mgon")
w("adjustment:")
w("  alpha: 0.05")
w("  max_iterations: 20")
w("  centering: independent   # independent | correlated (one covariance block per setup)")
w("# Instrument and target specifications: every direction, angle and distance of a setup that names an")
w("# instrument is weighted from them (docs/input-format.md, 'Instruments, targets and procedures').")
w("instruments:")
w("  - {id: TS3, direction_sd: 3, zenith_sd: 3, edm: 2 mm + 2 ppm, centering: 1.0 mm, height: 1.5 mm}  # ISO 17123-3 sd, arcsec")
w("targets:")
w("  - {id: TRIBRACH, centering: 1.0 mm, height: 1.5 mm}   # prism in a tribrach on a tripod")
w("levels:")
w("  - {id: DL10, sd_per_km: 1.0 mm}   # ISO 17123-2 sd of 1 km double-run levelling (used by the CSV level loop)")
w("default_sd:")
w(f"  direction: {SIG_DIR}")
w("  angle: 2.8")
w("  distance: 3 mm")
w("  height_difference: 1 mm")
w("points:")
w("  - {id: BK01, e: 2150.000, n: 5320.000, fix: en}   # control, held")
w("  - {id: BK02, e: 2480.512, n: 5790.233, fix: en}   # control, held (orientation)")
for p in loop[1:]:
    e, n = truth[p]
    w(f"  - {{id: {p}, e: {round(e + random.uniform(-0.4, 0.4), 1)}, n: {round(n + random.uniform(-0.4, 0.4), 1)}}}   # approximate")
w("  - {id: BMK1, h: 84.2170, fix: h}   # benchmark, held")
for b in ["BMK2", "BMK3", "BMK4", "BMK5"]:
    w(f"  - {{id: {b}}}")
w("setups:")
for i, st in enumerate(loop):
    back = loop[i - 1]; fore = loop[(i + 1) % len(loop)]
    w(f"  - at: {st}")
    w("    instrument: TS3")
    w("    target: TRIBRACH")
    w("    sets: 2")
    w("    faces: both")
    if st == "S3":  # this crew booked angles at S3
        a = (az(st, fore) - az(st, back)) + random.gauss(0, 2.8 / 206264.806)
        w("    angles:")
        w(f"      - {{from: {back}, to: {fore}, value: {dms(a)}}}")
    else:
        targets = ([ "BK02"] if st == "BK01" else []) + [back, fore]
        zero = random.uniform(0, 2 * math.pi)
        w("    directions:")
        for t in targets:
            r = az(st, t) - zero + random.gauss(0, SIG_DIR / 206264.806)
            w(f"      - {{to: {t}, value: {dms(r)}}}")
    d = dist(st, fore)
    w("    distances:")
    w(f"      - {{to: {fore}, value: {d + random.gauss(0, sig_dist(d)):.4f}}}")
w("files:")
w("  - brackenmoor-levels.csv")
open("../brackenmoor.yaml", "w").write("\n".join(lines) + "\n")

heights = {"BMK1": 84.2170, "BMK2": 86.0412, "BMK3": 91.3385, "BMK4": 88.9027, "BMK5": 85.1164}
sections = [("BMK1", "BMK2", 420.0), ("BMK2", "BMK3", 515.0), ("BMK3", "BMK4", 380.0), ("BMK4", "BMK5", 610.0), ("BMK5", "BMK1", 455.0)]
out = ["# Level loop at Brackenmoor (invented), double-run levelling with level DL10: sd = 1.0 mm/sqrt(km) x sqrt(length)",
       "kind,from,to,value,length,level"]
for a, b, L in sections:
    sd = 0.0010 * math.sqrt(L / 1000)
    out.append(f"height_difference,{a},{b},{heights[b] - heights[a] + random.gauss(0, sd):.5f},{L:.0f},DL10")
open("../brackenmoor-levels.csv", "w").write("\n".join(out) + "\n")
