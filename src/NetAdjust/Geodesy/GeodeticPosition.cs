using NetAdjust.Units;

namespace NetAdjust.Geodesy;

/// <summary>A position by geodetic latitude, longitude (east positive) and height above the ellipsoid. Immutable.
/// </summary>
/// <param name="Latitude">Geodetic latitude φ.</param>
/// <param name="Longitude">Geodetic longitude λ, east positive.</param>
/// <param name="EllipsoidalHeight">Height h above the ellipsoid along its normal.</param>
public readonly record struct GeodeticPosition(Angle Latitude, Angle Longitude, Length EllipsoidalHeight);
