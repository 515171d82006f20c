using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Procedures;

/// <summary>How one observation was reduced to the grid (docs/methods.md, "Grid and ground"). Made by the grid
/// reduction only (the constructor is internal).</summary>
public sealed record ObservationReduction
{
    /// <summary>Made by the grid reduction.</summary>
    internal ObservationReduction(int Index, Observation Observed, Observation Reduced, double? ElevationFactor,
        double? ScaleFactor, double? CombinedFactor, double? AngleCorrection, double? EllipsoidalHeight)
    {
        this.Index = Index; this.Observed = Observed; this.Reduced = Reduced; this.ElevationFactor = ElevationFactor;
        this.ScaleFactor = ScaleFactor; this.CombinedFactor = CombinedFactor; this.AngleCorrection = AngleCorrection;
        this.EllipsoidalHeight = EllipsoidalHeight;
    }

    /// <summary>The observation's index in the network.</summary>
    public int Index { get; internal init; }

    /// <summary>The observation as measured.</summary>
    public Observation Observed { get; internal init; }

    /// <summary>The observation on the grid, as adjusted.</summary>
    public Observation Reduced { get; internal init; }

    /// <summary>R / (R + h) of a horizontal distance; null where it does not apply or no height is known.</summary>
    public double? ElevationFactor { get; internal init; }

    /// <summary>The line scale factor (Simpson's rule) or the project scale; null where it does not apply.</summary>
    public double? ScaleFactor { get; internal init; }

    /// <summary>The factor the length was multiplied by (grid / ground); null for angles.</summary>
    public double? CombinedFactor { get; internal init; }

    /// <summary>The correction added to an angular observation in radians (arc-to-chord, and for a geodetic azimuth
    /// minus the convergence); null for lengths.</summary>
    internal double? AngleCorrection { get; init; }

    /// <summary>The mean ellipsoidal height of the line in metres; null when not used.</summary>
    internal double? EllipsoidalHeight { get; init; }

    /// <summary>The correction added to an angular observation (arc-to-chord, and for a geodetic azimuth minus the
    /// convergence); null for lengths.</summary>
    public Angle? AngularCorrection => Lengths.AngleOf(AngleCorrection);

    /// <summary>The mean ellipsoidal height of the line; null when not used.</summary>
    public Length? EllipsoidalHeightLength => Lengths.Of(EllipsoidalHeight);
}

/// <summary>The projection's quantities at one point. Made by the grid reduction only (the constructor is
/// internal).</summary>
public sealed record PointGridFactors
{
    /// <summary>Made by the grid reduction.</summary>
    internal PointGridFactors(string Point, double ScaleFactor, double Convergence)
    {
        this.Point = Point; this.ScaleFactor = ScaleFactor; this.Convergence = Convergence;
    }

    /// <summary>The point id.</summary>
    public string Point { get; internal init; }

    /// <summary>The point scale factor k.</summary>
    public double ScaleFactor { get; internal init; }

    /// <summary>The meridian convergence γ in radians (grid azimuth = geodetic azimuth − γ).</summary>
    internal double Convergence { get; init; }

    /// <summary>The meridian convergence γ (grid azimuth = geodetic azimuth − γ).</summary>
    public Angle ConvergenceAngle => Lengths.Radians(Convergence);
}

/// <summary>A network reduced to the grid, with what was done to each observation. Made by the grid reduction only (the
/// constructor is internal).</summary>
public sealed record GridReductionResult
{
    /// <summary>Made by the grid reduction.</summary>
    internal GridReductionResult(SurveyNetwork Network, GridSystem System,
        IReadOnlyList<ObservationReduction> Observations, IReadOnlyList<PointGridFactors> Points)
    {
        this.Network = Network; this.System = System; this.Observations = Observations; this.Points = Points;
    }

    /// <summary>The reduced network (same points and observations in the same order).</summary>
    public SurveyNetwork Network { get; internal init; }

    /// <summary>The grid system.</summary>
    public GridSystem System { get; internal init; }

    /// <summary>One entry per observation that was (or, for grid distances, could be) reduced, in input
    /// order.</summary>
    public IReadOnlyList<ObservationReduction> Observations { get; internal init; }

    /// <summary>The projection's factors at every point with plane coordinates (empty without a projection).</summary>
    public IReadOnlyList<PointGridFactors> Points { get; internal init; }
}

/// <summary>
/// Reduces a network's observations to the grid before the adjustment (docs/methods.md, "Grid and ground"):
/// horizontal ground distances by the combined factor (elevation factor × line scale factor, or the project
/// scale), slope distances and zenith angles by the line scale factor (the spatial model carries the heights
/// itself), directions and angles by the arc-to-chord correction, geodetic azimuths by the convergence and the
/// arc-to-chord correction. The factors are evaluated at coordinates from a preliminary adjustment of the
/// unreduced observations, then once more at the coordinates adjusted from the reduced ones, so that they belong to
/// the adjusted positions (a position error of 1 m changes a scale factor by less than 1e-8 in a UTM zone).
/// </summary>
public static class GridReduction
{
    /// <summary>Reduces the network; returns it unchanged (with no entries) when the system reduces nothing.</summary>
    /// <param name="network">The network as measured.</param>
    /// <param name="system">The grid system.</param>
    /// <param name="options">The adjustment options of the preliminary adjustments (progress is not reported).</param>
    /// <exception cref="InvalidInputException">When a line needs a height that no point or mean height gives.
    /// </exception>
    /// <exception cref="AdjustmentFailedException">When the preliminary adjustment fails (as the adjustment would).
    /// </exception>
    public static GridReductionResult Reduce(SurveyNetwork network, GridSystem system,
        AdjustmentOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(system);
        if (!system.Reduces && system.Projection is null) return ReduceAt(network, system, Given(network));
        var o = (options ?? AdjustmentOptions.Default) with { Progress = null };
        // The preliminary adjustments need only the adjusted positions: their iterations, not their covariance or
        // statistics (the same positions as a whole adjustment).
        var first = ReduceAt(network, system, Adjuster.AdjustedPositions(network, o));
        // When no observation was changed (a network of baselines and height differences only), the second
        // adjustment would be the first again: the same network, the same positions.
        if (Unchanged(network, first.Network)) return first;
        return ReduceAt(network, system, Adjuster.AdjustedPositions(first.Network, o));
    }

    /// <summary>
    /// True when the system leaves every observation of the network as it is: no ground distance it scales, and no
    /// slope distance, zenith angle, direction, angle or geodetic azimuth it corrects (a network of GNSS baselines and
    /// height differences, say). Its reduction is then only the factors at the adjusted positions, the preliminary
    /// adjustment of <see cref="Reduce"/> is the adjustment itself, and <see cref="ReduceAt(SurveyNetwork, GridSystem,
    /// AdjustmentResult)"/> with that adjustment gives what <see cref="Reduce"/> gives, without adjusting twice.
    /// </summary>
    /// <param name="network">The network as measured.</param>
    /// <param name="system">The grid system.</param>
    public static bool LeavesAsIs(SurveyNetwork network, GridSystem system)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(system);
        bool projected = system.Projection is not null, scaled = projected || system.ProjectScale is not null;
        foreach (var obs in network.Observations)
        {
            bool changed = obs switch
            {
                DistanceObservation => scaled && system.Distances == DistanceBasis.Ground,
                SlopeDistanceObservation or ZenithObservation => scaled,
                DirectionObservation or AngleObservation => projected,
                AzimuthObservation => projected && system.Azimuths == AzimuthBasis.Geodetic,
                _ => false,
            };
            if (changed) return false;
        }
        return true;
    }

    /// <summary>Reduces the network with the factors evaluated at the positions of an adjustment (its adjusted
    /// points; a height it does not adjust, the point's given one): for a network the system leaves as it is
    /// (<see cref="LeavesAsIs"/>), with the adjustment of that network, the same as <see cref="Reduce"/>.</summary>
    /// <param name="network">The network as measured.</param>
    /// <param name="system">The grid system.</param>
    /// <param name="adjusted">The adjustment whose positions the factors are evaluated at.</param>
    /// <exception cref="InvalidInputException">When a line needs a height or position that is not known.</exception>
    public static GridReductionResult ReduceAt(SurveyNetwork network, GridSystem system, AdjustmentResult adjusted)
    {
        ArgumentNullException.ThrowIfNull(adjusted);
        var positions = new Dictionary<string, (double E, double N, double? H)>(StringComparer.Ordinal);
        foreach (var p in adjusted.Points)
            if (p.E is double e && p.N is double n) positions[p.Id] = (e, n, p.H ?? p.Input.H);
        return ReduceAt(network, system, positions);
    }

    /// <summary>True when the reduced network holds the very observations of the one measured.</summary>
    private static bool Unchanged(SurveyNetwork measured, SurveyNetwork reduced)
    {
        for (int i = 0; i < measured.Observations.Count; i++)
            if (!ReferenceEquals(measured.Observations[i], reduced.Observations[i])) return false;
        return true;
    }

    /// <summary>Reduces the network with the factors evaluated at the given positions.</summary>
    /// <param name="network">The network as measured.</param>
    /// <param name="system">The grid system.</param>
    /// <param name="positions">Easting, northing (metres) and height (metres, or null) of the points, by id; points
    /// missing here use their given coordinates.</param>
    /// <exception cref="InvalidInputException">When a line needs a height or position that is not known.</exception>
    public static GridReductionResult ReduceAt(SurveyNetwork network, GridSystem system,
        IReadOnlyDictionary<string, (double E, double N, double? H)> positions)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(positions);
        var reduced = new List<Observation>(network.Observations.Count);
        var entries = new List<ObservationReduction>();
        var p = system.Projection;
        (double E, double N, double? H) At(string id)
        {
            if (positions.TryGetValue(id, out var x)) return x;
            var pt = network[id];
            if (pt.E is double e && pt.N is double n) return (e, n, pt.H);
            throw new InvalidInputException($"point {id} has no plane coordinates to reduce its observations to the " +
                "grid with");
        }
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var obs = network.Observations[i];
            var (r, entry) = obs switch
            {
                DistanceObservation d => Distance(d, i, system, At),
                SlopeDistanceObservation s when p is not null || system.ProjectScale is not null =>
                    Slope(s, i, system, At),
                ZenithObservation z when p is not null || system.ProjectScale is not null => Zenith(z, i, system, At),
                DirectionObservation d when p is not null => Turned(d, i, ArcToChord(p, At, d.Station, d.Target)),
                AngleObservation a when p is not null => Turned(a, i,
                    ArcToChord(p, At, a.Station, a.Foresight) - ArcToChord(p, At, a.Station, a.Backsight)),
                AzimuthObservation a when p is not null && system.Azimuths == AzimuthBasis.Geodetic =>
                    Turned(a, i, ArcToChord(p, At, a.From, a.To) -
                        ProjectionFactors.Convergence(p, At(a.From).E, At(a.From).N)),
                _ => (obs, (ObservationReduction?)null),
            };
            if (!double.IsFinite(r.Value) || entry is { CombinedFactor: double f } && !(f > 0.9 && f < 1.1))
                throw new InvalidInputException($"{obs.Describe()}: cannot be reduced to the grid (a point lies " +
                    "outside the projection's area, or a height is far out of range)");
            reduced.Add(r);
            if (entry is not null) entries.Add(entry);
        }
        var points = new List<PointGridFactors>();
        if (p is not null)
            foreach (var pt in network.Points)
            {
                if (!positions.ContainsKey(pt.Id) && (pt.E is null || pt.N is null)) continue;
                var (e, n, _) = At(pt.Id);
                double k = ProjectionFactors.PointScaleFactor(p, e, n), gamma = ProjectionFactors.Convergence(p, e, n);
                if (!double.IsFinite(k) || !double.IsFinite(gamma))
                    throw new InvalidInputException($"point {pt.Id} lies outside the area of the projection " +
                        $"{p.Name}");
                points.Add(new PointGridFactors(pt.Id, k, gamma));
            }
        return new GridReductionResult(new SurveyNetwork(network.Name, network.Points, reduced), system, entries,
            points);
    }

    private delegate (double E, double N, double? H) Locate(string id);

    private static (Observation, ObservationReduction?) Distance(DistanceObservation d, int i, GridSystem system,
        Locate at)
    {
        double? ef = null, k = null, h = null;
        if (system.Projection is IMapProjection p)
        {
            var (a, b) = (at(d.From), at(d.To));
            k = ProjectionFactors.LineScaleFactor(p, a.E, a.N, b.E, b.N);
            double? ha = system.EllipsoidalHeight(d.From, a.H), hb = system.EllipsoidalHeight(d.To, b.H);
            if (ha is double x && hb is double y)
            {
                h = (x + y) / 2;
                var (lat, _) = p.Inverse((a.E + b.E) / 2, (a.N + b.N) / 2);
                ef = ProjectionFactors.ElevationFactor(p.Ellipsoid, lat, Math.Atan2(b.E - a.E, b.N - a.N), h.Value);
            }
            else if (system.Distances == DistanceBasis.Ground)
                throw new InvalidInputException($"distance {d.From}→{d.To}: point {(ha is null ? d.From : d.To)} " +
                    "has no height and the project no mean height, so the distance cannot be reduced to the grid");
        }
        else if (system.ProjectScale is double s) k = s;
        else return (d, null);
        double? combined = system.Projection is null ? k : ef is double f ? f * k : null;
        if (system.Distances != DistanceBasis.Ground)
            return (d, new ObservationReduction(i, d, d, ef, k, combined, null, h));
        var r = d with { Distance = Length.FromMetres(d.Distance.Metres * combined!.Value) };
        return (r, new ObservationReduction(i, d, r, ef, k, combined, null, h));
    }

    private static double LineScale(GridSystem system, Locate at, string from, string to)
    {
        if (system.Projection is not IMapProjection p) return system.ProjectScale!.Value;
        var (a, b) = (at(from), at(to));
        return ProjectionFactors.LineScaleFactor(p, a.E, a.N, b.E, b.N);
    }

    /// <summary>The slope distance whose horizontal part is scaled by k: S'² = S² + (k² − 1)(S² − Δ²), with Δ the
    /// height difference of instrument and target from the heights at hand.</summary>
    private static (Observation, ObservationReduction?) Slope(SlopeDistanceObservation s, int i, GridSystem system,
        Locate at)
    {
        double k = LineScale(system, at, s.From, s.To);
        double ha = at(s.From).H ?? system.MeanHeight ?? 0, hb = at(s.To).H ?? system.MeanHeight ?? 0;
        double delta = hb + s.TargetHeight.Metres - ha - s.InstrumentHeight.Metres, d = s.Distance.Metres;
        double across2 = Math.Max(d * d - delta * delta, 0);
        double reduced = Math.Sqrt(d * d + (k * k - 1) * across2);
        var r = s with { Distance = Length.FromMetres(reduced) };
        return (r, new ObservationReduction(i, s, r, null, k, reduced / d, null, null));
    }

    /// <summary>The zenith angle of the spatial model (docs/methods.md) with its plane distance scaled by k: the
    /// geometric zenith z_g = z + κ s/(2R) (κ the refraction coefficient) has across part u = sin z_g and along part
    /// v = cos z_g per unit of slope distance; on the grid u′ = k u and v′ = v − (k² − 1) s²/(2R D), and
    /// z′ = atan2(u′, v′) − κ k s/(2R), with s ≈ D sin z_g and D a unit-free ratio here (only the direction counts;
    /// D is taken as s / sin z_g from the positions).</summary>
    private static (Observation, ObservationReduction?) Zenith(ZenithObservation z, int i, GridSystem system,
        Locate at)
    {
        double k = LineScale(system, at, z.From, z.To), v = z.Zenith.Radians;
        const double R = Geometry.SpatialGeometry.EarthRadius;
        var (a, b) = (at(z.From), at(z.To));
        double s = Math.Sqrt(Math.Pow(b.E - a.E, 2) + Math.Pow(b.N - a.N, 2)) / k; // plane distance on the ellipsoid
        double zg = v + z.Refraction * s / (2 * R), d = s / Math.Max(Math.Sin(zg), 1e-9);
        double reduced = Math.Atan2(k * Math.Sin(zg), Math.Cos(zg) - (k * k - 1) * s * s / (2 * R * d)) -
            z.Refraction * k * s / (2 * R);
        var r = z with { Zenith = Angle.FromRadians(reduced) };
        return (r, new ObservationReduction(i, z, r, null, k, null, reduced - v, null));
    }

    private static double ArcToChord(IMapProjection p, Locate at, string from, string to)
    {
        var (a, b) = (at(from), at(to));
        return ProjectionFactors.ArcToChord(p, a.E, a.N, b.E, b.N);
    }

    private static (Observation, ObservationReduction?) Turned(Observation o, int i, double correction)
    {
        Observation r = o switch
        {
            DirectionObservation d => d with { Reading = Angle.FromRadians(d.Reading.Radians + correction) },
            AngleObservation a => a with { Measured = Angle.FromRadians(a.Measured.Radians + correction) },
            AzimuthObservation a => a with { Azimuth = Angle.FromRadians(a.Azimuth.Radians + correction) },
            _ => o,
        };
        return (r, new ObservationReduction(i, o, r, null, null, null, correction, null));
    }

    private static Dictionary<string, (double E, double N, double? H)> Given(SurveyNetwork network) =>
        network.Points.Where(p => p.E is not null && p.N is not null)
            .ToDictionary(p => p.Id, p => (p.E!.Value, p.N!.Value, p.H), StringComparer.Ordinal);

}
