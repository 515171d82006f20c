using NetAdjust.Simulation;
using FsCheck;
using FsCheck.Xunit;
using NetAdjust.Adjustment;
using NetAdjust.Adjustment.Approximation;
using NetAdjust.Network;
using NetAdjust.Tests.Adjustment.Datum;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>
/// Automatic approximate coordinates. Oracles: the simulated truth (exact observations must give it back to
/// rounding, since polar, intersection, resection and distance intersections are exact constructions), and the
/// least-squares solution itself, which does not depend on where the iterations started.
/// </summary>
public class ApproximateCoordinatesTests
{
    private static double Az(double e1, double n1, double e2, double n2) =>
        Angle.Reduce0To2Pi(Math.Atan2(e2 - e1, n2 - n1));

    private static double Dist(double e1, double n1, double e2, double n2) =>
        Math.Sqrt(Math.Pow(e2 - e1, 2) + Math.Pow(n2 - n1, 2));

    private static (Dictionary<string, double> E, Dictionary<string, double> N) Run(SurveyNetwork net)
    {
        var plane = net.Observations.SelectMany(o => o.Points).ToHashSet();
        var e = net.Points.Where(p => p.E.HasValue).ToDictionary(p => p.Id, p => p.E!.Value);
        var n = net.Points.Where(p => p.N.HasValue).ToDictionary(p => p.Id, p => p.N!.Value);
        ApproximateCoordinates.Plane(net, plane, e, n, seedWhenNothingKnown: false);
        return (e, n);
    }

    private static readonly (string Id, double E, double N)[] Known =
        [("A", 1000, 2000), ("B", 1400, 2100), ("C", 1250, 1650), ("D", 900, 1800)];

    private static Point Held(string id) { var k =
        Known.Single(x => x.Id == id); return new Point(id) { E = k.E, N = k.N, Fixed = Fixity.EN }; }

    private static DirectionObservation Dir(string at, (double E, double N) from, string to,
        (double E, double N) target, double zero, string set) =>
        new(at, to, Angle.FromRadians(Angle.Reduce0To2Pi(Az(from.E, from.N, target.E, target.N) - zero)),
            set) { StandardDeviation = 1e-5 };

    [Fact]
    public void ResectionFromDirectionsToThreeKnownPointsIsExact()
    {
        // Closed-form resection (inversion of the inscribed-angle circles) against the chosen truth.
        var p = (E: 1180.0, N: 1910.0);
        var pts = new[] { Held("A"), Held("B"), Held("C"), new Point("P") };
        var obs = new Observation[]
        {
            Dir("P", p, "A", (1000, 2000), 0.7, "P/1"), Dir("P", p, "B", (1400, 2100), 0.7, "P/1"),
                Dir("P", p, "C", (1250, 1650), 0.7, "P/1"),
        };
        var (e, n) = Run(new SurveyNetwork("res", pts, obs));
        Assert.Equal(p.E, e["P"], 6);
        Assert.Equal(p.N, n["P"], 6);
    }

    [Fact]
    public void ResectionFromMeasuredAnglesIsExact()
    {
        var p = (E: 1330.0, N: 1850.0);
        double a(string x, string y)
        {
            var kx = Known.Single(k => k.Id == x); var ky = Known.Single(k => k.Id == y);
            return Angle.Reduce0To2Pi(Az(p.E, p.N, ky.E, ky.N) - Az(p.E, p.N, kx.E, kx.N));
        }
        var pts = new[] { Held("A"), Held("B"), Held("C"), new Point("P") };
        var obs = new Observation[]
        {
            new AngleObservation("P", "A", "B", Angle.FromRadians(a("A", "B"))) { StandardDeviation = 1e-5 },
            new AngleObservation("P", "B", "C", Angle.FromRadians(a("B", "C"))) { StandardDeviation = 1e-5 },
        };
        var (e, n) = Run(new SurveyNetwork("res", pts, obs));
        Assert.Equal(p.E, e["P"], 6);
        Assert.Equal(p.N, n["P"], 6);
    }

    [Fact]
    public void ForwardIntersectionFromTwoOrientedStationsIsExact()
    {
        var p = (E: 1210.0, N: 2380.0);
        var pts = new[] { Held("A"), Held("B"), new Point("P") };
        var obs = new Observation[]
        {
            Dir("A", (1000, 2000), "B", (1400, 2100), 1.1, "A/1"), Dir("A", (1000, 2000), "P", p, 1.1, "A/1"),
            Dir("B", (1400, 2100), "A", (1000, 2000), 4.0, "B/1"), Dir("B", (1400, 2100), "P", p, 4.0, "B/1"),
        };
        var (e, n) = Run(new SurveyNetwork("int", pts, obs));
        Assert.Equal(p.E, e["P"], 6);
        Assert.Equal(p.N, n["P"], 6);
    }

    [Theory]
    [InlineData(1150.0, 2300.0)] // left of A→B
    [InlineData(1250.0, 1800.0)] // right of A→B
    public void DistanceIntersectionTakesTheSolutionThatFitsTheOtherObservations(double pe, double pn)
    {
        // Two distances give two mirror solutions; a third distance from D decides. Both sides are tried so that a
        // fixed choice of side could not pass.
        var pts = new[] { Held("A"), Held("B"), Held("D"), new Point("P") };
        var obs = new Observation[]
        {
            new DistanceObservation("A", "P",
                Length.FromMetres(Dist(1000, 2000, pe, pn))) { StandardDeviation = 0.002 },
            new DistanceObservation("B", "P",
                Length.FromMetres(Dist(1400, 2100, pe, pn))) { StandardDeviation = 0.002 },
            new DistanceObservation("D", "P", Length.FromMetres(Dist(900, 1800, pe, pn))) { StandardDeviation = 0.002 },
        };
        var (e, n) = Run(new SurveyNetwork("dd", pts, obs));
        Assert.Equal(pe, e["P"], 6);
        Assert.Equal(pn, n["P"], 6);
    }

    [Fact]
    public void PolarPointFromAnAngleAtAKnownStationIsExact()
    {
        var p = (E: 870.0, N: 2150.0);
        var pts = new[] { Held("A"), Held("B"), new Point("P") };
        double ang = Angle.Reduce0To2Pi(Az(1000, 2000, p.E, p.N) - Az(1000, 2000, 1400, 2100));
        var obs = new Observation[]
        {
            new AngleObservation("A", "B", "P", Angle.FromRadians(ang)) { StandardDeviation = 1e-5 },
            new DistanceObservation("A", "P",
                Length.FromMetres(Dist(1000, 2000, p.E, p.N))) { StandardDeviation = 0.002 },
        };
        var (e, n) = Run(new SurveyNetwork("polar", pts, obs));
        Assert.Equal(p.E, e["P"], 6);
        Assert.Equal(p.N, n["P"], 6);
    }

    [Fact]
    public void ObservationsSetAsideAreNotUsedWhereOthersReach()
    {
        // A distance with a 100 m blunder, set aside (as the blunder hunt does), comes first in the input.
        var p = (E: 1180.0, N: 2250.0);
        var pts = new[] { Held("A"), Held("B"), new Point("P") };
        double d = Dist(1000, 2000, p.E, p.N);
        var obs = new Observation[]
        {
            new DistanceObservation("A", "P", Length.FromMetres(d + 100)) { StandardDeviation = 0.002,
                Excluded = true },
            Dir("A", (1000, 2000), "B", (1400, 2100), 0.3, "A/1"), Dir("A", (1000, 2000), "P", p, 0.3, "A/1"),
            new DistanceObservation("A", "P", Length.FromMetres(d)) { StandardDeviation = 0.002 },
        };
        var (e, n) = Run(new SurveyNetwork("aside", pts, obs));
        Assert.Equal(p.E, e["P"], 6);
        Assert.Equal(p.N, n["P"], 6);
    }

    /// <summary>Benchmark BM (40 m, held) and points L1 to L3 joined by the given height differences.</summary>
    private static SurveyNetwork LevelLine(params (string From, string To, double Dh)[] differences) =>
        new("lev", [new Point("BM") { H = 40.0, Fixed = Fixity.H }, new Point("L1"), new Point("L2"), new Point("L3")],
            [.. differences.Select(d => new HeightDifferenceObservation(d.From, d.To, Length.FromMetres(d.Dh))
                { StandardDeviation = 0.001 })]);

    [Fact]
    public void HeightsFollowTheLevellingFromTheBenchmark()
    {
        var net = LevelLine(("BM", "L1", 1.25), ("L2", "L1", -0.5), ("L2", "L3", 2.0));
        var h = new Dictionary<string, double> { ["BM"] = 40.0 };
        ApproximateCoordinates.Heights(net, net.Points.Select(p => p.Id).ToHashSet(), h);
        Assert.Equal(41.25, h["L1"], 12);
        Assert.Equal(41.75, h["L2"], 12);
        Assert.Equal(43.75, h["L3"], 12);
    }

    [Fact]
    public void HeightsKnownForEveryPointAreLeftAsTheyAreWithoutATree()
    {
        // every height given (as in a GNSS network whose points all carry h): nothing to fill in, so no tree of
        // height differences is built; with one height missing the tree is built and fills in that one only
        var net = LevelLine(("BM", "L1", 1.25), ("L2", "L3", 2.0));
        var ids = net.Points.Select(p => p.Id).ToHashSet();
        var h = new Dictionary<string, double> { ["BM"] = 40.0, ["L1"] = 50.0, ["L2"] = 60.0, ["L3"] = 70.0 };
        int trees = ApproximateCoordinates.HeightTreesBuilt;
        ApproximateCoordinates.Heights(net, ids, h);
        Assert.Equal(trees, ApproximateCoordinates.HeightTreesBuilt);
        Assert.Equal([40.0, 50.0, 60.0, 70.0], new[] { "BM", "L1", "L2", "L3" }.Select(id => h[id]));
        h.Remove("L3");
        ApproximateCoordinates.Heights(net, ids, h);
        Assert.Equal(trees + 1, ApproximateCoordinates.HeightTreesBuilt);
        Assert.Equal([40.0, 50.0, 60.0, 62.0], new[] { "BM", "L1", "L2", "L3" }.Select(id => h[id]));
    }

    [Theory]
    [InlineData(30, 1)]     // control side by side in a corner
    [InlineData(30, 899)]   // control in opposite corners: the network is built in a local frame and fitted on both
    public void LongChainsOfConstructionsStayWithinMetresOnALargeNetwork(int side, int last)
    {
        // 900 points over 6 km, 2" directions: each point is located by the shortest chain from the control, and
        // direction sets are oriented on the station that located their station, so errors grow like a random walk
        // (about a metre here), not geometrically. Bound 5 m: common practice is that a few metres still converge.
        var sim = GridNetworks.Grid(5, side, GridNetworks.TwoHeld(last, levelling: false), approx: null);
        var (e, n) = Run(sim.Network);
        double worst = sim.Truth.Max(t => Math.Max(Math.Abs(e[t.Key] - t.Value.E), Math.Abs(n[t.Key] - t.Value.N)));
        Assert.True(worst < 5, $"worst approximation error {worst:F2} m");
    }

    [Property(MaxTest = 12)]
    public void AutomaticApproximationsGiveTheSameAdjustmentAsTheTruthAsStart(PositiveInt seed)
    {
        // A random 3×3 or 4×4 network: the same least-squares solution whether the iterations start at the truth or
        // at coordinates computed from the observations (control: two held points).
        int side = 3 + (seed.Get % 2);
        var control = GridNetworks.TwoHeld(side * side - 1, levelling: true);
        var fromTruth = Adjuster.Adjust(GridNetworks.Grid(seed.Get, side, control, approx: 0, levelling: true).Network);
        var auto = Adjuster.Adjust(GridNetworks.Grid(seed.Get, side, control, approx: null, levelling: true).Network);
        for (int i = 0; i < auto.Points.Count; i++)
        {
            Assert.Equal(fromTruth.Points[i].E!.Value, auto.Points[i].E!.Value, 7);
            Assert.Equal(fromTruth.Points[i].N!.Value, auto.Points[i].N!.Value, 7);
            Assert.Equal(fromTruth.Points[i].H!.Value, auto.Points[i].H!.Value, 7);
        }
        Assert.True(Math.Abs(fromTruth.Statistics.Vtpv - auto.Statistics.Vtpv) <= 1e-8 * fromTruth.Statistics.Vtpv);
    }

    [Theory]
    [InlineData(3, 10.0)]
    [InlineData(5, 25.0)]
    public void ApproximationsMetresOffConvergeToTheSameSolution(int seed, double offset)
    {
        // Gauss-Newton with step halving (Hartley 1961, from memory): start values off by up to 25 m on 200 m lines.
        var control = GridNetworks.TwoHeld(15, levelling: false);
        var near = Adjuster.Adjust(GridNetworks.Grid(seed, 4, control, approx: 0).Network);
        var far = Adjuster.Adjust(GridNetworks.Grid(seed, 4, control, approx: offset).Network,
            AdjustmentOptions.Default with { MaxIterations = 50 });
        for (int i = 0; i < near.Points.Count; i++)
        {
            Assert.Equal(near.Points[i].E!.Value, far.Points[i].E!.Value, 7);
            Assert.Equal(near.Points[i].N!.Value, far.Points[i].N!.Value, 7);
        }
    }

    /// <summary>
    /// A point measured many times from few stations (repeated distances, azimuths) is located as from the first
    /// measurement of each station, bit for bit (the constructions take each station's first ray and first
    /// distance), and at the chosen truth; the repeated measurements come in runs and interleaved (as rounds or
    /// monitoring epochs come).
    /// </summary>
    [Theory]
    [InlineData("distances", false)]
    [InlineData("distances", true)]
    [InlineData("azimuths", false)]
    [InlineData("azimuths", true)]
    [InlineData("polar", false)]
    [InlineData("azimuth and distance", true)]
    public void APointMeasuredManyTimesIsLocatedAsFromOneMeasurementEach(string kind, bool interleaved)
    {
        var p = (E: 1180.0, N: 1910.0);
        DistanceObservation D(string from) { var k = Known.Single(x => x.Id == from);
            return new(from, "P", Length.FromMetres(Dist(k.E, k.N, p.E, p.N))) { StandardDeviation = 0.002 }; }
        AzimuthObservation Z(string from) { var k = Known.Single(x => x.Id == from);
            return new(from, "P", Angle.FromRadians(Az(k.E, k.N, p.E, p.N))) { StandardDeviation = 1e-5 }; }
        Observation[] once = kind switch
        {
            "distances" => [D("A"), D("B"), D("C")], // C decides between the two points where A's and B's meet
            "azimuths" => [Z("A"), Z("D")],
            "polar" => [Z("A"), D("A")],
            _ => [Z("A"), D("B"), D("C")],
        };
        const int Times = 3000;
        // each repeat of a distance 0.1 µm longer than the one before, of an azimuth 1 nrad larger (the first of
        // each station makes the construction, so the result is that of the first measurements bit for bit; a
        // later pair of rays cuts at a larger angle, so taking the best-conditioned pair over all rays would not)
        Observation Repeat(Observation o, int i) => o switch
        {
            DistanceObservation d => d with { Distance = Length.FromMetres(d.Distance.Metres + (i * 1e-7)) },
            AzimuthObservation z => z with { Azimuth = Angle.FromRadians(z.Azimuth.Radians + (i * 1e-9)) },
            _ => o,
        };
        var many = interleaved
            ? Enumerable.Range(0, Times).SelectMany(i => once.Select(o => Repeat(o, i))).ToArray()
            : once.SelectMany(o => Enumerable.Range(0, Times).Select(i => Repeat(o, i))).ToArray();
        var pts = new[] { Held("A"), Held("B"), Held("C"), Held("D"), new Point("P") };
        var (e1, n1) = Run(new SurveyNetwork("once", pts, once));
        var (e2, n2) = Run(new SurveyNetwork("many", pts, many));
        Assert.Equal(e1["P"], e2["P"]);
        Assert.Equal(n1["P"], n2["P"]);
        Assert.Equal(p.E, e2["P"], 6);
        Assert.Equal(p.N, n2["P"], 6);
    }

    /// <summary>
    /// A point fixed by distances from two stations only (nothing tells its two solutions apart) and measured many
    /// times from both, interleaved: it is located as from the first distance of each, and the two-solution
    /// candidates weighed against its measurements are one per pair of stations and strength tried, not one per
    /// pair of repeats (with 300 repeats interleaved, pairing every repeat weighed 180,001 candidates, each against
    /// 600 distances).
    /// </summary>
    [Fact]
    public void ATwoStationPointMeasuredManyTimesWeighsOneCandidatePerPairOfStations()
    {
        var p = (E: 1180.0, N: 1910.0);
        DistanceObservation D(string from, int i) { var k = Known.Single(x => x.Id == from);
            return new(from, "P", Length.FromMetres(Dist(k.E, k.N, p.E, p.N) + (i * 1e-7)))
                { StandardDeviation = 0.002 }; }
        var pts = new[] { Held("A"), Held("B"), new Point("P") };
        var (e1, n1) = Run(new SurveyNetwork("once", pts, [D("A", 0), D("B", 0)]));
        PlaneLocator.CandidatesWeighed = 0;
        var many = Enumerable.Range(0, 300).SelectMany(i => new Observation[] { D("A", i), D("B", i) }).ToArray();
        var (e2, n2) = Run(new SurveyNetwork("many", pts, many));
        Assert.Equal(e1["P"], e2["P"]);
        Assert.Equal(n1["P"], n2["P"]);
        Assert.InRange(PlaneLocator.CandidatesWeighed, 1, 4);
    }
}
