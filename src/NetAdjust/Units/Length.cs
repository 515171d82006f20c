namespace NetAdjust.Units;

/// <summary>
/// A length, stored in metres. Construct it with a unit-named factory and read it through a unit-named property.
/// There is deliberately no implicit conversion from <see cref="double"/>.
/// </summary>
public readonly record struct Length : IComparable<Length>
{
    private Length(double metres) => Metres = metres;

    /// <summary>The length in metres.</summary>
    public double Metres { get; }

    /// <summary>The length in international feet (0.3048 m exactly).</summary>
    public double InternationalFeet => Metres / LengthUnit.InternationalFoot.MetresPerUnit;

    /// <summary>The length in US survey feet (1200/3937 m).</summary>
    public double UsSurveyFeet => Metres / LengthUnit.UsSurveyFoot.MetresPerUnit;

    /// <summary>The zero length.</summary>
    public static Length Zero => default;

    /// <summary>Creates a length from metres.</summary>
    /// <param name="metres">Any finite value, in metres.</param>
    public static Length FromMetres(double metres) => new(metres);

    /// <summary>Creates a length from millimetres (e.g. a standard deviation of 3 mm).</summary>
    /// <param name="millimetres">Any finite value, in millimetres.</param>
    public static Length FromMillimetres(double millimetres) => new(millimetres / 1000.0);

    /// <summary>Creates a length from international feet (0.3048 m exactly).</summary>
    /// <param name="feet">Any finite value, in international feet.</param>
    public static Length FromInternationalFeet(double feet) => new(feet * LengthUnit.InternationalFoot.MetresPerUnit);

    /// <summary>Creates a length from US survey feet (1200/3937 m; deprecated since 2023 but still found in old
    /// records).</summary>
    /// <param name="feet">Any finite value, in US survey feet.</param>
    public static Length FromUsSurveyFeet(double feet) => new(feet * 1200.0 / 3937.0);

    /// <summary>Creates a length from a value in the given unit.</summary>
    /// <param name="value">The value in <paramref name="unit"/>.</param>
    /// <param name="unit">The unit of <paramref name="value"/>.</param>
    public static Length From(double value, LengthUnit unit) =>
        unit == LengthUnit.UsSurveyFoot ? FromUsSurveyFeet(value) : new(value * unit.MetresPerUnit);

    /// <summary>The length expressed in <paramref name="unit"/>.</summary>
    /// <param name="unit">The unit wanted.</param>
    public double In(LengthUnit unit) =>
        unit == LengthUnit.UsSurveyFoot ? Metres * 3937.0 / 1200.0 : Metres / unit.MetresPerUnit;

    /// <inheritdoc />
    public int CompareTo(Length other) => Metres.CompareTo(other.Metres);

    /// <summary>Sum of two lengths.</summary>
    public static Length operator +(Length a, Length b) => new(a.Metres + b.Metres);

    /// <summary>Difference of two lengths.</summary>
    public static Length operator -(Length a, Length b) => new(a.Metres - b.Metres);

    /// <summary>Length scaled by a factor.</summary>
    public static Length operator *(double k, Length a) => new(k * a.Metres);

    /// <inheritdoc />
    public override string ToString() => LengthPattern.Metres.Format(this);
}
