using NetAdjust.Misclosures;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Misclosures;

public class TraverseClosureTests
{
    private const double Arcsec = Math.PI / (180 * 3600);

    // Invented truth: reference R and start A held, stations P1..P4, end B held with its reference S.
    private static readonly (string Id, double E, double N)[] Truth =
    [
        ("R", 1000, 2000), ("A", 1000, 1500), ("P1", 1180, 1440), ("P2", 1390, 1475), ("P3", 1560, 1390),
        ("P4", 1750, 1455), ("B", 1930, 1400), ("S", 2050, 1800),
    ];

    private static (double E, double N) At(string id) => Truth.First(t => t.Id == id) is var t ? (t.E, t.N) : default;

    private static double Azimuth(string from, string to) =>
        Math.Atan2(At(to).E - At(from).E, At(to).N - At(from).N);

    /// <summary>Clockwise angle at a station from the backsight to the foresight, in [0, 2π).</summary>
    private static double AngleAt(string at, string back, string fore)
    {
        double a = Azimuth(at, fore) - Azimuth(at, back);
        return a < 0 ? a + (2 * Math.PI) : a;
    }

    private static SurveyNetwork LinkTraverse(double angleBlunderArcsec = 0, double distanceBlunder = 0)
    {
        string[] chain = ["R", "A", "P1", "P2", "P3", "P4", "B", "S"];
        bool held(string id) => id is "R" or "A" or "B" or "S";
        var points = Truth.Select(t => held(t.Id)
            ? new Point(t.Id) { E = t.E, N = t.N, Fixed = Fixity.EN } : new Point(t.Id)).ToList();
        var obs = new List<Observation>();
        for (int i = 1; i < chain.Length - 1; i++)
        {
            double a = AngleAt(chain[i], chain[i - 1], chain[i + 1]);
            if (chain[i] == "P2") a += angleBlunderArcsec * Arcsec;
            obs.Add(new AngleObservation(chain[i], chain[i - 1], chain[i + 1], Angle.FromRadians(a))
                { StandardDeviation = 1 * Arcsec, Source = $"t.yaml:{10 + i}" });
        }
        for (int i = 1; i < chain.Length - 2; i++)
        {
            var (e0, n0) = At(chain[i]);
            var (e1, n1) = At(chain[i + 1]);
            double d = Math.Sqrt(((e1 - e0) * (e1 - e0)) + ((n1 - n0) * (n1 - n0)));
            if (chain[i] == "P3") d += distanceBlunder;
            obs.Add(new DistanceObservation(chain[i], chain[i + 1], Length.FromMetres(d))
                { StandardDeviation = 0.002, Source = $"t.yaml:{30 + i}" });
        }
        return new SurveyNetwork("t", points, obs);
    }

    [Fact]
    public void ExactLinkTraverseClosesAndPasses()
    {
        var t = Assert.Single(MisclosureCheck.Run(LinkTraverse()).Traverses);
        Assert.Equal(TraverseKind.Link, t.Kind);
        Assert.Equal(["A", "P1", "P2", "P3", "P4", "B"], t.Points);
        Assert.Equal(0, t.AngularMisclosure, 9);
        Assert.Equal(0, t.LinearMisclosure, 6);
        Assert.True(t.Passed);
        // expected sd of the angular misclosure: √6 × 1″ for six angles (error of a sum, common practice)
        Assert.Equal(Math.Sqrt(6) * Arcsec, t.AngularSd, 12);
    }

    [Fact]
    public void TenArcsecondAngleBlunderFailsTheAngularMisclosure()
    {
        // A 10″ blunder in one angle is carried into every later azimuth: the angular misclosure is +10″ (carried
        // minus known), against 1.96 × √6 × 1″ = 4.8″ at 95% (normal quantile, MathNet): it fails, and the
        // failing traverse names the blundered angle among its observations.
        var net = LinkTraverse(angleBlunderArcsec: 10);
        var t = Assert.Single(MisclosureCheck.Run(net).Traverses);
        Assert.Equal(10 * Arcsec, t.AngularMisclosure, 12);
        Assert.False(t.Passed);
        Assert.Contains(t.Observations, i => net.Observations[i] is AngleObservation { Station: "P2" });
    }

    [Fact]
    public void DistanceBlunderShowsInTheLinearMisclosureAndItsRatio()
    {
        // 0.10 m added to the leg P3→P4: with exact angles the closing vector is that 0.10 m along the leg, so the
        // linear misclosure is 0.10 m and the precision ratio 1:(L / 0.10) (common practice).
        var net = LinkTraverse(distanceBlunder: 0.10);
        var t = Assert.Single(MisclosureCheck.Run(net).Traverses);
        double length = net.Observations.OfType<DistanceObservation>().Sum(d => d.Distance.Metres);
        Assert.Equal(0.10, t.LinearMisclosure, 9);
        Assert.Equal(length, t.Length, 9);
        Assert.Equal(length / 0.10, t.PrecisionRatio, 3);
        Assert.False(t.Passed);
        Assert.Equal(0, t.AngularMisclosure, 9);
    }

    [Fact]
    public void LeastRatioFailsATraverseBelowIt()
    {
        var net = LinkTraverse(distanceBlunder: 0.004);
        var t = Assert.Single(MisclosureCheck.Run(net, new MisclosureOptions { MinimumTraverseRatio = 1e6 })
            .Traverses);
        Assert.True(t.PrecisionRatio < 1e6);
        Assert.False(t.Passed);
    }

    [Fact]
    public void ClosedPolygonWithDirectionsChecksItsAngleSum()
    {
        // A pentagon observed with one set of directions at each corner (to both neighbours) and its five sides,
        // no known point: the angles must sum to (n − 2) × 180° (common practice); a 10″ blunder in one direction
        // gives a 10″ angular misclosure in size.
        (string Id, double E, double N)[] corners =
            [("K1", 0, 0), ("K2", 300, 40), ("K3", 380, 310), ("K4", 150, 420), ("K5", -60, 230)];
        var pts = corners.Select(c => new Point(c.Id) { E = c.E + 0.3, N = c.N - 0.2 }).ToList();
        pts[0] = pts[0] with { E = 0, N = 0, Fixed = Fixity.EN };
        double Az(int a, int b) => Math.Atan2(corners[b].E - corners[a].E, corners[b].N - corners[a].N);
        SurveyNetwork Build(double blunder)
        {
            var obs = new List<Observation>();
            for (int i = 0; i < 5; i++)
            {
                int prev = (i + 4) % 5, next = (i + 1) % 5;
                double zero = 0.3 * i;
                foreach (int t in new[] { prev, next })
                {
                    double r = Az(i, t) - zero + (i == 2 && t == next ? blunder * Arcsec : 0);
                    r = ((r % (2 * Math.PI)) + (2 * Math.PI)) % (2 * Math.PI);
                    obs.Add(new DirectionObservation(corners[i].Id, corners[t].Id, Angle.FromRadians(r),
                        corners[i].Id + "/1") { StandardDeviation = 1 * Arcsec });
                }
                double d = Math.Sqrt(Math.Pow(corners[next].E - corners[i].E, 2) +
                    Math.Pow(corners[next].N - corners[i].N, 2));
                obs.Add(new DistanceObservation(corners[i].Id, corners[next].Id, Length.FromMetres(d))
                    { StandardDeviation = 0.002 });
            }
            return new SurveyNetwork("pentagon", pts, obs);
        }
        var exact = Assert.Single(MisclosureCheck.Run(Build(0)).Traverses);
        Assert.Equal(TraverseKind.Closed, exact.Kind);
        Assert.Equal(6, exact.Points.Count); // five stations, the first repeated
        Assert.Equal(0, exact.AngularMisclosure, 9);
        Assert.Equal(0, exact.LinearMisclosure, 6);
        Assert.True(exact.Passed);
        // each angle from two directions of 1″: √(5 × 2) × 1″
        Assert.Equal(Math.Sqrt(10) * Arcsec, exact.AngularSd, 12);
        var blundered = Assert.Single(MisclosureCheck.Run(Build(10)).Traverses);
        Assert.Equal(10 * Arcsec, Math.Abs(blundered.AngularMisclosure), 12);
        Assert.False(blundered.Passed);
    }

    [Fact]
    public void AngleMeasuredAlsoByADirectionSetEntersAsTheWeightedMean()
    {
        // The angle at P2 is also measured by a set of two directions (1″ each: the angle 1″·√2) that reads it 6″
        // too large. Weighted by 1/σ² (common practice): (1 × 0″ + ½ × 6″) / (1 + ½) = 2″ in the angular
        // misclosure, and the angle's variance 1 / (1 + ½) = ⅔ (arcsec²) beside the other five angles' 1 each.
        var net = LinkTraverse();
        double zero = 1.234;
        double Reading(string to) => (((Azimuth("P2", to) - zero) % (2 * Math.PI)) + (2 * Math.PI)) % (2 * Math.PI);
        var set = new Observation[]
        {
            new DirectionObservation("P2", "P1", Angle.FromRadians(Reading("P1")), "P2/1")
                { StandardDeviation = 1 * Arcsec },
            new DirectionObservation("P2", "P3", Angle.FromRadians(Reading("P3") + (6 * Arcsec)), "P2/1")
                { StandardDeviation = 1 * Arcsec },
        };
        net = new SurveyNetwork("t", net.Points, [.. net.Observations, .. set]);
        var t = Assert.Single(MisclosureCheck.Run(net).Traverses);
        Assert.Equal(["A", "P1", "P2", "P3", "P4", "B"], t.Points);
        Assert.Equal(2 * Arcsec, t.AngularMisclosure, 12);
        Assert.Equal(Math.Sqrt(5 + (2.0 / 3)) * Arcsec, t.AngularSd, 12);
        int first = net.Observations.Count - 2;
        Assert.Contains(first, t.Observations);
        Assert.Contains(first + 1, t.Observations);
        Assert.Contains(t.Observations, i => net.Observations[i] is AngleObservation { Station: "P2" });
    }
}
