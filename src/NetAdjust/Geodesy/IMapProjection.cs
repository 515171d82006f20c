namespace NetAdjust.Geodesy;

/// <summary>
/// A conformal map projection of an ellipsoid to the grid: the one seam between the core and the library that does
/// the projection mathematics (NetAdjust.IO wraps ProjNET behind it; tests use their own series). The point scale
/// factor, the meridian convergence and the arc-to-chord correction are derived from it by
/// <see cref="ProjectionFactors"/>, so any conformal projection serves.
/// </summary>
public interface IMapProjection
{
    /// <summary>What the reports call the system, e.g. <c>EPSG:32633 (WGS 84 / UTM zone 33N)</c>.</summary>
    string Name { get; }

    /// <summary>The ellipsoid the projection maps.</summary>
    Ellipsoid Ellipsoid { get; }

    /// <summary>Geodetic to grid.</summary>
    /// <param name="latitude">Geodetic latitude in radians.</param>
    /// <param name="longitude">Geodetic longitude in radians, east positive.</param>
    /// <returns>Easting and northing in metres.</returns>
    (double Easting, double Northing) Forward(double latitude, double longitude);

    /// <summary>Grid to geodetic.</summary>
    /// <param name="easting">Easting in metres.</param>
    /// <param name="northing">Northing in metres.</param>
    /// <returns>Geodetic latitude and longitude in radians.</returns>
    (double Latitude, double Longitude) Inverse(double easting, double northing);
}
