using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>
/// The Tarnholm demo (invented site and names): five new stations S1 … S5 braced to three published control marks
/// on WGS 84 / UTM zone 33N (about 118 km east of the central meridian), 440–470 m above the geoid (separation
/// 47.3 m). The truth is on the grid; the observations are what the field would measure: directions along the
/// geodesic (grid bearing of the chord minus the arc-to-chord correction), horizontal distances on the ground (grid
/// distance divided by the combined factor, elevation factor × line scale factor, at the truth) and one geodetic
/// azimuth S3→S5 (grid bearing minus the arc-to-chord correction plus the convergence): the inverse of the
/// reduction (<see cref="Procedures.GridReduction"/>), through the same <see cref="ProjectionFactors"/> and the
/// projection given. Noise: directions 1″, distances 1.5 mm, azimuth 2″.
/// </summary>
internal static class TarnholmGrid
{
    private const double Arcsecond = 1.0 / Angle.ArcsecondsPerRadian;

    /// <summary>The geoid separation of the site, metres (ellipsoidal height = height + separation).</summary>
    public const double GeoidSeparation = 47.3;

    /// <summary>σ of a direction and of the geodetic azimuth, radians; σ of a distance, metres.</summary>
    public const double DirectionSd = 1.0 * Arcsecond, AzimuthSd = 2.0 * Arcsecond, DistanceSd = 0.0015;

    private static readonly (string Id, double E, double N, double H)[] TruePoints =
    [
        ("TQ01", 618240.512, 5209874.236, 452.318), ("TQ02", 619402.877, 5210611.904, 438.905),
        ("TQ03", 618955.140, 5208702.553, 471.226), ("S1", 618712.400, 5209560.100, 459.80),
        ("S2", 619180.300, 5209905.700, 447.20), ("S3", 619640.800, 5209402.500, 462.60),
        ("S4", 619298.600, 5208960.400, 468.90), ("S5", 618530.200, 5209110.800, 466.10),
    ];

    private static readonly (string At, string[] Directions, string[] Distances)[] Sightings =
    [
        ("S1", ["TQ01", "S2", "S5", "TQ03"], ["TQ01", "S2", "S5"]),
        ("S2", ["S1", "TQ02", "S3", "S4"], ["TQ02", "S3", "S4"]),
        ("S3", ["S2", "TQ02", "S4"], ["TQ02", "S4"]),
        ("S4", ["S3", "S2", "TQ03", "S5"], ["TQ03", "S5", "S1"]),
        ("S5", ["S4", "S1", "TQ01", "TQ03"], ["TQ01", "TQ03"]),
    ];

    public static DemoSurvey Draw(int seed, IMapProjection projection, SeededNoise noise)
    {
        var truth = TruePoints.ToDictionary(p => p.Id, p => (p.E, p.N, p.H), StringComparer.Ordinal);
        var points = TruePoints.Select(p => p.Id.StartsWith("TQ", StringComparison.Ordinal)
            ? new Point(p.Id) { E = p.E, N = p.N, H = p.H, Fixed = Fixity.EN }
            : new Point(p.Id) { H = p.H }).ToList();
        var setups = new List<(string, IReadOnlyList<Observation>)>();
        foreach (var (st, directions, distances) in Sightings)
        {
            var obs = new List<Observation>();
            double zero = noise.Uniform(0, 2 * Math.PI);
            foreach (var t in directions)
            {
                double value = GridTruth.Geodesic(projection, truth[st], truth[t]) - zero + noise.Gauss(DirectionSd);
                obs.Add(new DirectionObservation(st, t, GridTruth.Circle(value), st + "/1")
                    { StandardDeviation = DirectionSd });
            }
            foreach (var t in distances)
            {
                double d = GridTruth.Ground(projection, truth[st], truth[t], GeoidSeparation) + noise.Gauss(DistanceSd);
                obs.Add(new DistanceObservation(st, t, Length.FromMetres(d)) { StandardDeviation = DistanceSd });
            }
            setups.Add((st, obs));
        }
        var (from, to) = (truth["S3"], truth["S5"]);
        double azimuth =
            GridTruth.Geodesic(projection, from, to) + ProjectionFactors.Convergence(projection, from.E, from.N) +
            noise.Gauss(AzimuthSd);
        setups.Add(("S3", [new AzimuthObservation("S3", "S5", GridTruth.Circle(azimuth))
            { StandardDeviation = AzimuthSd }]));
        return new DemoSurvey(DemoScenario.Tarnholm, seed, points, setups, [], truth, []);
    }
}
