using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Reduction;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>The rounds of one setup of a drawn demonstration survey, as the field book holds them.</summary>
/// <param name="At">The station.</param>
/// <param name="InstrumentHeight">The booked instrument height, metres.</param>
/// <param name="TargetHeights">The booked target heights by target (none for a target sighted for direction only),
/// metres.</param>
/// <param name="Sets">The sets in the order observed, each with one reading per target.</param>
public sealed record DemoRoundsSetup(string At, double InstrumentHeight,
    IReadOnlyDictionary<string, double> TargetHeights,
    IReadOnlyList<IReadOnlyList<FaceReadings>> Sets);

/// <summary>
/// The Corvan Fell demo (invented site and names): a closed 3D traverse CF1 … CF6 observed in two sets in both faces
/// with horizontal readings, zenith angles and slope distances, tied to two levelled benchmarks (CF1 held in all
/// three components, CF4 in height) and oriented on a reference mark RM. Observations are drawn from the chosen
/// truth through the adjustment's own curved-earth model (SpatialGeometry) with k = 0.13, an instrument with
/// collimation and index errors, and the errors of the stochastic model: pointing and reading (ISO 17123-3 σ of 2″ for
/// the mean of both faces, so 2″·√2 per face), instrument and target centering (0.8 mm per axis, one offset per
/// setup and per sighting), instrument and target heights (1 mm), EDM 1 mm + 1.5 ppm (one error per sighting,
/// common to its faces and sets, as the budget treats it) and 0.3 mm of reading noise per face.
/// </summary>
internal static class CorvanFell
{
    private const double Arcsecond = 1.0 / Angle.ArcsecondsPerRadian;

    /// <summary>The refraction coefficient of the simulated atmosphere (common practice).</summary>
    public const double Refraction = 0.13;

    /// <summary>ISO 17123-3 σ of a direction and of a zenith angle in both faces, radians.</summary>
    public const double IsoSd = 2.0 * Arcsecond;

    /// <summary>Centering σ per axis of instrument and target, metres.</summary>
    public const double Centering = 0.0008;

    /// <summary>σ of a measured instrument or target height, metres.</summary>
    public const double HeightSd = 0.001;

    private static readonly (string Id, double E, double N, double H)[] TruePoints =
    [
        ("CF1", 3200.000, 6100.000, 142.315), ("RM", 3050.400, 6420.750, double.NaN),
        ("CF2", 3410.280, 6035.620, 151.870), ("CF3", 3605.940, 6180.330, 163.402),
        ("CF4", 3580.110, 6420.860, 158.225), ("CF5", 3390.470, 6515.290, 149.611),
        ("CF6", 3215.760, 6340.180, 139.084),
    ];

    private static readonly string[] Loop = ["CF1", "CF2", "CF3", "CF4", "CF5", "CF6"];

    public static DemoSurvey Draw(int seed, Func<double, double> gauss, Func<double, double, double> uniform)
    {
        var truth = TruePoints.ToDictionary(p => p.Id, p => (p.E, p.N, p.H), StringComparer.Ordinal);
        var points = new List<Point>
        {
            new("CF1") { E = 3200.000, N = 6100.000, H = 142.315, Fixed = Fixity.ENH },
            new("RM") { E = 3050.400, N = 6420.750, Fixed = Fixity.EN },
        };
        foreach (var id in Loop.Skip(1))
        {
            var t = truth[id];
            double e = Math.Round(t.E + uniform(-0.4, 0.4), 1), n = Math.Round(t.N + uniform(-0.4, 0.4), 1);
            points.Add(id == "CF4"
                ? new Point(id) { E = e, N = n, H = t.H, Fixed = Fixity.H }
                : new Point(id) { E = e, N = n, H = Math.Round(t.H + uniform(-0.3, 0.3), 1) });
        }
        // The plane coordinates' reference height as the reader takes it for a project without adjustment.plane_height
        // or grid: the mean of the given heights (docs/methods.md, "Spatial model").
        double planeHeight = points.Where(p => p.H is not null).Average(p => p.H!.Value);
        const double collimation = 6 * Arcsecond, index = -9 * Arcsecond;
        double face = IsoSd * Math.Sqrt(2);
        var rounds = new List<DemoRoundsSetup>();
        for (int i = 0; i < Loop.Length; i++)
        {
            string st = Loop[i], back = Loop[(i + Loop.Length - 1) % Loop.Length], fore = Loop[(i + 1) % Loop.Length];
            string[] targets = st == "CF1" ? ["RM", back, fore] : [back, fore];
            double hi = Math.Round(uniform(1.45, 1.65), 3);
            var station = new PlanePoint(truth[st].E + gauss(Centering), truth[st].N + gauss(Centering));
            double hiTrue = hi + gauss(HeightSd);
            var heights = new Dictionary<string, double>(StringComparer.Ordinal);
            var sight = new Dictionary<string, (double Az, double Z, double D)>(StringComparer.Ordinal);
            foreach (var t in targets)
            {
                var target = new PlanePoint(truth[t].E + gauss(Centering), truth[t].N + gauss(Centering));
                double az = Math.Atan2(target.E - station.E, target.N - station.N);
                if (t == "RM") { sight[t] = (az, double.NaN, double.NaN); continue; }
                double th = Math.Round(uniform(1.55, 1.80), 3);
                heights[t] = th;
                var s = new Sighting(st, station, truth[st].H, hiTrue, t, target, truth[t].H, th + gauss(HeightSd))
                {
                    PlaneHeight = planeHeight,
                };
                double d = SpatialGeometry.SlopeDistance(s).Value;
                double edm = gauss(Math.Sqrt((0.001 * 0.001) + (1.5e-6 * d * 1.5e-6 * d)));
                sight[t] = (az, SpatialGeometry.Zenith(s, Refraction).Value, d + edm);
            }
            var sets = new List<IReadOnlyList<FaceReadings>>();
            double zero = uniform(0, 2 * Math.PI);
            for (int set = 0; set < 2; set++)
            {
                double circle = zero + (set * Math.PI / 2); // the second set begun 90° round the circle
                var readings = new List<FaceReadings>();
                foreach (var t in targets)
                {
                    var (az, z, d) = sight[t];
                    double sinZ = double.IsNaN(z) ? 1 : Math.Sin(z);
                    var r = new FaceReadings(t)
                    {
                        HorizontalLeft = Circle(az - circle + (collimation / sinZ) + gauss(face)),
                        HorizontalRight = Circle(az - circle + Math.PI - (collimation / sinZ) + gauss(face)),
                    };
                    if (!double.IsNaN(z))
                        r = r with
                        {
                            ZenithLeft = Angle.FromRadians(z + index + gauss(face)),
                            ZenithRight = Angle.FromRadians((2 * Math.PI) - z + index + gauss(face)),
                            SlopeLeft = Length.FromMetres(Math.Round(d + gauss(0.0003), 4)),
                            SlopeRight = Length.FromMetres(Math.Round(d + gauss(0.0003), 4)),
                        };
                    readings.Add(r);
                }
                sets.Add(readings);
            }
            rounds.Add(new DemoRoundsSetup(st, hi, heights, sets));
        }
        return new DemoSurvey(DemoScenario.CorvanFell, seed, points, [], [], truth, []) { Rounds = rounds };
    }

    private static Angle Circle(double radians) => Angle.FromRadians(Angle.Reduce0To2Pi(radians));
}
