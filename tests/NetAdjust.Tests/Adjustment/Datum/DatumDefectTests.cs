using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Datum;

/// <summary>
/// Each kind of datum defect is found before solving and named in its own words. The defects of a plane network
/// (translation, rotation without azimuth, scale without distance) and of a level network (height) are common
/// practice; Koch (1999), §3.4 (section from memory), treats models not of full rank.
/// </summary>
public class DatumDefectTests
{
    private static Observation D(string a, string b, double m) => new DistanceObservation(a, b, Length.FromMetres(m)) { StandardDeviation = 0.002 };

    private static Observation R(string at, string to, double deg, string set) => new DirectionObservation(at, to, Angle.FromDegrees(deg), set) { StandardDeviation = 1e-5 };

    private static readonly Point[] Triangle =
    [
        new("A") { E = 0, N = 0 }, new("B") { E = 100, N = 0 }, new("C") { E = 50, N = 80 },
    ];

    private static Observation[] TriangleObs(bool distances = true) =>
    [
        .. distances ? new[] { D("A", "B", 100), D("B", "C", 94.34), D("A", "C", 94.34) } : [],
        R("A", "B", 90, "A/1"), R("A", "C", 32.005, "A/1"), R("B", "A", 270, "B/1"), R("B", "C", 327.995, "B/1"),
        R("C", "A", 212.005, "C/1"), R("C", "B", 147.995, "C/1"),
    ];

    private static DatumDefectException Defect(IEnumerable<Point> pts, IEnumerable<Observation> obs) =>
        Assert.Throws<DatumDefectException>(() => Adjuster.Adjust(new SurveyNetwork("t", pts, obs)));

    [Fact]
    public void NoFixedPoint()
    {
        var e = Defect(Triangle, TriangleObs());
        Assert.StartsWith("The datum is not defined: no fixed point.", e.Message);
        Assert.Contains("A, B, C", e.Message);
        Assert.Contains("translation in easting", e.Undetermined);
        Assert.Contains("rotation", e.Undetermined);
    }

    [Fact]
    public void NoOrientation()
    {
        var pts = Triangle.Select((p, k) => k == 0 ? p with { Fixed = Fixity.EN } : p);
        var e = Defect(pts, TriangleObs());
        Assert.StartsWith("The datum is not defined: no orientation.", e.Message);
        Assert.Contains("only one control point (A)", e.Message);
        Assert.Equal(["rotation"], e.Undetermined);
    }

    [Fact]
    public void NoDistance()
    {
        // One held point and an observed azimuth fix position and rotation, but nothing fixes the size.
        var pts = Triangle.Select((p, k) => k == 0 ? p with { Fixed = Fixity.EN } : p);
        var obs = TriangleObs(distances: false).Append(new AzimuthObservation("A", "B", Angle.FromDegrees(90)) { StandardDeviation = 1e-5 });
        var e = Defect(pts, obs);
        Assert.StartsWith("The datum is not defined: no distance.", e.Message);
        Assert.Equal(["scale"], e.Undetermined);
    }

    [Fact]
    public void TwoDisconnectedParts()
    {
        var pts = Triangle.Select((p, k) => k < 2 ? p with { Fixed = Fixity.EN } : p)
            .Concat([new Point("X") { E = 500, N = 500 }, new Point("Y") { E = 600, N = 500 }]);
        var obs = TriangleObs().Append(D("X", "Y", 100)).Append(R("X", "Y", 10, "X/1"));
        var e = Defect(pts, obs);
        Assert.StartsWith("The datum is not defined: the plane network falls apart into 2 parts", e.Message);
        Assert.Contains("part 1: A, B, C — has its datum", e.Message);
        Assert.Contains("part 2: X, Y — has no datum of its own", e.Message);
    }

    [Fact]
    public void NoHeightDatum()
    {
        var pts = new[] { new Point("L1"), new Point("L2"), new Point("L3") };
        var obs = new Observation[]
        {
            new HeightDifferenceObservation("L1", "L2", Length.FromMetres(1)) { StandardDeviation = 0.001 },
            new HeightDifferenceObservation("L2", "L3", Length.FromMetres(1)) { StandardDeviation = 0.001 },
        };
        var e = Defect(pts, obs);
        Assert.StartsWith("The datum is not defined: no height datum.", e.Message);
        Assert.Contains("L1, L2, L3", e.Message);
    }

    [Fact]
    public void TheFourPlaneDefectsHaveDistinctMessages()
    {
        var messages = new[]
        {
            Defect(Triangle, TriangleObs()).Message,
            Defect(Triangle.Select((p, k) => k == 0 ? p with { Fixed = Fixity.EN } : p), TriangleObs()).Message,
            Defect(Triangle.Select((p, k) => k == 0 ? p with { Fixed = Fixity.EN } : p),
                TriangleObs(false).Append(new AzimuthObservation("A", "B", Angle.FromDegrees(90)) { StandardDeviation = 1e-5 })).Message,
            Defect(Triangle.Select((p, k) => k < 2 ? p with { Fixed = Fixity.EN } : p).Concat([new Point("X") { E = 5, N = 5 }, new Point("Y") { E = 6, N = 5 }]),
                TriangleObs().Append(D("X", "Y", 1))).Message,
        };
        Assert.Equal(4, messages.Select(m => m.Split('.')[0] + m.Split('.')[1]).Distinct().Count());
        Assert.All(messages, m => Assert.DoesNotContain("singular", m, StringComparison.OrdinalIgnoreCase));
    }

    [Fact]
    public void AFreeNetworkMustBeConnected()
    {
        var pts = Triangle.Concat([new Point("X") { E = 500, N = 500 }, new Point("Y") { E = 600, N = 500 }]);
        var obs = TriangleObs().Append(D("X", "Y", 100));
        var e = Assert.Throws<DatumDefectException>(() => Adjuster.Adjust(new SurveyNetwork("t", pts, obs), AdjustmentOptions.Default with { Datum = DatumDefinition.Free() }));
        Assert.Contains("falls apart into 2 parts", e.Message);
        Assert.Contains("a free network can define the datum of one connected network only", e.Message);
    }

    [Fact]
    public void TheFreeNetworkNeedsNoControlAtAll()
    {
        // The triangle without a fixed point adjusts as a free network: r = n − u + 3 (translation in E and N, rotation).
        var r = Adjuster.Adjust(new SurveyNetwork("t", Triangle, TriangleObs()), AdjustmentOptions.Default with { Datum = DatumDefinition.Free() });
        Assert.Equal(r.Statistics.Observations - r.Statistics.Unknowns + 3, r.Statistics.DegreesOfFreedom);
    }
}
