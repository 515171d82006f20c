using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Network;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The reference height H0 of the plane coordinates (docs/methods.md, "Spatial model"; docs/input-format.md,
/// <c>adjustment.plane_height</c>): plane distances are horizontal distances at H0, for horizontal distances and for
/// the spatial model of slope distances and zenith angles alike.
/// </summary>
public class PlaneHeightTests
{
    private const double R = Geometry.SpatialGeometry.EarthRadius;
    private const double K = 0.13;
    private const double Hi = 1.55, Ht = 1.70;

    private static SurveyProject Parse(string yaml) =>
        ProjectReader.Parse(yaml, "t.yaml", Path.GetTempPath(), File.ReadAllText);

    private static string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>
    /// The slope distance and zenith angle of a sight over a sphere, by the law of cosines in the plane of the two
    /// radii (exact trigonometry, common practice), written apart from the model's own u, v form: the marks at
    /// heights hA, hB with instrument and target heights Hi, Ht, their central angle γ, and the line of sight
    /// refracted by k·γ/2.
    /// </summary>
    private static (double D, double Z) Sight(double gamma, double hA, double hB)
    {
        double ra = R + hA + Hi, rb = R + hB + Ht;
        // D² = rA² + rB² − 2 rA rB cos γ, written as (rB − rA)² + 4 rA rB sin²(γ/2) to keep its digits.
        double half = Math.Sin(gamma / 2);
        double d = Math.Sqrt(((rb - ra) * (rb - ra)) + (4 * ra * rb * half * half));
        // The angle at the instrument between its vertical (outward radius) and the chord:
        // cos z = (rB cos γ − rA)/D = ((rB − rA) − 2 rB sin²(γ/2))/D.
        double zg = Math.Acos(((rb - ra) - (2 * rb * half * half)) / d);
        return (d, zg - (K * gamma / 2));
    }

    /// <summary>A line A → B of horizontal length s at the plane height, both marks near 300 m, observed with a
    /// horizontal distance, an azimuth, and the slope distance and zenith angle of the same sighting.</summary>
    private static string Project(double s, double hA, double hB, double gamma, string adjustment)
    {
        var (d, z) = Sight(gamma, hA, hB);
        double zDeg = z * 180 / Math.PI;
        return "units: {length: m, angle: deg}\n" + adjustment +
            $"points:\n  - {{id: A, e: 1000, n: 1000, h: {F(hA)}, fix: enh}}\n" +
            $"  - {{id: B, e: {F(1000 + (0.6 * s) + 0.05)}, n: {F(1000 + (0.8 * s) - 0.05)}, h: {F(hB)}}}\n" +
            "setups:\n  - at: A\n    instrument_height: 1.55\n" +
            $"    azimuths:\n      - {{to: B, value: {F(Math.Atan2(0.6, 0.8) * 180 / Math.PI)}, sd: 1}}\n" +
            $"    distances:\n      - {{to: B, value: {F(s)}, sd: 0.002}}\n" +
            $"    zeniths:\n      - {{to: B, value: {F(zDeg)}, sd: 2, target_height: 1.70}}\n" +
            $"    slope_distances:\n      - {{to: B, value: {F(d)}, sd: 0.002, target_height: 1.70}}\n";
    }

    [Fact]
    public void AHorizontalDistanceAndASlopeDistanceOfOneLineAtThreeHundredMetresAgree()
    {
        // A local project at 300 m without a grid: H0 is the mean given height (299.5 + 301.2)/2. The observations
        // are drawn exactly (law of cosines, exact trigonometry) with γ = s/(R + H0), so the horizontal distance s is
        // true at H0 and all residuals vanish. Taking the plane at height 0 (γ = s/R) made the slope distance's
        // horizontal part s·(R + H0)/R, 47 ppm or 14 mm over 300 m longer than the horizontal distance (H0/R: common
        // practice, the elevation factor).
        const double s = 300, hA = 299.5, hB = 301.2, h0 = (hA + hB) / 2;
        var project = Parse(Project(s, hA, hB, s / (R + h0), ""));
        Assert.Equal(h0, project.PlaneHeight, 1e-9);
        var result = Adjuster.Adjust(project.Network, project.Options);
        foreach (var o in result.Observations)
        {
            double tol = o.Input.Kind is ObservationKind.Zenith or ObservationKind.Azimuth ? 1e-8 : 1e-6;
            Assert.True(Math.Abs(o.Residual) < tol, $"{o.Input.Kind} residual {o.Residual}");
        }
    }

    [Fact]
    public void PlaneCoordinatesTakenAtSeaLevelMisfitTheSameLineBy47PartsPerMillion()
    {
        // The defect the reference height removes, measured: the same exact data with the plane stated at height 0.
        // The slope distance then says the line is s·(R + H0)/R long, the horizontal distance s: a misfit of
        // s·H0/R = 14.1 mm over 300 m at H0 = 300.35 m (47 ppm), which the adjustment spreads over the two
        // distances of equal weight (7 mm each, common practice for two equal-weight observations of one quantity).
        const double s = 300, hA = 299.5, hB = 301.2, h0 = (hA + hB) / 2;
        var project = Parse(Project(s, hA, hB, s / (R + h0), "adjustment: {plane_height: 0}\n"));
        Assert.Equal(0.0, project.PlaneHeight);
        var result = Adjuster.Adjust(project.Network, project.Options);
        double misfit = s * h0 / R;
        Assert.Equal(0.0141, misfit, 0.0001);
        var distance = result.Observations.Single(o => o.Input.Kind == ObservationKind.Distance);
        Assert.Equal(misfit / 2, Math.Abs(distance.Residual), 0.001);
    }

    [Fact]
    public void TheHorizontalDistanceAtThePlaneHeightIsTheSeaLevelArcScaledByRPlusH0OverR()
    {
        // Hand-worked (exact trigonometry, common practice): a sight whose sea-level arc is 500 m between marks at
        // 250 m and 262 m. The horizontal distance at H0 = 256 m of the same two verticals is the arc of radius
        // R + H0 of the same central angle, 500·(R + 256)/R = 500.02009 m. Coordinates that far apart with the
        // stated H0 give the observed slope distance and zenith angle exactly; the sea-level plane needs 500 m.
        const double arc0 = 500, hA = 250, hB = 262, h0 = 256;
        double gamma = arc0 / R, atH0 = arc0 * (R + h0) / R;
        Assert.Equal(500.020091, atH0, 1e-6);
        var (d, z) = Sight(gamma, hA, hB);
        Geometry.Sighting At(double planeDistance, double planeHeight) =>
            new("A", new Geometry.PlanePoint(0, 0), hA, Hi, "B", new Geometry.PlanePoint(0, planeDistance), hB, Ht)
            {
                PlaneHeight = planeHeight,
            };
        Assert.Equal(d, Geometry.SpatialGeometry.SlopeDistance(At(atH0, h0)).Value, 1e-9);
        Assert.Equal(z, Geometry.SpatialGeometry.Zenith(At(atH0, h0), K).Value, 1e-12);
        Assert.Equal(d, Geometry.SpatialGeometry.SlopeDistance(At(arc0, 0)).Value, 1e-9);
        Assert.NotEqual(d, Geometry.SpatialGeometry.SlopeDistance(At(atH0, 0)).Value, 1e-4);
    }

    [Fact]
    public void ThePlaneHeightIsTheMeanGivenHeightByDefaultAndReachesEverySlopeDistanceAndZenith()
    {
        // docs/input-format.md: without adjustment.plane_height and grid, H0 is the mean of the given heights
        // (points without h do not count): (100 + 110 + 130)/3.
        var project = Parse("""
            units: {angle: deg}
            points:
              - {id: A, e: 0, n: 0, h: 100, fix: enh}
              - {id: B, e: 300, n: 0, h: 110}
              - {id: C, e: 0, n: 300, h: 130}
              - {id: D, e: 300, n: 300}
            setups:
              - at: A
                instrument_height: 1.5
                zeniths:
                  - {to: B, value: 88.5, sd: 2, target_height: 1.7}
                slope_distances:
                  - {to: B, value: 300.2, sd: 0.002, target_height: 1.7}
            """);
        Assert.Equal(340.0 / 3, project.PlaneHeight, 1e-12);
        Assert.Equal(PlaneHeightBasis.MeanHeight, project.PlaneHeightBasis);
        Assert.All(project.Network.Observations, o => Assert.Equal(340.0 / 3, o switch
        {
            ZenithObservation z => z.PlaneHeight.Metres,
            SlopeDistanceObservation d => d.PlaneHeight.Metres,
            _ => double.NaN,
        }, 1e-12));
    }

    [Fact]
    public void AStatedPlaneHeightIsInTheProjectsLengthUnit()
    {
        var project = Parse("units: {length: ft}\nadjustment: {plane_height: 1000}\n" +
            "points:\n  - {id: A, e: 0, n: 0, h: 10, fix: enh}\n");
        Assert.Equal(304.8, project.PlaneHeight, 1e-9); // 1 international foot = 0.3048 m exactly (common practice)
        Assert.Equal(PlaneHeightBasis.Stated, project.PlaneHeightBasis);
    }

    [Fact]
    public void WithAProjectionThePlaneIsTheEllipsoid()
    {
        // Grid coordinates are ellipsoid distances times the projection's scale (docs/methods.md, "Grid and
        // ground"): the ellipsoid lies at H = −N for orthometric heights H and geoid separation N.
        var project = Parse("crs: EPSG:32633\ngrid: {distances: grid, geoid_separation: 47.3}\n" +
            "points:\n  - {id: A, e: 500000, n: 5500000, h: 300, fix: enh}\n");
        Assert.Equal(-47.3, project.PlaneHeight, 1e-12);
        Assert.Equal(PlaneHeightBasis.Ellipsoid, project.PlaneHeightBasis);
    }

    [Theory]
    [InlineData("high", "is not a number")]
    [InlineData("10000.5", "outside −10 000 … 10 000 m")]
    [InlineData("-12000", "outside −10 000 … 10 000 m")]
    public void ABadPlaneHeightNamesFileLineAndItem(string value, string what)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(
            $"units: {{length: m}}\nadjustment:\n  plane_height: {value}\n" +
            "points:\n  - {id: A, e: 0, n: 0, h: 10, fix: enh}\n"));
        Assert.StartsWith("t.yaml:3: adjustment.plane_height", e.Message);
        Assert.Contains(what, e.Message);
    }
}
