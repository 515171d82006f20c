# An invented GNSS densification network for the benchmarks (docs/performance.md, "Fifteenth pass"): SIDE x SIDE
# points on a jittered grid about 1.5 km apart in ETRS89 / UTM 32N (one point in 400 held), baselines to the K nearest
# neighbours in 20 sessions, earth-centred vectors from the chosen truth plus seeded noise (numbers simulated, not
# measured). Python standard library only; UTM by Krueger's series (Karney 2011) to n^3.
# Usage: python3 benchmarks/gnss-network.py SIDE K OUT.yaml   (writes OUT.yaml and OUT-baselines.csv)
import math, random, sys
n_side = int(sys.argv[1]); k = int(sys.argv[2]); out = sys.argv[3]
random.seed(7)
a = 6378137.0; f = 1/298.257222101; e2 = f*(2-f)
nn = f/(2-f); A = a/(1+nn)*(1+nn**2/4+nn**4/64)
al = [nn/2-2*nn**2/3+5*nn**3/16, 13*nn**2/48-3*nn**3/5, 61*nn**3/240]
k0=0.9996; lon0=math.radians(9); E0=500000.0
def utm(lat, lon):
    s=math.sin(lat); c=2*math.sqrt(nn)/(1+nn)
    t=math.sinh(math.atanh(s)-c*math.atanh(c*s)); dl=lon-lon0
    xi=math.atan2(t, math.cos(dl)); eta=math.atanh(math.sin(dl)/math.sqrt(1+t*t))
    E=E0+k0*A*(eta+sum(al[j]*math.cos(2*(j+1)*xi)*math.sinh(2*(j+1)*eta) for j in range(3)))
    N=k0*A*(xi+sum(al[j]*math.sin(2*(j+1)*xi)*math.cosh(2*(j+1)*eta) for j in range(3)))
    return E,N
def ecef(lat, lon, h):
    Nr=a/math.sqrt(1-e2*math.sin(lat)**2)
    return ((Nr+h)*math.cos(lat)*math.cos(lon),(Nr+h)*math.cos(lat)*math.sin(lon),(Nr*(1-e2)+h)*math.sin(lat))
sep=47.42; spacing=0.02  # degrees
pts=[]
for i in range(n_side):
    for j in range(n_side):
        lat=math.radians(50.0+i*spacing*0.65+random.uniform(-0.004,0.004)); lon=math.radians(8.0+j*spacing+random.uniform(-0.006,0.006))
        H=200+100*math.sin(i/7.0)+random.uniform(0,30)
        pts.append((f"G{i:03d}{j:03d}",lat,lon,H))
with open(out,'w') as y:
    y.write("project: Vennmark national GNSS densification (invented demo)\nunits:\n  length: m\n  angle: dms\n  angle_sd: arcsec\n")
    y.write("crs: EPSG:25832\ngrid:\n  distances: ground\n  geoid_separation: 47.42\npoints:\n")
    for idx,(pid,lat,lon,H) in enumerate(pts):
        E,N=utm(lat,lon)
        fixed = (idx % 400 == 0)
        if fixed: y.write(f"- id: {pid}\n  e: {E:.4f}\n  n: {N:.4f}\n  h: {H:.4f}\n  fix: enh\n")
        else: y.write(f"- id: {pid}\n  e: {E+random.uniform(-2,2):.3f}\n  n: {N+random.uniform(-2,2):.3f}\n  h: {H+random.uniform(-2,2):.3f}\n")
    y.write("gnss:\n  frame: ETRS89\n  groups:\n")
    for g in range(20): y.write(f"  - id: D{g:02d}\n    scale: 1.0\n")
    y.write("files:\n- " + out.rsplit('/',1)[-1].replace('.yaml','-baselines.csv') + "\n")
X=[ecef(lat,lon,H+sep) for (_,lat,lon,H) in pts]
with open(out.replace('.yaml','-baselines.csv'),'w') as c:
    c.write("kind,from,to,dx,dy,dz,sd_x,sd_y,sd_z,r_xy,r_xz,r_yz,group\n")
    seen=set()
    for i in range(n_side):
        for j in range(n_side):
            p=i*n_side+j
            cand=[]
            for di in range(-2,3):
                for dj in range(-2,3):
                    if (di,dj)==(0,0): continue
                    ii,jj=i+di,j+dj
                    if 0<=ii<n_side and 0<=jj<n_side:
                        q=ii*n_side+jj; d=sum((X[p][t]-X[q][t])**2 for t in range(3)); cand.append((d,q))
            cand.sort()
            for d,q in cand[:k]:
                key=(min(p,q),max(p,q))
                if key in seen: continue
                seen.add(key)
                sd=[0.003+0.5e-6*math.sqrt(d)]*3; sd[2]*=1.6
                v=[X[q][t]-X[p][t]+random.gauss(0,sd[t]) for t in range(3)]
                g=random.randrange(20)
                c.write(f"baseline,{pts[p][0]},{pts[q][0]},{v[0]:.4f},{v[1]:.4f},{v[2]:.4f},{sd[0]:.5f},{sd[1]:.5f},{sd[2]:.5f},0.12,-0.31,0.08,D{g:02d}\n")
