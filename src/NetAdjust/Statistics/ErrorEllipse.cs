using NetAdjust.Units;

namespace NetAdjust.Statistics;

/// <summary>
/// The error ellipse of a 2×2 covariance matrix of (easting, northing): semi-axes a ≥ b (the square roots of the
/// eigenvalues) and the azimuth of the major axis, clockwise from north, in [0°, 180°). Immutable and made by the
/// library (<see cref="FromCovariance"/>); read it as <see cref="SemiMajorAxis"/>, <see cref="SemiMinorAxis"/>
/// (lengths) and <see cref="MajorAxisAzimuth"/> (an angle).
/// </summary>
/// <remarks>
/// a², b² = (σE² + σN²)/2 ± √(((σN² − σE²)/2)² + σEN²); azimuth θ = ½ atan2(2σEN, σN² − σE²)
/// (Mikhail &amp; Ackermann 1976, error ellipses; see docs/methods.md).
/// </remarks>
public readonly record struct ErrorEllipse
{
    /// <summary>Made by the library (<see cref="FromCovariance"/>, <see cref="Scaled"/>): semi-axes in m, azimuth in
    /// rad clockwise from north in [0, π).</summary>
    internal ErrorEllipse(double A, double B, double Azimuth)
    {
        this.A = A; this.B = B; this.Azimuth = Azimuth;
    }

    /// <summary>Semi-major axis (m), ≥ <see cref="B"/>.</summary>
    internal double A { get; init; }

    /// <summary>Semi-minor axis (m), ≥ 0.</summary>
    internal double B { get; init; }

    /// <summary>Azimuth of the semi-major axis, radians clockwise from north, in [0, π).</summary>
    internal double Azimuth { get; init; }

    /// <summary>The semi-major axis a (≥ <see cref="SemiMinorAxis"/>).</summary>
    public Length SemiMajorAxis => Length.FromMetres(A);

    /// <summary>The semi-minor axis b (≥ 0).</summary>
    public Length SemiMinorAxis => Length.FromMetres(B);

    /// <summary>The azimuth of the semi-major axis, clockwise from north, in [0°, 180°).</summary>
    public Angle MajorAxisAzimuth => Angle.FromRadians(Azimuth);

    /// <summary>The azimuth of the semi-major axis in degrees, in [0, 180), for the writers (units at the edge);
    /// the public, typed view is <see cref="MajorAxisAzimuth"/>.</summary>
    internal double AzimuthDegrees => Azimuth * 180.0 / Math.PI;

    /// <summary>
    /// The azimuth of the semi-major axis in degrees rounded to <paramref name="decimals"/> (midpoints away from zero),
    /// still in [0, 180) after rounding: 179.99996° to four decimals is 0, never 180.
    /// </summary>
    /// <param name="decimals">Decimals kept, 0..15.</param>
    internal double AzimuthDegreesRounded(int decimals)
    {
        double x = Math.Round(AzimuthDegrees, decimals, MidpointRounding.AwayFromZero);
        return x >= 180 ? x - 180 : x;
    }

    /// <summary>Computes the ellipse of a covariance matrix.</summary>
    /// <param name="varE">σE² (m²), ≥ 0.</param>
    /// <param name="varN">σN² (m²), ≥ 0.</param>
    /// <param name="covEN">σEN (m²).</param>
    /// <returns>The ellipse; a round covariance gives azimuth 0.</returns>
    public static ErrorEllipse FromCovariance(double varE, double varN, double covEN)
    {
        double mean = (varE + varN) / 2;
        double half = (varN - varE) / 2;
        double root = Math.Sqrt((half * half) + (covEN * covEN));
        double l1 = mean + root, l2 = Math.Max(0, mean - root);
        double az = root == 0 ? 0 : 0.5 * Math.Atan2(2 * covEN, varN - varE);
        if (az < 0) az += Math.PI;
        if (az >= Math.PI) az -= Math.PI;
        return new ErrorEllipse(Math.Sqrt(Math.Max(0, l1)), Math.Sqrt(l2), az);
    }

    /// <summary>The ellipse with both semi-axes multiplied by k (e.g. the 95% confidence ellipse from the standard
    /// one).</summary>
    /// <param name="k">The scale, positive.</param>
    public ErrorEllipse Scaled(double k) => new(A * k, B * k, Azimuth);

    /// <summary>
    /// The standard deviation along a direction: √(uᵀ C u) for the unit vector u at the given azimuth. Along the major
    /// axis it is <see cref="SemiMajorAxis"/>, across it <see cref="SemiMinorAxis"/>.
    /// </summary>
    /// <param name="azimuth">Azimuth of the direction, clockwise from north.</param>
    public Length SdAlong(Angle azimuth) => Length.FromMetres(SdAlong(azimuth.Radians));

    /// <summary>The standard deviation along a direction (m), the azimuth in radians clockwise from north.</summary>
    /// <param name="azimuth">Azimuth of the direction, radians clockwise from north.</param>
    internal double SdAlong(double azimuth)
    {
        double d = azimuth - Azimuth;
        double c = Math.Cos(d), s = Math.Sin(d);
        return Math.Sqrt((A * A * c * c) + (B * B * s * s));
    }
}
