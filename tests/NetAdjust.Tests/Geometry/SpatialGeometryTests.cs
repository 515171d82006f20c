using NetAdjust.Geometry;

namespace NetAdjust.Tests.Geometry;

/// <summary>Slope distance and zenith angle over a curved earth with refraction (docs/methods.md).</summary>
public class SpatialGeometryTests
{
    private const double Arcsec = Math.PI / 648000;

    private static Sighting Sight(double s, double hA, double hB, double i = 0, double t = 0) =>
        new("A", new PlanePoint(1000, 2000), hA, i, "B", new PlanePoint(1000 + (0.6 * s), 2000 + (0.8 * s)), hB, t);

    private static double ApparentRise(double s, double k)
    {
        // Two marks of equal height, instrument and target at the marks: D cos z is the apparent rise of the target,
        // negative (it appears below the horizon), and its size is the combined curvature and refraction.
        var sight = Sight(s, 50, 50);
        double d = SpatialGeometry.SlopeDistance(sight).Value, z = SpatialGeometry.Zenith(sight, k).Value;
        return -d * Math.Cos(z);
    }

    [Fact]
    public void CurvatureAndRefractionOverOneKilometreIsTheTextbookRule()
    {
        // Ghilani & Wolf, Elementary Surveying: An Introduction to Geomatics, ch. 4 "curvature and refraction":
        // h_cr = 0.0675 K² metres, K in km, for the usual refraction (k ≈ 0.14) (docs/references.md §10: seen in
        // notes citing the 13th edition).
        // The rule is printed to three figures, so it is met to half a unit of its last digit.
        Assert.Equal(0.0675, ApparentRise(1000, 0.14), 0.00005 + 1e-9);
        Assert.Equal(0.0675, SpatialGeometry.CurvatureAndRefraction(1000, 0.14), 0.00005 + 1e-9);
    }

    [Theory]
    [InlineData(500.0)]
    [InlineData(2000.0)]
    [InlineData(3000.0)]
    public void CurvatureAndRefractionGrowsWithTheSquareOfTheDistance(double s)
    {
        // Same source: h_cr ∝ K². The model's second-order terms stay below 1e-4 of the correction up to 3 km.
        double ratio = ApparentRise(s, 0.13) / ApparentRise(1000, 0.13);
        Assert.Equal(s * s / 1e6, ratio, 1e-4 * s * s / 1e6);
    }

    [Fact]
    public void ReciprocalZenithAnglesGiveAMeanHeightDifferenceThatDoesNotDependOnK()
    {
        // Common practice (e.g. Ghilani & Wolf, ch. 4, reciprocal observations, from memory): in the mean of the
        // height differences reduced from both ends, curvature and refraction cancel when k is the same both ways.
        // Observations simulated by the model at k = 0.13; reduced with the textbook first-order formula at any k.
        const double hA = 120.0, hB = 143.0, s = 1800.0;
        var ab = Sight(s, hA, hB);
        var ba = new Sighting("B", ab.Target, hB, 0, "A", ab.Station, hA, 0);
        double dAb = SpatialGeometry.SlopeDistance(ab).Value, zAb = SpatialGeometry.Zenith(ab, 0.13).Value;
        double dBa = SpatialGeometry.SlopeDistance(ba).Value, zBa = SpatialGeometry.Zenith(ba, 0.13).Value;
        double Mean(double k) =>
            ((dAb * Math.Cos(zAb)) + SpatialGeometry.CurvatureAndRefraction(s, k)
             - (dBa * Math.Cos(zBa)) - SpatialGeometry.CurvatureAndRefraction(s, k)) / 2;
        Assert.Equal(Mean(0.0), Mean(0.13), 1e-9);
        Assert.Equal(Mean(0.0), Mean(0.5), 1e-9);
        Assert.Equal(hB - hA, Mean(0.0), 0.002);
        // One way, a wrong k is off by Δk·s²/(2R): 0.13·1.8²/(2·6371) m = 33 mm (same source).
        double oneWay = (dAb * Math.Cos(zAb)) + SpatialGeometry.CurvatureAndRefraction(s, 0.0);
        Assert.Equal(0.13 * s * s / (2 * 6_371_008.8), oneWay - (hB - hA), 0.002);
    }

    [Fact]
    public void SlopeDistanceAndZenithReduceToTheHandWorkedHorizontalDistanceAndHeightDifference()
    {
        // Hand-worked, exact trigonometry (sin 89°30′ = 0.999 961 923, cos 89°30′ = 0.008 726 535 5):
        // D = 500.000 m, z = 89°30′00″, i = 1.500 m, t = 1.800 m, k = 0.13, R = 6 371 008.8 m:
        // s = D sin z = 499.980 96 m; D cos z = 4.363 268 m; (1 − k)s²/(2R) = 0.017 068 m;
        // ΔH = 4.363 268 + 0.017 068 + 1.500 − 1.800 = 4.080 336 m.
        // So marks at s = 499.980 96 m apart with heights 0 and 4.080 336 m must give back D and z (the first-order
        // reduction and the exact sphere differ by well under 1 mm here).
        var sight = new Sighting("A", new PlanePoint(0, 0), 0.0, 1.5, "B", new PlanePoint(0, 499.98096), 4.080336, 1.8);
        Assert.Equal(500.000, SpatialGeometry.SlopeDistance(sight).Value, 0.001);
        Assert.Equal((89.5 * 3600) * Arcsec, SpatialGeometry.Zenith(sight, 0.13).Value, 0.5 * Arcsec);
    }

    public static TheoryData<double, double, double, double> Geometries => new()
    {
        { 250.0, 100.0, 112.0, 0.13 },
        { 1500.0, 10.0, -40.0, 0.0 },
        { 40.0, 300.0, 330.0, 0.2 },
    };

    [Theory]
    [MemberData(nameof(Geometries))]
    public void PartialDerivativesAgreeWithCentralFiniteDifferences(double s, double hA, double hB, double k)
    {
        // At the height datum and with plane coordinates at a reference height H0 of 2500 m (γ = s/(R + H0)).
        foreach (double planeHeight in new[] { 0.0, 2500.0 })
            CheckPartials(Sight(s, hA, hB, 1.55, 1.7) with { PlaneHeight = planeHeight }, s, k);
    }

    private static void CheckPartials(Sighting sight, double s, double k)
    {
        // ∂z/∂k = −s/(2(R + H0)), the refraction unknown's column, against a central difference in k.
        double byK = (SpatialGeometry.Zenith(sight, k + 1e-3).Value - SpatialGeometry.Zenith(sight, k - 1e-3).Value)
            / 2e-3;
        Assert.Equal(byK, SpatialGeometry.ZenithByRefraction(s, sight.PlaneHeight), 1e-12);
        foreach (bool slope in new[] { true, false })
        {
            double F(Sighting x) => slope ? SpatialGeometry.SlopeDistance(x).Value : SpatialGeometry.Zenith(x, k).Value;
            var partials = slope
                ? SpatialGeometry.SlopeDistance(sight).Partials : SpatialGeometry.Zenith(sight, k).Partials;
            Assert.Equal(6, partials.Length);
            const double h = 1e-3; // central differences: truncation error ~h²·f‴, far below the tolerance
            foreach (var p in partials)
            {
                Sighting Moved(double by) => (p.Owner, p.Parameter) switch
                {
                    ("A", Parameter.E) => sight with { Station = sight.Station with { E = sight.Station.E + by } },
                    ("A", Parameter.N) => sight with { Station = sight.Station with { N = sight.Station.N + by } },
                    ("A", Parameter.H) => sight with { StationHeight = sight.StationHeight + by },
                    ("B", Parameter.E) => sight with { Target = sight.Target with { E = sight.Target.E + by } },
                    ("B", Parameter.N) => sight with { Target = sight.Target with { N = sight.Target.N + by } },
                    ("B", Parameter.H) => sight with { TargetHeight = sight.TargetHeight + by },
                    _ => throw new InvalidOperationException(p.ToString()),
                };
                double numeric = (F(Moved(h)) - F(Moved(-h))) / (2 * h);
                double scale = slope ? 1.0 : 1.0 / s;
                Assert.True(Math.Abs(numeric - p.Derivative) <= 1e-7 * scale,
                    $"{(slope ? "slope" : "zenith")} ∂/∂{p.Parameter}{p.Owner}: {p.Derivative} vs {numeric}");
            }
        }
    }
}
