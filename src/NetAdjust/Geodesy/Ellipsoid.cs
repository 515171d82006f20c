namespace NetAdjust.Geodesy;

/// <summary>
/// A reference ellipsoid of revolution given by its semi-major axis and inverse flattening, with the radii of
/// curvature the reductions need (docs/methods.md, "Grid and ground"). Immutable.
/// </summary>
/// <param name="Name">The ellipsoid's name, e.g. <c>GRS 1980</c>.</param>
/// <param name="SemiMajorAxis">a in metres (positive).</param>
/// <param name="InverseFlattening">1/f (greater than 1).</param>
public sealed partial record Ellipsoid(string Name, double SemiMajorAxis, double InverseFlattening)
{
    /// <summary>GRS 80: a = 6 378 137 m, 1/f = 298.257222101 (Moritz 1980; docs/references.md §11). The ellipsoid of
    /// ETRS89 and NAD83.</summary>
    public static Ellipsoid Grs80 { get; } = new("GRS 1980", 6378137.0, 298.257222101);

    /// <summary>WGS 84: a = 6 378 137 m, 1/f = 298.257223563 (NIMA TR8350.2, from memory).</summary>
    public static Ellipsoid Wgs84 { get; } = new("WGS 84", 6378137.0, 298.257223563);

    /// <summary>Airy 1830: a = 6 377 563.396 m, 1/f = 299.3249646 (Ordnance Survey, A guide to coordinate systems
    /// in Great Britain; from memory). The ellipsoid of OSGB36.</summary>
    public static Ellipsoid Airy1830 { get; } = new("Airy 1830", 6377563.396, 299.3249646);

    /// <summary>The flattening f = 1 / (1/f).</summary>
    public double Flattening => 1.0 / InverseFlattening;

    /// <summary>The semi-minor axis b = a (1 − f) in metres.</summary>
    public double SemiMinorAxis => SemiMajorAxis * (1.0 - Flattening);

    /// <summary>The first eccentricity squared e² = f (2 − f).</summary>
    public double EccentricitySquared => Flattening * (2.0 - Flattening);

    /// <summary>The radius of curvature of the meridian M = a (1 − e²) / (1 − e² sin²φ)^(3/2), in metres.</summary>
    /// <param name="latitude">Geodetic latitude φ in radians.</param>
    internal double MeridianRadius(double latitude)
    {
        double e2 = EccentricitySquared, s = Math.Sin(latitude);
        return SemiMajorAxis * (1 - e2) / Math.Pow(1 - e2 * s * s, 1.5);
    }

    /// <summary>The radius of curvature in the prime vertical ν = a / (1 − e² sin²φ)^(1/2), in metres.</summary>
    /// <param name="latitude">Geodetic latitude φ in radians.</param>
    internal double PrimeVerticalRadius(double latitude)
    {
        double e2 = EccentricitySquared, s = Math.Sin(latitude);
        return SemiMajorAxis / Math.Sqrt(1 - e2 * s * s);
    }

    /// <summary>The radius of curvature of the normal section in azimuth α (Euler):
    /// R_α = M ν / (M sin²α + ν cos²α), in metres.</summary>
    /// <param name="latitude">Geodetic latitude φ in radians.</param>
    /// <param name="azimuth">Azimuth α of the section in radians, clockwise from north.</param>
    internal double RadiusInAzimuth(double latitude, double azimuth)
    {
        double m = MeridianRadius(latitude), nu = PrimeVerticalRadius(latitude);
        double s = Math.Sin(azimuth), c = Math.Cos(azimuth);
        return m * nu / (m * s * s + nu * c * c);
    }

    /// <summary>The Gaussian mean radius √(M ν) in metres.</summary>
    /// <param name="latitude">Geodetic latitude φ in radians.</param>
    internal double GaussianMeanRadius(double latitude) => Math.Sqrt(MeridianRadius(latitude) *
        PrimeVerticalRadius(latitude));
}
