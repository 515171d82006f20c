using NetAdjust.Geodesy;

namespace NetAdjust.Tests.Geodesy;

/// <summary>Scale factor, convergence, line scale factor, arc-to-chord correction and elevation factor
/// (docs/methods.md, "Grid and ground"), derived numerically from a projection, against published series and
/// independent computations.</summary>
public class ProjectionFactorsTests
{
    private const double Deg = Math.PI / 180, Arcsec = Math.PI / 648000;
    private static readonly KruegerTransverseMercator Utm33 = KruegerTransverseMercator.Utm(Ellipsoid.Wgs84, 33);

    [Theory]
    [InlineData(0.0)]
    [InlineData(30.0)]
    [InlineData(47.0)]
    [InlineData(70.0)]
    public void ScaleFactorOnTheCentralMeridianIsK0(double latitude)
    {
        var (e, n) = Utm33.Forward(latitude * Deg, 15 * Deg);
        // UTM: k0 = 0.9996 on the central meridian (Snyder 1987, USGS Professional Paper 1395, §8)
        Assert.Equal(0.9996, ProjectionFactors.PointScaleFactor(Utm33, e, n), 10);
        Assert.Equal(0.0, ProjectionFactors.Convergence(Utm33, e, n), 10);
    }

    /// <summary>Snyder's series for the ellipsoidal transverse Mercator: k = k0 [1 + (1 + C) A²/2 + (5 − 4T + 42C
    /// + 13C² − 28e′²) A⁴/24 + (61 − 148T + 16T²) A⁶/720], T = tan²φ, C = e′² cos²φ, A = Δλ cos φ (Snyder 1987, USGS
    /// Professional Paper 1395, eq. 8-11, from memory).</summary>
    private static double SnyderScale(Ellipsoid ell, double k0, double phi, double dLambda)
    {
        double ep2 = ell.EccentricitySquared / (1 - ell.EccentricitySquared);
        double t = Math.Pow(Math.Tan(phi), 2), c = ep2 * Math.Pow(Math.Cos(phi), 2), a = dLambda * Math.Cos(phi);
        return k0 * (1 + (1 + c) * a * a / 2 + (5 - 4 * t + 42 * c + 13 * c * c - 28 * ep2) * Math.Pow(a, 4) / 24 +
            (61 - 148 * t + 16 * t * t) * Math.Pow(a, 6) / 720);
    }

    /// <summary>The convergence series γ = Δλ sin φ [1 + (Δλ² cos²φ / 3)(1 + 3η² + 2η⁴) + (Δλ⁴ cos⁴φ / 15)(2 −
    /// tan²φ)], η² = e′² cos²φ (the usual transverse Mercator series, e.g. Thomas 1952, Conformal projections in
    /// geodesy and cartography, US Coast and Geodetic Survey Special Publication 251; from memory).</summary>
    private static double SeriesConvergence(Ellipsoid ell, double phi, double dLambda)
    {
        double ep2 = ell.EccentricitySquared / (1 - ell.EccentricitySquared), c2 = Math.Pow(Math.Cos(phi), 2);
        double eta2 = ep2 * c2, l2 = dLambda * dLambda;
        return dLambda * Math.Sin(phi) * (1 + l2 * c2 / 3 * (1 + 3 * eta2 + 2 * eta2 * eta2) +
            l2 * l2 * c2 * c2 / 15 * (2 - Math.Pow(Math.Tan(phi), 2)));
    }

    [Theory]
    [InlineData(47.0, 1.0)]
    [InlineData(47.0, 3.0)]
    [InlineData(10.0, 2.5)]
    [InlineData(-35.0, -3.0)]
    [InlineData(65.0, 2.0)]
    public void ScaleFactorGrowsAwayFromTheCentralMeridianAsSnydersSeries(double latitude, double offset)
    {
        var (e, n) = Utm33.Forward(latitude * Deg, (15 + offset) * Deg);
        double k = ProjectionFactors.PointScaleFactor(Utm33, e, n);
        Assert.Equal(SnyderScale(Ellipsoid.Wgs84, 0.9996, latitude * Deg, offset * Deg), k, 9);
        Assert.True(k > 0.9996);
    }

    [Theory]
    [InlineData(47.0, 1.557)]
    [InlineData(47.0, -3.0)]
    [InlineData(10.0, 2.5)]
    [InlineData(-35.0, 3.0)]
    public void ConvergenceIsThePublishedSeriesAndPositiveEastOfTheCentralMeridianInTheNorth(double latitude,
        double offset)
    {
        var (e, n) = Utm33.Forward(latitude * Deg, (15 + offset) * Deg);
        double gamma = ProjectionFactors.Convergence(Utm33, e, n);
        Assert.Equal(SeriesConvergence(Ellipsoid.Wgs84, latitude * Deg, offset * Deg), gamma, 8); // < 0.002″
        Assert.Equal(Math.Sign(offset * latitude), Math.Sign(gamma)); // sign convention: docs/glossary.md
    }

    [Fact]
    public void SnydersWorkedExampleIsReproduced()
    {
        // Snyder 1987 (USGS PP 1395), transverse Mercator worked example for the ellipsoid (from memory):
        // Clarke 1866, φ0 = 0, λ0 = 75°W, k0 = 0.9996; φ = 40°30′N, λ = 73°30′W gives x = 127 106.5 m,
        // y = 4 484 124.4 m, k = 0.9997989.
        double a = 6378206.4, b = 6356583.8;
        var clarke = new Ellipsoid("Clarke 1866", a, a / (a - b));
        var tm = new KruegerTransverseMercator(clarke, -75, 0.9996, 0, 0);
        var (x, y) = tm.Forward(40.5 * Deg, -73.5 * Deg);
        Assert.Equal(127106.5, x, 0.1);
        Assert.Equal(4484124.4, y, 0.1);
        Assert.Equal(0.9997989, ProjectionFactors.PointScaleFactor(tm, x, y), 7);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(37.0)]
    [InlineData(90.0)]
    [InlineData(143.0)]
    [InlineData(260.0)]
    public void ArcToChordAndConvergenceTurnTheGeodesicAzimuthIntoTheChordBearing(double azimuthDeg)
    {
        // A 10 km line 118 km east of the central meridian; the geodesic's azimuth from Vincenty's inverse
        // (Survey Review 1975), an independent solution on the ellipsoid: t = α − γ + (t − T).
        double e1 = 618000, n1 = 5209000, d = 10000;
        double e2 = e1 + d * Math.Sin(azimuthDeg * Deg), n2 = n1 + d * Math.Cos(azimuthDeg * Deg);
        var (lat1, lon1) = Utm33.Inverse(e1, n1);
        var (lat2, lon2) = Utm33.Inverse(e2, n2);
        var (_, alpha) = Vincenty.Inverse(Ellipsoid.Wgs84, lat1, lon1, lat2, lon2);
        double gamma = ProjectionFactors.Convergence(Utm33, e1, n1);
        double tMinusT = ProjectionFactors.ArcToChord(Utm33, e1, n1, e2, n2);
        double chord = Math.Atan2(e2 - e1, n2 - n1);
        double miss = Math.IEEERemainder(alpha - gamma + tMinusT - chord, 2 * Math.PI);
        Assert.True(Math.Abs(miss) < 0.01 * Arcsec, $"misses by {miss / Arcsec:F4}″");
        if (Math.Abs(Math.Cos(azimuthDeg * Deg)) > 0.5) // a northward line: the correction is arcseconds
            Assert.True(Math.Abs(tMinusT) > 1 * Arcsec, $"t − T = {tMinusT / Arcsec:F3}″");
    }

    [Theory]
    [InlineData(45.0, 10000.0)]
    [InlineData(300.0, 25000.0)]
    public void LineScaleFactorIsTheGridChordOverTheGeodesic(double azimuthDeg, double d)
    {
        double e1 = 680000, n1 = 5100000;
        double e2 = e1 + d * Math.Sin(azimuthDeg * Deg), n2 = n1 + d * Math.Cos(azimuthDeg * Deg);
        var (lat1, lon1) = Utm33.Inverse(e1, n1);
        var (lat2, lon2) = Utm33.Inverse(e2, n2);
        var (s, _) = Vincenty.Inverse(Ellipsoid.Wgs84, lat1, lon1, lat2, lon2); // Vincenty 1975: independent
        Assert.Equal(d / s, ProjectionFactors.LineScaleFactor(Utm33, e1, n1, e2, n2), 8);
    }

    [Fact]
    public void ElevationFactorIsTheHandWorkedCase()
    {
        // Hand-worked (computed): GRS 80 at φ = 45°, an east-west line (radius ν = a / √(1 − e² sin²φ)
        // = 6 388 838.290 m), mean ellipsoidal height 500 m: R / (R + h) = 0.9999217446.
        var grs = Ellipsoid.Grs80;
        Assert.Equal(6388838.290, grs.RadiusInAzimuth(45 * Deg, 90 * Deg), 3);
        Assert.Equal(0.9999217446, ProjectionFactors.ElevationFactor(grs, 45 * Deg, 90 * Deg, 500), 10);
        // docs/references.md §11: EF = R/(R + h) = 0.99984306 at h = 1000 m with R = 6 371 000 m
        Assert.Equal(0.99984306, 6371000.0 / (6371000 + 1000), 8);
    }

    [Fact]
    public void CombinedFactorOfALineIsTheHandWorkedCase()
    {
        // A 300 m east-west line centred 100 km east of the central meridian of UTM on GRS 80, mean ellipsoidal
        // height 500 m. Hand-worked: k = k0 (1 + x²/(2R²) + x⁴/(24R⁴)), x = 100 km / k0, R = √(Mν) at the line's
        // latitude (common practice); EF = ν/(ν + h); combined = k · EF, about −355 ppm here.
        var tm = KruegerTransverseMercator.Utm(Ellipsoid.Grs80, 33);
        double n = 4985000, e1 = 599850, e2 = 600150;
        var (phi, _) = tm.Inverse(600000, n);
        var grs = Ellipsoid.Grs80;
        double r = grs.GaussianMeanRadius(phi), x = 100000 / 0.9996;
        double k = 0.9996 * (1 + x * x / (2 * r * r) + Math.Pow(x, 4) / (24 * Math.Pow(r, 4)));
        double nu = grs.PrimeVerticalRadius(phi), ef = nu / (nu + 500);
        double line = ProjectionFactors.LineScaleFactor(tm, e1, n, e2, n);
        Assert.Equal(k, line, 8);
        Assert.Equal(k * ef, line * ProjectionFactors.ElevationFactor(grs, phi, Math.PI / 2, 500), 8);
        Assert.InRange(k * ef, 0.99964, 0.99965);
    }
}
