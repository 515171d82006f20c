using NetAdjust.Adjustment;
using NetAdjust.Adjustment.Approximation;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>
/// Approximate heights (and plane positions) of points without given coordinates from zenith angles and slope
/// distances (docs/methods.md, "Approximate coordinates"), against a hand-worked trigonometric height.
/// </summary>
public class TrigonometricApproximationTests
{
    // Hand-worked, exact trigonometry (sin 89°30′ = 0.999 961 923, cos 89°30′ = 0.008 726 535 5,
    // cot 89°30′ = 0.008 726 867 8): D = 500.000 m, z = 89°30′00″, i = 1.500 m, t = 1.800 m, k = 0.13,
    // R = 6 371 008.8 m: s = D sin z = 499.980 96 m; D cos z = 4.363 268 m; (1 − k)s²/(2R) = 0.017 068 m;
    // ΔH = D cos z + (1 − k)s²/(2R) + i − t = 4.363 268 + 0.017 068 + 1.500 − 1.800 = 4.080 336 m
    // (the trigonometric height of Ghilani & Wolf, Elementary Surveying, ch. 4; docs/references.md §10).
    private const double HandWorkedRise = 4.080336, HandWorkedPlane = 499.98096;

    private static ZenithObservation Zenith(string from = "A", string to = "B") =>
        new(from, to, Angle.FromDegrees(89.5), Length.FromMetres(1.5), Length.FromMetres(1.8))
        { StandardDeviation = 1e-5, Refraction = 0.13 };

    private static SlopeDistanceObservation Slope() =>
        new("A", "B", Length.FromMetres(500.000), Length.FromMetres(1.5), Length.FromMetres(1.8))
        { StandardDeviation = 0.002 };

    [Fact]
    public void AZenithAngleAndASlopeDistanceGiveTheHandWorkedHeight()
    {
        var net = new SurveyNetwork("trig", [new Point("A") { E = 0, N = 0, H = 200, Fixed = Fixity.ENH },
            new Point("B") { E = 0, N = HandWorkedPlane }], [Zenith(), Slope()]);
        var h = new Dictionary<string, double> { ["A"] = 200 };
        ApproximateCoordinates.Heights(net, new HashSet<string> { "A", "B" }, h);
        Assert.Equal(200 + HandWorkedRise, h["B"], 1e-6);
    }

    [Fact]
    public void AZenithAngleAloneTakesTheHorizontalDistanceFromThePlaneCoordinates()
    {
        // s cot z = 499.980 96 × 0.008 726 867 8 = 4.363 267 m (hand-worked above): ΔH = 4.080 335 m.
        var net = new SurveyNetwork("trig", [new Point("A") { E = 0, N = 0, H = 200, Fixed = Fixity.ENH },
            new Point("B") { E = 0, N = HandWorkedPlane, Fixed = Fixity.EN }], [Zenith()]);
        var h = new Dictionary<string, double> { ["A"] = 200 };
        var e = new Dictionary<string, double> { ["A"] = 0, ["B"] = 0 };
        var n = new Dictionary<string, double> { ["A"] = 0, ["B"] = HandWorkedPlane };
        ApproximateCoordinates.Heights(net, new HashSet<string> { "A", "B" }, h, e, n);
        Assert.Equal(200 + 4.080335, h["B"], 2e-6);
        // reversed (B→A, the target at A): the same rise with the opposite sign, from B's end
        var back = new SurveyNetwork("trig", net.Points, [Zenith("B", "A")]);
        var hb = new Dictionary<string, double> { ["A"] = 200 };
        ApproximateCoordinates.Heights(back, new HashSet<string> { "A", "B" }, hb, e, n);
        Assert.Equal(200 - 4.080335, hb["B"], 2e-6);
    }

    [Fact]
    public void APointWithoutCoordinatesIsPlacedAndAdjustedFromADirectionASlopeDistanceAndAZenith()
    {
        // B has no e, n or h: polar point from A (oriented on R) at s = D sin z, height from the trigonometric
        // height. With no redundancy the adjustment reproduces the hand-worked values (the first-order formula and
        // the curved-earth model differ by well under 1 mm here; docs/methods.md). A is at height 0, the datum of
        // the plane distance, as in the hand-worked case: at 200 m the plane distance would be 16 mm shorter.
        var pts = new[]
        {
            new Point("A") { E = 1000, N = 1000, H = 0, Fixed = Fixity.ENH },
            new Point("R") { E = 1000, N = 2000, Fixed = Fixity.EN }, new Point("B"),
        };
        var obs = new Observation[]
        {
            new DirectionObservation("A", "R", Angle.FromDegrees(0), "A/1") { StandardDeviation = 1e-5 },
            new DirectionObservation("A", "B", Angle.FromDegrees(90), "A/1") { StandardDeviation = 1e-5 },
            Zenith(), Slope(),
        };
        var result = Adjuster.Adjust(new SurveyNetwork("polar", pts, obs));
        var b = result.Points.First(p => p.Id == "B");
        Assert.Equal(1000 + HandWorkedPlane, b.E!.Value, 0.001);
        Assert.Equal(1000, b.N!.Value, 0.001);
        Assert.Equal(HandWorkedRise, b.H!.Value, 0.001);
    }
}
