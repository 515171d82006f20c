namespace NetAdjust.Units;

/// <summary>How angles are written in a project file or a report.</summary>
public enum AngleFormat
{
    /// <summary>Degrees-minutes-seconds: <c>123-45-56.7</c> or <c>123°45'56.7"</c>.</summary>
    Dms,

    /// <summary>Decimal degrees: <c>123.765750</c>.</summary>
    Degrees,

    /// <summary>Gons (grads), 400 to the circle: <c>137.5167</c>.</summary>
    Gons,
}
