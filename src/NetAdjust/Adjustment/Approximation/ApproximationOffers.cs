using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// THE ONE PLACE that maps observation kinds to what they offer approximate coordinates: rays (azimuths, oriented
/// directions, angles at a located station), circles (distances), angles at the unknown point (angles and
/// directions observed there), height differences, membership of a direction set, and whether a kind fixes the
/// scale of a local frame. Everything else in this folder works on those offers only, so that the entries can
/// move into the observation kinds' own types.
/// </summary>
internal static class ApproximationOffers
{
    /// <summary>The direction when <paramref name="o"/> belongs to a set sharing one orientation; otherwise
    /// null.</summary>
    public static DirectionObservation? SetMember(Observation o) => o as DirectionObservation;

    /// <summary>Whether the observation fixes the scale of a part built in a local frame (distances).</summary>
    public static bool FixesScale(Observation o) =>
        o.Kind is ObservationKind.Distance or ObservationKind.SlopeDistance && !o.Excluded;

    /// <summary>Whether the observation ties plane positions (every kind but height differences).</summary>
    public static bool IsPlane(Observation o) => ObservationKindRegistry.IsHorizontal(o.Kind);

    /// <summary>GNSS baselines that can place their ends (one record per baseline, modelled on a projection);
    /// set-aside ones last.</summary>
    public static IEnumerable<BaselineObservation> Baselines(SurveyNetwork network) =>
        network.Observations.OfType<BaselineObservation>().Where(b => b.Grid?.Projection is not null)
            .DistinctBy(b => (b.BaselineId ?? b.Source, b.From, b.To)).OrderBy(b => b.Excluded);

    /// <summary>
    /// The other end of a GNSS baseline from a located end: its grid position, and the height difference
    /// H(other) − H(known), through the exact chain (grid → geodetic → earth-centred, plus or minus the vector, and
    /// back), the known end's height taken as 0 (a height error of 100 m moves the other end by about 1 mm on a
    /// 5 km baseline: enough for a start value).
    /// </summary>
    /// <param name="b">The baseline.</param>
    /// <param name="fromKnown">True when the known end is <see cref="Observation.From"/>.</param>
    /// <param name="e">Easting of the known end.</param>
    /// <param name="n">Northing of the known end.</param>
    public static (double E, double N, double Dh) BaselineStep(BaselineObservation b, bool fromKnown, double e,
        double n)
    {
        var grid = b.Grid!;
        var p = grid.Projection!;
        string known = fromKnown ? b.From : b.To, other = fromKnown ? b.To : b.From;
        double sign = fromKnown ? 1 : -1;
        var (lat, lon) = p.Inverse(e, n);
        var x = Geodesy.Geocentric.ToGeocentric(p.Ellipsoid, lat, lon, grid.EllipsoidalHeight(known, 0)!.Value);
        var (lat2, lon2, h2) = Geodesy.Geocentric.ToGeodetic(p.Ellipsoid, x.X + (sign * b.Dx.Metres),
            x.Y + (sign * b.Dy.Metres), x.Z + (sign * b.Dz.Metres));
        var (e2, n2) = p.Forward(lat2, lon2);
        return (e2, n2, h2 - grid.EllipsoidalHeight(other, 0)!.Value);
    }

    /// <summary>Height differences (from, to, H(to) − H(from)) of GNSS baselines whose start is located.</summary>
    /// <param name="network">The network.</param>
    /// <param name="plane">The located plane coordinates of a point, or null when it has none yet.</param>
    public static IEnumerable<(string From, string To, double Dh)> BaselineEdges(SurveyNetwork network,
        Func<string, PlanePoint?> plane)
    {
        foreach (var b in Baselines(network))
            if (plane(b.From) is PlanePoint a) yield return (b.From, b.To, BaselineStep(b, true, a.E, a.N).Dh);
    }

    /// <summary>Height differences as (from, to, H(to) − H(from)); set-aside observations last, so that they
    /// are used only where nothing else reaches.</summary>
    public static IEnumerable<(string From, string To, double Dh)> LevellingEdges(SurveyNetwork network) =>
        network.Observations.OfType<HeightDifferenceObservation>().OrderBy(x => x.Excluded)
            .Select(o => (o.From, o.To, o.Value));

    /// <summary>
    /// Height differences H(to) − H(from) of the marks reduced from zenith angles: the trigonometric height
    /// ΔH = D cos z + (1 − k)s²/(2R) + i − t (docs/methods.md) with the slope distance D observed between the same
    /// points (s = D sin z), else s from the plane coordinates located so far; set-aside observations last. Zenith
    /// angles with neither give no edge.
    /// </summary>
    /// <param name="network">The network.</param>
    /// <param name="plane">The located plane coordinates of a point, or null when it has none yet.</param>
    public static IEnumerable<(string From, string To, double Dh)> TrigonometricEdges(SurveyNetwork network,
        Func<string, PlanePoint?> plane)
    {
        var slopes = new Dictionary<(string, string), SlopeDistanceObservation>();
        foreach (var d in network.Observations.OfType<SlopeDistanceObservation>().OrderBy(x => x.Excluded))
            slopes.TryAdd((d.From, d.To), d);
        foreach (var z in network.Observations.OfType<ZenithObservation>().OrderBy(x => x.Excluded))
        {
            double cot = Math.Cos(z.Value) / Math.Sin(z.Value), s, rise;
            if (slopes.TryGetValue((z.From, z.To), out var d))
            {
                s = d.Value * Math.Sin(z.Value);
                // D cos z is the rise of the slope distance's line: it is taken between the slope distance's own
                // instrument and target heights, which the zenith angle's i − t added below then replaces
                rise = (d.Value * Math.Cos(z.Value)) + d.InstrumentHeight.Metres - d.TargetHeight.Metres
                    - z.InstrumentHeight.Metres + z.TargetHeight.Metres;
            }
            else if (plane(z.From) is PlanePoint a && plane(z.To) is PlanePoint b)
            {
                s = Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));
                rise = s * cot;
            }
            else continue;
            yield return (z.From, z.To, rise + SpatialGeometry.CurvatureAndRefraction(s, z.Refraction,
                SpatialGeometry.EarthRadius + z.PlaneHeight.Metres)
                + z.InstrumentHeight.Metres - z.TargetHeight.Metres);
        }
    }

    /// <summary>The horizontal distance s = D sin z of a slope distance, from a zenith angle observed between the
    /// same points (either way), or null when there is none.</summary>
    private static double? Horizontal(ObservationIndex index, SlopeDistanceObservation d)
    {
        foreach (var o in index.ObservationsOf(d.From))
            if (o is ZenithObservation z && ((z.From == d.From && z.To == d.To) || (z.From == d.To && z.To == d.From)))
                return d.Value * Math.Sin(z.Value);
        return null;
    }

    /// <summary>
    /// Everything that ties point <paramref name="id"/> to located points: rays from located stations, circles
    /// about located points, and angles at the point between located points.
    /// </summary>
    /// <param name="index">The observation index.</param>
    /// <param name="id">The point to locate.</param>
    /// <param name="known">Located points.</param>
    /// <param name="orientation">Orientations of the direction sets oriented so far, radians.</param>
    public static (List<Ray> Rays, List<Circle> Circles, List<AngleAtPoint> Cuts) Gather(ObservationIndex index,
        string id, IReadOnlyDictionary<string, PlanePoint> known, IReadOnlyDictionary<string, double> orientation)
    {
        var rays = new List<Ray>();
        var circles = new List<Circle>();
        var cuts = new List<AngleAtPoint>();
        foreach (var o in index.ObservationsOf(id))
        {
            switch (o)
            {
                case DistanceObservation d when d.From == id && known.TryGetValue(d.To, out var q):
                    circles.Add(new Circle(d.To, q, d.Value, d.StandardDeviation)); break;
                case DistanceObservation d when d.To == id && known.TryGetValue(d.From, out var q):
                    circles.Add(new Circle(d.From, q, d.Value, d.StandardDeviation)); break;
                case SlopeDistanceObservation d when Horizontal(index, d) is double s
                                                    && known.TryGetValue(d.From == id ? d.To : d.From, out var q):
                    circles.Add(new Circle(d.From == id ? d.To : d.From, q, s, d.StandardDeviation)); break;
                case AzimuthObservation a when a.To == id && known.TryGetValue(a.From, out var q):
                    rays.Add(new Ray(a.From, q, a.Value, a.StandardDeviation)); break;
                case AzimuthObservation a when a.From == id && known.TryGetValue(a.To, out var q):
                    rays.Add(new Ray(a.To, q, Angle.Reduce0To2Pi(a.Value + Math.PI), a.StandardDeviation)); break;
                case DirectionObservation d when d.Target == id && orientation.TryGetValue(d.SetId, out double w)
                                                 && known.TryGetValue(d.Station, out var q):
                    rays.Add(new Ray(d.Station, q, Angle.Reduce0To2Pi(d.Reading.Radians + w), d.StandardDeviation));
                    break;
                case AngleObservation g when g.Station != id && known.TryGetValue(g.Station, out var s):
                    if (g.Foresight == id && known.TryGetValue(g.Backsight, out var b))
                        rays.Add(new Ray(g.Station, s, Angle.Reduce0To2Pi(Constructions.Azimuth(s, b) + g.Value),
                            g.StandardDeviation));
                    else if (g.Backsight == id && known.TryGetValue(g.Foresight, out var f))
                        rays.Add(new Ray(g.Station, s, Angle.Reduce0To2Pi(Constructions.Azimuth(s, f) - g.Value),
                            g.StandardDeviation));
                    break;
                case AngleObservation g when g.Station == id && known.TryGetValue(g.Backsight, out var bb)
                                             && known.TryGetValue(g.Foresight, out var ff):
                    cuts.Add(new AngleAtPoint(g.Backsight, bb, g.Foresight, ff, g.Value, g.StandardDeviation)); break;
            }
        }
        // Direction sets at the point: every located target against the set's first located target (the
        // difference of two readings, σ√2).
        foreach (var dirs in index.SetsAt(id).Select(k => index.Sets[k]))
        {
            var located = dirs.Where(d => known.ContainsKey(d.Target)).ToList();
            for (int k = 1; k < located.Count; k++)
            {
                double angle = Angle.Reduce0To2Pi(located[k].Reading.Radians - located[0].Reading.Radians);
                cuts.Add(new AngleAtPoint(located[0].Target, known[located[0].Target], located[k].Target,
                    known[located[k].Target], angle, Math.Sqrt(2) * located[k].StandardDeviation));
            }
        }
        return (rays, circles, cuts);
    }

    /// <summary>
    /// A second point for a local frame started at <paramref name="first"/>: the far end of its first distance at
    /// the observed length (else the first other point of a plane observation at 100 m), on an observed azimuth
    /// between the two (else north). Null when no plane observation leaves the point.
    /// </summary>
    public static (string Id, PlanePoint At)? SeedNeighbour(ObservationIndex index, string first)
    {
        var mine = index.ObservationsOf(first);
        var dist = mine.OfType<DistanceObservation>().FirstOrDefault();
        string? other = dist is null ? null : dist.From == first ? dist.To : dist.From;
        other ??= mine.Where(IsPlane).SelectMany(o => o.Points).FirstOrDefault(p => p != first);
        if (other is null) return null;
        double d = dist?.Value ?? 100.0;
        var az = mine.OfType<AzimuthObservation>()
            .FirstOrDefault(a => (a.From == first && a.To == other) || (a.To == first && a.From == other));
        double t = az is null ? 0 : az.From == first ? az.Value : az.Value + Math.PI;
        return (other, new PlanePoint(d * Math.Sin(t), d * Math.Cos(t)));
    }
}
