using System.Globalization;
using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>
/// The a-priori standard deviation of one observation, typed like its value: a <see cref="Units.Length"/> for
/// distances, slope distances and height differences, an <see cref="Units.Angle"/> for directions, angles, azimuths
/// and zenith angles. It is always positive and finite. A length or an angle converts to it implicitly, so an
/// observation takes <c>{ Sd = Length.FromMillimetres(3) }</c> or <c>{ Sd = Angle.FromArcseconds(2) }</c>; a bare
/// number is never taken, so arcseconds cannot be mistaken for radians.
/// </summary>
public readonly record struct ObservationSd
{
    private ObservationSd(double si, bool isAngle)
    {
        Si = si;
        IsAngle = isAngle;
    }

    /// <summary>The value in SI units (metres or radians), for the adjustment's hot path.</summary>
    internal double Si { get; }

    /// <summary>True for an angular standard deviation (<see cref="AsAngle"/>), false for a length
    /// (<see cref="AsLength"/>).</summary>
    public bool IsAngle { get; }

    /// <summary>The standard deviation as a length; null when it is an angle.</summary>
    public Length? AsLength => IsAngle ? null : Units.Length.FromMetres(Si);

    /// <summary>The standard deviation as an angle; null when it is a length.</summary>
    public Angle? AsAngle => IsAngle ? Units.Angle.FromRadians(Si) : null;

    /// <summary>A standard deviation of a distance or height difference.</summary>
    /// <param name="sd">The standard deviation (positive and finite).</param>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="sd"/> is zero, negative, NaN or
    /// infinite.</exception>
    public static ObservationSd Of(Length sd) => new(Guards.PositiveSd(sd.Metres, nameof(sd), "m"), false);

    /// <summary>A standard deviation of a direction, angle, azimuth or zenith angle.</summary>
    /// <param name="sd">The standard deviation (positive and finite).</param>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="sd"/> is zero, negative, NaN or
    /// infinite.</exception>
    public static ObservationSd Of(Angle sd) => new(Guards.PositiveSd(sd.Radians, nameof(sd), "rad"), true);

    /// <summary>Converts a length with <see cref="Of(Length)"/>.</summary>
    /// <param name="sd">The standard deviation (positive and finite).</param>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="sd"/> is not positive and
    /// finite.</exception>
    public static implicit operator ObservationSd(Length sd) => Of(sd);

    /// <summary>Converts an angle with <see cref="Of(Angle)"/>.</summary>
    /// <param name="sd">The standard deviation (positive and finite).</param>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="sd"/> is not positive and
    /// finite.</exception>
    public static implicit operator ObservationSd(Angle sd) => Of(sd);

    /// <summary>A value already in SI units, unchecked (internal: the reader checks it later with file and
    /// line).</summary>
    internal static ObservationSd FromSi(double si, bool isAngle) => new(si, isAngle);

    /// <summary>Millimetres for a length (<c>3 mm</c>), arcseconds for an angle (<c>2.5"</c>).</summary>
    public override string ToString() => IsAngle
        ? string.Create(CultureInfo.InvariantCulture, $"{Units.Angle.FromRadians(Si).Arcseconds:0.###}\"")
        : string.Create(CultureInfo.InvariantCulture, $"{Si * 1000:0.###} mm");
}

/// <summary>Argument checks of the public constructors: each throws naming the parameter.</summary>
internal static class Guards
{
    /// <summary>A standard deviation: positive and finite.</summary>
    public static double PositiveSd(double value, string parameter, string unit) =>
        double.IsFinite(value) && value > 0 ? value
            : throw new ArgumentOutOfRangeException(parameter, value,
                $"A standard deviation must be a positive finite number, not {Show(value)} {unit}.");

    /// <summary>A length that must be positive and finite (a distance, a section length).</summary>
    public static Length PositiveLength(Length value, string parameter, string what) =>
        double.IsFinite(value.Metres) && value.Metres > 0 ? value
            : throw new ArgumentOutOfRangeException(parameter, value.Metres,
                $"{what} must be a positive finite length, not {Show(value.Metres)} m.");

    /// <summary>A length that must be zero or more and finite (an instrument height).</summary>
    public static Length NonNegativeLength(Length value, string parameter, string what) =>
        double.IsFinite(value.Metres) && value.Metres >= 0 ? value
            : throw new ArgumentOutOfRangeException(parameter, value.Metres,
                $"{what} must be a finite length of zero or more, not {Show(value.Metres)} m.");

    /// <summary>A length of either sign that must be finite (a height difference, a target height).</summary>
    public static Length FiniteLength(Length value, string parameter, string what) =>
        double.IsFinite(value.Metres) ? value
            : throw new ArgumentOutOfRangeException(parameter, value.Metres,
                $"{what} must be a finite length, not {Show(value.Metres)} m.");

    /// <summary>An angle that must be finite.</summary>
    public static Angle FiniteAngle(Angle value, string parameter, string what) =>
        double.IsFinite(value.Radians) ? value
            : throw new ArgumentOutOfRangeException(parameter, value.Radians,
                $"{what} must be a finite angle, not {Show(value.Radians)} rad.");

    /// <summary>A point, set or setup id: not null, empty or white space.</summary>
    public static string Id(string value, string parameter)
    {
        ArgumentNullException.ThrowIfNull(value, parameter);
        return string.IsNullOrWhiteSpace(value)
            ? throw new ArgumentException($"The id '{parameter}' is empty: give at least one character.", parameter)
            : value;
    }

    private static string Show(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
