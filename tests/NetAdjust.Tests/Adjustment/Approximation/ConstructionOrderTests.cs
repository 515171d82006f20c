using NetAdjust.Adjustment.Approximation;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>
/// Regression tests of the order and acceptance of constructions (issue 10, defect 4b). Observations are simulated
/// exactly from a chosen truth, except one deliberately wrong value: a point located by the strong construction
/// lands on the truth to rounding, one located by the weak construction carrying the wrong value does not. The
/// order itself (strongest construction first, a round ends at the first strength that locates a point) is the
/// method of docs/methods.md (approximate coordinates); it is common practice to build a point by polar
/// point or intersection rather than by resection or a two-solution construction when both are possible.
/// </summary>
public class ConstructionOrderTests
{
    private static readonly (string Id, double E, double N)[] Control =
        [("A", 1000, 2000), ("B", 1400, 2100), ("C", 1250, 1650), ("D", 900, 1800)];

    private static (double E, double N) At(string id, (string Id, double E, double N)[] truth) =>
        truth.Concat(Control).Where(t => t.Id == id).Select(t => (t.E, t.N)).Single();

    private static double Az((double E, double N) a, (double E, double N) b) =>
        Angle.Reduce0To2Pi(Math.Atan2(b.E - a.E, b.N - a.N));

    private static double Dist((double E, double N) a, (double E, double N) b) =>
        Math.Sqrt(Math.Pow(b.E - a.E, 2) + Math.Pow(b.N - a.N, 2));

    private static Point Held(string id)
    {
        var k = Control.Single(x => x.Id == id);
        return new Point(id) { E = k.E, N = k.N, Fixed = Fixity.EN };
    }

    /// <summary>Directions of one set from <paramref name="station"/>, zero at <paramref name="zero"/> rad; the
    /// reading to <paramref name="wrongTarget"/> off by <paramref name="wrongBy"/> rad.</summary>
    private static IEnumerable<Observation> Set(string station, string[] targets, double zero,
        (string Id, double E, double N)[] truth, string? wrongTarget = null, double wrongBy = 0) =>
        targets.Select(t =>
        {
            double reading = Az(At(station, truth), At(t, truth)) - zero + (t == wrongTarget ? wrongBy : 0);
            return (Observation)new DirectionObservation(station, t, Angle.FromRadians(Angle.Reduce0To2Pi(reading)),
                station + "/1") { StandardDeviation = 1e-5 };
        });

    private static Observation Distance(string from, string to, (string Id, double E, double N)[] truth,
        double wrongBy = 0) =>
        new DistanceObservation(from, to, Length.FromMetres(Dist(At(from, truth), At(to, truth)) + wrongBy))
        { StandardDeviation = 0.002 };

    private static (Dictionary<string, double> E, Dictionary<string, double> N) Run(SurveyNetwork net)
    {
        var plane = net.Observations.SelectMany(o => o.Points).ToHashSet();
        var e = net.Points.Where(p => p.E.HasValue).ToDictionary(p => p.Id, p => p.E!.Value);
        var n = net.Points.Where(p => p.N.HasValue).ToDictionary(p => p.Id, p => p.N!.Value);
        ApproximateCoordinates.Plane(net, plane, e, n, seedWhenNothingKnown: false);
        return (e, n);
    }

    private static void AtTruth((Dictionary<string, double> E, Dictionary<string, double> N) r, string id,
        (string Id, double E, double N)[] truth)
    {
        var t = At(id, truth);
        Assert.True(Math.Abs(r.E[id] - t.E) < 1e-6 && Math.Abs(r.N[id] - t.N) < 1e-6,
            $"{id} at ({r.E[id]:F4}, {r.N[id]:F4}), truth ({t.E:F4}, {t.N:F4})");
    }

    [Fact]
    public void ATwoDistanceIntersectionWaitsForAPolarPointOfTheNextRound()
    {
        // Round 1: Q is a polar point from A (set at A oriented on B, distance A–Q). P is reached only by three
        // distances from A, B and D, the one from A 0.30 m too long: a decided two-solution construction, weaker
        // than polar. Round 2: P is a polar point from Q (Q's set is oriented on A). The rule "strongest first"
        // keeps P out of round 1, so P comes from Q and lands on the truth.
        (string, double, double)[] truth = [("Q", 1150, 2250), ("P", 1300, 2300)];
        var pts = new[] { Held("A"), Held("B"), Held("D"), new Point("Q"), new Point("P") };
        var obs = Set("A", ["B", "Q"], 0.3, truth)
            .Append(Distance("A", "Q", truth))
            .Concat(Set("Q", ["A", "P"], 1.2, truth))
            .Append(Distance("Q", "P", truth))
            .Append(Distance("A", "P", truth, wrongBy: 0.30))
            .Append(Distance("B", "P", truth))
            .Append(Distance("D", "P", truth));
        var r = Run(new SurveyNetwork("order", pts, obs));
        AtTruth(r, "Q", truth);
        AtTruth(r, "P", truth);
    }

    [Fact]
    public void AResectionWaitsForAPolarPointOfTheNextRound()
    {
        // As above, but P is reached in round 1 only by a resection: its set sees A, B and D (the reading to D
        // 0.001 rad off, undetectable with three targets) and Q. In round 2 it is a polar point from Q.
        (string, double, double)[] truth = [("Q", 1150, 2250), ("P", 1250, 1950)];
        var pts = new[] { Held("A"), Held("B"), Held("D"), new Point("Q"), new Point("P") };
        var obs = Set("A", ["B", "Q"], 0.3, truth)
            .Append(Distance("A", "Q", truth))
            .Concat(Set("Q", ["A", "P"], 1.2, truth))
            .Append(Distance("Q", "P", truth))
            .Concat(Set("P", ["A", "B", "D", "Q"], 2.5, truth, wrongTarget: "D", wrongBy: 0.001));
        var r = Run(new SurveyNetwork("order", pts, obs));
        AtTruth(r, "Q", truth);
        AtTruth(r, "P", truth);
    }

    [Theory]
    [InlineData(1150.0, 2300.0)] // R left of A→B
    [InlineData(1250.0, 1800.0)] // R right of A→B
    public void AUniqueRayCircleSolutionIsNotLeftAsATie(double re, double rn)
    {
        // P: an azimuth from A and a distance from C; A lies inside the circle about C (|CA| = 430 m,
        // |CP| = 538.5 m), so only one solution lies ahead of the ray: P is located. R (listed first) has distances
        // from A and B, two mirror solutions that only the distance P–R tells apart. Were P's unique solution
        // taken as a tie, R would be the first undecided case and take a fixed side, wrong for one of the two
        // truths tried here.
        (string, double, double)[] truth = [("R", re, rn), ("P", 1050, 2150)];
        var pts = new[] { Held("A"), Held("B"), Held("C"), new Point("R"), new Point("P") };
        var obs = new Observation[]
        {
            new AzimuthObservation("A", "P", Angle.FromRadians(Az(At("A", truth), At("P", truth))))
                { StandardDeviation = 1e-5 },
            Distance("C", "P", truth),
            Distance("A", "R", truth),
            Distance("B", "R", truth),
            Distance("P", "R", truth),
        };
        var r = Run(new SurveyNetwork("unique", pts, obs));
        AtTruth(r, "P", truth);
        AtTruth(r, "R", truth);
    }

    [Fact]
    public void AResectionThatMisfitsByAThousandSigmaIsRejectedAndTheMessageSaysWhy()
    {
        // P sees A, B, C and D in one set (σ 1e-5 rad); the reading to D is 0.01 rad = 1000σ off. With four
        // targets the resection is redundant and the misfit shows; nothing else reaches P.
        (string, double, double)[] truth = [("P", 1180, 1910)];
        var pts = new[] { Held("A"), Held("B"), Held("C"), Held("D"), new Point("P") };
        var obs = Set("P", ["A", "B", "C", "D"], 0.7, truth, wrongTarget: "D", wrongBy: 0.01);
        var ex = Assert.Throws<InvalidInputException>(() => Run(new SurveyNetwork("misfit", pts, obs)));
        Assert.Contains("P:", ex.Message);
        Assert.Contains("3 angles at the point", ex.Message);
        Assert.Contains("resection from A, B, C, D was rejected", ex.Message);
        Assert.Contains("limit 100σ", ex.Message);
    }

    [Fact]
    public void AResectionWithOrdinaryNoiseIsAccepted()
    {
        // The same four targets with readings off by +2σ, −1σ, +1σ and −2σ: a few σ of misfit is noise, the
        // resection stands and lands within centimetres (σ 1e-5 rad over about 200 m is 2 mm per σ).
        (string, double, double)[] truth = [("P", 1180, 1910)];
        var pts = new[] { Held("A"), Held("B"), Held("C"), Held("D"), new Point("P") };
        double[] noise = [2e-5, -1e-5, 1e-5, -2e-5];
        string[] targets = ["A", "B", "C", "D"];
        var obs = targets.Select((t, k) => Set("P", [t], 0.7, truth, wrongTarget: t, wrongBy: noise[k]).Single());
        var r = Run(new SurveyNetwork("noise", pts, obs));
        Assert.True(Math.Abs(r.E["P"] - 1180) < 0.02 && Math.Abs(r.N["P"] - 1910) < 0.02,
            $"P at ({r.E["P"]:F4}, {r.N["P"]:F4})");
    }
}
