using FsCheck;
using FsCheck.Xunit;
using NetAdjust.Adjustment.Approximation;
using NetAdjust.Geometry;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>
/// The plane constructions against values worked by hand from the plane-coordinate formulas (common practice;
/// e.g. Wolf &amp; Ghilani, <i>Adjustment Computations</i>, chapters on traverse and intersection/resection, cited
/// from memory): polar point E = E₀ + d sin t, N = N₀ + d cos t; azimuth t = atan2(ΔE, ΔN). Each expected value
/// is worked in the comment beside it; the configurations use right angles and 3-4-5 triangles so that the
/// values are exact.
/// </summary>
public class ConstructionsTests
{
    private const double Deg = Math.PI / 180;

    private static void Near(double e, double n, PlanePoint p, int digits = 9)
    {
        Assert.Equal(e, p.E, digits);
        Assert.Equal(n, p.N, digits);
    }

    [Fact]
    public void PolarPointFromAStationAzimuthAndDistance()
    {
        // (100, 200), t = 30°, d = 50: E = 100 + 50·sin 30° = 125, N = 200 + 50·cos 30° = 200 + 25√3
        Near(125, 200 + (25 * Math.Sqrt(3)), Constructions.Polar(new PlanePoint(100, 200), 30 * Deg, 50));
    }

    [Fact]
    public void TwoRaysMeetAtRightAngles()
    {
        // From (0, 0) on 45° and from (100, 0) on 315°: the isosceles right triangle on the base gives (50, 50);
        // the rays cross at 90°, so |sin cut| = 1.
        var hit = Constructions.Intersect(new Ray("A", new PlanePoint(0, 0), 45 * Deg, 1e-5),
            new Ray("B", new PlanePoint(100, 0), 315 * Deg, 1e-5));
        Assert.NotNull(hit);
        Near(50, 50, hit.Value.Point);
        Assert.Equal(1, hit.Value.SinCut, 12);
    }

    [Fact]
    public void RaysThatMeetBehindTheirStationsOrRunParallelGiveNothing()
    {
        // 315° from (0, 0) and 45° from (100, 0) would meet at (50, −50), behind both stations.
        Assert.Null(Constructions.Intersect(new Ray("A", new PlanePoint(0, 0), 315 * Deg, 1e-5),
            new Ray("B", new PlanePoint(100, 0), 45 * Deg, 1e-5)));
        Assert.Null(Constructions.Intersect(new Ray("A", new PlanePoint(0, 0), 10 * Deg, 1e-5),
            new Ray("B", new PlanePoint(100, 0), 10 * Deg, 1e-5)));
    }

    [Fact]
    public void ARayThroughACircleMeetsItTwiceAhead()
    {
        // East from (0, 0) through the circle of radius 5 about (10, 0): s² − 20 s + 75 = 0, s = 15 or 5, so
        // (15, 0) first (the far one) and (5, 0).
        var hit = Constructions.RayCircle(new Ray("A", new PlanePoint(0, 0), 90 * Deg, 1e-5),
            new Circle("C", new PlanePoint(10, 0), 5, 0.002));
        Assert.NotNull(hit);
        Near(15, 0, hit.Value.First);
        Assert.NotNull(hit.Value.Second);
        Near(5, 0, hit.Value.Second!.Value);
    }

    [Fact]
    public void ARayFromInsideACircleMeetsItOnce()
    {
        // North from (12, 0), inside the circle of radius 5 about (10, 0): (12 − 10)² + N² = 25, N = ±√21; only
        // +√21 lies ahead, so the solution is unique (no second point).
        var hit = Constructions.RayCircle(new Ray("A", new PlanePoint(12, 0), 0, 1e-5),
            new Circle("C", new PlanePoint(10, 0), 5, 0.002));
        Assert.NotNull(hit);
        Near(12, Math.Sqrt(21), hit.Value.First);
        Assert.Null(hit.Value.Second);
    }

    [Fact]
    public void ARayThatMissesACircleGivesNothing()
    {
        // East along N = 20 passes 15 m clear of the circle of radius 5 about (10, 0).
        Assert.Null(Constructions.RayCircle(new Ray("A", new PlanePoint(0, 20), 90 * Deg, 1e-5),
            new Circle("C", new PlanePoint(10, 0), 5, 0.002)));
    }

    [Fact]
    public void TwoCirclesMeetOnBothSidesOfTheirCentreLine()
    {
        // Radii 5 about (0, 0) and (6, 0): x = (25 − 25 + 36)/12 = 3, y = √(25 − 9) = 4 (a 3-4-5 triangle).
        // Facing from the first centre to the second (east), the right-hand solution (3, −4) comes first.
        var hit = Constructions.CircleCircle(new Circle("A", new PlanePoint(0, 0), 5, 0.002),
            new Circle("B", new PlanePoint(6, 0), 5, 0.002));
        Assert.NotNull(hit);
        Near(3, -4, hit.Value.Right);
        Near(3, 4, hit.Value.Left);
    }

    [Fact]
    public void CirclesThatJustFailToTouchGiveTheTouchingPointAndCirclesApartGiveNothing()
    {
        // Radii 3 and 2.995 about (0, 0) and (6, 0): 5 mm short of touching (within 1e-3 of the 6 m centre
        // distance), so x = (9 − 8.970025 + 36)/12 = 3.0024979…, y = 0: the touching point twice.
        var hit = Constructions.CircleCircle(new Circle("A", new PlanePoint(0, 0), 3, 0.002),
            new Circle("B", new PlanePoint(6, 0), 2.995, 0.002));
        Assert.NotNull(hit);
        Near((9 - (2.995 * 2.995) + 36) / 12, 0, hit.Value.Right);
        Near(hit.Value.Right.E, hit.Value.Right.N, hit.Value.Left);
        // Radii 2 and 2 six metres apart: 2 m short, no solution.
        Assert.Null(Constructions.CircleCircle(new Circle("A", new PlanePoint(0, 0), 2, 0.002),
            new Circle("B", new PlanePoint(6, 0), 2, 0.002)));
    }

    [Fact]
    public void ResectionFromTwoRightAngles()
    {
        // Targets north (0, 100), east (100, 0) and south (0, −100) of the point: angles 90° and 90° from the
        // origin, which is where the point must be.
        var a = new PlanePoint(0, 100);
        var b = new PlanePoint(100, 0);
        var c = new PlanePoint(0, -100);
        var p = Constructions.Resect([new AngleAtPoint("A", a, "B", b, 90 * Deg, 1e-5),
            new AngleAtPoint("B", b, "C", c, 90 * Deg, 1e-5)]);
        Assert.NotNull(p);
        Near(0, 0, p.Value);
    }

    [Fact]
    public void ResectionWorkedFromHalfAngles()
    {
        // P = (50, 0), targets A (0, 100), B (100, 100), C (100, 0). Azimuths from P: to A −atan(1/2), to B
        // +atan(1/2), to C 90°; so angle A→B = 2·atan(1/2) = 53.1301…° and B→C = 90° − atan(1/2) = 63.4349…°.
        var a = new PlanePoint(0, 100);
        var b = new PlanePoint(100, 100);
        var c = new PlanePoint(100, 0);
        double half = Math.Atan(0.5);
        var p = Constructions.Resect([new AngleAtPoint("A", a, "B", b, 2 * half, 1e-5),
            new AngleAtPoint("B", b, "C", c, (90 * Deg) - half, 1e-5)]);
        Assert.NotNull(p);
        Near(50, 0, p.Value);
    }

    [Fact]
    public void ResectionOnTheDangerCircleIsRefused()
    {
        // P = (0, 0) and targets (0, 100), (100, 100), (100, 0) are the corners of one square, so all four lie on
        // one circle: every point of it sees the targets under the same angles (45° and 45°, inscribed-angle
        // theorem), the "danger circle" of resection (common practice), and no position may be given.
        var a = new PlanePoint(0, 100);
        var b = new PlanePoint(100, 100);
        var c = new PlanePoint(100, 0);
        Assert.Null(Constructions.Resect([new AngleAtPoint("A", a, "B", b, 45 * Deg, 1e-5),
            new AngleAtPoint("B", b, "C", c, 45 * Deg, 1e-5)]));
    }

    [Property(MaxTest = 200)]
    public void ResectionRecoversAnyPointAwayFromTheDangerCircle(NormalFloat pe, NormalFloat pn, PositiveInt seed)
    {
        // Cross-check by the forward problem: angles computed from a chosen P by atan2 (an independent
        // computation) must resect back to P, wherever P and the three targets lie, unless P is within 5% of the
        // radius of the circle through the targets (the danger circle, where no answer is asked for).
        var rng = new Random(seed.Get);
        var p = new PlanePoint(((double)pe % 500) + 0.5, ((double)pn % 500) + 0.25);
        var t = Enumerable.Range(0, 3)
            .Select(_ => new PlanePoint(rng.Next(-1000, 1000), rng.Next(-1000, 1000))).ToArray();
        double az(PlanePoint x) => Math.Atan2(x.E - p.E, x.N - p.N);
        var cuts = new[]
        {
            new AngleAtPoint("A", t[0], "B", t[1], Angle.Reduce0To2Pi(az(t[1]) - az(t[0])), 1e-5),
            new AngleAtPoint("B", t[1], "C", t[2], Angle.Reduce0To2Pi(az(t[2]) - az(t[1])), 1e-5),
        };
        // Distance of P from the circle through the targets (circumcircle by the perpendicular bisectors).
        double ax = t[0].E, ay = t[0].N, bx = t[1].E, by = t[1].N, cx = t[2].E, cy = t[2].N;
        double d = 2 * ((ax * (by - cy)) + (bx * (cy - ay)) + (cx * (ay - by)));
        bool wellPlaced = t.All(x => Constructions.Distance(x, p) > 50);
        if (Math.Abs(d) > 1e3 && wellPlaced)
        {
            double a2 = (ax * ax) + (ay * ay), b2 = (bx * bx) + (by * by), c2 = (cx * cx) + (cy * cy);
            var centre = new PlanePoint(((a2 * (by - cy)) + (b2 * (cy - ay)) + (c2 * (ay - by))) / d,
                ((a2 * (cx - bx)) + (b2 * (ax - cx)) + (c2 * (bx - ax))) / d);
            double off = Math.Abs(Constructions.Distance(centre, p) - Constructions.Distance(centre, t[0]));
            var r = Constructions.Resect(cuts);
            if (off > 0.05 * Constructions.Distance(centre, t[0]))
            {
                Assert.NotNull(r);
                Assert.True(Constructions.Distance(r.Value, p) < 1e-6 * (1 + Constructions.Distance(centre, t[0])),
                    $"resected ({r.Value.E}, {r.Value.N}) for ({p.E}, {p.N})");
            }
        }
    }

    [Fact]
    public void MisfitAddsSquaredStandardisedDifferences()
    {
        // x = (0, 10): a ray from (0, 0) observed at 0.001 rad (σ 0.0005) is 2σ off; a distance of 10.004 m
        // (σ 0.002) is 2σ off; so the misfit is 2² + 2² = 8.
        var x = new PlanePoint(0, 10);
        double m = Constructions.Misfit(x, [new Ray("A", new PlanePoint(0, 0), 0.001, 0.0005)],
            [new Circle("A", new PlanePoint(0, 0), 10.004, 0.002)], []);
        Assert.Equal(8, m, 6);
    }

    [Fact]
    public void SimilarityFittedOnTwoPointsRotatesAndScales()
    {
        // (0, 0) → (10, 10) and (1, 0) → (10, 12): the unit east vector becomes 2 north, a rotation by +90° (east
        // to north) and scale 2; so (0, 1), one unit north, becomes 2 west of (10, 10): (8, 10). Held rigid
        // (scale 1) about the centroids (0.5, 0) → (10, 11): (0, 1) is (−0.5, 1) from the centroid, rotated
        // (−1, −0.5), giving (9, 10.5).
        PlanePoint[] from = [new(0, 0), new(1, 0)];
        PlanePoint[] to = [new(10, 10), new(10, 12)];
        Near(8, 10, Constructions.Similarity(from, to, rigid: false)(new PlanePoint(0, 1)));
        Near(9, 10.5, Constructions.Similarity(from, to, rigid: true)(new PlanePoint(0, 1)));
    }

    [Fact]
    public void LevellingTreeCarriesHeightsAndStartsALooseLineFromZero()
    {
        // BM 10.000; BM→A +1.500 gives 11.500; A→B −0.250 gives 11.250; X and Y reach no height: X starts at 0
        // and Y = 0 + 2.000.
        var h = new Dictionary<string, double> { ["BM"] = 10.0 };
        Constructions.LevellingTree(["BM", "A", "B", "X", "Y"],
            [("BM", "A", 1.5), ("A", "B", -0.25), ("X", "Y", 2.0)], h);
        Assert.Equal(11.5, h["A"], 12);
        Assert.Equal(11.25, h["B"], 12);
        Assert.Equal(0, h["X"], 12);
        Assert.Equal(2, h["Y"], 12);
    }

    [Fact]
    public void AzimuthIsClockwiseFromNorth()
    {
        // atan2(ΔE, ΔN): east is 90°, south-west 225°.
        Assert.Equal(90 * Deg, Constructions.Azimuth(new PlanePoint(0, 0), new PlanePoint(5, 0)), 12);
        Assert.Equal(225 * Deg, Constructions.Azimuth(new PlanePoint(0, 0), new PlanePoint(-3, -3)), 12);
        Assert.Equal(Angle.FromDegrees(225).Radians,
            Constructions.Azimuth(new PlanePoint(1, 1), new PlanePoint(-2, -2)), 12);
    }
}
