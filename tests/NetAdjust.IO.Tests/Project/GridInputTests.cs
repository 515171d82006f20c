using NetAdjust.Geodesy;
using NetAdjust.IO.Project;
using NetAdjust.Tests.Geodesy;

namespace NetAdjust.IO.Tests.Project;

/// <summary>The <c>crs</c> and <c>grid</c> keys (docs/input-format.md, "Grid and ground") and the ProjNET
/// projection behind them.</summary>
public class GridInputTests
{
    private const double Deg = Math.PI / 180;

    private static SurveyProject Parse(string head, string points =
        "  - {id: A, e: 618000, n: 5209000, h: 450, fix: en}\n  - {id: B, e: 618500, n: 5209300, h: 460}\n",
        string setups = "setups:\n  - at: A\n    distances:\n      - {to: B, value: 583.0, sd: 0.002}\n") =>
        ProjectReader.Parse("project: t\n" + head + "points:\n" + points + setups, "t.yaml", "/nonexistent",
            _ => throw new FileNotFoundException());

    private static ProjectFileException Refused(string head, string? points = null)
    {
        var e = points is null
            ? Assert.Throws<ProjectFileException>(() => Parse(head))
            : Assert.Throws<ProjectFileException>(() => Parse(head, points));
        Assert.Equal("t.yaml", e.File);
        Assert.True(e.Line > 0, e.Message);
        return e;
    }

    [Theory]
    [InlineData("EPSG:32633", 15.0, 0.0, "WGS 84 / UTM zone 33N")]
    [InlineData("EPSG:32733", 15.0, 10000000.0, "WGS 84 / UTM zone 33S")]
    [InlineData("EPSG:25832", 9.0, 0.0, "ETRS89 / UTM zone 32N")]
    [InlineData("EPSG:26917", -81.0, 0.0, "NAD83 / UTM zone 17N")]
    [InlineData("EPSG:32601", -177.0, 0.0, "WGS 84 / UTM zone 1N")]
    public void AnEpsgUtmCodeGivesItsZonesProjection(string code, double centralMeridian, double falseNorthing,
        string name)
    {
        var p = Parse($"crs: {code}\ngrid: {{distances: grid}}\n").Grid!.Projection!;
        Assert.Contains(name, p.Name);
        // UTM: central meridian 6·zone − 183°, k0 0.9996, false easting 500 km (Snyder 1987, USGS PP 1395, §8)
        var (e, n) = p.Forward(0, centralMeridian * Deg);
        Assert.Equal(500000, e, 1e-6);
        Assert.Equal(falseNorthing, n, 1e-6);
        Assert.Equal(0.9996, ProjectionFactors.PointScaleFactor(p, 500000, falseNorthing + 1000), 9);
        var ellipsoid = code.StartsWith("EPSG:326", StringComparison.Ordinal) ||
            code.StartsWith("EPSG:327", StringComparison.Ordinal) ? Ellipsoid.Wgs84 : Ellipsoid.Grs80;
        Assert.Equal(ellipsoid.InverseFlattening, p.Ellipsoid.InverseFlattening, 9);
    }

    [Fact]
    public void TheBritishNationalGridIsResolved()
    {
        var p = Parse("crs: EPSG:27700\ngrid: {distances: grid}\n").Grid!.Projection!;
        // Ordnance Survey, A guide to coordinate systems in Great Britain (from memory): true origin 49°N 2°W maps
        // to 400 000 m E, −100 000 m N, scale 0.9996012717 there.
        var (e, n) = p.Forward(49 * Deg, -2 * Deg);
        Assert.Equal(400000, e, 1e-6);
        Assert.Equal(-100000, n, 1e-6);
        Assert.Equal(0.9996012717, ProjectionFactors.PointScaleFactor(p, e, n), 9);
    }

    [Theory]
    [InlineData(32633)]
    [InlineData(25832)]
    [InlineData(26911)]
    public void ProjNetAgreesWithAnIndependentSeriesAndRoundTripsToAMillimetreOverAZone(int code)
    {
        var p = Parse($"crs: EPSG:{code}\ngrid: {{distances: grid}}\n").Grid!.Projection!;
        int zone = code % 100;
        var series = KruegerTransverseMercator.Utm(p.Ellipsoid, zone);
        double cm = 6 * zone - 183, worst = 0, worstTrip = 0;
        for (double lat = 0; lat <= 80; lat += 5)
            for (double dl = -3; dl <= 3; dl += 0.5)
            {
                var (e, n) = p.Forward(lat * Deg, (cm + dl) * Deg);
                var (es, ns) = series.Forward(lat * Deg, (cm + dl) * Deg);
                worst = Math.Max(worst, Math.Max(Math.Abs(e - es), Math.Abs(n - ns)));
                var (lat2, lon2) = p.Inverse(e, n);
                var (e2, n2) = p.Forward(lat2, lon2);
                worstTrip = Math.Max(worstTrip, Math.Max(Math.Abs(e2 - e), Math.Abs(n2 - n)));
                // the inverse against the independent series, in metres on the ground
                var (lat3, lon3) = series.Inverse(e, n);
                Assert.True(Math.Abs(lat3 - lat2) * 6.4e6 < 0.001 &&
                    Math.Abs(lon3 - lon2) * 6.4e6 * Math.Cos(lat2) < 0.001, $"inverse at {lat}°, {dl}°");
            }
        // Krüger's series (Karney 2011, J. Geodesy 85) as the independent implementation: within 1 mm over the zone
        Assert.True(worst < 0.001, $"ProjNET differs from the series by {worst * 1000:F3} mm");
        Assert.True(worstTrip < 0.001, $"round trip misses by {worstTrip * 1000:F3} mm");
    }

    [Fact]
    public void SnydersWorkedExampleThroughWkt()
    {
        // Snyder 1987 (USGS PP 1395), transverse Mercator example (from memory): Clarke 1866, λ0 = 75°W, k0 = 0.9996,
        // φ = 40°30′N, λ = 73°30′W gives x = 127 106.5 m, y = 4 484 124.4 m, k = 0.9997989.
        const string wkt = "PROJCS[\"Snyder example\",GEOGCS[\"Clarke 1866\",DATUM[\"x\",SPHEROID[\"Clarke 1866\"," +
            "6378206.4,294.978698213898]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]]," +
            "PROJECTION[\"Transverse_Mercator\"],PARAMETER[\"latitude_of_origin\",0]," +
            "PARAMETER[\"central_meridian\",-75],PARAMETER[\"scale_factor\",0.9996],PARAMETER[\"false_easting\",0]," +
            "PARAMETER[\"false_northing\",0],UNIT[\"metre\",1]]";
        var p = Parse($"crs: '{wkt}'\ngrid: {{distances: grid}}\n").Grid!.Projection!;
        var (x, y) = p.Forward(40.5 * Deg, -73.5 * Deg);
        Assert.Equal(127106.5, x, 0.1);
        Assert.Equal(4484124.4, y, 0.1);
        Assert.Equal(0.9997989, ProjectionFactors.PointScaleFactor(p, x, y), 7);
    }

    [Fact]
    public void AProjectWithoutAGridSectionKeepsItsObservations()
    {
        var p = Parse("crs: EPSG:32633\n");
        Assert.Null(p.Grid);
        Assert.Equal("EPSG:32633", p.Crs);
    }

    [Fact]
    public void TheGridSectionIsRead()
    {
        var g = Parse("crs: EPSG:32633\ngrid:\n  distances: ground\n  azimuths: geodetic\n  geoid_separation: 47.3\n" +
            "  geoid_separations: {B: 47.5}\n  mean_height: 455\n  mean_height_sd: 5\n").Grid!;
        Assert.Equal(DistanceBasis.Ground, g.Distances);
        Assert.Equal(AzimuthBasis.Geodetic, g.Azimuths);
        Assert.Equal(450 + 47.3, g.EllipsoidalHeight("A", 450)!.Value, 9);
        Assert.Equal(455 + 47.5, g.EllipsoidalHeight("B", null)!.Value, 9);
        Assert.Equal(5, g.MeanHeightSd);
    }

    [Theory]
    [InlineData("crs: EPSG:4326\ngrid: {distances: grid}\n", "not a code NetAdjust can resolve")]
    [InlineData("crs: EPSG:32661\n", "not a code NetAdjust can resolve")]
    [InlineData("crs: 'GEOGCS[\"WGS 84\"]'\n", "WKT version 1")]
    [InlineData("crs: 'PROJCS[\"broken\"'\n", "cannot be read")]
    [InlineData("crs: EPSG:32633\ngrid: {azimuths: grid}\n", "grid.distances")]
    [InlineData("crs: EPSG:32633\ngrid: {distances: measured}\n", "ground")]
    [InlineData("crs: EPSG:32633\ngrid: {distances: ground, scale: 0.9999}\n", "contradict")]
    [InlineData("grid: {distances: ground, azimuths: geodetic}\n", "convergence")]
    [InlineData("grid: {distances: ground, geoid_separation: 40}\n", "only with a projection")]
    [InlineData("grid: {distances: ground, scale: 1.5}\n", "near 1")]
    [InlineData("crs: EPSG:32633\ngrid: {distances: ground, mean_height_sd: 3}\n", "without grid.mean_height")]
    [InlineData("crs: EPSG:32633\ngrid: {distances: ground, geoid_separations: {Z: 40}}\n", "'Z'")]
    [InlineData("crs: EPSG:32633\ngrid: {distances: ground, ground: yes}\n", "unknown key")]
    public void ABadGridDeclarationNamesFileLineAndItem(string head, string problem)
    {
        var e = Refused(head);
        Assert.Contains(problem, e.Message);
    }

    [Fact]
    public void GroundDistancesOnAProjectionNeedEveryHeight()
    {
        const string head = "crs: EPSG:32633\ngrid: {distances: ground}\n";
        const string points =
            "  - {id: A, e: 618000, n: 5209000, h: 450, fix: en}\n  - {id: B, e: 618500, n: 5209300}\n";
        var e = Refused(head, points);
        Assert.Equal(6, e.Line); // the line of point B
        Assert.Contains("point B", e.Message);
        Assert.Contains("mean_height", e.Message);
        // with a mean height the project is accepted; with grid distances no height is needed
        Assert.NotNull(Parse(head.Replace("ground}", "ground, mean_height: 450}"), points).Grid);
        Assert.NotNull(Parse(head.Replace("ground", "grid"), points).Grid);
    }
}
