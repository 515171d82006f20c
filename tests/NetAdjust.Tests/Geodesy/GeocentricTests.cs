using NetAdjust.Geodesy;
using NetAdjust.Units;

namespace NetAdjust.Tests.Geodesy;

/// <summary>Geodetic ↔ earth-centred conversion, the local east-north-up rotation and the Jacobian of the
/// conversion (docs/methods.md, "Earth-centred frame"; docs/references.md §11 and §16).</summary>
public class GeocentricTests
{
    private const double Deg = Math.PI / 180;

    public static TheoryData<string> Ellipsoids => ["GRS80", "WGS84"];

    private static Ellipsoid Named(string name) => name == "GRS80" ? Ellipsoid.Grs80 : Ellipsoid.Wgs84;

    [Fact]
    public void Grs80HasItsDefiningConstants()
    {
        // Moritz, "Geodetic Reference System 1980", Bull. Géod. 54 (1980), J. Geodesy 74 (2000) 128–133:
        // a = 6 378 137 m, 1/f = 298.257222101; derived b = 6 356 752.3141 m, e² = 0.00669438002290
        // (docs/references.md §11)
        var e = Ellipsoid.Grs80;
        Assert.Equal(6378137.0, e.SemiMajorAxis);
        Assert.Equal(298.257222101, e.InverseFlattening);
        Assert.Equal(6356752.3141, e.SemiMinorAxis, 4);
        Assert.Equal(0.00669438002290, e.EccentricitySquared, 14);
    }

    [Fact]
    public void Wgs84HasItsDefiningConstants()
    {
        // NIMA TR8350.2 (3rd ed., 2000), Department of Defense World Geodetic System 1984, tables 3.1 and 3.3:
        // a = 6 378 137 m, 1/f = 298.257223563; b = 6 356 752.3142 m, e² = 0.00669437999014 (from memory;
        // docs/references.md §16)
        var e = Ellipsoid.Wgs84;
        Assert.Equal(6378137.0, e.SemiMajorAxis);
        Assert.Equal(298.257223563, e.InverseFlattening);
        Assert.Equal(6356752.3142, e.SemiMinorAxis, 4);
        Assert.Equal(0.00669437999014, e.EccentricitySquared, 14);
    }

    [Fact]
    public void WorkedPointOfTheEpsgGuidanceConvertsBothWays()
    {
        // IOGP Publication 373-7-2 (EPSG Guidance Note 7-2), geographic/geocentric conversions (EPSG method 9602),
        // worked example on WGS 84: φ = 53°48′33.820″N, λ = 2°07′46.380″E, h = 73.000 m →
        // X = 3 771 793.968 m, Y = 140 253.342 m, Z = 5 124 304.349 m (from memory; docs/references.md §16)
        var geodetic = new GeodeticPosition(Angle.FromDms(53, 48, 33.820), Angle.FromDms(2, 7, 46.380),
            Length.FromMetres(73.0));
        var xyz = Geocentric.ToGeocentric(Ellipsoid.Wgs84, geodetic);
        Assert.Equal(3771793.968, xyz.X.Metres, 0.001);
        Assert.Equal(140253.342, xyz.Y.Metres, 0.001);
        Assert.Equal(5124304.349, xyz.Z.Metres, 0.001);

        var back = Geocentric.ToGeodetic(Ellipsoid.Wgs84, new GeocentricPosition(Length.FromMetres(3771793.968),
            Length.FromMetres(140253.342), Length.FromMetres(5124304.349)));
        // the printed X, Y, Z are rounded to 1 mm, so the way back agrees to about 1 mm (1 mm ≈ 0.00003″)
        Assert.Equal(geodetic.Latitude.Arcseconds, back.Latitude.Arcseconds, 0.0001);
        Assert.Equal(geodetic.Longitude.Arcseconds, back.Longitude.Arcseconds, 0.0001);
        Assert.Equal(73.0, back.EllipsoidalHeight.Metres, 0.001);
    }

    [Fact]
    public void PointsOnTheAxesAreWhereTheEllipsoidPutsThem()
    {
        // common practice: on the equator at λ = 0, X = a + h; at the north pole, Z = b + h
        var e = Ellipsoid.Grs80;
        var (x, y, z) = Geocentric.ToGeocentric(e, 0, 0, 100);
        Assert.Equal(e.SemiMajorAxis + 100, x, 9);
        Assert.Equal(0, y, 9);
        Assert.Equal(0, z, 9);
        (x, y, z) = Geocentric.ToGeocentric(e, 90 * Deg, 0, 100);
        Assert.Equal(0, Math.Sqrt(x * x + y * y), 6);
        Assert.Equal(e.SemiMinorAxis + 100, z, 6);
        var (lat, lon, h) = Geocentric.ToGeodetic(e, 0, 0, -(e.SemiMinorAxis + 250));
        Assert.Equal(-90 * Deg, lat, 14);
        Assert.Equal(0, lon);
        Assert.Equal(250, h, 6);
    }

    public static TheoryData<string, double, double, double> Grid()
    {
        var data = new TheoryData<string, double, double, double>();
        double[] lats = [-90, -89.99999, -89.9, -75, -45, -10, 0, 0.001, 30, 52.5, 60, 80, 89.9, 89.9999, 90];
        double[] heights = [-500, 0, 1234.5678, 10000];
        foreach (string name in new[] { "GRS80", "WGS84" })
            for (int i = 0; i < lats.Length; i++)
                foreach (double h in heights)
                    data.Add(name, lats[i], -180 + 47.3 * i, h);
        return data;
    }

    [Theory]
    [MemberData(nameof(Grid))]
    public void RoundTripReturnsThePositionToATenthOfAMillimetre(string ellipsoid, double latDeg, double lonDeg,
        double h)
    {
        var e = Named(ellipsoid);
        double lat = latDeg * Deg, lon = lonDeg * Deg;
        var (x, y, z) = Geocentric.ToGeocentric(e, lat, lon, h);
        var (lat2, lon2, h2) = Geocentric.ToGeodetic(e, x, y, z);
        // issue #19: round trip to 0.1 mm; measured along the meridian, the parallel and the normal
        Assert.True(Math.Abs(lat2 - lat) * (e.MeridianRadius(lat) + h) < 1e-4, $"latitude off by {lat2 - lat} rad");
        double dLon = Angle.ReduceSigned(lon2 - lon);
        Assert.True(Math.Abs(dLon) * (e.PrimeVerticalRadius(lat) + h) * Math.Cos(lat) < 1e-4,
            $"longitude off by {dLon} rad");
        Assert.True(Math.Abs(h2 - h) < 1e-4, $"height off by {h2 - h} m");
        // and the way back lands on the same X, Y, Z
        var (x2, y2, z2) = Geocentric.ToGeocentric(e, lat2, lon2, h2);
        Assert.True(Math.Sqrt(Sq(x2 - x) + Sq(y2 - y) + Sq(z2 - z)) < 1e-4);
    }

    [Theory]
    [MemberData(nameof(Grid))]
    public void InverseAgreesWithVermeillesClosedFormToAHundredthOfAMillimetre(string ellipsoid, double latDeg,
        double lonDeg, double h)
    {
        var e = Named(ellipsoid);
        var (x, y, z) = Geocentric.ToGeocentric(e, latDeg * Deg, lonDeg * Deg, h);
        var (lat, lon, hh) = Geocentric.ToGeodetic(e, x, y, z);
        var (vLat, vLon, vH) = Vermeille(e, x, y, z);
        // Vermeille 2002, "Direct transformation from geocentric coordinates to geodetic coordinates",
        // J. Geodesy 76, 451–454 (closed form, written below); contract: ToGeodetic to < 0.01 mm
        Assert.True(Math.Abs(lat - vLat) * e.SemiMajorAxis < 1e-5, $"latitude differs by {lat - vLat} rad");
        Assert.True(Math.Abs(Angle.ReduceSigned(lon - vLon)) * Math.Sqrt(x * x + y * y) < 1e-5);
        Assert.True(Math.Abs(hh - vH) < 1e-5, $"height differs by {hh - vH} m");
    }

    [Theory]
    [MemberData(nameof(Ellipsoids))]
    public void PublicConversionsCarryTheirUnits(string ellipsoid)
    {
        var e = Named(ellipsoid);
        var p = new GeodeticPosition(Angle.FromDegrees(47.25), Angle.FromDegrees(-122.5), Length.FromMetres(312.5));
        var xyz = Geocentric.ToGeocentric(e, p);
        var (x, y, z) = Geocentric.ToGeocentric(e, 47.25 * Deg, -122.5 * Deg, 312.5);
        Assert.Equal(x, xyz.X.Metres);
        Assert.Equal(y, xyz.Y.Metres);
        Assert.Equal(z, xyz.Z.Metres);
        var back = Geocentric.ToGeodetic(e, xyz);
        Assert.Equal(47.25, back.Latitude.Degrees, 10);
        Assert.Equal(-122.5, back.Longitude.Degrees, 10);
        Assert.Equal(312.5, back.EllipsoidalHeight.Metres, 6);
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(52.3, 13.4)]
    [InlineData(-33.9, 151.2)]
    [InlineData(89.5, -100.0)]
    [InlineData(-71.0, -170.0)]
    public void LocalRotationIsOrthonormalAndRightHanded(double latDeg, double lonDeg)
    {
        double[] r = Geocentric.LocalRotation(latDeg * Deg, lonDeg * Deg);
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
            {
                double dot = r[3 * i] * r[3 * j] + r[3 * i + 1] * r[3 * j + 1] + r[3 * i + 2] * r[3 * j + 2];
                Assert.Equal(i == j ? 1.0 : 0.0, dot, 14);
            }
        // east × north = up (a right-handed local frame, common practice)
        double[] cross =
        [
            r[1] * r[5] - r[2] * r[4],
            r[2] * r[3] - r[0] * r[5],
            r[0] * r[4] - r[1] * r[3],
        ];
        for (int k = 0; k < 3; k++) Assert.Equal(r[6 + k], cross[k], 14);
    }

    [Fact]
    public void LocalRotationAtTheOriginPointsAlongTheAxes()
    {
        // common practice: at φ = 0, λ = 0 east is +Y, north is +Z, up is +X
        double[] r = Geocentric.LocalRotation(0, 0);
        Assert.Equal([0, 1, 0, 0, 0, 1, 1, 0, 0], r.Select(v => Math.Round(v, 14) + 0.0).ToArray());
    }

    [Theory]
    [InlineData("GRS80", 52.3, 13.4, 120.0)]
    [InlineData("WGS84", -33.9, 151.2, 2500.0)]
    [InlineData("GRS80", 85.0, -45.0, 0.0)]
    public void LocalRotationRowsFollowTheGeometryOfTheEllipsoid(string ellipsoid, double latDeg, double lonDeg,
        double h)
    {
        var e = Named(ellipsoid);
        double lat = latDeg * Deg, lon = lonDeg * Deg;
        double[] r = Geocentric.LocalRotation(lat, lon);
        var (x, y, z) = Geocentric.ToGeocentric(e, lat, lon, 0);
        // up: the outward normal of the ellipsoid, the gradient of x²/a² + y²/a² + z²/b² (common practice)
        double a2 = e.SemiMajorAxis * e.SemiMajorAxis, b2 = e.SemiMinorAxis * e.SemiMinorAxis;
        AssertUnitAlong(r, 2, [x / a2, y / a2, z / b2]);
        // east: along the parallel, perpendicular to the meridian plane and to the polar axis (common practice)
        AssertUnitAlong(r, 0, [-y, x, 0]);
        // north: a step north moves the point along the meridian (central difference of the position; its chord is
        // the tangent to about step² = 1e-10 and rounding adds about 1e-10)
        var (xn, yn, zn) = Geocentric.ToGeocentric(e, lat + 1e-5, lon, h);
        var (xs, ys, zs) = Geocentric.ToGeocentric(e, lat - 1e-5, lon, h);
        AssertUnitAlong(r, 1, [xn - xs, yn - ys, zn - zs]);
    }

    [Theory]
    [InlineData("GRS80", 52.3, 13.4, 120.0)]
    [InlineData("WGS84", -33.9, 151.2, 2500.0)]
    [InlineData("GRS80", 0.0, 0.0, -400.0)]
    [InlineData("WGS84", 88.0, 179.0, 9000.0)]
    public void GeodeticJacobianMatchesCentralDifferences(string ellipsoid, double latDeg, double lonDeg, double h)
    {
        var e = Named(ellipsoid);
        double lat = latDeg * Deg, lon = lonDeg * Deg;
        double[] j = Geocentric.GeodeticJacobian(e, lat, lon, h);
        double[] steps = [1e-6, 1e-6, 1.0];
        for (int c = 0; c < 3; c++)
        {
            double[] plus = [lat, lon, h], minus = [lat, lon, h];
            plus[c] += steps[c];
            minus[c] -= steps[c];
            var p = Geocentric.ToGeocentric(e, plus[0], plus[1], plus[2]);
            var m = Geocentric.ToGeocentric(e, minus[0], minus[1], minus[2]);
            double[] diff = [(p.X - m.X) / (2 * steps[c]), (p.Y - m.Y) / (2 * steps[c]), (p.Z - m.Z) / (2 * steps[c])];
            for (int row = 0; row < 3; row++)
            {
                // central differences: truncation ~ a step²/6 ≈ 1e-6, rounding ≈ 1e-3 (m/rad); allow 1e-8 relative
                double scale = c == 2 ? 1 : e.SemiMajorAxis;
                Assert.True(Math.Abs(j[3 * row + c] - diff[row]) < 1e-8 * scale,
                    $"J[{row},{c}] = {j[3 * row + c]}, difference quotient {diff[row]}");
            }
        }
    }

    private static void AssertUnitAlong(double[] r, int row, double[] direction)
    {
        double n = Math.Sqrt(direction.Sum(d => d * d));
        for (int k = 0; k < 3; k++) Assert.Equal(direction[k] / n, r[3 * row + k], 9);
    }

    private static double Sq(double v) => v * v;

    /// <summary>Vermeille's closed form (H. Vermeille, J. Geodesy 76 (2002) 451–454, eqs. as in its algorithm
    /// section, from memory), independent of the iteration in the library. Valid outside a small region near the
    /// earth's centre.</summary>
    private static (double Lat, double Lon, double H) Vermeille(Ellipsoid ell, double x, double y, double z)
    {
        double a = ell.SemiMajorAxis, e2 = ell.EccentricitySquared, e4 = e2 * e2;
        double p = (x * x + y * y) / (a * a), q = (1 - e2) * z * z / (a * a), r = (p + q - e4) / 6;
        double s = e4 * p * q / (4 * r * r * r);
        double t = Math.Cbrt(1 + s + Math.Sqrt(s * (2 + s)));
        double u = r * (1 + t + 1 / t);
        double v = Math.Sqrt(u * u + e4 * q);
        double w = e2 * (u + v - q) / (2 * v);
        double k = Math.Sqrt(u + v + w * w) - w;
        double d = k * Math.Sqrt(x * x + y * y) / (k + e2);
        double lat = 2 * Math.Atan2(z, d + Math.Sqrt(d * d + z * z));
        double h = (k + e2 - 1) / k * Math.Sqrt(d * d + z * z);
        double lon = 2 * Math.Atan2(y, Math.Sqrt(x * x + y * y) + x);
        return (lat, lon, h);
    }
}
