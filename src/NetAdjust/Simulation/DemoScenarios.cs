using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>
/// Draws the invented demonstration surveys of data/ from their chosen truth and geometry: the same points,
/// stations, sightings and standard deviations as the committed files, with Gaussian noise drawn from
/// <see cref="Random"/> (Box–Muller). The committed files were drawn by an earlier generator with another random
/// source: a new draw has the same truth and geometry, not the same numbers (data/README.md).
/// </summary>
public static class DemoScenarios
{
    private const double Arcsecond = 1.0 / Angle.ArcsecondsPerRadian;

    /// <summary>The seed each scenario was first drawn with.</summary>
    /// <param name="scenario">The scenario.</param>
    public static int DefaultSeed(DemoScenario scenario) => scenario switch
    {
        DemoScenario.Harrowgate or DemoScenario.Tarnholm => 20261202,
        DemoScenario.CorvanFell => 20261203,
        DemoScenario.Skelmoor => 20261219,
        _ => 20261201,
    };

    /// <summary>Draws a scenario.</summary>
    /// <param name="scenario">The scenario.</param>
    /// <param name="seed">The random seed; the same seed gives the same survey on every machine.</param>
    /// <param name="projection">The map projection of a scenario on a grid (Tarnholm: WGS 84 / UTM zone 33N; Skelmoor:
    /// ETRS89 / UTM zone 32N), whose factors turn the grid truth into ground distances and geodesic directions and
    /// whose inverse turns it into earth-centred baselines; unused by the others.</param>
    /// <exception cref="ArgumentException">When a scenario on a grid is drawn without its projection.</exception>
    public static DemoSurvey Draw(DemoScenario scenario, int seed, IMapProjection? projection = null) =>
        scenario switch
    {
        DemoScenario.Brackenmoor => Brackenmoor(seed),
        DemoScenario.Harrowfield => Harrowfield(seed),
        DemoScenario.Harrowgate => Harrowgate(seed),
        DemoScenario.CorvanFell => CorvanFellDraw(seed),
        DemoScenario.Tarnholm => TarnholmGrid.Draw(seed, projection ?? throw new ArgumentException(
            "the Tarnholm scenario is drawn through its map projection", nameof(projection)), new SeededNoise(seed)),
        DemoScenario.Skelmoor => SkelmoorGnss.Draw(seed, projection ?? throw new ArgumentException(
            "the Skelmoor scenario is drawn through its map projection", nameof(projection)), new SeededNoise(seed)),
        _ => throw new ArgumentOutOfRangeException(nameof(scenario), scenario, "unknown scenario"),
    };

    private static DemoSurvey CorvanFellDraw(int seed)
    {
        var noise = new SeededNoise(seed);
        return CorvanFell.Draw(seed, noise.Gauss, noise.Uniform);
    }

    private static double Azimuth((double E, double N) a, (double E, double N) b) => Math.Atan2(b.E - a.E, b.N - a.N);

    private static double Distance((double E, double N) a, (double E, double N) b) => Math.Sqrt(
        ((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));

    private static Dictionary<string, (double E, double N, double H)> Plane(
        IEnumerable<(string Id, double E, double N)> points) =>
        points.ToDictionary(p => p.Id, p => (p.E, p.N, double.NaN), StringComparer.Ordinal);

    private static DirectionObservation Direction(string at, string to, double value, double sd) =>
        new(at, to, Angle.FromRadians(Angle.Reduce0To2Pi(value)), at + "/1") { StandardDeviation = sd };

    private static DistanceObservation Dist(string at, string to, double value, double sd) =>
        new(at, to, Length.FromMetres(value)) { StandardDeviation = sd };

    /// <summary>
    /// A closed traverse BK01, S1 ... S6 from control BK01 oriented on BK02 (directions 2″, one angle at S3 2.8″,
    /// distances 2 mm + 2 ppm with 1.5 mm centering), approximations within 0.4 m, and a level loop of five
    /// benchmarks (1 mm/√km).
    /// </summary>
    private static DemoSurvey Brackenmoor(int seed)
    {
        var noise = new SeededNoise(seed);
        var truth = Plane([
            ("BK01", 2150.000, 5320.000), ("BK02", 2480.512, 5790.233),
            ("S1", 2331.840, 5265.118), ("S2", 2512.406, 5331.572), ("S3", 2598.771, 5497.040),
            ("S4", 2470.225, 5622.914), ("S5", 2287.390, 5598.481), ("S6", 2158.652, 5471.306)]);
        string[] loop = ["BK01", "S1", "S2", "S3", "S4", "S5", "S6"];
        (double E, double N) P(string id) => (truth[id].E, truth[id].N);
        var points = new List<Point>
        {
            new("BK01") { E = 2150.000, N = 5320.000, Fixed = Fixity.EN },
            new("BK02") { E = 2480.512, N = 5790.233, Fixed = Fixity.EN },
        };
        foreach (var id in loop.Skip(1))
        {
            double e = Math.Round(truth[id].E + noise.Uniform(-0.4, 0.4), 1);
            double n = Math.Round(truth[id].N + noise.Uniform(-0.4, 0.4), 1);
            points.Add(new Point(id) { E = e, N = n });
        }
        var heights = new Dictionary<string, double>(StringComparer.Ordinal)
        {
            ["BMK1"] = 84.2170, ["BMK2"] = 86.0412, ["BMK3"] = 91.3385, ["BMK4"] = 88.9027, ["BMK5"] = 85.1164,
        };
        points.Add(new Point("BMK1") { H = heights["BMK1"], Fixed = Fixity.H });
        foreach (var id in heights.Keys.Skip(1)) points.Add(new Point(id));
        foreach (var (id, h) in heights) truth[id] = (double.NaN, double.NaN, h);

        const double sdDirection = 2.0 * Arcsecond, sdAngle = 2.8 * Arcsecond;
        static double SdDistance(double d) => Math.Sqrt((0.002 * 0.002) + (2e-6 * d * 2e-6 * d) + (0.0015 * 0.0015));
        var setups = new List<(string, IReadOnlyList<Observation>)>();
        for (int i = 0; i < loop.Length; i++)
        {
            string st = loop[i], back = loop[(i + loop.Length - 1) % loop.Length], fore = loop[(i + 1) % loop.Length];
            var obs = new List<Observation>();
            if (st == "S3") // this crew booked an angle at S3
            {
                double a = Azimuth(P(st), P(fore)) - Azimuth(P(st), P(back)) + noise.Gauss(sdAngle);
                obs.Add(new AngleObservation(st, back, fore, Angle.FromRadians(Angle.Reduce0To2Pi(a)))
                    { StandardDeviation = sdAngle });
            }
            else
            {
                string[] targets = st == "BK01" ? ["BK02", back, fore] : [back, fore];
                double zero = noise.Uniform(0, 2 * Math.PI);
                foreach (var t in targets)
                    obs.Add(Direction(st, t, Azimuth(P(st), P(t)) - zero + noise.Gauss(sdDirection), sdDirection));
            }
            double d = Distance(P(st), P(fore));
            obs.Add(Dist(st, fore, d + noise.Gauss(SdDistance(d)), SdDistance(d)));
            setups.Add((st, obs));
        }
        var levelling = new List<HeightDifferenceObservation>();
        foreach (var (a, b, length) in new[]
                 {
                     ("BMK1", "BMK2", 420.0), ("BMK2", "BMK3", 515.0), ("BMK3", "BMK4", 380.0),
                     ("BMK4", "BMK5", 610.0), ("BMK5", "BMK1", 455.0),
                 })
        {
            double sd = 0.0010 * Math.Sqrt(length / 1000);
            var dh = Length.FromMetres(heights[b] - heights[a] + noise.Gauss(sd));
            levelling.Add(new HeightDifferenceObservation(a, b, dh, Length.FromMetres(length))
                { StandardDeviation = sd });
        }
        return new DemoSurvey(DemoScenario.Brackenmoor, seed, points, setups, levelling, truth, []);
    }

    /// <summary>
    /// Two held marks and four new stations braced by directions (2″) and distances (3 mm), approximations within
    /// 0.3 m, and one planted blunder of +40 mm on the distance H3–H4.
    /// </summary>
    private static DemoSurvey Harrowfield(int seed)
    {
        var noise = new SeededNoise(seed);
        var truth = Plane([
            ("HQ1", 5120.000, 8040.000), ("HQ2", 5705.318, 8412.907),
            ("H1", 5233.417, 8391.226), ("H2", 5488.903, 8127.551), ("H3", 5391.264, 8608.772),
            ("H4", 5802.640, 8690.115)]);
        (double E, double N) P(string id) => (truth[id].E, truth[id].N);
        var points = new List<Point>();
        foreach (var (id, t) in truth)
        {
            // Approximations are drawn for every point, control included, as the scenario was first drawn.
            double e = Math.Round(t.E + noise.Uniform(-0.3, 0.3), 1), n = Math.Round(t.N + noise.Uniform(-0.3, 0.3), 1);
            points.Add(id.StartsWith("HQ", StringComparison.Ordinal)
                ? new Point(id) { E = t.E, N = t.N, Fixed = Fixity.EN }
                : new Point(id) { E = e, N = n });
        }
        var sights = new (string At, string[] To)[]
        {
            ("HQ1", ["HQ2", "H1", "H2"]), ("HQ2", ["HQ1", "H2", "H4"]), ("H1", ["HQ1", "H2", "H3"]),
            ("H2", ["HQ1", "HQ2", "H1", "H3", "H4"]), ("H3", ["H1", "H2", "H4"]), ("H4", ["HQ2", "H2", "H3"]),
        };
        const double sdDirection = 2.0 * Arcsecond, sdDistance = 0.003;
        (string At, string To, double Size) blunder = ("H3", "H4", 0.040);
        var done = new HashSet<(string, string)>();
        var setups = new List<(string, IReadOnlyList<Observation>)>();
        foreach (var (st, to) in sights)
        {
            var obs = new List<Observation>();
            double zero = noise.Uniform(0, 2 * Math.PI);
            foreach (var t in to)
                obs.Add(Direction(st, t, Azimuth(P(st), P(t)) - zero + noise.Gauss(sdDirection), sdDirection));
            foreach (var t in to)
            {
                var pair = string.CompareOrdinal(st, t) < 0 ? (st, t) : (t, st);
                if (pair == ("HQ1", "HQ2") || !done.Add(pair)) continue;
                double d = Distance(P(st), P(t)) + noise.Gauss(sdDistance);
                if ((st, t) == (blunder.At, blunder.To)) d += blunder.Size;
                obs.Add(Dist(st, t, d, sdDistance));
            }
            setups.Add((st, obs));
        }
        return new DemoSurvey(DemoScenario.Harrowfield, seed, points, setups, [], truth, [blunder]);
    }

    /// <summary>
    /// Six new stations (no approximations) braced to four published control marks, of which HV03 was moved by
    /// (+30 mm, +40 mm) after publication; directions 1″, distances 1 mm + 1.5 ppm with 1 mm centering.
    /// </summary>
    private static DemoSurvey Harrowgate(int seed)
    {
        var noise = new SeededNoise(seed);
        var truth = Plane([
            ("HV01", 5000.000, 8000.000), ("HV02", 5620.450, 8035.180), ("HV03", 5655.300, 8590.720),
            ("HV04", 4985.610, 8610.040), ("T1", 5210.330, 8140.250), ("T2", 5430.870, 8120.610),
            ("T3", 5515.420, 8330.090), ("T4", 5390.150, 8480.770), ("T5", 5170.640, 8455.320),
            ("T6", 5105.980, 8290.410)]);
        (double E, double N) P(string id) => (truth[id].E, truth[id].N);
        string[] control = ["HV01", "HV02", "HV03", "HV04"];
        string[] stations = ["T1", "T2", "T3", "T4", "T5", "T6"];
        var points = control.Select(c => c == "HV03" // the mark moved after its coordinates were published
                ? new Point(c) { E = truth[c].E + 0.030, N = truth[c].N + 0.040, Fixed = Fixity.EN }
                : new Point(c) { E = truth[c].E, N = truth[c].N, Fixed = Fixity.EN })
            .Concat(stations.Select(s => new Point(s))).ToList();
        var sights = new Dictionary<string, string[]>(StringComparer.Ordinal)
        {
            ["T1"] = ["HV01", "T2", "T6", "T5", "HV02"], ["T2"] = ["T1", "HV02", "T3", "T4"],
            ["T3"] = ["T2", "HV02", "HV03", "T4"], ["T4"] = ["T3", "HV03", "HV04", "T5"],
            ["T5"] = ["T4", "HV04", "T6", "T1"], ["T6"] = ["T5", "HV01", "T1", "HV04"],
        };
        const double sdDirection = 1.0 * Arcsecond;
        static double SdDistance(double d) => Math.Sqrt((0.001 * 0.001) + (1.5e-6 * d * 1.5e-6 * d) + (0.001 * 0.001));
        var setups = new List<(string, IReadOnlyList<Observation>)>();
        foreach (var st in stations)
        {
            var obs = new List<Observation>();
            double zero = noise.Uniform(0, 2 * Math.PI);
            foreach (var t in sights[st])
                obs.Add(Direction(st, t, Azimuth(P(st), P(t)) - zero + noise.Gauss(sdDirection), sdDirection));
            foreach (var t in sights[st])
            {
                if (!control.Contains(t) && Array.IndexOf(stations, t) < Array.IndexOf(stations, st)) continue;
                double d = Distance(P(st), P(t));
                obs.Add(Dist(st, t, d + noise.Gauss(SdDistance(d)), SdDistance(d)));
            }
            setups.Add((st, obs));
        }
        return new DemoSurvey(DemoScenario.Harrowgate, seed, points, setups, [], truth, []);
    }
}
