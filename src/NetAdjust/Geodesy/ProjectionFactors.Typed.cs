using NetAdjust.Units;

namespace NetAdjust.Geodesy;

/// <summary>The angular factors with typed angles and grid positions (the SI forms are internal).</summary>
public static partial class ProjectionFactors
{
    /// <summary>The meridian convergence γ at a grid position (grid azimuth = geodetic azimuth − γ).</summary>
    /// <param name="projection">The projection.</param>
    /// <param name="easting">Easting.</param>
    /// <param name="northing">Northing.</param>
    /// <returns>The convergence γ.</returns>
    public static Angle Convergence(IMapProjection projection, Length easting, Length northing) =>
        Angle.FromRadians(Convergence(projection, easting.Metres, northing.Metres));

    /// <summary>
    /// The arc-to-chord correction t − T at the first end of a line: add it to a direction or azimuth of the
    /// geodesic observed at the first end to get the grid bearing of the chord.
    /// </summary>
    /// <param name="projection">The projection.</param>
    /// <param name="e1">Easting of the station.</param>
    /// <param name="n1">Northing of the station.</param>
    /// <param name="e2">Easting of the target.</param>
    /// <param name="n2">Northing of the target.</param>
    /// <returns>The correction t − T.</returns>
    public static Angle ArcToChord(IMapProjection projection, Length e1, Length n1, Length e2, Length n2) =>
        Angle.FromRadians(ArcToChord(projection, e1.Metres, n1.Metres, e2.Metres, n2.Metres));

    /// <summary>The elevation factor R / (R + h) of a line: R is the radius of the normal section in the line's
    /// azimuth at its latitude, h its mean ellipsoidal height.</summary>
    /// <param name="ellipsoid">The ellipsoid.</param>
    /// <param name="latitude">Geodetic latitude of the line's mid-point.</param>
    /// <param name="azimuth">Azimuth of the line.</param>
    /// <param name="height">Mean ellipsoidal height of the line.</param>
    /// <returns>The factor (dimensionless).</returns>
    public static double ElevationFactor(Ellipsoid ellipsoid, Angle latitude, Angle azimuth, Length height) =>
        ElevationFactor(ellipsoid, latitude.Radians, azimuth.Radians, height.Metres);
}
