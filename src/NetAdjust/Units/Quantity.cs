using System.Globalization;

namespace NetAdjust.Units;

/// <summary>
/// A value that is a <see cref="Units.Length"/> or an <see cref="Units.Angle"/> depending on the observation it
/// belongs to: a length for distances, slope distances and height differences, an angle for directions, angles,
/// azimuths and zenith angles. Results use it for an observation's adjusted value, residual, standard deviation and
/// minimal detectable bias, so that a residual in radians cannot be read as metres or arcseconds. Any sign.
/// </summary>
public readonly record struct Quantity
{
    private Quantity(double si, bool isAngle)
    {
        Si = si;
        IsAngle = isAngle;
    }

    /// <summary>The value in SI units (metres or radians), for the library and its writers.</summary>
    internal double Si { get; }

    /// <summary>True for an angle (<see cref="AsAngle"/>), false for a length (<see cref="AsLength"/>).</summary>
    public bool IsAngle { get; }

    /// <summary>The value as a length; null when it is an angle.</summary>
    public Length? AsLength => IsAngle ? null : Units.Length.FromMetres(Si);

    /// <summary>The value as an angle; null when it is a length.</summary>
    public Angle? AsAngle => IsAngle ? Units.Angle.FromRadians(Si) : null;

    /// <summary>A length.</summary>
    /// <param name="length">The length.</param>
    public static Quantity Of(Length length) => new(length.Metres, false);

    /// <summary>An angle.</summary>
    /// <param name="angle">The angle.</param>
    public static Quantity Of(Angle angle) => new(angle.Radians, true);

    /// <summary>A value in SI units (metres, or radians when <paramref name="isAngle"/>).</summary>
    internal static Quantity FromSi(double si, bool isAngle) => new(si, isAngle);

    /// <summary>Metres for a length (<c>0.0123 m</c>), arcseconds for an angle (<c>2.5"</c>); culture-invariant.
    /// </summary>
    public override string ToString() => IsAngle
        ? string.Create(CultureInfo.InvariantCulture, $"{Si * Units.Angle.ArcsecondsPerRadian:0.###}\"")
        : string.Create(CultureInfo.InvariantCulture, $"{Si:0.######} m");
}
