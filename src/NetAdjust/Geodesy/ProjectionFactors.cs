namespace NetAdjust.Geodesy;

/// <summary>
/// The quantities of a conformal projection that reduce observations to the grid, derived from any
/// <see cref="IMapProjection"/> by central differences of its forward mapping (docs/methods.md, "Grid and ground"):
/// <list type="bullet">
/// <item>point scale factor k = |∂(E, N)/∂φ| / M (grid length over ellipsoid length along the meridian);</item>
/// <item>meridian convergence γ = −atan2(∂E/∂φ, ∂N/∂φ): the angle from geodetic north to grid north, clockwise
/// positive, so that grid azimuth = geodetic azimuth − γ (positive east of the central meridian of a transverse
/// Mercator projection in the northern hemisphere);</item>
/// <item>line scale factor by Simpson's rule (k₁ + 4 k_m + k₂) / 6 over the ends and the mid-point;</item>
/// <item>arc-to-chord correction t − T: the grid bearing of the chord minus the grid bearing of the projected
/// geodesic at its start, from the curvature of the geodesic's image, −∂(ln k)/∂n (the image bends towards smaller
/// scale), varying linearly along the line: t − T = d (2 c₁ + c₂) / 6.</item>
/// </list>
/// Steps: 1e-5 rad in latitude (about 64 m) for k and γ, 200 m on the grid for the gradient of ln k; with a
/// projection computed to 1e-9 m this gives k and γ to about 1e-10 and the arc-to-chord correction to better than
/// 0.001″ on lines of a few kilometres (checked against independent series and Vincenty's inverse in the tests).
/// </summary>
public static partial class ProjectionFactors
{
    private const double LatitudeStep = 1e-5;
    private const double GridStep = 200.0;

    /// <summary>The point scale factor k at a grid position (dimensionless).</summary>
    /// <param name="projection">The projection.</param>
    /// <param name="easting">Easting in metres.</param>
    /// <param name="northing">Northing in metres.</param>
    public static double PointScaleFactor(IMapProjection projection, double easting, double northing) =>
        Local(projection, easting, northing).Scale;

    /// <summary>The meridian convergence γ at a grid position in radians (grid azimuth = geodetic azimuth − γ).
    /// </summary>
    /// <param name="projection">The projection.</param>
    /// <param name="easting">Easting in metres.</param>
    /// <param name="northing">Northing in metres.</param>
    internal static double Convergence(IMapProjection projection, double easting, double northing) =>
        Local(projection, easting, northing).Convergence;

    /// <summary>The line scale factor between two grid positions by Simpson's rule, (k₁ + 4 k_m + k₂) / 6.</summary>
    /// <param name="projection">The projection.</param>
    /// <param name="e1">Easting of the first end in metres.</param>
    /// <param name="n1">Northing of the first end in metres.</param>
    /// <param name="e2">Easting of the second end in metres.</param>
    /// <param name="n2">Northing of the second end in metres.</param>
    public static double LineScaleFactor(IMapProjection projection, double e1, double n1, double e2, double n2)
    {
        ArgumentNullException.ThrowIfNull(projection);
        double k1 = PointScaleFactor(projection, e1, n1), k2 = PointScaleFactor(projection, e2, n2);
        double km = PointScaleFactor(projection, (e1 + e2) / 2, (n1 + n2) / 2);
        return (k1 + 4 * km + k2) / 6;
    }

    /// <summary>
    /// The arc-to-chord correction t − T at the first end of a line in radians: add it to a direction or azimuth
    /// of the geodesic observed at the first end to get the grid bearing of the chord.
    /// </summary>
    /// <param name="projection">The projection.</param>
    /// <param name="e1">Easting of the station in metres.</param>
    /// <param name="n1">Northing of the station in metres.</param>
    /// <param name="e2">Easting of the target in metres.</param>
    /// <param name="n2">Northing of the target in metres.</param>
    internal static double ArcToChord(IMapProjection projection, double e1, double n1, double e2, double n2)
    {
        ArgumentNullException.ThrowIfNull(projection);
        double de = e2 - e1, dn = n2 - n1, d = Math.Sqrt(de * de + dn * dn);
        if (d == 0) return 0;
        // r: unit normal to the right of the line; c = dθ/ds = −∇ln k · r (θ clockwise from grid north)
        double re = dn / d, rn = -de / d;
        var (g1e, g1n) = GradientOfLogScale(projection, e1, n1);
        var (g2e, g2n) = GradientOfLogScale(projection, e2, n2);
        double c1 = -(g1e * re + g1n * rn), c2 = -(g2e * re + g2n * rn);
        return d * (2 * c1 + c2) / 6;
    }

    /// <summary>The elevation factor R / (R + h) of a line: R is the radius of the normal section in the line's
    /// azimuth at its latitude, h its mean ellipsoidal height.</summary>
    /// <param name="ellipsoid">The ellipsoid.</param>
    /// <param name="latitude">Geodetic latitude of the line's mid-point in radians.</param>
    /// <param name="azimuth">Azimuth of the line in radians.</param>
    /// <param name="height">Mean ellipsoidal height of the line in metres.</param>
    internal static double ElevationFactor(Ellipsoid ellipsoid, double latitude, double azimuth, double height)
    {
        ArgumentNullException.ThrowIfNull(ellipsoid);
        double r = ellipsoid.RadiusInAzimuth(latitude, azimuth);
        return r / (r + height);
    }

    private static (double Scale, double Convergence) Local(IMapProjection projection, double easting,
        double northing)
    {
        ArgumentNullException.ThrowIfNull(projection);
        var (lat, lon) = projection.Inverse(easting, northing);
        var (eN, nN) = projection.Forward(lat + LatitudeStep, lon);
        var (eS, nS) = projection.Forward(lat - LatitudeStep, lon);
        double dE = (eN - eS) / (2 * LatitudeStep), dN = (nN - nS) / (2 * LatitudeStep);
        double k = Math.Sqrt(dE * dE + dN * dN) / projection.Ellipsoid.MeridianRadius(lat);
        return (k, -Math.Atan2(dE, dN));
    }

    private static (double E, double N) GradientOfLogScale(IMapProjection p, double e, double n) =>
        ((Math.Log(PointScaleFactor(p, e + GridStep, n)) - Math.Log(PointScaleFactor(p, e - GridStep, n)))
            / (2 * GridStep),
         (Math.Log(PointScaleFactor(p, e, n + GridStep)) - Math.Log(PointScaleFactor(p, e, n - GridStep)))
            / (2 * GridStep));
}
