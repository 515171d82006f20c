namespace NetAdjust.Units;

/// <summary>
/// A plane angle, stored in radians. Construct it with a unit-named factory
/// (<see cref="FromDegrees"/>, <see cref="FromDms"/>, <see cref="FromGons"/>, ...) and read it through a
/// unit-named property. There is deliberately no implicit conversion from <see cref="double"/>.
/// </summary>
public readonly record struct Angle : IComparable<Angle>
{
    /// <summary>Arcseconds in one radian: 648000/π.</summary>
    public const double ArcsecondsPerRadian = 648000.0 / Math.PI;

    private Angle(double radians) => Radians = radians;

    /// <summary>The angle in radians.</summary>
    public double Radians { get; }

    /// <summary>The angle in decimal degrees.</summary>
    public double Degrees => Radians * (180.0 / Math.PI);

    /// <summary>The angle in gons (400 gon = full circle).</summary>
    public double Gons => Radians * (200.0 / Math.PI);

    /// <summary>The angle in arcseconds.</summary>
    public double Arcseconds => Radians * ArcsecondsPerRadian;

    /// <summary>The zero angle.</summary>
    public static Angle Zero => default;

    /// <summary>Creates an angle from radians.</summary>
    /// <param name="radians">Any finite value, in radians.</param>
    public static Angle FromRadians(double radians) => new(radians);

    /// <summary>Creates an angle from decimal degrees.</summary>
    /// <param name="degrees">Any finite value, in degrees.</param>
    public static Angle FromDegrees(double degrees) => new(degrees * (Math.PI / 180.0));

    /// <summary>Creates an angle from gons (grads; 400 gon = full circle).</summary>
    /// <param name="gons">Any finite value, in gons.</param>
    public static Angle FromGons(double gons) => new(gons * (Math.PI / 200.0));

    /// <summary>Creates an angle from arcseconds.</summary>
    /// <param name="arcseconds">Any finite value, in arcseconds.</param>
    public static Angle FromArcseconds(double arcseconds) => new(arcseconds / ArcsecondsPerRadian);

    /// <summary>
    /// Creates an angle from degrees, minutes and seconds. The sign of the angle is the sign of
    /// <paramref name="degrees"/> (or of the first non-zero part); the parts themselves are taken as magnitudes.
    /// </summary>
    /// <param name="degrees">Whole degrees; its sign gives the sign of the angle.</param>
    /// <param name="minutes">Minutes, 0 ≤ minutes &lt; 60.</param>
    /// <param name="seconds">Seconds, 0 ≤ seconds &lt; 60.</param>
    /// <param name="negative">True for a negative angle whose degree part is zero (e.g. −0°30′).</param>
    /// <exception cref="ArgumentOutOfRangeException">When minutes or seconds are outside [0, 60).</exception>
    public static Angle FromDms(int degrees, int minutes, double seconds, bool negative = false)
    {
        if (minutes is < 0 or >= 60)
            throw new ArgumentOutOfRangeException(nameof(minutes), minutes, "minutes must be in [0, 60)");
        if (!(seconds >= 0 && seconds < 60))
            throw new ArgumentOutOfRangeException(nameof(seconds), seconds, "seconds must be in [0, 60)");
        double sign = degrees < 0 || negative ? -1.0 : 1.0;
        double arcsec = (Math.Abs((double)degrees) * 3600.0) + (minutes * 60.0) + seconds;
        return FromArcseconds(sign * arcsec);
    }

    /// <summary>
    /// The angle reduced to [0, 2π): used for azimuths and directions.
    /// </summary>
    public Angle Normalized0To2Pi()
    {
        double r = Radians % (2 * Math.PI);
        if (r < 0) r += 2 * Math.PI;
        if (r >= 2 * Math.PI) r = 0;
        return new Angle(r);
    }

    /// <summary>
    /// The angle reduced to (−π, π]: used for angular residuals and misclosures.
    /// </summary>
    public Angle NormalizedSigned() => new(ReduceSigned(Radians));

    /// <summary>Reduces a value in radians to (−π, π].</summary>
    /// <param name="radians">Any finite value, in radians.</param>
    /// <returns>The equivalent value in (−π, π].</returns>
    internal static double ReduceSigned(double radians)
    {
        double r = Math.IEEERemainder(radians, 2 * Math.PI); // in [−π, π]
        return r <= -Math.PI ? r + (2 * Math.PI) : r;
    }

    /// <summary>Reduces a value in radians to [0, 2π).</summary>
    /// <param name="radians">Any finite value, in radians.</param>
    internal static double Reduce0To2Pi(double radians) => FromRadians(radians).Normalized0To2Pi().Radians;

    /// <inheritdoc />
    public int CompareTo(Angle other) => Radians.CompareTo(other.Radians);

    /// <summary>Sum of two angles.</summary>
    public static Angle operator +(Angle a, Angle b) => new(a.Radians + b.Radians);

    /// <summary>Difference of two angles.</summary>
    public static Angle operator -(Angle a, Angle b) => new(a.Radians - b.Radians);

    /// <summary>Negated angle.</summary>
    public static Angle operator -(Angle a) => new(-a.Radians);

    /// <summary>Angle scaled by a factor.</summary>
    public static Angle operator *(double k, Angle a) => new(k * a.Radians);

    /// <inheritdoc />
    public override string ToString() => AnglePattern.Dms.Format(this);
}
