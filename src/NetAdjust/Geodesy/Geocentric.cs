using NetAdjust.Units;

namespace NetAdjust.Geodesy;

/// <summary>
/// Conversions between geodetic (φ, λ, h) and earth-centred Cartesian (X, Y, Z) positions on an ellipsoid, the
/// rotation to the local east, north, up frame and the Jacobian of the conversion (docs/methods.md, "Earth-centred
/// frame"). Forward: X = (ν + h) cos φ cos λ, Y = (ν + h) cos φ sin λ, Z = (ν (1 − e²) + h) sin φ. Inverse:
/// Bowring's iteration on the parametric latitude (Bowring 1976, Survey Review 23 (181), 323–327), iterated to
/// convergence, so exact to well under 0.01 mm at any latitude and height near the earth.
/// </summary>
public static class Geocentric
{
    /// <summary>Geodetic to earth-centred Cartesian.</summary>
    /// <param name="ellipsoid">The ellipsoid of the geodetic position.</param>
    /// <param name="position">Latitude, longitude and ellipsoidal height.</param>
    /// <returns>X, Y, Z.</returns>
    public static GeocentricPosition ToGeocentric(Ellipsoid ellipsoid, GeodeticPosition position)
    {
        ArgumentNullException.ThrowIfNull(ellipsoid);
        var (x, y, z) = ToGeocentric(ellipsoid, position.Latitude.Radians, position.Longitude.Radians,
            position.EllipsoidalHeight.Metres);
        return new GeocentricPosition(Length.FromMetres(x), Length.FromMetres(y), Length.FromMetres(z));
    }

    /// <summary>Earth-centred Cartesian to geodetic, to well under 0.01 mm for points near the earth's surface
    /// (heights from a few hundred kilometres below to far above it).</summary>
    /// <param name="ellipsoid">The ellipsoid of the geodetic position.</param>
    /// <param name="position">X, Y, Z.</param>
    /// <returns>Latitude (−90° to 90°), longitude (−180° to 180°) and ellipsoidal height.</returns>
    public static GeodeticPosition ToGeodetic(Ellipsoid ellipsoid, GeocentricPosition position)
    {
        ArgumentNullException.ThrowIfNull(ellipsoid);
        var (lat, lon, h) = ToGeodetic(ellipsoid, position.X.Metres, position.Y.Metres, position.Z.Metres);
        return new GeodeticPosition(Angle.FromRadians(lat), Angle.FromRadians(lon), Length.FromMetres(h));
    }

    /// <summary>Geodetic (radians, metres) to earth-centred Cartesian (metres).</summary>
    internal static (double X, double Y, double Z) ToGeocentric(Ellipsoid e, double lat, double lon, double h)
    {
        double e2 = e.EccentricitySquared;
        double sinLat = Math.Sin(lat), cosLat = Math.Cos(lat);
        double nu = e.SemiMajorAxis / Math.Sqrt(1 - e2 * sinLat * sinLat);
        return ((nu + h) * cosLat * Math.Cos(lon), (nu + h) * cosLat * Math.Sin(lon), (nu * (1 - e2) + h) * sinLat);
    }

    /// <summary>Earth-centred Cartesian (metres) to geodetic (radians, metres).</summary>
    internal static (double Lat, double Lon, double H) ToGeodetic(Ellipsoid e, double x, double y, double z)
    {
        double a = e.SemiMajorAxis, b = e.SemiMinorAxis, e2 = e.EccentricitySquared;
        double ep2 = e2 / (1 - e2);
        double p = Math.Sqrt(x * x + y * y);
        double lon = p == 0 ? 0 : Math.Atan2(y, x);
        // Bowring 1976: start from the parametric latitude of the point's direction, then iterate
        // tan φ = (z + e′² b sin³u) / (p − e² a cos³u), tan u = (1 − f) tan φ, until φ no longer changes.
        double lat = Math.Atan2(z, p * (1 - e2));
        for (int i = 0; i < 10; i++)
        {
            double u = Math.Atan2((1 - e.Flattening) * Math.Sin(lat), Math.Cos(lat));
            double su = Math.Sin(u), cu = Math.Cos(u);
            double next = Math.Atan2(z + ep2 * b * su * su * su, p - e2 * a * cu * cu * cu);
            bool done = Math.Abs(next - lat) < 1e-15;
            lat = next;
            if (done) break;
        }
        double sinLat = Math.Sin(lat), cosLat = Math.Cos(lat);
        // h = p cos φ + z sin φ − a √(1 − e² sin²φ): stable at the equator and at the poles alike.
        double h = p * cosLat + z * sinLat - a * Math.Sqrt(1 - e2 * sinLat * sinLat);
        return (lat, lon, h);
    }

    /// <summary>The rotation R from earth-centred differences to the local frame at (lat, lon): row-major 3×3, its
    /// rows the local east, north and up unit vectors in the earth-centred frame, so [dE, dN, dU] = R · [dX, dY, dZ].
    /// </summary>
    internal static double[] LocalRotation(double lat, double lon)
    {
        double sf = Math.Sin(lat), cf = Math.Cos(lat), sl = Math.Sin(lon), cl = Math.Cos(lon);
        return
        [
            -sl, cl, 0,
            -sf * cl, -sf * sl, cf,
            cf * cl, cf * sl, sf,
        ];
    }

    /// <summary>The Jacobian J = ∂(X, Y, Z)/∂(lat, lon, h), row-major 3×3 (rows X, Y, Z; columns φ in radians,
    /// λ in radians, h in metres): with M and ν the meridian and prime-vertical radii,
    /// ∂/∂φ = (M + h)·north, ∂/∂λ = (ν + h) cos φ·east, ∂/∂h = up.</summary>
    internal static double[] GeodeticJacobian(Ellipsoid e, double lat, double lon, double h)
    {
        double sf = Math.Sin(lat), cf = Math.Cos(lat), sl = Math.Sin(lon), cl = Math.Cos(lon);
        double m = e.MeridianRadius(lat) + h, n = (e.PrimeVerticalRadius(lat) + h) * cf;
        return
        [
            -m * sf * cl, -n * sl, cf * cl,
            -m * sf * sl, n * cl, cf * sl,
            m * cf, 0, sf,
        ];
    }
}
