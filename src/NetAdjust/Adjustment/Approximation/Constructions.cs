using NetAdjust.Geometry;
using NetAdjust.Units;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// The classical plane constructions of approximate coordinates as pure functions of located points and
/// observed values (grid azimuths clockwise from north, computed as atan2(ΔE, ΔN); metres and radians).
/// Textbook constructions, e.g. Wolf &amp; Ghilani, <i>Adjustment Computations</i>, chapters on traverse and
/// intersection/resection; the resection is solved in closed form (see <see cref="Resect"/>).
/// </summary>
internal static class Constructions
{
    /// <summary>Smallest accepted cut angle of two intersecting rays, 5° (common practice).</summary>
    public const double MinCut = 5 * Math.PI / 180;

    /// <summary>Grid azimuth from <paramref name="a"/> to <paramref name="b"/> in [0, 2π).</summary>
    public static double Azimuth(PlanePoint a, PlanePoint b) => Angle.Reduce0To2Pi(Math.Atan2(b.E - a.E, b.N - a.N));

    /// <summary>Horizontal distance between two points, metres.</summary>
    public static double Distance(PlanePoint a, PlanePoint b) =>
        Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));

    /// <summary>Polar point: the point at <paramref name="distance"/> from <paramref name="station"/> on
    /// <paramref name="azimuth"/>: E = E₀ + d sin t, N = N₀ + d cos t.</summary>
    public static PlanePoint Polar(PlanePoint station, double azimuth, double distance) =>
        new(station.E + (distance * Math.Sin(azimuth)), station.N + (distance * Math.Cos(azimuth)));

    /// <summary>
    /// Intersection of two rays; null when they are parallel or do not meet ahead of both stations. Also returns
    /// |sin| of the cut angle, the measure of how well the intersection is conditioned.
    /// </summary>
    public static (PlanePoint Point, double SinCut)? Intersect(Ray a, Ray b)
    {
        double ua = Math.Sin(a.Azimuth), va = Math.Cos(a.Azimuth), ub = Math.Sin(b.Azimuth), vb = Math.Cos(b.Azimuth);
        // a.At + s (ua, va) = b.At + t (ub, vb), solved by Cramer's rule
        double det = (ua * -vb) - (va * -ub);
        if (Math.Abs(det) < 1e-12) return null;
        double de = b.At.E - a.At.E, dn = b.At.N - a.At.N;
        double s = ((de * -vb) - (dn * -ub)) / det;
        double t = ((ua * dn) - (va * de)) / det;
        if (!(s > 0) || !(t > 0)) return null;
        return (new PlanePoint(a.At.E + (s * ua), a.At.N + (s * va)), Math.Abs(det));
    }

    /// <summary>
    /// Intersection of a ray with a circle about another point. Null when the ray misses the circle or meets it
    /// only behind its start. <c>Second</c> is null when the solution is unique: only one meeting point lies
    /// ahead of the station (it starts inside the circle) or the ray touches the circle.
    /// </summary>
    public static (PlanePoint First, PlanePoint? Second)? RayCircle(Ray r, Circle c)
    {
        double ue = Math.Sin(r.Azimuth), un = Math.Cos(r.Azimuth);
        double fe = r.At.E - c.At.E, fn = r.At.N - c.At.N;
        // |f + s u|² = d²:  s² + 2 s (u·f) + |f|² − d² = 0
        double bh = (ue * fe) + (un * fn), cc = (fe * fe) + (fn * fn) - (c.Distance * c.Distance);
        double disc = (bh * bh) - cc;
        if (disc < 0) return null;
        double s1 = -bh + Math.Sqrt(disc), s2 = -bh - Math.Sqrt(disc);
        if (!(s1 > 0)) return null;
        var p1 = new PlanePoint(r.At.E + (s1 * ue), r.At.N + (s1 * un));
        if (!(s2 > 0) || s2 == s1) return (p1, null);
        return (p1, new PlanePoint(r.At.E + (s2 * ue), r.At.N + (s2 * un)));
    }

    /// <summary>
    /// Intersection of two circles (distance–distance): the two solutions on either side of the line from a to b,
    /// the one on its right (clockwise) first. Slightly inconsistent distances of touching circles (within 1e-3 of
    /// the centre distance) give the touching point twice; otherwise null when the circles do not meet.
    /// </summary>
    public static (PlanePoint Right, PlanePoint Left)? CircleCircle(Circle a, Circle b)
    {
        double de = b.At.E - a.At.E, dn = b.At.N - a.At.N;
        double d = Math.Sqrt((de * de) + (dn * dn));
        if (d < 1e-9 || d > a.Distance + b.Distance || d < Math.Abs(a.Distance - b.Distance))
        {
            bool touchesOutside = Math.Abs(d - (a.Distance + b.Distance)) <= 1e-3 * d;
            bool touchesInside = Math.Abs(d - Math.Abs(a.Distance - b.Distance)) <= 1e-3 * d;
            if (d < 1e-9 || (!touchesOutside && !touchesInside)) return null;
        }
        // x along a→b from a to the chord, y half the chord: x = (ra² − rb² + d²) / 2d, y = √(ra² − x²)
        double x = ((a.Distance * a.Distance) - (b.Distance * b.Distance) + (d * d)) / (2 * d);
        double y = Math.Sqrt(Math.Max(0, (a.Distance * a.Distance) - (x * x)));
        double ee = de / d, en = dn / d;
        var m = new PlanePoint(a.At.E + (x * ee), a.At.N + (x * en));
        return (new PlanePoint(m.E + (y * en), m.N - (y * ee)), new PlanePoint(m.E - (y * en), m.N + (y * ee)));
    }

    /// <summary>
    /// Closed-form resection. With w = N + iE, azimuths are arguments, and the clockwise angle θ from located A to
    /// located T seen from the unknown P satisfies Im(e^(−iθ) (w_T − z) conj(w_A − z)) = 0 with z = w_P. Taking A
    /// as origin and dividing by |z|² makes this linear in q = 1/z: Im(e^(−iθ) w_T q) = −sin θ. Two or more targets
    /// besides A give q by least squares, and P = A + 1/q. (Each equation is the circle through A and T on which
    /// the angle is seen; inverting at A turns the circles into lines — the classical geometric solution.)
    /// Null when P lies near the circle through the targets ("danger circle") or fewer than two angles are given.
    /// </summary>
    public static PlanePoint? Resect(IReadOnlyList<AngleAtPoint> cuts)
    {
        if (cuts.Count < 2) return null;
        // Choose as reference the located point that appears in most cuts.
        var refs = cuts.SelectMany(c => new[] { c.X, c.Y }).GroupBy(s => s)
            .OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal);
        foreach (var g in refs)
        {
            string a = g.Key;
            var eqs = new List<(double Bx, double Ay, double Rhs, string Other)>();
            PlanePoint pa = default;
            foreach (var c in cuts)
            {
                PlanePoint t;
                double theta;
                if (c.X == a) { pa = c.AtX; t = c.AtY; theta = c.Angle; }
                else if (c.Y == a) { pa = c.AtY; t = c.AtX; theta = -c.Angle; }
                else continue;
                // c = e^(−iθ) w'_T = (cosθ − i sinθ)(dN + i dE)
                double dN = t.N - pa.N, dE = t.E - pa.E;
                double re = (Math.Cos(theta) * dN) + (Math.Sin(theta) * dE);
                double im = (Math.Cos(theta) * dE) - (Math.Sin(theta) * dN);
                // Im(c q) = re·y + im·x = −sin θ, q = x + i y
                eqs.Add((im, re, -Math.Sin(theta), c.X == a ? c.Y : c.X));
            }
            if (eqs.Select(q => q.Other).Distinct().Count() < 2) continue;
            double sxx = 0, sxy = 0, syy = 0, bx = 0, by = 0;
            foreach (var (cx, cy, r, _) in eqs)
            {
                double norm = 1 / ((cx * cx) + (cy * cy)); // equations scaled to unit coefficient norm
                sxx += cx * cx * norm; sxy += cx * cy * norm; syy += cy * cy * norm;
                bx += cx * r * norm; by += cy * r * norm;
            }
            double det = (sxx * syy) - (sxy * sxy);
            if (det < 1e-6 * Math.Max(sxx * syy, 1e-300)) continue; // danger circle or repeated target
            double qx = ((syy * bx) - (sxy * by)) / det, qy = ((sxx * by) - (sxy * bx)) / det;
            double q2 = (qx * qx) + (qy * qy);
            if (!(q2 > 0) || !double.IsFinite(q2)) continue;
            // z = 1/q = conj(q)/|q|²: Re z = N offset, Im z = E offset
            return new PlanePoint(pa.E + (-qy / q2), pa.N + (qx / q2));
        }
        return null;
    }

    /// <summary>
    /// Sum of squared standardised misfits of a candidate position against rays, circles and angles at it:
    /// Σ((computed − observed)/σ)², angular differences reduced to (−π, π].
    /// </summary>
    public static double Misfit(PlanePoint x, IEnumerable<Ray> rays, IEnumerable<Circle> circles,
        IEnumerable<AngleAtPoint> cuts)
    {
        double s = 0;
        foreach (var r in rays) s += Sq(Angle.ReduceSigned(Azimuth(r.At, x) - r.Azimuth) / r.Sd);
        foreach (var d in circles) s += Sq((Distance(d.At, x) - d.Distance) / d.Sd);
        foreach (var c in cuts) s += Sq(AngleMisfit(x, c) / c.Sd);
        return s;
    }

    /// <summary>Computed − observed angle at <paramref name="x"/>, reduced to (−π, π], radians.</summary>
    public static double AngleMisfit(PlanePoint x, AngleAtPoint c) =>
        Angle.ReduceSigned(Azimuth(x, c.AtY) - Azimuth(x, c.AtX) - c.Angle);

    /// <summary>
    /// The plane similarity (Helmert) transformation y = c·x + t in complex form (z = E + iN), fitted by least
    /// squares to point pairs; with <paramref name="rigid"/> the scale is set to 1. One pair gives a translation.
    /// </summary>
    public static Func<PlanePoint, PlanePoint> Similarity(IReadOnlyList<PlanePoint> from, IReadOnlyList<PlanePoint> to,
        bool rigid)
    {
        double fe = from.Average(p => p.E), fn = from.Average(p => p.N);
        double te = to.Average(p => p.E), tn = to.Average(p => p.N);
        double cr = 1, ci = 0;
        if (from.Count >= 2)
        {
            // c = Σ conj(x')·y' / Σ |x'|²
            double sr = 0, si = 0, ss = 0;
            for (int k = 0; k < from.Count; k++)
            {
                double xe = from[k].E - fe, xn = from[k].N - fn, ye = to[k].E - te, yn = to[k].N - tn;
                sr += (xe * ye) + (xn * yn);
                si += (xe * yn) - (xn * ye);
                ss += (xe * xe) + (xn * xn);
            }
            if (ss > 0) { cr = sr / ss; ci = si / ss; }
            double m = Math.Sqrt((cr * cr) + (ci * ci));
            if (rigid && m > 0) { cr /= m; ci /= m; }
        }
        return p =>
        {
            double xe = p.E - fe, xn = p.N - fn;
            return new PlanePoint(te + (cr * xe) - (ci * xn), tn + (ci * xe) + (cr * xn));
        };
    }

    /// <summary>
    /// Heights by a breadth-first spanning tree of height differences: from each point with a height, every
    /// neighbour without one gets H(to) = H(from) + ΔH. A part with no height at all starts from 0 at its first
    /// point in <paramref name="order"/>.
    /// </summary>
    /// <param name="order">The points to give heights, in input order.</param>
    /// <param name="edges">Height differences in the order to use them: (from, to, H(to) − H(from)) in metres.</param>
    /// <param name="h">Heights known so far, completed in place.</param>
    public static void LevellingTree(IReadOnlyList<string> order,
        IEnumerable<(string From, string To, double Dh)> edges, Dictionary<string, double> h)
    {
        var next = new Dictionary<string, List<(string To, double Dh)>>(StringComparer.Ordinal);
        List<(string To, double Dh)> Of(string id)
        {
            if (!next.TryGetValue(id, out var list)) next[id] = list = [];
            return list;
        }
        foreach (var (from, to, dh) in edges)
        {
            Of(from).Add((to, dh));
            Of(to).Add((from, -dh));
        }
        var queue = new Queue<string>(order.Where(h.ContainsKey));
        void Spread()
        {
            while (queue.Count > 0)
            {
                string a = queue.Dequeue();
                foreach (var (b, dh) in next.GetValueOrDefault(a) ?? [])
                    if (!h.ContainsKey(b)) { h[b] = h[a] + dh; queue.Enqueue(b); }
            }
        }
        Spread();
        foreach (var id in order)
            if (!h.ContainsKey(id)) { h[id] = 0; queue.Enqueue(id); Spread(); }
    }

    private static double Sq(double v) => v * v;
}
