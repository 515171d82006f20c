using NetAdjust.Units;

namespace NetAdjust.Geodesy;

/// <summary>
/// Typed use of an <see cref="IMapProjection"/>. The interface itself takes and gives SI doubles (radians and
/// metres) because it is the seam a projection library is wrapped behind, and such libraries work in plain numbers;
/// callers of a projection use these methods instead.
/// </summary>
public static class MapProjections
{
    /// <summary>Geodetic to grid.</summary>
    /// <param name="projection">The projection.</param>
    /// <param name="latitude">Geodetic latitude.</param>
    /// <param name="longitude">Geodetic longitude, east positive.</param>
    /// <returns>Easting and northing.</returns>
    public static (Length Easting, Length Northing) GridOf(this IMapProjection projection, Angle latitude,
        Angle longitude)
    {
        ArgumentNullException.ThrowIfNull(projection);
        var (e, n) = projection.Forward(latitude.Radians, longitude.Radians);
        return (Length.FromMetres(e), Length.FromMetres(n));
    }

    /// <summary>Grid to geodetic.</summary>
    /// <param name="projection">The projection.</param>
    /// <param name="easting">Easting.</param>
    /// <param name="northing">Northing.</param>
    /// <returns>Geodetic latitude and longitude (east positive).</returns>
    public static (Angle Latitude, Angle Longitude) GeodeticOf(this IMapProjection projection, Length easting,
        Length northing)
    {
        ArgumentNullException.ThrowIfNull(projection);
        var (lat, lon) = projection.Inverse(easting.Metres, northing.Metres);
        return (Angle.FromRadians(lat), Angle.FromRadians(lon));
    }
}
