namespace NetAdjust.Units;

/// <summary>Typed views of the SI doubles that results keep inside the library (metres and radians).</summary>
internal static class Lengths
{
    /// <summary>A length from metres.</summary>
    public static Length Metres(double metres) => Length.FromMetres(metres);

    /// <summary>A length from metres, null for null.</summary>
    public static Length? Of(double? metres) => metres is double m ? Length.FromMetres(m) : null;

    /// <summary>An angle from radians.</summary>
    public static Angle Radians(double radians) => Angle.FromRadians(radians);

    /// <summary>An angle from radians, null for null.</summary>
    public static Angle? AngleOf(double? radians) => radians is double r ? Angle.FromRadians(r) : null;
}
