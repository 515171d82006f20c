using System.Globalization;
using NetAdjust.Diagnosis;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Simulation;
using NetAdjust.Units;

namespace NetAdjust.Tests.Diagnosis;

/// <summary>
/// An invented total-station network for the diagnosis tests (the Ravelstone site): two held marks and five new
/// stations, each occupied once (setup id) with a set of directions (1″), slope distances (2 mm + 2 ppm) and zenith
/// angles (1.5″) with instrument and target heights to four or five points, and angles (1.5″) at one station.
/// Values are drawn from the chosen truth with seeded Gaussian noise; each observation keeps its booked text.
/// </summary>
internal static class DiagnosisNetworks
{
    public const double Arcsecond = 1.0 / Angle.ArcsecondsPerRadian;
    public const double SdDirection = 1.0 * Arcsecond, SdZenith = 1.5 * Arcsecond, SdAngle = 1.5 * Arcsecond;

    public static readonly IReadOnlyDictionary<string, (double E, double N, double H)> Truth =
        new Dictionary<string, (double, double, double)>(StringComparer.Ordinal)
        {
            ["RV1"] = (3000.000, 7000.000, 120.000), ["RV2"] = (3520.400, 7110.300, 131.250),
            ["Q1"] = (3180.750, 7290.120, 126.430), ["Q2"] = (3420.330, 7380.640, 140.870),
            ["Q3"] = (3650.910, 7330.280, 137.020), ["Q4"] = (3290.560, 6880.470, 115.340),
            ["Q5"] = (3560.120, 6900.850, 124.780),
        };

    private static readonly (string At, double Ih, string[] To)[] Plan =
    [
        ("RV1", 1.552, ["RV2", "Q1", "Q2", "Q4"]),
        ("RV2", 1.487, ["RV1", "Q2", "Q3", "Q5", "Q4"]),
        ("Q1", 1.603, ["RV1", "Q2", "Q4", "RV2"]),
        ("Q2", 1.511, ["Q1", "Q3", "RV2", "RV1"]),
        ("Q3", 1.538, ["Q2", "RV2", "Q5"]),
        ("Q4", 1.476, ["RV1", "Q1", "RV2", "Q5"]),
    ];

    private static readonly string[] AngleStationTargets = ["Q4", "RV2", "Q3"]; // angles at Q5 from Q4

    private static double SdSlope(double d) => Math.Sqrt((0.002 * 0.002) + (2e-6 * d * 2e-6 * d));

    /// <summary>Draws the network; the same seed gives the same network.</summary>
    public static SurveyNetwork Draw(int seed)
    {
        var noise = new SeededNoise(seed);
        var truth = new TruthCoordinates(Truth);
        var points = new List<Point>();
        foreach (var (id, t) in Truth)
            points.Add(id.StartsWith("RV", StringComparison.Ordinal)
                ? new Point(id) { E = t.E, N = t.N, H = t.H, Fixed = Fixity.ENH }
                : new Point(id)
                {
                    E = Math.Round(t.E + noise.Uniform(-0.2, 0.2), 1),
                    N = Math.Round(t.N + noise.Uniform(-0.2, 0.2), 1),
                    H = Math.Round(t.H + noise.Uniform(-0.2, 0.2), 1),
                });
        var obs = new List<Observation>();
        int line = 1;
        foreach (var (at, ih, targets) in Plan)
        {
            string setup = "S-" + at, set = at + "/1";
            truth.Orientations[set] = noise.Uniform(0, 2 * Math.PI);
            foreach (var to in targets)
            {
                var d = new DirectionObservation(at, to, Angle.FromRadians(0), set) { SetupId = setup };
                obs.Add(Noisy(d, truth, noise.Gauss(SdDirection), SdDirection, line++));
            }
            foreach (var to in targets)
            {
                double th = Math.Round(1.5 + noise.Uniform(0, 0.5), 3);
                var s = new SlopeDistanceObservation(at, to, Length.FromMetres(1), Length.FromMetres(ih),
                    Length.FromMetres(th)) { SetupId = setup };
                double sd = SdSlope(ObservationKindRegistry.Evaluate(s, truth).Value);
                obs.Add(Noisy(s, truth, noise.Gauss(sd), sd, line++));
                var z = new ZenithObservation(at, to, Angle.FromRadians(1), Length.FromMetres(ih),
                    Length.FromMetres(th)) { SetupId = setup };
                obs.Add(Noisy(z, truth, noise.Gauss(SdZenith), SdZenith, line++));
            }
        }
        foreach (var fore in AngleStationTargets.Skip(1))
        {
            var a = new AngleObservation("Q5", AngleStationTargets[0], fore, Angle.FromRadians(0)) { SetupId = "S-Q5" };
            obs.Add(Noisy(a, truth, noise.Gauss(SdAngle), SdAngle, line++));
        }
        return new SurveyNetwork("Ravelstone", points, obs);
    }

    /// <summary>The observation with a new SI value and its booked text (written anew in the usual unit when not
    /// given).</summary>
    public static Observation WithValue(Observation o, double value, string? booked = null)
    {
        var x = ObservationEdits.WithValue(o, value);
        return x with { BookedText = booked ?? Booked(x) };
    }

    /// <summary>The value as a surveyor would book it: DMS with one decimal of seconds, or metres with four
    /// decimals.</summary>
    public static string Booked(Observation o) => ObservationKinds.ValueIsAngle(o.Kind)
        ? AnglePattern.Dms.FormatDirection(Angle.FromRadians(o.Value))
        : o.Value.ToString("F4", CultureInfo.InvariantCulture);

    /// <summary>The network with one observation replaced.</summary>
    public static SurveyNetwork Replace(SurveyNetwork net, int i, Observation o)
    {
        var list = net.Observations.ToArray();
        list[i] = o;
        return new SurveyNetwork(net.Name, net.Points, list);
    }

    private static Observation Noisy(Observation o, TruthCoordinates truth, double e, double sd, int line)
    {
        double f = ObservationKindRegistry.Evaluate(o, truth).Value;
        var x = WithValue(o, f + e);
        // the booked text is the value rounded as booked; the value is the booked text, as a reader would give it
        var booked = Booked(x);
        double v = ObservationKinds.ValueIsAngle(o.Kind) ? AnglePattern.Dms.Parse(booked).Value.Radians
            : double.Parse(booked, CultureInfo.InvariantCulture);
        return WithValue(x, v, booked) with { StandardDeviation = sd, Source = $"ravelstone.yaml:{line}" };
    }

    /// <summary>The true coordinates and the orientations of the sets.</summary>
    public sealed class TruthCoordinates(IReadOnlyDictionary<string, (double E, double N, double H)> points)
        : ICoordinates
    {
        public Dictionary<string, double> Orientations { get; } = new(StringComparer.Ordinal);

        public PlanePoint Plane(string id) => new(points[id].E, points[id].N);

        public double Height(string id) => points[id].H;

        public double Orientation(string setId) => Orientations[setId];
    }
}
