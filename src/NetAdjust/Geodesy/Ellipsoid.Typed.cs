using NetAdjust.Units;

namespace NetAdjust.Geodesy;

/// <summary>The radii of curvature with typed latitudes and azimuths (the SI forms are internal).</summary>
public sealed partial record Ellipsoid
{
    /// <summary>The radius of curvature of the meridian M = a (1 − e²) / (1 − e² sin²φ)^(3/2).</summary>
    /// <param name="latitude">Geodetic latitude φ.</param>
    /// <returns>The radius M.</returns>
    public Length MeridianRadius(Angle latitude) => Length.FromMetres(MeridianRadius(latitude.Radians));

    /// <summary>The radius of curvature in the prime vertical ν = a / (1 − e² sin²φ)^(1/2).</summary>
    /// <param name="latitude">Geodetic latitude φ.</param>
    /// <returns>The radius ν.</returns>
    public Length PrimeVerticalRadius(Angle latitude) => Length.FromMetres(PrimeVerticalRadius(latitude.Radians));

    /// <summary>The radius of curvature of the normal section in azimuth α (Euler):
    /// R_α = M ν / (M sin²α + ν cos²α).</summary>
    /// <param name="latitude">Geodetic latitude φ.</param>
    /// <param name="azimuth">Azimuth α of the section, clockwise from north.</param>
    /// <returns>The radius R_α.</returns>
    public Length RadiusInAzimuth(Angle latitude, Angle azimuth) =>
        Length.FromMetres(RadiusInAzimuth(latitude.Radians, azimuth.Radians));

    /// <summary>The Gaussian mean radius √(M ν).</summary>
    /// <param name="latitude">Geodetic latitude φ.</param>
    /// <returns>The radius √(M ν).</returns>
    public Length GaussianMeanRadius(Angle latitude) => Length.FromMetres(GaussianMeanRadius(latitude.Radians));
}
