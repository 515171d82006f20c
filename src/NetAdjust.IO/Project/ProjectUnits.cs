using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>The units a project declares once, for its input and its reports.</summary>
/// <param name="Length">Unit of coordinates, distances, height differences and length standard deviations.</param>
/// <param name="Angle">Text form of observed angles.</param>
/// <param name="AngleSd">Unit of angular standard deviations and residuals.</param>
public sealed record ProjectUnits(LengthUnit Length, AngleFormat Angle, AngleSdUnit AngleSd)
{
    /// <summary>Metres, DMS, arcseconds.</summary>
    public static ProjectUnits Default { get; } = new(LengthUnit.Metre, AngleFormat.Dms, AngleSdUnit.Arcsecond);
}

/// <summary>The unit of small angles (standard deviations, residuals).</summary>
public enum AngleSdUnit
{
    /// <summary>Arcseconds (″).</summary>
    Arcsecond,

    /// <summary>Milligons (mgon; 1 gon = 1000 mgon).</summary>
    Milligon,
}

/// <summary>Conversions for <see cref="AngleSdUnit"/>.</summary>
public static class AngleSdUnits
{
    /// <summary>Radians in one unit.</summary>
    /// <param name="unit">The unit.</param>
    public static double RadiansPerUnit(this AngleSdUnit unit) =>
        unit == AngleSdUnit.Milligon ? Math.PI / 200000.0 : 1.0 / NetAdjust.Units.Angle.ArcsecondsPerRadian;

    /// <summary>The symbol used in files and reports.</summary>
    /// <param name="unit">The unit.</param>
    public static string Symbol(this AngleSdUnit unit) => unit == AngleSdUnit.Milligon ? "mgon" : "arcsec";
}
